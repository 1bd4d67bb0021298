package analyze

import (
	"walden/analyze/cip"
	"walden/analyze/molecule"
)

// cipLabels returns the CIP letter of every labelled stereocentre of m
// (double bonds are labelled on both ends).
func cipLabels(m *molecule.Molecule) map[int]string {
	if m == nil {
		return nil
	}
	ds, _ := cip.Label(m) // a unit over the node budget is left unlabelled
	out := make(map[int]string, len(ds))
	for _, d := range ds {
		out[d.Atoms[0]] = d.Label.String()
		if d.Atoms[1] >= 0 {
			out[d.Atoms[1]] = d.Label.String()
		}
	}
	return out
}
