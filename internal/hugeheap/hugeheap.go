// Package hugeheap asks the kernel to back the Go heap's next growth with
// huge pages.
//
// A long-running process that reads a whole page at once (the language
// server opening a document, `walden check` over a folder) grows its heap
// by tens of megabytes in a fraction of a second. Each fresh 4 KiB page
// costs a fault; on the virtual machines walden is measured on, one fault
// costs 5 to 13 µs, so a 30 MB growth costs 40 to 90 ms of CPU, as much as
// the chemistry. Backed by 2 MiB pages, the same growth takes a few dozen
// faults. The Go runtime no longer advises huge pages itself, and Linux's
// usual setting ("madvise") gives them only to memory that asks.
package hugeheap

// Prepare grows the heap by about n bytes and advises that range for huge
// pages, then frees it for the heap's ordinary use: the allocator hands
// out the lowest free addresses first, so the next n bytes of growth land
// there. It returns the number of bytes advised, 0 where the system has
// no such advice or refuses it. Call it once, early, before the heap has
// grown.
func Prepare(n int) (advised int, err error) { return prepare(n) }
