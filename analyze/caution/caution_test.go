package caution

import (
	"strings"
	"testing"

	"walden/analyze/molecule"
	"walden/analyze/smiles"
)

// mol reads a SMILES for a test, skipping while the reader is a stub.
func mol(t *testing.T, s string) (m *molecule.Molecule) {
	t.Helper()
	defer func() {
		if recover() != nil {
			t.Skip("waiting for smiles.Parse")
		}
	}()
	m, err := smiles.Parse(s)
	if err != nil {
		t.Fatalf("smiles.Parse(%q): %v", s, err)
	}
	return m
}

// sub builds a substance from "text|SMILES", or from one word that is
// read as SMILES when it can be and taken as a name otherwise.
func sub(t *testing.T, role Role, i int, spec string) Substance {
	text, smi, found := strings.Cut(spec, "|")
	s := Substance{Role: role, Index: i, Text: text}
	if found {
		s.Mol = mol(t, smi)
	} else if m, err := smiles.Parse(text); err == nil {
		s.Mol = m
	}
	return s
}

type stepSpec struct {
	substrate string
	reagents  []string
	solvents  []string
	bp        float64 // boiling point of the (first) solvent, 0 when unknown
	temp      float64
	hasTemp   bool
	reflux    bool
	sealed    bool
}

func build(t *testing.T, sp stepSpec) *Step {
	s := &Step{TempC: sp.temp, HasTemp: sp.hasTemp, Reflux: sp.reflux, Sealed: sp.sealed}
	if sp.substrate != "" {
		s.Substances = append(s.Substances, sub(t, Substrate, 0, sp.substrate))
	}
	for i, r := range sp.reagents {
		s.Substances = append(s.Substances, sub(t, Reagent, i, r))
	}
	for i, v := range sp.solvents {
		x := sub(t, Solvent, i, v)
		if sp.bp != 0 {
			x.BoilingC, x.HasBoilingC = sp.bp, true
		}
		s.Substances = append(s.Substances, x)
	}
	return s
}

func codes(cs []Caution) []string {
	var out []string
	for _, c := range cs {
		out = append(out, c.Code)
	}
	return out
}

// TestCautions checks each rule on combinations whose hazard is documented
// in the source named beside the case, and on near misses that must stay
// quiet.
func TestCautions(t *testing.T) {
	tests := []struct {
		name string
		step stepSpec
		want []string
	}{
		// Conrow & Dean, Org. Process Res. Dev. 2008, 12, 1285, diazidomethane
		// from NaN3 and CH2Cl2 (from memory); Bretherick (from memory).
		{"azide in DCM by SMILES", stepSpec{substrate: "CCBr", reagents: []string{"NaN3|[Na+].[N-]=[N+]=[N-]"}, solvents: []string{"ClCCl|ClCCl"}},
			[]string{"caution-azide-halomethane"}},
		{"azide in chloroform by name", stepSpec{reagents: []string{"NaN3"}, solvents: []string{"chloroform"}},
			[]string{"caution-azide-halomethane"}},
		// The other polyhalomethanes carry the same C–X bonds: flagged by
		// analogy (Bretherick, from memory; Conrow & Dean 2008, from memory).
		{"azide in CCl4", stepSpec{reagents: []string{"NaN3|[Na+].[N-]=[N+]=[N-]"}, solvents: []string{"CCl4|ClC(Cl)(Cl)Cl"}}, []string{"caution-azide-halomethane"}},
		{"azide in CBr4 by name", stepSpec{reagents: []string{"NaN3"}, solvents: []string{"CBr4"}}, []string{"caution-azide-halomethane"}},
		{"azide in bromoform", stepSpec{reagents: []string{"NaN3|[Na+].[N-]=[N+]=[N-]"}, solvents: []string{"CHBr3|BrC(Br)Br"}}, []string{"caution-azide-halomethane"}},
		{"azide in dibromomethane", stepSpec{reagents: []string{"x|[N-]=[N+]=[N-].[Na+]"}, solvents: []string{"y|BrCBr"}}, []string{"caution-azide-halomethane"}},
		{"tetrabutylammonium azide in chloroform", stepSpec{reagents: []string{"x|CCCC[N+](CCCC)(CCCC)CCCC.[N-]=[N+]=[N-]"}, solvents: []string{"y|ClC(Cl)Cl"}}, []string{"caution-azide-halomethane"}},
		// Organic azides and TMSN3 are handled in DCM routinely (common
		// practice): no halomethane caution; one chlorine is not CH2X2.
		{"organic azide in DCM", stepSpec{substrate: "CCCCN=[N+]=[N-]", reagents: []string{"PPh3|c1ccccc1P(c1ccccc1)c1ccccc1"}, solvents: []string{"DCM|ClCCl"}}, nil},
		{"TMSN3 in DCM", stepSpec{reagents: []string{"TMSN3|C[Si](C)(C)N=[N+]=[N-]"}, solvents: []string{"DCM|ClCCl"}}, nil},
		{"one chlorine: not a polyhalomethane", stepSpec{reagents: []string{"NaN3|[Na+].[N-]=[N+]=[N-]"}, solvents: []string{"MeCl|CCl"}}, nil},
		// Sodium azide SDS: contact with acids liberates very toxic gas
		// (common practice).
		{"azide with HCl", stepSpec{reagents: []string{"NaN3|[Na+].[N-]=[N+]=[N-]", "HCl|Cl"}}, []string{"caution-azide-acid"}},
		{"azide with dictionary acid", stepSpec{reagents: []string{"NaN3|[Na+].[N-]=[N+]=[N-]"}}, nil},
		// NaCN SDS: contact with acids liberates very toxic gas (common practice).
		{"cyanide with sulfuric acid", stepSpec{reagents: []string{"KCN|[K+].[C-]#N", "H2SO4|OS(=O)(=O)O"}}, []string{"caution-cyanide-acid"}},
		{"nitrile is not cyanide", stepSpec{substrate: "CC#N", reagents: []string{"HCl|Cl"}}, nil},
		// Yang et al., Org. Process Res. Dev. 2019, 23, 2210 (from memory).
		{"NaH in DMF", stepSpec{reagents: []string{"NaH|[Na+].[H-]"}, solvents: []string{"DMF|CN(C)C=O"}}, []string{"caution-hydride-dipolar"}},
		{"NaH in DMSO by SMILES", stepSpec{reagents: []string{"x|[NaH]"}, solvents: []string{"y|CS(C)=O"}}, []string{"caution-hydride-dipolar"}},
		{"NaH in THF", stepSpec{reagents: []string{"NaH|[Na+].[H-]"}, solvents: []string{"THF|C1CCOC1"}}, nil},
		// IARC / Prudent Practices (from memory): methylating agents.
		{"methyl iodide", stepSpec{reagents: []string{"MeI|CI"}}, []string{"caution-alkylating-agent"}},
		{"dimethyl sulfate", stepSpec{reagents: []string{"Me2SO4|COS(=O)(=O)OC"}}, []string{"caution-alkylating-agent"}},
		{"methyl triflate", stepSpec{reagents: []string{"MeOTf|COS(=O)(=O)C(F)(F)F"}}, []string{"caution-alkylating-agent"}},
		{"benzyl bromide substrate", stepSpec{substrate: "BrCc1ccccc1"}, []string{"caution-alkylating-agent"}},
		{"allyl bromide", stepSpec{substrate: "C=CCBr"}, []string{"caution-alkylating-agent"}},
		{"ordinary secondary bromide", stepSpec{substrate: "CCC(C)Br"}, nil},
		// Prudent Practices (from memory): α-halo ketones are lachrymators.
		{"chloroacetone", stepSpec{substrate: "CC(=O)CCl"}, []string{"caution-lachrymator"}},
		{"ethyl bromoacetate", stepSpec{reagents: []string{"CCOC(=O)CBr"}}, []string{"caution-lachrymator"}},
		// Common practice: DCM boils at 40 °C (CRC Handbook, from memory).
		{"DCM at 80 °C open", stepSpec{solvents: []string{"DCM"}, bp: 40, temp: 80, hasTemp: true}, []string{"caution-above-boiling"}},
		{"DCM at reflux open", stepSpec{solvents: []string{"DCM"}, bp: 40, reflux: true}, nil},
		{"DCM at 45 °C (bath margin)", stepSpec{solvents: []string{"DCM"}, bp: 40, temp: 45, hasTemp: true}, nil},
		{"THF sealed at 100 °C", stepSpec{solvents: []string{"THF"}, bp: 66, temp: 100, hasTemp: true, sealed: true}, []string{"caution-sealed-heating"}},
		{"DMF sealed at 100 °C", stepSpec{solvents: []string{"DMF"}, bp: 153, temp: 100, hasTemp: true, sealed: true}, nil},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got := codes(Find(build(t, tc.step)))
			if strings.Join(got, ",") != strings.Join(tc.want, ",") {
				t.Errorf("codes = %v, want %v", got, tc.want)
			}
		})
	}
}

// TestMessagesDefer checks that every caution defers to the lab's rules and
// never claims safety.
func TestMessagesDefer(t *testing.T) {
	s := &Step{Substances: []Substance{
		{Role: Reagent, Index: 0, Text: "NaN3"},
		{Role: Reagent, Index: 1, Text: "NaH"},
		{Role: Reagent, Index: 2, Text: "MeI"},
		{Role: Reagent, Index: 3, Text: "HCl", Acid: true},
		{Role: Solvent, Index: 0, Text: "DCM", BoilingC: 40, HasBoilingC: true},
		{Role: Solvent, Index: 1, Text: "DMSO"},
	}, TempC: 90, HasTemp: true}
	cs := Find(s)
	if len(cs) < 5 {
		t.Fatalf("got %d cautions, want at least 5: %v", len(cs), codes(cs))
	}
	for _, c := range cs {
		if !strings.HasSuffix(c.Message, Defer) {
			t.Errorf("%s: message does not end with the deferral: %q", c.Code, c.Message)
		}
		if strings.Contains(strings.ToLower(strings.TrimSuffix(c.Message, Defer)), "safe") {
			t.Errorf("%s: message speaks of safety: %q", c.Code, c.Message)
		}
	}
}

// TestRulesDocumented checks every rule has a code, a title and a source.
func TestRulesDocumented(t *testing.T) {
	seen := map[string]bool{}
	for _, r := range Rules() {
		if r.Code == "" || r.Title == "" || r.Source == "" || seen[r.Code] {
			t.Errorf("rule %+v: missing code, title or source, or duplicate", r.Code)
		}
		seen[r.Code] = true
	}
}
