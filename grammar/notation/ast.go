package notation

import "walden/grammar/source"

// Node is any part of a step line. Pos and End are byte offsets in the
// host document (the Markdown page, plan file or notebook cell), so a node
// can be shown in the editor without knowing where its line began.
type Node interface {
	Pos() source.Pos // first byte of the node
	End() source.Pos // first byte after the node
}

// Step is one reaction line: an optional status mark and label, the
// reactants (the first is the substrate), the conditions, an optional
// arrow with the expected products, and an optional trailing comment.
// Parse always returns a Step, with the parts it could read.
type Step struct {
	Span       source.Span // the whole line as given to Parse, without its line end
	Mark       *Mark       // "[x]", "[-]" or "[ ]" at the start; nil when absent
	Label      *Label      // "name:" naming this step's product; nil when absent
	Reactants  []*Term     // terms before the first ", "; Reactants[0] holds the substrate
	Conditions []*Term     // terms after the first ", " (solvents, temperatures, times, further reagents)
	Arrow      *Arrow      // "->" or "→"; nil when the line has none
	Products   []*Term     // terms after the arrow, joined by " + "; empty when the arrow asks for a prediction
	Comment    *Comment    // "// ..." to the end of the line; nil when absent
}

// Pos returns the start of the line.
func (s *Step) Pos() source.Pos { return s.Span.Start }

// End returns the end of the line.
func (s *Step) End() source.Pos { return s.Span.End }

// Substrate returns the substance of the first reactant, or nil when the
// line has none (a blank or comment-only line, or one that starts with a
// separator).
func (s *Step) Substrate() *Substance {
	if len(s.Reactants) == 0 {
		return nil
	}
	return s.Reactants[0].Substance
}

// Blank reports whether the line holds no reaction: nothing but a mark,
// a label, a comment or spaces.
func (s *Step) Blank() bool {
	return len(s.Reactants) == 0 && len(s.Conditions) == 0 && s.Arrow == nil && len(s.Products) == 0
}

// MarkState is what a status mark says about a step.
type MarkState int

const (
	Open    MarkState = iota + 1 // "[ ]": planned, not yet run
	Done                         // "[x]" or "[X]": run
	Skipped                      // "[-]": dropped from the plan
)

// String returns the state's name in lower case.
func (m MarkState) String() string {
	switch m {
	case Open:
		return "open"
	case Done:
		return "done"
	case Skipped:
		return "skipped"
	}
	return "unknown"
}

// Mark is the status mark at the start of a line.
type Mark struct {
	Span  source.Span
	State MarkState
}

// Pos returns the start of the mark.
func (m *Mark) Pos() source.Pos { return m.Span.Start }

// End returns the end of the mark.
func (m *Mark) End() source.Pos { return m.Span.End }

// Label names a step's product so that a later step can use it as
// "@name". Span covers the name and its colon, or, for a step number
// ("1." or "1)"), the number and its mark; Name is then the number.
type Label struct {
	Span     source.Span
	Name     string
	NameSpan source.Span // the name without the colon or mark
}

// Pos returns the start of the label.
func (l *Label) Pos() source.Pos { return l.Span.Start }

// End returns the end of the label.
func (l *Label) End() source.Pos { return l.Span.End }

// SepKind says which separator came before a term.
type SepKind int

const (
	Plus  SepKind = iota + 1 // " + ": another reactant (or product)
	Comma                    // ", ": another condition
)

// String returns the separator as written.
func (k SepKind) String() string {
	if k == Plus {
		return "+"
	}
	return ","
}

// Sep is a separator between terms.
type Sep struct {
	Span source.Span
	Kind SepKind
}

// Pos returns the start of the separator.
func (s *Sep) Pos() source.Pos { return s.Span.Start }

// End returns the end of the separator.
func (s *Sep) End() source.Pos { return s.Span.End }

// Arrow separates what goes in from the expected products.
type Arrow struct{ Span source.Span }

// Pos returns the start of the arrow.
func (a *Arrow) Pos() source.Pos { return a.Span.Start }

// End returns the end of the arrow.
func (a *Arrow) End() source.Pos { return a.Span.End }

// Comment is the text after "//". Text excludes the marker and the
// surrounding spaces.
type Comment struct {
	Span source.Span
	Text string
}

// Pos returns the start of the comment.
func (c *Comment) Pos() source.Pos { return c.Span.Start }

// End returns the end of the comment.
func (c *Comment) End() source.Pos { return c.Span.End }

// Term is one item of a line between separators: a substance with its
// amounts ("NaN3 (1.5 eq)", "1.5 eq NaN3", "3 mol% TBAI"), or only
// quantities ("60 °C", "0 °C to rt", "12 h"), with any parenthesised notes.
// The parser does not know which substances are solvents or reagents;
// that is analyze/'s business.
type Term struct {
	Span       source.Span
	Sep        *Sep        // the separator before the term; nil for the first term of the line
	Substance  *Substance  // nil when the term holds only quantities
	Quantities []*Quantity // in the order written (before and after the substance, and inside parentheses)
	Notes      []*Note     // parenthesised text that is not a quantity, e.g. "(freshly distilled)"

	sep Sep // storage for Sep
}

// Pos returns the start of the term.
func (t *Term) Pos() source.Pos { return t.Span.Start }

// End returns the end of the term.
func (t *Term) End() source.Pos { return t.Span.End }

// SubstanceKind says how a substance is written.
type SubstanceKind int

const (
	// Word is one whitespace-free word: a SMILES (also dotted, for salts)
	// or a dictionary name or abbreviation. Only analyze/ can tell which.
	Word SubstanceKind = iota + 1
	// Phrase is a name of several words ("potassium phthalimide"); it
	// cannot be SMILES, which holds no spaces.
	Phrase
	// Reference is "@label": the product of an earlier step.
	Reference
	// Mixture is several substances joined by "/" or an en dash
	// ("THF/water", "acetone–water 4:1"), with an optional ratio.
	Mixture
)

// String returns the kind's name in lower case.
func (k SubstanceKind) String() string {
	switch k {
	case Word:
		return "word"
	case Phrase:
		return "phrase"
	case Reference:
		return "reference"
	case Mixture:
		return "mixture"
	}
	return "unknown"
}

// Substance is a thing that takes part in a step.
type Substance struct {
	Span source.Span
	Kind SubstanceKind
	// Text is the substance as written; for a Phrase the words are joined
	// by single spaces, for a Reference it is the label without "@".
	Text  string
	Parts []*Substance // the components of a Mixture, in order
	Ratio *Quantity    // a Mixture's ratio ("4:1"); nil when not given
}

// Pos returns the start of the substance.
func (s *Substance) Pos() source.Pos { return s.Span.Start }

// End returns the end of the substance.
func (s *Substance) End() source.Pos { return s.Span.End }

// QuantityKind says what a quantity measures.
type QuantityKind int

const (
	Bare          QuantityKind = iota + 1 // a number without a unit (an error)
	Temperature                           // °C, K, °F; rt; reflux
	Duration                              // s, min, h, d; overnight
	Equivalents                           // eq, equiv, ×; cat.; excess
	MolPercent                            // mol%
	Mass                                  // mg, g, kg
	Volume                                // µL, mL, L
	Moles                                 // µmol, mmol, mol
	Concentration                         // mM, M
	Percent                               // %, wt% (yields, purities)
	Pressure                              // atm, bar, psi
	Ratio                                 // 4:1
)

var quantityKindNames = [...]string{"", "bare", "temperature", "duration", "equivalents", "mol%", "mass", "volume", "moles", "concentration", "percent", "pressure", "ratio"}

// String returns the kind's name in lower case.
func (k QuantityKind) String() string {
	if k > 0 && int(k) < len(quantityKindNames) {
		return quantityKindNames[k]
	}
	return "unknown"
}

// Quantity is a number with its unit ("60 °C", "1.5 eq", "3 mol%"), a
// word standing for one ("rt", "reflux", "overnight", "cat."), a range
// ("0 °C to rt", "12–16 h") or a ratio ("4:1").
type Quantity struct {
	Span     source.Span
	Kind     QuantityKind
	Value    float64     // the number; meaningless when HasValue is false
	HasValue bool        // false for words such as "rt" and "reflux"
	Unit     string      // the unit in canonical spelling ("°C", "h", "eq", "mol%"); "" for Bare, Ratio and words
	UnitSpan source.Span // the unit as written; empty when there is none
	Word     string      // "rt", "reflux", "overnight", "cat", "excess"; "" for numbers
	To       *Quantity   // the upper end of a range; nil otherwise
	Ratio    []float64   // the parts of a Ratio, e.g. [4 1]
}

// Pos returns the start of the quantity.
func (q *Quantity) Pos() source.Pos { return q.Span.Start }

// End returns the end of the quantity.
func (q *Quantity) End() source.Pos { return q.Span.End }

// Note is parenthesised text that is not a quantity. Text excludes the
// parentheses.
type Note struct {
	Span source.Span
	Text string
}

// Pos returns the start of the note.
func (n *Note) Pos() source.Pos { return n.Span.Start }

// End returns the end of the note.
func (n *Note) End() source.Pos { return n.Span.End }
