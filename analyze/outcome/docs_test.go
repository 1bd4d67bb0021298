package outcome

import (
	"os"
	"strings"
	"testing"
)

// TestDocsListEveryCodeAndRule keeps the documentation in step with the
// code: every finding code must be in the README's diagnostics reference
// and every rule in docs/outcome.md.
func TestDocsListEveryCodeAndRule(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range Codes {
		if !strings.Contains(string(readme), "`"+string(c.Code)+"`") {
			t.Errorf("README.md does not document finding %s", c.Code)
		}
	}
	data, err := os.ReadFile("../../docs/outcome.md")
	if err != nil {
		t.Fatal(err)
	}
	doc := string(data)
	for _, r := range Rules {
		if !strings.Contains(doc, "`"+r.Name+"`") {
			t.Errorf("docs/outcome.md does not list rule %s", r.Name)
		}
	}
}
