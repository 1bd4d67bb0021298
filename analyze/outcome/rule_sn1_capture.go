package outcome

// sn1CaptureRule: a carbocation formed in a nucleophilic solvent is
// mostly captured (SN1) and partly loses a β-proton (E1); tert-butyl
// bromide in ethanol gives about 81:19. Without a nucleophile the cation
// can only lose a proton.
// Hughes & Ingold (as tabulated by Solomons & Fryhle, substitution vs
// elimination section).
var sn1CaptureRule = Rule{
	Name:   "sn1-capture",
	Effect: "a cation is mostly captured by the nucleophile (SN1) and partly loses a proton (E1)",
	Source: "Hughes & Ingold, tert-butyl bromide in ethanol (Solomons & Fryhle)",
	Apply: func(c *scoring) {
		if !c.possible(SN1) {
			return
		}
		if c.nu == nil {
			c.block(SN1)
			c.say("no nucleophile to capture a cation: ionisation can only lead to elimination")
			return
		}
		c.add(E1, w("sn1-e1-split"))
	},
}
