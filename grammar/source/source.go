// Package source holds positions in host documents (notebook pages, plan
// files, notebook cells) and the one mapper between byte offsets and the
// editor's line and UTF-16 character positions.
package source

// Pos is a byte offset into a host document, like go/token.Pos but plain.
type Pos int

// Span is a half-open byte range [Start, End) in a host document.
type Span struct{ Start, End Pos }

// Len returns the number of bytes in s.
func (s Span) Len() int { return int(s.End - s.Start) }

// Contains reports whether p lies in s (an empty span contains its start).
func (s Span) Contains(p Pos) bool {
	return s.Start <= p && (p < s.End || s.Start == s.End && p == s.Start)
}

// Shift returns s moved by d bytes.
func (s Span) Shift(d Pos) Span { return Span{s.Start + d, s.End + d} }
