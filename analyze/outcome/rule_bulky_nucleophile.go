package outcome

import "walden/analyze/reagents"

// bulkyNucleophileRule: a hindered nucleophile substitutes slowly except
// at methyl, while as a base it still reaches a peripheral β-hydrogen.
// Brown, H. C.; Moritani, I.; Okamoto, Y. J. Am. Chem. Soc. 1956, 78, 2193.
var bulkyNucleophileRule = Rule{
	Name:   "bulky-reagent",
	Effect: "bulky reagents substitute slowly and eliminate",
	Source: "Brown, Moritani, Okamoto J. Am. Chem. Soc. 1956, 78, 2193",
	Apply: func(c *scoring) {
		if c.nu == nil || c.nu.Data.Bulk < reagents.Hindered || c.site.Degree == 0 {
			return
		}
		c.add(SN2, w("bulky-sn2"))
		b := append(c.text, "the nucleophile is bulky: substitution away from methyl is slowed ("...)
		b = appendSigned(b, w("bulky-sn2"), 1)
		c.said(append(b, ')'))
	},
}
