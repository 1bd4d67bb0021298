package cip

import (
	"errors"
	"math/rand"
	"sort"
	"strconv"
	"strings"
	"testing"

	"walden/analyze/molecule"
	"walden/analyze/smiles"
)

// labelKey writes each descriptor with an order-free description of its
// atoms (element, degree, hydrogens), so that the labels of a molecule
// and of its canonical rewriting, whose atoms come in another order, can
// be compared as multisets.
func labelKey(m *molecule.Molecule, ds []Descriptor) string {
	var keys []string
	atom := func(i int) string {
		return m.Atoms[i].Element.Symbol() + strconv.Itoa(m.Degree(i)) + "h" + strconv.Itoa(m.HydrogenCount(i)) + "i" + strconv.Itoa(m.Atoms[i].Isotope)
	}
	for _, d := range ds {
		k := atom(d.Atoms[0])
		if d.Atoms[1] >= 0 {
			a, b := k, atom(d.Atoms[1])
			if b < a {
				a, b = b, a
			}
			k = a + "=" + b
		}
		keys = append(keys, k+":"+d.Label.String())
	}
	sort.Strings(keys)
	return strings.Join(keys, " ")
}

// TestRoundTripKeepsLabels writes every suite entry and every generated
// molecule with smiles.Canonical (and once more in a random writing),
// reads it back, and checks that the CIP
// labels are the same (issue 2: "writing and re-reading keeps every CIP
// label"). The expected labels are the ones checked against the suite
// (Hanson et al. 2018) and against RDKit in the other tests.
func TestRoundTripKeepsLabels(t *testing.T) {
	var inputs []string
	for _, e := range readSuite(t) {
		inputs = append(inputs, e.smiles)
	}
	gen := newStereoGenerator(7)
	n := 3000
	if testing.Short() {
		n = 500
	}
	for range n {
		inputs = append(inputs, gen.next())
	}
	var l Labeller
	rng := rand.New(rand.NewSource(11))
	checked := 0
	for _, s := range inputs {
		m, err := smiles.Parse(s)
		if err != nil {
			continue // invalid generated strings
		}
		ds, err := l.Label(m)
		if err != nil {
			t.Errorf("%s: %v", s, err)
			continue
		}
		c := smiles.Canonical(m)
		m2, err := smiles.Parse(c)
		if err != nil {
			t.Errorf("%s: canonical %s does not read back: %v", s, c, err)
			continue
		}
		ds2, err := l.Label(m2)
		if err != nil {
			t.Errorf("%s: %v", c, err)
			continue
		}
		if a, b := labelKey(m, ds), labelKey(m2, ds2); a != b {
			t.Errorf("%s -> %s:\n labels %s\n became %s", s, c, a, b)
		}
		// Any other writing (random root, branch order, ring numbers,
		// aromatic or Kekulé) must keep the labels as well.
		w := smiles.WriteRandom(m, rng)
		m3, err := smiles.Parse(w)
		if err != nil {
			t.Errorf("%s: random writing %s does not read back: %v", s, w, err)
			continue
		}
		ds3, err := l.Label(m3)
		if a, b := labelKey(m, ds), labelKey(m3, ds3); err != nil || a != b {
			t.Errorf("%s -> %s:\n labels %s\n became %s (%v)", s, w, a, b, err)
		}
		checked++
	}
	t.Logf("round trip through smiles.Canonical kept the labels of %d molecules", checked)
}

// TestBudget checks that a pathological cage stops at the node limit with
// a typed error instead of running on, and that other units are still
// labelled.
func TestBudget(t *testing.T) {
	// Two long chains that differ only at their far ends: ranking them
	// explores the whole of both, more than a 30-node budget allows.
	m, err := smiles.Parse("C[C@H](CCCCCCCCCCCCO)CCCCCCCCCCCCN")
	if err != nil {
		t.Fatal(err)
	}
	l := Labeller{NodeLimit: 30}
	_, err = l.Label(m)
	var be *BudgetError
	if !errors.As(err, &be) {
		t.Fatalf("got %v, want a *BudgetError", err)
	}
	if be.Atoms != [2]int{1, -1} || be.Limit != 30 {
		t.Errorf("got %+v", be)
	}
	// With the default limit the same molecule is labelled.
	ds, err := Label(m)
	if err != nil || len(ds) != 1 {
		t.Errorf("default limit: %v, %v", ds, err)
	}
}
