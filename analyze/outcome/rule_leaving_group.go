package outcome

// leavingGroupRule: better leaving groups (weaker conjugate bases) speed
// every pathway; ionisation is far more sensitive to them than SN2.
// Noyce, D. S.; Virgilio, J. A. J. Org. Chem. 1972, 37, 2643 (solvolysis);
// Solomons & Fryhle, Organic Chemistry, leaving-group table (SN2).
var leavingGroupRule = Rule{
	Name:   "leaving-group",
	Effect: "leaving-group ability (I > Br > Cl >> F; sulfonates ≈ I)",
	Source: "Noyce & Virgilio J. Org. Chem. 1972, 37, 2643; Solomons & Fryhle leaving-group table",
	Apply: func(c *scoring) {
		d := c.site.Leaving.Data
		c.add(SN2, d.SN2)
		c.add(E2, d.SN2)
		c.add(SN1, d.Solvolysis)
		c.add(E1, d.Solvolysis)
		b := append(c.text, "leaving group "...)
		b = append(b, d.Kind...)
		b = append(b, " ("...)
		b = append(b, d.Name...)
		b = append(b, "): "...)
		b = appendSigned(b, d.SN2, 1)
		b = append(b, " for SN2/E2 and "...)
		b = appendSigned(b, d.Solvolysis, 1)
		c.said(append(b, " for ionisation (log10, chloride = 0)"...))
	},
}
