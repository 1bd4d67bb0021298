package outcome

import (
	"sync"

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

	// Pooled scratch (see getScoring): the site the rules look at, the
	// usable sites it was chosen from, the step's ionised reagents, and
	// the reason texts written so far, all in one buffer with the end of
	// each reason's text in ends (-1 for a fixed text, kept as it is).
	siteVal perceive.Site
	sites   []perceive.Site
	ionised []Reactant
	text    []byte
	ends    []int
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

// say records a reason with a fixed text from the rule being applied.
func (c *scoring) say(text string) {
	c.reasons = append(c.reasons, Reason{Rule: c.rule.Name, Text: text, Source: c.rule.Source})
	c.ends = append(c.ends, -1)
}

// said records a reason from the rule being applied whose text the rule
// appended to c.text (b is c.text with the text added).
func (c *scoring) said(b []byte) {
	c.text = b
	c.reasons = append(c.reasons, Reason{Rule: c.rule.Name, Source: c.rule.Source})
	c.ends = append(c.ends, len(b))
}

// takeReasons appends the reasons the rules gave to dst. With a Cache,
// each written text is the copy the Cache keeps (most recur from step to
// step); without one, the texts become one string that each reason's
// Text is a piece of. Either way no text costs an allocation of its own.
func (c *scoring) takeReasons(dst []Reason) []Reason {
	if len(c.reasons) == 0 {
		return dst
	}
	var all string
	if c.cache == nil {
		all = string(c.text)
	}
	if dst == nil {
		dst = make([]Reason, 0, len(c.reasons))
	}
	start := 0
	for i, r := range c.reasons {
		if end := c.ends[i]; end >= 0 {
			if c.cache != nil {
				r.Text = c.cache.texts.get(c.text[start:end])
			} else {
				r.Text = all[start:end]
			}
			start = end
		}
		dst = append(dst, r)
	}
	return dst
}

// scoringPool keeps scoring values between predictions; see getScoring.
var scoringPool = sync.Pool{New: func() any { return new(scoring) }}

// getScoring returns an empty scoring whose scratch slices keep their
// room from earlier predictions. The rules get it through a function
// value, so it would otherwise escape to the heap on every step.
func getScoring() *scoring {
	c := scoringPool.Get().(*scoring)
	*c = scoring{sites: c.sites[:0], ionised: c.ionised[:0], text: c.text[:0], ends: c.ends[:0], reasons: c.reasons[:0]}
	return c
}

// putScoring hands c back once nothing of the prediction points into it
// (Predict copies the reasons out, their texts are strings of their own,
// and the Outcome keeps no pointer to the site or the ionised list).
func putScoring(c *scoring) {
	clear(c.sites)
	clear(c.ionised)
	clear(c.reasons)
	*c = scoring{sites: c.sites[:0], ionised: c.ionised[:0], text: c.text[:0], ends: c.ends[:0], reasons: c.reasons[:0]}
	scoringPool.Put(c)
}
