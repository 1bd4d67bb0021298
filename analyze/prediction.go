package analyze

import (
	"slices"

	"walden/analyze/molecule"
)

// prediction is the outcome of one step in the terms the report needs. It
// is filled from the outcome engine by predict (outcome.go), so that the
// rest of this package does not depend on that engine's exact types.
type prediction struct {
	notAnalysed  string // why the rules cannot decide; "" when they can
	mechanism    string // "SN2", "SN1", "E2", "E1" or "none"
	distribution []share
	products     []product // the major product first
	reasons      []string  // what each rule contributed, in words
	sources      []string  // the published source of each reason ("" where none)
	findings     []chemFinding
	stereo       []stereoChange
	reacting     int // substrate atom that reacts; -1 when none
	leaving      []int
}

// role says what substrate atom i does in the step, for hover; "" for an
// onlooker.
func (p *prediction) role(i int) string {
	switch {
	case i == p.reacting && i >= 0:
		return "the reacting carbon: it bears the leaving group"
	case slices.Contains(p.leaving, i):
		return "part of the leaving group"
	}
	return ""
}

// share is one pathway's part of the predicted distribution.
type share struct {
	mechanism string
	fraction  float64
}

// product is one predicted product.
type product struct {
	smiles    string // canonical
	mol       *molecule.Molecule
	fraction  float64
	major     bool
	mechanism string
	note      string
}

// party says which substance of the step a finding concerns.
type party int

const (
	partyNone party = iota
	partySubstrate
	partyReagent
	partySolvent
	partyTemperature
)

// chemFinding is a finding of the outcome rules, placed by its parties.
type chemFinding struct {
	code     string
	severity Severity
	message  string
	atoms    []int // substrate atoms named by the finding
	on       party // where the mark goes
	index    int   // which reagent or solvent, for partyReagent / partySolvent
	also     []partyRef
	fixes    []chemFix
}

// partyRef names another party of a finding, for related information.
type partyRef struct {
	on    party
	index int
	why   string
}

// fixKind says what a chemical fix changes in the line.
type fixKind int

const (
	fixSwapSolvent    fixKind = iota + 1 // replace the solvent by text
	fixActivate                          // insert an activation step before this one
	fixReplaceReagent                    // replace a reagent by text
	fixTemperature                       // replace (or add) the temperature
)

// chemFix is a fix in chemical terms, turned into edits by fixes.go.
type chemFix struct {
	kind  fixKind
	title string
	text  string // the new solvent, reagent or temperature; for fixActivate the reagents of the new step ("TsCl + pyridine, DCM, 0 °C")
	index int    // which solvent or reagent
}

// stereoChange is what happened at one stereocentre of the substrate.
type stereoChange struct {
	atom          int
	before, after string // CIP letters; "" when none
	outcome       string // "inverted", "retained" or "lost"
	letterChanged bool
	why           string // why a lost centre is lost; "" otherwise
}
