package outcome

import (
	"reflect"
	"testing"

	"walden/analyze/molecule"
)

// TestCacheAnswersAsWithout predicts every scenario at several
// temperatures through one shared Cache, twice over so that the second
// round is answered from it, and checks each answer against Predict
// without a Cache on freshly read molecules.
func TestCacheAnswersAsWithout(t *testing.T) {
	cache := NewCache()
	type shared struct {
		sub      *molecule.Molecule
		reagents []Reactant
	}
	mols := make([]shared, len(scenarios))
	for i, sc := range scenarios {
		mols[i].sub = mustParse(t, sc.substrate)
		for _, r := range sc.reagents {
			mols[i].reagents = append(mols[i].reagents, Reactant{Mol: mustParse(t, r)})
		}
	}
	temps := []float64{0, 25, 80, 150}
	for round := range 2 {
		for i, sc := range scenarios {
			for _, temp := range temps {
				want := runScenario(t, scenario{substrate: sc.substrate, reagents: sc.reagents, solvent: sc.solvent, tempC: temp})
				st := Step{Substrate: mols[i].sub, Reagents: mols[i].reagents, Cache: cache}
				if sc.solvent != "" {
					st.Solvents = solventsFor(t, sc.solvent)
				}
				if temp != 0 {
					v := temp
					st.TempC = &v
				}
				got := Predict(st)
				if g, w := withoutMols(got), withoutMols(want); !reflect.DeepEqual(g, w) {
					t.Errorf("round %d, %s at %v °C: with a Cache\n%+v\nwithout\n%+v", round, sc.name, temp, g, w)
				}
			}
		}
	}
}

// withoutMols is o without its product molecules, which the canonical
// SMILES stand for.
func withoutMols(o Outcome) Outcome {
	o.Products = append([]Product(nil), o.Products...)
	for i := range o.Products {
		o.Products[i].Mol = nil
	}
	return o
}
