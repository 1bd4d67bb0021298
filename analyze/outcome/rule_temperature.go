package outcome

// temperatureRule: every rate rises with temperature (roughly doubling
// per 10 °C), and elimination, with its higher activation energy and
// entropy, gains on substitution as the temperature rises.
// Dhar, M. L.; Hughes, E. D.; Ingold, C. K. et al. J. Chem. Soc. 1948,
// 2093; van 't Hoff's rule (common practice).
var temperatureRule = Rule{
	Name:   "temperature",
	Effect: "heat speeds everything and favours elimination",
	Source: "Dhar, Hughes, Ingold et al. J. Chem. Soc. 1948, 2093; van 't Hoff rule (common practice)",
	Apply: func(c *scoring) {
		dt := c.md.TempC - 25
		if dt == 0 {
			return
		}
		for _, p := range Pathways {
			c.add(p, w("temperature-rate")*dt)
		}
		c.add(E2, w("temperature-elimination")*dt)
		c.add(E1, w("temperature-elimination")*dt)
		b := append(c.text, "at "...)
		b = appendFloat(b, c.md.TempC, 0)
		b = append(b, " °C: rates "...)
		b = appendSigned(b, w("temperature-rate")*dt, 1)
		b = append(b, ", elimination a further "...)
		c.said(appendSigned(b, w("temperature-elimination")*dt, 2))
	},
}
