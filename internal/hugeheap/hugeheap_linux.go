package hugeheap

import (
	"runtime"
	"syscall"
	"unsafe"
)

// hugePage is the huge page size of the platforms Go's heap runs on under
// Linux with 4 KiB base pages (amd64, arm64, 386): a whole number of them
// in the advised range gets huge pages, a part of one does not.
const hugePage = 2 << 20

// The advice values missing from package syscall.
const (
	madvHugepage      = 14
	madvPopulateWrite = 23
)

func prepare(advise, populate int) (advised, populated int, err error) {
	if advise < hugePage {
		return 0, 0, nil
	}
	// A fresh large object is a new mapping the runtime has not touched:
	// it knows fresh memory is zero and does not clear it.
	b := make([]byte, advise)
	p := uintptr(unsafe.Pointer(unsafe.SliceData(b)))
	beg := (p + hugePage - 1) &^ (hugePage - 1)
	end := (p + uintptr(advise)) &^ (hugePage - 1)
	if beg < end {
		if err = madvise(beg, end-beg, madvHugepage); err == nil {
			advised = int(end - beg)
			if n := min(uintptr(populate), end-beg) &^ (hugePage - 1); n > 0 && madvise(beg, n, madvPopulateWrite) == nil {
				populated = int(n)
			}
		}
	}
	runtime.KeepAlive(b)
	b = nil
	runtime.GC() // return the range to the page allocator now
	return advised, populated, err
}

func madvise(addr, n uintptr, advice int) error {
	if _, _, e := syscall.Syscall(syscall.SYS_MADVISE, addr, n, uintptr(advice)); e != 0 {
		return e
	}
	return nil
}
