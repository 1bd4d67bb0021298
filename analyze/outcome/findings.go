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
	site := Parties{Atoms: []int{s.Carbon}, Reactant: -1, Solvent: -1}
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
			Message: fmt.Sprintf("the carbon bearing the %s is tertiary: SN2 is blocked, so %s acts as a base or waits for ionisation", s.Leaving.Data.Name, c.nu.Kind)})
	}
	if s.Flags.Has(perceive.Bridgehead) {
		o.Findings = append(o.Findings, Finding{Code: CodeBridgehead, Severity: Error, Parties: site, Message: "the leaving group is on a bridgehead carbon: no backside attack and no planar cation"})
	}
	if s.Flags.Has(perceive.Neopentyl) || (s.Flags.Has(perceive.BetaBranched) && s.Degree == perceive.Primary) {
		what := "β-branched"
		if s.Flags.Has(perceive.Neopentyl) {
			what = "neopentyl-type"
		}
		o.Findings = append(o.Findings, Finding{Code: CodeHinderedBackside, Severity: Warning, Parties: site,
			Message: fmt.Sprintf("%s carbon: SN2 here is slowed by the branching next door (neopentyl ~10^-5, isobutyl ~1/30 of ethyl)", what)})
	}
	if c.base != nil && frac[E2] > 0.3 && frac[SN2]+frac[E2] > 0 && (o.Mechanism == E2 || frac[E2] > 0.3) && (c.nu == nil || c.nu.Kind == c.base.Kind || c.base.PKaH > 12) {
		bulky := ""
		if c.base.Bulk >= reagents.Hindered {
			bulky = "bulky "
		}
		o.Findings = append(o.Findings, Finding{Code: CodeBaseEliminates, Severity: Warning, Parties: Parties{Atoms: []int{s.Carbon}, Reactant: c.base.Reactant, Solvent: -1},
			Message: fmt.Sprintf("the %sbase %s (pKaH %.1f) eliminates here: about %.0f%% alkene predicted", bulky, c.base.Kind, c.base.PKaH, 100*frac[E2]),
			Fixes:   []Fix{{Kind: ReplaceReagent, Title: "use a weakly basic nucleophile", Names: []string{"NaN3", "NaCN", "KOAc", "NaSPh"}}, {Kind: ChangeTemp, Title: "run it cold", Names: []string{"0 °C"}}}})
	}
	if c.nu != nil && c.nu.Charge < 0 && c.md.Protic && o.Mechanism != SN1 && c.possible(SN2) && c.act.kind == actNone {
		best := bestAprotic()
		factor := math.Pow(10, best.Anion-c.md.Anion)
		idx := proticIndex(st)
		o.Findings = append(o.Findings, Finding{Code: CodeProticSlows, Severity: Warning, Parties: Parties{Atoms: []int{s.Carbon}, Reactant: nuIdx, Solvent: idx},
			Message: fmt.Sprintf("%s hydrogen-bonds the anionic %s and slows SN2: about %s times faster in %s (Parker 1969; azide + 1-bromobutane series)", c.md.Name, c.nu.Kind, roundFactor(factor), best.Names[0]),
			Fixes:   []Fix{{Kind: ReplaceSolvent, Title: "use a dipolar aprotic solvent", Names: []string{"DMF", "DMSO", "acetonitrile", "acetone"}}}})
	}
	if c.nu != nil && c.nu.Data.N < 3 && o.Mechanism != SN1 && c.possible(SN2) {
		o.Findings = append(o.Findings, Finding{Code: CodeWeakNucleophile, Severity: Info, Parties: Parties{Atoms: []int{s.Carbon}, Reactant: nuIdx, Solvent: -1},
			Message: fmt.Sprintf("%s is a weak nucleophile (Pearson n %.1f): substitution is slow", c.nu.Kind, c.nu.Data.N)})
	}
	if frac[SN1] > 0.2 && perceive.TetrahedralAt(st.Substrate, s.Carbon) >= 0 {
		o.Findings = append(o.Findings, Finding{Code: CodeRacemises, Severity: Warning, Parties: site, Message: "ionisation gives a planar carbocation: the configuration at this carbon is lost (racemic product)"})
	}
	if c.cation.shift != "" && frac[SN1]+frac[E1] > 0.2 {
		o.Findings = append(o.Findings, Finding{Code: CodeRearranges, Severity: Warning, Parties: Parties{Atoms: []int{s.Carbon, c.cation.centre}, Reactant: -1, Solvent: -1},
			Message: fmt.Sprintf("the carbocation rearranges by a 1,2-%s shift to a more stable %s cation: the product is rearranged", c.cation.shift, c.cation.kind),
			Fixes:   []Fix{{Kind: InsertStep, Title: "avoid the cation: make the sulfonate and displace it by SN2", Names: []string{"MsCl", "Et3N"}, Config: "retains"}}})
	}
	if c.nu != nil && c.nu.OverAlkylate && o.Mechanism == SN2 {
		o.Findings = append(o.Findings, Finding{Code: CodeOverAlkylation, Severity: Warning, Parties: Parties{Reactant: nuIdx, Solvent: -1},
			Message: "the amine product is as nucleophilic as the starting amine and can be alkylated again: expect over-alkylation unless the amine is in large excess"})
	}
	if c.nu != nil && len(c.nu.Alternatives) > 0 && c.nuMol != nil && distinctSites(c) > 0 {
		o.Findings = append(o.Findings, Finding{Code: CodeNucleophileSites, Severity: Warning, Parties: Parties{Reactant: nuIdx, Solvent: -1},
			Message: fmt.Sprintf("the nucleophile has %d other site(s) of similar reactivity: a mixture may form", distinctSites(c))})
	}
	if c.nu != nil && c.nu.Ambident != "" {
		o.Findings = append(o.Findings, Finding{Code: CodeAmbident, Severity: Info, Parties: Parties{Reactant: nuIdx, Solvent: -1}, Message: c.nu.Ambident})
	}
	if len(rg.Ionic) > 0 && !rg.Crown && c.md.Class == "nonpolar" {
		solvent := -1
		if len(st.Solvents) > 0 {
			solvent = 0
		}
		o.Findings = append(o.Findings, Finding{Code: CodeInsoluble, Severity: Warning, Parties: Parties{Reactant: rg.Ionic[0], Solvent: solvent},
			Message: fmt.Sprintf("the salt will hardly dissolve in %s", c.md.Name),
			Fixes:   []Fix{{Kind: ReplaceSolvent, Title: "use a polar aprotic solvent", Names: []string{"DMF", "DMSO", "acetonitrile"}}, {Kind: ReplaceReagent, Title: "add a phase-transfer catalyst or crown ether", Names: []string{"18-crown-6", "TBAB"}}}})
	}
	if o.Mechanism == None {
		o.Findings = append(o.Findings, Finding{Code: CodeNoReaction, Severity: Warning, Parties: site, Message: "no pathway is fast enough under these conditions: no reaction expected"})
	} else if best := bestScore(o); best < w("reaction-threshold")+1.5 {
		o.Findings = append(o.Findings, Finding{Code: CodeSlow, Severity: Info, Parties: site, Message: "the predicted pathway is slow under these conditions"})
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
	sym := perceive.SymmetryClasses(c.nuMol)
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
