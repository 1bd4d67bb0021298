package notation

import (
	"math/rand"
	"strconv"
	"testing"
)

// TestExactDecimal checks the fast conversion of amounts against
// strconv.ParseFloat, which rounds correctly, on the numbers chemists
// write and on random ones of up to 15 digits.
func TestExactDecimal(t *testing.T) {
	check := func(s string) {
		t.Helper()
		digits := 0
		for i := 0; i < len(s); i++ {
			if s[i] != '.' {
				digits++
			}
		}
		got, ok := exactDecimal(s, digits)
		want, err := strconv.ParseFloat(s, 64)
		if !ok || err != nil || got != want {
			t.Fatalf("exactDecimal(%q) = %v, %v; strconv.ParseFloat gives %v", s, got, ok, want)
		}
	}
	for _, s := range []string{"0", "0.1", "0.3", "1.5", "2", "60", "78", "1.2", "0.05", "12.345", "999999999999999", "0.00000000000001", "4.35"} {
		check(s)
	}
	r := rand.New(rand.NewSource(1))
	for range 200000 {
		n := 1 + r.Intn(15)
		b := make([]byte, n)
		for i := range b {
			b[i] = byte('0' + r.Intn(10))
		}
		s := string(b)
		if dot := r.Intn(n + 1); dot < n {
			s = s[:dot] + "." + s[dot:]
			if dot == 0 {
				s = "0" + s[:len(s)-1]
			}
		}
		check(s)
	}
	if _, ok := exactDecimal("1234567890123456", 16); ok {
		t.Error("exactDecimal took a 16-digit number")
	}
}
