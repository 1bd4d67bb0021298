package outcome

// solventAnionRule: protic solvents hydrogen-bond anions and slow their
// SN2 (and E2) reactions; dipolar aprotic solvents leave them bare and
// fast, by up to 10^6.
// Parker, A. J. Q. Rev. Chem. Soc. 1962, 16, 163; Parker, A. J. Chem. Rev.
// 1969, 69, 1.
var solventAnionRule = Rule{
	Name:   "solvent-anion",
	Effect: "protic solvents slow anionic nucleophiles; dipolar aprotic ones speed them (Parker)",
	Source: "Parker, A. J. Q. Rev. Chem. Soc. 1962, 16, 163; Parker, A. J. Chem. Rev. 1969, 69, 1",
	Apply: func(c *scoring) {
		if c.nu != nil && c.nu.Charge < 0 {
			c.add(SN2, c.md.Anion)
			c.say("anionic nucleophile in %s: solvent term %+.1f (log10, methanol = 0)", c.md.Name, c.md.Anion)
		}
		if c.base != nil && c.base.Anionic {
			c.add(E2, c.md.Anion)
		}
	},
}
