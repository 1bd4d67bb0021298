package server

import (
	"context"
	"encoding/json"
	"reflect"
	"sort"
	"strings"
	"testing"

	"walden/analyze"
	"walden/grammar/source"
)

// The per-line cache says exactly what encoding every diagnostic afresh
// says, over edits that type within a line, insert and delete lines, and
// move a finding onto another line.
func TestLineCacheMatchesFresh(t *testing.T) {
	type diag = analyze.Diagnostic
	texts := []string{
		"a: CCBr + NaN3\nb: CCO é 🧪 x\n\nc: @a + KOtBu\n",
		"a: CCBr + NaN3\nb: CCO é 🧪 xy\n\nc: @a + KOtBu\n",
		"new line\na: CCBr + NaN3\nb: CCO é 🧪 xy\n\nc: @a + KOtBu\n",
		"a: CCBr + NaN3\nb: CCO é 🧪 xy\n\nc: @a + KOtBu\n",
		"a: CCBr + NaN3\r\nb: CCO é 🧪 xy\r\n\r\nc: @a + KOtBu",
	}
	// findings placed by a search for fixed words on each line, so that
	// they follow the text as an Engine's would.
	find := func(text string) []diag {
		var out []diag
		add := func(word, code string, related bool) {
			for i := 0; i+len(word) <= len(text); i++ {
				if text[i:i+len(word)] == word {
					d := diag{Code: code, Severity: analyze.Warning, Message: "about " + word,
						Span: source.Span{Start: source.Pos(i), End: source.Pos(i + len(word))}}
					if related {
						d.Related = []analyze.Related{{Span: source.Span{Start: source.Pos(i), End: source.Pos(i + 1)}, Message: "here"}}
					}
					out = append(out, d)
				}
			}
		}
		add("CCBr", "one", true)
		add("x", "two", false)
		add("KOtBu", "three", true)
		add("@a", "four", false)
		// one finding spanning two lines, never cached
		out = append(out, diag{Code: "wide", Severity: analyze.Error, Message: "wide", Span: source.Span{Start: 0, End: source.Pos(len(text) - 1)}})
		sortDiags(out)
		return out
	}
	c := newLineCache()
	for round := 0; round < 2; round++ {
		for v, text := range texts {
			d := newDocument("file:///lab/p.md", int32(v), analyze.MarkdownPage, []byte(text))
			r := &analyze.Report{Diagnostics: find(text)}
			got := string(c.appendDiagnostics(nil, d, r))
			want := appendPublishDiagnostics(nil, &publishDiagnosticsParams{URI: d.uri, Diagnostics: lspDiagnostics(d, r)})
			wantArr := string(want[len(`{"uri":"file:///lab/p.md","diagnostics":`) : len(want)-1])
			if got != wantArr {
				t.Fatalf("round %d, text %d:\ncached %s\nfresh  %s", round, v, got, wantArr)
			}
		}
	}
	if len(c.lines) > 64+8 {
		t.Errorf("cache holds %d lines for pages of 5", len(c.lines))
	}
}

func sortDiags(ds []analyze.Diagnostic) {
	for i := 1; i < len(ds); i++ {
		for j := i; j > 0 && ds[j].Span.Start < ds[j-1].Span.Start; j-- {
			ds[j], ds[j-1] = ds[j-1], ds[j]
		}
	}
}

// With an Engine's Reports read line by line (AnalyzeLines), the cache
// says what encoding the full Report afresh says, over typing, inserted
// and deleted lines, labels that stop resolving and an unclosed fence.
func TestLineCacheMatchesFullReport(t *testing.T) {
	page := "# Page\r\n\r\n```reaction\r\na: CC(C)(Br)CC + KOtBu, THF, 60 °C\r\nCCCCBr + NaN3, EtOH, 25 °C\r\n@a + NaN3, DMF, 25 °C\r\nCCCCO + NaN3, DMF, 25 °C é\r\n```\r\n"
	edits := []func(string) string{
		func(s string) string { return strings.Replace(s, "EtOH, 25", "EtOH, 255", 1) },
		func(s string) string {
			return strings.Replace(s, "```reaction\r\n", "```reaction\r\nCCBr + NaN3, EtOH, 30 °C\r\n", 1)
		},
		func(s string) string { return strings.Replace(s, "a: CC", "b: CC", 1) },
		func(s string) string { return strings.Replace(s, "b: CC", "a: CC", 1) },
		func(s string) string { return strings.Replace(s, "CCBr + NaN3, EtOH, 30 °C\r\n", "", 1) },
		func(s string) string { return s + "\r\n```reaction\r\nCCCBr + NaN3, MeOH, 25 °C\r\n" },
		func(s string) string { return "Intro 🧪\r\n" + s },
	}
	e := analyze.NewEngine(analyze.Config{})
	c := newLineCache()
	text := page
	for i := -1; i < len(edits); i++ {
		if i >= 0 {
			text = edits[i](text)
		}
		d := newDocument("file:///lab/p.md", int32(i+2), analyze.MarkdownPage, []byte(text))
		reps, err := e.AnalyzeLines(context.Background(), []analyze.Source{{Name: "p.md", Kind: analyze.MarkdownPage, Text: []byte(text)}})
		if err != nil {
			t.Fatal(err)
		}
		if _, _, ok := reps[0].AppendLines(nil); !ok {
			t.Fatal("AnalyzeLines gave a Report without Lines")
		}
		got := c.appendDiagnostics(nil, d, reps[0])
		full := reps[0].Full()
		want := appendPublishDiagnostics(nil, &publishDiagnosticsParams{URI: d.uri, Diagnostics: lspDiagnostics(d, full)})
		var g, w []any
		if err := json.Unmarshal(got, &g); err != nil {
			t.Fatalf("edit %d: not JSON: %v\n%s", i, err, got)
		}
		var wp struct{ Diagnostics []any }
		_ = json.Unmarshal(want, &wp)
		w = wp.Diagnostics
		if len(w) == 0 {
			t.Fatalf("edit %d: the page draws no diagnostics; the test needs some", i)
		}
		canon := func(xs []any) []string {
			out := make([]string, len(xs))
			for k, x := range xs {
				b, _ := json.Marshal(x)
				out[k] = string(b)
			}
			sort.Strings(out)
			return out
		}
		if !reflect.DeepEqual(canon(g), canon(w)) {
			t.Errorf("edit %d:\ncached %s\nfresh  %s", i, got, want)
		}
	}
}
