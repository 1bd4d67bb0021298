package server

import (
	"context"
	"fmt"

	"go.lsp.dev/protocol"
)

// Text document synchronisation (LSP 3.17, "Text Document
// Synchronization"): didOpen, didChange (full and incremental), didSave
// and didClose of Markdown pages and plan files. Each version becomes a
// new document and a new snapshot of its unit; the old snapshot's
// analysis is abandoned.

func init() {
	notifications["textDocument/didOpen"] = notification((*Server).didOpen)
	notifications["textDocument/didChange"] = notification((*Server).didChange)
	notifications["textDocument/didSave"] = notification((*Server).didSave)
	notifications["textDocument/didClose"] = notification((*Server).didClose)
}

func (s *Server) didOpen(ctx context.Context, p *protocol.DidOpenTextDocumentParams) error {
	uri := p.TextDocument.URI
	s.mu.Lock()
	defer s.mu.Unlock()
	if nb := s.cellOf[uri]; nb != nil {
		return fmt.Errorf("%s is a cell of the open notebook %s; its text comes through notebookDocument/didChange", uri, nb.uri)
	}
	var warning error
	if _, open := s.texts[uri]; open {
		warning = fmt.Errorf("%s was opened twice; the new text replaces the old", uri)
	}
	d := newDocument(uri, p.TextDocument.Version, kindOf(uri, string(p.TextDocument.LanguageID)), []byte(p.TextDocument.Text))
	s.texts[uri] = d
	if d.kind != 0 {
		s.replaceUnit(uri, []*document{d})
	}
	return warning
}

func (s *Server) didChange(ctx context.Context, p *didChangeTextParams) error {
	uri, version := p.TextDocument.URI, p.TextDocument.Version
	s.mu.Lock()
	defer s.mu.Unlock()
	if nb := s.cellOf[uri]; nb != nil {
		// Clients that sync notebooks send cell edits in
		// notebookDocument/didChange; accept this form too.
		return nb.editCell(s, uri, version, p.ContentChanges)
	}
	d, open := s.texts[uri]
	if !open {
		return fmt.Errorf("change for %s, which is not open: ignored (send textDocument/didOpen first)", uri)
	}
	if version <= d.version {
		return fmt.Errorf("version %d of %s arrived after version %d: ignored, the text stays at version %d", version, uri, d.version, d.version)
	}
	nd, warnings := d.edited(version, p.ContentChanges)
	for _, w := range warnings {
		s.tell(protocol.MessageTypeWarning, w.Error())
	}
	s.texts[uri] = nd
	if nd.kind != 0 {
		s.replaceUnit(uri, []*document{nd})
	}
	return nil
}

func (s *Server) didSave(ctx context.Context, p *protocol.DidSaveTextDocumentParams) error {
	if isSettingsFile(p.TextDocument.URI) {
		s.reconfigure()
	}
	return nil
}

func (s *Server) didClose(ctx context.Context, p *protocol.DidCloseTextDocumentParams) error {
	uri := p.TextDocument.URI
	s.mu.Lock()
	defer s.mu.Unlock()
	d, open := s.texts[uri]
	if !open {
		return fmt.Errorf("close of %s, which is not open: ignored", uri)
	}
	delete(s.texts, uri)
	if d.kind != 0 {
		s.replaceUnit(uri, nil)
	}
	return nil
}

// replaceUnit makes docs the newest state of the unit key (nil: the unit
// is closed), abandons the analysis of the unit's previous snapshot, and
// asks the unit's publisher to publish. The caller holds s.mu.
func (s *Server) replaceUnit(key protocol.DocumentURI, docs []*document) {
	w := s.world.Load()
	if old := w.units[key]; old != nil {
		old.cancel()
	}
	var snap *snapshot
	if docs != nil {
		snap = newSnapshot(s.ctx, key, docs, s.engine)
	}
	s.world.Store(w.with(key, snap))
	p := s.pubs[key]
	if p == nil {
		if snap == nil {
			return
		}
		p = &publisher{s: s, shown: map[protocol.DocumentURI]shown{}, lines: map[protocol.DocumentURI]*lineCache{}}
		s.pubs[key] = p
	}
	p.kick(snap)
}

// reanalyseAll makes a new snapshot of every open unit with the current
// Engine. The caller holds s.mu.
func (s *Server) reanalyseAll() {
	for key, snap := range s.world.Load().units {
		s.replaceUnit(key, snap.docs)
	}
}
