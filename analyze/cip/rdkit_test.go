package cip

import (
	"bufio"
	"encoding/json"
	"fmt"
	"os"
	"os/exec"
	"sort"
	"strconv"
	"strings"
	"testing"

	"walden/analyze/smiles"
)

// oraclePython is Debian's interpreter, which has python3-rdkit; the
// python3 on PATH may be another build without it.
const oraclePython = "/usr/bin/python3"

// rdkitAvailable reports whether the RDKit oracle can run.
func rdkitAvailable() bool {
	return exec.Command(oraclePython, "-c", "from rdkit.Chem import rdCIPLabeler").Run() == nil
}

type oracleRecord struct {
	I          int             `json:"i"`
	Labels     [][]json.Number `json:"-"`
	Raw        [][3]any        `json:"labels"`
	Same       *bool           `json:"same_canonical"`
	RDKitCanon string          `json:"rdkit_canonical"`
	Error      string          `json:"error"`
}

// runOracle sends every SMILES (with walden's canonical form) through ONE
// python process running testdata/rdkit_cip.py.
func runOracle(t *testing.T, smis, canon []string) []oracleRecord {
	cmd := exec.Command(oraclePython, "testdata/rdkit_cip.py")
	var in strings.Builder
	for i, s := range smis {
		fmt.Fprintf(&in, "%d\t%s\t%s\n", i, s, canon[i])
	}
	cmd.Stdin = strings.NewReader(in.String())
	cmd.Stderr = os.Stderr
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("rdkit oracle: %v", err)
	}
	recs := make([]oracleRecord, len(smis))
	sc := bufio.NewScanner(strings.NewReader(string(out)))
	sc.Buffer(nil, 1<<20)
	n := 0
	for sc.Scan() {
		var r oracleRecord
		if err := json.Unmarshal(sc.Bytes(), &r); err != nil {
			t.Fatalf("rdkit oracle output %q: %v", sc.Text(), err)
		}
		recs[r.I] = r
		n++
	}
	if n != len(smis) {
		t.Fatalf("rdkit oracle answered %d of %d", n, len(smis))
	}
	return recs
}

// rdkitLabels writes the oracle's labels as walden's: "atom:atom2:letter",
// with seqCis/seqTrans written z/e.
func rdkitLabels(r oracleRecord) []string {
	var out []string
	for _, l := range r.Raw {
		a := int(l[0].(float64))
		b := int(l[1].(float64))
		code := l[2].(string)
		switch code {
		case "seqCis":
			code = "z"
		case "seqTrans":
			code = "e"
		}
		out = append(out, strconv.Itoa(a)+":"+strconv.Itoa(b)+":"+code)
	}
	sort.Strings(out)
	return out
}

func waldenLabels(ds []Descriptor) []string {
	var out []string
	for _, d := range ds {
		a, b := d.Atoms[0], d.Atoms[1]
		if b >= 0 && b < a {
			a, b = b, a
		}
		out = append(out, strconv.Itoa(a)+":"+strconv.Itoa(b)+":"+d.Label.String())
	}
	sort.Strings(out)
	return out
}

// TestRDKitDifferential compares walden's labels with RDKit's new CIP
// labeller (rdkit.Chem.rdCIPLabeler.AssignCIPLabels, Debian python3-rdkit
// 2022.09) on generated stereo molecules, and checks that RDKit reads
// walden's canonical SMILES as the same molecule as the input, stereo
// included. Disagreements must be explained by knownRDKitDifferences.
func TestRDKitDifferential(t *testing.T) {
	if !rdkitAvailable() {
		t.Skip("RDKit not available: install python3-rdkit (Debian) to run the differential test against /usr/bin/python3")
	}
	n := 6000
	if testing.Short() {
		n = 1000
	}
	gen := newStereoGenerator(20260301)
	var smis, canon []string
	var mine [][]string
	var l Labeller
	skipped := 0
	for len(smis) < n {
		s := gen.next()
		m, err := smiles.Parse(s)
		if err != nil {
			// The generator can put two marks on one side of a double
			// bond; such strings are invalid SMILES and are dropped.
			skipped++
			continue
		}
		ds, err := l.Label(m)
		if err != nil {
			t.Fatalf("%s: %v", s, err)
		}
		smis = append(smis, s)
		canon = append(canon, smiles.Canonical(m))
		mine = append(mine, waldenLabels(ds))
	}
	recs := runOracle(t, smis, canon)
	compared, agree, explained, canonSame, canonCompared := 0, 0, 0, 0, 0
	reasons := map[string]int{}
	for i, r := range recs {
		if r.Error != "" {
			t.Errorf("%s: rdkit: %s", smis[i], r.Error)
			continue
		}
		compared++
		theirs := rdkitLabels(r)
		if strings.Join(theirs, " ") == strings.Join(mine[i], " ") {
			agree++
		} else if why := explainDifference(smis[i], mine[i], theirs); why != "" {
			explained++
			reasons[why]++
		} else {
			t.Errorf("%s: walden %v, RDKit %v", smis[i], mine[i], theirs)
		}
		if r.Same != nil {
			canonCompared++
			if *r.Same {
				canonSame++
			} else {
				t.Errorf("%s: walden canonical %s reads in RDKit as a different molecule (RDKit canonical of input %s)", smis[i], canon[i], r.RDKitCanon)
			}
		}
	}
	t.Logf("generated %d molecules (%d invalid strings dropped)", len(smis), skipped)
	t.Logf("RDKit differential (rdCIPLabeler, 2022.09): %d compared, %d agree, %d explained, %d unexplained", compared, agree, explained, compared-agree-explained)
	for why, k := range reasons {
		t.Logf("  explained %d: %s", k, why)
	}
	kinds := map[string]int{}
	for _, ls := range mine {
		for _, l := range ls {
			kinds[l[strings.LastIndexByte(l, ':')+1:]]++
		}
	}
	t.Logf("walden labels in the generated set, by letter: %v", kinds)
	t.Logf("canonical SMILES: %d of %d read back by RDKit as the input molecule", canonSame, canonCompared)
}

// knownRDKitDifferences lists generated molecules where RDKit 2022.09 is
// known to answer against the rules, with the reason walden's answer is
// the rule's. With the generator's current seed the two agree on every
// molecule, so the list is empty; a new disagreement fails the test until
// it is understood and either fixed or entered here.
var knownRDKitDifferences = map[string]string{}

// explainDifference returns the documented reason for a known difference
// between walden and RDKit 2022.09, or "".
func explainDifference(smi string, mine, theirs []string) string {
	return knownRDKitDifferences[smi]
}
