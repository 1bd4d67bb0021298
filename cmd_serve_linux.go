package main

import (
	"os"
	"syscall"
)

// widenPipe raises the buffer of the pipe f writes to from the usual
// 64 KiB to 1 MiB (Linux's limit for unprivileged processes), so that a
// publication of a long page's diagnostics, several hundred kilobytes of
// JSON, goes to the editor in one write instead of a dozen that each wait
// for it to read. It does nothing when f is not a pipe or the system
// refuses.
func widenPipe(f *os.File) {
	const setPipeSize = 1031 // F_SETPIPE_SZ, missing from package syscall
	if fi, err := f.Stat(); err == nil && fi.Mode()&os.ModeNamedPipe != 0 {
		syscall.Syscall(syscall.SYS_FCNTL, f.Fd(), setPipeSize, 1<<20)
	}
}
