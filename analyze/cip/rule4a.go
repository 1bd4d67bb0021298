package cip

// compare4a implements sequence rule 4a, P-92.1.4 (IUPAC 2013):
//
//	"Chiral stereogenic units precede pseudoasymmetric stereogenic units
//	and these precede nonstereogenic units."
//
// Double bonds described E or Z sit with the pseudo-asymmetric units;
// a double bond whose seqCis/seqTrans sense depends on enantiomorphic
// ligands (z, e) is chiral (Hanson et al. 2018, Table 1).
func compare4a(g *digraph, a, b int32) int {
	return sign(ord4a(g.nodes[g.edges[a].end].aux) - ord4a(g.nodes[g.edges[b].end].aux))
}

func ord4a(l Letter) int {
	switch l {
	case R, S, M, P, LowerE, LowerZ:
		return 2
	case LowerR, LowerS, LowerM, LowerP, E, Z:
		return 1
	}
	return 0
}
