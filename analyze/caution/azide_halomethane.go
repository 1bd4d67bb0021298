package caution

// Azide with dichloromethane, chloroform or another polyhalomethane.
//
// Azide ion displaces halide from dichloromethane to give diazidomethane
// (and from chloroform, triazidomethane): highly explosive, and easily
// concentrated when the solvent is evaporated. Sources: Bretherick's
// Handbook of Reactive Chemical Hazards, entries for sodium azide and
// dichloromethane (from memory); A. Hassner et al., J. Org. Chem. 1990,
// 55, 2304, and the incident report by R. E. Conrow and W. D. Dean, Org.
// Process Res. Dev. 2008, 12, 1285 ("Diazidomethane Explosion") (from
// memory). Dibromomethane, bromoform, carbon tetrachloride and carbon
// tetrabromide carry the same C–X bonds and are flagged the same way, as
// a precaution by analogy (from memory; not a documented incident for each).
//
// Only the azide ion counts (sodium, potassium, ammonium azides, HN3):
// organic azides and TMSN3 are used in dichloromethane routinely (common
// practice) and do not displace its chloride.
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
	azides := s.each(func(x Substance) bool {
		return hasAzideIon(x.Mol) || x.named("NaN3", "sodium azide", "KN3", "potassium azide", "LiN3", "lithium azide", "TBAN3", "HN3")
	})
	solvents := s.each(func(x Substance) bool {
		return polyhalomethane(x.Mol) || x.named("DCM", "CH2Cl2", "dichloromethane", "methylene chloride", "chloroform", "CHCl3",
			"CH2Br2", "dibromomethane", "bromoform", "CHBr3", "CCl4", "carbon tetrachloride", "tetrachloromethane", "CBr4", "carbon tetrabromide")
	})
	for _, az := range azides {
		for _, sv := range solvents {
			if az.Role == sv.Role && az.Index == sv.Index {
				continue
			}
			out = append(out, Caution{
				Code: "caution-azide-halomethane",
				Message: say("Caution: azide with "+sv.display()+" can exchange halogen for azide and form di-, tri- or tetraazidomethane, which are explosive; diazidomethane from dichloromethane has detonated on concentration.",
					"Use a solvent without CH2X2, CHX3 or CX4 (DMF, DMSO, water, acetonitrile) and never concentrate such a mixture."),
				Parties: []Party{sv.party(), az.party()},
			})
		}
	}
	return out
}
