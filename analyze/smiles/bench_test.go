package smiles

import (
	"testing"
	"walden/analyze/molecule"
)

// benchInputs are the CIP validation suite's SMILES (Hanson et al. 2018),
// or the hand-made set when the suite is absent.
func benchInputs() []string {
	if s := suiteSMILESOrNone(); len(s) > 0 {
		return s
	}
	return handSet
}

// BenchmarkParse reads every suite SMILES once per iteration; ns/op is
// per molecule.
func BenchmarkParse(b *testing.B) {
	in := benchInputs()
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := Parse(in[i%len(in)]); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkCanonical canonicalises already-read molecules; ns/op is per
// molecule.
func BenchmarkCanonical(b *testing.B) {
	in := benchInputs()
	mols := make([]*molecule.Molecule, len(in))
	for i, s := range in {
		m, err := Parse(s)
		if err != nil {
			b.Fatal(err)
		}
		mols[i] = m
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Canonical(mols[i%len(mols)])
	}
}

// BenchmarkSmallStereo is the stereo command's typical load: a small
// molecule with one centre and one double bond.
func BenchmarkSmallStereo(b *testing.B) {
	const s = "C/C=C/[C@H](N)C(=O)O"
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		m, _ := Parse(s)
		Canonical(m)
	}
}
