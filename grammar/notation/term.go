package notation

import (
	"strings"

	"walden/grammar/source"
)

// term reads the tokens between two separators: quantities (wherever
// they stand), parenthesised groups, and the words left over, which name
// the substance.
func (p *parser) term(toks []tok, sep Sep) *draftTerm {
	t := p.newTerm()
	t.Span = p.tokSpan(toks[0], toks[len(toks)-1])
	t.sep = sep
	// The term's quantities and notes are appended to the parser's shared
	// lists, and the term keeps their ranges.
	t.q0, t.n0 = int32(len(p.qlist)), int32(len(p.notes))
	t.q1, t.n1 = t.q0, t.n0
	if tk := &toks[0]; len(toks) == 1 && tk.kind == tWord && tk.marks&^(cSlash|cColon) == 0 && p.str[tk.start] != '@' {
		// One name word, the commonest term ("DMF", "NaN3"): no
		// quantity, nothing to check; a '/' (cSlash) may join a
		// mixture, which substance looks for.
		t.sub = ref(p.substance(toks, tk.marks).id)
		return t
	}
	var subBuf [2]*draftSubstance
	subs := subBuf[:0]
	run := -1          // start in toks of the words not yet taken, or -1
	var runMarks uint8 // the marks of the run's words, or-ed
	for k := 0; k < len(toks); {
		tk := &toks[k] // not a copy: most words are only looked at
		var q *draftQuantity
		var n int
		var errs source.ErrorList
		if tk.kind == tWord && p.str[tk.start] != '@' {
			// The quick test is made here, so that most name words cost
			// no call of quantity.
			if tk.mayStartQuantity() {
				q, n, errs = p.quantityAt(toks, k, true)
			}
			if q == nil {
				if tk.marks&(cCheck|cStop) != 0 { // a '>', '+' or '-' to look at
					p.wordChecks(*tk)
				}
				if run < 0 {
					run = k
				}
				runMarks |= tk.marks
				k++
				continue
			}
		}
		// Anything else ends the run of name words.
		if run >= 0 {
			subs = append(subs, p.substance(toks[run:k], runMarks))
			run, runMarks = -1, 0
		}
		switch {
		case q != nil:
			p.qlist = append(p.qlist, q.id)
			p.addErrs(errs)
			k += n
		case tk.kind == tGroup:
			p.group(*tk)
			k++
		default:
			subs = append(subs, p.reference(*tk))
			k++
		}
	}
	if run >= 0 {
		subs = append(subs, p.substance(toks[run:], runMarks))
	}
	t.q1, t.n1 = int32(len(p.qlist)), int32(len(p.notes))
	if len(subs) > 0 {
		t.sub = ref(subs[0].id)
		for _, s := range subs[1:] {
			p.errorf(int(s.Span.Start-p.base), int(s.Span.End-p.base), "two-substances",
				"second substance %s in one term after %s; separate substances with ' + ' (a reactant) or ', ' (a condition)",
				quote(p.substanceText(s)), quote(p.substanceText(subs[0])))
		}
		if s := subs[0]; s.Kind == Mixture {
			p.mixtureRatio(t, s)
		}
	}
	return t
}

// mixtureRatio takes the first ratio among the quantities of t, if any,
// as the ratio of its mixture s ("THF/water 4:1").
func (p *parser) mixtureRatio(t *draftTerm, s *draftSubstance) {
	for k := t.q0; k < t.q1; k++ {
		if id := p.qlist[k]; p.qtyDrafts.at(id).Kind == Ratio {
			// The term's quantities are the last of p.qlist: the
			// ratio is taken out of them.
			s.ratio = ref(id)
			copy(p.qlist[k:], p.qlist[k+1:])
			p.qlist = p.qlist[:len(p.qlist)-1]
			t.q1--
			return
		}
	}
}

// wordChecks reports the slips a chemist makes inside one word that the
// notation can recognise without knowing chemistry.
func (p *parser) wordChecks(tk tok) {
	w := p.str[tk.start:tk.end]
	if len(w) == 1 && w[0] == '-' {
		p.errorf(int(tk.start), int(tk.end), "half-arrow", "'-' stands alone; write '->' before the expected product, or delete it")
		return
	}
	if tk.marks&cCheck == 0 {
		return // no '>' or '+' to report
	}
	depth := 0
	for i := 0; i < len(w); i++ {
		c := w[i]
		if !checkedBytes[c] {
			continue // most bytes
		}
		switch c {
		case '[', '(':
			depth++
		case ']', ')':
			depth--
		case '>':
			p.errorf(int(tk.start)+i, int(tk.start)+i+1, "reaction-smiles",
				"'>' in %s: walden does not read reaction SMILES; write 'substrate + reagent, conditions -> product'", quote(w))
			return
		case '+':
			// Outside brackets '+' is no SMILES character: two substances
			// were joined without spaces. Inside parentheses it is part
			// of a name such as "(+)-camphor".
			if depth == 0 && i > 0 && i+1 < len(w) {
				p.errorf(int(tk.start)+i, int(tk.start)+i+1, "plus-spaces",
					"'+' inside %s; put a space on each side of '+' to separate substances: %s",
					quote(w), quote(w[:i]+" + "+w[i+1:]))
				return
			}
		}
	}
}

// checkedBytes marks the bytes wordChecks looks at.
var checkedBytes = func() (t [256]bool) {
	for _, c := range []byte("[]()>+") {
		t[c] = true
	}
	return t
}()

// reference reads "@label".
func (p *parser) reference(tk tok) *draftSubstance {
	name := p.str[tk.start+1 : tk.end]
	s := p.newSubstance()
	s.Span, s.Kind = p.tokSpan(tk, tk), Reference
	if name == "" {
		p.errorf(int(tk.start), int(tk.end), "reference-empty", "'@' with no label after it; write the label of an earlier step, as in '@mesylate'")
		return s
	}
	for k := 0; k < len(name); k++ {
		if !isLabelByte(name[k]) {
			p.errorf(int(tk.start)+1+k, int(tk.end), "reference-bad",
				"reference %s holds %s; a label is ASCII letters, digits, '_', '-' and \"'\"", quote("@"+name), quote(badRune(name[k:])))
			break
		}
	}
	return s
}

// mayStartQuantity is a quick test that rules out most name words
// before the slower reading: a quantity starts with a digit, a sign, a
// point, a non-ASCII minus or dash, or the first two letters of a word
// of words.tsv or of "at"/"for" (see quantityStart). It may pass a word
// that starts no quantity, never fail one that does. lex makes the test
// and notes its answer in the word's marks.
func (t *tok) mayStartQuantity() bool { return t.marks&cQty != 0 }

// quantity reads a quantity starting at toks[k]: a word such as "rt", a
// number with its unit (glued or as the next word), a ratio, optionally
// after "at" or "for", optionally a range "… to …". It returns the
// quantity, how many tokens it used, and the errors to report if the
// caller keeps it; nil when toks[k] does not start a quantity. When
// ranges is false it does not look for "to" (the upper end of a range).
func (p *parser) quantity(toks []tok, k int, ranges bool) (*draftQuantity, int, source.ErrorList) {
	if k >= len(toks) || toks[k].kind != tWord || !toks[k].mayStartQuantity() {
		return nil, 0, nil
	}
	return p.quantityAt(toks, k, ranges)
}

// quantityAt is quantity for a word toks[k] that passed mayStartQuantity.
func (p *parser) quantityAt(toks []tok, k int, ranges bool) (*draftQuantity, int, source.ErrorList) {
	words := 0
	for k+words < len(toks) && toks[k+words].kind == tWord {
		words++
	}
	wordAt := func(i int) string { return p.text(toks[k+i]) }
	// "at 60 °C", "for 3 h"
	if w := wordAt(0); words > 1 && (w[0]|0x20 == 'a' || w[0]|0x20 == 'f') && (foldsTo(w, "at") || foldsTo(w, "for")) {
		if q, n, errs := p.quantity(toks, k+1, ranges); q != nil && q.Kind != Bare {
			q.Span.Start = p.tokSpan(toks[k], toks[k]).Start
			return q, n + 1, errs
		}
	}
	q, n := p.single(toks[k:k+words], words == 1 || toks[k+1].kind != tWord)
	if q == nil {
		return nil, 0, nil
	}
	var errs source.ErrorList
	if ranges && n+1 < words+1 && n < words && foldsTo(wordAt(n), "to") {
		toTok := toks[k+n]
		if to, m, e2 := p.quantity(toks, k+n+1, false); to != nil && (to.Kind == q.Kind || q.Kind == Bare || to.Kind == Bare) {
			if q.Kind == Bare {
				q.Kind, q.unit = to.Kind, to.unit
			}
			q.to = ref(to.id)
			q.Span.End = to.Span.End
			return q, n + 1 + m, append(errs, e2...)
		}
		errs.Add(p.tokSpan(toTok, toTok), "range-end",
			"expected the upper end of the range after 'to', such as 'rt' or '25 °C'; write it or delete 'to'")
		q.Span.End = p.tokSpan(toTok, toTok).End
		n++
	}
	if q.Kind == Bare {
		errs.Add(q.Span, "missing-unit",
			"number "+quote(wordAt(0))+" has no unit; write one, as in '60 °C', '3 h', '1.5 eq' or '3 mol%'")
	}
	return q, n, errs
}

// single reads one quantity without a range from the words ws. last
// says that ws[0] is the last word of its term, where a number alone is
// a quantity missing its unit rather than the start of a name ("4 Å MS").
func (p *parser) single(ws []tok, last bool) (*draftQuantity, int) {
	// Words standing for quantities, longest first. quantityWord's quick
	// test of the first byte is made once here, for numbers mostly.
	for n := min(maxWordsInQuantityWord, len(ws)); n >= 1 && mayStartWord(p.str[ws[0].start]); n-- {
		if u, ok := p.quantityWord(ws[:n]); ok {
			q := p.newQuantity()
			q.Span, q.Kind, q.word = p.tokSpan(ws[0], ws[n-1]), u.kind, u.id
			return q, n
		}
	}
	w := p.text(ws[0])
	if ws[0].marks&cColon != 0 { // a ratio holds ':'
		var ok bool
		if p.nums, ok = ratioParts(w, p.nums[:0]); ok {
			q := p.newQuantity()
			q.Span, q.Kind = p.tokSpan(ws[0], ws[0]), Ratio
			if len(ws) > 1 && foldsTo(p.text(ws[1]), "v/v") {
				q.Span.End = p.tokSpan(ws[1], ws[1]).End
				return q, 2
			}
			return q, 1
		}
	}
	var num number
	if !readNumber(w, &num) {
		return nil, 0
	}
	q := p.newQuantity()
	q.Span, q.HasValue = p.tokSpan(ws[0], ws[0]), true
	if num.hasTo {
		to := p.newQuantity()
		to.Span, to.HasValue = p.span(int(ws[0].start)+num.toStart, int(ws[0].start)+num.end), true
		q.to = ref(to.id)
	}
	if w[num.end:] == "." {
		num.end++ // "2. equiv"
	}
	if rest := w[num.end:]; rest != "" {
		// Glued unit: "60°C", "3h", "1.5eq", "3mol%".
		u, ok := lookupUnit(rest)
		if !ok {
			return nil, 0 // "18-crown-6", "2-propanol", "4Å"
		}
		p.setUnit(q, u, int(ws[0].start)+num.end, int(ws[0].end))
		return q, 1
	}
	if len(ws) > 1 {
		next := p.text(ws[1])
		// Two-word units: "mol %", "deg C", "° C", "wt %".
		if len(ws) > 2 {
			if next == "mol" || next == "°" || foldsTo(next, "deg") || next == "wt" {
				if u, ok := lookupUnit(next + p.text(ws[2])); ok {
					p.setUnit(q, u, int(ws[1].start), int(ws[2].end))
					q.Span.End = p.tokSpan(ws[2], ws[2]).End
					return q, 3
				}
			}
		}
		if u, ok := lookupUnit(next); ok {
			p.setUnit(q, u, int(ws[1].start), int(ws[1].end))
			q.Span.End = p.tokSpan(ws[1], ws[1]).End
			return q, 2
		}
		if foldsTo(next, "to") {
			q.Kind = Bare
			return q, 1
		}
	}
	if !last {
		return nil, 0
	}
	q.Kind = Bare
	return q, 1
}

// setUnit gives q, and the upper end of its range if it has one, the
// unit u written at a:b. It is a method rather than a closure in single,
// which would keep q in memory rather than in a register.
func (p *parser) setUnit(q *draftQuantity, u unit, a, b int) {
	q.Kind, q.unit, q.UnitSpan = u.kind, u.id, p.span(a, b)
	if to := p.qty(q.to); to != nil {
		to.Kind, to.unit = u.kind, u.id
	}
}

// group reads a parenthesised group: quantities separated by commas, or
// else a note.
func (p *parser) group(g tok) {
	innerEnd := g.end
	if g.closed() {
		innerEnd--
	}
	toks := p.lex(p.groupBuf[:0], int(g.start)+1, int(innerEnd))
	switch {
	case !g.closed() && len(toks) == 0:
		p.errorf(int(g.start), int(g.start+1), "unclosed-paren", "'(' is not closed; write an amount and ')', as in '(1.5 eq)'")
		return
	case !g.closed():
		p.errorf(int(g.start), int(g.start+1), "unclosed-paren",
			"'(' is not closed; write ')' after %s", quote(strings.TrimSpace(p.str[g.start+1:g.end])))
	case len(toks) == 0:
		p.errorf(int(g.start), int(g.end), "empty-parens", "empty parentheses; write an amount such as '(1.5 eq)' or delete them")
		return
	}
	// The pieces between commas are ranges of toks: none is copied.
	from := 0
	for k, tk := range toks {
		if tk.kind == tComma {
			p.groupPiece(toks[from:k])
			from = k + 1
		}
	}
	p.groupPiece(toks[from:])
}

// groupPiece reads the tokens of a group between two commas: quantities,
// or else a note.
func (p *parser) groupPiece(piece []tok) {
	if len(piece) == 0 {
		return
	}
	var errs source.ErrorList
	mark := len(p.qlist)
	for k := 0; k < len(piece); {
		q, n, e := p.quantity(piece, k, true)
		if q == nil {
			p.qlist = p.qlist[:mark]
			break
		}
		p.qlist, errs = append(p.qlist, q.id), append(errs, e...)
		k += n
	}
	if len(p.qlist) > mark {
		p.addErrs(errs)
	} else {
		p.notes = append(p.notes, p.tokSpan(piece[0], piece[len(piece)-1]))
	}
}

// substance reads a run of words that are not quantities: one word
// (SMILES or a name), a phrase (a name of several words), or a mixture
// of such parts joined by '/' or a dash ("THF/water", "acetone–water").
func (p *parser) substance(run []tok, marks uint8) *draftSubstance {
	// marks, the words' marks or-ed, spares most runs the look for joins.
	if marks&(cSlash|cDash) == 0 || !p.anyJoins(run) {
		s := p.newSubstance()
		first, last := run[0], run[len(run)-1]
		s.Span, s.Kind, s.plain = p.tokSpan(first, last), Word, true
		if len(run) == 1 {
			return s
		}
		s.Kind = Phrase
		for i := 1; i < len(run); i++ {
			if run[i].start != run[i-1].end+1 || p.str[run[i-1].end] != ' ' {
				s.plain = false // words apart by other spaces: the text joins them by one
				break
			}
		}
		return s
	}
	return p.mixture(run)
}

// mixture reads a run of words that holds a mark joining the parts of a
// mixture. It is apart from substance, whose common case then needs no
// room on the stack for the buffers below.
func (p *parser) mixture(run []tok) *draftSubstance {
	// Cut the run at its joining marks into parts, each a list
	// of pieces (words or parts of words), in stack buffers.
	type piece struct{ start, end int }
	var pieceBuf [16]piece
	var boundBuf, joinBuf [8]int
	var markBuf [8]joinMark
	pieces, bounds, joins := pieceBuf[:0], boundBuf[:0], joinBuf[:0]
	plain := true // only '/' marks, no spaces: the source text is the mixture's text
	for _, tk := range run {
		start := int(tk.start)
		for _, j := range p.mixtureJoins(markBuf[:0], tk) {
			if j.start > start {
				pieces = append(pieces, piece{start, j.start})
			}
			bounds, joins = append(bounds, len(pieces)), append(joins, j.start)
			plain = plain && j.end-j.start == 1 && p.str[j.start] == '/'
			start = j.end
		}
		if int(tk.end) > start {
			pieces = append(pieces, piece{start, int(tk.end)})
		}
	}
	bounds = append(bounds, len(pieces))
	plain = plain && len(run) == 1
	build := func(ps []piece) *draftSubstance {
		s := p.newSubstance()
		s.Span, s.Kind, s.plain = p.span(ps[0].start, ps[len(ps)-1].end), Word, true
		if len(ps) == 1 {
			return s
		}
		s.Kind = Phrase
		for i := 1; i < len(ps); i++ {
			// words one ASCII space apart: the source text is the name
			s.plain = s.plain && ps[i].start == ps[i-1].end+1 && p.str[ps[i-1].end] == ' '
		}
		return s
	}
	whole := p.tokSpan(run[0], run[len(run)-1])
	if len(bounds) == 1 { // no mark joins parts after all ("F/C=C/F")
		s := build(pieces)
		s.Span = whole
		return s
	}
	m := p.newSubstance()
	m.Span, m.Kind = whole, Mixture
	m.p0 = int32(len(p.slist))
	from := 0
	for i, to := range bounds {
		ps := pieces[from:to]
		from = to
		if len(ps) == 0 {
			at := joins[min(i, len(joins)-1)]
			side := "after"
			if i < len(joins) {
				side = "before"
			}
			p.errorf(at, at+1, "mixture-part", "expected a substance %s %s in a mixture; write both parts, as in 'THF/water'",
				side, quote(badRune(p.str[at:])))
			plain = false
			continue
		}
		p.slist = append(p.slist, build(ps).id)
	}
	m.p1 = int32(len(p.slist))
	// A plain mixture's text is its one word; any other's is its parts'
	// texts joined by '/'.
	m.plain = plain
	return m
}

// anyJoins reports whether a word of run may join a mixture.
func (p *parser) anyJoins(run []tok) bool {
	for _, tk := range run {
		if tk.marks&(cSlash|cDash) == 0 {
			continue // no '/' and no dash: most words
		}
		w := p.str[tk.start:tk.end]
		if strings.IndexByte(w, '/') >= 0 || strings.IndexByte(w, 0xE2) >= 0 && (strings.Contains(w, "–") || strings.Contains(w, "—")) {
			return true
		}
	}
	return false
}

// mixtureJoins returns the marks in a word that join the parts of a
// mixture: an en or em dash anywhere (never in SMILES), a word that is
// only '/', and '/' inside a word when no part holds a SMILES bond or
// bracket character ("THF/water", but not "F/C=C/F", where '/' is a
// double-bond stereo mark).
func (p *parser) mixtureJoins(out []joinMark, tk tok) []joinMark {
	w := p.str[tk.start:tk.end]
	if w == "/" {
		return append(out, joinMark{int(tk.start), int(tk.end)})
	}
	slashes := tk.marks&cSlash != 0 && !containsSMILESMark(w) && !foldsTo(w, "o/n") && !foldsTo(w, "v/v")
	if !slashes && tk.marks&cDash == 0 {
		return out // no '/' that joins, and no dash
	}
	for i := 0; i < len(w); {
		switch c := w[i]; {
		case c == '/' && slashes:
			out = append(out, joinMark{int(tk.start) + i, int(tk.start) + i + 1})
			i++
		case c == 0xE2 && (strings.HasPrefix(w[i:], "–") || strings.HasPrefix(w[i:], "—")):
			out = append(out, joinMark{int(tk.start) + i, int(tk.start) + i + 3})
			i += 3
		default:
			i++
		}
	}
	return out
}

// containsSMILESMark reports whether w holds a SMILES bond or bracket
// character, as strings.ContainsAny(w, "=#@[]()\\") does without making
// its set on every call.
func containsSMILESMark(w string) bool {
	for i := 0; i < len(w); i++ {
		if smilesMarks[w[i]] {
			return true
		}
	}
	return false
}

var smilesMarks = func() (t [256]bool) {
	for _, c := range []byte("=#@[]()\\") {
		t[c] = true
	}
	return t
}()

// joinMark is where a mark joining two parts of a mixture stands.
type joinMark struct{ start, end int }
