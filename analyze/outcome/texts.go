package outcome

import (
	"sync"

	"walden/internal/bounded"
)

// texts keeps one copy of each reason text a Cache's predictions wrote.
// The steps of a page repeat their leaving groups, nucleophiles and
// solvents, so most texts recur and a look-up by the written bytes
// costs no allocation where a fresh string costs one. Like the other
// tables it is emptied when it reaches bounded.Max entries.
type texts struct {
	mu sync.Mutex
	m  map[string]string
}

// get returns a string equal to b, shared with earlier calls.
func (t *texts) get(b []byte) string {
	t.mu.Lock()
	s, ok := t.m[string(b)] // no allocation: the conversion is only a key
	if !ok {
		if t.m == nil {
			t.m = map[string]string{}
		} else if len(t.m) >= bounded.Max {
			clear(t.m)
		}
		s = string(b)
		t.m[s] = s
	}
	t.mu.Unlock()
	return s
}
