// Package smiles reads and writes SMILES (OpenSMILES) and computes the
// canonical form used to compare structures exactly.
package smiles

import "walden/analyze/molecule"

// Parse reads one SMILES string. On error it returns the molecule read so
// far (possibly nil) and an ErrorList with every problem found.
// STUB: being written; the signature is fixed.
func Parse(s string) (*molecule.Molecule, error) {
	panic("smiles.Parse: not written yet")
}
