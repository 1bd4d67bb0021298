package source

import (
	"testing"
	"unicode/utf16"
	"unicode/utf8"
)

// FuzzMapper compares the Mapper with a plain character-by-character
// reading of the LSP rules (line ends "\n", "\r\n", "\r"; UTF-16 units,
// one per invalid byte) at every offset, and checks the way back.
func FuzzMapper(f *testing.F) {
	for _, s := range []string{sample, "a\r\r\nb\rc", "\xff\xfe\r\n😀é°→", "", "\n", "\r", "ab\xe2\x86"} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, text []byte) {
		m := NewMapper(text)
		line, char := 0, 0
		for i := 0; i <= len(text); {
			gl, gc := m.Position(Pos(i))
			if gl != line || gc != char {
				t.Fatalf("offset %d: got %d:%d, want %d:%d", i, gl, gc, line, char)
			}
			if back, err := m.Offset(line, char); err != nil || back != Pos(i) {
				t.Fatalf("offset %d: back %d, %v", i, back, err)
			}
			if i == len(text) {
				break
			}
			switch c := text[i]; {
			case c == '\r' && i+1 < len(text) && text[i+1] == '\n':
				i += 2
				line, char = line+1, 0
			case c == '\n' || c == '\r':
				i++
				line, char = line+1, 0
			default:
				r, size := utf8.DecodeRune(text[i:])
				i += size
				char += len(utf16.Encode([]rune{r}))
			}
		}
		if m.LineCount() != line+1 {
			t.Fatalf("%d lines, want %d", m.LineCount(), line+1)
		}
	})
}
