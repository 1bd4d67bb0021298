package outcome

import "walden/analyze/perceive"

// substrateSN2Rule: the SN2 rate falls steeply with substitution at and
// next to the reacting carbon (methyl > primary > secondary >> neopentyl,
// tertiary) and rises at allylic, benzylic and α-carbonyl carbons.
// Streitwieser, A. Chem. Rev. 1956, 56, 571 (averaged SN2 rates);
// Conant, J. B.; Kirner, W. R. J. Am. Chem. Soc. 1924, 46, 232.
var substrateSN2Rule = Rule{
	Name:   "substrate-sn2",
	Effect: "substitution at and next to the carbon sets the SN2 rate",
	Source: "Streitwieser, A. Chem. Rev. 1956, 56, 571; Conant & Kirner J. Am. Chem. Soc. 1924, 46, 232",
	Apply: func(c *scoring) {
		s := c.site
		sum, _ := perceive.ClassRate(*s)
		v := sum.SN2
		if s.Flags.Has(perceive.InRing) && s.RingSize == 6 && s.Degree == perceive.Secondary {
			v += w("cyclohexyl-sn2")
		}
		switch {
		case (s.Degree == perceive.Tertiary && !s.Flags.Has(perceive.AlphaCarbonyl)) || s.Flags.Has(perceive.Bridgehead):
			c.block(SN2)
			b := append(c.text, s.Degree.String()...)
			c.said(append(b, " carbon: the back side is shielded, so SN2 does not happen"...))
			return
		case s.Flags.Has(perceive.Neopentyl):
			c.say("neopentyl-type carbon: the quaternary neighbour blocks the back side (SN2 about 10^5 times slower than at ethyl)")
		case s.Flags.Has(perceive.BetaBranched):
			c.say("branching on the neighbouring carbon slows SN2 (isobutyl about 1/30 of ethyl)")
		}
		c.add(SN2, v)
		b := append(c.text, s.Degree.String()...)
		b = append(b, " carbon"...)
		b = appendFlagWords(b, s.Flags)
		b = append(b, ": SN2 class term "...)
		b = appendSigned(b, v, 1)
		c.said(append(b, " (log10, ethyl = 0)"...))
	},
}

// flagNames are the activating features of a site a reason names, in
// the order it names them.
var flagNames = [...]struct {
	f perceive.Flag
	w string
}{{perceive.Benzylic, "benzylic"}, {perceive.Allylic, "allylic"}, {perceive.Propargylic, "propargylic"}, {perceive.AlphaCarbonyl, "next to C=O"}, {perceive.AlphaHetero, "next to a heteroatom"}, {perceive.InRing, "in a ring"}}

// appendFlagWords describes the activating features of a site
// (", benzylic, in a ring").
func appendFlagWords(b []byte, f perceive.Flag) []byte {
	for _, x := range flagNames {
		if f.Has(x.f) {
			b = append(b, ", "...)
			b = append(b, x.w...)
		}
	}
	return b
}
