package bounded

import (
	"sync"
	"testing"
)

func TestDoComputesOnce(t *testing.T) {
	var tb Table[string, int]
	calls := 0
	for range 3 {
		if v := tb.Do("a", func() int { calls++; return 7 }); v != 7 {
			t.Fatalf("Do = %d, want 7", v)
		}
	}
	if calls != 1 {
		t.Errorf("build ran %d times, want 1", calls)
	}
}

func TestTableStaysBounded(t *testing.T) {
	var tb Table[int, int]
	tb.Reserve(10)
	for i := range 3 * Max {
		tb.Put(i, i)
	}
	if n := len(tb.m); n > Max {
		t.Errorf("%d entries, want at most %d", n, Max)
	}
	if v, ok := tb.Get(3*Max - 1); !ok || v != 3*Max-1 {
		t.Errorf("the last entry put is %d, %v", v, ok)
	}
}

func TestConcurrentUse(t *testing.T) {
	var tb Table[int, int]
	var wg sync.WaitGroup
	for g := range 4 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range 1000 {
				if v := tb.Do(i%50, func() int { return (i % 50) * 2 }); v != (i%50)*2 {
					t.Errorf("goroutine %d: Do(%d) = %d", g, i%50, v)
					return
				}
			}
		}()
	}
	wg.Wait()
}
