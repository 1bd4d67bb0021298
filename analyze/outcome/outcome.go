// Package outcome predicts what an aliphatic substitution or elimination
// step gives: a transparent score for SN2, SN1, E2 and E1 from small rules
// (one file each, registered in Rules), the distribution that follows, the
// products as molecules with their configuration, the changes at the
// reacting stereocentre, and findings a chemist can act on.
//
// It works on molecules and dictionary entries (a resolved Step), never on
// notation or positions, does no IO and is deterministic.
package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/reagents"
)

// Mechanism is a pathway of the outcome.
type Mechanism string

// The pathways walden scores.
const (
	SN2  Mechanism = "SN2"
	SN1  Mechanism = "SN1"
	E2   Mechanism = "E2"
	E1   Mechanism = "E1"
	None Mechanism = "none"
)

// Pathways lists the scored mechanisms in a fixed order.
var Pathways = []Mechanism{SN2, SN1, E2, E1}

// Reactant is one reagent of a step: its molecule, the dictionary entry
// it was named by (nil for a SMILES), and its equivalents (0 when not
// given).
type Reactant = perceive.Reactant

// SolventShare is one solvent with its volume fraction (0: equal shares).
type SolventShare = perceive.SolventShare

// Step is a resolved reaction step.
type Step struct {
	Substrate *molecule.Molecule
	Reagents  []Reactant
	Solvents  []SolventShare
	TempC     *float64 // nil when not given
	Reflux    bool
	// Cache, when set, keeps what does not depend on the conditions
	// between calls; see Cache for what the caller promises.
	Cache *Cache
}

// Role says whether a product is the major one.
type Role string

// Product roles.
const (
	Major Role = "major"
	Minor Role = "minor"
)

// Product is one predicted product.
type Product struct {
	Mol      *molecule.Molecule
	SMILES   string // canonical isomeric SMILES ("" while no writer is available)
	Fraction float64
	Role     Role
	Pathway  Mechanism
	Note     string // e.g. "rearranged by a 1,2-methyl shift"
}

// Reason is one rule's contribution, in words a chemist can read.
type Reason struct {
	Rule   string // the rule's name
	Text   string
	Source string
}

// Severity ranks a finding.
type Severity int

// Severities, most serious first.
const (
	Error Severity = iota + 1
	Warning
	Info
	Hint
)

// Parties says what a finding concerns, so that the caller can place it.
type Parties struct {
	Atoms    []int // substrate atoms
	Reactant int   // index into Step.Reagents, -1 when none
	Solvent  int   // index into Step.Solvents, -1 when none
	Temp     bool  // the temperature
}

// FixKind says what a fix changes.
type FixKind int

// Kinds of fixes.
const (
	ReplaceSolvent   FixKind = iota + 1 // use one of Names as the solvent
	InsertStep                          // insert an activation step (Names: its reagents) before this one
	ReplaceReagent                      // use one of Names instead of the reagent in Parties.Reactant
	ChangeTemp                          // run at the temperature in Names[0]
	ReplaceSubstrate                    // use another substrate (Names: what)
)

// Fix is a suggested change in chemical terms.
type Fix struct {
	Kind   FixKind
	Title  string
	Names  []string // solvent names, reagent names, or "80 °C"
	Config string   // what the change does to the configuration at the reacting carbon ("retains", "inverts", "")
}

// Finding is a problem or notice about the step.
type Finding struct {
	Code     Code
	Severity Severity
	Message  string
	Parties  Parties
	Fixes    []Fix
}

// Change says what happened at a stereocentre.
type Change string

// Changes at the reacting carbon.
const (
	Inverted Change = "inverted"
	Retained Change = "retained"
	Lost     Change = "lost"
)

// StereoChange is what happened at the reacting carbon (or another
// stereocentre of the substrate that the step touches).
type StereoChange struct {
	Atom          int    // substrate atom
	Before, After string // CIP letters; "" when none
	Change        Change
	LetterChanged bool
	// Why says in a few words why a lost centre is lost ("the carbon
	// becomes part of the double bond", "racemised through the planar
	// carbocation"); "" for inverted and retained centres.
	Why string
}

// Score is one pathway's log10 score.
type Score struct {
	Pathway  Mechanism
	Log10    float64
	Possible bool
	Fraction float64
}

// Outcome is the prediction for one step.
type Outcome struct {
	Mechanism   Mechanism
	Scores      []Score // one per pathway in Pathways order
	Products    []Product
	Reasons     []Reason
	Findings    []Finding
	Stereo      []StereoChange
	Site        int   // the reacting carbon, -1 when none
	Leaving     []int // atoms of the leaving group
	NotAnalysed string
}

// Major returns the major product, or nil.
func (o *Outcome) Major() *Product {
	for i := range o.Products {
		if o.Products[i].Role == Major {
			return &o.Products[i]
		}
	}
	return nil
}

// entryHasRole reports whether a dictionary entry plays role r.
func entryHasRole(e *reagents.Reagent, r reagents.Role) bool { return e != nil && e.Roles&r != 0 }
