package notation

import (
	"strings"
	"unicode/utf8"

	"walden/grammar/source"
)

// tokKind is the kind of a lexical token of a step line.
type tokKind uint8

const (
	tWord  tokKind = iota + 1 // a run of non-space text: SMILES, name, number, unit
	tGroup                    // "( … )" opened at the start of a word and closed before a break
	tPlus                     // "+"
	tComma                    // "," that separates
	tArrow                    // "->" or "→"
)

// tok is a token with its byte range in the line. A group's range
// includes its parentheses (the closing one may be missing). It is 12
// bytes, its offsets int32 (a line read is at most MaxLineLength bytes),
// and has four fields, so that the compiler keeps a copy of one in
// registers: a struct of more fields is copied through memory, and
// tokens are copied for every word of a line.
type tok struct {
	kind       tokKind
	marks      uint8 // for tWord: the byteClass bits of its bytes, or-ed, and cQty; for tGroup: cClosed
	start, end int32
}

// closed reports, for a tGroup, whether its ')' was found.
func (t tok) closed() bool { return t.marks&cClosed != 0 }

// spaceAt returns the length of the whitespace character at i, or 0.
// Besides space and tab it accepts the no-break and thin spaces that
// word processors put between a number and its unit ("60 °C").
func (p *parser) spaceAt(i, end int) int {
	if i >= end {
		return 0
	}
	switch c := p.str[i]; c {
	case ' ', '\t':
		return 1
	case 0xC2: // U+00A0 no-break space
		if i+1 < end && p.str[i+1] == 0xA0 {
			return 2
		}
	case 0xE2: // U+2002, U+2003, U+2009 thin space, U+202F narrow no-break space
		if i+2 < end && p.str[i+1] == 0x80 {
			switch p.str[i+2] {
			case 0x82, 0x83, 0x89, 0xAF:
				return 3
			}
		}
	}
	return 0
}

// arrowAt returns the length of an arrow at i ("->" or "→"), or 0. A
// hyphen followed by '>' never occurs in SMILES, so the arrow needs no
// spaces around it.
func (p *parser) arrowAt(i, end int) int {
	switch {
	case i+1 < end && p.str[i] == '-' && p.str[i+1] == '>':
		return 2
	case i+2 < end && p.str[i] == 0xE2 && p.str[i+1] == 0x86 && p.str[i+2] == 0x92: // U+2192 →
		return 3
	case i+2 < end && p.str[i] == 0xE2 && p.str[i+1] == 0x9F && p.str[i+2] == 0xB6: // U+27F6 ⟶
		return 3
	}
	return 0
}

// commaSeparates reports whether the comma at i separates terms. A comma
// followed by a space always does. One followed by more text is part of a
// name when it sits in a locant list such as "1,4-dioxane" or
// "N,N-dimethylformamide" (letters or digits on both sides and a hyphen
// later in the word); otherwise it still separates, forgiving a missing
// space ("DMF,60 °C").
func (p *parser) commaSeparates(i, end int) bool {
	if i+1 >= end || p.spaceAt(i+1, end) > 0 || i == 0 {
		return true
	}
	prev, next := p.str[i-1], p.str[i+1]
	if !(isDigitByte(prev) || isUpperByte(prev) || prev == '\'') || !(isDigitByte(next) || isUpperByte(next)) {
		return true
	}
	for j := i + 1; j < end && p.spaceAt(j, end) == 0; j++ {
		if p.str[j] == '-' {
			return false
		}
		if p.str[j] == ',' && j+1 < end && p.spaceAt(j+1, end) > 0 {
			return true
		}
	}
	return true
}

func isUpperByte(c byte) bool { return 'A' <= c && c <= 'Z' }

// Byte classes. A word is scanned byte by byte with one table lookup,
// without decoding UTF-8: most bytes have class 0 and simply continue
// it. The others are the bytes at which a word may end (checked in
// full by breakAt) and the bytes later readings look for, which the
// lexer notes in tok.marks so that those readings skip the words that
// hold none (nearly all). A continuation byte of UTF-8 is none of these.
const (
	// cStop: ' ', '\t', ',', '-' and the first bytes of the no-break
	// spaces and arrows (0xC2, 0xE2), at which a word may end.
	cStop uint8 = 1 << iota
	// cSlash: '/', which may join the parts of a mixture (anyJoins).
	cSlash
	// cDash: 0xE2, the first byte of the en and em dashes, which may
	// join the parts of a mixture (anyJoins).
	cDash
	// cCheck: '>' and '+', which wordChecks reports inside a word.
	cCheck
	// cColon: ':', which a ratio holds ("4:1"), and a label at its end.
	cColon
	// cQty is no byte class: lex sets it on a word that passes
	// mayStartQuantity, whose quick test it makes at the first byte
	// while that is at hand, so that most name words cost no call.
	cQty
	// cClosed is no byte class either: lex sets it on a group whose ')'
	// it found.
	cClosed
)

var byteClass = func() (t [256]uint8) {
	for _, c := range []byte{' ', '\t', ',', '-', 0xC2, 0xE2} {
		t[c] |= cStop
	}
	t['/'] |= cSlash
	t[0xE2] |= cDash
	t[':'] |= cColon
	t['>'] |= cCheck
	t['+'] |= cCheck
	return t
}()

// startsToken marks the first bytes of spaces and of the tokens other
// than words, which lex checks in full before it starts a word.
var startsToken = func() (t [256]bool) {
	for _, c := range []byte{' ', '\t', 0xC2, 0xE2, '-', '+', ',', '('} {
		t[c] = true
	}
	return t
}()

// breakAt reports whether a word cannot continue at i: the end, a space,
// a separating comma or an arrow.
func (p *parser) breakAt(i, end int) bool {
	return i >= end || p.spaceAt(i, end) > 0 || p.arrowAt(i, end) > 0 ||
		p.str[i] == ',' && p.commaSeparates(i, end)
}

// matchParen returns the index of the ')' closing the '(' at i, or -1.
func (p *parser) matchParen(i, end int) int {
	depth := 0
	for j := i; j < end; j++ {
		switch p.str[j] {
		case '(':
			depth++
		case ')':
			depth--
			if depth == 0 {
				return j
			}
		}
	}
	return -1
}

// lex appends the tokens of src[i:end] to toks. SMILES hold no spaces, so every
// separator that could also be a SMILES character ('+', '(') is a
// separator only at the start of a word; ',' and arrows never occur in
// SMILES and separate anywhere (see commaSeparates for names).
func (p *parser) lex(toks []tok, i, end int) []tok {
	// src ends at end, which spares the loops bounds checks.
	src := p.str[:end]
	for i < len(src) {
		c := src[i]
		// A letter, digit or bracket starts a word: only the bytes of
		// startsToken need the checks below.
		if startsToken[c] {
			if c == ' ' || c == '\t' {
				i++
				continue
			}
			if n := p.spaceAt(i, end); n > 0 {
				i += n
				continue
			}
			if c == '-' || c == 0xE2 { // the first bytes of the arrows
				if n := p.arrowAt(i, end); n > 0 {
					toks = addTok(toks, tArrow, 0, i, i+n)
					i += n
					continue
				}
			}
			switch c {
			case '+':
				toks = addTok(toks, tPlus, 0, i, i+1)
				i++
				continue
			case ',':
				toks = addTok(toks, tComma, 0, i, i+1)
				i++
				continue
			case '(':
				// "(S)-4-phenylbutan-2-ol" is a name that starts with a
				// parenthesis; "(1.5 eq)" stands apart and is a group.
				close := p.matchParen(i, end)
				if close < 0 {
					toks = addTok(toks, tGroup, 0, i, end)
					i = end
					continue
				}
				if close+1 < len(src) && src[close+1] == ' ' || p.breakAt(close+1, end) {
					toks = addTok(toks, tGroup, cClosed, i, close+1)
					i = close + 1
					continue
				}
			}
		}
		// Most bytes continue a word by the table alone, and the commonest
		// others, a space that ends it, a hyphen that is no arrow or a
		// comma, are decided here rather than by breakAt.
		j := i
		var marks uint8
		// Four bytes at a time while none needs a look.
		for len(src)-j >= 4 {
			w := src[j : j+4]
			if byteClass[w[0]]|byteClass[w[1]]|byteClass[w[2]]|byteClass[w[3]] != 0 {
				break
			}
			j += 4
		}
	scan:
		for j < len(src) {
			cl := byteClass[src[j]]
			if cl == 0 {
				j++
				continue
			}
			if cl&cStop != 0 {
				c := src[j]
				if c == ' ' || c == '\t' {
					break
				}
				switch c {
				case '-':
					if j+1 < len(src) && src[j+1] == '>' {
						break scan // an arrow
					}
				case ',':
					// A comma before a space, the commonest, separates.
					if j+1 < len(src) && src[j+1] == ' ' || p.commaSeparates(j, end) {
						break scan
					}
				default: // 0xC2, 0xE2: a space, an arrow or a letter
					if p.breakAt(j, end) {
						break scan
					}
				}
			}
			marks |= cl
			j++
		}
		switch quantityStart[c] { // mayStartQuantity
		case qsAlways:
			marks |= cQty
		case qsPair:
			second := byte(' ') // a word of one letter is followed by the joining space
			if j-i > 1 {
				second = src[i+1]
			}
			if quantityStartPair(c, second) {
				marks |= cQty
			}
		}
		toks = addTok(toks, tWord, marks, i, j)
		i = j
	}
	return toks
}

// addTok appends a token. A tok has four fields, which the compiler
// keeps in registers: the literal is stored field by field, with no
// copy through the stack.
func addTok(toks []tok, kind tokKind, marks uint8, start, end int) []tok {
	return append(toks, tok{kind: kind, marks: marks, start: int32(start), end: int32(end)})
}

// text returns the bytes of t as a string.
func (p *parser) text(t tok) string { return p.str[t.start:t.end] }

// quote shortens s for a message.
func quote(s string) string {
	const max = 40
	if len(s) > max {
		cut := max
		for cut > 0 && !utf8.RuneStart(s[cut]) {
			cut--
		}
		s = s[:cut] + "…"
	}
	return "'" + strings.ReplaceAll(s, "'", "’") + "'"
}

// tokSpan converts the range from the start of a to the end of b into
// host offsets.
func (p *parser) tokSpan(a, b tok) source.Span {
	return p.span(int(a.start), int(b.end))
}
