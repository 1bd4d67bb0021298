// Package reagents is walden's dictionary of reagents and solvents: the
// names chemists write, the species they stand for, and the
// physical-organic data the outcome rules need, each value with its source.
// The tables are embedded TSV files read once at start-up.
package reagents

// Role is a bit set of what a reagent does in a step.
type Role uint16

const (
	Nucleophile Role = 1 << iota
	Base
	Activator // turns a poor leaving group into a good one (TsCl, MsCl, PPh3/DEAD, SOCl2 …)
	Acid
	Catalyst
	Additive // phase-transfer agents, crown ethers, iodide salts …
	Oxidant
	Reductant
)

// Bulk says how hindered a nucleophile or base is.
type Bulk int8

const (
	Small Bulk = iota
	Moderate
	Hindered // KOtBu, LDA, DBU, DIPEA: eliminate rather than substitute
)

// Value is a number with the source it was taken from ("common practice"
// and "from memory" are allowed sources, see DESIGN.md).
type Value struct {
	V      float64
	Known  bool
	Source string
}

// Reagent is one dictionary entry.
type Reagent struct {
	Names      []string // the first is the display name; all are accepted in lines
	Species    string   // SMILES of the active species (the nucleophile or base as it reacts)
	Counterion string   // SMILES of the counter-ion, "" when none
	Whole      string   // SMILES of the reagent as weighed out (species and counter-ion, or the neutral molecule)
	Roles      Role
	PKaH       Value // pKa of the conjugate acid of the active species (water unless Source says otherwise)
	Nucleo     Value // nucleophilicity, Pearson n(CH3I) in methanol where known
	Bulk       Bulk
	Soluble    string // solvent classes it dissolves in: "protic", "polar-aprotic", "nonpolar" (comma-separated)
	Hazards    []string
	Source     string // where the entry as a whole comes from
	Notes      string
}

// Solvent is one solvent entry.
type Solvent struct {
	Names      []string
	SMILES     string
	Dielectric Value // relative permittivity near 25 °C
	Protic     bool
	BoilingC   Value  // normal boiling point, °C
	Class      string // "polar protic", "polar aprotic", "nonpolar"
	Source     string
}
