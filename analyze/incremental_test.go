package analyze

import (
	"context"
	"fmt"
	"reflect"
	"strings"
	"sync"
	"testing"
)

// TestIncrementalMatchesFresh: after each of a series of edits, the
// Engine that has seen every earlier version reports exactly what a new
// Engine reports for the same text. Cached pieces, shifted or reused,
// must never show through as stale positions, labels or diagnostics.
func TestIncrementalMatchesFresh(t *testing.T) {
	page := string(benchNotebook(120))
	at := strings.Index(page, "NaI, acetone, 23 °C")
	edits := []func(string) string{
		func(s string) string { return s[:at] + "NaI, acetone, 2" + s[at+len("NaI, acetone, 2"):] }, // no change
		func(s string) string { return s[:at] + "NaI, acetone, 250 °C" + s[at+len("NaI, acetone, 23 °C"):] },
		func(s string) string { return s[:at] + "NaI, acetone, 23 °C" + s[at+len("NaI, acetone, 250 °C"):] },
		func(s string) string { return strings.Replace(s, "s8: ", "s8x: ", 1) },           // a label others use goes
		func(s string) string { return strings.Replace(s, "s8x: ", "s8: ", 1) },           // and comes back
		func(s string) string { return strings.Replace(s, "s13: ", "", 1) },               // a label is dropped
		func(s string) string { return s[:at] + "CCCCBr + KOtBu, THF, 60 °C\n" + s[at:] }, // a line is inserted
		func(s string) string { return strings.Replace(s, "CCCCBr + KOtBu, THF, 60 °C\n", "", 1) },
		func(s string) string {
			return strings.Replace(s, "```reaction\n", "```reaction\nC[C@@H](Br)CC + NaN3, ethanol, 40 °C\n", 1)
		},
	}
	e := NewEngine(Config{Disabled: []string{CodeLabelDuplicate}})
	text := page
	for i := -1; i < len(edits); i++ {
		if i >= 0 {
			text = edits[i](text)
		}
		for pass := range 2 { // the second pass reuses placements kept by the first
			srcs := []Source{{Name: "a.md", Kind: MarkdownPage, Text: []byte(text)}, {Name: "b.steps", Kind: PlanFile, Text: []byte("@s3 + NaN3, DMF, 25 °C\n")}}
			got, err := e.Analyze(context.Background(), srcs)
			if err != nil {
				t.Fatal(err)
			}
			want, _ := NewEngine(e.Config()).Analyze(context.Background(), srcs)
			for k := range want {
				if !reflect.DeepEqual(got[k].Steps, want[k].Steps) {
					t.Errorf("edit %d pass %d source %d: steps differ from a fresh Engine's", i, pass, k)
				}
				if !reflect.DeepEqual(got[k].Diagnostics, want[k].Diagnostics) {
					t.Errorf("edit %d pass %d source %d: diagnostics differ from a fresh Engine's:\n%s", i, pass, k, firstDiff(got[k].Diagnostics, want[k].Diagnostics))
				}
			}
		}
	}
}

func firstDiff(got, want []Diagnostic) string {
	for i := range min(len(got), len(want)) {
		if !reflect.DeepEqual(got[i], want[i]) {
			return fmt.Sprintf("#%d got  %+v\n    want %+v", i, got[i], want[i])
		}
	}
	return fmt.Sprintf("lengths %d and %d", len(got), len(want))
}

// TestConcurrentOpen: several long pages opened at once on one Engine,
// each spread over the cores, agree with a fresh Engine (run with -race).
func TestConcurrentOpen(t *testing.T) {
	e := NewEngine(Config{})
	pages := [][]byte{benchNotebook(150), benchNotebook(90), []byte(strings.Replace(string(benchNotebook(150)), "DMF", "DMSO", -1))}
	var wg sync.WaitGroup
	got := make([][]*Report, 2*len(pages))
	for g := range got {
		wg.Add(1)
		go func() {
			defer wg.Done()
			got[g], _ = e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: pages[g%len(pages)]}})
		}()
	}
	wg.Wait()
	for g, reps := range got {
		want, _ := NewEngine(Config{}).Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: pages[g%len(pages)]}})
		if !reflect.DeepEqual(reps[0].Steps, want[0].Steps) || !reflect.DeepEqual(reps[0].Diagnostics, want[0].Diagnostics) {
			t.Errorf("page %d: concurrent analysis differs from a fresh Engine's", g)
		}
	}
}

// TestEditParsesOnlyChangedLines: an edit parses the lines whose text
// changed and no other, however far the edit moves the lines after it.
func TestEditParsesOnlyChangedLines(t *testing.T) {
	page := string(benchNotebook(300))
	e := NewEngine(Config{})
	e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: []byte(page)}})
	at := strings.Index(page, "NaI, acetone, 23 °C")
	edited := page[:at] + "NaI, acetone, 230 °C" + page[at+len("NaI, acetone, 23 °C"):]
	parsed, analysed := e.parsed.Load(), e.Analysed()
	e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: []byte(edited)}})
	if n := e.parsed.Load() - parsed; n != 1 {
		t.Errorf("one line edited: %d lines parsed, want 1", n)
	}
	if n := e.Analysed() - analysed; n != 1 {
		t.Errorf("one line edited, its product unchanged: %d steps analysed, want 1 (the step using its label is cached by product)", n)
	}
}
