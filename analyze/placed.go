package analyze

import (
	"sort"

	"walden/grammar/source"
)

// placedStep is a cached step result placed in its host.
type placedStep struct {
	span    source.Span // the line in the host
	res     *stepResult
	own     []Diagnostic // res.diags, kept here so that AppendLines reads no result
	ent     *lineEntry   // the line's text and parse
	nLabels int32        // how many labels (Report.labels) are visible to the step

	// Label findings, in host positions (AnalyzeLines only): few lines
	// have any, and a page's steps are made anew on every edit.
	extra *[]Diagnostic
}

// text is the step's line.
func (ps *placedStep) text() string { return ps.ent.text }

// extras returns the label findings of the step.
func (ps *placedStep) extras() []Diagnostic {
	if ps.extra == nil {
		return nil
	}
	return *ps.extra
}

// stepAt returns the step whose line holds pos (its end included, where
// the cursor sits after typing), or nil.
func (r *Report) stepAt(pos source.Pos) *placedStep {
	i := sort.Search(len(r.steps), func(i int) bool { return r.steps[i].span.End >= pos })
	if i < len(r.steps) && r.steps[i].span.Start <= pos {
		return &r.steps[i]
	}
	return nil
}

// placement is a step result in host positions: its StepReport and
// diagnostics. Reports are immutable, so one placement serves every
// report that has the line at the same offset.
type placement struct {
	base  source.Pos
	step  StepReport
	diags []Diagnostic
}

// place appends the result placed at the start of ps.span to the report's steps and
// diagnostics, dropping the diagnostics whose codes are disabled.
//
// While a line stays put, its last placement is reused as is. A moved
// line's pieces are carved from the arena of the Analyze call: a handful
// of allocations per call instead of several per line. A placement is
// kept for reuse only once the line is seen at the same offset twice in a
// row: while a chemist types, the lines after the cursor move on every
// keystroke, and keeping theirs would be wasted work.
func (r *stepResult) place(rep *Report, ps placedStep, a *arena, disabled map[string]bool) {
	if p := r.last.Load(); p != nil && p.base == ps.span.Start && p.step.Span == ps.span {
		rep.Steps = append(rep.Steps, p.step)
		rep.Diagnostics = append(rep.Diagnostics, p.diags...)
		return
	}
	step := StepReport{Span: ps.span, Label: r.label, Inlay: r.inlay, Fixes: a.shiftFixes(r.fixes, ps.span.Start), Prediction: r.pred}
	if len(r.tokens) > 0 {
		// r.tokens are sorted when the result is made, and a shift keeps
		// the order.
		ts := a.tokens(len(r.tokens))
		for i, t := range r.tokens {
			ts[i] = Token{Span: t.Span.Shift(ps.span.Start), Kind: t.Kind}
		}
		step.Tokens = ts
	}
	rep.Steps = append(rep.Steps, step)
	from := len(rep.Diagnostics)
	for _, d := range r.diags {
		if disabled[d.Code] {
			continue
		}
		d.Span = d.Span.Shift(ps.span.Start)
		if len(d.Related) > 0 {
			rel := a.related(len(d.Related))
			for j, x := range d.Related {
				rel[j] = Related{Span: x.Span.Shift(ps.span.Start), Message: x.Message}
			}
			d.Related = rel
		}
		d.Fixes = a.shiftFixes(d.Fixes, ps.span.Start)
		rep.Diagnostics = append(rep.Diagnostics, d)
	}
	if r.seen.Swap(int64(ps.span.Start)) != int64(ps.span.Start) {
		return // moved since the last call: likely to move again
	}
	p := a.placement()
	p.base, p.step = ps.span.Start, step
	if n := len(rep.Diagnostics) - from; n > 0 {
		p.diags = a.diags(n)
		copy(p.diags, rep.Diagnostics[from:])
	}
	r.last.Store(p)
}

// arena hands out the pieces of the placements made by one Analyze call
// from shared chunks. A chunk is small enough that a placement kept for
// later calls holds little besides its own pieces alive.
type arena struct {
	places  []placement
	diagBuf []Diagnostic
	fixBuf  []Fix
	editBuf []Edit
	relBuf  []Related
	tokBuf  []Token
}

// arenaChunk is how many pieces of one kind a chunk holds.
const arenaChunk = 128

// carve returns n elements of *buf, starting a new chunk when the current
// one is too short. Chunks grow from small to arenaChunk, so that a call
// placing a line or two does not set aside room for a page. The result's
// capacity is n, so an append by a reader of the Report cannot reach a
// neighbour's pieces.
func carve[T any](buf *[]T, n int) []T {
	if cap(*buf)-len(*buf) < n {
		*buf = make([]T, 0, max(n, min(arenaChunk, 2*cap(*buf)+4)))
	}
	l := len(*buf)
	*buf = (*buf)[:l+n]
	return (*buf)[l : l+n : l+n]
}

func (a *arena) placement() *placement    { return &carve(&a.places, 1)[0] }
func (a *arena) diags(n int) []Diagnostic { return carve(&a.diagBuf, n) }
func (a *arena) related(n int) []Related  { return carve(&a.relBuf, n) }
func (a *arena) tokens(n int) []Token     { return carve(&a.tokBuf, n) }

// shiftFixes returns fs moved by the given offset.
func (a *arena) shiftFixes(fs []Fix, by source.Pos) []Fix {
	if len(fs) == 0 {
		return nil
	}
	out := carve(&a.fixBuf, len(fs))
	for i, f := range fs {
		es := carve(&a.editBuf, len(f.Edits))
		for j, ed := range f.Edits {
			es[j] = Edit{Span: ed.Span.Shift(by), NewText: ed.NewText}
		}
		if len(es) == 0 {
			es = nil
		}
		out[i] = Fix{Title: f.Title, Preferred: f.Preferred, Edits: es}
	}
	return out
}
