package server

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"strings"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
)

// requestFunc answers a request from its raw params.
type requestFunc func(s *Server, ctx context.Context, params json.RawMessage) (any, error)

// notificationFunc handles a notification from its raw params. An error is
// shown to the user through window/logMessage, since a notification has no
// reply.
type notificationFunc func(s *Server, ctx context.Context, params json.RawMessage) error

// requests and notifications are the methods walden implements; initialize
// advertises exactly these (capabilities.go). Each feature file adds its
// own entries in an init function.
var (
	requests      = map[string]requestFunc{}
	notifications = map[string]notificationFunc{}
)

// request adapts a typed handler to requestFunc, decoding params into P.
func request[P any](fn func(s *Server, ctx context.Context, p *P) (any, error)) requestFunc {
	return func(s *Server, ctx context.Context, raw json.RawMessage) (any, error) {
		var p P
		if err := decodeParams(raw, &p); err != nil {
			return nil, err
		}
		return fn(s, ctx, &p)
	}
}

// notification adapts a typed handler to notificationFunc.
func notification[P any](fn func(s *Server, ctx context.Context, p *P) error) notificationFunc {
	return func(s *Server, ctx context.Context, raw json.RawMessage) error {
		var p P
		if err := decodeParams(raw, &p); err != nil {
			return err
		}
		return fn(s, ctx, &p)
	}
}

func decodeParams(raw json.RawMessage, into any) error {
	if len(raw) == 0 || string(raw) == "null" {
		return jsonrpc2.NewError(codeInvalidParams, "params are missing")
	}
	if err := json.Unmarshal(raw, into); err != nil {
		return jsonrpc2.NewError(codeInvalidParams, "params not understood: "+err.Error())
	}
	return nil
}

// invalidParams is the error for a request whose params decode but make
// no sense (a position outside the document, say).
func invalidParams(format string, args ...any) error {
	return jsonrpc2.NewError(codeInvalidParams, fmt.Sprintf(format, args...))
}

// route dispatches a message to its handler, after the lifecycle checks
// of the LSP specification ("Lifecycle Messages"): before initialize only
// initialize and exit are served, after shutdown only exit.
func (s *Server) route(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
	method := req.Method()
	s.mu.Lock()
	ph := s.phase
	s.mu.Unlock()

	if _, isCall := req.(*jsonrpc2.Call); isCall {
		h, known := requests[method]
		switch {
		case ph == starting && method != "initialize":
			return reply(ctx, nil, jsonrpc2.NewError(codeServerNotInitialized, fmt.Sprintf("%s before initialize", method)))
		case ph == shuttingDown:
			return reply(ctx, nil, jsonrpc2.NewError(codeInvalidRequest, fmt.Sprintf("%s after shutdown: only exit is accepted now", method)))
		case !known:
			return reply(ctx, nil, jsonrpc2.NewError(codeMethodNotFound, fmt.Sprintf("method %q is not implemented by walden", method)))
		}
		result, err := h(s, ctx, req.Params())
		return reply(ctx, result, rpcError(err))
	}

	h, known := notifications[method]
	switch {
	case method == "exit":
		s.exit()
		return reply(ctx, nil, nil)
	case !known:
		// "$/" notifications may be ignored (LSP 3.17, "$ Notifications
		// and Requests"); others are logged, as a client may want to know.
		if !strings.HasPrefix(method, "$/") {
			s.log.Info("notification not implemented; ignored", "method", method)
		}
		return reply(ctx, nil, nil)
	case ph == starting:
		s.log.Warn("notification before initialize dropped", "method", method)
		return reply(ctx, nil, nil)
	case ph == shuttingDown:
		s.log.Warn("notification after shutdown dropped", "method", method)
		return reply(ctx, nil, nil)
	}
	if err := h(s, ctx, req.Params()); err != nil {
		s.tell(protocol.MessageTypeError, fmt.Sprintf("%s: %v", method, err))
	}
	return reply(ctx, nil, nil)
}

// rpcError turns a handler's error into the reply's error.
func rpcError(err error) error {
	var rpc *jsonrpc2.Error
	switch {
	case err == nil:
		return nil
	case errors.As(err, &rpc):
		return rpc
	case errors.Is(err, errSuperseded):
		return jsonrpc2.NewError(codeContentModified, err.Error())
	case errors.Is(err, context.Canceled):
		return jsonrpc2.NewError(codeRequestCancelled, "request cancelled")
	}
	return jsonrpc2.NewError(codeInternalError, err.Error())
}
