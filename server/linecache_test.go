package server

import (
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
