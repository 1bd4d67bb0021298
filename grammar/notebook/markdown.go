package notebook

import (
	"bytes"
	"fmt"
)

// FindMarkdown finds the step lines of a Markdown text (a page, or the
// text of one notebook cell): the lines of fenced code blocks whose info
// string's first word is "reaction".
//
// Fences follow CommonMark 0.31.2, section 4.5 "Fenced code blocks": at
// least three backticks or tildes, indented at most three spaces relative
// to the enclosing list item's content; a backtick fence's info string
// holds no backtick; the block ends at a fence of the same character at
// least as long, followed only by spaces, or else where its list item ends
// (a non-blank line indented less than the item's content, section 5.2)
// or at the end of the text. An unclosed reaction block is reported, and
// its lines are still read, as CommonMark reads them. Other fenced blocks
// are skipped whole, so a fence line inside them is not taken for ours.
//
// Not handled: fences inside block quotes ("> ```reaction"), and the
// lazy-continuation subtleties of list items; tabs count to the next
// multiple of four columns as CommonMark says.
func FindMarkdown(text []byte) *Page {
	pg := &Page{}
	if binary(text, pg) {
		return pg
	}
	var itemBuf [8]int
	items := itemBuf[:0] // content columns of the open list items, innermost last
	var f fence          // the fenced block we are in, when inFence
	inFence := false
	it := newLineIter(text)
	// The lines of the text bound its step lines: room for that many
	// saves growing the list a dozen times over on a long page.
	pg.Lines = make([]Line, 0, it.lines)
	for {
		start, end, ok := it.line()
		if !ok {
			break
		}
		col, first := indentation(text, start, end)
		blank := first == end
		if inFence {
			if !blank && col < f.base {
				f.unclosed(pg, "its list item ends first")
				inFence = false
			} else {
				if !blank && col-f.base <= 3 && f.closedBy(text, first, end) {
					if f.reaction {
						b := &pg.Blocks[f.block]
						b.Closed, b.Span.End = true, span(first, end).End
					}
					inFence = false
					continue
				}
				if f.reaction {
					pg.Blocks[f.block].Span.End = span(start, end).End
					if a, b := trimLine(text, first, end); a < b {
						if isComment(text, a, b) {
							pg.Comments = append(pg.Comments, span(a, b))
						} else {
							pg.Lines = append(pg.Lines, Line{Span: span(a, b), Block: f.block})
						}
					}
				}
				continue
			}
		}
		if blank {
			continue
		}
		for len(items) > 0 && col < items[len(items)-1] {
			items = items[:len(items)-1]
		}
		base := 0
		if len(items) > 0 {
			base = items[len(items)-1]
		}
		// Open list items on this line, then look for a fence.
		i := first
		for col-base < 4 {
			w, ok := listMarker(text, i, end)
			if !ok {
				break
			}
			after := i + w
			acol, afirst := indentationFrom(text, after, end, col+w)
			content := acol
			if afirst == end || acol-(col+w) > 4 {
				content = col + w + 1 // blank after the marker, or indented code
			}
			items = append(items, content)
			base = content
			if afirst == end {
				break
			}
			i, col = afirst, acol
		}
		if col-base >= 4 {
			continue // indented code, not a fence
		}
		if nf, ok := openFence(text, i, end); ok {
			nf.base = base
			if nf.reaction {
				nf.block = len(pg.Blocks)
				a, b := trimLine(text, i, end)
				pg.Blocks = append(pg.Blocks, Block{Span: span(a, b), Fence: span(a, b)})
			}
			f, inFence = nf, true
		}
	}
	if inFence {
		f.unclosed(pg, "the text ends first")
	}
	return pg
}

// fence is an open fenced code block.
type fence struct {
	char     byte // '`' or '~'
	n        int  // fence length
	base     int  // content column of the enclosing list item (0 at top level)
	reaction bool
	block    int // index in Page.Blocks when reaction
}

// unclosed reports a reaction block left open.
func (f *fence) unclosed(pg *Page, why string) {
	if !f.reaction {
		return
	}
	b := pg.Blocks[f.block]
	marks := string(bytes.Repeat([]byte{f.char}, f.n))
	pg.Errors.Add(b.Fence, "unclosed-fence", fmt.Sprintf(
		"reaction block is not closed (%s); add a line %s after its last step, or the rest of the block is read as steps", why, marks))
}

// closedBy reports whether text[i:end] closes f.
func (f *fence) closedBy(text []byte, i, end int) bool {
	n := 0
	for i+n < end && text[i+n] == f.char {
		n++
	}
	if n < f.n {
		return false
	}
	for _, c := range text[i+n : end] {
		if c != ' ' && c != '\t' {
			return false
		}
	}
	return true
}

// openFence reads an opening fence at text[i:end]; ok is false when
// there is none.
func openFence(text []byte, i, end int) (f fence, ok bool) {
	if i >= end || text[i] != '`' && text[i] != '~' {
		return fence{}, false
	}
	c, n := text[i], 0
	for i+n < end && text[i+n] == c {
		n++
	}
	if n < 3 {
		return fence{}, false
	}
	info := bytes.TrimSpace(text[i+n : end])
	if c == '`' && bytes.IndexByte(info, '`') >= 0 {
		return fence{}, false // an inline code span, not a fence
	}
	word := info
	if k := bytes.IndexAny(info, " \t"); k >= 0 {
		word = info[:k]
	}
	return fence{char: c, n: n, reaction: bytes.EqualFold(word, []byte("reaction"))}, true
}

// listMarker returns the width of a list item marker at text[i:end]
// ("-", "*", "+", or one to nine digits and "." or ")"), which must be
// followed by a space, a tab or the end of the line (CommonMark 5.2).
func listMarker(text []byte, i, end int) (int, bool) {
	if i >= end {
		return 0, false
	}
	w := 0
	switch c := text[i]; {
	case c == '-' || c == '*' || c == '+':
		w = 1
	case '0' <= c && c <= '9':
		for i+w < end && w < 10 && '0' <= text[i+w] && text[i+w] <= '9' {
			w++
		}
		if w > 9 || i+w >= end || text[i+w] != '.' && text[i+w] != ')' {
			return 0, false
		}
		w++
	default:
		return 0, false
	}
	if i+w < end && text[i+w] != ' ' && text[i+w] != '\t' {
		return 0, false
	}
	// "---" and "***" are thematic breaks, not items; a fence never starts
	// with these characters, so treating them as markers does no harm
	// beyond that line.
	return w, true
}

// indentation returns the column of the first non-space character of
// text[start:end] and its offset (end when the line is blank).
func indentation(text []byte, start, end int) (col, first int) {
	return indentationFrom(text, start, end, 0)
}

// indentationFrom is indentation starting at column col.
func indentationFrom(text []byte, i, end, col int) (int, int) {
	for ; i < end; i++ {
		switch text[i] {
		case ' ':
			col++
		case '\t':
			col += 4 - col%4
		default:
			return col, i
		}
	}
	return col, end
}
