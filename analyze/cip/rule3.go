package cip

// compare3 implements sequence rule 3, P-92.1.4 (IUPAC 2013):
//
//	"When considering double bonds and planar tetraligand atoms, 'seqcis'
//	= 'Z' precedes 'seqtrans' = 'E', and this precedes nonstereogenic
//	double bonds."
//
// The descriptors are the auxiliary ones assigned inside the digraph.
func compare3(g *digraph, a, b int32) int {
	return sign(ord3(g.nodes[g.edges[a].end].aux) - ord3(g.nodes[g.edges[b].end].aux))
}

func ord3(l Letter) int {
	switch l {
	case Z:
		return 2
	case E:
		return 1
	}
	return 0
}
