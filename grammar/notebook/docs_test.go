package notebook

import (
	"bytes"
	"os"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"walden/grammar/notation"
)

// TestDocExamples: every step shown in README.md (the reaction blocks of
// the page, and those quoted inside its ~~~markdown example)
// parses without a syntax error, so the documentation cannot drift from
// the parser.
func TestDocExamples(t *testing.T) {
	doc, err := os.ReadFile("../../README.md")
	require.NoError(t, err)
	texts := [][]byte{doc}
	if i := bytes.Index(doc, []byte("~~~markdown\n")); i >= 0 {
		rest := doc[i+len("~~~markdown\n"):]
		if j := bytes.Index(rest, []byte("\n~~~")); j >= 0 {
			texts = append(texts, rest[:j+1])
		}
	}
	n := 0
	for _, text := range texts {
		pg := FindMarkdown(text)
		assert.Empty(t, pg.Errors)
		for _, l := range pg.Lines {
			line := text[l.Span.Start:l.Span.End]
			st, errs := notation.Parse(line, 0)
			assert.Empty(t, errs, "%s", line)
			_, ok := st.Substrate()
			assert.True(t, ok, "%s", line)
			n++
		}
	}
	assert.GreaterOrEqual(t, n, 6)
}
