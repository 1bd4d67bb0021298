package server

import (
	"fmt"
	"path/filepath"
	"strings"
	"testing"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

// A step that draws the solvent-assumed finding: no solvent is named.
const noSolvent = "```reaction\nCCBr + NaI, 25 °C\n```\n"

// The editor's settings disable a code; the settings file's defaults are
// read from the workspace root; a change to either re-analyses.
func TestConfiguration(t *testing.T) {
	files := map[string]string{
		filepath.Join("/lab", analyze.SettingsFile): "# test lab\nsolvent = acetone\n",
	}
	c := newClient(t, Options{ReadFile: func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, fmt.Errorf("open %s: no such file", p)
	}})
	var res initializeResult
	c.call("initialize", map[string]any{"rootUri": "file:///lab", "capabilities": map[string]any{}}, &res)
	c.notify("initialized", map[string]any{})
	uri := protocol.DocumentURI("file:///lab/page.md")
	c.open(uri, "markdown", 1, noSolvent)
	first := c.diagnosticsFor(uri, 1)
	if !messageHas(first, analyze.CodeDefaultSolvent, "acetone") {
		t.Errorf("the settings file's default solvent (acetone) is not what the step assumes: %+v", first)
	}

	// Without the settings file, another default is assumed.
	delete(files, filepath.Join("/lab", analyze.SettingsFile))
	c.notify("workspace/didChangeConfiguration", map[string]any{"settings": nil})
	c.waitFor("the default solvent once the settings file is gone", func() bool {
		return says(last(c, uri), "DMF")
	})

	// The editor's solvent wins.
	c.notify("workspace/didChangeConfiguration", map[string]any{"settings": map[string]any{"solvent": "DMSO"}})
	c.waitFor("the editor's default solvent", func() bool {
		return says(last(c, uri), "DMSO")
	})
	code := ""
	for _, d := range last(c, uri) {
		if strings.Contains(d.Message, "DMSO") {
			code = fmt.Sprint(d.Code)
		}
	}

	// The editor disables it.
	c.notify("workspace/didChangeConfiguration", map[string]any{"settings": map[string]any{
		"walden": map[string]any{"solvent": "DMSO", "disable": []string{code}}}})
	c.waitFor(code+" disabled by the editor", func() bool {
		return !hasCode(last(c, uri), code)
	})

	// Settings that cannot be read are reported, not swallowed.
	c.notify("workspace/didChangeConfiguration", map[string]any{"settings": map[string]any{"walden": map[string]any{"disable": 42}}})
	c.waitLog("settings not understood")
}

// last returns the latest diagnostics published for uri; the caller holds
// c.mu.
func last(c *testClient, uri protocol.DocumentURI) []protocol.Diagnostic {
	for i := len(c.diags) - 1; i >= 0; i-- {
		if c.diags[i].URI == uri {
			return c.diags[i].Diagnostics
		}
	}
	return nil
}

// says reports whether any diagnostic's message holds text.
func says(diags []protocol.Diagnostic, text string) bool {
	for _, d := range diags {
		if strings.Contains(d.Message, text) {
			return true
		}
	}
	return false
}

// messageHas reports whether a diagnostic with code says text.
func messageHas(diags []protocol.Diagnostic, code, text string) bool {
	for _, d := range diags {
		if d.Code == code && strings.Contains(d.Message, text) {
			return true
		}
	}
	return false
}

// Bad lines in the settings file are shown with file:line:column.
func TestSettingsFileErrors(t *testing.T) {
	path := filepath.Join("/lab", analyze.SettingsFile)
	c := newClient(t, Options{ReadFile: func(p string) ([]byte, error) {
		if p == path {
			return []byte("solvent = DMF\ncolour = blue\n"), nil
		}
		return nil, fmt.Errorf("open %s: no such file", p)
	}})
	c.call("initialize", map[string]any{"rootUri": "file:///lab", "capabilities": map[string]any{}}, nil)
	c.waitLog(path + ":2:1: unknown setting")
}

// Diagnostics reach the client in version order, ending with the newest:
// a burst of edits never leaves older results showing.
func TestNoStaleDiagnostics(t *testing.T) {
	c := start(t)
	uri := protocol.DocumentURI("file:///lab/burst.md")
	c.open(uri, "markdown", 1, "```reaction\nCCBr + NaI, acetone\n```\n")
	const final = 60
	for v := int32(2); v <= final; v++ {
		c.change(uri, v, contentChange{Range: rng(1, 4, 1, 4), Text: "C"})
	}
	c.diagnosticsFor(uri, final)
	prev := int32(0)
	for _, p := range c.published(uri) {
		if p.Version == nil {
			t.Fatalf("publication without a version for an open document")
		}
		if *p.Version < prev {
			t.Errorf("version %d published after version %d", *p.Version, prev)
		}
		prev = *p.Version
	}
	if prev != final {
		t.Errorf("last publication for version %d, want %d", prev, final)
	}
}
