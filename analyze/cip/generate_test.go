package cip

import (
	"math/rand"
	"strings"
)

// stereoGenerator writes random small stereo molecules as SMILES, from a
// fixed seed, for the differential test against RDKit and for the
// benchmarks. Its choices cover what the labeller must tell apart: chains,
// rings, hetero atoms, isotopes, E/Z alkenes, 1,4-disubstituted
// cyclohexanes, pseudo-asymmetric centres, nested centres, hetero centres.
type stereoGenerator struct {
	r *rand.Rand
}

func newStereoGenerator(seed int64) *stereoGenerator {
	return &stereoGenerator{rand.New(rand.NewSource(seed))}
}

var plainSubs = []string{
	"C", "CC", "CCC", "C(C)C", "C(C)(C)C", "O", "OC", "OCC", "N", "NC", "N(C)C",
	"F", "Cl", "Br", "I", "S", "SC", "C=C", "C#C", "C#N", "C(=O)O", "C(=O)OC",
	"C(=O)N", "C=O", "c1ccccc1", "c1ccncc1", "c1ccco1", "c1cccs1", "[2H]", "[13CH3]",
	"C[2H]", "C([2H])([2H])[2H]", "[13CH2]C", "OC(C)=O", "C1CC1", "C1CCCC1",
	"[Si](C)(C)C", "CO", "CCl", "CBr", "C(F)(F)F", "[N+](=O)[O-]", "S(=O)(=O)C",
	"P(=O)(OC)OC", "C(C)=C", "CC=C", "[18OH]", "O[2H]", "[15NH2]", "C1CCOC1",
}

func (g *stereoGenerator) at() string {
	if g.r.Intn(2) == 0 {
		return "@"
	}
	return "@@"
}

func (g *stereoGenerator) dir() string {
	if g.r.Intn(2) == 0 {
		return "/"
	}
	return `\`
}

// sub returns a random substituent; depth limits nested stereocentres.
func (g *stereoGenerator) sub(depth int) string {
	if depth < 2 && g.r.Intn(5) == 0 {
		switch g.r.Intn(3) {
		case 0:
			return "[C" + g.at() + "H](" + g.sub(depth+1) + ")" + g.sub(depth+1)
		case 1:
			return "C(" + g.dir() + "C)=C" + g.dir() + g.sub(depth+1)
		default:
			return "C" + "[C" + g.at() + "H](" + g.sub(depth+1) + ")" + g.sub(depth+1)
		}
	}
	return plainSubs[g.r.Intn(len(plainSubs))]
}

// next returns one molecule.
func (g *stereoGenerator) next() string {
	s := g.sub
	switch g.r.Intn(12) {
	case 0, 1: // carbon centre with a hydrogen
		return "[C" + g.at() + "H](" + s(0) + ")(" + s(0) + ")" + s(0)
	case 2: // quaternary carbon centre
		return "[C" + g.at() + "](" + s(0) + ")(" + s(0) + ")(" + s(0) + ")" + s(0)
	case 3: // alkene
		var b strings.Builder
		b.WriteString("C(" + g.dir() + s(1) + ")")
		if g.r.Intn(2) == 0 {
			b.WriteString("(" + s(1) + ")")
		}
		b.WriteString("=C(" + g.dir() + s(1) + ")")
		if g.r.Intn(2) == 0 {
			b.WriteString(s(1))
		} else {
			b.WriteString("[H]")
		}
		return b.String()
	case 4: // 1,4-disubstituted cyclohexane
		if g.r.Intn(2) == 0 {
			return "[C" + g.at() + "H]%91(" + s(1) + ")CC[C" + g.at() + "H](" + s(1) + ")CC%91"
		}
		return "[C" + g.at() + "]%91(" + s(1) + ")(" + s(1) + ")CC[C" + g.at() + "H](" + s(1) + ")CC%91"
	case 5: // pseudo-asymmetric middle centre
		a, x := s(1), s(1)
		return "[C" + g.at() + "H](" + a + ")(" + x + ")[C" + g.at() + "H](" + s(1) + ")[C" + g.at() + "H](" + a + ")" + x
	case 6: // cyclopentane with three centres
		return "[C" + g.at() + "H]%91(" + s(1) + ")[C" + g.at() + "H](" + s(1) + ")C[C" + g.at() + "H](" + s(1) + ")C%91"
	case 7: // hetero centres
		switch g.r.Intn(6) {
		// Centres with a lone pair start after a first atom: where the
		// centre itself opens the string, OpenSMILES readers disagree on
		// where the lone pair stands (see the package report).
		case 0:
			return "C[S" + g.at() + "](=O)" + s(1)
		case 1:
			return "C[S" + g.at() + "+](" + s(1) + ")" + s(1)
		case 2:
			return "[P" + g.at() + "](=O)(" + s(1) + ")(" + s(1) + ")" + s(1)
		case 3:
			return "C[P" + g.at() + "](" + s(1) + ")" + s(1)
		case 4:
			return "[Si" + g.at() + "](" + s(1) + ")(" + s(1) + ")(" + s(1) + ")" + s(1)
		default:
			return "[N" + g.at() + "+](" + s(1) + ")(" + s(1) + ")(" + s(1) + ")" + s(1)
		}
	case 8: // alkene between centres
		return "[C" + g.at() + "H](" + s(1) + ")(" + s(1) + ")" + g.dir() + "C=C" + g.dir() + "[C" + g.at() + "H](" + s(1) + ")" + s(1)
	case 9: // cyclohexane with two adjacent centres
		return "[C" + g.at() + "H]%91(" + s(1) + ")[C" + g.at() + "H](" + s(1) + ")CCCC%91"
	case 10: // isotopically distinguished centre
		iso := []string{"[2H]", "[3H]", "[13CH3]", "[14CH3]", "[18OH]", "[17OH]", "[15NH2]", "[37Cl]", "[81Br]"}
		base := []string{"[H]", "[H]", "C", "C", "O", "O", "N", "Cl", "Br"}
		k := g.r.Intn(len(iso))
		return "[C" + g.at() + "](" + iso[k] + ")(" + base[k] + ")(" + s(1) + ")" + s(1)
	}
	// ring with an exocyclic centre and a ring heteroatom
	return "[C" + g.at() + "H](" + s(1) + ")(" + s(1) + ")C%91CCOC%91"
}
