package notation

import (
	"fmt"
	"math/bits"
	"runtime"
	"slices"
	"strings"
	"sync"
	"sync/atomic"
	"unicode/utf8"
	"unsafe"

	"walden/grammar/source"
)

// MaxLineLength is the longest step line Parse reads, in bytes. A longer
// line gets one error and an empty Step: no chemist writes a 16 KiB
// reaction, and refusing keeps every later stage bounded.
const MaxLineLength = 16 << 10

// maxErrors bounds the errors reported for one line, so that a pasted
// binary blob yields a short list.
const maxErrors = 50

// parser holds the state of one Parse call, or of one run of lines of
// ParseLines.
type parser struct {
	src  []byte
	str  string // src as a string: texts are substrings of it, which costs no allocation
	base source.Pos
	errs source.ErrorList

	// The drafts of the line being read, reused from line to line.
	st         draftStep
	termDrafts slab[draftTerm]
	subDrafts  slab[draftSubstance]
	qtyDrafts  slab[draftQuantity]
	order      []int32       // the step's terms: reactants, conditions, products
	qlist      []int32       // the terms' quantities, by id
	slist      []int32       // the mixtures' parts, by id
	notes      []source.Span // the terms' notes
	nums       []float64     // scratch for ratioParts
	nodes      []node        // Parse's nodes before they are copied into the Tree
	tokBuf     [32]tok
	groupBuf   [16]tok
	// The list terms builds, kept here rather than on its stack, where
	// it would be cleared for every line.
	placedBuf [16]placed
}

// parsers keeps parser state, drafts and token buffers included, between
// calls: the server parses every changed line of a page on each edit.
var parsers = sync.Pool{New: func() any { return new(parser) }}

// release drops the line's text and puts p back in the pool.
func (p *parser) release() {
	p.src, p.str, p.errs = nil, "", nil
	parsers.Put(p)
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
//
// The Step's Tree holds a copy of the line and the line's nodes, in one
// block: a clean line costs two allocations, the Tree and the block.
func Parse(line []byte, base source.Pos) (Step, source.ErrorList) {
	p := parsers.Get().(*parser)
	defer p.release()
	p.src, p.base = line, base
	if len(line) <= MaxLineLength { // a longer line is refused unread
		// While the line is read its texts are views of line itself:
		// nothing the parser keeps or returns refers to p.str (messages
		// are formatted copies), and the Tree gets its own copy below.
		p.str = unsafe.String(unsafe.SliceData(line), len(line))
	}
	errs := p.parse()
	// The nodes are written into the parser's buffer, which stays in the
	// cache from line to line, and then copied at once into the Tree,
	// whose size is known only now: this is cheaper than walking the
	// drafts to size the Tree first.
	e := emitter{p: p, base: base, nodes: p.nodes[:0]}
	e.emit()
	p.nodes = e.nodes
	t := &Tree{base: base}
	t.nodes, t.src = nodesAndText(e.nodes, p.str)
	p.str = ""
	return Step{t, 0}, errs
}

// nodesAndText copies nodes and text into one new block of memory, which
// holds no pointer, and returns the copies: the nodes first, then the
// text's bytes. One allocation rather than two saves the runtime's work
// for the second, and the block is at least one node long, so it is
// never a tiny object and is aligned for nodes.
func nodesAndText(nodes []node, text string) ([]node, string) {
	const size = int(unsafe.Sizeof(node{}))
	n := len(nodes)
	block := make([]byte, n*size+len(text))
	var out []node
	if n > 0 {
		out = unsafe.Slice((*node)(unsafe.Pointer(&block[0])), n)
		copy(out, nodes)
	}
	if text == "" {
		return out, ""
	}
	tail := block[n*size:]
	copy(tail, text)
	return out, unsafe.String(&tail[0], len(tail))
}

// ParseLines parses the step lines of one host text, given by their
// spans (as grammar/notebook finds them), and returns the steps, in the
// order of spans, and the errors of all lines: each line's as Parse
// sorts them, line after line. Their spans are host offsets, so one list
// serves the page, as go/scanner's serves a file, and a page of clean
// lines allocates none. It gives the same trees as calling Parse on each
// line, but its Steps share one copy of the text, and Trees of about a
// hundred steps each, so that reading a whole page costs an allocation
// per hundred lines. A span outside text gives an empty Step and a
// "bad-span" error.
func ParseLines(text []byte, spans []source.Span) ([]Step, source.ErrorList) {
	host := string(text)
	steps := make([]Step, len(spans))
	// A long page is cut into runs of lines, read by one goroutine per
	// core, each run by a parser of its own into Trees of its own: lines
	// are independent, and on opening a page the chemist waits for the
	// whole of it. There are a few runs per core, taken in turn, so that
	// a core the collector or another process holds for a while delays
	// only the run it is reading. Short pages are not worth a goroutine.
	workers := min(runtime.GOMAXPROCS(0), len(spans)/parallelLines)
	if workers < 2 {
		return steps, parseRun(text, host, spans, steps)
	}
	runs := min(runsPerCore*workers, len(spans)/parallelLines)
	errs := make([]source.ErrorList, runs)
	var next atomic.Int32
	work := func() {
		for r := int(next.Add(1) - 1); r < runs; r = int(next.Add(1) - 1) {
			lo, hi := r*len(spans)/runs, (r+1)*len(spans)/runs
			errs[r] = parseRun(text, host, spans[lo:hi], steps[lo:hi])
		}
	}
	var wg sync.WaitGroup
	for range workers - 1 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			work()
		}()
	}
	work() // the calling goroutine is one of the workers
	wg.Wait()
	return steps, slices.Concat(errs...)
}

// parallelLines is the fewest lines per run in ParseLines: about a
// quarter of a millisecond of reading, against the few microseconds a
// goroutine costs to start and join, so that a page of a few hundred
// lines already opens on both cores of a small machine.
const parallelLines = 256

// runsPerCore is how many runs ParseLines cuts a long page into per
// core.
const runsPerCore = 4

// parseRun parses the lines at spans into steps with one parser, as
// ParseLines describes, and returns their errors.
func parseRun(text []byte, host string, spans []source.Span, steps []Step) (errs source.ErrorList) {
	p := parsers.Get().(*parser)
	defer p.release()
	// The nodes of the lines from line first on are gathered in the
	// parser's buffer, which stays in the cache, until they would pass
	// treeNodes; then they are copied at once into a Tree of their exact
	// size. Allocating with make and copy leaves the memory unzeroed, and
	// Trees of that size reuse the memory the runtime keeps for small
	// objects.
	e := emitter{p: p, nodes: p.nodes[:0]}
	defer func() { p.nodes = e.nodes }()
	first := 0
	flush := func(to, n int) {
		// make followed at once by copy from a variable allocates
		// without zeroing.
		from := e.nodes[:n]
		nodes := make([]node, n)
		copy(nodes, from)
		t := &Tree{src: host, nodes: nodes}
		for k := first; k < to; k++ {
			steps[k].t = t
		}
		first = to
	}
	for i, sp := range spans {
		start := e.next()
		p.errs = nil
		if sp.Start < 0 || sp.Start > sp.End || int(sp.End) > len(text) {
			// A caller's mistake, reported rather than panicking.
			errs.Add(sp, "bad-span", fmt.Sprintf("line span %d-%d lies outside the %d-byte text", sp.Start, sp.End, len(text)))
			e.add(nStep, sp) // an empty step
		} else {
			p.src, p.base = text[sp.Start:sp.End], sp.Start
			p.str = ""
			if sp.Len() <= MaxLineLength {
				p.str = host[sp.Start:sp.End]
			}
			errs = append(errs, p.parse()...)
			e.emit()
		}
		if len(e.nodes) > treeNodes && start > 0 {
			// This line's nodes overflow the Tree: it starts the next.
			flush(i, int(start))
			e.nodes = e.nodes[:copy(e.nodes, e.nodes[start:])]
			start = 0
		}
		steps[i].i = start
	}
	if len(spans) > first {
		flush(len(spans), len(e.nodes))
	}
	return errs
}

// treeNodes is the most nodes of a Tree made by ParseLines (but for a
// line of more): as many 24-byte nodes (TestNodeSize) as fit in 32 KiB,
// the largest of the runtime's small objects; a hundred steps or so.
const treeNodes = 32 << 10 / 24

// parse reads p.src into p.st and returns the line's errors.
func (p *parser) parse() source.ErrorList {
	line := p.src
	p.termDrafts.reset()
	p.subDrafts.reset()
	p.qtyDrafts.reset()
	p.order, p.qlist, p.slist = p.order[:0], p.qlist[:0], p.slist[:0]
	p.notes = p.notes[:0]
	st := &p.st
	*st = draftStep{}
	st.Span = p.span(0, len(line))
	if len(line) > MaxLineLength {
		p.errorf(0, len(line), "line-too-long",
			"step line is %d bytes long; walden reads at most %d bytes per line: split the line or shorten it",
			len(line), MaxLineLength)
		return p.errs
	}
	slash := p.checkBytes()
	end := len(line)
	if c := p.commentStart(slash); c >= 0 {
		st.comment, st.hasComment = p.span(c, end), true
		end = c
	}
	i := p.skipSpace(0, end)
	i = p.mark(st, i, end)
	toks := p.lex(p.tokBuf[:0], i, end)
	toks = p.label(st, toks)
	p.terms(st, toks)
	if len(p.errs) > maxErrors {
		p.errs = p.errs[:maxErrors]
		p.errorf(0, len(line), "too-many-errors", "more than %d errors on this line; only the first are shown", maxErrors)
	}
	if len(p.errs) > 1 {
		p.errs.Sort()
	}
	return p.errs
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

// addErrs adds the errors a reading left to report. Most readings leave
// none, and then p.errs is not stored: storing a slice passes the
// garbage collector's write barrier whenever a collection is running.
func (p *parser) addErrs(errs source.ErrorList) {
	if len(errs) > 0 {
		p.errs = append(p.errs, errs...)
	}
}

func (p *parser) skipSpace(i, end int) int {
	for n := p.spaceAt(i, end); n > 0; n = p.spaceAt(i, end) {
		i += n
	}
	return i
}

// checkBytes reports invalid UTF-8 and control characters, which no
// editor shows faithfully; the bytes stay in the words that hold them.
// It returns the index of the first '/', where commentStart begins to
// look, or -1: most lines hold none, and then need no second look.
func (p *parser) checkBytes() (slash int) {
	// The line is read as p.str, as every reading below does: in a
	// batch p.src is another copy of the text, which would be a second
	// stream of bytes through the cache.
	s := p.str
	slash = -1
	for i := 0; i < len(s); {
		// Eight printable ASCII bytes but '/' at a time: the common
		// case. Else the bytes before the first other one are skipped.
		if i+8 <= len(s) {
			m := unprintableOrSlash8(load64(s, i))
			if m == 0 {
				i += 8
				continue
			}
			i += bits.TrailingZeros64(m) / 8
		}
		c := s[i]
		if c < utf8.RuneSelf {
			if c == '/' {
				if slash < 0 {
					slash = i
				}
			} else if c < 0x20 && c != '\t' || c == 0x7F {
				p.errorf(i, i+1, "control-character", "control character U+%04X found in a step line; delete it", c)
			}
			i++
			continue
		}
		// Two- and three-byte characters that cannot be overlong or
		// surrogates need no decoding: '°', 'µ', '–', '→' and their kin.
		if i+1 < len(s) && 0xC2 <= c && c <= 0xDF && s[i+1]&0xC0 == 0x80 {
			i += 2
			continue
		}
		if i+2 < len(s) && (0xE1 <= c && c <= 0xEC || c == 0xEE || c == 0xEF) &&
			s[i+1]&0xC0 == 0x80 && s[i+2]&0xC0 == 0x80 {
			i += 3
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			j := i + 1
			for j < len(s) && s[j] >= utf8.RuneSelf && !utf8.FullRuneInString(s[j:]) {
				j++
			}
			p.errorf(i, j, "invalid-utf8", "invalid UTF-8 byte 0x%02X; the file must be saved as UTF-8", c)
			i = j
			continue
		}
		i += size
	}
	return slash
}

// load64 reads the eight bytes of s at i as a little-endian word; the
// compiler makes the shifts one load.
func load64(s string, i int) uint64 {
	s = s[i : i+8]
	return uint64(s[0]) | uint64(s[1])<<8 | uint64(s[2])<<16 | uint64(s[3])<<24 |
		uint64(s[4])<<32 | uint64(s[5])<<40 | uint64(s[6])<<48 | uint64(s[7])<<56
}

// unprintableOrSlash8 returns a mask whose lowest set bit is the high
// bit of the first of the eight bytes of x (little-endian) that is '/'
// or outside 0x20–0x7E, or 0 when there is none. Bits above the lowest
// may be set wrongly (a carry or borrow passes into the next byte, but
// only out of a byte that is itself found), never the lowest.
func unprintableOrSlash8(x uint64) uint64 {
	const ones, highs = 0x0101010101010101, 0x8080808080808080
	// x+1 has its high bit set for 0x7F (and the bytes above 0x7F,
	// found by x itself); x-0x20 for the bytes below 0x20.
	v := x ^ '/'*ones // a zero byte where x has '/'
	return (x | (x + ones) | (x - 0x20*ones) | (v-ones)&^v) & highs
}

// commentStart returns where "//" begins a comment, or -1; slash is the
// index of the line's first '/', or -1 when it has none. The marker
// must open the line or follow a space: a SMILES never holds a space and
// never starts with '/', so " //" cannot be part of one.
func (p *parser) commentStart(slash int) int {
	if slash < 0 {
		return -1
	}
	s := p.str
	// The slashes are found by IndexByte, much faster than a search for
	// "//"; most lines hold none, or one in a SMILES or a mixture.
	for from := slash; ; {
		k := strings.IndexByte(s[from:], '/')
		if k < 0 {
			return -1
		}
		i := from + k
		if i+1 < len(s) && s[i+1] == '/' &&
			(i == 0 || s[i-1] == ' ' || s[i-1] == '\t' || p.skipSpace(0, i) == i) {
			return i
		}
		from = i + 1
	}
}

// mark reads a status mark "[x]", "[X]", "[-]" or "[ ]" at i. A mark
// must be followed by a space or the end: "[x]" and "[-]" are not SMILES
// bracket atoms (no element symbol is x or empty), and the space keeps
// the mark apart from any word after it.
func (p *parser) mark(st *draftStep, i, end int) int {
	if i+2 >= end || p.str[i] != '[' || p.str[i+2] != ']' {
		return i
	}
	var state MarkState
	switch p.str[i+1] {
	case ' ':
		state = Open
	case 'x', 'X':
		state = Done
	case '-':
		state = Skipped
	default:
		return i
	}
	st.mark, st.hasMark = Mark{Span: p.span(i, i+3), State: state}, true
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
func (p *parser) label(st *draftStep, toks []tok) []tok {
	if len(toks) == 0 || toks[0].kind != tWord {
		return toks
	}
	// The last byte of the first word tells a label (':') and a step
	// number ('.' or ')') from the first word of most lines.
	switch p.str[toks[0].end-1] {
	case ':':
	case '.', ')':
		if p.numbered(toks) {
			t := toks[0]
			st.label, st.hasLabel = p.tokSpan(t, t), true
			if len(toks) == 1 {
				p.errorf(int(t.start), int(t.end), "missing-substrate", "step number %s with no step after it; write the substrate after it", quote(p.text(t)))
			}
			return toks[1:]
		}
		return toks
	default:
		return toks
	}
	t := toks[0]
	name := p.str[t.start : t.end-1]
	st.label, st.hasLabel = p.tokSpan(t, t), true
	switch {
	case name == "":
		p.errorf(int(t.start), int(t.end), "label-empty", "':' with no label before it; write a label such as 'azide:' or delete the ':'")
	default:
		for k := 0; k < len(name); k++ {
			if !isLabelByte(name[k]) {
				p.errorf(int(t.start), int(t.end-1), "label-bad",
					"step label %s holds %s; a label is ASCII letters, digits, '_', '-' and \"'\" followed by ':'",
					quote(name), quote(badRune(name[k:])))
				break
			}
		}
	}
	if len(toks) == 1 {
		p.errorf(int(t.start), int(t.end), "missing-substrate", "label %s names no step; write the substrate after it", quote(name+":"))
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

// placed is a term placed in its part of the step, by its draft's id.
// It holds no pointer, so that filling a list of them passes no write
// barrier while the collector runs.
type placed struct {
	ph phase
	id int32
}

// phase is the part of the line a term belongs to.
type phase uint8

const (
	inReactants phase = iota
	inConditions
	inProducts
)

// isSep reports whether a token of kind k separates terms: tPlus, tComma
// or tArrow.
func isSep(k tokKind) bool { return k >= tPlus }

// sepFrom returns the index of the first separator in toks from i on,
// or len(toks) (i, if i is past the end).
func sepFrom(toks []tok, i int) int {
	for i < len(toks) && !isSep(toks[i].kind) {
		i++
	}
	return i
}

// terms groups the tokens into terms and files each into its part of the
// step.
func (p *parser) terms(st *draftStep, toks []tok) {
	if len(toks) == 0 {
		if st.hasMark && !st.hasLabel {
			p.errorf(int(st.mark.Span.Start-p.base), int(st.mark.Span.End-p.base), "missing-substrate",
				"status mark with no step after it; write the step after the mark")
		}
		return
	}
	all := p.placedBuf[:0]
	ph := inReactants
	// The words between two separators are contiguous in toks: each
	// segment is toks[from:to], found as it is read, with the separator
	// before it (sepTok, kind 0 for the first) and the one after it
	// (next, kind 0 for the last).
	var sepTok, next tok
	for from, to := 0, sepFrom(toks, 0); from <= len(toks); sepTok, from, to = next, to+1, sepFrom(toks, to+1) {
		next = tok{}
		if to < len(toks) {
			next = toks[to]
		}
		var sep Sep
		segToks := toks[from:to]
		switch sepTok.kind {
		case tPlus:
			sep = Sep{Span: p.tokSpan(sepTok, sepTok), Kind: Plus}
		case tComma:
			sep = Sep{Span: p.tokSpan(sepTok, sepTok), Kind: Comma}
			if ph == inReactants {
				ph = inConditions
			} else if ph == inProducts {
				ph = inConditions
			}
		case tArrow:
			var last *draftTerm
			if len(all) > 0 && all[len(all)-1].ph == inConditions {
				last = p.termDrafts.at(all[len(all)-1].id)
			}
			if p.rangeAcrossArrow(last, segToks) {
				continue
			}
			if st.hasArrow {
				p.errorf(int(sepTok.start), int(sepTok.end), "second-arrow",
					"second arrow in one step; a step has one '->' before its expected products: split the line into two steps")
			} else {
				st.arrow, st.hasArrow = p.tokSpan(sepTok, sepTok), true
			}
			ph = inProducts
			if len(segToks) == 0 {
				if next.kind != 0 && next.kind != tArrow {
					p.errorf(int(sepTok.start), int(sepTok.end), "missing-product",
						"expected a product after %s, found %s; write the expected product or delete the arrow",
						quote(p.text(sepTok)), quote(p.text(next)))
				}
				// A bare arrow at the end of a line asks for the
				// prediction; it is not an error.
				continue
			}
			all = append(all, placed{inProducts, p.term(segToks, Sep{}).id})
			continue
		}
		if len(segToks) == 0 {
			p.emptySegment(sepTok, next, from == 0, ph)
			continue
		}
		all = append(all, placed{ph, p.term(segToks, sep).id})
	}
	// One backing array for the three lists. The counts and the next
	// places of the three phases are packed 16 bits each into one word
	// (a line has fewer than 1<<16 terms), which stays in a register:
	// counters in an array would be incremented through memory, each
	// waiting for the last.
	var counts uint64
	for _, pt := range all {
		counts += 1 << (16 * pt.ph)
	}
	nR, nC := int(counts&0xFFFF), int(counts>>16&0xFFFF)
	// Every place of order is written below: it is grown, not cleared.
	order := slices.Grow(p.order[:0], len(all))[:len(all)]
	at := uint64(nR)<<16 | uint64(nR+nC)<<32 // 0, nR, nR+nC
	for _, pt := range all {
		sh := 16 * pt.ph
		order[at>>sh&0xFFFF] = pt.id
		at += 1 << sh
	}
	p.order = order
	st.nR, st.nC, st.nP = nR, nC, len(all)-nR-nC
}

// emptySegment reports a separator with nothing on one side: sep is the
// separator before the empty segment (kind 0 for the first), next the
// one after it (kind 0 for the last).
func (p *parser) emptySegment(sep, next tok, first bool, ph phase) {
	switch {
	case first:
		p.errorf(int(next.start), int(next.end), "missing-substrate",
			"expected the substrate before %s, found the start of the line; write the substrate first", quote(p.text(next)))
	case next.kind == 0:
		what := "a reactant"
		switch {
		case sep.kind == tComma:
			what = "a condition (solvent, temperature, time or reagent)"
		case ph == inProducts:
			what = "a product"
		case ph == inConditions:
			what = "a reagent"
		}
		p.errorf(int(sep.start), int(sep.end), "missing-term",
			"expected %s after %s, found the end of the line; write it or delete the %s",
			what, quote(p.text(sep)), quote(p.text(sep)))
	default:
		p.errorf(int(sep.start), int(next.end), "empty-term",
			"nothing between %s and %s; delete one of them or write the missing term",
			quote(p.text(sep)), quote(p.text(next)))
	}
}

// rangeAcrossArrow handles "-78 °C -> rt" among the conditions: an arrow
// between two temperatures is a temperature range, not the reaction
// arrow. last is the condition before the arrow, if any, and toks the
// segment after the arrow. It reports whether it took the segment.
func (p *parser) rangeAcrossArrow(last *draftTerm, toks []tok) bool {
	if last == nil || len(toks) == 0 {
		return false
	}
	if last.sub != 0 || last.q1-last.q0 != 1 {
		return false
	}
	from := p.qtyDrafts.at(p.qlist[last.q0])
	if from.Kind != Temperature || from.to != 0 {
		return false
	}
	q, n, errs := p.quantity(toks, 0, false)
	if q == nil || q.Kind != Temperature || n != len(toks) {
		return false
	}
	p.addErrs(errs)
	from.to = ref(q.id)
	from.Span.End = q.Span.End
	last.Span.End = q.Span.End
	return true
}
