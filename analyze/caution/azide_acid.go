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
		Check:  azideAcid,
	})
}

func azideAcid(s *Step) []Caution {
	return withAcid(s, "caution-azide-acid",
		func(x Substance) bool { return hasAzide(x.Mol) || x.named("NaN3", "sodium azide", "TMSN3") },
		"azide with %s releases hydrazoic acid (HN3), which is volatile, highly toxic and explosive.",
		"Keep azide away from acid, including in work-up and waste.")
}
