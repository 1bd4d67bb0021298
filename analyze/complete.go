package analyze

import (
	"fmt"
	"strings"

	"walden/grammar/source"
)

// Complete returns suggestions at pos: step labels where a reference
// ("@…") is being written, reagent and solvent names elsewhere in a step
// line. Each suggestion replaces the word being typed. A Report made by
// AnalyzeLines answers without Full.
func (r *Report) Complete(pos source.Pos) []Completion {
	ps := r.stepAt(pos)
	if ps == nil {
		return nil
	}
	rel := pos - ps.span.Start
	// The word being typed: back from the cursor to a separator.
	start := int(rel)
	if start > len(ps.text()) {
		start = len(ps.text())
	}
	for start > 0 && !strings.ContainsRune(" \t,+(/>", rune(ps.text()[start-1])) {
		start--
	}
	word := ps.text()[start:min(int(rel), len(ps.text()))]
	span := source.Span{Start: ps.span.Start + source.Pos(start), End: pos}
	if strings.HasPrefix(word, "@") {
		return r.completeLabels(ps, word[1:], span)
	}
	if r.dict == nil {
		return nil
	}
	return r.dict.complete(word, span)
}

// completeLabels offers the labels visible to the step.
func (r *Report) completeLabels(ps *placedStep, prefix string, span source.Span) []Completion {
	var out []Completion
	for _, d := range r.labels[:min(int(ps.nLabels), len(r.labels))] {
		if !strings.HasPrefix(strings.ToLower(d.name), strings.ToLower(prefix)) {
			continue
		}
		c := Completion{Label: "@" + d.name, Kind: CompleteLabel, Span: span, Detail: "step label"}
		if d.handOn != nil {
			c.Detail = "step label · " + d.handOn.smiles
			c.Doc = fmt.Sprintf("The product of step **%s**: `%s`", d.name, d.handOn.smiles)
			if len(d.handOn.history) > 0 {
				c.Doc += "\n\nConfiguration through the plan: " + strings.Join(d.handOn.history, " → ")
			}
		}
		out = append(out, c)
	}
	return out
}

// complete offers the dictionary's names starting with prefix (any case).
func (d *dictionary) complete(prefix string, span source.Span) []Completion {
	var out []Completion
	low := strings.ToLower(prefix)
	for _, n := range d.allNames() {
		if !strings.HasPrefix(strings.ToLower(n.Text), low) {
			continue
		}
		kind := CompleteReagent
		if n.Entry.Reagent == nil {
			kind = CompleteSolvent
		}
		out = append(out, Completion{Label: n.Text, Kind: kind, Span: span, Detail: n.Detail, Doc: n.Doc})
	}
	return out
}
