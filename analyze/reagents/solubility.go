package reagents

import "strings"

// Solubility is the answer of DissolvesIn.
type Solubility int8

const (
	SolubilityUnknown Solubility = iota // the dictionary does not say
	Dissolves                           // dissolves well enough to react
	DissolvesPoorly                     // stays mostly undissolved
)

// Words of the Soluble field. Besides these, a solvent's name says the
// reagent dissolves in that solvent, and a name after "-" says it does not
// even though its class would suggest so ("protic,polar-aprotic,-acetone"
// for NaBr, which precipitates from acetone). These are hints of the kind
// "ionic salts dissolve in water and dipolar aprotic solvents, poorly in
// ethers and hydrocarbons" — common practice, not measured solubilities.
const (
	SolubleAny          = "any"           // neutral organic reagents
	SolubleNone         = "none"          // used as a suspension in everything (NaH, AgCN)
	SolubleWater        = "water"         // water alone
	SolubleProtic       = "protic"        // water and alcohols
	SolublePolarAprotic = "polar-aprotic" // DMF, DMSO, MeCN, acetone, NMP …
	SolubleWeaklyPolar  = "weakly-polar"  // THF, ethers, DCM, EtOAc …
	SolubleNonpolar     = "nonpolar"      // hydrocarbons, CCl4
)

var solubleWords = [...]string{SolubleAny, SolubleNone, SolubleWater, SolubleProtic, SolublePolarAprotic, SolubleWeaklyPolar, SolubleNonpolar}

func isSolubleWord(w string) bool { return contains(solubleWords[:], w) }

// classWord maps a solvent class to the Soluble word that covers it.
func classWord(class string) string {
	switch class {
	case ClassPolarProtic:
		return SolubleProtic
	case ClassPolarAprotic:
		return SolublePolarAprotic
	case ClassWeaklyPolar:
		return SolubleWeaklyPolar
	case ClassNonpolar:
		return SolubleNonpolar
	}
	return ""
}

// DissolvesIn says whether r dissolves in s, from the hints in r.Soluble.
// A solvent named outright wins over its class; an exception ("-acetone")
// wins over both.
func (r *Reagent) DissolvesIn(s *Solvent) Solubility {
	if r == nil || s == nil || strings.TrimSpace(r.Soluble) == "" {
		return SolubilityUnknown
	}
	named, classOK, any := false, false, false
	cw := classWord(s.Class)
	for _, w := range strings.Split(r.Soluble, ",") {
		w = strings.TrimSpace(w)
		switch {
		case w == "":
		case strings.HasPrefix(w, "-"):
			if solventNamed(s, w[1:]) {
				return DissolvesPoorly
			}
		case w == SolubleAny:
			any = true
		case w == SolubleNone:
		case w == SolubleWater:
			named = named || solventNamed(s, "water")
		case w == SolubleProtic:
			classOK = classOK || s.Protic
		case isSolubleWord(w):
			classOK = classOK || w == cw
		default:
			named = named || solventNamed(s, w)
		}
	}
	if named || classOK || any {
		return Dissolves
	}
	return DissolvesPoorly
}

// solventNamed reports whether name is one of s's names, compared as
// Lookup compares them.
func solventNamed(s *Solvent, name string) bool {
	var a, b [maxKey]byte
	k, ok := normalize(a[:0], name, true)
	if !ok {
		return false
	}
	for _, n := range s.Names {
		if m, ok := normalize(b[:0], n, true); ok && string(m) == string(k) {
			return true
		}
	}
	return false
}
