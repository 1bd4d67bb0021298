package server

import (
	"go.lsp.dev/protocol"
)

// advertised returns the capabilities sent in reply to initialize:
// exactly the features this package implements (capabilities_test.go
// checks each against the method table).
func advertised() capabilities {
	return capabilities{
		ServerCapabilities: protocol.ServerCapabilities{
			TextDocumentSync: &protocol.TextDocumentSyncOptions{
				OpenClose: true,
				Change:    protocol.TextDocumentSyncKindIncremental,
				Save:      &protocol.SaveOptions{}, // didSave re-reads the settings file
			},
			HoverProvider:          true,
			CompletionProvider:     &protocol.CompletionOptions{TriggerCharacters: []string{"+", ","}},
			CodeActionProvider:     &protocol.CodeActionOptions{CodeActionKinds: codeActionKinds},
			DocumentSymbolProvider: true,
		},
		PositionEncoding: "utf-16",
		SemanticTokensProvider: &semanticTokensOptions{
			Legend: legend,
			Full:   true,
			Range:  true,
		},
		InlayHintProvider: &inlayHintOptions{},
		NotebookDocumentSync: &notebookSyncOptions{
			NotebookSelector: []notebookSelector{{
				Notebook: &notebookFilter{NotebookType: "jupyter-notebook"},
				Cells:    []cellLanguage{{Language: "markdown"}},
			}},
			Save: true,
		},
	}
}
