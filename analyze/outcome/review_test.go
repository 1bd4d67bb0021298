package outcome

import (
	"strings"
	"testing"
)

// TestFindingsChemistsExpect checks that findings appear where a bench
// chemist would want them and stay away from routine steps, each row
// against the source named in it.
func TestFindingsChemistsExpect(t *testing.T) {
	tests := []struct {
		substrate string
		reagents  []string // dictionary names or SMILES
		solvent   string
		code      Code
		want      bool
		source    string
	}{
		// protic-solvent-slows
		{"CCCCBr", []string{"NaN3"}, "methanol", CodeProticSlows, true,
			"Parker, Chem. Rev. 1969, 69, 1: azide + n-BuBr is thousands of times faster in DMF than in methanol (from memory)"},
		{"CCCCBr", []string{"NaSPh"}, "ethanol", CodeProticSlows, false,
			"thiolates are the least solvated anions and are alkylated in ethanol routinely (Parker 1969, from memory; common practice)"},
		{"CCCCBr", []string{"NaOH"}, "water", CodeProticSlows, false,
			"hydroxide does not dissolve in dipolar aprotic solvents; aqueous hydrolysis is the usual practice (common practice)"},
		{"CC(C)Br", []string{"NaOEt"}, "ethanol", CodeProticSlows, false,
			"ethoxide in ethanol on a secondary bromide is an E2 (Dhar, Hughes, Ingold et al. J. Chem. Soc. 1948, 2093): an aprotic solvent would not make it an SN2"},
		// over-alkylation
		{"CCCCBr", []string{"CCN"}, "ethanol", CodeOverAlkylation, true,
			"primary amines over-alkylate (March's Advanced Organic Chemistry, amine alkylation, from memory)"},
		{"CCCCBr", []string{"C1COCCN1", "K2CO3"}, "acetonitrile", CodeOverAlkylation, false,
			"secondary amine + primary bromide gives the tertiary amine cleanly (common practice)"},
		{"CI", []string{"C1COCCN1", "K2CO3"}, "acetonitrile", CodeOverAlkylation, true,
			"methyl iodide quaternises tertiary amines readily (Menshutkin reaction; common practice)"},
		// base-eliminates
		{"CC(C)(C)Br", []string{"NaN3"}, "DMF", CodeBaseEliminates, false,
			"a tertiary bromide with azide: tertiary-no-sn2 already says azide acts as a base there (common practice: no SN2 at tertiary carbon)"},
		{"CC(C)(C)Br", []string{"NaN3"}, "DMF", CodeTertiarySN2, true,
			"no backside attack at a tertiary carbon (Solomons & Fryhle Table 6.4)"},
		{"CC(C)Br", []string{"KOtBu"}, "tert-butanol", CodeBaseEliminates, true,
			"tert-butoxide eliminates from secondary halides (Brown, Moritani, Okamoto J. Am. Chem. Soc. 1956, 78, 2193, from memory)"},
	}
	for _, tc := range tests {
		name := tc.substrate + " + " + strings.Join(tc.reagents, " + ") + ", " + tc.solvent + ": " + string(tc.code)
		t.Run(name, func(t *testing.T) {
			st := Step{Substrate: mustParse(t, tc.substrate), Solvents: solventsFor(t, tc.solvent)}
			for _, r := range tc.reagents {
				st.Reagents = append(st.Reagents, reactantFor(t, r))
			}
			o := Predict(st)
			got := false
			for _, f := range o.Findings {
				got = got || f.Code == tc.code
			}
			if got != tc.want { // source: tc.source
				t.Errorf("%s = %v, want %v (%s); findings %v", tc.code, got, tc.want, tc.source, findingCodes(o))
			}
		})
	}
}

// TestBaseEliminatesWords: the finding names the reagent and its kind in
// plain words, and never offers the reagent already in the step as the
// fix. Wording, not chemistry.
func TestBaseEliminatesWords(t *testing.T) {
	st := Step{Substrate: mustParse(t, "CC(C)Br"), Solvents: solventsFor(t, "tert-butanol"), Reagents: []Reactant{reactantFor(t, "KOtBu")}}
	o := Predict(st)
	for _, f := range o.Findings {
		if f.Code != CodeBaseEliminates {
			continue
		}
		if !strings.Contains(f.Message, "KOtBu, a tertiary alkoxide") || strings.Contains(f.Message, "alkoxide-tertiary") {
			t.Errorf("message %q", f.Message)
		}
		return
	}
	t.Errorf("no base-eliminates finding: %v", findingCodes(o))
}

// TestEsterAtCarbonyl: hydroxide, alkoxides and amines attack an ester at
// its carbonyl carbon (saponification, transesterification, aminolysis:
// common practice; March's Advanced Organic Chemistry, acyl substitution,
// from memory). The step is outside the rules, so it is not analysed,
// and no poor-leaving-group error is raised on a routine step; with
// iodide, which does not attack the carbonyl, the error stays.
func TestEsterAtCarbonyl(t *testing.T) {
	tests := []struct {
		reagent, solvent string
		notAnalysed      bool
	}{
		{"NaOH", "methanol", true},
		{"NaOMe", "methanol", true},
		{"CCN", "ethanol", true},
		{"NaI", "acetone", false},
	}
	for _, tc := range tests {
		st := Step{Substrate: mustParse(t, "CCOC(=O)c1ccccc1"), Solvents: solventsFor(t, tc.solvent), Reagents: []Reactant{reactantFor(t, tc.reagent)}}
		o := Predict(st)
		poor := false
		for _, f := range o.Findings {
			poor = poor || f.Code == CodePoorLeaving
		}
		if (o.NotAnalysed != "") != tc.notAnalysed || poor == tc.notAnalysed {
			t.Errorf("ethyl benzoate + %s: not analysed %q, poor-leaving-group %v; want not analysed %v", tc.reagent, o.NotAnalysed, poor, tc.notAnalysed)
		}
	}
}
