package cip

// ruleID names one sequence rule.
type ruleID uint8

const (
	rule1a ruleID = iota
	rule1b
	rule2
	rule3
	rule4a
	rule4b
	rule4c
	rule5
	rule6
)

// rule is a sequence rule as used in one comparison. ref is set only for
// the stand-in forms of rules 4b and 5 that rank branches relative to a
// reference descriptor while descriptor lists are built (P-92.5.2.2).
type rule struct {
	id  ruleID
	ref Letter
}

// ruleSeq is a list of rules applied in turn, with an identity so that
// orderings made with it can be cached.
type ruleSeq struct {
	id    uint8
	rules []rule
}

// sequence lists the rules in the order they are applied: the
// constitutional rules 1a, 1b and 2 first, then the stereo rules (P-92.1.3).
var sequence = []rule{{rule1a, None}, {rule1b, None}, {rule2, None}, {rule3, None},
	{rule4a, None}, {rule4b, None}, {rule4c, None}, {rule5, None}, {rule6, None}}

// prefixes[i] is sequence[:i+1]: rule i and the rules before it, the
// order in which rule i explores its branches.
var prefixes = func() []*ruleSeq {
	p := make([]*ruleSeq, len(sequence))
	for i := range p {
		p[i] = &ruleSeq{uint8(i), sequence[: i+1 : i+1]}
	}
	return p
}()

var (
	// constitutional needs no auxiliary descriptors.
	constitutional = prefixes[rule2]
	// allRules is the whole sequence.
	allRules = prefixes[rule6]
)

// Rules 4b and 5 with a reference descriptor: alone (the way such a rule
// explores its own branches) and in place of the plain rule at the end of
// the sequence that orders branches while descriptor lists are built.
var (
	only4bR = &ruleSeq{9, []rule{{rule4b, R}}}
	only4bS = &ruleSeq{10, []rule{{rule4b, S}}}
	only5R  = &ruleSeq{11, []rule{{rule5, R}}}
	only5S  = &ruleSeq{12, []rule{{rule5, S}}}
	with4bR = &ruleSeq{13, append(append([]rule(nil), sequence[:5]...), rule{rule4b, R})}
	with4bS = &ruleSeq{14, append(append([]rule(nil), sequence[:5]...), rule{rule4b, S})}
	with5R  = &ruleSeq{15, append(append([]rule(nil), sequence[:7]...), rule{rule5, R})}
	with5S  = &ruleSeq{16, append(append([]rule(nil), sequence[:7]...), rule{rule5, S})}
)

// numSeqs counts the distinct rule sequences, for the ordering cache.
const numSeqs = 17

// explorer returns the rules that order the branches while rule r is
// explored sphere by sphere: r and the rules before it.
func explorer(r rule) *ruleSeq {
	switch {
	case r.ref == None:
		return prefixes[r.id]
	case r.id == rule4b && r.ref == R:
		return only4bR
	case r.id == rule4b:
		return only4bS
	case r.ref == R:
		return only5R
	}
	return only5S
}

// withRef returns the sequence up to rule id (4b or 5) with that rule
// replaced by its form relative to ref.
func withRef(id ruleID, ref Letter) *ruleSeq {
	switch {
	case id == rule4b && ref == R:
		return with4bR
	case id == rule4b:
		return with4bS
	case ref == R:
		return with5R
	}
	return with5S
}

// compare ranks the far ends of edges a and b by rule r alone, looking no
// further: >0 when a ranks higher, <0 when b does. Rule 5 answers ±2 when
// the two differ as enantiomorphs, which makes a centre pseudo-asymmetric.
func (g *digraph) compare(r rule, a, b int32) int {
	switch r.id {
	case rule1a:
		return compare1a(g, a, b)
	case rule1b:
		return compare1b(g, a, b)
	case rule2:
		return compare2(g, a, b)
	case rule3:
		return compare3(g, a, b)
	case rule4a:
		return compare4a(g, a, b)
	case rule4b:
		return compare4b(g, r.ref, a, b)
	case rule4c:
		return compare4c(g, a, b)
	case rule5:
		return compare5(g, r.ref, a, b)
	case rule6:
		return compare6(g, a, b)
	}
	return 0
}

// explore compares the branches behind edges a and b by rule r over the
// whole digraph, sphere by sphere, the higher-ranked branches first
// (hierarchical digraph exploration, P-92.1.4 and Hanson et al. 2018,
// section 2): at each pair of nodes the sets of children are compared
// in order, first as ranked by this sphere alone and then, if equal, in
// the order the full exploration of each child gives.
func (g *digraph) explore(r rule, a, b int32) int {
	if g.nodes[g.edges[a].end].zNum == 0 || g.nodes[g.edges[b].end].zNum == 0 {
		return 0
	}
	if c := g.compare(r, a, b); c != 0 {
		return c
	}
	// Branches reaching this point have the same constitution (rule 1a
	// explored them first), so a rule can only tell them apart by what
	// it looks at: rule 2 by stated mass numbers, rules 3 to 5 by
	// auxiliary descriptors, rule 6 by its reference.
	switch {
	case r.id == rule2 && !g.mol.isotopes,
		r.id >= rule3 && r.id <= rule5 && !g.hasAux(g.edges[a].end) && !g.hasAux(g.edges[b].end),
		r.id == rule6 && g.rule6 < 0:
		return 0
	}
	// The constitutional rules see only the atoms, the bonds and which
	// node is the root, so their answer for a pair of edges holds until
	// the next reroot; a ranking asks it again for every rule sequence.
	var key exploreKey
	if r.id <= rule2 {
		key = exploreKey{a, b, g.rootKey(), r.id}
		if c, ok := g.explored[key]; ok {
			return int(c)
		}
	}
	c := g.exploreDeep(r, a, b)
	if r.id <= rule2 {
		if g.explored == nil {
			g.explored = make(map[exploreKey]int8)
		}
		g.explored[key] = int8(c)
	}
	return c
}

// exploreKey names one constitutional comparison for the explore memo.
type exploreKey struct {
	a, b int32
	root uint32
	rule ruleID
}

// exploreDeep is explore past the far ends of a and b themselves.
func (g *digraph) exploreDeep(r rule, a, b int32) int {
	seq := explorer(r)
	qa := append(g.buf(), a)
	qb := append(g.buf(), b)
	defer func() {
		g.put(qa)
		g.put(qb)
	}()
	for pos := 0; pos < len(qa) && pos < len(qb); pos++ {
		na, nb := g.edges[qa[pos]].end, g.edges[qb[pos]].end
		as, bs := g.nearOut(na, seq), g.nearOut(nb, seq)
		for i := 0; i < len(as) && i < len(bs); i++ {
			if g.nodes[g.edges[as[i]].end].zNum == 0 || g.nodes[g.edges[bs[i]].end].zNum == 0 {
				return 0
			}
			if c := g.compare(r, as[i], bs[i]); c != 0 {
				return c
			}
		}
		if len(as) != len(bs) {
			return sign(len(as) - len(bs))
		}
		as = g.sortedOut(na, seq)
		bs = g.sortedOut(nb, seq)
		for i := range as {
			if g.nodes[g.edges[as[i]].end].zNum == 0 || g.nodes[g.edges[bs[i]].end].zNum == 0 {
				return 0
			}
			if c := g.compare(r, as[i], bs[i]); c != 0 {
				return c
			}
			qa = append(qa, as[i])
			qb = append(qb, bs[i])
		}
	}
	return 0
}

// ligands compares two edges leaving the same node by every rule of seq
// in turn; deep explores each rule over the whole digraph.
func (g *digraph) ligands(seq *ruleSeq, a, b int32, deep bool) int {
	rules := seq.rules
	if deep && g.root == 0 && len(rules) > len(constitutional.rules) && g.constTied(a, b) {
		rules = rules[len(constitutional.rules):]
	}
	for _, r := range rules {
		var c int
		if deep {
			c = g.explore(r, a, b)
		} else {
			c = g.compare(r, a, b)
		}
		if c != 0 {
			return c
		}
	}
	if deep && g.root == 0 && seq == constitutional {
		if g.ties == nil {
			g.ties = make(map[[2]int32]bool)
		}
		g.ties[[2]int32{a, b}] = true
	}
	return 0
}

// constTied reports whether edges a and b at the origin were found tied
// by the constitutional rules already.
func (g *digraph) constTied(a, b int32) bool {
	return g.ties[[2]int32{a, b}] || g.ties[[2]int32{b, a}]
}

// rank sorts es, edges leaving n, highest first by the rules of seq. It
// reports whether every ligand was told apart, and whether exactly one
// comparison was decided by an enantiomorphic pair (rule 5), which makes
// the unit pseudo-asymmetric.
func (g *digraph) rank(n int32, es []int32, deep bool, seq *ruleSeq) (unique, pseudo bool) {
	if deep && len(es) > 1 {
		if u, ok := g.rankByFirst(es, seq.rules[0]); ok {
			return u, false
		}
	}
	unique = true
	enantio := 0
	var seenTmp [16][3]int32
	seen := seenTmp[:0] // comparisons made, for the recount below
	for i := 1; i < len(es); i++ {
		for j := i; j > 0; j-- {
			c := g.ligands(seq, es[j-1], es[j], deep)
			seen = append(seen, [3]int32{es[j-1], es[j], int32(c)})
			if c < -1 || c > 1 {
				enantio++
			}
			if c < 0 {
				es[j], es[j-1] = es[j-1], es[j]
				continue
			}
			if c == 0 {
				unique = false
			}
			break
		}
	}
	if enantio > 0 {
		// The count above depends on the order the ligands came in;
		// count again on the final order, where only neighbours in rank
		// are compared, so that the answer is the same for any input
		// order of the atoms.
		enantio = 0
		for i := 1; i < len(es); i++ {
			c, ok := 0, false
			for _, s := range seen {
				if s[0] == es[i-1] && s[1] == es[i] {
					c, ok = int(s[2]), true
				} else if s[0] == es[i] && s[1] == es[i-1] {
					c, ok = -int(s[2]), true
				}
			}
			if !ok {
				c = g.ligands(seq, es[i-1], es[i], deep)
			}
			if c > 1 || c < -1 {
				enantio++
			}
		}
	}
	return unique, enantio == 1
}

// rankByFirst sorts es by rule r alone, looking no further than the
// nodes themselves. When that leaves no tie except between implicit
// hydrogens (which no rule can ever tell apart), the order is the one a
// full exploration would give, since every rule is tried on the nodes
// themselves before it looks deeper; ok reports that case, and unique
// whether there was no tie at all. Most nodes in a digraph are settled
// here, which saves exploring their branches.
func (g *digraph) rankByFirst(es []int32, r rule) (unique, ok bool) {
	for i := 1; i < len(es); i++ {
		for j := i; j > 0 && g.compare(r, es[j-1], es[j]) < 0; j-- {
			es[j], es[j-1] = es[j-1], es[j]
		}
	}
	unique = true
	for i := 1; i < len(es); i++ {
		if g.compare(r, es[i-1], es[i]) != 0 {
			continue
		}
		if g.nodes[g.edges[es[i-1]].end].flags&implicitH == 0 || g.nodes[g.edges[es[i]].end].flags&implicitH == 0 {
			return false, false
		}
		unique = false
	}
	return unique, true
}

// groups splits ranked edges into runs that seq cannot tell apart.
func (g *digraph) groups(seq *ruleSeq, es []int32) [][]int32 {
	var out [][]int32
	for i, e := range es {
		if i == 0 || g.ligands(seq, es[i-1], e, true) != 0 {
			out = append(out, nil)
		}
		out[len(out)-1] = append(out[len(out)-1], e)
	}
	return out
}

// sortedOut returns the edges leaving n ranked highest first by seq over
// the whole digraph. Orderings are cached: those by the constitutional
// rules depend only on which node is the root, the others also on the
// auxiliary descriptors and the rule 6 reference. The slice must not be
// modified.
func (g *digraph) sortedOut(n int32, seq *ruleSeq) []int32 { return g.ordered(n, seq, true) }

// nearOut returns the edges leaving n ranked highest first by seq
// looking at their far ends only, the order in which explore compares a
// sphere before it looks deeper. Cached like sortedOut, on the same
// terms: the comparisons see nothing the cache keys leave out.
func (g *digraph) nearOut(n int32, seq *ruleSeq) []int32 { return g.ordered(n, seq, false) }

// ordered is sortedOut (deep) and nearOut (not deep).
func (g *digraph) ordered(n int32, seq *ruleSeq, deep bool) []int32 {
	if seq.rules[0] == (rule{rule1a, None}) {
		if es, ok := g.firstOrder(n); ok {
			return es
		}
	}
	k := int(n)*cacheSlots + int(seq.id)*2
	if !deep {
		k++
	}
	rk := g.rootKey()
	if k < len(g.cache) {
		c := g.cache[k]
		if c.root == rk && (seq.id <= uint8(rule2) || c.aux == g.auxGen) {
			return g.arena[c.start:c.end:c.end]
		}
	}
	// A node has few out edges: rank them on the stack, not in a
	// pooled slice whose handling costs more than the ranking.
	var tmp [8]int32
	es := g.out(n, tmp[:0])
	g.rank(n, es, deep, seq)
	return g.store(k, es)
}

// firstOrder returns the edges leaving n ranked by rule 1a on their far
// ends alone, when that leaves no tie but between implicit hydrogens.
// Such an order is the one every rule sequence that starts with rule 1a
// gives, deep or not: rule 1a decides every other pair first, and no
// rule can tell two implicit hydrogens apart (see rankByFirst). It
// depends only on the root, so it is worked out once per node and root
// however many sequences and auxiliary descriptors ask for it.
func (g *digraph) firstOrder(n int32) ([]int32, bool) {
	rk := g.rootKey()
	if int(n) < len(g.first) {
		if c := g.first[n]; c.root == rk {
			if c.start < 0 {
				return nil, false
			}
			return g.arena[c.start:c.end:c.end], true
		}
	}
	for len(g.first) <= int(n) {
		g.first = append(g.first, sortEntry{root: ^uint32(0)})
	}
	var tmp [8]int32
	es := g.out(n, tmp[:0])
	if _, ok := g.rankByFirst(es, rule{rule1a, None}); !ok {
		g.first[n] = sortEntry{rk, 0, -1, -1}
		return nil, false
	}
	start := int32(len(g.arena))
	g.arena = append(g.arena, es...)
	end := int32(len(g.arena))
	g.first[n] = sortEntry{rk, 0, start, end}
	return g.arena[start:end:end], true
}

// store copies es into the arena as cache entry k.
func (g *digraph) store(k int, es []int32) []int32 {
	start := int32(len(g.arena))
	g.arena = append(g.arena, es...)
	if len(g.cache) <= k {
		// Room for every slot of the node at once.
		grown := (k/cacheSlots + 1) * cacheSlots
		old := len(g.cache)
		g.cache = append(g.cache, make([]sortEntry, grown-old)...)
		for i := old; i < grown; i++ {
			g.cache[i].root = ^uint32(0)
		}
	}
	end := int32(len(g.arena))
	g.cache[k] = sortEntry{g.rootKey(), g.auxGen, start, end}
	return g.arena[start:end:end]
}

// cacheSlots counts the slots of the ordering cache for one node: two
// per rule sequence, deep and not.
const cacheSlots = 2 * numSeqs

// sortEntry records a cached ordering, arena[start:end], made with the
// root and auxiliary descriptors of the given generations.
type sortEntry struct {
	root, aux  uint32
	start, end int32
}

// rootKey identifies the current root for the cache: 0 for the origin,
// to which labelling keeps coming back, else the count of reroots so far.
func (g *digraph) rootKey() uint32 {
	if g.root == 0 {
		return 0
	}
	return g.rootGen
}

// auxChanged forgets cached orderings that depend on auxiliary
// descriptors or the rule 6 reference.
func (g *digraph) auxChanged() { g.auxGen++ }

// buf takes a scratch slice from the digraph's pool.
func (g *digraph) buf() []int32 {
	if n := len(g.pool); n > 0 {
		b := g.pool[n-1]
		g.pool = g.pool[:n-1]
		return b[:0]
	}
	return make([]int32, 0, 8)
}

// put returns a scratch slice to the pool.
func (g *digraph) put(b []int32) {
	g.pool = append(g.pool, b)
}

// hasAux reports whether n or any node of its branch (away from the
// current root) carries an auxiliary descriptor. Answers are kept until
// the root or the descriptors change.
func (g *digraph) hasAux(n int32) bool {
	stamp := uint64(g.rootKey())<<32 | uint64(g.auxGen)
	for len(g.auxMemo) < len(g.nodes) {
		g.auxMemo = append(g.auxMemo, auxMark{stamp: ^uint64(0)})
	}
	if m := g.auxMemo[n]; m.stamp == stamp {
		return m.has
	}
	has := g.nodes[n].aux != None
	if !has && !g.terminal(n) {
		es := g.out(n, g.buf())
		for _, e := range es {
			if g.hasAux(g.edges[e].end) {
				has = true
				break
			}
		}
		g.put(es)
	}
	for len(g.auxMemo) < len(g.nodes) { // the walk may have made nodes
		g.auxMemo = append(g.auxMemo, auxMark{stamp: ^uint64(0)})
	}
	g.auxMemo[n] = auxMark{stamp, has}
	return has
}

// auxMark memoises hasAux for one node.
type auxMark struct {
	stamp uint64
	has   bool
}
