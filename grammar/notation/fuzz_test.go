package notation

import (
	"testing"
	"unicode/utf8"

	"walden/grammar/source"
)

// FuzzParse: any bytes give a tree and errors whose spans lie in the
// line, in order, without a panic.
func FuzzParse(f *testing.F) {
	for _, s := range []string{
		"[x] azide: @mesylate + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1 // ok",
		"(S)-4-phenylbutan-2-ol + potassium phthalimide, acetone–water 4:1, 0 °C to rt, 2 d",
		"CC(Br)C +", "CCBr + NaN3, DM", "@ + ,, NaN3 (1.5 eq", "F/C=C/F + THF/, −78 °C -> rt -> ->",
		"1,4-dioxane, N,N-DMF,60 °C", "CCBr>>C", "[-]x", "a: ", "((((", "0–25 °C to", "12-16 h, 3 mol %",
	} {
		f.Add([]byte(s), 7)
	}
	f.Fuzz(func(t *testing.T, line []byte, base int) {
		base = base & 0xffff
		st, errs := Parse(line, source.Pos(base))
		lo, hi := source.Pos(base), source.Pos(base+len(line))
		for i, e := range errs {
			if e.Span.Start < lo || e.Span.End > hi || e.Span.Start > e.Span.End {
				t.Fatalf("error span %v outside [%d,%d): %s", e.Span, lo, hi, e.Msg)
			}
			if i > 0 && errs.Less(i, i-1) {
				t.Fatal("errors not sorted")
			}
			if e.Code == "" || !utf8.ValidString(e.Code) {
				t.Fatalf("error without code: %s", e.Msg)
			}
		}
		if len(errs) > maxErrors+1 {
			t.Fatalf("%d errors", len(errs))
		}
		Inspect(st, func(n Node) bool {
			if n.Pos() < lo || n.End() > hi || n.Pos() > n.End() {
				t.Fatalf("%T span [%d,%d) outside [%d,%d)", n, n.Pos(), n.End(), lo, hi)
			}
			return true
		})
		_ = st.String()
		if len(st.t.nodes) != cap(st.t.nodes) {
			t.Fatalf("Parse sized the Tree for %d nodes and wrote %d", cap(st.t.nodes), len(st.t.nodes))
		}

		// The batch parser agrees with Parse on every line of the input
		// read as a host text.
		var spans []source.Span
		start := 0
		for i := 0; i <= len(line); i++ {
			if i == len(line) || line[i] == '\n' {
				spans = append(spans, source.Span{Start: source.Pos(start), End: source.Pos(i)})
				start = i + 1
			}
		}
		steps, allErrs := ParseLines(line, spans)
		var wantAll source.ErrorList
		for i, sp := range spans {
			want, wantErrs := Parse(line[sp.Start:sp.End], sp.Start)
			if steps[i].String() != want.String() {
				t.Fatalf("ParseLines differs from Parse on %q:\n%s\n%s", line[sp.Start:sp.End], steps[i], want)
			}
			wantAll = append(wantAll, wantErrs...)
		}
		if len(allErrs) != len(wantAll) {
			t.Fatalf("ParseLines gives %d errors, Parse %d", len(allErrs), len(wantAll))
		}
		for i := range wantAll {
			if *allErrs[i] != *wantAll[i] {
				t.Fatalf("error %d: ParseLines gives %v, Parse %v", i, allErrs[i], wantAll[i])
			}
		}
	})
}
