package perceive

import (
	_ "embed"

	"walden/analyze/molecule"
)

//go:embed leaving_groups.tsv
var leavingTable string

// LeavingKind names a kind of leaving group by the short form chemists
// write ("Br", "OTs", "OH2+" …).
type LeavingKind string

// Leaving-group kinds the perception recognises.
const (
	Iodide      LeavingKind = "I"
	Bromide     LeavingKind = "Br"
	Chloride    LeavingKind = "Cl"
	Fluoride    LeavingKind = "F"
	Triflate    LeavingKind = "OTf"
	Nosylate    LeavingKind = "ONs"
	Brosylate   LeavingKind = "OBs"
	Tosylate    LeavingKind = "OTs"
	Mesylate    LeavingKind = "OMs"
	Sulfonate   LeavingKind = "OSO2R"
	Sulfate     LeavingKind = "OSO3R"
	Oxonium     LeavingKind = "OH2+"
	Phosphonium LeavingKind = "OP+"
	Ammonium    LeavingKind = "NR3+"
	Sulfonium   LeavingKind = "SR2+"
	Epoxide     LeavingKind = "epoxide"
	Hydroxyl    LeavingKind = "OH"
	Alkoxy      LeavingKind = "OR"
	Carboxylate LeavingKind = "OC(=O)R"
	Amino       LeavingKind = "NH2"
)

// LeavingData is one row of the leaving-group table.
type LeavingData struct {
	Kind LeavingKind
	Name string
	// SN2 and Solvolysis are log10 rates relative to chloride.
	SN2, Solvolysis float64
	PKaH            float64
	PKaHKnown       bool
	Poor            bool // OH, OR, ester O, NH2: needs activation
	Source          string
}

var leavingData = func() map[LeavingKind]LeavingData {
	out := map[LeavingKind]LeavingData{}
	for _, r := range readTSV(leavingTable) {
		d := LeavingData{Kind: LeavingKind(r["kind"]), Name: r["name"], Poor: r["poor"] == "yes", Source: r["source"]}
		d.SN2, _ = num(r["sn2"])
		d.Solvolysis, _ = num(r["solvolysis"])
		d.PKaH, d.PKaHKnown = num(r["pKaH"])
		out[d.Kind] = d
	}
	return out
}()

// Leaving returns the table row for kind k.
func Leaving(k LeavingKind) (LeavingData, bool) {
	d, ok := leavingData[k]
	return d, ok
}

// LeavingKinds lists the kinds in the table.
func LeavingKinds() []LeavingKind {
	out := make([]LeavingKind, 0, len(leavingData))
	for k := range leavingData {
		out = append(out, k)
	}
	return out
}

// LeavingGroup is a leaving group found on a substrate.
type LeavingGroup struct {
	Kind   LeavingKind
	Attach int   // the atom bonded to the carbon (halogen, O, N or S)
	Atoms  []int // every atom that leaves with it (Attach first); empty for a ring-opening group that stays attached
	InRing bool  // the bond to the carbon is a ring bond (epoxide, cyclic onium): the group stays on the molecule
	Data   LeavingData
}

// classifyLeaving looks at the atom x bonded to sp3 carbon c and says what
// kind of leaving group it is, if any.
func classifyLeaving(m *molecule.Molecule, r *Rings, c, x int) (LeavingKind, bool) {
	a := m.Atoms[x]
	bi := m.BondBetween(c, x)
	if bi < 0 || m.Bonds[bi].Order != 1 {
		return "", false
	}
	switch a.Element {
	case molecule.I:
		return Iodide, a.Charge == 0
	case molecule.Br:
		return Bromide, a.Charge == 0
	case molecule.Cl:
		return Chloride, a.Charge == 0
	case molecule.F:
		return Fluoride, a.Charge == 0
	case molecule.N:
		if a.Charge == 1 && m.Degree(x)+a.ImplicitH == 4 && allSingle(m, x) {
			return Ammonium, true
		}
		if a.Charge == 0 && !a.Aromatic && allSingle(m, x) && m.HydrogenCount(x) == 2 {
			return Amino, true
		}
	case molecule.S:
		if a.Charge == 1 && m.Degree(x)+a.ImplicitH == 3 && allSingle(m, x) {
			return Sulfonium, true
		}
	case molecule.O:
		return classifyOxygen(m, r, c, x)
	}
	return "", false
}

func allSingle(m *molecule.Molecule, x int) bool {
	for _, e := range m.Edges(x) {
		if m.Bonds[e.Bond].Order != 1 {
			return false
		}
	}
	return true
}

func classifyOxygen(m *molecule.Molecule, r *Rings, c, o int) (LeavingKind, bool) {
	a := m.Atoms[o]
	if a.Charge == 1 {
		for _, e := range m.Edges(o) {
			if m.Atoms[e.Atom].Element == molecule.P {
				return Phosphonium, true
			}
		}
		return Oxonium, true
	}
	if a.Charge != 0 {
		return "", false
	}
	if m.Degree(o) == 1 && m.HydrogenCount(o) >= 1 {
		return Hydroxyl, true
	}
	for _, e := range m.Edges(o) {
		if e.Atom == c {
			continue
		}
		y := e.Atom
		switch m.Atoms[y].Element {
		case molecule.S:
			return sulfonylKind(m, o, y)
		case molecule.P:
			if m.Atoms[y].Charge == 1 {
				return Phosphonium, true
			}
		case molecule.H:
			return Hydroxyl, true
		case molecule.C:
			if r.SmallestRingBond(c, o) == 3 {
				return Epoxide, true
			}
			if hasDoubleO(m, y) {
				return Carboxylate, true
			}
			return Alkoxy, true
		}
	}
	return "", false
}

// sulfonylKind names the sulfonate or sulfate ester O–S(=O)(=O)–R.
func sulfonylKind(m *molecule.Molecule, o, s int) (LeavingKind, bool) {
	doubleO := 0
	var rest []int
	for _, e := range m.Edges(s) {
		if e.Atom == o {
			continue
		}
		if m.Atoms[e.Atom].Element == molecule.O && m.Bonds[e.Bond].Order == 2 {
			doubleO++
			continue
		}
		rest = append(rest, e.Atom)
	}
	if doubleO != 2 || len(rest) != 1 {
		return "", false
	}
	y := rest[0]
	switch m.Atoms[y].Element {
	case molecule.O:
		return Sulfate, true
	case molecule.C:
		if countF(m, y) == 3 {
			return Triflate, true
		}
		if !m.Atoms[y].Aromatic && m.HydrogenCount(y) == 3 {
			return Mesylate, true
		}
		if m.Atoms[y].Aromatic {
			switch paraSubstituent(m, y) {
			case "C":
				return Tosylate, true
			case "N+":
				return Nosylate, true
			case "Br":
				return Brosylate, true
			}
		}
		return Sulfonate, true
	}
	return Sulfonate, true
}

func countF(m *molecule.Molecule, c int) int {
	n := 0
	for _, e := range m.Edges(c) {
		if m.Atoms[e.Atom].Element == molecule.F {
			n++
		}
	}
	return n
}

func hasDoubleO(m *molecule.Molecule, c int) bool {
	for _, e := range m.Edges(c) {
		if m.Atoms[e.Atom].Element == molecule.O && m.Bonds[e.Bond].Order == 2 {
			return true
		}
	}
	return false
}

// paraSubstituent walks a benzene ring from ipso atom y three bonds round
// and names the substituent on the para carbon: "C" for methyl, "N+" for
// nitro, "Br", or "".
func paraSubstituent(m *molecule.Molecule, y int) string {
	dist := map[int]int{y: 0}
	queue := []int{y}
	for len(queue) > 0 {
		a := queue[0]
		queue = queue[1:]
		for _, e := range m.Edges(a) {
			if !m.Atoms[e.Atom].Aromatic || !m.Bonds[e.Bond].Aromatic {
				continue
			}
			if _, ok := dist[e.Atom]; !ok {
				dist[e.Atom] = dist[a] + 1
				queue = append(queue, e.Atom)
			}
		}
	}
	for a, d := range dist {
		if d != 3 {
			continue
		}
		for _, e := range m.Edges(a) {
			if m.Atoms[e.Atom].Aromatic {
				continue
			}
			switch el := m.Atoms[e.Atom].Element; {
			case el == molecule.C && m.HydrogenCount(e.Atom) == 3:
				return "C"
			case el == molecule.N && m.Atoms[e.Atom].Charge == 1:
				return "N+"
			case el == molecule.Br:
				return "Br"
			}
		}
	}
	return ""
}

// leavingAtoms collects the atoms that leave with the group attached at x
// when the bond to carbon c breaks: everything reachable from x without
// crossing c. It returns nil when that reaches c again (a ring).
func leavingAtoms(m *molecule.Molecule, c, x int) []int {
	seen := map[int]bool{c: true, x: true}
	out := []int{x}
	stack := []int{x}
	for len(stack) > 0 {
		a := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		for _, e := range m.Edges(a) {
			if e.Atom == c && a != x {
				return nil
			}
			if e.Atom == c {
				continue
			}
			if !seen[e.Atom] {
				seen[e.Atom] = true
				out = append(out, e.Atom)
				stack = append(stack, e.Atom)
			}
		}
	}
	return out
}
