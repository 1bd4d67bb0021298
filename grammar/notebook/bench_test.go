package notebook

import (
	"bytes"
	"encoding/json"
	"fmt"
	"runtime"
	"sync"
	"sync/atomic"
	"testing"

	"walden/grammar/notation"
	"walden/grammar/source"
	"walden/internal/benchcpu"
)

// kestrelSteps are the lines the generated notebooks repeat: the Kestrel
// plan, from short to long.
var kestrelSteps = []string{
	"mesylate%d: C[C@H](O)CCc1ccccc1 + MsCl (1.2 eq) + Et3N (1.5 eq), CH2Cl2, 0 °C, 1 h",
	"[x] azide%d: @mesylate%d + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1",
	"amine%d: @azide%d + PPh3, THF/water, rt, overnight",
	"ether%d: @mesylate%d + NaOEt, EtOH, reflux // E2 risk",
	"CCBr + NaN3, DMF",
}

// page writes a Markdown page of n steps, ten to a fenced block with a
// line of prose between blocks.
func page(n int) []byte {
	var b bytes.Buffer
	b.WriteString("# Kestrel, generated\n\n")
	for i := 0; i < n; i++ {
		if i%10 == 0 {
			if i > 0 {
				b.WriteString("```\n\nNext batch.\n\n")
			}
			b.WriteString("```reaction\n")
		}
		var line string
		switch f := kestrelSteps[i%len(kestrelSteps)]; i % len(kestrelSteps) {
		case 0:
			line = fmt.Sprintf(f, i)
		case 4:
			line = f
		default:
			line = fmt.Sprintf(f, i, i-1)
		}
		b.WriteString(line)
		b.WriteByte('\n')
	}
	b.WriteString("```\n")
	return b.Bytes()
}

// start begins the timing of a benchmark over n bytes, with allocations
// and CPU time reported; the function it returns ends it.
func start(b *testing.B, n int) func() {
	b.SetBytes(int64(n))
	b.ReportAllocs()
	b.ResetTimer()
	return benchcpu.Measure(b)
}

// BenchmarkMarkdown10000: find and parse every step of a 10,000-step page.
func BenchmarkMarkdown10000(b *testing.B) {
	text := page(10000)
	defer start(b, len(text))()
	for range b.N {
		pg := FindMarkdown(text)
		if len(pg.Lines) != 10000 {
			b.Fatalf("%d lines", len(pg.Lines))
		}
		for _, l := range pg.Lines {
			notation.Parse(text[l.Span.Start:l.Span.End], l.Span.Start)
		}
	}
}

// BenchmarkMarkdown10000Batch: the same with notation.ParseLines, as a
// whole page is read by the command line and on opening a document.
func BenchmarkMarkdown10000Batch(b *testing.B) {
	text := page(10000)
	defer start(b, len(text))()
	for range b.N {
		pg := FindMarkdown(text)
		spans := make([]source.Span, len(pg.Lines))
		for i, l := range pg.Lines {
			spans[i] = l.Span
		}
		steps, _ := notation.ParseLines(text, spans)
		if len(steps) != 10000 {
			b.Fatalf("%d steps", len(steps))
		}
	}
}

// BenchmarkFind10000: finding the lines only.
func BenchmarkFind10000(b *testing.B) {
	text := page(10000)
	defer start(b, len(text))()
	for range b.N {
		FindMarkdown(text)
	}
}

// notebook10000 is the page of BenchmarkMarkdown10000 cut into 1,000
// markdown cells of a Jupyter notebook.
func notebook10000(b *testing.B) []byte {
	text := page(10000)
	var cells []map[string]any
	for _, chunk := range bytes.SplitAfter(text, []byte("\nNext batch.\n")) {
		cells = append(cells, map[string]any{"cell_type": "markdown", "metadata": map[string]any{}, "source": string(chunk)})
	}
	data, err := json.Marshal(map[string]any{"nbformat": 4, "nbformat_minor": 5, "metadata": map[string]any{}, "cells": cells})
	if err != nil {
		b.Fatal(err)
	}
	return data
}

// mustRead reads a notebook the benchmark made.
func mustRead(b *testing.B, data []byte) *Notebook {
	nb, errs := ReadNotebook(data)
	if len(errs) > 0 {
		b.Fatal(errs)
	}
	return nb
}

// BenchmarkNotebook10000: the notebook read, and its steps parsed line
// by line with notation.Parse.
func BenchmarkNotebook10000(b *testing.B) {
	data := notebook10000(b)
	defer start(b, len(data))()
	for range b.N {
		nb := mustRead(b, data)
		n := 0
		for _, c := range nb.Cells {
			for _, l := range c.Page.Lines {
				notation.Parse(c.Text[l.Span.Start:l.Span.End], l.Span.Start)
				n++
			}
		}
		if n != 10000 {
			b.Fatalf("%d steps", n)
		}
	}
}

// BenchmarkNotebook10000Batch: the same with each cell read by
// notation.ParseLines, the cells shared out between the cores as a
// reader of a whole notebook does (cells are separate texts, and one of
// ten steps is too short for ParseLines to share out itself).
func BenchmarkNotebook10000Batch(b *testing.B) {
	data := notebook10000(b)
	defer start(b, len(data))()
	for range b.N {
		nb := mustRead(b, data)
		// The cells are taken in turn, a few dozen at a time, so that a
		// core the collector holds for a while delays only its share.
		const chunk = 32
		var next, steps atomic.Int64
		var wg sync.WaitGroup
		for range runtime.GOMAXPROCS(0) {
			wg.Add(1)
			go func() {
				defer wg.Done()
				var spans []source.Span
				for {
					lo := int(next.Add(chunk)) - chunk
					if lo >= len(nb.Cells) {
						return
					}
					for _, c := range nb.Cells[lo:min(lo+chunk, len(nb.Cells))] {
						spans = spans[:0]
						for _, l := range c.Page.Lines {
							spans = append(spans, l.Span)
						}
						parsed, _ := notation.ParseLines(c.Text, spans)
						steps.Add(int64(len(parsed)))
					}
				}
			}()
		}
		wg.Wait()
		if n := steps.Load(); n != 10000 {
			b.Fatalf("%d steps", n)
		}
	}
}

// BenchmarkReadNotebook10000: reading the notebook only.
func BenchmarkReadNotebook10000(b *testing.B) {
	data := notebook10000(b)
	defer start(b, len(data))()
	for range b.N {
		mustRead(b, data)
	}
}
