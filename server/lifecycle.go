package server

import (
	"context"
	"encoding/json"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
)

// The lifecycle messages of LSP 3.17 ("Lifecycle Messages"): initialize,
// initialized, shutdown and exit.

func init() {
	requests["initialize"] = request((*Server).initialize)
	requests["shutdown"] = (*Server).shutdown
	notifications["initialized"] = func(*Server, context.Context, json.RawMessage) error { return nil }
}

// initializeParams is the part of InitializeParams walden reads.
type initializeParams struct {
	RootURI               protocol.DocumentURI       `json:"rootUri,omitempty"`
	RootPath              string                     `json:"rootPath,omitempty"`
	WorkspaceFolders      []protocol.WorkspaceFolder `json:"workspaceFolders,omitempty"`
	InitializationOptions json.RawMessage            `json:"initializationOptions,omitempty"`
}

func (s *Server) initialize(ctx context.Context, p *initializeParams) (any, error) {
	s.mu.Lock()
	if s.phase != starting {
		s.mu.Unlock()
		return nil, jsonrpc2.NewError(codeInvalidRequest, "initialize was already sent")
	}
	s.phase = running
	s.settings.root = rootFolder(p)
	s.mu.Unlock()
	if len(p.InitializationOptions) > 0 && string(p.InitializationOptions) != "null" {
		if err := s.configure(p.InitializationOptions); err != nil {
			s.tell(protocol.MessageTypeError, "initializationOptions: "+err.Error())
		}
	} else {
		s.reconfigure()
	}
	version := s.opts.Version
	if version == "" {
		version = "dev"
	}
	return &initializeResult{
		Capabilities: advertised(),
		ServerInfo:   &protocol.ServerInfo{Name: "walden", Version: version},
	}, nil
}

// rootFolder returns the folder where the settings file search starts.
func rootFolder(p *initializeParams) string {
	switch {
	case p.RootURI != "":
		return filePath(p.RootURI)
	case len(p.WorkspaceFolders) > 0:
		return filePath(protocol.DocumentURI(p.WorkspaceFolders[0].URI))
	}
	return p.RootPath
}

// shutdown answers null and refuses everything after it but exit.
func (s *Server) shutdown(ctx context.Context, _ json.RawMessage) (any, error) {
	s.mu.Lock()
	s.phase = shuttingDown
	s.mu.Unlock()
	return nil, nil
}

// exit ends the session; Serve returns 0 if shutdown came first, else 1.
func (s *Server) exit() {
	s.exitOnce.Do(func() { close(s.exited) })
}
