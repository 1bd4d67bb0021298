package main

import (
	"bytes"
	"context"
	"flag"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"runtime"
	"sort"
	"strings"
	"sync"
	"unicode/utf8"

	"walden/analyze"
	"walden/grammar/source"
	"walden/internal/hugeheap"
)

// checkHugeHeap is how much of `walden check`'s heap growth is advised
// for huge pages: what 100,000 steps need; a quarter is faulted in at the
// start.
const checkHugeHeap = 256 << 20

func init() {
	commands["check"] = command{"check notebook files and folders", runCheck}
}

// Exit codes of walden check.
const (
	exitClean    = 0 // nothing at or above the --fail-on severity
	exitFindings = 1 // findings at or above the --fail-on severity
	exitUsage    = 2 // bad flags or arguments
)

// maxFileSize is the largest file walden check reads; larger files are
// reported and skipped. Notebooks of a real lab are far below it.
const maxFileSize = 32 << 20

// checkExts maps the extensions walden check reads to how steps are found.
var checkExts = map[string]analyze.SourceKind{
	".md":       analyze.MarkdownPage,
	".markdown": analyze.MarkdownPage,
	".steps":    analyze.PlanFile,
	".ipynb":    analyze.MarkdownCell,
}

// checkedFile is one file's findings, ready to print.
type checkedFile struct {
	path     string
	steps    int
	findings []finding
}

// finding is one diagnostic placed in a file (and, for a notebook, a cell).
type finding struct {
	file  string // set when the finding is in another file than the one checked (the settings or names file)
	cell  int    // index of the notebook cell; -1 outside notebooks
	start source.Point
	end   source.Point
	// LSP positions: 0-based line and UTF-16 character.
	line, char, endLine, endChar int
	diag                         analyze.Diagnostic
}

func runCheck(args []string, _ io.Reader, stdout, stderr io.Writer) int {
	fl := flag.NewFlagSet("check", flag.ContinueOnError)
	fl.SetOutput(stderr)
	format := fl.String("format", "text", "output format: text, json or sarif")
	failOn := fl.String("fail-on", "error", "exit non-zero when a finding is at least this severe: error, warning, info or never")
	quiet := fl.Bool("quiet", false, "print no summary line")
	fl.Usage = func() {
		fmt.Fprintln(stderr, "usage: walden check [--format text|json|sarif] [--fail-on error|warning|info|never] PATH...")
		fmt.Fprintln(stderr, "\nChecks every reaction step in the Markdown pages (.md, .markdown), plan files (.steps)")
		fmt.Fprintln(stderr, "and Jupyter notebooks (.ipynb) named, searching folders recursively.")
		fl.PrintDefaults()
	}
	if err := fl.Parse(args); err != nil {
		return exitUsage
	}
	var threshold analyze.Severity
	switch *failOn {
	case "error":
		threshold = analyze.Error
	case "warning":
		threshold = analyze.Warning
	case "info":
		threshold = analyze.Info
	case "never":
		threshold = 0
	default:
		fmt.Fprintf(stderr, "walden check: --fail-on %q: expected error, warning, info or never\n", *failOn)
		return exitUsage
	}
	if *format != "text" && *format != "json" && *format != "sarif" {
		fmt.Fprintf(stderr, "walden check: --format %q: expected text, json or sarif\n", *format)
		return exitUsage
	}
	if stdout == os.Stdout {
		// A folder of long pages grows the heap by hundreds of megabytes;
		// see package hugeheap. Only a real process: a test's heap is
		// long grown.
		hugeheap.Prepare(checkHugeHeap, checkHugeHeap/4)
	}
	if fl.NArg() == 0 {
		fl.Usage()
		return exitUsage
	}
	paths, bad := collectPaths(fl.Args())
	for _, b := range bad {
		fmt.Fprintln(stderr, "walden check:", b)
	}
	if len(paths) == 0 && len(bad) > 0 {
		return exitUsage
	}
	files := checkFiles(paths)

	var err error
	switch *format {
	case "text":
		err = writeText(stdout, files)
	case "json":
		err = writeJSON(stdout, files)
	case "sarif":
		err = writeSARIF(stdout, files)
	}
	if err != nil {
		fmt.Fprintln(stderr, "walden check:", err)
	}
	sum := summarise(files)
	if !*quiet {
		w := stdout
		if *format != "text" {
			w = stderr // keep stdout one JSON document
		}
		fmt.Fprintln(w, sum.String())
	}
	if threshold != 0 && sum.worst != 0 && sum.worst <= threshold {
		return exitFindings
	}
	if len(bad) > 0 {
		return exitUsage
	}
	return exitClean
}

// collectPaths expands folders into the notebook files below them, in a
// stable order. Named files are kept whatever their extension (and
// reported if walden cannot read that kind); unnamed files in folders are
// kept only with a known extension. Hidden folders are skipped.
func collectPaths(args []string) (paths []string, bad []string) {
	seen := map[string]bool{}
	add := func(p string) {
		if !seen[p] {
			seen[p] = true
			paths = append(paths, p)
		}
	}
	for _, a := range args {
		info, err := os.Stat(a)
		if err != nil {
			bad = append(bad, err.Error())
			continue
		}
		if !info.IsDir() {
			add(a)
			continue
		}
		var found []string
		walkErr := filepath.WalkDir(a, func(p string, d fs.DirEntry, err error) error {
			if err != nil {
				bad = append(bad, err.Error())
				if d != nil && d.IsDir() {
					return fs.SkipDir
				}
				return nil
			}
			if d.IsDir() {
				if p != a && strings.HasPrefix(d.Name(), ".") {
					return fs.SkipDir
				}
				return nil
			}
			if _, ok := checkExts[strings.ToLower(filepath.Ext(p))]; ok && d.Type().IsRegular() {
				found = append(found, p)
			}
			return nil
		})
		if walkErr != nil {
			bad = append(bad, walkErr.Error())
		}
		sort.Strings(found)
		for _, p := range found {
			add(p)
		}
	}
	return paths, bad
}

// checkFiles analyses every file, one at a time per core, and returns
// the results in the order of paths. Each file gets its own Engine (labels
// do not cross files), so memory stays bounded by the largest file; the
// settings file's problems are reported once, on the first file it covers.
func checkFiles(paths []string) []checkedFile {
	out := make([]checkedFile, len(paths))
	var (
		mu       sync.Mutex
		settings = map[string]analyze.Config{}
		wg       sync.WaitGroup
		next     = make(chan int)
	)
	engineFor := func(p string) (*analyze.Engine, []finding) {
		cfg, file, errs := analyze.LoadSettings(p, os.ReadFile)
		mu.Lock()
		_, seen := settings[file]
		settings[file] = cfg
		mu.Unlock()
		var fs []finding
		if !seen && len(errs) > 0 {
			text, _ := os.ReadFile(file)
			for _, f := range placeErrors(text, -1, errs, analyze.CodeSettings) {
				f.file = file
				fs = append(fs, f)
			}
		}
		eng := analyze.NewEngine(cfg)
		if !seen && len(eng.NamesErrors()) > 0 {
			text, _ := os.ReadFile(cfg.LabNamesFile)
			for _, f := range placeErrors(text, -1, eng.NamesErrors(), analyze.CodeSettings) {
				f.file = cfg.LabNamesFile
				fs = append(fs, f)
			}
		}
		return eng, fs
	}
	for range max(1, runtime.GOMAXPROCS(0)) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				out[i] = checkFile(paths[i], engineFor)
			}
		}()
	}
	for i := range paths {
		next <- i
	}
	close(next)
	wg.Wait()
	return out
}

// checkFile reads and analyses one file. It never fails: every problem
// becomes a finding on the file.
func checkFile(path string, engineFor func(string) (*analyze.Engine, []finding)) checkedFile {
	cf := checkedFile{path: path}
	kind, ok := checkExts[strings.ToLower(filepath.Ext(path))]
	if !ok {
		cf.findings = append(cf.findings, fileFinding(fmt.Sprintf("not a notebook file: walden reads .md, .markdown, .steps and .ipynb files, not %q", filepath.Ext(path))))
		return cf
	}
	text, msg := readText(path)
	if msg != "" {
		cf.findings = append(cf.findings, fileFinding(msg))
		return cf
	}
	eng, settingsFindings := engineFor(path)
	if len(settingsFindings) > 0 {
		cf.findings = append(cf.findings, settingsFindings...)
	}
	var docs []document
	if kind == analyze.MarkdownCell {
		cells, err := notebookCells(text)
		if err != nil {
			cf.findings = append(cf.findings, err...)
			return cf
		}
		docs = cells
	} else {
		docs = []document{{cell: -1, src: analyze.Source{Name: path, Kind: kind, Text: text}}}
	}
	srcs := make([]analyze.Source, len(docs))
	for i, d := range docs {
		srcs[i] = d.src
		srcs[i].Name = path
	}
	reps, _ := eng.Analyze(context.Background(), srcs)
	for i, r := range reps {
		cf.steps += len(r.Steps)
		m := source.NewMapper(docs[i].src.Text)
		for _, d := range r.Diagnostics {
			cf.findings = append(cf.findings, place(m, docs[i].cell, d))
		}
	}
	return cf
}

// document is one text analysed: a whole file, or one notebook cell.
type document struct {
	cell int
	src  analyze.Source
}

// readText reads a file as UTF-8 text, or says in one sentence why not.
func readText(path string) ([]byte, string) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err.Error()
	}
	defer f.Close()
	text, err := io.ReadAll(io.LimitReader(f, maxFileSize+1))
	if err != nil {
		return nil, "cannot read the file: " + err.Error()
	}
	if len(text) > maxFileSize {
		return nil, fmt.Sprintf("file larger than %d MiB, not checked", maxFileSize>>20)
	}
	if bytes.IndexByte(text[:min(len(text), 8000)], 0) >= 0 {
		return nil, "binary file (it holds NUL bytes), not checked"
	}
	if !utf8.Valid(text) {
		bad := 0
		for bad < len(text) {
			r, size := utf8.DecodeRune(text[bad:])
			if r == utf8.RuneError && size <= 1 {
				break
			}
			bad += size
		}
		p := source.NewMapper(text).Point(source.Pos(bad))
		return nil, fmt.Sprintf("not UTF-8 text: invalid byte 0x%02x at line %d, column %d; save the file as UTF-8", text[bad], p.Line, p.Column)
	}
	return text, ""
}

// fileFinding is a finding about a whole file, placed at its start.
func fileFinding(msg string) finding {
	return finding{cell: -1, start: source.Point{Line: 1, Column: 1}, end: source.Point{Line: 1, Column: 1},
		diag: analyze.Diagnostic{Code: analyze.CodeUnreadable, Severity: analyze.Error, Message: msg}}
}

// place converts a diagnostic's byte span into both kinds of position.
func place(m *source.Mapper, cell int, d analyze.Diagnostic) finding {
	d.Fixes, d.Related = nil, nil // not printed; dropping them keeps big runs small
	f := finding{cell: cell, diag: d, start: m.Point(d.Span.Start), end: m.Point(d.Span.End)}
	f.line, f.char, f.endLine, f.endChar = m.Range(d.Span)
	return f
}

// placeErrors turns positioned errors in text into findings with code
// (or each error's own code when it has one).
func placeErrors(text []byte, cell int, errs source.ErrorList, code string) []finding {
	m := source.NewMapper(text)
	var out []finding
	for _, e := range errs {
		c := code
		if e.Code != "" && code != analyze.CodeSettings {
			c = e.Code
		}
		out = append(out, place(m, cell, analyze.Diagnostic{Code: c, Severity: analyze.Error, Message: e.Msg, Span: e.Span}))
	}
	return out
}

// summary counts findings by severity.
type summary struct {
	files, steps, errors, warnings, infos int
	worst                                 analyze.Severity // 0 when there are none
}

func summarise(files []checkedFile) summary {
	s := summary{files: len(files)}
	for _, f := range files {
		s.steps += f.steps
		for _, x := range f.findings {
			switch x.diag.Severity {
			case analyze.Error:
				s.errors++
			case analyze.Warning:
				s.warnings++
			default:
				s.infos++
			}
			if s.worst == 0 || x.diag.Severity < s.worst {
				s.worst = x.diag.Severity
			}
		}
	}
	return s
}

func (s summary) String() string {
	return fmt.Sprintf("walden: %s, %s checked: %s, %s, %d notes",
		plural(s.files, "file"), plural(s.steps, "step"), plural(s.errors, "error"), plural(s.warnings, "warning"), s.infos)
}

func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return fmt.Sprintf("%d %ss", n, word)
}
