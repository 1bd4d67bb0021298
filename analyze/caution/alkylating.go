package caution

import "walden/analyze/molecule"

// Potent alkylating agents.
//
// Methyl halides and methyl sulfonates/sulfates (methyl iodide, dimethyl
// sulfate, methyl triflate) and benzylic and allylic halides alkylate DNA
// and proteins readily; several are classed as probable or possible human
// carcinogens, dimethyl sulfate is acutely toxic with delayed effects, and
// benzylic and allylic halides are also lachrymators. Sources: IARC
// Monographs, dimethyl sulfate group 2A and methyl iodide group 3 (from
// memory); Prudent Practices in the Laboratory, National Research Council
// 2011, chapter on particularly hazardous substances (from memory); common
// practice.
func init() {
	register(Rule{
		Code:   "caution-alkylating-agent",
		Title:  "potent alkylating agent (methyl iodide, dimethyl sulfate, methyl triflate, benzylic and allylic halides)",
		Source: "IARC Monographs (from memory); Prudent Practices in the Laboratory, NRC 2011 (from memory); common practice",
		check:  alkylating,
	})
}

func alkylating(f finder) []Caution {
	var out []Caution
	for i, x := range f.Substances {
		if x.Role == Solvent {
			continue
		}
		what := alkylatingKind(x, f.named(i, alkylatingNames))
		if what == "" {
			continue
		}
		out = append(out, Caution{
			Code: "caution-alkylating-agent",
			Message: say("Caution: "+x.display()+" is "+what+".",
				"Handle it in a fume hood with suitable gloves, and quench excess reagent before work-up."),
			Parties: []Party{x.party()},
		})
	}
	return out
}

// alkylatingKind names the kind of alkylating agent x is, or ""; named
// says whether x goes by one of alkylatingNames.
func alkylatingKind(x Substance, named bool) string {
	if named {
		return "a potent alkylating agent, toxic and a suspected carcinogen"
	}
	m := x.Mol
	kind := ""
	sp3CarbonsWithLeavingGroup(m, func(c int, lg string) {
		if kind != "" {
			return
		}
		if isMethylCarbon(m, c) {
			kind = "a potent methylating agent, toxic and a suspected carcinogen"
			return
		}
		if lg != "halide" {
			return
		}
		benzylic, allylic := benzylicOrAllylic(m, c)
		switch {
		case benzylic:
			kind = "a benzylic halide: a potent alkylating agent and a lachrymator"
		case allylic:
			kind = "an allylic halide: a potent alkylating agent and a lachrymator"
		}
	})
	return kind
}

// isMethylCarbon reports a CH3 bonded to one heavy atom.
func isMethylCarbon(m *molecule.Molecule, c int) bool {
	return m.Atoms[c].Element == molecule.C && heavyNeighbours(m, c) == 1 && m.HydrogenCount(c) == 3
}

// alkylatingNames are the potent alkylating agents named by the chemist.
var alkylatingNames = nameSetOf("MeI", "methyl iodide", "iodomethane", "Me2SO4", "dimethyl sulfate", "MeOTf", "methyl triflate")
