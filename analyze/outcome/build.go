package outcome

import (
	"walden/analyze/molecule"
)

// builder assembles a product from the substrate (less the atoms it
// drops) and one component of a reagent. It keeps every configuration
// whose atoms all survive; the caller adds the ones the reaction makes.
type builder struct {
	out    *molecule.Molecule
	subMap []int // substrate atom → product atom, -1 when dropped
	nuMap  []int // reagent atom → product atom, -1 when not taken
}

// newBuilder copies sub without the atoms in drop, and the component of
// nu containing atom nuAtom (nu may be nil).
func newBuilder(sub *molecule.Molecule, drop map[int]bool, skipCentres map[int]bool, nu *molecule.Molecule, nuAtom int) *builder {
	b := &builder{out: &molecule.Molecule{}}
	// Room for the whole product at once: growing the lists atom by atom
	// allocated several times the product's size.
	atoms, bonds := len(sub.Atoms), len(sub.Bonds)
	var comp []int
	want := 0
	if nu != nil {
		comp, _ = nu.Components()
		want = comp[nuAtom]
		for _, k := range comp {
			if k == want {
				atoms++
			}
		}
		for _, bd := range nu.Bonds {
			if comp[bd.A] == want {
				bonds++
			}
		}
	}
	b.out.Grow(atoms, bonds+1) // +1: the bond the reaction makes
	b.subMap = copyInto(b.out, sub, func(i int) bool { return !drop[i] }, skipCentres)
	if nu != nil {
		b.nuMap = copyInto(b.out, nu, func(i int) bool { return comp[i] == want }, map[int]bool{nuAtom: true})
	}
	return b
}

// copyInto appends the atoms of src for which keep is true to dst, with
// their bonds and stereo, and returns the index map. Tetrahedral
// configurations at atoms in skip are left out.
func copyInto(dst, src *molecule.Molecule, keep func(int) bool, skip map[int]bool) []int {
	idx := make([]int, len(src.Atoms))
	for i, a := range src.Atoms {
		idx[i] = -1
		if keep(i) {
			a.Span = molecule.Span{}
			idx[i] = dst.AddAtom(a)
		}
	}
	for _, bd := range src.Bonds {
		if idx[bd.A] >= 0 && idx[bd.B] >= 0 {
			bd.A, bd.B = idx[bd.A], idx[bd.B]
			bd.Span = molecule.Span{}
			dst.AddBond(bd)
		}
	}
	mapRef := func(r int) (int, bool) {
		if r == molecule.Implicit {
			return r, true
		}
		if idx[r] < 0 {
			return 0, false
		}
		return idx[r], true
	}
	for _, t := range src.Tetrahedral {
		if skip[t.Centre] || idx[t.Centre] < 0 {
			continue
		}
		nt := t
		nt.Centre = idx[t.Centre]
		ok := true
		for k, r := range t.Refs {
			if nt.Refs[k], ok = mapRef(r); !ok {
				break
			}
		}
		if ok {
			dst.Tetrahedral = append(dst.Tetrahedral, nt)
		}
	}
	for _, ct := range src.CisTrans {
		nc := ct
		ok := true
		for k := range 2 {
			var ok1, ok2 bool
			nc.Ends[k], ok1 = mapRef(ct.Ends[k])
			nc.Refs[k], ok2 = mapRef(ct.Refs[k])
			if !ok1 || !ok2 || ct.Ends[k] < 0 || ct.Refs[k] < 0 {
				ok = false
			}
		}
		if ok {
			dst.CisTrans = append(dst.CisTrans, nc)
		}
	}
	return idx
}

// attach bonds product atoms a and b with a single bond.
func (b *builder) attach(a, c int) { b.out.AddBond(molecule.Bond{A: a, B: c, Order: 1}) }

// takeProton removes one hydrogen from product atom a (implicit first).
// It reports false when a has none.
func takeProton(m *molecule.Molecule, a int) bool {
	if m.Atoms[a].ImplicitH > 0 {
		m.Atoms[a].ImplicitH--
		return true
	}
	return false
}

// bondAfterAttack fixes the valence of the nucleophile's atom once it has
// formed a new bond: an anion becomes neutral; a neutral atom with a
// hydrogen loses it (to the base or the medium); a neutral atom without
// one becomes a cation (quaternisation).
func bondAfterAttack(m *molecule.Molecule, a int, charge int) {
	at := &m.Atoms[a]
	switch {
	case charge < 0:
		at.Charge++
		if at.Charge != 0 || at.ImplicitH > 0 && !at.Bracket {
			return
		}
	case takeProton(m, a):
	default:
		at.Charge++
		at.Bracket = true
	}
}
