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
		check:  cyanideAcid,
	})
}

func cyanideAcid(f finder) []Caution {
	return withAcid(f, "caution-cyanide-acid",
		func(i int) bool {
			return hasCyanide(f.Substances[i].Mol) || f.named(i, cyanideNames)
		},
		"cyanide with %s releases hydrogen cyanide (HCN), a highly toxic gas.",
		"Keep cyanide away from acid, including in work-up and waste, and work where an HCN release can be contained.")
}

// withAcid pairs every substance that is(x) with every acid of the step.
func withAcid(f finder, code string, is func(i int) bool, finding, advice string) []Caution {
	var out []Caution
	var acBuf, isBuf [8]int
	acids := f.each(acBuf[:0], f.acid)
	for _, i := range f.each(isBuf[:0], is) {
		a := &f.Substances[i]
		for _, j := range acids {
			h := &f.Substances[j]
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

// cyanideNames are the cyanides named by the chemist.
var cyanideNames = nameSetOf("NaCN", "KCN", "TMSCN", "CuCN", "sodium cyanide", "potassium cyanide")
