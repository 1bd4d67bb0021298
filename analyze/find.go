package analyze

import (
	"bytes"

	"walden/grammar/notebook"
)

// foundLine is one step line of a source: where it lies in the host
// (Span). Its text is the host's bytes there; the Engine copies them only
// for a line it has not seen before.
type foundLine = notebook.Line

// lastFound is what the Engine found in a source on its last call: a
// text edited inside one step line is found from it (notebook.Edited)
// instead of being read again.
type lastFound struct {
	kind SourceKind
	text []byte
	page *notebook.Page
	ents []*lineEntry // the entry of each of page.Lines, once looked up
}

// same returns the entry of line a or b of the last call (of was, its
// lines) if that line's text is text, and the entry is still cached.
func (lf *lastFound) same(was []foundLine, text []byte, a, b int) *lineEntry {
	for _, k := range [2]int{a, b} {
		if k < 0 || k >= len(was) {
			continue
		}
		if ent := lf.ents[k]; !ent.evicted && bytes.Equal(text, lf.text[was[k].Span.Start:was[k].Span.End]) {
			return ent
		}
	}
	return nil
}

// maxLastFound is how many sources' last pages the Engine keeps: the
// documents open in an editor, with room to spare.
const maxLastFound = 64

// findLines finds the step lines of a source (the page's Lines), with
// the finder's errors (unterminated fences, binary text) as diagnostics,
// and returns what was found in the source on the Engine's last call, if
// anything.
func (e *Engine) findLines(s Source) (*notebook.Page, []Diagnostic, lastFound) {
	e.mu.Lock()
	last, seen := e.lastFound[s.Name]
	e.mu.Unlock()
	var pg *notebook.Page
	// A text changed in place in the same array cannot be compared with
	// what it was.
	if seen && last.kind == s.Kind && (len(s.Text) == 0 || len(last.text) == 0 || &s.Text[0] != &last.text[0]) {
		pg, _ = notebook.Edited(last.page, last.text, s.Text)
	}
	if pg == nil {
		f := notebook.Markdown
		if s.Kind == PlanFile {
			f = notebook.Plan
		}
		pg = notebook.Find(f, s.Text)
	}
	e.mu.Lock()
	if len(e.lastFound) >= maxLastFound {
		clear(e.lastFound)
	}
	e.lastFound[s.Name] = lastFound{kind: s.Kind, text: s.Text, page: pg}
	e.mu.Unlock()
	var diags []Diagnostic
	for _, er := range pg.Errors {
		code := er.Code
		if code == "" {
			code = CodeSyntax
		}
		diags = append(diags, Diagnostic{Code: code, Severity: Error, Message: er.Msg, Span: er.Span})
	}
	if !seen || last.kind != s.Kind {
		last = lastFound{}
	}
	return pg, diags, last
}

// keepEntries records ents, the entries of the lines of pg, as found in
// source name, unless another call has found the source since.
func (e *Engine) keepEntries(name string, pg *notebook.Page, ents []*lineEntry) {
	if lf, ok := e.lastFound[name]; ok && lf.page == pg {
		lf.ents = ents
		e.lastFound[name] = lf
	}
}
