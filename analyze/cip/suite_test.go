package cip

import (
	"bufio"
	"os"
	"sort"
	"strconv"
	"strings"
	"testing"

	"walden/analyze/smiles"
)

// suitePath is the even half of the CIP validation suite of Hanson,
// Musacchio, Mayfield, Vainio, Yerin and Redkin, J. Chem. Inf. Model.
// 2018, 58, 1755 (repository CIPValidationSuite/ValidationSuite, file
// compounds.smi, commit 6b9f9db4), as kept in the shared reference folder.
const suitePath = "../../../shared/reference/cip-validation-dev.smi"

type suiteEntry struct {
	smiles, id string
	labels     []string // "12E", "2R": atom number (from 1) and letter
	kinds      []string // TH, CT, AT, HE, ...
}

func readSuite(t testing.TB) []suiteEntry {
	f, err := os.Open(suitePath)
	if err != nil {
		t.Skipf("CIP validation suite not found (%v)", err)
	}
	defer f.Close()
	var out []suiteEntry
	sc := bufio.NewScanner(f)
	sc.Buffer(nil, 1<<20)
	for sc.Scan() {
		cols := strings.Split(sc.Text(), "\t")
		for len(cols) < 6 {
			cols = append(cols, "")
		}
		e := suiteEntry{smiles: cols[0], id: cols[1], labels: strings.Fields(cols[2])}
		if cols[4] != "" {
			e.kinds = strings.Split(cols[4], ",")
		}
		out = append(out, e)
	}
	return out
}

// wantSet expands the suite's labels into a set of "atom letter" strings.
func wantSet(labels []string) []string {
	var out []string
	for _, l := range labels {
		out = append(out, l)
	}
	sort.Strings(out)
	return out
}

// gotSet writes walden's descriptors the way the suite does: one entry
// per atom, numbered from 1.
func gotSet(ds []Descriptor) []string {
	var out []string
	for _, d := range ds {
		for _, a := range d.Atoms {
			if a >= 0 {
				out = append(out, strconv.Itoa(a+1)+d.Label.String())
			}
		}
	}
	sort.Strings(out)
	return out
}

func hasKind(e suiteEntry, k string) bool {
	for _, x := range e.kinds {
		if x == k {
			return true
		}
	}
	return false
}

func TestSuiteDebug(t *testing.T) {
	for _, e := range readSuite(t) {
		m, err := smiles.Parse(e.smiles)
		if err != nil {
			t.Logf("%s parse: %v", e.id, err)
			continue
		}
		ds, err := Label(m)
		got := strings.Join(gotSet(ds), " ")
		want := strings.Join(wantSet(e.labels), " ")
		if got != want {
			t.Logf("%s %v kinds=%v\n  want %s\n  got  %s %v", e.id, e.smiles, e.kinds, want, got, err)
		}
	}
}
