package outcome

import (
	"cmp"
	"fmt"
	"math"
	"slices"

	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/smiles"
)

// Predict scores the pathways of step st, predicts its products with
// their configuration and reports findings. It does no IO and never
// panics on odd input: what it cannot decide it says in NotAnalysed.
func Predict(st Step) (o Outcome) {
	o = Outcome{Mechanism: None, Site: -1}
	defer func() {
		if r := recover(); r != nil {
			o = Outcome{Mechanism: None, Site: -1, NotAnalysed: fmt.Sprintf("internal error while analysing this step (%v)", r)}
		}
		if o.NotAnalysed != "" {
			o.Findings = append(o.Findings, Finding{Code: CodeNotAnalysed, Severity: Info, Message: "not analysed: " + o.NotAnalysed, Parties: Parties{Reactant: -1, Solvent: -1}})
		}
	}()
	if st.Substrate == nil || len(st.Substrate.Atoms) == 0 {
		o.NotAnalysed = "no substrate"
		return o
	}
	// The scoring state, the ionised reagents, the usable sites and the
	// reason texts live in pooled scratch: a page predicts thousands of
	// steps and each fresh allocation costs more than the rules themselves.
	// Nothing the Outcome keeps points into it.
	c := getScoring()
	defer putScoring(c)
	sub := st.Cache.Substrate(st.Substrate)
	md := st.Cache.solvents(st.Solvents).AtTemp(st.TempC, st.Reflux)
	if md.Defaulted {
		o.Findings = append(o.Findings, Finding{Code: CodeNoSolvent, Severity: Info, Message: "no solvent given: the prediction assumes " + perceive.DefaultSolvent, Parties: Parties{Reactant: -1, Solvent: -1}})
	}
	ionised := c.ionised[:0]
	for _, r := range st.Reagents {
		if r.Mol != nil {
			r.Mol = st.Cache.ionise(r.Mol)
		}
		ionised = append(ionised, r)
	}
	c.ionised = ionised
	st.Reagents = ionised
	act := detectActivation(st.Reagents, md.Parts)
	rg := st.Cache.perceiveReagents(st.Reagents)

	// An acid that is only a salt former (an amine hydrochloride) does
	// not activate anything when the substrate has a real leaving group.
	if (act.kind == actHX || act.kind == actDehydrate) && !hasHydroxyl(sub) {
		act = activation{}
	}
	if act.kind == actSulfonylate {
		return sulfonylate(o, st, sub, act)
	}
	c.sites = usableSites(c.sites[:0], sub, act)
	sites := c.sites
	if len(sites) == 0 {
		return noSite(o, sub, rg)
	}
	c.siteVal = sites[0]
	site := &c.siteVal
	o.Site = site.Carbon
	if len(site.Leaving.Atoms) > 0 {
		o.Leaving = site.Leaving.Atoms
	} else {
		o.Leaving = []int{site.Leaving.Attach}
	}
	if len(sites) > 1 && site.Leaving.Kind == perceive.Epoxide && sites[1].Leaving.Attach == site.Leaving.Attach {
		o.Reasons = append(o.Reasons, Reason{Rule: "epoxide-opening", Text: "a nucleophile opens an epoxide from the back side at the less substituted carbon (basic or neutral conditions)", Source: "Parker, R. E.; Isaacs, N. S. Chem. Rev. 1959, 59, 737"})
	} else if len(sites) > 1 && sites[1].Carbon != site.Carbon && sub.Sym[sites[1].Carbon] != sub.Sym[site.Carbon] {
		o.Findings = append(o.Findings, Finding{Code: CodeCompetingSites, Severity: Warning,
			Message: fmt.Sprintf("two carbons bear leaving groups (%s and %s); the prediction takes the more reactive one (%s)", sites[0].Leaving.Kind, sites[1].Leaving.Kind, site.Leaving.Kind),
			Parties: Parties{Atoms: []int{site.Carbon, sites[1].Carbon}, Reactant: -1, Solvent: -1}})
	}
	if act.kind == actDehydrate {
		return dehydrate(o, sub, site, md)
	}

	c.sub, c.site, c.md, c.act, c.can, c.cache = sub, site, md, act, [4]bool{true, true, true, true}, st.Cache
	switch {
	case act.nu != nil:
		c.nu, c.nuMol = act.nu, act.nuMol
	case rg.Nucleophile != nil:
		c.nu = rg.Nucleophile
		c.nuMol = st.Reagents[c.nu.Reactant].Mol
	default:
		c.nu, c.nuMol = solventNucleophile(md, st.Cache)
	}
	if act.kind == actNone {
		c.base = rg.Base
	}
	if site.Flags.Has(perceive.NoStereo) {
		o.Findings = append(o.Findings, Finding{Code: CodeUndefinedConfig, Severity: Info, Message: "the reacting carbon is a stereocentre without a written configuration: the product's configuration cannot be predicted", Parties: Parties{Atoms: []int{site.Carbon}, Reactant: -1, Solvent: -1}})
	}
	c.cation = findCation(sub, site)
	if act.kind == actAppel || act.kind == actMitsunobu {
		c.block(SN1)
		c.block(E1)
	}
	if dehalogenate(&o, st, sub, site, c) || bromonium(&o, st, site, c) || epoxideClosure(&o, st, site, c) {
		return o
	}
	for i := range Rules {
		c.rule = &Rules[i]
		Rules[i].Apply(c)
	}
	o.Reasons = c.takeReasons(o.Reasons)
	distribute(&o, c)
	findings(&o, st, c, rg)
	if o.Mechanism == None {
		return o
	}
	products(&o, st, c)
	stereo(&o, st.Substrate, c)
	return o
}

// usableSites appends to out the sites that can react under the step's
// reagents, best first, with activated hydroxyls turned into their
// activated leaving group.
func usableSites(out []perceive.Site, sub *perceive.Substrate, act activation) []perceive.Site {
	for _, s := range sub.Sites {
		if !s.Flags.Has(perceive.Sp3) {
			continue
		}
		if s.Leaving.Kind == perceive.Hydroxyl {
			var k perceive.LeavingKind
			switch act.kind {
			case actMitsunobu, actAppel:
				k = perceive.Phosphonium
			case actHX, actDehydrate:
				k = perceive.Oxonium
			default:
				continue
			}
			s.Leaving.Kind = k
			s.Leaving.Data, _ = perceive.Leaving(k)
			s.Rank += 30 // the activating reagent says this is the site meant
		} else if s.Leaving.Data.Poor {
			continue
		}
		out = append(out, s)
	}
	// Onium salts: Hofmann elimination at a carbon with β-hydrogens wins
	// over demethylation (common practice).
	hasBeta := false
	for _, s := range out {
		if (s.Leaving.Kind == perceive.Ammonium || s.Leaving.Kind == perceive.Sulfonium) && s.BetaH() > 0 {
			hasBeta = true
		}
	}
	if hasBeta {
		kept := out[:0]
		for _, s := range out {
			if (s.Leaving.Kind == perceive.Ammonium || s.Leaving.Kind == perceive.Sulfonium) && s.Degree == perceive.Methyl {
				continue
			}
			kept = append(kept, s)
		}
		out = kept
	}
	// Best first, stably.
	slices.SortStableFunc(out, func(a, b perceive.Site) int { return cmp.Compare(b.Rank, a.Rank) })
	return out
}

// noSite explains why nothing can react.
func noSite(o Outcome, sub *perceive.Substrate, rg perceive.Reagents) Outcome {
	if why := deprotonationOnly(sub, rg); why != "" {
		o.NotAnalysed = why
		return o
	}
	if why := acylOnly(sub, rg); why != "" {
		o.NotAnalysed = why
		return o
	}
	for _, s := range sub.Sites {
		switch {
		case s.Flags.Has(perceive.Aryl) || s.Flags.Has(perceive.Vinylic):
			where := "an aromatic"
			if s.Flags.Has(perceive.Vinylic) {
				where = "a vinylic"
			}
			o.Findings = append(o.Findings, Finding{Code: CodeSp2Leaving, Severity: Error, Message: fmt.Sprintf("the %s is on %s carbon: neither SN2 nor SN1 takes place there", s.Leaving.Data.Name, where), Parties: Parties{Atoms: []int{s.Carbon, s.Leaving.Attach}, Reactant: -1, Solvent: -1},
				Fixes: []Fix{{Kind: ReplaceReagent, Title: "use a cross-coupling or an SNAr reaction (activated arenes) instead"}}})
			o.Reasons = append(o.Reasons, Reason{Rule: "sp2-carbon", Text: "a leaving group on an sp2 carbon is not displaced: no backside approach, no stable cation", Source: "textbook generality (March's Advanced Organic Chemistry, aliphatic substitution)"})
		case s.Leaving.Data.Poor:
			o.Findings = append(o.Findings, poorLeaving(s))
			o.Reasons = append(o.Reasons, Reason{Rule: "poor-leaving-group", Text: fmt.Sprintf("%s is a poor leaving group (conjugate acid pKa %.1f): it must be activated first", s.Leaving.Data.Name, s.Leaving.Data.PKaH), Source: s.Leaving.Data.Source})
		}
	}
	if len(o.Findings) == 0 || (len(o.Findings) == 1 && o.Findings[0].Code == CodeNoSolvent) {
		o.NotAnalysed = "no carbon bearing a leaving group was found on the substrate"
	}
	return o
}

func poorLeaving(s perceive.Site) Finding {
	f := Finding{Code: CodePoorLeaving, Severity: Error,
		Message: fmt.Sprintf("%s does not leave under these conditions (conjugate acid pKa %.1f)", s.Leaving.Data.Name, s.Leaving.Data.PKaH),
		Parties: Parties{Atoms: []int{s.Carbon, s.Leaving.Attach}, Reactant: -1, Solvent: -1}}
	if s.Leaving.Kind == perceive.Hydroxyl {
		f.Message = fmt.Sprintf("the OH does not leave under these conditions (hydroxide: conjugate acid pKa %.1f); activate it first: a tosylate or mesylate keeps the configuration, Mitsunobu or Appel conditions invert it", s.Leaving.Data.PKaH)
		f.Fixes = []Fix{
			{Kind: InsertStep, Title: "make the tosylate first (keeps the configuration)", Names: []string{"TsCl", "pyridine"}, Config: "retains"},
			{Kind: InsertStep, Title: "make the mesylate first (keeps the configuration)", Names: []string{"MsCl", "Et3N"}, Config: "retains"},
			{Kind: ReplaceReagent, Title: "Mitsunobu conditions substitute with inversion", Names: []string{"PPh3", "DIAD"}, Config: "inverts"},
			{Kind: ReplaceReagent, Title: "Appel conditions give the halide with inversion", Names: []string{"PPh3", "CBr4"}, Config: "inverts"},
			{Kind: ReplaceReagent, Title: "HBr gives the bromide (SN1 with loss of configuration at tertiary carbons)", Names: []string{"HBr"}, Config: "inverts at primary, lost at tertiary"},
		}
	}
	return f
}

// solventNucleophile returns the solvent molecule that captures a cation
// or attacks in solvolysis, or nil.
func solventNucleophile(md perceive.Medium, cache *Cache) (*perceive.Nucleophile, *molecule.Molecule) {
	bestShare := 0.0
	var best string
	for i, p := range md.Parts {
		if p.Nucleophile != "" && md.Shares[i] > bestShare {
			best, bestShare = p.Nucleophile, md.Shares[i]
		}
	}
	if best == "" {
		return nil, nil
	}
	if cache != nil {
		nu, m := cache.solventNucleophile(best)
		if nu == nil {
			return nil, nil
		}
		nu.FromSolvent = true
		nu.Reactant = -1
		return nu, m
	}
	m, err := smiles.Parse(best)
	if err != nil {
		return nil, nil
	}
	g := perceive.PerceiveReagents([]Reactant{{Mol: m}})
	if g.Nucleophile == nil {
		return nil, nil
	}
	nu := *g.Nucleophile
	nu.FromSolvent = true
	nu.Reactant = -1
	return &nu, m
}

// distribute turns the scores into a distribution and picks the
// mechanism.
func distribute(o *Outcome, c *scoring) {
	o.Scores = make([]Score, len(Pathways))
	maxv := math.Inf(-1)
	for i, p := range Pathways {
		o.Scores[i] = Score{Pathway: p, Log10: c.log[i], Possible: c.can[i]}
		if c.can[i] && c.log[i] > maxv {
			maxv = c.log[i]
		}
	}
	if math.IsInf(maxv, -1) || maxv < w("reaction-threshold") {
		o.Mechanism = None
		return
	}
	sum := 0.0
	for i := range o.Scores {
		if o.Scores[i].Possible {
			o.Scores[i].Fraction = math.Pow(10, o.Scores[i].Log10-maxv)
			sum += o.Scores[i].Fraction
		}
	}
	best := 0.0
	for i := range o.Scores {
		o.Scores[i].Fraction /= sum
		if o.Scores[i].Fraction > best {
			best = o.Scores[i].Fraction
			o.Mechanism = o.Scores[i].Pathway
		}
	}
}

// hasHydroxyl reports whether the substrate has an alcohol OH on an sp3
// carbon.
func hasHydroxyl(sub *perceive.Substrate) bool {
	for _, s := range sub.Sites {
		if s.Leaving.Kind == perceive.Hydroxyl && s.Flags.Has(perceive.Sp3) {
			return true
		}
	}
	return false
}

// acylOnly explains a step whose only leaving group is an ester's alkyl
// oxygen and whose reagent attacks carbonyls (hydroxide, alkoxides,
// amines): saponification, transesterification and aminolysis happen at
// the carbonyl carbon by addition–elimination, not at
// the sp3 carbon (common practice; March's Advanced Organic Chemistry,
// acyl substitution, from memory). walden's rules do not cover them, so
// the step is "not analysed" rather than an error about a leaving group.
func acylOnly(sub *perceive.Substrate, rg perceive.Reagents) string {
	if len(sub.Sites) == 0 {
		return ""
	}
	for _, s := range sub.Sites {
		if s.Leaving.Kind != perceive.Carboxylate {
			return ""
		}
	}
	kinds := []perceive.NucKind{}
	if rg.Nucleophile != nil {
		kinds = append(kinds, rg.Nucleophile.Kind)
	}
	if rg.Base != nil {
		kinds = append(kinds, rg.Base.Kind)
	}
	for _, k := range kinds {
		switch k {
		case "hydroxide", "alkoxide", "alkoxide-secondary", "alkoxide-tertiary", "ammonia", "amine-primary", "amine-secondary", "hydrazine":
			return "the ester reacts at its carbonyl carbon (hydrolysis, transesterification or aminolysis: acyl substitution), which walden's rules for substitution at sp3 carbon do not cover"
		}
	}
	return ""
}

// deprotonationOnly explains a step that only makes an alkoxide: an
// alcohol with a base strong enough to remove its proton (NaH, KH, LDA,
// BuLi; alcohol pKa about 16–18, common compilations, from memory) and
// no electrophile. That is an acid–base step whose product a later step
// uses ("tBuOH + NaH, THF"), not a substitution with a poor leaving group.
func deprotonationOnly(sub *perceive.Substrate, rg perceive.Reagents) string {
	if len(sub.Sites) == 0 || rg.Base == nil || rg.Base.PKaH < 19 {
		return ""
	}
	for _, s := range sub.Sites {
		if s.Leaving.Kind != perceive.Hydroxyl {
			return ""
		}
	}
	if rg.Nucleophile != nil && rg.Nucleophile.Kind != rg.Base.Kind {
		return ""
	}
	return "the base only removes the alcohol's proton (an acid–base step: the alkoxide for a later step); no carbon here bears a leaving group"
}
