package outcome

// nucleophilicityRule: the SN2 rate follows the nucleophile's Pearson
// n(CH3I) (log10 of its rate with methyl iodide relative to methanol). A
// solvent acting as nucleophile gains from its concentration.
// Pearson, R. G.; Sobel, H.; Songstad, J. J. Am. Chem. Soc. 1968, 90, 319.
var nucleophilicityRule = Rule{
	Name:   "nucleophilicity",
	Effect: "nucleophile strength (Pearson n)",
	Source: "Pearson, Sobel, Songstad J. Am. Chem. Soc. 1968, 90, 319",
	Apply: func(c *scoring) {
		if c.nu == nil {
			c.block(SN2)
			c.say("no nucleophile present: SN2 cannot happen")
			return
		}
		n := c.nu.Data.N
		c.add(SN2, n)
		b := append(c.text, "nucleophile "...)
		b = append(b, c.nu.Kind.Words()...)
		b = append(b, ": n = "...)
		b = appendFloat(b, n, 2)
		c.said(append(b, " (Pearson n(CH3I), methanol = 0)"...))
		if c.nu.Kind == "water" || c.nu.Kind == "alcohol" {
			c.add(SN2, w("solvent-mass-action"))
			b := append(c.text, "the solvent is the nucleophile and is present in large excess ("...)
			b = appendSigned(b, w("solvent-mass-action"), 1)
			c.said(append(b, ')'))
		}
	},
}
