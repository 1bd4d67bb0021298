package analyze

import (
	"fmt"

	"walden/analyze/molecule"
)

// takeElectrophile makes the alkylating agent the substrate when the
// line starts with the nucleophile, as chemists often write an ether or
// amine alkylation ("@alcohol + NaH + MeI, THF": common practice). It
// does so only when the first substance has no leaving group that can
// go without activation and exactly one reagent, or the best of several,
// carries one on an sp3 carbon. Carbons bearing two or more halogens are
// never taken: CBr4 and CCl4 are the Appel reagents that activate the
// alcohol, not the electrophile (Appel, Angew. Chem. Int. Ed. 1975, 14,
// 801, from memory).
func takeElectrophile(in *stepInput, m *memo) {
	if in.substrate == nil || in.substrate.mol == nil {
		return
	}
	if m.substrate(in.substrate.mol).HasGood() {
		return
	}
	best, bestRank := -1, 0.0
	for i, r := range in.reagents {
		if r.mol == nil {
			continue
		}
		for _, s := range m.substrate(r.mol).Good() {
			if halogens(r.mol, s.Carbon) > 1 {
				continue
			}
			if best < 0 || s.Rank > bestRank {
				best, bestRank = i, s.Rank
			}
		}
	}
	if best < 0 {
		return
	}
	nu, el := in.substrate, in.reagents[best]
	in.substrate, in.reagents[best] = el, nu
	in.electrophileFirst = fmt.Sprintf("%s carries the leaving group, so it is the substrate; %s is the nucleophile", el.shown(), nu.shown())
}

// halogens counts the halogen atoms on atom c.
func halogens(m *molecule.Molecule, c int) int {
	n := 0
	for _, e := range m.Edges(c) {
		switch m.Atoms[e.Atom].Element {
		case molecule.F, molecule.Cl, molecule.Br, molecule.I:
			n++
		}
	}
	return n
}
