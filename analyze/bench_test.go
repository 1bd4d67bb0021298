package analyze

import (
	"context"
	"fmt"
	"slices"
	"strings"
	"testing"

	"walden/internal/benchcpu"
	"walden/internal/benchpage"
)

// benchLines are the kinds of step a notebook holds, cycled with varied
// numbers so that most lines are distinct (a cold cache sees each once).
var benchLines = []string{
	"C[C@H](Br)CCc1ccccc1 + NaN3 (1.5 eq), DMF, %d °C",
	"C[C@H](O)CCc1ccccc1 + TsCl (1.2 eq) + pyridine, DCM, 0 °C to rt, %d h",
	"CC(C)(Br)CCc1ccccc1 + KOtBu, THF, %d °C",
	"CCCCBr + NaI, acetone, %d °C",
	"BrCc1ccccc1 + OCCc1ccccc1 + NaH, THF, 0 °C, %d h",
	"CCCCCl + NaCN, DMSO, %d °C -> CCCCC#N",
}

// benchNotebook returns a Markdown page with n steps in blocks of 20, with
// label chains (every fifth step uses the one before it).
func benchNotebook(n int) []byte {
	var b strings.Builder
	b.WriteString("# Bench notebook\n\n")
	for i := 0; i < n; i++ {
		if i%20 == 0 {
			if i > 0 {
				b.WriteString("```\n\nProse between blocks.\n\n")
			}
			b.WriteString("```reaction\n")
		}
		line := fmt.Sprintf(benchLines[i%len(benchLines)], 20+i%97)
		switch i % 5 {
		case 3:
			line = fmt.Sprintf("s%d: %s", i, line)
		case 4:
			line = fmt.Sprintf("@s%d + NaN3, DMF, %d °C", i-1, 20+i%89)
		}
		b.WriteString(line + "\n")
	}
	b.WriteString("```\n")
	return []byte(b.String())
}

// BenchmarkSingleStep analyses one step with an empty cache each time.
func BenchmarkSingleStep(b *testing.B) {
	src := []Source{{Kind: PlanFile, Text: []byte("C[C@H](Br)CCc1ccccc1 + NaN3 (1.5 eq), DMF, 60 °C")}}
	b.ReportAllocs()
	for range b.N {
		NewEngine(Config{}).AnalyzeLines(context.Background(), src)
	}
}

// BenchmarkNotebook10k analyses a 10,000-step page with an empty cache.
func BenchmarkNotebook10k(b *testing.B) {
	src := []Source{{Name: "bench.md", Kind: MarkdownPage, Text: benchNotebook(10_000)}}
	b.ReportAllocs()
	b.ResetTimer()
	defer benchcpu.Measure(b)()
	for range b.N {
		NewEngine(Config{}).AnalyzeLines(context.Background(), src)
	}
}

// BenchmarkNotebook10kEdit re-analyses the page after a one-step edit,
// as the language server does on every keystroke.
func BenchmarkNotebook10kEdit(b *testing.B) {
	text := benchNotebook(10_000)
	e := NewEngine(Config{})
	e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: text}})
	b.ReportAllocs()
	b.ResetTimer()
	defer benchcpu.Measure(b)()
	for i := range b.N {
		edited := strings.Replace(string(text), "NaI, acetone, 23 °C", fmt.Sprintf("NaI, acetone, %d °C", 100+i%50), 1)
		e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: []byte(edited)}})
	}
}

// BenchmarkEditOneLine re-analyses a 5,000-step page after an edit of one
// line near its top, the worst place: every later line moves. Each
// iteration types one more character or deletes it again, as a chemist
// does, so the page's length and the positions after the edit change.
func BenchmarkEditOneLine(b *testing.B) {
	text := string(benchNotebook(5_000))
	at := strings.Index(text, "NaI, acetone, 23 °C") + len("NaI, acetone, 23")
	pages := [][]byte{[]byte(text[:at] + "5" + text[at:]), []byte(text)}
	e := NewEngine(Config{})
	for _, p := range pages {
		e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: p}})
	}
	b.ReportAllocs()
	b.ResetTimer()
	defer benchcpu.Measure(b)()
	for i := range b.N {
		e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: pages[i%2]}})
	}
}

// BenchmarkEditOneLineNew is BenchmarkEditOneLine with a line text the
// Engine has not seen, so the edited line is parsed and analysed.
func BenchmarkEditOneLineNew(b *testing.B) {
	text := string(benchNotebook(5_000))
	at := strings.Index(text, "NaI, acetone, 23 °C") + len("NaI, acetone, 2")
	e := NewEngine(Config{})
	e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: []byte(text)}})
	pages := make([][]byte, 1000)
	for i := range pages {
		pages[i] = []byte(text[:at] + fmt.Sprint(1000+i) + text[at:])
	}
	b.ReportAllocs()
	b.ResetTimer()
	defer benchcpu.Measure(b)()
	for i := range b.N {
		e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: pages[i%len(pages)]}})
	}
}

// BenchmarkOpen5k analyses a 5,000-step page with an empty cache, as on
// opening a document: the time to the first diagnostics.
func BenchmarkOpen5k(b *testing.B) {
	benchOpen(b, Source{Name: "bench.md", Kind: MarkdownPage, Text: benchNotebook(5_000)})
}

// BenchmarkOpenTypical analyses the language server benchmark's typical
// 5,000-line page (benchpage.Typical) with an empty cache, as the server
// does (AnalyzeLines): the work behind the first diagnostics after
// opening it.
func BenchmarkOpenTypical(b *testing.B) {
	text, _ := benchpage.Typical(5_000)
	benchOpen(b, Source{Name: "typical.md", Kind: MarkdownPage, Text: []byte(text)})
}

// benchOpen analyses src with a new Engine each time.
func benchOpen(b *testing.B, src Source) {
	b.ReportAllocs()
	b.ResetTimer()
	defer benchcpu.Measure(b)()
	for range b.N {
		NewEngine(Config{}).AnalyzeLines(context.Background(), []Source{src})
	}
}

// BenchmarkEditTypical re-reads the typical page (benchpage.Typical) as
// the language server does after each keystroke (AnalyzeLines): a
// character typed into a step line, then deleted again, as in the
// server's edit benchmark.
func BenchmarkEditTypical(b *testing.B) {
	text, steps := benchpage.Typical(5_000)
	lines := strings.SplitAfter(text, "\n")
	e := NewEngine(Config{})
	original := []byte(text)
	e.AnalyzeLines(context.Background(), []Source{{Name: "typical.md", Kind: MarkdownPage, Text: original}})
	edited := make([][]byte, 64)
	for i := range edited {
		changed := slices.Clone(lines)
		l := steps[(i*37)%len(steps)]
		changed[l] = changed[l][:4] + "C" + changed[l][4:]
		edited[i] = []byte(strings.Join(changed, ""))
	}
	b.ReportAllocs()
	b.ResetTimer()
	defer benchcpu.Measure(b)()
	for i := range b.N {
		page := original
		if i%2 == 0 {
			page = edited[(i/2)%len(edited)]
		}
		e.AnalyzeLines(context.Background(), []Source{{Name: "typical.md", Kind: MarkdownPage, Text: page}})
	}
}
