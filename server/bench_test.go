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
	if err := cmd.Start(); err != nil {
		b.Fatal(err)
	}
	c := connect(b, out, in)
	c.light = true
	c.initialize(nil)
	b.Cleanup(func() {
		c.call("shutdown", nil, nil)
		c.notify("exit", nil)
		if err := cmd.Wait(); err != nil {
			b.Errorf("walden serve after shutdown and exit: %v", err)
		}
	})
	return c, cmd
}

// benchPage returns a Markdown page of about n lines: prose paragraphs and
// reaction blocks with labelled steps, references to them, conditions and
// expected products, as a long-running notebook page would hold. The steps
// are invented, for load only.
func benchPage(n int) (text string, stepLines []int) {
	substrates := []string{"CCBr", "CC(C)Br", "C[C@@H](Br)CC", "CC(C)(C)Cl", "BrCc1ccccc1", "C[C@H](OS(C)(=O)=O)CCc1ccccc1", "ClCC=C", "CCCCI"}
	reagents := []string{"NaN3", "NaCN", "NaI", "KOtBu", "NaOEt", "KSAc", "NaOMe", "DBU"}
	solvents := []string{"DMF", "acetone", "EtOH", "DMSO", "THF", "MeOH", "MeCN", "toluene"}
	var b strings.Builder
	line := 0
	add := func(s string) {
		b.WriteString(s)
		b.WriteByte('\n')
		line++
	}
	add("# Route scouting, notebook 7")
	for k := 0; line < n; k++ {
		add("")
		add(fmt.Sprintf("## Entry %d", k+1))
		add("The substrate was dried over sieves; the reagent was weighed under nitrogen and added in portions.")
		add("")
		add("```reaction")
		for j := 0; j < 8 && line < n-1; j++ {
			i := k*8 + j
			step := fmt.Sprintf("s%d: %s + %s (1.5 eq), %s, %d °C", i, substrates[i%len(substrates)], reagents[(i/3)%len(reagents)], solvents[(i/7)%len(solvents)], 20+i%60)
			if j > 0 && j%3 == 0 {
				step = fmt.Sprintf("s%d: @s%d + %s, %s, rt", i, i-1, reagents[(i/5)%len(reagents)], solvents[(i/2)%len(solvents)])
			}
			stepLines = append(stepLines, line)
			add(step)
		}
		add("```")
	}
	return b.String(), stepLines
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

// cpuTime reads the process's user and system CPU time so far, which,
// unlike wall-clock latency, does not grow when other work shares the
// machine.
func cpuTime(pid int) time.Duration {
	data, err := os.ReadFile(fmt.Sprintf("/proc/%d/stat", pid))
	if err != nil {
		return 0
	}
	s := string(data)
	f := strings.Fields(s[strings.LastIndexByte(s, ')')+2:])
	if len(f) < 13 {
		return 0
	}
	ut, _ := strconv.ParseInt(f[11], 10, 64)
	st, _ := strconv.ParseInt(f[12], 10, 64)
	return time.Duration(ut+st) * time.Second / 100 // USER_HZ is 100 on Linux
}

func report(b *testing.B, what string, lat []time.Duration, cmd *exec.Cmd, cpu0 time.Duration) {
	p50, p99 := percentiles(lat)
	rss, peak := memory(b, cmd.Process.Pid)
	cpu := float64((cpuTime(cmd.Process.Pid) - cpu0).Microseconds()) / 1000 / float64(max(1, len(lat)))
	b.ReportMetric(cpu, "server-cpu-ms/op")
	b.ReportMetric(p50, "p50-ms")
	b.ReportMetric(p99, "p99-ms")
	b.ReportMetric(rss, "RSS-MB")
	b.ReportMetric(peak, "peakRSS-MB")
	b.ReportMetric(0, "ns/op")
	b.Logf("%s: n=%d p50 %.3f ms, p99 %.3f ms; server CPU %.3f ms per operation; server RSS %.1f MB (peak %.1f MB)", what, len(lat), p50, p99, cpu, rss, peak)
}

const benchLines = 5000

// typicalPage returns a Markdown page of about n lines as a working
// notebook holds them: headings, prose, and reaction blocks in which
// about 40% of the page's lines are steps and about 30% of the steps have
// findings. The steps come from a few templates whose substrates vary
// (chain length, end group) with the temperature, so that nearly every
// step text is distinct, as on a real page. Invented, for load only.
func typicalPage(n int) (text string, stepLines []int) {
	// %s is the substrate's chain, %d the temperature.
	clean := []string{
		"%sCBr + NaN3 (1.5 eq), DMF, %d °C",
		"%sCBr + NaI, acetone, %d °C",
		"%sCO + TsCl (1.2 eq) + pyridine, DCM, 0 °C to rt, %d h",
		"%sCBr + KSAc, DMF, %d °C",
		"%sCI + NaN3, MeCN, %d °C",
		"C[C@H](Br)C%s + NaN3, DMF, %d °C",
		"%sCCl + NaI (2 eq), acetone, %d °C",
	}
	flagged := []string{
		"%sCBr + NaN3, EtOH, %d °C",           // protic solvent slows SN2
		"CC(C)(Br)C%s + KOtBu, THF, %d °C",    // the bulky base eliminates
		"%sCO + NaN3, DMF, %d °C",             // OH does not leave
		"CC(Br)C%s + NaOEt, EtOH, %d °C",      // elimination, undefined configuration
		"%sCBr + NaCN, DMSO, %d °C",           // ambident nucleophile (a note)
		"BrCc1ccc(C%s)cc1 + NaN3, DMF, %d °C", // benzylic halide caution
	}
	tails := []string{"C", "CC", "CCC", "CCCC", "CC(C)C", "CCOC", "CCc1ccccc1", "CCCCC", "CCC(C)C", "CCCOC"}
	prose := []string{
		"The flask was flame-dried and cooled under nitrogen before the substrate was added.",
		"TLC (hexane/ethyl acetate 4:1) showed the starting material gone after the stated time.",
		"Work-up: diluted with water, extracted three times with ether, dried over MgSO4 and concentrated.",
		"Yield and NMR to follow; the crude material was carried on without purification.",
	}
	var b strings.Builder
	line := 0
	add := func(s string) {
		b.WriteString(s)
		b.WriteByte('\n')
		line++
	}
	add("# Substitution series, notebook 12")
	i := 0
	for k := 0; line < n; k++ {
		add("")
		add(fmt.Sprintf("## Entry %d", k+1))
		for p := range 4 {
			add(prose[(k+p)%len(prose)])
		}
		add("")
		add("```reaction")
		for j := 0; j < 8 && line < n-1; j++ {
			tail := tails[(i/7)%len(tails)] + strings.Repeat("C", (i/70)%6)
			temp := 20 + (i*7)%61
			var step string
			if i%10 < 3 {
				step = fmt.Sprintf(flagged[(i/10)%len(flagged)], tail, temp)
			} else {
				step = fmt.Sprintf(clean[i%len(clean)], tail, temp)
			}
			if j == 0 {
				step = fmt.Sprintf("t%d: %s", i, step)
			}
			stepLines = append(stepLines, line)
			add(step)
			i++
		}
		add("```")
	}
	return b.String(), stepLines
}

// BenchmarkServe measures two pages: "worst", where every step has
// findings (benchPage), and "typical" (typicalPage).
func BenchmarkServe(b *testing.B) {
	for _, page := range []struct {
		name string
		make func(int) (string, []int)
	}{{"worst", benchPage}, {"typical", typicalPage}} {
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
		var lat []time.Duration
		var cpu time.Duration
		var last *exec.Cmd
		for i := 0; i < min(b.N, 10); i++ {
			c, cmd := serveProcess(b)
			uri := protocol.DocumentURI(fmt.Sprintf("file:///lab/open%d.md", i))
			cpu0 := cpuTime(cmd.Process.Pid)
			t0 := time.Now()
			c.open(uri, "markdown", 1, text)
			c.diagnosticsFor(uri, 1)
			lat = append(lat, time.Since(t0))
			cpu += cpuTime(cmd.Process.Pid) - cpu0
			last = cmd
		}
		report(b, "open → first diagnostics (cold)", lat, last, cpuTime(last.Process.Pid)-cpu)
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
			cpu0 := cpuTime(cmd.Process.Pid)
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
			report(b, name+" → published diagnostics", lat, cmd, cpu0)
		})
	}
	b.Run("hover", func(b *testing.B) {
		c, cmd := serveProcess(b)
		uri := protocol.DocumentURI("file:///lab/page.md")
		c.open(uri, "markdown", 1, text)
		c.diagnosticsFor(uri, 1)
		var lat []time.Duration
		cpu0 := cpuTime(cmd.Process.Pid)
		for i := 0; i < b.N; i++ {
			line := uint32(steps[(i*53)%len(steps)])
			var h *protocol.Hover
			t0 := time.Now()
			c.call("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
				TextDocument: protocol.TextDocumentIdentifier{URI: uri}, Position: protocol.Position{Line: line, Character: uint32(5 + i%12)}}}, &h)
			lat = append(lat, time.Since(t0))
		}
		report(b, "hover", lat, cmd, cpu0)
	})
}
