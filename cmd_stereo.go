package main

import (
	"bufio"
	"fmt"
	"io"
	"os"
	"runtime"
	"runtime/debug"
	"strconv"
	"strings"
	"sync"
	"unicode/utf8"

	"walden/analyze/cip"
	"walden/analyze/smiles"
)

func init() {
	commands["stereo"] = command{"print the CIP descriptors of SMILES", runStereo}
}

const stereoUsage = `usage: walden stereo [--json] SMILES
       walden stereo [--json] --file FILE

Prints the CIP descriptors (R/S, r/s, E/Z, M/P, m/p) of every stereogenic
unit written in the SMILES, with atoms numbered from 1 in input order
(explicit atoms only), and the canonical SMILES.

  --json       one JSON object per molecule:
               {"smiles": ..., "canonical": ..., "labels": [{"atom": 2, "label": "R"},
                {"atom": 3, "atom2": 4, "label": "E"}]}
               with "id" when the file line has one, "error" for a line that
               cannot be read, and "undecided" for units SMILES cannot describe
               (hindered biaryl axes, helices)
  --file FILE  read one SMILES per line, optionally followed by a tab and an id;
               "-" reads standard input; empty lines are skipped
`

func runStereo(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	asJSON := false
	file := ""
	var rest []string
	for i := 0; i < len(args); i++ {
		switch a := args[i]; {
		case a == "-h" || a == "--help" || a == "-help":
			fmt.Fprint(stdout, stereoUsage)
			return 0
		case a == "--json" || a == "-json":
			asJSON = true
		case a == "--file" || a == "-file" || a == "-f":
			if i+1 >= len(args) {
				fmt.Fprintln(stderr, "walden stereo: --file needs a file name")
				return 2
			}
			i++
			file = args[i]
		case strings.HasPrefix(a, "--file="):
			file = strings.TrimPrefix(a, "--file=")
		case a == "--":
			rest = append(rest, args[i+1:]...)
			i = len(args)
		case strings.HasPrefix(a, "-") && len(a) > 1 && !looksLikeSMILES(a):
			fmt.Fprintf(stderr, "walden stereo: unknown option %q\n\n%s", a, stereoUsage)
			return 2
		default:
			rest = append(rest, a)
		}
	}
	out := bufio.NewWriterSize(stdout, 64<<10)
	defer out.Flush()
	if file != "" {
		if len(rest) > 0 {
			fmt.Fprintln(stderr, "walden stereo: give either SMILES or --file, not both")
			return 2
		}
		in := stdin
		if file != "-" {
			f, err := os.Open(file)
			if err != nil {
				fmt.Fprintln(stderr, "walden stereo:", err)
				return 1
			}
			defer f.Close()
			in = f
		}
		if err := stereoBatch(in, out, asJSON); err != nil {
			out.Flush()
			fmt.Fprintln(stderr, "walden stereo:", err)
			return 1
		}
		return 0
	}
	if len(rest) != 1 {
		fmt.Fprint(stderr, stereoUsage)
		return 2
	}
	var l cip.Labeller
	r := analyseStereo(&l, rest[0], "")
	var buf []byte
	if asJSON {
		buf = r.appendJSON(buf)
	} else {
		buf = r.appendText(buf)
	}
	out.Write(buf)
	if r.err != "" {
		return 1
	}
	return 0
}

// looksLikeSMILES lets a SMILES that starts with '-' pass as an argument;
// none does in practice, so every leading '-' is an option.
func looksLikeSMILES(string) bool { return false }

// stereoResult is the analysis of one input line.
type stereoResult struct {
	smiles, id, canonical, err string
	labels                     []cip.Descriptor
	undecided                  []cip.Undecided
	notes                      []string
}

// analyseStereo reads one SMILES and labels it with l.
func analyseStereo(l *cip.Labeller, s, id string) stereoResult {
	r := stereoResult{smiles: s, id: id}
	m, err := smiles.Parse(s)
	if err != nil {
		r.err = err.Error()
		return r
	}
	r.canonical = smiles.Canonical(m)
	r.labels, err = l.Label(m)
	if err != nil {
		r.notes = append(r.notes, err.Error())
	}
	r.undecided = cip.Undecideds(m)
	return r
}

func (r stereoResult) appendJSON(b []byte) []byte {
	b = append(b, `{"smiles": `...)
	b = appendJSONString(b, r.smiles)
	if r.id != "" {
		b = append(b, `, "id": `...)
		b = appendJSONString(b, r.id)
	}
	if r.err != "" {
		b = append(b, `, "error": `...)
		b = appendJSONString(b, r.err)
		return append(b, "}\n"...)
	}
	b = append(b, `, "canonical": `...)
	b = appendJSONString(b, r.canonical)
	b = append(b, `, "labels": [`...)
	for i, d := range r.labels {
		if i > 0 {
			b = append(b, ", "...)
		}
		b = append(b, `{"atom": `...)
		b = strconv.AppendInt(b, int64(d.Atoms[0]+1), 10)
		if d.Atoms[1] >= 0 {
			b = append(b, `, "atom2": `...)
			b = strconv.AppendInt(b, int64(d.Atoms[1]+1), 10)
		}
		b = append(b, `, "label": "`...)
		b = append(b, d.Label.String()...)
		b = append(b, `"}`...)
	}
	b = append(b, ']')
	if len(r.undecided) > 0 {
		b = append(b, `, "undecided": [`...)
		for i, u := range r.undecided {
			if i > 0 {
				b = append(b, ", "...)
			}
			b = append(b, `{"atom": `...)
			b = strconv.AppendInt(b, int64(u.Atoms[0]+1), 10)
			b = append(b, `, "atom2": `...)
			b = strconv.AppendInt(b, int64(u.Atoms[1]+1), 10)
			b = append(b, `, "reason": `...)
			b = appendJSONString(b, u.Reason())
			b = append(b, '}')
		}
		b = append(b, ']')
	}
	if len(r.notes) > 0 {
		b = append(b, `, "notes": [`...)
		for i, n := range r.notes {
			if i > 0 {
				b = append(b, ", "...)
			}
			b = appendJSONString(b, n)
		}
		b = append(b, ']')
	}
	return append(b, "}\n"...)
}

func (r stereoResult) appendText(b []byte) []byte {
	b = append(b, r.smiles...)
	if r.id != "" {
		b = append(b, "  ("...)
		b = append(b, r.id...)
		b = append(b, ')')
	}
	b = append(b, '\n')
	if r.err != "" {
		b = append(b, "  error: "...)
		b = append(b, r.err...)
		return append(b, '\n')
	}
	b = append(b, "  canonical: "...)
	b = append(b, r.canonical...)
	b = append(b, '\n')
	if len(r.labels) == 0 {
		b = append(b, "  no stereogenic unit with a CIP descriptor\n"...)
	}
	for _, d := range r.labels {
		if d.Atoms[1] < 0 {
			b = fmt.Appendf(b, "  atom %d: %s\n", d.Atoms[0]+1, d.Label)
		} else {
			b = fmt.Appendf(b, "  atoms %d and %d: %s\n", d.Atoms[0]+1, d.Atoms[1]+1, d.Label)
		}
	}
	for _, u := range r.undecided {
		b = fmt.Appendf(b, "  atoms %d and %d: not decidable from SMILES: %s\n", u.Atoms[0]+1, u.Atoms[1]+1, u.Reason())
	}
	for _, n := range r.notes {
		b = append(b, "  note: "...)
		b = append(b, n...)
		b = append(b, '\n')
	}
	return b
}

// appendJSONString appends s as a JSON string; invalid UTF-8 becomes
// U+FFFD.
func appendJSONString(b []byte, s string) []byte {
	const hex = "0123456789abcdef"
	b = append(b, '"')
	for i := 0; i < len(s); {
		c := s[i]
		if c < utf8.RuneSelf {
			switch {
			case c == '"' || c == '\\':
				b = append(b, '\\', c)
			case c < 0x20:
				b = append(b, '\\', 'u', '0', '0', hex[c>>4], hex[c&0xf])
			default:
				b = append(b, c)
			}
			i++
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			b = append(b, `\ufffd`...)
		} else {
			b = append(b, s[i:i+size]...)
		}
		i += size
	}
	return append(b, '"')
}

// stereoBatch labels every line of in, in parallel over the available
// cores, and writes the results in input order.
func stereoBatch(in io.Reader, out io.Writer, asJSON bool) error {
	// The live heap of a batch stays at a few megabytes, so at the
	// default GOGC=100 the collector runs every few hundred molecules
	// and takes about a third of the run; four times the live heap as
	// headroom (some 25 MB more peak memory) removes most of that. A
	// GOGC set by the user wins.
	if os.Getenv("GOGC") == "" {
		defer debug.SetGCPercent(debug.SetGCPercent(400))
	}
	const chunk = 512
	workers := runtime.GOMAXPROCS(0)
	type job struct {
		lines []string
		done  chan []byte
	}
	jobs := make(chan job, workers*2)
	order := make(chan job, workers*2)
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			var l cip.Labeller
			for j := range jobs {
				// About 150 bytes of JSON a line: sized once, not grown.
				buf := make([]byte, 0, 192*len(j.lines))
				for _, line := range j.lines {
					s, id, _ := strings.Cut(line, "\t")
					r := analyseStereo(&l, strings.TrimSpace(s), strings.TrimSpace(id))
					if asJSON {
						buf = r.appendJSON(buf)
					} else {
						buf = r.appendText(buf)
					}
				}
				j.done <- buf
			}
		}()
	}
	var werr error
	writerDone := make(chan struct{})
	go func() {
		defer close(writerDone)
		for j := range order {
			b := <-j.done
			if werr == nil {
				_, werr = out.Write(b)
			}
		}
	}()
	sc := bufio.NewScanner(in)
	sc.Buffer(make([]byte, 64<<10), smilesLineLimit)
	var lines []string
	flush := func() {
		if len(lines) == 0 {
			return
		}
		j := job{lines, make(chan []byte, 1)}
		order <- j
		jobs <- j
		lines = nil
	}
	for sc.Scan() {
		line := strings.TrimRight(sc.Text(), "\r")
		if strings.TrimSpace(line) == "" {
			continue
		}
		lines = append(lines, line)
		if len(lines) == chunk {
			flush()
		}
	}
	flush()
	close(jobs)
	close(order)
	wg.Wait()
	<-writerDone
	if err := sc.Err(); err != nil {
		return err
	}
	return werr
}

// smilesLineLimit bounds one input line of --file (16 MiB); the SMILES
// reader refuses molecules far smaller than that with its own message.
const smilesLineLimit = 16 << 20
