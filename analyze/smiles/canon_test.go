package smiles

import (
	"fmt"
	"math/rand"
	"path/filepath"
	"strings"
	"testing"
	"walden/internal/golden"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// handSet is a hand-made set of structures for the canonical form:
// symmetric stereo (cis/trans-1,4-dimethylcyclohexane, meso and chiral
// tartaric acid, inositol-like rings), conjugated and ring cis/trans,
// allenes, charged and fused aromatics, isotopes and classes, several
// components. Structures are common textbook examples (common practice).
var handSet = []string{
	"C[C@H]1CC[C@@H](C)CC1",                             // cis-1,4-dimethylcyclohexane
	"C[C@H]1CC[C@H](C)CC1",                              // trans
	"O[C@H](C(=O)O)[C@@H](O)C(=O)O",                     // meso-tartaric acid
	"O[C@H](C(=O)O)[C@H](O)C(=O)O",                      // (R,R) or (S,S)
	"O[C@H]1[C@H](O)[C@@H](O)[C@H](O)[C@@H](O)[C@@H]1O", // an inositol
	"Cl[C@H]1[C@H](Cl)[C@@H](Cl)[C@H](Cl)[C@@H](Cl)[C@@H]1Cl",
	"C/C=C/C=C/C",
	"C/C=C\\C=C/C",
	"C/C=C/C(=C/C)/C=C/C",
	"CCC/C(=C/C)/C=C/C",  // branched diene: a mark shared by both double bonds
	"CCC/C(=C\\C)/C=C/C", // its (Z) isomer at the branched double bond
	"F/C=C/F",
	"F/C=C\\F",
	"C/1=C/CCCCCC1",
	"C/C=C/1C(/C=C1)=C2\\CC2", // marks on a cyclobutene's ring double bond say nothing (found by FuzzRoundTrip)
	"C1CCC/C=C/CC1",
	"F/[P](C)(C)=C/F",     // marks at a double-bond end with three other neighbours say nothing
	"F/C=C/[P](C)(C)=C/F", // beside a configured bond, which keeps its own
	"CC=[C@]=CC",
	"CC=[C@@]=CC",
	"NC(Br)=[C@]=C(O)C",
	"Br\\C=C=C=C\\Cl",
	"c1ccccc1",
	"C1=CC=CC=C1",
	"c1ccc2ccccc2c1",
	"c1ccc2cccc2cc1",
	"c1ccc2c(c1)ccc1ccccc12",
	"c1cc[nH]c1",
	"Cn1cnc2c1c(=O)n(C)c(=O)n2C",
	"O=c1cc[nH]cc1",
	"[cH-]1cccc1",
	"[cH+]1cccccc1",
	"C[n+]1ccccc1",
	"c1ccsc1",
	"c1ccoc1",
	"[13CH3][C@H](O)[2H]",
	"C[C@@H](O)CC",
	"N[C@@H](C)C(=O)O",
	"[NH3+][C@@H](C)C(=O)[O-]",
	"C[S@](=O)c1ccccc1",
	"C[S@@](=O)c1ccccc1",
	"C[P@](c1ccccc1)CC",
	"[Na+].[Cl-]",
	"CC(=O)O.OCC",
	"[CH3:1][OH:2]",
	"C1CC2CCC1CC2",
	"C12C3C4C1C5C2C3C45", // cubane
	"C[C@]12CC[C@H]3[C@@H](CCc4cc(O)ccc34)[C@@H]1CC[C@@H]2O", // estradiol
	"OC[C@H]1OC(O)[C@H](O)[C@@H](O)[C@@H]1O",
	"C[C@H]1C[C@@H](C)C[C@H](C)C1",
	"C[C@H]1C[C@H](C)C[C@H](C)C1",
	"F[C@](Cl)(Br)I",
	"[2H][C@@](F)(Cl)Br",
}

// canonicalOf parses s and returns its canonical SMILES.
func canonicalOf(t *testing.T, s string) string {
	t.Helper()
	m, err := Parse(s)
	require.NoError(t, err, s)
	return Canonical(m)
}

// invariance checks that n random rewrites of s give the canonical
// SMILES of s, and that the canonical SMILES reads back to itself.
func invariance(t *testing.T, s string, n int, r *rand.Rand) {
	t.Helper()
	m, err := Parse(s)
	require.NoError(t, err, s)
	want := Canonical(m)
	again := canonicalOf(t, want)
	assert.Equal(t, want, again, "canonical of canonical, input %s", s)
	for range n {
		w := WriteRandom(m, r)
		m2, err := Parse(w)
		if !assert.NoError(t, err, "random rewrite %s of %s", w, s) {
			return
		}
		if got := Canonical(m2); got != want {
			assert.Equal(t, want, got, "random rewrite %s of %s", w, s)
			return
		}
	}
}

func TestCanonicalHandSet(t *testing.T) {
	r := rand.New(rand.NewSource(7))
	for _, s := range handSet {
		invariance(t, s, 50, r)
	}
}

// The CIP validation suite (Hanson et al., J. Chem. Inf. Model. 2018,
// 58, 1755) gives varied stereo structures; 50 random rewrites of each
// must canonicalise alike.
func TestCanonicalSuite(t *testing.T) {
	r := rand.New(rand.NewSource(11))
	n := 50
	if testing.Short() {
		n = 5
	}
	for _, s := range suiteSMILES(t) {
		invariance(t, s, n, r)
	}
}

// Distinct structures must stay distinct: stereoisomers and Kekulé
// versus aromatic are checked against their known relation (common
// practice): cis and trans differ; meso and chiral tartaric acid differ;
// benzene in both forms is one.
func TestCanonicalDistinguishes(t *testing.T) {
	pairs := []struct {
		a, b string
		same bool
	}{
		{"C[C@H]1CC[C@@H](C)CC1", "C[C@H]1CC[C@H](C)CC1", false},
		{"O[C@H](C(=O)O)[C@@H](O)C(=O)O", "O[C@H](C(=O)O)[C@H](O)C(=O)O", false},
		{"O[C@H](C(=O)O)[C@@H](O)C(=O)O", "O[C@@H](C(=O)O)[C@H](O)C(=O)O", true}, // meso: mirror is itself
		{"O[C@H](C(=O)O)[C@H](O)C(=O)O", "O[C@@H](C(=O)O)[C@@H](O)C(=O)O", false},
		{"F/C=C/F", "F/C=C\\F", false},
		{"F/C=C/F", "F\\C=C\\F", true},
		{"C1=CC=CC=C1", "c1ccccc1", true},
		{"C1=CC2=CC=CC=C2C=C1", "c1ccc2ccccc2c1", true},
		{"C1=CC=C2C=CC=CC=C12", "c1ccc2cccc2cc1", true}, // azulene
		{"N[C@@H](C)C(=O)O", "N[C@H](C)C(=O)O", false},
		{"CC=[C@]=CC", "CC=[C@@]=CC", false},
		{"C[S@](=O)c1ccccc1", "C[S@@](=O)c1ccccc1", false},
		// 1,3,5-trimethylcyclohexane: the first two writings are one
		// diastereomer, the third another (RDKit 2022.09, Debian
		// python3-rdkit, canonical SMILES).
		{"C[C@H]1C[C@@H](C)C[C@H](C)C1", "C[C@H]1C[C@H](C)C[C@H](C)C1", true},
		{"C[C@H]1C[C@@H](C)C[C@@H](C)C1", "C[C@H]1C[C@H](C)C[C@H](C)C1", false},
		{"C1=CNC=C1", "c1cc[nH]c1", true},
	}
	for _, p := range pairs {
		a, b := canonicalOf(t, p.a), canonicalOf(t, p.b)
		if p.same {
			assert.Equal(t, a, b, "%s vs %s", p.a, p.b)
		} else {
			assert.NotEqual(t, a, b, "%s vs %s", p.a, p.b)
		}
	}
}

// TestCanonicalGolden records the canonical SMILES of the hand set and
// the suite in testdata/canonical.golden, so that any change of the
// canonical form shows in review. This is a regression record, not a
// check against the world: TestRDKitOracle is that check.
func TestCanonicalGolden(t *testing.T) {
	var b strings.Builder
	for _, s := range append(append([]string(nil), handSet...), suiteSMILESOrNone()...) {
		fmt.Fprintf(&b, "%s\t%s\n", s, canonicalOf(t, s))
	}
	golden.Check(t, filepath.Join("testdata", "canonical.golden"), b.String())
}
