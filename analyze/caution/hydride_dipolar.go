package caution

// Sodium hydride in DMSO, DMF or DMAc.
//
// Saline hydrides with DMSO, DMF or N,N-dimethylacetamide can decompose
// exothermically and run away, even at modest temperatures; several plant
// and laboratory explosions are on record. Sources: Q. Yang et al.,
// "Explosion Hazards of Sodium Hydride in Dimethyl Sulfoxide,
// N,N-Dimethylformamide, and N,N-Dimethylacetamide", Org. Process Res. Dev.
// 2019, 23, 2210 (from memory); Bretherick's Handbook of Reactive Chemical
// Hazards, entry for sodium hydride (from memory).
func init() {
	register(Rule{
		Code:   "caution-hydride-dipolar",
		Title:  "sodium (or potassium) hydride in DMSO, DMF or DMAc",
		Source: "Yang et al., Org. Process Res. Dev. 2019, 23, 2210 (from memory); Bretherick's Handbook (from memory)",
		check:  hydrideDipolar,
	})
}

func hydrideDipolar(f finder) []Caution {
	var out []Caution
	var hyBuf, svBuf [8]int
	hydrides := f.each(hyBuf[:0], func(i int) bool {
		x := &f.Substances[i]
		return x.Role != Solvent && (hasHydride(x.Mol) || f.named(i, hydrideNames))
	})
	solvents := f.each(svBuf[:0], func(i int) bool {
		return f.named(i, dipolarNames) || dipolarBySMILES(f.Substances[i])
	})
	for _, i := range hydrides {
		h := &f.Substances[i]
		for _, j := range solvents {
			sv := &f.Substances[j]
			out = append(out, Caution{
				Code: "caution-hydride-dipolar",
				Message: say("Caution: "+h.display()+" in "+sv.display()+" can decompose exothermically and run away; explosions have been reported, sometimes below 50 °C.",
					"Consider THF or another solvent, add the hydride in portions with cooling, and keep the scale small."),
				Parties: []Party{sv.party(), h.party()},
			})
		}
	}
	return out
}

// dipolarBySMILES recognises DMSO, DMF and DMAc from their graphs.
func dipolarBySMILES(x Substance) bool {
	m := x.Mol
	if m == nil {
		return false
	}
	heavy := 0
	for _, a := range m.Atoms {
		if a.Element.Symbol() != "H" {
			heavy++
		}
	}
	// DMSO: S(=O) with two methyls (4 heavy atoms).
	// DMF: O=C–N(C)C (5 heavy); DMAc: CC(=O)N(C)C (6 heavy).
	for i, a := range m.Atoms {
		switch {
		case a.Element.Symbol() == "S" && heavy == 4 && doubleO(m, i) && heavyNeighbours(m, i) == 3:
			return true
		case a.Element.Symbol() == "N" && (heavy == 5 || heavy == 6) && heavyNeighbours(m, i) == 3:
			for _, e := range m.Edges(i) {
				if doubleO(m, e.Atom) {
					return true
				}
			}
		}
	}
	return false
}

// hydrideNames are the saline hydrides named by the chemist.
var hydrideNames = nameSetOf("NaH", "KH", "sodium hydride", "potassium hydride")

// dipolarNames are the dipolar aprotic amide and sulfoxide solvents named
// by the chemist.
var dipolarNames = nameSetOf("DMSO", "DMF", "DMAc", "DMA", "dimethyl sulfoxide", "dimethylformamide", "N,N-dimethylformamide", "dimethylacetamide", "N,N-dimethylacetamide")
