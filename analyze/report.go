// Package analyze turns the reaction steps found in notebook sources into
// reports: predicted outcomes, diagnostics, hover text and fixes, all
// positioned by byte offsets in the host document. It knows chemistry and
// the notation's syntax tree, never the Language Server Protocol.
package analyze

import "walden/grammar/source"

// Severity ranks a diagnostic. The values match no protocol on purpose;
// the server converts at its boundary.
type Severity int

const (
	Error Severity = iota + 1
	Warning
	Info
	Hint
)

// Diagnostic is one finding about a step, positioned in its host document.
type Diagnostic struct {
	Code     string // stable code, documented in README.md
	Severity Severity
	Message  string
	Span     source.Span
	Related  []Related
	Fixes    []Fix
	Unneeded bool // the marked text has no effect (shown faded by editors)
}

// Related points at another party to a finding, e.g. the base that will
// cause elimination when the diagnostic sits on the substrate.
type Related struct {
	Span    source.Span
	Message string
}

// Fix is a suggested change: a title and the edits that make it.
type Fix struct {
	Title     string
	Edits     []Edit
	Preferred bool
}

// Edit replaces the bytes of Span with NewText.
type Edit struct {
	Span    source.Span
	NewText string
}

// Source is one host text handed to the Engine: a Markdown page, a plan
// file, or the text of one Markdown cell of a notebook. Steps in a later
// source may refer by label to steps in an earlier one (cells of one
// notebook, in order). The Engine keeps Text until it next analyses a
// source of the same Name, to compare the two: it must not change
// meanwhile.
type Source struct {
	Name string // file path or URI, used in messages only
	Kind SourceKind
	Text []byte
}

// SourceKind says how reaction lines are found in a Source's text.
type SourceKind int

const (
	MarkdownPage SourceKind = iota + 1 // fenced ```reaction blocks
	PlanFile                           // every non-blank, non-comment line
	MarkdownCell                       // one notebook cell: like MarkdownPage
)

// Report is the analysis of one Source. It is immutable once returned.
type Report struct {
	Name        string
	Steps       []StepReport
	Diagnostics []Diagnostic

	steps  []placedStep // the cached results behind Steps, for Hover and Complete
	labels []*labelDef  // labels defined up to the end of this source, in order
	dict   *dictionary  // for completion
	lines  *lineParts   // set by AnalyzeLines: Steps and Diagnostics are built by Full
}

// StepReport is what the editor shows of one step besides diagnostics.
type StepReport struct {
	Span   source.Span // the whole step line in the host
	Label  string      // "" when the step has none
	Inlay  string      // short text shown at the end of the line (predicted product or configuration)
	Tokens []Token     // parts of the line, for semantic highlighting
	Fixes  []Fix       // actions on the step not tied to a diagnostic (e.g. write the predicted product after '->')
	// Prediction is the outcome of the step; nil for a line with no
	// reaction or a substrate that could not be read.
	Prediction *Prediction
}

// Token is one classified part of a step line.
type Token struct {
	Span source.Span
	Kind TokenKind
}

// TokenKind classifies a part of a step line.
type TokenKind int

const (
	TokenLabel TokenKind = iota + 1
	TokenReference
	TokenSubstrate
	TokenReagent
	TokenSolvent
	TokenAmount
	TokenTemperature
	TokenTime
	TokenOperator // '+', ',', '->'
	TokenProduct
	TokenComment
	TokenStatus // done / skipped marks
	TokenSetup  // the vessel or set-up: "sealed tube", "microwave"
)

// Completion is one suggestion at a position in a step line.
type Completion struct {
	Label  string // what the user sees and what is inserted
	Detail string // one line (e.g. "reagent · nucleophile · [N-]=[N+]=[N-]")
	Doc    string // Markdown
	Kind   CompletionKind
	Span   source.Span // the text the completion replaces
}

// CompletionKind says what a Completion names.
type CompletionKind int

const (
	CompleteReagent CompletionKind = iota + 1
	CompleteSolvent
	CompleteLabel
)

// Config is what a lab or a user can set (from the project's settings file
// or the editor's configuration).
type Config struct {
	LabNames       []byte   // contents of the lab's own names file, if any
	LabNamesFile   string   // its path, for messages
	Disabled       []string // diagnostic codes not to report
	DefaultSolvent string   // used when a step names none ("" means the documented default)
	DefaultTempC   *float64 // used when a step gives no temperature
}
