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
func (r *resolver) build(p *notation.Step) *stepInput {
	in := &stepInput{parsed: p}
	if p.Mark != nil {
		r.token(p.Mark.Span, TokenStatus)
	}
	if p.Label != nil {
		r.token(p.Label.Span, TokenLabel)
	}
	for i, t := range p.Reactants {
		r.sep(t)
		if t.Substance == nil {
			r.quantities(in, t)
			continue
		}
		if i == 0 {
			in.substrate = r.term(t, TokenSubstrate)
			r.quantities(in, t)
			continue
		}
		s := r.term(t, TokenReagent)
		if s.solvent != nil && s.reagent == nil {
			in.solvents = append(in.solvents, s)
		} else {
			in.reagents = append(in.reagents, s)
		}
		r.quantities(in, t)
	}
	for _, t := range p.Conditions {
		r.sep(t)
		r.quantities(in, t)
		r.notes(in, t)
		if t.Substance == nil {
			continue
		}
		if setupWords[strings.ToLower(t.Substance.Text)] {
			in.sealed = true
			r.token(t.Substance.Span, TokenSetup)
			continue
		}
		parts := []*notation.Substance{t.Substance}
		if t.Substance.Kind == notation.Mixture && len(t.Substance.Parts) > 0 {
			parts = t.Substance.Parts
		}
		for _, ps := range parts {
			s := r.substance(ps, t)
			switch {
			case s.solvent != nil:
				in.solvents = append(in.solvents, s)
				r.token(ps.Span, TokenSolvent)
			case s.ref != "":
				in.reagents = append(in.reagents, s)
				r.token(ps.Span, TokenReference)
			default:
				in.reagents = append(in.reagents, s)
				r.token(ps.Span, TokenReagent)
			}
		}
	}
	if p.Arrow != nil {
		r.token(p.Arrow.Span, TokenOperator)
	}
	for _, t := range p.Products {
		r.sep(t)
		if t.Substance != nil {
			in.products = append(in.products, r.term(t, TokenProduct))
		}
	}
	if p.Comment != nil {
		r.token(p.Comment.Span, TokenComment)
	}
	return in
}

// term resolves the substance of a reactant or product term and records
// its token (references keep their own kind).
func (r *resolver) term(t *notation.Term, kind TokenKind) *substance {
	s := r.substance(t.Substance, t)
	if s.ref != "" {
		kind = TokenReference
	} else if kind == TokenReagent && s.solvent != nil && s.reagent == nil {
		kind = TokenSolvent
	}
	r.token(t.Substance.Span, kind)
	return s
}

func (r *resolver) sep(t *notation.Term) {
	if t.Sep != nil {
		r.token(t.Sep.Span, TokenOperator)
	}
}

// quantities records temperatures (the last one written wins, and the
// upper end of a range: the temperature the mixture reaches) and tokens.
func (r *resolver) quantities(in *stepInput, t *notation.Term) {
	for _, q := range t.Quantities {
		switch q.Kind {
		case notation.Temperature:
			r.token(q.Span, TokenTemperature)
			top := q
			if q.To != nil {
				top = q.To
			}
			in.tempSpan = q.Span
			switch {
			case top.Word == "reflux":
				in.reflux, in.hasTemp = true, false
			case top.Word == "rt":
				in.tempC, in.hasTemp, in.reflux = roomTempC, true, false
			case top.HasValue:
				if c, ok := celsius(top.Value, top.Unit); ok {
					in.tempC, in.hasTemp, in.reflux = c, true, false
				}
			}
		case notation.Duration:
			r.token(q.Span, TokenTime)
		default:
			r.token(q.Span, TokenAmount)
		}
	}
}

// notes looks in parenthesised notes for a closed vessel.
func (r *resolver) notes(in *stepInput, t *notation.Term) {
	for _, n := range t.Notes {
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
