package perceive

import (
	_ "embed"

	"walden/analyze/molecule"
	"walden/analyze/reagents"
)

//go:embed nucleophiles.tsv
var nucleophileTable string

//go:embed acids.tsv
var acidTable string

// NucKind names a kind of nucleophile or base ("azide", "phenoxide" …).
type NucKind string

// NucData is one row of the nucleophile table.
type NucData struct {
	Kind   NucKind
	PKaH   float64
	N      float64 // Pearson n(CH3I) in methanol
	Bulk   reagents.Bulk
	Soft   bool
	Source string
}

var nucData = func() map[NucKind]NucData {
	out := map[NucKind]NucData{}
	for _, r := range readTSV(nucleophileTable) {
		d := NucData{Kind: NucKind(r["kind"]), Soft: r["soft"] == "yes", Source: r["source"]}
		d.PKaH, _ = num(r["pKaH"])
		d.N, _ = num(r["n"])
		switch r["bulk"] {
		case "moderate":
			d.Bulk = reagents.Moderate
		case "hindered":
			d.Bulk = reagents.Hindered
		}
		out[d.Kind] = d
	}
	return out
}()

// NucleophileData returns the table row for kind k.
func NucleophileData(k NucKind) (NucData, bool) {
	d, ok := nucData[k]
	return d, ok
}

// AcidData is one row of the acid-site table.
type AcidData struct {
	Kind   string
	PKa    float64
	Anion  NucKind
	Source string
}

var acidData = func() map[string]AcidData {
	out := map[string]AcidData{}
	for _, r := range readTSV(acidTable) {
		d := AcidData{Kind: r["kind"], Anion: NucKind(r["anion"]), Source: r["source"]}
		d.PKa, _ = num(r["pKa"])
		out[d.Kind] = d
	}
	return out
}()

// Acid returns the acid-site row for kind k.
func Acid(k string) (AcidData, bool) {
	d, ok := acidData[k]
	return d, ok
}

// Reactant is one reagent of a step as perception sees it: its molecule
// and, when it was named from the dictionary, the entry.
type Reactant struct {
	Mol   *molecule.Molecule
	Entry *reagents.Reagent
	Equiv float64 // 0 when not given
}

// Candidate is one atom of a reagent that could attack carbon.
type Candidate struct {
	Reactant int
	Atom     int
	Kind     NucKind
	Charge   int    // charge of the attacking atom as it reacts
	Acid     string // the acid-site kind it came from when a base removed a proton ("" otherwise)
	AcidPKa  float64
	Data     NucData
}

// Nucleophile is the site that reacts, with what perception learnt.
type Nucleophile struct {
	Candidate
	Deprotonated bool // a base present removed a proton first
	ProtonFrom   int  // the atom that lost the proton (may differ from Atom for an azole anion), -1 when none
	By           int  // reactant index of that base, -1 when none
	Ambident     string
	Alternatives []Candidate // other sites within reach (for the close-sites warning)
	Neutral      bool        // attacks as a neutral species
	OverAlkylate bool        // neutral ammonia or amine with N–H: the product amine can react again
	FromSolvent  bool        // the solvent itself (solvolysis)
}

// Base is the strongest base present.
type Base struct {
	Reactant int
	Atom     int
	Kind     NucKind
	PKaH     float64
	Bulk     reagents.Bulk
	Anionic  bool
	Data     NucData
}

// Reagents is what perception found among the reagents of a step.
type Reagents struct {
	Nucleophile *Nucleophile // nil when none
	Base        *Base        // nil when none
	Candidates  []Candidate  // every site considered, best first
	Silver      bool         // a silver salt is present (ambident cyanide and nitrite attack by N / halide abstraction)
	Crown       bool         // a crown ether or phase-transfer catalyst is present
	Ionic       []int        // reactants that are salts
}

// acidSites finds X–H groups of m a base could remove.
func acidSites(m *molecule.Molecule, r *Rings) []Candidate {
	var out []Candidate
	// A molecule that is already an anion is not deprotonated again.
	comp, _ := m.Components()
	net := map[int]int{}
	for i, a := range m.Atoms {
		net[comp[i]] += a.Charge
	}
	for i, a := range m.Atoms {
		if net[comp[i]] < 0 {
			continue
		}
		if a.Charge != 0 || m.HydrogenCount(i) == 0 {
			continue
		}
		kind := ""
		switch a.Element {
		case molecule.O:
			kind = oxygenAcid(m, i)
		case molecule.S:
			if m.Degree(i) == 1 && allSingle(m, i) {
				if m.Atoms[m.Edges(i)[0].Atom].Aromatic {
					kind = "thiophenol"
				} else {
					kind = "thiol"
				}
			}
		case molecule.N:
			kind = nitrogenAcid(m, r, i)
		case molecule.C:
			kind = carbonAcid(m, i)
		}
		if kind == "" {
			continue
		}
		d := acidData[kind]
		out = append(out, Candidate{Atom: i, Kind: d.Anion, Charge: -1, Acid: kind, AcidPKa: d.PKa, Data: nucData[d.Anion]})
	}
	return out
}

func oxygenAcid(m *molecule.Molecule, o int) string {
	if !allSingle(m, o) {
		return ""
	}
	if m.Degree(o) == 0 {
		return "water"
	}
	if m.Degree(o) != 1 {
		return ""
	}
	n := m.Edges(o)[0].Atom
	na := m.Atoms[n]
	switch {
	case na.Element == molecule.N && m.HydrogenCount(o) == 1:
		return "oxime"
	case na.Element == molecule.C && hasDoubleO(m, n):
		return "carboxylic-acid"
	case na.Element == molecule.C && na.Aromatic:
		return "phenol"
	case na.Element == molecule.C && allSingle(m, n):
		return "alcohol"
	}
	return ""
}

func acylLike(m *molecule.Molecule, x int) (acyl, sulfonyl bool) {
	switch m.Atoms[x].Element {
	case molecule.C:
		for _, e := range m.Edges(x) {
			el := m.Atoms[e.Atom].Element
			if m.Bonds[e.Bond].Order == 2 && !m.Bonds[e.Bond].Aromatic && (el == molecule.O || el == molecule.S) {
				return true, false
			}
		}
	case molecule.S:
		if hasDoubleO(m, x) {
			return false, true
		}
	}
	return false, false
}

func nitrogenAcid(m *molecule.Molecule, r *Rings, n int) string {
	a := m.Atoms[n]
	if a.Aromatic {
		size := r.SmallestRing(n)
		ringN := 0
		carbonyl := false
		for _, x := range ringAtoms(m, r, n, size) {
			if m.Atoms[x].Element == molecule.N {
				ringN++
			}
		}
		for _, e := range m.Edges(n) {
			if ac, _ := acylLike(m, e.Atom); ac {
				carbonyl = true
			}
		}
		switch {
		case carbonyl:
			return "lactam-aromatic"
		case size != 5:
			return ""
		case ringN >= 4:
			return "tetrazole"
		case ringN == 3:
			return "triazole"
		case ringN == 2:
			for _, e := range m.Edges(n) {
				if m.Atoms[e.Atom].Element == molecule.N {
					if fusedBenzo(m, r, n) {
						return "indazole"
					}
					return "pyrazole"
				}
			}
			if fusedBenzo(m, r, n) {
				return "benzimidazole"
			}
			return "imidazole"
		default:
			if fusedBenzo(m, r, n) {
				return "indole"
			}
			return "pyrrole"
		}
	}
	acyl, sulf := 0, 0
	arylN := false
	for _, e := range m.Edges(n) {
		if m.Bonds[e.Bond].Order != 1 {
			return ""
		}
		ac, su := acylLike(m, e.Atom)
		if ac {
			acyl++
		}
		if su {
			sulf++
		}
		if m.Atoms[e.Atom].Aromatic {
			arylN = true
		}
	}
	switch {
	case sulf > 0:
		return "sulfonamide"
	case acyl >= 2:
		return "imide"
	case acyl == 1 && arylN:
		return "anilide"
	case acyl == 1:
		return "amide"
	case arylN:
		return "aniline"
	}
	return "amine"
}

func fusedBenzo(m *molecule.Molecule, r *Rings, n int) bool {
	for _, x := range ringAtoms(m, r, n, 5) {
		if r.RingDegree(x) >= 3 {
			return true
		}
	}
	return false
}

// ringAtoms returns atoms within size/2 ring bonds of a (a rough ring
// neighbourhood, enough to count ring heteroatoms of small rings).
func ringAtoms(m *molecule.Molecule, r *Rings, a, size int) []int {
	depth := map[int]int{a: 0}
	out := []int{a}
	queue := []int{a}
	for len(queue) > 0 {
		x := queue[0]
		queue = queue[1:]
		if depth[x] >= size/2 {
			continue
		}
		for _, e := range m.Edges(x) {
			if !r.Bond[e.Bond] || !m.Atoms[e.Atom].Aromatic {
				continue
			}
			if _, ok := depth[e.Atom]; !ok {
				depth[e.Atom] = depth[x] + 1
				out = append(out, e.Atom)
				queue = append(queue, e.Atom)
			}
		}
	}
	return out
}

func carbonAcid(m *molecule.Molecule, c int) string {
	a := m.Atoms[c]
	if a.Aromatic {
		return ""
	}
	for _, e := range m.Edges(c) {
		if m.Bonds[e.Bond].Order == 3 && m.Atoms[e.Atom].Element == molecule.C {
			return "alkyne"
		}
	}
	if !allSingle(m, c) {
		return ""
	}
	ewg, nitro, nitrile := 0, false, false
	for _, e := range m.Edges(c) {
		x := e.Atom
		if ac, su := acylLike(m, x); ac || su {
			ewg++
		}
		if m.Atoms[x].Element == molecule.N && m.Atoms[x].Charge == 1 {
			nitro = true
			ewg++
		}
		if m.Atoms[x].Element == molecule.C {
			for _, f := range m.Edges(x) {
				if m.Bonds[f.Bond].Order == 3 && m.Atoms[f.Atom].Element == molecule.N {
					nitrile = true
					ewg++
				}
			}
		}
	}
	switch {
	case ewg >= 2:
		return "dicarbonyl"
	case nitro:
		return "nitroalkane"
	case nitrile:
		return "nitrile-alpha"
	case ewg == 1:
		return "ketone-alpha"
	}
	return ""
}

// intrinsicSites finds atoms that attack as they are: anions, and neutral
// atoms with a lone pair (amines, pyridine-type nitrogen, water,
// alcohols, phosphines, sulfur).
func intrinsicSites(m *molecule.Molecule, r *Rings) []Candidate {
	var out []Candidate
	for i, a := range m.Atoms {
		kind := NucKind("")
		switch {
		case a.Charge < 0:
			kind = anionKind(m, i)
		case a.Charge == 0:
			kind = neutralKind(m, r, i)
		}
		if kind == "" {
			continue
		}
		d := nucData[kind]
		out = append(out, Candidate{Atom: i, Kind: kind, Charge: a.Charge, Data: d})
	}
	return out
}

// HalideKind is the nucleophile kind of the halide ion of el; "" when el
// is not a halogen.
func HalideKind(el molecule.Element) NucKind {
	switch el {
	case molecule.I:
		return "iodide"
	case molecule.Br:
		return "bromide"
	case molecule.Cl:
		return "chloride"
	case molecule.F:
		return "fluoride"
	}
	return ""
}

func anionKind(m *molecule.Molecule, i int) NucKind {
	a := m.Atoms[i]
	deg := m.Degree(i)
	if k := HalideKind(a.Element); k != "" {
		return k
	}
	switch a.Element {
	case molecule.H:
		return "hydride"
	case molecule.O:
		if deg == 0 {
			return "hydroxide"
		}
		n := m.Edges(i)[0].Atom
		na := m.Atoms[n]
		switch {
		case na.Element == molecule.N && na.Charge == 1:
			return "" // nitro group oxygen
		case na.Element == molecule.N:
			return "nitrite"
		case na.Element == molecule.S || na.Element == molecule.P:
			return "sulfonate"
		case na.Element == molecule.C && hasDoubleO(m, n):
			if isCarbonate(m, n) {
				return "carbonate"
			}
			return "carboxylate"
		case na.Element == molecule.C && na.Aromatic:
			return "phenoxide"
		case na.Element == molecule.C:
			switch carbonsOn(m, n) {
			case 3:
				return "alkoxide-tertiary"
			case 2:
				return "alkoxide-secondary"
			}
			return "alkoxide"
		}
	case molecule.S:
		if deg == 0 {
			return "hydrosulfide"
		}
		n := m.Edges(i)[0].Atom
		if m.Atoms[n].Element == molecule.C && m.Bonds[m.Edges(i)[0].Bond].Order == 3 {
			return ""
		}
		if m.Atoms[n].Element == molecule.C && m.Atoms[n].Aromatic {
			return "thiophenoxide"
		}
		if m.Atoms[n].Element == molecule.C {
			for _, e := range m.Edges(n) {
				if m.Bonds[e.Bond].Order == 3 {
					return "thiocyanate"
				}
			}
		}
		return "thiolate"
	case molecule.N:
		// Azide: terminal N of N=N+=N-.
		for _, e := range m.Edges(i) {
			if m.Atoms[e.Atom].Element == molecule.N && m.Atoms[e.Atom].Charge == 1 {
				return "azide"
			}
		}
		for _, e := range m.Edges(i) {
			if m.Atoms[e.Atom].Element == molecule.Si {
				return "silylamide"
			}
		}
		if a.Aromatic {
			return "azolide"
		}
		if carbonsOnN(m, i) >= 2 {
			for _, e := range m.Edges(i) {
				if ac, su := acylLike(m, e.Atom); ac || su {
					return "amidate"
				}
			}
			return "amide-base"
		}
		return "amidate"
	case molecule.C:
		for _, e := range m.Edges(i) {
			if m.Bonds[e.Bond].Order == 3 && m.Atoms[e.Atom].Element == molecule.N {
				return "cyanide"
			}
			if m.Bonds[e.Bond].Order == 3 {
				return "acetylide"
			}
		}
		for _, e := range m.Edges(i) {
			if ac, su := acylLike(m, e.Atom); ac || su {
				return "enolate"
			}
		}
		return "carbanion"
	}
	return ""
}

func isCarbonate(m *molecule.Molecule, c int) bool {
	o := 0
	for _, e := range m.Edges(c) {
		if m.Atoms[e.Atom].Element == molecule.O {
			o++
		}
	}
	return o == 3
}

func carbonsOn(m *molecule.Molecule, c int) int {
	n := 0
	for _, e := range m.Edges(c) {
		if m.Atoms[e.Atom].Element == molecule.C {
			n++
		}
	}
	return n
}

func carbonsOnN(m *molecule.Molecule, n int) int { return carbonsOn(m, n) }

func neutralKind(m *molecule.Molecule, r *Rings, i int) NucKind {
	a := m.Atoms[i]
	h := m.HydrogenCount(i)
	switch a.Element {
	case molecule.N:
		if a.Aromatic {
			if h == 0 && m.Degree(i) == 2 {
				if r.SmallestRing(i) == 5 {
					return "azole"
				}
				return "pyridine"
			}
			return ""
		}
		if !allSingle(m, i) {
			return ""
		}
		aryl := false
		for _, e := range m.Edges(i) {
			if ac, su := acylLike(m, e.Atom); ac || su {
				return "amide"
			}
			if m.Atoms[e.Atom].Aromatic || !allSingle(m, e.Atom) {
				aryl = true
			}
			if el := m.Atoms[e.Atom].Element; (el == molecule.N || el == molecule.O) && h > 0 {
				return "hydrazine"
			}
			if m.Atoms[e.Atom].Element != molecule.C && m.Atoms[e.Atom].Element != molecule.H {
				return ""
			}
		}
		if aryl {
			for _, e := range m.Edges(i) {
				for _, f := range m.Edges(e.Atom) {
					if m.Bonds[f.Bond].Order == 2 && !m.Bonds[f.Bond].Aromatic && m.Atoms[f.Atom].Element == molecule.N {
						return "amidine"
					}
				}
			}
			return "aniline"
		}
		switch m.Degree(i) {
		case 0:
			return "ammonia"
		case 1:
			return "amine-primary"
		case 2:
			return "amine-secondary"
		default:
			if hinderedAmine(m, i) {
				return "amine-hindered"
			}
			return "amine-tertiary"
		}
	case molecule.O:
		if h == 2 && m.Degree(i) == 0 {
			return "water"
		}
		if !allSingle(m, i) || h == 0 {
			return ""
		}
		switch oxygenAcid(m, i) {
		case "alcohol":
			return "alcohol"
		case "phenol":
			return "phenol"
		case "carboxylic-acid":
			return "carboxylic-acid"
		}
	case molecule.S:
		if m.Degree(i) == 1 && !allSingle(m, i) {
			n := m.Edges(i)[0]
			if m.Bonds[n.Bond].Order == 2 && m.Atoms[n.Atom].Element == molecule.C {
				return "thiourea"
			}
		}
		if !allSingle(m, i) || a.Aromatic {
			return ""
		}
		if h == 1 {
			return "thiol"
		}
		if m.Degree(i) == 2 {
			return "thioether"
		}
		if m.Degree(i) == 1 {
			// Thiourea and thioamide sulfur (C=S).
			return ""
		}
	case molecule.P:
		if m.Degree(i) == 3 && allSingle(m, i) {
			return "phosphine"
		}
	}
	return ""
}

// hinderedAmine: a tertiary amine with two or more branched (secondary
// or tertiary) carbons on N, as in Hünig's base.
func hinderedAmine(m *molecule.Molecule, n int) bool {
	branched := 0
	for _, e := range m.Edges(n) {
		if carbonsOn(m, e.Atom) >= 3 {
			branched++
		}
	}
	return branched >= 2
}

// AcidSites lists the X–H groups of m a base could remove, with the pKa
// of each (from the acid-site table).
func AcidSites(m *molecule.Molecule) []Candidate { return acidSites(m, NewRings(m)) }
