package outcome

import (
	"fmt"

	"walden/analyze/molecule"
	"walden/analyze/perceive"
)

// Rule is one effect on the pathway scores. Apply adds log10 terms to the
// scores of the context and records why, in a chemist's words.
type Rule struct {
	Name   string
	Effect string // the effect, as docs/outcome.md lists it
	Source string
	Apply  func(c *scoring)
}

// Rules is the one list of scoring rules, applied in order.
var Rules = []Rule{
	substrateSN2Rule,
	substrateSN1Rule,
	leavingGroupRule,
	nucleophilicityRule,
	bulkyNucleophileRule,
	solventAnionRule,
	ionisingPowerRule,
	baseStrengthRule,
	betaHydrogenRule,
	temperatureRule,
	sn1CaptureRule,
}

// scoring is the state the rules work on.
type scoring struct {
	sub     *perceive.Substrate
	site    *perceive.Site
	nu      *perceive.Nucleophile // nil when none
	nuMol   *molecule.Molecule
	base    *perceive.Base // nil when none
	md      perceive.Medium
	act     activation
	cation  cation // the carbocation an ionisation would give (after any 1,2-shift)
	log     [4]float64
	can     [4]bool
	reasons []Reason
	rule    *Rule
	cache   *Cache // nil when the caller keeps nothing between steps
}

func idx(p Mechanism) int {
	switch p {
	case SN2:
		return 0
	case SN1:
		return 1
	case E2:
		return 2
	}
	return 3
}

// add adds v to pathway p's score.
func (c *scoring) add(p Mechanism, v float64) { c.log[idx(p)] += v }

// block marks pathway p impossible.
func (c *scoring) block(p Mechanism) { c.can[idx(p)] = false }

// possible reports whether pathway p is still open.
func (c *scoring) possible(p Mechanism) bool { return c.can[idx(p)] }

// say records a reason from the rule being applied.
func (c *scoring) say(format string, args ...any) {
	c.reasons = append(c.reasons, Reason{Rule: c.rule.Name, Text: fmt.Sprintf(format, args...), Source: c.rule.Source})
}
