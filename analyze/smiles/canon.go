package smiles

import (
	"cmp"
	"slices"
	"sync"

	"walden/analyze/molecule"
)

// Canonical returns the canonical SMILES of m: the same string for the
// same structure whatever the atom order, ring-closure numbering, or
// aromatic versus Kekulé input, stereo included.
//
// Method: atoms get invariants (element, isotope, charge, hydrogens,
// degree, perceived aromaticity, atom class) refined by neighbour ranks
// and bond types until stable (iterative partition refinement, as in
// Weininger, Weininger and Weininger, J. Chem. Inf. Comput. Sci. 1989, 29,
// 97, with exact sorting instead of prime products). Stereo enters as
// invariants too: the parity of each centre, double bond and allene
// relative to the current ranks once its references are distinguished.
// Remaining ties are broken by choosing each member of the first tied
// class that touches a stereo element in turn and keeping the smallest
// string (at most SearchBudget partial orders); ties that touch no stereo
// element are between equivalent atoms and broken by the first member.
func Canonical(m *molecule.Molecule) string {
	if m == nil || len(m.Atoms) == 0 {
		return ""
	}
	c := canonPool.Get().(*canon)
	c.init(m)
	s := c.run()
	c.m, c.w.m = nil, nil
	canonPool.Put(c)
	return s
}

// canonPool keeps the working buffers of Canonical between calls, so the
// stereo command's stream of small molecules allocates little.
var canonPool = sync.Pool{New: func() any { return &canon{w: &writer{}} }}

// SearchBudget bounds the tie-breaking search of Canonical, in atoms
// ranked (partial orders tried times atoms). Molecules needing more
// (highly symmetric ones with many stereo marks) still get a valid
// SMILES, but it may depend on the input order: a documented limit.
const SearchBudget = 400_000

type canon struct {
	m       *molecule.Molecule
	w       *writer
	inv     []uint64
	relev   []bool
	nbStart []int32 // neighbour list offsets into nbAtom/nbCode
	nbAtom  []int32
	nbCode  []int32
	stereo  []int32
	key     []uint64
	order   []int32
	tmp     []int32
	rank    []int32
	best    string
	found   bool
	budget  int
}

func (c *canon) init(m *molecule.Molecule) {
	n := len(m.Atoms)
	c.m = m
	c.budget = SearchBudget
	c.best, c.found = "", false
	c.w.init(m, true)
	if cap(c.inv) < n {
		c.inv = make([]uint64, n)
	}
	c.inv = c.inv[:n]
	c.relev = resizeBool(c.relev, n)
	c.nbStart = resizeInt32(c.nbStart, n+1, 0)
	for i := range n {
		a := m.Atoms[i]
		arom := uint64(0)
		if c.w.aromatic && c.w.arom[i] {
			arom = 1
		}
		iso := uint64(min(max(a.Isotope, 0), 4095))
		q := uint64(min(max(a.Charge+64, 0), 127))
		h := uint64(min(max(a.ImplicitH, 0), 31))
		d := uint64(min(m.Degree(i), 31))
		cls := uint64(min(max(a.Class, 0), 1<<26-1))
		c.inv[i] = d<<58 | uint64(a.Element&127)<<51 | iso<<39 | q<<32 | h<<27 | arom<<26 | cls
		c.nbStart[i+1] = c.nbStart[i] + int32(m.Degree(i))
	}
	c.nbAtom = resizeInt32(c.nbAtom, int(c.nbStart[n]), 0)
	c.nbCode = resizeInt32(c.nbCode, int(c.nbStart[n]), 0)
	for i := range n {
		k := c.nbStart[i]
		for _, e := range m.Edges(i) {
			c.nbAtom[k] = int32(e.Atom)
			code := int32(m.Bonds[e.Bond].Order)
			if c.w.aromatic && c.w.aromB[e.Bond] {
				code = 5
			}
			c.nbCode[k] = code
			k++
		}
	}
	mark := func(a int) {
		if a >= 0 && a < n {
			c.relev[a] = true
		}
	}
	for _, t := range m.Tetrahedral {
		mark(t.Centre)
		for _, r := range t.Refs {
			mark(r)
		}
	}
	for _, ct := range m.CisTrans {
		for s := range 2 {
			mark(ct.Ends[s])
			if e := ct.Ends[s]; e >= 0 && e < n {
				for _, ed := range m.Edges(e) {
					mark(ed.Atom)
				}
			}
		}
	}
	for _, ax := range m.Axial {
		mark(ax.Centre)
		mark(ax.Ends[0])
		mark(ax.Ends[1])
		for _, r := range ax.Refs {
			mark(r)
		}
	}
	c.stereo = resizeInt32(c.stereo, n, 0)
	c.order = resizeInt32(c.order, n, 0)
	c.tmp = resizeInt32(c.tmp, n, 0)
	c.rank = resizeInt32(c.rank, n, 0)
}

func (c *canon) run() string {
	rank := c.rank
	// Initial ranks from the invariants.
	for i := range c.order {
		c.order[i] = int32(i)
	}
	sortIdx(c.order, func(a, b int32) int {
		switch {
		case c.inv[a] < c.inv[b]:
			return -1
		case c.inv[a] > c.inv[b]:
			return 1
		}
		return 0
	})
	for k, a := range c.order {
		if k > 0 && c.inv[a] == c.inv[c.order[k-1]] {
			rank[a] = rank[c.order[k-1]]
		} else {
			rank[a] = int32(k)
		}
	}
	c.search(rank)
	return c.best
}

// search refines rank, then either writes the leaf or breaks a tie.
func (c *canon) search(rank []int32) {
	c.refine(rank)
	for {
		cls, size := c.tiedClass(rank, true)
		if cls < 0 {
			break
		}
		if size > 0 && c.budget > 0 {
			// Try each member of the stereo-relevant tied class.
			members := make([]int32, 0, size)
			for i, r := range rank {
				if r == cls {
					members = append(members, int32(i))
				}
			}
			for _, x := range members {
				if c.budget <= 0 && c.found {
					break
				}
				c.budget -= len(rank)
				next := append([]int32(nil), rank...)
				breakTie(next, cls, x)
				c.search(next)
			}
			return
		}
		// Out of budget: break deterministically and go on.
		c.breakFirst(rank, cls)
	}
	for {
		cls, _ := c.tiedClass(rank, false)
		if cls < 0 {
			break
		}
		c.breakFirst(rank, cls)
	}
	s := c.w.write(rank, nil)
	if !c.found || s < c.best {
		c.best, c.found = s, true
	}
}

func (c *canon) breakFirst(rank []int32, cls int32) {
	for i, r := range rank {
		if r == cls {
			breakTie(rank, cls, int32(i))
			break
		}
	}
	c.refine(rank)
}

// breakTie keeps atom x at rank cls and moves the rest of its class one
// rank up.
func breakTie(rank []int32, cls, x int32) {
	for i, r := range rank {
		if r == cls && int32(i) != x {
			rank[i] = cls + 1
		}
	}
}

// tiedClass returns the lowest rank shared by several atoms (only among
// stereo-relevant atoms when relevant is set) and the class size; -1
// when there is none.
func (c *canon) tiedClass(rank []int32, relevant bool) (int32, int) {
	n := len(rank)
	count := c.tmp
	clear(count)
	hasRel := c.order // reuse as flags: 1 when the class has a relevant atom
	clear(hasRel)
	for i, r := range rank {
		count[r]++
		if c.relev[i] {
			hasRel[r] = 1
		}
	}
	for r := range n {
		if count[r] > 1 && (!relevant || hasRel[r] == 1) {
			return int32(r), int(count[r])
		}
	}
	return -1, 0
}

// refine splits rank classes by neighbour ranks, bond types and stereo
// parities until the number of classes stops growing. Each round hashes
// an atom's stereo code and the multiset of its (neighbour rank, bond
// type) pairs into 64 bits and sorts by (rank, hash); a round costs
// O(n log n) even on chains of thousands of atoms, where the number of
// rounds grows with the length. A hash collision could only merge two
// classes that the tie-breaking search then separates.
func (c *canon) refine(rank []int32) {
	n := len(rank)
	if cap(c.key) < n {
		c.key = make([]uint64, n)
	}
	key := c.key[:n]
	// order lists atoms grouped by class, each class starting at its
	// rank (ranks are the start index of their class), by counting sort.
	fill := c.tmp
	clear(fill)
	for i := range n {
		r := rank[i]
		c.order[r+fill[r]] = int32(i)
		fill[r]++
	}
	classes := 0
	for r := range n {
		if fill[r] > 0 {
			classes++
		}
	}
	for {
		c.stereoCodes(rank)
		// Only atoms in classes of two or more can split.
		for start := 0; start < n; {
			end := start + 1
			for end < n && rank[c.order[end]] == rank[c.order[start]] {
				end++
			}
			if end-start > 1 {
				for _, i := range c.order[start:end] {
					h := mix(uint64(c.stereo[i]) + 0x9e3779b97f4a7c15)
					for k := c.nbStart[i]; k < c.nbStart[i+1]; k++ {
						h += mix(uint64(rank[c.nbAtom[k]])<<3 | uint64(c.nbCode[k]))
					}
					key[i] = h
				}
				seg := c.order[start:end]
				slices.SortFunc(seg, func(a, b int32) int { return cmp.Compare(key[a], key[b]) })
			}
			start = end
		}
		// New ranks: the start index of each (old class, key) group.
		next := c.tmp
		nc := 0
		for k, a := range c.order {
			if k > 0 {
				p := c.order[k-1]
				if rank[a] == rank[p] && key[a] == key[p] {
					next[a] = next[p]
					continue
				}
			}
			next[a] = int32(k)
			nc++
		}
		for _, a := range c.order {
			rank[a] = next[a]
		}
		if nc == classes {
			return
		}
		classes = nc
	}
}

// mix is the splitmix64 finaliser: a cheap, well-spread 64-bit hash.
func mix(x uint64) uint64 {
	x ^= x >> 30
	x *= 0xbf58476d1ce4e5b9
	x ^= x >> 27
	x *= 0x94d049bb133111eb
	x ^= x >> 31
	return x
}

func countClasses(rank []int32, seen []int32) int {
	clear(seen)
	n := 0
	for _, r := range rank {
		if seen[r] == 0 {
			seen[r] = 1
			n++
		}
	}
	return n
}

// sortIdx sorts idx by cmp (shell sort: allocation-free and fast enough
// for molecules; stability is not needed as ties are equal keys).
func sortIdx(idx []int32, cmp func(a, b int32) int) {
	n := len(idx)
	gap := 1
	for gap < n/3 {
		gap = 3*gap + 1
	}
	for ; gap > 0; gap /= 3 {
		for i := gap; i < n; i++ {
			for j := i; j >= gap && cmp(idx[j], idx[j-gap]) < 0; j -= gap {
				idx[j], idx[j-gap] = idx[j-gap], idx[j]
			}
		}
	}
}

// stereoCodes gives each stereo atom a code from its configuration read
// against the current ranks: 1 or 2 for the two senses, 3 while its
// references are not yet told apart.
func (c *canon) stereoCodes(rank []int32) {
	m := c.m
	n := int32(len(rank))
	clear(c.stereo)
	rk := func(a int) int32 {
		if a < 0 || a >= int(n) {
			return -1
		}
		return rank[a]
	}
	for _, t := range m.Tetrahedral {
		if t.Centre < 0 || t.Centre >= int(n) {
			continue
		}
		var keys [4]int32
		for k, r := range t.Refs {
			keys[k] = rk(r)
		}
		c.stereo[t.Centre] = c.stereo[t.Centre]*4 + parityCode(t.Winding, keys)
	}
	for _, ax := range m.Axial {
		if ax.Centre < 0 || ax.Centre >= int(n) {
			continue
		}
		var keys [4]int32
		for k, r := range ax.Refs {
			keys[k] = rk(r)
		}
		// The two ends may themselves be told apart only by rank: read
		// the refs with the lower-ranked end first.
		w := ax.Winding
		if rk(ax.Ends[0]) > rk(ax.Ends[1]) {
			keys = [4]int32{keys[2], keys[3], keys[0], keys[1]}
			// Swapping the two pairs is an even permutation.
		}
		code := int32(3)
		if keys[0] != keys[1] && keys[2] != keys[3] {
			// Pairs ordered within each end; each swap inverts.
			if keys[0] > keys[1] {
				w = w.Invert()
			}
			if keys[2] > keys[3] {
				w = w.Invert()
			}
			code = 1
			if w == molecule.Clockwise {
				code = 2
			}
		}
		c.stereo[ax.Centre] = c.stereo[ax.Centre]*4 + code
	}
	for _, ct := range m.CisTrans {
		e0, e1 := ct.Ends[0], ct.Ends[1]
		if e0 < 0 || e0 >= int(n) || e1 < 0 || e1 >= int(n) {
			continue
		}
		code := int32(3)
		f0, ok0 := c.flipFor(e0, ct.Refs[0], rank)
		f1, ok1 := c.flipFor(e1, ct.Refs[1], rank)
		if ok0 && ok1 {
			cfg := int(ct.Config) * f0 * f1
			code = 1
			if cfg < 0 {
				code = 2
			}
		}
		c.stereo[e0] = c.stereo[e0]*4 + code
		c.stereo[e1] = c.stereo[e1]*4 + code
	}
}

// flipFor returns -1 when ref is not the highest-ranked single-bonded
// neighbour of end (the configuration then reads inverted against it),
// and false when two such neighbours tie.
func (c *canon) flipFor(end, ref int, rank []int32) (int, bool) {
	m := c.m
	best, bestRank, tie := -1, int32(-1), false
	for _, e := range m.Edges(end) {
		if m.Bonds[e.Bond].Order == 2 {
			continue
		}
		r := rank[e.Atom]
		switch {
		case r > bestRank:
			best, bestRank, tie = e.Atom, r, false
		case r == bestRank:
			tie = true
		}
	}
	if tie || best < 0 {
		return 0, false
	}
	if best == ref {
		return 1, true
	}
	return -1, true
}

// parityCode reads a winding against the ranks of its references: 1 or 2
// for the two senses, 3 when two references share a rank.
func parityCode(w molecule.Winding, keys [4]int32) int32 {
	for i := range 4 {
		for j := i + 1; j < 4; j++ {
			if keys[i] == keys[j] {
				return 3
			}
		}
	}
	if windingFor(w, keys) == molecule.Anticlockwise {
		return 1
	}
	return 2
}
