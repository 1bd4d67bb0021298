package analyze

import (
	"strings"
	"testing"
)

// TestElectrophileWrittenLater: chemists often write the nucleophile
// first ("alcohol + NaH + MeI"). The alkylating agent must still be the
// substrate and the alkoxide the nucleophile: Williamson ether synthesis,
// sodium hydride deprotonates the alcohol and the alkoxide displaces
// iodide by SN2 (common practice); the carbinol carbon is not touched, so
// its configuration is kept. Appel reagents (CBr4) must not be taken as
// the electrophile: PPh3/CBr4 turns the alcohol into the bromide with
// inversion (Appel, Angew. Chem. Int. Ed. 1975, 14, 801, from memory;
// letters RDKit 2022.09: C[C@@H](Br)CCc1ccccc1 is R).
func TestElectrophileWrittenLater(t *testing.T) {
	tests := []struct {
		text    string
		product string
	}{
		{"alc: C[C@H](O)CCc1ccccc1\n@alc + NaH + CI, THF\n", "CO[C@@H](C)CCc1ccccc1"},
		{"CI + C[C@H](O)CCc1ccccc1 + NaH, THF\n", "CO[C@@H](C)CCc1ccccc1"},
		{"Oc1ccccc1 + K2CO3 + BrCc1ccccc1, DMF\n", "c1ccccc1COc1ccccc1"},
		{"C[C@H](O)CCc1ccccc1 + PPh3 + CBr4, DCM\n", "C[C@@H](Br)CCc1ccccc1"},
		// Mitsunobu with benzoic acid: the ester with inversion, not the
		// phosphonium (Mitsunobu, Synthesis 1981, 1, from memory; letters
		// RDKit: C[C@H](CCc1ccccc1)OC(=O)c1ccccc1 is R).
		{"alc: C[C@H](O)CCc1ccccc1\nacid: OC(=O)c1ccccc1\n@alc + PPh3 + DIAD + @acid, THF, 0 °C\n", "C[C@H](CCc1ccccc1)OC(=O)c1ccccc1"},
		{"C[C@H](O)CCc1ccccc1 + PPh3 + DIAD + PhCO2H, THF, 0 °C\n", "C[C@H](CCc1ccccc1)OC(=O)c1ccccc1"},
	}
	for _, tc := range tests {
		rep := analyse(t, NewEngine(Config{}), Source{Name: "e.steps", Kind: PlanFile, Text: []byte(tc.text)})[0]
		last := rep.Steps[len(rep.Steps)-1]
		if last.Prediction == nil || len(last.Prediction.Products) == 0 {
			t.Errorf("%q: no product; diagnostics %v", tc.text, rep.Diagnostics)
			continue
		}
		if got, want := last.Prediction.Products[0].SMILES, canon(t, tc.product); got != want {
			t.Errorf("%q: product %s, want %s", tc.text, got, want)
		}
		for _, d := range rep.Diagnostics {
			if d.Code == "poor-leaving-group" {
				t.Errorf("%q: %s", tc.text, d.Message)
			}
		}
	}
}

// TestCautionNamesLabel: a caution about a referenced substance names the
// label with its SMILES, not the bare label. Wording, not chemistry (the
// methyl iodide caution itself is checked in analyze/caution).
func TestCautionNamesLabel(t *testing.T) {
	rep := analyse(t, NewEngine(Config{}), Source{Name: "c.steps", Kind: PlanFile, Text: []byte("me: CI\n@me + OCCc1ccccc1 + NaH, THF\n")})[0]
	for _, d := range rep.Diagnostics {
		if d.Code == "caution-alkylating-agent" {
			if !strings.Contains(d.Message, "@me (CI)") {
				t.Errorf("message %q does not name @me (CI)", d.Message)
			}
			return
		}
	}
	t.Errorf("no alkylating-agent caution: %v", rep.Diagnostics)
}

// TestReagentAsSolvent: "tBuBr + H2O" names no solvent, but the water is
// the medium: tert-butyl bromide hydrolyses by SN1 to tert-butanol with
// some isobutene (Hughes & Ingold, J. Chem. Soc. 1935, 244; common
// practice), not as a salt-free SN2 in the default DMF.
func TestReagentAsSolvent(t *testing.T) {
	rep := analyse(t, NewEngine(Config{DefaultSolvent: "DMF"}), Source{Name: "w.steps", Kind: PlanFile, Text: []byte("CC(C)(C)Br + H2O\n")})[0]
	p := rep.Steps[0].Prediction
	if p == nil || p.Mechanism != "SN1" || len(p.Products) == 0 || p.Products[0].SMILES != canon(t, "CC(C)(C)O") {
		t.Fatalf("prediction %+v, want SN1 to tert-butanol", p)
	}
	for _, d := range rep.Diagnostics {
		if d.Code == "no-solvent" || d.Code == CodeDefaultSolvent {
			t.Errorf("no-solvent reported although water is the medium: %s", d.Message)
		}
	}
}

// TestNotebookLabelsMitsunobuAndEther: the same two steps in notebook
// cells, the alcohol and the acid defined in an earlier cell. Mitsunobu
// with benzoic acid gives the (R) benzoate with inversion (Mitsunobu,
// Synthesis 1981, 1, from memory; letters RDKit 2022.09), and NaH + MeI
// on the alcohol gives the methyl ether with the carbinol carbon
// untouched (Williamson, common practice).
func TestNotebookLabelsMitsunobuAndEther(t *testing.T) {
	cell1 := Source{Name: "nb.ipynb", Kind: MarkdownCell, Text: []byte("```reaction\nalc: C[C@H](O)CCc1ccccc1\nacid: OC(=O)c1ccccc1\n```\n")}
	cell2 := Source{Name: "nb.ipynb", Kind: MarkdownCell, Text: []byte("```reaction\n@alc + PPh3 + DIAD + @acid, THF, 0 °C\n@alc + NaH + CI, THF\n```\n")}
	reps := analyse(t, NewEngine(Config{}), cell1, cell2)
	want := []string{"C[C@H](CCc1ccccc1)OC(=O)c1ccccc1", "CO[C@@H](C)CCc1ccccc1"}
	if len(reps[1].Steps) != 2 {
		t.Fatalf("%d steps in cell 2", len(reps[1].Steps))
	}
	for i, w := range want {
		p := reps[1].Steps[i].Prediction
		if p == nil || len(p.Products) == 0 || p.Products[0].SMILES != canon(t, w) {
			t.Errorf("step %d: prediction %+v, want %s", i+1, p, w)
		}
	}
}
