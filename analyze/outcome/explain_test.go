package outcome

import (
	"os"
	"strings"
	"testing"
)

// TestExplainStep prints the reasons for one step given in WALDEN_EXPLAIN as
// "substrate|reagent;reagent|solvent".
func TestExplainStep(t *testing.T) {
	spec := os.Getenv("WALDEN_EXPLAIN")
	if spec == "" {
		t.Skip("set WALDEN_EXPLAIN to run")
	}
	parts := strings.Split(spec, "|")
	st := Step{Substrate: mustParse(t, parts[0])}
	for _, r := range strings.Split(parts[1], ";") {
		if r != "" {
			st.Reagents = append(st.Reagents, Reactant{Mol: mustParse(t, r)})
		}
	}
	if len(parts) > 2 {
		st.Solvents = solventsFor(t, parts[2])
	}
	o := Predict(st)
	t.Logf("mechanism %s %s", o.Mechanism, o.NotAnalysed)
	for _, s := range o.Scores {
		t.Logf("  %s %.2f %v %.2f", s.Pathway, s.Log10, s.Possible, s.Fraction)
	}
	for _, r := range o.Reasons {
		t.Logf("  [%s] %s", r.Rule, r.Text)
	}
	for _, p := range o.Products {
		t.Logf("  %s %.2f %s %s", p.Role, p.Fraction, p.Pathway, p.SMILES)
	}
	for _, f := range o.Findings {
		t.Logf("  %s: %s", f.Code, f.Message)
	}
}
