package analyze

import (
	"runtime"
	"sync"
)

// parseNew parses line texts the Engine has not seen, on every core when
// there are many: opening a long page parses every line, lines are
// independent, and the chemist waits for the whole page. Short runs, as
// an edit makes, stay on the calling goroutine.
func parseNew(texts [][]byte, gen uint64) []*lineEntry {
	n := len(texts)
	fresh := make([]*lineEntry, n)
	workers := min(runtime.GOMAXPROCS(0), n/parseNewMin)
	if workers < 2 {
		for k := range fresh {
			fresh[k] = newLineEntry(texts[k], gen)
		}
		return fresh
	}
	var wg sync.WaitGroup
	for w := range workers {
		// Contiguous runs: neighbouring lines share the page's cache lines.
		lo, hi := w*n/workers, (w+1)*n/workers
		wg.Add(1)
		go func() {
			defer wg.Done()
			for k := lo; k < hi; k++ {
				fresh[k] = newLineEntry(texts[k], gen)
			}
		}()
	}
	wg.Wait()
	return fresh
}

// parseNewMin is the fewest lines per goroutine in parseNew.
const parseNewMin = 256
