package molecule_test

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"walden/analyze/smiles"
)

// The number of aromatic atoms each Kekulé structure gets. Expected
// counts are RDKit 2022.09's default aromaticity model (Debian
// python3-rdkit, GetIsAromatic after MolFromSmiles), which the simple
// Hückel model here follows for these common cases.
func TestAromaticity(t *testing.T) {
	tests := []struct {
		smiles string
		atoms  int
	}{
		{"C1=CC=CC=C1", 6},                    // benzene
		{"C1=CC=NC=C1", 6},                    // pyridine
		{"C1=CNC=C1", 5},                      // pyrrole
		{"C1=COC=C1", 5},                      // furan
		{"C1=CSC=C1", 5},                      // thiophene
		{"C1=CCC=C1", 0},                      // cyclopentadiene
		{"C1=CC=CC=CC=C1", 0},                 // cyclooctatetraene, 8 electrons
		{"O=C1C=CC(=O)C=C1", 0},               // benzoquinone
		{"C1=CC=C2C=CC=CC=C12", 10},           // azulene, by its perimeter
		{"O=C1C=CNC=C1", 6},                   // 4-pyridone
		{"C1=CC=C2C=CC=CC2=C1", 10},           // naphthalene
		{"[CH-]1C=CC=C1", 5},                  // cyclopentadienide
		{"[CH+]1C=CC=CC=C1", 7},               // tropylium
		{"O=C1C=CC=CC=C1", 7},                 // tropone
		{"C1=CC2=CC=CC2=C1", 0},               // pentalene, 8 electrons
		{"B1C=CC=C1", 0},                      // borole, 4 electrons
		{"C1=CC=C2C(=C1)C=CC3=CC=CC=C32", 14}, // phenanthrene
		{"CN1C=NC2=C1C(=O)N(C(=O)N2C)C", 9},   // caffeine
		{"CCO", 0},
	}
	for _, tt := range tests {
		t.Run(tt.smiles, func(t *testing.T) {
			m, err := smiles.Parse(tt.smiles)
			require.NoError(t, err)
			atoms, _ := m.Aromaticity()
			n := 0
			for _, a := range atoms {
				if a {
					n++
				}
			}
			assert.Equal(t, tt.atoms, n)
		})
	}
}
