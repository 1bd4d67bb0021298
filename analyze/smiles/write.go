package smiles

import (
	"math/rand"
	"strconv"
	"strings"

	"walden/analyze/molecule"
)

// Write returns SMILES for m with atoms in their stored order as far as
// the graph allows: the first atom starts, branches follow atom order,
// perceived aromatic rings are written in lower case. Stereo is written
// as recorded in m. Write does not fail; a molecule built with
// inconsistent stereo references loses those marks.
func Write(m *molecule.Molecule) string {
	if m == nil || len(m.Atoms) == 0 {
		return ""
	}
	rank := make([]int32, len(m.Atoms))
	for i := range rank {
		rank[i] = int32(i)
	}
	w := newWriter(m, true)
	return w.write(rank, nil)
}

// WriteRandom writes m from a random root with random branch order, random
// ring-closure numbers and, at random, in aromatic or Kekulé form. It is
// meant for tests: every output must read back to the same canonical
// SMILES.
func WriteRandom(m *molecule.Molecule, r *rand.Rand) string {
	if m == nil || len(m.Atoms) == 0 {
		return ""
	}
	rank := make([]int32, len(m.Atoms))
	for i, p := range r.Perm(len(m.Atoms)) {
		rank[i] = int32(p)
	}
	w := newWriter(m, r.Intn(2) == 0)
	return w.write(rank, r)
}

// writer turns a molecule and an atom ranking into SMILES.
type writer struct {
	m        *molecule.Molecule
	aromatic bool   // lower-case aromatic form
	arom     []bool // perceived aromatic atoms
	aromB    []bool // perceived aromatic bonds

	// plan, rebuilt by every write
	rank    []int32
	seen    []bool
	done    []bool // bond used by the plan
	ringAt  [][]int32
	opener  []int32 // per bond: atom where a ring closure opens, -1 for tree bonds
	tokens  []token
	pos     []int32 // sequence number of each atom in the output
	keyA    []int32 // sequence number of each bond at its A end
	keyB    []int32
	bdir    []int8  // '/' '\' per bond, read from A to B
	group   []int32 // per marked bond: the configuration it first serves
	coef    []int8  // per marked bond: its direction over that unknown
	uf      []int32 // union-find over configurations
	par     []int8
	val     []int8
	digitOf []int8 // ring-closure number per bond while writing
	rootBuf []int32
	// stereoOf indexes m.Tetrahedral then m.Axial by centre atom, -1
	// for none.
	stereoOf []int32
	order    []int32
	edgeBuf  []molecule.Edge
	buf      strings.Builder
}

type tokenKind uint8

const (
	tAtom  tokenKind = iota
	tRing            // ring-closure digit at atom
	tBond            // tree bond before a child
	tOpen            // '('
	tClose           // ')'
	tDot
)

type token struct {
	kind tokenKind
	atom int32 // atom written, or the atom the ring digit / bond starts at
	bond int32
}

func newWriter(m *molecule.Molecule, aromatic bool) *writer {
	w := &writer{}
	w.init(m, aromatic)
	return w
}

// init prepares w for m, keeping its buffers.
func (w *writer) init(m *molecule.Molecule, aromatic bool) {
	w.m, w.aromatic = m, aromatic
	// Index the stereo entries by atom, so writing an atom does not scan
	// every centre.
	w.stereoOf = resizeInt32(w.stereoOf, len(m.Atoms), -1)
	for k, t := range m.Tetrahedral {
		if t.Centre >= 0 && t.Centre < len(m.Atoms) && w.stereoOf[t.Centre] < 0 {
			w.stereoOf[t.Centre] = int32(k)
		}
	}
	for k, ax := range m.Axial {
		if ax.Centre >= 0 && ax.Centre < len(m.Atoms) && w.stereoOf[ax.Centre] < 0 {
			w.stereoOf[ax.Centre] = int32(len(m.Tetrahedral) + k)
		}
	}
	if aromatic {
		w.arom, w.aromB = m.Aromaticity()
		if !w.aromaticReadable() {
			w.aromatic = false
		}
	}
}

// aromaticReadable checks that every lower-case atom would read back
// with the same hydrogens and the same need for a double bond; if not,
// the molecule is written in Kekulé form. An atom with a configuration is
// written in brackets, where the reader judges its need for a double bond
// by its charge alone, so the bare form's check does not speak for it.
func (w *writer) aromaticReadable() bool {
	for i := range w.m.Atoms {
		bare := w.stereoOf[i] < 0 && w.bareOK(i, true)
		if w.arom[i] && !bare && !w.bracketAromaticOK(i) {
			return false
		}
	}
	return true
}

// kekuleDouble reports whether atom i has a double bond among the
// perceived aromatic bonds.
func (w *writer) kekuleDouble(i int) bool {
	for _, e := range w.m.Edges(i) {
		if w.aromB[e.Bond] && w.m.Bonds[e.Bond].Order == 2 {
			return true
		}
	}
	return false
}

// aromaticDegree is the valence the reader sees before kekulising:
// aromatic bonds count one, others their order.
func (w *writer) aromaticDegree(i int) int {
	d := 0
	for _, e := range w.m.Edges(i) {
		if w.aromB[e.Bond] {
			d++
		} else {
			d += w.m.Bonds[e.Bond].Order
		}
	}
	return d
}

func (w *writer) bracketAromaticOK(i int) bool {
	a := w.m.Atoms[i]
	switch a.Element {
	case molecule.B, molecule.C, molecule.N, molecule.O, molecule.P, molecule.S, molecule.As, molecule.Se, 52:
	default:
		return false
	}
	v := aromaticValence(a.Element, a.Charge)
	need := v >= 0 && v-(w.aromaticDegree(i)+a.ImplicitH) >= 1
	return need == w.kekuleDouble(i)
}

func organic(e molecule.Element) bool {
	switch e {
	case molecule.B, molecule.C, molecule.N, molecule.O, molecule.P, molecule.S, molecule.F, molecule.Cl, molecule.Br, molecule.I:
		return true
	}
	return false
}

// bareOK reports whether atom i can be written without brackets: the
// reader would give it the same hydrogens (and, in lower case, the same
// need for a double bond).
func (w *writer) bareOK(i int, lower bool) bool {
	a := w.m.Atoms[i]
	if a.Isotope != 0 || a.Charge != 0 || a.Class != 0 {
		return false
	}
	if a.Element == 0 {
		return a.ImplicitH == 0 && !lower
	}
	if !organic(a.Element) {
		return false
	}
	vals := a.Element.DefaultValences()
	if lower {
		switch a.Element {
		case molecule.B, molecule.C, molecule.N, molecule.O, molecule.P, molecule.S:
		default:
			return false
		}
		d := w.aromaticDegree(i)
		need := false
		for _, v := range vals {
			if v >= d {
				need = v-d >= 1
				break
			}
		}
		if need != w.kekuleDouble(i) {
			return false
		}
	}
	s := w.m.BondOrderSum(i)
	h := 0
	for _, v := range vals {
		if v >= s {
			h = v - s
			break
		}
	}
	return h == a.ImplicitH
}

// lowerSymbol is the aromatic (lower-case) symbol of e.
func lowerSymbol(e molecule.Element) string {
	switch e {
	case molecule.B:
		return "b"
	case molecule.C:
		return "c"
	case molecule.N:
		return "n"
	case molecule.O:
		return "o"
	case molecule.P:
		return "p"
	case molecule.S:
		return "s"
	case molecule.As:
		return "as"
	case molecule.Se:
		return "se"
	case 52:
		return "te"
	}
	return strings.ToLower(e.Symbol())
}

// lower reports whether atom i is written in lower case.
func (w *writer) lower(i int) bool { return w.aromatic && w.arom[i] }

// aromaticBond reports whether bond b is written as an implicit aromatic
// bond.
func (w *writer) aromaticBond(b int) bool { return w.aromatic && w.aromB[b] }

// sortedEdges returns the edges of atom a ordered by neighbour rank.
func (w *writer) sortedEdges(a int) []molecule.Edge {
	w.edgeBuf = append(w.edgeBuf[:0], w.m.Edges(a)...)
	e := w.edgeBuf
	for i := 1; i < len(e); i++ {
		for j := i; j > 0 && w.rank[e[j].Atom] < w.rank[e[j-1].Atom]; j-- {
			e[j], e[j-1] = e[j-1], e[j]
		}
	}
	return e
}

func (w *writer) reset(rank []int32) {
	n, nb := len(w.m.Atoms), len(w.m.Bonds)
	w.rank = rank
	w.seen = resizeBool(w.seen, n)
	w.done = resizeBool(w.done, nb)
	w.opener = resizeInt32(w.opener, nb, -1)
	w.pos = resizeInt32(w.pos, n, 0)
	w.keyA = resizeInt32(w.keyA, nb, 0)
	w.keyB = resizeInt32(w.keyB, nb, 0)
	if cap(w.bdir) < nb {
		w.bdir = make([]int8, nb)
	}
	w.bdir = w.bdir[:nb]
	clear(w.bdir)
	if len(w.ringAt) < n {
		w.ringAt = make([][]int32, n)
	}
	for i := range n {
		w.ringAt[i] = w.ringAt[i][:0]
	}
	w.tokens = w.tokens[:0]
}

func resizeBool(s []bool, n int) []bool {
	if cap(s) < n {
		s = make([]bool, n)
	}
	s = s[:n]
	clear(s)
	return s
}

func resizeInt32(s []int32, n int, v int32) []int32 {
	if cap(s) < n {
		s = make([]int32, n)
	}
	s = s[:n]
	for i := range s {
		s[i] = v
	}
	return s
}

// findRings runs the depth-first search that decides which bonds close
// rings; the ring closure opens at the atom reached first.
func (w *writer) findRings(a, parentBond int) {
	w.seen[a] = true
	// Copy: sortedEdges reuses one buffer across the recursion.
	var local [8]molecule.Edge
	edges := append(local[:0], w.sortedEdges(a)...)
	for _, e := range edges {
		if e.Bond == parentBond || w.done[e.Bond] {
			continue
		}
		w.done[e.Bond] = true
		if w.seen[e.Atom] {
			w.opener[e.Bond] = int32(e.Atom)
			w.ringAt[e.Atom] = append(w.ringAt[e.Atom], int32(e.Bond))
			w.ringAt[a] = append(w.ringAt[a], int32(e.Bond))
			continue
		}
		w.findRings(e.Atom, e.Bond)
	}
}

// emit lays out the tokens of the tree under a and numbers every atom
// and bond position as the reader will see them.
func (w *writer) emit(a, parentBond int, seq *int32) {
	w.seen[a] = true
	w.pos[a] = *seq
	*seq++
	w.tokens = append(w.tokens, token{kind: tAtom, atom: int32(a)})
	// Ring digits: closures of rings opened earlier first, then openings,
	// each group by partner rank.
	rings := w.ringAt[a]
	for i := 1; i < len(rings); i++ {
		for j := i; j > 0 && w.ringLess(a, rings[j], rings[j-1]); j-- {
			rings[j], rings[j-1] = rings[j-1], rings[j]
		}
	}
	for _, b := range rings {
		w.setKey(int(b), a, *seq)
		*seq++
		w.tokens = append(w.tokens, token{kind: tRing, atom: int32(a), bond: b})
	}
	var local [8]molecule.Edge
	edges := append(local[:0], w.sortedEdges(a)...)
	var kids [8]molecule.Edge
	children := kids[:0]
	for _, e := range edges {
		if e.Bond == parentBond || w.opener[e.Bond] >= 0 || w.seen[e.Atom] {
			continue
		}
		children = append(children, e)
	}
	for k, e := range children {
		if w.seen[e.Atom] {
			continue
		}
		branch := k < len(children)-1
		if branch {
			w.tokens = append(w.tokens, token{kind: tOpen})
		}
		w.setKey(e.Bond, a, *seq)
		w.setKey(e.Bond, e.Atom, *seq)
		*seq++
		w.tokens = append(w.tokens, token{kind: tBond, atom: int32(a), bond: int32(e.Bond)})
		w.emit(e.Atom, e.Bond, seq)
		if branch {
			w.tokens = append(w.tokens, token{kind: tClose})
		}
	}
}

// ringLess orders ring bonds at atom a: closings before openings, then by
// partner rank.
func (w *writer) ringLess(a int, x, y int32) bool {
	xo, yo := w.opener[x] == int32(a), w.opener[y] == int32(a)
	if xo != yo {
		return !xo
	}
	return w.rank[w.m.Bonds[x].Other(a)] < w.rank[w.m.Bonds[y].Other(a)]
}

func (w *writer) setKey(b, atom int, k int32) {
	if w.m.Bonds[b].A == atom {
		w.keyA[b] = k
	} else {
		w.keyB[b] = k
	}
}

func (w *writer) keyAt(b, atom int) int32 {
	if w.m.Bonds[b].A == atom {
		return w.keyA[b]
	}
	return w.keyB[b]
}

// write produces the SMILES for ranking rank; r, when not nil, picks
// ring-closure numbers at random.
func (w *writer) write(rank []int32, r *rand.Rand) string {
	m := w.m
	n := len(m.Atoms)
	w.reset(rank)
	// Roots: lowest-ranked atom of each component, components in rank
	// order.
	w.order = resizeInt32(w.order, n, 0)
	order := w.order
	for i := range order {
		order[i] = int32(i)
	}
	sortByRank(order, rank)
	roots := w.roots(order)
	for _, a := range roots {
		w.findRings(int(a), -1)
	}
	clear(w.seen)
	var seq int32
	first := true
	for _, a := range roots {
		if !first {
			w.tokens = append(w.tokens, token{kind: tDot})
		}
		first = false
		w.emit(int(a), -1, &seq)
	}
	w.cisTransMarks()
	return w.text(r)
}

// roots returns the first atom of each component, components in rank
// order: the lowest-ranked atom, except that a three-coordinate centre
// with a lone pair does not start a component when another atom can.
// Readers differ on where the lone pair of a leading centre stands (the
// OpenSMILES reading, used here, puts it first like a hydrogen; RDKit
// 2022.09 puts it last), so the writer never leaves that choice open.
func (w *writer) roots(order []int32) []int32 {
	m := w.m
	var lp []bool
	for _, t := range m.Tetrahedral {
		c := t.Centre
		if c >= 0 && c < len(m.Atoms) && m.Degree(c) == 3 && m.Atoms[c].ImplicitH == 0 {
			if lp == nil {
				lp = make([]bool, len(m.Atoms))
			}
			lp[c] = true
		}
	}
	roots := w.rootBuf[:0]
	defer func() { w.rootBuf = roots }()
	if lp == nil {
		for _, a := range order {
			if !w.seen[a] {
				roots = append(roots, a)
				w.markComponent(int(a))
			}
		}
		clear(w.seen)
		return roots
	}
	comp, n := m.Components()
	best := make([]int32, n)
	for i := range best {
		best[i] = -1
	}
	for _, a := range order {
		c := comp[a]
		if best[c] < 0 || lp[best[c]] && !lp[a] {
			best[c] = a
		}
	}
	// Components in the rank order of their lowest atom.
	roots = roots[:0]
	done := make([]bool, n)
	for _, a := range order {
		c := comp[a]
		if !done[c] {
			done[c] = true
			roots = append(roots, best[c])
		}
	}
	return roots
}

// markComponent marks every atom connected to a as seen.
func (w *writer) markComponent(a int) {
	stack := []int{a}
	w.seen[a] = true
	for len(stack) > 0 {
		x := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		for _, e := range w.m.Edges(x) {
			if !w.seen[e.Atom] {
				w.seen[e.Atom] = true
				stack = append(stack, e.Atom)
			}
		}
	}
}

func sortByRank(order []int32, rank []int32) {
	// Insertion sort for the small case, else a simple shell sort; both
	// allocation-free.
	n := len(order)
	gap := 1
	for gap < n/3 {
		gap = 3*gap + 1
	}
	for ; gap > 0; gap /= 3 {
		for i := gap; i < n; i++ {
			for j := i; j >= gap && lessRank(rank, order[j], order[j-gap]); j -= gap {
				order[j], order[j-gap] = order[j-gap], order[j]
			}
		}
	}
}

func lessRank(rank []int32, a, b int32) bool {
	if rank[a] != rank[b] {
		return rank[a] < rank[b]
	}
	return a < b
}

// text renders the tokens.
func (w *writer) text(r *rand.Rand) string {
	m := w.m
	b := &w.buf
	b.Reset()
	var digits [100]bool
	if cap(w.digitOf) < len(m.Bonds) {
		w.digitOf = make([]int8, len(m.Bonds))
	}
	digitOf := w.digitOf[:len(m.Bonds)]
	for _, t := range w.tokens {
		switch t.kind {
		case tAtom:
			w.atomText(int(t.atom))
		case tRing:
			a := int(t.atom)
			if w.opener[t.bond] == int32(a) {
				d := -1
				if r != nil {
					free := 0
					for i := range digits {
						if !digits[i] {
							free++
						}
					}
					if free > 0 {
						k := r.Intn(min(free, 12))
						for i := range digits {
							if !digits[i] {
								if k == 0 {
									d = i
									break
								}
								k--
							}
						}
					}
				} else {
					for i := 1; i < len(digits); i++ {
						if !digits[i] {
							d = i
							break
						}
					}
				}
				if d < 0 {
					d = 99
				}
				digits[d] = true
				digitOf[t.bond] = int8(d)
				w.bondText(int(t.bond), a)
				writeDigit(b, d)
			} else {
				d := int(digitOf[t.bond])
				digits[d] = false
				writeDigit(b, d)
			}
		case tBond:
			w.bondText(int(t.bond), int(t.atom))
		case tOpen:
			b.WriteByte('(')
		case tClose:
			b.WriteByte(')')
		case tDot:
			b.WriteByte('.')
		}
	}
	_ = m
	return b.String()
}

func writeDigit(b *strings.Builder, d int) {
	if d < 10 {
		b.WriteByte(byte('0' + d))
		return
	}
	b.WriteByte('%')
	b.WriteByte(byte('0' + d/10))
	b.WriteByte(byte('0' + d%10))
}

// bondText writes the symbol of bond bi written from atom from.
func (w *writer) bondText(bi, from int) {
	m := w.m
	bd := m.Bonds[bi]
	b := &w.buf
	if d := w.bdir[bi]; d != 0 {
		if bd.A != from {
			d = -d
		}
		if d > 0 {
			b.WriteByte('/')
		} else {
			b.WriteByte('\\')
		}
		return
	}
	if w.aromaticBond(bi) {
		return
	}
	switch bd.Order {
	case 2:
		b.WriteByte('=')
	case 3:
		b.WriteByte('#')
	case 4:
		b.WriteByte('$')
	default:
		if w.lower(bd.A) && w.lower(bd.B) {
			b.WriteByte('-')
		}
	}
}

// atomText writes atom i, bare when the reader would restore it exactly.
func (w *writer) atomText(i int) {
	m := w.m
	a := m.Atoms[i]
	b := &w.buf
	lower := w.lower(i)
	chir := w.chirality(i)
	sym := a.Element.Symbol()
	if lower {
		sym = lowerSymbol(a.Element)
	}
	if chir == 0 && w.bareOK(i, lower) {
		b.WriteString(sym)
		return
	}
	b.WriteByte('[')
	if a.Isotope != 0 {
		b.WriteString(strconv.Itoa(a.Isotope))
	}
	b.WriteString(sym)
	switch chir {
	case molecule.Anticlockwise:
		b.WriteByte('@')
	case molecule.Clockwise:
		b.WriteString("@@")
	}
	if a.ImplicitH > 0 {
		b.WriteByte('H')
		if a.ImplicitH > 1 {
			b.WriteString(strconv.Itoa(min(a.ImplicitH, 9)))
		}
	}
	if a.Charge != 0 {
		if a.Charge > 0 {
			b.WriteByte('+')
		} else {
			b.WriteByte('-')
		}
		if q := abs(a.Charge); q > 1 {
			b.WriteString(strconv.Itoa(q))
		}
	}
	if a.Class != 0 {
		b.WriteByte(':')
		b.WriteString(strconv.Itoa(a.Class))
	}
	b.WriteByte(']')
}

// chirality returns the '@'/'@@' to write on atom i for the output's
// neighbour order, 0 when none.
func (w *writer) chirality(i int) molecule.Winding {
	m := w.m
	k := int(w.stereoOf[i])
	if k < 0 {
		return 0
	}
	if k < len(m.Tetrahedral) {
		t := m.Tetrahedral[k]
		var keys [4]int32
		for k, r := range t.Refs {
			if r == molecule.Implicit {
				keys[k] = w.pos[i]
				continue
			}
			if r < 0 || r >= len(m.Atoms) {
				return 0
			}
			b := m.BondBetween(i, r)
			if b < 0 {
				return 0
			}
			keys[k] = w.keyAt(b, i)
		}
		return windingFor(t.Winding, keys)
	}
	{
		ax := m.Axial[k-len(m.Tetrahedral)]
		var keys [4]int32
		for k, r := range ax.Refs {
			end := ax.Ends[k/2]
			if end < 0 || end >= len(m.Atoms) {
				return 0
			}
			if r == molecule.Implicit {
				keys[k] = w.pos[end]
				continue
			}
			if r < 0 || r >= len(m.Atoms) {
				return 0
			}
			b := m.BondBetween(end, r)
			if b < 0 {
				return 0
			}
			keys[k] = w.keyAt(b, end)
		}
		return windingFor(ax.Winding, keys)
	}
}

// windingFor converts a winding stated for references in stored order to
// the winding for the same references read in order of keys: inverted
// when sorting them is an odd permutation. Equal keys (two implicit
// hydrogens) keep their stored order.
func windingFor(w molecule.Winding, keys [4]int32) molecule.Winding {
	odd := false
	for i := 1; i < 4; i++ {
		for j := i; j > 0 && keys[j] < keys[j-1]; j-- {
			keys[j], keys[j-1] = keys[j-1], keys[j]
			odd = !odd
		}
	}
	if odd {
		return w.Invert()
	}
	return w
}
