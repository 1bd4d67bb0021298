package analyze

import (
	"context"
	"fmt"
	"strings"
	"testing"
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
		NewEngine(Config{}).Analyze(context.Background(), src)
	}
}

// BenchmarkNotebook10k analyses a 10,000-step page with an empty cache.
func BenchmarkNotebook10k(b *testing.B) {
	src := []Source{{Name: "bench.md", Kind: MarkdownPage, Text: benchNotebook(10_000)}}
	b.ReportAllocs()
	b.ResetTimer()
	for range b.N {
		NewEngine(Config{}).Analyze(context.Background(), src)
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
	for i := range b.N {
		edited := strings.Replace(string(text), "NaI, acetone, 23 °C", fmt.Sprintf("NaI, acetone, %d °C", 100+i%50), 1)
		e.Analyze(context.Background(), []Source{{Kind: MarkdownPage, Text: []byte(edited)}})
	}
}
