package server

import (
	"encoding/json"
	"strings"
	"testing"
	"time"

	"go.lsp.dev/protocol"
)

// These tests drive the server end to end over net.Pipe through the real
// jsonrpc2 stack, as an editor would. Expected behaviour is the LSP 3.17
// specification's, quoted beside each check.

func TestInitializeAdvertisesCapabilities(t *testing.T) {
	c := newClient(t, Options{Version: "1.2.3"})
	res := c.initialize(nil)
	if res.ServerInfo == nil || res.ServerInfo.Name != "walden" || res.ServerInfo.Version != "1.2.3" {
		t.Errorf("serverInfo = %+v, want walden 1.2.3", res.ServerInfo)
	}
}

func TestCapabilitiesOnTheWire(t *testing.T) {
	c := newClient(t, Options{})
	var res struct {
		Capabilities map[string]json.RawMessage `json:"capabilities"`
	}
	c.call("initialize", map[string]any{"capabilities": map[string]any{}}, &res)
	for _, member := range []string{"textDocumentSync", "hoverProvider", "completionProvider", "codeActionProvider",
		"documentSymbolProvider", "semanticTokensProvider", "inlayHintProvider", "notebookDocumentSync", "positionEncoding"} {
		if _, ok := res.Capabilities[member]; !ok {
			t.Errorf("capabilities lack %s", member)
		}
	}
	var sync struct {
		Change int `json:"change"`
	}
	_ = json.Unmarshal(res.Capabilities["textDocumentSync"], &sync)
	if sync.Change != 2 { // TextDocumentSyncKind.Incremental
		t.Errorf("textDocumentSync.change = %d, want 2 (incremental)", sync.Change)
	}
	if !strings.Contains(string(res.Capabilities["semanticTokensProvider"]), `"legend"`) {
		t.Errorf("semanticTokensProvider has no legend: %s", res.Capabilities["semanticTokensProvider"])
	}
	for _, unimplemented := range []string{"definitionProvider", "renameProvider", "documentFormattingProvider"} {
		if _, ok := res.Capabilities[unimplemented]; ok {
			t.Errorf("capabilities advertise %s, which walden does not implement", unimplemented)
		}
	}
}

// Every advertised feature has a handler, and every handler is advertised.
func TestCapabilitiesMatchHandlers(t *testing.T) {
	caps := map[string]bool{
		"textDocument/hover":          true,
		"textDocument/completion":     true,
		"textDocument/codeAction":     true,
		"textDocument/documentSymbol": true,
		methodSemanticTokensFull:      true,
		methodSemanticTokensRange:     true,
		methodInlayHint:               true,
		"initialize":                  true,
		"shutdown":                    true,
	}
	for m := range requests {
		if !caps[m] && !strings.HasPrefix(m, "walden/test") {
			t.Errorf("request %s is handled but not advertised", m)
		}
	}
	for m := range caps {
		if requests[m] == nil {
			t.Errorf("request %s is advertised but has no handler", m)
		}
	}
	a := advertised()
	if a.HoverProvider != true || a.CompletionProvider == nil || a.CodeActionProvider == nil ||
		a.DocumentSymbolProvider != true || a.SemanticTokensProvider == nil || a.InlayHintProvider == nil ||
		a.NotebookDocumentSync == nil {
		t.Errorf("advertised() misses a handled feature: %+v", a)
	}
	for _, n := range []string{"textDocument/didOpen", "textDocument/didChange", "textDocument/didClose", "textDocument/didSave",
		methodNotebookDidOpen, methodNotebookDidChange, methodNotebookDidSave, methodNotebookDidClose,
		"workspace/didChangeConfiguration", "initialized"} {
		if notifications[n] == nil {
			t.Errorf("notification %s has no handler", n)
		}
	}
}

func TestSecondInitializeIsRefused(t *testing.T) {
	c := start(t)
	err := c.try("initialize", map[string]any{"capabilities": map[string]any{}}, nil)
	if rpcCode(err) != codeInvalidRequest {
		t.Errorf("second initialize: %v, want InvalidRequest", err)
	}
}

// "If the server receives a request or notification before the initialize
// request it should act as follows: for a request the response should be an
// error with code: -32002."
func TestRequestBeforeInitialize(t *testing.T) {
	c := newClient(t, Options{})
	err := c.try("textDocument/hover", &protocol.HoverParams{}, nil)
	if rpcCode(err) != codeServerNotInitialized {
		t.Errorf("hover before initialize: %v, want -32002", err)
	}
	c.initialize(nil) // the server is still there
}

// "The server should exit with success code 0 if the shutdown request has
// been received before; otherwise with error code 1."
func TestExitAfterShutdownIsZero(t *testing.T) {
	c := start(t)
	c.call("shutdown", nil, nil)
	// "If a server receives requests after a shutdown request those
	// requests should error with InvalidRequest."
	if err := c.try("textDocument/hover", &protocol.HoverParams{}, nil); rpcCode(err) != codeInvalidRequest {
		t.Errorf("hover after shutdown: %v, want InvalidRequest", err)
	}
	c.notify("exit", nil)
	if code := waitExit(t, c); code != 0 {
		t.Errorf("exit code %d, want 0", code)
	}
}

func TestExitWithoutShutdownIsOne(t *testing.T) {
	c := start(t)
	c.notify("exit", nil)
	if code := waitExit(t, c); code != 1 {
		t.Errorf("exit code %d, want 1", code)
	}
}

func TestStreamEndWithoutExitIsOne(t *testing.T) {
	c := start(t)
	c.conn.Close()
	if code := waitExit(t, c); code != 1 {
		t.Errorf("exit code %d, want 1", code)
	}
}

func waitExit(t *testing.T, c *testClient) int {
	t.Helper()
	select {
	case code := <-c.exit:
		c.exit <- code // for the cleanup
		return code
	case <-time.After(waitTimeout):
		t.Fatal("server did not exit")
		return -1
	}
}

// Diagnostics are published for each version, carrying that version.
func TestDiagnosticsCarryVersion(t *testing.T) {
	c := start(t)
	uri := protocol.DocumentURI("file:///lab/plan.md")
	c.open(uri, "markdown", 1, "# Plan\n\n```reaction\nCCBr + NaI, acetone\n```\n")
	c.diagnosticsFor(uri, 1)
	c.change(uri, 2, contentChange{Range: &protocol.Range{
		Start: protocol.Position{Line: 3, Character: 4}, End: protocol.Position{Line: 3, Character: 4}}, Text: "C"})
	c.diagnosticsFor(uri, 2)
	c.change(uri, 3, contentChange{Text: "# Plan\n"})
	c.diagnosticsFor(uri, 3)
	for _, p := range c.published(uri) {
		if p.Diagnostics == nil {
			t.Errorf("version %v published null diagnostics; want a list", p.Version)
		}
	}
}

// Closing a document clears its diagnostics.
func TestCloseClearsDiagnostics(t *testing.T) {
	c := start(t)
	uri := protocol.DocumentURI("file:///lab/plan.steps")
	c.open(uri, PlanLanguageID, 1, "CCBr + NaI, acetone\n")
	c.diagnosticsFor(uri, 1)
	n := len(c.published(uri))
	c.notify("textDocument/didClose", &protocol.DidCloseTextDocumentParams{TextDocument: protocol.TextDocumentIdentifier{URI: uri}})
	c.waitFor("cleared diagnostics", func() bool {
		var last *publishDiagnosticsParams
		count := 0
		for i := range c.diags {
			if c.diags[i].URI == uri {
				last = &c.diags[i]
				count++
			}
		}
		return count > n && last.Version == nil && len(last.Diagnostics) == 0
	})
}

// Requests on documents walden does not read get empty answers, not errors.
func TestUnanalysedDocumentGetsNull(t *testing.T) {
	c := start(t)
	uri := protocol.DocumentURI("file:///lab/notes.txt")
	c.open(uri, "plaintext", 1, "just text\n")
	var hover *protocol.Hover
	c.call("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
		TextDocument: protocol.TextDocumentIdentifier{URI: uri}}}, &hover)
	if hover != nil {
		t.Errorf("hover on a text file = %+v, want null", hover)
	}
}

// Every request walden answers works on an open page without error.
func TestEveryRequestAnswers(t *testing.T) {
	c := start(t)
	uri := protocol.DocumentURI("file:///lab/plan.md")
	c.open(uri, "markdown", 1, "```reaction\nCCBr + NaI, acetone\n```\n")
	c.diagnosticsFor(uri, 1)
	doc := protocol.TextDocumentIdentifier{URI: uri}
	pos := protocol.TextDocumentPositionParams{TextDocument: doc, Position: protocol.Position{Line: 1, Character: 2}}
	whole := protocol.Range{End: protocol.Position{Line: 3}}
	for method, params := range map[string]any{
		"textDocument/hover":          &protocol.HoverParams{TextDocumentPositionParams: pos},
		"textDocument/completion":     &protocol.CompletionParams{TextDocumentPositionParams: pos},
		"textDocument/codeAction":     &protocol.CodeActionParams{TextDocument: doc, Range: whole},
		"textDocument/documentSymbol": &protocol.DocumentSymbolParams{TextDocument: doc},
		methodSemanticTokensFull:      &protocol.SemanticTokensParams{TextDocument: doc},
		methodSemanticTokensRange:     &protocol.SemanticTokensRangeParams{TextDocument: doc, Range: whole},
		methodInlayHint:               &inlayHintParams{TextDocument: doc, Range: whole},
	} {
		var out json.RawMessage
		if err := c.try(method, params, &out); err != nil {
			t.Errorf("%s: %v", method, err)
		}
	}
}
