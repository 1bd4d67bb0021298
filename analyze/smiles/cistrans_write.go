package smiles

import "walden/analyze/molecule"

// cisTransMarks chooses '/' and '\' for single bonds around every
// recorded double-bond configuration (OpenSMILES section 3.9.5).
//
// One single bond at each end is marked, unless a bond marked for a
// conjugated neighbour is there already. Each marked bond's direction is
// then a sign times one unknown per configuration (the side of its first
// reference); a bond shared by two configurations ties their unknowns,
// as does an end with two marked bonds (its neighbours must sit on
// opposite sides). The unknowns are solved with a union-find carrying
// parity, and each connected group is flipped so that its first mark in
// the output is '/', which keeps the string independent of where the
// marks were started.
func (w *writer) cisTransMarks() {
	m := w.m
	if len(m.CisTrans) == 0 {
		return
	}
	var idx [16]int
	order := idx[:0]
	for i, ct := range m.CisTrans {
		if w.validCisTrans(ct) {
			order = append(order, i)
		}
	}
	if len(order) == 0 {
		return
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
	// Choose the marked bonds: bdir 1 stands for "marked" until solved.
	for _, ci := range order {
		ct := m.CisTrans[ci]
		for s := range 2 {
			w.chooseMark(ct.Ends[s], ct.Refs[s], ct.Ends[1-s])
		}
	}
	// Per marked bond: the configuration it first belongs to and its
	// coefficient; later memberships tie configurations together.
	nct := len(m.CisTrans)
	w.group = resizeInt32(w.group, len(m.Bonds), -1)
	w.coef = resizeInt8(w.coef, len(m.Bonds))
	w.uf = resizeInt32(w.uf, nct, -1)
	w.par = resizeInt8(w.par, nct)
	for i := range w.uf {
		w.uf[i] = int32(i)
	}
	for _, ci := range order {
		ct := m.CisTrans[ci]
		for s := range 2 {
			end := ct.Ends[s]
			for _, e := range m.Edges(end) {
				b := e.Bond
				if m.Bonds[b].Order != 1 || w.bdir[b] == 0 {
					continue
				}
				c := int8(1)
				if m.Bonds[b].A != end {
					c = -c
				}
				if e.Atom != ct.Refs[s] {
					c = -c
				}
				if s == 1 && ct.Config == molecule.Opposite {
					c = -c
				}
				if w.group[b] < 0 {
					w.group[b], w.coef[b] = int32(ci), c
					continue
				}
				// c·X[ci] = coef·X[group] ties the two unknowns.
				w.union(int32(ci), w.group[b], c*w.coef[b])
			}
		}
	}
	// Solve: each root's value chosen at its first mark in the output.
	w.val = resizeInt8(w.val, nct)
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
		if w.group[b] < 0 {
			continue
		}
		root, p := w.find(w.group[b])
		if w.val[root] != 0 {
			continue
		}
		// Want the written mark '/': direction +1 read from "from".
		d := int8(1)
		if m.Bonds[b].A != from {
			d = -1
		}
		// bdir = coef·X[group] = coef·p·X[root]
		w.val[root] = d * w.coef[b] * p
	}
	for b := range w.bdir {
		if w.group[b] < 0 {
			w.bdir[b] = 0
			continue
		}
		root, p := w.find(w.group[b])
		v := w.val[root]
		if v == 0 {
			v = 1
		}
		w.bdir[b] = w.coef[b] * p * v
	}
}

// find returns the root of configuration x and the parity p with
// X[x] = p·X[root].
func (w *writer) find(x int32) (int32, int8) {
	p := int8(1)
	for w.uf[x] != x {
		p *= w.par[x]
		x = w.uf[x]
	}
	return x, p
}

// union records X[a] = q·X[b]; a contradiction (possible only for marks
// that no geometry satisfies) keeps the first relation.
func (w *writer) union(a, b int32, q int8) {
	ra, pa := w.find(a)
	rb, pb := w.find(b)
	if ra == rb {
		return
	}
	// X[a] = pa·X[ra], X[b] = pb·X[rb], X[a] = q·X[b]
	// → X[ra] = pa·q·pb·X[rb]
	w.uf[ra] = rb
	w.par[ra] = pa * q * pb
}

func resizeInt8(s []int8, n int) []int8 {
	if cap(s) < n {
		s = make([]int8, n)
	}
	s = s[:n]
	clear(s)
	return s
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

// chooseMark marks one single bond at end for the configuration with
// reference ref, unless one is marked already. It prefers a neighbour
// that is not itself the end of an unconfigured double bond, where a mark
// on each side would be read as a configuration that was never given;
// then, at a plain sp2 end (one or two single-bonded neighbours, none of
// them the far end), the neighbour written first, so that the marks do not
// depend on which reference the input happened to record; elsewhere the
// reference itself.
func (w *writer) chooseMark(end, ref, other int) {
	m := w.m
	singles, plain := 0, true
	for _, e := range m.Edges(end) {
		if m.Bonds[e.Bond].Order == 1 {
			singles++
			plain = plain && e.Atom != other
		}
	}
	plain = plain && singles <= 2
	best, bestScore, bestPos := -1, -1, int32(0)
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
		if !plain && e.Atom == ref {
			score++
		}
		p := w.pos[e.Atom]
		if score > bestScore || plain && score == bestScore && p < bestPos {
			best, bestScore, bestPos = e.Bond, score, p
		}
	}
	if best >= 0 {
		w.bdir[best] = 1
	}
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
