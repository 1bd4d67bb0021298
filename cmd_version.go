package main

import (
	"fmt"
	"io"
	"runtime/debug"
)

// version is set at release time with -ldflags "-X main.version=…".
var version = "0.1.0-dev"

func init() {
	commands["version"] = command{"print walden's version", runVersion}
}

func runVersion(args []string, _ io.Reader, stdout, _ io.Writer) int {
	v := version
	if bi, ok := debug.ReadBuildInfo(); ok {
		v += " (" + bi.GoVersion + ")"
	}
	fmt.Fprintln(stdout, "walden", v)
	return 0
}
