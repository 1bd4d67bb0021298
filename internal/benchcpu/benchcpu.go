// Package benchcpu adds the process's CPU time per operation to a
// benchmark's figures. On a machine shared with other work the wall clock
// also counts their turns; user + system CPU time, garbage collector
// included, does not.
package benchcpu

import (
	"syscall"
	"testing"
	"time"
)

// now is the process's user + system CPU time so far.
func now() time.Duration {
	var ru syscall.Rusage
	if syscall.Getrusage(syscall.RUSAGE_SELF, &ru) != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}

// Measure starts measuring; the function it returns adds the
// "cpu-ms/op" metric for the b.N operations since. Use it as
//
//	defer benchcpu.Measure(b)()
//
// after b.ResetTimer.
func Measure(b *testing.B) func() {
	start := now()
	return func() {
		if d := now() - start; d > 0 {
			b.ReportMetric(float64(d)/float64(time.Millisecond)/float64(b.N), "cpu-ms/op")
		}
	}
}
