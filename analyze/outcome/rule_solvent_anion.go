package outcome

import "walden/analyze/perceive"

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
			b := append(c.text, "anionic nucleophile in "...)
			b = append(b, c.md.Name...)
			b = append(b, ": solvent term "...)
			b = appendSigned(b, c.md.Anion, 1)
			c.said(append(b, " (log10, methanol = 0)"...))
		}
		// Carbonates and phosphates stay largely undissolved in aprotic
		// solvents and act at the solid surface: no naked-anion gain
		// (common practice).
		if c.base != nil && c.base.Anionic && !heterogeneous[c.base.Kind] {
			c.add(E2, c.md.Anion)
		}
	},
}

// heterogeneous lists the inorganic bases used as suspensions.
var heterogeneous = map[perceive.NucKind]bool{"carbonate": true, "bicarbonate": true, "phosphate": true, "hydride": true}
