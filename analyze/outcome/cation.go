package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
)

// cation is the carbocation an ionisation gives, after any 1,2-shift.
type cation struct {
	centre  int // substrate atom bearing the positive charge
	score   float64
	kind    string // "tertiary", "secondary benzylic" …
	shift   string // "hydride", "methyl", "alkyl" or ""
	from    int    // the carbon the migrating group left (the new centre) when shifted
	migrant int    // the migrating carbon; -1 for a hydride
}

// cationAt scores a cation at atom c as the substrate-class table does.
func cationAt(m *molecule.Molecule, c, exclude int, extraHeavy int) (float64, string) {
	heavy, aryl, flags := extraHeavy, 0, perceive.Sp3
	for _, e := range m.Edges(c) {
		if e.Atom == exclude || m.Atoms[e.Atom].Element == molecule.H {
			continue
		}
		heavy++
		if m.Atoms[e.Atom].Aromatic {
			flags |= perceive.Benzylic
			aryl++
		}
	}
	s := perceive.Site{Flags: flags, Aryls: aryl}
	switch {
	case heavy <= 0:
		s.Degree = perceive.Methyl
	case heavy == 1:
		s.Degree = perceive.Primary
	case heavy == 2:
		s.Degree = perceive.Secondary
	default:
		s.Degree = perceive.Tertiary
	}
	r, _ := perceive.ClassRate(s)
	kind := s.Degree.String()
	if aryl > 0 {
		kind += " benzylic"
	}
	return r.SN1, kind
}

// findCation scores ionisation at the site and looks for a 1,2-hydride
// or 1,2-alkyl shift to a more stable cation (Whitmore 1932).
func findCation(sub *perceive.Substrate, s *perceive.Site) cation {
	m := sub.Mol
	sum, _ := perceive.ClassRate(*s)
	kind := s.Degree.String()
	switch {
	case s.Flags.Has(perceive.Benzylic):
		kind += " benzylic"
	case s.Flags.Has(perceive.Allylic):
		kind += " allylic"
	}
	best := cation{centre: s.Carbon, score: sum.SN1, kind: kind, from: -1, migrant: -1}
	if s.Flags.Has(perceive.Benzylic) || s.Flags.Has(perceive.Allylic) || s.Flags.Has(perceive.AlphaHetero) {
		return best
	}
	for _, b := range s.Beta {
		bt := b.Atom
		if m.Atoms[bt].Aromatic {
			continue
		}
		if b.H > 0 {
			// Hydride moves to the cation; the β-carbon keeps its other bonds
			// and gains the bond to the old centre as a substituent.
			v, k := cationAt(m, bt, s.Leaving.Attach, 0)
			v -= w("rearrangement-penalty")
			if v > best.score+1 {
				best = cation{centre: bt, score: v, kind: k, shift: "hydride", from: bt, migrant: -1}
			}
			continue
		}
		// No hydrogen: an alkyl group (methyl first) can move.
		mig := -1
		for _, e := range m.Edges(bt) {
			x := e.Atom
			if x == s.Carbon || m.Atoms[x].Element != molecule.C || m.Atoms[x].Aromatic {
				continue
			}
			if mig < 0 || m.Degree(x) < m.Degree(mig) {
				mig = x
			}
		}
		if mig < 0 {
			continue
		}
		v, k := cationAt(m, bt, mig, 0)
		v -= w("rearrangement-penalty")
		if v > best.score+1 {
			shift := "alkyl"
			if m.Degree(mig) == 1 {
				shift = "methyl"
			}
			best = cation{centre: bt, score: v, kind: k, shift: shift, from: bt, migrant: mig}
		}
	}
	return best
}
