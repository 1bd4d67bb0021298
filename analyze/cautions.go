package analyze

import (
	"walden/analyze/caution"
	"walden/analyze/reagents"
)

// cautionsFor asks the caution rules about a step.
func cautionsFor(in *stepInput) []caution.Caution {
	st := &caution.Step{TempC: in.tempC, HasTemp: in.hasTemp, Reflux: in.reflux, Sealed: in.sealed,
		Substances: make([]caution.Substance, 0, 1+len(in.reagents)+len(in.solvents))}
	add := func(role caution.Role, i int, s *substance) {
		if s == nil {
			return
		}
		c := caution.Substance{Role: role, Index: i, Text: s.shown(), Mol: s.mol}
		if s.reagent != nil {
			c.Names = s.reagent.Names
			c.Acid = s.reagent.Roles&reagents.Acid != 0
		}
		if s.solvent != nil {
			if len(c.Names) == 0 {
				c.Names = s.solvent.Names // shared, read only: no copy
			} else {
				// A new list: appending to the reagent's own would write
				// into the dictionary's shared array.
				c.Names = append(append(make([]string, 0, len(c.Names)+len(s.solvent.Names)), c.Names...), s.solvent.Names...)
			}
			if s.solvent.BoilingC.Known {
				c.BoilingC, c.HasBoilingC = s.solvent.BoilingC.V, true
			}
		}
		st.Substances = append(st.Substances, c)
	}
	add(caution.Substrate, 0, in.substrate)
	for i, s := range in.reagents {
		add(caution.Reagent, i, s)
	}
	for i, s := range in.solvents {
		add(caution.Solvent, i, s)
	}
	return caution.Find(st)
}

// placeCautions puts each caution on its first party, with the others as
// related information.
func placeCautions(in *stepInput, cs []caution.Caution) []Diagnostic {
	var out []Diagnostic
	for _, c := range cs {
		d := Diagnostic{Code: c.Code, Severity: Warning, Message: c.Message, Span: in.parsed.Span()}
		for i, p := range c.Parties {
			sp, name, ok := spanOf(in, cautionParty(p.Role), p.Index)
			if !ok {
				continue
			}
			if i == 0 {
				d.Span = sp
			} else {
				d.Related = append(d.Related, Related{Span: sp, Message: name})
			}
		}
		out = append(out, d)
	}
	return out
}

func cautionParty(r caution.Role) party {
	switch r {
	case caution.Substrate:
		return partySubstrate
	case caution.Reagent:
		return partyReagent
	case caution.Solvent:
		return partySolvent
	}
	return partyNone
}
