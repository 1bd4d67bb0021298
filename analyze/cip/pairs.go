package cip

// A descriptor list for rules 4b and 5 (P-92.5.2.2): the reference
// descriptor first, then the descriptors met while a branch is explored
// in order of precedence, each folded onto R or S by refLetter. Comparing
// two lists asks, position by position, which one is "like" its
// reference where the other is "unlike".
type pairList []Letter

// fillPairs explores the branch from n breadth-first, ordering each
// node's children by seq (the sequence with the stand-in rule for ref),
// and lists the descriptors met.
func (g *digraph) fillPairs(n int32, ref Letter, seq *ruleSeq) pairList {
	list := pairList{ref}
	queue := []int32{n}
	for i := 0; i < len(queue); i++ {
		x := queue[i]
		if c := refLetter(g.nodes[x].aux); c != None {
			list = append(list, c)
		}
		// Only branches holding descriptors can add to the list, and
		// their order among themselves is all that matters.
		var only int32 = -1
		k := 0
		b := g.out(x, g.buf())
		for _, e := range b {
			if g.hasAux(g.edges[e].end) {
				only = g.edges[e].end
				k++
			}
		}
		g.put(b)
		switch {
		case k == 1:
			queue = append(queue, only)
		case k > 1:
			for _, e := range g.sortedOut(x, seq) {
				if end := g.edges[e].end; !g.terminal(end) && g.hasAux(end) {
					queue = append(queue, end)
				}
			}
		}
	}
	return list
}

// compareTo returns >0 when l has a "like" pair where o first has an
// "unlike" one, <0 for the reverse, 0 when they agree throughout (or
// cannot be compared because their lengths differ, which only happens
// for branches that are not constitutionally equivalent).
func (l pairList) compareTo(o pairList) int {
	if len(l) != len(o) || len(l) == 0 {
		return 0
	}
	for i := 1; i < len(l); i++ {
		lk, ok := l[i] == l[0], o[i] == o[0]
		if lk && !ok {
			return 1
		}
		if !lk && ok {
			return -1
		}
	}
	return 0
}

// compareRef is the stand-in form of rules 4b and 5 used away from the
// root: a node whose descriptor is like ref ranks above one whose
// descriptor is unlike it.
func compareRef(g *digraph, ref Letter, a, b int32) int {
	if ref == None {
		return 0
	}
	x := refLetter(g.nodes[g.edges[a].end].aux)
	y := refLetter(g.nodes[g.edges[b].end].aux)
	if x == None || y == None {
		return 0
	}
	xl, yl := x == ref, y == ref
	switch {
	case xl && !yl:
		return 1
	case yl && !xl:
		return -1
	}
	return 0
}

// atRoot reports whether edges a and b both leave the current root.
func (g *digraph) atRoot(a, b int32) bool {
	return g.edges[a].beg == g.root && g.edges[b].beg == g.root
}
