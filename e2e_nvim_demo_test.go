package main

// What the end-to-end test expects Neovim to receive for the demo notebook
// (testdata/demo): findings on the problem lines and the hover of a step.
// Lines are found by their text, so the demo may grow without breaking
// these checks; a line that disappears fails the test, asking for an
// update here.

import (
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"unicode/utf16"
)

// demoFinding is a diagnostic that must sit on a demo line.
type demoFinding struct {
	line   string // the whole step line, trimmed, as written in the demo
	code   string // walden's stable code (README, analyze/codes.go)
	token  string // text on that line that the diagnostic's range, or one of its related locations, must lie within
	source string // why the finding is right
}

var demoFindings = []demoFinding{
	{"C[C@H](O)CCc1ccccc1 + NaN3, DMF, 80 °C", "poor-leaving-group", "C[C@H](O)CCc1ccccc1",
		"hydroxide (conjugate acid water, pKa 15.7) is not displaced by azide; an alcohol is activated first, as a sulfonate or halide: common practice"},
	{"CC(C)(Br)CCc1ccccc1 + NaN3, DMF, 60 °C", "tertiary-no-sn2", "CC(C)(Br)CCc1ccccc1",
		"no backside attack at a tertiary carbon, so no SN2: common practice"},
	{"@tos + KOtBu, THF, rt", "base-eliminates", "KOtBu",
		"potassium tert-butoxide, a strong hindered base, gives mainly E2 alkenes from secondary sulfonates: common practice"},
	{"@tos + NaN3, MeOH, reflux", "protic-solvent-slows", "MeOH",
		"protic solvents hydrogen-bond anionic nucleophiles and slow SN2 by orders of magnitude against dipolar aprotic ones: A. J. Parker, Chem. Rev. 1969, 69, 1 (from memory)"},
	{"@tos + NaN3, DCM, rt", "caution-azide-halomethane", "DCM",
		"sodium azide with dichloromethane forms explosive diazidomethane: common practice in process safety (from memory: reported in Org. Process Res. Dev. 2008)"},
	{"CI + C[C@H](O)CCc1ccccc1 + NaH (1.2 eq), DMF, 0 °C to rt", "caution-hydride-dipolar", "DMF",
		"NaH in DMF decomposes exothermically and can run away: Q. Yang et al., Org. Process Res. Dev. 2019, 23, 2210 (from memory)"},
	{"@tos + NaN3, DMF, 60 °C -> C[C@H](N=[N+]=[N-])CCc1ccccc1", "product-stereo", "C[C@H](N=[N+]=[N-])CCc1ccccc1",
		"SN2 inverts the (S) tosylate to the (R) azide; the written product is (S): CIP labels by RDKit 2022.09 rdCIPLabeler (run 2026-12-01: C[C@H](N=[N+]=[N-])CCc1ccccc1 is S)"},
	{"@tos + NaN3, DMFF, 60 °C", "unknown-name", "DMFF", "not chemistry: a misspelt solvent name"},
	{"@tosylate + NaN3, DMF, 60 °C", "label-unresolved", "@tosylate", "not chemistry: no step is labelled 'tosylate'"},
}

// demoClean lists route steps the demo presents as sound: no error may sit
// on them. (Tosylation with TsCl and pyridine keeps the carbinol
// configuration, and azide in DMF displaces a secondary tosylate with
// inversion: common practice.)
var demoClean = []string{
	"tos: C[C@H](O)CCc1ccccc1 + TsCl (1.2 eq) + pyridine, DCM, 0 °C to rt, 4 h",
	"azide: @tos + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1",
}

// demoHover is the hover expected on a step line (requested at the line's
// first character, the step's label).
type demoHover struct {
	line      string
	mechanism string
	change    string // the configuration change at the reacting carbon, as the hover writes it
	product   string // the predicted major product, any valid SMILES of it
	source    string
}

var demoHovers = []demoHover{
	{
		line:      "azide: @tos + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1",
		mechanism: "SN2",
		change:    "S → R",
		product:   "C[C@@H](N=[N+]=[N-])CCc1ccccc1",
		source: "azide displaces a secondary tosylate in DMF by SN2 with inversion: common practice; " +
			"C[C@H](O)CCc1ccccc1 (the alcohol, whose tosylate keeps its configuration) is S and " +
			"C[C@@H](N=[N+]=[N-])CCc1ccccc1 is R: RDKit 2022.09 rdCIPLabeler, run 2026-12-01 and re-checked below when RDKit is present",
	},
}

// demoLine finds a trimmed line in the files Neovim opened and returns the
// file, the 0-based line number and the untrimmed text.
func demoLine(t *testing.T, res e2eResults, want string) (e2eSeen, int, string, bool) {
	t.Helper()
	for _, f := range res.Files {
		b, err := os.ReadFile(f.Path)
		if err != nil {
			t.Fatal(err)
		}
		for i, l := range strings.Split(strings.ReplaceAll(string(b), "\r\n", "\n"), "\n") {
			if strings.TrimSpace(l) == want {
				return f, i, l, true
			}
		}
	}
	return e2eSeen{}, 0, "", false
}

// utf16Span returns where token sits in line, in UTF-16 code units as LSP
// counts them ("°" is two bytes but one unit).
func utf16Span(line, token string) (start, end int, ok bool) {
	i := strings.Index(line, token)
	if i < 0 {
		return 0, 0, false
	}
	start = len(utf16.Encode([]rune(line[:i])))
	return start, start + len(utf16.Encode([]rune(token))), true
}

// within reports whether r lies on line inside [start, end).
func within(r lspRange, line, start, end int) bool {
	return r.Start.Line == line && r.End.Line == line &&
		r.Start.Character >= start && r.End.Character <= end && r.Start.Character < r.End.Character
}

func diagnosticCode(d lspDiagnostic) string {
	var s string
	if json.Unmarshal(d.Code, &s) == nil {
		return s
	}
	return string(d.Code)
}

func checkDemoFindings(t *testing.T, res e2eResults) {
	for _, w := range demoFindings {
		f, n, text, ok := demoLine(t, res, w.line)
		if !ok {
			t.Errorf("demo line %q not found: update demoFindings if the demo changed", w.line)
			continue
		}
		start, end, ok := utf16Span(text, w.token)
		if !ok {
			t.Fatalf("token %q not on line %q", w.token, w.line)
		}
		if f.AfterOpen == nil {
			t.Errorf("%s: no diagnostics arrived", f.Path)
			continue
		}
		var onLine []string
		found := false
		for _, d := range f.AfterOpen.Diagnostics {
			if d.Range.Start.Line != n {
				continue
			}
			onLine = append(onLine, diagnosticCode(d))
			if diagnosticCode(d) != w.code {
				continue
			}
			// Error or warning: a problem line must show as a problem.
			if d.Severity != 1 && d.Severity != 2 {
				t.Errorf("%s:%d: %s has severity %d, want error (1) or warning (2)", filepath.Base(f.Path), n+1, w.code, d.Severity)
			}
			placed := within(d.Range, n, start, end)
			for _, r := range d.Related {
				placed = placed || within(r.Location.Range, n, start, end)
			}
			if !placed {
				t.Errorf("%s:%d: %s at %v (related %v), want it or a related location on %q (characters %d–%d)",
					filepath.Base(f.Path), n+1, w.code, d.Range, d.Related, w.token, start, end)
			}
			found = true
		}
		if !found {
			t.Errorf("%s:%d: no %s diagnostic on %q (found %v). Why it is expected: %s",
				filepath.Base(f.Path), n+1, w.code, w.line, onLine, w.source)
		}
	}
	for _, line := range demoClean {
		f, n, _, ok := demoLine(t, res, line)
		if !ok {
			t.Errorf("demo line %q not found: update demoClean if the demo changed", line)
			continue
		}
		if f.AfterOpen == nil {
			continue
		}
		for _, d := range f.AfterOpen.Diagnostics {
			if d.Range.Start.Line == n && d.Severity == 1 {
				t.Errorf("%s:%d: error %s %q on a sound route step", filepath.Base(f.Path), n+1, diagnosticCode(d), d.Message)
			}
		}
	}
}

// backticked finds the `code spans` of a Markdown text.
var backticked = regexp.MustCompile("`([^`]+)`")

func checkDemoHovers(t *testing.T, res e2eResults) {
	for _, w := range demoHovers {
		f, n, _, ok := demoLine(t, res, w.line)
		if !ok {
			t.Errorf("demo line %q not found: update demoHovers if the demo changed", w.line)
			continue
		}
		var text string
		for _, h := range f.Hovers {
			if h.Line == n {
				var hr struct {
					Contents struct {
						Value string `json:"value"`
					} `json:"contents"`
				}
				if err := json.Unmarshal(h.Result, &hr); err != nil {
					t.Fatalf("hover result %s: %v", h.Result, err)
				}
				text = hr.Contents.Value
			}
		}
		if text == "" {
			t.Errorf("%s:%d: empty hover on the step %q", filepath.Base(f.Path), n+1, w.line)
			continue
		}
		t.Logf("hover on %s:%d:\n%s", filepath.Base(f.Path), n+1, text)
		head, _, _ := strings.Cut(text, "\n")
		if !strings.Contains(head, w.mechanism) {
			t.Errorf("hover's first line %q does not name %s (%s)", head, w.mechanism, w.source)
		}
		if !strings.Contains(text, w.change) {
			t.Errorf("hover does not show the configuration change %q (%s)", w.change, w.source)
		}
		m := backticked.FindStringSubmatch(head)
		if m == nil {
			t.Errorf("hover's first line %q shows no product SMILES", head)
			continue
		}
		t.Run("product by RDKit", func(t *testing.T) {
			const alcohol = "C[C@H](O)CCc1ccccc1"
			got := rdkit(t, m[1], w.product, alcohol)
			if got[0].canonical != got[1].canonical {
				t.Errorf("predicted product %s is %s canonically, want %s (%s)", m[1], got[0].canonical, got[1].canonical, w.source)
			}
			if got[2].labels != "S" || got[1].labels != "R" {
				t.Errorf("RDKit labels %s %s and %s %s; the recorded source says S and R", alcohol, got[2].labels, w.product, got[1].labels)
			}
		})
	}
}

// rdkitResult is what RDKit says of one SMILES.
type rdkitResult struct {
	canonical string // canonical isomeric SMILES
	labels    string // the CIP labels of its atoms in order, joined ("S")
}

// rdkit runs Debian's RDKit (the python3 on PATH may lack it) once on
// the given SMILES, with its new CIP labeller, and skips the calling test
// when RDKit is absent.
func rdkit(t *testing.T, smiles ...string) []rdkitResult {
	t.Helper()
	const py = "/usr/bin/python3"
	const script = `import sys
from rdkit import Chem
from rdkit.Chem import rdCIPLabeler
for s in sys.argv[1:]:
    m = Chem.MolFromSmiles(s)
    rdCIPLabeler.AssignCIPLabels(m)
    print(Chem.MolToSmiles(m) + "\t" + "".join(a.GetProp("_CIPCode") for a in m.GetAtoms() if a.HasProp("_CIPCode")))
`
	if _, err := os.Stat(py); err != nil {
		t.Skip("not checked: /usr/bin/python3 is absent (Debian: apt-get install python3-rdkit)")
	}
	out, err := exec.Command(py, append([]string{"-c", script}, smiles...)...).CombinedOutput()
	if err != nil {
		if strings.Contains(string(out), "No module named") {
			t.Skip("not checked: RDKit is not installed for /usr/bin/python3 (Debian: apt-get install python3-rdkit)")
		}
		t.Fatalf("RDKit on %v: %v\n%s", smiles, err, out)
	}
	lines := strings.Split(strings.TrimRight(string(out), "\n"), "\n")
	if len(lines) != len(smiles) {
		t.Fatalf("RDKit on %v printed %q", smiles, out)
	}
	res := make([]rdkitResult, len(lines))
	for i, l := range lines {
		res[i].canonical, res[i].labels, _ = strings.Cut(l, "\t")
	}
	return res
}
