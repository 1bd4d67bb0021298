package outcome

import (
	"testing"

	"walden/analyze/smiles"
)

func benchStep(b *testing.B, substrate, reagent, solvent string) {
	sub, err := smiles.Parse(substrate)
	if err != nil {
		b.Fatal(err)
	}
	r, err := smiles.Parse(reagent)
	if err != nil {
		b.Fatal(err)
	}
	t := &testing.T{}
	st := Step{Substrate: sub, Reagents: []Reactant{{Mol: r}}, Solvents: solventsFor(t, solvent)}
	b.ReportAllocs()
	b.ResetTimer()
	for range b.N {
		Predict(st)
	}
}

// BenchmarkSN2Stereo: (R)-2-bromooctane + azide in DMF, with CIP labels
// before and after.
func BenchmarkSN2Stereo(b *testing.B) {
	benchStep(b, "CCCCCC[C@@H](C)Br", "[N-]=[N+]=[N-]", "DMF")
}

// BenchmarkE2Cyclohexane: menthyl chloride + ethoxide (trans-diaxial E2).
func BenchmarkE2Cyclohexane(b *testing.B) {
	benchStep(b, "CC(C)[C@@H]1CC[C@@H](C)C[C@H]1Cl", "CC[O-]", "ethanol")
}

// BenchmarkE2OpenChain: 2-bromobutane + ethoxide (Zaitsev, E and Z).
func BenchmarkE2OpenChain(b *testing.B) {
	benchStep(b, "CCC(C)Br", "CC[O-]", "ethanol")
}
