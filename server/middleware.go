package server

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"log/slog"
	"runtime/debug"
	"sync"
	"time"

	"go.lsp.dev/jsonrpc2"
)

// middleware wraps a handler with one concern.
type middleware func(jsonrpc2.Handler) jsonrpc2.Handler

// chain returns h wrapped by mws, the first outermost.
func chain(h jsonrpc2.Handler, mws ...middleware) jsonrpc2.Handler {
	for i := len(mws) - 1; i >= 0; i-- {
		h = mws[i](h)
	}
	return h
}

// handler is the server's whole chain. The order matters:
//   - swallow: jsonrpc2 closes the connection when a handler returns an
//     error, so no error may escape; it is logged instead.
//   - cancel: $/cancelRequest, and a cancellable context per request.
//   - pin: the request sees the world as it was when it arrived, even if
//     it runs later on another goroutine.
//   - async: requests run on their own goroutines so a slow one does not
//     hold up the next message; notifications run in arrival order on the
//     reading goroutine, since each changes the documents.
//   - log: method, duration and error of every message.
//   - recover: a panic becomes a logged error and, for a request, an
//     InternalError reply; the server goes on serving.
func (s *Server) handler() jsonrpc2.Handler {
	return chain(s.route, s.swallow, s.cancel, s.pin, s.async, s.logging, s.recovering)
}

func (s *Server) swallow(next jsonrpc2.Handler) jsonrpc2.Handler {
	return func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		if err := next(ctx, reply, req); err != nil {
			s.log.Error("handler failed", "method", req.Method(), "err", err)
		}
		return nil
	}
}

// cancel implements $/cancelRequest (LSP 3.17, "Cancellation Support"): the
// named request's context is cancelled, and if it then ends with an error
// the reply carries RequestCancelled.
func (s *Server) cancel(next jsonrpc2.Handler) jsonrpc2.Handler {
	var mu sync.Mutex
	running := make(map[jsonrpc2.ID]context.CancelFunc)
	return func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		if req.Method() == "$/cancelRequest" {
			var p struct {
				ID jsonrpc2.ID `json:"id"`
			}
			if err := json.Unmarshal(req.Params(), &p); err != nil {
				s.log.Warn("$/cancelRequest with unreadable id", "params", truncate(string(req.Params()), 80))
				return reply(ctx, nil, nil)
			}
			mu.Lock()
			stop := running[p.ID]
			mu.Unlock()
			if stop != nil {
				stop()
			}
			return reply(ctx, nil, nil)
		}
		call, ok := req.(*jsonrpc2.Call)
		if !ok {
			return next(ctx, reply, req)
		}
		ctx, stop := context.WithCancel(ctx)
		id := call.ID()
		mu.Lock()
		running[id] = stop
		mu.Unlock()
		return next(ctx, func(rctx context.Context, result any, err error) error {
			mu.Lock()
			delete(running, id)
			mu.Unlock()
			if err != nil && ctx.Err() != nil {
				err = jsonrpc2.NewError(codeRequestCancelled, fmt.Sprintf("%s cancelled", req.Method()))
			}
			stop()
			return reply(context.WithoutCancel(rctx), result, err)
		}, req)
	}
}

type worldKey struct{}

// pin records the world as of the message's arrival in its context.
func (s *Server) pin(next jsonrpc2.Handler) jsonrpc2.Handler {
	return func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		return next(context.WithValue(ctx, worldKey{}, s.world.Load()), reply, req)
	}
}

// worldOf returns the world pinned in ctx.
func worldOf(ctx context.Context) *world {
	w, _ := ctx.Value(worldKey{}).(*world)
	if w == nil {
		return &world{}
	}
	return w
}

// inOrder are the requests that must finish before the next message is
// read: the client may not send anything else until they are answered.
var inOrder = map[string]bool{"initialize": true, "shutdown": true}

func (s *Server) async(next jsonrpc2.Handler) jsonrpc2.Handler {
	return func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		if _, ok := req.(*jsonrpc2.Call); !ok || inOrder[req.Method()] {
			return next(ctx, reply, req)
		}
		s.requests.Add(1)
		go func() {
			defer s.requests.Done()
			if err := next(ctx, reply, req); err != nil {
				s.log.Error("request failed", "method", req.Method(), "err", err)
			}
		}()
		return nil
	}
}

func (s *Server) logging(next jsonrpc2.Handler) jsonrpc2.Handler {
	return func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		start := time.Now()
		id := ""
		if call, ok := req.(*jsonrpc2.Call); ok {
			id = fmt.Sprint(call.ID())
		}
		err := next(ctx, func(ctx context.Context, result any, rerr error) error {
			if rerr != nil {
				s.log.Warn("request answered with an error", "method", req.Method(), "id", id, "err", rerr, "took", time.Since(start))
			} else if s.log.Enabled(ctx, slog.LevelDebug) {
				s.log.Debug("request answered", "method", req.Method(), "id", id, "took", time.Since(start))
			}
			return reply(ctx, result, rerr)
		}, req)
		if id == "" && s.log.Enabled(ctx, slog.LevelDebug) {
			s.log.Debug("notification handled", "method", req.Method(), "took", time.Since(start))
		}
		return err
	}
}

// panicError is a recovered panic with its stack.
type panicError struct {
	what  string
	value any
	stack string
}

func (e *panicError) Error() string { return fmt.Sprintf("internal error in %s: %v", e.what, e.value) }

func stack() string { return string(debug.Stack()) }

func (s *Server) recovering(next jsonrpc2.Handler) jsonrpc2.Handler {
	return func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) (err error) {
		var mu sync.Mutex
		replied := false
		once := func(ctx context.Context, result any, rerr error) error {
			mu.Lock()
			if replied {
				mu.Unlock()
				return errors.New("second reply to " + req.Method() + " dropped")
			}
			replied = true
			mu.Unlock()
			return reply(ctx, result, rerr)
		}
		defer func() {
			r := recover()
			if r == nil {
				return
			}
			pe := &panicError{what: req.Method(), value: r, stack: stack()}
			s.log.Error("recovered from a panic", "method", req.Method(), "panic", fmt.Sprint(r), "stack", pe.stack)
			mu.Lock()
			done := replied
			mu.Unlock()
			if !done {
				err = once(ctx, nil, jsonrpc2.NewError(codeInternalError, pe.Error()))
			}
		}()
		return next(ctx, once, req)
	}
}
