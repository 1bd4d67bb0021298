package notation

import (
	"testing"
)

// BenchmarkParse parses one long Kestrel step.
func BenchmarkParse(b *testing.B) {
	line := []byte("[x] azide: @mesylate + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1 // 81 %")
	b.ReportAllocs()
	b.SetBytes(int64(len(line)))
	for range b.N {
		Parse(line, 0)
	}
}
