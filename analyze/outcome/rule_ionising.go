package outcome

// ionisingPowerRule: ionisation creates charge, so polar protic solvents
// speed it enormously (Hughes–Ingold); the Grunwald–Winstein Y value
// measures it (log10 rate of tert-butyl chloride relative to 80% ethanol).
// Hughes, E. D.; Ingold, C. K. J. Chem. Soc. 1935, 244; Grunwald, E.;
// Winstein, S. J. Am. Chem. Soc. 1948, 70, 846.
var ionisingPowerRule = Rule{
	Name:   "ionising-power",
	Effect: "polar protic solvents speed ionisation (Hughes–Ingold; Grunwald–Winstein Y)",
	Source: "Hughes & Ingold J. Chem. Soc. 1935, 244; Grunwald & Winstein J. Am. Chem. Soc. 1948, 70, 846",
	Apply: func(c *scoring) {
		c.add(SN1, c.md.Y)
		c.add(E1, c.md.Y)
		b := append(c.text, "ionising power of "...)
		b = append(b, c.md.Name...)
		b = append(b, ": Y = "...)
		c.said(appendSigned(b, c.md.Y, 1))
	},
}
