package outcome

import (
	"fmt"
	"math"
	"strconv"
)

// The rules write their reasons by appending to one buffer (see
// scoring.said) instead of calling fmt: formatting boxes every number
// and allocates a string per reason, which on a page of thousands of
// steps was a twentieth of everything the analysis allocated. These
// helpers produce exactly what fmt's verbs did.

// appendFloat appends v as fmt's %.<prec>f does.
func appendFloat(b []byte, v float64, prec int) []byte {
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return fmt.Appendf(b, "%.*f", prec, v) // fmt's own signs for these
	}
	return strconv.AppendFloat(b, v, 'f', prec, 64)
}

// appendSigned appends v as fmt's %+.<prec>f does: always with a sign.
func appendSigned(b []byte, v float64, prec int) []byte {
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return fmt.Appendf(b, "%+.*f", prec, v)
	}
	n := len(b)
	b = strconv.AppendFloat(b, v, 'f', prec, 64)
	if b[n] != '+' && b[n] != '-' {
		b = append(b, 0)
		copy(b[n+1:], b[n:])
		b[n] = '+'
	}
	return b
}

// appendInt appends v as fmt's %d does.
func appendInt(b []byte, v int) []byte { return strconv.AppendInt(b, int64(v), 10) }
