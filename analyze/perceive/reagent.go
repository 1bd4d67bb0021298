package perceive

import (
	"sort"

	"walden/analyze/molecule"
	"walden/analyze/reagents"
)

// deprotonationWindow is how far (pKa units) above a base's pKaH an acid
// site may lie and still be alkylated through its anion: carbonates in
// DMF alkylate azoles and indoles (pKa 14-16) although the equilibrium lies on the acid
// side, because the anion is consumed as it forms (common practice).
const deprotonationWindow = 6.0 // N–H acids

// oxygenWindow is the reach for O–H, S–H and C–H acids: carbonates
// alkylate phenols and thiols but not alcohols (common practice).
const oxygenWindow = 4.0

// neutralBaseWindow is the same reach for neutral amine bases, which only
// shift an equilibrium (Et3N with phenols, not with alcohols).
const neutralBaseWindow = 2.0

// notNucleophiles are kinds that act only as bases or spectators.
var notNucleophiles = map[NucKind]bool{
	"hydride": true, "amide-base": true, "silylamide": true, "sulfonate": true,
	"carbonate": true, "bicarbonate": true, "phosphate": true, "amidine": true,
}

// PerceiveReagents finds the nucleophile and the strongest base among the
// reactants. A base removes the most acidic proton of another reactant
// (or of the same one) when its conjugate acid is weaker by no more than
// the deprotonation window; the anion formed then attacks.
func PerceiveReagents(rs []Reactant) Reagents {
	var out Reagents
	var intrinsic, acids []Candidate
	for i, r := range rs {
		if r.Mol == nil {
			continue
		}
		m := r.Mol
		ring := NewRings(m)
		for j, a := range m.Atoms {
			if isAlkali(a.Element) && a.Charge == 0 && m.Degree(j) == 0 {
				// A bare alkali metal deprotonates N–H and O–H acids
				// (potassium on phthalimide: common practice).
				d := nucData["hydride"]
				intrinsic = append(intrinsic, Candidate{Reactant: i, Atom: j, Kind: "hydride", Charge: -1, Data: d})
			}
		}
		ionic := false
		for _, a := range m.Atoms {
			switch a.Element {
			case 47: // silver
				out.Silver = true
			}
			if a.Charge != 0 {
				ionic = true
			}
		}
		if ionic && hasMetal(m) {
			out.Ionic = append(out.Ionic, i)
		}
		if isCrown(m, ring) || isQuat(m) {
			out.Crown = true
			continue
		}
		// The entry's values describe the reagent's nucleophilic atom,
		// which is its best site by the table: giving them to every site
		// would let thiourea's NH2 groups tie with its sulfur (thiourea
		// alkylates on S to the isothiouronium salt: Urquhart, Gates,
		// Connor, Org. Synth. 1941, 21, 36, from memory).
		sites := intrinsicSites(m, ring)
		best := -1
		for k, c := range sites {
			if best < 0 || c.Data.N > sites[best].Data.N {
				best = k
			}
		}
		for k, c := range sites {
			c.Reactant = i
			if k == best {
				c.Data = withEntry(c.Data, r.Entry, m, c.Atom)
			}
			intrinsic = append(intrinsic, c)
		}
		for _, c := range acidSites(m, ring) {
			c.Reactant = i
			acids = append(acids, c)
		}
	}
	// The strongest base present (anions first, then neutral amines).
	for _, c := range intrinsic {
		if c.Kind == "" {
			continue
		}
		if c.Charge >= 0 && !isAmine(c.Kind) && c.Kind != "amidine" {
			continue
		}
		b := &Base{Reactant: c.Reactant, Atom: c.Atom, Kind: c.Kind, PKaH: c.Data.PKaH, Bulk: c.Data.Bulk, Anionic: c.Charge < 0, Data: c.Data}
		if out.Base == nil || b.PKaH > out.Base.PKaH {
			out.Base = b
		}
	}
	// Amidines such as DBU: the sp2 nitrogen is the basic site.
	for i, r := range rs {
		if r.Mol == nil {
			continue
		}
		if r.Entry != nil && r.Entry.Roles&reagents.Base != 0 && r.Entry.PKaH.Known && (out.Base == nil || r.Entry.PKaH.V > out.Base.PKaH) {
			out.Base = &Base{Reactant: i, Atom: -1, Kind: "amidine", PKaH: r.Entry.PKaH.V, Bulk: r.Entry.Bulk, Data: nucData["amidine"]}
		} else if isAmidine(r.Mol) && (out.Base == nil || nucData["amidine"].PKaH > out.Base.PKaH) {
			d := nucData["amidine"]
			out.Base = &Base{Reactant: i, Atom: -1, Kind: "amidine", PKaH: d.PKaH, Bulk: d.Bulk, Data: d}
		}
	}
	var cands []Candidate
	for _, c := range intrinsic {
		if !notNucleophiles[c.Kind] {
			cands = append(cands, c)
		}
	}
	deprot := map[int]bool{}
	if out.Base != nil {
		// Each reactant's most acidic site within reach becomes an anion.
		best := map[int]int{}
		window := deprotonationWindow
		if !out.Base.Anionic {
			window = neutralBaseWindow
		}
		for k, a := range acids {
			reach := window
			if rs[a.Reactant].Mol.Atoms[a.Atom].Element != molecule.N && reach > oxygenWindow {
				reach = oxygenWindow
			}
			if a.Acid == "amine" {
				reach = 0 // only organolithium bases make amide anions (LDA): common practice
			}
			if a.AcidPKa > out.Base.PKaH+reach {
				continue
			}
			if a.Reactant == out.Base.Reactant && a.Atom == out.Base.Atom {
				continue
			}
			if j, ok := best[a.Reactant]; !ok || a.AcidPKa < acids[j].AcidPKa {
				best[a.Reactant] = k
			}
		}
		for r, k := range best {
			a := acids[k]
			deprot[r] = true
			cands = append(cands, a)
			// Other sites of the same molecule as acidic as the best one
			// (within one unit) are close competitors. A carboxylate is
			// so weak a nucleophile that the next acid site within reach
			// (a phenol, a thiol) reacts instead (common practice).
			next := -1
			for j, o := range acids {
				if j == k || o.Reactant != r || o.Acid == "amine" || o.AcidPKa > out.Base.PKaH+window {
					continue
				}
				if o.AcidPKa <= a.AcidPKa+1 {
					cands = append(cands, o)
				} else if a.Acid == "carboxylic-acid" && o.AcidPKa <= 11 && (next < 0 || o.AcidPKa < acids[next].AcidPKa) {
					next = j
				}
			}
			if next >= 0 {
				cands = append(cands, acids[next])
			}
		}
	}
	// A base that deprotonated another reagent is spent doing so (about
	// one equivalent): it no longer competes as a nucleophile.
	if len(deprot) > 0 && out.Base != nil {
		kept := cands[:0]
		for _, c := range cands {
			if c.Reactant == out.Base.Reactant && c.Atom == out.Base.Atom && !deprot[c.Reactant] {
				continue
			}
			kept = append(kept, c)
		}
		cands = kept
	}
	// Iodide and bromide salts beside another nucleophile are catalysts
	// (in situ Finkelstein exchange), not the nucleophile of the step
	// (common practice).
	other := false
	for _, c := range cands {
		if !halideKinds[c.Kind] && c.Data.N >= 2 {
			other = true
		}
	}
	if other {
		kept := cands[:0]
		for _, c := range cands {
			if !halideKinds[c.Kind] {
				kept = append(kept, c)
			}
		}
		cands = kept
	}
	// Tertiary amines, amidines and pyridines added beside another
	// nucleophile serve as bases, not as nucleophiles (common practice).
	otherNu := map[int]bool{}
	for _, c := range cands {
		if !auxiliaryBase(c.Kind) && c.Data.N >= 3 {
			otherNu[c.Reactant] = true
		}
	}
	if len(otherNu) > 0 {
		kept := cands[:0]
		for _, c := range cands {
			if auxiliaryBase(c.Kind) && !otherNu[c.Reactant] && len(otherNu) > 0 {
				continue
			}
			kept = append(kept, c)
		}
		cands = kept
	}
	// In a molecule carrying an anion, its neutral sites do not compete.
	anionIn := map[int]bool{}
	for _, c := range cands {
		if c.Charge < 0 {
			anionIn[c.Reactant] = true
		}
	}
	filtered := cands[:0]
	for _, c := range cands {
		if c.Charge == 0 && anionIn[c.Reactant] && c.Acid == "" {
			continue
		}
		filtered = append(filtered, c)
	}
	cands = filtered
	// The most nucleophilic site reacts: anions formed by the base and
	// neutral amines compete on Pearson n (excess carbonate deprotonates
	// every site within reach: common practice).
	sort.SliceStable(cands, func(i, j int) bool {
		a, b := cands[i], cands[j]
		if a.Data.N != b.Data.N {
			return a.Data.N > b.Data.N
		}
		if (a.Charge < 0) != (b.Charge < 0) {
			return a.Charge < 0
		}
		return a.AcidPKa < b.AcidPKa
	})
	out.Candidates = cands
	if len(cands) == 0 {
		return out
	}
	best := cands[0]
	nu := &Nucleophile{Candidate: best, By: -1, Neutral: best.Charge == 0, ProtonFrom: -1}
	if best.Acid != "" {
		nu.Deprotonated = true
		nu.By = out.Base.Reactant
		nu.ProtonFrom = best.Atom
		// The base is spent making the anion, which is then the base of
		// the step (NaH, carbonates and amide bases are used this way:
		// common practice).
		out.Base = &Base{Reactant: best.Reactant, Atom: best.Atom, Kind: best.Kind, PKaH: best.AcidPKa, Bulk: best.Data.Bulk, Anionic: true, Data: best.Data}
	}
	m := rs[best.Reactant].Mol
	switch best.Kind {
	case "cyanide":
		nu.Ambident = "cyanide attacks through carbon with alkali-metal salts (nitrile) and through nitrogen with silver cyanide (isocyanide)"
		if out.Silver {
			nu.Atom = farEnd(m, best.Atom)
		}
	case "nitrite":
		nu.Ambident = "nitrite attacks through nitrogen (nitroalkane) or oxygen (alkyl nitrite); both form"
		nu.Atom = m.Edges(best.Atom)[0].Atom
	case "enolate":
		nu.Ambident = "enolates attack soft alkyl halides mainly through carbon; O-alkylation is the minor path"
	case "azolide":
		// Benzo-fused azoles (indazole N1, benzimidazole) and lactam-type
		// N–H alkylate at the nitrogen that bore the hydrogen; simple
		// azoles at the less hindered nitrogen (common practice).
		if best.Acid == "pyrazole" || best.Acid == "imidazole" || best.Acid == "triazole" {
			nu.Atom = leastHinderedRingN(m, best.Atom)
		}
		if nu.Atom != best.Atom {
			nu.Ambident = "the azole anion can attack through either ring nitrogen; the less hindered one is taken"
		}
	}
	if best.Charge == 0 && m.HydrogenCount(best.Atom) > 0 && (best.Kind == "ammonia" || best.Kind == "amine-primary" || best.Kind == "amine-secondary") {
		nu.OverAlkylate = true
	}
	for _, c := range cands[1:] {
		if c.Reactant == best.Reactant && c.Atom != best.Atom && c.Charge == best.Charge && best.Data.N-c.Data.N < 0.5 && (c.Acid == "" || best.Acid == "" || c.AcidPKa-best.AcidPKa < 1) {
			nu.Alternatives = append(nu.Alternatives, c)
		}
	}
	out.Nucleophile = nu
	return out
}

// withEntry lets a dictionary entry's own values override the table's
// when the entry describes this molecule's active species.
func withEntry(d NucData, e *reagents.Reagent, m *molecule.Molecule, atom int) NucData {
	if e == nil {
		return d
	}
	if e.PKaH.Known {
		d.PKaH = e.PKaH.V
		d.Source = e.PKaH.Source
	}
	if e.Nucleo.Known {
		d.N = e.Nucleo.V
		d.Source = e.Nucleo.Source
	}
	if e.Bulk > d.Bulk {
		d.Bulk = e.Bulk
	}
	return d
}

// auxiliaryBase: kinds used as added bases (Et3N, DIPEA, DBU, pyridine).
func auxiliaryBase(k NucKind) bool {
	switch k {
	case "amine-tertiary", "amine-hindered", "pyridine", "amidine":
		return true
	}
	return false
}

var halideKinds = map[NucKind]bool{"iodide": true, "bromide": true, "chloride": true}

func isAmine(k NucKind) bool {
	switch k {
	case "ammonia", "amine-primary", "amine-secondary", "amine-tertiary", "amine-hindered", "pyridine", "azole":
		return true
	}
	return false
}

func isAlkali(e molecule.Element) bool {
	switch e {
	case 3, 11, 19, 37, 55:
		return true
	}
	return false
}

// Ionise returns m with every bond between an alkali or alkaline-earth
// metal and another atom written as ions (N#C[Na] → N#[C-].[Na+]), so
// that salts drawn with covalent metal bonds are read like salts. It
// returns m itself when there is nothing to change.
func Ionise(m *molecule.Molecule) *molecule.Molecule {
	metal := func(e molecule.Element) bool { return isAlkali(e) || e == 12 || e == 20 || e == 30 }
	need := false
	for _, b := range m.Bonds {
		if metal(m.Atoms[b.A].Element) != metal(m.Atoms[b.B].Element) {
			need = true
		}
	}
	if !need {
		return m
	}
	out := &molecule.Molecule{}
	for _, a := range m.Atoms {
		out.AddAtom(a)
	}
	for _, b := range m.Bonds {
		ma, mb := metal(m.Atoms[b.A].Element), metal(m.Atoms[b.B].Element)
		if ma == mb {
			out.AddBond(b)
			continue
		}
		mi, x := b.A, b.B
		if mb {
			mi, x = b.B, b.A
		}
		out.Atoms[mi].Charge++
		out.Atoms[mi].Bracket = true
		out.Atoms[x].Charge--
		out.Atoms[x].Bracket = true
	}
	out.Tetrahedral = m.Tetrahedral
	out.CisTrans = m.CisTrans
	return out
}

func hasMetal(m *molecule.Molecule) bool {
	for _, a := range m.Atoms {
		switch a.Element {
		case 3, 11, 19, 37, 55, 12, 20, 47, 30, 29, 38, 56:
			return true
		}
	}
	return false
}

// isCrown spots a crown ether: a ring of twelve or more atoms with four
// or more oxygens.
func isCrown(m *molecule.Molecule, r *Rings) bool {
	o := 0
	for i, a := range m.Atoms {
		if a.Element == molecule.O && r.InRing(i) && r.SmallestRing(i) >= 12 {
			o++
		}
	}
	return o >= 4
}

// isQuat spots a tetraalkylammonium salt used as a phase-transfer
// catalyst (at least twelve carbons on N+).
func isQuat(m *molecule.Molecule) bool {
	for i, a := range m.Atoms {
		if a.Element == molecule.N && a.Charge == 1 && m.Degree(i) == 4 && m.HydrogenCount(i) == 0 {
			c := 0
			for _, x := range m.Atoms {
				if x.Element == molecule.C {
					c++
				}
			}
			return c >= 12
		}
	}
	return false
}

func isAmidine(m *molecule.Molecule) bool {
	for i, a := range m.Atoms {
		if a.Element != molecule.N || a.Aromatic || a.Charge != 0 {
			continue
		}
		for _, e := range m.Edges(i) {
			if m.Bonds[e.Bond].Order == 2 && m.Atoms[e.Atom].Element == molecule.C {
				for _, f := range m.Edges(e.Atom) {
					if f.Atom != i && m.Atoms[f.Atom].Element == molecule.N && m.Bonds[f.Bond].Order == 1 && m.HydrogenCount(f.Atom) == 0 {
						return true
					}
				}
			}
		}
	}
	return false
}

// farEnd returns the atom at the other end of a's triple bond (the N of
// cyanide).
func farEnd(m *molecule.Molecule, a int) int {
	for _, e := range m.Edges(a) {
		if m.Bonds[e.Bond].Order == 3 {
			return e.Atom
		}
	}
	return a
}

// leastHinderedRingN picks, among the nitrogen n of an azole anion and
// the ring nitrogens next to it or one further, the one whose ring
// neighbours carry the fewest heavy substituents. Ties keep n.
func leastHinderedRingN(m *molecule.Molecule, n int) int {
	r := NewRings(m)
	best, bestH := n, hindrance(m, r, n)
	for _, x := range ringAtoms(m, r, n, 5) {
		if x == n || m.Atoms[x].Element != molecule.N || m.HydrogenCount(x) > 0 || m.Degree(x) != 2 {
			continue
		}
		if h := hindrance(m, r, x); h < bestH {
			best, bestH = x, h
		}
	}
	return best
}

func hindrance(m *molecule.Molecule, r *Rings, n int) int {
	h := 0
	for _, e := range m.Edges(n) {
		for _, f := range m.Edges(e.Atom) {
			if f.Atom != n && !r.Bond[f.Bond] && m.Atoms[f.Atom].Element != molecule.H {
				h++
			}
		}
		if r.RingDegree(e.Atom) >= 3 {
			h++
		}
	}
	return h
}
