package analyze

import (
	"errors"
	"io/fs"
	"path/filepath"
	"strings"
	"testing"
)

func TestParseSettings(t *testing.T) {
	text := "# Kestrel lab\n" +
		"names = lab-names.txt # ours\n" +
		"disable = caution-lachrymator, no-solvent\n" +
		"solvent = DMF\n" +
		"temperature = 40 °C\n"
	cfg, errs := ParseSettings("/lab", []byte(text))
	if len(errs) != 0 {
		t.Fatalf("errors: %v", errs)
	}
	if cfg.LabNamesFile != filepath.Join("/lab", "lab-names.txt") {
		t.Errorf("LabNamesFile = %q", cfg.LabNamesFile)
	}
	if strings.Join(cfg.Disabled, "|") != "caution-lachrymator|no-solvent" {
		t.Errorf("Disabled = %q", cfg.Disabled)
	}
	if cfg.DefaultSolvent != "DMF" || cfg.DefaultTempC == nil || *cfg.DefaultTempC != 40 {
		t.Errorf("solvent %q temperature %v", cfg.DefaultSolvent, cfg.DefaultTempC)
	}
}

// TestParseSettingsErrors checks every error is placed on the offending
// characters, marked in the text with «».
func TestParseSettingsErrors(t *testing.T) {
	tests := []struct{ marked, msg string }{
		{"«colour» = blue\n", "unknown setting"},
		{"«just words»\n", "expected 'key = value'"},
		{"temperature = «warm»\n", "not understood"},
		{"solvent = DMF\n«solvent» = THF\n", "given twice"},
		{"«disable =»\n", "has no value"},
	}
	for _, tc := range tests {
		start := strings.Index(tc.marked, "«")
		end := strings.Index(tc.marked, "»") - len("«")
		text := strings.NewReplacer("«", "", "»", "").Replace(tc.marked)
		_, errs := ParseSettings("", []byte(text))
		if len(errs) != 1 {
			t.Errorf("%q: %d errors, want 1: %v", text, len(errs), errs)
			continue
		}
		e := errs[0]
		if int(e.Span.Start) != start || int(e.Span.End) != end || !strings.Contains(e.Msg, tc.msg) {
			t.Errorf("%q: got %d-%d %q, want %d-%d containing %q", text, e.Span.Start, e.Span.End, e.Msg, start, end, tc.msg)
		}
	}
}

func TestLoadSettingsWalksUp(t *testing.T) {
	files := map[string]string{
		filepath.FromSlash("/lab/walden.settings"): "names = names.txt\nsolvent = MeCN\n",
		filepath.FromSlash("/lab/names.txt"):       "kestrel-base\n",
	}
	read := func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, fs.ErrNotExist
	}
	cfg, file, errs := LoadSettings(filepath.FromSlash("/lab/pages/week1/azide.md"), read)
	if file != filepath.FromSlash("/lab/walden.settings") || len(errs) != 0 {
		t.Fatalf("file %q errs %v", file, errs)
	}
	if cfg.DefaultSolvent != "MeCN" || string(cfg.LabNames) != "kestrel-base\n" {
		t.Errorf("cfg = %+v", cfg)
	}
	_, file, _ = LoadSettings(filepath.FromSlash("/elsewhere/x.md"), read)
	if file != "" {
		t.Errorf("found %q outside the lab", file)
	}
	delete(files, filepath.FromSlash("/lab/names.txt"))
	_, _, errs = LoadSettings(filepath.FromSlash("/lab/a.steps"), func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, errors.New("no such file")
	})
	if len(errs) != 1 || errs[0].Span.Start != 0 {
		t.Errorf("missing names file: %v", errs)
	}
}
