package cip

import "walden/analyze/molecule"

// UndecidedKind names a kind of stereogenic unit that SMILES cannot
// describe.
type UndecidedKind uint8

const (
	// BiarylAxis is a hindered single bond between two rings
	// (atropisomerism, "AT" in the CIP validation suite).
	BiarylAxis UndecidedKind = iota + 1
	// Helix is an ortho-fused polycyclic system that may be helical
	// ("HE" in the suite).
	Helix
)

// Undecided is a possible stereogenic unit whose configuration SMILES
// cannot express, so no descriptor can be decided for it.
type Undecided struct {
	Kind  UndecidedKind
	Atoms [2]int // the axis atoms; for a helix two atoms of the system
}

// Reason says why no descriptor is given, for display.
func (u Undecided) Reason() string {
	if u.Kind == Helix {
		return "helicity of an ortho-fused ring system is not decidable from SMILES (it needs coordinates)"
	}
	return "axial chirality of a hindered biaryl bond is not decidable from SMILES (it needs coordinates)"
}

// Undecideds finds units that may be stereogenic but cannot be described
// in SMILES, so that a caller can say "not decidable from SMILES" instead
// of staying silent. It is a screen, not a proof of chirality:
//
//   - a biaryl axis is a single bond outside rings joining two atoms of
//     unsaturated rings, with at least three of the four ortho positions
//     substituted (common practice: three ortho groups usually block
//     rotation at room temperature);
//   - a helix is a fused system of unsaturated six-membered rings, at
//     least five of them, with no atom shared by three rings (ortho-fused,
//     as in [5]helicene; linear acenes pass the screen too).
func Undecideds(m *molecule.Molecule) []Undecided {
	// Two six-membered rings and three ortho groups need 15 atoms; a
	// helix needs more. Small molecules are settled without ring search.
	if len(m.Atoms) < 15 {
		return nil
	}
	ring := m.RingBonds()
	unsat := make([]bool, len(m.Atoms))
	for i, a := range m.Atoms {
		if a.Aromatic {
			unsat[i] = true
			continue
		}
		for _, e := range m.Edges(i) {
			if b := m.Bonds[e.Bond]; b.Order == 2 && ring[e.Bond] || b.Aromatic {
				unsat[i] = true
			}
		}
	}
	var out []Undecided
	for bi, b := range m.Bonds {
		if ring[bi] || b.Order != 1 || !unsat[b.A] || !unsat[b.B] {
			continue
		}
		na, okA := orthoSubstituted(m, ring, b.A, b.B)
		nb, okB := orthoSubstituted(m, ring, b.B, b.A)
		if okA && okB && na >= 1 && nb >= 1 && na+nb >= 3 {
			out = append(out, Undecided{BiarylAxis, [2]int{b.A, b.B}})
		}
	}
	// Fused unsaturated ring systems.
	comp := make([]int, len(m.Atoms))
	for i := range comp {
		comp[i] = -1
	}
	for s := range m.Atoms {
		if !unsat[s] || comp[s] >= 0 {
			continue
		}
		atoms := []int{s}
		comp[s] = s
		for k := 0; k < len(atoms); k++ {
			for _, e := range m.Edges(atoms[k]) {
				if !ring[e.Bond] || !unsat[e.Atom] {
					continue
				}
				if comp[e.Atom] < 0 {
					comp[e.Atom] = s
					atoms = append(atoms, e.Atom)
				}
			}
		}
		bonds := 0
		for bi, b := range m.Bonds {
			if ring[bi] && comp[b.A] == s && comp[b.B] == s {
				bonds++
			}
		}
		rings := bonds - len(atoms) + 1
		if rings < 5 {
			continue
		}
		// Ortho-fused (catacondensed) six-membered rings leave every atom
		// on the rim: 4r+2 atoms for r rings. An atom shared by three
		// rings (pyrene, coronene) makes the count smaller.
		inner := len(atoms) != 4*rings+2
		if !inner {
			out = append(out, Undecided{Helix, [2]int{atoms[0], atoms[len(atoms)-1]}})
		}
	}
	return out
}

// orthoSubstituted counts the substituted ring neighbours of a (the
// ortho positions seen from the bond to b); ok is false unless a has
// exactly two ring neighbours.
func orthoSubstituted(m *molecule.Molecule, ring []bool, a, b int) (n int, ok bool) {
	k := 0
	for _, e := range m.Edges(a) {
		if e.Atom == b || !ring[e.Bond] {
			continue
		}
		k++
		if m.Degree(e.Atom) >= 3 {
			n++
		}
	}
	return n, k == 2
}
