package server

import (
	"fmt"

	"go.lsp.dev/protocol"

	"walden/grammar/source"
)

// This file is the server's only contact with line and character
// positions: every conversion between an LSP Position and a byte offset
// goes through grammar/source's Mapper, walden's one mapper.

// lspRange returns the LSP range of span in the text m maps.
func lspRange(m *source.Mapper, span source.Span) protocol.Range {
	sl, sc, el, ec := m.Range(span)
	return protocol.Range{
		Start: protocol.Position{Line: uint32(sl), Character: uint32(sc)},
		End:   protocol.Position{Line: uint32(el), Character: uint32(ec)},
	}
}

// lspPosition returns the LSP position of p.
func lspPosition(m *source.Mapper, p source.Pos) protocol.Position {
	l, c := m.Position(p)
	return protocol.Position{Line: uint32(l), Character: uint32(c)}
}

// offset returns the byte offset of an LSP position. A character past the
// end of its line is the end of the line (the specification's rule); a
// line past the last one is an error naming the document's size, and the
// returned offset is then the end of the text.
func offset(m *source.Mapper, p protocol.Position) (source.Pos, error) {
	pos, err := m.Offset(int(p.Line), int(p.Character))
	if err != nil {
		return pos, fmt.Errorf("position %d:%d is outside the document: %w", p.Line, p.Character, err)
	}
	return pos, nil
}

// span returns the byte span of an LSP range, with offset's errors. A range
// whose end comes before its start is an error too.
func span(m *source.Mapper, r protocol.Range) (source.Span, error) {
	start, err := offset(m, r.Start)
	if err != nil {
		return source.Span{Start: start, End: start}, err
	}
	end, err := offset(m, r.End)
	if err != nil {
		return source.Span{Start: start, End: max(start, end)}, err
	}
	if end < start {
		return source.Span{Start: start, End: start}, fmt.Errorf("range %d:%d-%d:%d ends before it starts",
			r.Start.Line, r.Start.Character, r.End.Line, r.End.Character)
	}
	return source.Span{Start: start, End: end}, nil
}
