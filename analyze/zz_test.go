package analyze

import (
	"context"
	"testing"
	"fmt"
	"runtime"
	"os"
	"runtime/pprof"
)

func TestZZMem(t *testing.T) {
	text := benchNotebook(10_000)
	e := NewEngine(Config{})
	reps, _ := e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: text}})
	runtime.GC()
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	fmt.Println("heap MB", ms.HeapAlloc>>20, len(reps[0].Steps), e.Analysed())
	f, _ := os.Create("/tmp/heap.out")
	pprof.WriteHeapProfile(f)
	f.Close()
	runtime.KeepAlive(e)
	runtime.KeepAlive(reps)
}
