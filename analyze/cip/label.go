package cip

import (
	"sort"

	"walden/analyze/molecule"
)

// Descriptor is the CIP label of one stereogenic unit.
type Descriptor struct {
	// Atoms are the unit's atoms (0-based, molecule order): the centre and
	// -1, or the two ends of a double bond, cumulene or allene.
	Atoms [2]int
	Label Letter
}

// Labeller assigns CIP descriptors. Its buffers are reused from call to
// call, so one Labeller per goroutine labels many molecules with few
// allocations. The zero value is ready to use.
type Labeller struct {
	// NodeLimit caps each unit's digraph; 0 means DefaultNodeLimit.
	NodeLimit int

	g     digraph
	v     view
	spent int // digraph nodes made for the current molecule
	units []unit
	es    [2][]int32
}

// Label returns the descriptors of every stereogenic unit written in m
// that is a true stereogenic unit, ordered by atom. See Labeller.Label.
func Label(m *molecule.Molecule) ([]Descriptor, error) {
	var l Labeller
	return l.Label(m)
}

// Label returns the descriptors of every stereogenic unit written in m
// (tetrahedral @/@@, double-bond / \, allene @) that is a true
// stereogenic unit, ordered by atom. Units whose ligands cannot be told
// apart get no descriptor. When a unit's digraph outgrows the node limit
// it is skipped and the error is a *BudgetError for the first such unit;
// the descriptors of the others are still returned.
func (l *Labeller) Label(m *molecule.Molecule) ([]Descriptor, error) {
	l.units = units(m, l.units[:0])
	if len(l.units) == 0 {
		return nil, nil
	}
	l.prepare(m)
	var out []Descriptor
	var err error
	l.spent = 0
	for i := range l.units {
		d, e := l.labelUnit(i)
		if e != nil && err == nil {
			err = e
		}
		if d != None {
			out = append(out, Descriptor{l.units[i].atoms, d})
		}
	}
	sort.Slice(out, func(i, j int) bool {
		if out[i].Atoms[0] != out[j].Atoms[0] {
			return out[i].Atoms[0] < out[j].Atoms[0]
		}
		return out[i].Atoms[1] < out[j].Atoms[1]
	})
	return out, err
}

// maxPathWords bounds the path bitsets (128 bytes a node, 12.8 MB for a
// full digraph); larger molecules find ring closures by walking up.
const maxPathWords = 16

// MoleculeNodeLimit caps the digraph nodes made for all the units of one
// molecule together, so that a molecule with thousands of centres stays
// within bounded time; units labelled after it is spent get a
// *BudgetError.
const MoleculeNodeLimit = 1_000_000

func (l *Labeller) prepare(m *molecule.Molecule) {
	n := len(m.Atoms)
	l.v.m = m
	l.v.words = (n + 63) / 64
	if l.v.words > maxPathWords {
		l.v.words = 0
	}
	l.v.isotopes = false
	for i := range m.Atoms {
		if m.Atoms[i].Isotope != 0 {
			l.v.isotopes = true
			break
		}
	}
	if cap(l.v.fracNum) < n {
		l.v.fracNum = make([]int32, n)
		l.v.fracDen = make([]int32, n)
	}
	l.v.fracNum = l.v.fracNum[:n]
	l.v.fracDen = l.v.fracDen[:n]
	mancude(m, l.v.fracNum, l.v.fracDen)
}

// labelUnit labels unit i in a digraph of its own: by the constitutional
// rules first, and only if they leave a tie, by all rules after the
// auxiliary descriptors have been set.
func (l *Labeller) labelUnit(i int) (d Letter, err error) {
	u := &l.units[i]
	limit := l.NodeLimit
	if limit <= 0 {
		limit = DefaultNodeLimit
	}
	if left := MoleculeNodeLimit - l.spent; left < limit {
		limit = max(left, 1)
	}
	defer func() {
		l.spent += len(l.g.nodes)
		if r := recover(); r != nil {
			if _, ok := r.(overBudget); !ok {
				panic(r)
			}
			d, err = None, &BudgetError{Atoms: u.atoms, Limit: limit}
		}
	}()
	g := &l.g
	g.reset(&l.v, u.atoms[0], limit)
	d, tied := l.labelAt(u, 0, constitutional)
	if !tied {
		return d, nil
	}
	l.setAux(i)
	g.reroot(0)
	d, _ = l.labelAt(u, 0, allRules)
	return d, nil
}

// labelAt labels unit u at node n of the current digraph with the rules
// of seq. tied reports that the ligands could not all be told apart.
func (l *Labeller) labelAt(u *unit, n int32, seq *ruleSeq) (d Letter, tied bool) {
	switch u.kind {
	case centre:
		return l.labelCentre(u, n, seq)
	case bond:
		return l.labelBond(u, n, seq)
	}
	return l.labelAxis(u, n, seq)
}

// setAux assigns auxiliary descriptors to every other unit's nodes in
// unit i's digraph, from the outermost sphere inwards (P-92.1.4 and
// Hanson et al. 2018, section 2.3): each is labelled within this digraph,
// seeing only the descriptors already set farther out.
func (l *Labeller) setAux(i int) {
	g := &l.g
	g.reroot(0)
	type job struct {
		n int32
		u int
	}
	var jobs []job
	var ns []int32
	for j := range l.units {
		if j == i {
			continue
		}
		o := &l.units[j]
		ns = g.nodesOf(int32(o.atoms[0]), ns[:0])
		for _, n := range ns {
			low := n
			if o.kind != centre {
				if m := l.walk(o, n); m >= 0 && g.nodes[m].dist < g.nodes[n].dist {
					low = m
				}
			}
			if g.nodes[low].flags&duplicate == 0 {
				jobs = append(jobs, job{low, j})
			}
		}
	}
	sort.SliceStable(jobs, func(a, b int) bool { return g.nodes[jobs[a].n].dist > g.nodes[jobs[b].n].dist })
	type result struct {
		n int32
		d Letter
	}
	var pending []result
	prev := int32(1 << 30)
	for _, jb := range jobs {
		if d := g.nodes[jb.n].dist; d < prev {
			for _, p := range pending {
				g.nodes[p.n].aux = p.d
			}
			pending = pending[:0]
			prev = d
		}
		d, _ := l.labelAt(&l.units[jb.u], jb.n, allRules)
		pending = append(pending, result{jb.n, d})
	}
	for _, p := range pending {
		g.nodes[p.n].aux = p.d
	}
	g.auxChanged()
}

// walk follows u's chain of atoms from node n (a node of either end) to
// the node of the other end, or returns -1.
func (l *Labeller) walk(u *unit, n int32) int32 {
	g := &l.g
	p := u.path
	forward := g.nodes[n].atom == p[0]
	var es []int32
	cur := n
	for k := 1; k < len(p); k++ {
		want := p[k]
		if !forward {
			want = p[len(p)-1-k]
		}
		next := int32(-1)
		es = g.incident(cur, es[:0])
		for _, e := range es {
			o := g.other(e, cur)
			if g.nodes[o].atom == want && g.nodes[o].flags&duplicate == 0 {
				next = o
				break
			}
		}
		if next < 0 {
			return -1
		}
		cur = next
	}
	return cur
}

// ligandsOf returns the edges at n other than those to atom skip (the
// chain neighbour, with its duplicates).
func (l *Labeller) ligandsOf(n, skip int32, buf []int32) []int32 {
	g := &l.g
	all := g.incident(n, nil)
	buf = buf[:0]
	for _, e := range all {
		if g.nodes[g.other(e, n)].atom != skip {
			buf = append(buf, e)
		}
	}
	return buf
}

// atomOf returns the molecule atom at the far end of e from the root, or
// molecule.Implicit for an implicit hydrogen.
func (g *digraph) atomOf(e int32) int {
	a := g.nodes[g.edges[e].end].atom
	if a < 0 {
		return molecule.Implicit
	}
	return int(a)
}
