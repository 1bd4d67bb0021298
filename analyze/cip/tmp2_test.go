package cip

import (
	"os"
	"strings"
	"testing"
	"time"

	"walden/analyze/smiles"
)

func TestTmpPP(t *testing.T) {
	b, _ := os.ReadFile("/tmp/pp2.smi")
	m, err := smiles.Parse(strings.TrimSpace(string(b)))
	if err != nil {
		t.Fatal(err)
	}
	s := cpuNow2()
	ds, err := Label(m)
	t.Logf("label: %v, %d labels, %v", cpuNow2()-s, len(ds), err)
	s = cpuNow2()
	smiles.Canonical(m)
	t.Logf("canonical: %v", cpuNow2()-s)
}

func cpuNow2() time.Duration { return cpuTime() }
