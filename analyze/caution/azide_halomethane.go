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
		check:  azideHalomethane,
	})
}

func azideHalomethane(f finder) []Caution {
	var out []Caution
	var azBuf, svBuf [8]int
	azides := f.each(azBuf[:0], func(i int) bool {
		return hasAzideIon(f.Substances[i].Mol) || f.named(i, azideIonNames)
	})
	solvents := f.each(svBuf[:0], func(i int) bool {
		return polyhalomethane(f.Substances[i].Mol) || f.named(i, halomethaneNames)
	})
	for _, i := range azides {
		az := &f.Substances[i]
		for _, j := range solvents {
			sv := &f.Substances[j]
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

// azideIonNames are the ionic azides named by the chemist.
var azideIonNames = nameSetOf("NaN3", "sodium azide", "KN3", "potassium azide", "LiN3", "lithium azide", "TBAN3", "HN3")

// halomethaneNames are the polyhalomethanes named by the chemist.
var halomethaneNames = nameSetOf("DCM", "CH2Cl2", "dichloromethane", "methylene chloride", "chloroform", "CHCl3",
	"CH2Br2", "dibromomethane", "bromoform", "CHBr3", "CCl4", "carbon tetrachloride", "tetrachloromethane", "CBr4", "carbon tetrabromide")
