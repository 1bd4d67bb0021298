package analyze

import (
	"sort"

	"walden/grammar/source"
)

// placedStep is a cached step result placed in its host.
type placedStep struct {
	base    source.Pos  // where the line starts in the host
	span    source.Span // the line in the host
	res     *stepResult
	text    string // the line
	nLabels int    // how many labels (Report.labels) are visible to the step
}

// report makes the exported StepReport, in host positions.
func (ps placedStep) report() StepReport {
	r := ps.res
	sr := StepReport{Span: ps.span, Label: r.label, Inlay: r.inlay, Fixes: shiftFixes(r.fixes, ps.base), Prediction: r.pred}
	if len(r.tokens) > 0 {
		sr.Tokens = make([]Token, len(r.tokens))
		for i, t := range r.tokens {
			sr.Tokens[i] = Token{Span: t.Span.Shift(ps.base), Kind: t.Kind}
		}
		sort.Slice(sr.Tokens, func(i, j int) bool { return sr.Tokens[i].Span.Start < sr.Tokens[j].Span.Start })
	}
	return sr
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

// placed returns the result placed at ps.base, reusing the last placement
// when the line has not moved: an edit moves only the lines after it, and
// copying the fixes of every diagnostic of a long page is most of the
// cost of a re-analysis.
func (r *stepResult) placed(ps placedStep) *placement {
	if p := r.last.Load(); p != nil && p.base == ps.base && p.step.Span == ps.span {
		return p
	}
	p := &placement{base: ps.base, step: ps.report()}
	if len(r.diags) > 0 {
		p.diags = make([]Diagnostic, len(r.diags))
		for i, d := range r.diags {
			p.diags[i] = shiftDiag(d, ps.base)
		}
	}
	r.last.Store(p)
	return p
}
