package server

import (
	"context"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

// Completion (LSP 3.17, "Completion Request"): reagent and solvent names
// with their data as documentation, and step labels where a reference to
// an earlier step is expected. Each item replaces the partial word analyze
// reports, so the editor does not have to guess word boundaries in SMILES.

func init() {
	requests["textDocument/completion"] = request((*Server).completion)
}

// completionKinds maps what a suggestion names to the LSP item kind whose
// icon suits it best.
var completionKinds = map[analyze.CompletionKind]protocol.CompletionItemKind{
	analyze.CompleteReagent: protocol.CompletionItemKindValue,
	analyze.CompleteSolvent: protocol.CompletionItemKindConstant,
	analyze.CompleteLabel:   protocol.CompletionItemKindReference,
}

func (s *Server) completion(ctx context.Context, p *protocol.CompletionParams) (any, error) {
	t, ok, err := pointTargetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	pos, err := t.at(p.Position)
	if err != nil {
		return nil, err
	}
	list := &protocol.CompletionList{Items: []protocol.CompletionItem{}}
	for _, c := range t.rep.Complete(pos) {
		item := protocol.CompletionItem{
			Label:    c.Label,
			Kind:     completionKinds[c.Kind],
			Detail:   c.Detail,
			TextEdit: &protocol.TextEdit{Range: lspRange(t.doc.mapper, c.Span), NewText: c.Label},
		}
		if c.Doc != "" {
			item.Documentation = protocol.MarkupContent{Kind: protocol.Markdown, Value: c.Doc}
		}
		list.Items = append(list.Items, item)
	}
	return list, nil
}
