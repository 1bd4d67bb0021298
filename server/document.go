package server

import (
	"fmt"
	"path"
	"strings"

	"go.lsp.dev/protocol"

	"walden/analyze"
	"walden/grammar/source"
)

// document is one version of one text document as the client sent it. It
// never changes once made: an edit makes a new document.
type document struct {
	uri     protocol.DocumentURI
	version int32
	kind    analyze.SourceKind // 0: a document walden does not analyse
	mapper  *source.Mapper     // holds the text
}

// text returns the document's bytes.
func (d *document) text() []byte { return d.mapper.Text() }

// newDocument returns version of the document at uri holding text.
func newDocument(uri protocol.DocumentURI, version int32, kind analyze.SourceKind, text []byte) *document {
	return &document{uri: uri, version: version, kind: kind, mapper: source.NewMapper(text)}
}

// PlanFileExt is the extension of walden's plan files, in which every
// non-blank, non-comment line is a step.
const PlanFileExt = ".steps"

// PlanLanguageID is the language identifier editors give plan files.
const PlanLanguageID = "walden-steps"

// kindOf says how the steps of a text document are found, from its file
// extension first and its language identifier second (an unsaved buffer
// has no extension). 0 means walden does not read the document.
func kindOf(uri protocol.DocumentURI, languageID string) analyze.SourceKind {
	switch strings.ToLower(path.Ext(string(uri))) {
	case ".md", ".markdown":
		return analyze.MarkdownPage
	case PlanFileExt:
		return analyze.PlanFile
	}
	switch languageID {
	case "markdown":
		return analyze.MarkdownPage
	case PlanLanguageID:
		return analyze.PlanFile
	}
	return 0
}

// contentChange is LSP's TextDocumentContentChangeEvent. protocol v0.12.0
// declares its range as a value, which cannot tell a whole-text change (no
// range) from an edit at 0:0-0:0, so the server decodes its own.
type contentChange struct {
	Range *protocol.Range `json:"range,omitempty"`
	Text  string          `json:"text"`
}

// edited returns the document after changes, applied in order as the
// specification says (each range refers to the text after the previous
// change). A range outside the text is clamped to it, so the document
// stays usable, and reported in warnings: the client and the server then
// disagree about the text, which the client should hear about.
func (d *document) edited(version int32, changes []contentChange) (*document, []error) {
	m := d.mapper
	var warnings []error
	for i, c := range changes {
		if c.Range == nil {
			m = source.NewMapper([]byte(c.Text))
			continue
		}
		sp, err := span(m, *c.Range)
		if err != nil {
			warnings = append(warnings, fmt.Errorf("change %d of version %d: %w; applied at the nearest place in the text", i+1, version, err))
		}
		m = m.Replaced(sp, c.Text)
	}
	return &document{uri: d.uri, version: version, kind: d.kind, mapper: m}, warnings
}
