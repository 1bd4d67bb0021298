package notebook

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestEdited lists the changes Edited takes on itself and those it
// leaves to a fresh reading; where it takes one, its page must equal the
// fresh one (FuzzEdited checks the same on arbitrary changes).
func TestEdited(t *testing.T) {
	old := "# Page\n\n```reaction\ns1: CCBr + NaN3, DMF  \n/x + y\n// note\n```\n\nProse.\n```reaction\nCCO + NaH\n```\n"
	for _, c := range []struct {
		name     string
		from, to string // the first occurrence of from becomes to
		reusable bool
	}{
		{"type inside a step", "NaN3,", "NaN3 ,", true},
		{"type at the end of a step", "DMF  ", "DMF, 60 °C  ", true},
		{"delete inside a step", "CCBr + ", "CCBr", true},
		{"delete to the step's end", ", DMF", "", true},
		{"type in the second block", "NaH", "NaH (2 eq)", true},
		{"type in prose", "Prose.", "Prose!", false},
		{"a line end", "NaN3,", "NaN3,\n", false},
		{"a fence character", "DMF", "DMF`", false},
		{"before the first character", "s1:", "xs1:", false},
		{"make a comment", "/x", "//x", false},
		{"type on the fence", "```\n\nProse", "```x\n\nProse", false},
	} {
		t.Run(c.name, func(t *testing.T) {
			require.Contains(t, old, c.from)
			text := strings.Replace(old, c.from, c.to, 1)
			got, ok := Edited(FindMarkdown([]byte(old)), []byte(old), []byte(text))
			require.Equal(t, c.reusable, ok)
			if ok {
				assert.Equal(t, FindMarkdown([]byte(text)), got)
			}
			// A plan file reads every line; where Edited takes the change
			// on, it must agree with the plan finder too.
			if got, ok := Edited(FindPlan([]byte(old)), []byte(old), []byte(text)); ok {
				assert.Equal(t, FindPlan([]byte(text)), got)
			}
		})
	}
}
