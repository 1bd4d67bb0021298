package analyze

import (
	"context"
	"fmt"
	"reflect"
	"slices"
	"strings"
	"testing"
)

// TestAnalyzeLinesMatchesAnalyze: over a series of edits, the Reports of
// AnalyzeLines, made full, equal those of Analyze, and their Lines put
// back together give the same diagnostics.
func TestAnalyzeLinesMatchesAnalyze(t *testing.T) {
	page := string(benchNotebook(120))
	at := strings.Index(page, "NaI, acetone, 23 °C")
	edits := []func(string) string{
		func(s string) string { return s[:at] + "NaI, acetone, 250 °C" + s[at+len("NaI, acetone, 23 °C"):] },
		func(s string) string { return strings.Replace(s, "s8: ", "s8x: ", 1) },
		func(s string) string { return strings.Replace(s, "s13: ", "s8x: ", 1) }, // a label defined twice
		func(s string) string { return s[:at] + "CCCCBr + KOtBu, THF, 60 °C\n" + s[at:] },
		func(s string) string {
			return strings.Replace(s, "```reaction\n", "```reaction\n@nowhere + NaN3, DMF, 25 °C\n", 1)
		},
		func(s string) string { return s + "```reaction\nCCBr + NaN3, DMF, 25 °C\n" }, // unterminated fence
	}
	lazy, eager := NewEngine(Config{}), NewEngine(Config{})
	text := page
	for i := -1; i < len(edits); i++ {
		if i >= 0 {
			text = edits[i](text)
		}
		srcs := []Source{{Name: "a.md", Kind: MarkdownPage, Text: []byte(text)}, {Name: "b.steps", Kind: PlanFile, Text: []byte("@s3 + NaN3, DMF, 25 °C\n")}}
		got, err := lazy.AnalyzeLines(context.Background(), srcs)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := eager.Analyze(context.Background(), srcs)
		for k := range want {
			full := got[k].Full()
			if !reflect.DeepEqual(full.Steps, want[k].Steps) {
				t.Errorf("edit %d source %d: steps differ from Analyze's", i, k)
			}
			if !reflect.DeepEqual(full.Diagnostics, want[k].Diagnostics) {
				t.Errorf("edit %d source %d: diagnostics differ from Analyze's:\n%s", i, k, firstDiff(full.Diagnostics, want[k].Diagnostics))
			}
			// Hover and Complete read no Steps or Diagnostics: the Report
			// as AnalyzeLines made it answers as the full one does.
			for _, st := range want[k].Steps {
				for pos := st.Span.Start; pos <= st.Span.End; pos += 7 {
					if g, w := fmt.Sprint(got[k].Hover(pos)), fmt.Sprint(want[k].Hover(pos)); g != w {
						t.Fatalf("edit %d source %d: hover at %d is\n%s\nwant\n%s", i, k, pos, g, w)
					}
					if g, w := got[k].Complete(pos), want[k].Complete(pos); !reflect.DeepEqual(g, w) {
						t.Fatalf("edit %d source %d: completions at %d differ: %v, want %v", i, k, pos, g, w)
					}
				}
			}
			lines, other, ok := got[k].AppendLines(nil)
			if !ok {
				t.Fatalf("edit %d: a Report of AnalyzeLines has no Lines", i)
			}
			var back []Diagnostic
			back = append(back, other...)
			for _, l := range lines {
				for _, d := range l.Own {
					d.Span = d.Span.Shift(l.Span.Start)
					back = append(back, d)
				}
				back = append(back, l.Extra...)
			}
			key := func(d Diagnostic) string { return d.Code + "|" + d.Message + "|" + fmt.Sprint(d.Span) }
			a, b := make([]string, 0, len(back)), make([]string, 0, len(full.Diagnostics))
			for _, d := range back {
				a = append(a, key(d))
			}
			for _, d := range full.Diagnostics {
				b = append(b, key(d))
			}
			slices.Sort(a)
			slices.Sort(b)
			if !slices.Equal(a, b) {
				t.Errorf("edit %d source %d: Lines give %d diagnostics, Full %d", i, k, len(a), len(b))
			}
		}
	}
	if _, _, ok := (&Report{}).AppendLines(nil); ok {
		t.Error("a Report made by Analyze claims Lines")
	}
}
