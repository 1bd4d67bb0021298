package smiles

import "walden/analyze/molecule"

// cisTransMarks chooses '/' and '\' for the single bonds around every
// recorded double-bond configuration, in the order the double bonds are
// written, so that one mark shared by two conjugated double bonds serves
// both (OpenSMILES section 3.9.5). Every single bond at both ends is
// marked, which the reader checks for consistency.
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

// placeMarks puts ref on side s of end and the other single-bonded
// neighbour on the other side, leaving marks already set.
func (w *writer) placeMarks(end, ref, s int, g int32) {
	for _, e := range w.m.Edges(end) {
		if w.m.Bonds[e.Bond].Order != 1 || w.bdir[e.Bond] != 0 {
			continue
		}
		want := s
		if e.Atom != ref {
			want = -s
		}
		if w.m.Bonds[e.Bond].A != end {
			want = -want
		}
		w.bdir[e.Bond] = int8(want)
		w.group[e.Bond] = g
	}
}
