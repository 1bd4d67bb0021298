package analyze

import (
	"cmp"
	"context"
	"fmt"
	"runtime"
	"slices"
	"sort"
	"strings"
	"sync"
	"sync/atomic"

	"walden/grammar/notation"
	"walden/grammar/notebook"
	"walden/grammar/source"
)

// Engine analyses sources and remembers per-step results, so that an edit
// re-analyses only the steps that changed and those that refer to them.
// An Engine is safe for concurrent use.
//
// The cache is keyed by a step line's text plus the products of the labels
// it refers to; results hold positions relative to their line, so a line
// moved by an edit above it is not analysed again.
type Engine struct {
	cfg      Config
	dict     *dictionary
	disabled map[string]bool
	memo     *memo // chemistry shared by steps that differ only in part

	mu    sync.Mutex
	lines map[string]*lineEntry // by line text
	gen   uint64                // Analyze calls so far, for eviction

	// Eviction: lastGen is the generation of the latest call that
	// analysed each source (by name), so that the lines of a page open
	// but not edited lately stay; sweepAt is the cache size at which the
	// next sweep runs.
	lastGen map[string]uint64
	sweepAt int

	lastFound map[string]lastFound // by source name, for the next edit (find.go)

	analysed atomic.Int64 // steps analysed (cache misses), for tests and figures
	diagHint atomic.Int64 // diagnostics in the last one-source Report, to size the next
	parsed   atomic.Int64 // lines parsed (texts not seen before), for tests
}

// lineEntry is everything cached for one line text: its parse and one
// result per combination of referenced products.
type lineEntry struct {
	text    string
	step    notation.Step
	errs    source.ErrorList
	refs    []string // labels referred to, in order
	label   string   // the label the line defines; "" for none
	results results
	used    uint64 // the last Analyze generation that used it

	// The products referred to by the last Analyze call that used the
	// line, and its result: on an edit elsewhere they are the same
	// pointers, and no key needs building.
	lastIns []*handOn
	lastRes *stepResult
	lastOwn []Diagnostic // lastRes.diags, read with the entry
	queued  bool         // taken by a prewarm worker
	evicted bool         // swept from the cache
}

// results are a line's results by the key of the products it refers to
// ("" for none, as for most lines: they need no map).
type results struct {
	plain *stepResult
	byKey map[string]*stepResult
}

func (rs *results) get(key string) (*stepResult, bool) {
	if key == "" {
		return rs.plain, rs.plain != nil
	}
	r, ok := rs.byKey[key]
	return r, ok
}

// put keeps res under key. A line whose references keep changing keeps
// only its latest few results.
func (rs *results) put(key string, res *stepResult) {
	if key == "" {
		rs.plain = res
		return
	}
	if rs.byKey == nil {
		rs.byKey = make(map[string]*stepResult, 1)
	}
	if len(rs.byKey) > 8 {
		clear(rs.byKey)
	}
	rs.byKey[key] = res
}

// The cache is swept once it holds a quarter more lines than it kept
// after the last sweep (at least sweepMin more). A sweep keeps the lines
// used by one of the last keepGens calls, or by the latest call that
// analysed a source still known (the last maxSources names analysed):
// what the open documents use, plus the few texts of recent typing.
const (
	keepGens   = 16
	sweepMin   = 1024
	maxSources = 256
)

// NewEngine returns an Engine using cfg.
func NewEngine(cfg Config) *Engine {
	e := &Engine{cfg: cfg, dict: newDictionary(cfg), disabled: map[string]bool{}, memo: newMemo(), lines: map[string]*lineEntry{},
		lastGen: map[string]uint64{}, lastFound: map[string]lastFound{}, sweepAt: sweepMin}
	for _, c := range cfg.Disabled {
		e.disabled[strings.TrimSpace(c)] = true
	}
	return e
}

// Config returns the configuration the Engine was made with.
func (e *Engine) Config() Config { return e.cfg }

// NamesErrors returns the problems found in the lab's names file, each
// positioned in that file (Config.LabNamesFile).
func (e *Engine) NamesErrors() source.ErrorList { return e.dict.errs }

// Analysed returns how many step analyses the Engine has run (cache
// misses), for tests and measurements.
func (e *Engine) Analysed() int64 { return e.analysed.Load() }

// labelDef is a label defined by a step, as later steps see it.
type labelDef struct {
	name   string
	src    int         // index of the source defining it
	span   source.Span // the name in its host
	handOn *handOn
}

// Analyze returns one Report per source, in order. Labels defined in an
// earlier source are visible to later ones. It returns ctx.Err() if the
// context is cancelled before it finishes.
//
// Its cost on an edit is what the changed lines cost to parse and
// analyse, plus one pass over the page that copies each unchanged line's
// cached pieces (shifted when the edit moved the line) into the Report.
func (e *Engine) Analyze(ctx context.Context, srcs []Source) ([]*Report, error) {
	return e.analyze(ctx, srcs, false)
}

// AnalyzeLines is Analyze for a caller that reads each step line's
// findings through Report.AppendLines, as the language server does after every
// edit: its Reports leave Steps and Diagnostics empty, so an edit does not
// rewrite the pieces of every line it moved; Report.Full builds them, once,
// for the callers that need them. With codes disabled in the Config it
// returns full Reports, whose Lines reports false.
func (e *Engine) AnalyzeLines(ctx context.Context, srcs []Source) ([]*Report, error) {
	return e.analyze(ctx, srcs, len(e.disabled) == 0)
}

func (e *Engine) analyze(ctx context.Context, srcs []Source, lazy bool) ([]*Report, error) {
	reps := make([]*Report, len(srcs))
	for i, s := range srcs {
		reps[i] = &Report{Name: s.Name, dict: e.dict}
	}
	found := make([][]foundLine, len(srcs))
	finds := make([][]Diagnostic, len(srcs))
	ents := make([][]*lineEntry, len(srcs))
	prev := make([]lastFound, len(srcs))
	pages := make([]*notebook.Page, len(srcs))
	for i, s := range srcs {
		if ctx.Err() != nil {
			return reps, ctx.Err()
		}
		pages[i], finds[i], prev[i] = e.findLines(s)
		found[i] = pages[i].Lines
		ents[i] = make([]*lineEntry, len(found[i]))
	}
	gen := e.entries(srcs, found, prev, ents)
	e.mu.Lock()
	for i, s := range srcs {
		e.keepEntries(s.Name, pages[i], ents[i])
	}
	e.mu.Unlock()
	e.prewarm(ctx, ents)
	nLabels, anyRefs := 0, false
	for i := range srcs {
		for _, ent := range ents[i] {
			if ent.label != "" {
				nLabels++
			}
			anyRefs = anyRefs || len(ent.refs) > 0
		}
	}
	// Every label of every source, so that a reference to a label defined
	// further down is told apart from one defined nowhere; only a page
	// that refers to labels needs it.
	var later map[string]bool
	if anyRefs {
		later = make(map[string]bool, nLabels)
		for i := range srcs {
			for _, ent := range ents[i] {
				if ent.label != "" {
					later[ent.label] = true
				}
			}
		}
	}
	defined := make(map[string]*labelDef, nLabels)
	order := make([]*labelDef, 0, nLabels)
	defs := make([]labelDef, 0, nLabels) // one allocation for every label
	var a arena
	var ins []*handOn // the products a line refers to, reused line to line
	e.mu.Lock()
	defer e.mu.Unlock()
	for i := range srcs {
		rep := reps[i]
		rep.steps = make([]placedStep, 0, len(found[i]))
		if lazy {
			rep.lines = &lineParts{finds: finds[i]}
			e.linesLocked(ctx, rep, found[i], ents[i], defined, later, &order, &defs, i, srcs)
			rep.labels = order[:len(order):len(order)]
			continue
		}
		rep.Steps = make([]StepReport, 0, len(found[i]))
		rep.Diagnostics = make([]Diagnostic, 0, len(finds[i])+max(len(found[i])/2, int(e.diagHint.Load())))
		rep.Diagnostics = append(rep.Diagnostics, finds[i]...)
		for n, l := range found[i] {
			if n%64 == 0 && ctx.Err() != nil {
				return reps, ctx.Err()
			}
			ent := ents[i][n]
			ins = ins[:0]
			for _, name := range ent.refs {
				if d, ok := defined[name]; ok {
					ins = append(ins, d.handOn)
				} else {
					ins = append(ins, undefinedRef)
				}
			}
			res := e.resultLocked(ent, ins)
			ps := placedStep{span: l.Span, res: res, own: ent.lastOwn, ent: ent, nLabels: int32(len(order))}
			rep.steps = append(rep.steps, ps)
			from := len(rep.Diagnostics)
			res.place(rep, ps, &a, e.disabled)
			if len(ent.refs) > 0 && len(res.refs) > 0 {
				rep.Diagnostics = append(rep.Diagnostics, e.labelDiags(res, l.Span.Start, defined, later)...)
			}
			if ent.label != "" && res.label != "" {
				if prev, dup := defined[res.label]; dup {
					rep.Diagnostics = append(rep.Diagnostics, Diagnostic{Code: CodeLabelDuplicate, Severity: Error,
						Message: fmt.Sprintf("label '%s' is already defined%s; later steps use the first one", res.label, where(prev, i, srcs)),
						Span:    res.labelSpan.Shift(l.Span.Start)})
				} else {
					defs = append(defs, labelDef{name: res.label, src: i, span: res.labelSpan.Shift(l.Span.Start), handOn: res.handOn})
					d := &defs[len(defs)-1]
					defined[res.label] = d
					order = append(order, d)
				}
			}
			// A line's diagnostics lie within the line: sorting each
			// line's few keeps the whole list sorted.
			if len(rep.Diagnostics)-from > 1 {
				slices.SortStableFunc(rep.Diagnostics[from:], byStart)
			}
		}
		rep.labels = order[:len(order):len(order)]
		rep.Diagnostics = e.filter(rep.Diagnostics)
		if len(srcs) == 1 {
			e.diagHint.Store(int64(len(rep.Diagnostics) + len(rep.Diagnostics)/16))
		}
		if !slices.IsSortedFunc(rep.Diagnostics, byStart) {
			slices.SortStableFunc(rep.Diagnostics, byStart)
		}
	}
	e.evictLocked(gen)
	return reps, ctx.Err()
}

// byStart orders diagnostics by where they start.
func byStart(a, b Diagnostic) int { return cmp.Compare(a.Span.Start, b.Span.Start) }

// undefinedRef stands for a label no step before has defined, among the
// products a line refers to.
var undefinedRef = new(handOn)

// prewarm analyses, on every core, the lines not yet analysed that refer
// to no label: their results depend on nothing else on the page. Opening a
// long page is thus not bound to one core; an edit has a line or two to
// analyse and skips this.
func (e *Engine) prewarm(ctx context.Context, ents [][]*lineEntry) {
	workers := runtime.GOMAXPROCS(0)
	if workers < 2 {
		return
	}
	var todo []*lineEntry
	e.mu.Lock()
	for _, es := range ents {
		for _, ent := range es {
			// A line analysed before has lastRes set: checking it first
			// keeps an edit from looking every line up in its results.
			if ent.lastRes == nil && len(ent.refs) == 0 && !ent.queued && ent.results.plain == nil {
				ent.queued = true // an entry appears once however often its text does
				todo = append(todo, ent)
			}
		}
	}
	e.mu.Unlock()
	if len(todo) < prewarmMin {
		e.mu.Lock()
		for _, ent := range todo {
			ent.queued = false
		}
		e.mu.Unlock()
		return
	}
	e.memo.reserve(len(todo))
	var next atomic.Int64
	var wg sync.WaitGroup
	for range min(workers, len(todo)/prewarmMin+1) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for {
				k := int(next.Add(1)) - 1
				if k >= len(todo) || ctx.Err() != nil {
					return
				}
				ent := todo[k]
				res := e.analyseSafely(ent, nil)
				e.mu.Lock()
				if ent.results.plain == nil {
					ent.results.plain = res
				}
				ent.queued = false
				e.mu.Unlock()
			}
		}()
	}
	wg.Wait()
	e.mu.Lock()
	for _, ent := range todo { // those left by a cancellation
		ent.queued = false
	}
	e.mu.Unlock()
}

// prewarmMin is the fewest lines worth spreading over the cores.
const prewarmMin = 32

// entries fills ents with the cached parse of every found line, parsing
// only the lines not seen before, and returns the generation of this
// call, for eviction.
func (e *Engine) entries(srcs []Source, found [][]foundLine, prev []lastFound, ents [][]*lineEntry) uint64 {
	type miss struct{ src, line int }
	var misses []miss
	e.mu.Lock()
	e.gen++
	gen := e.gen
	for _, s := range srcs {
		e.lastGen[s.Name] = gen
	}
	for i, s := range srcs {
		// After an edit most lines have the text of the same line on the
		// last call, counted from the top before the change and from the
		// bottom after it: comparing the bytes costs less than looking
		// the text up.
		var was []foundLine
		if prev[i].page != nil && len(prev[i].ents) == len(prev[i].page.Lines) {
			was = prev[i].page.Lines
		}
		shift := len(found[i]) - len(was)
		for n, l := range found[i] {
			text := s.Text[l.Span.Start:l.Span.End]
			if ent := prev[i].same(was, text, n, n-shift); ent != nil {
				ent.used = gen
				ents[i][n] = ent
				continue
			}
			// Indexing by string(bytes) does not copy the bytes.
			if ent, ok := e.lines[string(text)]; ok {
				ent.used = gen
				ents[i][n] = ent
			} else {
				misses = append(misses, miss{i, n})
			}
		}
	}
	e.mu.Unlock()
	if len(misses) == 0 {
		return gen
	}
	e.parsed.Add(int64(len(misses)))
	texts := make([][]byte, len(misses))
	for k, m := range misses {
		l := found[m.src][m.line]
		texts[k] = srcs[m.src].Text[l.Span.Start:l.Span.End]
	}
	fresh := parseNew(texts, gen)
	e.mu.Lock()
	for k, m := range misses {
		ent := fresh[k]
		if old, ok := e.lines[ent.text]; ok {
			ent = old // another goroutine, or an equal line above, parsed it first
			ent.used = gen
		} else {
			e.lines[ent.text] = ent
		}
		ents[m.src][m.line] = ent
	}
	e.mu.Unlock()
	return gen
}

// where says in which source an earlier definition is, when not this one.
func where(d *labelDef, cur int, srcs []Source) string {
	if d.src == cur {
		return " above"
	}
	return " in " + srcs[d.src].Name
}

// labelDiags reports references that do not resolve. They depend on the
// whole document, so they are made here rather than cached with the step.
func (e *Engine) labelDiags(res *stepResult, base source.Pos, defined map[string]*labelDef, later map[string]bool) []Diagnostic {
	var out []Diagnostic
	for _, r := range res.refs {
		d, ok := defined[r.name]
		span := r.span.Shift(base)
		switch {
		case ok && d.handOn == nil:
			out = append(out, Diagnostic{Code: CodeLabelNoProduct, Severity: Warning, Span: span,
				Message: fmt.Sprintf("step '%s' yields no product to use (it was not analysed and has no product written after '->')", r.name)})
		case ok:
		case r.name == res.label:
			out = append(out, Diagnostic{Code: CodeLabelForward, Severity: Error, Span: span,
				Message: fmt.Sprintf("step '%s' refers to its own product", r.name)})
		case later[r.name]:
			out = append(out, Diagnostic{Code: CodeLabelForward, Severity: Error, Span: span,
				Message: fmt.Sprintf("label '%s' is defined only further down; a step can use only the products of steps before it", r.name)})
		default:
			msg := fmt.Sprintf("no step is labelled '%s'", r.name)
			var fixes []Fix
			if near := closestLabels(r.name, defined); len(near) > 0 {
				msg += "; did you mean " + orList(quoteAll(near)) + "?"
				for i, n := range near {
					fixes = append(fixes, Fix{Title: "Refer to '" + n + "'", Edits: []Edit{{Span: span, NewText: "@" + n}}, Preferred: i == 0})
				}
			} else {
				msg += "; label a step by starting its line with 'name:'"
			}
			out = append(out, Diagnostic{Code: CodeLabelUnresolved, Severity: Error, Span: span, Message: msg, Fixes: fixes})
		}
	}
	return out
}

// newLineEntry parses a line seen for the first time.
func newLineEntry(text []byte, gen uint64) *lineEntry {
	step, errs := notation.Parse(text, 0)
	ent := &lineEntry{text: string(text), step: step, errs: errs, used: gen}
	if l, ok := step.Label(); ok {
		ent.label = l.Name
	}
	for _, r := range references(step) {
		ent.refs = append(ent.refs, r.name)
	}
	return ent
}

// resultLocked returns the cached analysis of a line for the given
// referenced products (one per ent.refs, undefinedRef for a label not
// defined), analysing it on a miss. e.mu is held, and released while
// analysing.
func (e *Engine) resultLocked(ent *lineEntry, ins []*handOn) *stepResult {
	// The common case: the same products as last time, by identity.
	if ent.lastRes != nil && slices.Equal(ent.lastIns, ins) {
		return ent.lastRes
	}
	var refs map[string]*handOn
	key := ""
	if len(ent.refs) > 0 {
		refs = make(map[string]*handOn, len(ent.refs))
		var kb strings.Builder
		for k, name := range ent.refs {
			kb.WriteString(name)
			if h := ins[k]; h != undefinedRef {
				refs[name] = h
				kb.WriteString("=" + h.key() + "\x00")
			} else {
				kb.WriteString("=?\x00")
			}
		}
		key = kb.String()
	}
	res, ok := ent.results.get(key)
	if !ok {
		e.mu.Unlock()
		res = e.analyseSafely(ent, refs)
		e.mu.Lock()
		if old, ok := ent.results.get(key); ok {
			res = old
		} else {
			ent.results.put(key, res)
		}
	}
	ent.lastIns = append(ent.lastIns[:0:0], ins...)
	ent.lastRes, ent.lastOwn = res, res.diags
	return res
}

// analyseSafely runs analyseStep and turns a panic in the chemistry into
// a diagnostic on the line: the core must not fail.
func (e *Engine) analyseSafely(ent *lineEntry, refs map[string]*handOn) (res *stepResult) {
	defer func() {
		if p := recover(); p != nil {
			res = &stepResult{diags: []Diagnostic{{Code: CodeNotAnalysed, Severity: Info, Span: ent.step.Span(),
				Message: fmt.Sprintf("not analysed: internal error (%v); please report this line", p)}}, inlay: "not analysed"}
		}
	}()
	res = e.analyseStep(ent.step, ent.errs, refs)
	// Placements copy the tokens in this order into every Report.
	slices.SortStableFunc(res.tokens, func(a, b Token) int { return cmp.Compare(a.Span.Start, b.Span.Start) })
	return res
}

// evictLocked drops the lines no open document is likely to use once the
// cache has grown (see keepGens). Without it every text ever typed would
// stay: each keystroke makes a new line text. e.mu is held.
func (e *Engine) evictLocked(gen uint64) {
	if len(e.lines) < e.sweepAt {
		return
	}
	if len(e.lastGen) > maxSources {
		// Forget the sources analysed longest ago (closed documents, most
		// likely).
		gens := make([]uint64, 0, len(e.lastGen))
		for _, g := range e.lastGen {
			gens = append(gens, g)
		}
		slices.Sort(gens)
		cut := gens[len(gens)-maxSources]
		for name, g := range e.lastGen {
			if g < cut {
				delete(e.lastGen, name)
			}
		}
	}
	live := make(map[uint64]bool, len(e.lastGen))
	for _, g := range e.lastGen {
		live[g] = true
	}
	for k, v := range e.lines {
		if v.used+keepGens < gen && !live[v.used] {
			v.evicted = true // an entry a source's last page holds is not used again
			delete(e.lines, k)
		}
	}
	e.sweepAt = len(e.lines) + max(len(e.lines)/4, sweepMin)
}

// CachedLines returns how many line texts the Engine keeps, for tests
// and measurements.
func (e *Engine) CachedLines() int {
	e.mu.Lock()
	defer e.mu.Unlock()
	return len(e.lines)
}

// filter drops the diagnostics whose codes the Config disables.
func (e *Engine) filter(ds []Diagnostic) []Diagnostic {
	if len(e.disabled) == 0 {
		return ds
	}
	out := ds[:0]
	for _, d := range ds {
		if !e.disabled[d.Code] {
			out = append(out, d)
		}
	}
	return out
}

// closestLabels returns up to three defined labels close to name.
func closestLabels(name string, defined map[string]*labelDef) []string {
	type cand struct {
		n string
		d int
	}
	var cs []cand
	for n := range defined {
		a, b := strings.ToLower(name), strings.ToLower(n)
		d := editDistance(a, b)
		if d <= max(1, len(name)/3) || len(b) >= 2 && (strings.HasPrefix(a, b) || strings.HasPrefix(b, a)) {
			cs = append(cs, cand{n, d})
		}
	}
	sort.Slice(cs, func(i, j int) bool { return cs[i].d < cs[j].d || cs[i].d == cs[j].d && cs[i].n < cs[j].n })
	var out []string
	for i := 0; i < len(cs) && i < 3; i++ {
		out = append(out, cs[i].n)
	}
	return out
}

// editDistance is the Levenshtein distance between a and b.
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			c := 1
			if ra[i-1] == rb[j-1] {
				c = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+c)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}
