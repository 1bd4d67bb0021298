package analyze

import (
	"context"
	"testing"
)

// FuzzParseSettings: any text gives a Config and positioned errors inside
// the text, never a panic.
func FuzzParseSettings(f *testing.F) {
	for _, s := range []string{"names = x\n", "disable = a, b\nsolvent = DMF\ntemperature = 25 °C\n", "=\n", "temperature: rt", "a b c", "\xff=\x00"} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, text []byte) {
		_, errs := ParseSettings("/lab", text)
		for _, e := range errs {
			if e.Span.Start < 0 || int(e.Span.End) > len(text) || e.Span.Start > e.Span.End {
				t.Fatalf("error span %v outside the text of %d bytes", e.Span, len(text))
			}
		}
	})
}

// FuzzAnalyze: any plan text gives reports whose spans lie in the text,
// never a panic or a hang.
func FuzzAnalyze(f *testing.F) {
	for _, s := range []string{
		"tos: C[C@H](O)CCc1ccccc1 + TsCl + pyridine, DCM, 0 °C\naz: @tos + NaN3, DMF, 60 °C -> C[C@@H](N=[N+]=[N-])CCc1ccccc1",
		"CCCCBr + NaN3, DMFF, 25 °C", "@x + y", "a: b: c", "CC(C)(C)Br + KOtBu, THF, reflux", "[x] C + , -> ->",
		"CI + OCC + NaH (sealed tube), DMSO, 200 °C",
	} {
		f.Add([]byte(s))
	}
	e := NewEngine(Config{})
	f.Fuzz(func(t *testing.T, text []byte) {
		if len(text) > 4096 {
			return
		}
		reps, _ := e.Analyze(context.Background(), []Source{{Kind: PlanFile, Text: text}, {Kind: MarkdownPage, Text: text}})
		for _, r := range reps {
			for _, d := range r.Diagnostics {
				if d.Span.Start < 0 || int(d.Span.End) > len(text) || d.Span.Start > d.Span.End {
					t.Fatalf("diagnostic %s span %v outside the text of %d bytes", d.Code, d.Span, len(text))
				}
				for _, fx := range d.Fixes {
					for _, ed := range fx.Edits {
						if ed.Span.Start < 0 || int(ed.Span.End) > len(text) {
							t.Fatalf("fix %q edit span %v outside the text", fx.Title, ed.Span)
						}
					}
				}
			}
			for _, s := range r.Steps {
				r.Hover(s.Span.Start)
				r.Complete(s.Span.End)
			}
		}
	})
}
