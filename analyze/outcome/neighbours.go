package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/smiles"
)

// A group on the neighbouring carbon can take part before any outside
// reagent does. Each function here handles one such case and reports
// whether it applied.

// vicinalHalogen returns the halogen atom on β-carbon b, or -1.
func vicinalHalogen(m *molecule.Molecule, b int) int {
	for _, e := range m.Edges(b) {
		switch m.Atoms[e.Atom].Element {
		case molecule.Br, molecule.I:
			return e.Atom
		}
	}
	return -1
}

// dehalogenate: iodide attacks one bromine of a vicinal dibromide and the
// other leaves anti-periplanar, giving the alkene stereospecifically
// (Winstein, S.; Pressman, D.; Young, W. G. J. Am. Chem. Soc. 1939, 61,
// 1645).
func dehalogenate(o *Outcome, st Step, sub *perceive.Substrate, site *perceive.Site, c *scoring) bool {
	if c.nu == nil || c.nu.Kind != "iodide" || (site.Leaving.Kind != perceive.Bromide && site.Leaving.Kind != perceive.Iodide) {
		return false
	}
	m := st.Substrate
	for _, b := range site.Beta {
		x := vicinalHalogen(m, b.Atom)
		if x < 0 {
			continue
		}
		a, bt := site.Carbon, b.Atom
		drop := map[int]bool{site.Leaving.Attach: true, x: true}
		bd := newBuilder(m, drop, map[int]bool{a: true, bt: true}, nil, 0)
		pm := bd.out
		pm.Bonds[pm.BondBetween(bd.subMap[a], bd.subMap[bt])].Order = 2
		ra := heavySub(m, a, bt, site.Leaving.Attach)
		rb := heavySub(m, bt, a, x)
		note := ""
		if len(ra) > 0 && len(rb) > 0 && perceive.TetrahedralAt(m, a) >= 0 && perceive.TetrahedralAt(m, bt) >= 0 {
			if cis, ok := perceive.AntiCis(m, a, site.Leaving.Attach, ra[0], bt, x, rb[0]); ok {
				pm.CisTrans = append(pm.CisTrans, molecule.CisTrans{Ends: [2]int{bd.subMap[a], bd.subMap[bt]}, Refs: [2]int{bd.subMap[ra[0]], bd.subMap[rb[0]]}, Config: cfg(cis)})
				note = "anti-periplanar loss of both halogens fixes the geometry"
			}
		}
		o.Mechanism = E2
		o.Scores = []Score{{Pathway: SN2}, {Pathway: SN1}, {Pathway: E2, Possible: true, Fraction: 1}, {Pathway: E1}}
		o.Products = []Product{{Mol: pm, SMILES: smiles.Canonical(pm), Fraction: 1, Role: Major, Pathway: E2, Note: note}}
		o.Reasons = append(o.Reasons, Reason{Rule: "dehalogenation", Text: "iodide removes one halogen of the vicinal dihalide and the other leaves anti-periplanar: the alkene forms with the geometry the configurations dictate", Source: "Winstein, Pressman, Young J. Am. Chem. Soc. 1939, 61, 1645"})
		o.Leaving = []int{site.Leaving.Attach, x}
		return true
	}
	return false
}

// bromonium: under HX, a bromine on the neighbouring carbon displaces the
// protonated hydroxyl (a bromonium ion) and the halide opens it: two
// inversions, net retention (Winstein, S.; Lucas, H. J. J. Am. Chem. Soc.
// 1939, 61, 1576 and 2845).
func bromonium(o *Outcome, st Step, site *perceive.Site, c *scoring) bool {
	if c.act.kind != actHX || site.Leaving.Kind != perceive.Oxonium || c.nu == nil {
		return false
	}
	m := st.Substrate
	for _, b := range site.Beta {
		if vicinalHalogen(m, b.Atom) < 0 {
			continue
		}
		p := substitute(m, c, false)
		if p == nil {
			return false
		}
		// Double inversion: undo the single inversion substitute wrote.
		for i := range p.Mol.Tetrahedral {
			if p.Mol.Tetrahedral[i].Centre == shifted(m, c, site.Carbon) {
				p.Mol.Tetrahedral[i].Winding = p.Mol.Tetrahedral[i].Winding.Invert()
			}
		}
		p.Pathway, p.Fraction, p.Role = SN1, 1, Major
		p.SMILES = smiles.Canonical(p.Mol)
		p.Note = "neighbouring bromine: two inversions, net retention"
		o.Mechanism = SN1
		o.Scores = []Score{{Pathway: SN2}, {Pathway: SN1, Possible: true, Fraction: 1}, {Pathway: E2}, {Pathway: E1}}
		o.Products = []Product{*p}
		o.Reasons = append(o.Reasons, Reason{Rule: "neighbouring-bromine", Text: "the bromine on the neighbouring carbon displaces the protonated hydroxyl (bromonium ion) and bromide opens it: two inversions, so the configuration is retained", Source: "Winstein & Lucas J. Am. Chem. Soc. 1939, 61, 1576; 2845"})
		if perceive.TetrahedralAt(m, site.Carbon) >= 0 {
			before := label(m, site.Carbon)
			after := label(p.Mol, shifted(m, c, site.Carbon))
			o.Stereo = []StereoChange{{Atom: site.Carbon, Before: before, After: after, Change: Retained, LetterChanged: before != "" && after != "" && before != after}}
		}
		return true
	}
	return false
}

// epoxideClosure: a base deprotonates a hydroxyl on the neighbouring
// carbon and the alkoxide displaces the leaving group from behind, giving
// the epoxide with inversion at the carbon that loses the leaving group;
// on a ring only a trans (anti) hydroxyl can reach (Bartlett, P. D. J. Am.
// Chem. Soc. 1935, 57, 224).
func epoxideClosure(o *Outcome, st Step, site *perceive.Site, c *scoring) bool {
	if c.base == nil || c.base.PKaH < 14 || site.Leaving.Data.Poor {
		return false
	}
	m := st.Substrate
	for _, b := range site.Beta {
		oh := -1
		for _, e := range m.Edges(b.Atom) {
			if m.Atoms[e.Atom].Element == molecule.O && m.Degree(e.Atom) == 1 && m.HydrogenCount(e.Atom) == 1 {
				oh = e.Atom
			}
		}
		if oh < 0 {
			continue
		}
		if b.InRing {
			rn := ringNeighbourOf(c.sub, site.Carbon, b.Atom)
			rb := ringNeighbourOf(c.sub, b.Atom, site.Carbon)
			if rn < 0 || rb < 0 {
				continue
			}
			if trans, ok := perceive.AntiCis(m, site.Carbon, site.Leaving.Attach, rn, b.Atom, oh, rb); !ok || !trans {
				continue
			}
		}
		// Build like an SN2 with the substrate's own oxygen as nucleophile.
		drop := map[int]bool{}
		for _, x := range site.Leaving.Atoms {
			drop[x] = true
		}
		bd := newBuilder(m, drop, map[int]bool{site.Carbon: true}, nil, 0)
		pm := bd.out
		po := bd.subMap[oh]
		bd.attach(bd.subMap[site.Carbon], po)
		takeProton(pm, po)
		if ti := perceive.TetrahedralAt(m, site.Carbon); ti >= 0 {
			t := m.Tetrahedral[ti]
			nt := molecule.Tetrahedral{Centre: bd.subMap[site.Carbon], Winding: t.Winding.Invert()}
			for k, r := range t.Refs {
				switch {
				case r == site.Leaving.Attach:
					nt.Refs[k] = po
				case r == molecule.Implicit:
					nt.Refs[k] = r
				default:
					nt.Refs[k] = bd.subMap[r]
				}
			}
			pm.Tetrahedral = append(pm.Tetrahedral, nt)
		}
		o.Mechanism = SN2
		o.Scores = []Score{{Pathway: SN2, Possible: true, Fraction: 1}, {Pathway: SN1}, {Pathway: E2}, {Pathway: E1}}
		o.Products = []Product{{Mol: pm, SMILES: smiles.Canonical(pm), Fraction: 1, Role: Major, Pathway: SN2, Note: "intramolecular SN2: epoxide"}}
		o.Reasons = append(o.Reasons, Reason{Rule: "epoxide-closure", Text: "the base turns the neighbouring hydroxyl into an alkoxide, which displaces the leaving group from behind (intramolecular SN2): an epoxide forms with inversion at that carbon", Source: "Bartlett, P. D. J. Am. Chem. Soc. 1935, 57, 224"})
		return true
	}
	return false
}

// ringNeighbourOf returns a ring neighbour of a other than not.
func ringNeighbourOf(sub *perceive.Substrate, a, not int) int {
	for _, e := range sub.Mol.Edges(a) {
		if e.Atom != not && sub.Rings.Bond[e.Bond] {
			return e.Atom
		}
	}
	return -1
}
