package perceive

import "walden/analyze/molecule"

// TetrahedralAt returns the index in m.Tetrahedral of the configuration
// written at atom c, or -1 when none is.
func TetrahedralAt(m *molecule.Molecule, c int) int {
	for i, t := range m.Tetrahedral {
		if t.Centre == c {
			return i
		}
	}
	return -1
}

// Winding reports the sense in which x, y and z appear around centre c
// when viewed from v. Any of v, x, y, z may be molecule.Implicit for the
// one implicit hydrogen (or lone pair) of the centre. ok is false when
// the centre has no configuration or the four references are not its
// neighbours.
//
// The four references are a permutation of the stored ones; an even
// permutation keeps the stored winding and an odd one reverses it
// (OpenSMILES 3.9.2, "the order of the neighbours").
func Winding(m *molecule.Molecule, c, v, x, y, z int) (w molecule.Winding, ok bool) {
	ti := TetrahedralAt(m, c)
	if ti < 0 {
		return 0, false
	}
	t := m.Tetrahedral[ti]
	want := [4]int{v, x, y, z}
	var perm [4]int
	used := [4]bool{}
	for i, a := range want {
		found := false
		for j, r := range t.Refs {
			if !used[j] && r == a {
				perm[i], used[j], found = j, true, true
				break
			}
		}
		if !found {
			return 0, false
		}
	}
	// Count inversions of perm to get its parity.
	inv := 0
	for i := range 4 {
		for j := i + 1; j < 4; j++ {
			if perm[i] > perm[j] {
				inv++
			}
		}
	}
	if inv%2 == 0 {
		return t.Winding, true
	}
	return t.Winding.Invert(), true
}

// Neighbours returns the four references of a tetrahedral carbon c in the
// order: graph neighbours as listed, then molecule.Implicit once per
// implicit hydrogen. ok is false when c does not have four.
func Neighbours(m *molecule.Molecule, c int) (refs [4]int, ok bool) {
	n := 0
	for _, e := range m.Edges(c) {
		if n == 4 {
			return refs, false
		}
		refs[n] = e.Atom
		n++
	}
	for range m.Atoms[c].ImplicitH {
		if n == 4 {
			return refs, false
		}
		refs[n] = molecule.Implicit
		n++
	}
	return refs, n == 4
}

// others returns the two references of c other than a and b (in the order
// Neighbours gives them).
func others(m *molecule.Molecule, c, a, b int) (x, y int, ok bool) {
	refs, ok := Neighbours(m, c)
	if !ok {
		return 0, 0, false
	}
	got := 0
	skipA, skipB := true, true
	var out [2]int
	for _, r := range refs {
		if skipA && r == a {
			skipA = false
			continue
		}
		if skipB && r == b {
			skipB = false
			continue
		}
		if got == 2 {
			return 0, 0, false
		}
		out[got] = r
		got++
	}
	return out[0], out[1], got == 2 && !skipA && !skipB
}

// Others is the exported form of others: the two references of centre c
// besides a and b.
func Others(m *molecule.Molecule, c, a, b int) (x, y int, ok bool) { return others(m, c, a, b) }

// AntiCis reports, for two bonded tetrahedral centres a and b held with
// lg (on a) and h (on b) anti-periplanar, whether substituent sa of a ends
// up on the same side as substituent sb of b (cis in the alkene that
// forms). In a Newman projection along a→b, with lg at 0° and h at 180°,
// sa and sb are on the same side exactly when (lg, sa, other) seen from b
// and (h, sb, other) seen from a wind the same way.
//
// For two ring atoms the same relation read with sa, sb the ring
// neighbours says whether lg and h are trans on the ring: ring bonds are
// gauche, so lg and h can be anti (trans-diaxial in a chair) only when
// they lie on opposite faces.
func AntiCis(m *molecule.Molecule, a, lg, sa, b, h, sb int) (cis, ok bool) {
	oa, ok1 := third(m, a, b, lg, sa)
	ob, ok2 := third(m, b, a, h, sb)
	if !ok1 || !ok2 {
		return false, false
	}
	wa, ok1 := Winding(m, a, b, lg, sa, oa)
	wb, ok2 := Winding(m, b, a, h, sb, ob)
	if !ok1 || !ok2 {
		return false, false
	}
	return wa == wb, true
}

// third returns the fourth reference of centre c given three of them.
func third(m *molecule.Molecule, c, p, q, r int) (int, bool) {
	refs, ok := Neighbours(m, c)
	if !ok {
		return 0, false
	}
	skip := []int{p, q, r}
	var rest []int
	for _, x := range refs {
		matched := false
		for i, s := range skip {
			if s == x {
				skip = append(skip[:i:i], skip[i+1:]...)
				matched = true
				break
			}
		}
		if !matched {
			rest = append(rest, x)
		}
	}
	if len(rest) != 1 || len(skip) != 0 {
		return 0, false
	}
	return rest[0], true
}
