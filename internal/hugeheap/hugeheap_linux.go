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

// madvHugepage is MADV_HUGEPAGE, missing from package syscall.
const madvHugepage = 14

func prepare(n int) (int, error) {
	if n < hugePage {
		return 0, nil
	}
	// A fresh large object is a new mapping the runtime has not touched:
	// it knows fresh memory is zero and does not clear it.
	b := make([]byte, n)
	p := uintptr(unsafe.Pointer(unsafe.SliceData(b)))
	beg := (p + hugePage - 1) &^ (hugePage - 1)
	end := (p + uintptr(n)) &^ (hugePage - 1)
	var err error
	if beg < end {
		if _, _, e := syscall.Syscall(syscall.SYS_MADVISE, beg, end-beg, madvHugepage); e != 0 {
			err = e
		}
	}
	runtime.KeepAlive(b)
	b = nil
	runtime.GC() // return the range to the page allocator now
	if err != nil || beg >= end {
		return 0, err
	}
	return int(end - beg), nil
}
