package server

import (
	"context"
	"strings"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

// Code actions (LSP 3.17, "Code Action Request"): analyze's fixes as
// edits. A fix attached to a diagnostic in the requested range is a
// quick fix carrying that diagnostic (swap a protic solvent, insert an
// activation step, replace an unknown name with the closest known one,
// replace a mismatched product); a fix attached to a step (write the
// predicted product after '->') is a rewrite of that step.

func init() {
	requests["textDocument/codeAction"] = request((*Server).codeAction)
}

// stepFixKind is the kind of a step's own fixes.
const stepFixKind protocol.CodeActionKind = "refactor.rewrite"

// codeActionKinds are the kinds walden offers, advertised at initialize.
var codeActionKinds = []protocol.CodeActionKind{protocol.QuickFix, stepFixKind}

func (s *Server) codeAction(ctx context.Context, p *protocol.CodeActionParams) (any, error) {
	t, ok, err := targetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	within, err := t.within(p.Range)
	if err != nil {
		return nil, err
	}
	actions := []protocol.CodeAction{}
	if wanted(p.Context.Only, protocol.QuickFix) {
		for i := range t.rep.Diagnostics {
			f := &t.rep.Diagnostics[i]
			if !overlaps(f.Span, within) {
				continue
			}
			diag := lspDiagnostic(t.doc, f)
			for _, fix := range f.Fixes {
				a := t.action(fix, protocol.QuickFix)
				a.Diagnostics = []protocol.Diagnostic{diag}
				actions = append(actions, a)
			}
		}
	}
	if wanted(p.Context.Only, stepFixKind) {
		for _, st := range t.rep.Steps {
			if !overlaps(st.Span, within) {
				continue
			}
			for _, fix := range st.Fixes {
				actions = append(actions, t.action(fix, stepFixKind))
			}
		}
	}
	return actions, nil
}

// action converts one fix.
func (t target) action(fix analyze.Fix, kind protocol.CodeActionKind) protocol.CodeAction {
	edits := make([]protocol.TextEdit, len(fix.Edits))
	for i, e := range fix.Edits {
		edits[i] = protocol.TextEdit{Range: lspRange(t.doc.mapper, e.Span), NewText: e.NewText}
	}
	return protocol.CodeAction{
		Title:       fix.Title,
		Kind:        kind,
		IsPreferred: fix.Preferred,
		Edit:        &protocol.WorkspaceEdit{Changes: map[protocol.DocumentURI][]protocol.TextEdit{t.doc.uri: edits}},
	}
}

// wanted reports whether kind passes the client's "only" filter. Kinds are
// hierarchical: "refactor" admits "refactor.rewrite" (LSP 3.17,
// CodeActionKind).
func wanted(only []protocol.CodeActionKind, kind protocol.CodeActionKind) bool {
	if len(only) == 0 {
		return true
	}
	for _, o := range only {
		if o == kind || strings.HasPrefix(string(kind), string(o)+".") {
			return true
		}
	}
	return false
}
