package cip

// compare1b implements sequence rule 1b as revised by Hanson et al.,
// J. Chem. Inf. Model. 2018, 58, 1755 (section 3, "Rule 1b"), replacing
// the wording of P-92.1.4.3 (IUPAC 2013):
//
//	"A duplicate atom node whose corresponding nonduplicated atom node is
//	the root or is closer to the root ranks higher than a duplicate atom
//	node whose corresponding nonduplicated atom node is farther from the
//	root."
//
// Only ring-closure duplicates take part: between two of them the one
// duplicating an atom nearer the root ranks higher, and a ring-closure
// duplicate ranks above any node that is not one.
func compare1b(g *digraph, a, b int32) int {
	x := &g.nodes[g.edges[a].end]
	y := &g.nodes[g.edges[b].end]
	xr, yr := x.flags&ringDup != 0, y.flags&ringDup != 0
	switch {
	case xr && yr:
		return -sign(int(x.dist) - int(y.dist))
	case xr:
		return 1
	case yr:
		return -1
	}
	return 0
}
