package outcome

import (
	"strings"
	"testing"

	"walden/analyze/reagents"
)

// TestInsolubleSalt checks reagent-insoluble against what bench chemists
// do every day, so that routine suspensions and soluble salts are not
// flagged and real mistakes are. Each row names its source.
func TestInsolubleSalt(t *testing.T) {
	tests := []struct {
		reagents []string // dictionary names, or SMILES when not in it
		solvent  string
		want     bool
		source   string
	}{
		{[]string{"NaN3"}, "CCl4", true, "ionic salts do not dissolve in nonpolar solvents (common practice; Reichardt, Solvents and Solvent Effects, from memory)"},
		{[]string{"NaN3"}, "DCM", true, "sodium azide is insoluble in dichloromethane (common practice)"},
		{[]string{"NaN3"}, "toluene", true, "sodium azide is insoluble in toluene (common practice)"},
		{[]string{"[Na+].[N-]=[N+]=[N-]"}, "toluene", true, "the same salt written as SMILES (common practice)"},
		{[]string{"NaN3", "TBAB"}, "toluene", false, "phase-transfer catalysis: Starks, J. Am. Chem. Soc. 1971, 93, 195 (from memory)"},
		{[]string{"KCN", "18-crown-6"}, "toluene", false, "crown ether dissolves the salt: Pedersen, J. Am. Chem. Soc. 1967, 89, 7017; Liotta & Harris 1974 (from memory)"},
		{[]string{"NaN3"}, "DMF", false, "sodium azide in DMF is the standard SN2 azidation (common practice)"},
		{[]string{"NaH"}, "THF", false, "NaH is always used as a suspension, THF is the usual solvent (common practice)"},
		{[]string{"KOtBu"}, "THF", false, "KOtBu is sold as a 1 M solution in THF (common practice)"},
		{[]string{"LiBr"}, "THF", false, "LiBr dissolves in THF (common practice, from memory)"},
		{[]string{"K2CO3"}, "toluene", true, "potassium carbonate does not dissolve in toluene without a catalyst (common practice)"},
		{[]string{"NaN3"}, "water/1,4-dioxane (25:75 v/v)", false, "water in the mixture dissolves the salt (common practice)"},
	}
	for _, tc := range tests {
		name := strings.Join(tc.reagents, " + ") + ", " + tc.solvent
		t.Run(name, func(t *testing.T) {
			st := Step{Substrate: mustParse(t, "CCCCBr"), Solvents: solventsFor(t, tc.solvent)}
			for _, r := range tc.reagents {
				st.Reagents = append(st.Reagents, reactantFor(t, r))
			}
			o := Predict(st)
			got := false
			for _, f := range o.Findings {
				got = got || f.Code == CodeInsoluble
			}
			if got != tc.want { // source: tc.source
				t.Errorf("reagent-insoluble = %v, want %v (%s); findings %v", got, tc.want, tc.source, findingCodes(o))
			}
		})
	}
}

// reactantFor builds a reactant from a dictionary name (its species and
// counter-ion, as the analysis builds it) or from SMILES.
func reactantFor(t *testing.T, s string) Reactant {
	t.Helper()
	if e, ok := reagents.Lookup(s); ok && e.Reagent != nil {
		r := e.Reagent
		smi := r.Whole
		if smi == "" {
			smi = r.Species
			if r.Counterion != "" {
				smi += "." + r.Counterion
			}
		}
		return Reactant{Mol: mustParse(t, smi), Entry: r}
	}
	return Reactant{Mol: mustParse(t, s)}
}
