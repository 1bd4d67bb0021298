package server

import (
	"go.lsp.dev/protocol"

	"walden/analyze"
)

// Diagnostics (LSP 3.17, "PublishDiagnostics Notification"): each of a
// report's findings becomes an LSP Diagnostic with its stable code, its
// severity, the range of the responsible token, related information
// pointing at the other party (the base that will eliminate, say) and
// the Unnecessary tag where the marked text has no effect. publish.go
// sends them.

// diagnosticSource names walden as the producer of its diagnostics.
const diagnosticSource = "walden"

// lspSeverity converts analyze's severities, which match no protocol on
// purpose.
func lspSeverity(s analyze.Severity) protocol.DiagnosticSeverity {
	switch s {
	case analyze.Error:
		return protocol.DiagnosticSeverityError
	case analyze.Warning:
		return protocol.DiagnosticSeverityWarning
	case analyze.Info:
		return protocol.DiagnosticSeverityInformation
	}
	return protocol.DiagnosticSeverityHint
}

// lspDiagnostic converts one finding in document d.
func lspDiagnostic(d *document, f *analyze.Diagnostic) protocol.Diagnostic {
	out := protocol.Diagnostic{
		Range:    lspRange(d.mapper, f.Span),
		Severity: lspSeverity(f.Severity),
		Source:   diagnosticSource,
		Message:  f.Message,
	}
	if f.Code != "" {
		out.Code = f.Code
	}
	for _, r := range f.Related {
		out.RelatedInformation = append(out.RelatedInformation, protocol.DiagnosticRelatedInformation{
			Location: protocol.Location{URI: d.uri, Range: lspRange(d.mapper, r.Span)},
			Message:  r.Message,
		})
	}
	if f.Unneeded {
		out.Tags = []protocol.DiagnosticTag{protocol.DiagnosticTagUnnecessary}
	}
	return out
}

// lspDiagnostics converts every finding of r, never returning nil: an
// empty list is how the client learns a version has no problems.
func lspDiagnostics(d *document, r *analyze.Report) []protocol.Diagnostic {
	out := make([]protocol.Diagnostic, 0, len(r.Diagnostics))
	for i := range r.Diagnostics {
		out = append(out, lspDiagnostic(d, &r.Diagnostics[i]))
	}
	return out
}
