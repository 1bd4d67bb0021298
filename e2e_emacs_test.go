package main

// The second editor end-to-end test: Emacs in batch mode with eglot (Debian
// 12: emacs-nox, elpa-eglot, elpa-markdown-mode) opens the demo through the
// set-up chemists install (editors/emacs/walden.el) and reports what it
// saw. It checks that the same `walden serve` reaches a second, unrelated
// LSP client with the same findings; the detailed protocol checks are in
// the Neovim test.

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

type emacsResults struct {
	Error string `json:"error"`
	Emacs string `json:"emacs"`
	Files []struct {
		Path      string `json:"path"`
		Mode      string `json:"mode"`
		Published []struct {
			Line     int    `json:"line"`
			Severity int    `json:"severity"`
			Code     string `json:"code"`
			Message  string `json:"message"`
		} `json:"published"`
		FlymakeCount int `json:"flymake_count"`
		Hovers       []struct {
			Line  int    `json:"line"`
			Value string `json:"value"`
			Error string `json:"error"`
		} `json:"hovers"`
	} `json:"files"`
}

func TestEmacsEndToEnd(t *testing.T) {
	emacs, err := exec.LookPath("emacs")
	if err != nil {
		t.Skip("emacs is not on PATH: install Emacs with eglot (Debian: apt-get install emacs-nox elpa-eglot elpa-markdown-mode) to run this test; CI installs them")
	}
	probe := exec.Command(emacs, "--batch", "-q", "--eval",
		"(progn (require 'package) (package-initialize) (require 'eglot) (require 'markdown-mode))")
	if out, err := probe.CombinedOutput(); err != nil {
		t.Skipf("Emacs lacks eglot or markdown-mode (Debian: apt-get install elpa-eglot elpa-markdown-mode): %v\n%s", err, out)
	}
	work := t.TempDir()
	bin := buildWalden(t, work)
	var plan e2ePlan
	plan.TimeoutMS = int(e2eWait / time.Millisecond)
	for _, d := range copyDemo(t, work) {
		dst := d.dst
		f := e2eFile{Path: dst}
		for _, st := range d.steps {
			for _, h := range demoHovers {
				if strings.TrimSpace(st.text) == h.line {
					f.Hovers = append(f.Hovers, lspPosition{Line: st.line, Character: st.indent})
				}
			}
		}
		plan.Files = append(plan.Files, f)
	}
	planPath, outPath := filepath.Join(work, "plan.json"), filepath.Join(work, "results.json")
	b, _ := json.Marshal(plan)
	if err := os.WriteFile(planPath, b, 0o644); err != nil {
		t.Fatal(err)
	}
	emacsDir, err := filepath.Abs(filepath.Join("editors", "emacs"))
	if err != nil {
		t.Fatal(err)
	}

	ctx, cancel := context.WithTimeout(context.Background(), nvimE2ETimeout)
	defer cancel()
	cmd := exec.CommandContext(ctx, emacs, "--batch", "-q", "-l", filepath.Join(emacsDir, "test", "e2e.el"))
	cmd.Dir = work
	cmd.Env = append(os.Environ(),
		"WALDEN_E2E_EMACS_DIR="+emacsDir,
		"WALDEN_E2E_CMD="+bin,
		"WALDEN_E2E_PLAN="+planPath,
		"WALDEN_E2E_OUT="+outPath,
		"HOME="+work, // no user init, no ~/.emacs.d state
	)
	var log bytes.Buffer
	cmd.Stdout, cmd.Stderr = &log, &log
	cmd.WaitDelay = 5 * time.Second
	runErr := cmd.Run()
	if errors.Is(ctx.Err(), context.DeadlineExceeded) {
		t.Fatalf("Emacs did not finish within %v\n%s", nvimE2ETimeout, log.String())
	}
	var res emacsResults
	if b, err = os.ReadFile(outPath); err != nil {
		t.Fatalf("Emacs wrote no results (%v): %v\n%s", runErr, err, log.String())
	}
	if err := json.Unmarshal(b, &res); err != nil {
		t.Fatalf("results %s: %v", b, err)
	}
	if res.Error != "" || runErr != nil {
		t.Fatalf("the Emacs driver failed: %s (%v)\n%s", res.Error, runErr, log.String())
	}
	t.Logf("Emacs %s, %d files", res.Emacs, len(res.Files))

	for _, f := range res.Files {
		name := filepath.Base(f.Path)
		wantMode := map[string]string{".md": "markdown-mode", ".steps": "walden-steps-mode"}[filepath.Ext(name)]
		if f.Mode != wantMode {
			t.Errorf("%s: major mode %s, want %s (editors/emacs/walden.el)", name, f.Mode, wantMode)
		}
		if f.Published == nil {
			t.Errorf("%s: no publishDiagnostics within %v", name, e2eWait)
		}
		t.Logf("%s: %s, %d diagnostics received, %d shown by Flymake", name, f.Mode, len(f.Published), f.FlymakeCount)
		if f.FlymakeCount != len(f.Published) {
			t.Errorf("%s: Flymake shows %d diagnostics, the server sent %d", name, f.FlymakeCount, len(f.Published))
		}
		text, err := os.ReadFile(f.Path)
		if err != nil {
			t.Fatal(err)
		}
		lines := strings.Split(string(text), "\n")
		// The same findings as in Neovim, by code and line; their sources
		// are named in demoFindings.
		for _, w := range demoFindings {
			for n, l := range lines {
				if strings.TrimSpace(l) != w.line {
					continue
				}
				found := false
				for _, d := range f.Published {
					found = found || d.Line == n && d.Code == w.code
				}
				if !found {
					t.Errorf("%s:%d: Emacs received no %s (%s)", name, n+1, w.code, w.source)
				}
			}
		}
		for _, h := range f.Hovers {
			if h.Error != "" {
				t.Errorf("%s:%d: hover failed: %s", name, h.Line+1, h.Error)
				continue
			}
			for _, w := range demoHovers {
				if strings.TrimSpace(lines[h.Line]) == w.line && !strings.Contains(h.Value, w.mechanism) {
					t.Errorf("%s:%d: hover %q does not name %s (%s)", name, h.Line+1, h.Value, w.mechanism, w.source)
				}
			}
		}
	}
}
