package outcome

import (
	"fmt"
	"strings"

	"walden/analyze/perceive"
	"walden/analyze/reagents"
)

// baseEliminates reports a base that turns the step into an elimination:
// strong and bulky bases favour E2 over SN2 (Brown, Moritani, Okamoto J.
// Am. Chem. Soc. 1956, 78, 2193; Dhar, Hughes, Ingold et al. J. Chem. Soc.
// 1948, 2093). A weak base on a tertiary carbon is left to the
// tertiary-no-sn2 finding, which already says the nucleophile acts as a
// base there: two warnings on one token would say the same thing. The
// fix never offers the reagent already in the step.
func baseEliminates(o *Outcome, st Step, c *scoring, frac map[Mechanism]float64) {
	b := c.base
	if b == nil || frac[E2] <= 0.3 {
		return
	}
	if c.nu != nil && c.nu.Kind != b.Kind && b.PKaH <= 12 {
		return
	}
	weak := b.PKaH <= 12
	if weak && c.site.Degree == perceive.Tertiary {
		return
	}
	bulky := ""
	if b.Bulk >= reagents.Hindered {
		bulky = "bulky "
	}
	name := b.Kind.Words()
	if b.Reactant >= 0 && b.Reactant < len(st.Reagents) {
		if e := st.Reagents[b.Reactant].Entry; e != nil && len(e.Names) > 0 && !strings.EqualFold(e.Names[0], name) {
			name = e.Names[0] + ", " + article(name) + " " + name
		}
	}
	var swap []string
	for _, n := range []string{"NaN3", "NaCN", "KOAc", "NaSPh"} {
		if e, ok := reagents.Lookup(n); ok && e.Reagent != nil && perceive.NucKind(kindOf(e.Reagent)) == b.Kind {
			continue
		}
		swap = append(swap, n)
	}
	f := Finding{Code: CodeBaseEliminates, Severity: Warning, Parties: Parties{Atoms: []int{c.site.Carbon}, Reactant: b.Reactant, Solvent: -1},
		Message: fmt.Sprintf("the %sbase (%s, pKaH %.1f) removes a β-hydrogen faster than it substitutes: about %.0f%% alkene predicted", bulky, name, b.PKaH, 100*frac[E2]),
		Fixes:   []Fix{{Kind: ReplaceReagent, Title: "use a weakly basic nucleophile", Names: swap}, {Kind: ChangeTemp, Title: "run it cold", Names: []string{"0 °C"}}}}
	if c.site.Degree == perceive.Tertiary {
		// No nucleophile and no temperature gives SN2 at a tertiary
		// carbon (Solomons & Fryhle Table 6.4): offering them would
		// mislead; the alkene is the product of this step.
		f.Message += "; a tertiary carbon gives no SN2 product with any nucleophile"
		f.Fixes = nil
	}
	o.Findings = append(o.Findings, f)
}

// kindOf names the nucleophile kind of a dictionary entry's species, as
// far as the fix list needs it.
func kindOf(r *reagents.Reagent) string {
	switch r.Species {
	case "[N-]=[N+]=[N-]":
		return "azide"
	case "[C-]#N":
		return "cyanide"
	case "CC(=O)[O-]":
		return "carboxylate"
	case "[S-]c1ccccc1":
		return "thiophenoxide"
	}
	return ""
}

// article is "an" before a vowel sound, else "a" (good enough for the
// kind words: "an alkoxide", "a tertiary alkoxide").
func article(w string) string {
	if w != "" && strings.ContainsRune("aeiou", rune(w[0])) {
		return "an"
	}
	return "a"
}
