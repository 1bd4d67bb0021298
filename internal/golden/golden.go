// Package golden compares test output with golden files under testdata/
// and rewrites them when the tests run with -update. Every package's
// golden tests use it, so the flag and the messages are the same
// everywhere.
package golden

import (
	"flag"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite golden files")

// Updating reports whether the tests run with -update.
func Updating() bool { return *update }

// Check compares got with the file at path, or writes got there with
// -update. A difference shows the first lines that differ; review the
// whole diff with git after an update.
func Check(t testing.TB, path, got string) {
	t.Helper()
	if *update {
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if string(want) != got {
		t.Errorf("%s differs (run go test -update and review the diff):\n%s", path, Diff(string(want), got))
	}
}

// Diff shows the first lines where want and got differ, numbered from 1.
func Diff(want, got string) string {
	wl, gl := strings.Split(want, "\n"), strings.Split(got, "\n")
	var b strings.Builder
	shown := 0
	for i := 0; i < max(len(wl), len(gl)) && shown < 10; i++ {
		var w, g string
		if i < len(wl) {
			w = wl[i]
		}
		if i < len(gl) {
			g = gl[i]
		}
		if w == g {
			continue
		}
		b.WriteString("line " + strconv.Itoa(i+1) + "\n  want: " + w + "\n  got:  " + g + "\n")
		shown++
	}
	return b.String()
}
