// Package notebook finds the step lines in the files chemists keep their
// plans in, each with its exact byte span in its host text:
//
//   - Markdown pages (.md, .markdown): the lines of fenced code blocks
//     whose info string's first word is "reaction";
//   - plan files (.steps): every line that is neither blank nor a comment;
//   - Jupyter notebooks (.ipynb, nbformat 4): the same fenced blocks in
//     markdown cells, each cell a host text of its own.
//
// It knows nothing of chemistry: a step line is found by where it stands,
// not by what it says; grammar/notation parses it.
package notebook

import (
	"bytes"
	"fmt"
	"path/filepath"
	"strings"

	"walden/grammar/source"
)

// Format is a kind of host file.
type Format int

const (
	Markdown Format = iota + 1 // fenced ```reaction blocks in a Markdown page (also one notebook cell)
	Plan                       // a plan file: one step per line
	Jupyter                    // a Jupyter notebook
)

// PlanExt is the file extension of walden's plan files.
const PlanExt = ".steps"

// String returns the format's name in lower case.
func (f Format) String() string {
	switch f {
	case Markdown:
		return "markdown"
	case Plan:
		return "plan"
	case Jupyter:
		return "jupyter"
	}
	return "unknown"
}

// FormatOf returns the format of a file by its extension (case does not
// matter), and false when walden does not read such files.
func FormatOf(path string) (Format, bool) {
	switch strings.ToLower(filepath.Ext(path)) {
	case ".md", ".markdown":
		return Markdown, true
	case PlanExt:
		return Plan, true
	case ".ipynb":
		return Jupyter, true
	}
	return 0, false
}

// Line is one step line found in a host text.
type Line struct {
	// Span is the step's text without its indentation, trailing spaces and
	// line end: the bytes to hand to notation.Parse with Span.Start as base.
	Span source.Span
	// Block is the index in Page.Blocks of the fenced block holding the
	// line, or -1 in a plan file.
	Block int
}

// Block is one fenced reaction block of a Markdown text.
type Block struct {
	Span   source.Span // from the opening fence to the end of the closing fence (or of the last line read)
	Fence  source.Span // the opening fence line, without indentation
	Closed bool        // false when the page or the list item ended first
}

// Page is what was found in one host text. Errors is empty for a well-
// formed text; even with errors, Lines holds every step line found.
type Page struct {
	Lines    []Line
	Blocks   []Block
	Comments []source.Span // whole-line comments among the steps ("// …")
	Errors   source.ErrorList
}

// Find finds the step lines of a Markdown or plan text. Jupyter
// notebooks are JSON and are read with ReadNotebook; Find treats
// Jupyter as Markdown, which is right for the text of one cell.
func Find(f Format, text []byte) *Page {
	if f == Plan {
		return FindPlan(text)
	}
	return FindMarkdown(text)
}

// skipBOM returns where the text starts after a UTF-8 byte order mark,
// which some Windows editors write at the start of a file.
func skipBOM(text []byte) int {
	if bytes.HasPrefix(text, []byte("\xef\xbb\xbf")) {
		return 3
	}
	return 0
}

// binary reports a NUL byte, which no text notebook holds, as one error,
// so that a binary file is refused instead of read as garbage steps.
func binary(text []byte, pg *Page) bool {
	i := bytes.IndexByte(text, 0)
	if i < 0 {
		return false
	}
	pg.Errors.Add(source.Span{Start: source.Pos(i), End: source.Pos(i + 1)}, "binary",
		fmt.Sprintf("binary file: NUL byte at offset %d; walden reads UTF-8 text only", i))
	return true
}

// lineIter walks the lines of a text; each line ends at "\n", "\r\n" or
// a lone "\r", as in source.Mapper.
type lineIter struct {
	text  []byte
	next  int
	cr    bool // the text holds a '\r'
	lines int  // the number of lines, at most
}

// newLineIter returns an iterator over the lines of text after any byte
// order mark. Counting and looking for '\r' once, with the vectorised
// searches, is cheaper than asking again on every line.
func newLineIter(text []byte) lineIter {
	it := lineIter{text: text, next: skipBOM(text), cr: bytes.IndexByte(text, '\r') >= 0}
	it.lines = bytes.Count(text, []byte{'\n'}) + 1
	if it.cr {
		it.lines += bytes.Count(text, []byte{'\r'})
	}
	return it
}

// line returns the next line's start and the end of its text (before the
// line end), and false after the last line. The empty line after a final
// line end is not returned: it holds nothing.
func (it *lineIter) line() (start, end int, ok bool) {
	if it.next >= len(it.text) {
		return 0, 0, false
	}
	start = it.next
	// IndexByte is vectorised and IndexAny is not; a lone CR is rare, so
	// look for LF first and then for a CR before it.
	rest := it.text[start:]
	i := bytes.IndexByte(rest, '\n')
	if i < 0 {
		i = len(rest)
	}
	if it.cr {
		if j := bytes.IndexByte(rest[:i], '\r'); j >= 0 {
			i = j
		}
	}
	if i == len(rest) {
		it.next = len(it.text)
		return start, len(it.text), true
	}
	end = start + i
	it.next = end + 1
	if it.text[end] == '\r' && end+1 < len(it.text) && it.text[end+1] == '\n' {
		it.next++
	}
	return start, end, true
}

// trimLine returns the span of text[start:end] without surrounding spaces
// and tabs.
func trimLine(text []byte, start, end int) (int, int) {
	for start < end && (text[start] == ' ' || text[start] == '\t') {
		start++
	}
	for end > start && (text[end-1] == ' ' || text[end-1] == '\t') {
		end--
	}
	return start, end
}

// isComment reports whether the trimmed line is a whole-line comment.
func isComment(text []byte, start, end int) bool {
	return end-start >= 2 && text[start] == '/' && text[start+1] == '/'
}

func span(a, b int) source.Span { return source.Span{Start: source.Pos(a), End: source.Pos(b)} }
