package server

import (
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"runtime/debug"
	"sort"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"go.lsp.dev/protocol"

	"walden/internal/benchpage"
)

// The speed targets of the language server, measured as figures (never as
// timed tests that could fail on a slow machine). The server under test is
// the real binary, `walden serve`, driven over its stdin and stdout by the
// jsonrpc2 client of client_test.go (in its light mode, which notes each
// publication by uri and version without decoding the diagnostics, as the
// time an editor's own decoder takes is not the server's), on two
// 5,000-line notebook pages (see BenchmarkServe):
//
//	go test ./server -run XXX -bench Serve -benchtime 300x
//
// Figures reported per sub-benchmark: p50 and p99 latency in ms (edit →
// published diagnostics, hover → reply, open → first diagnostics) and the
// server process's resident memory (VmRSS and its peak VmHWM, from
// /proc/PID/status) after the run.

var (
	buildOnce sync.Once
	binary    string
	buildErr  error
)

// waldenBinary builds walden once per test process, or uses $WALDEN_BIN.
func waldenBinary(b *testing.B) string {
	buildOnce.Do(func() {
		if p := os.Getenv("WALDEN_BIN"); p != "" {
			binary = p
			return
		}
		dir, err := os.MkdirTemp("", "walden-bench")
		if err != nil {
			buildErr = err
			return
		}
		binary = filepath.Join(dir, "walden")
		out, err := exec.Command("go", "build", "-o", binary, "..").CombinedOutput()
		if err != nil {
			buildErr = fmt.Errorf("go build: %v\n%s", err, out)
		}
	})
	if buildErr != nil {
		b.Fatal(buildErr)
	}
	return binary
}

// serveProcess starts `walden serve` and returns an initialized client
// and the process.
func serveProcess(b *testing.B) (*testClient, *exec.Cmd) {
	c, cmd, _ := startServe(b)
	return c, cmd
}

// startServe is serveProcess, also returning how long the server took
// from its start to its answer to initialize.
func startServe(b *testing.B) (*testClient, *exec.Cmd, time.Duration) {
	args := []string{"serve"}
	if p := os.Getenv("WALDEN_CPUPROFILE"); p != "" {
		args = append(args, "--cpuprofile", p)
	}
	cmd := exec.Command(waldenBinary(b), args...)
	cmd.Stderr = os.Stderr
	in, err := cmd.StdinPipe()
	if err != nil {
		b.Fatal(err)
	}
	out, err := cmd.StdoutPipe()
	if err != nil {
		b.Fatal(err)
	}
	t0 := time.Now()
	if err := cmd.Start(); err != nil {
		b.Fatal(err)
	}
	c := connect(b, out, in)
	c.light = true
	c.initialize(nil)
	started := time.Since(t0)
	b.Cleanup(func() {
		c.call("shutdown", nil, nil)
		c.notify("exit", nil)
		if err := cmd.Wait(); err != nil {
			b.Errorf("walden serve after shutdown and exit: %v", err)
		}
	})
	return c, cmd, started
}

// percentiles returns p50 and p99 of d in milliseconds.
func percentiles(d []time.Duration) (p50, p99 float64) {
	if len(d) == 0 {
		return 0, 0
	}
	s := append([]time.Duration(nil), d...)
	sort.Slice(s, func(i, j int) bool { return s[i] < s[j] })
	at := func(q float64) float64 {
		return float64(s[min(len(s)-1, int(q*float64(len(s))))].Microseconds()) / 1000
	}
	return at(0.50), at(0.99)
}

// memory reads the process's resident memory in MB.
func memory(b *testing.B, pid int) (rss, peak float64) {
	if runtime.GOOS != "linux" {
		return 0, 0
	}
	data, err := os.ReadFile(fmt.Sprintf("/proc/%d/status", pid))
	if err != nil {
		b.Logf("reading memory: %v", err)
		return 0, 0
	}
	for _, l := range strings.Split(string(data), "\n") {
		f := strings.Fields(l)
		if len(f) < 2 {
			continue
		}
		kb, _ := strconv.ParseFloat(f[1], 64)
		switch f[0] {
		case "VmRSS:":
			rss = kb / 1024
		case "VmHWM:":
			peak = kb / 1024
		}
	}
	return rss, peak
}

// usage is what a process has used so far: its user and system CPU time,
// which, unlike wall-clock latency, does not grow when other work shares
// the machine, and its minor page faults, each a first touch of fresh
// memory (on this machine's virtual machines, 5 to 13 µs apiece).
type usage struct {
	cpu    time.Duration
	faults int64
}

func (u usage) sub(v usage) usage { return usage{u.cpu - v.cpu, u.faults - v.faults} }
func (u usage) add(v usage) usage { return usage{u.cpu + v.cpu, u.faults + v.faults} }

// usageOf reads /proc/PID/stat.
func usageOf(pid int) usage {
	data, err := os.ReadFile(fmt.Sprintf("/proc/%d/stat", pid))
	if err != nil {
		return usage{}
	}
	s := string(data)
	f := strings.Fields(s[strings.LastIndexByte(s, ')')+2:])
	if len(f) < 13 {
		return usage{}
	}
	minflt, _ := strconv.ParseInt(f[7], 10, 64)
	ut, _ := strconv.ParseInt(f[11], 10, 64)
	st, _ := strconv.ParseInt(f[12], 10, 64)
	return usage{cpu: time.Duration(ut+st) * time.Second / 100, faults: minflt} // USER_HZ is 100 on Linux
}

// report prints the figures of n operations that used used of the server.
func report(b *testing.B, what string, lat []time.Duration, cmd *exec.Cmd, used usage) {
	p50, p99 := percentiles(lat)
	rss, peak := memory(b, cmd.Process.Pid)
	n := float64(max(1, len(lat)))
	cpu := float64(used.cpu.Microseconds()) / 1000 / n
	faults := float64(used.faults) / n
	b.ReportMetric(cpu, "server-cpu-ms/op")
	b.ReportMetric(faults, "faults/op")
	b.ReportMetric(p50, "p50-ms")
	b.ReportMetric(p99, "p99-ms")
	b.ReportMetric(rss, "RSS-MB")
	b.ReportMetric(peak, "peakRSS-MB")
	b.ReportMetric(0, "ns/op")
	b.Logf("%s: n=%d p50 %.3f ms, p99 %.3f ms; server CPU %.3f ms and %.0f page faults per operation; server RSS %.1f MB (peak %.1f MB)", what, len(lat), p50, p99, cpu, faults, rss, peak)
}

const benchLines = 5000

// BenchmarkServe measures two pages: "worst", where every step has
// findings (benchpage.Worst), and "typical" (benchpage.Typical).
func BenchmarkServe(b *testing.B) {
	for _, page := range []struct {
		name string
		make func(int) (string, []int)
	}{{"worst", benchpage.Worst}, {"typical", benchpage.Typical}} {
		text, steps := page.make(benchLines)
		b.Run(page.name, func(b *testing.B) { benchServe(b, text, steps) })
	}
}

func benchServe(b *testing.B, text string, steps []int) {
	// The client (this process) is not what is measured: fewer of its own
	// collections keep its pauses out of the latencies.
	defer debug.SetGCPercent(debug.SetGCPercent(400))
	// open: a fresh server each time, so the Engine's cache is cold, as
	// when an editor starts; at most 10 rounds, since each starts a process.
	b.Run("open", func(b *testing.B) {
		var lat, starts []time.Duration
		var used usage
		var last *exec.Cmd
		for i := 0; i < min(b.N, 10); i++ {
			c, cmd, started := startServe(b)
			starts = append(starts, started)
			uri := protocol.DocumentURI(fmt.Sprintf("file:///lab/open%d.md", i))
			u0 := usageOf(cmd.Process.Pid)
			t0 := time.Now()
			c.open(uri, "markdown", 1, text)
			c.diagnosticsFor(uri, 1)
			lat = append(lat, time.Since(t0))
			used = used.add(usageOf(cmd.Process.Pid).sub(u0))
			last = cmd
		}
		report(b, "open → first diagnostics (cold)", lat, last, used)
		// What an editor waits for before it can open anything.
		p50, _ := percentiles(starts)
		b.ReportMetric(p50, "start-p50-ms")
		b.Logf("process start → initialize answered: p50 %.3f ms", p50)
	})
	// edit: type one character into a step line, then delete it again on
	// the next round: each edit changes one step, and no line number.
	// insert: insert a step line above a step, then delete it again: every
	// line below moves down and back.
	for _, insert := range []bool{false, true} {
		name := "edit"
		if insert {
			name = "insert"
		}
		b.Run(name, func(b *testing.B) {
			c, cmd := serveProcess(b)
			uri := protocol.DocumentURI("file:///lab/page.md")
			c.open(uri, "markdown", 1, text)
			c.diagnosticsFor(uri, 1)
			var lat []time.Duration
			u0 := usageOf(cmd.Process.Pid)
			for i := 0; i < b.N; i++ {
				line := uint32(steps[(i/2*37)%len(steps)])
				var ch contentChange
				switch at := (protocol.Position{Line: line, Character: 4}); {
				case !insert && i%2 == 0:
					ch = contentChange{Range: &protocol.Range{Start: at, End: at}, Text: "C"}
				case !insert:
					ch = contentChange{Range: &protocol.Range{Start: at, End: protocol.Position{Line: line, Character: 5}}}
				case i%2 == 0:
					at.Character = 0
					ch = contentChange{Range: &protocol.Range{Start: at, End: at}, Text: fmt.Sprintf("CCC%sBr + NaN3, DMF, 25 °C\n", strings.Repeat("C", i%40))}
				default:
					ch = contentChange{Range: &protocol.Range{Start: protocol.Position{Line: line}, End: protocol.Position{Line: line + 1}}}
				}
				v := int32(i + 2)
				t0 := time.Now()
				c.change(uri, v, ch)
				c.diagnosticsFor(uri, v)
				lat = append(lat, time.Since(t0))
			}
			report(b, name+" → published diagnostics", lat, cmd, usageOf(cmd.Process.Pid).sub(u0))
		})
	}
	b.Run("hover", func(b *testing.B) {
		c, cmd := serveProcess(b)
		uri := protocol.DocumentURI("file:///lab/page.md")
		c.open(uri, "markdown", 1, text)
		c.diagnosticsFor(uri, 1)
		var lat []time.Duration
		u0 := usageOf(cmd.Process.Pid)
		for i := 0; i < b.N; i++ {
			line := uint32(steps[(i*53)%len(steps)])
			var h *protocol.Hover
			t0 := time.Now()
			c.call("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
				TextDocument: protocol.TextDocumentIdentifier{URI: uri}, Position: protocol.Position{Line: line, Character: uint32(5 + i%12)}}}, &h)
			lat = append(lat, time.Since(t0))
		}
		report(b, "hover", lat, cmd, usageOf(cmd.Process.Pid).sub(u0))
	})
}
