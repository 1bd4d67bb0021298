package server

import (
	"context"
	"io"
	"log/slog"
	"strconv"
	"sync"
	"sync/atomic"
	"time"

	segjson "github.com/segmentio/encoding/json"
	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"

	"walden/analyze"
)

// Options configure a Server.
type Options struct {
	// Log receives the server's own log; nil discards it. It must not
	// write to the stream the server speaks on.
	Log *slog.Logger
	// Version is reported to the client in serverInfo.
	Version string
	// ReadFile reads files from disk (the settings file and the lab's names
	// file); nil means os.ReadFile. Tests replace it.
	ReadFile func(path string) ([]byte, error)
}

// Server is one language server session: one client on one stream.
type Server struct {
	opts   Options
	log    *slog.Logger
	conn   jsonrpc2.Conn
	stream *stream

	// world is what requests read; replaced, never changed.
	world atomic.Pointer[world]

	// mu guards the session state below. Notifications change it, in
	// arrival order, on the connection's reading goroutine.
	mu        sync.Mutex
	phase     phase
	texts     map[protocol.DocumentURI]*document  // open text documents outside notebooks
	notebooks map[protocol.DocumentURI]*notebook  // open notebooks
	cellOf    map[protocol.DocumentURI]*notebook  // open cell → its notebook
	pubs      map[protocol.DocumentURI]*publisher // unit → its diagnostics publisher
	settings  settings
	engine    *analyze.Engine

	ctx      context.Context // ends when the session ends
	stop     context.CancelFunc
	exited   chan struct{}
	exitOnce sync.Once
	requests sync.WaitGroup // requests running on their own goroutines
	pubWG    sync.WaitGroup // publishers running
}

// phase is where the session is in the lifecycle the LSP specification
// lays down: initialize, work, shutdown, exit.
type phase int

const (
	starting     phase = iota // before initialize
	running                   // after initialize
	shuttingDown              // after shutdown: only exit is accepted
)

// New returns a Server ready to Serve one client.
func New(opts Options) *Server {
	log := opts.Log
	if log == nil {
		log = slog.New(slog.NewTextHandler(io.Discard, nil))
	}
	s := &Server{
		opts:      opts,
		log:       log,
		texts:     map[protocol.DocumentURI]*document{},
		notebooks: map[protocol.DocumentURI]*notebook{},
		cellOf:    map[protocol.DocumentURI]*notebook{},
		pubs:      map[protocol.DocumentURI]*publisher{},
		exited:    make(chan struct{}),
	}
	s.engine = analyze.NewEngine(analyze.Config{})
	s.world.Store(&world{})
	return s
}

// Serve speaks LSP on rwc until the client sends exit or the stream ends.
// It returns the process exit code the specification asks for: 0 when
// exit came after shutdown, 1 otherwise (including a stream that ended
// without exit).
func (s *Server) Serve(ctx context.Context, rwc io.ReadWriteCloser) int {
	s.ctx, s.stop = context.WithCancel(ctx)
	defer s.stop()
	s.stream = newStream(rwc, func(err error) { s.log.Warn("bad message skipped", "err", err) })
	s.conn = jsonrpc2.NewConn(s.stream)
	s.conn.Go(s.ctx, s.handler())
	select {
	case <-s.exited:
	case <-s.conn.Done():
		if err := s.conn.Err(); err != nil {
			s.log.Info("stream ended", "err", err)
		}
	case <-ctx.Done():
	}
	// Close without waiting for the reading goroutine: a blocking stdin
	// (the socket pair an editor on libuv hands over, kept open after
	// exit) is not interrupted by Close, and the specification wants the
	// process to end at exit. Requests and publishers are given a moment
	// to finish their last write.
	s.conn.Close()
	s.stop()
	finished := make(chan struct{})
	go func() {
		s.requests.Wait()
		s.pubWG.Wait()
		close(finished)
	}()
	select {
	case <-finished:
	case <-time.After(time.Second):
		s.log.Warn("requests still running at exit were abandoned")
	}
	s.mu.Lock()
	defer s.mu.Unlock()
	select {
	case <-s.exited:
		if s.phase == shuttingDown {
			return 0
		}
	default:
	}
	return 1
}

// notify sends a notification to the client, logging a failure (the
// client may have gone). It encodes the params once and writes the frame
// itself: jsonrpc2's Notify encodes them, then re-reads and re-encodes
// them twice more, which for the diagnostics of a long page costs more
// than the analysis of an edit.
func (s *Server) notify(method string, params any) {
	p, err := segjson.Marshal(params)
	if err != nil {
		s.log.Error("notification not encoded", "method", method, "err", err)
		return
	}
	m, _ := segjson.Marshal(method)
	body := make([]byte, 0, len(p)+len(m)+40)
	body = append(body, `{"jsonrpc":"2.0","method":`...)
	body = append(body, m...)
	body = append(body, `,"params":`...)
	body = append(body, p...)
	body = append(body, '}')
	if _, err := s.stream.writeFrame(body); err != nil {
		s.log.Info("notification not sent", "method", method, "err", err)
	}
}

// publishDiagnostics sends p, encoding it into buf, which it returns for
// the caller to reuse: a long page's diagnostics are sent after every
// edit, and a fresh buffer each time would be most of the garbage the
// server makes.
func (s *Server) publishDiagnostics(buf []byte, p *publishDiagnosticsParams) []byte {
	if !plain(p) {
		s.notify("textDocument/publishDiagnostics", p)
		return buf
	}
	buf = append(buf[:0], `{"jsonrpc":"2.0","method":"textDocument/publishDiagnostics","params":`...)
	buf = appendPublishDiagnostics(buf, p)
	buf = append(buf, '}')
	if _, err := s.stream.writeFrame(buf); err != nil {
		s.log.Info("diagnostics not sent", "uri", p.URI, "err", err)
	}
	if cap(buf) > 16<<20 {
		return nil // do not keep a huge buffer after one huge page
	}
	return buf
}

// publishEncoded sends the diagnostics of uri at version (nil: none)
// given as a JSON array, encoding the start of the message into buf,
// which it returns for reuse; the array is written as it is.
func (s *Server) publishEncoded(buf []byte, uri protocol.DocumentURI, version *int32, diags []byte) []byte {
	buf = append(buf[:0], `{"jsonrpc":"2.0","method":"textDocument/publishDiagnostics","params":{"uri":`...)
	buf = appendString(buf, string(uri))
	if version != nil {
		buf = append(buf, `,"version":`...)
		buf = strconv.AppendInt(buf, int64(*version), 10)
	}
	buf = append(buf, `,"diagnostics":`...)
	if _, err := s.stream.writeFrame(buf, diags, []byte("}}")); err != nil {
		s.log.Info("diagnostics not sent", "uri", uri, "err", err)
	}
	return buf
}

// tell shows the client a message in its log (window/logMessage), for
// problems with notifications, which cannot be answered with an error.
func (s *Server) tell(typ protocol.MessageType, msg string) {
	switch typ {
	case protocol.MessageTypeError:
		s.log.Error(msg)
	case protocol.MessageTypeWarning:
		s.log.Warn(msg)
	default:
		s.log.Info(msg)
	}
	s.notify("window/logMessage", &protocol.LogMessageParams{Type: typ, Message: "walden: " + msg})
}
