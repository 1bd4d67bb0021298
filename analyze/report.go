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
