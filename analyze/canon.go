package analyze

import (
	"walden/analyze/molecule"
	"walden/analyze/smiles"
)

// canonical is the canonical SMILES of m, stereo kept; "" when m is nil.
func canonical(m *molecule.Molecule) string {
	if m == nil {
		return ""
	}
	return smiles.Canonical(m)
}
