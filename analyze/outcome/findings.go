package outcome

import (
	"fmt"
	"math"

	"walden/analyze/perceive"
	"walden/analyze/reagents"
)

// findings adds the diagnostics that follow from the scores.
func findings(o *Outcome, st Step, c *scoring, rg perceive.Reagents) {
	s := c.site
	// The reacting carbon as the party of a finding, made when the first
	// finding needs it and shared by the rest: most steps have none.
	var siteAtoms []int
	site := func() Parties {
		if siteAtoms == nil {
			siteAtoms = []int{s.Carbon}
		}
		return Parties{Atoms: siteAtoms, Reactant: -1, Solvent: -1}
	}
	nuIdx := -1
	if c.nu != nil && !c.nu.FromSolvent {
		nuIdx = c.nu.Reactant
	}
	frac := map[Mechanism]float64{}
	for _, sc := range o.Scores {
		frac[sc.Pathway] = sc.Fraction
	}
	strongNu := c.nu != nil && c.nu.Data.N >= 5 && c.nu.Kind != "water" && c.nu.Kind != "alcohol"
	if s.Degree == perceive.Tertiary && strongNu && !s.Flags.Has(perceive.AlphaCarbonyl) {
		o.Findings = append(o.Findings, Finding{Code: CodeTertiarySN2, Severity: Warning, Parties: Parties{Atoms: []int{s.Carbon}, Reactant: nuIdx, Solvent: -1},
			Message: fmt.Sprintf("the carbon bearing the %s is tertiary: SN2 is blocked, so %s acts as a base or waits for ionisation", s.Leaving.Data.Name, c.nu.Kind.Words())})
	}
	if s.Flags.Has(perceive.Bridgehead) {
		o.Findings = append(o.Findings, Finding{Code: CodeBridgehead, Severity: Error, Parties: site(), Message: "the leaving group is on a bridgehead carbon: no backside attack and no planar cation"})
	}
	if s.Flags.Has(perceive.Neopentyl) || (s.Flags.Has(perceive.BetaBranched) && s.Degree == perceive.Primary) {
		what := "β-branched"
		if s.Flags.Has(perceive.Neopentyl) {
			what = "neopentyl-type"
		}
		o.Findings = append(o.Findings, Finding{Code: CodeHinderedBackside, Severity: Warning, Parties: site(),
			Message: fmt.Sprintf("%s carbon: SN2 here is slowed by the branching next door (neopentyl ~10^-5, isobutyl ~1/30 of ethyl)", what)})
	}
	baseEliminates(o, st, c, frac)
	// Large, polarisable or delocalised anions (iodide, thiocyanate,
	// thiolates, enolates) are the least hydrogen-bonded and gain least from a dipolar aprotic
	// solvent (Parker, Chem. Rev. 1969, 69, 1, from memory): quoting the
	// azide factor for them would overstate it, and thiolates or malonate
	// with NaOEt in ethanol are routine (common practice). A salt that dissolves in no dipolar
	// aprotic solvent (NaOH, KOH) has no such alternative to offer.
	// A step predicted to eliminate is left alone: a dipolar aprotic
	// solvent frees the anion as a base as much as a nucleophile (Parker
	// 1969), so it would not turn an E2 into an SN2.
	if c.nu != nil && c.nu.Charge < 0 && c.md.Protic && o.Mechanism != SN1 && o.Mechanism != E2 && c.possible(SN2) && c.act.kind == actNone && !littleSolvated[c.nu.Kind] && dissolvesAprotic(st, c.nu) {
		best := bestAprotic()
		factor := math.Pow(10, best.Anion-c.md.Anion)
		idx := proticIndex(st)
		o.Findings = append(o.Findings, Finding{Code: CodeProticSlows, Severity: Warning, Parties: Parties{Atoms: []int{s.Carbon}, Reactant: nuIdx, Solvent: idx},
			Message: fmt.Sprintf("%s hydrogen-bonds the anionic %s and slows SN2: about %s times faster in %s (Parker 1969; azide + 1-bromobutane series)", c.md.Name, c.nu.Kind.Words(), roundFactor(factor), best.Names[0]),
			Fixes:   []Fix{{Kind: ReplaceSolvent, Title: "use a dipolar aprotic solvent", Names: []string{"DMF", "DMSO", "acetonitrile", "acetone"}}}})
	}
	if c.nu != nil && c.nu.Data.N < 3 && o.Mechanism != SN1 && c.possible(SN2) {
		o.Findings = append(o.Findings, Finding{Code: CodeWeakNucleophile, Severity: Info, Parties: Parties{Atoms: []int{s.Carbon}, Reactant: nuIdx, Solvent: -1},
			Message: fmt.Sprintf("%s is a weak nucleophile (Pearson n %.1f): substitution is slow", c.nu.Kind.Words(), c.nu.Data.N)})
	}
	if frac[SN1] > 0.2 && perceive.TetrahedralAt(st.Substrate, s.Carbon) >= 0 {
		o.Findings = append(o.Findings, Finding{Code: CodeRacemises, Severity: Warning, Parties: site(), Message: "ionisation gives a planar carbocation: the configuration at this carbon is lost (racemic product)"})
	}
	if c.cation.shift != "" && frac[SN1]+frac[E1] > 0.2 {
		o.Findings = append(o.Findings, Finding{Code: CodeRearranges, Severity: Warning, Parties: Parties{Atoms: []int{s.Carbon, c.cation.centre}, Reactant: -1, Solvent: -1},
			Message: fmt.Sprintf("the carbocation rearranges by a 1,2-%s shift to a more stable %s cation: the product is rearranged", c.cation.shift, c.cation.kind),
			Fixes:   []Fix{{Kind: InsertStep, Title: "avoid the cation: make the sulfonate and displace it by SN2", Names: []string{"MsCl", "Et3N"}, Config: "retains"}}})
	}
	if c.nu != nil && c.nu.OverAlkylate && o.Mechanism == SN2 && overAlkylates(c) {
		o.Findings = append(o.Findings, Finding{Code: CodeOverAlkylation, Severity: Warning, Parties: Parties{Reactant: nuIdx, Solvent: -1},
			Message: overAlkylationMessage(c)})
	}
	if c.nu != nil && len(c.nu.Alternatives) > 0 && c.nuMol != nil {
		if n := distinctSites(c); n > 0 {
			o.Findings = append(o.Findings, Finding{Code: CodeNucleophileSites, Severity: Warning, Parties: Parties{Reactant: nuIdx, Solvent: -1},
				Message: fmt.Sprintf("the nucleophile has %d other site(s) of similar reactivity: a mixture may form", n)})
		}
	}
	if c.nu != nil && c.nu.Ambident != "" {
		o.Findings = append(o.Findings, Finding{Code: CodeAmbident, Severity: Info, Parties: Parties{Reactant: nuIdx, Solvent: -1}, Message: c.nu.Ambident})
	}
	insoluble(o, st, c, rg)
	if o.Mechanism == None {
		o.Findings = append(o.Findings, Finding{Code: CodeNoReaction, Severity: Warning, Parties: site(), Message: "no pathway is fast enough under these conditions: no reaction expected"})
	} else if best := bestScore(o); best < w("reaction-threshold")+1.5 {
		o.Findings = append(o.Findings, Finding{Code: CodeSlow, Severity: Info, Parties: site(), Message: "the predicted pathway is slow under these conditions"})
	}
}

func bestScore(o *Outcome) float64 {
	b := math.Inf(-1)
	for _, s := range o.Scores {
		if s.Possible && s.Log10 > b {
			b = s.Log10
		}
	}
	return b
}

// bestAprotic returns the common dipolar aprotic solvent with the largest
// anion speed-up among DMF, DMSO and acetonitrile.
func bestAprotic() perceive.SolventEffect {
	var best perceive.SolventEffect
	for _, n := range []string{"DMF", "DMSO", "acetonitrile"} {
		if e, ok := perceive.LookupSolvent(n, ""); ok && e.Anion > best.Anion {
			best = e
		}
	}
	return best
}

func roundFactor(f float64) string {
	if f < 10 {
		return fmt.Sprintf("%.0f", f)
	}
	p := math.Pow(10, math.Floor(math.Log10(f)))
	return fmt.Sprintf("%.0f", math.Round(f/p)*p)
}

// distinctSites counts the alternative nucleophilic sites that are not
// symmetry-equivalent to the one that reacts (those give another product).
func distinctSites(c *scoring) int {
	sym := c.cache.symmetry(c.nuMol)
	n := 0
	for _, a := range c.nu.Alternatives {
		if a.Atom < len(sym) && sym[a.Atom] != sym[c.nu.Atom] {
			n++
		}
	}
	return n
}

// proticIndex returns the index in st.Solvents of the first protic
// solvent, or -1.
func proticIndex(st Step) int {
	for i, s := range st.Solvents {
		if s.Solvent == nil {
			continue
		}
		for _, n := range s.Solvent.Names {
			if e, ok := perceive.LookupSolvent(n, s.Solvent.SMILES); ok && e.Protic {
				return i
			}
		}
		if s.Solvent.Protic {
			return i
		}
	}
	return -1
}

// littleSolvated lists the anions whose SN2 rate a protic solvent slows
// least (Parker 1969, from memory).
var littleSolvated = map[perceive.NucKind]bool{"iodide": true, "thiocyanate": true, "thiophenoxide": true, "thiolate": true, "hydrosulfide": true, "enolate": true}

// dissolvesAprotic reports whether the nucleophile's reagent can be used
// in DMF at all, by the dictionary's solubility hints (true when unknown).
func dissolvesAprotic(st Step, nu *perceive.Nucleophile) bool {
	if nu.Reactant < 0 || nu.Reactant >= len(st.Reagents) || st.Reagents[nu.Reactant].Entry == nil {
		return true
	}
	e, ok := reagents.Lookup("DMF")
	if !ok || e.Solvent == nil {
		return true
	}
	return st.Reagents[nu.Reactant].Entry.DissolvesIn(e.Solvent) != reagents.DissolvesPoorly
}

// overAlkylates says whether the amine's product will compete: primary
// amines and ammonia give secondary amines that are at least as
// nucleophilic (common practice; March's Advanced Organic Chemistry,
// amine alkylation, from memory). A secondary amine gives a tertiary
// amine that is quaternised only by reactive electrophiles (methyl,
// allylic, benzylic); with other carbons the tertiary amine is the usual
// clean product (common practice).
func overAlkylates(c *scoring) bool {
	if c.nu.Kind != "amine-secondary" {
		return true
	}
	s := c.site
	return s.Degree == perceive.Methyl || s.Flags.Has(perceive.Allylic) || s.Flags.Has(perceive.Benzylic)
}

func overAlkylationMessage(c *scoring) string {
	if c.nu.Kind == "amine-secondary" {
		return "the tertiary amine formed reacts again with so reactive an electrophile: expect some quaternary ammonium salt unless the amine is in excess and the electrophile added slowly"
	}
	return "the amine product is as nucleophilic as the starting amine and can be alkylated again: expect over-alkylation unless the amine is in large excess"
}
