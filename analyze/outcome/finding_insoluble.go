package outcome

import (
	"fmt"

	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/reagents"
)

// insoluble reports each ionic reagent that will hardly dissolve in any
// solvent of the step: "ionic salts dissolve in water and dipolar aprotic
// solvents, poorly in ethers and hydrocarbons" (common practice; Reichardt,
// Solvents and Solvent Effects in Organic Chemistry, ch. 2, from memory).
//
// The dictionary entry's solubility hints decide where they exist, so
// that salts used routinely in a given solvent are not flagged: KOtBu and
// LiBr dissolve in THF, and NaH or KH are always used as suspensions (a
// finding would only be noise). A salt written as SMILES with no entry is
// flagged only when it is small and inorganic (halide, azide, cyanide,
// carbonate) and every solvent is weakly polar or nonpolar. A crown ether
// or a phase-transfer catalyst carries the anion into the organic phase
// (Starks, J. Am. Chem. Soc. 1971, 93, 195; Pedersen, J. Am. Chem. Soc.
// 1967, 89, 7017; from memory), so none is reported then.
func insoluble(o *Outcome, st Step, c *scoring, rg perceive.Reagents) {
	if rg.Crown || len(st.Solvents) == 0 {
		return // no solvent: the default (DMF) dissolves the usual salts
	}
	for _, i := range rg.Ionic {
		if i < 0 || i >= len(st.Reagents) {
			continue
		}
		r := st.Reagents[i]
		where, ok := undissolved(r, st.Solvents)
		if !ok {
			continue
		}
		name := "the salt"
		if r.Entry != nil && len(r.Entry.Names) > 0 {
			name = r.Entry.Names[0]
		}
		o.Findings = append(o.Findings, Finding{Code: CodeInsoluble, Severity: Warning, Parties: Parties{Reactant: i, Solvent: where},
			Message: fmt.Sprintf("%s is a salt and will hardly dissolve in %s: expect a very slow, heterogeneous reaction", name, c.md.Name),
			Fixes:   []Fix{{Kind: ReplaceSolvent, Title: "use a polar aprotic solvent", Names: []string{"DMF", "DMSO", "acetonitrile"}}, {Kind: ReplaceReagent, Title: "add a phase-transfer catalyst or crown ether", Names: []string{"18-crown-6", "TBAB"}}}})
	}
}

// undissolved reports whether reagent r dissolves in none of the
// solvents, and which solvent to mark (the first).
func undissolved(r Reactant, solvents []SolventShare) (int, bool) {
	if r.Entry != nil && r.Entry.Soluble != "" {
		if r.Entry.Soluble == reagents.SolubleNone {
			return -1, false // always a suspension: not a mistake
		}
		for _, s := range solvents {
			if s.Solvent == nil || r.Entry.DissolvesIn(s.Solvent) != reagents.DissolvesPoorly {
				return -1, false
			}
		}
		return 0, true
	}
	if !smallInorganicSalt(r.Mol) {
		return -1, false
	}
	for _, s := range solvents {
		if s.Solvent == nil || (s.Solvent.Class != reagents.ClassWeaklyPolar && s.Solvent.Class != reagents.ClassNonpolar) {
			return -1, false
		}
	}
	return 0, true
}

// smallInorganicSalt reports a metal salt whose anion holds at most one
// carbon and no hydride: halides, azide, cyanide, carbonate, nitrite.
func smallInorganicSalt(m *molecule.Molecule) bool {
	if m == nil {
		return false
	}
	carbons := 0
	for i, a := range m.Atoms {
		switch {
		case a.Element == molecule.C:
			carbons++
		case a.Element == molecule.H && a.Charge < 0:
			return false
		case a.Charge == 0 && m.Degree(i) > 0 && isMetal(a.Element):
			return false // a covalent metal–carbon or metal–nitrogen bond: organometallic
		}
	}
	return carbons <= 1
}

func isMetal(e molecule.Element) bool {
	switch e {
	case 3, 11, 19, 37, 55, 12, 20, 47, 30, 29, 38, 56:
		return true
	}
	return false
}
