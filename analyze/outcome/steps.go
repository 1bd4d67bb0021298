package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/smiles"
)

// sulfonylate turns the substrate's hydroxyl into a sulfonate ester: the
// O–S bond forms and the C–O bond is untouched, so the configuration is
// kept (Phillips, H. J. Chem. Soc. 1923, 123, 44; Tipson, R. S. J. Org.
// Chem. 1944, 9, 235).
func sulfonylate(o Outcome, st Step, sub *perceive.Substrate, act activation) Outcome {
	var site *perceive.Site
	for i, s := range sub.Sites {
		if s.Leaving.Kind == perceive.Hydroxyl && s.Flags.Has(perceive.Sp3) {
			site = &sub.Sites[i]
			break
		}
	}
	if site == nil {
		o.NotAnalysed = "a sulfonylating reagent is present but the substrate has no alcohol OH on an sp3 carbon"
		return o
	}
	o.Site = site.Carbon
	k := sulfonateKey{sub: st.Substrate, reagent: st.Reagents[act.reagent].Mol, carbon: site.Carbon, oxygen: site.Leaving.Attach, sulfonyl: act.sulfonyl, leaving: act.leaving}
	est := st.Cache.sulfonate(k)
	p := Product{Mol: est.mol, SMILES: est.smiles, Fraction: 1, Role: Major, Pathway: None, Note: "sulfonate ester; the C–O bond is untouched"}
	o.Products = []Product{p}
	o.Reasons = append(o.Reasons, Reason{Rule: "sulfonylation", Text: "the sulfonyl chloride esterifies the alcohol oxygen; the C–O bond does not break, so the configuration is retained and the sulfonate is a good leaving group for a later SN2 (with inversion)", Source: "Phillips, H. J. Chem. Soc. 1923, 123, 44; Tipson, R. S. J. Org. Chem. 1944, 9, 235"})
	if perceive.TetrahedralAt(st.Substrate, site.Carbon) >= 0 {
		before := st.Cache.label(st.Substrate, site.Carbon)
		after := st.Cache.label(est.mol, est.carbon)
		o.Stereo = []StereoChange{{Atom: site.Carbon, Before: before, After: after, Change: Retained, LetterChanged: before != after && before != "" && after != ""}}
	}
	return o
}

// sulfonateKey is everything buildSulfonate reads: the substrate and the
// sulfonylating reagent by identity, the atoms by index.
type sulfonateKey struct {
	sub, reagent                      *molecule.Molecule
	carbon, oxygen, sulfonyl, leaving int
}

// sulfonateEster is the ester a sulfonylation gives, with its canonical
// SMILES and the product atom of the substrate's carbon.
type sulfonateEster struct {
	mol    *molecule.Molecule
	smiles string
	carbon int
}

// buildSulfonate joins the substrate's oxygen k.oxygen to the reagent's
// sulfur k.sulfonyl and leaves out the atoms the reagent loses with
// k.leaving. The ester is built in one pass: the substrate, then the
// sulfonyl group's component less the atoms that leave (as building it
// whole and rebuilding without them did, with the same atom order).
func buildSulfonate(k sulfonateKey) sulfonateEster {
	r := k.reagent
	comp, _ := r.Components()
	want := comp[k.sulfonyl]
	lost := make([]bool, len(r.Atoms))
	lost[k.leaving] = true
	for _, x := range leavingSide(r, k.sulfonyl, k.leaving) {
		lost[x] = true
	}
	take := func(i int) bool { return comp[i] == want && !lost[i] }
	atoms, bonds := len(k.sub.Atoms), len(k.sub.Bonds)+1 // +1: the O–S bond
	for i := range r.Atoms {
		if take(i) {
			atoms++
		}
	}
	for _, bd := range r.Bonds {
		if take(bd.A) && take(bd.B) {
			bonds++
		}
	}
	out := &molecule.Molecule{}
	out.Grow(atoms, bonds)
	subMap := copyInto(out, k.sub, func(int) bool { return true }, nil)
	nuMap := copyInto(out, r, take, map[int]bool{k.sulfonyl: true})
	oAt := subMap[k.oxygen]
	out.AddBond(molecule.Bond{A: oAt, B: nuMap[k.sulfonyl], Order: 1})
	takeProton(out, oAt)
	return sulfonateEster{mol: out, smiles: smiles.Canonical(out), carbon: subMap[k.carbon]}
}

// leavingSide lists the atoms of reagent r that go with atom l when the
// S–l bond breaks (the chloride, or the other half of an anhydride).
func leavingSide(r *molecule.Molecule, s, l int) []int {
	seen := map[int]bool{s: true, l: true}
	out := []int{l}
	stack := []int{l}
	for len(stack) > 0 {
		a := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		for _, e := range r.Edges(a) {
			if !seen[e.Atom] {
				seen[e.Atom] = true
				out = append(out, e.Atom)
				stack = append(stack, e.Atom)
			}
		}
	}
	return out
}

// dehydrate: a strong acid whose conjugate base does not capture cations
// (H3PO4, H2SO4) dehydrates the alcohol by E1 to the most stable alkene
// (Coleman, G. H.; Johnstone, H. F. Org. Synth. 1925, 5, 33).
func dehydrate(o Outcome, sub *perceive.Substrate, site *perceive.Site, md perceive.Medium) Outcome {
	c := &scoring{sub: sub, site: site, md: md, can: [4]bool{false, false, false, true}}
	c.cation = findCation(sub, site)
	o.Mechanism = E1
	o.Scores = []Score{{Pathway: SN2}, {Pathway: SN1}, {Pathway: E2}, {Pathway: E1, Possible: true, Fraction: 1}}
	o.Reasons = append(o.Reasons, Reason{Rule: "acid-dehydration", Text: "a strong acid with a non-nucleophilic conjugate base protonates the alcohol; the cation loses a proton (E1) towards the most stable alkene", Source: "Coleman & Johnstone Org. Synth. 1925, 5, 33"})
	for _, p := range eliminate(sub.Mol, c, E1) {
		o.Products = append(o.Products, p)
	}
	for i := range o.Products {
		o.Products[i].SMILES = smiles.Canonical(o.Products[i].Mol)
		o.Products[i].Role = Minor
	}
	sortProducts(o.Products)
	return o
}

func sortProducts(ps []Product) {
	for i := 1; i < len(ps); i++ {
		for j := i; j > 0 && ps[j].Fraction > ps[j-1].Fraction; j-- {
			ps[j], ps[j-1] = ps[j-1], ps[j]
		}
	}
	if len(ps) > 0 {
		ps[0].Role = Major
	}
}
