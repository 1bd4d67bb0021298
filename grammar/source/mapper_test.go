package source

import (
	"strings"
	"testing"
	"unicode/utf16"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// sample holds the characters the issue names (é, °, →, an emoji outside
// the BMP) and the three line ends. Byte layout, worked out by hand from
// the UTF-8 encoding (RFC 3629) and UTF-16 (RFC 2781):
//
//	é  bytes 0-1   1 unit     line 0 starts at 0
//	°  bytes 2-3   1 unit
//	→  bytes 4-6   1 unit
//	😀 bytes 7-10  2 units (surrogate pair)
//	x  byte  11    1 unit
//	\r\n bytes 12-13          line 1 starts at 14: "ab"
//	\r byte 16                line 2 starts at 17: "c"
//	\n byte 18                line 3 starts at 19: ""
const sample = "é°→😀x\r\nab\rc\n"

func TestPosition(t *testing.T) {
	m := NewMapper([]byte(sample))
	require.Equal(t, 4, m.LineCount())
	for _, tc := range []struct {
		off        Pos
		line, char int
	}{
		{0, 0, 0}, {2, 0, 1}, {4, 0, 2}, {7, 0, 3}, {11, 0, 5},
		{12, 0, 6}, // before CRLF
		{13, 0, 6}, // inside CRLF: end of line 0
		{14, 1, 0}, {16, 1, 2}, {17, 2, 0}, {18, 2, 1}, {19, 3, 0},
		{8, 0, 3},  // inside the emoji: its start
		{5, 0, 2},  // inside →
		{-5, 0, 0}, // clamped
		{99, 3, 0}, // clamped to the end
	} {
		line, char := m.Position(tc.off)
		assert.Equal(t, [2]int{tc.line, tc.char}, [2]int{line, char}, "offset %d", tc.off)
	}
}

func TestOffset(t *testing.T) {
	m := NewMapper([]byte(sample))
	for _, tc := range []struct {
		line, char int
		off        Pos
		bad        bool
	}{
		{0, 0, 0, false}, {0, 1, 2, false}, {0, 2, 4, false}, {0, 3, 7, false},
		{0, 4, 7, false}, // between the surrogates: start of the emoji
		{0, 5, 11, false}, {0, 6, 12, false},
		{0, 99, 12, false}, // past the end of the line: its end (LSP)
		{1, 2, 16, false}, {2, 0, 17, false}, {3, 0, 19, false}, {3, 7, 19, false},
		{4, 0, 19, true}, {-1, 0, 0, true}, {1, -1, 14, true},
	} {
		off, err := m.Offset(tc.line, tc.char)
		assert.Equal(t, tc.off, off, "line %d char %d", tc.line, tc.char)
		if tc.bad {
			assert.ErrorIs(t, err, ErrOutOfRange)
		} else {
			assert.NoError(t, err)
		}
	}
}

// TestRoundTrip checks Offset(Position(p)) == p at every character
// boundary, and compares each character count with Go's own UTF-16
// encoder over the line's prefix.
func TestRoundTrip(t *testing.T) {
	texts := []string{
		sample,
		"CCBr + NaN3, DMF, 60 °C → C[C@H](N=[N+]=[N-])C 🧪\n",
		"\r\n\r\n\n\r",
		"a\xffb\xe2\x86c\r\n\xf0\x9f\x98\x80", // invalid UTF-8 and a truncated arrow
		"",
		"no line end",
		"acetone–water 4:1, −78 °C\r\nºC ℃\r",
	}
	for _, text := range texts {
		m := NewMapper([]byte(text))
		for p := 0; p <= len(text); p++ {
			if p < len(text) && !boundary(text, p) {
				continue
			}
			line, char := m.Position(Pos(p))
			span := m.Line(line)
			prefix := text[span.Start:min(Pos(p), span.End)]
			assert.Equal(t, len(utf16.Encode([]rune(prefix))), char, "%q at %d", text, p)
			back, err := m.Offset(line, char)
			require.NoError(t, err)
			if p <= int(span.End) {
				assert.Equal(t, Pos(p), back, "%q at %d", text, p)
			} else {
				assert.Equal(t, span.End, back, "%q at %d (inside a line end)", text, p)
			}
		}
	}
}

// boundary reports whether p starts a character as Go's decoder reads
// text (invalid bytes are characters of their own).
func boundary(text string, p int) bool {
	for i := 0; i < len(text); {
		if i == p {
			return true
		}
		if i > p {
			return false
		}
		_, size := utf8.DecodeRuneInString(text[i:])
		i += size
	}
	return p == len(text)
}

func TestPoint(t *testing.T) {
	m := NewMapper([]byte(sample))
	assert.Equal(t, Point{1, 5}, m.Point(11)) // x is the 5th character: the emoji counts once
	assert.Equal(t, "2:3", m.Point(16).String())
	assert.Equal(t, Point{4, 1}, m.Point(19))
}

func TestLongLine(t *testing.T) {
	text := strings.Repeat("é", 1<<20) + "\n"
	m := NewMapper([]byte(text))
	line, char := m.Position(Pos(2 << 20))
	assert.Equal(t, [2]int{0, 1 << 20}, [2]int{line, char})
}

func BenchmarkMapper(b *testing.B) {
	var sb strings.Builder
	for i := range 10000 {
		if i%3 == 0 {
			sb.WriteString("[x] azide: @mesylate + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@H](N=[N+]=[N-])CCc1ccccc1\n")
		} else {
			sb.WriteString("CC(O)CCc1ccccc1 + MsCl (1.2 eq) + Et3N, CH2Cl2, 0 C\n")
		}
	}
	text := []byte(sb.String())
	b.ReportAllocs()
	b.ResetTimer()
	for range b.N {
		m := NewMapper(text)
		for p := 0; p < len(text); p += 97 {
			l, c := m.Position(Pos(p))
			if _, err := m.Offset(l, c); err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkReplaced: one character typed into a 5,000-line text, as the
// language server applies an edit, against reading the new text afresh.
func BenchmarkReplaced(b *testing.B) {
	text := []byte(strings.Repeat("s1: CC(C)Br + NaOEt, EtOH, 55 °C\nThe flask was dried.\n", 2500))
	m := NewMapper(text)
	at := Pos(len(text) / 2)
	b.Run("replaced", func(b *testing.B) {
		b.ReportAllocs()
		for range b.N {
			m.Replaced(Span{at, at}, "C")
		}
	})
	b.Run("fresh", func(b *testing.B) {
		b.ReportAllocs()
		for range b.N {
			edited := make([]byte, 0, len(text)+1)
			edited = append(append(append(edited, text[:at]...), 'C'), text[at:]...)
			NewMapper(edited)
		}
	})
}
