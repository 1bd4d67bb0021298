package server

import (
	"context"
	"fmt"
	"strings"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

// Notebook documents (LSP 3.17, "Notebook Document Synchronization"): a
// Jupyter notebook arrives as notebookDocument/didOpen with its cells,
// each cell a text document with its own URI. The Markdown cells, in
// order, are one analysis unit, so a step in a later cell can use the
// product of a labelled step in an earlier one; diagnostics are published
// per cell. Code cells are kept in the cell list (their positions matter
// for structure changes) but not analysed.

func init() {
	notifications[methodNotebookDidOpen] = notification((*Server).notebookDidOpen)
	notifications[methodNotebookDidChange] = notification((*Server).notebookDidChange)
	notifications[methodNotebookDidSave] = notification((*Server).notebookDidSave)
	notifications[methodNotebookDidClose] = notification((*Server).notebookDidClose)
}

// notebook is the server's copy of an open notebook. It is changed only
// under Server.mu; what requests see is the snapshot made from it.
type notebook struct {
	uri     protocol.DocumentURI
	version int32
	cells   []notebookCell
	docs    map[protocol.DocumentURI]*document // text of each open cell
}

// sources returns the Markdown cells' documents in notebook order.
func (nb *notebook) sources() []*document {
	var docs []*document
	for _, c := range nb.cells {
		if d := nb.docs[c.Document]; d != nil && c.Kind == cellMarkup {
			docs = append(docs, d)
		}
	}
	return docs
}

// cellKind is the source kind of a cell's text: only Markdown cells hold
// steps.
func cellKind(k notebookCellKind) analyze.SourceKind {
	if k == cellMarkup {
		return analyze.MarkdownCell
	}
	return 0
}

func (nb *notebook) kindOf(uri protocol.DocumentURI) notebookCellKind {
	for _, c := range nb.cells {
		if c.Document == uri {
			return c.Kind
		}
	}
	return 0
}

func (s *Server) notebookDidOpen(ctx context.Context, p *didOpenNotebookParams) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	n := p.NotebookDocument
	if old := s.notebooks[n.URI]; old != nil {
		s.forgetCells(old)
	}
	nb := &notebook{uri: n.URI, version: n.Version, cells: append([]notebookCell(nil), n.Cells...),
		docs: map[protocol.DocumentURI]*document{}}
	s.notebooks[n.URI] = nb
	var missing []string
	for _, item := range p.CellTextDocuments {
		nb.openCell(s, item)
	}
	for _, c := range nb.cells {
		if nb.docs[c.Document] == nil {
			missing = append(missing, string(c.Document))
		}
	}
	s.replaceUnit(nb.uri, nb.sources())
	if len(missing) > 0 {
		return fmt.Errorf("notebook %s lists cells whose text was not sent: %s", n.URI, strings.Join(missing, ", "))
	}
	return nil
}

func (nb *notebook) openCell(s *Server, item protocol.TextDocumentItem) {
	nb.docs[item.URI] = newDocument(item.URI, item.Version, cellKind(nb.kindOf(item.URI)), []byte(item.Text))
	s.cellOf[item.URI] = nb
}

func (s *Server) notebookDidChange(ctx context.Context, p *didChangeNotebookParams) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	nb := s.notebooks[p.NotebookDocument.URI]
	if nb == nil {
		return fmt.Errorf("change for notebook %s, which is not open: ignored", p.NotebookDocument.URI)
	}
	if v := p.NotebookDocument.Version; v <= nb.version {
		return fmt.Errorf("version %d of notebook %s arrived after version %d: ignored", v, nb.uri, nb.version)
	}
	nb.version = p.NotebookDocument.Version
	var problems []string
	if c := p.Change.Cells; c != nil {
		if st := c.Structure; st != nil {
			a := st.Array
			if a.Start < 0 || a.DeleteCount < 0 || a.Start+a.DeleteCount > len(nb.cells) {
				problems = append(problems, fmt.Sprintf("cell change at %d deleting %d does not fit the notebook's %d cells; the cell list was not changed", a.Start, a.DeleteCount, len(nb.cells)))
			} else {
				cells := append([]notebookCell(nil), nb.cells[:a.Start]...)
				cells = append(cells, a.Cells...)
				nb.cells = append(cells, nb.cells[a.Start+a.DeleteCount:]...)
			}
			for _, id := range st.DidClose {
				delete(nb.docs, id.URI)
				delete(s.cellOf, id.URI)
			}
			for _, item := range st.DidOpen {
				nb.openCell(s, item)
			}
		}
		for _, cell := range c.Data {
			for i := range nb.cells {
				if nb.cells[i].Document == cell.Document {
					nb.cells[i].Kind = cell.Kind
				}
			}
			if d := nb.docs[cell.Document]; d != nil {
				nb.docs[cell.Document] = newDocument(d.uri, d.version, cellKind(cell.Kind), d.text())
			}
		}
		for _, tc := range c.TextContent {
			if err := nb.applyCellChange(s, tc.Document.URI, tc.Document.Version, tc.Changes); err != nil {
				problems = append(problems, err.Error())
			}
		}
	}
	s.replaceUnit(nb.uri, nb.sources())
	if len(problems) > 0 {
		return fmt.Errorf("%s", strings.Join(problems, "; "))
	}
	return nil
}

// applyCellChange edits one cell's text. The caller holds s.mu.
func (nb *notebook) applyCellChange(s *Server, uri protocol.DocumentURI, version int32, changes []contentChange) error {
	d := nb.docs[uri]
	if d == nil {
		return fmt.Errorf("change for cell %s, which is not open in notebook %s: ignored", uri, nb.uri)
	}
	if version <= d.version {
		return fmt.Errorf("version %d of cell %s arrived after version %d: ignored", version, uri, d.version)
	}
	nd, warnings := d.edited(version, changes)
	for _, w := range warnings {
		s.tell(protocol.MessageTypeWarning, w.Error())
	}
	nb.docs[uri] = nd
	return nil
}

// editCell applies a textDocument/didChange addressed to a cell. The
// caller holds s.mu.
func (nb *notebook) editCell(s *Server, uri protocol.DocumentURI, version int32, changes []contentChange) error {
	if err := nb.applyCellChange(s, uri, version, changes); err != nil {
		return err
	}
	s.replaceUnit(nb.uri, nb.sources())
	return nil
}

func (s *Server) notebookDidSave(ctx context.Context, p *didSaveNotebookParams) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.notebooks[p.NotebookDocument.URI] == nil {
		return fmt.Errorf("save of notebook %s, which is not open: ignored", p.NotebookDocument.URI)
	}
	return nil
}

func (s *Server) notebookDidClose(ctx context.Context, p *didCloseNotebookParams) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	nb := s.notebooks[p.NotebookDocument.URI]
	if nb == nil {
		return fmt.Errorf("close of notebook %s, which is not open: ignored", p.NotebookDocument.URI)
	}
	s.forgetCells(nb)
	delete(s.notebooks, nb.uri)
	s.replaceUnit(nb.uri, nil)
	return nil
}

// forgetCells drops the cell → notebook entries of nb. The caller holds
// s.mu.
func (s *Server) forgetCells(nb *notebook) {
	for uri := range nb.docs {
		if s.cellOf[uri] == nb {
			delete(s.cellOf, uri)
		}
	}
}
