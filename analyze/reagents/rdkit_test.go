package reagents

import (
	"bytes"
	"fmt"
	"os/exec"
	"strings"
	"testing"
)

// Every SMILES of the tables read by RDKit (Debian's python3-rdkit, an
// outside oracle): it must parse, and its net formal charge must be the one
// walden's tables imply (0 for reagents as weighed out and for solvents).
// Skipped when /usr/bin/python3 has no rdkit.
func TestTableSMILESWithRDKit(t *testing.T) {
	if testing.Short() {
		t.Skip("RDKit oracle skipped in -short mode")
	}
	if err := exec.Command("/usr/bin/python3", "-c", "import rdkit").Run(); err != nil {
		t.Skip("RDKit not available (/usr/bin/python3 -c 'import rdkit' failed); CI installs python3-rdkit")
	}
	type item struct{ who, smi string }
	var items []item
	for _, g := range Builtin().reagents {
		items = append(items, item{g.Name() + " whole", g.Whole}, item{g.Name() + " species", g.Species})
	}
	for _, s := range Builtin().solvents {
		items = append(items, item{s.Name(), s.SMILES})
	}
	var in bytes.Buffer
	for _, it := range items {
		fmt.Fprintln(&in, it.smi)
	}
	script := `
import sys
from rdkit import Chem, RDLogger
RDLogger.DisableLog('rdApp.*')
for line in sys.stdin:
    m = Chem.MolFromSmiles(line.strip())
    print('bad' if m is None else Chem.GetFormalCharge(m))
`
	cmd := exec.Command("/usr/bin/python3", "-c", script)
	cmd.Stdin = &in
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("rdkit: %v", err)
	}
	lines := strings.Split(strings.TrimSpace(string(out)), "\n")
	if len(lines) != len(items) {
		t.Fatalf("rdkit answered %d lines for %d SMILES", len(lines), len(items))
	}
	for i, it := range items {
		switch {
		case lines[i] == "bad":
			t.Errorf("%s: RDKit cannot read %q", it.who, it.smi)
		case !strings.HasSuffix(it.who, " species") && lines[i] != "0":
			t.Errorf("%s: %q has net charge %s in RDKit", it.who, it.smi, lines[i])
		}
	}
	t.Logf("%d SMILES read by RDKit", len(items))
}
