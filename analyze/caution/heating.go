package caution

import "fmt"

// Heating a solvent past its boiling point.
//
// A temperature above the solvent's normal boiling point means the solvent
// boils off in an open flask (the set temperature is never reached) or, in a
// closed vessel, that pressure builds up; low-boiling solvents such as
// dichloromethane (bp 40 °C) and diethyl ether (bp 35 °C) build the most
// pressure. Sources: common practice; boiling points from the dictionary's
// solvent table, which names its own sources.
func init() {
	register(Rule{
		Code:   "caution-above-boiling",
		Title:  "temperature above the solvent's boiling point in an open setup",
		Source: "common practice",
		check:  aboveBoiling,
	})
	register(Rule{
		Code:   "caution-sealed-heating",
		Title:  "solvent heated at or above its boiling point in a sealed vessel",
		Source: "common practice",
		check:  sealedHeating,
	})
}

// boilMargin is how far above the normal boiling point a set temperature
// may go before it is flagged: bath temperatures a few degrees above the
// boiling point are the normal way to hold a reflux (common practice).
const boilMargin = 10

func aboveBoiling(f finder) []Caution {
	s := f.Step
	if !s.HasTemp || s.Reflux || s.Sealed {
		return nil
	}
	var out []Caution
	for _, x := range s.Substances {
		if x.Role != Solvent || !x.HasBoilingC || s.TempC <= x.BoilingC+boilMargin {
			continue
		}
		out = append(out, Caution{
			Code: "caution-above-boiling",
			Message: say(fmt.Sprintf("Caution: %g °C is above the boiling point of %s (%g °C): in an open flask it boils off, in a closed one it builds pressure.", s.TempC, x.display(), x.BoilingC),
				"Use a higher-boiling solvent, heat at reflux with a condenser, or use a pressure-rated vessel behind a shield."),
			Parties: []Party{x.party()},
		})
	}
	return out
}

func sealedHeating(f finder) []Caution {
	s := f.Step
	if !s.Sealed || !(s.Reflux || s.HasTemp) {
		return nil
	}
	var out []Caution
	for _, x := range s.Substances {
		if x.Role != Solvent || !x.HasBoilingC {
			continue
		}
		if !s.Reflux && s.TempC < x.BoilingC {
			continue
		}
		out = append(out, Caution{
			Code: "caution-sealed-heating",
			Message: say(fmt.Sprintf("Caution: heating %s (bp %g °C) in a sealed vessel builds pressure.", x.display(), x.BoilingC),
				"Use a vessel rated for the pressure, fill it no more than the maker allows, and work behind a blast shield."),
			Parties: []Party{x.party()},
		})
	}
	return out
}
