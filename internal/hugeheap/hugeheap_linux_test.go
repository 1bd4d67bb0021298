package hugeheap

import (
	"bufio"
	"bytes"
	"os"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// advisedMemory sums, over the process's mappings that carry the huge
// page advice ("hg" in VmFlags of /proc/self/smaps), their size and the
// part of it backed by huge pages, in bytes.
func advisedMemory(t *testing.T) (size, huge int) {
	data, err := os.ReadFile("/proc/self/smaps")
	require.NoError(t, err)
	var vmSize, vmHuge int
	sc := bufio.NewScanner(bytes.NewReader(data))
	for sc.Scan() {
		f := strings.Fields(sc.Text())
		if len(f) < 2 {
			continue
		}
		kb := func() int { n, _ := strconv.Atoi(f[1]); return n << 10 }
		switch f[0] {
		case "Size:":
			vmSize = kb()
		case "AnonHugePages:":
			vmHuge = kb()
		case "VmFlags:":
			for _, fl := range f[1:] {
				if fl == "hg" {
					size += vmSize
					huge += vmHuge
				}
			}
		}
	}
	return size, huge
}

func TestPrepareAdvisesTheNextGrowth(t *testing.T) {
	size0, huge0 := advisedMemory(t)
	advised, populated, err := Prepare(16<<20, 4<<20)
	require.NoError(t, err)
	require.GreaterOrEqual(t, advised, 14<<20, "a 16 MiB range holds at least seven whole 2 MiB pages")
	size1, _ := advisedMemory(t)
	require.GreaterOrEqual(t, size1-size0, advised, "the advice is on the process's mappings")
	if populated == 0 {
		t.Log("this kernel cannot populate (Linux before 5.14): only the advice is checked")
	} else {
		require.Equal(t, 4<<20, populated)
	}

	// The heap's next growth lands in the advised range: small objects
	// kept alive fill it, and the kernel backs it with huge pages where
	// the system allows them at all.
	keep := make([][]byte, 0, 12<<10)
	for range cap(keep) {
		b := make([]byte, 1<<10)
		b[0] = 1
		keep = append(keep, b)
	}
	setting, _ := os.ReadFile("/sys/kernel/mm/transparent_hugepage/enabled")
	if !bytes.Contains(setting, []byte("[madvise]")) && !bytes.Contains(setting, []byte("[always]")) {
		t.Skipf("huge pages are off on this system (%q): only the advice is checked", strings.TrimSpace(string(setting)))
	}
	_, huge1 := advisedMemory(t)
	require.Greater(t, huge1, huge0, "12 MiB of new small objects are backed by huge pages")
	_ = keep[len(keep)-1]
}
