package cip

import (
	"syscall"
	"testing"
	"time"

	"walden/analyze/molecule"
	"walden/analyze/smiles"
)

func cpuNow() time.Duration {
	var ru syscall.Rusage
	syscall.Getrusage(syscall.RUSAGE_SELF, &ru)
	return time.Duration(ru.Utime.Nano())
}

func TestTemplateCost(t *testing.T) {
	cases := map[string]string{
		"centre":  "[C@H](OC)(c1ccccc1)C(=O)O",
		"alkene":  "C/C(CC)=C/Cl",
		"cyclohex": "[C@H]1(O)CC[C@@H](C)CC1",
		"two":     "C[C@H](Br)[C@H](O)CC",
	}
	for name, s := range cases {
		m, _ := smiles.Parse(s)
		var l Labeller
		ms := []*molecule.Molecule{m}
		start := cpuNow()
		for range 20000 {
			l.Label(ms[0])
		}
		t.Logf("%s: %v per molecule", name, (cpuNow()-start)/20000)
	}
}
