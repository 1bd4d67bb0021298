package server

import (
	"go.lsp.dev/protocol"
)

// protocol v0.12.0 describes LSP 3.15. The types below are the parts of
// LSP 3.16 and 3.17 that walden uses, written from the LSP 3.17
// specification; the server decodes and encodes them itself.

// Methods of LSP 3.16 and 3.17 that protocol v0.12.0 does not name.
const (
	methodInlayHint           = "textDocument/inlayHint"           // 3.17
	methodNotebookDidOpen     = "notebookDocument/didOpen"         // 3.17
	methodNotebookDidChange   = "notebookDocument/didChange"       // 3.17
	methodNotebookDidSave     = "notebookDocument/didSave"         // 3.17
	methodNotebookDidClose    = "notebookDocument/didClose"        // 3.17
	methodSemanticTokensFull  = "textDocument/semanticTokens/full" // 3.16
	methodSemanticTokensRange = "textDocument/semanticTokens/range"
)

// capabilities is ServerCapabilities with the 3.16/3.17 members walden
// implements. The embedded 3.15 struct's fields are flattened into the
// same JSON object.
type capabilities struct {
	protocol.ServerCapabilities
	InlayHintProvider      *inlayHintOptions      `json:"inlayHintProvider,omitempty"`
	NotebookDocumentSync   *notebookSyncOptions   `json:"notebookDocumentSync,omitempty"`
	PositionEncoding       string                 `json:"positionEncoding,omitempty"`
	SemanticTokensProvider *semanticTokensOptions `json:"semanticTokensProvider,omitempty"`
}

// initializeResult is InitializeResult with the wider capabilities.
type initializeResult struct {
	Capabilities capabilities         `json:"capabilities"`
	ServerInfo   *protocol.ServerInfo `json:"serverInfo,omitempty"`
}

// semanticTokensOptions is SemanticTokensOptions (3.16) with its members,
// which protocol v0.12.0 leaves out.
type semanticTokensOptions struct {
	Legend protocol.SemanticTokensLegend `json:"legend"`
	Range  bool                          `json:"range,omitempty"`
	Full   bool                          `json:"full,omitempty"`
}

// inlayHintOptions is InlayHintOptions (3.17).
type inlayHintOptions struct {
	ResolveProvider bool `json:"resolveProvider,omitempty"`
}

// inlayHintParams is InlayHintParams (3.17).
type inlayHintParams struct {
	TextDocument protocol.TextDocumentIdentifier `json:"textDocument"`
	Range        protocol.Range                  `json:"range"`
}

// inlayHint is InlayHint (3.17) with a plain string label.
type inlayHint struct {
	Position     protocol.Position `json:"position"`
	Label        string            `json:"label"`
	Kind         int               `json:"kind,omitempty"` // 1 Type, 2 Parameter
	Tooltip      string            `json:"tooltip,omitempty"`
	PaddingLeft  bool              `json:"paddingLeft,omitempty"`
	PaddingRight bool              `json:"paddingRight,omitempty"`
}

// inlayHintKindType is InlayHintKind.Type: the hint names what a thing
// becomes, which is what a predicted product is.
const inlayHintKindType = 1

// notebookSyncOptions is NotebookDocumentSyncOptions (3.17).
type notebookSyncOptions struct {
	NotebookSelector []notebookSelector `json:"notebookSelector"`
	Save             bool               `json:"save,omitempty"`
}

// notebookSelector is one entry of NotebookDocumentSyncOptions'
// notebookSelector: which notebooks, and which of their cells, to sync.
type notebookSelector struct {
	Notebook *notebookFilter `json:"notebook,omitempty"`
	Cells    []cellLanguage  `json:"cells,omitempty"`
}

// notebookFilter is NotebookDocumentFilter (3.17).
type notebookFilter struct {
	NotebookType string `json:"notebookType,omitempty"`
	Scheme       string `json:"scheme,omitempty"`
	Pattern      string `json:"pattern,omitempty"`
}

// cellLanguage selects cells by language.
type cellLanguage struct {
	Language string `json:"language"`
}

// notebookCellKind is NotebookCellKind: 1 Markup, 2 Code.
type notebookCellKind int

const (
	cellMarkup notebookCellKind = 1
	cellCode   notebookCellKind = 2
)

// notebookCell is NotebookCell (3.17), without the metadata walden ignores.
type notebookCell struct {
	Kind     notebookCellKind     `json:"kind"`
	Document protocol.DocumentURI `json:"document"`
}

// notebookDocument is NotebookDocument (3.17).
type notebookDocument struct {
	URI          protocol.DocumentURI `json:"uri"`
	NotebookType string               `json:"notebookType"`
	Version      int32                `json:"version"`
	Cells        []notebookCell       `json:"cells"`
}

// didOpenNotebookParams is DidOpenNotebookDocumentParams.
type didOpenNotebookParams struct {
	NotebookDocument  notebookDocument            `json:"notebookDocument"`
	CellTextDocuments []protocol.TextDocumentItem `json:"cellTextDocuments"`
}

// versionedNotebookID is VersionedNotebookDocumentIdentifier.
type versionedNotebookID struct {
	Version int32                `json:"version"`
	URI     protocol.DocumentURI `json:"uri"`
}

// notebookID is NotebookDocumentIdentifier.
type notebookID struct {
	URI protocol.DocumentURI `json:"uri"`
}

// didChangeNotebookParams is DidChangeNotebookDocumentParams.
type didChangeNotebookParams struct {
	NotebookDocument versionedNotebookID `json:"notebookDocument"`
	Change           notebookChange      `json:"change"`
}

// notebookChange is NotebookDocumentChangeEvent (metadata is ignored).
type notebookChange struct {
	Cells *notebookCellsChange `json:"cells,omitempty"`
}

// notebookCellsChange is the cells member of NotebookDocumentChangeEvent.
type notebookCellsChange struct {
	Structure   *notebookStructureChange `json:"structure,omitempty"`
	Data        []notebookCell           `json:"data,omitempty"`
	TextContent []cellTextChange         `json:"textContent,omitempty"`
}

// notebookStructureChange is the structure member of the cells change:
// cells added or removed, and the text documents opened and closed with
// them.
type notebookStructureChange struct {
	Array    notebookCellArrayChange           `json:"array"`
	DidOpen  []protocol.TextDocumentItem       `json:"didOpen,omitempty"`
	DidClose []protocol.TextDocumentIdentifier `json:"didClose,omitempty"`
}

// cellTextChange is one entry of the textContent member: edits to one
// cell's text.
type cellTextChange struct {
	Document protocol.VersionedTextDocumentIdentifier `json:"document"`
	Changes  []contentChange                          `json:"changes"`
}

// notebookCellArrayChange is NotebookCellArrayChange: replace DeleteCount
// cells from Start with Cells.
type notebookCellArrayChange struct {
	Start       int            `json:"start"`
	DeleteCount int            `json:"deleteCount"`
	Cells       []notebookCell `json:"cells,omitempty"`
}

// didSaveNotebookParams is DidSaveNotebookDocumentParams.
type didSaveNotebookParams struct {
	NotebookDocument notebookID `json:"notebookDocument"`
}

// didCloseNotebookParams is DidCloseNotebookDocumentParams.
type didCloseNotebookParams struct {
	NotebookDocument  notebookID                        `json:"notebookDocument"`
	CellTextDocuments []protocol.TextDocumentIdentifier `json:"cellTextDocuments"`
}

// didChangeTextParams is DidChangeTextDocumentParams with walden's
// contentChange (see document.go).
type didChangeTextParams struct {
	TextDocument   protocol.VersionedTextDocumentIdentifier `json:"textDocument"`
	ContentChanges []contentChange                          `json:"contentChanges"`
}

// publishDiagnosticsParams is PublishDiagnosticsParams. protocol v0.12.0
// declares the version as uint32 with omitempty, which drops version 0;
// this one always sends the version when there is one.
type publishDiagnosticsParams struct {
	URI         protocol.DocumentURI  `json:"uri"`
	Version     *int32                `json:"version,omitempty"`
	Diagnostics []protocol.Diagnostic `json:"diagnostics"`
}
