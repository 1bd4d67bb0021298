package server

import (
	"cmp"
	"slices"
	"strconv"

	"walden/analyze"
	"walden/grammar/source"
)

// lineCache keeps, for one document, the JSON of the diagnostics of each
// line as last published, so that a publication after an edit encodes
// only the lines whose findings changed and copies the others' bytes.
//
// A line's entry is found by the line's text and used when the line's
// findings, taken relative to the line's start, are the same as when it
// was encoded: the characters (UTF-16 units) of a span depend only on the
// text before it on its line, so only the line number can differ, and
// the entry knows where it wrote each. Typing within a line changes no
// other line's JSON; inserting a line rewrites the numbers of the lines
// below it, not their JSON.
//
// Only the publisher's loop touches a lineCache.
type lineCache struct {
	lines map[string]*encodedLine // by line text
	gen   uint64                  // publications so far, for eviction

	// For Reports with Lines: by the identity of a line's own findings,
	// which the Engine keeps the same while the line's result is the same.
	owned map[*analyze.Diagnostic]*encodedLine

	found []analyze.LineFindings // reused by every publication
	group []analyze.Diagnostic   // joined's scratch
}

// encodedLine is the JSON of one line's diagnostics.
type encodedLine struct {
	diags []analyze.Diagnostic // relative to the line's start; Fixes dropped (not published)
	line  int                  // the line number written in json
	json  []byte               // the diagnostics, separated by commas
	cuts  []int                // where each line number starts in json
	used  uint64               // the last publication that used it

	// For an entry in owned: where the step starts on its line, the text
	// before it there (the characters depend on it) and the line's
	// label findings, relative to the line's start.
	inLine source.Pos
	before string
	extra  []analyze.Diagnostic
}

func newLineCache() *lineCache {
	return &lineCache{lines: map[string]*encodedLine{}, owned: map[*analyze.Diagnostic]*encodedLine{}}
}

// appendDiagnostics appends the JSON array of r's diagnostics in d.
// r.Diagnostics are sorted by start (analyze.Report's promise); a
// diagnostic reaching outside its line is encoded afresh every time.
func (c *lineCache) appendDiagnostics(b []byte, d *document, r *analyze.Report) []byte {
	lines, other, ok := r.AppendLines(c.found[:0])
	if !ok {
		return c.appendFlat(b, d, r.Diagnostics)
	}
	b = c.appendLines(b, d, lines, other)
	clear(lines) // keep the buffer, not the findings
	c.found = lines
	return b
}

// appendFlat appends the JSON array of ds, sorted by start, caching by
// line text and comparing each line's findings by value.
func (c *lineCache) appendFlat(b []byte, d *document, ds []analyze.Diagnostic) []byte {
	c.gen++
	m := d.mapper
	text := m.Text()
	n := m.LineCount()
	a := jsonArray{b: append(b, '[')}
	k, groups := 0, 0
	for i := 0; i < len(ds); {
		start := ds[i].Span.Start
		for k+1 < n && m.Line(k+1).Start <= start {
			k++
		}
		line := m.Line(k)
		next := source.Pos(len(text) + 1)
		if k+1 < n {
			next = m.Line(k + 1).Start
		}
		j := i + 1
		for j < len(ds) && ds[j].Span.Start < next {
			j++
		}
		group := ds[i:j]
		i = j
		if !within(group, line) {
			for x := range group {
				a.fresh(d, &group[x])
			}
			continue
		}
		groups++
		a.raw(c.byText(d, text, group, line, k).json)
	}
	c.sweep(groups)
	return append(a.b, ']')
}

// jsonArray writes the elements of a JSON array of diagnostics.
type jsonArray struct {
	b       []byte
	started bool
}

// raw appends an element already encoded.
func (a *jsonArray) raw(elem []byte) {
	if a.started {
		a.b = append(a.b, ',')
	}
	a.started = true
	a.b = append(a.b, elem...)
}

// fresh converts and encodes f as the next element.
func (a *jsonArray) fresh(d *document, f *analyze.Diagnostic) {
	if a.started {
		a.b = append(a.b, ',')
	}
	a.started = true
	dg := lspDiagnostic(d, f)
	a.b = appendDiagnostic(a.b, &dg)
}

// sweep drops the entries the last publication did not use once they
// outnumber those it used.
func (c *lineCache) sweep(used int) {
	if len(c.lines)+len(c.owned) <= 2*used+64 {
		return
	}
	for key, ent := range c.lines {
		if ent.used != c.gen {
			delete(c.lines, key)
		}
	}
	for key, ent := range c.owned {
		if ent.used != c.gen {
			delete(c.owned, key)
		}
	}
}

// within reports whether every span of the group, related ones included,
// lies on line.
func within(group []analyze.Diagnostic, line source.Span) bool {
	in := func(s source.Span) bool { return s.Start >= line.Start && s.End <= line.End && s.Start <= s.End }
	for x := range group {
		if !in(group[x].Span) {
			return false
		}
		for _, r := range group[x].Related {
			if !in(r.Span) {
				return false
			}
		}
	}
	return true
}

// encode makes the entry of a line's group of diagnostics: its JSON and,
// when byValue, the findings relative to the line's start, for comparing
// with later ones (an entry found by identity needs no copy).
func (c *lineCache) encode(d *document, group []analyze.Diagnostic, base source.Pos, line int, byValue bool) *encodedLine {
	ent := &encodedLine{line: line, json: make([]byte, 0, len(group)*diagnosticBytes), cuts: make([]int, 0, 4*len(group))}
	for x := range group {
		if x > 0 {
			ent.json = append(ent.json, ',')
		}
		dg := lspDiagnostic(d, &group[x])
		ent.json = appendDiagnosticCuts(ent.json, &dg, &ent.cuts)
	}
	if byValue {
		ent.diags = relative(group, base)
	}
	return ent
}

// same reports whether group, placed at base, says what the entry says.
func (e *encodedLine) same(group []analyze.Diagnostic, base source.Pos) bool {
	if len(e.diags) != len(group) {
		return false
	}
	for x := range group {
		a, g := &e.diags[x], &group[x]
		if a.Span != g.Span.Shift(-base) || a.Severity != g.Severity || a.Unneeded != g.Unneeded ||
			a.Code != g.Code || a.Message != g.Message || len(a.Related) != len(g.Related) {
			return false
		}
		for y := range g.Related {
			if a.Related[y].Span != g.Related[y].Span.Shift(-base) || a.Related[y].Message != g.Related[y].Message {
				return false
			}
		}
	}
	return true
}

// move rewrites the entry's line numbers for line.
func (e *encodedLine) move(line int) {
	var ob, nb [20]byte
	old := strconv.AppendInt(ob[:0], int64(e.line), 10)
	num := strconv.AppendInt(nb[:0], int64(line), 10)
	if len(num) == len(old) {
		// The usual case, a line moved by a few: the numbers are
		// overwritten where they stand.
		for _, at := range e.cuts {
			copy(e.json[at:], num)
		}
		e.line = line
		return
	}
	out := make([]byte, 0, len(e.json)+len(e.cuts)*(len(num)-len(old)))
	prev := 0
	for x, at := range e.cuts {
		out = append(out, e.json[prev:at]...)
		e.cuts[x] = len(out)
		out = append(out, num...)
		prev = at + len(old)
	}
	e.json = append(out, e.json[prev:]...)
	e.line = line
}

// appendLines appends the JSON array of the diagnostics of a Report made
// by AnalyzeLines: each line's own findings are looked up by identity,
// so an unchanged line costs a map lookup and a copy, and the others
// (few: unterminated fences and the like) are encoded afresh, in start
// order with the lines.
func (c *lineCache) appendLines(b []byte, d *document, lines []analyze.LineFindings, other []analyze.Diagnostic) []byte {
	c.gen++
	m := d.mapper
	text := m.Text()
	n := m.LineCount()
	// Room for the whole array at once: grown by appends, the 600 kB
	// array of a long page would be copied a dozen times on opening it.
	count, owning := len(other), 0
	for _, l := range lines {
		count += len(l.Own) + len(l.Extra)
		if len(l.Own) > 0 {
			owning++
		}
	}
	if len(c.owned) == 0 {
		c.owned = make(map[*analyze.Diagnostic]*encodedLine, owning) // a first publication: no growing
	}
	a := jsonArray{b: append(slices.Grow(b, count*diagnosticBytes), '[')}
	k, o, used := 0, 0, 0
	for _, l := range lines {
		if len(l.Own) == 0 && len(l.Extra) == 0 {
			continue
		}
		for o < len(other) && other[o].Span.Start <= l.Span.Start {
			a.fresh(d, &other[o])
			o++
		}
		for k+1 < n && m.Line(k+1).Start <= l.Span.Start {
			k++
		}
		line := m.Line(k)
		if len(l.Own) == 0 || l.Span.End > line.End {
			// Label findings only (cached by value), or a step that is not
			// on one line.
			group := l.Extra
			if len(l.Own) > 0 {
				group = c.joined(l)
			}
			if within(group, line) {
				used++
				a.raw(c.byText(d, text, group, line, k).json)
				continue
			}
			for x := range group {
				a.fresh(d, &group[x])
			}
			continue
		}
		inLine := l.Span.Start - line.Start
		before := text[line.Start:l.Span.Start]
		ent := c.owned[&l.Own[0]]
		switch {
		case ent == nil || len(ent.diags) != len(l.Own) || ent.inLine != inLine || ent.before != string(before) || !sameRel(ent.extra, l.Extra, line.Start):
			group := c.joined(l)
			if !within(group, line) {
				for x := range group {
					a.fresh(d, &group[x])
				}
				continue
			}
			ent = c.encode(d, group, line.Start, k, false)
			ent.diags = l.Own // kept for its length; the entry is keyed by its identity
			ent.inLine, ent.before = inLine, string(before)
			ent.extra = relative(l.Extra, line.Start)
			c.owned[&l.Own[0]] = ent
		case ent.line != k:
			ent.move(k)
		}
		ent.used = c.gen
		used++
		a.raw(ent.json)
	}
	for ; o < len(other); o++ {
		a.fresh(d, &other[o])
	}
	c.sweep(used)
	return append(a.b, ']')
}

// diagnosticBytes is about what one diagnostic takes in JSON (its range,
// code, message and related information), for sizing buffers.
const diagnosticBytes = 400

// joined returns a line's findings in host positions, sorted by start as
// Report.Full sorts them, in the cache's scratch slice: valid until the
// next call.
func (c *lineCache) joined(l analyze.LineFindings) []analyze.Diagnostic {
	g := appendShifted(c.group[:0], l.Own, l.Span.Start)
	g = append(g, l.Extra...)
	slices.SortStableFunc(g, func(a, b analyze.Diagnostic) int { return cmp.Compare(a.Span.Start, b.Span.Start) })
	c.group = g
	return g
}

// byText returns the entry of a group of findings on line k, found by
// the line's text and compared by value, encoding it on a miss.
func (c *lineCache) byText(d *document, text []byte, group []analyze.Diagnostic, line source.Span, k int) *encodedLine {
	ent := c.lines[string(text[line.Start:line.End])]
	switch {
	case ent == nil || !ent.same(group, line.Start):
		ent = c.encode(d, group, line.Start, k, true)
		c.lines[string(text[line.Start:line.End])] = ent
	case ent.line != k:
		ent.move(k)
	}
	ent.used = c.gen
	return ent
}

// relative returns ds moved to positions relative to base, for comparing.
func relative(ds []analyze.Diagnostic, base source.Pos) []analyze.Diagnostic {
	if len(ds) == 0 {
		return nil
	}
	return appendShifted(make([]analyze.Diagnostic, 0, len(ds)), ds, -base)
}

// appendShifted appends ds moved by the given offset, related spans
// included, without their fixes, which are not published.
func appendShifted(dst, ds []analyze.Diagnostic, by source.Pos) []analyze.Diagnostic {
	for _, f := range ds {
		f.Span = f.Span.Shift(by)
		f.Fixes = nil
		if len(f.Related) > 0 {
			rel := make([]analyze.Related, len(f.Related))
			for y, r := range f.Related {
				rel[y] = analyze.Related{Span: r.Span.Shift(by), Message: r.Message}
			}
			f.Related = rel
		}
		dst = append(dst, f)
	}
	return dst
}

// sameRel reports whether ds, placed at base, are rel.
func sameRel(rel, ds []analyze.Diagnostic, base source.Pos) bool {
	return (&encodedLine{diags: rel}).same(ds, base)
}
