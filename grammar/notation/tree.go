package notation

import (
	"walden/grammar/source"
)

// Tree holds the syntax of one or more step lines: the text they were
// read from, once, and their nodes as small records in one slice. A
// node refers to its children by their distance in the slice and to its
// text by offsets, and holds no pointer, so that a page of ten thousand
// steps is some hundred allocations the garbage collector need not scan,
// rather than a hundred thousand small ones it must. Node handles (Step,
// Term, Substance, Quantity) read the records on demand; texts such as
// a substance's are slices of the Tree's text, made only when asked for.
//
// A Tree is never changed once built, so it may be read by several
// goroutines at once.
type Tree struct {
	src   string     // the text the nodes' offsets index
	base  source.Pos // host offset of src[0]
	nodes []node
}

// nodeKind is the kind of a node record.
type nodeKind uint8

const (
	nStep nodeKind = iota + 1
	nTerm
	nSubstance
	nQuantity
	nNote
)

// node is one record of a Tree, 24 bytes. Offsets (start, end, and those
// kept in b and c) are relative to Tree.base; child references are
// distances forward from the node, 0 meaning none. The other fields
// mean, by kind:
//
//	step:      the terms follow it; flags the optional parts (hasMark
//	           and kin); sub the MarkState; a the numbers of reactants
//	           and conditions, b that of products and where the arrow
//	           starts, c where the label ends and the comment starts,
//	           as pairs (pack16) of offsets into the line. The mark
//	           opens the line and the label follows it, after spaces;
//	           the comment runs to the line's end
//	term:      sub the SepKind (0: no separator); a the first child:
//	           the substance if flags has termSubstance, then b
//	           quantities, then c notes. A term of one part is written
//	           as that part, a substance or a quantity node, in the
//	           term's place, with the SepKind in flags (sepShift)
//	substance: sub the SubstanceKind; flags plainText; a the ratio;
//	           b the first part, c their number
//	quantity:  sub the QuantityKind; flags hasValue; unit the unit's id
//	           if it has a value, else the word's; a the upper end of a
//	           range; b, c the unit's span
//
// A quantity keeps no number: Value and Ratio read it again from the
// text with the functions that read it first, which costs less than
// eight more bytes in every node of every page.
type node struct {
	kind       nodeKind
	sub        uint8
	flags      uint8
	unit       uint8
	start, end int32
	a, b, c    int32
}

// pack16 and unpack16 keep two numbers below 1<<16 in one field: counts
// and offsets within one line, which is at most MaxLineLength long.
func pack16(lo, hi int32) int32 { return lo | hi<<16 }

func unpack16(v int32) (lo, hi int32) { return v & 0xffff, int32(uint32(v) >> 16) }

// Lines fit pack16.
const _ = uint(1<<16 - 1 - MaxLineLength)

// sepShift is where the SepKind of a term written as its one part
// stands in the part's flags, above the part's own flag.
const sepShift = 1

// sepBefore returns the offset of the separator before a term that
// starts at offset start. Only spaces stand between them, as the lexer
// skips nothing else, so the Tree need not keep it: it is the last byte
// before the spaces, read backwards by the rule of parser.spaceAt.
func (t *Tree) sepBefore(start int32) int32 {
	s := t.src[:start]
	for {
		switch n := len(s); {
		case n >= 1 && (s[n-1] == ' ' || s[n-1] == '\t'):
			s = s[:n-1]
		case n >= 2 && s[n-2] == 0xC2 && s[n-1] == 0xA0:
			s = s[:n-2]
		case n >= 3 && s[n-3] == 0xE2 && s[n-2] == 0x80 && (s[n-1] == 0x82 || s[n-1] == 0x83 || s[n-1] == 0x89 || s[n-1] == 0xAF):
			s = s[:n-3]
		default:
			return int32(n - 1)
		}
	}
}

func (t *Tree) pos(rel int32) source.Pos { return t.base + source.Pos(rel) }

func (t *Tree) span(n *node) source.Span {
	return source.Span{Start: t.base + source.Pos(n.start), End: t.base + source.Pos(n.end)}
}

// text returns the text at the host span sp.
func (t *Tree) text(sp source.Span) string { return t.src[sp.Start-t.base : sp.End-t.base] }

// singleSpaced returns the words of a Phrase, which lie apart by runs of
// the spaces the lexer skips, joined by single ASCII spaces.
func singleSpaced(s string) string {
	b := make([]byte, 0, len(s))
	for i := 0; i < len(s); {
		if n := spaceLen(s[i:]); n > 0 {
			for i < len(s) {
				if n = spaceLen(s[i:]); n == 0 {
					break
				}
				i += n
			}
			b = append(b, ' ')
			continue
		}
		b = append(b, s[i])
		i++
	}
	return string(b)
}

// spaceLen is the length of the space at the start of s, by the rule of
// parser.spaceAt, or 0.
func spaceLen(s string) int {
	if s == "" {
		return 0
	}
	switch s[0] {
	case ' ', '\t':
		return 1
	case 0xC2:
		if len(s) > 1 && s[1] == 0xA0 {
			return 2
		}
	case 0xE2:
		if len(s) > 2 && s[1] == 0x80 {
			switch s[2] {
			case 0x82, 0x83, 0x89, 0xAF:
				return 3
			}
		}
	}
	return 0
}
