package outcome

import (
	"strings"
	"testing"
)

// scenario is one step with what the rules must say about it.
type scenario struct {
	name      string
	substrate string
	reagents  []string
	solvent   string // "" for none
	tempC     float64
	mechanism Mechanism
	reasons   []string // substrings of reason texts that must appear
	findings  []Code
	source    string // the outside source of the expected outcome
}

var scenarios = []scenario{
	{"Finkelstein", "CCCCBr", []string{"[I-]"}, "acetone", 0, SN2,
		[]string{"SN2 class term", "leaving group Br", "nucleophile iodide: n =", "anionic nucleophile in acetone", "ionising power of acetone", "base iodide (pKaH"}, nil,
		"Finkelstein, Ber. 1910, 43, 1528 (outcomes-dev D01)"},
	{"tertiary with azide", "CC(C)(C)Br", []string{"[Na+].[N-]=[N+]=[N-]"}, "DMF", 0, E2,
		[]string{"the back side is shielded"}, []Code{CodeTertiarySN2},
		"tertiary halides do not undergo SN2 (Solomons & Fryhle Table 6.4, ~0)"},
	{"neopentyl", "CC(C)(C)CBr", []string{"CC[O-]"}, "ethanol", 0, SN2,
		[]string{"neopentyl-type carbon", "no hydrogen on a neighbouring carbon"}, []Code{CodeHinderedBackside, CodeSlow},
		"Dostrovsky, Hughes, Ingold J. Chem. Soc. 1946, 157 (outcomes-dev D44)"},
	{"isobutyl", "CC(C)CBr", []string{"CC[O-]"}, "ethanol", 55, E2,
		[]string{"branching on the neighbouring carbon", "at 55 °C"}, []Code{CodeHinderedBackside, CodeBaseEliminates},
		"Dhar, Hughes, Ingold et al. J. Chem. Soc. 1948, 2093 (outcomes-dev D11)"},
	{"bromobenzene", "Brc1ccccc1", []string{"CC[O-]"}, "ethanol", 0, None,
		[]string{"a leaving group on an sp2 carbon"}, []Code{CodeSp2Leaving},
		"aryl halides are inert to SN1/SN2 (outcomes-dev D46)"},
	{"bridgehead", "ClC12CCC(CC1)CC2", []string{"[Na+].[N-]=[N+]=[N-]"}, "DMF", 0, None,
		nil, []Code{CodeBridgehead, CodeNoReaction},
		"Bartlett & Knox J. Am. Chem. Soc. 1939, 61, 3184 (bridgehead chlorides inert)"},
	{"alcohol", "CCCCO", []string{"[Na+].[Br-]"}, "DMF", 0, None,
		[]string{"is a poor leaving group"}, []Code{CodePoorLeaving},
		"hydroxide is not displaced (Solomons & Fryhle leaving-group table, ~0)"},
	{"isopropyl ethoxide", "CC(C)Br", []string{"CC[O-]"}, "ethanol", 55, E2,
		nil, []Code{CodeBaseEliminates},
		"Dhar et al. 1948 (outcomes-dev D13: 79% propene)"},
	{"azide in methanol", "CCCCBr", []string{"[N-]=[N+]=[N-]"}, "methanol", 0, SN2,
		nil, []Code{CodeProticSlows},
		"Parker Chem. Rev. 1969, 69, 1 (azide/BuBr: DMF 2800 x methanol)"},
	{"methanolysis of primary", "CCCCBr", nil, "methanol", 0, SN2,
		[]string{"the solvent is the nucleophile"}, []Code{CodeWeakNucleophile},
		"solvolysis of primary halides is SN2 by solvent (Bentley & Schleyer 1976)"},
	{"tertiary solvolysis", "CCC[C@](C)(Br)CC", []string{"O"}, "aqueous acetone", 0, SN1,
		[]string{"cation: ionisation term", "no base present"}, []Code{CodeRacemises},
		"SN1 racemisation (outcomes-dev D37)"},
	{"pinacolyl alcohol", "CC(O)C(C)(C)C", []string{"Cl"}, "water", 0, SN1,
		[]string{"the cation would rearrange by a 1,2-methyl shift"}, []Code{CodeRearranges},
		"Whitmore J. Am. Chem. Soc. 1932, 54, 3274 (outcomes-dev D53)"},
	{"2-bromobutane azide", "CCC(C)Br", []string{"[Na+].[N-]=[N+]=[N-]"}, "DMF", 0, SN2,
		nil, []Code{CodeUndefinedConfig},
		"a stereocentre written without @ has no defined configuration (OpenSMILES)"},
	{"two leaving groups", "ClCCCBr", []string{"[Na+].[N-]=[N+]=[N-]"}, "DMF", 0, SN2,
		nil, []Code{CodeCompetingSites},
		"bromide reacts before chloride (Solomons & Fryhle leaving-group table)"},
	{"bisphenol", "CCCCBr", []string{"Oc1ccc(cc1)-c1ccc(O)c(C)c1", "O=C([O-])[O-].[K+].[K+]"}, "DMF", 0, SN2,
		nil, []Code{CodeNucleophileSites},
		"two phenols of similar acidity both alkylate (common practice)"},
	{"ethylamine", "CCCCBr", []string{"CCN"}, "ethanol", 0, SN2,
		nil, []Code{CodeOverAlkylation},
		"amines over-alkylate (Hofmann; March's Advanced Organic Chemistry, amine alkylation)"},
	{"azide in toluene", "CCCCBr", []string{"[Na+].[N-]=[N+]=[N-]"}, "toluene", 0, SN2,
		nil, []Code{CodeInsoluble},
		"sodium azide is insoluble in toluene (common practice)"},
	{"no solvent", "CCCCBr", []string{"[Na+].[N-]=[N+]=[N-]"}, "", 0, SN2,
		nil, []Code{CodeNoSolvent},
		"project default (docs/outcome.md)"},
	{"NaI test tertiary", "CC(C)(C)Br", []string{"[I-]"}, "acetone", 25, None,
		nil, []Code{CodeNoReaction},
		"Shriner, Fuson, Curtin NaI/acetone test (outcomes-dev D38)"},
	{"cyanide", "CCCCCl", []string{"[Na+].[C-]#N"}, "DMSO", 0, SN2,
		nil, []Code{CodeAmbident},
		"Friedman & Shechter J. Org. Chem. 1960, 25, 877 (outcomes-dev D02)"},
	{"no leaving group", "CCCC", []string{"[Na+].[N-]=[N+]=[N-]"}, "DMF", 0, None,
		nil, []Code{CodeNotAnalysed},
		"butane has no leaving group"},
	{"tert-butoxide", "CCCCCCCCCCCCCCCCCCBr", []string{"CC(C)(C)[O-]"}, "tert-butanol", 40, E2,
		[]string{"the nucleophile is bulky"}, nil,
		"Solomons & Fryhle (outcomes-dev D12: 85% alkene)"},
	{"menthyl chloride E2", "CC(C)[C@@H]1CC[C@@H](C)C[C@H]1Cl", []string{"CC[O-]"}, "ethanol", 0, E2,
		nil, nil, "Hughes, Ingold et al. (outcomes-dev D22)"},
	{"trans-diaxial impossible", "C[C@H]1CCCC[C@@H]1Br", []string{"CC(C)(C)[O-]"}, "tert-butanol", 0, E2,
		nil, nil, "E2 in cyclohexanes needs a trans H: here C2-H is cis but C6 has one (Barton 1950)"},
	{"no anti hydrogen", "C[C@H]1CCC[C@@H](C)[C@@H]1Br", []string{"CC[O-]"}, "ethanol", 0, SN2,
		[]string{"no β-hydrogen can be anti-periplanar"}, nil,
		"both ring neighbours carry their H cis to Br (faces checked with an RDKit 3D embedding): no trans-diaxial H, so no E2 (Barton Experientia 1950, 6, 316)"},
	{"tert-butyl in neutral solvent no nucleophile", "CC(C)(C)Br", nil, "DMSO", 150, E1,
		[]string{"no nucleophile to capture a cation", "no nucleophile present"}, nil,
		"thermal ionisation without a nucleophile can only eliminate (common practice)"},
	{"tosylation", "CCCCCC[C@@H](C)O", []string{"Cc1ccc(S(=O)(=O)Cl)cc1", "c1ccncc1"}, "pyridine", 0, None,
		[]string{"the sulfonyl chloride esterifies"}, nil, "Tipson J. Org. Chem. 1944, 9, 235 (outcomes-dev D49)"},
	{"dehydration", "OC1CCCCC1", []string{"O=P(O)(O)O"}, "water", 160, E1,
		[]string{"a strong acid with a non-nucleophilic"}, nil, "Coleman & Johnstone Org. Synth. 1925, 5, 33 (outcomes-dev D58)"},
	{"dehalogenation", "Br[C@H](c1ccccc1)[C@@H](Br)c1ccccc1", []string{"[I-]"}, "acetone", 0, E2,
		[]string{"iodide removes one halogen"}, nil, "Winstein, Pressman, Young 1939 (outcomes-dev D26)"},
	{"bromonium", "C[C@H](Br)[C@@H](C)O", []string{"Br"}, "water", 0, SN1,
		[]string{"the bromine on the neighbouring carbon"}, nil, "Winstein & Lucas 1939 (outcomes-dev D54)"},
	{"epoxide opening", "C[C@@H]1CO1", []string{"[N-]=[N+]=[N-]"}, "DMF", 0, SN2,
		[]string{"opens an epoxide from the back side at the less substituted carbon"}, nil, "Parker & Isaacs Chem. Rev. 1959, 59, 737 (basic epoxide opening at the less hindered carbon)"},
	{"epoxide", "O[C@@H]1CCCC[C@H]1Cl", []string{"[OH-]"}, "water", 0, SN2,
		[]string{"the base turns the neighbouring hydroxyl"}, nil, "Bartlett J. Am. Chem. Soc. 1935, 57, 224 (outcomes-dev D60)"},
}

func runScenario(t *testing.T, sc scenario) Outcome {
	t.Helper()
	st := Step{Substrate: mustParse(t, sc.substrate)}
	for _, r := range sc.reagents {
		st.Reagents = append(st.Reagents, Reactant{Mol: mustParse(t, r)})
	}
	if sc.solvent != "" {
		st.Solvents = solventsFor(t, sc.solvent)
	}
	if sc.tempC != 0 {
		v := sc.tempC
		st.TempC = &v
	}
	return Predict(st)
}

// TestScenarios checks mechanism, reasons and findings of each scenario
// against the source named in it.
func TestScenarios(t *testing.T) {
	for _, sc := range scenarios {
		o := runScenario(t, sc)
		if o.Mechanism != sc.mechanism {
			t.Errorf("%s: mechanism %s, want %s (%s)", sc.name, o.Mechanism, sc.mechanism, sc.source)
		}
		for _, want := range sc.reasons {
			found := false
			for _, r := range o.Reasons {
				found = found || strings.Contains(r.Text, want)
			}
			if !found {
				t.Errorf("%s: no reason containing %q; got %v", sc.name, want, reasonTexts(o))
			}
		}
		for _, code := range sc.findings {
			found := false
			for _, f := range o.Findings {
				found = found || f.Code == code
			}
			if !found {
				t.Errorf("%s: no finding %s; got %v", sc.name, code, findingCodes(o))
			}
		}
	}
}

// TestEveryCodeAndRuleExercised: every finding code and every rule is
// produced by at least one scenario, so no text shown to users is
// untested.
func TestEveryCodeAndRuleExercised(t *testing.T) {
	codes := map[Code]bool{}
	rules := map[string]bool{}
	for _, sc := range scenarios {
		for _, c := range sc.findings {
			codes[c] = true
		}
		o := runScenario(t, sc)
		for _, r := range o.Reasons {
			if containsAny(r.Text, sc.reasons) {
				rules[r.Rule] = true
			}
		}
	}
	for _, d := range Codes {
		if !codes[d.Code] {
			t.Errorf("finding code %s is not checked by any scenario", d.Code)
		}
	}
	for _, r := range Rules {
		if !rules[r.Name] {
			t.Errorf("rule %s has no checked reason text", r.Name)
		}
	}
}

func containsAny(s string, subs []string) bool {
	for _, x := range subs {
		if strings.Contains(s, x) {
			return true
		}
	}
	return false
}

func reasonTexts(o Outcome) []string {
	var out []string
	for _, r := range o.Reasons {
		out = append(out, r.Text)
	}
	return out
}

func findingCodes(o Outcome) []Code {
	var out []Code
	for _, f := range o.Findings {
		out = append(out, f.Code)
	}
	return out
}
