// Command walden reads reaction plans in chemists' notebooks, predicts the
// outcome of aliphatic substitution and elimination steps, and serves the
// same analysis to editors over the Language Server Protocol.
package main

import (
	"fmt"
	"io"
	"os"
	"sort"
)

// command is one subcommand. run returns the process exit code.
type command struct {
	summary string
	run     func(args []string, stdin io.Reader, stdout, stderr io.Writer) int
}

// commands is filled by the init functions of the cmd_*.go files, one file
// per subcommand.
var commands = map[string]command{}

func main() {
	os.Exit(run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}

func run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	if len(args) == 0 || args[0] == "help" || args[0] == "-h" || args[0] == "--help" {
		usage(stdout)
		return 0
	}
	c, ok := commands[args[0]]
	if !ok {
		fmt.Fprintf(stderr, "walden: unknown command %q\n\n", args[0])
		usage(stderr)
		return 2
	}
	return c.run(args[1:], stdin, stdout, stderr)
}

func usage(w io.Writer) {
	fmt.Fprintln(w, "usage: walden <command> [arguments]\n\ncommands:")
	names := make([]string, 0, len(commands))
	for n := range commands {
		names = append(names, n)
	}
	sort.Strings(names)
	for _, n := range names {
		fmt.Fprintf(w, "  %-8s %s\n", n, commands[n].summary)
	}
	fmt.Fprintln(w, "\nRun 'walden <command> -h' for a command's options.")
}
