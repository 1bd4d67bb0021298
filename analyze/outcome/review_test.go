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
		// close-nucleophile-sites
		{"CCCCBr", []string{"NaN3"}, "DMF", CodeNucleophileSites, false,
			"azide's two terminal nitrogens are equivalent: one alkyl azide forms (Bräse et al., Angew. Chem. Int. Ed. 2005, 44, 5188, from memory)"},
		{"CCCCBr", []string{"Oc1ccc(O)cc1", "K2CO3"}, "DMF", CodeNucleophileSites, false,
			"hydroquinone's two OH groups are equivalent: the same mono-ether from either (common practice)"},
		{"CCCCBr", []string{"Oc1ccc(cc1)-c1ccc(O)c(C)c1", "K2CO3"}, "DMF", CodeNucleophileSites, true,
			"two phenols of similar acidity in different positions both alkylate (common practice)"},
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

// TestThioureaAlkylatesOnSulfur: thiourea and a primary bromide give the
// S-alkylisothiouronium salt (Urquhart, Gates, Connor, Org. Synth. 1941,
// 21, 36, from memory; common practice for thiols), not an N-alkyl
// thiourea, and its two NH2 groups are no competing site.
func TestThioureaAlkylatesOnSulfur(t *testing.T) {
	st := Step{Substrate: mustParse(t, "CCCCBr"), Solvents: solventsFor(t, "ethanol"), Reagents: []Reactant{reactantFor(t, "thiourea")}}
	o := Predict(st)
	// Either resonance form of the cation is the right answer.
	m := o.Major()
	if m == nil || (m.SMILES != canon(t, "CCCCSC(N)=[NH2+]") && m.SMILES != canon(t, "CCCC[S+]=C(N)N")) {
		t.Errorf("major %+v, want S-butylisothiouronium", m)
	}
	for _, f := range o.Findings {
		if f.Code == CodeNucleophileSites {
			t.Errorf("unexpected %s: %s", f.Code, f.Message)
		}
	}
}

// TestMalonateInEthanol: the malonic ester synthesis is run with NaOEt in
// ethanol (Org. Synth. Coll. Vol. 1, 250, diethyl n-butylmalonate, from
// memory): C-alkylation, and no protic-solvent warning on the textbook
// conditions.
func TestMalonateInEthanol(t *testing.T) {
	st := Step{Substrate: mustParse(t, "CCCCBr"), Solvents: solventsFor(t, "ethanol"),
		Reagents: []Reactant{reactantFor(t, "CCOC(=O)CC(=O)OCC"), reactantFor(t, "NaOEt")}}
	o := Predict(st)
	if m := o.Major(); m == nil || m.SMILES != canon(t, "CCCCC(C(=O)OCC)C(=O)OCC") {
		t.Errorf("major %+v, want diethyl butylmalonate", o.Major())
	}
	for _, f := range o.Findings {
		if f.Code == CodeProticSlows {
			t.Errorf("unexpected %s: %s", f.Code, f.Message)
		}
	}
}

// TestNoMarkOnFalseCentre: methoxide displaces bromide from (S)-1-bromo-
// ethyl methyl ether to the acetal CH3CH(OMe)2, whose carbon bears two
// methoxy groups and is no stereocentre (IUPAC 2013 P-93.1, common
// practice); RDKit 2022.09 writes it COC(C)OC with no mark. A real
// centre keeps its mark ((S)-2-bromobutane + azide: (R)-2-azidobutane,
// letters by RDKit).
func TestNoMarkOnFalseCentre(t *testing.T) {
	tests := []struct{ substrate, reagent, solvent, product string }{
		{"C[C@H](Br)OC", "NaOMe", "DMSO", "COC(C)OC"},
		{"C[C@H](Br)CC", "NaN3", "DMF", "C[C@@H](N=[N+]=[N-])CC"},
	}
	for _, tc := range tests {
		st := Step{Substrate: mustParse(t, tc.substrate), Solvents: solventsFor(t, tc.solvent), Reagents: []Reactant{reactantFor(t, tc.reagent)}}
		o := Predict(st)
		if m := o.Major(); m == nil || m.SMILES != canon(t, tc.product) {
			t.Errorf("%s + %s: major %+v, want %s", tc.substrate, tc.reagent, m, tc.product)
		}
	}
}

// TestNoSN2FixAtTertiary: tert-butyl bromide with KOtBu eliminates, and no
// other nucleophile or temperature would give an SN2 product at a
// tertiary carbon (Solomons & Fryhle Table 6.4: tertiary ~0), so the
// finding offers no reagent swap.
func TestNoSN2FixAtTertiary(t *testing.T) {
	st := Step{Substrate: mustParse(t, "CC(C)(C)Br"), Solvents: solventsFor(t, "tert-butanol"), Reagents: []Reactant{reactantFor(t, "KOtBu")}}
	o := Predict(st)
	for _, f := range o.Findings {
		if f.Code == CodeBaseEliminates {
			if len(f.Fixes) != 0 {
				t.Errorf("fixes %+v offered at a tertiary carbon", f.Fixes)
			}
			return
		}
	}
	t.Errorf("no base-eliminates: %v", findingCodes(o))
}
