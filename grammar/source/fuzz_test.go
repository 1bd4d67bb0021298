package source

import (
	"slices"
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

// FuzzReplaced checks that a Mapper made by Replaced, which reads again
// only the lines around the change, equals one made from scratch for the
// new text: every CR and LF joined or split at the change's edges
// included.
func FuzzReplaced(f *testing.F) {
	for _, s := range []struct {
		text, repl string
		at, cut    uint16
	}{
		{sample, "x", 3, 0}, {"a\r\nb", "", 1, 1}, {"a\rb", "\n", 2, 0}, {"a\r", "\n", 2, 0},
		{"a\nb\nc\n", "\r", 2, 0}, {"a\r\nb", "", 2, 1}, {"", "\n\r", 0, 0}, {"\r\r\r", "\n", 1, 1},
		{"line one\nline two\r\nthree é\n", "new\nlines\r", 9, 8}, {"😀\n°→\r", "", 5, 6},
	} {
		f.Add([]byte(s.text), []byte(s.repl), s.at, s.cut)
	}
	f.Fuzz(func(t *testing.T, text, repl []byte, at, cut uint16) {
		start := int(at) % (len(text) + 1)
		end := min(start+int(cut), len(text))
		got := NewMapper(text).Replaced(Span{Pos(start), Pos(end)}, string(repl))
		newText := append(append(append([]byte{}, text[:start]...), repl...), text[end:]...)
		want := NewMapper(newText)
		if string(got.text) != string(want.text) {
			t.Fatalf("text %q, want %q", got.text, want.text)
		}
		if !slices.Equal(got.starts, want.starts) || !slices.Equal(got.ascii, want.ascii) {
			t.Fatalf("%q with %d-%d replaced by %q: starts %v ascii %v, want %v %v", text, start, end, repl, got.starts, got.ascii, want.starts, want.ascii)
		}
	})
}
