package server

import (
	"context"
	"fmt"
	"strings"

	"go.lsp.dev/protocol"

	"walden/analyze"
	"walden/grammar/source"
)

// Document symbols (LSP 3.17, "Document Symbols Request"): the steps of a
// page, named by their label or, for an unlabelled step, by the start of
// its line, with the predicted product as detail. Editors show them as
// the page's outline.

func init() {
	requests["textDocument/documentSymbol"] = request((*Server).documentSymbol)
}

// symbolNameLen is how much of an unlabelled step's line names it.
const symbolNameLen = 48

func (s *Server) documentSymbol(ctx context.Context, p *protocol.DocumentSymbolParams) (any, error) {
	t, ok, err := targetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	syms := make([]protocol.DocumentSymbol, 0, len(t.rep.Steps))
	for i, st := range t.rep.Steps {
		whole := lspRange(t.doc.mapper, st.Span)
		whole.End = lspPosition(t.doc.mapper, lineEnd(t.doc, st.Span))
		sel := whole
		if sp, ok := labelSpan(st); ok {
			sel = lspRange(t.doc.mapper, sp)
		}
		syms = append(syms, protocol.DocumentSymbol{
			Name:           stepName(t.doc, st, i),
			Detail:         st.Inlay,
			Kind:           protocol.SymbolKindEvent,
			Range:          whole,
			SelectionRange: sel,
		})
	}
	return syms, nil
}

// labelSpan returns where a step's label is written.
func labelSpan(st analyze.StepReport) (sp source.Span, ok bool) {
	for _, tok := range st.Tokens {
		if tok.Kind == analyze.TokenLabel {
			return tok.Span, true
		}
	}
	return sp, false
}

// stepName is a step's name in the outline; never empty, as the
// specification requires.
func stepName(d *document, st analyze.StepReport, i int) string {
	if st.Label != "" {
		return st.Label
	}
	end := lineEnd(d, st.Span)
	start := min(max(st.Span.Start, 0), end)
	text := strings.Join(strings.Fields(string(d.text()[start:end])), " ")
	if r := []rune(text); len(r) > symbolNameLen {
		text = string(r[:symbolNameLen]) + "…"
	}
	if text == "" {
		return fmt.Sprintf("step %d", i+1)
	}
	return text
}
