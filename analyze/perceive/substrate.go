package perceive

import (
	"sort"

	"walden/analyze/molecule"
)

// Degree is the substitution of the carbon bearing the leaving group.
type Degree int8

// Degrees, by the number of heavy atoms on the carbon besides the
// leaving group.
const (
	Methyl Degree = iota
	Primary
	Secondary
	Tertiary
)

func (d Degree) String() string {
	return [...]string{"methyl", "primary", "secondary", "tertiary"}[d]
}

// Flag is a bit set of structural features of the reacting carbon.
type Flag uint32

// Features of the reacting carbon. Each is named as chemists do.
const (
	Allylic Flag = 1 << iota
	Benzylic
	Propargylic
	AlphaCarbonyl // next to C=O, C≡N or S(=O)2
	AlphaHetero   // next to O, N or S (not the leaving group)
	BetaBranched  // primary, with a β-carbon bearing two or more carbons
	Neopentyl     // primary, with a quaternary β-carbon
	Vinylic       // the leaving group is on an sp2 carbon of a C=C
	Aryl          // the leaving group is on an aromatic carbon
	Bridgehead
	SmallRing  // in a three- or four-membered ring
	InRing     // in any ring
	BetaHetero // a sulfur or nitrogen two bonds from the carbon that can assist (mustard-type)
	NoStereo   // the carbon is a stereocentre but its configuration is not written
	Stereo     // the carbon's configuration is written
	Sp3        // the carbon is sp3 (not vinylic or aryl)
)

// Has reports whether all bits of g are set.
func (f Flag) Has(g Flag) bool { return f&g == g }

// Beta is a carbon next to the reacting carbon, for elimination.
type Beta struct {
	Atom int
	H    int // hydrogens on it
	// AntiH counts hydrogens that can be anti-periplanar to the leaving
	// group. On a ring only a hydrogen trans to the leaving group can;
	// -1 means every hydrogen can (open chain) or it cannot be decided
	// (configuration not written).
	AntiH int
	// TransH is the hydrogen reference (an atom, or molecule.Implicit)
	// that is trans to the leaving group on a ring when it could be
	// decided; -2 when not decided.
	TransH    int
	InRing    bool // the α–β bond is a ring bond
	Undecided bool // a ring β-carbon whose anti hydrogens could not be decided from the written configuration
	// Substituents is the number of carbons on the alkene formed by
	// removing a hydrogen here (Zaitsev's count).
	Substituents int
	Conjugated   bool // the alkene would be conjugated with an aryl ring, C=C or C=O
	Acidified    bool // a halogen or acyl group on the β-carbon makes its hydrogen acidic
	Leaving      *LeavingGroup
}

// Site is one carbon bearing a leaving group.
type Site struct {
	Carbon   int
	Leaving  LeavingGroup
	Degree   Degree
	Flags    Flag
	RingSize int // smallest ring through the carbon, 0 when none
	Aryls    int // aromatic carbons bonded to the carbon
	Beta     []Beta
	// Rank orders the sites of one substrate: higher reacts first by SN2
	// (log10 of the relative rate, from the leaving group and the class).
	Rank float64
}

// BetaH counts all hydrogens on the β-carbons.
func (s *Site) BetaH() int {
	n := 0
	for _, b := range s.Beta {
		n += b.H
	}
	return n
}

// Substrate is what perception found on a substrate molecule.
type Substrate struct {
	Mol   *molecule.Molecule
	Sites []Site // good leaving groups first, then by Rank
	Rings *Rings
	Sym   []uint64
}

// Good returns the sites whose leaving group does not need activation
// and whose carbon is sp3.
func (s *Substrate) Good() []Site {
	var out []Site
	for _, x := range s.Sites {
		if !x.Leaving.Data.Poor && x.Flags.Has(Sp3) {
			out = append(out, x)
		}
	}
	return out
}

// HasGood reports whether Good would return any site, without making
// the list.
func (s *Substrate) HasGood() bool {
	for _, x := range s.Sites {
		if !x.Leaving.Data.Poor && x.Flags.Has(Sp3) {
			return true
		}
	}
	return false
}

// PerceiveSubstrate finds every carbon of m bearing a leaving group (good,
// poor, and on sp2 carbons for the diagnostics) and describes it.
func PerceiveSubstrate(m *molecule.Molecule) *Substrate {
	r := NewRings(m)
	s := &Substrate{Mol: m, Rings: r, Sym: SymmetryClasses(m)}
	for c, a := range m.Atoms {
		if a.Element != molecule.C || a.Charge != 0 {
			continue
		}
		sp3 := !a.Aromatic && allSingle(m, c)
		for _, e := range m.Edges(c) {
			kind, ok := classifyLeaving(m, r, c, e.Atom)
			if !ok {
				continue
			}
			if !sp3 && !isHalogenOrSulfonate(kind) {
				continue
			}
			lg := LeavingGroup{Kind: kind, Attach: e.Atom, Data: leavingData[kind]}
			lg.InRing = r.Bond[e.Bond]
			if !lg.InRing {
				lg.Atoms = leavingAtoms(m, c, e.Atom)
			}
			site := describe(m, r, s.Sym, c, lg, sp3)
			s.Sites = append(s.Sites, site)
		}
	}
	sort.SliceStable(s.Sites, func(i, j int) bool {
		a, b := s.Sites[i], s.Sites[j]
		ga := !a.Leaving.Data.Poor && a.Flags.Has(Sp3)
		gb := !b.Leaving.Data.Poor && b.Flags.Has(Sp3)
		if ga != gb {
			return ga
		}
		return a.Rank > b.Rank
	})
	return s
}

func isHalogenOrSulfonate(k LeavingKind) bool {
	switch k {
	case Iodide, Bromide, Chloride, Fluoride, Triflate, Tosylate, Mesylate, Nosylate, Brosylate, Sulfonate:
		return true
	}
	return false
}

func describe(m *molecule.Molecule, r *Rings, sym []uint64, c int, lg LeavingGroup, sp3 bool) Site {
	s := Site{Carbon: c, Leaving: lg}
	a := m.Atoms[c]
	if !sp3 {
		if a.Aromatic {
			s.Flags |= Aryl
		} else {
			s.Flags |= Vinylic
		}
		s.Rank = -20
		return s
	}
	s.Flags |= Sp3
	heavy := 0
	for _, e := range m.Edges(c) {
		if e.Atom == lg.Attach || m.Atoms[e.Atom].Element == molecule.H {
			continue
		}
		heavy++
		n := e.Atom
		na := m.Atoms[n]
		switch na.Element {
		case molecule.C:
			if na.Aromatic {
				s.Flags |= Benzylic
				s.Aryls++
			}
			for _, f := range m.Edges(n) {
				if f.Atom == c {
					continue
				}
				b := m.Bonds[f.Bond]
				fe := m.Atoms[f.Atom].Element
				switch {
				case b.Order == 2 && !b.Aromatic && fe == molecule.C:
					s.Flags |= Allylic
				case b.Order == 3 && fe == molecule.C:
					s.Flags |= Propargylic
				case b.Order == 2 && (fe == molecule.O || fe == molecule.S) && !b.Aromatic:
					s.Flags |= AlphaCarbonyl
				case b.Order == 3 && fe == molecule.N:
					s.Flags |= AlphaCarbonyl
				}
			}
		case molecule.O, molecule.N, molecule.S:
			if na.Element == molecule.S && hasDoubleO(m, n) {
				s.Flags |= AlphaCarbonyl
			} else if !na.Aromatic {
				s.Flags |= AlphaHetero
			}
		}
	}
	switch {
	case heavy == 0:
		s.Degree = Methyl
	case heavy == 1:
		s.Degree = Primary
	case heavy == 2:
		s.Degree = Secondary
	default:
		s.Degree = Tertiary
	}
	if r.InRing(c) {
		s.Flags |= InRing
		s.RingSize = r.SmallestRing(c)
		// The strain of an epoxide is what makes it react: its own ring
		// does not count as a small-ring penalty.
		ownRing := lg.InRing && r.SmallestRingBond(c, lg.Attach) == s.RingSize
		if s.RingSize > 0 && s.RingSize <= 4 && !ownRing {
			s.Flags |= SmallRing
		}
		if r.Bridgehead(c) {
			s.Flags |= Bridgehead
		}
	}
	if TetrahedralAt(m, c) >= 0 {
		s.Flags |= Stereo
	} else if sym != nil && stereocentre(m, sym, c) {
		s.Flags |= NoStereo
	}
	s.Beta = betas(m, r, c, lg)
	if s.Degree == Primary || s.Degree == Secondary {
		for _, e := range m.Edges(c) {
			if e.Atom == lg.Attach || m.Atoms[e.Atom].Element != molecule.C || m.Atoms[e.Atom].Aromatic {
				continue
			}
			carbons := 0
			for _, f := range m.Edges(e.Atom) {
				if f.Atom != c && m.Atoms[f.Atom].Element == molecule.C {
					carbons++
				}
			}
			if carbons >= 3 && m.HydrogenCount(e.Atom) == 0 {
				s.Flags |= Neopentyl
			} else if carbons >= 2 && allSingle(m, e.Atom) {
				s.Flags |= BetaBranched
			}
		}
	}
	// A sulfur or amine nitrogen two bonds away can displace the leaving
	// group from behind first (mustard-type anchimeric assistance).
	for _, e := range m.Edges(c) {
		if e.Atom == lg.Attach {
			continue
		}
		for _, f := range m.Edges(e.Atom) {
			if f.Atom == c {
				continue
			}
			fa := m.Atoms[f.Atom]
			if fa.Element == molecule.S && fa.Charge == 0 && m.Degree(f.Atom) == 2 && allSingle(m, f.Atom) && !fa.Aromatic {
				s.Flags |= BetaHetero
			}
		}
	}
	s.Rank = siteRank(s)
	return s
}

// siteRank is a rough log10 SN2 rate for ordering several sites of one
// substrate: leaving group plus class, from the same tables the SN2 rules
// use.
func siteRank(s Site) float64 {
	r := s.Leaving.Data.SN2
	if d, ok := ClassRate(s); ok {
		r += d.SN2
	}
	return r
}

// betas lists the β-carbons of c with their hydrogens.
func betas(m *molecule.Molecule, r *Rings, c int, lg LeavingGroup) []Beta {
	var out []Beta
	for _, e := range m.Edges(c) {
		b := e.Atom
		if b == lg.Attach || m.Atoms[b].Element != molecule.C {
			continue
		}
		if m.Atoms[b].Aromatic || !allSingle(m, b) {
			continue
		}
		h := m.HydrogenCount(b)
		beta := Beta{Atom: b, H: h, AntiH: -1, TransH: -2, InRing: r.Bond[e.Bond]}
		if h > 0 {
			beta.Substituents, beta.Conjugated = alkeneSubstitution(m, c, b, lg.Attach)
			for _, f := range m.Edges(b) {
				el := m.Atoms[f.Atom].Element
				if f.Atom == c {
					continue
				}
				if el == molecule.Br || el == molecule.Cl || el == molecule.I {
					beta.Acidified = true
				}
				if ac, su := acylLike(m, f.Atom); ac || su {
					beta.Acidified = true
				}
			}
		}
		if beta.InRing && h > 0 {
			ringAnti(m, c, b, lg, &beta)
			// A double bond inside a three- or four-membered ring is too
			// strained to form by E2 (cyclobutene, azetine: common practice).
			if r.SmallestRingBond(c, b) <= 4 {
				beta.AntiH = 0
			}
		}
		out = append(out, beta)
	}
	return out
}

// alkeneSubstitution counts the carbons that would sit on the C=C formed
// between c and b (leaving group and one hydrogen gone), and whether it
// would be conjugated.
func alkeneSubstitution(m *molecule.Molecule, c, b, attach int) (n int, conj bool) {
	for _, end := range [2]int{c, b} {
		for _, e := range m.Edges(end) {
			if e.Atom == c || e.Atom == b || e.Atom == attach {
				continue
			}
			x := e.Atom
			if m.Atoms[x].Element == molecule.H {
				continue
			}
			if m.Atoms[x].Element == molecule.C {
				n++
			}
			if m.Atoms[x].Aromatic {
				conj = true
			}
			for _, f := range m.Edges(x) {
				if f.Atom == end {
					continue
				}
				if bo := m.Bonds[f.Bond]; bo.Order >= 2 && !bo.Aromatic {
					conj = true
				}
			}
		}
	}
	return n, conj
}

// ringAnti decides which hydrogens of ring β-carbon b can be anti to the
// leaving group on ring carbon c: only those trans across the ring bond
// (the trans-diaxial requirement of cyclohexane E2).
func ringAnti(m *molecule.Molecule, c, b int, lg LeavingGroup, beta *Beta) {
	r := NewRings(m)
	rc := ringNeighbour(m, r, c, b)
	rb := ringNeighbour(m, r, b, c)
	if rc < 0 || rb < 0 {
		beta.Undecided = true
		return
	}
	hs := hydrogenRefs(m, b)
	if len(hs) == 2 {
		// A CH2 always has one hydrogen on each face.
		beta.AntiH = 1
		if TetrahedralAt(m, c) < 0 {
			return
		}
		// Which one is trans can only be named when hydrogens are atoms;
		// with two implicit ones the product does not depend on it.
		return
	}
	if len(hs) != 1 {
		beta.Undecided = true
		return
	}
	if TetrahedralAt(m, c) < 0 || TetrahedralAt(m, b) < 0 {
		beta.Undecided = true
		return
	}
	cis, ok := AntiCis(m, c, lg.Attach, rc, b, hs[0], rb)
	if !ok {
		beta.Undecided = true
		return
	}
	// With the ring neighbours on one side (cis in the Newman sense), the
	// leaving group and the hydrogen are anti, i.e. trans on the ring.
	if cis {
		beta.AntiH = 1
		beta.TransH = hs[0]
	} else {
		beta.AntiH = 0
	}
}

// ringNeighbour returns the ring neighbour of a, other than not, that
// lies on the smallest ring through the bond (a, not).
func ringNeighbour(m *molecule.Molecule, r *Rings, a, not int) int {
	best, bestSize := -1, 0
	for _, e := range m.Edges(a) {
		if e.Atom == not || !r.Bond[e.Bond] {
			continue
		}
		size := r.pathLen(e.Atom, not, e.Bond, 0)
		if size == 0 {
			continue
		}
		if best < 0 || size < bestSize {
			best, bestSize = e.Atom, size
		}
	}
	return best
}

// hydrogenRefs lists the hydrogens of atom a as stereo references:
// explicit hydrogen atoms, then molecule.Implicit per implicit one.
func hydrogenRefs(m *molecule.Molecule, a int) []int {
	var out []int
	for _, e := range m.Edges(a) {
		if m.Atoms[e.Atom].Element == molecule.H {
			out = append(out, e.Atom)
		}
	}
	for range m.Atoms[a].ImplicitH {
		out = append(out, molecule.Implicit)
	}
	return out
}

// HydrogenRefs is the exported form of hydrogenRefs.
func HydrogenRefs(m *molecule.Molecule, a int) []int { return hydrogenRefs(m, a) }

// stereocentre reports whether carbon c has four different substituents
// (by symmetry class; an implicit hydrogen counts as one kind).
func stereocentre(m *molecule.Molecule, sym []uint64, c int) bool {
	refs, ok := Neighbours(m, c)
	if !ok {
		return false
	}
	seen := map[uint64]bool{}
	for _, r := range refs {
		k := uint64(0)
		if r >= 0 {
			if m.Atoms[r].Element == molecule.H {
				k = 0
			} else {
				k = sym[r]
			}
		}
		if seen[k] {
			return false
		}
		seen[k] = true
	}
	return true
}

// Stereocentre is the exported form of stereocentre, computing the
// symmetry classes of m.
func Stereocentre(m *molecule.Molecule, c int) bool { return stereocentre(m, SymmetryClasses(m), c) }
