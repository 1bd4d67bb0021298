package outcome

import (
	"cmp"
	"math"
	"slices"

	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/reagents"
	"walden/analyze/smiles"
)

// minShare is the smallest pathway share whose product is listed.
const minShare = 0.02

// products generates the products of every pathway with a share worth
// listing, and marks the largest one major.
func products(o *Outcome, st Step, c *scoring) {
	// Each pathway's products first, so that the list is made once at
	// its final size.
	var per [4][]Product
	n := 0
	for i, s := range o.Scores {
		if !s.Possible || s.Fraction < minShare {
			continue
		}
		if c.cache != nil {
			per[i] = c.cache.pathwayProducts(st.Substrate, c, s.Pathway)
		} else {
			per[i] = buildProducts(st.Substrate, c, s.Pathway)
		}
		n += len(per[i])
	}
	var out []Product
	if n > 0 {
		out = make([]Product, 0, n)
	}
	for i, s := range o.Scores {
		for _, p := range per[i] {
			switch s.Pathway {
			case SN2, SN1:
				p.Fraction = s.Fraction
			case E2, E1:
				p.Fraction *= s.Fraction
			}
			out = append(out, p)
		}
	}
	// Largest share first, stably.
	slices.SortStableFunc(out, func(a, b Product) int { return cmp.Compare(b.Fraction, a.Fraction) })
	for i := range out {
		out[i].Role = Minor
		if i == 0 {
			out[i].Role = Major
		}
	}
	// The same product by two pathways is listed once, where it first
	// appears (the lists are a few products long: no map needed).
	kept := out[:0]
outer:
	for _, p := range out {
		if p.SMILES != "" {
			for j := range kept {
				if kept[j].SMILES == p.SMILES {
					kept[j].Fraction += p.Fraction
					continue outer
				}
			}
		}
		kept = append(kept, p)
	}
	o.Products = kept
}

// buildProducts builds the products of pathway p, each with its share
// within the pathway, its configuration settled and its canonical SMILES.
func buildProducts(sub *molecule.Molecule, c *scoring, p Mechanism) []Product {
	var out []Product
	switch p {
	case SN2, SN1:
		if x := substitute(sub, c, p == SN1); x != nil {
			out = append(out, *x)
		}
	case E2, E1:
		out = eliminate(sub, c, p)
	}
	for i := range out {
		if out[i].Pathway == SN2 || out[i].Pathway == SN1 {
			dropFalseCentre(out[i].Mol)
		}
		out[i].SMILES = smiles.Canonical(out[i].Mol)
	}
	return out
}

// substitute replaces the leaving group by the nucleophile: with
// geometric inversion (SN2) or with the configuration lost at the cation
// centre and any 1,2-shift applied (SN1).
func substitute(sub *molecule.Molecule, c *scoring, ionised bool) *Product {
	if c.nu == nil || c.nuMol == nil {
		return nil
	}
	s := c.site
	lg := s.Leaving
	drop := map[int]bool{}
	for _, a := range lg.Atoms {
		drop[a] = true
	}
	centre := s.Carbon
	skip := map[int]bool{s.Carbon: true}
	if ionised {
		centre = c.cation.centre
		skip[centre] = true
	}
	b := newBuilder(sub, drop, skip, c.nuMol, c.nu.Atom)
	m := b.out
	if lg.InRing {
		// The group stays on the molecule: cut the bond and give the
		// oxygen (or nitrogen) back its hydrogen after work-up.
		cutBond(b, s.Carbon, lg.Attach)
		m = b.out
		at := &m.Atoms[b.subMap[lg.Attach]]
		if at.Charge > 0 {
			at.Charge = 0
		} else {
			at.ImplicitH++
		}
	}
	if ionised && c.cation.shift != "" {
		// 1,2-shift: the migrating group moves from the new centre to the
		// old one.
		if c.cation.migrant < 0 {
			takeProton(m, b.subMap[centre])
			m.Atoms[b.subMap[s.Carbon]].ImplicitH++
		} else {
			cutBond(b, centre, c.cation.migrant)
			m = b.out
			b.attach(b.subMap[s.Carbon], b.subMap[c.cation.migrant])
		}
	}
	nuAt := b.nuMap[c.nu.Atom]
	b.attach(b.subMap[centre], nuAt)
	if c.nu.Deprotonated {
		from := nuAt
		if c.nu.ProtonFrom >= 0 {
			from = b.nuMap[c.nu.ProtonFrom]
		}
		takeProton(m, from)
		if from != nuAt && m.Atoms[nuAt].Aromatic {
			rekekulise(m, nuAt)
		}
	} else {
		bondAfterAttack(m, nuAt, c.nuMol.Atoms[c.nu.Atom].Charge)
		shiftAzoleProton(m, nuAt)
	}
	p := &Product{Mol: m, Pathway: SN2}
	if ionised {
		p.Pathway = SN1
		if c.cation.shift != "" {
			p.Note = "rearranged by a 1,2-" + c.cation.shift + " shift"
		}
		return p
	}
	if degenerate(c) {
		p.Note = "the nucleophile is the leaving group: each exchange inverts, so the carbon racemises"
		return p
	}
	// Geometric inversion: the nucleophile takes the leaving group's
	// place among the references and the winding reverses.
	if ti := perceive.TetrahedralAt(sub, s.Carbon); ti >= 0 {
		t := sub.Tetrahedral[ti]
		nt := molecule.Tetrahedral{Centre: b.subMap[s.Carbon], Winding: t.Winding.Invert()}
		ok := true
		for k, r := range t.Refs {
			switch {
			case r == lg.Attach:
				nt.Refs[k] = nuAt
			case r == molecule.Implicit:
				nt.Refs[k] = r
			case b.subMap[r] >= 0:
				nt.Refs[k] = b.subMap[r]
			default:
				ok = false
			}
		}
		if ok {
			m.Tetrahedral = append(m.Tetrahedral, nt)
		}
	}
	return p
}

// degenerate: the nucleophile is the same halide as the leaving group
// (a halide leaving group is its halogen atom, Leaving.Attach).
func degenerate(c *scoring) bool {
	k := perceive.HalideKind(c.sub.Mol.Atoms[c.site.Leaving.Attach].Element)
	return k != "" && c.nu != nil && c.nu.Kind == k
}

// cutBond removes the bond between substrate atoms a and b from the
// product being built (the graph has no removal, so it is rebuilt).
func cutBond(b *builder, a, c int) {
	pa, pc := b.subMap[a], b.subMap[c]
	old := b.out
	m := &molecule.Molecule{}
	m.Grow(len(old.Atoms), len(old.Bonds)+1) // +1: the bond the caller adds next
	for _, at := range old.Atoms {
		m.AddAtom(at)
	}
	for _, bd := range old.Bonds {
		if (bd.A == pa && bd.B == pc) || (bd.A == pc && bd.B == pa) {
			continue
		}
		m.AddBond(bd)
	}
	for _, t := range old.Tetrahedral {
		if t.Centre == pa || t.Centre == pc {
			continue
		}
		m.Tetrahedral = append(m.Tetrahedral, t)
	}
	m.CisTrans = old.CisTrans
	b.out = m
}

// option is one way to eliminate: the β-carbon and which hydrogen.
type option struct {
	beta   perceive.Beta
	weight float64
}

// eliminate forms the alkenes of an E2 or E1 step with their shares.
// E2 uses only β-hydrogens that can be anti-periplanar; the geometry is
// read from the configurations when both carbons are defined and the
// β-carbon has one hydrogen, otherwise the more stable E isomer leads.
func eliminate(sub *molecule.Molecule, c *scoring, p Mechanism) []Product {
	s := c.site
	hofmann := p == E2 && hofmannConditions(c)
	var opts []option
	for _, b := range s.Beta {
		if b.H == 0 || (p == E2 && b.AntiH == 0) {
			continue
		}
		h := b.H
		if p == E2 && b.AntiH > 0 {
			h = b.AntiH
		}
		wgt := math.Log10(float64(h))
		if hofmann {
			wgt -= w("bulky-hofmann") * float64(b.Substituents)
		} else {
			wgt += w("zaitsev-per-carbon") * float64(b.Substituents)
			if b.Conjugated {
				wgt += w("conjugation")
			}
		}
		opts = append(opts, option{b, wgt})
	}
	if len(opts) == 0 {
		return nil
	}
	// Equivalent β-carbons give the same alkene.
	sum := 0.0
	for _, o := range opts {
		sum += math.Pow(10, o.weight)
	}
	per := make([][]Product, len(opts))
	for i, o := range opts {
		share := math.Pow(10, o.weight) / sum
		per[i] = alkenes(sub, c, o.beta, p)
		for k := range per[i] {
			per[i][k].Fraction *= share
		}
	}
	// Symmetry-equivalent β-carbons give mirror-image alkenes at equal
	// rates: only the configurations both share survive (a racemate).
	for i := range opts {
		for j := i + 1; j < len(opts); j++ {
			if c.sub.Sym[opts[i].beta.Atom] != c.sub.Sym[opts[j].beta.Atom] || len(per[i]) != len(per[j]) {
				continue
			}
			for k := range per[i] {
				racemate(per[i][k].Mol, per[j][k].Mol)
			}
		}
	}
	var out []Product
	for _, ps := range per {
		out = append(out, ps...)
	}
	return out
}

// racemate compares two alkenes formed at equal rates from equivalent
// β-carbons. When they are the same constitution but differ in
// configuration (mirror images), the configurations whose CIP letters
// differ between them are dropped from both: the product is racemic
// there.
func racemate(a, b *molecule.Molecule) {
	if smiles.Canonical(a) == smiles.Canonical(b) || flat(a) != flat(b) {
		return
	}
	la, lb := labels(a), labels(b)
	keep := func(m *molecule.Molecule, mine, other map[int]string) {
		kept := m.Tetrahedral[:0]
		for _, t := range m.Tetrahedral {
			if mine[t.Centre] == other[t.Centre] {
				kept = append(kept, t)
			}
		}
		m.Tetrahedral = kept
	}
	keep(a, la, lb)
	keep(b, lb, la)
}

// flat is the canonical SMILES without any stereo.
func flat(m *molecule.Molecule) string {
	c := m.Clone()
	c.Tetrahedral, c.CisTrans, c.Axial = nil, nil, nil
	return smiles.Canonical(c)
}

// labels maps centre atoms to their CIP letters.
func labels(m *molecule.Molecule) map[int]string {
	out := map[int]string{}
	for _, t := range m.Tetrahedral {
		out[t.Centre] = label(m, t.Centre)
	}
	return out
}

// commonTetrahedral keeps the configurations written identically in a
// and b (same atom order, as both come from one substrate).
func commonTetrahedral(a, b *molecule.Molecule) []molecule.Tetrahedral {
	var out []molecule.Tetrahedral
	for _, t := range a.Tetrahedral {
		for _, u := range b.Tetrahedral {
			if t == u {
				out = append(out, t)
				break
			}
		}
	}
	return out
}

// hofmannConditions: bulky bases, fluoride and onium leaving groups give
// the less substituted alkene (Brown, Moritani, Okamoto 1956; Bartsch &
// Bunnett J. Am. Chem. Soc. 1968, 90, 408; Hofmann's rule).
func hofmannConditions(c *scoring) bool {
	if c.base != nil && c.base.Bulk >= reagents.Hindered {
		return true
	}
	switch c.site.Leaving.Kind {
	case perceive.Fluoride, perceive.Ammonium, perceive.Sulfonium:
		return true
	}
	return false
}

// alkenes builds the alkene(s) from removing a hydrogen of beta.
func alkenes(sub *molecule.Molecule, c *scoring, beta perceive.Beta, p Mechanism) []Product {
	s := c.site
	a, bt := s.Carbon, beta.Atom
	drop := map[int]bool{}
	for _, x := range s.Leaving.Atoms {
		drop[x] = true
	}
	hs := perceive.HydrogenRefs(sub, bt)
	removeH := molecule.Implicit
	if len(hs) > 0 && hs[0] >= 0 {
		removeH = hs[0]
		drop[removeH] = true
	}
	b := newBuilder(sub, drop, map[int]bool{a: true, bt: true}, nil, 0)
	m := b.out
	if removeH == molecule.Implicit {
		takeProton(m, b.subMap[bt])
	}
	if s.Leaving.InRing {
		cutBond(b, a, s.Leaving.Attach)
		m = b.out
		m.Atoms[b.subMap[s.Leaving.Attach]].ImplicitH++
	}
	bi := m.BondBetween(b.subMap[a], b.subMap[bt])
	m.Bonds[bi].Order = 2
	note := ""
	if c.sub.Rings.Bond[sub.BondBetween(a, bt)] && c.sub.Rings.SmallestRingBond(a, bt) < 8 {
		return []Product{{Mol: m, Pathway: p, Fraction: 1}}
	}
	ra := heavySub(sub, a, bt, s.Leaving.Attach)
	rb := heavySub(sub, bt, a, removeH)
	if len(ra) == 0 || len(rb) == 0 || !distinct(sub, c.sub.Sym, a, bt, s.Leaving.Attach) || !distinct(sub, c.sub.Sym, bt, a, removeH) {
		return []Product{{Mol: m, Pathway: p, Fraction: 1}}
	}
	xa, xb := ra[0], rb[0]
	// Stereospecific: E2, one hydrogen on the β-carbon, both configured.
	if p == E2 && len(hs) == 1 && perceive.TetrahedralAt(sub, a) >= 0 && perceive.TetrahedralAt(sub, bt) >= 0 {
		if cis, ok := perceive.AntiCis(sub, a, s.Leaving.Attach, xa, bt, hs[0], xb); ok {
			m.CisTrans = append(m.CisTrans, molecule.CisTrans{Ends: [2]int{b.subMap[a], b.subMap[bt]}, Refs: [2]int{b.subMap[xa], b.subMap[xb]}, Config: cfg(cis)})
			return []Product{{Mol: m, Pathway: p, Fraction: 1, Note: "anti-periplanar elimination fixes the geometry"}}
		}
	}
	// Stereoselective: larger groups trans.
	bigA := bigger(sub, a, ra, bt)
	bigB := bigger(sub, bt, rb, a)
	// The Z isomer is a copy; the E isomer is m itself (nothing else
	// holds it), which saves building a third molecule.
	z := m.Clone()
	z.CisTrans = append(z.CisTrans, molecule.CisTrans{Ends: [2]int{b.subMap[a], b.subMap[bt]}, Refs: [2]int{b.subMap[bigA], b.subMap[bigB]}, Config: molecule.Together})
	e := m
	e.CisTrans = append(e.CisTrans, molecule.CisTrans{Ends: [2]int{b.subMap[a], b.subMap[bt]}, Refs: [2]int{b.subMap[bigA], b.subMap[bigB]}, Config: molecule.Opposite})
	fe := math.Pow(10, w("e-over-z"))
	_ = note
	return []Product{{Mol: e, Pathway: p, Fraction: fe / (fe + 1), Note: "larger groups trans"}, {Mol: z, Pathway: p, Fraction: 1 / (fe + 1)}}
}

func cfg(cis bool) molecule.Config {
	if cis {
		return molecule.Together
	}
	return molecule.Opposite
}

// heavySub lists the non-hydrogen neighbours of x other than the two given.
func heavySub(m *molecule.Molecule, x, not1, not2 int) []int {
	var out []int
	for _, e := range m.Edges(x) {
		if e.Atom == not1 || e.Atom == not2 || m.Atoms[e.Atom].Element == molecule.H {
			continue
		}
		out = append(out, e.Atom)
	}
	return out
}

// distinct reports whether the two substituents left on alkene end x
// (besides the other end and the departing atom) differ.
func distinct(m *molecule.Molecule, sym []uint64, x, other, gone int) bool {
	var keys []uint64
	for _, e := range m.Edges(x) {
		if e.Atom == other || e.Atom == gone {
			continue
		}
		if m.Atoms[e.Atom].Element == molecule.H {
			keys = append(keys, 0)
		} else {
			keys = append(keys, sym[e.Atom])
		}
	}
	h := m.Atoms[x].ImplicitH
	if gone == molecule.Implicit {
		h--
	}
	for range h {
		keys = append(keys, 0)
	}
	return len(keys) == 2 && keys[0] != keys[1]
}

// bigger returns the larger of the heavy substituents (a hydrogen being
// smallest), by branch size.
func bigger(m *molecule.Molecule, x int, subs []int, other int) int {
	best, size := subs[0], -1
	for _, s := range subs {
		if n := perceive.BranchSize(m, x, s, 64); n > size {
			best, size = s, n
		}
	}
	return best
}

// shiftAzoleProton: a neutral azole attacks through its pyridine-type
// nitrogen and then loses the N–H proton of the other nitrogen, so the
// product is the neutral N-alkyl azole (common practice).
func shiftAzoleProton(m *molecule.Molecule, n int) {
	if !m.Atoms[n].Aromatic || m.Atoms[n].Charge != 1 {
		return
	}
	seen := map[int]bool{n: true}
	queue := []int{n}
	for len(queue) > 0 {
		x := queue[0]
		queue = queue[1:]
		if x != n && m.Atoms[x].Element == molecule.N && m.Atoms[x].ImplicitH > 0 && m.Atoms[x].Charge == 0 {
			m.Atoms[x].ImplicitH--
			m.Atoms[n].Charge = 0
			rekekulise(m, n)
			return
		}
		for _, e := range m.Edges(x) {
			if m.Bonds[e.Bond].Aromatic && !seen[e.Atom] {
				seen[e.Atom] = true
				queue = append(queue, e.Atom)
			}
		}
	}
}
