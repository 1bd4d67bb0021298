package reagents

import (
	"strings"
	"testing"
)

// Names as chemists write them lead to the entry the trade means by them
// (common practice); the display name is what Lookup must find.
func TestLookup(t *testing.T) {
	cases := []struct {
		in      string
		reagent string // display name, "" for none
		solvent string
	}{
		{"NaN3", "NaN3", ""},
		{"NaN₃", "NaN3", ""}, // subscript digits
		{"nan3", "NaN3", ""}, // case folded on the second try
		{"sodium azide", "NaN3", ""},
		{"Sodium Azide", "NaN3", ""},
		{"KOtBu", "KOtBu", ""},
		{"t-BuOK", "KOtBu", ""},
		{"tBuOK", "KOtBu", ""},
		{"potassium tert-butoxide", "KOtBu", ""},
		{"potassium tert‑butoxide", "KOtBu", ""}, // non-breaking hyphen
		{"potassium t-butoxide", "KOtBu", ""},
		{"Hünig's base", "DIPEA", ""},
		{"Hunig’s base", "DIPEA", ""}, // typographic apostrophe
		{"iPr2NEt", "DIPEA", ""},
		{"Et₃N", "Et3N", ""},
		{"BF3·OEt2", "BF3·OEt2", ""},
		{"BF3.OEt2", "BF3·OEt2", ""},
		{"18-crown-6", "18-crown-6", ""},
		{"18 crown 6", "18-crown-6", ""},
		{"pyridine", "pyridine", "pyridine"}, // both a base and a solvent
		{"water", "water", "water"},
		{"H2O", "water", "water"},
		{"MeOH", "MeOH", "MeOH"},
		{"AcOH", "AcOH", "AcOH"},
		{"DMF", "", "DMF"},
		{"dmf", "", "DMF"},
		{"N,N-dimethylformamide", "", "DMF"},
		{"DMA", "", "DMA"}, // the solvent; dimethylamine is Me2NH
		{"Me2NH", "Me2NH", ""},
		{"THF", "", "THF"},
		{"2-MeTHF", "", "2-MeTHF"},
		{"CH2Cl2", "", "DCM"},
		{"CCl4", "CCl4", "CCl4"},
		{"LiHMDS", "LiHMDS", ""},
		{"n-BuLi", "nBuLi", ""},
		{"diethyl malonate", "diethyl malonate", ""},
		{"MeI", "MeI", ""},
		{"CO", "", ""}, // carbon monoxide is not in the dictionary, and no case folding may turn it into something else
		{"", "", ""},
		{"   ", "", ""},
		{"-", "", ""},
		{strings.Repeat("x", 500), "", ""},
		{"\xff\xfe", "", ""},
	}
	for _, c := range cases {
		e, ok := Lookup(c.in)
		got := [2]string{}
		if e.Reagent != nil {
			got[0] = e.Reagent.Name()
		}
		if e.Solvent != nil {
			got[1] = e.Solvent.Name()
		}
		if got != [2]string{c.reagent, c.solvent} || ok != (c.reagent != "" || c.solvent != "") {
			t.Errorf("Lookup(%q) = %q, %v; want reagent %q, solvent %q", c.in, got, ok, c.reagent, c.solvent)
		}
	}
}

func TestSuggest(t *testing.T) {
	cases := []struct {
		in   string
		want string // must be the first suggestion
	}{
		{"NaN4", "NaN3"},
		{"sodium azde", "sodium azide"},
		{"sodium aizde", "sodium azide"}, // a swap of neighbours counts as one edit
		{"KOBut", "KOtBu"},
		{"tetrahydrofurane", "tetrahydrofuran"},
		{"DMSO2", "DMSO"},
		{"dichloromethan", "dichloromethane"},
		{"triethylamin", "triethylamine"},
		{"Cs2CO", "Cs2CO3"}, // a prefix of a name
		{"aceton", "acetone"},
	}
	for _, c := range cases {
		got := Suggest(c.in, 5)
		if len(got) == 0 || got[0] != c.want {
			t.Errorf("Suggest(%q) = %q, want %q first", c.in, got, c.want)
		}
	}
	if got := Suggest("qqqqqqqq", 5); len(got) != 0 {
		t.Errorf("Suggest of nonsense = %q, want nothing", got)
	}
	if got := Suggest("Na", 3); len(got) != 3 {
		t.Errorf("Suggest(Na, 3) = %q, want three names", got)
	}
	if got := Suggest("", 3); got != nil {
		t.Errorf("Suggest(\"\") = %q", got)
	}
	// Each suggestion names a different substance.
	seen := map[Entry]bool{}
	for _, s := range Suggest("sodium", 10) {
		e, _ := Lookup(s)
		if seen[e] {
			t.Errorf("Suggest(sodium) offers %s twice", e.Name())
		}
		seen[e] = true
	}
}

// Solubility hints as the trade uses them (common practice): salts
// dissolve in water and dipolar aprotic solvents, poorly in ethers and
// hydrocarbons; NaI dissolves in acetone while NaBr and NaCl do not
// (Finkelstein, Ber. Dtsch. Chem. Ges. 1910, 43, 1528).
func TestDissolvesIn(t *testing.T) {
	cases := []struct {
		reagent, solvent string
		want             Solubility
	}{
		{"NaI", "acetone", Dissolves},
		{"NaBr", "acetone", DissolvesPoorly},
		{"NaCl", "acetone", DissolvesPoorly},
		{"NaN3", "DMF", Dissolves},
		{"NaN3", "water", Dissolves},
		{"NaN3", "toluene", DissolvesPoorly},
		{"NaN3", "THF", DissolvesPoorly},
		{"KOtBu", "THF", Dissolves},
		{"KOtBu", "tBuOH", Dissolves},
		{"TBAI", "DCM", Dissolves},
		{"K2CO3", "hexane", DissolvesPoorly},
		{"NaH", "DMF", DissolvesPoorly},
		{"BnBr", "hexane", Dissolves},
		{"LiCl", "THF", Dissolves},
	}
	for _, c := range cases {
		r, _ := Lookup(c.reagent)
		s, _ := Lookup(c.solvent)
		if got := r.Reagent.DissolvesIn(s.Solvent); got != c.want {
			t.Errorf("%s in %s: %d, want %d", c.reagent, c.solvent, got, c.want)
		}
	}
	if got := (&Reagent{}).DissolvesIn(&Solvent{}); got != SolubilityUnknown {
		t.Errorf("empty hints: %d, want unknown", got)
	}
}

func TestNamesAndDetail(t *testing.T) {
	names := Builtin().Names()
	if len(names) < 400 {
		t.Errorf("only %d names", len(names))
	}
	found := false
	for _, n := range names {
		if n.Text == "NaN3" {
			found = true
			if n.Detail != "reagent · nucleophile · [N-]=[N+]=[N-]" {
				t.Errorf("detail of NaN3 = %q", n.Detail)
			}
		}
		if n.Detail == "" || n.Entry.IsZero() {
			t.Errorf("name %q has no detail or entry", n.Text)
		}
	}
	if !found {
		t.Error("NaN3 missing from Names")
	}
	e, _ := Lookup("DMSO")
	if d := Detail(e); d != "solvent · polar aprotic · ε 46.45 · bp 189 °C" {
		t.Errorf("Detail(DMSO) = %q", d)
	}
}

func TestRoleAndBulkWords(t *testing.T) {
	for _, w := range RoleWords() {
		r, ok := ParseRole(w)
		if !ok || r.String() != w {
			t.Errorf("role %q round-trips to %q", w, r)
		}
	}
	if (Nucleophile|Base).String() != "nucleophile, base" || Role(0).String() != "none" {
		t.Error("Role.String")
	}
	for _, w := range []string{"small", "moderate", "hindered"} {
		if b, ok := ParseBulk(w); !ok || b.String() != w {
			t.Errorf("bulk %q", w)
		}
	}
	if _, ok := ParseBulk("huge"); ok {
		t.Error("ParseBulk accepted huge")
	}
}

// Mixtures are estimated from their components; the checks here are of
// the estimate's stated rules, with the component data from the tables.
func TestMixture(t *testing.T) {
	thf, _ := Lookup("THF")
	water, _ := Lookup("water")
	acetone, _ := Lookup("acetone")
	m := Mixture([]*Solvent{thf.Solvent, water.Solvent}, []float64{1, 1})
	if !m.Protic || m.Class != ClassPolarProtic || m.BoilingC.V != 66 {
		t.Errorf("THF/water 1:1: %+v", m)
	}
	if want := (7.58 + 78.36) / 2; m.Dielectric.V < want-0.01 || m.Dielectric.V > want+0.01 {
		t.Errorf("THF/water 1:1 dielectric %v, want %v", m.Dielectric.V, want)
	}
	if !strings.Contains(m.Dielectric.Source, "estimate") || m.Name() != "THF/water 1:1" {
		t.Errorf("mixture name %q, source %q", m.Name(), m.Dielectric.Source)
	}
	if !m.HasHazard(HazardPeroxideFormer) {
		t.Error("a mixture keeps its components' hazards")
	}
	// 20:1 acetone–water: under a tenth of water, still counted aprotic.
	m = Mixture([]*Solvent{acetone.Solvent, water.Solvent}, []float64{20, 1})
	if m.Protic || m.Class != ClassPolarAprotic {
		t.Errorf("acetone/water 20:1: protic %v, class %s", m.Protic, m.Class)
	}
	if Mixture(nil, nil) != nil || Mixture([]*Solvent{thf.Solvent}, []float64{0}) != nil {
		t.Error("empty mixtures should be nil")
	}
	if m := Mixture([]*Solvent{thf.Solvent, water.Solvent}, nil); m == nil || m.Name() != "THF/water 1:1" {
		t.Errorf("equal parts by default: %v", m)
	}
}

// The server looks names up from many requests at once; run with -race.
func TestConcurrentUse(t *testing.T) {
	d, _ := Load([]byte(`alias Zed = NaN3`), "lab")
	done := make(chan bool)
	for i := 0; i < 4; i++ {
		go func() {
			for j := 0; j < 200; j++ {
				Lookup("NaN3")
				d.Lookup("Zed")
				Suggest("sodium azde", 3)
			}
			done <- true
		}()
	}
	for i := 0; i < 4; i++ {
		<-done
	}
}
