package perceive

import (
	"bufio"
	"strconv"
	"strings"
)

// readTSV splits an embedded table into rows keyed by its header,
// skipping '#' comment lines and blank lines. The tables are part of the
// program, so a malformed one is a programming error caught by the
// package's tests, not a run-time condition.
func readTSV(text string) []map[string]string {
	var header []string
	var rows []map[string]string
	sc := bufio.NewScanner(strings.NewReader(text))
	sc.Buffer(make([]byte, 1<<16), 1<<20)
	for sc.Scan() {
		line := sc.Text()
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		cells := strings.Split(line, "\t")
		if header == nil {
			header = cells
			continue
		}
		row := make(map[string]string, len(header))
		for i, h := range header {
			if i < len(cells) {
				row[h] = strings.TrimSpace(cells[i])
			}
		}
		rows = append(rows, row)
	}
	return rows
}

// num reads a number cell; ok is false for an empty or non-numeric cell.
func num(s string) (float64, bool) {
	s = strings.TrimSpace(s)
	if s == "" {
		return 0, false
	}
	f, err := strconv.ParseFloat(s, 64)
	return f, err == nil
}
