package analyze

import (
	"context"

	"walden/grammar/source"
)

// Engine analyses sources and remembers per-step results, so that an edit
// re-analyses only the steps that changed and those that refer to them.
// An Engine is safe for concurrent use.
//
// STUB: the signatures are fixed; the bodies are being written.
type Engine struct {
	cfg Config
}

// NewEngine returns an Engine using cfg.
func NewEngine(cfg Config) *Engine { return &Engine{cfg: cfg} }

// Analyze returns one Report per source, in order. Labels defined in an
// earlier source are visible to later ones. It returns ctx.Err() if the
// context is cancelled before it finishes.
func (e *Engine) Analyze(ctx context.Context, srcs []Source) ([]*Report, error) {
	reps := make([]*Report, len(srcs))
	for i, s := range srcs {
		reps[i] = &Report{Name: s.Name}
	}
	return reps, ctx.Err()
}

// Hover returns Markdown describing what is at pos: a step (predicted
// product, configuration before and after, mechanism, distribution,
// reasons, cautions), a reagent or solvent (its data and sources), or an
// atom of a SMILES (its CIP label and role). ok is false where there is
// nothing to say.
func (r *Report) Hover(pos source.Pos) (markdown string, span source.Span, ok bool) {
	return "", source.Span{}, false
}

// Complete returns suggestions at pos (reagent and solvent names, or step
// labels where a reference is expected).
func (r *Report) Complete(pos source.Pos) []Completion { return nil }
