package server

import (
	"context"

	"go.lsp.dev/protocol"
)

// Hover (LSP 3.17, "Hover Request"): the Markdown that analyze writes for
// the step, substance or atom under the cursor, with the range it covers.

func init() {
	requests["textDocument/hover"] = request((*Server).hover)
}

func (s *Server) hover(ctx context.Context, p *protocol.HoverParams) (any, error) {
	t, ok, err := pointTargetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	pos, err := t.at(p.Position)
	if err != nil {
		return nil, err
	}
	md, sp, ok := t.rep.Hover(pos)
	if !ok {
		return nil, nil
	}
	r := lspRange(t.doc.mapper, sp)
	return &protocol.Hover{Contents: protocol.MarkupContent{Kind: protocol.Markdown, Value: md}, Range: &r}, nil
}
