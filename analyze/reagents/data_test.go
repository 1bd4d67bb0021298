package reagents

import (
	"strings"
	"testing"

	"walden/analyze/smiles"
)

// The built-in tables must read without a single problem.
func TestBuiltinTablesHaveNoProblems(t *testing.T) {
	for _, p := range Builtin().Problems() {
		t.Error(p)
	}
}

// The issue asks for at least 150 reagents and 35 solvents.
func TestBuiltinCounts(t *testing.T) {
	d := Builtin()
	if n := len(d.reagents); n < 150 {
		t.Errorf("%d reagents, want at least 150", n)
	}
	if n := len(d.solvents); n < 35 {
		t.Errorf("%d solvents, want at least 35", n)
	}
	t.Logf("%d reagents, %d solvents, %d names", len(d.reagents), len(d.solvents), len(d.names))
}

// Every entry and every number carries a source saying how it was
// obtained (DESIGN.md, "Data provenance").
func TestEveryValueHasSource(t *testing.T) {
	d := Builtin()
	for _, g := range d.reagents {
		if g.Source == "" {
			t.Errorf("reagent %s has no source", g.Name())
		}
		for what, v := range map[string]Value{"pKaH": g.PKaH, "n": g.Nucleo} {
			if v.Known && !hasProvenance(v.Source) {
				t.Errorf("reagent %s: %s %v has source %q without provenance", g.Name(), what, v.V, v.Source)
			}
		}
	}
	for _, s := range d.solvents {
		if s.Source == "" || !s.Dielectric.Known || !s.BoilingC.Known {
			t.Errorf("solvent %s lacks a source, a dielectric constant or a boiling point", s.Name())
		}
		for what, v := range map[string]Value{"dielectric": s.Dielectric, "bp": s.BoilingC} {
			if !hasProvenance(v.Source) {
				t.Errorf("solvent %s: %s has source %q without provenance", s.Name(), what, v.Source)
			}
		}
	}
}

// A name leads to one reagent and at most one solvent. The only names
// shared between a reagent and a solvent are those of one substance used
// both ways (pyridine, water, MeOH, AcOH …): the reagent as weighed out
// must then be the solvent molecule itself.
func TestNamesAreUnique(t *testing.T) {
	d := Builtin()
	owner := map[string]string{}
	claim := func(kind, display, name string) {
		k, ok := normalize(nil, name, false)
		if !ok || len(k) == 0 {
			t.Errorf("%s %s: name %q has no usable key", kind, display, name)
			return
		}
		key := kind + "\x00" + string(k)
		if o, dup := owner[key]; dup && o != display {
			t.Errorf("%s name %q belongs to both %s and %s", kind, name, o, display)
		}
		owner[key] = display
	}
	for _, g := range d.reagents {
		for _, n := range g.Names {
			claim("reagent", g.Name(), n)
		}
	}
	for _, s := range d.solvents {
		for _, n := range s.Names {
			claim("solvent", s.Name(), n)
		}
	}
	for key, r := range d.exact {
		if r.r > 0 && r.s > 0 {
			g, s := d.reagents[r.r-1], d.solvents[r.s-1]
			if g.Whole != s.SMILES {
				t.Errorf("name %q is reagent %s (%s) and solvent %s (%s): not the same substance", key, g.Name(), g.Whole, s.Name(), s.SMILES)
			}
		}
	}
	// No two names may differ only in case, or case folding would be
	// unsafe for them (see normalize).
	for k, r := range d.folded {
		if r.ambiguous {
			t.Errorf("names differing only in case share the folded key %q", k)
		}
	}
}

// Every SMILES in the tables is read by walden's own SMILES reader, and
// each reagent as weighed out is electrically neutral (common practice:
// salts are written with their counter-ions).
func TestTableSMILESParse(t *testing.T) {
	d := Builtin()
	check := func(who, what, s string) int {
		if s == "" {
			return 0
		}
		m, err := smiles.Parse(s)
		if err != nil {
			t.Errorf("%s: %s %q: %v", who, what, s, err)
			return 0
		}
		q := 0
		for _, a := range m.Atoms {
			q += a.Charge
		}
		return q
	}
	for _, g := range d.reagents {
		check(g.Name(), "species", g.Species)
		check(g.Name(), "counter-ion", g.Counterion)
		if q := check(g.Name(), "whole", g.Whole); q != 0 {
			t.Errorf("%s: %q has net charge %d", g.Name(), g.Whole, q)
		}
	}
	for _, s := range d.solvents {
		if q := check(s.Name(), "SMILES", s.SMILES); q != 0 {
			t.Errorf("%s: %q has net charge %d", s.Name(), s.SMILES, q)
		}
	}
	for smi, sp := range loadTables().species {
		check(sp.name, "species", smi)
	}
}

// Nucleophiles and bases need a pKaH for the outcome rules; the few that
// have none are listed here on purpose (Lewis acids and complex hydrides,
// whose basicity is not a pKa, and the thiourea and sulfide species whose
// values are not known well enough).
func TestNucleophilesAndBasesHavePKaH(t *testing.T) {
	noPKaH := map[string]bool{
		"Na2S": true, "thiourea": true, "NaBH4": true, "LiAlH4": true, "LiBHEt3": true,
		"BF3·OEt2": true, "ZnCl2": true, "AlCl3": true, "NaBH3CN": true,
	}
	for _, g := range Builtin().reagents {
		if g.Roles&(Nucleophile|Base|Acid) == 0 || g.PKaH.Known {
			continue
		}
		if !noPKaH[g.Name()] {
			t.Errorf("%s (species %s) is a %s without a pKaH", g.Name(), g.Species, g.Roles)
		}
	}
}

// Hazard tags the caution rules rely on sit where the trade expects them
// (common practice; DESIGN.md "Cautions").
func TestHazardTags(t *testing.T) {
	cases := []struct {
		name, hazard string
	}{
		{"NaN3", HazardAzide}, {"TMSN3", HazardAzide}, {"NaCN", HazardCyanide}, {"KCN", HazardCyanide},
		{"NaH", HazardWaterReactive}, {"nBuLi", HazardPyrophoric}, {"tBuLi", HazardPyrophoric},
		{"MeI", HazardAlkylating}, {"Me2SO4", HazardAlkylating}, {"MeOTf", HazardAlkylating},
		{"BnBr", HazardLachrymator}, {"allyl bromide", HazardLachrymator}, {"SOCl2", HazardCorrosive},
		{"DCM", HazardHalogenated}, {"chloroform", HazardHalogenated}, {"THF", HazardPeroxideFormer},
	}
	for _, c := range cases {
		e, ok := Lookup(c.name)
		if !ok {
			t.Errorf("%s not found", c.name)
			continue
		}
		if !(e.Reagent != nil && e.Reagent.HasHazard(c.hazard) || e.Solvent != nil && e.Solvent.HasHazard(c.hazard)) {
			t.Errorf("%s lacks hazard %s", c.name, c.hazard)
		}
	}
}

// Roles of well-known reagents, as any synthesis text uses them (common
// practice).
func TestRoles(t *testing.T) {
	cases := []struct {
		name string
		role Role
		bulk Bulk
	}{
		{"NaN3", Nucleophile, Small}, {"KOtBu", Base, Hindered}, {"LDA", Base, Hindered},
		{"DBU", Base, Hindered}, {"DIPEA", Base, Hindered}, {"TsCl", Activator, Moderate},
		{"DEAD", Activator, Small}, {"H2SO4", Acid, Small}, {"18-crown-6", Additive, Small},
		{"MeI", Electrophile, Small}, {"pyridine", Base, Small},
	}
	for _, c := range cases {
		e, ok := Lookup(c.name)
		if !ok || e.Reagent == nil {
			t.Errorf("%s: no reagent", c.name)
			continue
		}
		if !e.Reagent.Roles.Has(c.role) || e.Reagent.Bulk != c.bulk {
			t.Errorf("%s: roles %s, bulk %s; want %s, %s", c.name, e.Reagent.Roles, e.Reagent.Bulk, c.role, c.bulk)
		}
	}
}

func TestDocMentionsSources(t *testing.T) {
	e, _ := Lookup("NaN3")
	doc := Doc(e)
	for _, want := range []string{"**NaN3**", "`[N-]=[N+]=[N-]`", "4.72", "5.78", "Pearson", "from memory", "safety data sheet"} {
		if !strings.Contains(doc, want) {
			t.Errorf("Doc(NaN3) lacks %q:\n%s", want, doc)
		}
	}
	e, _ = Lookup("pyridine")
	if doc := Doc(e); !strings.Contains(doc, "reagent") || !strings.Contains(doc, "solvent") {
		t.Errorf("Doc(pyridine) should describe both the reagent and the solvent:\n%s", doc)
	}
}
