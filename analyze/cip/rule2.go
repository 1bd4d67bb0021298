package cip

// compare2 implements sequence rule 2, P-92.1.4 (IUPAC 2013):
//
//	"Higher atomic mass number precedes lower."
//
// An atom written with a mass number ([2H], [13C]) counts with the atomic
// mass of that nuclide (isotopes.tsv; its mass number where the table has
// none); an atom of natural isotopic composition counts with the standard
// atomic weight of its element (masses.tsv). So [2H] ranks above H, H
// above [1H], and O (15.999) above [16O] (15.995), as the CIP validation
// suite of Hanson et al. 2018 expects (entry VS176). Where neither
// node has a stated mass number the rule has nothing to say: equal
// elements have equal weights, and a mancude duplicate must not be ranked
// by the Kekulé structure that happened to make it.
func compare2(g *digraph, a, b int32) int {
	x := &g.nodes[g.edges[a].end]
	y := &g.nodes[g.edges[b].end]
	if x.zNum == 0 || y.zNum == 0 {
		return 0
	}
	xi, yi := g.isotope(x), g.isotope(y)
	if xi == 0 && yi == 0 {
		return 0
	}
	xm, ym := g.mass(x, xi), g.mass(y, yi)
	switch {
	case xm > ym:
		return 1
	case xm < ym:
		return -1
	}
	return 0
}

func (g *digraph) isotope(n *node) int {
	if n.atom < 0 {
		return 0
	}
	return g.mol.m.Atoms[n.atom].Isotope
}

func (g *digraph) mass(n *node, isotope int) float64 {
	if n.atom < 0 {
		return standardWeight[1]
	}
	e := g.mol.m.Atoms[n.atom].Element
	if isotope > 0 {
		if m, ok := nuclideMass[[2]int{int(e), isotope}]; ok {
			return m
		}
		return float64(isotope)
	}
	return standardWeight[e]
}
