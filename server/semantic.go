package server

import (
	"context"
	"sort"

	"go.lsp.dev/protocol"

	"walden/analyze"
	"walden/grammar/source"
)

// Semantic tokens (LSP 3.17, "Semantic Tokens"): the parts of each step
// line as analyze classifies them (analyze.TokenKind), so that editors
// colour substrates, reagents, solvents, conditions and products apart
// even where no grammar of their own knows walden's notation. The legend
// uses the specification's predefined token types, which every theme
// colours; the table below says which stands for which part.

func init() {
	requests[methodSemanticTokensFull] = request((*Server).semanticTokensFull)
	requests[methodSemanticTokensRange] = request((*Server).semanticTokensRange)
}

// tokenTypes maps each analyze.TokenKind to a predefined LSP token type.
var tokenTypes = map[analyze.TokenKind]protocol.SemanticTokenTypes{
	analyze.TokenLabel:       protocol.SemanticTokenNamespace, // names a step, as a namespace names code
	analyze.TokenReference:   protocol.SemanticTokenVariable,  // stands for an earlier step's product
	analyze.TokenSubstrate:   protocol.SemanticTokenClass,
	analyze.TokenReagent:     protocol.SemanticTokenFunction, // acts on the substrate
	analyze.TokenSolvent:     protocol.SemanticTokenType,
	analyze.TokenAmount:      protocol.SemanticTokenNumber,
	analyze.TokenTemperature: protocol.SemanticTokenNumber,
	analyze.TokenTime:        protocol.SemanticTokenNumber,
	analyze.TokenOperator:    protocol.SemanticTokenOperator,
	analyze.TokenProduct:     protocol.SemanticTokenStruct,
	analyze.TokenComment:     protocol.SemanticTokenComment,
	analyze.TokenStatus:      protocol.SemanticTokenKeyword,
}

// legend lists the token types in the order their indices are sent, and
// tokenIndex gives each kind its index.
var legend, tokenIndex = func() (protocol.SemanticTokensLegend, map[analyze.TokenKind]uint32) {
	kinds := make([]analyze.TokenKind, 0, len(tokenTypes))
	for k := range tokenTypes {
		kinds = append(kinds, k)
	}
	sort.Slice(kinds, func(i, j int) bool { return kinds[i] < kinds[j] })
	l := protocol.SemanticTokensLegend{TokenTypes: []protocol.SemanticTokenTypes{}, TokenModifiers: []protocol.SemanticTokenModifiers{}}
	at := map[protocol.SemanticTokenTypes]uint32{}
	idx := map[analyze.TokenKind]uint32{}
	for _, k := range kinds {
		typ := tokenTypes[k]
		i, ok := at[typ]
		if !ok {
			i = uint32(len(l.TokenTypes))
			at[typ] = i
			l.TokenTypes = append(l.TokenTypes, typ)
		}
		idx[k] = i
	}
	return l, idx
}()

func (s *Server) semanticTokensFull(ctx context.Context, p *protocol.SemanticTokensParams) (any, error) {
	t, ok, err := targetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	return &protocol.SemanticTokens{Data: t.tokens(source.Span{Start: 0, End: source.Pos(len(t.doc.text()))})}, nil
}

func (s *Server) semanticTokensRange(ctx context.Context, p *protocol.SemanticTokensRangeParams) (any, error) {
	t, ok, err := targetOf(ctx, p.TextDocument.URI)
	if !ok {
		return nil, err
	}
	within, err := t.within(p.Range)
	if err != nil {
		return nil, err
	}
	return &protocol.SemanticTokens{Data: t.tokens(within)}, nil
}

// tokens encodes the tokens of the steps within span in the
// specification's relative form: for each token, the line delta, the
// start delta (from the previous token's start when on the same line),
// the length, the type and the modifiers, all in UTF-16 units. A token
// that crosses a line end is cut at it; steps are single lines, so this
// only guards against surprises.
func (t target) tokens(within source.Span) []uint32 {
	type tok struct{ line, char, length, typ uint32 }
	var toks []tok
	for _, st := range t.rep.Steps {
		if !overlaps(st.Span, within) {
			continue
		}
		for _, k := range st.Tokens {
			typ, known := tokenIndex[k.Kind]
			if !known || k.Span.Len() <= 0 || !overlaps(k.Span, within) {
				continue
			}
			sl, sc, el, ec := t.doc.mapper.Range(k.Span)
			if el != sl {
				ec = int(lspPosition(t.doc.mapper, t.doc.mapper.Line(sl).End).Character)
			}
			if ec <= sc {
				continue
			}
			toks = append(toks, tok{uint32(sl), uint32(sc), uint32(ec - sc), typ})
		}
	}
	sort.SliceStable(toks, func(i, j int) bool {
		if toks[i].line != toks[j].line {
			return toks[i].line < toks[j].line
		}
		return toks[i].char < toks[j].char
	})
	data := make([]uint32, 0, 5*len(toks))
	var line, char, length uint32
	for i, k := range toks {
		if i > 0 && k.line == line && k.char < char+length {
			continue // overlapping tokens are not allowed; keep the first
		}
		dl, dc := k.line-line, k.char
		if dl == 0 {
			dc = k.char - char
		}
		data = append(data, dl, dc, k.length, k.typ, 0)
		line, char, length = k.line, k.char, k.length
	}
	return data
}
