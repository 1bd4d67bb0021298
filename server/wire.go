package server

import (
	"bufio"
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
	"sync"

	segjson "github.com/segmentio/encoding/json"
	"go.lsp.dev/jsonrpc2"
)

// MaxMessageBytes is the largest message body the server reads. A larger
// one is skipped unread and answered with an error, so that a runaway
// client cannot make the server allocate without bound.
const MaxMessageBytes = 64 << 20

// JSON-RPC 2.0 error codes the server sends (the specification's own
// numbers, plus the LSP-reserved ones from the LSP 3.17 specification,
// "Response Message").
const (
	codeParseError           jsonrpc2.Code = -32700
	codeInvalidRequest       jsonrpc2.Code = -32600
	codeMethodNotFound       jsonrpc2.Code = -32601
	codeInvalidParams        jsonrpc2.Code = -32602
	codeInternalError        jsonrpc2.Code = -32603
	codeServerNotInitialized jsonrpc2.Code = -32002
	codeRequestCancelled     jsonrpc2.Code = -32800
	codeContentModified      jsonrpc2.Code = -32801
)

// stream frames JSON-RPC messages with Content-Length headers, as the LSP
// base protocol says. Unlike jsonrpc2.NewStream it survives bad input: a
// body that is not a JSON-RPC message, or a frame that is too large, is
// answered with an error response (id null where the id cannot be read)
// and reading goes on with the next frame. jsonrpc2's own stream would
// report the error to the connection, which then closes.
type stream struct {
	in     *bufio.Reader
	out    io.Writer
	closer io.Closer
	onBad  func(error) // logs what was skipped; may be nil
	limit  int         // largest body read; MaxMessageBytes unless a test says otherwise

	mu  sync.Mutex // one whole frame at a time on out
	buf bytes.Buffer
}

// newStream returns a stream reading and writing rwc.
func newStream(rwc io.ReadWriteCloser, onBad func(error)) *stream {
	return &stream{in: bufio.NewReaderSize(rwc, 64<<10), out: rwc, closer: rwc, onBad: onBad, limit: MaxMessageBytes}
}

// frameError is a problem with one frame that does not end the stream.
type frameError struct {
	code jsonrpc2.Code
	id   json.RawMessage // the request's id when it could be read, else nil
	msg  string
}

func (e *frameError) Error() string { return e.msg }

// Read returns the next well-formed message. Bad frames are answered and
// skipped; only a failure of the underlying reader ends reading.
func (s *stream) Read(ctx context.Context) (jsonrpc2.Message, int64, error) {
	for {
		if err := ctx.Err(); err != nil {
			return nil, 0, err
		}
		body, n, err := s.readFrame()
		var fe *frameError
		if errors.As(err, &fe) {
			s.reject(fe)
			continue
		}
		if err != nil {
			return nil, n, err
		}
		msg, err := decodeMessage(body)
		if errors.As(err, &fe) {
			s.reject(fe)
			continue
		}
		return msg, n, nil
	}
}

// readFrame reads one header block and its body.
func (s *stream) readFrame() ([]byte, int64, error) {
	var total int64
	length := -1
	var bad string
	for {
		line, err := s.in.ReadString('\n')
		total += int64(len(line))
		if err != nil {
			if err == io.EOF && total == 0 {
				return nil, total, io.EOF
			}
			return nil, total, fmt.Errorf("reading header: %w", err)
		}
		line = strings.TrimSpace(line)
		if line == "" {
			if length < 0 && bad == "" && total <= 2 {
				continue // stray blank line between frames
			}
			break
		}
		name, value, ok := strings.Cut(line, ":")
		if !ok {
			bad = fmt.Sprintf("header line %q has no colon", truncate(line, 60))
			continue
		}
		if strings.EqualFold(strings.TrimSpace(name), "Content-Length") {
			v, err := strconv.ParseInt(strings.TrimSpace(value), 10, 64)
			if err != nil || v <= 0 {
				bad = fmt.Sprintf("Content-Length %q is not a positive number", truncate(value, 30))
				continue
			}
			length = int(min(v, 1<<40))
		}
	}
	if bad != "" {
		return nil, total, &frameError{code: codeParseError, msg: "bad message header: " + bad}
	}
	if length < 0 {
		return nil, total, &frameError{code: codeParseError, msg: "message header has no Content-Length"}
	}
	limit := s.limit
	if limit <= 0 {
		limit = MaxMessageBytes
	}
	if length > limit {
		n, err := io.CopyN(io.Discard, s.in, int64(length))
		total += n
		if err != nil {
			return nil, total, fmt.Errorf("skipping oversized message: %w", err)
		}
		return nil, total, &frameError{code: codeInvalidRequest,
			msg: fmt.Sprintf("message of %d bytes skipped: the limit is %d bytes", length, limit)}
	}
	body := make([]byte, length)
	n, err := io.ReadFull(s.in, body)
	total += int64(n)
	if err != nil {
		return nil, total, fmt.Errorf("reading %d-byte message body: %w", length, err)
	}
	return body, total, nil
}

// wireMessage holds every member a JSON-RPC message may have.
type wireMessage struct {
	JSONRPC string          `json:"jsonrpc"`
	ID      json.RawMessage `json:"id"`
	Method  *string         `json:"method"`
	Params  json.RawMessage `json:"params"`
	Result  json.RawMessage `json:"result"`
	Error   *jsonrpc2.Error `json:"error"`
}

// decodeMessage reads a JSON-RPC message, turning every failure into a
// frameError that names the problem and, where it can, the request's id.
//
// It reads the body once, without copying it (the body is the frame's
// own), and builds the message from the parts: jsonrpc2.DecodeMessage
// would set aside a 32 kB buffer for every message, a small hover request
// included, and the garbage collector would pay for it during edits.
func decodeMessage(body []byte) (jsonrpc2.Message, error) {
	var w wireMessage
	rest, err := segjson.Parse(body, &w, segjson.ZeroCopy)
	if trail := bytes.TrimLeft(rest, " \t\r\n"); err == nil && len(trail) > 0 {
		return nil, &frameError{code: codeParseError,
			msg: fmt.Sprintf("malformed JSON at byte %d of the message: %q after the message object", len(body)-len(trail), truncate(string(trail), 20))}
	}
	if err != nil {
		var syn *json.SyntaxError
		if errors.As(err, &syn) {
			return nil, &frameError{code: codeParseError,
				msg: fmt.Sprintf("malformed JSON at byte %d of the message: %v", syn.Offset, err)}
		}
		return nil, &frameError{code: codeInvalidRequest, msg: "not a JSON-RPC message object: " + err.Error()}
	}
	id := w.ID
	if isNull(id) {
		id = nil
	}
	rid, ok := readID(id)
	if len(id) > 0 && !ok {
		return nil, &frameError{code: codeInvalidRequest, msg: fmt.Sprintf("request id %s is neither a number nor a string", truncate(string(id), 40))}
	}
	if w.JSONRPC != jsonrpc2.Version {
		return nil, &frameError{code: codeInvalidRequest, id: id,
			msg: fmt.Sprintf("jsonrpc is %q, want %q", w.JSONRPC, jsonrpc2.Version)}
	}
	if w.Method != nil && *w.Method == "" {
		return nil, &frameError{code: codeInvalidRequest, id: id, msg: "method is empty"}
	}
	var params any
	if !isNull(w.Params) {
		params = w.Params
	}
	var msg jsonrpc2.Message
	switch {
	case w.Method != nil && id == nil:
		msg, err = jsonrpc2.NewNotification(*w.Method, params)
	case w.Method != nil:
		msg, err = jsonrpc2.NewCall(rid, *w.Method, params)
	case id == nil:
		return nil, &frameError{code: codeInvalidRequest, msg: "invalid JSON-RPC message: a response without an id"}
	default:
		var result any
		if !isNull(w.Result) {
			result = w.Result
		}
		var rerr error
		if w.Error != nil {
			rerr = w.Error
		}
		msg, err = jsonrpc2.NewResponse(rid, result, rerr)
	}
	if err != nil {
		return nil, &frameError{code: codeInvalidRequest, id: id, msg: "invalid JSON-RPC message: " + err.Error()}
	}
	return msg, nil
}

// isNull reports whether raw is absent or the JSON null.
func isNull(raw json.RawMessage) bool { return len(raw) == 0 || string(raw) == "null" }

// readID reads a request id: a JSON number that fits jsonrpc2's int32
// ids, or a string. ok is false for anything else.
func readID(raw json.RawMessage) (id jsonrpc2.ID, ok bool) {
	var n int32
	if json.Unmarshal(raw, &n) == nil {
		return jsonrpc2.NewNumberID(n), true
	}
	var s string
	if json.Unmarshal(raw, &s) == nil {
		return jsonrpc2.NewStringID(s), true
	}
	return jsonrpc2.ID{}, false
}

// reject answers a bad frame. Notifications get no answer in JSON-RPC, but
// a frame that cannot be read may have been a request, so an error with id
// null is the specification's answer (JSON-RPC 2.0, section 5).
func (s *stream) reject(fe *frameError) {
	if s.onBad != nil {
		s.onBad(fe)
	}
	id := fe.id
	if len(id) == 0 {
		id = json.RawMessage("null")
	}
	body, _ := json.Marshal(struct {
		JSONRPC string          `json:"jsonrpc"`
		ID      json.RawMessage `json:"id"`
		Error   struct {
			Code    jsonrpc2.Code `json:"code"`
			Message string        `json:"message"`
		} `json:"error"`
	}{JSONRPC: jsonrpc2.Version, ID: id, Error: struct {
		Code    jsonrpc2.Code `json:"code"`
		Message string        `json:"message"`
	}{fe.code, fe.msg}})
	_, _ = s.writeFrame(body)
}

// Write sends msg as one frame.
func (s *stream) Write(ctx context.Context, msg jsonrpc2.Message) (int64, error) {
	if err := ctx.Err(); err != nil {
		return 0, err
	}
	data, err := segjson.Marshal(msg)
	if err != nil {
		return 0, fmt.Errorf("marshaling message: %w", err)
	}
	return s.writeFrame(data)
}

// writeFrame writes one frame whose body is the parts, in order: the
// header and the small parts in a single write, and each large part
// (a long page's diagnostics) written as it is, to spare copying it.
func (s *stream) writeFrame(parts ...[]byte) (int64, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	length := 0
	for _, p := range parts {
		length += len(p)
	}
	s.buf.Reset()
	s.buf.WriteString("Content-Length: ")
	s.buf.WriteString(strconv.Itoa(length))
	s.buf.WriteString("\r\n\r\n")
	var total int64
	flush := func() error {
		n, err := s.out.Write(s.buf.Bytes())
		total += int64(n)
		s.buf.Reset()
		return err
	}
	for _, p := range parts {
		if len(p) <= 64<<10 {
			s.buf.Write(p)
			continue
		}
		if err := flush(); err != nil {
			return total, fmt.Errorf("writing message: %w", err)
		}
		n, err := s.out.Write(p)
		total += int64(n)
		if err != nil {
			return total, fmt.Errorf("writing message: %w", err)
		}
	}
	if s.buf.Len() > 0 {
		if err := flush(); err != nil {
			return total, fmt.Errorf("writing message: %w", err)
		}
	}
	return total, nil
}

// Close closes the underlying connection.
func (s *stream) Close() error { return s.closer.Close() }

func truncate(s string, n int) string {
	if len(s) <= n {
		return s
	}
	return s[:n] + "…"
}
