package outcome

import (
	"walden/analyze/cip"
	"walden/analyze/molecule"
	"walden/analyze/perceive"
)

// cipNodeLimit bounds the CIP digraph per centre so that a pathological
// molecule cannot stall an editor; labels beyond it are left blank.
const cipNodeLimit = 5000

// label returns the CIP letter of atom a of m, or "".
func label(m *molecule.Molecule, a int) string {
	l := cip.Labeller{NodeLimit: cipNodeLimit}
	ds, _ := l.Label(m)
	for _, d := range ds {
		if d.Atoms[0] == a && d.Atoms[1] < 0 {
			return d.Label.String()
		}
	}
	return ""
}

// stereo records what happened at the reacting carbon in the major
// product: inverted (SN2), lost (SN1, elimination, degenerate exchange).
func stereo(o *Outcome, sub *molecule.Molecule, c *scoring) {
	if perceive.TetrahedralAt(sub, c.site.Carbon) < 0 {
		return
	}
	before := c.cache.label(sub, c.site.Carbon)
	ch := StereoChange{Atom: c.site.Carbon, Before: before, Change: Lost}
	mp := o.Major()
	if mp != nil && mp.Pathway == SN2 && !degenerate(c) {
		ch.Change = Inverted
		// The reacting carbon is the atom bonded to the nucleophile;
		// find it as the tetrahedral centre whose refs changed: the
		// builder keeps substrate order, so its index is the substrate
		// index less the dropped atoms before it.
		ch.After = c.cache.label(mp.Mol, shifted(sub, c, c.site.Carbon))
	}
	ch.LetterChanged = ch.Before != "" && ch.After != "" && ch.Before != ch.After
	if ch.Change == Lost {
		ch.Why = lostWhy(mp, c)
	}
	o.Stereo = append(o.Stereo, ch)
}

// shifted maps a substrate atom to its index in a substitution product
// (atoms keep their order; the leaving group's atoms are dropped).
func shifted(sub *molecule.Molecule, c *scoring, a int) int {
	n := a
	for _, x := range c.site.Leaving.Atoms {
		if x < a {
			n--
		}
	}
	return n
}

// lostWhy says why the configuration at the reacting carbon is lost in
// the major product, so that no wording of a lost centre has to guess.
func lostWhy(mp *Product, c *scoring) string {
	switch {
	case mp == nil:
		return "no product is predicted"
	case mp.Pathway == E2 || mp.Pathway == E1:
		return "the carbon becomes part of the double bond"
	case mp.Pathway == SN1:
		return "racemised through the planar carbocation"
	case degenerate(c):
		return "racemised: the halide displaces the same halide again and again"
	}
	return "the configuration is not kept"
}
