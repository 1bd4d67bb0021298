package cip

// compare1a implements sequence rule 1a, P-92.1.4 (IUPAC 2013):
//
//	"Higher atomic number precedes lower."
//
// Duplicate atoms in mancude rings carry the averaged atomic number of
// P-92.1.4.4 (see mancude), so the comparison is between fractions. A
// wildcard atom (atomic number 0) ties with everything, as Hanson et al.
// 2018 treat unknown atoms.
func compare1a(g *digraph, a, b int32) int {
	x := &g.nodes[g.edges[a].end]
	y := &g.nodes[g.edges[b].end]
	if x.zNum == 0 || y.zNum == 0 {
		return 0
	}
	return sign64(int64(x.zNum)*int64(y.zDen) - int64(y.zNum)*int64(x.zDen))
}

func sign64(d int64) int {
	switch {
	case d > 0:
		return 1
	case d < 0:
		return -1
	}
	return 0
}

func sign(d int) int {
	switch {
	case d > 0:
		return 1
	case d < 0:
		return -1
	}
	return 0
}
