package cip

// compare6 implements sequence rule 6 as proposed by Hanson et al.,
// J. Chem. Inf. Model. 2018, 58, 1755 (section 3, "Rule 6"):
//
//	"An undifferentiated reference node has priority over any other
//	undifferentiated node."
//
// It breaks the ties left in highly symmetric cages (C2, S4 and D2d
// centres) by choosing one of the tied ligands as the reference; the
// caller sets g.rule6 while it ranks.
func compare6(g *digraph, a, b int32) int {
	if g.rule6 < 0 {
		return 0
	}
	x := g.nodes[g.edges[a].end].atom == g.rule6
	y := g.nodes[g.edges[b].end].atom == g.rule6
	switch {
	case x && !y:
		return 1
	case y && !x:
		return -1
	}
	return 0
}
