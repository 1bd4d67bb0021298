package cip

import (
	"fmt"

	"walden/analyze/molecule"
)

// DefaultNodeLimit is the number of digraph nodes one stereogenic unit may
// expand before labelling gives up on it with a *BudgetError. Highly
// bridged cages make the hierarchical digraph grow exponentially; the
// limit keeps such input to a bounded time and memory (about 5 MB).
const DefaultNodeLimit = 100000

// BudgetError reports a stereogenic unit whose digraph outgrew the node
// limit. The unit gets no descriptor; the other units are still labelled.
type BudgetError struct {
	Atoms [2]int // the unit's atoms, as in Descriptor; Atoms[1] is -1 for a centre
	Limit int
}

func (e *BudgetError) Error() string {
	if e.Atoms[1] < 0 {
		return fmt.Sprintf("cip: atom %d: not analysed: the hierarchical digraph exceeds %d nodes", e.Atoms[0]+1, e.Limit)
	}
	return fmt.Sprintf("cip: atoms %d-%d: not analysed: the hierarchical digraph exceeds %d nodes", e.Atoms[0]+1, e.Atoms[1]+1, e.Limit)
}

// overBudget is the panic value that unwinds a labelling when the digraph
// outgrows its limit; label recovers it and returns a *BudgetError.
type overBudget struct{}

// Node flags.
const (
	expanded  uint8 = 1 << iota
	ringDup         // duplicate made at a ring closure
	bondDup         // duplicate made for a multiple bond
	implicitH       // a hydrogen that is not an atom of the graph
)

const duplicate = ringDup | bondDup

// node is a vertex of the hierarchical digraph: one visit of an atom on a
// path out from the root.
type node struct {
	atom  int32 // molecule atom; -1 for an implicit hydrogen
	up    int32 // node this one was made from (-1 for the origin); rerooting leaves it alone, so it always traces the path that decides duplicates
	made  int32 // edge that made this node (-1 for the origin)
	dist  int32 // sphere (origin = 1); for a duplicate, the sphere of the atom it duplicates (0 when that atom is not on the path)
	zNum  int32 // atomic number as the fraction zNum/zDen, for mancude duplicates
	zDen  int32
	first int32 // out edges made by expansion: g.kids[first:last]
	last  int32
	flags uint8
	aux   Letter // auxiliary descriptor, for rules 3 to 5
}

// edge joins two nodes. beg is the end nearer the current root; rerooting
// swaps beg and end along the path to the new root.
type edge struct {
	beg, end int32
}

// digraph is the hierarchical digraph of one stereogenic unit.
type digraph struct {
	mol     *view
	nodes   []node
	edges   []edge
	kids    []int32
	root    int32 // current root
	rule6   int32 // atom preferred by rule 6, -1 when none
	limit   int
	cache   []sortEntry // by node*cacheSlots + 2*rule sequence + 1 when not deep: the node's ranked out edges in arena
	first   []sortEntry // by node: its out edges ranked by rule 1a alone (firstOrder); start -1 when that leaves a tie
	arena   []int32
	rootGen uint32            // counts reroots, for the cache
	auxGen  uint32            // counts changes of auxiliary descriptors and the rule 6 reference
	pool    [][]int32         // scratch slices
	auxMemo []auxMark         // by node: whether its branch has auxiliary descriptors
	ties    map[[2]int32]bool // pairs of edges at the origin tied by the constitutional rules
	path    []uint64          // by node, mol.words words: the atoms on the path from the origin

	explored map[exploreKey]int8 // answers of explore by the constitutional rules
}

// reset starts a new digraph rooted at atom.
func (g *digraph) reset(v *view, atom int, limit int) {
	g.mol = v
	g.nodes = g.nodes[:0]
	g.edges = g.edges[:0]
	g.kids = g.kids[:0]
	g.rule6 = -1
	g.limit = limit
	g.cache = g.cache[:0]
	g.first = g.first[:0]
	g.arena = g.arena[:0]
	g.auxMemo = g.auxMemo[:0]
	clear(g.ties)
	clear(g.explored)
	z := int32(v.m.Atoms[atom].Element)
	g.nodes = append(g.nodes, node{atom: int32(atom), up: -1, made: -1, dist: 1, zNum: z, zDen: 1, first: -1, last: -1})
	g.root = 0
	if w := v.words; w > 0 {
		g.path = append(g.path[:0], make([]uint64, w)...)
		g.path[atom/64] |= 1 << (atom % 64)
	}
}

func (g *digraph) addNode(n node, from int32) int32 {
	if len(g.nodes) >= g.limit {
		panic(overBudget{})
	}
	i := int32(len(g.nodes))
	e := int32(len(g.edges))
	g.edges = append(g.edges, edge{from, i})
	n.made = e
	n.up = from
	n.first, n.last = 0, 0
	g.nodes = append(g.nodes, n)
	g.kids = append(g.kids, e)
	if w := g.mol.words; w > 0 {
		// The node's path is its parent's plus its own atom; terminal
		// nodes are never expanded, but keep their slot for indexing.
		base := len(g.path)
		g.path = append(g.path, g.path[int(from)*w:int(from+1)*w]...)
		if n.atom >= 0 && n.flags&duplicate == 0 {
			g.path[base+int(n.atom)/64] |= 1 << (n.atom % 64)
		}
	}
	return i
}

// onPath returns the sphere of the node for atom on the path from the
// origin to n, or 0 when atom is not on it.
func (g *digraph) onPath(n int32, atom int32) int32 {
	if w := g.mol.words; w > 0 && g.path[int(n)*w+int(atom)/64]&(1<<(atom%64)) == 0 {
		return 0
	}
	for n >= 0 {
		if g.nodes[n].atom == atom {
			return g.nodes[n].dist
		}
		n = g.nodes[n].up
	}
	return 0
}

// expand makes the children of n: one node per neighbour not yet on the
// path, a ring-closure duplicate for a neighbour already on it, bond
// duplicates for multiple bonds (P-92.1.4.2), and the implicit hydrogens.
// The root's own multiple bonds get no duplicates (a sulfoxide S=O at the
// root keeps three ligands and a lone pair).
func (g *digraph) expand(n int32) {
	nd := g.nodes[n]
	g.nodes[n].flags |= expanded
	g.nodes[n].first = int32(len(g.kids))
	if nd.atom < 0 || nd.flags&duplicate != 0 {
		g.nodes[n].last = g.nodes[n].first
		return
	}
	v := g.mol
	atom := int(nd.atom)
	prev := int32(-1)
	if nd.up >= 0 {
		prev = g.nodes[nd.up].atom
	}
	originAtom := g.nodes[0].atom
	frac := v.fracDen[atom] > 1
	neg := v.m.Atoms[atom].Charge < 0 && frac
	for _, e := range v.m.Edges(atom) {
		nbr := int32(e.Atom)
		order := v.m.Bonds[e.Bond].Order
		dups := order - 1
		if neg {
			dups = 1
		}
		if d := g.onPath(n, nbr); d == 0 {
			g.addNode(node{atom: nbr, dist: nd.dist + 1, zNum: int32(v.m.Atoms[nbr].Element), zDen: 1}, n)
			if n != 0 {
				g.addDups(n, nbr, 0, dups)
			}
		} else if nbr == prev {
			if nbr != originAtom {
				g.addDups(n, nbr, d, order-1)
			}
		} else {
			g.addNode(node{atom: nbr, dist: d, zNum: int32(v.m.Atoms[nbr].Element), zDen: 1, flags: ringDup | expanded}, n)
			g.addDups(n, nbr, d, dups)
		}
	}
	for range v.m.Atoms[atom].ImplicitH {
		g.addNode(node{atom: -1, dist: nd.dist + 1, zNum: 1, zDen: 1, flags: implicitH | expanded}, n)
	}
	g.nodes[n].last = int32(len(g.kids))
}

// addDups adds count bond duplicates of atom nbr to n. In a mancude ring
// the duplicate takes the averaged atomic number of n's ring neighbours
// (P-92.1.4.4), so that the choice of Kekulé structure cannot matter.
func (g *digraph) addDups(n, nbr, dist int32, count int) {
	v := g.mol
	at := g.nodes[n].atom
	for range count {
		z, d := int32(v.m.Atoms[nbr].Element), int32(1)
		if v.fracDen[at] > 1 {
			z, d = v.fracNum[at], v.fracDen[at]
		}
		g.addNode(node{atom: nbr, dist: dist, zNum: z, zDen: d, flags: bondDup | expanded}, n)
	}
}

// incident appends every edge touching n to buf, expanding n if needed.
func (g *digraph) incident(n int32, buf []int32) []int32 {
	if g.nodes[n].flags&expanded == 0 {
		g.expand(n)
	}
	nd := &g.nodes[n]
	if nd.made >= 0 {
		buf = append(buf, nd.made)
	}
	return append(buf, g.kids[nd.first:nd.last]...)
}

// out appends the edges leading away from the current root at n.
func (g *digraph) out(n int32, buf []int32) []int32 {
	if g.nodes[n].flags&expanded == 0 {
		g.expand(n)
	}
	nd := &g.nodes[n]
	if nd.made >= 0 && g.edges[nd.made].beg == n {
		buf = append(buf, nd.made)
	}
	for _, e := range g.kids[nd.first:nd.last] {
		if g.edges[e].beg == n {
			buf = append(buf, e)
		}
	}
	return buf
}

// other returns the node at the far end of e from n.
func (g *digraph) other(e, n int32) int32 {
	if g.edges[e].beg == n {
		return g.edges[e].end
	}
	return g.edges[e].beg
}

// terminal reports whether n can have no children: a duplicate, an
// implicit hydrogen or an atom with a single neighbour and no hydrogens.
func (g *digraph) terminal(n int32) bool {
	nd := &g.nodes[n]
	if nd.flags&(duplicate|implicitH) != 0 {
		return true
	}
	a := int(nd.atom)
	return g.mol.m.Degree(a) == 1 && g.mol.m.Atoms[a].ImplicitH == 0 && n != g.root
}

// reroot makes n the root by reversing the edges on the path from the
// current root to n.
func (g *digraph) reroot(n int32) {
	if n == g.root {
		return
	}
	cur, last := n, int32(-1)
	for {
		in := g.inEdge(cur, last)
		if in < 0 {
			break
		}
		last = in
		p := g.edges[in].beg
		g.edges[in].beg, g.edges[in].end = g.edges[in].end, g.edges[in].beg
		cur = p
	}
	g.root = n
	g.rootGen++
}

// inEdge returns the edge other than except that ends at n, or -1 at
// the root. Only the edge that made n and the edges n made can touch it.
func (g *digraph) inEdge(n, except int32) int32 {
	nd := &g.nodes[n]
	if nd.made >= 0 && nd.made != except && g.edges[nd.made].end == n {
		return nd.made
	}
	if nd.flags&expanded != 0 {
		for _, e := range g.kids[nd.first:nd.last] {
			if e != except && g.edges[e].end == n {
				return e
			}
		}
	}
	return -1
}

// nodesOf returns every non-duplicate node for atom, expanding the whole
// digraph breadth-first from the current root.
func (g *digraph) nodesOf(atom int32, buf []int32) []int32 {
	queue := []int32{g.root}
	var es []int32
	for i := 0; i < len(queue); i++ {
		n := queue[i]
		if g.nodes[n].atom == atom && g.nodes[n].flags&duplicate == 0 {
			buf = append(buf, n)
		}
		es = g.out(n, es[:0])
		for _, e := range es {
			queue = append(queue, g.edges[e].end)
		}
	}
	return buf
}

// view is what labelling needs from a molecule, computed once.
type view struct {
	m        *molecule.Molecule
	isotopes bool    // some atom has a stated mass number
	words    int     // words of a node's path bitset; 0 for large molecules, whose paths are walked
	fracNum  []int32 // averaged atomic number of mancude duplicates made on each atom
	fracDen  []int32
}

// setRule6 makes atom the reference of rule 6 (-1 for none).
func (g *digraph) setRule6(atom int32) {
	g.rule6 = atom
	g.auxChanged()
}
