package analyze

import (
	"fmt"
	"sort"
	"strings"

	"walden/analyze/outcome"
	"walden/grammar/notation"
	"walden/grammar/source"
)

// analyseStep analyses one parsed line (positions relative to the line)
// with the products of the labels it can see. It never fails: whatever
// cannot be decided becomes a diagnostic.
func (e *Engine) analyseStep(p notation.Step, perrs source.ErrorList, refs map[string]*handOn) *stepResult {
	e.analysed.Add(1)
	res := &stepResult{}
	for _, er := range perrs {
		code := er.Code
		if code == "" {
			code = CodeSyntax
		}
		res.diags = append(res.diags, Diagnostic{Code: code, Severity: Error, Message: er.Msg, Span: er.Span})
	}
	r := &resolver{dict: e.dict, memo: e.memo, refs: refs}
	in := r.build(p)
	res.tokens = r.tokens
	res.diags = append(res.diags, r.diags...)
	if l, ok := p.Label(); ok {
		res.label, res.labelSpan = l.Name, l.NameSpan
	}
	res.refs = references(p)
	res.slots = slots(p)
	res.in = in
	if p.Blank() {
		return res
	}
	if in.substrate == nil {
		res.diags = append(res.diags, Diagnostic{Code: CodeNoSubstrate, Severity: Error,
			Message: "the step names no substrate; start the line with the substrate (SMILES, a name or @label)", Span: p.Span()})
		return res
	}
	if !in.substrate.known() {
		// Already reported (unknown name, bad SMILES, unresolved label);
		// nothing to predict from.
		res.hover = "**not analysed**: the substrate could not be read."
		res.inlay = "not analysed"
		return res
	}
	if declaration(in) {
		// "sm: SMILES" names a starting material: later steps use it as is.
		if res.label != "" {
			h := &handOn{mol: in.substrate.mol, smiles: canonical(in.substrate.mol)}
			if in.substrate.from != nil {
				h.history = in.substrate.from.history
			}
			res.handOn = h
		}
		res.inlay = "starting material"
		res.hover = fmt.Sprintf("**starting material** `%s`", canonical(in.substrate.mol))
		if l := cipLabels(in.substrate.mol); len(l) > 0 {
			res.hover += "\n\nCIP: " + labelList(l)
		}
		res.pred = nil
		return res
	}
	if bad := unreadable(in); bad != "" {
		// Predicting without a reagent or solvent the line names would
		// answer another question than the chemist's.
		res.hover = fmt.Sprintf("**not analysed**: '%s' could not be read; fix it and the prediction follows.", bad)
		res.inlay = "not analysed"
		res.pred = &Prediction{Mechanism: "none", NotAnalysed: fmt.Sprintf("'%s' could not be read", bad)}
		res.diags = append(res.diags, placeCautions(in, e.memo.cautions(in))...)
		return res
	}
	e.applyDefaults(in)
	takeElectrophile(in, e.memo)
	pred := e.predict(in)
	if in.electrophileFirst != "" {
		pred.reasons = append([]string{in.electrophileFirst}, pred.reasons...)
		pred.sources = append([]string{""}, pred.sources...)
	}
	cautions := e.memo.cautions(in)
	found := placeFindings(in, pred)
	if hasCode(r.diags, CodeUnknownName) || hasCode(r.diags, CodeSMILES) {
		// An unreadable condition may well be the solvent: "no solvent
		// given" would mislead.
		found = dropCode(found, string(outcome.CodeNoSolvent))
	}
	res.diags = append(res.diags, found...)
	res.diags = append(res.diags, placeCautions(in, cautions)...)
	res.diags = append(res.diags, compareProducts(in, pred)...)
	res.fixes = stepFixes(p, in, pred)
	res.handOn = handOnFrom(res.label, in, pred)
	res.pred = pred.public(through(res.label, in, pred))
	res.inlay = inlayText(pred)
	res.chem, res.cautions = pred, cautions
	return res
}

// unreadable returns the text of the first reagent or solvent that did
// not resolve, or "".
func unreadable(in *stepInput) string {
	for _, list := range [][]*substance{in.reagents, in.solvents} {
		for _, s := range list {
			if !s.known() {
				return s.text
			}
		}
	}
	return ""
}

// declaration reports a line that only names a substance: no reagents,
// no conditions, no arrow.
func declaration(in *stepInput) bool {
	p := in.parsed
	_, arrow := p.Arrow()
	return p.Reactants().Len() == 1 && p.Conditions().Len() == 0 && !arrow && in.substrate.mol != nil
}

// labelList writes CIP labels as "atom 2 S, atom 5 R".
func labelList(l map[int]string) string {
	atoms := make([]int, 0, len(l))
	for a := range l {
		atoms = append(atoms, a)
	}
	sort.Ints(atoms)
	parts := make([]string, len(atoms))
	for i, a := range atoms {
		parts[i] = fmt.Sprintf("atom %d %s", a+1, l[a])
	}
	return strings.Join(parts, ", ")
}

// applyDefaults fills the solvent and temperature a step does not give,
// from the Config, and says so once.
func (e *Engine) applyDefaults(in *stepInput) {
	if len(in.solvents) == 0 {
		// "RBr + EtOH, reflux" is a solvolysis in ethanol: a reagent that
		// is also a solvent, in a line naming no other, is the medium
		// (common practice) rather than a guess at the default solvent.
		for _, r := range in.reagents {
			if r.solvent != nil {
				in.solvents = append(in.solvents, r)
				break
			}
		}
	}
	if len(in.solvents) == 0 && e.cfg.DefaultSolvent != "" {
		if sv := e.dict.asSolvent(e.cfg.DefaultSolvent); sv != nil {
			in.solvents = append(in.solvents, &substance{text: e.cfg.DefaultSolvent, solvent: sv, span: source.Span{Start: in.parsed.End(), End: in.parsed.End()}})
			in.solventAssumed = e.cfg.DefaultSolvent
		}
	}
	if !in.hasTemp && !in.reflux && e.cfg.DefaultTempC != nil {
		in.tempC, in.hasTemp = *e.cfg.DefaultTempC, true
	}
}

// references lists the "@label" uses of a line, in order.
func references(p notation.Step) []refUse {
	var out []refUse
	add := func(s notation.Substance) {
		if s.Kind() == notation.Reference {
			out = append(out, refUse{s.Text(), s.Span()})
		}
	}
	for _, ts := range [2]notation.Terms{p.Reactants(), p.Conditions()} {
		for k := range ts.Len() {
			s, ok := ts.At(k).Substance()
			if !ok {
				continue
			}
			add(s)
			parts := s.Parts()
			for j := range parts.Len() {
				add(parts.At(j))
			}
		}
	}
	return out
}

// slots lists where completion applies: every substance of the line.
func slots(p notation.Step) []slot {
	reactants, conditions := p.Reactants(), p.Conditions()
	out := make([]slot, 0, reactants.Len()+conditions.Len())
	for _, ts := range [2]notation.Terms{reactants, conditions} {
		for k := range ts.Len() {
			if s, ok := ts.At(k).Substance(); ok {
				out = append(out, slot{span: s.Span(), reference: s.Kind() == notation.Reference})
			}
		}
	}
	return out
}

// spanOf returns where a party of a finding sits in the line.
func spanOf(in *stepInput, on party, index int) (source.Span, string, bool) {
	switch on {
	case partySubstrate:
		if in.substrate != nil {
			return in.substrate.span, in.substrate.text, true
		}
	case partyReagent:
		if index >= 0 && index < len(in.reagents) {
			return in.reagents[index].span, in.reagents[index].text, true
		}
	case partySolvent:
		if index >= 0 && index < len(in.solvents) && in.solventAssumed == "" {
			return in.solvents[index].span, in.solvents[index].text, true
		}
	case partyTemperature:
		if in.tempSpan.End > in.tempSpan.Start {
			return in.tempSpan, "the temperature", true
		}
	}
	return source.Span{}, "", false
}

// atomSpan returns the span of substrate atom a inside the line, when the
// substrate was written as SMILES in it.
func atomSpan(in *stepInput, a int) (source.Span, bool) {
	return smilesAtomSpan(in.substrate, a)
}

// smilesAtomSpan returns the span of atom a of a substance written as
// SMILES in the line.
func smilesAtomSpan(s *substance, a int) (source.Span, bool) {
	if s == nil || !s.asSMILES || s.mol == nil || a < 0 || a >= len(s.mol.Atoms) {
		return source.Span{}, false
	}
	as := s.mol.Atoms[a].Span
	if as.End <= as.Start {
		return source.Span{}, false
	}
	return source.Span{Start: s.span.Start + source.Pos(as.Start), End: s.span.Start + source.Pos(as.End)}, true
}

// placeFindings turns the outcome's findings into diagnostics on the
// responsible token: the substrate atom named (inside the SMILES), the
// reagent or the solvent, with related information on the other parties.
func placeFindings(in *stepInput, pred *prediction) []Diagnostic {
	var out []Diagnostic
	whole := in.parsed.Span()
	for _, f := range pred.findings {
		d := Diagnostic{Code: f.code, Severity: f.severity, Message: f.message, Span: whole}
		placed := false
		if f.on == partySubstrate || f.on == partyNone {
			for _, a := range f.atoms {
				if sp, ok := atomSpan(in, a); ok {
					d.Span, placed = sp, true
					break
				}
			}
		}
		if !placed {
			if sp, _, ok := spanOf(in, f.on, f.index); ok {
				d.Span = sp
			} else if in.substrate != nil && f.on == partyNone {
				d.Span = in.substrate.span
			}
		}
		for _, o := range f.also {
			if sp, name, ok := spanOf(in, o.on, o.index); ok && sp != d.Span {
				why := o.why
				if why == "" {
					why = name
				}
				d.Related = append(d.Related, Related{Span: sp, Message: why})
			}
		}
		d.Fixes = chemFixes(in, f.fixes)
		out = append(out, d)
	}
	if pred.notAnalysed != "" && !hasCode(out, CodeNotAnalysed) {
		sp := whole
		if in.substrate != nil {
			sp = in.substrate.span
		}
		out = append(out, Diagnostic{Code: CodeNotAnalysed, Severity: Info, Message: "not analysed: " + pred.notAnalysed, Span: sp})
	}
	if in.solventAssumed != "" {
		out = append(out, Diagnostic{Code: CodeDefaultSolvent, Severity: Info,
			Message: fmt.Sprintf("no solvent given; predicted for %s, the default set in %s", in.solventAssumed, SettingsFile), Span: in.substrate.span})
	}
	return out
}

func hasCode(ds []Diagnostic, code string) bool {
	for _, d := range ds {
		if d.Code == code {
			return true
		}
	}
	return false
}

func dropCode(ds []Diagnostic, code string) []Diagnostic {
	out := ds[:0]
	for _, d := range ds {
		if d.Code != code {
			out = append(out, d)
		}
	}
	return out
}

// handOnFrom is what a later "@label" gets: the product the chemist wrote
// after '->' if any, else the predicted major product; with the
// configuration history extended by this step.
func handOnFrom(label string, in *stepInput, pred *prediction) *handOn {
	if label == "" {
		return nil
	}
	h := &handOn{}
	if len(in.products) > 0 && in.products[0].mol != nil {
		h.mol, h.smiles, h.written = in.products[0].mol, canonical(in.products[0].mol), true
	} else if len(pred.products) > 0 && pred.products[0].mol != nil {
		h.mol, h.smiles = pred.products[0].mol, pred.products[0].smiles
	} else {
		return nil
	}
	h.history = through(label, in, pred)
	return h
}

// through is the configuration at the reacting carbon through the plan:
// the referenced step's history and this step's change, as in
// "k1 retained (S) → k2 inverted (R)".
func through(label string, in *stepInput, pred *prediction) []string {
	var out []string
	if in.substrate != nil && in.substrate.from != nil {
		out = append(out, in.substrate.from.history...)
	}
	if c, ok := reactingChange(pred); ok && pred.notAnalysed == "" {
		if label == "" {
			label = "this step"
		}
		entry := label + " " + c.outcome
		if c.after != "" {
			entry += " (" + c.after + ")"
		}
		out = append(out, entry)
	}
	return out
}

// reactingChange returns the stereo change at the reacting carbon.
func reactingChange(pred *prediction) (stereoChange, bool) {
	for _, c := range pred.stereo {
		if c.atom == pred.reacting {
			return c, true
		}
	}
	if len(pred.stereo) == 1 {
		return pred.stereo[0], true
	}
	return stereoChange{}, false
}

// plural-free percentage, "95%".
func percent(f float64) string {
	return fmt.Sprintf("%.0f%%", 100*f)
}

// join joins non-empty strings.
func join(sep string, parts ...string) string {
	var out []string
	for _, p := range parts {
		if p != "" {
			out = append(out, p)
		}
	}
	return strings.Join(out, sep)
}
