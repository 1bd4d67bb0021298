package reagents

import (
	"embed"
	"fmt"
	"strconv"
	"strings"

	"walden/grammar/source"
)

// The built-in tables. Each is tab-separated with a header row; lines
// starting with '#' are comments. Every value cell that holds a number has
// a source cell beside it, and every entry has a source column.
//
//go:embed data/sources.tsv data/species.tsv data/reagents.tsv data/solvents.tsv
var tables embed.FS

// tsvRow is one data row of a table, with where it sits in its file.
type tsvRow struct {
	line  int
	start int // byte offset of the row in the file
	cells []string
	at    []int // byte offset of each cell in the file
}

// table is a parsed TSV file: its header and rows.
type table struct {
	file string
	text string
	cols map[string]int
	rows []tsvRow
}

// readTable splits a TSV file into rows, checking that every row has as
// many cells as the header and that the wanted columns exist.
func readTable(file, text string, want []string, errs *ErrorList) *table {
	t := &table{file: file, text: text, cols: map[string]int{}}
	header := true
	ncol := 0
	for off, line := 0, 1; off < len(text); line++ {
		end := strings.IndexByte(text[off:], '\n')
		if end < 0 {
			end = len(text) - off
		}
		raw := strings.TrimSuffix(text[off:off+end], "\r")
		start := off
		off += end + 1
		if raw == "" || strings.HasPrefix(raw, "#") {
			continue
		}
		cells := strings.Split(raw, "\t")
		at := make([]int, len(cells))
		p := start
		for i, c := range cells {
			at[i] = p
			p += len(c) + 1
		}
		if header {
			header = false
			ncol = len(cells)
			for i, c := range cells {
				t.cols[c] = i
			}
			for _, w := range want {
				if _, ok := t.cols[w]; !ok {
					t.errorf(errs, line, start, start+len(raw), "the header has no column %q", w)
				}
			}
			continue
		}
		if len(cells) != ncol {
			t.errorf(errs, line, start, start+len(raw), "found %d cells, expected %d as in the header", len(cells), ncol)
			continue
		}
		t.rows = append(t.rows, tsvRow{line: line, start: start, cells: cells, at: at})
	}
	return t
}

func (t *table) errorf(errs *ErrorList, line, start, end int, format string, args ...any) {
	col := start - strings.LastIndexByte(t.text[:start], '\n')
	*errs = append(*errs, &Error{File: t.file, Line: line, Col: col, Span: source.Span{Start: source.Pos(start), End: source.Pos(end)}, Msg: fmt.Sprintf(format, args...)})
}

// cell returns the cell of row r in column name, and its offset.
func (t *table) cell(r tsvRow, name string) (string, int) {
	i, ok := t.cols[name]
	if !ok {
		return "", r.start
	}
	return strings.TrimSpace(r.cells[i]), r.at[i]
}

// cellErr reports a problem with the cell of r in column name.
func (t *table) cellErr(errs *ErrorList, r tsvRow, name, format string, args ...any) {
	c, at := t.cell(r, name)
	t.errorf(errs, r.line, at, at+len(c), format, args...)
}

// provenanceWords are the words one of which every value's source must
// contain, so that a reader can tell checked values from recalled ones.
var provenanceWords = []string{"from memory", "common practice", "checked", "estimate", "measured"}

func hasProvenance(s string) bool {
	for _, w := range provenanceWords {
		if strings.Contains(s, w) {
			return true
		}
	}
	return false
}

// expandSources replaces every @key in s with its citation from sources.
func expandSources(s string, sources map[string]string) (string, []string) {
	var b strings.Builder
	var unknown []string
	for {
		i := strings.IndexByte(s, '@')
		if i < 0 {
			b.WriteString(s)
			return b.String(), unknown
		}
		b.WriteString(s[:i])
		j := i + 1
		for j < len(s) && (isAlnum(s[j])) {
			j++
		}
		key := s[i+1 : j]
		if c, ok := sources[key]; ok {
			b.WriteString(c)
		} else {
			unknown = append(unknown, key)
			b.WriteString(s[i:j])
		}
		s = s[j:]
	}
}

func isAlnum(c byte) bool {
	return 'a' <= c && c <= 'z' || 'A' <= c && c <= 'Z' || '0' <= c && c <= '9'
}

// value reads a number column and its source column into a Value.
func (t *table) value(errs *ErrorList, r tsvRow, col, srcCol string, sources map[string]string) Value {
	c, _ := t.cell(r, col)
	if c == "" {
		return Value{}
	}
	v, err := strconv.ParseFloat(c, 64)
	if err != nil {
		t.cellErr(errs, r, col, "found %q, expected a number", c)
		return Value{}
	}
	src, _ := t.cell(r, srcCol)
	if src == "" {
		t.cellErr(errs, r, col, "the value %s has no source in column %q", c, srcCol)
	} else if !hasProvenance(src) {
		t.cellErr(errs, r, srcCol, "the source does not say how the value was obtained (one of %s)", strings.Join(provenanceWords, ", "))
	}
	exp, unknown := expandSources(src, sources)
	for _, k := range unknown {
		t.cellErr(errs, r, srcCol, "unknown source key @%s (see data/sources.tsv)", k)
	}
	return Value{V: v, Known: true, Source: exp}
}

// species is one row of species.tsv.
type species struct {
	name   string
	pKaH   Value
	nucleo Value
	notes  string
}

// builtinTables holds the parsed built-in tables.
type builtinTables struct {
	reagents []*Reagent
	solvents []*Solvent
	species  map[string]species
	sources  map[string]string
	errs     ErrorList
}

func readFile(name string) string {
	b, err := tables.ReadFile(name)
	if err != nil {
		return ""
	}
	return string(b)
}

// loadTables parses the embedded tables. Problems are collected, never
// fatal: a test insists there are none.
func loadTables() *builtinTables {
	bt := &builtinTables{species: map[string]species{}, sources: map[string]string{}}
	errs := &bt.errs

	st := readTable("data/sources.tsv", readFile("data/sources.tsv"), []string{"key", "citation"}, errs)
	for _, r := range st.rows {
		k, _ := st.cell(r, "key")
		c, _ := st.cell(r, "citation")
		bt.sources[k] = c
	}

	sp := readTable("data/species.tsv", readFile("data/species.tsv"), []string{"name", "smiles", "pKaH", "pKaH_source", "n", "n_source", "notes"}, errs)
	for _, r := range sp.rows {
		smi, _ := sp.cell(r, "smiles")
		name, _ := sp.cell(r, "name")
		if _, dup := bt.species[smi]; dup {
			sp.cellErr(errs, r, "smiles", "species %s is listed twice", smi)
			continue
		}
		notes, _ := sp.cell(r, "notes")
		bt.species[smi] = species{
			name:   name,
			pKaH:   sp.value(errs, r, "pKaH", "pKaH_source", bt.sources),
			nucleo: sp.value(errs, r, "n", "n_source", bt.sources),
			notes:  notes,
		}
	}

	rt := readTable("data/reagents.tsv", readFile("data/reagents.tsv"),
		[]string{"names", "species", "counterion", "whole", "roles", "bulk", "soluble", "hazards", "needs_base", "source", "notes"}, errs)
	for _, r := range rt.rows {
		if g := rt.reagent(errs, r, bt); g != nil {
			bt.reagents = append(bt.reagents, g)
		}
	}

	vt := readTable("data/solvents.tsv", readFile("data/solvents.tsv"),
		[]string{"names", "smiles", "dielectric", "dielectric_T_C", "dielectric_source", "protic", "class", "bp_C", "bp_source", "hazards", "notes"}, errs)
	for _, r := range vt.rows {
		if s := vt.solvent(errs, r, bt); s != nil {
			bt.solvents = append(bt.solvents, s)
		}
	}
	return bt
}

func splitNames(s string) []string {
	var out []string
	for _, n := range strings.Split(s, ";") {
		if n = strings.TrimSpace(n); n != "" {
			out = append(out, n)
		}
	}
	return out
}

func splitWords(s string) []string {
	var out []string
	for _, w := range strings.Split(s, ",") {
		if w = strings.TrimSpace(w); w != "" {
			out = append(out, w)
		}
	}
	return out
}

func (t *table) reagent(errs *ErrorList, r tsvRow, bt *builtinTables) *Reagent {
	g := &Reagent{Origin: "built-in"}
	names, _ := t.cell(r, "names")
	g.Names = splitNames(names)
	if len(g.Names) == 0 {
		t.cellErr(errs, r, "names", "a reagent needs at least one name")
		return nil
	}
	g.Species, _ = t.cell(r, "species")
	g.Counterion, _ = t.cell(r, "counterion")
	g.Whole, _ = t.cell(r, "whole")
	if g.Species == "" {
		t.cellErr(errs, r, "species", "a reagent needs its species SMILES")
		return nil
	}
	if g.Whole == "" {
		g.Whole = g.Species
		if g.Counterion != "" {
			g.Whole = g.Counterion + "." + g.Species
		}
	}
	roles, _ := t.cell(r, "roles")
	for _, w := range splitWords(roles) {
		role, ok := ParseRole(w)
		if !ok {
			t.cellErr(errs, r, "roles", "unknown role %q, expected one of %s", w, strings.Join(roleWords[:], ", "))
		}
		g.Roles |= role
	}
	if g.Roles == 0 {
		t.cellErr(errs, r, "roles", "a reagent needs at least one role")
	}
	if b, _ := t.cell(r, "bulk"); b != "" {
		var ok bool
		if g.Bulk, ok = ParseBulk(b); !ok {
			t.cellErr(errs, r, "bulk", "unknown bulk %q, expected small, moderate or hindered", b)
		}
	}
	g.Soluble, _ = t.cell(r, "soluble")
	hz, _ := t.cell(r, "hazards")
	for _, h := range splitWords(hz) {
		if !isHazard(h) {
			t.cellErr(errs, r, "hazards", "unknown hazard %q", h)
		}
		g.Hazards = append(g.Hazards, h)
	}
	switch nb, _ := t.cell(r, "needs_base"); nb {
	case "yes":
		g.NeedsBase = true
	case "no", "":
	default:
		t.cellErr(errs, r, "needs_base", "found %q, expected yes or no", nb)
	}
	src, _ := t.cell(r, "source")
	if src == "" {
		t.cellErr(errs, r, "source", "every entry needs a source")
	}
	var unknown []string
	g.Source, unknown = expandSources(src, bt.sources)
	for _, k := range unknown {
		t.cellErr(errs, r, "source", "unknown source key @%s (see data/sources.tsv)", k)
	}
	g.Notes, _ = t.cell(r, "notes")
	if sp, ok := bt.species[g.Species]; ok {
		g.PKaH, g.Nucleo = sp.pKaH, sp.nucleo
	}
	return g
}

func (t *table) solvent(errs *ErrorList, r tsvRow, bt *builtinTables) *Solvent {
	s := &Solvent{Origin: "built-in", Source: "names, class and SMILES: common practice"}
	names, _ := t.cell(r, "names")
	s.Names = splitNames(names)
	if len(s.Names) == 0 {
		t.cellErr(errs, r, "names", "a solvent needs at least one name")
		return nil
	}
	s.SMILES, _ = t.cell(r, "smiles")
	s.Dielectric = t.value(errs, r, "dielectric", "dielectric_source", bt.sources)
	if tc, _ := t.cell(r, "dielectric_T_C"); tc != "" {
		v, err := strconv.ParseFloat(tc, 64)
		if err != nil {
			t.cellErr(errs, r, "dielectric_T_C", "found %q, expected a temperature in °C", tc)
		}
		s.DielectricTempC = v
	}
	s.BoilingC = t.value(errs, r, "bp_C", "bp_source", bt.sources)
	switch p, _ := t.cell(r, "protic"); p {
	case "yes":
		s.Protic = true
	case "no":
	default:
		t.cellErr(errs, r, "protic", "found %q, expected yes or no", p)
	}
	s.Class, _ = t.cell(r, "class")
	if classWord(s.Class) == "" {
		t.cellErr(errs, r, "class", "unknown class %q, expected %q, %q, %q or %q", s.Class, ClassPolarProtic, ClassPolarAprotic, ClassWeaklyPolar, ClassNonpolar)
	}
	hz, _ := t.cell(r, "hazards")
	for _, h := range splitWords(hz) {
		if !isHazard(h) {
			t.cellErr(errs, r, "hazards", "unknown hazard %q", h)
		}
		s.Hazards = append(s.Hazards, h)
	}
	s.Notes, _ = t.cell(r, "notes")
	if strings.Contains(s.Notes, "@") {
		s.Notes, _ = expandSources(s.Notes, bt.sources)
	}
	return s
}
