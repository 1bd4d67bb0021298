package outcome

import "math"

// baseStrengthRule: E2 speeds up with the strength of the base (pKa of
// its conjugate acid, Brønsted β ~0.4) and with the number of β-hydrogens
// and the substitution of the alkene that forms (Zaitsev).
// Soft, charge-delocalised bases (enolates, thiolates, cyanide) remove
// protons far more slowly than their pKaH suggests.
// Bunnett, J. F. Angew. Chem. Int. Ed. 1962, 1, 225; Dhar, M. L.; Hughes,
// E. D.; Ingold, C. K. et al. J. Chem. Soc. 1948, 2093; Bernasconi, C. F.
// Acc. Chem. Res. 1992, 25, 9 (intrinsic barriers of delocalised anions).
var baseStrengthRule = Rule{
	Name:   "base-strength",
	Effect: "stronger bases and more substituted alkenes speed E2",
	Source: "Bunnett Angew. Chem. Int. Ed. 1962, 1, 225; Dhar, Hughes, Ingold et al. J. Chem. Soc. 1948, 2093",
	Apply: func(c *scoring) {
		if c.base == nil {
			c.block(E2)
			c.say("no base present: E2 cannot happen")
			return
		}
		best, nH := -1.0, 0
		conj, acid := false, false
		for _, b := range c.site.Beta {
			if b.H == 0 || b.AntiH == 0 {
				continue
			}
			h := b.H
			if b.AntiH > 0 {
				h = b.AntiH
			}
			nH += h
			if float64(b.Substituents) > best {
				best = float64(b.Substituents)
			}
			conj = conj || b.Conjugated
			acid = acid || b.Acidified
		}
		if nH == 0 {
			return
		}
		v := w("e2-base-slope")*c.base.PKaH + w("e2-offset") + w("zaitsev-per-carbon")*best + math.Log10(float64(nH))
		if conj {
			v += w("conjugation")
		}
		if acid {
			v += w("beta-acidifying")
		}
		if c.base.Data.Soft {
			v += w("soft-base")
		}
		c.add(E2, v)
		b := append(c.text, "base "...)
		b = append(b, c.base.Kind.Words()...)
		b = append(b, " (pKaH "...)
		b = appendFloat(b, c.base.PKaH, 1)
		b = append(b, ") with "...)
		b = appendInt(b, nH)
		b = append(b, " removable β-hydrogen(s), best alkene "...)
		b = appendInt(b, int(best))
		b = append(b, "-substituted"...)
		if conj {
			b = append(b, ", conjugated"...)
		}
		b = append(b, ": E2 term "...)
		c.said(appendSigned(b, v, 1))
	},
}
