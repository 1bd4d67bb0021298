package cip

import "walden/analyze/molecule"

// labelBond labels a double bond, or a cumulene with an odd number of
// double bonds, from node n of one end: the ligands on each end are
// ranked apart from the chain, and the written configuration of the
// reference atoms, carried over to the higher-ranked ligands, gives Z
// (same side) or E (P-93.4.2.1). When exactly one end's ranking was
// decided by an enantiomorphic pair the descriptor is the
// reflection-dependent z or e.
func (l *Labeller) labelBond(u *unit, n int32, seq *ruleSeq) (Letter, bool) {
	g := &l.g
	m := l.walk(u, n)
	if m < 0 {
		return None, false
	}
	p := u.path
	end0, end1 := n, m
	if g.nodes[n].atom != p[0] {
		end0, end1 = m, n
	}
	flip := false
	var pseudo [2]bool
	for k, x := range [2]int32{end0, end1} {
		skip := p[1]
		if k == 1 {
			skip = p[len(p)-2]
		}
		es := l.ligandsOf(x, skip, l.es[k])
		l.es[k] = es
		if len(es) == 0 {
			return None, false
		}
		g.reroot(x)
		unique, ps := g.rank(x, es, true, seq)
		if !unique {
			return None, true
		}
		pseudo[k] = ps
		if g.atomOf(es[0]) != u.refs[k] {
			flip = !flip
		}
	}
	conf := u.conf
	if flip {
		conf = -conf
	}
	switch {
	case conf == molecule.Together && pseudo[0] != pseudo[1]:
		return LowerZ, false
	case conf == molecule.Together:
		return Z, false
	case pseudo[0] != pseudo[1]:
		return LowerE, false
	}
	return E, false
}

// labelAxis labels an allene-type axis (a cumulene with an even number of
// double bonds) from node n of one end. The ligands of each end are
// ranked; the nearer end's pair ranks above the farther end's (P-93.5.7.1,
// the elongated tetrahedron), and reading the written winding in that
// order gives M where a centre would be R, and P where it would be S
// (P-93.5.7.1: Ra ≡ M, Sa ≡ P).
func (l *Labeller) labelAxis(u *unit, n int32, seq *ruleSeq) (Letter, bool) {
	g := &l.g
	m := l.walk(u, n)
	if m < 0 {
		return None, false
	}
	p := u.path
	end0, end1 := n, m
	if g.nodes[n].atom != p[0] {
		end0, end1 = m, n
	}
	var ordered [4]int
	var pseudo [2]bool
	for k, x := range [2]int32{end0, end1} {
		skip := p[1]
		if k == 1 {
			skip = p[len(p)-2]
		}
		es := l.ligandsOf(x, skip, l.es[k])
		l.es[k] = es
		if len(es) != 2 {
			return None, false
		}
		g.reroot(x)
		unique, ps := g.rank(x, es, true, seq)
		if !unique {
			return None, true
		}
		pseudo[k] = ps
		ordered[2*k] = g.atomOf(es[0])
		ordered[2*k+1] = g.atomOf(es[1])
	}
	odd, ok := parity(u.refs[:], ordered[:])
	if !ok {
		return None, false
	}
	w := u.wind
	if odd {
		w = w.Invert()
	}
	lower := pseudo[0] != pseudo[1]
	switch {
	case w == molecule.Clockwise && lower:
		return LowerM, false
	case w == molecule.Clockwise:
		return M, false
	case lower:
		return LowerP, false
	}
	return P, false
}
