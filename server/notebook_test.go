package server

import (
	"fmt"
	"testing"

	"go.lsp.dev/protocol"
)

// Notebook synchronisation over the wire (LSP 3.17, "Notebook Document
// Synchronization"): cells opened with the notebook, edited, added,
// removed and closed, with diagnostics per cell.

const nbURI = protocol.DocumentURI("file:///lab/route.ipynb")

func cellURI(n int) protocol.DocumentURI {
	return protocol.DocumentURI(fmt.Sprintf("vscode-notebook-cell:/lab/route.ipynb#c%d", n))
}

func openNotebook(c *testClient, cells ...string) {
	p := didOpenNotebookParams{NotebookDocument: notebookDocument{URI: nbURI, NotebookType: "jupyter-notebook", Version: 1}}
	for i, text := range cells {
		p.NotebookDocument.Cells = append(p.NotebookDocument.Cells, notebookCell{Kind: cellMarkup, Document: cellURI(i)})
		p.CellTextDocuments = append(p.CellTextDocuments, protocol.TextDocumentItem{URI: cellURI(i), LanguageID: "markdown", Version: 1, Text: text})
	}
	c.notify(methodNotebookDidOpen, &p)
}

func hasCode(diags []protocol.Diagnostic, code string) bool {
	for _, d := range diags {
		if d.Code == code {
			return true
		}
	}
	return false
}

const (
	defineCell = "```reaction\nmesylate: C[C@@H](O)CCc1ccccc1 + MsCl, Et3N, DCM\n```\n"
	useCell    = "```reaction\nazide: @mesylate + NaN3, DMF\n```\n"
)

// A reference in a later cell resolves to a label in an earlier one; when
// the defining cell is removed it no longer does, and when the notebook
// closes every cell's diagnostics are cleared.
func TestNotebookCellsShareLabels(t *testing.T) {
	c := start(t)
	openNotebook(c, defineCell, useCell)
	c.diagnosticsFor(cellURI(0), 1)
	if d := c.diagnosticsFor(cellURI(1), 1); hasCode(d, "label-unresolved") {
		t.Errorf("@mesylate in cell 2 did not resolve to cell 1's label: %+v", d)
	}

	// Remove the first cell: the reference now dangles.
	var p didChangeNotebookParams
	p.NotebookDocument = versionedNotebookID{URI: nbURI, Version: 2}
	p.Change.Cells = &notebookCellsChange{}
	p.Change.Cells.Structure = &notebookStructureChange{Array: notebookCellArrayChange{Start: 0, DeleteCount: 1}, DidClose: []protocol.TextDocumentIdentifier{{URI: cellURI(0)}}}
	c.notify(methodNotebookDidChange, &p)
	c.waitFor("the removed cell's diagnostics cleared and the reference reported", func() bool {
		cleared, dangling := false, false
		for _, d := range c.diags {
			if d.URI == cellURI(0) && d.Version == nil && len(d.Diagnostics) == 0 {
				cleared = true
			}
			if d.URI == cellURI(1) && hasCode(d.Diagnostics, "label-forward") || d.URI == cellURI(1) && hasCode(d.Diagnostics, "label-unresolved") {
				dangling = true
			}
		}
		return cleared && dangling
	})

	// Put it back at the end, after its user: now the label is defined
	// only further down.
	p.NotebookDocument.Version = 3
	p.Change.Cells.Structure.Array = notebookCellArrayChange{Start: 1, Cells: []notebookCell{{Kind: cellMarkup, Document: cellURI(2)}}}
	p.Change.Cells.Structure.DidClose = nil
	p.Change.Cells.Structure.DidOpen = []protocol.TextDocumentItem{{URI: cellURI(2), LanguageID: "markdown", Version: 1, Text: defineCell}}
	c.notify(methodNotebookDidChange, &p)
	c.waitFor("label-forward in the using cell", func() bool {
		last := c.diags[len(c.diags)-1]
		for i := len(c.diags) - 1; i >= 0; i-- {
			if c.diags[i].URI == cellURI(1) {
				last = c.diags[i]
				break
			}
		}
		return hasCode(last.Diagnostics, "label-forward")
	})

	c.notify(methodNotebookDidClose, &didCloseNotebookParams{NotebookDocument: notebookID{URI: nbURI},
		CellTextDocuments: []protocol.TextDocumentIdentifier{{URI: cellURI(1)}, {URI: cellURI(2)}}})
	c.waitFor("all cells cleared", func() bool {
		open := map[protocol.DocumentURI]bool{}
		for _, d := range c.diags {
			open[d.URI] = d.Version != nil
		}
		return !open[cellURI(1)] && !open[cellURI(2)]
	})
}

// Cell text edits arrive in notebookDocument/didChange with the cell's own
// version; diagnostics of that cell carry it.
func TestNotebookCellEdit(t *testing.T) {
	c := start(t)
	openNotebook(c, defineCell, useCell)
	c.diagnosticsFor(cellURI(1), 1)
	var p didChangeNotebookParams
	p.NotebookDocument = versionedNotebookID{URI: nbURI, Version: 2}
	p.Change.Cells = &notebookCellsChange{TextContent: []cellTextChange{{
		Document: protocol.VersionedTextDocumentIdentifier{TextDocumentIdentifier: protocol.TextDocumentIdentifier{URI: cellURI(1)}, Version: 2},
		Changes:  []contentChange{{Range: rng(1, 8, 1, 16), Text: "mesylat"}},
	}}}
	c.notify(methodNotebookDidChange, &p)
	if d := c.diagnosticsFor(cellURI(1), 2); !hasCode(d, "label-unresolved") {
		t.Errorf("after renaming the reference to @mesylat, want label-unresolved, got %+v", d)
	}
	// A stale cell version is refused and reported.
	p.NotebookDocument.Version = 3
	p.Change.Cells.TextContent[0].Document.Version = 2
	c.notify(methodNotebookDidChange, &p)
	c.waitLog("version 2 of cell vscode-notebook-cell:/lab/route.ipynb#c1 arrived after version 2")
	// Requests on a cell work with the cell's own positions.
	var h *protocol.Hover
	c.call("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
		TextDocument: protocol.TextDocumentIdentifier{URI: cellURI(0)}, Position: protocol.Position{Line: 1, Character: 0}}}, &h)
	if h == nil || h.Range.Start.Line != 1 {
		t.Errorf("hover on cell 1's step = %+v, want a hover on line 1", h)
	}
}
