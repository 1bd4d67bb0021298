package caution

import "walden/analyze/molecule"

// The functional groups the rules look for, read from the molecule graph
// so that any way of writing the SMILES is recognised.

// hasAzide reports an azide: an N+ bonded only to two nitrogens, as in the
// azide ion [N-]=[N+]=[N-], organic azides and TMSN3.
func hasAzide(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	for i, a := range m.Atoms {
		if a.Element != molecule.N || a.Charge != 1 || m.Degree(i) != 2 {
			continue
		}
		both := true
		for _, e := range m.Edges(i) {
			if m.Atoms[e.Atom].Element != molecule.N {
				both = false
			}
		}
		if both {
			return true
		}
	}
	return false
}

// hasCyanide reports inorganic or silyl cyanide (C≡N whose carbon bears no
// other carbon): cyanide salts, HCN, TMSCN. Organic nitriles are not
// counted, they do not release HCN with acid under ordinary conditions.
func hasCyanide(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	for i, a := range m.Atoms {
		if a.Element != molecule.C {
			continue
		}
		triple, carbon := false, false
		for _, e := range m.Edges(i) {
			o := m.Atoms[e.Atom]
			if o.Element == molecule.N && m.Bonds[e.Bond].Order == 3 {
				triple = true
			} else if o.Element == molecule.C {
				carbon = true
			}
		}
		if triple && !carbon {
			return true
		}
	}
	return false
}

// hasHydride reports a saline hydride: a hydride ion [H-] or a bracket
// alkali or alkaline-earth metal carrying hydrogen ([NaH], [KH], [LiH]).
func hasHydride(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	for i, a := range m.Atoms {
		if a.Element == molecule.H && a.Charge == -1 && m.Degree(i) == 0 {
			return true
		}
		switch a.Element.Symbol() {
		case "Li", "Na", "K", "Ca":
			if m.HydrogenCount(i) > 0 && m.Degree(i) == 0 {
				return true
			}
		}
	}
	return false
}

// polyhalomethane reports a one-carbon molecule with two or more of Cl,
// Br, I and nothing else but hydrogen: CH2Cl2, CHCl3, CH2Br2, CHBr3,
// CCl4, CBr4 and the mixed ones. Azide ion can exchange their halogens
// for azide and give di-, tri- or tetraazidomethane.
func polyhalomethane(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	for i, a := range m.Atoms {
		if a.Element != molecule.C {
			continue
		}
		x, other := 0, 0
		for _, e := range m.Edges(i) {
			switch m.Atoms[e.Atom].Element {
			case molecule.Cl, molecule.Br, molecule.I:
				x++
			case molecule.H:
			default:
				other++
			}
		}
		if x >= 2 && other == 0 && x+m.HydrogenCount(i) == 4 {
			return true
		}
	}
	return false
}

// hasAzideIon reports an azide group whose nitrogens are bonded to no
// carbon and no silicon: the azide ion of NaN3, KN3 or a tetraalkyl-
// ammonium azide, a metal azide, or HN3. Organic azides (R–N3) and
// silyl azides (TMSN3) do not displace halide from a halomethane under
// ordinary conditions.
func hasAzideIon(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	for i, a := range m.Atoms {
		if a.Element != molecule.N || a.Charge != 1 || m.Degree(i) != 2 {
			continue
		}
		ion := true
		for _, e := range m.Edges(i) {
			end := m.Atoms[e.Atom]
			if end.Element != molecule.N {
				ion = false
				break
			}
			for _, f := range m.Edges(e.Atom) {
				if f.Atom == i {
					continue
				}
				if el := m.Atoms[f.Atom].Element; el == molecule.C || el == molecule.Si {
					ion = false
				}
			}
		}
		if ion {
			return true
		}
	}
	return false
}

// strongAcid reports a Brønsted acid by shape: a hydrogen halide, or an
// O–H on sulfur or phosphorus (sulfuric, sulfonic, phosphoric acids), or a
// carboxylic acid.
func strongAcid(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	for i, a := range m.Atoms {
		switch a.Element {
		case molecule.Cl, molecule.Br, molecule.I, molecule.F:
			if m.Degree(i) == 0 && a.Charge == 0 && m.HydrogenCount(i) == 1 {
				return true
			}
		case molecule.O:
			if a.Charge != 0 || m.HydrogenCount(i) != 1 || m.Degree(i) != 1 {
				continue
			}
			c := m.Edges(i)[0].Atom
			switch m.Atoms[c].Element {
			case molecule.S, molecule.P:
				return true
			case molecule.C:
				if doubleO(m, c) {
					return true
				}
			}
		}
	}
	return false
}

// doubleO reports whether atom i carries a C=O / S=O.
func doubleO(m *molecule.Molecule, i int) bool {
	for _, e := range m.Edges(i) {
		if m.Atoms[e.Atom].Element == molecule.O && m.Bonds[e.Bond].Order == 2 {
			return true
		}
	}
	return false
}

// halide reports whether an element is Cl, Br or I (the halides that make
// good alkylating agents).
func halide(e molecule.Element) bool {
	return e == molecule.Cl || e == molecule.Br || e == molecule.I
}

// sp3CarbonsWithLeavingGroup calls f for every sp3 carbon bearing a
// halide or a sulfonate/sulfate oxygen, with the kind ("halide",
// "sulfonate").
func sp3CarbonsWithLeavingGroup(m *molecule.Molecule, f func(c int, kind string)) {
	if m == nil {
		return
	}
	for i, a := range m.Atoms {
		if a.Element != molecule.C || a.Aromatic || m.BondOrderSum(i) != m.Degree(i) {
			continue
		}
		for _, e := range m.Edges(i) {
			o := m.Atoms[e.Atom]
			if halide(o.Element) && m.Degree(e.Atom) == 1 {
				f(i, "halide")
			} else if o.Element == molecule.O && m.Degree(e.Atom) == 2 {
				for _, e2 := range m.Edges(e.Atom) {
					if e2.Atom != i && m.Atoms[e2.Atom].Element == molecule.S && doubleO(m, e2.Atom) {
						f(i, "sulfonate")
					}
				}
			}
		}
	}
}

// heavyNeighbours returns the number of non-hydrogen neighbours of atom i.
func heavyNeighbours(m *molecule.Molecule, i int) int {
	n := 0
	for _, e := range m.Edges(i) {
		if m.Atoms[e.Atom].Element != molecule.H {
			n++
		}
	}
	return n
}

// benzylicOrAllylic reports whether sp3 carbon c is bonded to an aromatic
// carbon or to a carbon of a C=C.
func benzylicOrAllylic(m *molecule.Molecule, c int) (benzylic, allylic bool) {
	for _, e := range m.Edges(c) {
		n := e.Atom
		if m.Atoms[n].Element != molecule.C {
			continue
		}
		if m.Atoms[n].Aromatic {
			benzylic = true
			continue
		}
		for _, e2 := range m.Edges(n) {
			b := m.Bonds[e2.Bond]
			if e2.Atom != c && m.Atoms[e2.Atom].Element == molecule.C && b.Order == 2 {
				if b.Aromatic {
					benzylic = true
				} else {
					allylic = true
				}
			}
		}
	}
	return
}

// alphaCarbonyl reports whether sp3 carbon c is bonded to a C=O carbon.
func alphaCarbonyl(m *molecule.Molecule, c int) bool {
	for _, e := range m.Edges(c) {
		if m.Atoms[e.Atom].Element == molecule.C && doubleO(m, e.Atom) {
			return true
		}
	}
	return false
}
