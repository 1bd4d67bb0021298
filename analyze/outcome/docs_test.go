package outcome

import (
	"os"
	"strings"
	"testing"
)

// TestDocsListEveryCodeAndRule keeps docs/outcome.md in step with the
// code: every finding code and every rule must be documented there.
func TestDocsListEveryCodeAndRule(t *testing.T) {
	data, err := os.ReadFile("../../docs/outcome.md")
	if err != nil {
		t.Skipf("docs/outcome.md not found: %v", err)
	}
	doc := string(data)
	for _, c := range Codes {
		if !strings.Contains(doc, "`"+string(c.Code)+"`") {
			t.Errorf("docs/outcome.md does not document finding %s", c.Code)
		}
	}
	for _, r := range Rules {
		if !strings.Contains(doc, "`"+r.Name+"`") {
			t.Errorf("docs/outcome.md does not list rule %s", r.Name)
		}
	}
}
