package reagents

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"unicode/utf8"
	"walden/internal/golden"
)

// dumpLab writes what a lab file did to the dictionary: every error, then
// every entry that came from the file, for the golden test.
func dumpLab(d *Dictionary, errs ErrorList) string {
	var b strings.Builder
	b.WriteString("== errors\n")
	for _, e := range errs {
		fmt.Fprintf(&b, "%s [%d,%d)\n", e.Error(), e.Span.Start, e.Span.End)
	}
	b.WriteString("== entries\n")
	for _, g := range d.reagents {
		if g.Origin == "built-in" {
			continue
		}
		fmt.Fprintf(&b, "reagent %s (%s)\n  names: %s\n  whole %s · species %s · counter-ion %q · roles %s · bulk %s\n  pKaH %v %v · n %v %v · soluble %q · hazards %v · needs base %v\n  source %q\n",
			g.Name(), g.Origin, strings.Join(g.Names, " | "), g.Whole, g.Species, g.Counterion, g.Roles, g.Bulk,
			g.PKaH.V, g.PKaH.Known, g.Nucleo.V, g.Nucleo.Known, g.Soluble, g.Hazards, g.NeedsBase, g.Source)
	}
	for _, s := range d.solvents {
		if s.Origin == "built-in" {
			continue
		}
		fmt.Fprintf(&b, "solvent %s (%s)\n  names: %s\n  SMILES %s · ε %v at %v °C · protic %v · class %s · bp %v %v\n  source %q\n",
			s.Name(), s.Origin, strings.Join(s.Names, " | "), s.SMILES, s.Dielectric.V, s.DielectricTempC, s.Protic, s.Class, s.BoilingC.V, s.BoilingC.Known, s.Source)
	}
	for _, probe := range []string{"Huenig", "Hünig base", "NaOH(aq)", "potassium tert-butoxide", "sodium azide solution", "KI"} {
		e, ok := d.Lookup(probe)
		fmt.Fprintf(&b, "lookup %q → %q %v\n", probe, e.Name(), ok)
	}
	return b.String()
}

// The sample lab file in testdata, with its errors and entries, against a
// golden file reviewed by hand (run with -update to rewrite it).
func TestLabFileGolden(t *testing.T) {
	in := filepath.Join("testdata", "lab.names")
	text, err := os.ReadFile(in)
	if err != nil {
		t.Fatal(err)
	}
	d, errs := Load(text, "lab.names")
	got := dumpLab(d, errs)
	golden.Check(t, filepath.Join("testdata", "lab.golden"), got)
}

// Small lab files, each with the errors expected: "line:col: substring".
func TestLabFileErrors(t *testing.T) {
	cases := []struct {
		name string
		text string
		want []string
	}{
		{"empty", "", nil},
		{"comments only", "# nothing\n\n   # indented comment\r\n", nil},
		{"good reagent", `reagent X1: smiles=CCO roles=nucleophile source="from memory"`, nil},
		{"good solvent CRLF", "solvent S1: smiles=CCO dielectric=20 protic=yes source=\"from memory\"\r\n", nil},
		{"bad kind", "reagnt X: smiles=C", []string{"1:1: found \"reagnt\""}},
		{"no colon", "reagent X smiles=C", []string{"1:19: expected ':'"}},
		{"no names", "reagent : smiles=C", []string{"1:9: expected a name, found ':'"}},
		{"empty name in list", "reagent A, : smiles=C roles=base source=x", []string{"1:12: expected a name"}},
		{"unterminated name", `reagent "abc: smiles=C`, []string{"1:9: unterminated quoted name"}},
		{"quote inside bare name", `reagent ab"c: smiles=C`, []string{"1:11: found '\"' inside a bare name"}},
		{"missing required", "reagent A: smiles=C", []string{"1:1: the reagent \"A\" lacks roles=, source="}},
		{"unknown key", `reagent A: smiles=C roles=base sauce=x source="from memory"`, []string{"1:32: unknown key \"sauce\" for a reagent (did you mean source?)"}},
		{"duplicate key", `reagent A: smiles=C smiles=O roles=base source=x`, []string{"1:21: smiles= given twice (first at column 12)"}},
		{"no value", `reagent A: smiles=C roles= source=x`, []string{"1:27: roles= has no value"}},
		{"key without =", `reagent A: smiles=C roles base source=x`, []string{"1:21: found \"roles\", expected key=value"}},
		{"bad number", `reagent A: smiles=C roles=base pKaH=1O source=x`, []string{"1:37: pKaH= found \"1O\", expected a number"}},
		{"NaN number", `reagent A: smiles=C roles=base pKaH=NaN source=x`, []string{"1:37: pKaH= found \"NaN\""}},
		{"bad role", `reagent A: smiles=C roles=base,nucleofile source=x`, []string{"1:32: unknown role \"nucleofile\" (did you mean nucleophile?)"}},
		{"bad hazard", `reagent A: smiles=C roles=base hazards=toxic,boom source=x`, []string{"1:46: unknown hazard \"boom\""}},
		{"bad SMILES", `reagent A: smiles=C1CC roles=base source=x`, []string{"1:20: smiles= is not valid SMILES: ring closure 1"}},
		{"bad soluble", `reagent A: smiles=C roles=base soluble=water,lava source=x`, []string{"1:46: soluble= found \"lava\""}},
		{"bad solvent", `solvent B: smiles=O dielectric=0.5 protic=maybe class=fluffy source=x`, []string{
			"1:32: dielectric= found 0.5", "1:43: protic= found \"maybe\"", "1:55: class= found \"fluffy\""}},
		{"unterminated value", `reagent A: smiles=C roles=base source="from`, []string{"1:39: unterminated quoted value"}},
		{"text after quote", `reagent A: smiles=C roles=base source="x"y`, []string{"1:42: expected a space after the closing quote"}},
		{"duplicate lab name", "reagent A: smiles=C roles=base source=x\nreagent a: smiles=C roles=base source=x", []string{"2:9: \"a\" is already a reagent name on line 1"}},
		{"two built-ins", `reagent NaI, KI: smiles=[Na+].[I-] roles=nucleophile source=x`, []string{"1:9: these names belong to different reagents already (KI, NaI)"}},
		{"replace twice", "reagent NaI: smiles=[Na+].[I-] roles=nucleophile source=x\nreagent sodium iodide: smiles=[Na+].[I-] roles=nucleophile source=x", []string{"2:9: line 1 already replaces the built-in reagent NaI"}},
		{"alias unknown", "alias Foo = NaN4", []string{"1:13: alias target \"NaN4\" is not a known reagent or solvent; did you mean NaN3"}},
		{"alias taken", "alias DMF = NaN3", []string{"1:7: \"DMF\" already names DMF"}},
		{"alias no =", "alias Foo NaN3", []string{"1:15: expected '=' after the names"}},
		{"alias two targets", "alias Foo = NaN3, NaI", []string{"1:13: expected one known name after '=', found 2"}},
		{"alias conflict", "alias Z9 = NaN3\nalias Z9 = NaI", []string{"2:7: \"Z9\" is already an alias of another entry"}},
		{"long name", "reagent " + strings.Repeat("a", 200) + ": smiles=C roles=base source=x", []string{"1:9: the name is longer than"}},
		{"symbol-only name", "reagent --: smiles=C roles=base source=x", []string{"1:9: the name \"--\" has no letters or digits"}},
		{"invalid UTF-8", "reagent \xff: smiles=C roles=base source=x", []string{"1:1: the line is not valid UTF-8"}},
		{"second line", "# c\nreagent A: smiles=C roles=base source=x pKaH=x", []string{"2:46: pKaH= found \"x\""}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, errs := Load([]byte(c.text), "f")
			var got []string
			for _, e := range errs {
				got = append(got, fmt.Sprintf("%d:%d: %s", e.Line, e.Col, e.Msg))
			}
			if len(got) != len(c.want) {
				t.Fatalf("got %d errors, want %d:\n%s", len(got), len(c.want), strings.Join(got, "\n"))
			}
			for i, w := range c.want {
				if !strings.HasPrefix(got[i], w) {
					t.Errorf("error %d = %q, want prefix %q", i, got[i], w)
				}
			}
			for _, e := range errs {
				if e.Span.Start < 0 || int(e.Span.End) > len(c.text) || e.Span.Start > e.Span.End {
					t.Errorf("span %v outside the text", e.Span)
				}
			}
		})
	}
}

// A lab entry replaces the built-in one it names, keeping all the built-in
// names; other entries are unchanged, and the built-in dictionary itself
// is left alone.
func TestLabFileOverrides(t *testing.T) {
	text := `reagent NaN3: smiles=[Na+].[N-]=[N+]=[N-] species=[N-]=[N+]=[N-] counterion=[Na+] roles=nucleophile pKaH=4.6 source="measured in our lab"
solvent DMF: smiles=CN(C)C=O dielectric=38.25 temp=20 protic=no bp=153 source="CRC, 20 °C; checked"
alias azoture = sodium azide`
	d, errs := Load([]byte(text), "lab")
	if len(errs) > 0 {
		t.Fatal(errs)
	}
	for _, n := range []string{"NaN3", "sodium azide", "azoture"} {
		e, _ := d.Lookup(n)
		if e.Reagent == nil || e.Reagent.PKaH.V != 4.6 || !strings.Contains(e.Reagent.PKaH.Source, "measured in our lab (lab:1)") {
			t.Errorf("%s does not lead to the lab entry: %+v", n, e.Reagent)
		}
	}
	if e, _ := d.Lookup("N,N-dimethylformamide"); e.Solvent == nil || e.Solvent.Dielectric.V != 38.25 || e.Solvent.Class != ClassPolarAprotic {
		t.Errorf("DMF not replaced: %+v", e.Solvent)
	}
	if e, _ := Lookup("NaN3"); e.Reagent.PKaH.V != 4.72 {
		t.Error("the built-in dictionary changed")
	}
	if _, ok := Lookup("azoture"); ok {
		t.Error("the alias leaked into the built-in dictionary")
	}
	if len(d.Reagents()) != len(Builtin().Reagents()) {
		t.Error("a replacement added an entry")
	}
}

// FuzzLoad: any bytes give a dictionary and positioned errors, never a
// panic, with spans inside the text and lines and columns that agree
// with the spans.
func FuzzLoad(f *testing.F) {
	seed, _ := os.ReadFile(filepath.Join("testdata", "lab.names"))
	f.Add(seed)
	f.Add([]byte(`reagent A, "b,c": smiles=C roles=base source="x"`))
	f.Add([]byte("alias a = b\n\r\n\"\"\"=:"))
	// A small base dictionary keeps each run short, so that the parser
	// itself gets most of the executions; the seeds above cover the
	// built-in one through TestLabFileGolden.
	var small []*Reagent
	for _, n := range []string{"NaN3", "NaI", "KI", "DIPEA"} {
		e, _ := Lookup(n)
		small = append(small, e.Reagent)
	}
	dmf, _ := Lookup("DMF")
	base := build(small, []*Solvent{dmf.Solvent})
	f.Fuzz(func(t *testing.T, text []byte) {
		d, errs := base.Extend(text, "fuzz")
		if d == nil {
			t.Fatal("nil dictionary")
		}
		for _, e := range errs {
			if e.Span.Start < 0 || int(e.Span.End) > len(text) || e.Span.Start > e.Span.End {
				t.Fatalf("span %v outside [0,%d]: %s", e.Span, len(text), e.Msg)
			}
			if line := 1 + strings.Count(string(text[:e.Span.Start]), "\n"); line != e.Line {
				t.Fatalf("line %d, span says %d", e.Line, line)
			}
			if !utf8.ValidString(e.Msg) && utf8.Valid(text) {
				t.Fatalf("message is not UTF-8: %q", e.Msg)
			}
		}
	})
}
