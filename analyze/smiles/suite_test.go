package smiles

import (
	"bufio"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// suitePath is the even-numbered half of the CIP validation suite:
// Hanson, Musacchio, Mayfield, Vainio, Yerin, Redkin, J. Chem. Inf.
// Model. 2018, 58, 1755-1765 (CIPValidationSuite/ValidationSuite,
// compounds.smi). See ../shared/reference/README.md.
const suitePath = "../../../shared/reference/cip-validation-dev.smi"

// suiteSMILES returns the SMILES column of the suite, or skips.
func suiteSMILES(t testing.TB) []string {
	f, err := os.Open(suitePath)
	if err != nil {
		t.Skipf("CIP validation suite not found at %s: %v", suitePath, err)
	}
	defer f.Close()
	var out []string
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		out = append(out, strings.SplitN(line, "\t", 2)[0])
	}
	require.NoError(t, sc.Err())
	return out
}

// Every SMILES of the suite (Hanson et al. 2018) is valid OpenSMILES and
// must read without error.
func TestSuiteParses(t *testing.T) {
	for _, s := range suiteSMILES(t) {
		_, err := Parse(s)
		require.NoError(t, err, s)
	}
}
