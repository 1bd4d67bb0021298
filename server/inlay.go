package server

import (
	"context"
)

// Inlay hints (LSP 3.17, "Inlay Hint Request"): the predicted product or
// configuration shown at the end of each step line. protocol v0.12.0
// predates inlay hints, so the types are walden's own (lsp317.go).

func init() {
	requests[methodInlayHint] = request((*Server).inlayHint)
}

func (s *Server) inlayHint(ctx context.Context, p *inlayHintParams) (any, error) {
	t, ok, err := targetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	within, err := t.within(p.Range)
	if err != nil {
		return nil, err
	}
	hints := []inlayHint{}
	for _, st := range t.rep.Steps {
		if st.Inlay == "" || !overlaps(st.Span, within) {
			continue
		}
		hints = append(hints, inlayHint{
			Position:    lspPosition(t.doc.mapper, lineEnd(t.doc, st.Span)),
			Label:       st.Inlay,
			Kind:        inlayHintKindType,
			PaddingLeft: true,
		})
	}
	return hints, nil
}
