package analyze

import (
	"cmp"
	"fmt"
	"slices"
	"strings"

	"walden/analyze/outcome"
	"walden/grammar/notation"
)

// runOutcome is the outcome engine's entry point (a variable so that
// tests can count or replace it).
var runOutcome = func(st *outcome.Step) *outcome.Outcome {
	o := outcome.Predict(*st)
	return &o
}

// predict runs the outcome engine on a resolved step and converts its
// answer into the report's terms.
func (e *Engine) predict(in *stepInput) *prediction {
	if runOutcome == nil {
		return &prediction{notAnalysed: "the outcome rules are not available in this build", reacting: -1, mechanism: "none"}
	}
	st := &outcome.Step{Substrate: in.substrate.mol, Reflux: in.reflux}
	if in.hasTemp {
		t := in.tempC
		st.TempC = &t
	}
	st.Reagents = make([]outcome.Reactant, len(in.reagents))
	for i, r := range in.reagents {
		st.Reagents[i] = outcome.Reactant{Mol: r.mol, Entry: r.reagent, Equiv: equivalents(r.term)}
	}
	st.Solvents = make([]outcome.SolventShare, 0, len(in.solvents))
	solventIndex := make(map[int]int, len(in.solvents)) // outcome's index → ours
	for i, s := range in.solvents {
		if s.solvent == nil {
			continue
		}
		solventIndex[len(st.Solvents)] = i
		st.Solvents = append(st.Solvents, outcome.SolventShare{Solvent: s.solvent})
	}
	return e.memo.prediction(st, solventIndex)
}

// fromOutcome converts the outcome engine's answer.
func fromOutcome(o *outcome.Outcome, solventIndex map[int]int) *prediction {
	p := &prediction{notAnalysed: o.NotAnalysed, mechanism: string(o.Mechanism), reacting: o.Site, leaving: o.Leaving}
	for _, s := range o.Scores {
		if s.Possible && s.Fraction >= 0.005 { // shares that round to 0% say nothing
			if p.distribution == nil {
				p.distribution = make([]share, 0, len(o.Scores))
			}
			p.distribution = append(p.distribution, share{string(s.Pathway), s.Fraction})
		}
	}
	slices.SortStableFunc(p.distribution, func(a, b share) int { return cmp.Compare(b.fraction, a.fraction) })
	if len(o.Products) > 0 {
		// The major product first (the last one named, should there be
		// several), then the others in the engine's order.
		p.products = make([]product, 0, len(o.Products))
		add := func(x outcome.Product) {
			smi := x.SMILES
			if smi == "" {
				smi = canonical(x.Mol)
			}
			p.products = append(p.products, product{smiles: smi, mol: x.Mol, fraction: x.Fraction, major: x.Role == outcome.Major, mechanism: string(x.Pathway), note: x.Note})
		}
		for i := len(o.Products) - 1; i >= 0; i-- {
			if o.Products[i].Role == outcome.Major {
				add(o.Products[i])
			}
		}
		for _, x := range o.Products {
			if x.Role != outcome.Major {
				add(x)
			}
		}
	}
	if n := len(o.Reasons); n > 0 {
		both := make([]string, 2*n)
		p.reasons, p.sources = both[:n:n], both[n:]
		for i, r := range o.Reasons {
			p.reasons[i], p.sources[i] = r.Text, r.Source
		}
	}
	for _, c := range o.Stereo {
		p.stereo = append(p.stereo, stereoChange{atom: c.Atom, before: c.Before, after: c.After, outcome: string(c.Change), letterChanged: c.LetterChanged, why: c.Why})
	}
	for _, f := range o.Findings {
		p.findings = append(p.findings, fromFinding(f, solventIndex))
	}
	return p
}

// fromFinding places a finding by its parties: the substrate atoms named
// first, else the reagent, the solvent or the temperature; the other
// parties become related information.
func fromFinding(f outcome.Finding, solventIndex map[int]int) chemFinding {
	cf := chemFinding{code: fmt.Sprint(f.Code), severity: Severity(f.Severity), message: f.Message, atoms: f.Parties.Atoms, on: partyNone, index: -1}
	var parties []partyRef
	if len(f.Parties.Atoms) > 0 {
		parties = append(parties, partyRef{on: partySubstrate, why: "the substrate"})
	}
	if f.Parties.Reactant >= 0 {
		parties = append(parties, partyRef{on: partyReagent, index: f.Parties.Reactant})
	}
	if f.Parties.Solvent >= 0 {
		if i, ok := solventIndex[f.Parties.Solvent]; ok {
			parties = append(parties, partyRef{on: partySolvent, index: i})
		}
	}
	if f.Parties.Temp {
		parties = append(parties, partyRef{on: partyTemperature})
	}
	if want, ok := markOn[cf.code]; ok {
		for i, p := range parties {
			if p.on == want {
				parties[0], parties[i] = parties[i], parties[0]
				break
			}
		}
	}
	if len(parties) > 0 {
		cf.on, cf.index = parties[0].on, parties[0].index
		cf.also = parties[1:]
	}
	for _, x := range f.Fixes {
		cf.fixes = append(cf.fixes, fromFix(x, f.Parties, solventIndex)...)
	}
	return cf
}

// markOn names the party whose token carries a finding when it is not
// the substrate: the mark goes where the chemist would make the change
// the fix offers (the solvent for a protic solvent, the base for an
// elimination); the substrate stays as related information.
var markOn = map[string]party{
	string(outcome.CodeProticSlows):    partySolvent,
	string(outcome.CodeBaseEliminates): partyReagent,
}

// fromFix turns a fix in chemical terms into one chemFix per choice
// (one per solvent or reagent offered; an activation step is one fix
// whose Names are the reagents of the new step).
func fromFix(x outcome.Fix, ps outcome.Parties, solventIndex map[int]int) []chemFix {
	var out []chemFix
	title := func(n string) string {
		if x.Title == "" {
			return n
		}
		if len(x.Names) <= 1 {
			return x.Title
		}
		return x.Title + ": " + n
	}
	switch x.Kind {
	case outcome.ReplaceSolvent:
		idx := -1
		if i, ok := solventIndex[ps.Solvent]; ok {
			idx = i
		}
		for _, n := range x.Names {
			out = append(out, chemFix{kind: fixSwapSolvent, title: title(n), text: n, index: idx})
		}
	case outcome.ReplaceReagent:
		for _, n := range x.Names {
			out = append(out, chemFix{kind: fixReplaceReagent, title: title(n), text: n, index: ps.Reactant})
		}
	case outcome.ChangeTemp:
		if len(x.Names) > 0 {
			out = append(out, chemFix{kind: fixTemperature, title: title(x.Names[0]), text: x.Names[0]})
		}
	case outcome.InsertStep:
		if len(x.Names) > 0 {
			t := x.Title
			if t == "" {
				t = "activate first with " + strings.Join(x.Names, " + ")
			}
			out = append(out, chemFix{kind: fixActivate, title: t, text: strings.Join(x.Names, " + ")})
		}
	}
	return out
}

// equivalents reads the equivalents written on a term, 0 when none.
func equivalents(t notation.Term) float64 {
	if t.IsZero() {
		return 0
	}
	qs := t.Quantities()
	for k := range qs.Len() {
		if q := qs.At(k); q.Kind() == notation.Equivalents && q.HasValue() {
			return q.Value()
		}
	}
	return 0
}
