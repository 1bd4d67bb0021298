//go:build !linux

package main

import "os"

// widenPipe is a Linux tuning (cmd_serve_linux.go).
func widenPipe(*os.File) {}
