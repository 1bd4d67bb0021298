package notebook

import (
	"bytes"
	"reflect"
	"testing"

	"walden/grammar/source"
)

// checkPage fails when a line, block, comment or error of pg lies outside
// text or when lines are out of order.
func checkPage(t *testing.T, text []byte, pg *Page) {
	n := source.Pos(len(text))
	in := func(s source.Span) bool { return 0 <= s.Start && s.Start <= s.End && s.End <= n }
	var prev source.Pos = -1
	for _, l := range pg.Lines {
		if !in(l.Span) || l.Span.Start <= prev || l.Span.Len() == 0 {
			t.Fatalf("line span %v (text %d bytes, previous %d)", l.Span, n, prev)
		}
		if bytes.ContainsAny(text[l.Span.Start:l.Span.End], "\r\n") {
			t.Fatalf("line %v holds a line end", l.Span)
		}
		if l.Block >= len(pg.Blocks) {
			t.Fatalf("line in block %d of %d", l.Block, len(pg.Blocks))
		}
		prev = l.Span.Start
	}
	for _, b := range pg.Blocks {
		if !in(b.Span) || !in(b.Fence) {
			t.Fatalf("block %v", b)
		}
	}
	for _, c := range pg.Comments {
		if !in(c) {
			t.Fatalf("comment %v", c)
		}
	}
	for _, e := range pg.Errors {
		if !in(e.Span) || e.Msg == "" {
			t.Fatalf("error %v", e)
		}
	}
}

// FuzzMarkdown: the fence finder never panics, and what it finds lies in
// the text.
func FuzzMarkdown(f *testing.F) {
	for _, s := range []string{
		"```reaction\nCCBr + NaN3\n```\n", "- x\n  ~~~~reaction\n  A\n  ~~~\nB", "1. ```reaction\r\nA\r\n```",
		"````reaction\n```\n````", "    ```reaction\n", "```reaction `x`\n", "\ufeff```reaction\nA", "\x00",
		"> ```reaction\n> A\n> ```", "* * *\n- - ```reaction\n    A",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, text []byte) {
		checkPage(t, text, FindMarkdown(text))
		checkPage(t, text, FindPlan(text))
	})
}

// FuzzNotebook: the notebook reader never panics; a failure is exactly
// one positioned error, and a success positions every line in its cell.
func FuzzNotebook(f *testing.F) {
	for _, s := range []string{
		`{"nbformat":4,"cells":[{"cell_type":"markdown","source":["` + "```reaction\\n" + `","A + B\n","` + "```" + `"]}]}`,
		`{"nbformat":4,"cells":[{"cell_type":"markdown","source":"x"},{"cell_type":"code","source":[],"outputs":[{}]}]}`,
		`{"nbformat":3}`, `{"nbformat":4,"cells":[`, `[]`, ``, `{"cells":[],"nbformat":4,"x":{"y":[1,2,{"z":null}]}}`,
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		nb, errs := ReadNotebook(data)
		if nb == nil {
			t.Fatal("nil notebook")
		}
		if len(errs) > 0 {
			if len(errs) != 1 || len(nb.Cells) != 0 {
				t.Fatalf("%d errors, %d cells", len(errs), len(nb.Cells))
			}
			e := errs[0]
			if e.Span.Start < 0 || e.Span.End > source.Pos(len(data)) || e.Span.Start > e.Span.End {
				t.Fatalf("error span %v in %d bytes", e.Span, len(data))
			}
			return
		}
		for _, c := range nb.Cells {
			if c.Page != nil {
				checkPage(t, c.Text, c.Page)
			}
		}
	})
}

// FuzzEdited checks that a page derived by Edited after a change equals
// the page found afresh in the changed text, for Markdown and plan
// texts; where Edited declines, nothing is checked.
func FuzzEdited(f *testing.F) {
	page := "# p\n\n- item\n  ```reaction\n  s1: CCBr + NaN3, DMF  \n  // note\n  CC(C)Br + KOtBu\n  ```\n\n```reaction\n/x + y\n`a` + b\n```\ntext\r\nCCO + NaH\r\n"
	for _, s := range []struct {
		text, repl string
		at, cut    uint16
	}{
		{page, "C", 30, 0}, {page, "", 28, 3}, {page, "/", 116, 0}, {page, "x", 117, 0}, {page, "  ", 43, 0},
		{page, "K", 47, 2}, {page, "", 40, 14}, {page, "q", 150, 0}, {"```reaction\nA + B\n```", "", 13, 2},
		{"```reaction\nA + B  \n", "C", 17, 0}, {"A + B\nC", "D", 1, 0}, {"\ufeffA + B", "x", 4, 0},
	} {
		f.Add([]byte(s.text), []byte(s.repl), s.at, s.cut)
	}
	f.Fuzz(func(t *testing.T, old, repl []byte, at, cut uint16) {
		start := int(at) % (len(old) + 1)
		end := min(start+int(cut), len(old))
		text := append(append(append([]byte{}, old[:start]...), repl...), old[end:]...)
		for _, find := range []func([]byte) *Page{FindMarkdown, FindPlan} {
			got, ok := Edited(find(old), old, text)
			if !ok {
				continue
			}
			if want := find(text); !reflect.DeepEqual(got, want) {
				t.Fatalf("%q with %d-%d replaced by %q:\ngot  %+v\nwant %+v", old, start, end, repl, got, want)
			}
		}
	})
}
