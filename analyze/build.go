package analyze

import (
	"strings"

	"walden/grammar/notation"
	"walden/grammar/source"
)

// setupWords are condition words that say the vessel is closed (common
// practice); they matter to the heating cautions.
var setupWords = map[string]bool{
	"sealed": true, "sealed tube": true, "sealed vial": true, "sealed vessel": true,
	"autoclave": true, "pressure tube": true, "microwave": true, "mw": true, "closed vessel": true,
}

// build resolves a parsed step: the substrate, reagents, solvents,
// temperature and written products, with tokens for every part.
func (r *resolver) build(p notation.Step) *stepInput {
	in := &stepInput{parsed: p}
	reactants, conditions, products := p.Reactants(), p.Conditions(), p.Products()
	// One allocation for the substances of a line and one for its lists.
	nSubs := 0
	for _, ts := range [3]notation.Terms{reactants, conditions, products} {
		for i := range ts.Len() {
			if sub, ok := ts.At(i).Substance(); ok {
				nSubs += max(1, sub.Parts().Len())
			}
		}
	}
	r.slab = make([]substance, 0, nSubs)
	if nSubs > 1 {
		lists := make([]*substance, 2*nSubs)
		in.reagents, in.solvents = lists[:0:nSubs], lists[nSubs:nSubs:2*nSubs]
	}
	if m, ok := p.Mark(); ok {
		r.token(m.Span, TokenStatus)
	}
	if l, ok := p.Label(); ok {
		r.token(l.Span, TokenLabel)
	}
	for i := range reactants.Len() {
		t := reactants.At(i)
		r.sep(t)
		sub, ok := t.Substance()
		if !ok {
			r.quantities(in, t)
			continue
		}
		if i == 0 {
			in.substrate = r.term(t, sub, TokenSubstrate)
			r.quantities(in, t)
			continue
		}
		s := r.term(t, sub, TokenReagent)
		if s.solvent != nil && s.reagent == nil {
			in.solvents = append(in.solvents, s)
		} else {
			in.reagents = append(in.reagents, s)
		}
		r.quantities(in, t)
	}
	for i := range conditions.Len() {
		t := conditions.At(i)
		r.sep(t)
		r.quantities(in, t)
		r.notes(in, t)
		sub, ok := t.Substance()
		if !ok {
			continue
		}
		if setupWords[strings.ToLower(sub.Text())] {
			in.sealed = true
			r.token(sub.Span(), TokenSetup)
			continue
		}
		parts := sub.Parts()
		n := parts.Len()
		if sub.Kind() != notation.Mixture || n == 0 {
			n = 1 // the substance stands for itself
		}
		for k := range n {
			ps := sub
			if sub.Kind() == notation.Mixture && parts.Len() > 0 {
				ps = parts.At(k)
			}
			s := r.substance(ps, t)
			switch {
			case s.solvent != nil:
				in.solvents = append(in.solvents, s)
				r.token(s.span, TokenSolvent)
			case s.ref != "":
				in.reagents = append(in.reagents, s)
				r.token(s.span, TokenReference)
			default:
				in.reagents = append(in.reagents, s)
				r.token(s.span, TokenReagent)
			}
		}
	}
	if a, ok := p.Arrow(); ok {
		r.token(a.Span, TokenOperator)
	}
	for i := range products.Len() {
		t := products.At(i)
		r.sep(t)
		if sub, ok := t.Substance(); ok {
			in.products = append(in.products, r.term(t, sub, TokenProduct))
		}
	}
	if c, ok := p.Comment(); ok {
		r.token(c.Span, TokenComment)
	}
	return in
}

// term resolves sub, the substance of a reactant or product term t, and
// records its token (references keep their own kind).
func (r *resolver) term(t notation.Term, sub notation.Substance, kind TokenKind) *substance {
	s := r.substance(sub, t)
	if s.ref != "" {
		kind = TokenReference
	} else if kind == TokenReagent && s.solvent != nil && s.reagent == nil {
		kind = TokenSolvent
	}
	r.token(s.span, kind)
	return s
}

func (r *resolver) sep(t notation.Term) {
	if sep, ok := t.Sep(); ok {
		r.token(sep.Span, TokenOperator)
	}
}

// quantities records temperatures (the last one written wins, and the
// upper end of a range: the temperature the mixture reaches) and tokens.
func (r *resolver) quantities(in *stepInput, t notation.Term) {
	qs := t.Quantities()
	for k := range qs.Len() {
		q := qs.At(k)
		switch q.Kind() {
		case notation.Temperature:
			r.token(q.Span(), TokenTemperature)
			top := q
			if to, ok := q.To(); ok {
				top = to
			}
			in.tempSpan = q.Span()
			switch {
			case top.Word() == "reflux":
				in.reflux, in.hasTemp = true, false
			case top.Word() == "rt":
				in.tempC, in.hasTemp, in.reflux = roomTempC, true, false
			case top.HasValue():
				if c, ok := celsius(top.Value(), top.Unit()); ok {
					in.tempC, in.hasTemp, in.reflux = c, true, false
				}
			}
		case notation.Duration:
			r.token(q.Span(), TokenTime)
		default:
			r.token(q.Span(), TokenAmount)
		}
	}
}

// notes looks in parenthesised notes for a closed vessel.
func (r *resolver) notes(in *stepInput, t notation.Term) {
	ns := t.Notes()
	for k := range ns.Len() {
		n := ns.At(k)
		if setupWords[strings.ToLower(strings.TrimSpace(n.Text))] {
			in.sealed = true
		}
		r.token(n.Span, TokenComment)
	}
}

// celsius converts a temperature to °C.
func celsius(v float64, unit string) (float64, bool) {
	switch unit {
	case "°C", "C", "":
		return v, true
	case "K":
		return v - 273.15, true
	case "°F", "F":
		return (v - 32) * 5 / 9, true
	}
	return 0, false
}

func (r *resolver) token(s source.Span, k TokenKind) {
	if s.End > s.Start {
		if r.tokens == nil {
			r.tokens = make([]Token, 0, 16) // a line has about a dozen: one allocation
		}
		r.tokens = append(r.tokens, Token{Span: s, Kind: k})
	}
}
