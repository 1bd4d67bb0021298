package caution

// Lachrymators.
//
// α-Halo ketones and esters (chloroacetone, bromoacetone, phenacyl
// bromide, ethyl bromoacetate) and acryloyl and chloroacetyl chlorides are
// strong lachrymators: small vapour exposures cause tearing and airway
// irritation. Benzylic and allylic halides are lachrymators too; the
// alkylating-agent caution says so for them. Sources: Prudent Practices in
// the Laboratory, NRC 2011 (from memory); Bretherick's Handbook of Reactive
// Chemical Hazards (from memory); common practice.
func init() {
	register(Rule{
		Code:   "caution-lachrymator",
		Title:  "lachrymator (α-halo ketones and esters, chloroacetone, phenacyl bromide)",
		Source: "Prudent Practices in the Laboratory, NRC 2011 (from memory); common practice",
		check:  lachrymator,
	})
}

func lachrymator(f finder) []Caution {
	var out []Caution
	for i, x := range f.Substances {
		if x.Role == Solvent || !isLachrymator(x, f.named(i, lachrymatorNames)) {
			continue
		}
		out = append(out, Caution{
			Code: "caution-lachrymator",
			Message: say("Caution: "+x.display()+" is a lachrymator (tear gas): small amounts of vapour irritate eyes and airways.",
				"Weigh and transfer it in a fume hood and decontaminate glassware before taking it out."),
			Parties: []Party{x.party()},
		})
	}
	return out
}

// isLachrymator reports a known lachrymator: by name (named says whether
// x goes by one of lachrymatorNames) or an α-halo carbonyl compound.
func isLachrymator(x Substance, named bool) bool {
	if named {
		return true
	}
	m := x.Mol
	found := false
	sp3CarbonsWithLeavingGroup(m, func(c int, lg string) {
		if lg == "halide" && alphaCarbonyl(m, c) {
			found = true
		}
	})
	return found
}

// lachrymatorNames are the lachrymators named by the chemist.
var lachrymatorNames = nameSetOf("chloroacetone", "bromoacetone", "phenacyl bromide", "ethyl bromoacetate", "methyl bromoacetate", "tert-butyl bromoacetate", "chloroacetyl chloride", "acryloyl chloride")
