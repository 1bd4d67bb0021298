package caution

import "fmt"

// Cyanide with acid.
//
// Acid protonates cyanide salts to hydrogen cyanide, a volatile and highly
// toxic gas (bp 26 °C). Sources: Bretherick's Handbook of Reactive Chemical
// Hazards, entries for sodium and potassium cyanide (from memory); the
// safety data sheets of NaCN and KCN (common practice: "contact with acids
// liberates very toxic gas").
func init() {
	register(Rule{
		Code:   "caution-cyanide-acid",
		Title:  "cyanide with acid (hydrogen cyanide, HCN)",
		Source: "Bretherick's Handbook of Reactive Chemical Hazards (from memory); NaCN/KCN safety data sheets (common practice)",
		Check:  cyanideAcid,
	})
}

func cyanideAcid(s *Step) []Caution {
	return withAcid(s, "caution-cyanide-acid",
		func(x Substance) bool {
			return hasCyanide(x.Mol) || x.named("NaCN", "KCN", "TMSCN", "CuCN", "sodium cyanide", "potassium cyanide")
		},
		"cyanide with %s releases hydrogen cyanide (HCN), a highly toxic gas.",
		"Keep cyanide away from acid, including in work-up and waste, and work where an HCN release can be contained.")
}

// withAcid pairs every substance that is(x) with every acid of the step.
func withAcid(s *Step, code string, is func(Substance) bool, finding, advice string) []Caution {
	var out []Caution
	acids := s.each(func(x Substance) bool { return x.Acid || strongAcid(x.Mol) })
	for _, a := range s.each(is) {
		for _, h := range acids {
			if a.Role == h.Role && a.Index == h.Index {
				continue
			}
			out = append(out, Caution{
				Code:    code,
				Message: say("Caution: "+fmt.Sprintf(finding, h.display()), advice),
				Parties: []Party{h.party(), a.party()},
			})
		}
	}
	return out
}
