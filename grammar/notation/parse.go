package notation

import (
	"encoding/binary"
	"fmt"
	"runtime"
	"strings"
	"sync"
	"unicode/utf8"

	"walden/grammar/source"
)

// MaxLineLength is the longest step line Parse reads, in bytes. A longer
// line gets one error and an empty Step: no chemist writes a 16 KiB
// reaction, and refusing keeps every later stage bounded.
const MaxLineLength = 16 << 10

// maxErrors bounds the errors reported for one line, so that a pasted
// binary blob yields a short list.
const maxErrors = 50

// parser holds the state of one Parse call.
type parser struct {
	src  []byte
	str  string // src as a string: node texts are substrings of it, which costs no allocation
	base source.Pos
	errs source.ErrorList

	// Nodes are carved from small slabs: a step has a dozen nodes, and
	// one allocation per node would dominate the parse time.
	termSlab []Term
	subSlab  []Substance
	qtySlab  []Quantity
	tokBuf   [32]tok
	groupBuf [16]tok

	mark0  *Mark // the step's Mark, Label and Arrow, allocated with it
	label0 *Label
	arrow0 *Arrow

	// batch is set by ParseLines: slabs are large and shared by lines.
	// There a step's optional nodes come from slabs of their own, only
	// for the lines that have them: most lines have no mark, label or
	// comment, and setting room aside for them in every step would make
	// a page's tree bigger by a tenth.
	batch       bool
	stepSlab    []Step
	markSlab    []Mark
	labelSlab   []Label
	arrowSlab   []Arrow
	commentSlab []Comment
	qptr        []*Quantity // backing of the terms' Quantities lists
	ptrSlab     []*Term
}

const (
	slabSize  = 6   // nodes per slab when a line needs more than sizeSlabs foresaw
	batchSlab = 128 // nodes per slab in ParseLines
)

// parsers keeps parser state, token buffers included, between calls:
// the server parses every line of a page on each edit.
var parsers = sync.Pool{New: func() any { return new(parser) }}

// release clears p of everything the returned tree or errors hold and
// puts it back in the pool.
func (p *parser) release() {
	// Drop what the tree and the errors hold; the token buffers hold no
	// pointers and need no clearing.
	p.src, p.str, p.errs = nil, "", nil
	p.termSlab, p.subSlab, p.qtySlab, p.qptr = nil, nil, nil, nil
	p.mark0, p.label0, p.arrow0 = nil, nil, nil
	parsers.Put(p)
}

// sizeSlabs makes the node slabs as large as the tokens say they will
// need to be, so that most lines take one allocation per kind of node.
func (p *parser) sizeSlabs(toks []tok) {
	if p.batch {
		return
	}
	terms, subs, qtys := 1, 0, 0
	for _, t := range toks {
		switch t.kind {
		case tPlus, tComma, tArrow:
			terms++
		case tGroup:
			qtys += 2
		case tWord:
			switch c := p.src[t.start]; {
			case isDigitByte(c) || c == '-' || c == '+' || c == '.' ||
				c == 0xE2 && strings.HasPrefix(p.str[t.start:], "−") || strings.HasPrefix(p.str[t.start:], "–"):
				qtys++
			case quantityWordStarts[c|0x20]:
				if _, ok := p.quantityWord([]tok{t}); ok {
					qtys++
				} else {
					subs++
				}
			default:
				subs++
			}
		}
	}
	p.termSlab = make([]Term, 0, terms)
	p.subSlab = make([]Substance, 0, min(subs, terms+1))
	p.qtySlab = make([]Quantity, 0, min(qtys, 2*terms))
}

func (p *parser) slabSize() int {
	if p.batch {
		return batchSlab
	}
	return slabSize
}

// newTerm, newSubstance and newQuantity return a zero node carved from
// its slab. A slab is never reused, so the node is always fresh: callers
// set its fields one by one rather than assigning a whole struct, which
// would write every pointer field through the garbage collector's write
// barrier.
func (p *parser) newTerm() *Term {
	if len(p.termSlab) == cap(p.termSlab) {
		p.termSlab = make([]Term, 0, p.slabSize())
	}
	p.termSlab = p.termSlab[:len(p.termSlab)+1]
	return &p.termSlab[len(p.termSlab)-1]
}

func (p *parser) newSubstance() *Substance {
	if len(p.subSlab) == cap(p.subSlab) {
		p.subSlab = make([]Substance, 0, p.slabSize())
	}
	p.subSlab = p.subSlab[:len(p.subSlab)+1]
	return &p.subSlab[len(p.subSlab)-1]
}

func (p *parser) newQuantity() *Quantity {
	if len(p.qtySlab) == cap(p.qtySlab) {
		p.qtySlab = make([]Quantity, 0, p.slabSize())
	}
	p.qtySlab = p.qtySlab[:len(p.qtySlab)+1]
	return &p.qtySlab[len(p.qtySlab)-1]
}

// Parse reads one step line. line must not hold its line end; base is
// the offset of line[0] in the host document, and every position in the
// returned tree and errors is base-relative, i.e. a host offset.
//
// Parse always returns a Step, holding every part it could read, and
// every syntax error it found, sorted by position. It recovers at each
// separator (" + ", ", ", "->"), so one bad term does not hide the rest of
// the line. It does not judge chemistry: whether a word is a known name or
// valid SMILES, or a term a sensible solvent, is left to analyze/.
func Parse(line []byte, base source.Pos) (*Step, source.ErrorList) {
	p := parsers.Get().(*parser)
	defer p.release()
	p.src, p.base = line, base
	if len(line) <= MaxLineLength {
		p.str = string(line) // a longer line is refused unread
	}
	return p.parse()
}

// ParseLines parses the step lines of one host text, given by their
// spans (as grammar/notebook finds them), and returns the steps and each
// line's errors (nil for a clean line), in the order of spans. It gives
// the same trees as calling Parse on each line, but shares one copy of
// the text and large node slabs among the lines, so that reading a whole
// page costs a few allocations per hundred lines instead of several per
// line. A span outside text gives an empty Step and a "bad-span" error.
func ParseLines(text []byte, spans []source.Span) ([]*Step, []source.ErrorList) {
	host := string(text)
	steps := make([]*Step, len(spans))
	errs := make([]source.ErrorList, len(spans))
	// A long page is cut into one run of lines per core, each read by a
	// parser of its own: lines are independent, and on opening a page the
	// chemist waits for the whole of it. Short pages are not worth a
	// goroutine.
	workers := min(runtime.GOMAXPROCS(0), len(spans)/parallelLines)
	if workers < 2 {
		parseRun(text, host, spans, steps, errs)
		return steps, errs
	}
	var wg sync.WaitGroup
	for w := range workers {
		lo, hi := w*len(spans)/workers, (w+1)*len(spans)/workers
		wg.Add(1)
		go func() {
			defer wg.Done()
			parseRun(text, host, spans[lo:hi], steps[lo:hi], errs[lo:hi])
		}()
	}
	wg.Wait()
	return steps, errs
}

// parallelLines is the fewest lines per goroutine in ParseLines.
const parallelLines = 1000

// parseRun parses the lines at spans into steps and errs with one
// parser, as ParseLines describes.
func parseRun(text []byte, host string, spans []source.Span, steps []*Step, errs []source.ErrorList) {
	p := &parser{batch: true}
	for i, sp := range spans {
		if sp.Start < 0 || sp.Start > sp.End || int(sp.End) > len(text) {
			// A caller's mistake, reported rather than panicking.
			st := &Step{Span: sp}
			errs[i].Add(sp, "bad-span", fmt.Sprintf("line span %d-%d lies outside the %d-byte text", sp.Start, sp.End, len(text)))
			steps[i] = st
			continue
		}
		p.src, p.base, p.errs = text[sp.Start:sp.End], sp.Start, nil
		p.str = ""
		if sp.Len() <= MaxLineLength {
			p.str = host[sp.Start:sp.End]
		}
		steps[i], errs[i] = p.parse()
	}
}

// slabNode returns one zero node carved from *slab, starting a new slab
// of batchSlab nodes when it is full.
func slabNode[T any](slab *[]T) []T {
	if len(*slab) == cap(*slab) {
		*slab = make([]T, 0, batchSlab)
	}
	n := len(*slab)
	*slab = (*slab)[:n+1]
	return (*slab)[n : n+1 : n+1]
}

// markNode, labelNode and arrowNode return the node for the step being
// parsed: allocated with it by Parse, carved on first use by ParseLines.
func (p *parser) markNode() *Mark {
	if p.mark0 == nil {
		p.mark0 = &slabNode(&p.markSlab)[0]
	}
	return p.mark0
}

func (p *parser) labelNode() *Label {
	if p.label0 == nil {
		p.label0 = &slabNode(&p.labelSlab)[0]
	}
	return p.label0
}

func (p *parser) arrowNode() *Arrow {
	if p.arrow0 == nil {
		p.arrow0 = &slabNode(&p.arrowSlab)[0]
	}
	return p.arrow0
}

// stepNodes holds a step and its single nodes, allocated together.
type stepNodes struct {
	st      Step
	mark    Mark
	label   Label
	arrow   Arrow
	comment Comment
}

// parse reads p.src.
func (p *parser) parse() (*Step, source.ErrorList) {
	line := p.src
	var st *Step
	var comment *Comment
	if p.batch {
		st = &slabNode(&p.stepSlab)[0]
		p.mark0, p.label0, p.arrow0 = nil, nil, nil
	} else {
		one := new(stepNodes)
		p.mark0, p.label0, p.arrow0 = &one.mark, &one.label, &one.arrow
		st, comment = &one.st, &one.comment
	}
	st.Span = p.span(0, len(line))
	if len(line) > MaxLineLength {
		p.errorf(0, len(line), "line-too-long",
			"step line is %d bytes long; walden reads at most %d bytes per line: split the line or shorten it",
			len(line), MaxLineLength)
		return st, p.errs
	}
	p.checkBytes()
	end := len(line)
	if c := p.commentStart(); c >= 0 {
		if comment == nil {
			comment = &slabNode(&p.commentSlab)[0]
		}
		comment.Span, comment.Text = p.span(c, end), strings.TrimSpace(p.str[c+2:end])
		st.Comment = comment
		end = c
	}
	i := p.skipSpace(0, end)
	i = p.mark(st, i, end)
	toks := p.lex(p.tokBuf[:0], i, end)
	p.sizeSlabs(toks)
	toks = p.label(st, toks)
	p.terms(st, toks)
	if len(p.errs) > maxErrors {
		p.errs = p.errs[:maxErrors]
		p.errorf(0, len(line), "too-many-errors", "more than %d errors on this line; only the first are shown", maxErrors)
	}
	p.errs.Sort()
	return st, p.errs
}

// span converts a range of the line into host offsets.
func (p *parser) span(a, b int) source.Span {
	return source.Span{Start: p.base + source.Pos(a), End: p.base + source.Pos(b)}
}

func (p *parser) errorf(a, b int, code, format string, args ...any) {
	if len(p.errs) > maxErrors {
		return
	}
	p.errs.Add(p.span(a, b), code, fmt.Sprintf(format, args...))
}

func (p *parser) skipSpace(i, end int) int {
	for n := p.spaceAt(i, end); n > 0; n = p.spaceAt(i, end) {
		i += n
	}
	return i
}

// checkBytes reports invalid UTF-8 and control characters, which no
// editor shows faithfully; the bytes stay in the words that hold them.
func (p *parser) checkBytes() {
	for i := 0; i < len(p.src); {
		// Eight printable ASCII bytes at a time: the common case.
		if i+8 <= len(p.src) && printable8(binary.LittleEndian.Uint64(p.src[i:])) {
			i += 8
			continue
		}
		c := p.src[i]
		if c < utf8.RuneSelf {
			if c < 0x20 && c != '\t' || c == 0x7F {
				p.errorf(i, i+1, "control-character", "control character U+%04X found in a step line; delete it", c)
			}
			i++
			continue
		}
		r, size := utf8.DecodeRune(p.src[i:])
		if r == utf8.RuneError && size == 1 {
			j := i + 1
			for j < len(p.src) && p.src[j] >= utf8.RuneSelf && !utf8.FullRune(p.src[j:]) {
				j++
			}
			p.errorf(i, j, "invalid-utf8", "invalid UTF-8 byte 0x%02X; the file must be saved as UTF-8", c)
			i = j
			continue
		}
		i += size
	}
}

// printable8 reports whether the eight bytes of x are all in 0x20–0x7E.
func printable8(x uint64) bool {
	const ones, highs = 0x0101010101010101, 0x8080808080808080
	below := (x - 0x20*ones) &^ x & highs                      // some byte < 0x20
	del := ((x ^ 0x7F*ones) - ones) &^ (x ^ 0x7F*ones) & highs // some byte == 0x7F
	return (x|below|del)&highs == 0
}

// commentStart returns where "//" begins a comment, or -1. The marker
// must open the line or follow a space: a SMILES never holds a space and
// never starts with '/', so " //" cannot be part of one.
func (p *parser) commentStart() int {
	for from := 0; ; {
		k := strings.Index(p.str[from:], "//")
		if k < 0 {
			return -1
		}
		i := from + k
		if i == 0 || p.src[i-1] == ' ' || p.src[i-1] == '\t' || p.skipSpace(0, i) == i {
			return i
		}
		from = i + 1
	}
}

// mark reads a status mark "[x]", "[X]", "[-]" or "[ ]" at i. A mark
// must be followed by a space or the end: "[x]" and "[-]" are not SMILES
// bracket atoms (no element symbol is x or empty), and the space keeps
// the mark apart from any word after it.
func (p *parser) mark(st *Step, i, end int) int {
	if i+2 >= end || p.src[i] != '[' || p.src[i+2] != ']' {
		return i
	}
	var state MarkState
	switch p.src[i+1] {
	case ' ':
		state = Open
	case 'x', 'X':
		state = Done
	case '-':
		state = Skipped
	default:
		return i
	}
	st.Mark = p.markNode()
	st.Mark.Span, st.Mark.State = p.span(i, i+3), state
	if i+3 < end && p.spaceAt(i+3, end) == 0 {
		p.errorf(i, i+3, "mark-space", "status mark %s is followed by %s; put a space after the mark",
			quote(p.str[i:i+3]), quote(p.wordAt(i+3, end)))
		return i + 3
	}
	return p.skipSpace(i+3, end)
}

// wordAt returns the text from i to the next space.
func (p *parser) wordAt(i, end int) string {
	j := i
	for j < end && p.spaceAt(j, end) == 0 {
		j++
	}
	return p.str[i:j]
}

// label reads "name:" from the first token. A SMILES never ends with
// ':' (it is a bond and needs an atom after it), so a first word ending
// in a colon is a label.
func (p *parser) label(st *Step, toks []tok) []tok {
	if len(toks) == 0 || toks[0].kind != tWord {
		return toks
	}
	if p.numbered(toks) {
		t := toks[0]
		st.Label = p.labelNode()
		st.Label.Span, st.Label.Name, st.Label.NameSpan = p.span(t.start, t.end), p.str[t.start:t.end-1], p.span(t.start, t.end-1)
		if len(toks) == 1 {
			p.errorf(t.start, t.end, "missing-substrate", "step number %s with no step after it; write the substrate after it", quote(p.text(t)))
		}
		return toks[1:]
	}
	if p.src[toks[0].end-1] != ':' {
		return toks
	}
	t := toks[0]
	name := p.str[t.start : t.end-1]
	st.Label = p.labelNode()
	st.Label.Span, st.Label.Name, st.Label.NameSpan = p.span(t.start, t.end), name, p.span(t.start, t.end-1)
	switch {
	case name == "":
		p.errorf(t.start, t.end, "label-empty", "':' with no label before it; write a label such as 'azide:' or delete the ':'")
	default:
		for k := 0; k < len(name); k++ {
			if !isLabelByte(name[k]) {
				p.errorf(t.start, t.end-1, "label-bad",
					"step label %s holds %s; a label is ASCII letters, digits, '_', '-' and \"'\" followed by ':'",
					quote(name), quote(badRune(name[k:])))
				break
			}
		}
	}
	if len(toks) == 1 {
		p.errorf(t.start, t.end, "missing-substrate", "label %s names no step; write the substrate after it", quote(name+":"))
	}
	return toks[1:]
}

// numbered reports whether the line starts with a step number as in a
// numbered list ("1.", "12)"), which labels the step like "1:". No SMILES
// starts with a digit; "2. equiv" (a unit next) is not taken for one.
func (p *parser) numbered(toks []tok) bool {
	t := toks[0]
	w := p.str[t.start:t.end]
	if len(w) < 2 || w[len(w)-1] != '.' && w[len(w)-1] != ')' {
		return false
	}
	for i := 0; i < len(w)-1; i++ {
		if !isDigitByte(w[i]) {
			return false
		}
	}
	if len(toks) > 1 && toks[1].kind == tWord {
		if _, ok := lookupUnit(p.text(toks[1])); ok {
			return false
		}
	}
	return true
}

// badRune returns the first character of s.
func badRune(s string) string {
	_, size := utf8.DecodeRuneInString(s)
	return s[:size]
}

// segment is the tokens between two separators, with the separator
// before them (nil for the first).
type segment struct {
	sep  *tok
	toks []tok
}

// phase is the part of the line a term belongs to.
type phase int

const (
	inReactants phase = iota
	inConditions
	inProducts
)

// terms groups the tokens into terms and files each into its part of the
// step.
func (p *parser) terms(st *Step, toks []tok) {
	// The words between two separators are contiguous in toks, so each
	// segment is a sub-slice and costs nothing.
	var segBuf [16]segment
	segs := append(segBuf[:0], segment{})
	from := 0
	for k := range toks {
		switch toks[k].kind {
		case tPlus, tComma, tArrow:
			segs[len(segs)-1].toks = toks[from:k]
			segs = append(segs, segment{sep: &toks[k]})
			from = k + 1
		}
	}
	segs[len(segs)-1].toks = toks[from:]
	if len(segs) == 1 && len(segs[0].toks) == 0 {
		if st.Mark != nil && st.Label == nil {
			p.errorf(int(st.Mark.Span.Start-p.base), int(st.Mark.Span.End-p.base), "missing-substrate",
				"status mark with no step after it; write the step after the mark")
		}
		return
	}
	type placed struct {
		ph phase
		t  *Term
	}
	var allBuf [16]placed
	all := allBuf[:0]
	ph := inReactants
	for k, seg := range segs {
		var sep *Sep
		if seg.sep != nil {
			switch seg.sep.kind {
			case tPlus:
				sep = &Sep{Span: p.span(seg.sep.start, seg.sep.end), Kind: Plus}
			case tComma:
				sep = &Sep{Span: p.span(seg.sep.start, seg.sep.end), Kind: Comma}
				if ph == inReactants {
					ph = inConditions
				} else if ph == inProducts {
					ph = inConditions
				}
			case tArrow:
				var last *Term
				if len(all) > 0 && all[len(all)-1].ph == inConditions {
					last = all[len(all)-1].t
				}
				if p.rangeAcrossArrow(last, seg) {
					continue
				}
				if st.Arrow != nil {
					p.errorf(seg.sep.start, seg.sep.end, "second-arrow",
						"second arrow in one step; a step has one '->' before its expected products: split the line into two steps")
				} else {
					st.Arrow = p.arrowNode()
					st.Arrow.Span = p.span(seg.sep.start, seg.sep.end)
				}
				ph = inProducts
				if len(seg.toks) == 0 {
					if k+1 < len(segs) && segs[k+1].sep.kind != tArrow {
						p.errorf(seg.sep.start, seg.sep.end, "missing-product",
							"expected a product after %s, found %s; write the expected product or delete the arrow",
							quote(p.text(*seg.sep)), quote(p.text(*segs[k+1].sep)))
					}
					// A bare arrow at the end of a line asks for the
					// prediction; it is not an error.
					continue
				}
				all = append(all, placed{inProducts, p.term(seg.toks, nil)})
				continue
			}
		}
		if len(seg.toks) == 0 {
			p.emptySegment(segs, k, ph)
			continue
		}
		all = append(all, placed{ph, p.term(seg.toks, sep)})
	}
	// One backing array for the three lists.
	var count [3]int
	for _, pt := range all {
		count[pt.ph]++
	}
	var backing []*Term
	if p.batch {
		if cap(p.ptrSlab)-len(p.ptrSlab) < len(all) {
			p.ptrSlab = make([]*Term, 0, max(len(all), 4*batchSlab))
		}
		n := len(p.ptrSlab)
		p.ptrSlab = p.ptrSlab[:n+len(all)]
		backing = p.ptrSlab[n : n+len(all) : n+len(all)]
	} else {
		backing = make([]*Term, len(all))
	}
	next := [3]int{0, count[0], count[0] + count[1]}
	for _, pt := range all {
		backing[next[pt.ph]] = pt.t
		next[pt.ph]++
	}
	r, c := count[0], count[0]+count[1]
	if r > 0 {
		st.Reactants = backing[:r:r]
	}
	if c > r {
		st.Conditions = backing[r:c:c]
	}
	if len(all) > c {
		st.Products = backing[c:]
	}
}

// emptySegment reports a separator with nothing on one side.
func (p *parser) emptySegment(segs []segment, k int, ph phase) {
	seg := segs[k]
	switch {
	case k == 0:
		next := segs[1].sep
		p.errorf(next.start, next.end, "missing-substrate",
			"expected the substrate before %s, found the start of the line; write the substrate first", quote(p.text(*next)))
	case k == len(segs)-1:
		what := "a reactant"
		switch {
		case seg.sep.kind == tComma:
			what = "a condition (solvent, temperature, time or reagent)"
		case ph == inProducts:
			what = "a product"
		case ph == inConditions:
			what = "a reagent"
		}
		p.errorf(seg.sep.start, seg.sep.end, "missing-term",
			"expected %s after %s, found the end of the line; write it or delete the %s",
			what, quote(p.text(*seg.sep)), quote(p.text(*seg.sep)))
	default:
		next := segs[k+1].sep
		p.errorf(seg.sep.start, next.end, "empty-term",
			"nothing between %s and %s; delete one of them or write the missing term",
			quote(p.text(*seg.sep)), quote(p.text(*next)))
	}
}

// rangeAcrossArrow handles "-78 °C -> rt" among the conditions: an arrow
// between two temperatures is a temperature range, not the reaction
// arrow. last is the condition before the arrow, if any. It reports
// whether it took the segment.
func (p *parser) rangeAcrossArrow(last *Term, seg segment) bool {
	if last == nil || len(seg.toks) == 0 {
		return false
	}
	if last.Substance != nil || len(last.Quantities) != 1 || last.Quantities[0].Kind != Temperature || last.Quantities[0].To != nil {
		return false
	}
	q, n, errs := p.quantity(seg.toks, 0, false)
	if q == nil || q.Kind != Temperature || n != len(seg.toks) {
		return false
	}
	p.errs = append(p.errs, errs...)
	from := last.Quantities[0]
	from.To = q
	from.Span.End = q.Span.End
	last.Span.End = q.Span.End
	return true
}
