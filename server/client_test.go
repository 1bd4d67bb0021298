package server

import (
	"bufio"
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"log/slog"
	"net"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	segjson "github.com/segmentio/encoding/json"
	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
)

// testClient is an LSP client over the real jsonrpc2 stack, connected to a
// Server through net.Pipe. It records every notification the server
// sends and every error response with id null (the answers to frames the
// server could not read), which jsonrpc2's own reader would refuse.
type testClient struct {
	t    testing.TB
	conn jsonrpc2.Conn
	raw  *clientStream // the client's end, for hand-written frames
	exit chan int      // Serve's exit code

	mu       sync.Mutex
	changed  chan struct{} // closed and replaced whenever something arrives
	diags    []publishDiagnosticsParams
	logs     []protocol.LogMessageParams
	rejected []string                   // error messages answering unreadable frames
	replies  map[string]json.RawMessage // responses to hand-written requests, by their "raw-…" id

	srv *Server

	// light makes the client note publishDiagnostics by uri and version
	// only, without decoding the diagnostics, so that benchmarks time the
	// server rather than the client's JSON decoder.
	light bool
}

// waitTimeout bounds every wait, so a broken server fails a test instead
// of hanging it.
const waitTimeout = 20 * time.Second

// testLogger sends the server's log to the test's log.
func testLogger(t testing.TB) *slog.Logger {
	return slog.New(slog.NewTextHandler(testWriter{t}, &slog.HandlerOptions{Level: slog.LevelWarn}))
}

type testWriter struct{ t testing.TB }

func (w testWriter) Write(p []byte) (int, error) {
	w.t.Helper()
	w.t.Log(strings.TrimRight(string(p), "\n"))
	return len(p), nil
}

// newClient starts a server and connects a client to it, without
// initializing.
func newClient(t testing.TB, opts Options) *testClient {
	t.Helper()
	if opts.Log == nil {
		opts.Log = testLogger(t)
	}
	if opts.ReadFile == nil {
		opts.ReadFile = func(path string) ([]byte, error) { return nil, fmt.Errorf("open %s: no such file", path) }
	}
	srvEnd, cliEnd := net.Pipe()
	srv := New(opts)
	ctx, cancel := context.WithCancel(context.Background())
	exit := make(chan int, 1)
	go func() { exit <- srv.Serve(ctx, srvEnd) }()
	c := connect(t, cliEnd, cliEnd)
	c.srv, c.exit = srv, exit
	t.Cleanup(func() {
		cancel()
		c.conn.Close()
		select {
		case <-c.exit:
		case <-time.After(waitTimeout):
			t.Error("server did not stop")
		}
	})
	return c
}

// connect returns a client speaking on in and out.
func connect(t testing.TB, in io.Reader, out io.WriteCloser) *testClient {
	c := &testClient{t: t, changed: make(chan struct{}), replies: map[string]json.RawMessage{}}
	c.raw = &clientStream{c: c, in: bufio.NewReaderSize(in, 1<<20), out: out}
	c.conn = jsonrpc2.NewConn(c.raw)
	c.conn.Go(context.Background(), c.handle)
	return c
}

// start returns an initialized client.
func start(t testing.TB) *testClient {
	t.Helper()
	c := newClient(t, Options{})
	c.initialize(nil)
	return c
}

func (c *testClient) initialize(initOptions any) initializeResult {
	c.t.Helper()
	var res initializeResult
	params := map[string]any{"processId": 1, "rootUri": nil, "capabilities": map[string]any{}}
	if initOptions != nil {
		params["initializationOptions"] = initOptions
	}
	c.call("initialize", params, &res)
	c.notify("initialized", map[string]any{})
	return res
}

// call sends a request and fails the test on an error reply.
func (c *testClient) call(method string, params, result any) {
	c.t.Helper()
	if err := c.try(method, params, result); err != nil {
		c.t.Fatalf("%s: %v", method, err)
	}
}

// try sends a request and returns its error reply.
func (c *testClient) try(method string, params, result any) error {
	ctx, cancel := context.WithTimeout(context.Background(), waitTimeout)
	defer cancel()
	_, err := c.conn.Call(ctx, method, params, result)
	return err
}

func (c *testClient) notify(method string, params any) {
	c.t.Helper()
	if err := c.conn.Notify(context.Background(), method, params); err != nil {
		c.t.Fatalf("%s: %v", method, err)
	}
}

// send writes one hand-made frame.
func (c *testClient) send(frame string) {
	c.t.Helper()
	c.raw.mu.Lock()
	defer c.raw.mu.Unlock()
	if _, err := io.WriteString(c.raw.out, frame); err != nil {
		c.t.Fatalf("writing frame: %v", err)
	}
}

// frame wraps body in a Content-Length header.
func frame(body string) string { return fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(body), body) }

func (c *testClient) handle(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
	c.mu.Lock()
	switch req.Method() {
	case "textDocument/publishDiagnostics":
		var p publishDiagnosticsParams
		if err := segjson.Unmarshal(req.Params(), &p); err != nil {
			c.t.Errorf("publishDiagnostics params: %v", err)
		}
		c.diags = append(c.diags, p)
	case "window/logMessage", "window/showMessage":
		var p protocol.LogMessageParams
		_ = json.Unmarshal(req.Params(), &p)
		c.logs = append(c.logs, p)
	}
	c.signal()
	c.mu.Unlock()
	return reply(ctx, nil, nil)
}

// signal wakes waiters; the caller holds c.mu.
func (c *testClient) signal() {
	close(c.changed)
	c.changed = make(chan struct{})
}

// waitFor waits until cond, evaluated under c.mu, holds.
func (c *testClient) waitFor(what string, cond func() bool) {
	c.t.Helper()
	deadline := time.After(waitTimeout)
	for {
		c.mu.Lock()
		ok, ch := cond(), c.changed
		c.mu.Unlock()
		if ok {
			return
		}
		select {
		case <-ch:
		case <-deadline:
			c.t.Fatalf("timed out waiting for %s", what)
		}
	}
}

// diagnosticsFor waits for diagnostics of uri at version and returns them.
func (c *testClient) diagnosticsFor(uri protocol.DocumentURI, version int32) []protocol.Diagnostic {
	c.t.Helper()
	var got []protocol.Diagnostic
	c.waitFor(fmt.Sprintf("diagnostics of %s version %d", uri, version), func() bool {
		for i := len(c.diags) - 1; i >= 0; i-- {
			d := c.diags[i]
			if d.URI == uri && d.Version != nil && *d.Version == version {
				got = d.Diagnostics
				return true
			}
		}
		return false
	})
	return got
}

// published returns every publication for uri so far, in order.
func (c *testClient) published(uri protocol.DocumentURI) []publishDiagnosticsParams {
	c.mu.Lock()
	defer c.mu.Unlock()
	var out []publishDiagnosticsParams
	for _, d := range c.diags {
		if d.URI == uri {
			out = append(out, d)
		}
	}
	return out
}

// waitReply waits for the response to the hand-written request id.
func (c *testClient) waitReply(id string) string {
	c.t.Helper()
	var got string
	c.waitFor("the reply to "+id, func() bool {
		r, ok := c.replies[id]
		got = string(r)
		return ok
	})
	return got
}

// waitLog waits for a window/logMessage containing text.
func (c *testClient) waitLog(text string) protocol.LogMessageParams {
	c.t.Helper()
	var got protocol.LogMessageParams
	c.waitFor("a log message containing "+text, func() bool {
		for _, l := range c.logs {
			if strings.Contains(l.Message, text) {
				got = l
				return true
			}
		}
		return false
	})
	return got
}

// waitRejected waits for the n-th answer to an unreadable frame.
func (c *testClient) waitRejected(n int) string {
	c.t.Helper()
	var got string
	c.waitFor(fmt.Sprintf("%d rejected frames", n), func() bool {
		if len(c.rejected) >= n {
			got = c.rejected[n-1]
			return true
		}
		return false
	})
	return got
}

func (c *testClient) open(uri protocol.DocumentURI, lang string, version int32, text string) {
	c.t.Helper()
	c.notify("textDocument/didOpen", &protocol.DidOpenTextDocumentParams{TextDocument: protocol.TextDocumentItem{
		URI: uri, LanguageID: protocol.LanguageIdentifier(lang), Version: version, Text: text}})
}

func (c *testClient) change(uri protocol.DocumentURI, version int32, changes ...contentChange) {
	c.t.Helper()
	c.notify("textDocument/didChange", &didChangeTextParams{
		TextDocument:   protocol.VersionedTextDocumentIdentifier{TextDocumentIdentifier: protocol.TextDocumentIdentifier{URI: uri}, Version: version},
		ContentChanges: changes,
	})
}

// clientStream reads frames like the server's stream but hands error
// responses with id null to the test instead of to jsonrpc2, which would
// close the connection on them.
type clientStream struct {
	c   *testClient
	in  *bufio.Reader
	out io.Writer
	mu  sync.Mutex
}

func (s *clientStream) Read(ctx context.Context) (jsonrpc2.Message, int64, error) {
	rd := &stream{in: s.in}
	for {
		body, n, err := rd.readFrame()
		if err != nil {
			return nil, n, err
		}
		if s.c.light && bytes.HasPrefix(body, publishPrefix) {
			if p, ok := peekPublication(body[len(publishPrefix):]); ok {
				s.c.mu.Lock()
				s.c.diags = append(s.c.diags, p)
				s.c.signal()
				s.c.mu.Unlock()
				continue
			}
		}
		if bytes.HasPrefix(body, []byte(`{"jsonrpc":"2.0","method":`)) {
			// A notification from the server: no need to look for ids,
			// and decoding a long page's diagnostics twice would make the
			// client, not the server, the slow part of the benchmarks.
			msg, err := decodeMessage(body)
			return msg, n, err
		}
		if !bytes.Contains(body, []byte(`"raw-`)) && !bytes.Contains(body, []byte(`"id":null`)) {
			// An answer to a call of the client's own: decoded once, the
			// way the server decodes, so that the benchmarks' client
			// makes little garbage of its own (its collections would show
			// in the latencies measured).
			msg, err := decodeMessage(body)
			return msg, n, err
		}
		var probe struct {
			ID    json.RawMessage `json:"id"`
			Error *struct {
				Code    int    `json:"code"`
				Message string `json:"message"`
			} `json:"error"`
		}
		if json.Unmarshal(body, &probe) == nil && strings.HasPrefix(string(probe.ID), `"raw-`) {
			var id string
			_ = json.Unmarshal(probe.ID, &id)
			s.c.mu.Lock()
			s.c.replies[id] = body
			s.c.signal()
			s.c.mu.Unlock()
			continue
		}
		if json.Unmarshal(body, &probe) == nil && string(probe.ID) == "null" && probe.Error != nil {
			s.c.mu.Lock()
			s.c.rejected = append(s.c.rejected, fmt.Sprintf("%d %s", probe.Error.Code, probe.Error.Message))
			s.c.signal()
			s.c.mu.Unlock()
			continue
		}
		msg, err := decodeMessage(body)
		return msg, n, err
	}
}

// Write sends msg as one frame. It encodes as an editor's client would,
// once and without extra copies, so that opening a long page measures the
// server rather than this client.
func (s *clientStream) Write(ctx context.Context, msg jsonrpc2.Message) (int64, error) {
	data, err := segjson.Marshal(msg)
	if err != nil {
		return 0, err
	}
	s.mu.Lock()
	defer s.mu.Unlock()
	n, err := fmt.Fprintf(s.out, "Content-Length: %d\r\n\r\n", len(data))
	if err != nil {
		return int64(n), err
	}
	m, err := s.out.Write(data)
	return int64(n + m), err
}

func (s *clientStream) Close() error {
	if c, ok := s.out.(io.Closer); ok {
		return c.Close()
	}
	return nil
}

// publishPrefix starts every publishDiagnostics the server writes itself.
var publishPrefix = []byte(`{"jsonrpc":"2.0","method":"textDocument/publishDiagnostics","params":{"uri":`)

// peekPublication reads the uri and version at the start of a
// publication's params, as the server writes them (encode.go).
func peekPublication(rest []byte) (publishDiagnosticsParams, bool) {
	var p publishDiagnosticsParams
	end := bytes.Index(rest, []byte(`,"version":`))
	if end < 0 {
		return p, false
	}
	var uri string
	if json.Unmarshal(rest[:end], &uri) != nil {
		return p, false
	}
	rest = rest[end+len(`,"version":`):]
	n := bytes.IndexByte(rest, ',')
	if n < 0 {
		return p, false
	}
	v, err := strconv.ParseInt(string(rest[:n]), 10, 32)
	if err != nil {
		return p, false
	}
	version := int32(v)
	p.URI, p.Version = protocol.DocumentURI(uri), &version
	return p, true
}

// rpcCode returns the JSON-RPC error code of err, or 0.
func rpcCode(err error) jsonrpc2.Code {
	var e *jsonrpc2.Error
	if errors.As(err, &e) {
		return e.Code
	}
	return 0
}
