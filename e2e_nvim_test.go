package main

// The end-to-end test through a real editor: Debian's headless Neovim
// (0.7.2 in Debian 12) opens the demo notebook through the same Lua set-up
// chemists install (editors/nvim/lua/walden.lua), talks to a freshly built
// `walden serve`, and reports what it saw. It lives here, in the command's
// own package, because it tests the command as shipped: it can see whether
// `serve` is registered, and `go build .` in this folder is the binary.

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
	"time"
	"unicode/utf16"
)

// nvimE2ETimeout bounds the whole editor session; each wait inside the Lua
// driver is bounded by e2eWait.
const (
	nvimE2ETimeout = 2 * time.Minute
	e2eWait        = 15 * time.Second
)

// e2ePlan is what the Lua driver reads (see editors/nvim/test/e2e.lua).
type e2ePlan struct {
	TimeoutMS int       `json:"timeout_ms"`
	Files     []e2eFile `json:"files"`
}

type e2eFile struct {
	Path   string        `json:"path"`
	Hovers []lspPosition `json:"hovers"`
	Edit   *e2eEdit      `json:"edit,omitempty"`
}

type lspPosition struct {
	Line      int `json:"line"`
	Character int `json:"character"`
}

// e2eEdit replaces one whole line, as a chemist retyping it would.
type e2eEdit struct {
	Line int    `json:"line"`
	Text string `json:"text"`
}

// e2eResults is what the Lua driver writes. Neovim encodes an empty Lua
// table as [] whatever it stood for, so object-valued fields that may be
// empty are kept raw.
type e2eResults struct {
	Nvim       string          `json:"nvim"`
	Error      string          `json:"error"`
	LSPLog     string          `json:"lsp_log"`
	Initialize json.RawMessage `json:"initialize"`
	Files      []e2eSeen       `json:"files"`
	Published  []e2ePublished  `json:"published"`
	Exit       *struct {
		Code   int `json:"code"`
		Signal int `json:"signal"`
	} `json:"exit"`
}

type e2eSeen struct {
	Path           string          `json:"path"`
	URI            string          `json:"uri"`
	Filetype       string          `json:"filetype"`
	OpenedVersion  int             `json:"opened_version"`
	AfterOpen      *e2ePublished   `json:"after_open"`
	Shown          []nvimDiagnosic `json:"shown"`
	Hovers         []e2eHover      `json:"hovers"`
	EditAtMS       int64           `json:"edit_at_ms"`
	EditedVersion  int             `json:"edited_version"`
	AfterEdit      *e2ePublished   `json:"after_edit"`
	ShownAfterEdit []nvimDiagnosic `json:"shown_after_edit"`
}

type e2ePublished struct {
	URI         string          `json:"uri"`
	Version     *int            `json:"version"`
	Diagnostics []lspDiagnostic `json:"diagnostics"`
	AtMS        int64           `json:"at_ms"` // Neovim's clock when it arrived
}

type lspDiagnostic struct {
	Range    lspRange        `json:"range"`
	Severity int             `json:"severity"`
	Code     json.RawMessage `json:"code"`
	Source   string          `json:"source"`
	Message  string          `json:"message"`
	Related  []struct {
		Location struct {
			URI   string   `json:"uri"`
			Range lspRange `json:"range"`
		} `json:"location"`
		Message string `json:"message"`
	} `json:"relatedInformation"`
}

type lspRange struct {
	Start lspPosition `json:"start"`
	End   lspPosition `json:"end"`
}

// nvimDiagnosic is an entry of vim.diagnostic.get(): what the chemist sees.
type nvimDiagnosic struct {
	Lnum     int    `json:"lnum"`
	Col      int    `json:"col"`
	EndLnum  int    `json:"end_lnum"`
	EndCol   int    `json:"end_col"`
	Severity int    `json:"severity"`
	Message  string `json:"message"`
}

type e2eHover struct {
	Line      int             `json:"line"`
	Character int             `json:"character"`
	Result    json.RawMessage `json:"result"`
	Error     json.RawMessage `json:"error"`
}

func TestNeovimEndToEnd(t *testing.T) {
	nvim, err := exec.LookPath("nvim")
	if err != nil {
		t.Skip("nvim is not on PATH: install Neovim (Debian: apt-get install neovim) to run the editor end-to-end test; CI installs it")
	}
	work := t.TempDir()
	bin := buildWalden(t, work)

	// A copy, so the edit below never touches the repository and the
	// project folder Neovim finds is the copy's.
	var plan e2ePlan
	plan.TimeoutMS = int(e2eWait / time.Millisecond)
	for _, d := range copyDemo(t, work) {
		src, dst, steps := d.src, d.dst, d.steps
		if len(steps) == 0 {
			t.Fatalf("%s: no step lines found; the demo should have some", src)
		}
		f := e2eFile{Path: dst}
		first := steps[0]
		f.Hovers = []lspPosition{{Line: first.line, Character: first.indent}}
		for _, st := range steps {
			for _, h := range demoHovers {
				if strings.TrimSpace(st.text) == h.line {
					f.Hovers = append(f.Hovers, lspPosition{Line: st.line, Character: st.indent})
				}
			}
		}
		// Retype the first step with a dangling '+': a half-typed line,
		// the commonest edit there is.
		f.Edit = &e2eEdit{Line: first.line, Text: first.text + " +"}
		plan.Files = append(plan.Files, f)
	}

	res := runNeovim(t, nvim, bin, work, plan)
	if res.Error != "" {
		t.Fatalf("the Lua driver failed: %s%s", res.Error, lspLogTail(res.LSPLog))
	}
	t.Logf("Neovim %s, %d files, %d publishDiagnostics", res.Nvim, len(res.Files), len(res.Published))

	t.Run("initialize", func(t *testing.T) {
		var init struct {
			Capabilities map[string]any `json:"capabilities"`
			ServerInfo   *struct {
				Name string `json:"name"`
			} `json:"serverInfo"`
		}
		if err := json.Unmarshal(res.Initialize, &init); err != nil {
			t.Fatalf("initialize result %s: %v", res.Initialize, err)
		}
		for _, c := range []string{"textDocumentSync", "hoverProvider"} {
			if init.Capabilities[c] == nil {
				t.Errorf("initialize did not advertise %s; capabilities: %s", c, res.Initialize)
			}
		}
		if init.ServerInfo == nil || init.ServerInfo.Name != "walden" {
			t.Errorf("serverInfo = %s, want name walden", res.Initialize)
		}
	})

	t.Run("documents", func(t *testing.T) {
		if len(res.Files) != len(plan.Files) {
			t.Fatalf("driver saw %d files, plan had %d", len(res.Files), len(plan.Files))
		}
		for _, f := range res.Files {
			wantType := map[string]string{".md": "markdown", ".steps": "walden-steps"}[filepath.Ext(f.Path)]
			if f.Filetype != wantType {
				t.Errorf("%s: filetype %q, want %q (set by editors/nvim/lua/walden.lua)", f.Path, f.Filetype, wantType)
			}
			if f.AfterOpen == nil {
				t.Errorf("%s: no publishDiagnostics after didOpen within %v", f.Path, e2eWait)
			} else if f.AfterOpen.Version == nil || *f.AfterOpen.Version != f.OpenedVersion {
				t.Errorf("%s: diagnostics after open carry version %v, want %d", f.Path, f.AfterOpen.Version, f.OpenedVersion)
			}
			// What Neovim shows must be what the server sent.
			if f.AfterOpen != nil && len(f.Shown) != len(f.AfterOpen.Diagnostics) {
				t.Errorf("%s: Neovim shows %d diagnostics, server sent %d", f.Path, len(f.Shown), len(f.AfterOpen.Diagnostics))
			}
		}
	})

	t.Run("hover answers", func(t *testing.T) {
		for _, f := range res.Files {
			for _, h := range f.Hovers {
				if len(h.Error) > 0 && string(h.Error) != "null" {
					t.Errorf("%s:%d:%d: hover error %s", f.Path, h.Line+1, h.Character+1, h.Error)
				}
			}
		}
	})

	t.Run("edit through the debounce", func(t *testing.T) {
		for i, f := range res.Files {
			if f.EditedVersion <= f.OpenedVersion {
				t.Errorf("%s: Neovim did not register the edit (version %d after %d)", f.Path, f.EditedVersion, f.OpenedVersion)
				continue
			}
			if f.AfterEdit == nil || f.AfterEdit.Version == nil || *f.AfterEdit.Version != f.EditedVersion {
				t.Errorf("%s: no diagnostics for edited version %d within %v (got %+v)", f.Path, f.EditedVersion, e2eWait, f.AfterEdit)
				continue
			}
			// A figure for the report, not a check: it includes Neovim's
			// own 150 ms didChange debounce.
			t.Logf("%s: edit → diagnostics in Neovim %d ms", filepath.Base(f.Path), f.AfterEdit.AtMS-f.EditAtMS)
			// The half-typed line must show an error at its dangling '+'.
			edit := plan.Files[i].Edit
			plus := len(utf16.Encode([]rune(edit.Text))) - 1
			flagged := false
			for _, d := range f.AfterEdit.Diagnostics {
				if d.Range.Start.Line == edit.Line && d.Severity == 1 && d.Range.Start.Character >= plus {
					flagged = true
				}
			}
			if !flagged {
				t.Errorf("%s:%d: no error at the dangling '+' of %q after the edit; got %+v", filepath.Base(f.Path), edit.Line+1, edit.Text, f.AfterEdit.Diagnostics)
			}
		}
		// No stale result may be published over a newer one.
		last := map[string]int{}
		for _, p := range res.Published {
			if p.Version == nil {
				continue
			}
			if *p.Version < last[p.URI] {
				t.Errorf("%s: version %d published after version %d", p.URI, *p.Version, last[p.URI])
			}
			last[p.URI] = *p.Version
		}
	})

	t.Run("shutdown and exit", func(t *testing.T) {
		if res.Exit == nil {
			// Neovim, like every libuv-based client, hands the server a
			// socket pair as stdin and keeps it open after exit, so a
			// server that waits for its reader to end never stops.
			t.Fatalf("walden serve did not exit within %v of shutdown+exit: the server must end after the exit notification without waiting for stdin to close", e2eWait)
		}
		if res.Exit.Code != 0 || res.Exit.Signal != 0 {
			t.Errorf("walden serve ended with code %d signal %d after shutdown+exit, want 0 and 0 (LSP: exit after shutdown is code 0)", res.Exit.Code, res.Exit.Signal)
		}
	})

	t.Run("problem lines", func(t *testing.T) {
		checkDemoFindings(t, res)
	})
	t.Run("hover on a step", func(t *testing.T) {
		checkDemoHovers(t, res)
	})
}

// stepLine is a line of a host document that holds a step.
type stepLine struct {
	line   int    // 0-based
	indent int    // bytes of leading blanks (ASCII, so also UTF-16 units)
	text   string // the whole line
}

// stepLines finds step lines by the notation's documented shape, without
// the grammar package, so that this test does not share the parser's
// mistakes: in Markdown the lines of fenced blocks whose info string
// starts with "reaction"; in a plan file every non-blank line that is not
// a "//" comment.
func stepLines(ext, text string) []stepLine {
	var steps []stepLine
	fence, reaction := "", false // fence is the opening fence while inside a block
	for i, l := range strings.Split(strings.ReplaceAll(text, "\r\n", "\n"), "\n") {
		trimmed := strings.TrimSpace(l)
		indent := len(l) - len(strings.TrimLeft(l, " \t"))
		isStep := trimmed != "" && !strings.HasPrefix(trimmed, "//")
		if ext == ".steps" {
			if isStep {
				steps = append(steps, stepLine{i, indent, l})
			}
			continue
		}
		f := fenceOf(trimmed)
		switch {
		case fence == "" && f != "":
			fence = f
			info := strings.Fields(trimmed[len(f):])
			reaction = len(info) > 0 && info[0] == "reaction"
		case fence != "" && f != "" && f[0] == fence[0] && len(f) >= len(fence) && len(f) == len(trimmed):
			fence = ""
		case fence != "" && reaction && isStep:
			steps = append(steps, stepLine{i, indent, l})
		}
	}
	return steps
}

// fenceOf returns the run of three or more backticks or tildes that
// starts s, or "".
func fenceOf(s string) string {
	if s == "" || s[0] != '`' && s[0] != '~' {
		return ""
	}
	n := len(s) - len(strings.TrimLeft(s, s[:1]))
	if n < 3 {
		return ""
	}
	return s[:n]
}

// demoCopy is one file of the demo notebook copied for an editor test.
type demoCopy struct {
	src, dst string
	steps    []stepLine
}

// copyDemo copies the demo's Markdown pages and plan files into
// work/notebook and returns each copy with its step lines.
func copyDemo(t *testing.T, work string) []demoCopy {
	t.Helper()
	demo := filepath.Join("testdata", "demo")
	pages, _ := filepath.Glob(filepath.Join(demo, "*.md"))
	plans, _ := filepath.Glob(filepath.Join(demo, "*.steps"))
	if len(pages) == 0 || len(plans) == 0 {
		t.Fatal("testdata/demo needs a .md page and a .steps plan")
	}
	var out []demoCopy
	for _, src := range append(pages, plans...) {
		text, err := os.ReadFile(src)
		if err != nil {
			t.Fatal(err)
		}
		dst := filepath.Join(work, "notebook", filepath.Base(src))
		if err := os.MkdirAll(filepath.Dir(dst), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(dst, text, 0o644); err != nil {
			t.Fatal(err)
		}
		out = append(out, demoCopy{src, dst, stepLines(filepath.Ext(src), string(text))})
	}
	return out
}

// buildWalden builds the command into dir and returns the program's path.
func buildWalden(t *testing.T, dir string) string {
	t.Helper()
	goTool := filepath.Join(runtime.GOROOT(), "bin", "go")
	if _, err := os.Stat(goTool); err != nil {
		goTool = "go"
	}
	bin := filepath.Join(dir, "walden")
	cmd := exec.Command(goTool, "build", "-o", bin, ".")
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	return bin
}

// runNeovim runs the Lua driver in a headless Neovim with no user
// configuration, no shada and no swap files, and returns its results.
func runNeovim(t *testing.T, nvim, bin, work string, plan e2ePlan) e2eResults {
	t.Helper()
	planPath := filepath.Join(work, "plan.json")
	outPath := filepath.Join(work, "results.json")
	b, err := json.Marshal(plan)
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(planPath, b, 0o644); err != nil {
		t.Fatal(err)
	}
	nvimDir, err := filepath.Abs(filepath.Join("editors", "nvim"))
	if err != nil {
		t.Fatal(err)
	}
	driver := filepath.Join(nvimDir, "test", "e2e.lua")

	ctx, cancel := context.WithTimeout(context.Background(), nvimE2ETimeout)
	defer cancel()
	cmd := exec.CommandContext(ctx, nvim, "--headless", "-u", "NONE", "-i", "NONE", "-n",
		"-c", "luafile "+driver)
	cmd.Dir = work
	// Neovim's LSP log and state go to the temporary folder, not $HOME.
	cmd.Env = append(os.Environ(),
		"WALDEN_E2E_NVIM_DIR="+nvimDir,
		"WALDEN_E2E_CMD="+bin,
		"WALDEN_E2E_PLAN="+planPath,
		"WALDEN_E2E_OUT="+outPath,
		"XDG_CACHE_HOME="+filepath.Join(work, "cache"),
		"XDG_STATE_HOME="+filepath.Join(work, "state"),
		"XDG_DATA_HOME="+filepath.Join(work, "data"),
		"XDG_CONFIG_HOME="+filepath.Join(work, "config"),
	)
	var stderr bytes.Buffer
	cmd.Stdout = &stderr // headless Neovim writes messages to stdout
	cmd.Stderr = &stderr
	cmd.WaitDelay = 5 * time.Second
	runErr := cmd.Run()
	if errors.Is(ctx.Err(), context.DeadlineExceeded) {
		t.Fatalf("Neovim did not finish within %v\n%s%s", nvimE2ETimeout, stderr.String(),
			lspLogTail(filepath.Join(work, "cache", "nvim", "lsp.log")))
	}
	var res e2eResults
	b, err = os.ReadFile(outPath)
	if err != nil {
		t.Fatalf("Neovim wrote no results (%v): %v\n%s", runErr, err, stderr.String())
	}
	if err := json.Unmarshal(b, &res); err != nil {
		t.Fatalf("results %s: %v", b, err)
	}
	if runErr != nil && res.Error == "" {
		t.Fatalf("Neovim: %v\n%s", runErr, stderr.String())
	}
	return res
}

// lspLogTail returns the end of Neovim's LSP log (where it copies the
// server's stderr), for failure messages.
func lspLogTail(path string) string {
	b, err := os.ReadFile(path)
	if err != nil || len(b) == 0 {
		return ""
	}
	if len(b) > 4000 {
		b = b[len(b)-4000:]
	}
	return "\n--- end of " + path + " ---\n" + string(b)
}
