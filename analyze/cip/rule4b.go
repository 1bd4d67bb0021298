package cip

// compare4b implements sequence rule 4b, P-92.1.4 (IUPAC 2013), with the
// reference-descriptor procedure of P-92.5.2.2 as made explicit by
// Hanson et al. 2018:
//
//	"When two ligands have descriptor pairs, the ligand with like
//	descriptor pairs ('RR', 'SS', 'MM', 'PP', 'RM', 'SP', 'seqCis
//	seqCis', 'seqTrans seqTrans', 'RseqCis', 'SseqTrans', 'MseqCis',
//	'PseqTrans') precedes the ligand with unlike descriptor pairs ('RS',
//	'SR', 'MP', 'PM', 'RP', 'SM', ...)."
//
// For each ligand the reference descriptor is the one met first, in the
// highest-ranked sphere and branch that has any (the more frequent one
// when a set of equivalent branches holds both; both in turn on a tie).
// The branch is then explored in order of precedence and each descriptor
// paired with the reference; the first like/unlike difference decides.
func compare4b(g *digraph, ref Letter, a, b int32) int {
	if !g.atRoot(a, b) {
		return compareRef(g, ref, a, b)
	}
	x, y := g.edges[a].end, g.edges[b].end
	ra := g.references(x)
	rb := g.references(y)
	if len(ra) == 0 || len(rb) == 0 {
		return 0
	}
	// A branch whose first descriptor set is evenly split has two
	// candidate references; against a branch with a single one, R is
	// taken, as in the reference implementation of Hanson et al.
	if len(ra) == 1 || len(rb) == 1 {
		return g.likeFirst(x, y, ra[0], rb[0])
	}
	la := make([]pairList, len(ra))
	lb := make([]pairList, len(rb))
	for i := range ra {
		la[i] = g.fillPairs(x, ra[i], withRef(rule4b, ra[i]))
		lb[i] = g.fillPairs(y, rb[i], withRef(rule4b, rb[i]))
	}
	sortLists(la)
	sortLists(lb)
	for i := range la {
		if c := la[i].compareTo(lb[i]); c != 0 {
			return c
		}
	}
	return 0
}

// sortLists orders descriptor lists highest first.
func sortLists(ls []pairList) {
	for i := 1; i < len(ls); i++ {
		for j := i; j > 0 && ls[j-1].compareTo(ls[j]) < 0; j-- {
			ls[j], ls[j-1] = ls[j-1], ls[j]
		}
	}
}

// references finds the reference descriptor(s) of the branch at n: the
// majority R-like or S-like descriptor of the first set of equivalent
// nodes, sphere by sphere, that carries any.
func (g *digraph) references(n int32) []Letter {
	level := [][]int32{{n}}
	seq := prefixes[rule4b]
	var es []int32
	for len(level) > 0 {
		for _, set := range level {
			r, s := 0, 0
			for _, x := range set {
				switch refLetter(g.nodes[x].aux) {
				case R:
					r++
				case S:
					s++
				}
			}
			switch {
			case r+s == 0:
				continue
			case r > s:
				return []Letter{R}
			case s > r:
				return []Letter{S}
			}
			return []Letter{R, S}
		}
		var next [][]int32
		for _, set := range level {
			var parts [][][]int32
			for _, x := range set {
				es = es[:0]
				for _, e := range g.sortedOut(x, seq) {
					if !g.terminal(g.edges[e].end) {
						es = append(es, e)
					}
				}
				parts = append(parts, g.groups(seq, es))
			}
			for i := 0; ; i++ {
				var eq []int32
				more := false
				for _, p := range parts {
					if i < len(p) {
						more = true
						for _, e := range p[i] {
							eq = append(eq, g.edges[e].end)
						}
					}
				}
				if !more {
					break
				}
				if len(eq) > 0 {
					next = append(next, eq)
				}
			}
		}
		level = next
	}
	return nil
}

// likeFirst explores the branches at x and y in parallel, each ordered
// relative to its own reference, and ranks first the one that meets a
// descriptor like its reference where the other meets an unlike one.
func (g *digraph) likeFirst(x, y int32, refX, refY Letter) int {
	seqX := withRef(rule4b, refX)
	seqY := withRef(rule4b, refY)
	qx := []int32{x}
	qy := []int32{y}
	for pos := 0; pos < len(qx) && pos < len(qy); pos++ {
		a, b := qx[pos], qy[pos]
		da, db := refLetter(g.nodes[a].aux), refLetter(g.nodes[b].aux)
		if da == refX && db != refY {
			return 1
		}
		if da != refX && db == refY {
			return -1
		}
		for _, e := range g.sortedOut(a, seqX) {
			if end := g.edges[e].end; !g.terminal(end) {
				qx = append(qx, end)
			}
		}
		for _, e := range g.sortedOut(b, seqY) {
			if end := g.edges[e].end; !g.terminal(end) {
				qy = append(qy, end)
			}
		}
	}
	return 0
}
