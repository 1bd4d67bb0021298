package analyze

import (
	"context"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strings"
	"testing"
	"walden/internal/golden"

	"walden/grammar/source"
)

// TestFeatures runs every notebook under testdata/features. Each is a
// small document: step lines, and after a step a comment line
//
//	// want: code code …
//
// naming diagnostics the step must carry ("// want: none" for a step that
// must carry no error or warning). The full analysis — diagnostics with
// the text they mark, fixes, inlay and hover — is compared with the
// golden file beside it; run with -update to rewrite it after checking
// the difference by eye.
func TestFeatures(t *testing.T) {
	needOutcome(t)
	gaps := knownGaps(t)
	seen := map[[2]string]bool{}
	ran, want := 0, 0
	defer func() {
		if ran < want {
			return // some files filtered out with -run: their gaps were not looked for
		}
		for k, g := range gaps {
			if !seen[k] {
				t.Errorf("known gap no longer happens (fixed?): %s on %q; remove it from testdata/features/known-gaps.tsv", g.code, g.step)
			}
		}
	}()
	files, _ := filepath.Glob("testdata/features/*")
	for _, f := range files {
		kind := MarkdownPage
		switch filepath.Ext(f) {
		case ".steps":
			kind = PlanFile
		case ".md":
		default:
			continue
		}
		want++
		t.Run(filepath.Base(f), func(t *testing.T) {
			ran++
			text, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			reps, err := NewEngine(Config{}).Analyze(context.Background(), []Source{{Name: f, Kind: kind, Text: text}})
			if err != nil {
				t.Fatal(err)
			}
			checkWants(t, text, reps[0], gaps, seen)
			golden.Check(t, f+".golden", describe(text, reps[0]))
		})
	}
}

// knownGap is one listed case where a "// want: none" step carries a
// finding the chemistry does not support: the step line (trimmed, as
// written), the code, and why the finding is wrong with its source.
type knownGap struct{ step, code, why string }

// knownGaps reads testdata/features/known-gaps.tsv. Each entry must still
// happen: TestFeatures fails on a listed gap that no longer occurs, so the
// list cannot keep an entry that has been fixed.
func knownGaps(t *testing.T) map[[2]string]knownGap {
	t.Helper()
	m := map[[2]string]knownGap{}
	data, err := os.ReadFile("testdata/features/known-gaps.tsv")
	if err != nil {
		t.Fatal(err)
	}
	for i, l := range strings.Split(string(data), "\n") {
		if strings.TrimSpace(l) == "" || strings.HasPrefix(l, "#") {
			continue
		}
		f := strings.Split(l, "\t")
		if len(f) != 3 || f[0] == "" || f[1] == "" || strings.TrimSpace(f[2]) == "" {
			t.Errorf("known-gaps.tsv:%d: want step<TAB>code<TAB>why, got %q", i+1, l)
			continue
		}
		m[[2]string{f[0], f[1]}] = knownGap{f[0], f[1], f[2]}
	}
	return m
}

var wantLine = regexp.MustCompile(`(?m)^[ \t]*//[ \t]*want:[ \t]*(.*)$`)

// checkWants checks the "// want:" comments against the diagnostics of
// the step line just above each.
func checkWants(t *testing.T, text []byte, rep *Report, gaps map[[2]string]knownGap, seen map[[2]string]bool) {
	t.Helper()
	m := source.NewMapper(text)
	for _, loc := range wantLine.FindAllSubmatchIndex(text, -1) {
		at := source.Pos(loc[0])
		want := strings.Fields(strings.ReplaceAll(string(text[loc[2]:loc[3]]), ",", " "))
		var step *StepReport
		for i := range rep.Steps {
			if rep.Steps[i].Span.End <= at {
				step = &rep.Steps[i]
			}
		}
		line := m.Point(at).Line
		if step == nil {
			t.Errorf("line %d: '// want:' with no step above it", line)
			continue
		}
		got := map[string]bool{}
		serious := []string{}
		for _, d := range rep.Diagnostics {
			if d.Span.Start >= step.Span.Start && d.Span.Start <= step.Span.End {
				got[d.Code] = true
				if d.Severity <= Warning {
					serious = append(serious, d.Code)
				}
			}
		}
		for _, w := range want {
			if w == "none" {
				var wrong []string
				stepText := strings.TrimSpace(string(text[step.Span.Start:step.Span.End]))
				for _, c := range serious {
					k := [2]string{stepText, c}
					if g, gap := gaps[k]; gap {
						seen[k] = true
						t.Logf("line %d: known gap %s: %s", line, c, g.why)
						continue
					}
					wrong = append(wrong, c)
				}
				if len(wrong) > 0 {
					t.Errorf("line %d: want no errors or warnings on %q, got %v", line, text[step.Span.Start:step.Span.End], wrong)
				}
				continue
			}
			if !got[w] {
				var have []string
				for c := range got {
					have = append(have, c)
				}
				sort.Strings(have)
				t.Errorf("line %d: want %s on %q, got %v", line, w, text[step.Span.Start:step.Span.End], have)
			}
		}
	}
}

// describe writes a report as a readable document: each step with its
// inlay, the diagnostics under it with the text they mark, fixes and
// related parties, and the hover.
func describe(text []byte, rep *Report) string {
	var b strings.Builder
	m := source.NewMapper(text)
	quote := func(s source.Span) string { return fmt.Sprintf("%q", text[s.Start:s.End]) }
	for _, st := range rep.Steps {
		fmt.Fprintf(&b, "== %d: %s\n", m.Point(st.Span.Start).Line, text[st.Span.Start:st.Span.End])
		if st.Label != "" {
			fmt.Fprintf(&b, "   label: %s\n", st.Label)
		}
		if st.Inlay != "" {
			fmt.Fprintf(&b, "   inlay: %s\n", st.Inlay)
		}
		for _, d := range rep.Diagnostics {
			if d.Span.Start < st.Span.Start || d.Span.Start > st.Span.End {
				continue
			}
			fmt.Fprintf(&b, "   %s %s on %s: %s\n", d.Severity, d.Code, quote(d.Span), d.Message)
			for _, r := range d.Related {
				fmt.Fprintf(&b, "      related %s: %s\n", quote(r.Span), r.Message)
			}
			for _, f := range d.Fixes {
				fmt.Fprintf(&b, "      fix %q:%s\n", f.Title, edits(text, f.Edits))
			}
		}
		for _, f := range st.Fixes {
			fmt.Fprintf(&b, "   action %q:%s\n", f.Title, edits(text, f.Edits))
		}
		if md, _, ok := rep.Hover(st.Span.Start + source.Pos(len(st.Label))); ok {
			for _, l := range strings.Split(strings.TrimRight(md, "\n"), "\n") {
				fmt.Fprintf(&b, "   | %s\n", l)
			}
		}
	}
	return b.String()
}

func edits(text []byte, es []Edit) string {
	var b strings.Builder
	for _, e := range es {
		fmt.Fprintf(&b, " %q→%q", text[e.Span.Start:e.Span.End], e.NewText)
	}
	return b.String()
}

// needOutcome skips tests that need predictions while the outcome
// engine is not wired in.
func needOutcome(t *testing.T) {
	t.Helper()
	if runOutcome == nil {
		t.Skip("waiting for outcome.Predict")
	}
}
