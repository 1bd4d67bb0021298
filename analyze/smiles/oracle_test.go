package smiles

import (
	"bytes"
	"math/rand"
	"os"
	"os/exec"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// rdkitPython is Debian's interpreter, which carries python3-rdkit; the
// python3 on PATH may be another build without it.
const rdkitPython = "/usr/bin/python3"

// rdkitCanonical asks RDKit (2022.09, Debian python3-rdkit) for the
// canonical isomeric SMILES of every input, in one process. An input
// RDKit cannot read gives "".
func rdkitCanonical(t *testing.T, smiles []string) []string {
	return rdkitEach(t, "Chem.MolToSmiles(m)", smiles)
}

// rdkitEach reads every input with RDKit in one process and returns the
// Python expression expr, of the molecule m, for each; "" for an input
// RDKit cannot read.
func rdkitEach(t *testing.T, expr string, smiles []string) []string {
	t.Helper()
	if _, err := os.Stat(rdkitPython); err != nil {
		t.Skipf("%s not found; install python3-rdkit to run the RDKit oracle test", rdkitPython)
	}
	check := exec.Command(rdkitPython, "-c", "import rdkit")
	if err := check.Run(); err != nil {
		t.Skipf("%s has no rdkit module; install python3-rdkit to run the RDKit oracle test", rdkitPython)
	}
	script := `
import sys
from rdkit import Chem, RDLogger
RDLogger.DisableLog("rdApp.*")
for line in sys.stdin:
    s = line.rstrip("\n")
    m = Chem.MolFromSmiles(s)
    print(str(` + expr + `) if m is not None else "")
`
	cmd := exec.Command(rdkitPython, "-c", script)
	cmd.Stdin = strings.NewReader(strings.Join(smiles, "\n") + "\n")
	var out, errb bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errb
	require.NoError(t, cmd.Run(), errb.String())
	lines := strings.Split(strings.TrimRight(out.String(), "\n"), "\n")
	require.Len(t, lines, len(smiles))
	return lines
}

// TestRDKitDoubleBondStereo: walden records a cis/trans configuration
// for as many double bonds as RDKit 2022.09 (Debian python3-rdkit)
// assigns stereo to, on the marked double bonds of the hand set and on
// the cases where marks configure nothing: a double bond in a ring of
// fewer than eight atoms, and an end with three neighbours besides its
// double bond. (RDKit also drops a configuration whose end carries two
// like neighbours, which walden leaves to the CIP layer: no such input
// here.)
func TestRDKitDoubleBondStereo(t *testing.T) {
	inputs := []string{
		"F/C=C/F", "F/C=C\\F", "C/C=C/C=C/C", "CCC/C(=C/C)/C=C/C", "C1CCC/C=C/CC1",
		"C1CC/C=C/CC1", "C1C/C=C\\C1",
		"F/[P](C)(C)=C/F", "C[P](/F)(C)=C/F", "F/C=C/[P](C)(C)=C/F", "C/C=C/[S](C)(C)=C/C",
	}
	got := rdkitEach(t, "sum(1 for b in m.GetBonds() if b.GetStereo() != Chem.BondStereo.STEREONONE)", inputs)
	for i, s := range inputs {
		m, err := Parse(s)
		require.NoError(t, err, s)
		assert.Equal(t, got[i], strconv.Itoa(len(m.CisTrans)), "configured double bonds of %s: RDKit, walden", s)
	}
}

// The RDKit oracle: RDKit's canonical form of walden's canonical SMILES
// equals RDKit's canonical form of the input, stereo kept. Source: RDKit
// 2022.09 (Debian python3-rdkit) as an independent implementation of
// SMILES reading and canonicalisation; inputs are the CIP validation
// suite (Hanson et al., J. Chem. Inf. Model. 2018, 58, 1755) and the
// hand-made set. Allene '@' is not read by that RDKit version, so allene
// entries compare without their axial stereo (known limit of the oracle).
func TestRDKitOracle(t *testing.T) {
	inputs := append(append([]string(nil), handSet...), suiteSMILESOrNone()...)
	// Each input goes with walden's canonical SMILES and three random
	// rewrites (random root, branch order, ring numbers, aromatic or
	// Kekulé), so the writer's stereo marks are checked by an independent
	// reader too.
	const per = 5
	r := rand.New(rand.NewSource(3))
	var batch []string
	for _, s := range inputs {
		m, err := Parse(s)
		require.NoError(t, err, s)
		batch = append(batch, s, Canonical(m))
		for range per - 2 {
			batch = append(batch, WriteRandom(m, r))
		}
	}
	got := rdkitCanonical(t, batch)
	agree, compared := 0, 0
	for i := 0; i < len(batch); i += per {
		in := got[i]
		if reason, ok := oracleExceptions[batch[i]]; ok {
			t.Logf("not compared with RDKit: %s: %s", batch[i], reason)
			continue
		}
		compared++
		ok := assert.NotEmpty(t, in, "RDKit cannot read the input %s", batch[i])
		for k := 1; k < per; k++ {
			ok = ok && assert.Equal(t, in, got[i+k], "input %s, walden wrote %s", batch[i], batch[i+k])
		}
		if ok {
			agree++
		}
	}
	t.Logf("RDKit agreement: %d of %d structures compared (%d excepted)", agree, compared, len(batch)/per-compared)
}

// oracleExceptions are inputs where RDKit 2022.09 disagrees with itself,
// so it cannot serve as the oracle; each with the reason.
var oracleExceptions = map[string]string{
	// VS296 of the CIP suite: RDKit does not perceive the central spiro
	// atom as a stereocentre (the suite labels it 9S by rules 4c and 6),
	// drops its mark, and then writes the input and walden's canonical
	// form as two different strings for one structure: its own canonical
	// SMILES of the input read back gives the second string (checked by
	// hand with Chem.MolToSmiles on both).
	"C1[C@@]2(OCCC1)CC[C@]3(CC2)CC[C@@]4(CC3)OCCCC4": "RDKit drops the spiro centre's mark and its canonical form is then order-dependent",
}

// suiteSMILESOrNone is suiteSMILES without the skip, for tests that have
// other inputs too.
func suiteSMILESOrNone() []string {
	if _, err := os.Stat(suitePath); err != nil {
		return nil
	}
	var out []string
	data, _ := os.ReadFile(suitePath)
	for _, line := range strings.Split(string(data), "\n") {
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		out = append(out, strings.SplitN(line, "\t", 2)[0])
	}
	return out
}
