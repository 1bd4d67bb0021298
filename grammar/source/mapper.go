package source

import (
	"bytes"
	"encoding/binary"
	"errors"
	"fmt"
	"sort"
	"unicode/utf8"
)

// Mapper converts between byte offsets in one text and the editor's
// positions: a 0-based line and a 0-based character counted in UTF-16 code
// units, as the Language Server Protocol counts them. It is the only place
// in walden that does this conversion.
//
// Lines end at "\n", "\r\n" or a lone "\r" (the three line ends the LSP
// specification recognises). A character outside the Basic Multilingual
// Plane (an emoji) counts as two units; each byte of invalid UTF-8 counts
// as one unit, as an editor shows it as one U+FFFD replacement character.
//
// A Mapper records the start of every line when it is made, so each
// conversion costs a binary search plus, on lines that are not pure ASCII,
// a walk over that one line. A Mapper never changes; it is safe for
// concurrent use.
type Mapper struct {
	text   []byte
	starts []int  // byte offset where each line begins; starts[0] == 0
	ascii  []bool // line i holds only ASCII bytes, so characters are bytes
}

// ErrOutOfRange is wrapped by the errors Offset returns for a line or
// character that lies outside the text.
var ErrOutOfRange = errors.New("position out of range")

// NewMapper returns a Mapper for text. The Mapper keeps text; the caller
// must not change it afterwards.
func NewMapper(text []byte) *Mapper {
	m := &Mapper{text: text, starts: make([]int, 1, 1+len(text)/32)}
	m.starts, m.ascii = scanLines(text, 0, len(text)+1, m.starts, make([]bool, 0, cap(m.starts)))
	return m
}

// Replaced returns the Mapper of the text with the bytes of sp replaced
// by repl: a new text, whose lines are read again only around the change
// (an edit in a long document costs a copy, not a scan). A span outside
// the text is clamped to it.
func (m *Mapper) Replaced(sp Span, repl string) *Mapper {
	start := min(max(int(sp.Start), 0), len(m.text))
	end := min(max(int(sp.End), start), len(m.text))
	text := make([]byte, 0, len(m.text)-(end-start)+len(repl))
	text = append(text, m.text[:start]...)
	text = append(text, repl...)
	text = append(text, m.text[end:]...)
	delta := len(repl) - (end - start)

	// Lines are read again from the start of the line before the change,
	// whose line end the change cannot reach, up to the start of the
	// second line after it, whose line end lies wholly after the change:
	// a CR or LF at either side of the change may join or split line ends.
	a := max(m.lineOf(start)-1, 0)
	b := m.lineOf(end) + 2
	stop := len(text) + 1
	if b < len(m.starts) {
		stop = m.starts[b] + delta
	}
	n := &Mapper{text: text}
	n.starts = make([]int, a+1, len(m.starts)+len(repl)/32+4)
	copy(n.starts, m.starts[:a+1])
	n.ascii = make([]bool, a, cap(n.starts))
	copy(n.ascii, m.ascii[:a])
	n.starts, n.ascii = scanLines(text, m.starts[a], stop, n.starts, n.ascii)
	if b < len(m.starts) {
		for _, s := range m.starts[b:] {
			n.starts = append(n.starts, s+delta)
		}
		n.ascii = append(n.ascii, m.ascii[b:]...)
	}
	return n
}

// scanLines reads the lines of text from the line start pos on: it
// appends the ASCII flag of each line it reads to ascii and the start of
// each next line to starts, until the next line would start at stop or
// the text ends.
//
// Line feeds are found with the vectorised IndexByte, then lone carriage
// returns inside each line; a text of Windows or Unix line ends is
// scanned at memory speed.
func scanLines(text []byte, pos, stop int, starts []int, ascii []bool) ([]int, []bool) {
	for {
		lineEnd, next := len(text), -1
		if nl := bytes.IndexByte(text[pos:], '\n'); nl >= 0 {
			lineEnd, next = pos+nl, pos+nl+1
		}
		// A CR ends the line unless it is the CR of a CRLF.
		if cr := bytes.IndexByte(text[pos:lineEnd], '\r'); cr >= 0 && (pos+cr+1 != lineEnd || next < 0) {
			lineEnd, next = pos+cr, pos+cr+1
		}
		ascii = append(ascii, isASCII(text[pos:lineEnd]))
		if next < 0 || next >= stop {
			return starts, ascii
		}
		starts = append(starts, next)
		pos = next
	}
}

// isASCII reports whether b holds only ASCII bytes, eight at a time.
func isASCII(b []byte) bool {
	for len(b) >= 8 {
		if binary.LittleEndian.Uint64(b)&0x8080808080808080 != 0 {
			return false
		}
		b = b[8:]
	}
	for _, c := range b {
		if c >= utf8.RuneSelf {
			return false
		}
	}
	return true
}

// Text returns the text the Mapper was made for.
func (m *Mapper) Text() []byte { return m.text }

// LineCount returns the number of lines; a text ending in a line end has
// a last, empty line after it, as editors show it.
func (m *Mapper) LineCount() int { return len(m.starts) }

// Line returns the span of line i without its line end. It returns an
// empty span at the end of the text when i is out of range.
func (m *Mapper) Line(i int) Span {
	if i < 0 || i >= len(m.starts) {
		n := Pos(len(m.text))
		return Span{n, n}
	}
	return Span{Pos(m.starts[i]), Pos(m.contentEnd(i))}
}

// contentEnd returns the offset where line i's line end begins.
func (m *Mapper) contentEnd(i int) int {
	if i+1 >= len(m.starts) {
		return len(m.text)
	}
	end := m.starts[i+1] - 1
	if m.text[end] == '\n' && end > m.starts[i] && m.text[end-1] == '\r' {
		end--
	}
	return end
}

// lineOf returns the line holding offset p, which must lie in the text.
func (m *Mapper) lineOf(p int) int {
	return sort.Search(len(m.starts), func(k int) bool { return m.starts[k] > p }) - 1
}

// Position returns the 0-based line and UTF-16 character of offset p.
// An offset before the text is taken as 0 and one past its end as its
// end; an offset inside a line end maps to the end of that line's text,
// and one inside a multi-byte character maps to that character's start.
func (m *Mapper) Position(p Pos) (line, char int) {
	q := min(max(int(p), 0), len(m.text))
	line = m.lineOf(q)
	start, end := m.starts[line], m.contentEnd(line)
	upto := min(q, end) - start
	if m.ascii[line] {
		return line, upto
	}
	return line, utf16Len(m.text[start:end], upto)
}

// utf16Len counts the UTF-16 code units of line[:upto]. A character that
// straddles upto does not count: an offset inside a character maps to its
// start. Decoding runs over the whole line so that a byte of invalid UTF-8
// is judged in its real context.
func utf16Len(line []byte, upto int) int {
	n := 0
	for i := 0; i < upto; {
		c := line[i]
		if c < utf8.RuneSelf {
			n++
			i++
			continue
		}
		r, size := utf8.DecodeRune(line[i:])
		if i+size > upto {
			break
		}
		if r >= 0x10000 {
			n += 2
		} else {
			n++
		}
		i += size
	}
	return n
}

// Offset returns the byte offset of the 0-based line and UTF-16
// character. A character past the end of the line's text maps to the end
// of that text, as the LSP specification asks; a character inside a
// surrogate pair maps to the start of that character. A negative line or
// character, or a line past the last, gives the nearest offset in the
// text together with an error wrapping ErrOutOfRange.
func (m *Mapper) Offset(line, char int) (Pos, error) {
	switch {
	case line < 0:
		return 0, fmt.Errorf("line %d: %w (lines start at 0)", line, ErrOutOfRange)
	case line >= len(m.starts):
		return Pos(len(m.text)), fmt.Errorf("line %d: %w (the text has %d lines)", line, ErrOutOfRange, len(m.starts))
	case char < 0:
		return Pos(m.starts[line]), fmt.Errorf("character %d: %w (characters start at 0)", char, ErrOutOfRange)
	}
	start, end := m.starts[line], m.contentEnd(line)
	if m.ascii[line] {
		return Pos(start + min(char, end-start)), nil
	}
	n := 0
	for i := start; i < end; {
		if n >= char {
			return Pos(i), nil
		}
		c := m.text[i]
		if c < utf8.RuneSelf {
			n++
			i++
			continue
		}
		r, size := utf8.DecodeRune(m.text[i:end])
		w := 1
		if r >= 0x10000 {
			w = 2
		}
		if n+w > char {
			return Pos(i), nil // inside a surrogate pair
		}
		n += w
		i += size
	}
	return Pos(end), nil
}

// Point is a position as people read it: 1-based line and 1-based column
// counted in characters (an emoji is one column), for the command line's
// "file:line:column" output.
type Point struct{ Line, Column int }

// String formats p as "line:column".
func (p Point) String() string { return fmt.Sprintf("%d:%d", p.Line, p.Column) }

// Point returns the readable position of offset p, clamped as Position
// clamps it.
func (m *Mapper) Point(p Pos) Point {
	q := min(max(int(p), 0), len(m.text))
	line := m.lineOf(q)
	start, end := m.starts[line], m.contentEnd(line)
	upto := min(q, end)
	if m.ascii[line] {
		return Point{line + 1, upto - start + 1}
	}
	n := 0
	for i := start; i < upto; {
		_, size := utf8.DecodeRune(m.text[i:end])
		if i+size > upto {
			break
		}
		n++
		i += size
	}
	return Point{line + 1, n + 1}
}

// Range returns the LSP positions of both ends of s.
func (m *Mapper) Range(s Span) (startLine, startChar, endLine, endChar int) {
	startLine, startChar = m.Position(s.Start)
	endLine, endChar = m.Position(s.End)
	return
}
