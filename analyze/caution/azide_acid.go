package caution

// Azide with acid.
//
// Acid protonates azide to hydrazoic acid, HN3: volatile (bp 37 °C), highly
// toxic and explosive. Sources: Bretherick's Handbook of Reactive Chemical
// Hazards, entry for hydrogen azide (from memory); the safety data sheet of
// sodium azide (common practice: "contact with acids liberates very toxic
// gas").
func init() {
	register(Rule{
		Code:   "caution-azide-acid",
		Title:  "azide with acid (hydrazoic acid, HN3)",
		Source: "Bretherick's Handbook of Reactive Chemical Hazards (from memory); sodium azide safety data sheet (common practice)",
		check:  azideAcid,
	})
}

func azideAcid(f finder) []Caution {
	return withAcid(f, "caution-azide-acid",
		func(i int) bool { return hasAzide(f.Substances[i].Mol) || f.named(i, azideNames) },
		"azide with %s releases hydrazoic acid (HN3), which is volatile, highly toxic and explosive.",
		"Keep azide away from acid, including in work-up and waste.")
}

// azideNames are the azides named by the chemist.
var azideNames = nameSetOf("NaN3", "sodium azide", "TMSN3")
