package notation

import "walden/grammar/source"

// emit appends the drafted step e.p.st to e's nodes and returns the
// index of its node. A step's nodes form one block: the step, its terms
// (reactants, conditions, products), then each term's children, so that
// every list a handle reads is contiguous.
func (e *emitter) emit() int32 {
	p := e.p
	st := &p.st
	si := e.add(nStep, st.Span)
	// The optional parts are offsets into the line, kept in the step's
	// node (see node).
	line := st.Span.Start
	var flags uint8
	var arrowAt, labelEnd, commentAt int32
	if st.hasMark {
		flags |= hasMark
		e.nodes[si].sub = uint8(st.mark.State)
	}
	if st.hasLabel {
		flags |= hasLabel
		labelEnd = int32(st.label.End - line)
	}
	if st.hasArrow {
		flags |= hasArrow
		arrowAt = int32(st.arrow.Start - line)
	}
	if st.hasComment {
		flags |= hasComment
		commentAt = int32(st.comment.Start - line)
	}
	first := e.next()
	for _, id := range p.order {
		d := p.termDrafts.at(id)
		e.add(p.termKind(d), d.Span)
	}
	for k, id := range p.order {
		e.term(first+int32(k), p.termDrafts.at(id))
	}
	n := &e.nodes[si]
	n.flags = flags
	n.a = pack16(int32(st.nR), int32(st.nC))
	n.b = pack16(int32(st.nP), arrowAt)
	n.c = pack16(labelEnd, commentAt)
	return si
}

// emitter appends the nodes of steps to a slice, as the nodes of a Tree
// based at base. Its caller keeps it, on its stack, for all the lines it
// writes: storing the slice into a Tree on every append would pass the
// garbage collector's write barrier each time, and making an emitter
// for each line is a composite copied in wide loads over narrow stores,
// which stalls the processor.
type emitter struct {
	p     *parser
	base  source.Pos
	nodes []node
}

func (e *emitter) next() int32 { return int32(len(e.nodes)) }

func (e *emitter) rel(p source.Pos) int32 { return int32(p - e.base) }

// add appends a node of kind k at the host span sp and returns its index.
func (e *emitter) add(k nodeKind, sp source.Span) int32 {
	i := e.next()
	// A zero node is appended and its fields set in place: a composite
	// literal would be built on the stack and copied in wide loads that
	// overlap its narrow stores, which stalls the processor on every node.
	e.nodes = append(e.nodes, node{})
	n := &e.nodes[i]
	n.kind, n.start, n.end = k, e.rel(sp.Start), e.rel(sp.End)
	return i
}

// termKind returns the kind of node a term is written as: a term of one
// part, a substance or a quantity spanning the whole term ("DMF",
// "@mesylate", "60 °C"), is written as that part alone, with the
// separator's kind in its flags; most terms are, and a page so keeps a
// third fewer nodes.
func (p *parser) termKind(d *draftTerm) nodeKind {
	if d.n1 > d.n0 {
		return nTerm
	}
	switch {
	case d.sub != 0 && d.q1 == d.q0:
		if p.sub(d.sub).Span == d.Span {
			return nSubstance
		}
	case d.sub == 0 && d.q1-d.q0 == 1:
		if p.qtyDrafts.at(p.qlist[d.q0]).Span == d.Span {
			return nQuantity
		}
	}
	return nTerm
}

// term fills the node ti from d, of the kind termKind gave, and appends
// what it holds: the substance, the quantities and the notes of a term,
// then what they hold.
func (e *emitter) term(ti int32, d *draftTerm) {
	switch e.nodes[ti].kind {
	case nSubstance:
		e.substance(ti, e.p.sub(d.sub))
		e.nodes[ti].flags |= uint8(d.sep.Kind) << sepShift
		return
	case nQuantity:
		e.quantity(ti, e.p.qtyDrafts.at(e.p.qlist[d.q0]))
		e.nodes[ti].flags |= uint8(d.sep.Kind) << sepShift
		return
	}
	first := e.next()
	s := e.p.sub(d.sub)
	var flags uint8
	if s != nil {
		flags = termSubstance
		e.add(nSubstance, s.Span)
	}
	qs := e.next()
	qids := e.p.qlist[d.q0:d.q1]
	for _, id := range qids {
		e.add(nQuantity, e.p.qtyDrafts.at(id).Span)
	}
	if d.n1 > d.n0 { // notes are rare: the common case skips the slicing
		for _, sp := range e.p.notes[d.n0:d.n1] {
			e.add(nNote, sp)
		}
	}
	if s != nil {
		e.substance(first, s)
	}
	for k, id := range qids {
		e.quantity(qs+int32(k), e.p.qtyDrafts.at(id))
	}
	n := &e.nodes[ti]
	n.sub, n.flags = uint8(d.sep.Kind), flags
	n.a, n.b, n.c = first-ti, d.q1-d.q0, d.n1-d.n0
}

// substance fills the substance node si from d and appends its parts
// and its ratio.
func (e *emitter) substance(si int32, d *draftSubstance) {
	parts := e.next()
	if d.p1 > d.p0 { // only mixtures have parts
		for _, id := range e.p.slist[d.p0:d.p1] {
			part := e.p.subDrafts.at(id)
			k := e.add(nSubstance, part.Span)
			e.nodes[k].sub = uint8(part.Kind)
			e.nodes[k].flags = plainFlag(part)
		}
	}
	var ratio int32
	if r := e.p.qty(d.ratio); r != nil {
		ratio = e.add(nQuantity, r.Span)
		e.quantity(ratio, r)
		ratio -= si
	}
	n := &e.nodes[si]
	n.sub, n.flags = uint8(d.Kind), plainFlag(d)
	n.a, n.b, n.c = ratio, parts-si, d.p1-d.p0
}

// plainFlag returns plainText when d's text is its source text, which is
// then all the Tree keeps.
func plainFlag(d *draftSubstance) uint8 {
	if d.plain || d.Kind == Reference {
		return plainText
	}
	return 0
}

// quantity fills the quantity node qi from d and appends the upper end
// of its range.
func (e *emitter) quantity(qi int32, d *draftQuantity) {
	var to int32
	if q := e.p.qty(d.to); q != nil {
		to = e.add(nQuantity, q.Span)
		e.quantity(to, q)
		to -= qi
	}
	n := &e.nodes[qi]
	n.sub, n.a = uint8(d.Kind), to
	if d.HasValue {
		n.flags, n.unit = hasValue, d.unit
	} else {
		n.unit = d.word // a quantity with no value has no unit
	}
	if d.Kind != Ratio {
		n.b, n.c = e.rel(d.UnitSpan.Start), e.rel(d.UnitSpan.End)
	}
}
