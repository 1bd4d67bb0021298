package outcome

import "walden/analyze/molecule"

// rekekulise reassigns the double bonds of the aromatic system containing
// atom a after a reaction moved a hydrogen or a substituent between ring
// atoms (an azole alkylated at the nitrogen that did not carry the
// hydrogen). Every aromatic atom that needs one π-bond gets exactly one,
// found as a perfect matching over the aromatic bonds (Kuhn's augmenting
// paths; the systems are small).
func rekekulise(m *molecule.Molecule, a int) {
	// Collect the aromatic system around a.
	seen := map[int]bool{a: true}
	sys := []int{a}
	for i := 0; i < len(sys); i++ {
		for _, e := range m.Edges(sys[i]) {
			if m.Bonds[e.Bond].Aromatic && !seen[e.Atom] {
				seen[e.Atom] = true
				sys = append(sys, e.Atom)
			}
		}
	}
	for _, x := range sys {
		for _, e := range m.Edges(x) {
			if m.Bonds[e.Bond].Aromatic {
				m.Bonds[e.Bond].Order = 1
			}
		}
	}
	needs := map[int]bool{}
	for _, x := range sys {
		needs[x] = needsPi(m, x)
	}
	match := map[int]int{}
	var try func(x int, visited map[int]bool) bool
	try = func(x int, visited map[int]bool) bool {
		for _, e := range m.Edges(x) {
			y := e.Atom
			if !m.Bonds[e.Bond].Aromatic || !needs[y] || visited[y] {
				continue
			}
			visited[y] = true
			if p, ok := match[y]; !ok || try(p, visited) {
				match[y] = x
				match[x] = y
				return true
			}
		}
		return false
	}
	for _, x := range sys {
		if needs[x] {
			if _, ok := match[x]; !ok {
				try(x, map[int]bool{x: true})
			}
		}
	}
	for x, y := range match {
		if x < y {
			m.Bonds[m.BondBetween(x, y)].Order = 2
		}
	}
}

// needsPi reports whether aromatic atom x needs a double bond inside the
// aromatic system: a carbon with three σ-neighbours (hydrogens included)
// and no exocyclic double bond, or a two-coordinate neutral nitrogen.
func needsPi(m *molecule.Molecule, x int) bool {
	a := m.Atoms[x]
	for _, e := range m.Edges(x) {
		if !m.Bonds[e.Bond].Aromatic && m.Bonds[e.Bond].Order == 2 {
			return false
		}
	}
	n := m.Degree(x) + a.ImplicitH
	switch a.Element {
	case molecule.C:
		return n == 3 && a.Charge == 0
	case molecule.N, molecule.P:
		return (n == 2 && a.Charge == 0) || (n == 3 && a.Charge == 1)
	}
	return false
}
