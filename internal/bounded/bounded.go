// Package bounded holds the table the analysis keeps its shared work in:
// a map safe for concurrent use that never grows past a fixed number of
// entries, because a chemist's session may run for hours over pages that
// keep changing.
package bounded

import "sync"

// Max is how many entries a Table holds before it is emptied. Emptying
// costs some recomputation and never a wrong answer.
const Max = 1 << 13

// Table maps keys to values computed once. The zero value is an empty
// table, made on first use so that a caller that looks up one key does
// not pay for a large map.
type Table[K comparable, V any] struct {
	mu sync.Mutex
	m  map[K]V
}

// Get returns the value stored under k.
func (t *Table[K, V]) Get(k K) (V, bool) {
	t.mu.Lock()
	v, ok := t.m[k]
	t.mu.Unlock()
	return v, ok
}

// Put stores v under k, emptying the table first when it is full.
func (t *Table[K, V]) Put(k K, v V) {
	t.mu.Lock()
	if t.m == nil {
		t.m = map[K]V{}
	} else if len(t.m) >= Max {
		clear(t.m)
	}
	t.m[k] = v
	t.mu.Unlock()
}

// Do returns the value under k, computing it with build and storing it
// on a miss. build runs without the lock held: two goroutines missing the
// same key may both compute it, and either answer serves.
func (t *Table[K, V]) Do(k K, build func() V) V {
	if v, ok := t.Get(k); ok {
		return v
	}
	v := build()
	t.Put(k, v)
	return v
}

// Reserve makes an empty table with room for n entries (at most Max), so
// that filling it for a long page does not grow it step by step.
func (t *Table[K, V]) Reserve(n int) {
	t.mu.Lock()
	if t.m == nil {
		t.m = make(map[K]V, min(n, Max))
	}
	t.mu.Unlock()
}
