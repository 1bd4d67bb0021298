package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
)

// dropFalseCentre removes the configuration mark of a product's only
// stereocentre when substitution has given that carbon two equivalent
// groups (1-bromoethyl methyl ether + methoxide gives the acetal
// CH3CH(OMe)2): a carbon with two identical substituents is not a
// stereocentre (IUPAC 2013 Recommendations P-93.1; common practice), and
// RDKit drops such a mark on reading. Only a lone acyclic centre is
// handled: with other stereo elements two constitutionally equal
// branches may still be enantiomorphic (a pseudo-asymmetric centre), and
// ring carbons carry cis/trans information.
func dropFalseCentre(m *molecule.Molecule) {
	if m == nil || len(m.Tetrahedral) != 1 || len(m.CisTrans) > 0 || len(m.Axial) > 0 {
		return
	}
	t := m.Tetrahedral[0]
	if t.Centre < 0 || t.Centre >= len(m.Atoms) || perceive.NewRings(m).InRing(t.Centre) {
		return
	}
	sym := perceive.SymmetryClasses(m)
	for i := range 4 {
		for j := i + 1; j < 4; j++ {
			a, b := t.Refs[i], t.Refs[j]
			if a >= 0 && b >= 0 && a < len(sym) && b < len(sym) && sym[a] == sym[b] {
				m.Tetrahedral = m.Tetrahedral[:0]
				return
			}
		}
	}
}
