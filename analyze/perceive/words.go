package perceive

import "strings"

// Words returns the kind as a chemist says it: "tertiary alkoxide" for
// alkoxide-tertiary, "secondary amine" for amine-secondary. The table
// keys stay hyphenated; messages and reasons use these words.
func (k NucKind) Words() string {
	s := string(k)
	head, tail, ok := strings.Cut(s, "-")
	if !ok {
		return s
	}
	switch tail {
	case "primary", "secondary", "tertiary", "hindered":
		return tail + " " + head
	}
	return strings.ReplaceAll(s, "-", " ")
}
