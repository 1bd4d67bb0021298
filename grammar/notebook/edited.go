package notebook

import (
	"bytes"
	"slices"
	"sort"

	"walden/grammar/source"
)

// Edited returns the page of text given prev, the page of old, when the
// two differ only inside one step line of prev, as after a keystroke in
// a long page: that line's span ends where the change leaves it, and
// every later position moves by the change in length, without the text
// being read again. It works for Markdown and plan texts alike, since a
// line inside a step line's text cannot change what either finder makes
// of the lines around it.
//
// ok is false whenever the change might do more, and the caller reads
// text afresh: a changed byte that is a line end, a fence character or
// NUL; a change at or before a line's first character (which decides its
// indentation, whether it closes a fence and whether it is a comment),
// or outside every step line; a line that the change turns into a
// comment.
func Edited(prev *Page, old, text []byte) (pg *Page, ok bool) {
	if prev == nil || slices.ContainsFunc(prev.Errors, func(e *source.Error) bool { return e.Code == "binary" }) {
		return nil, false
	}
	p := commonPrefix(old, text)
	s := commonSuffix(old[p:], text[p:])
	oldEnd, newEnd := len(old)-s, len(text)-s
	delta := len(text) - len(old)
	if !plainBytes(old[p:oldEnd]) || !plainBytes(text[p:newEnd]) {
		return nil, false
	}
	// The step line holding the change: the last to start before it.
	k := sort.Search(len(prev.Lines), func(i int) bool { return int(prev.Lines[i].Span.Start) >= p }) - 1
	if k < 0 {
		return nil, false
	}
	a, b := int(prev.Lines[k].Span.Start), int(prev.Lines[k].Span.End)
	lineEnd := b
	for lineEnd < len(old) && (old[lineEnd] == ' ' || old[lineEnd] == '\t') {
		lineEnd++
	}
	switch {
	case p > lineEnd: // in a line after it
		return nil, false
	case old[a] == '`' || old[a] == '~' || old[a] == '/' && p == a+1:
		return nil, false // the change could make a fence or a comment
	}
	// The line's new end, without trailing blanks.
	nb := lineEnd + delta
	for nb > a && (text[nb-1] == ' ' || text[nb-1] == '\t') {
		nb--
	}
	if isComment(text, a, nb) {
		return nil, false
	}
	move := func(x source.Pos) source.Pos {
		if int(x) >= oldEnd {
			return x + source.Pos(delta)
		}
		return x
	}
	moveSpan := func(sp source.Span) source.Span { return source.Span{Start: move(sp.Start), End: move(sp.End)} }
	pg = &Page{Lines: make([]Line, len(prev.Lines))}
	copy(pg.Lines, prev.Lines[:k])
	pg.Lines[k] = Line{Span: span(a, nb), Block: prev.Lines[k].Block}
	for i := k + 1; i < len(prev.Lines); i++ {
		pg.Lines[i] = Line{Span: moveSpan(prev.Lines[i].Span), Block: prev.Lines[i].Block}
	}
	if len(prev.Blocks) > 0 {
		pg.Blocks = make([]Block, len(prev.Blocks))
		for i, bl := range prev.Blocks {
			pg.Blocks[i] = Block{Span: moveSpan(bl.Span), Fence: moveSpan(bl.Fence), Closed: bl.Closed}
		}
	}
	if len(prev.Comments) > 0 {
		pg.Comments = make([]source.Span, len(prev.Comments))
		for i, c := range prev.Comments {
			pg.Comments[i] = moveSpan(c)
		}
	}
	for _, e := range prev.Errors {
		pg.Errors.Add(moveSpan(e.Span), e.Code, e.Msg)
	}
	return pg, true
}

// plainBytes reports whether b holds no line end, fence character or
// NUL: bytes that change how lines are found.
func plainBytes(b []byte) bool {
	for _, c := range b {
		switch c {
		case '\n', '\r', '`', '~', 0:
			return false
		}
	}
	return true
}

// commonPrefix returns how many bytes a and b share at their start. Whole
// blocks are compared first, with the vectorised bytes.Equal: a page is
// compared on every keystroke.
func commonPrefix(a, b []byte) int {
	n := min(len(a), len(b))
	i := 0
	for i+compareBlock <= n && bytes.Equal(a[i:i+compareBlock], b[i:i+compareBlock]) {
		i += compareBlock
	}
	for i < n && a[i] == b[i] {
		i++
	}
	return i
}

// commonSuffix returns how many bytes a and b share at their end.
func commonSuffix(a, b []byte) int {
	n := min(len(a), len(b))
	i := 0
	for i+compareBlock <= n && bytes.Equal(a[len(a)-i-compareBlock:len(a)-i], b[len(b)-i-compareBlock:len(b)-i]) {
		i += compareBlock
	}
	for i < n && a[len(a)-1-i] == b[len(b)-1-i] {
		i++
	}
	return i
}

// compareBlock is how many bytes commonPrefix and commonSuffix compare at
// once.
const compareBlock = 256
