package main

import (
	"bufio"
	"encoding/json"
	"fmt"
	"math/rand"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
	"time"

	"walden/analyze/cip"
	"walden/analyze/smiles"
)

type stereoJSON struct {
	Smiles    string `json:"smiles"`
	ID        string `json:"id"`
	Canonical string `json:"canonical"`
	Error     string `json:"error"`
	Labels    []struct {
		Atom  int    `json:"atom"`
		Atom2 int    `json:"atom2"`
		Label string `json:"label"`
	} `json:"labels"`
	Undecided []map[string]any `json:"undecided"`
}

func labelsOf(r stereoJSON) string {
	var parts []string
	for _, l := range r.Labels {
		if l.Atom2 != 0 {
			parts = append(parts, fmt.Sprintf("%d-%d%s", l.Atom, l.Atom2, l.Label))
		} else {
			parts = append(parts, fmt.Sprintf("%d%s", l.Atom, l.Label))
		}
	}
	return strings.Join(parts, " ")
}

// TestStereoJSON checks the interface DESIGN.md fixes for `walden stereo
// --json SMILES`. Expected labels are entries of the CIP validation suite
// (Hanson et al., J. Chem. Inf. Model. 2018, 58, 1755), numbered from 1 in
// SMILES order as there.
func TestStereoJSON(t *testing.T) {
	tests := []struct{ smi, want string }{
		{"Cl[C@H](Br)F", "2R"},                         // VS162
		{"C/C=C\\C", "2-3Z"},                           // VS060
		{"CC/C=C\\C=C\\CC", "3-4Z 5-6E"},               // VS058
		{"NC(=[C@]=C(C)O)Br", "2-4P"},                  // VS144
		{"C[S@](=O)C=1C=CC=CC1", "2S"},                 // VS074
		{"O[C@H]1CC[C@H](CC1)O", "2s 5s"},              // VS222
		{"C[C@H](O)[2H]", "2R"},                        // VS182
		{"C1=CCC=CC=C1", ""},                           // VS002: no stereo
		{"C[C@H]1CCC[C@@]12C[C@H](CCC2)C", "2S 6R 8S"}, // VS028
	}
	for _, tc := range tests {
		out, errOut, code := runCmd("stereo", "--json", tc.smi)
		if code != 0 {
			t.Errorf("%s: exit %d: %s", tc.smi, code, errOut)
			continue
		}
		var r stereoJSON
		if err := json.Unmarshal([]byte(out), &r); err != nil || strings.Count(out, "\n") != 1 {
			t.Errorf("%s: not one JSON line: %v\n%s", tc.smi, err, out)
			continue
		}
		if r.Smiles != tc.smi || r.Canonical == "" {
			t.Errorf("%s: smiles %q canonical %q", tc.smi, r.Smiles, r.Canonical)
		}
		if got := labelsOf(r); got != tc.want {
			t.Errorf("%s: labels %q, want %q", tc.smi, got, tc.want)
		}
		if !strings.Contains(out, `"labels": [`) {
			t.Errorf("%s: no labels array: %s", tc.smi, out)
		}
	}
}

// TestStereoUndecided: a hindered biaryl (suite entry VS086, axial
// chirality) is reported as not decidable, with no guessed label.
func TestStereoUndecided(t *testing.T) {
	out, _, code := runCmd("stereo", "--json", "[O-][N+](C1=C(C=2C(=CC=C(C2)OC)OC)C(=CC=C1)C(=O)O)=O")
	var r stereoJSON
	if code != 0 || json.Unmarshal([]byte(out), &r) != nil {
		t.Fatalf("exit %d: %s", code, out)
	}
	if len(r.Labels) != 0 || len(r.Undecided) != 1 {
		t.Errorf("labels %v undecided %v, want none and one", r.Labels, r.Undecided)
	}
	text, _, _ := runCmd("stereo", "[O-][N+](C1=C(C=2C(=CC=C(C2)OC)OC)C(=CC=C1)C(=O)O)=O")
	if !strings.Contains(text, "not decidable from SMILES") {
		t.Errorf("text form does not say so:\n%s", text)
	}
}

// TestStereoFile checks --file: one object per non-empty line, in order,
// ids kept, bad lines reported inline with a position, the run going on.
func TestStereoFile(t *testing.T) {
	var b strings.Builder
	var want []string
	for i := range 3000 { // several chunks, so the parallel workers must keep order
		switch i % 3 {
		case 0:
			b.WriteString("Cl[C@H](Br)F\tm" + fmt.Sprint(i) + "\n") // VS162: 2R
			want = append(want, "2R")
		case 1:
			b.WriteString("C[C@@H](Cl\n")
			want = append(want, "error")
		default:
			b.WriteString("\nC/C=C\\C\n") // VS060: 2Z 3Z
			want = append(want, "2-3Z")
		}
	}
	p := filepath.Join(t.TempDir(), "in.smi")
	os.WriteFile(p, []byte(b.String()), 0o644)
	out, errOut, code := runCmd("stereo", "--json", "--file", p)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	lines := strings.Split(strings.TrimSuffix(out, "\n"), "\n")
	if len(lines) != len(want) {
		t.Fatalf("%d lines, want %d", len(lines), len(want))
	}
	for i, line := range lines {
		var r stereoJSON
		if err := json.Unmarshal([]byte(line), &r); err != nil {
			t.Fatalf("line %d: %v: %s", i+1, err, line)
		}
		got := labelsOf(r)
		if r.Error != "" {
			got = "error"
			if !strings.Contains(r.Error, "-") || r.Smiles != "C[C@@H](Cl" {
				t.Errorf("line %d: error without position or input: %s", i+1, line)
			}
		}
		if got != want[i] {
			t.Fatalf("line %d: got %s, want %s: %s", i+1, got, want[i], line)
		}
		if i%3 == 0 && r.ID != fmt.Sprint("m", i) {
			t.Fatalf("line %d: id %q", i+1, r.ID)
		}
	}
}

// TestStereoText checks the readable form.
func TestStereoText(t *testing.T) {
	out, _, code := runCmd("stereo", "F/C=C/C[C@@H](Cl)Br")
	if code != 0 || !strings.Contains(out, "atoms 2 and 3: E") || !strings.Contains(out, "atom 5: S") {
		t.Errorf("exit %d:\n%s", code, out) // E: trans marks; S: checked with RDKit 2022.09 rdCIPLabeler
	}
	if _, _, code := runCmd("stereo", "C[C@@H](Cl"); code == 0 {
		t.Error("bad SMILES: exit 0")
	}
}

// stereoBenchSMILES writes n small stereo molecules, chosen at random
// (fixed seed) from substituted centres, alkenes and rings: the kind of
// file the throughput target is stated for.
func stereoBenchSMILES(n int) string {
	r := rand.New(rand.NewSource(5))
	// The phenyl closes ring 2: the cyclohexanes below hold ring 1 open
	// around their substituents, and reusing an open ring number there
	// would make the line invalid.
	subs := []string{"C", "CC", "O", "OC", "N", "F", "Cl", "Br", "C(=O)O", "c2ccccc2", "C#N", "CC(C)C", "[2H]", "SC", "C=C"}
	at := func() string {
		if r.Intn(2) == 0 {
			return "@"
		}
		return "@@"
	}
	dir := func() string {
		if r.Intn(2) == 0 {
			return "/"
		}
		return "\\"
	}
	s := func() string { return subs[r.Intn(len(subs))] }
	var b strings.Builder
	for i := range n {
		switch i % 4 {
		case 0:
			b.WriteString("[C" + at() + "H](" + s() + ")(" + s() + ")" + s())
		case 1:
			b.WriteString("C" + dir() + "C(" + s() + ")=C" + dir() + s())
		case 2:
			b.WriteString("[C" + at() + "H]1(" + s() + ")CC[C" + at() + "H](" + s() + ")CC1")
		default:
			b.WriteString("C[C" + at() + "H](" + s() + ")[C" + at() + "H](O)" + s())
		}
		fmt.Fprintf(&b, "\tb%d\n", i)
	}
	return b.String()
}

// BenchmarkStereoFileProcess builds the walden binary and times the whole
// process `walden stereo --json --file` on 200,000 small stereo molecules,
// reporting molecules per second of wall time and of CPU time (the
// machine may be shared). testdata/stereo/bench.sh does the same from the
// shell with /usr/bin/time -v for peak memory.
func BenchmarkStereoFileProcess(b *testing.B) {
	dir := b.TempDir()
	bin := filepath.Join(dir, "walden")
	if out, err := exec.Command("go", "build", "-o", bin, ".").CombinedOutput(); err != nil {
		b.Fatalf("build: %v\n%s", err, out)
	}
	const n = 200000
	in := filepath.Join(dir, "in.smi")
	os.WriteFile(in, []byte(stereoBenchSMILES(n)), 0o644)
	b.ResetTimer()
	var wall, cpu time.Duration
	for range b.N {
		cmd := exec.Command(bin, "stereo", "--json", "--file", in)
		out, err := cmd.StdoutPipe()
		if err != nil {
			b.Fatal(err)
		}
		start := time.Now()
		if err := cmd.Start(); err != nil {
			b.Fatal(err)
		}
		lines := 0
		sc := bufio.NewScanner(out)
		for sc.Scan() {
			lines++
		}
		if err := cmd.Wait(); err != nil {
			b.Fatal(err)
		}
		wall += time.Since(start)
		cpu += cmd.ProcessState.UserTime() + cmd.ProcessState.SystemTime()
		if lines != n {
			b.Fatalf("%d lines out, want %d", lines, n)
		}
	}
	b.ReportMetric(float64(n*b.N)/wall.Seconds(), "molecules/s")
	b.ReportMetric(float64(n*b.N)/cpu.Seconds()*float64(runtime.NumCPU()), "molecules/s-if-idle")
}

// TestWriteStereoBenchInput writes the input of testdata/stereo/bench.sh
// to the file named by WALDEN_WRITE_STEREO_BENCH.
func TestWriteStereoBenchInput(t *testing.T) {
	if os.Getenv("WALDEN_WRITE_STEREO_BENCH") == "" {
		t.Skip("set WALDEN_WRITE_STEREO_BENCH=1 to write the input of testdata/stereo/bench.sh")
	}
	if err := os.WriteFile(os.Getenv("WALDEN_WRITE_STEREO_BENCH"), []byte(stereoBenchSMILES(200000)), 0o644); err != nil {
		t.Fatal(err)
	}
}

// TestStereoBenchInputValid checks that every line of the benchmark input
// is a valid SMILES (OpenSMILES ring-closure rules: a ring number is free
// again only once its ring is closed), so that the benchmark times
// labelling, not error messages.
func TestStereoBenchInputValid(t *testing.T) {
	for i, line := range strings.Split(strings.TrimSpace(stereoBenchSMILES(4000)), "\n") {
		s, _, _ := strings.Cut(line, "\t")
		if _, err := smiles.Parse(s); err != nil {
			t.Errorf("line %d: %s: %v", i+1, s, err)
		}
	}
}

// BenchmarkStereoLine times one line of --file inside the process:
// reading, canonical SMILES, labels, the undecided screen and JSON.
func BenchmarkStereoLine(b *testing.B) {
	lines := strings.Split(strings.TrimSpace(stereoBenchSMILES(4000)), "\n")
	var l cip.Labeller
	var buf []byte
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		s, id, _ := strings.Cut(lines[i%len(lines)], "\t")
		r := analyseStereo(&l, s, id)
		buf = r.appendJSON(buf[:0])
	}
}
