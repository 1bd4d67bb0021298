package cip

import "walden/analyze/molecule"

// mancude assigns the averaged atomic numbers that bond duplicates get in
// mancude rings (rings with the maximum number of non-cumulative double
// bonds). P-92.1.4.4 and Hanson et al. 2018 (section "Mancude rings"): the
// duplicate atom of a ring double bond gets the mean of the atomic numbers
// it would have in every Kekulé structure, so that pyridine's C2 carries a
// duplicate of 6.5 whichever way the input was written. An atom's value is
// the mean atomic number of its neighbours in the same conjugated ring
// system; where a negative charge is spread round the system (the
// cyclopentadienide and pyrrolide anions) every atom of the system takes
// the mean over the system's double bonds.
func mancude(m *molecule.Molecule, num, den []int32) {
	n := len(m.Atoms)
	for i := range n {
		num[i], den[i] = int32(m.Atoms[i].Element), 1
	}
	// Every resonant type needs a double bond or a negative charge.
	possible := false
	for _, b := range m.Bonds {
		if b.Order == 2 {
			possible = true
			break
		}
	}
	for i := 0; i < n && !possible; i++ {
		possible = m.Atoms[i].Charge < 0
	}
	if !possible {
		return
	}
	ring := m.RingBonds()
	const (
		other = iota
		cv4d3
		cv3d3minus
		nv3d2
		nv2d2minus
		nv4d3plus
		ov3d2plus
	)
	typ := make([]uint8, n)
	any := false
	for i, a := range m.Atoms {
		bt := a.ImplicitH
		inRing := false
		for _, e := range m.Edges(i) {
			switch m.Bonds[e.Bond].Order {
			case 1:
				bt += 0x1
			case 2:
				bt += 0x100
			default:
				bt += 0x1000000
			}
			if ring[e.Bond] {
				inRing = true
			}
		}
		if !inRing {
			continue
		}
		q := a.Charge
		switch a.Element {
		case molecule.C, molecule.Si, molecule.Ge:
			if q == 0 && bt == 0x102 {
				typ[i] = cv4d3
			} else if q == -1 && bt == 0x3 {
				typ[i] = cv3d3minus
				any = true
			}
		case molecule.N, molecule.P, molecule.As:
			if q == 0 && bt == 0x101 {
				typ[i] = nv3d2
				any = true
			} else if q == -1 && bt == 0x2 {
				typ[i] = nv2d2minus
				any = true
			} else if q == 1 && bt == 0x102 {
				typ[i] = nv4d3plus
				any = true
			}
		case molecule.O:
			if q == 1 && bt == 0x101 {
				typ[i] = ov3d2plus
				any = true
			}
		}
	}
	if !any {
		return
	}
	// An atom stays typed only with at least two typed ring neighbours:
	// resonance needs a way in and a way out.
	count := make([]int, n)
	var queue []int
	for i := range n {
		if typ[i] == other {
			continue
		}
		for _, e := range m.Edges(i) {
			if ring[e.Bond] && typ[e.Atom] != other {
				count[i]++
			}
		}
		if count[i] <= 1 {
			queue = append(queue, i)
		}
	}
	for len(queue) > 0 {
		i := queue[0]
		queue = queue[1:]
		if typ[i] == other {
			continue
		}
		typ[i] = other
		for _, e := range m.Edges(i) {
			if !ring[e.Bond] || typ[e.Atom] == other {
				continue
			}
			count[e.Atom]--
			if count[e.Atom] == 1 {
				queue = append(queue, e.Atom)
			}
		}
	}
	// Conjugated systems: typed atoms joined by ring bonds.
	part := make([]int, n)
	parts := 0
	var stack []int
	for s := range n {
		if typ[s] == other || part[s] != 0 {
			continue
		}
		parts++
		part[s] = parts
		stack = append(stack[:0], s)
		for len(stack) > 0 {
			a := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			for _, e := range m.Edges(a) {
				if ring[e.Bond] && typ[e.Atom] != other && part[e.Atom] == 0 {
					part[e.Atom] = parts
					stack = append(stack, e.Atom)
				}
			}
		}
	}
	if parts == 0 {
		return
	}
	charged := make([]bool, parts+1)
	for i := range n {
		if part[i] == 0 {
			continue
		}
		if typ[i] == cv3d3minus || typ[i] == nv2d2minus {
			charged[part[i]] = true
		}
		var s, c int32
		for _, e := range m.Edges(i) {
			if part[e.Atom] == part[i] {
				s += int32(m.Atoms[e.Atom].Element)
				c++
			}
		}
		if c > 0 {
			num[i], den[i] = reduce(s, c)
		}
	}
	pn := make([]int32, parts+1)
	pd := make([]int32, parts+1)
	for i := range n {
		p := part[i]
		if p == 0 || !charged[p] {
			continue
		}
		pd[p]++
		for _, e := range m.Edges(i) {
			if o := m.Bonds[e.Bond].Order; o > 1 && part[e.Atom] == p {
				pn[p] += int32(o-1) * int32(m.Atoms[e.Atom].Element)
			}
		}
	}
	for i := range n {
		if p := part[i]; p != 0 && charged[p] && pd[p] != 0 {
			num[i], den[i] = reduce(pn[p], pd[p])
		}
	}
}

// reduce returns a/b in lowest terms.
func reduce(a, b int32) (int32, int32) {
	x, y := a, b
	for y != 0 {
		x, y = y, x%y
	}
	if x == 0 {
		return a, b
	}
	if x < 0 {
		x = -x
	}
	return a / x, b / x
}
