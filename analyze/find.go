package analyze

import (
	"walden/grammar/notebook"
)

// foundLine is one step line of a source: where it lies in the host
// (Span). Its text is the host's bytes there; the Engine copies them only
// for a line it has not seen before.
type foundLine = notebook.Line

// findLines finds the step lines of a source, with the finder's errors
// (unterminated fences, binary text) as diagnostics.
func findLines(s Source) ([]foundLine, []Diagnostic) {
	f := notebook.Markdown
	if s.Kind == PlanFile {
		f = notebook.Plan
	}
	pg := notebook.Find(f, s.Text)
	var diags []Diagnostic
	for _, e := range pg.Errors {
		code := e.Code
		if code == "" {
			code = CodeSyntax
		}
		diags = append(diags, Diagnostic{Code: code, Severity: Error, Message: e.Msg, Span: e.Span})
	}
	return pg.Lines, diags
}
