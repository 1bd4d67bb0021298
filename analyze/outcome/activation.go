package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
)

// activationKind is what the reagents do to a hydroxyl group.
type activationKind int

const (
	actNone        activationKind = iota
	actSulfonylate                // TsCl, MsCl, Tf2O … with a base: O–S bond formed, configuration kept
	actMitsunobu                  // PPh3 + azodicarboxylate + acidic pronucleophile: SN2 with inversion
	actAppel                      // PPh3 + CX4: halide with inversion
	actHX                         // HCl, HBr, HI: protonated OH leaves as water
	actDehydrate                  // H3PO4, H2SO4, TsOH with heat: E1 to the alkene
)

// activation describes the reagents that turn OH into a leaving group.
type activation struct {
	kind     activationKind
	reagent  int                   // the reagent that does it (sulfonyl chloride, HX, acid)
	nu       *perceive.Nucleophile // the nucleophile it delivers (halide, pronucleophile anion)
	nuMol    *molecule.Molecule
	sulfonyl int // atom S of the sulfonyl chloride
	leaving  int // atom Cl (or O) that the sulfonyl group loses
}

// detectActivation looks for activating reagents among rs.
func detectActivation(rs []Reactant, solvents []perceive.SolventEffect) activation {
	phosphine, azo, halide := -1, -1, molecule.Element(0)
	var a activation
	for i, r := range rs {
		m := r.Mol
		if m == nil {
			continue
		}
		if s, l, ok := sulfonylChloride(m); ok {
			return activation{kind: actSulfonylate, reagent: i, sulfonyl: s, leaving: l}
		}
		if len(m.Atoms) == 1 && m.Atoms[0].Charge == 0 && m.HydrogenCount(0) == 1 {
			switch el := m.Atoms[0].Element; el {
			case molecule.Cl, molecule.Br, molecule.I:
				a = activation{kind: actHX, reagent: i}
				a.nu, a.nuMol = halideNucleophile(el, i)
			}
		}
		if oxoAcid(m) {
			a = activation{kind: actDehydrate, reagent: i}
		}
		for j, at := range m.Atoms {
			if at.Element == molecule.P && at.Charge == 0 && m.Degree(j) == 3 && carbonsOn(m, j) == 3 {
				phosphine = i
			}
			if at.Element == molecule.N {
				for _, e := range m.Edges(j) {
					if m.Atoms[e.Atom].Element == molecule.N && m.Bonds[e.Bond].Order == 2 {
						azo = i
					}
				}
			}
			if at.Element == molecule.C && m.Degree(j) == 4 {
				if x := tetrahalo(m, j); x != 0 {
					halide = x
				}
			}
		}
	}
	if phosphine >= 0 && halide == 0 {
		for _, s := range solvents {
			if s.SMILES == "ClC(Cl)(Cl)Cl" {
				halide = molecule.Cl
			}
		}
	}
	switch {
	case phosphine >= 0 && azo >= 0:
		a = activation{kind: actMitsunobu, reagent: phosphine}
		// The pronucleophile: the most acidic site among the other reagents.
		var rest []Reactant
		var index []int
		for i, r := range rs {
			if i != phosphine && i != azo {
				rest = append(rest, r)
				index = append(index, i)
			}
		}
		// The betaine from PPh3 and the azo ester is the base (pKaH ~13, common practice).
		betaine := &molecule.Molecule{}
		betaine.Grow(1, 0)
		betaine.AddAtom(molecule.Atom{Element: molecule.N, Charge: -1, ImplicitH: 1, Bracket: true})
		rest = append(rest, Reactant{Mol: betaine})
		g := perceive.PerceiveReagents(rest)
		for _, cand := range g.Candidates {
			if cand.Reactant >= len(index) || cand.Acid == "" {
				continue
			}
			nu := perceive.Nucleophile{Candidate: cand, Deprotonated: true, By: -1, ProtonFrom: cand.Atom}
			nu.Reactant = index[cand.Reactant]
			a.nu, a.nuMol = &nu, rs[nu.Reactant].Mol
			break
		}
	case phosphine >= 0 && halide != 0:
		a = activation{kind: actAppel, reagent: phosphine}
		a.nu, a.nuMol = halideNucleophile(halide, phosphine)
	}
	return a
}

func carbonsOn(m *molecule.Molecule, a int) int {
	n := 0
	for _, e := range m.Edges(a) {
		if m.Atoms[e.Atom].Element == molecule.C {
			n++
		}
	}
	return n
}

// tetrahalo returns the halogen of a CX4 carbon (CCl4, CBr4, CI4), or 0.
func tetrahalo(m *molecule.Molecule, c int) molecule.Element {
	var x molecule.Element
	for _, e := range m.Edges(c) {
		el := m.Atoms[e.Atom].Element
		if el != molecule.Cl && el != molecule.Br && el != molecule.I {
			return 0
		}
		x = el
	}
	return x
}

// sulfonylChloride finds R–S(=O)(=O)–Cl (or the anhydride R–SO2–O–SO2–R).
func sulfonylChloride(m *molecule.Molecule) (s, leaving int, ok bool) {
	for i, a := range m.Atoms {
		if a.Element != molecule.S {
			continue
		}
		dbl := 0
		cl := -1
		for _, e := range m.Edges(i) {
			el := m.Atoms[e.Atom].Element
			if el == molecule.O && m.Bonds[e.Bond].Order == 2 {
				dbl++
			}
			if el == molecule.Cl {
				cl = e.Atom
			}
			if el == molecule.O && m.Bonds[e.Bond].Order == 1 && m.Degree(e.Atom) == 2 {
				for _, f := range m.Edges(e.Atom) {
					if f.Atom != i && m.Atoms[f.Atom].Element == molecule.S {
						cl = e.Atom
					}
				}
			}
		}
		if dbl == 2 && cl >= 0 {
			return i, cl, true
		}
	}
	return 0, 0, false
}

// oxoAcid spots phosphoric, sulfuric or a sulfonic acid: strong acids
// whose conjugate bases do not capture cations.
func oxoAcid(m *molecule.Molecule) bool {
	for i, a := range m.Atoms {
		if a.Element != molecule.P && a.Element != molecule.S {
			continue
		}
		oh, dbl := 0, 0
		for _, e := range m.Edges(i) {
			if m.Atoms[e.Atom].Element != molecule.O {
				continue
			}
			if m.Bonds[e.Bond].Order == 2 {
				dbl++
			} else if m.HydrogenCount(e.Atom) == 1 {
				oh++
			}
		}
		if oh >= 1 && dbl >= 1 && (a.Element == molecule.P || dbl == 2) {
			return true
		}
	}
	return false
}

func halideNucleophile(el molecule.Element, reactant int) (*perceive.Nucleophile, *molecule.Molecule) {
	m := &molecule.Molecule{}
	m.Grow(1, 0) // one atom: not the default room for a larger molecule
	m.AddAtom(molecule.Atom{Element: el, Charge: -1, Bracket: true})
	kind := perceive.HalideKind(el)
	d, _ := perceive.NucleophileData(kind)
	return &perceive.Nucleophile{Candidate: perceive.Candidate{Reactant: reactant, Atom: 0, Kind: kind, Charge: -1, Data: d}, By: -1}, m
}
