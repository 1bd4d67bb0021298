package analyze

import (
	"context"
	"os"
	"runtime"
	"runtime/pprof"
	"testing"

	"walden/internal/benchpage"
)

func TestTmpLive(t *testing.T) {
	runtime.MemProfileRate = 512
	text, _ := benchpage.Typical(5_000)
	src := []Source{{Name: "typical.md", Kind: MarkdownPage, Text: []byte(text)}}
	var m0, m1 runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&m0)
	e := NewEngine(Config{})
	r, _ := e.AnalyzeLines(context.Background(), src)
	runtime.GC()
	runtime.ReadMemStats(&m1)
	t.Logf("live after open: %.1f MB, allocated %.1f MB, GCs %d", float64(m1.HeapAlloc-m0.HeapAlloc)/1e6, float64(m1.TotalAlloc-m0.TotalAlloc)/1e6, m1.NumGC-m0.NumGC)
	f, _ := os.Create("/tmp/live.mem")
	pprof.Lookup("heap").WriteTo(f, 0)
	f.Close()
	runtime.KeepAlive(r)
	runtime.KeepAlive(e)
}
