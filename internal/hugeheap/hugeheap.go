// Package hugeheap asks the kernel to back the Go heap's next growth with
// huge pages, and to fault the first part of it in at once.
//
// A long-running process that reads a whole page at once (the language
// server opening a document, `walden check` over a folder) grows its heap
// by tens of megabytes in a fraction of a second. Each fresh 4 KiB page
// costs a fault; on the virtual machines walden is measured on, one fault
// costs 5 to 13 µs, so a 30 MB growth costs 40 to 90 ms of CPU, as much as
// the chemistry. Backed by 2 MiB pages, the same growth takes a few dozen
// faults; faulted in by one madvise(MADV_POPULATE_WRITE) call, 64 MiB of
// them took 4 to 13 ms here, where touching them one by one took 120 to
// 160 ms while the host had not yet backed them. The Go runtime no longer
// advises huge pages itself, and Linux's usual setting ("madvise") gives
// them only to memory that asks.
package hugeheap

// Prepare grows the heap by about advise bytes, advises that range for
// huge pages and faults in its first populate bytes, then frees it for
// the heap's ordinary use: the allocator hands out the lowest free
// addresses first, so the next growth lands there. It returns the bytes
// advised and populated, 0 where the system has no such advice or
// refuses it (populating needs Linux 5.14). Call it once, early, before
// the heap has grown.
func Prepare(advise, populate int) (advised, populated int, err error) {
	return prepare(advise, populate)
}
