package smiles

import (
	"fmt"
	"path/filepath"
	"strings"
	"testing"
	"walden/internal/golden"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"walden/analyze/molecule"
)

// hydrogens lists the total hydrogen count of every atom.
func hydrogens(m *molecule.Molecule) []int {
	h := make([]int, len(m.Atoms))
	for i := range m.Atoms {
		h[i] = m.Atoms[i].ImplicitH
	}
	return h
}

// Hydrogen counts follow the OpenSMILES specification, section 3.1.5
// (default valences of the organic subset; bracket atoms state theirs),
// checked by hand against the structural formulae (common practice).
func TestParseHydrogens(t *testing.T) {
	tests := []struct {
		smiles string
		h      []int
	}{
		{"C", []int{4}},
		{"CCO", []int{3, 2, 1}},
		{"C=O", []int{2, 0}},
		{"C#N", []int{1, 0}},
		{"CS(=O)(=O)C", []int{3, 0, 0, 0, 3}},         // S at valence 6
		{"CS(=O)C", []int{3, 0, 0, 3}},                // S at valence 4
		{"CP(C)C", []int{3, 0, 3, 3}},                 // P at valence 3
		{"O=P(O)(O)O", []int{0, 0, 1, 1, 1}},          // P at valence 5
		{"[NH4+]", []int{4}},                          // stated
		{"[CH3-]", []int{3}},                          // stated
		{"[Na+].[Cl-]", []int{0, 0}},                  // bracket atoms default to none
		{"[H][H]", []int{0, 0}},                       // hydrogen atoms are atoms
		{"ClCBr", []int{0, 2, 0}},                     // two-letter organic atoms
		{"c1ccccc1", []int{1, 1, 1, 1, 1, 1}},         // benzene
		{"c1cc[nH]c1", []int{1, 1, 1, 1, 1}},          // pyrrole
		{"c1ccncc1", []int{1, 1, 1, 0, 1, 1}},         // pyridine
		{"O=c1cc[nH]cc1", []int{0, 0, 1, 1, 1, 1, 1}}, // 4-pyridone
		{"Cc1ccccc1", []int{3, 0, 1, 1, 1, 1, 1}},
		{"*C", []int{0, 3}},
		{"[2H]C([2H])([2H])O", []int{0, 0, 0, 0, 1}},
		{"B(C)(C)C", []int{0, 3, 3, 3}},
		{"FC(F)(F)I", []int{0, 0, 0, 0, 0}},
	}
	for _, tt := range tests {
		t.Run(tt.smiles, func(t *testing.T) {
			m, err := Parse(tt.smiles)
			require.NoError(t, err)
			assert.Equal(t, tt.h, hydrogens(m))
		})
	}
}

// Bracket atom fields, OpenSMILES section 3.1 (atoms).
func TestParseBracketAtom(t *testing.T) {
	tests := []struct {
		smiles string
		want   molecule.Atom
	}{
		{"[13CH4]", molecule.Atom{Element: molecule.C, Isotope: 13, ImplicitH: 4, Bracket: true}},
		{"[Fe+2]", molecule.Atom{Element: 26, Charge: 2, Bracket: true}},
		{"[Fe++]", molecule.Atom{Element: 26, Charge: 2, Bracket: true}},
		{"[O-2]", molecule.Atom{Element: molecule.O, Charge: -2, Bracket: true}},
		{"[O--]", molecule.Atom{Element: molecule.O, Charge: -2, Bracket: true}},
		{"[NH4+]", molecule.Atom{Element: molecule.N, Charge: 1, ImplicitH: 4, Bracket: true}},
		{"[CH3:7]", molecule.Atom{Element: molecule.C, ImplicitH: 3, Class: 7, Bracket: true}},
		{"[2H+]", molecule.Atom{Element: molecule.H, Isotope: 2, Charge: 1, Bracket: true}},
		{"[*]", molecule.Atom{Element: 0, Bracket: true}},
		{"[Sc]", molecule.Atom{Element: 21, Bracket: true}},
		{"[se]1cccc1", molecule.Atom{Element: molecule.Se, Aromatic: true, Bracket: true}},
		{"[Cl-]", molecule.Atom{Element: molecule.Cl, Charge: -1, Bracket: true}},
	}
	for _, tt := range tests {
		t.Run(tt.smiles, func(t *testing.T) {
			m, err := Parse(tt.smiles)
			require.NoError(t, err)
			got := m.Atoms[0]
			got.Span = molecule.Span{}
			assert.Equal(t, tt.want, got)
		})
	}
}

// doubleBonds counts Kekulé double bonds.
func doubleBonds(m *molecule.Molecule) int {
	n := 0
	for _, b := range m.Bonds {
		if b.Order == 2 {
			n++
		}
	}
	return n
}

// valenceOK checks that every aromatic carbon ends with four bonds and
// hydrogens, the property a Kekulé structure must have (common practice).
func valenceOK(t *testing.T, m *molecule.Molecule) {
	for i, a := range m.Atoms {
		if a.Aromatic && a.Element == molecule.C {
			v := m.BondOrderSum(i) + a.ImplicitH + abs(a.Charge)
			assert.Equal(t, 4, v, "carbon %d valence", i+1)
		}
	}
}

// The number of C=C/C=N double bonds in each Kekulé structure follows
// from the structural formulae (common practice: benzene 3, naphthalene 5,
// azulene 5, pyrrole 2, cyclopentadienide 2, tropylium 3, pyridinium 3,
// indole 4, carbazole 6, caffeine's imidazole and pyrimidinedione rings 4
// including the two C=O).
func TestKekulise(t *testing.T) {
	tests := []struct {
		smiles  string
		doubles int
	}{
		{"c1ccccc1", 3},
		{"c1ccc2ccccc2c1", 5},
		{"c1ccc2cccc2cc1", 5}, // azulene: 5- and 7-ring, not bipartite
		{"c1cc[nH]c1", 2},
		{"[cH-]1cccc1", 2},
		{"[cH+]1cccccc1", 3},
		{"c1cc[nH+]cc1", 3},
		{"C[n+]1ccccc1", 3},
		{"c1cc[n+]cc1", 3},
		{"c1ccc2[nH]ccc2c1", 4},
		{"c1ccc2c(c1)[nH]c1ccccc12", 6},
		{"Cn1cnc2c1c(=O)n(C)c(=O)n2C", 4},
		{"c1ccoc1", 2},
		{"c1ccsc1", 2},
		{"o1cccc1", 2},
		{"c1cc[o+]cc1", 3},
		{"c1ccc2c(c1)c1ccccc1c1ccccc21", 9}, // triphenylene
		{"c1ccc(cc1)-c1ccccc1", 6},          // biphenyl, explicit single
		{"c1ccc(cc1)c1ccccc1", 6},           // biphenyl, implicit bond
		{"c12ccccc1cccc2", 5},
		{"n1ccnc1", -1}, // imidazole without [nH]
		{"c1ccnc1", -1}, // pyrrole without [nH]
		{"c1cccc1", -1}, // cyclopentadienyl without charge
		{"cC", -1},      // aromatic atom outside a ring
	}
	for _, tt := range tests {
		t.Run(tt.smiles, func(t *testing.T) {
			m, err := Parse(tt.smiles)
			if tt.doubles < 0 {
				require.Error(t, err)
				assert.Contains(t, err.Error(), "no Kekulé form")
				return
			}
			require.NoError(t, err)
			assert.Equal(t, tt.doubles, doubleBonds(m))
			valenceOK(t, m)
		})
	}
}

// Every error must point at the offending bytes. Spans are checked here;
// the full messages are in testdata/errors.golden.
func TestParseErrors(t *testing.T) {
	tests := []struct {
		smiles string
		spans  []molecule.Span
	}{
		{"", []molecule.Span{sp(0, 0)}},
		{"C(C", []molecule.Span{sp(1, 2)}},
		{"CC)", []molecule.Span{sp(2, 3)}},
		{"C1CC", []molecule.Span{sp(1, 2)}},
		{"C%1C", []molecule.Span{sp(1, 3)}},
		{"C==C", []molecule.Span{sp(2, 3)}},
		{"=C", []molecule.Span{sp(0, 1)}},
		{"CC=", []molecule.Span{sp(2, 3)}},
		{"C()C", []molecule.Span{sp(1, 3)}},
		{"C=(O)C", []molecule.Span{sp(1, 3)}},
		{"NaCl", []molecule.Span{sp(0, 2)}},
		{"C12CC2", []molecule.Span{sp(1, 2)}},
		{"C[Xx]C", []molecule.Span{sp(2, 3)}},
		{"C[C", []molecule.Span{sp(1, 3)}},
		{"C[CH3+]]", []molecule.Span{sp(7, 8)}},
		{"[C@SP1](F)(Cl)(Br)I", []molecule.Span{sp(2, 6)}},
		{"[C@OH12](F)(Cl)(Br)I", []molecule.Span{sp(2, 7)}},
		{"[C@TB5](F)(Cl)(Br)I", []molecule.Span{sp(2, 6)}},
		{"[C@TH3](F)(Cl)(Br)I", []molecule.Span{sp(2, 6)}},
		{"F[C@H]F", []molecule.Span{sp(3, 4)}},
		{"C[N@](F)Cl", nil},
		{"C-1CC=1", []molecule.Span{sp(1, 7)}},
		{"C1CC1C11", []molecule.Span{sp(6, 8)}},
		{"C12CC12", []molecule.Span{sp(6, 7)}},
		{"c1ccnc1", []molecule.Span{sp(5, 6)}},
		{"C/C=C", []molecule.Span{sp(1, 2)}},
		{"F/C(\\Cl)=C/F", []molecule.Span{sp(4, 5)}},
		{"C/1=C/CCCCCC/1", []molecule.Span{sp(1, 14)}},
		{"C C", []molecule.Span{sp(1, 2)}},
		{"C[Fe+16]", []molecule.Span{sp(4, 7)}},
		{"C[C@](F)Cl", []molecule.Span{sp(3, 4)}},
		{"C→C", []molecule.Span{sp(1, 4)}},
		{"H", []molecule.Span{sp(0, 1)}},
	}
	var msgs strings.Builder
	for _, tt := range tests {
		t.Run(tt.smiles, func(t *testing.T) {
			_, err := Parse(tt.smiles)
			if tt.spans == nil {
				// Three neighbours on N, P, S... is a centre with a lone
				// pair (OpenSMILES 3.9.3), so no error.
				assert.NoError(t, err)
				return
			}
			require.Error(t, err)
			list := err.(ErrorList)
			var spans []molecule.Span
			fmt.Fprintf(&msgs, "%q\n", tt.smiles)
			for _, e := range list {
				spans = append(spans, e.Span)
				fmt.Fprintf(&msgs, "\t%d-%d %s\n", e.Span.Start, e.Span.End, e.Msg)
				assert.LessOrEqual(t, e.Span.End, len(tt.smiles))
			}
			assert.Equal(t, tt.spans, spans)
		})
	}
	golden.Check(t, filepath.Join("testdata", "errors.golden"), msgs.String())
}

// Hostile input is refused by the documented limits, with a message.
func TestParseLimits(t *testing.T) {
	long := strings.Repeat("C", MaxAtoms+10)
	_, err := Parse(long)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "atoms")

	huge := strings.Repeat("C", MaxLength+1)
	_, err = Parse(huge)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "longer than the limit")

	deep := "C" + strings.Repeat("(C", MaxBranchDepth+5) + strings.Repeat(")", MaxBranchDepth+5)
	_, err = Parse(deep)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "nested deeper")

	var rings strings.Builder
	rings.WriteString("C")
	for i := range 3000 {
		fmt.Fprintf(&rings, "%%%02d", i%100)
	}
	_, err = Parse(rings.String())
	require.Error(t, err)

	junk := strings.Repeat("?", 10000)
	_, err = Parse(junk)
	require.Error(t, err)
	assert.LessOrEqual(t, len(err.(ErrorList)), MaxErrors+1)
}

// canonicalWinding returns the winding of the centre's configuration when
// its references are listed in the order given by key (an element-based
// order chosen by the test), so centres read from different writings can
// be compared.
func windingByOrder(t *testing.T, tet molecule.Tetrahedral, order [4]int) molecule.Winding {
	t.Helper()
	w := tet.Winding
	if permutationOdd(tet.Refs[:], order[:]) {
		w = w.Invert()
	}
	return w
}

// Different writings of one centre describe the same configuration
// (OpenSMILES section 3.9.3: swapping two neighbours inverts @/@@; the
// implicit hydrogen takes the place right after the preceding atom, or
// the first place when the centre comes first). Checked against the
// worked examples of that section (N[C@](C)(F)C(=O)O and its rewritings)
// and RDKit's canonical SMILES of each form (RDKit 2022.09, Debian
// python3-rdkit: all forms of a group canonicalise alike).
func TestTetrahedralWritings(t *testing.T) {
	groups := [][]string{
		{"N[C@](Br)(O)C", "Br[C@](O)(N)C", "O[C@](Br)(C)N", "Br[C@](C)(O)N", "C[C@](Br)(N)O", "Br[C@](N)(C)O", "C[C@@](Br)(O)N", "Br[C@@](N)(O)C", "[C@@](C)(Br)(O)N", "[C@@](Br)(N)(O)C"},
		{"F[C@H](Cl)Br", "F[C@@H](Br)Cl", "[C@@H](F)(Cl)Br", "Cl[C@@H](F)Br", "Br[C@@H](Cl)F", "[H][C@@](F)(Cl)Br"},
		{"C[C@H]1CCCCO1", "C[C@@H](CCCC1)O1", "O1CCCC[C@@H]1C", "[C@H]1(C)CCCCO1", "C1CCO[C@@H](C)C1"},
		{"C[S@](=O)CC", "CC[S@@](=O)C", "O=[S@@](C)CC", "[S@](=O)(C)CC"},
	}
	for _, g := range groups {
		var want molecule.Winding
		for k, s := range g {
			m, err := Parse(s)
			require.NoError(t, err, s)
			require.Len(t, m.Tetrahedral, 1, s)
			tet := m.Tetrahedral[0]
			order := refOrder(m, tet)
			w := windingByOrder(t, tet, order)
			if k == 0 {
				want = w
				continue
			}
			assert.Equal(t, want, w, "%s vs %s", s, g[0])
		}
	}
}

// refOrder sorts a centre's references by an order that does not depend
// on the writing: element (hydrogen or lone pair last), then for carbons
// by degree, then for ring atoms by their neighbours' elements. Enough for
// the small test molecules above, where no two references tie.
func refOrder(m *molecule.Molecule, tet molecule.Tetrahedral) [4]int {
	key := func(r int) int {
		if r == molecule.Implicit {
			return 1 << 20
		}
		if m.Atoms[r].Element == molecule.H {
			return 1 << 19
		}
		k := int(m.Atoms[r].Element) * 1000
		k += m.Degree(r) * 100
		for _, e := range m.Edges(r) {
			k += int(m.Atoms[e.Atom].Element)
		}
		return k
	}
	o := tet.Refs
	for i := 1; i < 4; i++ {
		for j := i; j > 0 && key(o[j]) < key(o[j-1]); j-- {
			o[j], o[j-1] = o[j-1], o[j]
		}
	}
	return o
}

// Cis/trans reading, OpenSMILES section 3.9.5: F/C=C/F is trans and
// F/C=C\F cis; marks on ring-closure bonds read as if the partner followed
// the digit. Expected configurations agree with RDKit 2022.09 (Debian
// python3-rdkit), e.g. C/1=C/CCCCCC1 is Z there.
func TestCisTrans(t *testing.T) {
	tests := []struct {
		smiles string
		want   []molecule.Config // per CisTrans, reading refs as parsed
		refs   [][2]molecule.Element
	}{
		{"F/C=C/F", []molecule.Config{molecule.Opposite}, nil},
		{"F\\C=C\\F", []molecule.Config{molecule.Opposite}, nil},
		{"F/C=C\\F", []molecule.Config{molecule.Together}, nil},
		{"C(/F)=C/F", []molecule.Config{molecule.Together}, nil},
		{"C(\\F)=C/F", []molecule.Config{molecule.Opposite}, nil},
		{"C/C=C/C=C/C", []molecule.Config{molecule.Opposite, molecule.Opposite}, nil},
		{"C/C=C\\C=C/C", []molecule.Config{molecule.Together, molecule.Together}, nil},
		{"C/1=C/CCCCCC1", []molecule.Config{molecule.Together}, nil},
		{"C1CCCCC/C=C/1", []molecule.Config{molecule.Opposite}, nil},
		{"C1CCC/C=C/CC1", []molecule.Config{molecule.Opposite}, nil},
		{"Br\\C=C=C=C\\Cl", []molecule.Config{molecule.Opposite}, nil},
		{"F/C(Cl)=C/F", []molecule.Config{molecule.Opposite}, nil},
		{"F/C(/Cl)=C/F", []molecule.Config{molecule.Opposite}, nil},
		{"C/1=C/CCCCCC\\1", []molecule.Config{molecule.Together}, nil},
		{"C1=C/CCCCCC/1", []molecule.Config{molecule.Opposite}, nil},
		// A ring of fewer than eight atoms holds its double bond cis
		// whatever the marks say (common practice; RDKit assigns these
		// no stereo either): nothing is recorded.
		{"C1CC/C=C/CC1", nil, nil},
		{"C1C/C=C\\C1", nil, nil},
		// An end with three neighbours besides its double bond has no
		// two sides (common practice; RDKit 2022.09 assigns it no stereo
		// either, TestRDKitDoubleBondStereo): nothing is
		// recorded, wherever the marks stand.
		{"F/[P](C)(C)=C/F", nil, nil},
		{"C[P](/F)(C)=C/F", nil, nil},
		// Beside it, an ordinary configured bond keeps its own.
		{"F/C=C/[P](C)(C)=C", []molecule.Config{molecule.Opposite}, nil},
	}
	for _, tt := range tests {
		t.Run(tt.smiles, func(t *testing.T) {
			m, err := Parse(tt.smiles)
			require.NoError(t, err)
			var got []molecule.Config
			for _, c := range m.CisTrans {
				got = append(got, c.Config)
			}
			assert.Equal(t, tt.want, got)
		})
	}
}

// Allene '@' on the central atom (OpenSMILES section 3.9.6, extended
// tetrahedral): reading NC(Br)=[C@]=C(O)C looks from N at Br, O, C.
func TestAllene(t *testing.T) {
	m, err := Parse("NC(Br)=[C@]=C(O)C")
	require.NoError(t, err)
	require.Len(t, m.Axial, 1)
	ax := m.Axial[0]
	assert.Equal(t, [2]int{1, 4}, ax.Ends)
	assert.Equal(t, [4]int{0, 2, 5, 6}, ax.Refs)
	assert.Equal(t, molecule.Anticlockwise, ax.Winding)

	// The same allene with the Br written after the far end: N, O, C, Br
	// in reading order; regrouped to N, Br, O, C is an even permutation
	// (Br moved past two), so the winding stays.
	m, err = Parse("NC(=[C@]=C(O)C)Br")
	require.NoError(t, err)
	require.Len(t, m.Axial, 1)
	assert.Equal(t, [4]int{0, 6, 4, 5}, m.Axial[0].Refs)
	assert.Equal(t, molecule.Anticlockwise, m.Axial[0].Winding)
}

func TestLonePairCentre(t *testing.T) {
	// Sulfoxide, OpenSMILES section 3.9.3: the lone pair sits where an
	// implicit hydrogen would. For a centre written first RDKit 2022.09
	// differs (it reads [S@](C)(=O)CC like C[S@](=O)CC); walden follows
	// the specification and never writes such a centre first, so its
	// output reads alike in both (TestRDKitOracle).
	m, err := Parse("C[S@](=O)CC")
	require.NoError(t, err)
	require.Len(t, m.Tetrahedral, 1)
	assert.Equal(t, [4]int{0, molecule.Implicit, 2, 3}, m.Tetrahedral[0].Refs)
	m, err = Parse("[S@](C)(=O)CC")
	require.NoError(t, err)
	assert.Equal(t, [4]int{molecule.Implicit, 1, 2, 3}, m.Tetrahedral[0].Refs)
}

func sp(start, end int) molecule.Span { return molecule.Span{Start: start, End: end} }
