// Package caution finds combinations in a reaction step that are known to
// hurt people — explosive by-products, toxic gases, runaway reactions,
// potent alkylating agents, lachrymators, solvents heated past their
// boiling points — and words a plain caution for each.
//
// A caution is a reminder, never a safety assessment: every message defers
// to the lab's safety rules, the safety data sheets and local regulations,
// and the absence of a caution says nothing about whether a plan is safe.
// Each rule lives in its own file with a doc comment naming its source.
package caution

import (
	"sort"
	"strings"
	"sync"

	"walden/analyze/molecule"
)

// Defer is the sentence every caution ends with.
const Defer = "Follow the lab's safety rules, the safety data sheets and local regulations; walden does not judge any plan safe."

// Role says which part of a step a Substance plays.
type Role int

const (
	Substrate Role = iota + 1
	Reagent
	Solvent
)

// Substance is one substance of a step as the caution rules see it.
type Substance struct {
	Role  Role
	Index int    // the caller's index among substances of this role, echoed in Party
	Text  string // as written in the step ("NaN3", "ClCCl")
	Names []string
	Mol   *molecule.Molecule // nil when the text could not be read as a molecule
	Acid  bool               // the dictionary lists it as an acid
	// BoilingC is the normal boiling point of a solvent, when known.
	BoilingC    float64
	HasBoilingC bool
}

// Step is what the rules look at: the substances and the conditions.
type Step struct {
	Substances []Substance
	TempC      float64
	HasTemp    bool
	Reflux     bool // heated at the boiling point of the solvent
	Sealed     bool // a closed vessel: sealed tube, autoclave, microwave vial
}

// Party names one substance a caution is about.
type Party struct {
	Role  Role
	Index int
}

// Caution is one finding.
type Caution struct {
	Code    string
	Message string  // plain words, ending with Defer
	Parties []Party // the first is where an editor should place the mark
}

// Rule is one kind of caution.
type Rule struct {
	Code   string
	Title  string // one line, for the documentation
	Source string // where the hazard is documented
	Check  func(*Step) []Caution
}

var rules []Rule

func register(r Rule) { rules = append(rules, r) }

// Rules returns every rule, sorted by code.
func Rules() []Rule {
	out := append([]Rule(nil), rules...)
	sort.Slice(out, func(i, j int) bool { return out[i].Code < out[j].Code })
	return out
}

// Find runs every rule on s and returns the cautions in rule order.
func Find(s *Step) []Caution {
	var out []Caution
	for _, r := range sortedRules() {
		out = append(out, r.Check(s)...)
	}
	return out
}

// sortedRules is Rules made once: every step of a page asks the rules,
// and the list is complete once the package's init functions have run.
var sortedRules = sync.OnceValue(Rules)

// say builds a message: the finding, then the deferral.
func say(parts ...string) string {
	return strings.Join(parts, " ") + " " + Defer
}

func (s Substance) party() Party { return Party{s.Role, s.Index} }

// display returns how to name a substance in a message.
func (s Substance) display() string {
	if s.Text != "" {
		for _, n := range s.Names {
			if strings.EqualFold(n, s.Text) {
				return s.Text
			}
		}
		if len(s.Names) > 0 { // written as SMILES: name it too
			return s.Text + " (" + s.Names[0] + ")"
		}
		return s.Text
	}
	if len(s.Names) > 0 {
		return s.Names[0]
	}
	return "a substance"
}

// named reports whether any of the substance's names, or its text, equals
// one of want (case-insensitive).
func (s Substance) named(want ...string) bool {
	if equalsAny(s.Text, want) {
		return true
	}
	for _, n := range s.Names {
		if equalsAny(n, want) {
			return true
		}
	}
	return false
}

// equalsAny reports whether n, trimmed, equals one of want
// (case-insensitive).
func equalsAny(n string, want []string) bool {
	n = strings.TrimSpace(n)
	for _, w := range want {
		if strings.EqualFold(n, w) {
			return true
		}
	}
	return false
}

// each returns the substances for which ok holds.
func (st *Step) each(ok func(Substance) bool) []Substance {
	var out []Substance
	for _, s := range st.Substances {
		if ok(s) {
			out = append(out, s)
		}
	}
	return out
}
