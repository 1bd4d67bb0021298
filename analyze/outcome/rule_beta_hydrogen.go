package outcome

// betaHydrogenRule: elimination needs a hydrogen on a neighbouring sp3
// carbon, and E2 needs it anti-periplanar to the leaving group; on a
// cyclohexane only a hydrogen trans to the leaving group (trans-diaxial)
// qualifies. Hughes, E. D.; Ingold, C. K. et al. J. Chem. Soc. (menthyl
// and neomenthyl chlorides, late 1940s); Barton, D. H. R. Experientia
// 1950, 6, 316 (conformational analysis).
var betaHydrogenRule = Rule{
	Name:   "beta-hydrogen",
	Effect: "elimination needs a β-hydrogen; E2 needs it anti-periplanar (trans-diaxial on rings)",
	Source: "Hughes, Ingold et al. J. Chem. Soc. late 1940s (menthyl chlorides); Barton Experientia 1950, 6, 316",
	Apply: func(c *scoring) {
		any, anti := false, false
		for _, b := range c.site.Beta {
			if b.H > 0 {
				any = true
				if b.AntiH != 0 {
					anti = true
				}
			}
		}
		if !any {
			c.block(E2)
			c.block(E1)
			c.say("no hydrogen on a neighbouring carbon: no elimination")
			return
		}
		if !anti {
			c.block(E2)
			c.say("no β-hydrogen can be anti-periplanar to the leaving group: no E2")
		}
	},
}
