package notebook

import (
	"math/bits"
	"runtime"
	"strconv"
	"sync"
	"sync/atomic"
	"unicode/utf16"
	"unicode/utf8"

	"walden/grammar/source"
)

// readFast reads a well-formed nbformat 4 notebook in one pass over its
// bytes, and reports false for anything else: invalid JSON, a field of
// the wrong shape, another nbformat, a string that encoding/json would
// mend (invalid UTF-8, a lone surrogate). ReadNotebook then reads the
// file again with readChecked, which words every error; the two
// readings agree on every notebook this one accepts (FuzzNotebookFast).
// A notebook of ten thousand steps is mostly strings, and encoding/json,
// token by token, took ten times as long to read it.
func readFast(data []byte) (*Notebook, bool) {
	s := scanner{data: data}
	nb := &Notebook{}
	format, sawCells := 0.0, false
	s.space()
	ok := s.byte('{') && s.list('}', func() bool {
		key, ok := s.key()
		if !ok {
			return false
		}
		switch string(key) {
		case "nbformat":
			v, ok := s.number()
			format = v
			return ok && v == float64(int(v)) && v >= 1
		case "cells":
			sawCells = true
			return s.cells(nb)
		}
		return s.value(0)
	})
	if !ok {
		return nil, false
	}
	s.space()
	if s.i != len(data) || format != 4 || !sawCells {
		return nil, false
	}
	if !finishCells(data, nb.Cells, s.sources) {
		return nil, false
	}
	return nb, true
}

// finishCells decodes each cell's source from its JSON value, which
// the scan only skipped, and finds the step lines of the markdown cells,
// on every core when there are many: cells are separate
// texts, and a notebook of a thousand cells spends longer on them than
// on the rest of its JSON. It reports false when a source is not one
// readFast reads.
func finishCells(data []byte, cells []*Cell, sources []source.Span) bool {
	var failed atomic.Bool
	finish := func(lo, hi int) {
		var s scanner
		for k := lo; k < hi; k++ {
			c, raw := cells[k], sources[k]
			s.data, s.i = data[:raw.End], int(raw.Start)
			text, ok := s.source()
			if !ok || s.i != int(raw.End) {
				failed.Store(true)
				return
			}
			c.Text = text
			if c.Kind == "markdown" {
				c.Page = FindMarkdown(c.Text)
			}
		}
	}
	workers := min(runtime.GOMAXPROCS(0), len(cells)/parallelCells)
	if workers < 2 {
		finish(0, len(cells))
		return !failed.Load()
	}
	var wg sync.WaitGroup
	for w := range workers - 1 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			finish(w*len(cells)/workers, (w+1)*len(cells)/workers)
		}()
	}
	finish((workers-1)*len(cells)/workers, len(cells)) // the calling goroutine takes the last share
	wg.Wait()
	return !failed.Load()
}

// parallelCells is the fewest cells per goroutine in finishCells, about
// a tenth of a millisecond of work.
const parallelCells = 64

// scanner reads JSON (RFC 8259) from data at i.
type scanner struct {
	data    []byte
	i       int
	buf     []byte        // a string being decoded, reused
	sources []source.Span // the cells' sources as JSON, for finishCells
}

// maxDepth is the deepest nesting value skips, as encoding/json allows.
const maxDepth = 10000

func (s *scanner) space() {
	for s.i < len(s.data) {
		switch s.data[s.i] {
		case ' ', '\t', '\n', '\r':
			s.i++
		default:
			return
		}
	}
}

// list reads the members of an object or the elements of a list, up to
// end, with item, which reads one and reports whether it could.
func (s *scanner) list(end byte, item func() bool) bool {
	for first := true; ; first = false {
		s.space()
		if s.byte(end) {
			return true
		}
		if !first {
			if !s.byte(',') {
				return false
			}
			s.space()
		}
		if !item() {
			return false
		}
	}
}

// byte consumes c if it comes next.
func (s *scanner) byte(c byte) bool {
	if s.i < len(s.data) && s.data[s.i] == c {
		s.i++
		return true
	}
	return false
}

// key reads an object key and its colon. The key is valid until the
// next string is read.
func (s *scanner) key() ([]byte, bool) {
	k, ok := s.str()
	if !ok {
		return nil, false
	}
	s.space()
	if !s.byte(':') {
		return nil, false
	}
	s.space()
	return k, true
}

// cells reads the list of cells.
func (s *scanner) cells(nb *Notebook) bool {
	return s.byte('[') && s.list(']', func() bool {
		c := &Cell{Index: len(nb.Cells)}
		start := s.i
		sawSource := false
		var raw source.Span // the source's JSON value
		ok := s.byte('{') && s.list('}', func() bool {
			key, ok := s.key()
			if !ok {
				return false
			}
			switch string(key) {
			case "cell_type":
				kind, ok := s.str()
				c.Kind = string(kind)
				return ok
			case "source":
				// Only where the source ends is found here: it is
				// decoded, and so checked, by finishCells, on every
				// core. A second source would go unchecked:
				// encoding/json reads such a cell.
				if sawSource {
					return false
				}
				sawSource = true
				at := s.i
				ok := s.skipSource()
				raw = span(at, s.i)
				return ok
			}
			return s.value(0)
		})
		if !ok || !sawSource {
			return false
		}
		c.JSON = span(start, s.i)
		nb.Cells = append(nb.Cells, c)
		s.sources = append(s.sources, raw)
		return true
	})
}

// source reads a cell's source: a string, or a list of strings joined.
func (s *scanner) source() ([]byte, bool) {
	if s.i < len(s.data) && s.data[s.i] == '"' {
		b, ok := s.str()
		return append(make([]byte, 0, len(b)), b...), ok
	}
	text := []byte{} // not nil: strings.Join of no strings gives ""
	ok := s.byte('[') && s.list(']', func() bool {
		b, ok := s.str()
		text = append(text, b...)
		return ok
	})
	return text, ok
}

// skipSource moves past a cell's source, a string or a list of strings,
// finding only where it ends.
func (s *scanner) skipSource() bool {
	if s.i < len(s.data) && s.data[s.i] == '"' {
		return s.skipStr()
	}
	return s.byte('[') && s.list(']', func() bool {
		return s.i < len(s.data) && s.data[s.i] == '"' && s.skipStr()
	})
}

// skipStr moves past the string at s.i, looking only at quotes and
// backslashes; its bytes are checked when it is decoded.
func (s *scanner) skipStr() bool {
	j := s.i + 1 // after the opening quote
	for {
		for j+8 <= len(s.data) && quoteOrBackslash8(le64(s.data[j:])) == 0 {
			j += 8
		}
		for j < len(s.data) && s.data[j] != '"' && s.data[j] != '\\' {
			j++
		}
		switch {
		case j >= len(s.data):
			return false
		case s.data[j] == '"':
			s.i = j + 1
			return true
		}
		j += 2 // a backslash and the byte it escapes
	}
}

// str reads a string and returns its decoded bytes, valid until the next
// call. It refuses what encoding/json would decode with replacements.
func (s *scanner) str() ([]byte, bool) {
	if !s.byte('"') {
		return nil, false
	}
	s.buf = s.buf[:0]
	for s.i < len(s.data) {
		// Plain bytes up to the next quote, backslash, control or
		// non-ASCII byte are taken as they stand, found eight at a time.
		j := s.i
		for j+8 <= len(s.data) {
			if m := special8(le64(s.data[j:])); m != 0 {
				j += bits.TrailingZeros64(m) / 8
				break
			}
			j += 8
		}
		for j < len(s.data) {
			c := s.data[j]
			if c == '"' || c == '\\' || c < 0x20 || c >= utf8.RuneSelf {
				break
			}
			j++
		}
		s.buf = append(s.buf, s.data[s.i:j]...)
		s.i = j
		if j == len(s.data) {
			return nil, false
		}
		switch c := s.data[j]; {
		case c == '"':
			s.i++
			return s.buf, true
		case c < 0x20:
			return nil, false
		case c >= utf8.RuneSelf:
			r, size := utf8.DecodeRune(s.data[j:])
			if r == utf8.RuneError && size == 1 {
				return nil, false // encoding/json would put U+FFFD
			}
			s.buf = append(s.buf, s.data[j:j+size]...)
			s.i += size
		default: // '\\'
			if !s.escape() {
				return nil, false
			}
		}
	}
	return nil, false
}

// le64 reads eight bytes, little-endian (encoding/binary's name is taken
// in this package by the binary-file check).
func le64(b []byte) uint64 {
	_ = b[7]
	return uint64(b[0]) | uint64(b[1])<<8 | uint64(b[2])<<16 | uint64(b[3])<<24 |
		uint64(b[4])<<32 | uint64(b[5])<<40 | uint64(b[6])<<48 | uint64(b[7])<<56
}

// special8 returns a mask whose lowest set bit is the high bit of the
// first of the eight bytes of x (little-endian) that is a quote, a
// backslash, a control byte or not ASCII, or 0 when there is none.
// Bits above the lowest may be set wrongly (a borrow carries into the
// next byte), never the lowest.
func special8(x uint64) uint64 {
	const ones, highs = 0x0101010101010101, 0x8080808080808080
	control := (x - 0x20*ones) &^ x & highs
	return (x | control | quoteOrBackslash8(x)) & highs
}

// quoteOrBackslash8 is special8 for quotes and backslashes only.
func quoteOrBackslash8(x uint64) uint64 {
	const ones, highs = 0x0101010101010101, 0x8080808080808080
	quote := ((x ^ '"'*ones) - ones) &^ (x ^ '"'*ones) & highs
	backslash := ((x ^ '\\'*ones) - ones) &^ (x ^ '\\'*ones) & highs
	return quote | backslash
}

// escape decodes the escape sequence at s.i.
func (s *scanner) escape() bool {
	if s.i+1 >= len(s.data) {
		return false
	}
	c := s.data[s.i+1]
	s.i += 2
	switch c {
	case '"', '\\', '/':
		s.buf = append(s.buf, c)
	case 'b':
		s.buf = append(s.buf, '\b')
	case 'f':
		s.buf = append(s.buf, '\f')
	case 'n':
		s.buf = append(s.buf, '\n')
	case 'r':
		s.buf = append(s.buf, '\r')
	case 't':
		s.buf = append(s.buf, '\t')
	case 'u':
		r, ok := s.hex4()
		if !ok {
			return false
		}
		if utf16.IsSurrogate(r) {
			// Only a high surrogate followed by an escaped low one makes
			// a character; anything else encoding/json replaces.
			if r >= 0xDC00 || s.i+1 >= len(s.data) || s.data[s.i] != '\\' || s.data[s.i+1] != 'u' {
				return false
			}
			s.i += 2
			lo, ok := s.hex4()
			if !ok || lo < 0xDC00 || lo > 0xDFFF {
				return false
			}
			r = utf16.DecodeRune(r, lo)
		}
		s.buf = utf8.AppendRune(s.buf, r)
	default:
		return false
	}
	return true
}

// hex4 reads the four hexadecimal digits of a \u escape.
func (s *scanner) hex4() (rune, bool) {
	if s.i+4 > len(s.data) {
		return 0, false
	}
	v, err := strconv.ParseUint(string(s.data[s.i:s.i+4]), 16, 32)
	if err != nil {
		return 0, false
	}
	s.i += 4
	return rune(v), true
}

// number reads a number as encoding/json does.
func (s *scanner) number() (float64, bool) {
	start := s.i
	if !s.skipNumber() {
		return 0, false
	}
	v, err := strconv.ParseFloat(string(s.data[start:s.i]), 64)
	return v, err == nil
}

// skipNumber moves past a number: -?(0|[1-9][0-9]*)(.[0-9]+)?([eE][+-]?[0-9]+)?
func (s *scanner) skipNumber() bool {
	s.byte('-')
	switch {
	case s.byte('0'):
	case s.digits() == 0:
		return false
	}
	if s.byte('.') && s.digits() == 0 {
		return false
	}
	if s.byte('e') || s.byte('E') {
		if !s.byte('+') {
			s.byte('-')
		}
		if s.digits() == 0 {
			return false
		}
	}
	return true
}

// digits moves past a run of digits and returns its length.
func (s *scanner) digits() int {
	start := s.i
	for s.i < len(s.data) && '0' <= s.data[s.i] && s.data[s.i] <= '9' {
		s.i++
	}
	return s.i - start
}

// value moves past any value, at the given nesting depth.
func (s *scanner) value(depth int) bool {
	if depth >= maxDepth || s.i >= len(s.data) {
		return false
	}
	switch c := s.data[s.i]; c {
	case '"':
		_, ok := s.str()
		return ok
	case '{', '[':
		end := byte('}')
		if c == '[' {
			end = ']'
		}
		s.i++
		return s.list(end, func() bool {
			if c == '{' {
				if _, ok := s.key(); !ok {
					return false
				}
			}
			return s.value(depth + 1)
		})
	case 't':
		return s.literal("true")
	case 'f':
		return s.literal("false")
	case 'n':
		return s.literal("null")
	}
	return s.skipNumber()
}

// literal moves past the word w.
func (s *scanner) literal(w string) bool {
	if len(s.data)-s.i < len(w) || string(s.data[s.i:s.i+len(w)]) != w {
		return false
	}
	s.i += len(w)
	return true
}
