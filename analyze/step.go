package analyze

import (
	"sync/atomic"

	"walden/analyze/caution"
	"walden/analyze/molecule"
	"walden/analyze/reagents"
	"walden/grammar/notation"
	"walden/grammar/source"
)

// stepResult is the analysis of one step line, independent of where the
// line sits in its host: every span in it is relative to the start of the
// line, so the same result serves the line wherever an edit moves it.
// A stepResult is never changed once cached.
type stepResult struct {
	label     string
	labelSpan source.Span
	refs      []refUse
	handOn    *handOn // what a reference to this step's label yields; nil when nothing
	diags     []Diagnostic
	tokens    []Token
	inlay     string
	fixes     []Fix
	hover     string // Markdown for the whole step, when fixed at analysis (else built from chem)
	// What hover text is built from, on demand: a step's hover is read
	// far less often than it is analysed, so the Markdown is not kept.
	in       *stepInput
	chem     *prediction
	cautions []caution.Caution
	slots    []slot                    // where completion applies
	pred     *Prediction               // nil when nothing was predicted
	last     atomic.Pointer[placement] // the last placement, reused while the line does not move
	seen     atomic.Int64              // where the line started in the last Analyze call
}

// refUse is one "@label" in a step.
type refUse struct {
	name string
	span source.Span
}

// slot is a place in a line where a name or a label can be completed.
type slot struct {
	span      source.Span
	reference bool // "@…": complete labels
}

// handOn is the product a step hands on to steps that name its label.
type handOn struct {
	smiles  string // canonical
	mol     *molecule.Molecule
	written bool     // the chemist's own product after '->', not the prediction
	history []string // configuration through the plan, e.g. "k1 retained (S)"
}

// key identifies a handOn in cache keys.
func (h *handOn) key() string {
	if h == nil {
		return "-"
	}
	k := h.smiles
	for _, s := range h.history {
		k += "|" + s
	}
	return k
}

// substance is one resolved substance of a step.
type substance struct {
	text     string
	span     source.Span   // relative to the line
	term     notation.Term // zero when the substance stands for no term of the line
	kind     notation.SubstanceKind
	mol      *molecule.Molecule
	smiles   string // as read (the written SMILES, the dictionary's, or the referenced product's)
	reagent  *reagents.Reagent
	solvent  *reagents.Solvent
	ref      string  // the label, when the substance is "@label"
	from     *handOn // the referenced step's product
	asSMILES bool    // read from SMILES written in the line
}

// shown is how messages name the substance: as written, and for a
// reference the label with the SMILES it stands for ("@me (CI)"), so
// that a caution never names a bare label as if it were a chemical.
func (s *substance) shown() string {
	if s.ref == "" {
		return s.text
	}
	if s.smiles != "" {
		return "@" + s.ref + " (" + s.smiles + ")"
	}
	return "@" + s.ref
}

// known reports whether the substance resolved to something walden can
// reason about.
func (s *substance) known() bool {
	return s != nil && (s.mol != nil || s.reagent != nil || s.solvent != nil)
}

// stepInput is a step with every substance and condition resolved.
type stepInput struct {
	parsed         notation.Step
	substrate      *substance
	reagents       []*substance
	solvents       []*substance
	products       []*substance // written after '->'
	tempC          float64
	hasTemp        bool
	reflux         bool
	sealed         bool
	tempSpan       source.Span
	solventAssumed string // the default used when no solvent is named
	// electrophileFirst says why a reagent was taken as the substrate
	// when the line starts with the nucleophile; "" otherwise.
	electrophileFirst string
}
