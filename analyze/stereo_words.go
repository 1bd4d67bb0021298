package analyze

import "fmt"

// describe says what happened at a stereocentre in words that are true
// for every combination a step can produce. Text output, hover and the
// predict command all use it, so that no path can say of a lost centre
// that "the letter stays" (a lost centre has no letter after the step).
//
// The letter and the geometry are separate facts: an SN2 inversion can
// keep the CIP letter when the nucleophile ranks differently from the
// leaving group, and a retention can change it (CIP rules: IUPAC 2013
// Recommendations P-92.1; common practice).
func (c stereoChange) describe() string {
	return fmt.Sprintf("%s → %s, %s (%s)", orDash(c.before), orDash(c.after), c.outcome, c.letterNote())
}

// letterNote is the parenthesis of describe: what became of the CIP
// letter, or why there is none to compare.
func (c stereoChange) letterNote() string {
	if c.outcome == "lost" {
		why := c.why
		if why == "" {
			why = "the configuration is not kept"
		}
		return why
	}
	switch {
	case c.before == "" && c.after == "":
		return "no CIP letter before or after to compare"
	case c.before == "":
		return "no CIP letter before the step to compare"
	case c.after == "":
		return "no CIP letter after the step: the carbon may no longer be a stereocentre"
	case c.before != c.after:
		return "the CIP letter changes"
	}
	return "the CIP letter stays"
}
