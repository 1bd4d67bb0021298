package main

import (
	"context"
	"flag"
	"fmt"
	"io"
	"log/slog"
	"os"
	"os/signal"
	"runtime/debug"
	"runtime/pprof"
	"syscall"

	"walden/internal/hugeheap"
	"walden/server"
)

func init() {
	commands["serve"] = command{"speak the Language Server Protocol on stdin and stdout", runServe}
}

// runServe runs the language server on stdin and stdout. Nothing but
// JSON-RPC may reach stdout, so the log goes to stderr or --log FILE, and
// os.Stdout is pointed at stderr for the session: a stray print anywhere
// cannot corrupt the stream.
func runServe(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("serve", flag.ContinueOnError)
	fs.SetOutput(stderr)
	logFile := fs.String("log", "", "append the server's log to `FILE` instead of stderr")
	verbose := fs.Bool("v", false, "log every message, not only problems")
	cpuProfile := fs.String("cpuprofile", "", "write a CPU profile of the session to `FILE` (for benchmarks)")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: walden serve [--log FILE] [-v]\n\nSpeaks the Language Server Protocol over stdin and stdout; editors start it.")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		if err == flag.ErrHelp {
			return 0
		}
		return 2
	}
	if fs.NArg() > 0 {
		fmt.Fprintf(stderr, "walden serve: unexpected argument %q\n", fs.Arg(0))
		return 2
	}

	logTo := stderr
	if *logFile != "" {
		f, err := os.OpenFile(*logFile, os.O_CREATE|os.O_APPEND|os.O_WRONLY, 0o644)
		if err != nil {
			fmt.Fprintf(stderr, "walden serve: %v\n", err)
			return 1
		}
		defer f.Close()
		logTo = f
	}
	level := slog.LevelInfo
	if *verbose {
		level = slog.LevelDebug
	}
	log := slog.New(slog.NewTextHandler(logTo, &slog.HandlerOptions{Level: level}))

	if stdout == os.Stdout && os.Getenv("GOMEMLIMIT") == "" {
		// A soft limit: the collector works harder only as the heap nears
		// it, which keeps the server's resident memory within its target
		// (issue 5: ≤ 100 MB) on a long page edited for hours; GOMEMLIMIT
		// overrides it.
		debug.SetMemoryLimit(serveMemoryLimit)
	}
	if stdout == os.Stdout && os.Getenv("GOGC") == "" {
		// Every edit re-reads the whole page, some hundreds of kilobytes
		// of short-lived memory; the collector's work per edit is in
		// inverse proportion to this setting, and the limit above keeps
		// the memory it costs within the target. GOGC overrides it.
		debug.SetGCPercent(serveGCPercent)
	}
	if stdout == os.Stdout {
		// Opening a long page grows the heap by tens of megabytes at
		// once; see package hugeheap for why that growth should come in
		// huge pages. Only a real process: a test's heap is long grown.
		advised, populated, err := hugeheap.Prepare(serveHugeHeap, serveHugeHeap/2)
		log.Debug("heap prepared for huge pages", "advised", advised, "populated", populated, "err", err)
		widenPipe(stdout.(*os.File))
		os.Stdout = os.Stderr
		defer func() { os.Stdout = stdout.(*os.File) }()
	}

	if *cpuProfile != "" {
		f, err := os.Create(*cpuProfile)
		if err != nil {
			fmt.Fprintf(stderr, "walden serve: %v\n", err)
			return 1
		}
		defer f.Close()
		if err := pprof.StartCPUProfile(f); err != nil {
			fmt.Fprintf(stderr, "walden serve: %v\n", err)
			return 1
		}
		defer pprof.StopCPUProfile()
	}

	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM)
	defer stop()
	s := server.New(server.Options{Log: log, Version: version})
	log.Info("walden serve started", "version", version, "pid", os.Getpid())
	code := s.Serve(ctx, stdio{stdin, stdout})
	log.Info("walden serve stopped", "exit", code)
	return code
}

// serveMemoryLimit is the soft memory limit of `walden serve`, in bytes.
const serveMemoryLimit = 88 << 20

// serveGCPercent is the collector's setting in `walden serve` (Go's
// default is 100): the heap may grow to this many percent beyond what is
// live before a collection.
const serveGCPercent = 200

// serveHugeHeap is how much of the server's heap growth is advised for
// huge pages: what opening a 5,000-line page and editing it needs. Half
// of it, what the opening needs, is faulted in at the start.
const serveHugeHeap = 64 << 20

// stdio joins the process's standard input and output into the one
// stream the server speaks on.
type stdio struct {
	io.Reader
	io.Writer
}

// Close closes both ends that can be closed, which unblocks a pending
// read when the session ends.
func (s stdio) Close() error {
	if c, ok := s.Reader.(io.Closer); ok {
		c.Close()
	}
	if c, ok := s.Writer.(io.Closer); ok {
		return c.Close()
	}
	return nil
}
