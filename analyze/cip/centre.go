package cip

import "walden/analyze/molecule"

// labelCentre labels a tetrahedral centre at node n: its ligands are
// ranked, and the written winding, read in order of precedence, gives R
// (clockwise) or S (P-92.1.1). A lone pair ranks lowest (P-92.1.4.1).
// Where the rules leave two pairs, or all four ligands, tied in a
// symmetric cage, rule 6 picks a reference ligand (Hanson et al. 2018).
func (l *Labeller) labelCentre(u *unit, n int32, seq *ruleSeq) (Letter, bool) {
	g := &l.g
	g.reroot(n)
	es := g.out(n, l.es[0][:0])
	l.es[0] = es
	if len(es) < 3 {
		return None, false
	}
	unique, pseudo := g.rank(n, es, true, seq)
	if !unique {
		if seq == constitutional || len(es) != 4 {
			return None, true
		}
		switch parts := g.groups(seq, es); len(parts) {
		case 2:
			g.setRule6(g.nodes[g.edges[es[1]].end].atom)
			unique, pseudo = g.rank(n, es, true, seq)
			g.setRule6(-1)
		case 1:
			g.setRule6(g.nodes[g.edges[es[0]].end].atom)
			g.rank(n, es, true, seq)
			first := append([]int32(nil), es...)
			g.setRule6(g.nodes[g.edges[es[1]].end].atom)
			unique, pseudo = g.rank(n, es, true, seq)
			g.setRule6(-1)
			if odd, ok := parity(first, es); !ok || odd {
				return None, true
			}
		}
		if !unique {
			return None, true
		}
		// A centre told apart only by the rule 6 reference has
		// homomorphic, not enantiomorphic, ligands: its descriptor is
		// R or S (suite entries VS280 to VS300, Hanson et al. 2018).
		pseudo = false
	}
	var ordered [4]int
	k := 0
	for _, e := range es {
		end := &g.nodes[g.edges[e].end]
		if end.flags&bondDup != 0 {
			continue
		}
		if k == 4 {
			return None, false
		}
		ordered[k] = g.atomOf(e)
		k++
	}
	for ; k < 4; k++ {
		ordered[k] = molecule.Implicit // the lone pair
	}
	odd, ok := parity(u.refs[:], ordered[:])
	if !ok {
		return None, false
	}
	w := u.wind
	if odd {
		w = w.Invert()
	}
	switch {
	case w == molecule.Clockwise && pseudo:
		return LowerR, false
	case w == molecule.Clockwise:
		return R, false
	case pseudo:
		return LowerS, false
	}
	return S, false
}

// parity reports whether b is an odd permutation of a; ok is false when
// b is not a permutation of a.
func parity[T comparable](a, b []T) (odd, ok bool) {
	if len(a) != len(b) {
		return false, false
	}
	perm := make([]int, len(b))
	used := make([]bool, len(a))
	for i, x := range b {
		perm[i] = -1
		for j, y := range a {
			if !used[j] && x == y {
				perm[i] = j
				used[j] = true
				break
			}
		}
		if perm[i] < 0 {
			return false, false
		}
	}
	for i := range perm {
		for j := i + 1; j < len(perm); j++ {
			if perm[i] > perm[j] {
				odd = !odd
			}
		}
	}
	return odd, true
}
