package analyze

import (
	"walden/analyze/caution"
	"walden/analyze/molecule"
	"walden/analyze/outcome"
	"walden/analyze/perceive"
	"walden/analyze/smiles"
	"walden/internal/bounded"
)

// memo keeps, for one Engine, the chemistry that depends on only part of
// a step, so that the thousands of steps of a page that differ only in
// their temperature, label or amounts read, perceive and predict each
// substance once. Steps of one page are mostly such variations.
//
// Everything kept is shared between steps and never changed: molecules
// are read-only once built (the outcome rules build products as new
// molecules and never write to a substrate or reagent, as the
// dictionary's shared molecules already require), and so are the
// perceptions and outcomes, which the callers only read. Keys hold the
// molecules they name, so a pointer in a key cannot be reused by another
// molecule while the entry lives.
//
// Each table is bounded (internal/bounded): when it is full it is
// emptied, which costs a page larger than that some recomputation and
// never a wrong answer. A memo is safe for concurrent use (prewarm
// analyses on every core); two goroutines missing the same key both
// compute it, and either answer serves.
type memo struct {
	smiles     bounded.Table[string, *readSMILES]
	chem       *outcome.Cache // perception, products and CIP letters by molecule
	outcomes   bounded.Table[outcomeKey, *prediction]
	cautionsBy bounded.Table[cautionKey, []caution.Caution]
}

// readSMILES is a SMILES text as read: its molecule or error, and the
// dictionary entry with the same structure (a solvent or reagent written
// as SMILES is still that entry).
type readSMILES struct {
	mol   *molecule.Molecule // nil when the text does not read
	err   error
	entry entry
}

// newMemo returns an empty memo; its tables are made on first use.
func newMemo() *memo { return &memo{chem: outcome.NewCache()} }

// reserve makes the tables of whole steps with room for n steps, so that
// opening a long page does not grow them step by step.
func (m *memo) reserve(n int) {
	if m == nil {
		return
	}
	m.outcomes.Reserve(n)
	m.cautionsBy.Reserve(n)
}

// readSMILES reads text as SMILES, once per text. The molecule is shared:
// callers must not change it.
func (m *memo) readSMILES(d *dictionary, text string) *readSMILES {
	read := func() *readSMILES {
		r := &readSMILES{}
		r.mol, r.err = smiles.Parse(text)
		if r.err == nil {
			r.entry = d.bySMILES(r.mol)
		} else {
			r.mol = nil
		}
		return r
	}
	if m == nil {
		return read()
	}
	return m.smiles.Do(text, read)
}

// substrate perceives mol as a substrate, once per molecule. The answer
// is shared: callers must not change it.
func (m *memo) substrate(mol *molecule.Molecule) *perceive.Substrate {
	if m == nil {
		return perceive.PerceiveSubstrate(mol)
	}
	return m.chem.Substrate(mol)
}

// memoParties is the most reagents and solvents a step may have for its
// outcome to be kept; longer steps are rare and predicted each time.
const memoParties = 4

// outcomeKey is everything outcome.Predict reads from a Step: molecules
// and dictionary entries by identity (the same text gives the same
// shared molecule), numbers by value.
type outcomeKey struct {
	sub             *molecule.Molecule
	reagents        [memoParties]outcome.Reactant
	solvents        [memoParties]outcome.SolventShare
	nReag, nSolv    int
	tempC           float64
	hasTemp, reflux bool
}

// prediction returns the outcome engine's answer for st in the report's
// terms, predicting and converting it once per distinct step. The
// prediction is the caller's own (a copy), but the slices and molecules
// in it are shared and must not be changed in place.
func (m *memo) prediction(st *outcome.Step, solventIndex map[int]int) *prediction {
	if m == nil || len(st.Reagents) > memoParties || len(st.Solvents) > memoParties {
		if m != nil {
			st.Cache = m.chem
		}
		return convert(runOutcome(st), solventIndex)
	}
	st.Cache = m.chem
	// The outcome's solvent indices are ours whenever every solvent of
	// the step is a dictionary solvent, as resolution makes them; only
	// then is the converted prediction the same for every step, and worth
	// keeping. The rare other steps are predicted each time: keeping the
	// raw outcome for them would keep it for every step.
	same := len(solventIndex) == len(st.Solvents)
	for i, j := range solventIndex {
		same = same && i == j
	}
	if !same {
		return convert(runOutcome(st), solventIndex)
	}
	k := outcomeKey{sub: st.Substrate, nReag: len(st.Reagents), nSolv: len(st.Solvents), reflux: st.Reflux}
	copy(k.reagents[:], st.Reagents)
	copy(k.solvents[:], st.Solvents)
	if st.TempC != nil {
		k.tempC, k.hasTemp = *st.TempC, true
	}
	got := m.outcomes.Do(k, func() *prediction { return convert(runOutcome(st), solventIndex) })
	p := *got
	return &p
}

// convert is fromOutcome, with the answer for an engine that gave none.
func convert(o *outcome.Outcome, solventIndex map[int]int) *prediction {
	if o == nil {
		return &prediction{notAnalysed: "the outcome rules gave no answer", reacting: -1, mechanism: "none"}
	}
	return fromOutcome(o, solventIndex)
}
