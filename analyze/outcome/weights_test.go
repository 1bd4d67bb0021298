package outcome

import (
	"os"
	"regexp"
	"testing"
)

// TestWeightsExist: every weight the rules read is in weights.tsv with a
// source (DESIGN.md, data provenance).
func TestWeightsExist(t *testing.T) {
	re := regexp.MustCompile(`w\("([a-z0-9-]+)"\)`)
	files, _ := os.ReadDir(".")
	for _, f := range files {
		if f.IsDir() || len(f.Name()) < 3 || f.Name()[len(f.Name())-3:] != ".go" {
			continue
		}
		data, _ := os.ReadFile(f.Name())
		for _, m := range re.FindAllStringSubmatch(string(data), -1) {
			wt, ok := weights[m[1]]
			if !ok {
				t.Errorf("%s: weight %q not in weights.tsv", f.Name(), m[1])
			} else if wt.Source == "" {
				t.Errorf("weight %q has no source", m[1])
			}
		}
	}
}

// TestCompare: same structure, configuration-only difference, different
// constitution.
func TestCompare(t *testing.T) {
	// (S)-2-azidooctane is the SN2 product of (R)-2-bromooctane
	// (../shared/reference/outcomes-dev.tsv D29, RDKit CIP checked).
	pred := mustParse(t, "CCCCCC[C@H](C)N=[N+]=[N-]")
	if c := Compare(mustParse(t, "[N-]=[N+]=N[C@@H](C)CCCCCC"), pred); !c.Same {
		t.Errorf("same molecule written differently: %+v", c)
	}
	c := Compare(mustParse(t, "CCCCCC[C@@H](C)N=[N+]=[N-]"), pred)
	if c.Same || !c.SameConstitution || c.Explanation == "" {
		t.Errorf("enantiomer: %+v", c)
	}
	c = Compare(mustParse(t, "CCCCCCC(C)N=[N+]=[N-]"), pred)
	if c.Same || !c.SameConstitution {
		t.Errorf("unassigned: %+v", c)
	}
	c = Compare(mustParse(t, "CCCCCCCCN=[N+]=[N-]"), pred)
	if c.SameConstitution {
		t.Errorf("regioisomer: %+v", c)
	}
}
