package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"walden/internal/golden"
)

// runCmd runs walden with args and returns stdout, stderr and the exit code.
func runCmd(args ...string) (string, string, int) {
	var out, errOut bytes.Buffer
	code := run(args, strings.NewReader(""), &out, &errOut)
	return out.String(), errOut.String(), code
}

// TestCheckDemo checks the bundled demo notebook — the README's first
// command — in all three formats against golden files.
func TestCheckDemo(t *testing.T) {
	for _, f := range []struct{ format, file string }{
		{"text", "demo.txt"}, {"json", "demo.json"}, {"sarif", "demo.sarif"},
	} {
		t.Run(f.format, func(t *testing.T) {
			out, _, code := runCmd("check", "--format", f.format, "testdata/demo")
			if code != exitFindings {
				t.Errorf("exit code %d, want %d (the demo holds errors on purpose)", code, exitFindings)
			}
			golden.Check(t, filepath.Join("testdata", "check", f.file), out)
		})
	}
}

// TestCheckJSONShape checks the stable fields of --format json
// (DESIGN.md, "Interfaces that outside checks rely on").
func TestCheckJSONShape(t *testing.T) {
	out, _, _ := runCmd("check", "--format", "json", "testdata/demo")
	var got []map[string]any
	if err := json.Unmarshal([]byte(out), &got); err != nil {
		t.Fatalf("not JSON: %v", err)
	}
	if len(got) == 0 {
		t.Fatal("no findings on the demo")
	}
	for _, d := range got {
		for _, k := range []string{"file", "range", "code", "severity", "message"} {
			if _, ok := d[k]; !ok {
				t.Errorf("finding without %q: %v", k, d)
			}
		}
		r := d["range"].(map[string]any)
		for _, end := range []string{"start", "end"} {
			p := r[end].(map[string]any)
			if _, ok := p["line"].(float64); !ok {
				t.Errorf("range.%s.line missing: %v", end, r)
			}
			if _, ok := p["character"].(float64); !ok {
				t.Errorf("range.%s.character missing: %v", end, r)
			}
		}
	}
}

// TestCheckSARIF checks the fields the SARIF 2.1.0 schema requires (OASIS
// SARIF v2.1.0, sections 3.13 sarifLog, 3.14 run, 3.19 toolComponent,
// 3.27 result, 3.28 location, 3.29 physicalLocation, 3.30 region).
func TestCheckSARIF(t *testing.T) {
	out, _, _ := runCmd("check", "--format", "sarif", "testdata/demo")
	var log struct {
		Version string `json:"version"`
		Runs    []struct {
			Tool struct {
				Driver struct {
					Name  string `json:"name"`
					Rules []struct {
						ID string `json:"id"`
					} `json:"rules"`
				} `json:"driver"`
			} `json:"tool"`
			Results []struct {
				RuleID  string `json:"ruleId"`
				Level   string `json:"level"`
				Message struct {
					Text string `json:"text"`
				} `json:"message"`
				Locations []struct {
					PhysicalLocation struct {
						ArtifactLocation struct {
							URI string `json:"uri"`
						} `json:"artifactLocation"`
						Region struct {
							StartLine, StartColumn, EndLine, EndColumn int
						} `json:"region"`
					} `json:"physicalLocation"`
				} `json:"locations"`
			} `json:"results"`
		} `json:"runs"`
	}
	if err := json.Unmarshal([]byte(out), &log); err != nil {
		t.Fatal(err)
	}
	if log.Version != "2.1.0" || len(log.Runs) != 1 || log.Runs[0].Tool.Driver.Name != "walden" {
		t.Fatalf("version %q, %d runs", log.Version, len(log.Runs))
	}
	rules := map[string]bool{}
	for _, r := range log.Runs[0].Tool.Driver.Rules {
		rules[r.ID] = true
	}
	for _, r := range log.Runs[0].Results {
		if !rules[r.RuleID] || r.Message.Text == "" || len(r.Locations) != 1 {
			t.Errorf("result %+v: unknown rule, no message or no location", r)
		}
		switch r.Level {
		case "error", "warning", "note":
		default:
			t.Errorf("level %q", r.Level)
		}
		reg := r.Locations[0].PhysicalLocation.Region
		if reg.StartLine < 1 || reg.StartColumn < 1 || reg.EndLine < reg.StartLine || r.Locations[0].PhysicalLocation.ArtifactLocation.URI == "" {
			t.Errorf("region %+v is not 1-based", reg)
		}
	}
}

// TestCheckRobust reads binary, invalid UTF-8, unknown and missing files:
// each gets a clear message and the run goes on.
func TestCheckRobust(t *testing.T) {
	dir := t.TempDir()
	write := func(name string, data []byte) string {
		p := filepath.Join(dir, name)
		os.WriteFile(p, data, 0o644)
		return p
	}
	bin := write("bin.md", []byte("```reaction\n\x00\x01\x02\n```\n"))
	bad := write("latin1.steps", []byte("CCCCBr + NaN3, DMF, 60 \xb0C\n"))
	good := write("ok.steps", []byte("CCCCBr + NaN3, DMF, 25 °C\n"))
	nb := write("broken.ipynb", []byte(`{"cells": [`))
	out, errOut, code := runCmd("check", bin, bad, good, nb)
	for _, want := range []string{"binary file", "not UTF-8 text: invalid byte 0xb0 at line 1, column 24", "broken.ipynb"} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	if !strings.Contains(out, "4 files") || code != exitFindings {
		t.Errorf("code %d, stderr %q, summary in:\n%s", code, errOut, out)
	}
	_, errOut, code = runCmd("check", filepath.Join(dir, "missing.md"))
	if code != exitUsage || !strings.Contains(errOut, "missing.md") {
		t.Errorf("missing file: code %d, stderr %q", code, errOut)
	}
	if _, _, code = runCmd("check", "--format", "xml", good); code != exitUsage {
		t.Errorf("bad format: code %d, want %d", code, exitUsage)
	}
}

// TestCheckExitCodes: warnings alone pass unless --fail-on warning.
func TestCheckExitCodes(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "warn.steps")
	os.WriteFile(p, []byte("CCCCBr + NaN3, DCM, 25 °C\n"), 0o644)
	if _, _, code := runCmd("check", p); code != exitClean {
		t.Errorf("warnings only: code %d, want %d", code, exitClean)
	}
	if _, _, code := runCmd("check", "--fail-on", "warning", p); code != exitFindings {
		t.Errorf("--fail-on warning: code %d, want %d", code, exitFindings)
	}
}
