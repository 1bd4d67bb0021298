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

	check func(finder) []Caution // what Check runs; Find calls it directly
}

var rules []Rule

// register adds a rule given by its check; Check is made from it.
func register(r Rule) {
	check := r.check
	r.Check = func(s *Step) []Caution { return check(newFinder(s)) }
	rules = append(rules, r)
}

// Rules returns every rule, sorted by code.
func Rules() []Rule {
	out := append([]Rule(nil), rules...)
	sort.Slice(out, func(i, j int) bool { return out[i].Code < out[j].Code })
	return out
}

// Find runs every rule on s and returns the cautions in rule order.
// The name sets of every substance are worked out once here rather than
// by each rule (see finder).
func Find(s *Step) []Caution {
	f := newFinder(s)
	var out []Caution
	for _, r := range sortedRules() {
		out = append(out, r.check(f)...)
	}
	return out
}

// sortedRules is Rules made once: every step of a page asks the rules,
// and the list is complete once the package's init functions have run.
var sortedRules = sync.OnceValue(Rules)

// say builds a message: the finding, then the deferral, in one
// allocation.
func say(parts ...string) string {
	n := len(Defer)
	for _, p := range parts {
		n += len(p) + 1
	}
	var b strings.Builder
	b.Grow(n)
	for i, p := range parts {
		if i > 0 {
			b.WriteByte(' ')
		}
		b.WriteString(p)
	}
	b.WriteByte(' ')
	b.WriteString(Defer)
	return b.String()
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

// named reports whether any of the substance's names, or its text,
// trimmed, equals one of want (case-insensitive).
func (s *Substance) named(want *nameSet) bool {
	if want.has(s.Text) {
		return true
	}
	for _, n := range s.Names {
		if want.has(n) {
			return true
		}
	}
	return false
}

// finder is a step as the rules see it: the step, and for each of its
// first maxSets substances the name sets its text or names belong to.
// The rules ask about names many times per substance (each asks its own
// sets, several rules ask the same), and a dictionary entry carries a
// dozen synonyms: reading each name once makes every later question one
// bit test. Which substances are acids, which two rules ask, is worked
// out once too. It is passed by value, so it costs no allocation.
type finder struct {
	*Step
	sets  [maxSets]uint32
	acids uint32 // bit i: substance i is an acid (see isAcid)
}

// maxSets is how many substances a finder keeps name sets for; a longer
// step asks about the rest name by name.
const maxSets = 8

func newFinder(s *Step) finder {
	f := finder{Step: s}
	for i := range min(len(s.Substances), maxSets) {
		x := &s.Substances[i]
		bits := setsOf(x.Text)
		for _, n := range x.Names {
			bits |= setsOf(n)
		}
		f.sets[i] = bits
		if isAcid(x) {
			f.acids |= 1 << i
		}
	}
	return f
}

// isAcid reports an acid: listed as one by the dictionary, or one by shape.
func isAcid(x *Substance) bool { return x.Acid || strongAcid(x.Mol) }

// acid reports whether substance i is an acid.
func (f *finder) acid(i int) bool {
	if i < maxSets {
		return f.acids&(1<<i) != 0
	}
	return isAcid(&f.Substances[i])
}

// named reports whether substance i is named by one of want.
func (f *finder) named(i int, want *nameSet) bool {
	if i < maxSets {
		return f.sets[i]&want.bit != 0
	}
	return f.Substances[i].named(want)
}

// each appends to out the indices in Substances of the substances for
// which ok holds. Callers pass a small array of their own as out: a step
// has few substances, and copying them out cost an allocation per rule
// and step.
func (f *finder) each(out []int, ok func(i int) bool) []int {
	for i := range f.Substances {
		if ok(i) {
			out = append(out, i)
		}
	}
	return out
}
