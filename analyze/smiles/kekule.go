package smiles

import "walden/analyze/molecule"

// aromaticValence is the valence an aromatic atom reaches in its Kekulé
// form, from its element and charge. Charged atoms take the valence of
// the isoelectronic neutral atom (N+ like C, C- like N, O+ like N), as is
// common practice for pyridinium, pyrylium and cyclopentadienide.
// Returns -1 when the element has no aromatic form.
func aromaticValence(e molecule.Element, charge int) int {
	switch e {
	case molecule.C, molecule.Si, 32: // Ge
		return 4 - abs(charge)
	case molecule.N, molecule.P, molecule.As:
		return 3 + charge
	case molecule.O, molecule.S, molecule.Se, 52: // Te
		return 2 + charge
	case molecule.B:
		return 3 - charge
	case 0:
		return -1
	}
	return -1
}

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}

// needsDouble reports whether aromatic atom i must take one double bond
// among its aromatic bonds in the Kekulé form: its valence, counting each
// aromatic bond as single and its hydrogens, falls one short of the
// valence it should reach. OpenSMILES section 3.5 (aromaticity) leaves
// hydrogens of bare aromatic atoms implicit, so a bare c, n or p takes the
// lowest default valence that allows one more bond.
func (p *parser) needsDouble(i int) bool {
	m := p.m
	a := &m.Atoms[i]
	d := 0
	for _, e := range m.Edges(i) {
		d += m.Bonds[e.Bond].Order // aromatic bonds are still 1 here
	}
	if a.Bracket {
		v := aromaticValence(a.Element, a.Charge)
		return v >= 0 && v-(d+a.ImplicitH) >= 1
	}
	for _, v := range a.Element.DefaultValences() {
		if v >= d {
			return v-d >= 1
		}
	}
	return false
}

// kekulise turns aromatic bonds into alternating single and double ones:
// a perfect matching, over the aromatic bonds, of the atoms that need a
// double bond (Edmonds' blossom algorithm, since fused 5- and 7-rings are
// not bipartite). Reports the atoms left without a partner when no Kekulé
// form exists.
func (p *parser) kekulise() {
	m := p.m
	n := len(m.Atoms)
	any := false
	for i := range m.Bonds {
		if m.Bonds[i].Aromatic {
			any = true
			break
		}
	}
	anyAtom := false
	for i := range m.Atoms {
		if m.Atoms[i].Aromatic {
			anyAtom = true
			break
		}
	}
	if !any && !anyAtom {
		return
	}
	// Compact index over the atoms that need a double bond.
	local := make([]int, n)
	var verts []int
	for i := range m.Atoms {
		local[i] = -1
		if m.Atoms[i].Aromatic && p.needsDouble(i) {
			local[i] = len(verts)
			verts = append(verts, i)
		}
	}
	if len(verts) == 0 {
		return
	}
	g := matcher{adj: make([][]int32, len(verts)), bond: make([][]int32, len(verts))}
	for bi := range m.Bonds {
		b := &m.Bonds[bi]
		if !b.Aromatic {
			continue
		}
		la, lb := local[b.A], local[b.B]
		if la < 0 || lb < 0 {
			continue
		}
		g.adj[la] = append(g.adj[la], int32(lb))
		g.adj[lb] = append(g.adj[lb], int32(la))
		g.bond[la] = append(g.bond[la], int32(bi))
		g.bond[lb] = append(g.bond[lb], int32(bi))
	}
	ok := g.solve(kekuleBudget)
	if !ok {
		first := m.Atoms[verts[0]].Span
		last := m.Atoms[verts[len(verts)-1]].Span
		p.errorf(first.Start, last.End, "aromatic system of %d atoms is too large to kekulise within the work limit; write it in Kekulé form", len(verts))
		return
	}
	var lonely []int
	for v, w := range g.match {
		if w < 0 {
			lonely = append(lonely, verts[v])
			continue
		}
		if v < int(w) {
			for k, u := range g.adj[v] {
				if u == w {
					m.Bonds[g.bond[v][k]].Order = 2
					break
				}
			}
		}
	}
	if len(lonely) > 0 {
		a := m.Atoms[lonely[0]]
		hint := "check the ring for a missing or extra atom, or write it in Kekulé form"
		// A bare aromatic n with two neighbours is the usual culprit even
		// when the matching happened to leave a carbon over.
		for i := range m.Atoms {
			if at := m.Atoms[i]; at.Aromatic && !at.Bracket && (at.Element == molecule.N || at.Element == molecule.P) && m.Degree(i) == 2 {
				hint = "if a nitrogen carries a hydrogen, as in pyrrole, write it as [nH]"
				break
			}
		}
		p.errorf(a.Span.Start, a.Span.End, "no Kekulé form: %d aromatic atom(s) here found no partner for a double bond; %s", len(lonely), hint)
	}
}

// matcher finds a maximum matching in a general graph.
type matcher struct {
	adj   [][]int32
	bond  [][]int32
	match []int32
}

// solve matches greedily, lowest-degree vertices first, then grows the
// matching by augmenting paths with blossom contraction. It gives up
// (false) once budget steps are spent.
func (g *matcher) solve(budget int) bool {
	n := len(g.adj)
	g.match = make([]int32, n)
	for i := range g.match {
		g.match[i] = -1
	}
	// Greedy pass: vertices with fewer free neighbours first, which
	// settles chains and most rings without search.
	for deg := 1; deg <= 4; deg++ {
		for v := range n {
			if g.match[v] >= 0 {
				continue
			}
			free := 0
			for _, u := range g.adj[v] {
				if g.match[u] < 0 {
					free++
				}
			}
			if free > deg || free == 0 {
				continue
			}
			for _, u := range g.adj[v] {
				if g.match[u] < 0 {
					g.match[v], g.match[u] = u, int32(v)
					break
				}
			}
		}
	}
	for v := range n {
		if g.match[v] >= 0 {
			continue
		}
		for _, u := range g.adj[v] {
			if g.match[u] < 0 {
				g.match[v], g.match[u] = u, int32(v)
				break
			}
		}
	}
	var b blossom
	for root := range n {
		if g.match[root] >= 0 || len(g.adj[root]) == 0 {
			continue
		}
		end := b.findPath(g, int32(root), &budget)
		if budget < 0 {
			return false
		}
		for v := end; v >= 0; {
			pv := b.parent[v]
			ppv := g.match[pv]
			g.match[v], g.match[pv] = pv, v
			v = ppv
		}
	}
	return true
}

type blossom struct {
	parent, base []int32
	used, inB    []bool
	seen         []bool
	queue        []int32
}

func (b *blossom) lca(g *matcher, x, y int32) int32 {
	for i := range b.seen {
		b.seen[i] = false
	}
	for {
		x = b.base[x]
		b.seen[x] = true
		if g.match[x] < 0 {
			break
		}
		x = b.parent[g.match[x]]
	}
	for {
		y = b.base[y]
		if b.seen[y] {
			return y
		}
		y = b.parent[g.match[y]]
	}
}

func (b *blossom) markPath(g *matcher, v, base, child int32) {
	for b.base[v] != base {
		b.inB[b.base[v]] = true
		b.inB[b.base[g.match[v]]] = true
		b.parent[v] = child
		child = g.match[v]
		v = b.parent[g.match[v]]
	}
}

// findPath searches an augmenting path from root and returns its free
// end, or -1.
func (b *blossom) findPath(g *matcher, root int32, budget *int) int32 {
	n := len(g.adj)
	if len(b.parent) != n {
		b.parent = make([]int32, n)
		b.base = make([]int32, n)
		b.used = make([]bool, n)
		b.inB = make([]bool, n)
		b.seen = make([]bool, n)
	}
	for i := range n {
		b.parent[i] = -1
		b.base[i] = int32(i)
		b.used[i] = false
	}
	*budget -= n
	b.used[root] = true
	b.queue = append(b.queue[:0], root)
	for qh := 0; qh < len(b.queue); qh++ {
		v := b.queue[qh]
		for _, to := range g.adj[v] {
			*budget--
			if *budget < 0 {
				return -1
			}
			if b.base[v] == b.base[to] || g.match[v] == to {
				continue
			}
			if to == root || g.match[to] >= 0 && b.parent[g.match[to]] >= 0 {
				cur := b.lca(g, v, to)
				for i := range b.inB {
					b.inB[i] = false
				}
				b.markPath(g, v, cur, to)
				b.markPath(g, to, cur, v)
				*budget -= 2 * n
				for i := range n {
					if b.inB[b.base[i]] {
						b.base[i] = cur
						if !b.used[i] {
							b.used[i] = true
							b.queue = append(b.queue, int32(i))
						}
					}
				}
			} else if b.parent[to] < 0 {
				b.parent[to] = v
				if g.match[to] < 0 {
					return to
				}
				b.used[g.match[to]] = true
				b.queue = append(b.queue, g.match[to])
			}
		}
	}
	return -1
}

// implicitHydrogens gives every bare (non-bracket) atom the hydrogens that
// bring it to the lowest default valence at or above its bond-order sum
// (OpenSMILES section 3.1.5); none when it is above the highest.
func (p *parser) implicitHydrogens() {
	m := p.m
	for i := range m.Atoms {
		a := &m.Atoms[i]
		if a.Bracket {
			continue
		}
		v := m.BondOrderSum(i)
		a.ImplicitH = 0
		for _, d := range a.Element.DefaultValences() {
			if d >= v {
				a.ImplicitH = d - v
				break
			}
		}
	}
}
