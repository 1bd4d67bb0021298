package outcome

// substrateSN1Rule: ionisation needs a stabilised carbocation: tertiary,
// benzylic, allylic and α-alkoxy carbons ionise, primary and methyl do
// not, α-carbonyl cations are destabilised. A 1,2-shift to a more stable
// cation lets a poorer carbon ionise with rearrangement.
// Streitwieser, A. Chem. Rev. 1956, 56, 571 (solvolysis series);
// Bentley, T. W.; Schleyer, P. v. R. J. Am. Chem. Soc. 1976, 98, 7658;
// Whitmore, F. C. J. Am. Chem. Soc. 1932, 54, 3274 (1,2-shifts).
var substrateSN1Rule = Rule{
	Name:   "substrate-sn1",
	Effect: "carbocation stability sets the ionisation rate (SN1, E1)",
	Source: "Streitwieser 1956; Bentley & Schleyer J. Am. Chem. Soc. 1976, 98, 7658; Whitmore J. Am. Chem. Soc. 1932, 54, 3274",
	Apply: func(c *scoring) {
		v := c.cation.score
		c.add(SN1, v)
		c.add(E1, v)
		if c.cation.shift != "" {
			b := append(c.text, "the cation would rearrange by a 1,2-"...)
			b = append(b, c.cation.shift...)
			b = append(b, " shift to a more stable "...)
			b = append(b, c.cation.kind...)
			b = append(b, " cation (ionisation term "...)
			b = appendSigned(b, v, 1)
			c.said(append(b, ')'))
			return
		}
		b := append(c.text, c.cation.kind...)
		b = append(b, " cation: ionisation term "...)
		b = appendSigned(b, v, 1)
		c.said(append(b, " (log10; tert-butyl = 6)"...))
	},
}
