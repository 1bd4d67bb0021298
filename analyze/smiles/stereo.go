package smiles

import (
	"walden/analyze/molecule"
)

// stereo turns the '@' marks and the '/' '\' bond marks into the
// molecule's configurations. OpenSMILES section 3.9 (stereochemistry):
// the neighbours of a centre are read in the order they are written, the
// preceding atom first and a bracket hydrogen (or, for a three-coordinate
// centre, the lone pair) in the place just after it.
func (p *parser) stereo() {
	for _, c := range p.chiral {
		p.centre(c)
	}
	p.doubleBonds()
}

// keyAt is the reading order of bond bi around atom a.
func (p *parser) keyAt(bi, a int) int {
	if p.m.Bonds[bi].A == a {
		return p.notes[bi].keyA
	}
	return p.notes[bi].keyB
}

type ref struct{ key, atom int }

// sortRefs sorts a few references by key (insertion sort: at most five).
func sortRefs(r []ref) {
	for i := 1; i < len(r); i++ {
		for j := i; j > 0 && r[j].key < r[j-1].key; j-- {
			r[j], r[j-1] = r[j-1], r[j]
		}
	}
}

func (p *parser) centre(c chiralMark) {
	m := p.m
	i := c.atom
	a := m.Atoms[i]
	var buf [8]ref
	refs := buf[:0]
	for _, e := range m.Edges(i) {
		if len(refs) == len(buf) {
			break
		}
		refs = append(refs, ref{p.keyAt(e.Bond, i), e.Atom})
	}
	doubles := 0
	for _, e := range m.Edges(i) {
		if m.Bonds[e.Bond].Order == 2 && !m.Bonds[e.Bond].Aromatic {
			doubles++
		}
	}
	if m.Degree(i) == 2 && doubles == 2 && a.ImplicitH == 0 {
		p.allene(c)
		return
	}
	for range a.ImplicitH {
		if len(refs) == len(buf) {
			break
		}
		refs = append(refs, ref{2 * a.Span.Start, molecule.Implicit})
	}
	total := m.Degree(i) + a.ImplicitH
	if total == 3 && hasLonePair(a) {
		// A lone pair stands where an implicit hydrogen would.
		refs = append(refs, ref{2 * a.Span.Start, molecule.Implicit})
	}
	if total != 4 && !(total == 3 && hasLonePair(a)) || len(refs) != 4 {
		p.errorf(c.span.Start, c.span.End, "found '%s' on an atom with %d neighbours (hydrogens included); tetrahedral stereo needs 4, or 3 and a lone pair, and allene stereo a central atom with two double bonds; drop the mark", p.src[c.span.Start:c.span.End], total)
		return
	}
	sortRefs(refs)
	t := molecule.Tetrahedral{Centre: i, Winding: c.winding}
	for k := range 4 {
		t.Refs[k] = refs[k].atom
	}
	m.Tetrahedral = append(m.Tetrahedral, t)
}

// cumulatedNext follows a cumulene from atom a, entered by bond from,
// and returns the bond and atom after it when a is itself cumulated (two
// non-aromatic double bonds and nothing else), else -1.
func (p *parser) cumulatedNext(a, from int) (bond, atom int) {
	m := p.m
	if m.Degree(a) != 2 || m.Atoms[a].ImplicitH != 0 {
		return -1, -1
	}
	for _, e := range m.Edges(a) {
		if e.Bond == from {
			continue
		}
		b := m.Bonds[e.Bond]
		if b.Order == 2 && !b.Aromatic && m.Bonds[from].Order == 2 {
			return e.Bond, e.Atom
		}
	}
	return -1, -1
}

// walk follows cumulated double bonds from centre through bond first and
// returns the terminal atom and the number of double bonds crossed.
func (p *parser) walk(centre, first int) (end, bonds int) {
	m := p.m
	bond, at := first, m.Bonds[first].Other(centre)
	bonds = 1
	for bonds <= MaxAtoms {
		nb, na := p.cumulatedNext(at, bond)
		if nb < 0 {
			return at, bonds
		}
		bond, at = nb, na
		bonds++
	}
	return at, bonds
}

// allene reads '@' on the central atom of a cumulene with an even number
// of double bonds (OpenSMILES 3.9.6, extended tetrahedral): the four
// substituents of the terminal atoms are read in the order written, a
// hydrogen in the place just after its terminal atom.
func (p *parser) allene(c chiralMark) {
	m := p.m
	i := c.atom
	e := m.Edges(i)
	end0, n0 := p.walk(i, e[0].Bond)
	end1, n1 := p.walk(i, e[1].Bond)
	if n0 != n1 {
		p.errorf(c.span.Start, c.span.End, "found '%s' on a cumulated atom that is not the centre of its cumulene (%d and %d double bonds on either side); write it on the middle atom", p.src[c.span.Start:c.span.End], n0, n1)
		return
	}
	if end0 > end1 {
		end0, end1 = end1, end0
	}
	var refs [4]ref
	var side [4]int
	k := 0
	for s, end := range [2]int{end0, end1} {
		a := m.Atoms[end]
		if m.Degree(end)-1+a.ImplicitH != 2 {
			p.errorf(c.span.Start, c.span.End, "found '%s' on an allene whose end atom %d has %d substituents; allene stereo needs two on each end", p.src[c.span.Start:c.span.End], end+1, m.Degree(end)-1+a.ImplicitH)
			return
		}
		for _, ed := range m.Edges(end) {
			if m.Bonds[ed.Bond].Order == 2 && !m.Bonds[ed.Bond].Aromatic && p.onCumulene(ed.Atom, i) {
				continue
			}
			refs[k], side[k] = ref{p.keyAt(ed.Bond, end), ed.Atom}, s
			k++
		}
		for range a.ImplicitH {
			refs[k], side[k] = ref{2 * a.Span.Start, molecule.Implicit}, s
			k++
		}
	}
	if k != 4 {
		return
	}
	// Reading order by key; then regroup as two of end0, two of end1,
	// tracking the parity of the permutation.
	order := [4]int{0, 1, 2, 3}
	for x := 1; x < 4; x++ {
		for y := x; y > 0 && refs[order[y]].key < refs[order[y-1]].key; y-- {
			order[y], order[y-1] = order[y-1], order[y]
		}
	}
	// order[] is the written sequence; target is stable partition by side.
	var target [4]int
	t := 0
	for s := range 2 {
		for _, o := range order {
			if side[o] == s {
				target[t] = o
				t++
			}
		}
	}
	w := c.winding
	if permutationOdd(order[:], target[:]) {
		w = w.Invert()
	}
	ax := molecule.Axial{Centre: i, Ends: [2]int{end0, end1}, Winding: w}
	for x := range 4 {
		ax.Refs[x] = refs[target[x]].atom
	}
	m.Axial = append(m.Axial, ax)
}

// onCumulene reports whether atom a lies on the cumulene through centre:
// a is the centre or a cumulated atom leading to it.
func (p *parser) onCumulene(a, centre int) bool {
	if a == centre {
		return true
	}
	m := p.m
	return m.Degree(a) == 2 && m.Atoms[a].ImplicitH == 0 && func() bool {
		for _, e := range m.Edges(a) {
			b := m.Bonds[e.Bond]
			if b.Order != 2 || b.Aromatic {
				return false
			}
		}
		return true
	}()
}

// permutationOdd reports whether b is an odd permutation of a (same
// elements, small slices).
func permutationOdd(a, b []int) bool {
	c := make([]int, len(a))
	copy(c, a)
	odd := false
	for i := range c {
		if c[i] == b[i] {
			continue
		}
		for j := i + 1; j < len(c); j++ {
			if c[j] == b[i] {
				c[i], c[j] = c[j], c[i]
				odd = !odd
				break
			}
		}
	}
	return odd
}

// markAt returns the side (+1/-1) on which the '/' '\' mark of bond bi
// puts the neighbour of end, 0 when unmarked. "X/Y" puts Y above X when
// read left to right; seen from Y, X is below.
func (p *parser) markAt(bi, end int) int {
	d := int(p.notes[bi].dir)
	if p.m.Bonds[bi].A == end {
		return d
	}
	return -d
}

// doubleBonds reads '/' and '\' around every non-aromatic double bond
// (and through cumulenes with an odd number of double bonds) into
// CisTrans entries. Conflicting marks at one end are errors; marks next
// to a double bond that end up describing nothing are reported too.
// Marks far from any double bond are ignored, as common practice.
func (p *parser) doubleBonds() {
	m := p.m
	anyMark := false
	for _, n := range p.notes {
		if n.dir != 0 {
			anyMark = true
			break
		}
	}
	if !anyMark {
		return
	}
	used := make([]bool, len(m.Bonds))
	done := make([]bool, len(m.Bonds))
	for bi := range m.Bonds {
		b := m.Bonds[bi]
		if b.Order != 2 || b.Aromatic || done[bi] {
			continue
		}
		done[bi] = true
		// Walk both ways through cumulated atoms to the two terminal atoms.
		ends := [2]int{b.A, b.B}
		into := [2]int{bi, bi}
		count := 1
		for s := range 2 {
			for steps := 0; steps <= MaxAtoms; steps++ {
				nb, na := p.cumulatedNext(ends[s], into[s])
				if nb < 0 {
					break
				}
				done[nb] = true
				ends[s], into[s] = na, nb
				count++
			}
		}
		if count%2 == 0 {
			continue
		}
		if count == 1 && inSmallRing(m, bi) || crowdedEnd(m, ends, into) {
			// Marks configure nothing around a double bond in a ring of
			// fewer than eight atoms, which can only be cis, nor at an
			// end with three neighbours or more besides its double bond
			// (a hypervalent atom), which has no two sides to tell
			// apart (common practice; RDKit 2022.09 assigns neither any
			// stereo, TestRDKitDoubleBondStereo). Such marks neither
			// configure nor conflict, and reading them would let two
			// spellings of one molecule differ.
			for s, end := range ends {
				for _, e := range m.Edges(end) {
					if e.Bond != into[s] && p.notes[e.Bond].dir != 0 {
						used[e.Bond] = true
					}
				}
			}
			continue
		}
		var refs [2]int
		var sides [2]int
		clash := [2]int{-1, -1}
		ok, conflict := true, false
		for s := range 2 {
			refs[s] = -1
			for _, e := range m.Edges(ends[s]) {
				if e.Bond == into[s] {
					continue
				}
				side := p.markAt(e.Bond, ends[s])
				if side == 0 {
					continue
				}
				if refs[s] < 0 {
					refs[s], sides[s] = e.Atom, side
				} else if side == sides[s] {
					clash[s] = e.Bond
				}
			}
			if refs[s] < 0 {
				ok = false
			}
		}
		// Two neighbours on one side is an error only when the bond is
		// configured at all (marks at both ends); otherwise those marks
		// serve neighbouring double bonds.
		if ok {
			for s := range 2 {
				if b := clash[s]; b >= 0 {
					sp := m.Bonds[b].Span
					p.errorf(sp.Start, sp.End, "conflicting '/' '\\' marks: two neighbours of atom %d are both placed on the same side of its double bond; flip one mark", ends[s]+1)
					ok, conflict = false, true
				}
			}
		}
		for s := range 2 {
			if !ok && !conflict {
				break
			}
			for _, e := range m.Edges(ends[s]) {
				if e.Bond != into[s] && p.notes[e.Bond].dir != 0 {
					used[e.Bond] = true
				}
			}
		}
		if !ok {
			continue
		}
		cfg := molecule.Opposite
		if sides[0] == sides[1] {
			cfg = molecule.Together
		}
		m.CisTrans = append(m.CisTrans, molecule.CisTrans{Ends: ends, Refs: refs, Config: cfg})
	}
	// Marks touching a double-bond atom that served no configuration.
	for bi, n := range p.notes {
		if n.dir == 0 || used[bi] {
			continue
		}
		b := m.Bonds[bi]
		if p.hasDouble(b.A) || p.hasDouble(b.B) {
			p.errorf(b.Span.Start, b.Span.End, "found a '/' or '\\' mark next to a double bond whose other end has no mark, so it describes no configuration; mark a neighbour at the other end too, or drop the mark")
		}
	}
}

func (p *parser) hasDouble(a int) bool {
	for _, e := range p.m.Edges(a) {
		b := p.m.Bonds[e.Bond]
		if b.Order == 2 && !b.Aromatic {
			return true
		}
	}
	return false
}

// hasLonePair reports whether a three-coordinate atom can be a
// stereocentre with a lone pair as its fourth ligand: N, P, As, S, Se and
// Te (amines at bridgeheads, phosphines, sulfoxides, sulfonium), and
// carbanions (common practice).
func hasLonePair(a molecule.Atom) bool {
	switch a.Element {
	case molecule.N, molecule.P, molecule.As, molecule.S, molecule.Se, 52:
		return true
	case molecule.C, molecule.Si, 32:
		return a.Charge < 0
	}
	return false
}

// smallRing is the size below which a ring's double bonds have no
// configuration of their own.
const smallRing = 8

// inSmallRing reports whether bond bi lies in a ring of fewer than
// smallRing atoms: whether its ends are joined, without it, by a path of
// at most smallRing-2 bonds.
func inSmallRing(m *molecule.Molecule, bi int) bool {
	b := m.Bonds[bi]
	dist := map[int]int{b.A: 0}
	queue := []int{b.A}
	for len(queue) > 0 {
		a := queue[0]
		queue = queue[1:]
		if dist[a] >= smallRing-2 {
			continue
		}
		for _, e := range m.Edges(a) {
			if e.Bond == bi {
				continue
			}
			if e.Atom == b.B {
				return true
			}
			if _, seen := dist[e.Atom]; !seen {
				dist[e.Atom] = dist[a] + 1
				queue = append(queue, e.Atom)
			}
		}
	}
	return false
}

// crowdedEnd reports whether an end of the double bond (or cumulated
// chain) reached through into has more than two other neighbours.
func crowdedEnd(m *molecule.Molecule, ends, into [2]int) bool {
	for s, end := range ends {
		n := 0
		for _, e := range m.Edges(end) {
			if e.Bond != into[s] {
				n++
			}
		}
		if n > 2 {
			return true
		}
	}
	return false
}
