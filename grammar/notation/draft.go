package notation

import "walden/grammar/source"

// The parser reads a line into drafts, records that are easy to patch
// while recovering from errors, and then writes them into the Tree in its
// compact form (emit.go). Drafts live in the parser and are reused from
// line to line, so they cost no allocation; they hold no pointers, so
// that neither filling nor clearing them involves the garbage collector.
// A draft refers to another by its id plus one (0: none), and to a list
// by a range of one of the parser's shared lists.

// draftStep is a Step being read. Its terms are the ids in
// parser.order: nR reactants, nC conditions, nP products.
type draftStep struct {
	Span                        source.Span
	mark                        Mark
	label, arrow, comment       source.Span
	hasMark, hasLabel, hasArrow bool
	hasComment                  bool
	nR, nC, nP                  int
}

// draftTerm is a Term being read.
type draftTerm struct {
	id     int32
	Span   source.Span
	sep    Sep   // Kind 0: none
	sub    int32 // the substance
	q0, q1 int32 // the quantities: parser.qlist[q0:q1]
	n0, n1 int32 // the notes: parser.notes[n0:n1]
}

// draftSubstance is a Substance being read.
type draftSubstance struct {
	id     int32
	Span   source.Span
	Kind   SubstanceKind
	plain  bool  // the text is the source text (see Substance.Text)
	p0, p1 int32 // the parts: parser.slist[p0:p1]
	ratio  int32 // the ratio quantity
}

// draftQuantity is a Quantity being read.
type draftQuantity struct {
	id       int32
	Span     source.Span
	Kind     QuantityKind
	HasValue bool  // a number, which the Tree reads again from the text
	unit     uint8 // index in unitNames
	word     uint8 // index in wordNames
	UnitSpan source.Span
	to       int32 // the upper end of a range
}

// slab hands out drafts of one type from chunks that are kept between
// lines: a pointer to a draft stays valid until reset, and its id finds
// it again. The drafts it hands out are not cleared: newTerm and its
// kin overwrite them whole, with a composite literal of their concrete
// type, which the compiler clears inline (a generic clear costs a call).
type slab[T any] struct {
	chunks []*[slabChunk]T
	cur    *[slabChunk]T // the chunk of the next draft, once it is taken
	next   int32         // the id of the next draft
}

const slabChunk = 32

// get returns a draft, holding whatever it last held, and its id. It is
// small enough to be inlined: a chunk is a pointer to an array, so the
// index needs no bounds check, and a new chunk is taken out of line.
func (s *slab[T]) get() (*T, int32) {
	id := s.next
	if uint32(id)%slabChunk == 0 {
		s.grow(id)
	}
	s.next = id + 1
	return &s.cur[uint32(id)%slabChunk], id
}

// grow moves to the chunk of the draft id, the first of its chunk,
// making the chunk if it is new.
func (s *slab[T]) grow(id int32) {
	c := int(uint32(id) / slabChunk)
	if c == len(s.chunks) {
		s.chunks = append(s.chunks, new([slabChunk]T))
	}
	s.cur = s.chunks[c]
}

// at returns the draft with the given id.
func (s *slab[T]) at(id int32) *T {
	// Unsigned, the division and remainder are a shift and a mask.
	u := uint32(id)
	return &s.chunks[u/slabChunk][u%slabChunk]
}

// reset makes every draft free for the next line.
func (s *slab[T]) reset() { s.next = 0 }

// newTerm, newSubstance and newQuantity return a zero draft.
func (p *parser) newTerm() *draftTerm {
	t, id := p.termDrafts.get()
	*t = draftTerm{id: id}
	return t
}

func (p *parser) newSubstance() *draftSubstance {
	s, id := p.subDrafts.get()
	*s = draftSubstance{id: id}
	return s
}

func (p *parser) newQuantity() *draftQuantity {
	q, id := p.qtyDrafts.get()
	*q = draftQuantity{id: id}
	return q
}

// sub and qty return the draft a reference names, or nil for 0.
func (p *parser) sub(ref int32) *draftSubstance {
	if ref == 0 {
		return nil
	}
	return p.subDrafts.at(ref - 1)
}

func (p *parser) qty(ref int32) *draftQuantity {
	if ref == 0 {
		return nil
	}
	return p.qtyDrafts.at(ref - 1)
}

// ref returns the reference to a draft with the given id.
func ref(id int32) int32 { return id + 1 }

// substanceText is Substance.Text for a draft, for messages.
func (p *parser) substanceText(s *draftSubstance) string {
	text := p.str[s.Span.Start-p.base : s.Span.End-p.base]
	switch {
	case s.Kind == Reference:
		return text[1:]
	case s.plain:
		return text
	case s.Kind == Mixture:
		var b []byte
		for k := s.p0; k < s.p1; k++ {
			if k > s.p0 {
				b = append(b, '/')
			}
			b = append(b, p.substanceText(p.subDrafts.at(p.slist[k]))...)
		}
		return string(b)
	}
	return singleSpaced(text)
}
