package smiles

import "walden/analyze/molecule"

// cisTransMarks chooses '/' and '\' for the single bonds around every
// recorded double-bond configuration, in the order the double bonds are
// written, so that one mark shared by two conjugated double bonds serves
// both (OpenSMILES section 3.9.5). One single bond at each end is
// marked.
func (w *writer) cisTransMarks() {
	m := w.m
	if len(m.CisTrans) == 0 {
		return
	}
	var idx [16]int
	order := idx[:0]
	for i := range m.CisTrans {
		order = append(order, i)
	}
	first := func(i int) int32 {
		ct := m.CisTrans[i]
		return min(w.pos[ct.Ends[0]], w.pos[ct.Ends[1]])
	}
	for i := 1; i < len(order); i++ {
		for j := i; j > 0 && first(order[j]) < first(order[j-1]); j-- {
			order[j], order[j-1] = order[j-1], order[j]
		}
	}
	w.group = resizeInt32(w.group, len(m.Bonds), -1)
	groups := int32(0)
	for _, ci := range order {
		ct := m.CisTrans[ci]
		if !w.validCisTrans(ct) {
			continue
		}
		// Side of each end's reference, from marks already placed.
		s0, g0 := w.knownSide(ct.Ends[0], ct.Refs[0])
		s1, g1 := w.knownSide(ct.Ends[1], ct.Refs[1])
		switch {
		case s0 != 0 && s1 != 0 && g0 != g1:
			// Two groups of marks meet: flip the second to agree, then
			// merge.
			if s1 != s0*int(ct.Config) {
				w.flipGroup(g1)
			}
			w.mergeGroup(g1, g0)
		case s0 == 0 && s1 != 0:
			s0, g0 = s1*int(ct.Config), g1
		case s0 == 0:
			s0, g0 = 1, groups
			groups++
		}
		s1 = s0 * int(ct.Config)
		w.placeMarks(ct.Ends[0], ct.Refs[0], s0, g0)
		w.placeMarks(ct.Ends[1], ct.Refs[1], s1, g0)
	}
	// A group of marks read the same when all are flipped; choose the
	// flip whose first mark in the output is '/', so the choice does not
	// depend on where the marks were started.
	settled := make([]bool, groups)
	for _, t := range w.tokens {
		var b, from int
		switch {
		case t.kind == tBond:
			b, from = int(t.bond), int(t.atom)
		case t.kind == tRing && w.opener[t.bond] == t.atom:
			b, from = int(t.bond), int(t.atom)
		default:
			continue
		}
		g := w.group[b]
		if w.bdir[b] == 0 || g < 0 || settled[g] {
			continue
		}
		settled[g] = true
		if w.sideOf(b, from) < 0 {
			w.flipGroup(g)
		}
	}
}

func (w *writer) flipGroup(g int32) {
	for b, x := range w.group {
		if x == g {
			w.bdir[b] = -w.bdir[b]
		}
	}
}

func (w *writer) mergeGroup(from, into int32) {
	for b, x := range w.group {
		if x == from {
			w.group[b] = into
		}
	}
}

func (w *writer) validCisTrans(ct molecule.CisTrans) bool {
	m := w.m
	n := len(m.Atoms)
	for s := range 2 {
		e, r := ct.Ends[s], ct.Refs[s]
		if e < 0 || e >= n || r < 0 || r >= n || m.BondBetween(e, r) < 0 {
			return false
		}
	}
	if b := m.BondBetween(ct.Ends[0], ct.Ends[1]); b >= 0 && w.aromaticBond(b) {
		return false
	}
	return ct.Config == molecule.Together || ct.Config == molecule.Opposite
}

// sideOf is the side on which bond b's mark puts the neighbour of end.
func (w *writer) sideOf(b, end int) int {
	d := int(w.bdir[b])
	if w.m.Bonds[b].A != end {
		d = -d
	}
	return d
}

// knownSide returns the side of ref at end implied by marks already set
// on single bonds at end, and their group; 0 when none.
func (w *writer) knownSide(end, ref int) (int, int32) {
	for _, e := range w.m.Edges(end) {
		if w.m.Bonds[e.Bond].Order != 1 || w.bdir[e.Bond] == 0 {
			continue
		}
		s := w.sideOf(e.Bond, end)
		if e.Atom == ref {
			return s, w.group[e.Bond]
		}
		return -s, w.group[e.Bond]
	}
	return 0, -1
}

// placeMarks puts ref on side s of end by marking one single bond at
// end, unless one is marked already (by a conjugated neighbour, checked
// consistent by the caller). It prefers a neighbour that is not itself
// the end of an unconfigured double bond, where a mark on each side would
// be read as a configuration that was never given.
func (w *writer) placeMarks(end, ref, s int, g int32) {
	m := w.m
	best, bestScore := -1, -1
	for _, e := range m.Edges(end) {
		if m.Bonds[e.Bond].Order != 1 {
			continue
		}
		if w.bdir[e.Bond] != 0 {
			return
		}
		score := 0
		if !w.freeDouble(e.Atom) {
			score += 2
		}
		if e.Atom == ref {
			score++
		}
		if score > bestScore {
			best, bestScore = e.Bond, score
		}
	}
	if best < 0 {
		return
	}
	want := s
	if m.Bonds[best].Other(end) != ref {
		want = -s
	}
	if m.Bonds[best].A != end {
		want = -want
	}
	w.bdir[best] = int8(want)
	w.group[best] = g
}

// freeDouble reports whether atom a has a written double bond that
// carries no recorded configuration.
func (w *writer) freeDouble(a int) bool {
	m := w.m
	for _, e := range m.Edges(a) {
		if m.Bonds[e.Bond].Order != 2 || w.aromaticBond(e.Bond) {
			continue
		}
		configured := false
		for _, ct := range m.CisTrans {
			if ct.Ends[0] == a || ct.Ends[1] == a {
				configured = true
			}
		}
		if !configured {
			return true
		}
	}
	return false
}
