package notation

import (
	"strings"

	"walden/grammar/source"
)

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
//
// A Step, like every node of the syntax tree but the small ones (Mark,
// Label, Sep, Arrow, Comment, Note), is a handle: a Tree and an index
// into it. It is cheap to copy and compare, and it reads its fields from
// the Tree on demand. The zero Step is no step; its methods must not be
// called.
type Step struct {
	t *Tree
	i int32
}

func (s Step) n() *node { return &s.t.nodes[s.i] }

// Span returns the whole line as given to Parse, without its line end.
func (s Step) Span() source.Span { return s.t.span(s.n()) }

// Pos returns the start of the line.
func (s Step) Pos() source.Pos { return s.t.pos(s.n().start) }

// End returns the end of the line.
func (s Step) End() source.Pos { return s.t.pos(s.n().end) }

// Step flags say which optional parts the line has. The step's node
// holds them (see node): a line's parts are short offsets into it.
const (
	hasMark uint8 = 1 << iota
	hasLabel
	hasArrow
	hasComment
)

// at returns the host offset off bytes into the line.
func (s Step) at(off int32) source.Pos { return s.t.pos(s.n().start + off) }

// after returns the offset into the line of the first byte at or after
// off that is no space, by the rule of parser.spaceAt.
func (s Step) after(off int32) int32 {
	n := s.n()
	for off < n.end-n.start {
		k := spaceLen(s.t.src[n.start+off : n.end])
		if k == 0 {
			break
		}
		off += int32(k)
	}
	return off
}

// Mark returns the status mark ("[x]", "[-]" or "[ ]") at the start of
// the line, and false when there is none.
func (s Step) Mark() (Mark, bool) {
	n := s.n()
	if n.flags&hasMark == 0 {
		return Mark{}, false
	}
	at := s.after(0) // the mark opens the line
	return Mark{Span: source.Span{Start: s.at(at), End: s.at(at + 3)}, State: MarkState(n.sub)}, true
}

// Label returns the "name:" naming this step's product, and false when
// there is none.
func (s Step) Label() (Label, bool) {
	n := s.n()
	if n.flags&hasLabel == 0 {
		return Label{}, false
	}
	// The label is the first word, after the mark if there is one.
	var from int32
	if n.flags&hasMark != 0 {
		from = s.after(0) + 3
	}
	end, _ := unpack16(n.c)
	sp := source.Span{Start: s.at(s.after(from)), End: s.at(end)}
	name := source.Span{Start: sp.Start, End: sp.End - 1}
	return Label{Span: sp, Name: s.t.text(name), NameSpan: name}, true
}

// Arrow returns the "->" or "→", and false when the line has none.
func (s Step) Arrow() (Arrow, bool) {
	n := s.n()
	if n.flags&hasArrow == 0 {
		return Arrow{}, false
	}
	_, off := unpack16(n.b)
	width := int32(3) // "→" or "⟶"
	if s.t.src[n.start+off] == '-' {
		width = 2 // "->"
	}
	return Arrow{Span: source.Span{Start: s.at(off), End: s.at(off + width)}}, true
}

// Comment returns the "// ..." to the end of the line, and false when
// there is none.
func (s Step) Comment() (Comment, bool) {
	n := s.n()
	if n.flags&hasComment == 0 {
		return Comment{}, false
	}
	_, off := unpack16(n.c)
	sp := source.Span{Start: s.at(off), End: s.End()}
	return Comment{Span: sp, Text: strings.TrimSpace(s.t.text(source.Span{Start: sp.Start + 2, End: sp.End}))}, true
}

// counts returns the numbers of reactants, conditions and products.
func (s Step) counts() (nR, nC, nP int32) {
	n := s.n()
	nR, nC = unpack16(n.a)
	nP, _ = unpack16(n.b)
	return nR, nC, nP
}

// Reactants returns the terms before the first ", "; the first holds the
// substrate. The terms follow the step's node.
func (s Step) Reactants() Terms {
	nR, _, _ := s.counts()
	return Terms{s.t, s.i + 1, nR}
}

// Conditions returns the terms after the first ", " (solvents,
// temperatures, times, further reagents).
func (s Step) Conditions() Terms {
	nR, nC, _ := s.counts()
	return Terms{s.t, s.i + 1 + nR, nC}
}

// Products returns the terms after the arrow, joined by " + "; none when
// the arrow asks for a prediction.
func (s Step) Products() Terms {
	nR, nC, nP := s.counts()
	return Terms{s.t, s.i + 1 + nR + nC, nP}
}

// Substrate returns the substance of the first reactant, and false when
// the line has none (a blank or comment-only line, one that starts with a
// separator, or one whose first term holds only quantities).
func (s Step) Substrate() (Substance, bool) {
	r := s.Reactants()
	if r.Len() == 0 {
		return Substance{}, false
	}
	return r.At(0).Substance()
}

// Blank reports whether the line holds no reaction: nothing but a mark,
// a label, a comment or spaces.
func (s Step) Blank() bool {
	nR, nC, nP := s.counts()
	return nR == 0 && nC == 0 && nP == 0 && s.n().flags&hasArrow == 0
}

// Terms is a list of terms of one step.
type Terms struct {
	t    *Tree
	i, n int32 // the first term's node, and how many
}

// Len returns the number of terms.
func (l Terms) Len() int { return int(l.n) }

// At returns the k-th term, 0 ≤ k < Len().
func (l Terms) At(k int) Term {
	if k < 0 || k >= int(l.n) {
		panic("notation: term index out of range")
	}
	return Term{l.t, l.i + int32(k)}
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
func (m Mark) Pos() source.Pos { return m.Span.Start }

// End returns the end of the mark.
func (m Mark) End() source.Pos { return m.Span.End }

// Label names a step's product so that a later step can use it as
// "@name". Span covers the name and its colon, or, for a step number
// ("1." or "1)"), the number and its mark; Name is then the number.
type Label struct {
	Span     source.Span
	Name     string
	NameSpan source.Span // the name without the colon or mark
}

// Pos returns the start of the label.
func (l Label) Pos() source.Pos { return l.Span.Start }

// End returns the end of the label.
func (l Label) End() source.Pos { return l.Span.End }

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
func (s Sep) Pos() source.Pos { return s.Span.Start }

// End returns the end of the separator.
func (s Sep) End() source.Pos { return s.Span.End }

// Arrow separates what goes in from the expected products.
type Arrow struct{ Span source.Span }

// Pos returns the start of the arrow.
func (a Arrow) Pos() source.Pos { return a.Span.Start }

// End returns the end of the arrow.
func (a Arrow) End() source.Pos { return a.Span.End }

// Comment is the text after "//". Text excludes the marker and the
// surrounding spaces.
type Comment struct {
	Span source.Span
	Text string
}

// Pos returns the start of the comment.
func (c Comment) Pos() source.Pos { return c.Span.Start }

// End returns the end of the comment.
func (c Comment) End() source.Pos { return c.Span.End }

// Term is one item of a line between separators: a substance with its
// amounts ("NaN3 (1.5 eq)", "1.5 eq NaN3", "3 mol% TBAI"), or only
// quantities ("60 °C", "0 °C to rt", "12 h"), with any parenthesised notes.
// The parser does not know which substances are solvents or reagents;
// that is analyze/'s business. The zero Term is no term.
type Term struct {
	t *Tree
	i int32
}

func (t Term) n() *node { return &t.t.nodes[t.i] }

// IsZero reports whether t is the zero Term, which stands for no term.
func (t Term) IsZero() bool { return t.t == nil }

// Span returns the term from its first to its last byte.
func (t Term) Span() source.Span { return t.t.span(t.n()) }

// Pos returns the start of the term.
func (t Term) Pos() source.Pos { return t.t.pos(t.n().start) }

// End returns the end of the term.
func (t Term) End() source.Pos { return t.t.pos(t.n().end) }

// Sep returns the separator before the term, and false for the first
// term of the line and the first product.
func (t Term) Sep() (Sep, bool) {
	n := t.n()
	kind := SepKind(n.sub)
	if n.kind != nTerm {
		kind = SepKind(n.flags >> sepShift)
	}
	if kind == 0 {
		return Sep{}, false
	}
	at := t.t.pos(t.t.sepBefore(n.start))
	return Sep{Span: source.Span{Start: at, End: at + 1}, Kind: kind}, true
}

// Substance returns the term's substance, and false when it holds only
// quantities.
func (t Term) Substance() (Substance, bool) {
	n := t.n()
	switch {
	case n.kind == nSubstance:
		return Substance{t.t, t.i}, true
	case n.kind == nQuantity || n.flags&termSubstance == 0:
		return Substance{}, false
	}
	return Substance{t.t, t.i + n.a}, true
}

// termSubstance marks a term with a substance, the term's first child.
const termSubstance uint8 = 1

// firstQuantity returns the index of the term's first quantity, which
// follows its substance.
func (t Term) firstQuantity() int32 {
	n := t.n()
	return t.i + n.a + int32(n.flags&termSubstance)
}

// Quantities returns the term's quantities in the order written (before
// and after the substance, and inside parentheses).
func (t Term) Quantities() Quantities {
	switch t.n().kind {
	case nQuantity:
		return Quantities{t.t, t.i, 1}
	case nSubstance:
		return Quantities{}
	}
	return Quantities{t.t, t.firstQuantity(), t.n().b}
}

// Notes returns the parenthesised texts that are not quantities, such as
// "(freshly distilled)".
func (t Term) Notes() Notes {
	n := t.n()
	if n.kind != nTerm {
		return Notes{}
	}
	return Notes{t.t, t.firstQuantity() + n.b, n.c}
}

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
	t *Tree
	i int32
}

func (s Substance) n() *node { return &s.t.nodes[s.i] }

// Span returns the substance as written.
func (s Substance) Span() source.Span { return s.t.span(s.n()) }

// Pos returns the start of the substance.
func (s Substance) Pos() source.Pos { return s.t.pos(s.n().start) }

// End returns the end of the substance.
func (s Substance) End() source.Pos { return s.t.pos(s.n().end) }

// Kind returns how the substance is written.
func (s Substance) Kind() SubstanceKind { return SubstanceKind(s.n().sub) }

// plainText marks a substance whose Text is its source text as it
// stands (for a Reference, without the "@").
const plainText uint8 = 1

// Text returns the substance as written; for a Phrase the words are
// joined by single spaces, for a Mixture its parts by "/", for a
// Reference it is the label without "@".
func (s Substance) Text() string {
	n := s.n()
	text := s.t.text(s.t.span(n))
	switch {
	case SubstanceKind(n.sub) == Reference:
		return text[1:]
	case n.flags&plainText != 0:
		return text
	case SubstanceKind(n.sub) == Mixture:
		return s.Parts().joined()
	}
	return singleSpaced(text)
}

// Parts returns the components of a Mixture, in order; none for other
// kinds.
func (s Substance) Parts() Substances {
	n := s.n()
	return Substances{s.t, s.i + n.b, n.c}
}

// Ratio returns a Mixture's ratio ("4:1"), and false when not given.
func (s Substance) Ratio() (Quantity, bool) {
	n := s.n()
	if n.a == 0 {
		return Quantity{}, false
	}
	return Quantity{s.t, s.i + n.a}, true
}

// Substances is a list of substances: the parts of a mixture.
type Substances struct {
	t    *Tree
	i, n int32
}

// Len returns the number of substances.
func (l Substances) Len() int { return int(l.n) }

// At returns the k-th substance, 0 ≤ k < Len().
func (l Substances) At(k int) Substance {
	if k < 0 || k >= int(l.n) {
		panic("notation: substance index out of range")
	}
	return Substance{l.t, l.i + int32(k)}
}

// joined returns the texts of the substances joined by "/".
func (l Substances) joined() string {
	var b []byte
	for k := range l.Len() {
		if k > 0 {
			b = append(b, '/')
		}
		b = append(b, l.At(k).Text()...)
	}
	return string(b)
}

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
	t *Tree
	i int32
}

func (q Quantity) n() *node { return &q.t.nodes[q.i] }

// Span returns the quantity as written.
func (q Quantity) Span() source.Span { return q.t.span(q.n()) }

// Pos returns the start of the quantity.
func (q Quantity) Pos() source.Pos { return q.t.pos(q.n().start) }

// End returns the end of the quantity.
func (q Quantity) End() source.Pos { return q.t.pos(q.n().end) }

// Kind returns what the quantity measures.
func (q Quantity) Kind() QuantityKind { return QuantityKind(q.n().sub) }

// hasValue marks a quantity written as a number.
const hasValue uint8 = 1

// Value returns the number; it is meaningless when HasValue is false.
func (q Quantity) Value() float64 {
	if q.n().flags&hasValue == 0 {
		return 0
	}
	v, _, _ := readSigned(q.number())
	return v
}

// number returns q's text from its number on: a quantity starts with its
// number but for "at" or "for" before it ("at 60 °C"), which
// parser.quantity accepts only as words of their own.
func (q Quantity) number() string {
	s := q.t.text(q.Span())
	for {
		var w int
		switch {
		case len(s) > 2 && foldsTo(s[:2], "at"):
			w = 2
		case len(s) > 3 && foldsTo(s[:3], "for"):
			w = 3
		}
		if w == 0 || spaceLen(s[w:]) == 0 {
			return s
		}
		for s = s[w:]; spaceLen(s) > 0; {
			s = s[spaceLen(s):]
		}
	}
}

// HasValue reports whether the quantity is a number; it is false for
// words such as "rt" and "reflux".
func (q Quantity) HasValue() bool { return q.n().flags&hasValue != 0 }

// Unit returns the unit in canonical spelling ("°C", "h", "eq", "mol%");
// "" for Bare, Ratio and words.
func (q Quantity) Unit() string {
	if n := q.n(); n.flags&hasValue != 0 {
		return unitNames[n.unit]
	}
	return "" // a word, whose id unit holds
}

// UnitSpan returns the unit as written; it is empty when there is none.
func (q Quantity) UnitSpan() source.Span {
	n := q.n()
	if QuantityKind(n.sub) == Ratio {
		return source.Span{}
	}
	return source.Span{Start: q.t.pos(n.b), End: q.t.pos(n.c)}
}

// Word returns "rt", "reflux", "overnight", "cat" or "excess" for a
// quantity written as a word; "" for numbers.
func (q Quantity) Word() string {
	if n := q.n(); n.flags&hasValue == 0 {
		return wordNames[n.unit]
	}
	return ""
}

// To returns the upper end of a range, and false when q is no range.
func (q Quantity) To() (Quantity, bool) {
	n := q.n()
	if n.a == 0 {
		return Quantity{}, false
	}
	return Quantity{q.t, q.i + n.a}, true
}

// Ratio returns the parts of a Ratio, e.g. [4 1]; nil for other kinds.
func (q Quantity) Ratio() []float64 {
	n := q.n()
	if QuantityKind(n.sub) != Ratio {
		return nil
	}
	// The ratio is the first word from the number on ("4:1 v/v").
	w := q.number()
	for i := range len(w) {
		if spaceLen(w[i:]) > 0 {
			w = w[:i]
			break
		}
	}
	out, _ := ratioParts(w, nil)
	return out
}

// Quantities is a list of quantities of one term.
type Quantities struct {
	t    *Tree
	i, n int32
}

// Len returns the number of quantities.
func (l Quantities) Len() int { return int(l.n) }

// At returns the k-th quantity, 0 ≤ k < Len().
func (l Quantities) At(k int) Quantity {
	if k < 0 || k >= int(l.n) {
		panic("notation: quantity index out of range")
	}
	return Quantity{l.t, l.i + int32(k)}
}

// Note is parenthesised text that is not a quantity. Text excludes the
// parentheses.
type Note struct {
	Span source.Span
	Text string
}

// Pos returns the start of the note.
func (n Note) Pos() source.Pos { return n.Span.Start }

// End returns the end of the note.
func (n Note) End() source.Pos { return n.Span.End }

// Notes is a list of notes of one term.
type Notes struct {
	t    *Tree
	i, n int32
}

// Len returns the number of notes.
func (l Notes) Len() int { return int(l.n) }

// At returns the k-th note, 0 ≤ k < Len().
func (l Notes) At(k int) Note {
	if k < 0 || k >= int(l.n) {
		panic("notation: note index out of range")
	}
	sp := l.t.span(&l.t.nodes[l.i+int32(k)])
	return Note{Span: sp, Text: l.t.text(sp)}
}
