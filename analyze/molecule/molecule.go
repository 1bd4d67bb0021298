// Package molecule holds the plain graph that all of walden's chemistry
// works on: atoms, bonds and the stereo configurations written on them.
//
// A Molecule knows nothing of SMILES text beyond the byte spans its atoms
// and bonds came from; reading and writing live in package smiles, CIP
// labelling in package cip.
package molecule

// Implicit stands in a stereo reference list for a hydrogen that is not an
// atom of the graph (an implicit or bracket hydrogen) or for a lone pair.
const Implicit = -1

// Span is a half-open byte range [Start, End) in the text a molecule was
// read from.
type Span struct{ Start, End int }

// Atom is one vertex of the graph.
type Atom struct {
	Element   Element // atomic number; 0 for the wildcard atom '*'
	Isotope   int     // mass number; 0 when not given
	Charge    int
	ImplicitH int  // hydrogens carried on the atom rather than as atoms of the graph
	Aromatic  bool // written in aromatic (lower-case) form
	Bracket   bool // written as a bracket atom, so ImplicitH was stated, not derived
	Class     int  // atom class (the :n of a bracket atom); 0 when none
	Span      Span
}

// Bond is one edge of the graph. Order is the Kekulé order (1, 2, 3 or 4)
// once aromatic input has been kekulised; Aromatic records that the bond
// was aromatic in the input or was perceived so.
type Bond struct {
	A, B     int
	Order    int
	Aromatic bool
	Span     Span
}

// Other returns the atom at the far end of b from atom a.
func (b Bond) Other(a int) int {
	if b.A == a {
		return b.B
	}
	return b.A
}

// Edge is one entry of an atom's adjacency list.
type Edge struct {
	Atom int // the neighbour
	Bond int // index into Molecule.Bonds
}

// Winding is the sense in which three references appear when viewed from
// the first reference towards the centre.
type Winding int8

const (
	Anticlockwise Winding = 1  // SMILES '@'
	Clockwise     Winding = -1 // SMILES '@@'
)

// Invert returns the opposite winding.
func (w Winding) Invert() Winding { return -w }

// Tetrahedral is a configuration at a four-coordinate centre (or a
// three-coordinate one with a lone pair, which appears as Implicit).
// Looking from Refs[0] towards Centre, Refs[1], Refs[2], Refs[3] appear in
// the order given by Winding.
type Tetrahedral struct {
	Centre  int
	Refs    [4]int
	Winding Winding
}

// Config says on which sides of a double bond two reference atoms lie.
type Config int8

const (
	Together Config = 1  // same side (cis to each other)
	Opposite Config = -1 // opposite sides (trans)
)

// CisTrans is a configuration of a double bond (or of a cumulene with an
// odd number of double bonds, where Ends are the terminal atoms).
// Refs[i] is a neighbour of Ends[i] outside the double bond.
type CisTrans struct {
	Ends   [2]int
	Refs   [2]int
	Config Config
}

// Axial is the configuration of an allene-like cumulene with an even number
// of double bonds, written with '@' or '@@' on the central atom. Refs holds
// two neighbours of Ends[0] then two of Ends[1] (Implicit for hydrogens that
// are not atoms), and Winding reads them as a Tetrahedral would.
type Axial struct {
	Centre  int
	Ends    [2]int
	Refs    [4]int
	Winding Winding
}

// Molecule is a graph of atoms and bonds with the stereo configurations
// that were specified on it. Several disconnected components may share
// one Molecule, as in SMILES with '.'.
type Molecule struct {
	Atoms       []Atom
	Bonds       []Bond
	Tetrahedral []Tetrahedral
	CisTrans    []CisTrans
	Axial       []Axial

	adj  [][]Edge
	slab []Edge // backing store handing out adjacency lists of 4
}

// AddAtom appends a and returns its index.
func (m *Molecule) AddAtom(a Atom) int {
	m.Atoms = append(m.Atoms, a)
	// Adjacency lists come four at a time from a shared slab, so reading
	// a molecule costs a few allocations rather than several per atom;
	// an atom with more than four bonds grows its own list.
	if cap(m.slab)-len(m.slab) < 4 {
		m.slab = make([]Edge, 0, 64)
	}
	k := len(m.slab)
	m.slab = m.slab[:k+4]
	m.adj = append(m.adj, m.slab[k:k:k+4])
	return len(m.Atoms) - 1
}

// Grow reserves room for atoms and bonds more atoms and bonds, so that a
// reader that knows the size in advance allocates once.
func (m *Molecule) Grow(atoms, bonds int) {
	if cap(m.Atoms)-len(m.Atoms) < atoms {
		a := make([]Atom, len(m.Atoms), len(m.Atoms)+atoms)
		copy(a, m.Atoms)
		m.Atoms = a
		j := make([][]Edge, len(m.adj), len(m.adj)+atoms)
		copy(j, m.adj)
		m.adj = j
		if cap(m.slab)-len(m.slab) < 4*atoms {
			m.slab = make([]Edge, 0, 4*atoms)
		}
	}
	if cap(m.Bonds)-len(m.Bonds) < bonds {
		b := make([]Bond, len(m.Bonds), len(m.Bonds)+bonds)
		copy(b, m.Bonds)
		m.Bonds = b
	}
}

// AddBond appends b, records it in both atoms' adjacency lists and returns
// its index. The caller guarantees that b.A and b.B are distinct atoms not
// yet bonded.
func (m *Molecule) AddBond(b Bond) int {
	i := len(m.Bonds)
	m.Bonds = append(m.Bonds, b)
	m.adj[b.A] = append(m.adj[b.A], Edge{b.B, i})
	m.adj[b.B] = append(m.adj[b.B], Edge{b.A, i})
	return i
}

// Edges returns the adjacency list of atom i, in the order bonds were added.
// The slice belongs to the molecule and must not be modified.
func (m *Molecule) Edges(i int) []Edge { return m.adj[i] }

// Degree returns the number of graph neighbours of atom i.
func (m *Molecule) Degree(i int) int { return len(m.adj[i]) }

// BondBetween returns the index of the bond joining a and b, or -1.
func (m *Molecule) BondBetween(a, b int) int {
	for _, e := range m.adj[a] {
		if e.Atom == b {
			return e.Bond
		}
	}
	return -1
}

// HydrogenCount returns all hydrogens on atom i: implicit ones plus
// hydrogen atoms of the graph bonded to it.
func (m *Molecule) HydrogenCount(i int) int {
	n := m.Atoms[i].ImplicitH
	for _, e := range m.adj[i] {
		if m.Atoms[e.Atom].Element == H {
			n++
		}
	}
	return n
}

// BondOrderSum returns the sum of the Kekulé orders of the bonds at atom i,
// not counting implicit hydrogens.
func (m *Molecule) BondOrderSum(i int) int {
	s := 0
	for _, e := range m.adj[i] {
		s += m.Bonds[e.Bond].Order
	}
	return s
}

// Clone returns a deep copy of m.
func (m *Molecule) Clone() *Molecule {
	c := &Molecule{
		Atoms:       append([]Atom(nil), m.Atoms...),
		Bonds:       append([]Bond(nil), m.Bonds...),
		Tetrahedral: append([]Tetrahedral(nil), m.Tetrahedral...),
		CisTrans:    append([]CisTrans(nil), m.CisTrans...),
		Axial:       append([]Axial(nil), m.Axial...),
		adj:         make([][]Edge, len(m.adj)),
	}
	// The adjacency lists share one backing array, each capped at its
	// length so that a bond added later moves only its own atoms' lists.
	n := 0
	for _, l := range m.adj {
		n += len(l)
	}
	slab := make([]Edge, 0, n)
	for i, l := range m.adj {
		k := len(slab)
		slab = append(slab, l...)
		c.adj[i] = slab[k:len(slab):len(slab)]
	}
	return c
}

// Components returns, for every atom, the index of the connected component
// it belongs to, and the number of components. Components are numbered in
// order of their lowest atom.
func (m *Molecule) Components() (comp []int, n int) {
	comp = make([]int, len(m.Atoms))
	for i := range comp {
		comp[i] = -1
	}
	stack := make([]int, 0, 16)
	for s := range m.Atoms {
		if comp[s] >= 0 {
			continue
		}
		comp[s] = n
		stack = append(stack[:0], s)
		for len(stack) > 0 {
			a := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			for _, e := range m.adj[a] {
				if comp[e.Atom] < 0 {
					comp[e.Atom] = n
					stack = append(stack, e.Atom)
				}
			}
		}
		n++
	}
	return comp, n
}

// RingBonds reports for every bond whether it lies on a ring, that is,
// whether it is not a bridge of the graph.
func (m *Molecule) RingBonds() []bool {
	ring := make([]bool, len(m.Bonds))
	for i := range ring {
		ring[i] = true
	}
	// Iterative Tarjan bridge finding: a bond is a bridge when the far
	// side cannot reach back above it.
	n := len(m.Atoms)
	both := make([]int, 2*n) // disc and low in one allocation
	disc, low := both[:n:n], both[n:]
	for i := range disc {
		disc[i] = -1
	}
	type frame struct{ atom, viaBond, next int }
	stack := make([]frame, 0, 16)
	t := 0
	for s := 0; s < n; s++ {
		if disc[s] >= 0 {
			continue
		}
		stack = append(stack[:0], frame{s, -1, 0})
		disc[s], low[s] = t, t
		t++
		for len(stack) > 0 {
			f := &stack[len(stack)-1]
			if f.next < len(m.adj[f.atom]) {
				e := m.adj[f.atom][f.next]
				f.next++
				if e.Bond == f.viaBond {
					continue
				}
				if disc[e.Atom] < 0 {
					disc[e.Atom], low[e.Atom] = t, t
					t++
					stack = append(stack, frame{e.Atom, e.Bond, 0})
				} else if disc[e.Atom] < low[f.atom] {
					low[f.atom] = disc[e.Atom]
				}
				continue
			}
			stack = stack[:len(stack)-1]
			if len(stack) > 0 {
				p := &stack[len(stack)-1]
				if low[f.atom] < low[p.atom] {
					low[p.atom] = low[f.atom]
				}
				if low[f.atom] > disc[p.atom] {
					ring[f.viaBond] = false
				}
			}
		}
	}
	return ring
}
