package molecule

// Aromaticity perception, used by the canonical SMILES writer so that
// Kekulé and aromatic input of one structure come out alike.
//
// Model (simple Hückel rule, common practice; close to RDKit's default
// model): a ring is aromatic when every atom in it is a candidate and
// the ring holds 4n+2 pi electrons. Candidates and their electrons:
//   - an atom with one double bond that lies on a ring, to another
//     candidate: 1 (the usual sp2 carbon or pyridine nitrogen);
//   - an atom with an exocyclic double bond to O, S, Se or N: 0 (pyridone
//     carbon);
//   - N, P, As with three neighbours (hydrogens counted) and no charge,
//     or with two and charge -1: 2 (pyrrole, indolizine);
//   - O, S, Se, Te with two neighbours and no charge: 2 (furan, thiophene);
//   - C with charge -1 and no double bond: 2; with charge +1: 0;
//   - B with three neighbours and no charge: 0.
// Elements other than B, C, N, O, P, S, As, Se, Te are never candidates;
// a triple bond or two double bonds disqualify an atom. Rings considered
// are all simple cycles of up to MaxAromaticRing atoms holding at least
// one double bond, and every pair of them fused on one bond (so azulene's
// 10-electron perimeter counts).
// Larger rings ([18]annulene) are not perceived: a documented limit.

// MaxAromaticRing is the largest single ring tested for aromaticity.
const MaxAromaticRing = 8

// cycleBudget bounds the search for small cycles in dense graphs, and
// maxCycles the cycles kept (fused pairs are tested among them, so their
// number must stay small); beyond them perception is partial, which only
// dense cage-like graphs reach.
const (
	cycleBudget = 200_000
	maxCycles   = 512
)

func aromaticElement(e Element) bool {
	switch e {
	case B, C, N, O, P, S, As, Se, 52:
		return true
	}
	return false
}

// piElectrons returns the pi electrons atom i gives to a ring, or -1 when
// it cannot be part of an aromatic ring.
func (m *Molecule) piElectrons(i int, ring []bool) int {
	a := &m.Atoms[i]
	if !aromaticElement(a.Element) {
		return -1
	}
	doubles, partner, bond := 0, -1, -1
	for _, e := range m.adj[i] {
		switch m.Bonds[e.Bond].Order {
		case 2:
			doubles++
			partner, bond = e.Atom, e.Bond
		case 1:
		default:
			return -1
		}
	}
	if doubles > 1 {
		return -1
	}
	if doubles == 1 {
		if ring[bond] {
			if aromaticElement(m.Atoms[partner].Element) {
				return 1
			}
			return -1
		}
		switch m.Atoms[partner].Element {
		case O, S, Se, N:
			return 0
		}
		return -1
	}
	n := len(m.adj[i]) + a.ImplicitH
	switch a.Element {
	case C:
		switch a.Charge {
		case -1:
			return 2
		case 1:
			return 0
		}
	case N, P, As:
		if a.Charge == 0 && n == 3 || a.Charge == -1 && n == 2 {
			return 2
		}
	case O, S, Se, 52:
		if a.Charge == 0 && n == 2 {
			return 2
		}
	case B:
		if a.Charge == 0 && n == 3 {
			return 0
		}
	}
	return -1
}

// Aromaticity reports which atoms and bonds are aromatic by the model
// above, from the Kekulé bond orders (Bond.Order); Bond.Aromatic and
// Atom.Aromatic are not consulted.
func (m *Molecule) Aromaticity() (atoms, bonds []bool) {
	n := len(m.Atoms)
	atoms = make([]bool, n)
	bonds = make([]bool, len(m.Bonds))
	// Every aromatic ring of the model holds a double bond; without one
	// there is nothing to find.
	double := false
	for i := range m.Bonds {
		if m.Bonds[i].Order == 2 {
			double = true
			break
		}
	}
	if !double || len(m.Bonds) < 3 {
		return atoms, bonds
	}
	ring := m.RingBonds()
	elec := make([]int8, n)
	cand := false
	for i := range n {
		elec[i] = int8(m.piElectrons(i, ring))
		if elec[i] >= 0 {
			cand = true
		}
	}
	if !cand {
		return atoms, bonds
	}
	cycles := m.smallCycles(elec, ring)
	if len(cycles) == 0 {
		return atoms, bonds
	}
	// Aromatic systems: single rings, then pairs fused on one bond whose
	// perimeter holds 4n+2 electrons. A system is a pair of cycle indices
	// (j < 0 for a single ring).
	type system struct{ i, j int }
	var systems []system
	single := make([]bool, len(cycles))
	for ci, c := range cycles {
		sum, ones := 0, 0
		for _, a := range c {
			sum += int(elec[a])
			if elec[a] == 1 {
				ones++
			}
		}
		if sum%4 == 2 && ones > 0 {
			single[ci] = true
			systems = append(systems, system{ci, -1})
		}
	}
	inA := make([]bool, n)
	for i := range cycles {
		for _, a := range cycles[i] {
			inA[a] = true
		}
		for j := i + 1; j < len(cycles); j++ {
			if single[i] && single[j] {
				continue
			}
			shared, sum, ones := 0, 0, 0
			for _, a := range cycles[i] {
				sum += int(elec[a])
				if elec[a] == 1 {
					ones++
				}
			}
			var s [2]int
			for _, a := range cycles[j] {
				if inA[a] {
					if shared < 2 {
						s[shared] = a
					}
					shared++
				} else {
					sum += int(elec[a])
				}
			}
			if shared != 2 || sum%4 != 2 || ones == 0 || m.BondBetween(s[0], s[1]) < 0 {
				continue
			}
			systems = append(systems, system{i, j})
		}
		for _, a := range cycles[i] {
			inA[a] = false
		}
	}
	if len(systems) == 0 {
		return atoms, bonds
	}
	// An atom whose double bond leaves the aromatic bonds could not be
	// read back from lower-case SMILES; a system holding one is dropped.
	// Dropping only shrinks the union, so repeating until nothing changes
	// reaches the same result whatever the atom order.
	alive := make([]bool, len(systems))
	for k := range alive {
		alive[k] = true
	}
	markCycle := func(c []int) {
		for k, a := range c {
			atoms[a] = true
			bonds[m.BondBetween(a, c[(k+1)%len(c)])] = true
		}
	}
	for changed := true; changed; {
		changed = false
		clear(atoms)
		clear(bonds)
		for k, sy := range systems {
			if !alive[k] {
				continue
			}
			markCycle(cycles[sy.i])
			if sy.j >= 0 {
				markCycle(cycles[sy.j])
			}
		}
		for k, sy := range systems {
			if !alive[k] {
				continue
			}
			bad := false
			for _, ci := range [2]int{sy.i, sy.j} {
				if ci < 0 {
					continue
				}
				for _, a := range cycles[ci] {
					if elec[a] != 1 {
						continue
					}
					for _, e := range m.adj[a] {
						if m.Bonds[e.Bond].Order == 2 && !bonds[e.Bond] {
							bad = true
						}
					}
				}
			}
			if bad {
				alive[k] = false
				changed = true
			}
		}
	}
	return atoms, bonds
}

// smallCycles lists every simple cycle of at most MaxAromaticRing
// candidate atoms joined by ring bonds, each once, as atom sequences
// starting at its lowest atom.
func (m *Molecule) smallCycles(elec []int8, ring []bool) [][]int {
	var out [][]int
	path := make([]int, 0, MaxAromaticRing)
	on := make([]bool, len(m.Atoms))
	budget := cycleBudget
	var dfs func(start, at int)
	dfs = func(start, at int) {
		for _, e := range m.adj[at] {
			budget--
			if budget < 0 {
				return
			}
			if !ring[e.Bond] || elec[e.Atom] < 0 {
				continue
			}
			if e.Atom == start && len(path) >= 3 {
				if path[1] < path[len(path)-1] && len(out) < maxCycles {
					out = append(out, append([]int(nil), path...))
				}
				continue
			}
			if e.Atom <= start || on[e.Atom] || len(path) >= MaxAromaticRing {
				continue
			}
			on[e.Atom] = true
			path = append(path, e.Atom)
			dfs(start, e.Atom)
			path = path[:len(path)-1]
			on[e.Atom] = false
		}
	}
	for s := range m.Atoms {
		if elec[s] < 0 {
			continue
		}
		path = append(path[:0], s)
		on[s] = true
		dfs(s, s)
		on[s] = false
	}
	return out
}
