package server

import (
	"testing"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

func rng(sl, sc, el, ec uint32) *protocol.Range {
	return &protocol.Range{Start: protocol.Position{Line: sl, Character: sc}, End: protocol.Position{Line: el, Character: ec}}
}

// Incremental edits are positioned in UTF-16 code units, as LSP counts them
// (LSP 3.17, "Text Documents": "character offsets ... based on a UTF-16
// string representation"): 'é', '°' and '→' are one unit, an emoji two.
func TestEdited(t *testing.T) {
	for _, tc := range []struct {
		name    string
		text    string
		changes []contentChange
		want    string
		warn    bool
	}{
		{"full text", "old", []contentChange{{Text: "new"}}, "new", false},
		{"insert", "CCBr + NaI\n", []contentChange{{Range: rng(0, 4, 0, 4), Text: "C"}}, "CCBrC + NaI\n", false},
		{"after é", "é CCBr\n", []contentChange{{Range: rng(0, 2, 0, 6), Text: "CCI"}}, "é CCI\n", false},
		{"after °", "25 °C, CCBr\n", []contentChange{{Range: rng(0, 7, 0, 11), Text: "X"}}, "25 °C, X\n", false},
		{"after →", "A → B\n", []contentChange{{Range: rng(0, 4, 0, 5), Text: "C"}}, "A → C\n", false},
		{"after an emoji", "🧪 CCBr\n", []contentChange{{Range: rng(0, 3, 0, 7), Text: "CCl"}}, "🧪 CCl\n", false},
		{"CRLF lines", "a\r\nb\r\nc", []contentChange{{Range: rng(1, 0, 1, 1), Text: "B"}}, "a\r\nB\r\nc", false},
		{"in sequence", "abc", []contentChange{{Range: rng(0, 0, 0, 1), Text: "xy"}, {Range: rng(0, 2, 0, 3), Text: "Z"}}, "xyZc", false},
		{"multi-line", "a\nb\nc\n", []contentChange{{Range: rng(0, 1, 2, 0), Text: "-"}}, "a-c\n", false},
		{"character past the line end", "ab\ncd\n", []contentChange{{Range: rng(0, 9, 0, 9), Text: "!"}}, "ab!\ncd\n", false},
		{"line past the end", "ab\n", []contentChange{{Range: rng(7, 0, 7, 0), Text: "!"}}, "ab\n!", true},
	} {
		t.Run(tc.name, func(t *testing.T) {
			d := newDocument("file:///x.md", 1, analyze.MarkdownPage, []byte(tc.text))
			nd, warnings := d.edited(2, tc.changes)
			if got := string(nd.text()); got != tc.want {
				t.Errorf("text %q, want %q", got, tc.want)
			}
			if (len(warnings) > 0) != tc.warn {
				t.Errorf("warnings %v, want some: %v", warnings, tc.warn)
			}
			if nd.version != 2 || string(d.text()) != tc.text {
				t.Errorf("the old version changed or the new one has version %d", nd.version)
			}
		})
	}
}

func TestKindOf(t *testing.T) {
	for _, tc := range []struct {
		uri, lang string
		want      analyze.SourceKind
	}{
		{"file:///a/plan.md", "markdown", analyze.MarkdownPage},
		{"file:///a/plan.MARKDOWN", "", analyze.MarkdownPage},
		{"file:///a/route.steps", "", analyze.PlanFile},
		{"untitled:Untitled-1", PlanLanguageID, analyze.PlanFile},
		{"untitled:Untitled-2", "markdown", analyze.MarkdownPage},
		{"file:///a/notes.txt", "plaintext", 0},
		{"file:///a/main.go", "go", 0},
	} {
		if got := kindOf(protocol.DocumentURI(tc.uri), tc.lang); got != tc.want {
			t.Errorf("kindOf(%s, %s) = %v, want %v", tc.uri, tc.lang, got, tc.want)
		}
	}
}
