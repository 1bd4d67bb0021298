package main

import (
	"go/parser"
	"go/token"
	"io/fs"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestArchitectureInvariants holds the layers to what ARCHITECTURE.md
// promises: grammar knows neither chemistry nor LSP, analyze knows no LSP,
// and the server reaches the chemistry only through package analyze.
func TestArchitectureInvariants(t *testing.T) {
	rules := []struct {
		dir       string
		forbidden []string
	}{
		{"grammar", []string{"walden/analyze", "walden/server", "go.lsp.dev/"}},
		{"analyze", []string{"walden/server", "go.lsp.dev/"}},
		{"server", []string{"walden/analyze/"}}, // package analyze itself is allowed, its chemistry packages are not
	}
	for _, r := range rules {
		err := filepath.WalkDir(r.dir, func(path string, d fs.DirEntry, err error) error {
			if err != nil || d.IsDir() || !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
				return err
			}
			f, err := parser.ParseFile(token.NewFileSet(), path, nil, parser.ImportsOnly)
			if err != nil {
				return err
			}
			for _, imp := range f.Imports {
				p, _ := strconv.Unquote(imp.Path.Value)
				for _, bad := range r.forbidden {
					// "x/" forbids the packages below x; "x" forbids x and them.
					if strings.HasPrefix(p, bad) || p == bad || strings.HasPrefix(p, bad+"/") {
						t.Errorf("%s imports %s: %s/ must not depend on it (ARCHITECTURE.md)", path, p, r.dir)
					}
				}
			}
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
	}
}
