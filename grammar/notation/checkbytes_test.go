package notation

import (
	"encoding/binary"
	"math/rand"
	"testing"
)

// TestUnprintableOrSlash8 checks that the lowest set bit of the mask is
// the first byte checkBytes must look at, byte by byte, on words made of
// the bytes around each boundary of the test and on random ones.
func TestUnprintableOrSlash8(t *testing.T) {
	looked := func(c byte) bool { return c == '/' || c < 0x20 || c > 0x7E }
	check := func(b [8]byte) {
		t.Helper()
		want := -1
		for k, c := range b {
			if looked(c) {
				want = k
				break
			}
		}
		m := unprintableOrSlash8(binary.LittleEndian.Uint64(b[:]))
		got := -1
		if m != 0 {
			for got = 0; m&(0x80<<(8*got)) == 0; got++ {
			}
		}
		if got != want {
			t.Fatalf("unprintableOrSlash8(%q): first byte %d, want %d", b[:], got, want)
		}
	}
	edges := []byte{0x00, 0x01, '\t', 0x1F, ' ', '!', '.', '/', '0', 'a', 0x7E, 0x7F, 0x80, 0xC2, 0xFE, 0xFF}
	for _, c := range edges {
		for _, d := range edges {
			for k := 0; k < 7; k++ {
				b := [8]byte{'a', 'a', 'a', 'a', 'a', 'a', 'a', 'a'}
				b[k], b[k+1] = c, d
				check(b)
			}
		}
	}
	r := rand.New(rand.NewSource(1))
	for range 200000 {
		var b [8]byte
		for k := range b {
			b[k] = edges[r.Intn(len(edges))]
			if r.Intn(2) == 0 {
				b[k] = byte(0x20 + r.Intn(0x5F))
			}
		}
		check(b)
	}
}
