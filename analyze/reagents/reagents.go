// Package reagents is walden's dictionary of reagents and solvents: the
// names chemists write, the species they stand for, and the
// physical-organic data the outcome rules need, each value with its source.
// The tables are embedded TSV files read once at start-up; a lab adds its
// own names in a small line-based file of the project's own format (see
// Load and docs/reagents.md).
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
	Electrophile // an alkylating agent written as a reagent (MeI, BnBr, Me2SO4 …)
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
//
// For an acid (HBr, TsOH, H2SO4) Species is the conjugate base the acid
// releases and PKaH is then the acid's own pKa, so that one rule — "pKa of
// the conjugate acid of the species" — covers bases and acids alike.
type Reagent struct {
	Names      []string // the first is the display name; all are accepted in lines
	Species    string   // SMILES of the active species (the nucleophile or base as it reacts)
	Counterion string   // SMILES of the counter-ion, "" when none
	Whole      string   // SMILES of the reagent as weighed out (species and counter-ion, or the neutral molecule)
	Roles      Role
	PKaH       Value // pKa of the conjugate acid of the active species (water unless Source says otherwise)
	Nucleo     Value // nucleophilicity, Pearson n(CH3I) in methanol where known
	Bulk       Bulk
	Soluble    string // where it dissolves: comma-separated words of the vocabulary in solubility.go
	Hazards    []string
	Source     string // where the entry as a whole comes from
	Notes      string
	// NeedsBase is set when the species forms only after a base removes a
	// proton from the reagent as weighed out (phenols, thiols, malonates).
	NeedsBase bool
	// Origin says where the entry was defined: "built-in" or "file:line"
	// of a lab's names file.
	Origin string
}

// Solvent is one solvent entry.
type Solvent struct {
	Names      []string
	SMILES     string
	Dielectric Value // relative permittivity near 25 °C (DielectricTempC says where)
	Protic     bool
	BoilingC   Value  // normal boiling point, °C
	Class      string // one of ClassPolarProtic, ClassPolarAprotic, ClassWeaklyPolar, ClassNonpolar
	Source     string
	// DielectricTempC is the temperature (°C) at which Dielectric was
	// measured: tables mix 20 and 25 °C, and the difference can be 2 units.
	DielectricTempC float64
	Hazards         []string // e.g. "halogenated", "peroxide-former"
	Notes           string
	Origin          string // "built-in" or "file:line" of a lab's names file
}

// Solvent classes, in the words chemists use. THF, ethers, DCM and EtOAc
// are often loosely called polar aprotic; they are kept apart because they
// dissolve salts poorly and leave anions paired.
const (
	ClassPolarProtic  = "polar protic"
	ClassPolarAprotic = "polar aprotic"
	ClassWeaklyPolar  = "weakly polar aprotic"
	ClassNonpolar     = "nonpolar"
)

// Name returns the display name of r.
func (r *Reagent) Name() string { return first(r.Names) }

// Name returns the display name of s.
func (s *Solvent) Name() string { return first(s.Names) }

// HasHazard reports whether r carries the hazard tag h (see hazard.go).
func (r *Reagent) HasHazard(h string) bool { return contains(r.Hazards, h) }

// HasHazard reports whether s carries the hazard tag h (see hazard.go).
func (s *Solvent) HasHazard(h string) bool { return contains(s.Hazards, h) }

func first(names []string) string {
	if len(names) == 0 {
		return ""
	}
	return names[0]
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}
