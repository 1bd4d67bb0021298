package analyze

import (
	"strings"
	"testing"

	"walden/analyze/smiles"
	"walden/grammar/source"
)

// canon reads a SMILES written in a test and returns walden's canonical
// form, so that expected products can be written in any valid form.
func canon(t *testing.T, s string) string {
	t.Helper()
	m, err := smiles.Parse(s)
	if err != nil {
		t.Fatalf("test SMILES %q: %v", s, err)
	}
	return smiles.Canonical(m)
}

// TestPlanTracksConfiguration follows (S)-4-phenylbutan-2-ol through a
// labelled plan: tosylation keeps the configuration (the C–O bond is not
// broken), azide displacement inverts it (SN2, Walden inversion). Both
// are common practice; the classic demonstration is H. Phillips, J. Chem.
// Soc., Trans. 1923, 123, 44 and 1925, 127, 2552 (sulfonate esters of
// optically active secondary alcohols displaced with inversion) — from
// memory. The CIP letters were checked with RDKit 2022.09
// (rdCIPLabeler.AssignCIPLabels) on the SMILES below: alcohol S,
// tosylate S, azide R.
func TestPlanTracksConfiguration(t *testing.T) {
	src := Source{Name: "plan.steps", Kind: PlanFile, Text: []byte(
		"tos: C[C@H](O)CCc1ccccc1 + TsCl (1.2 eq) + pyridine, DCM, 0 °C\n" +
			"az: @tos + NaN3 (1.5 eq), DMF, 60 °C\n")}
	rep := analyse(t, NewEngine(Config{}), src)[0]
	if len(rep.Steps) != 2 {
		t.Fatalf("%d steps", len(rep.Steps))
	}
	tests := []struct {
		product       string
		before, after string
		change        string
		through       string
	}{
		{"C[C@H](OS(=O)(=O)c1ccc(C)cc1)CCc1ccccc1", "S", "S", "retained", "tos retained (S)"},
		{"C[C@@H](N=[N+]=[N-])CCc1ccccc1", "S", "R", "inverted", "tos retained (S) → az inverted (R)"},
	}
	for i, tc := range tests {
		p := rep.Steps[i].Prediction
		if p == nil || len(p.Products) == 0 {
			t.Fatalf("step %d: no prediction", i+1)
		}
		if got, want := p.Products[0].SMILES, canon(t, tc.product); got != want {
			t.Errorf("step %d: product %s, want %s", i+1, got, want)
		}
		if len(p.Stereo) != 1 || p.Stereo[0].Before != tc.before || p.Stereo[0].After != tc.after || p.Stereo[0].Outcome != tc.change {
			t.Errorf("step %d: stereo %+v, want %s→%s %s", i+1, p.Stereo, tc.before, tc.after, tc.change)
		}
		if got := strings.Join(p.Through, " → "); got != tc.through {
			t.Errorf("step %d: through %q, want %q", i+1, got, tc.through)
		}
	}
	// The hover of the second step says so in words.
	md, _, _ := rep.Hover(rep.Steps[1].Span.Start)
	if !strings.Contains(md, "tos retained (S) → az inverted (R)") || !strings.Contains(md, "inverted (the CIP letter changes)") {
		t.Errorf("hover lacks the configuration through the plan:\n%s", md)
	}
	if !strings.HasSuffix(rep.Steps[1].Inlay, "(2S→2R, inverted)") {
		t.Errorf("inlay %q", rep.Steps[1].Inlay)
	}
}

// TestPlanUsesWrittenProduct: a later step uses the product the chemist
// wrote after '->' rather than the prediction.
func TestPlanUsesWrittenProduct(t *testing.T) {
	src := Source{Kind: PlanFile, Text: []byte(
		"a: CCCCBr + NaI, acetone, 25 °C -> CCCCCl\n" +
			"@a + NaN3, DMF, 25 °C\n")}
	rep := analyse(t, NewEngine(Config{}), src)[0]
	at := strings.Index(string(src.Text), "@a")
	md, _, ok := rep.Hover(source.Pos(at))
	if !ok || !strings.Contains(md, "CCCCCl") || !strings.Contains(md, "as written") {
		t.Errorf("hover on @a = %q", md)
	}
}
