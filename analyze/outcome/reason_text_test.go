package outcome

import (
	"fmt"
	"math"
	"testing"
)

// TestAppendMatchesFmt checks that the reason writers give what the fmt
// verbs they replaced gave, signs of zero and rounding included.
func TestAppendMatchesFmt(t *testing.T) {
	vals := []float64{0, math.Copysign(0, -1), 0.04, -0.04, 0.05, -0.05, 0.25, -0.25, 1.25, -1.25, 2.5, -2.5, 1e9, -3.14159,
		123.456, 0.005, -0.005, 99.95, -99.95, 1e-9, -1e-9, math.Inf(1), math.Inf(-1), math.NaN()}
	for _, v := range vals {
		for _, p := range []int{0, 1, 2} {
			if g, w := string(appendFloat([]byte("x"), v, p)), "x"+fmt.Sprintf("%.*f", p, v); g != w {
				t.Errorf("appendFloat(%v, %d) = %q, fmt gives %q", v, p, g, w)
			}
			if g, w := string(appendSigned([]byte("x"), v, p)), "x"+fmt.Sprintf("%+.*f", p, v); g != w {
				t.Errorf("appendSigned(%v, %d) = %q, fmt gives %q", v, p, g, w)
			}
		}
	}
	for _, n := range []int{0, 1, -1, 42, -1 << 40} {
		if g, w := string(appendInt(nil, n)), fmt.Sprintf("%d", n); g != w {
			t.Errorf("appendInt(%d) = %q, fmt gives %q", n, g, w)
		}
	}
}
