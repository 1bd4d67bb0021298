package perceive

import (
	"slices"

	"walden/analyze/molecule"
)

// Rings holds ring facts of one molecule computed once.
type Rings struct {
	Bond []bool // bond lies on a ring
	m    *molecule.Molecule
}

// NewRings computes the ring bonds of m.
func NewRings(m *molecule.Molecule) *Rings { return &Rings{Bond: m.RingBonds(), m: m} }

// InRing reports whether atom a has a ring bond.
func (r *Rings) InRing(a int) bool { return r.RingDegree(a) > 0 }

// RingDegree counts the ring bonds at atom a.
func (r *Rings) RingDegree(a int) int {
	n := 0
	for _, e := range r.m.Edges(a) {
		if r.Bond[e.Bond] {
			n++
		}
	}
	return n
}

// SmallestRing returns the size of the smallest ring through atom a, or 0.
// It is a breadth-first search over ring bonds from each ring neighbour
// back to a without using the first bond.
func (r *Rings) SmallestRing(a int) int {
	best := 0
	for _, e := range r.m.Edges(a) {
		if !r.Bond[e.Bond] {
			continue
		}
		if d := r.pathLen(e.Atom, a, e.Bond, best); d > 0 && (best == 0 || d+1 < best) {
			best = d + 1
		}
	}
	return best
}

// SmallestRingBond returns the size of the smallest ring containing bond
// (a, b), or 0.
func (r *Rings) SmallestRingBond(a, b int) int {
	bi := r.m.BondBetween(a, b)
	if bi < 0 || !r.Bond[bi] {
		return 0
	}
	if d := r.pathLen(a, b, bi, 0); d > 0 {
		return d + 1
	}
	return 0
}

// pathLen is the shortest path length from s to t over ring bonds not
// using bond skip; 0 when there is none (or none shorter than limit when
// limit > 0).
func (r *Rings) pathLen(s, t, skip, limit int) int {
	m := r.m
	dist := map[int]int{s: 0}
	queue := []int{s}
	for len(queue) > 0 {
		a := queue[0]
		queue = queue[1:]
		if limit > 0 && dist[a]+1 >= limit {
			continue
		}
		for _, e := range m.Edges(a) {
			if e.Bond == skip || !r.Bond[e.Bond] {
				continue
			}
			if _, seen := dist[e.Atom]; seen {
				continue
			}
			dist[e.Atom] = dist[a] + 1
			if e.Atom == t {
				return dist[e.Atom]
			}
			queue = append(queue, e.Atom)
		}
	}
	return 0
}

// Bridgehead reports whether atom a is a bridgehead of a bridged ring
// system: it has three ring bonds and another atom with three ring bonds
// that it does not bond to directly is reachable from each of its ring
// neighbours without passing through a (bicyclo[x.y.z] with z > 0).
// Fused ring junctions (decalin) are not bridgeheads in this sense.
func (r *Rings) Bridgehead(a int) bool {
	m := r.m
	if r.RingDegree(a) < 3 {
		return false
	}
	var nbrs []int
	for _, e := range m.Edges(a) {
		if r.Bond[e.Bond] {
			nbrs = append(nbrs, e.Atom)
		}
	}
	counts := map[int]int{}
	for _, s := range nbrs {
		seen := map[int]bool{a: true, s: true}
		queue := []int{s}
		depth := map[int]int{s: 0}
		for len(queue) > 0 {
			x := queue[0]
			queue = queue[1:]
			if x != s && r.RingDegree(x) >= 3 && m.BondBetween(a, x) < 0 {
				counts[x]++
			}
			if depth[x] >= 6 {
				continue
			}
			for _, e := range m.Edges(x) {
				if r.Bond[e.Bond] && !seen[e.Atom] {
					seen[e.Atom] = true
					depth[e.Atom] = depth[x] + 1
					queue = append(queue, e.Atom)
				}
			}
		}
	}
	for x, c := range counts {
		if c >= 3 && x != a {
			return true
		}
	}
	return false
}

// SymmetryClasses returns an invariant per atom such that atoms related
// by a symmetry of the graph (constitution only) share a value. It is the
// iterative refinement of atom invariants by neighbour classes (Morgan's
// extended connectivity idea: H. L. Morgan, J. Chem. Doc. 1965, 5, 107).
// Different values prove atoms different; equal values are taken as
// equivalent, which is exact for the small molecules of reaction steps in
// all but contrived regular graphs.
func SymmetryClasses(m *molecule.Molecule) []uint64 {
	n := len(m.Atoms)
	cls := make([]uint64, n)
	for i, a := range m.Atoms {
		h := uint64(a.Element)
		h = h*31 + uint64(a.Charge+8)
		h = h*31 + uint64(m.HydrogenCount(i))
		h = h*31 + uint64(m.Degree(i))
		h = h*31 + uint64(a.Isotope)
		cls[i] = mix(h)
	}
	next := make([]uint64, n)
	buf := make([]uint64, 0, 8)
	scratch := make([]uint64, n) // for countDistinct, one allocation for every round
	distinct := countDistinct(cls, scratch)
	for range n {
		for i := range m.Atoms {
			buf = buf[:0]
			for _, e := range m.Edges(i) {
				buf = append(buf, mix(cls[e.Atom]*7+uint64(m.Bonds[e.Bond].Order)))
			}
			slices.Sort(buf)
			h := cls[i]
			for _, v := range buf {
				h = mix(h*1000003 ^ v)
			}
			next[i] = h
		}
		cls, next = next, cls
		d := countDistinct(cls, scratch)
		if d == distinct {
			break
		}
		distinct = d
	}
	return cls
}

// countDistinct counts the distinct values of v, sorting a copy in
// scratch (len(v) long) rather than building a set: it runs once per
// refinement round of every perceived molecule.
func countDistinct(v, scratch []uint64) int {
	s := scratch[:len(v)]
	copy(s, v)
	slices.Sort(s)
	n := 0
	for i, x := range s {
		if i == 0 || x != s[i-1] {
			n++
		}
	}
	return n
}

// mix is the 64-bit finaliser of SplitMix64 (Steele, Lea, Flood 2014).
func mix(x uint64) uint64 {
	x ^= x >> 30
	x *= 0xbf58476d1ce4e5b9
	x ^= x >> 27
	x *= 0x94d049bb133111eb
	x ^= x >> 31
	return x
}

// BranchSize counts the heavy atoms reachable from atom start without
// passing through atom from, up to limit: a cheap measure of how large a
// substituent is.
func BranchSize(m *molecule.Molecule, from, start, limit int) int {
	if start < 0 {
		return 0
	}
	seen := map[int]bool{from: true, start: true}
	stack := []int{start}
	n := 0
	for len(stack) > 0 && n < limit {
		a := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if m.Atoms[a].Element != molecule.H {
			n++
		}
		for _, e := range m.Edges(a) {
			if !seen[e.Atom] {
				seen[e.Atom] = true
				stack = append(stack, e.Atom)
			}
		}
	}
	return n
}
