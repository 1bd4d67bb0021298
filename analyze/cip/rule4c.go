package cip

// compare4c implements sequence rule 4c, P-92.1.4 (IUPAC 2013):
//
//	"'r' precedes 's' and 'm' precedes 'p'."
func compare4c(g *digraph, a, b int32) int {
	return sign(ord4c(g.nodes[g.edges[a].end].aux) - ord4c(g.nodes[g.edges[b].end].aux))
}

func ord4c(l Letter) int {
	switch l {
	case LowerR, LowerM:
		return 2
	case LowerS, LowerP:
		return 1
	}
	return 0
}
