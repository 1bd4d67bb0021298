package outcome

import (
	"testing"

	"walden/analyze/smiles"
)

// FuzzPredict: whatever molecules the SMILES reader accepts, Predict
// returns without panicking (its recover would turn a panic into
// NotAnalysed, which the fuzzer reports as a failure here).
func FuzzPredict(f *testing.F) {
	for _, s := range []string{"CCCCBr\x00[N-]=[N+]=[N-]", "CC(C)(C)Br\x00CC[O-]", "CC(C)[C@@H]1CC[C@@H](C)C[C@H]1Cl\x00CC[O-]", "O[C@@H]1CCCC[C@H]1Cl\x00[OH-]", "CC(O)C(C)(C)C\x00Cl", "C1CO1\x00N", "Br[C@H](c1ccccc1)[C@@H](Br)c1ccccc1\x00[I-]"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, in string) {
		sub, rest := in, ""
		for i := 0; i < len(in); i++ {
			if in[i] == 0 {
				sub, rest = in[:i], in[i+1:]
				break
			}
		}
		m, err := smiles.Parse(sub)
		if err != nil || m == nil || len(m.Atoms) > 60 {
			return
		}
		st := Step{Substrate: m}
		if r, err := smiles.Parse(rest); err == nil && r != nil && len(r.Atoms) <= 60 {
			st.Reagents = []Reactant{{Mol: r}}
		}
		o := Predict(st)
		if len(o.NotAnalysed) > 8 && o.NotAnalysed[:8] == "internal" {
			t.Fatalf("%q: %s", in, o.NotAnalysed)
		}
	})
}
