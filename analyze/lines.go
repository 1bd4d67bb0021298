package analyze

import (
	"context"
	"fmt"
	"slices"
	"sync"

	"walden/grammar/source"
)

// LineFindings is what one step line adds to its Report's diagnostics,
// for a caller that keeps its own work per line (the language server
// keeps each line's diagnostics encoded for the wire).
type LineFindings struct {
	Span source.Span // the step line in the host
	// Own are the line's findings, positioned relative to Span.Start. The
	// Engine hands out the very same slice, by identity, for as long as
	// the line's text and the products it refers to stay the same, so a
	// caller may key its work by it. It must not be modified.
	Own []Diagnostic
	// Extra are the findings that depend on the rest of the page (labels
	// not resolved, defined twice), in host positions.
	Extra []Diagnostic
}

// lineParts is what a Report made by AnalyzeLines holds instead of its
// flat Steps and Diagnostics, and those, built once when asked for.
type lineParts struct {
	finds []Diagnostic // the line finder's own, in host positions

	once sync.Once
	full *Report
}

// AppendLines appends to dst the findings of every step line of a Report
// made by AnalyzeLines, in page order, and returns them with the
// diagnostics not tied to a step line (an unterminated fence, say), in
// host positions. Together they are Full().Diagnostics. A caller that
// publishes after every edit passes the slice of its last call, so that
// a publication allocates nothing per line. ok is false for a Report made
// otherwise.
func (r *Report) AppendLines(dst []LineFindings) (lines []LineFindings, other []Diagnostic, ok bool) {
	if r.lines == nil {
		return dst, nil, false
	}
	lines = slices.Grow(dst, len(r.steps))
	for i := range r.steps {
		ps := &r.steps[i]
		lines = append(lines, LineFindings{Span: ps.span, Own: ps.own, Extra: ps.extras()})
	}
	return lines, r.lines.finds, true
}

// Full returns the Report with its Steps and Diagnostics: r itself, or,
// for a Report made by AnalyzeLines, one built on the first call and
// shared by every later one. Both are immutable.
func (r *Report) Full() *Report {
	lp := r.lines
	if lp == nil {
		return r
	}
	lp.once.Do(func() {
		f := &Report{Name: r.Name, steps: r.steps, labels: r.labels, dict: r.dict}
		f.Steps = make([]StepReport, 0, len(r.steps))
		f.Diagnostics = make([]Diagnostic, 0, len(lp.finds)+len(r.steps))
		f.Diagnostics = append(f.Diagnostics, lp.finds...)
		var a arena
		for _, ps := range r.steps {
			from := len(f.Diagnostics)
			ps.res.place(f, ps, &a, nil)
			f.Diagnostics = append(f.Diagnostics, ps.extras()...)
			if len(f.Diagnostics)-from > 1 {
				slices.SortStableFunc(f.Diagnostics[from:], byStart)
			}
		}
		if !slices.IsSortedFunc(f.Diagnostics, byStart) {
			slices.SortStableFunc(f.Diagnostics, byStart)
		}
		lp.full = f
	})
	return lp.full
}

// linesLocked is Analyze's pass over the lines of source i for
// AnalyzeLines: the same results and label bookkeeping, with nothing
// placed. e.mu is held.
func (e *Engine) linesLocked(ctx context.Context, rep *Report, found []foundLine, ents []*lineEntry,
	defined map[string]*labelDef, later map[string]bool, order *[]*labelDef, defs *[]labelDef, i int, srcs []Source) {
	var ins []*handOn
	for n, l := range found {
		if n%64 == 0 && ctx.Err() != nil {
			return
		}
		ent := ents[n]
		ins = ins[:0]
		for _, name := range ent.refs {
			if d, ok := defined[name]; ok {
				ins = append(ins, d.handOn)
			} else {
				ins = append(ins, undefinedRef)
			}
		}
		res := e.resultLocked(ent, ins)
		ps := placedStep{span: l.Span, res: res, own: ent.lastOwn, ent: ent, nLabels: int32(len(*order))}
		var extra []Diagnostic
		// The entry says whether the line refers to or defines a label;
		// asking it first spares reading the result of every other line,
		// one cache miss each on a long page.
		if len(ent.refs) > 0 && len(res.refs) > 0 {
			extra = e.labelDiags(res, l.Span.Start, defined, later)
		}
		if ent.label != "" && res.label != "" {
			if prev, dup := defined[res.label]; dup {
				extra = append(extra, Diagnostic{Code: CodeLabelDuplicate, Severity: Error,
					Message: fmt.Sprintf("label '%s' is already defined%s; later steps use the first one", res.label, where(prev, i, srcs)),
					Span:    res.labelSpan.Shift(l.Span.Start)})
			} else {
				*defs = append(*defs, labelDef{name: res.label, src: i, span: res.labelSpan.Shift(l.Span.Start), handOn: res.handOn})
				d := &(*defs)[len(*defs)-1]
				defined[res.label] = d
				*order = append(*order, d)
			}
		}
		if len(extra) > 0 {
			kept := extra[:len(extra):len(extra)]
			ps.extra = &kept
		}
		rep.steps = append(rep.steps, ps)
	}
}
