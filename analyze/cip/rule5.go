package cip

// compare5 implements sequence rule 5, P-92.1.4 (IUPAC 2013):
//
//	"An atom or group with descriptor 'R', 'M' and 'seqCis' has priority
//	over its enantiomorph 'S', 'P' or 'seqTrans'."
//
// Following Hanson et al. 2018 each branch is listed twice, once paired
// against an R reference and once against S (P-92.5.2.2). When both
// listings agree on which branch ranks higher the pair is ordinary (±1);
// when they disagree the branches are enantiomorphic and the answer is
// ±2, which is what makes a centre pseudo-asymmetric (r, s).
func compare5(g *digraph, ref Letter, a, b int32) int {
	if !g.atRoot(a, b) {
		return compareRef(g, ref, a, b)
	}
	x, y := g.edges[a].end, g.edges[b].end
	ra := g.fillPairs(x, R, with5R)
	sa := g.fillPairs(x, S, with5S)
	rb := g.fillPairs(y, R, with5R)
	sb := g.fillPairs(y, S, with5S)
	cr := ra.compareTo(rb)
	cs := sa.compareTo(sb)
	switch {
	case cr < 0:
		if cs < 0 {
			return -1
		}
		return -2
	case cr > 0:
		if cs > 0 {
			return 1
		}
		return 2
	}
	return 0
}
