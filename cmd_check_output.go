package main

import (
	"bufio"
	"encoding/json"
	"fmt"
	"io"
)

// location returns how people read where a finding is:
// "file:line:column", or "file[cell N]:line:column" in a notebook (cells
// counted from 1, as notebook editors show them).
func (f finding) location(path string) string {
	path = f.path(path)
	if f.cell >= 0 {
		return fmt.Sprintf("%s[cell %d]:%s", path, f.cell+1, f.start)
	}
	return fmt.Sprintf("%s:%s", path, f.start)
}

// path is the file a finding is in: the checked file, or the settings
// or names file it points at.
func (f finding) path(checked string) string {
	if f.file != "" {
		return f.file
	}
	return checked
}

// writeText prints one line per finding:
// "file:line:column: severity code: message", and indented lines for the
// other parties of a finding.
func writeText(w io.Writer, files []checkedFile) error {
	bw := bufio.NewWriter(w)
	for _, cf := range files {
		for _, f := range cf.findings {
			fmt.Fprintf(bw, "%s: %s %s: %s\n", f.location(cf.path), f.diag.Severity, f.diag.Code, f.diag.Message)
		}
	}
	return bw.Flush()
}

// jsonPosition and jsonRange are LSP positions: 0-based line, UTF-16
// character.
type jsonPosition struct {
	Line      int `json:"line"`
	Character int `json:"character"`
}

type jsonRange struct {
	Start jsonPosition `json:"start"`
	End   jsonPosition `json:"end"`
}

// jsonFinding is one element of `walden check --format json` output. The
// fields file, range, code, severity and message are a stable interface.
type jsonFinding struct {
	File     string    `json:"file"`
	Cell     *int      `json:"cell,omitempty"` // 0-based index into the notebook's cells, for .ipynb files
	Range    jsonRange `json:"range"`
	Code     string    `json:"code"`
	Severity string    `json:"severity"`
	Message  string    `json:"message"`
}

// writeJSON prints one JSON array of findings.
func writeJSON(w io.Writer, files []checkedFile) error {
	out := []jsonFinding{}
	for _, cf := range files {
		for _, f := range cf.findings {
			j := jsonFinding{
				File:     f.path(cf.path),
				Range:    jsonRange{jsonPosition{f.line, f.char}, jsonPosition{f.endLine, f.endChar}},
				Code:     f.diag.Code,
				Severity: f.diag.Severity.String(),
				Message:  f.diag.Message,
			}
			if f.cell >= 0 {
				c := f.cell
				j.Cell = &c
			}
			out = append(out, j)
		}
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(out)
}
