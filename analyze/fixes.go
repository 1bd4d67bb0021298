package analyze

import (
	"fmt"
	"strings"

	"walden/grammar/notation"
	"walden/grammar/source"
)

// chemFixes turns fixes in chemical terms into edits of the line.
func chemFixes(in *stepInput, fs []chemFix) []Fix {
	var out []Fix
	for _, f := range fs {
		var edits []Edit
		switch f.kind {
		case fixSwapSolvent:
			if sp, name, ok := spanOf(in, partySolvent, f.index); ok {
				if strings.EqualFold(name, f.text) {
					continue
				}
				edits = []Edit{{Span: sp, NewText: f.text}}
			} else {
				edits = []Edit{appendCondition(in.parsed, f.text)}
			}
		case fixReplaceReagent:
			if sp, name, ok := spanOf(in, partyReagent, f.index); ok && !strings.EqualFold(name, f.text) {
				edits = []Edit{{Span: sp, NewText: f.text}}
			}
		case fixTemperature:
			if sp, _, ok := spanOf(in, partyTemperature, 0); ok {
				edits = []Edit{{Span: sp, NewText: f.text}}
			} else {
				edits = []Edit{appendCondition(in.parsed, f.text)}
			}
		case fixActivate:
			edits = activationEdits(in, f.text)
		}
		if len(edits) == 0 {
			continue
		}
		out = append(out, Fix{Title: f.title, Edits: edits, Preferred: len(out) == 0})
	}
	return out
}

// activationEdits inserts a new step line before this one that turns the
// substrate's poor leaving group into a good one, and makes this step use
// its product by label. reagents is what follows the substrate in the new
// line ("TsCl + pyridine, DCM, 0 °C").
func activationEdits(in *stepInput, reagents string) []Edit {
	s := in.substrate
	if s == nil {
		return nil
	}
	label := "act"
	if l, ok := in.parsed.Label(); ok {
		label = l.Name + "-act"
	}
	if !strings.Contains(reagents, ",") {
		// Sulfonylation is run in dichloromethane from 0 °C (common
		// practice); a line without them would only draw "no solvent".
		reagents += ", DCM, 0 °C"
	}
	line := fmt.Sprintf("%s: %s + %s\n", label, s.text, reagents)
	if s.ref != "" {
		line = fmt.Sprintf("%s: @%s + %s\n", label, s.ref, reagents)
	}
	start := in.parsed.Pos()
	return []Edit{
		{Span: source.Span{Start: start, End: start}, NewText: line},
		{Span: s.span, NewText: "@" + label},
	}
}

// appendCondition adds ", text" after the last condition (before any
// arrow or comment).
func appendCondition(p notation.Step, text string) Edit {
	at := lastTermEnd(p)
	return Edit{Span: source.Span{Start: at, End: at}, NewText: ", " + text}
}

// lastTermEnd is where the reactants and conditions end.
func lastTermEnd(p notation.Step) source.Pos {
	at := p.Pos()
	for _, ts := range [2]notation.Terms{p.Reactants(), p.Conditions()} {
		for k := range ts.Len() {
			if end := ts.At(k).End(); end > at {
				at = end
			}
		}
	}
	if l, ok := p.Label(); ok && l.Span.End > at {
		at = l.Span.End
	}
	return at
}

// stepFixes are the actions on a step not tied to a diagnostic: write the
// predicted product after '->' when the chemist wrote none.
func stepFixes(p notation.Step, in *stepInput, pred *prediction) []Fix {
	if len(in.products) > 0 || len(pred.products) == 0 || pred.notAnalysed != "" {
		return nil
	}
	smi := pred.products[0].smiles
	var e Edit
	if a, ok := p.Arrow(); ok {
		e = Edit{Span: source.Span{Start: a.Span.End, End: a.Span.End}, NewText: " " + smi}
	} else {
		at := lastTermEnd(p)
		e = Edit{Span: source.Span{Start: at, End: at}, NewText: " -> " + smi}
	}
	// Every step without a written product has this fix: the fix and its
	// edit share one allocation.
	both := &struct {
		fix  [1]Fix
		edit [1]Edit
	}{edit: [1]Edit{e}}
	both.fix[0] = Fix{Title: "Write the predicted product after '->'", Edits: both.edit[:]}
	return both.fix[:]
}
