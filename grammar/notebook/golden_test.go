package notebook

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"walden/internal/golden"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"walden/grammar/notation"
	"walden/grammar/source"
)

// TestGolden reads every sample host under grammar/testdata and writes
// what was found (blocks, step lines, comments, errors, each step's parse
// errors) with LSP positions, to compare with the .golden file beside it.
func TestGolden(t *testing.T) {
	files, err := filepath.Glob("../testdata/*")
	require.NoError(t, err)
	n := 0
	for _, path := range files {
		f, ok := FormatOf(path)
		if !ok {
			continue
		}
		n++
		t.Run(filepath.Base(path), func(t *testing.T) {
			data, err := os.ReadFile(path)
			require.NoError(t, err)
			var out bytes.Buffer
			fmt.Fprintf(&out, "%s (%s)\n", filepath.Base(path), f)
			if f == Jupyter {
				nb, errs := ReadNotebook(data)
				writeErrors(&out, "", source.NewMapper(data), errs)
				for _, c := range nb.Cells {
					fmt.Fprintf(&out, "cell %d (%s) %d bytes\n", c.Index+1, c.Kind, len(c.Text))
					if c.Page != nil {
						writePage(&out, "  ", c.Text, c.Page, c)
					}
				}
			} else {
				writePage(&out, "", data, Find(f, data), nil)
			}
			golden.Check(t, path+".golden", out.String())
		})
	}
	assert.GreaterOrEqual(t, n, 8)
}

func lsp(m *source.Mapper, s source.Span) string {
	l1, c1, l2, c2 := m.Range(s)
	return fmt.Sprintf("%d:%d-%d:%d", l1, c1, l2, c2)
}

func writeErrors(out *bytes.Buffer, indent string, m *source.Mapper, errs source.ErrorList) {
	for _, e := range errs {
		fmt.Fprintf(out, "%serror %s %s: %s\n", indent, lsp(m, e.Span), e.Code, e.Msg)
	}
}

func writePage(out *bytes.Buffer, indent string, text []byte, pg *Page, cell *Cell) {
	m := source.NewMapper(text)
	for i, b := range pg.Blocks {
		fmt.Fprintf(out, "%sblock %d fence %s span %s closed=%v\n", indent, i, lsp(m, b.Fence), lsp(m, b.Span), b.Closed)
	}
	for _, l := range pg.Lines {
		line := text[l.Span.Start:l.Span.End]
		fmt.Fprintf(out, "%sstep %s block %d %q\n", indent, lsp(m, l.Span), l.Block, line)
		if cell != nil {
			fmt.Fprintf(out, "%s  at %s\n", indent, cell.Where(l.Span.Start))
		}
		_, errs := notation.Parse(line, l.Span.Start)
		writeErrors(out, indent+"  ", m, errs)
	}
	for _, c := range pg.Comments {
		fmt.Fprintf(out, "%scomment %s %q\n", indent, lsp(m, c), text[c.Start:c.End])
	}
	writeErrors(out, indent, m, pg.Errors)
}

// TestCellIsMarkdown: the server gets one cell's text at a time; the
// cell's steps are those FindMarkdown finds in that text.
func TestCellIsMarkdown(t *testing.T) {
	data, err := os.ReadFile("../testdata/kestrel.ipynb")
	require.NoError(t, err)
	nb, errs := ReadNotebook(data)
	require.Empty(t, errs)
	require.Len(t, nb.Cells, 5)
	for _, c := range nb.Cells {
		if c.Kind == "markdown" {
			assert.Equal(t, FindMarkdown(c.Text), c.Page)
		} else {
			assert.Nil(t, c.Page)
		}
	}
	assert.Len(t, nb.Cells[0].Page.Lines, 2)
	assert.Len(t, nb.Cells[2].Page.Lines, 2)
}

func TestFormatOf(t *testing.T) {
	for path, want := range map[string]Format{"a.md": Markdown, "B.MARKDOWN": Markdown, "x/plan.steps": Plan, "n.ipynb": Jupyter, "n.txt": 0, "md": 0} {
		got, ok := FormatOf(path)
		assert.Equal(t, want, got, path)
		assert.Equal(t, want != 0, ok, path)
	}
}

// TestFences: CommonMark 0.31.2 section 4.5 cases, each with the step
// lines expected by hand.
func TestFences(t *testing.T) {
	for _, tc := range []struct {
		name, text string
		steps      []string
		errs       int
	}{
		{"backticks", "```reaction\nA\n```\n", []string{"A"}, 0},
		{"tildes", "~~~reaction\nA\n~~~\n", []string{"A"}, 0},
		{"longer close", "```reaction\nA\n`````\nB\n", []string{"A"}, 0},
		{"shorter close is content", "````reaction\nA\n```\nB\n````\n", []string{"A", "```", "B"}, 0},
		{"other char is content", "```reaction\nA\n~~~\n```\n", []string{"A", "~~~"}, 0},
		{"close with info is content", "```reaction\nA\n```x\n```\n", []string{"A", "```x"}, 0},
		{"close indented 3", "```reaction\nA\n   ```\nB\n", []string{"A"}, 0},
		{"close indented 4 is content", "```reaction\nA\n    ```\n```\n", []string{"A", "```"}, 0},
		{"open indented 3", "   ```reaction\nA\n```\n", []string{"A"}, 0},
		{"open indented 4 is code", "    ```reaction\nA\n```\n", nil, 0},
		{"tab indent is code", "\t```reaction\nA\n```\n", nil, 0},
		{"two backticks", "``reaction\nA\n``\n", nil, 0},
		{"backtick in info", "```reaction `x`\nA\n```\n", nil, 0},
		{"tilde info may hold backticks", "~~~reaction `x`\nA\n~~~\n", []string{"A"}, 0},
		{"info case", "```Reaction\nA\n```\n", []string{"A"}, 0},
		{"other language", "```python\nA\n```\n", nil, 0},
		{"reactions is not reaction", "```reactions\nA\n```\n", nil, 0},
		{"unclosed", "```reaction\nA\nB", []string{"A", "B"}, 1},
		{"list item", "- x\n  ```reaction\n  A\n  ```\n", []string{"A"}, 0},
		{"fence on the marker line", "- ```reaction\n  A\n  ```\n", []string{"A"}, 0},
		{"ordered item", "10. x\n    ```reaction\n    A\n    ```\n", []string{"A"}, 0},
		{"nested items", "- a\n  - b\n    ```reaction\n    A\n    ```\n", []string{"A"}, 0},
		{"item ends the block", "- x\n  ```reaction\n  A\nB\n", []string{"A"}, 1},
		{"blank lines inside", "```reaction\n\nA\n\n\nB\n```\n", []string{"A", "B"}, 0},
		{"empty text", "", nil, 0},
		{"no line end after close", "```reaction\nA\n```", []string{"A"}, 0},
	} {
		pg := FindMarkdown([]byte(tc.text))
		var got []string
		for _, l := range pg.Lines {
			got = append(got, tc.text[l.Span.Start:l.Span.End])
		}
		assert.Equal(t, tc.steps, got, tc.name)
		assert.Len(t, pg.Errors, tc.errs, tc.name)
	}
}

func TestPlan(t *testing.T) {
	text := "A\r\n\r\n  // c\r\n  B  \rC"
	pg := FindPlan([]byte(text))
	var got []string
	for _, l := range pg.Lines {
		got = append(got, text[l.Span.Start:l.Span.End])
	}
	assert.Equal(t, []string{"A", "B", "C"}, got)
	require.Len(t, pg.Comments, 1)
	assert.Equal(t, "// c", text[pg.Comments[0].Start:pg.Comments[0].End])
}

// TestHostile: binary data, a 10 MB single line, invalid UTF-8 and
// broken notebooks give clear errors, never a panic.
func TestHostile(t *testing.T) {
	long := strings.Repeat("CCBr + NaN3 ", 10<<20/12)
	pg := FindPlan([]byte(long))
	require.Len(t, pg.Lines, 1)
	_, errs := notation.Parse([]byte(long)[pg.Lines[0].Span.Start:pg.Lines[0].Span.End], 0)
	require.Len(t, errs, 1)
	assert.Contains(t, errs[0].Msg, "at most 16384 bytes")

	pg = FindMarkdown([]byte("```reaction\n" + long))
	assert.Len(t, pg.Lines, 1)
	assert.Len(t, pg.Errors, 1)

	pg = FindMarkdown([]byte("ok\x00\xff"))
	require.Len(t, pg.Errors, 1)
	assert.Equal(t, "binary", pg.Errors[0].Code)

	for _, bad := range []string{"", "[]", "null", "{", `{"nbformat":4}`, `{"nbformat":4,"cells":{}}`, `{"nbformat":4,"cells":[1]}`,
		`{"nbformat":4,"cells":[{"cell_type":3,"source":""}]}`, `{"nbformat":4,"cells":[{"cell_type":"markdown"}]}`,
		`{"nbformat":"4","cells":[]}`, `{"nbformat":4.5,"cells":[]}`, `{"nbformat":4,"cells":[]} {}`, "\x00\x01"} {
		nb, errs := ReadNotebook([]byte(bad))
		require.NotNil(t, nb, "%q", bad)
		assert.Empty(t, nb.Cells, "%q", bad)
		require.Len(t, errs, 1, "%q", bad)
		assert.True(t, errs[0].Span.Start >= 0 && int(errs[0].Span.End) <= len(bad), "%q: %v", bad, errs[0].Span)
	}
}
