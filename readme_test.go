package main

import (
	"os"
	"strings"
	"testing"

	"walden/analyze"
)

// TestReadmeDocumentsEveryCode keeps the README's diagnostics reference in
// step with the codes walden can emit: a new code must be documented there
// before it ships.
func TestReadmeDocumentsEveryCode(t *testing.T) {
	data, err := os.ReadFile("README.md")
	if err != nil {
		t.Fatal(err)
	}
	readme := string(data)
	for _, c := range analyze.Codes() {
		if !strings.Contains(readme, "`"+c.Code+"`") {
			t.Errorf("README.md does not document diagnostic code %q (%s)", c.Code, c.Title)
		}
	}
}
