package analyze

import (
	"walden/analyze/caution"
	"walden/analyze/molecule"
	"walden/analyze/reagents"
)

// cautionPart is what the caution rules read of one substance.
type cautionPart struct {
	text    string // as messages name it (substance.shown)
	mol     *molecule.Molecule
	reagent *reagents.Reagent
	solvent *reagents.Solvent
}

// cautionKey is everything cautionsFor reads from a step: the substrate,
// then the reagents, then the solvents (the counts say where each list
// ends), and the conditions. It is kept small: it is hashed for every
// step.
type cautionKey struct {
	parties                 [1 + memoParties]cautionPart // substrate, reagents, solvents
	hasSub                  bool
	nReag, nSolv            int
	tempC                   float64
	hasTemp, reflux, sealed bool
}

// cautions returns cautionsFor(in), asking the rules once per distinct
// step. The answer is shared: callers must not change it.
func (m *memo) cautions(in *stepInput) []caution.Caution {
	if m == nil || len(in.reagents)+len(in.solvents) > memoParties || refers(in) {
		return cautionsFor(in)
	}
	k := cautionKey{hasSub: in.substrate != nil, nReag: len(in.reagents), nSolv: len(in.solvents),
		tempC: in.tempC, hasTemp: in.hasTemp, reflux: in.reflux, sealed: in.sealed}
	party := func(s *substance) cautionPart {
		return cautionPart{text: s.shown(), mol: s.mol, reagent: s.reagent, solvent: s.solvent}
	}
	if in.substrate != nil {
		k.parties[0] = party(in.substrate)
	}
	for i, s := range in.reagents {
		k.parties[1+i] = party(s)
	}
	for i, s := range in.solvents {
		k.parties[1+len(in.reagents)+i] = party(s)
	}
	return m.cautionsBy.Do(k, func() []caution.Caution { return cautionsFor(in) })
}

// refers reports a step naming an "@label": its cautions name the label,
// so no other line has the same key, and keeping them would only cost.
func refers(in *stepInput) bool {
	if in.substrate != nil && in.substrate.ref != "" {
		return true
	}
	for _, list := range [][]*substance{in.reagents, in.solvents} {
		for _, s := range list {
			if s.ref != "" {
				return true
			}
		}
	}
	return false
}
