package reagents

import "strings"

// roleWords are the words for each Role in the tables, the lab file and
// the documentation, in bit order.
var roleWords = [...]string{
	"nucleophile", "base", "activator", "acid", "catalyst", "additive",
	"oxidant", "reductant", "electrophile",
}

// RoleWords returns the accepted role words, in a fixed order.
func RoleWords() []string { return append([]string(nil), roleWords[:]...) }

// ParseRole returns the Role named by word (one of RoleWords).
func ParseRole(word string) (Role, bool) {
	for i, w := range roleWords {
		if w == word {
			return 1 << i, true
		}
	}
	return 0, false
}

// Has reports whether r includes every role of q.
func (r Role) Has(q Role) bool { return r&q == q && q != 0 }

// String lists the roles as comma-separated words ("nucleophile, base").
func (r Role) String() string {
	var parts []string
	for i, w := range roleWords {
		if r&(1<<i) != 0 {
			parts = append(parts, w)
		}
	}
	if len(parts) == 0 {
		return "none"
	}
	return strings.Join(parts, ", ")
}

// bulkWords are the words for each Bulk, in order.
var bulkWords = [...]string{"small", "moderate", "hindered"}

// ParseBulk returns the Bulk named by word ("small", "moderate", "hindered").
func ParseBulk(word string) (Bulk, bool) {
	for i, w := range bulkWords {
		if w == word {
			return Bulk(i), true
		}
	}
	return 0, false
}

// String returns "small", "moderate" or "hindered".
func (b Bulk) String() string {
	if b >= 0 && int(b) < len(bulkWords) {
		return bulkWords[b]
	}
	return "unknown"
}
