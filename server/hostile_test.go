package server

import (
	"bufio"
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"strings"
	"testing"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
)

// Hostile input through the wire. Each test sends something a broken or
// malicious client might, then checks three things: the answer is a clear
// error, nothing the server held was lost, and the server still serves.

// Test-only methods: one that panics, one that waits to be cancelled.
func init() {
	requests["walden/testPanic"] = func(*Server, context.Context, json.RawMessage) (any, error) {
		var m map[string]int
		m["boom"]++ // a nil-map write: a real runtime panic
		return nil, nil
	}
	requests["walden/testWait"] = func(_ *Server, ctx context.Context, _ json.RawMessage) (any, error) {
		<-ctx.Done()
		return nil, ctx.Err()
	}
}

// alive checks that the server still answers and still holds uri.
func alive(t *testing.T, c *testClient, uri protocol.DocumentURI) {
	t.Helper()
	var syms json.RawMessage
	c.call("textDocument/documentSymbol", &protocol.DocumentSymbolParams{TextDocument: protocol.TextDocumentIdentifier{URI: uri}}, &syms)
	if string(syms) == "null" {
		t.Errorf("the server no longer holds %s", uri)
	}
}

func openPage(t *testing.T, c *testClient) protocol.DocumentURI {
	t.Helper()
	uri := protocol.DocumentURI("file:///lab/page.md")
	c.open(uri, "markdown", 1, "# Page\n\n```reaction\nCCBr + NaI, acetone\n```\n")
	c.diagnosticsFor(uri, 1)
	return uri
}

func TestMalformedFrames(t *testing.T) {
	for _, tc := range []struct {
		name  string
		frame string
		want  string // in the error answer
	}{
		{"malformed JSON", frame(`{"jsonrpc":"2.0","id":1,"method":"textDocument/hover","params":{`), "-32700 malformed JSON"},
		{"not an object", frame(`[1, 2, 3]`), "-32600 not a JSON-RPC message object"},
		{"wrong version", frame(`{"jsonrpc":"1.0","method":"initialized"}`), `-32600 jsonrpc is "1.0"`},
		{"bad id", frame(`{"jsonrpc":"2.0","id":{"a":1},"method":"shutdown"}`), "-32600 request id"},
		{"empty method", frame(`{"jsonrpc":"2.0","method":""}`), "-32600 method is empty"},
		{"no Content-Length", "Content-Type: application/json\r\n\r\n", "-32700 message header has no Content-Length"},
		{"bad Content-Length", "Content-Length: twelve\r\n\r\n", "-32700 bad message header"},
		{"binary body", frame("\x00\xff\xfe garbage"), "-32700 malformed JSON"},
		{"trailing data", frame(`{"jsonrpc":"2.0","id":7,"method":"shutdown"} {"more":1}`), `-32700 malformed JSON at byte 45`},
		{"response without id", frame(`{"jsonrpc":"2.0","result":{}}`), "-32600 invalid JSON-RPC message: a response without an id"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			c := start(t)
			uri := openPage(t, c)
			c.send(tc.frame)
			if got := c.waitRejected(1); !strings.Contains(got, tc.want) {
				t.Errorf("answer %q, want it to contain %q", got, tc.want)
			}
			alive(t, c, uri)
		})
	}
}

// A request with a readable id but an unreadable body is answered with its
// own id.
func TestMalformedRequestKeepsItsID(t *testing.T) {
	c := start(t)
	c.send(frame(`{"jsonrpc":"1.0","id":"raw-1","method":"textDocument/hover"}`))
	if got := c.waitReply("raw-1"); !strings.Contains(got, `"code":-32600`) {
		t.Errorf("reply %s, want InvalidRequest", got)
	}
}

func TestOversizedFrameIsSkipped(t *testing.T) {
	body := `{"jsonrpc":"2.0","method":"initialized","params":{"pad":"` + strings.Repeat("x", 2000) + `"}}`
	next := `{"jsonrpc":"2.0","method":"exit"}`
	var out bytes.Buffer
	in := strings.NewReader(frame(body) + frame(next))
	s := &stream{in: bufio.NewReader(in), out: &out, closer: io.NopCloser(nil), limit: 1000}
	msg, _, err := s.Read(context.Background())
	if err != nil {
		t.Fatal(err)
	}
	if n, ok := msg.(*jsonrpc2.Notification); !ok || n.Method() != "exit" {
		t.Errorf("after the oversized frame read %v, want the exit notification", msg)
	}
	if !strings.Contains(out.String(), "skipped: the limit is 1000 bytes") {
		t.Errorf("answer %q does not explain the skip", out.String())
	}
}

func TestUnknownMethods(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	err := c.try("walden/noSuchThing", map[string]int{}, nil)
	if rpcCode(err) != codeMethodNotFound || !strings.Contains(err.Error(), "walden/noSuchThing") {
		t.Errorf("unknown request: %v, want MethodNotFound naming the method", err)
	}
	c.notify("walden/noSuchNotification", map[string]int{})
	c.notify("$/setTrace", map[string]string{"value": "off"})
	alive(t, c, uri)
}

func TestInvalidParams(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	err := c.try("textDocument/hover", json.RawMessage(`{"textDocument":{"uri":"file:///lab/page.md"},"position":{"line":-1,"character":0}}`), nil)
	if rpcCode(err) != codeInvalidParams {
		t.Errorf("negative line: %v, want InvalidParams", err)
	}
	err = c.try("textDocument/hover", json.RawMessage(`"just a string"`), nil)
	if rpcCode(err) != codeInvalidParams {
		t.Errorf("string params: %v, want InvalidParams", err)
	}
	alive(t, c, uri)
}

func TestOutOfRangePositions(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	doc := protocol.TextDocumentIdentifier{URI: uri}
	err := c.try("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
		TextDocument: doc, Position: protocol.Position{Line: 500, Character: 3}}}, nil)
	if rpcCode(err) != codeInvalidParams || !strings.Contains(err.Error(), "outside the document") {
		t.Errorf("hover at line 500: %v, want InvalidParams saying the position is outside the document", err)
	}
	// "If the character value is greater than the line length it defaults
	// back to the line length." (LSP 3.17, Position)
	if err := c.try("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
		TextDocument: doc, Position: protocol.Position{Line: 3, Character: 9999}}}, nil); err != nil {
		t.Errorf("hover past the end of a line: %v, want an answer", err)
	}
	err = c.try(methodInlayHint, &inlayHintParams{TextDocument: doc, Range: protocol.Range{
		Start: protocol.Position{Line: 2}, End: protocol.Position{Line: 1}}}, nil)
	if rpcCode(err) != codeInvalidParams {
		t.Errorf("backwards range: %v, want InvalidParams", err)
	}
	// An edit outside the text is applied at the nearest place and the
	// client is told.
	c.change(uri, 2, contentChange{Range: &protocol.Range{Start: protocol.Position{Line: 90}, End: protocol.Position{Line: 91}}, Text: "x"})
	c.waitLog("outside the document")
	c.diagnosticsFor(uri, 2)
	if got := textOf(c, uri); !strings.HasSuffix(got, "```\nx") {
		t.Errorf("text after the clamped edit ends %q, want the edit at the end", got[max(0, len(got)-10):])
	}
	alive(t, c, uri)
}

func textOf(c *testClient, uri protocol.DocumentURI) string {
	c.srv.mu.Lock()
	defer c.srv.mu.Unlock()
	if d := c.srv.texts[uri]; d != nil {
		return string(d.text())
	}
	return ""
}

func versionOf(c *testClient, uri protocol.DocumentURI) int32 {
	c.srv.mu.Lock()
	defer c.srv.mu.Unlock()
	if d := c.srv.texts[uri]; d != nil {
		return d.version
	}
	return -1
}

func TestChangesForUnopenedDocuments(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	ghost := protocol.DocumentURI("file:///lab/ghost.md")
	c.change(ghost, 2, contentChange{Text: "boo"})
	if l := c.waitLog("ghost.md, which is not open"); l.Type != protocol.MessageTypeError {
		t.Errorf("message type %v, want Error", l.Type)
	}
	c.notify("textDocument/didClose", &protocol.DidCloseTextDocumentParams{TextDocument: protocol.TextDocumentIdentifier{URI: ghost}})
	c.waitLog("close of file:///lab/ghost.md, which is not open")
	c.notify(methodNotebookDidChange, &didChangeNotebookParams{NotebookDocument: versionedNotebookID{URI: "file:///lab/none.ipynb", Version: 2}})
	c.waitLog("notebook file:///lab/none.ipynb, which is not open")
	if p := c.published(ghost); len(p) != 0 {
		t.Errorf("diagnostics published for a document never opened: %+v", p)
	}
	alive(t, c, uri)
}

func TestOutOfOrderVersions(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	c.change(uri, 3, contentChange{Text: "# version three\n"})
	c.diagnosticsFor(uri, 3)
	c.change(uri, 2, contentChange{Text: "# version two, late\n"})
	c.waitLog("version 2 of file:///lab/page.md arrived after version 3")
	c.change(uri, 3, contentChange{Text: "# version three again\n"})
	c.waitLog("version 3 of file:///lab/page.md arrived after version 3")
	if v, text := versionOf(c, uri), textOf(c, uri); v != 3 || text != "# version three\n" {
		t.Errorf("document at version %d holding %q, want version 3 unchanged", v, text)
	}
	for _, p := range c.published(uri) {
		if p.Version != nil && *p.Version == 2 {
			t.Errorf("diagnostics published for the late version 2")
		}
	}
	alive(t, c, uri)
}

func TestPanicInHandlerIsRecovered(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	err := c.try("walden/testPanic", map[string]int{}, nil)
	if rpcCode(err) != codeInternalError || !strings.Contains(err.Error(), "assignment to entry in nil map") {
		t.Errorf("panicking request: %v, want InternalError naming the panic", err)
	}
	alive(t, c, uri)
}

// "$/cancelRequest": the request's context ends and its answer is the
// RequestCancelled error.
func TestCancelRequest(t *testing.T) {
	c := start(t)
	uri := openPage(t, c)
	for _, id := range []string{`"raw-wait"`, `7001`} {
		c.send(frame(fmt.Sprintf(`{"jsonrpc":"2.0","id":%s,"method":"walden/testWait","params":{}}`, id)))
		c.send(frame(fmt.Sprintf(`{"jsonrpc":"2.0","method":"$/cancelRequest","params":{"id":%s}}`, id)))
	}
	if got := c.waitReply("raw-wait"); !strings.Contains(got, `"code":-32800`) {
		t.Errorf("cancelled request answered %s, want RequestCancelled", got)
	}
	// A cancel for a request that is not running is harmless.
	c.notify("$/cancelRequest", map[string]any{"id": 424242})
	alive(t, c, uri)
}

// A 10 MB page opens, is analysed, can be edited and queried: a page of
// prose with reaction blocks, and a plan file that is one 10 MB line.
func TestTenMegabyteDocument(t *testing.T) {
	if testing.Short() {
		t.Skip("10 MB document: skipped in -short mode")
	}
	var page strings.Builder
	page.WriteString("# A very long page\n\n```reaction\nCC(C)CBr + NaI, acetone, 25 °C\n```\n\n")
	for page.Len() < 10<<20 {
		page.WriteString("The bromide was stirred with sodium iodide in acetone; a white solid came out of solution within minutes.\n\n")
	}
	page.WriteString("```reaction\nCCI + NaCN, DMSO, 40 °C\n```\n")
	line := strings.Repeat("C", 10<<20) + "Br + NaI, acetone\n"
	for _, tc := range []struct {
		uri  protocol.DocumentURI
		lang string
		text string
	}{
		{"file:///lab/huge.md", "markdown", page.String()},
		{"file:///lab/huge.steps", PlanLanguageID, line},
	} {
		t.Run(string(tc.uri), func(t *testing.T) {
			c := start(t)
			uri := tc.uri
			lines := uint32(strings.Count(tc.text, "\n"))
			c.open(uri, tc.lang, 1, tc.text)
			c.diagnosticsFor(uri, 1)
			insert := "CCI + NaCN, DMSO\n"
			c.change(uri, 2, contentChange{Range: &protocol.Range{Start: protocol.Position{Line: lines / 2}, End: protocol.Position{Line: lines / 2}}, Text: insert})
			c.diagnosticsFor(uri, 2)
			var hover json.RawMessage
			c.call("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
				TextDocument: protocol.TextDocumentIdentifier{URI: uri}, Position: protocol.Position{Line: lines - 1, Character: 2}}}, &hover)
			if got, want := len(textOf(c, uri)), len(tc.text)+len(insert); got != want {
				t.Errorf("document holds %d bytes, want %d", got, want)
			}
			alive(t, c, uri)
		})
	}
}
