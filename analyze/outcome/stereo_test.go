package outcome

import (
	"path/filepath"
	"strings"
	"testing"
	"walden/internal/golden"
)

// TestStereoChanges: SN2 inverts geometrically and the CIP letter may or
// may not change; SN1 loses the configuration; sulfonylation retains it.
// Expected letters from ../shared/reference/outcomes-dev.tsv (RDKit CIP
// checked there): D29 (R)-2-bromooctane → (S)-2-azidooctane (letter
// changes); D31 (S)-tosylate → (R)-acetate; D32 (S)-2-bromobutane → (R);
// D49 (R)-octan-2-ol → (R)-tosylate (retained); D37 racemised.
func TestStereoChanges(t *testing.T) {
	cases := []struct {
		substrate string
		reagents  []string
		solvent   string
		before    string
		after     string
		change    Change
	}{
		{"CCCCCC[C@@H](C)Br", []string{"[N-]=[N+]=[N-]"}, "DMF", "R", "S", Inverted},
		{"Cc1ccc(S(=O)(=O)O[C@@H](C)Cc2ccccc2)cc1", []string{"CC(=O)[O-]"}, "ethanol", "S", "R", Inverted},
		{"CC[C@H](C)Br", []string{"[S-]c1ccccc1"}, "DMF", "S", "R", Inverted},
		{"CCCCCC[C@@H](C)O", []string{"Cc1ccc(S(=O)(=O)Cl)cc1", "c1ccncc1"}, "pyridine", "R", "R", Retained},
		{"CCC[C@](C)(Br)CC", []string{"O"}, "aqueous acetone", "R", "", Lost},
		// Inversion without a letter change: the nucleophile ranks like
		// the leaving group did relative to the other ligands. (R)-1-bromo-
		// 1-deuterio... kept simple: (S)-2-bromobutane with chloride gives
		// (R)-2-chlorobutane? No: Cl and Br both outrank carbon, so the
		// letter changes; with thiolate it changes too. Letter kept: the
		// sulfonate → azide case below, where N ranks below the O of the
		// ester ligand it replaces but above carbon: letter changes.
	}
	for _, c := range cases {
		st := Step{Substrate: mustParse(t, c.substrate), Solvents: solventsFor(t, c.solvent)}
		for _, r := range c.reagents {
			st.Reagents = append(st.Reagents, Reactant{Mol: mustParse(t, r)})
		}
		o := Predict(st)
		if len(o.Stereo) == 0 {
			t.Errorf("%s: no stereo change reported", c.substrate)
			continue
		}
		s := o.Stereo[0]
		if s.Before != c.before || s.After != c.after || s.Change != c.change {
			t.Errorf("%s: %s→%s %s, want %s→%s %s", c.substrate, s.Before, s.After, s.Change, c.before, c.after, c.change)
		}
		if want := c.before != c.after && c.after != ""; s.LetterChanged != want {
			t.Errorf("%s: LetterChanged %v", c.substrate, s.LetterChanged)
		}
	}
}

// TestInversionKeepsLetter: geometric inversion with the CIP letter
// kept. In 1-bromoethyl methyl ether Br ranks first and OMe second; after
// cyanide replaces Br, OMe ranks first and CN second: the rank swap and
// the geometric inversion cancel, so the letter stays (letters confirmed
// by the RDKit oracle in TestStereoAgainstRDKit).
func TestInversionKeepsLetter(t *testing.T) {
	st := Step{Substrate: mustParse(t, "C[C@@H](Br)OC"), Reagents: []Reactant{{Mol: mustParse(t, "[C-]#N")}}, Solvents: solventsFor(t, "DMF")}
	o := Predict(st)
	if len(o.Stereo) == 0 || o.Stereo[0].Change != Inverted || o.Stereo[0].LetterChanged || o.Stereo[0].Before == "" {
		t.Errorf("stereo %+v, want inverted with the letter kept", o.Stereo)
	}
}

// TestStereoAgainstRDKit compares the CIP letters of predicted SN2
// products with RDKit's (oracle; skipped when absent).
func TestStereoAgainstRDKit(t *testing.T) {
	if testing.Short() {
		t.Skip("RDKit oracle skipped in -short mode")
	}
	steps := []struct{ substrate, reagent string }{
		{"CCCCCC[C@@H](C)Br", "[N-]=[N+]=[N-]"},
		{"C[C@H](Br)C(F)(F)F", "[S-]c1ccccc1"},
		{"C[C@@H](OS(C)(=O)=O)C(Cl)(Cl)Cl", "[N-]=[N+]=[N-]"},
		{"OC[C@H](C)Br", "[I-]"},
		{"CC(C)(C)[C@H]1CC[C@@H](Br)CC1", "[S-]c1ccccc1"},
		{"C[C@@H](Br)OC", "[C-]#N"},
	}
	var lines []string
	for _, s := range steps {
		st := Step{Substrate: mustParse(t, s.substrate), Reagents: []Reactant{{Mol: mustParse(t, s.reagent)}}, Solvents: solventsFor(t, "DMF")}
		o := Predict(st)
		p := o.Major()
		if p == nil || p.Pathway != SN2 {
			t.Errorf("%s: no SN2 product", s.substrate)
			continue
		}
		// Letters are numbered in the canonical SMILES' atom order, as
		// RDKit will read it.
		lines = append(lines, s.substrate+"\t"+p.SMILES+"\t"+letterList(mustParse(t, p.SMILES)))
	}
	golden.Check(t, filepath.Join("testdata", "sn2_stereo.golden"), strings.Join(lines, "\n")+"\n")
	// The oracle: RDKit's CIP letters for the predicted product SMILES.
	out, err := rdkitLetters(lines)
	if err != nil {
		t.Skipf("RDKit oracle not available: %v", err)
	}
	for i, l := range lines {
		mine := strings.Split(l, "\t")[2]
		if out[i] != mine {
			t.Errorf("%s: walden %s, RDKit %s", l, mine, out[i])
		}
	}
}
