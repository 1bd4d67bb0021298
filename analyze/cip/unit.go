package cip

import "walden/analyze/molecule"

// unitKind tells the three kinds of stereogenic unit apart.
type unitKind uint8

const (
	centre unitKind = iota // tetrahedral (or trigonal pyramidal) centre
	bond                   // double bond, or cumulene with an odd number of double bonds
	axis                   // cumulene with an even number of double bonds (allene)
)

// unit is one stereogenic unit written in the molecule.
type unit struct {
	kind  unitKind
	atoms [2]int  // centre and -1, or the two ends
	path  []int32 // atoms from atoms[0] to atoms[1] along the cumulated chain
	refs  [4]int  // centre: Tetrahedral.Refs; bond: the two Refs; axis: Axial.Refs
	wind  molecule.Winding
	conf  molecule.Config
}

// units collects the stereogenic units of m that walden labels. A
// tetrahedral configuration counts only where the centre can really hold
// one (see canHoldConfig); double bonds and allenes count when their
// chain of cumulated double bonds can be traced.
func units(m *molecule.Molecule, out []unit) []unit {
	for _, t := range m.Tetrahedral {
		if !canHoldConfig(m, t) {
			continue
		}
		out = append(out, unit{kind: centre, atoms: [2]int{t.Centre, -1}, refs: t.Refs, wind: t.Winding})
	}
	for _, c := range m.CisTrans {
		p := chain(m, c.Ends[0], c.Ends[1])
		if p == nil || !trigonal(m, c.Ends[0]) || !trigonal(m, c.Ends[1]) {
			continue
		}
		out = append(out, unit{kind: bond, atoms: c.Ends, path: p, refs: [4]int{c.Refs[0], c.Refs[1], -1, -1}, conf: c.Config})
	}
	for _, a := range m.Axial {
		p := chain(m, a.Ends[0], a.Ends[1])
		if p == nil || !trigonal(m, a.Ends[0]) || !trigonal(m, a.Ends[1]) {
			continue
		}
		out = append(out, unit{kind: axis, atoms: a.Ends, path: p, refs: a.Refs, wind: a.Winding})
	}
	return out
}

// trigonal reports whether a double-bond end has at most three ligands
// (two besides the double bond), as a planar sp2 end must.
func trigonal(m *molecule.Molecule, a int) bool {
	return m.Degree(a)+m.Atoms[a].ImplicitH <= 3
}

// chain returns the atoms from a to b along cumulated double bonds, or nil.
func chain(m *molecule.Molecule, a, b int) []int32 {
	path := []int32{int32(a)}
	prev, cur := -1, a
	for steps := 0; steps <= len(m.Atoms); steps++ {
		next := -1
		for _, e := range m.Edges(cur) {
			if e.Atom != prev && m.Bonds[e.Bond].Order == 2 {
				if next >= 0 {
					return nil // branches: not a chain
				}
				next = e.Atom
			}
		}
		if next < 0 {
			return nil
		}
		path = append(path, int32(next))
		if next == b {
			return path
		}
		prev, cur = cur, next
	}
	return nil
}

// canHoldConfig decides whether a tetrahedral configuration written on a
// centre describes a real stereocentre: four-coordinate C, Si, Ge, Sn,
// ammonium N, P, As, S, Se; three-coordinate P and As (phosphines),
// sulfoxide-type and sulfonium S and Se (the lone pair being the fourth
// ligand). Three-coordinate N inverts quickly at room temperature and
// gets a label only as a bridgehead of a small bicycle, where inversion is
// blocked (Tröger's base); common practice, kept conservative.
func canHoldConfig(m *molecule.Molecule, t molecule.Tetrahedral) bool {
	c := t.Centre
	a := m.Atoms[c]
	lig := m.Degree(c) + a.ImplicitH
	implicit := 0
	for _, r := range t.Refs {
		if r == molecule.Implicit {
			implicit++
		}
	}
	if implicit > 1 {
		return false
	}
	switch a.Element {
	case molecule.C, molecule.Si, molecule.Ge, 50: // 50: Sn
		return lig == 4
	case molecule.N:
		if lig == 4 && a.Charge == 1 {
			return true
		}
		return lig == 3 && a.Charge == 0 && a.ImplicitH == 0 && bridgehead(m, c)
	case molecule.P, molecule.As:
		return lig == 4 || lig == 3 && a.Charge == 0
	case molecule.S, molecule.Se, 52: // 52: Te
		if lig == 4 {
			return true
		}
		if lig != 3 {
			return false
		}
		return a.Charge == 1 || a.Charge == 0 && m.BondOrderSum(c)+a.ImplicitH == 4
	}
	return false
}

// bridgehead reports whether atom c is a bridgehead of a bicycle whose
// three bridges each hold one to three atoms: from each of its three
// neighbours another atom, not bonded to c, can be reached within three
// bonds without passing through c.
func bridgehead(m *molecule.Molecule, c int) bool {
	if m.Degree(c) != 3 {
		return false
	}
	ring := m.RingBonds()
	for _, e := range m.Edges(c) {
		if !ring[e.Bond] {
			return false
		}
	}
	hits := make(map[int]int)
	for _, e := range m.Edges(c) {
		seen := map[int]bool{c: true, e.Atom: true}
		frontier := []int{e.Atom}
		for d := 0; d < 3; d++ {
			var next []int
			for _, x := range frontier {
				for _, f := range m.Edges(x) {
					if !seen[f.Atom] {
						seen[f.Atom] = true
						next = append(next, f.Atom)
					}
				}
			}
			frontier = next
		}
		for x := range seen {
			if x != c && m.BondBetween(x, c) < 0 {
				hits[x]++
			}
		}
	}
	for _, n := range hits {
		if n == 3 {
			return true
		}
	}
	return false
}
