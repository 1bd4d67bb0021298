package outcome

import (
	"math"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"testing"

	"walden/analyze/reagents"
)

// sn2Score runs one step and returns the SN2 score (log10) and whether
// SN2 was possible.
func sn2Score(t *testing.T, substrate, reagent, solvent string) (float64, bool) {
	t.Helper()
	st := Step{Substrate: mustParse(t, substrate), Reagents: []Reactant{{Mol: mustParse(t, reagent)}}, Solvents: solventsFor(t, solvent)}
	o := Predict(st)
	for _, s := range o.Scores {
		if s.Pathway == SN2 {
			return s.Log10, s.Possible
		}
	}
	t.Fatalf("%s + %s: no SN2 score (%s)", substrate, reagent, o.NotAnalysed)
	return 0, false
}

// leadingNumber reads "1e-5", "~200", "0.02" and the like.
func leadingNumber(s string) (float64, bool) {
	s = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(s), "~"))
	if i := strings.IndexAny(s, " ("); i > 0 {
		s = s[:i]
	}
	v, err := strconv.ParseFloat(s, 64)
	return v, err == nil
}

// TestSubstrateSN2Order: methyl > primary > secondary >> neopentyl,
// tertiary, compared with the textbook relative SN2 rates (Solomons &
// Fryhle Table 6.4, series B of ../shared/reference/tables/substrate_rates.tsv).
func TestSubstrateSN2Order(t *testing.T) {
	rows := readRows(t, filepath.Join(referenceDir, "tables", "substrate_rates.tsv"))
	type pt struct {
		smiles string
		ref    float64
		got    float64
		ok     bool
	}
	var pts []pt
	for _, r := range rows {
		if !strings.HasPrefix(r["series"], "B:") {
			continue
		}
		v, ok := leadingNumber(r["relative_rate"])
		if !ok {
			continue
		}
		g, possible := sn2Score(t, r["substrate_smiles"], "[I-]", "acetone")
		pts = append(pts, pt{r["substrate_smiles"], v, g, possible})
	}
	if len(pts) < 5 {
		t.Fatalf("series B has %d rows", len(pts))
	}
	sort.Slice(pts, func(i, j int) bool { return pts[i].ref > pts[j].ref })
	for i := 1; i < len(pts); i++ {
		a, b := pts[i-1], pts[i]
		if b.ref == 0 || !b.ok {
			// "~0" (tert-butyl): SN2 must be blocked.
			if b.ok && b.ref == 0 {
				t.Errorf("%s: SN2 should be blocked (textbook ~0)", b.smiles)
			}
			continue
		}
		if !(a.got > b.got) {
			t.Errorf("SN2 order: %s (%.2f) should beat %s (%.2f) as in the table (%g > %g)", a.smiles, a.got, b.smiles, b.got, a.ref, b.ref)
		}
		// The size of each step agrees with the table within one log unit.
		if d := (a.got - b.got) - math.Log10(a.ref/b.ref); math.Abs(d) > 1 {
			t.Errorf("SN2 gap %s→%s is %.1f log units, table %.1f", a.smiles, b.smiles, a.got-b.got, math.Log10(a.ref/b.ref))
		}
	}
}

// TestLeavingGroupOrder: I > Br > Cl >> F and OTs > I in SN2, compared
// with the textbook column of ../shared/reference/tables/leaving_groups.tsv
// (Solomons & Fryhle leaving-group table).
func TestLeavingGroupOrder(t *testing.T) {
	rows := readRows(t, filepath.Join(referenceDir, "tables", "leaving_groups.tsv"))
	type pt struct {
		name string
		ref  float64
		got  float64
	}
	var pts []pt
	for _, r := range rows {
		v, ok := leadingNumber(r["rel_reactivity_textbook_SN2"])
		if !ok || v <= 0 {
			continue
		}
		frag := strings.Replace(r["smiles_fragment"], "*", "CCCC", 1)
		g, _ := sn2Score(t, frag, "[N-]=[N+]=[N-]", "DMF")
		pts = append(pts, pt{r["group"], v, g})
	}
	if len(pts) < 5 {
		t.Fatalf("only %d leaving groups with textbook values", len(pts))
	}
	sort.Slice(pts, func(i, j int) bool { return pts[i].ref > pts[j].ref })
	for i := 1; i < len(pts); i++ {
		if !(pts[i-1].got > pts[i].got) {
			t.Errorf("leaving-group order: %s (%.2f) should beat %s (%.2f)", pts[i-1].name, pts[i-1].got, pts[i].name, pts[i].got)
		}
	}
}

// TestNucleophileOrderMethanol: within one protic solvent, the SN2 rank of
// anionic nucleophiles follows Pearson's n(CH3I) in methanol (Pearson,
// Sobel, Songstad J. Am. Chem. Soc. 1968, 90, 319, as tabulated in
// ../shared/reference/tables/nucleophiles.tsv).
func TestNucleophileOrderMethanol(t *testing.T) {
	rows := readRows(t, filepath.Join(referenceDir, "tables", "nucleophiles.tsv"))
	type pt struct {
		name string
		ref  float64
		got  float64
	}
	var pts []pt
	for _, r := range rows {
		v, ok := leadingNumber(r["n_PSS_CH3I_MeOH"])
		if !ok || r["charge"] != "-1" {
			continue
		}
		g, _ := sn2Score(t, "CI", r["smiles"], "methanol")
		pts = append(pts, pt{r["species"], v, g})
	}
	if len(pts) < 6 {
		t.Fatalf("only %d anions with Pearson n", len(pts))
	}
	sort.Slice(pts, func(i, j int) bool { return pts[i].ref > pts[j].ref })
	for i := 1; i < len(pts); i++ {
		if pts[i-1].ref-pts[i].ref < 0.3 {
			continue // within the scale's scatter
		}
		if !(pts[i-1].got > pts[i].got) {
			t.Errorf("nucleophile order in methanol: %s (%.2f) should beat %s (%.2f)", pts[i-1].name, pts[i-1].got, pts[i].name, pts[i].got)
		}
	}
}

// TestParkerSpeedUp: azide + 1-bromobutane is faster in dipolar aprotic
// solvents than in methanol by the factors of
// ../shared/reference/tables/solvent_rate_effects.tsv (McMurry's table
// after Parker: DMSO 1300, DMF 2800, acetonitrile 5000); the engine must
// agree within a factor of 10.
func TestParkerSpeedUp(t *testing.T) {
	rows := readRows(t, filepath.Join(referenceDir, "tables", "solvent_rate_effects.tsv"))
	base, _ := sn2Score(t, "CCCCBr", "[N-]=[N+]=[N-]", "methanol")
	checked := 0
	for _, r := range rows {
		if r["nucleophile"] != "azide" || r["substrate_smiles"] != "CCCCBr" || r["solvent"] == "methanol" {
			continue
		}
		v, ok := leadingNumber(r["value"])
		if !ok {
			continue
		}
		if _, ok := reagents.Lookup(r["solvent"]); !ok {
			if _, ok2 := solventText[r["solvent"]]; !ok2 && r["solvent"] != "HMPA" && r["solvent"] != "water" {
				continue
			}
		}
		g, _ := sn2Score(t, "CCCCBr", "[N-]=[N+]=[N-]", r["solvent"])
		if d := (g - base) - math.Log10(v); math.Abs(d) > 1 {
			t.Errorf("%s: engine speed-up 10^%.1f, table %g (10^%.1f)", r["solvent"], g-base, v, math.Log10(v))
		}
		checked++
	}
	if checked < 3 {
		t.Errorf("only %d solvents checked", checked)
	}
}
