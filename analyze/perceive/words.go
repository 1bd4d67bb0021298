package perceive

import "strings"

// Words returns the kind as a chemist says it: "tertiary alkoxide" for
// alkoxide-tertiary, "secondary amine" for amine-secondary. The table
// keys stay hyphenated; messages and reasons use these words.
func (k NucKind) Words() string {
	if !strings.Contains(string(k), "-") {
		return string(k)
	}
	if w, ok := kindWords[k]; ok {
		return w // the table's kinds are worded once, not per message
	}
	return k.words()
}

// words is Words worked out.
func (k NucKind) words() string {
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

// kindWords holds Words for the hyphenated kinds of the nucleophile table.
var kindWords = func() map[NucKind]string {
	out := map[NucKind]string{}
	for k := range nucData {
		if strings.Contains(string(k), "-") {
			out[k] = k.words()
		}
	}
	return out
}()
