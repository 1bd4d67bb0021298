package caution

// Azide with dichloromethane or chloroform.
//
// Sodium azide reacts with dichloromethane to give diazidomethane (and with
// chloroform, triazidomethane), highly explosive and easily concentrated
// when the solvent is evaporated. Sources: Bretherick's Handbook of
// Reactive Chemical Hazards, entries for sodium azide and dichloromethane
// (from memory); A. B. Hassner et al., J. Org. Chem. 1990, 55, 2304, and the
// incident report by R. E. Conrow and W. D. Dean, Org. Process Res. Dev.
// 2008, 12, 1285 ("Diazidomethane Explosion") (from memory).
func init() {
	register(Rule{
		Code:   "caution-azide-halomethane",
		Title:  "azide with dichloromethane, chloroform or another polyhalomethane",
		Source: "Bretherick's Handbook of Reactive Chemical Hazards (from memory); Conrow & Dean, Org. Process Res. Dev. 2008, 12, 1285 (from memory)",
		Check:  azideHalomethane,
	})
}

func azideHalomethane(s *Step) []Caution {
	var out []Caution
	azides := s.each(func(x Substance) bool { return hasAzide(x.Mol) || x.named("NaN3", "sodium azide", "TMSN3") })
	solvents := s.each(func(x Substance) bool {
		return dihalomethane(x.Mol) || x.named("DCM", "CH2Cl2", "dichloromethane", "methylene chloride", "chloroform", "CHCl3", "CH2Br2", "dibromomethane")
	})
	for _, az := range azides {
		for _, sv := range solvents {
			if az.Role == sv.Role && az.Index == sv.Index {
				continue
			}
			out = append(out, Caution{
				Code: "caution-azide-halomethane",
				Message: say("Caution: azide with "+sv.display()+" can form di- or triazidomethane, which are explosive and have detonated on concentration.",
					"Use a solvent without CH2X2/CHX3 groups (DMF, DMSO, water, acetonitrile) and never concentrate such a mixture."),
				Parties: []Party{sv.party(), az.party()},
			})
		}
	}
	return out
}
