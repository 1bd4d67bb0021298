package reagents

import (
	"errors"
	"fmt"
	"strconv"
	"strings"

	"walden/analyze/smiles"
	"walden/grammar/source"
)

// A lab's names file adds reagents and solvents to the dictionary, or
// replaces built-in ones, one entry per line (the format is the project's
// own; docs/reagents.md is its reference):
//
//	# comment lines start with '#'
//	reagent NAME[, NAME…]: key=value key=value …
//	solvent NAME[, NAME…]: key=value …
//	alias NAME[, NAME…] = KNOWN-NAME
//
// A name is bare text (spaces allowed) or "quoted" when it holds a comma,
// colon, equals sign or '#'. A value is bare text without spaces or
// "quoted". Reagent keys: smiles (required: as weighed out), species,
// counterion, roles (required), pKaH, n, bulk, soluble, hazards, base,
// source (required), notes. Solvent keys: smiles, dielectric, protic and
// source (required), temp, class, bp, hazards, notes.
//
// A lab entry that shares a name with a built-in entry of the same kind
// replaces it, and every name of the built-in entry then leads to the lab
// entry. Entries are checked as a whole; a bad entry is left out and every
// problem is reported with its position.

// reagentKeys and solventKeys are the keys each kind of entry accepts.
var (
	reagentKeys = []string{"smiles", "species", "counterion", "roles", "pKaH", "n", "bulk", "soluble", "hazards", "base", "source", "notes"}
	solventKeys = []string{"smiles", "dielectric", "temp", "protic", "class", "bp", "hazards", "source", "notes"}
)

// Load reads a lab's names file and returns the built-in dictionary
// extended by it, with every problem found. file names the file in
// messages. It never fails outright: bad entries are left out.
func Load(text []byte, file string) (*Dictionary, ErrorList) {
	return Builtin().Extend(text, file)
}

// Extend returns a new dictionary: d with the entries of a lab's names
// file added (see Load). d itself is not changed.
func (d *Dictionary) Extend(text []byte, file string) (*Dictionary, ErrorList) {
	p := &labParser{file: file, text: string(text), base: d}
	p.parse()
	nd := p.apply()
	nd.problems = d.problems
	p.errs.Sort()
	return nd, p.errs
}

// span is a byte range in the lab file.
type span struct{ start, end int }

type labName struct {
	text string
	at   span
}

type labField struct {
	key, val string
	keyAt    span
	valAt    span
}

type labEntry struct {
	kind   string // "reagent", "solvent" or "alias"
	line   int
	kindAt span
	names  []labName
	fields []labField
	target labName // alias only
	whole  span    // the whole line, for entry-level messages

	reagent *Reagent
	solvent *Solvent
	bad     bool            // a field was wrong: check the others, then leave the entry out
	present map[string]bool // keys written, even those whose value was wrong
}

type labParser struct {
	file    string
	text    string
	base    *Dictionary
	errs    ErrorList
	entries []*labEntry
}

func (p *labParser) errorf(at span, format string, args ...any) {
	// A mark one past the end of the text (a value missing at the very
	// end) becomes an empty mark at the end.
	at.end = min(at.end, len(p.text))
	at.start = min(at.start, at.end)
	line := 1 + strings.Count(p.text[:at.start], "\n")
	col := at.start - strings.LastIndexByte(p.text[:at.start], '\n')
	p.errs = append(p.errs, &Error{
		File: p.file, Line: line, Col: col,
		Span: source.Span{Start: source.Pos(at.start), End: source.Pos(at.end)},
		Msg:  fmt.Sprintf(format, args...),
	})
}

// parse splits the file into lines and reads each.
func (p *labParser) parse() {
	for off, line := 0, 1; off < len(p.text); line++ {
		end := strings.IndexByte(p.text[off:], '\n')
		if end < 0 {
			end = len(p.text) - off
		}
		l := p.text[off : off+end]
		l = strings.TrimSuffix(l, "\r")
		p.line(l, off, line)
		off += end + 1
	}
}

func isSpace(c byte) bool { return c == ' ' || c == '\t' }

// line reads one line starting at byte offset base.
func (p *labParser) line(l string, base, lineNo int) {
	i := 0
	for i < len(l) && isSpace(l[i]) {
		i++
	}
	if i == len(l) || l[i] == '#' {
		return
	}
	if !utf8Valid(l) {
		p.errorf(span{base, base + len(l)}, "the line is not valid UTF-8 text")
		return
	}
	j := i
	for j < len(l) && !isSpace(l[j]) && l[j] != ':' && l[j] != '=' && l[j] != ',' {
		j++
	}
	kind := l[i:j]
	e := &labEntry{kind: kind, line: lineNo, kindAt: span{base + i, base + j}, whole: span{base + i, base + len(l)}}
	switch kind {
	case "reagent", "solvent", "alias":
	default:
		if j == i {
			j = i + 1
		}
		p.errorf(span{base + i, base + j}, "found %q at the start of the line, expected \"reagent\", \"solvent\" or \"alias\" (or '#' for a comment)", clip(l[i:j]))
		return
	}
	term := byte(':')
	if kind == "alias" {
		term = '='
	}
	names, k, ok := p.names(l, j, base, term)
	if !ok {
		return
	}
	for _, n := range names {
		if key, fits := normalize(nil, n.text, false); !fits {
			p.errorf(n.at, "the name is longer than the %d characters a name may have", maxKey)
			return
		} else if len(key) == 0 {
			p.errorf(n.at, "the name %q has no letters or digits", n.text)
			return
		}
	}
	e.names = names
	if k >= len(l) || l[k] != term {
		p.errorf(span{base + k, base + len(l)}, "expected '%c' after the names%s", term, map[bool]string{
			true:  ", then the known name the aliases stand for",
			false: ", then fields such as smiles=… roles=… source=…",
		}[kind == "alias"])
		return
	}
	k++
	if kind == "alias" {
		for k < len(l) && isSpace(l[k]) {
			k++
		}
		tn, k2, ok := p.names(l, k, base, 0)
		if !ok {
			return
		}
		if len(tn) != 1 {
			p.errorf(span{base + k, base + k2}, "expected one known name after '=', found %d", len(tn))
			return
		}
		e.target = tn[0]
		p.entries = append(p.entries, e)
		return
	}
	ok, fatal := p.fields(e, l, k, base)
	if fatal {
		return
	}
	e.bad = !ok
	p.entries = append(p.entries, e)
}

// names reads a comma-separated list of names from l[i:], stopping at
// term (or at the end of the line when term is 0). It returns the index
// of the terminator.
func (p *labParser) names(l string, i, base int, term byte) ([]labName, int, bool) {
	var out []labName
	for {
		for i < len(l) && isSpace(l[i]) {
			i++
		}
		if i < len(l) && l[i] == '"' {
			end := strings.IndexByte(l[i+1:], '"')
			if end < 0 {
				p.errorf(span{base + i, base + len(l)}, "unterminated quoted name: add a closing '\"'")
				return nil, i, false
			}
			text := l[i+1 : i+1+end]
			if strings.TrimSpace(text) == "" {
				p.errorf(span{base + i, base + i + end + 2}, "empty quoted name")
				return nil, i, false
			}
			out = append(out, labName{text, span{base + i + 1, base + i + 1 + end}})
			i += end + 2
			for i < len(l) && isSpace(l[i]) {
				i++
			}
		} else {
			j := i
			for j < len(l) && l[j] != ',' && (term == 0 || l[j] != term) {
				if l[j] == '"' {
					p.errorf(span{base + j, base + j + 1}, "found '\"' inside a bare name; quote the whole name instead")
					return nil, j, false
				}
				j++
			}
			text := strings.TrimRight(l[i:j], " \t")
			if text == "" {
				what := "end of line"
				if j < len(l) {
					what = fmt.Sprintf("'%c'", l[j])
				}
				end := j
				if j < len(l) {
					end = j + 1
				}
				p.errorf(span{base + i, base + end}, "expected a name, found %s", what)
				return nil, j, false
			}
			out = append(out, labName{text, span{base + i, base + i + len(text)}})
			i = j
		}
		if i < len(l) && l[i] == ',' {
			i++
			continue
		}
		if term == 0 && i < len(l) {
			p.errorf(span{base + i, base + len(l)}, "unexpected text after the name: %q", clip(l[i:]))
			return nil, i, false
		}
		return out, i, true
	}
}

// fields reads key=value pairs from l[i:]. fatal means the line could not
// be read to its end, so that the fields read are not all there are.
func (p *labParser) fields(e *labEntry, l string, i, base int) (ok, fatal bool) {
	keys := reagentKeys
	if e.kind == "solvent" {
		keys = solventKeys
	}
	ok = true
	seen := map[string]span{}
	first := true
	for {
		for i < len(l) && isSpace(l[i]) {
			i++
		}
		if i >= len(l) {
			return ok, false
		}
		j := i
		for j < len(l) && l[j] != '=' && !isSpace(l[j]) {
			j++
		}
		key := l[i:j]
		keyAt := span{base + i, base + j}
		if j >= len(l) || l[j] != '=' {
			hint := ""
			if first {
				hint = "; a name holding ':', ',' or '=' must be \"quoted\""
			}
			p.errorf(keyAt, "found %q, expected key=value (keys: %s)%s", clip(key), strings.Join(keys, ", "), hint)
			return false, true
		}
		first = false
		if key == "" {
			p.errorf(span{base + j, base + j + 1}, "found '=' without a key before it")
			return false, true
		}
		j++
		var val string
		var valAt span
		if j < len(l) && l[j] == '"' {
			end := strings.IndexByte(l[j+1:], '"')
			if end < 0 {
				p.errorf(span{base + j, base + len(l)}, "unterminated quoted value: add a closing '\"'")
				return false, true
			}
			val = l[j+1 : j+1+end]
			valAt = span{base + j + 1, base + j + 1 + end}
			j += end + 2
			if j < len(l) && !isSpace(l[j]) {
				p.errorf(span{base + j, base + j + 1}, "expected a space after the closing quote")
				return false, true
			}
		} else {
			k := j
			for k < len(l) && !isSpace(l[k]) {
				k++
			}
			val = l[j:k]
			valAt = span{base + j, base + k}
			j = k
		}
		i = j
		if !contains(keys, key) {
			hint := ""
			if s := closestWord(key, keys); s != "" {
				hint = fmt.Sprintf(" (did you mean %s?)", s)
			}
			p.errorf(keyAt, "unknown key %q for a %s%s; keys: %s", clip(key), e.kind, hint, strings.Join(keys, ", "))
			ok = false
			continue
		}
		if prev, dup := seen[key]; dup {
			p.errorf(keyAt, "%s= given twice (first at column %d)", key, prev.start-lineStart(p.text, prev.start)+1)
			ok = false
			continue
		}
		seen[key] = keyAt
		if e.present == nil {
			e.present = map[string]bool{}
		}
		e.present[key] = true
		if val == "" {
			p.errorf(span{valAt.start, valAt.start + 1}, "%s= has no value", key)
			ok = false
			continue
		}
		e.fields = append(e.fields, labField{key, val, keyAt, valAt})
	}
}

func lineStart(text string, at int) int { return strings.LastIndexByte(text[:at], '\n') + 1 }

// clip shortens a quoted piece of input for a message.
func clip(s string) string {
	if len(s) > 40 {
		s = s[:40]
		for len(s) > 0 && !utf8Valid(s) {
			s = s[:len(s)-1]
		}
		return s + "…"
	}
	return s
}

// closestWord returns the word of words nearest to w, if any is close.
func closestWord(w string, words []string) string {
	best, bestD := "", 3
	lw := []byte(strings.ToLower(w))
	if len(lw) > maxKey {
		return ""
	}
	for _, c := range words {
		if d := osa(lw, strings.ToLower(c), 2); d < bestD {
			best, bestD = c, d
		}
	}
	return best
}

// checkSMILES reads s with the SMILES reader and reports its first
// problem, positioned inside the value at.
func (p *labParser) checkSMILES(key, s string, at span) bool {
	err := parseSMILES(s)
	if err == nil {
		return true
	}
	var list smiles.ErrorList
	if errors.As(err, &list) && len(list) > 0 {
		e := list[0]
		st := min(max(at.start+e.Span.Start, at.start), at.end)
		en := min(max(at.start+e.Span.End, st), at.end)
		p.errorf(span{st, en}, "%s= is not valid SMILES: %s", key, e.Msg)
		return false
	}
	p.errorf(at, "%s= is not valid SMILES: %v", key, err)
	return false
}

// parseSMILES runs the SMILES reader under a recover, so that a bug there
// turns into a message here rather than a crash of the server.
func parseSMILES(s string) (err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("the SMILES reader failed on it (%v)", r)
		}
	}()
	_, err = smiles.Parse(s)
	return err
}

func (p *labParser) number(f labField, what string) (Value, bool) {
	v, err := strconv.ParseFloat(f.val, 64)
	if err != nil || v != v || v > 1e6 || v < -1e6 {
		p.errorf(f.valAt, "%s= found %q, expected %s", f.key, clip(f.val), what)
		return Value{}, false
	}
	return Value{V: v, Known: true}, true
}

func yesNo(s string) (bool, bool) {
	switch strings.ToLower(s) {
	case "yes", "true":
		return true, true
	case "no", "false":
		return false, true
	}
	return false, false
}

// words splits a comma-separated value, with the span of each word.
func words(f labField) []labName {
	var out []labName
	at := f.valAt.start
	for _, w := range strings.Split(f.val, ",") {
		t := strings.TrimSpace(w)
		lead := strings.Index(w, t)
		if t != "" {
			out = append(out, labName{t, span{at + lead, at + lead + len(t)}})
		}
		at += len(w) + 1
	}
	return out
}

func (p *labParser) hazards(f labField) ([]string, bool) {
	var out []string
	ok := true
	for _, w := range words(f) {
		if !isHazard(w.text) {
			hint := ""
			if s := closestWord(w.text, hazardWords[:]); s != "" {
				hint = fmt.Sprintf(" (did you mean %s?)", s)
			}
			p.errorf(w.at, "unknown hazard %q%s; hazards: %s", clip(w.text), hint, strings.Join(hazardWords[:], ", "))
			ok = false
			continue
		}
		out = append(out, w.text)
	}
	return out, ok
}

// entryFields turns the fields of reagent and solvent lines into entries.
func (p *labParser) entryFields(e *labEntry) bool {
	get := map[string]labField{}
	for _, f := range e.fields {
		get[f.key] = f
	}
	origin := fmt.Sprintf("%s:%d", p.file, e.line)
	src, hasSrc := get["source"]
	required := []string{"smiles", "roles", "source"}
	if e.kind == "solvent" {
		required = []string{"smiles", "dielectric", "protic", "source"}
	}
	ok := true
	var missing []string
	for _, k := range required {
		if !e.present[k] {
			missing = append(missing, k+"=")
		}
	}
	if len(missing) > 0 {
		msg := fmt.Sprintf("the %s %q lacks %s", e.kind, e.names[0].text, strings.Join(missing, ", "))
		if !hasSrc {
			msg += "; source= says where the values come from (a paper, a data sheet, \"common practice\", \"from memory\" or \"measured in our lab\")"
		}
		p.errorf(span{e.kindAt.start, e.whole.end}, "%s", msg)
		ok = false
	}
	source := src.val
	valueSource := source + " (" + origin + ")"
	names := make([]string, len(e.names))
	for i, n := range e.names {
		names[i] = n.text
	}
	for _, k := range []string{"smiles", "species", "counterion"} {
		if f, has := get[k]; has && !p.checkSMILES(k, f.val, f.valAt) {
			ok = false
		}
	}
	if e.kind == "reagent" {
		g := &Reagent{Names: names, Source: source, Origin: origin, Bulk: Small}
		g.Whole = get["smiles"].val
		g.Species = g.Whole
		if f, has := get["species"]; has {
			g.Species = f.val
		}
		g.Counterion = get["counterion"].val
		if f, has := get["roles"]; has {
			for _, w := range words(f) {
				r, known := ParseRole(w.text)
				if !known {
					hint := ""
					if s := closestWord(w.text, roleWords[:]); s != "" {
						hint = fmt.Sprintf(" (did you mean %s?)", s)
					}
					p.errorf(w.at, "unknown role %q%s; roles: %s", clip(w.text), hint, strings.Join(roleWords[:], ", "))
					ok = false
				}
				g.Roles |= r
			}
		}
		if f, has := get["pKaH"]; has {
			v, good := p.number(f, "a number (the pKa of the species' conjugate acid)")
			ok = ok && good
			v.Source = valueSource
			g.PKaH = v
		}
		if f, has := get["n"]; has {
			v, good := p.number(f, "a number (nucleophilicity n(CH3I) in methanol, the Pearson–Sobel–Songstad scale)")
			ok = ok && good
			v.Source = valueSource
			g.Nucleo = v
		}
		if f, has := get["bulk"]; has {
			b, known := ParseBulk(f.val)
			if !known {
				p.errorf(f.valAt, "bulk= found %q, expected small, moderate or hindered", clip(f.val))
				ok = false
			}
			g.Bulk = b
		}
		if f, has := get["soluble"]; has {
			for _, w := range words(f) {
				t := strings.TrimPrefix(w.text, "-")
				if isSolubleWord(t) {
					continue
				}
				if en, found := p.base.Lookup(t); !found || en.Solvent == nil {
					p.errorf(w.at, "soluble= found %q, expected a solvent name or one of %s", clip(w.text), strings.Join(solubleWords[:], ", "))
					ok = false
				}
			}
			g.Soluble = f.val
		}
		if f, has := get["hazards"]; has {
			h, good := p.hazards(f)
			ok = ok && good
			g.Hazards = h
		}
		if f, has := get["base"]; has {
			b, good := yesNo(f.val)
			if !good {
				p.errorf(f.valAt, "base= found %q, expected yes (the species forms only after a base deprotonates the reagent) or no", clip(f.val))
				ok = false
			}
			g.NeedsBase = b
		}
		g.Notes = get["notes"].val
		e.reagent = g
		return ok
	}
	s := &Solvent{Names: names, Source: source, Origin: origin, SMILES: get["smiles"].val, DielectricTempC: 25}
	if f, has := get["dielectric"]; has {
		v, good := p.number(f, "a number (relative permittivity)")
		if good && v.V < 1 {
			p.errorf(f.valAt, "dielectric= found %s, expected a relative permittivity of at least 1", f.val)
			good = false
		}
		ok = ok && good
		v.Source = valueSource
		s.Dielectric = v
	}
	if f, has := get["temp"]; has {
		v, good := p.number(f, "the temperature in °C at which the dielectric constant was measured")
		ok = ok && good
		s.DielectricTempC = v.V
	}
	if f, has := get["protic"]; has {
		b, good := yesNo(f.val)
		if !good {
			p.errorf(f.valAt, "protic= found %q, expected yes or no", clip(f.val))
			ok = false
		}
		s.Protic = b
	}
	if f, has := get["bp"]; has {
		v, good := p.number(f, "the normal boiling point in °C")
		ok = ok && good
		v.Source = valueSource
		s.BoilingC = v
	}
	if f, has := get["class"]; has {
		c := strings.ReplaceAll(f.val, "-", " ")
		if classWord(c) == "" {
			p.errorf(f.valAt, "class= found %q, expected %q, %q, %q or %q (hyphens for spaces are fine)", clip(f.val), ClassPolarProtic, ClassPolarAprotic, ClassWeaklyPolar, ClassNonpolar)
			ok = false
		}
		s.Class = c
	} else {
		s.Class = defaultClass(s)
	}
	if f, has := get["hazards"]; has {
		h, good := p.hazards(f)
		ok = ok && good
		s.Hazards = h
	}
	s.Notes = get["notes"].val
	e.solvent = s
	return ok
}

// defaultClass guesses a solvent's class from its permittivity when the
// lab file gives none: above 15 counts as polar, below 3 as nonpolar
// (common practice; the thresholds are the usual rough ones).
func defaultClass(s *Solvent) string {
	switch {
	case s.Protic:
		return ClassPolarProtic
	case s.Dielectric.V >= 15:
		return ClassPolarAprotic
	case s.Dielectric.V >= 3:
		return ClassWeaklyPolar
	}
	return ClassNonpolar
}

// apply checks names against each other and the base dictionary and
// builds the extended dictionary.
func (p *labParser) apply() *Dictionary {
	reagents := append([]*Reagent(nil), p.base.reagents...)
	solvents := append([]*Solvent(nil), p.base.solvents...)
	type owner struct {
		line int
		kind string
	}
	defined := map[string]owner{} // folded key → first lab definition
	var aliases []*labEntry
	replacedBy := map[string]int{} // kind+index of a built-in entry → line of the lab entry replacing it
	for _, e := range p.entries {
		if e.kind == "alias" {
			aliases = append(aliases, e)
			continue
		}
		if !p.entryFields(e) || e.bad {
			continue
		}
		clash := false
		for _, n := range e.names {
			k, _ := normalize(nil, n.text, true)
			if o, dup := defined[e.kind+"\x00"+string(k)]; dup {
				p.errorf(n.at, "%q is already a %s name on line %d", n.text, e.kind, o.line)
				clash = true
			}
		}
		if clash {
			continue
		}
		// Which built-in entries of the same kind do the names reach?
		hits := map[int32]string{}
		for _, n := range e.names {
			if en, found := p.base.Lookup(n.text); found {
				if e.kind == "reagent" && en.Reagent != nil {
					hits[p.base.indexOfReagent(en.Reagent)] = en.Reagent.Name()
				}
				if e.kind == "solvent" && en.Solvent != nil {
					hits[p.base.indexOfSolvent(en.Solvent)] = en.Solvent.Name()
				}
			}
		}
		if len(hits) > 1 {
			var which []string
			for _, n := range hits {
				which = append(which, n)
			}
			sortStrings(which)
			p.errorf(span{e.names[0].at.start, e.names[len(e.names)-1].at.end}, "these names belong to different %ss already (%s); an entry may replace only one", e.kind, strings.Join(which, ", "))
			continue
		}
		if replaced := false; len(hits) == 1 {
			for idx := range hits {
				if line, done := replacedBy[e.kind+strconv.Itoa(int(idx))]; done {
					p.errorf(span{e.names[0].at.start, e.names[len(e.names)-1].at.end}, "line %d already replaces the built-in %s %s", line, e.kind, hits[idx])
					replaced = true
				}
			}
			if replaced {
				continue
			}
		}
		for _, n := range e.names {
			k, _ := normalize(nil, n.text, true)
			defined[e.kind+"\x00"+string(k)] = owner{e.line, e.kind}
		}
		for idx := range hits {
			replacedBy[e.kind+strconv.Itoa(int(idx))] = e.line
			if e.kind == "reagent" {
				e.reagent.Names = mergeNames(e.reagent.Names, reagents[idx].Names)
				reagents[idx] = e.reagent
			} else {
				e.solvent.Names = mergeNames(e.solvent.Names, solvents[idx].Names)
				solvents[idx] = e.solvent
			}
		}
		if len(hits) == 0 {
			if e.kind == "reagent" {
				reagents = append(reagents, e.reagent)
			} else {
				solvents = append(solvents, e.solvent)
			}
		}
	}
	d := build(reagents, solvents)
	if len(aliases) == 0 {
		return d
	}
	// Aliases name entries of d (built-in or from this file, not other
	// aliases); they are gathered first and applied in one rebuild.
	type target struct{ r, s int32 }
	addR := map[int32][]string{}
	addS := map[int32][]string{}
	claimed := map[string]target{}
	for _, a := range aliases {
		en, found := d.Lookup(a.target.text)
		if !found {
			msg := fmt.Sprintf("alias target %q is not a known reagent or solvent", clip(a.target.text))
			if s := d.Suggest(a.target.text, 3); len(s) > 0 {
				msg += "; did you mean " + strings.Join(s, ", ") + "?"
			}
			p.errorf(a.target.at, "%s", msg)
			continue
		}
		t := target{-1, -1}
		if en.Reagent != nil {
			t.r = d.indexOfReagent(en.Reagent)
		}
		if en.Solvent != nil {
			t.s = d.indexOfSolvent(en.Solvent)
		}
		for _, n := range a.names {
			if other, taken := d.Lookup(n.text); taken {
				if other != en {
					p.errorf(n.at, "%q already names %s; an alias cannot take it", n.text, other.Name())
				}
				continue
			}
			k, ok := normalize(nil, n.text, true)
			if !ok {
				p.errorf(n.at, "the name is longer than %d characters", maxKey)
				continue
			}
			if prev, dup := claimed[string(k)]; dup {
				if prev != t {
					p.errorf(n.at, "%q is already an alias of another entry in this file", n.text)
				}
				continue
			}
			claimed[string(k)] = t
			if t.r >= 0 {
				addR[t.r] = append(addR[t.r], n.text)
			}
			if t.s >= 0 {
				addS[t.s] = append(addS[t.s], n.text)
			}
		}
	}
	for i, names := range addR {
		g := *reagents[i]
		g.Names = mergeNames(g.Names, names)
		reagents[i] = &g
	}
	for i, names := range addS {
		s := *solvents[i]
		s.Names = mergeNames(s.Names, names)
		solvents[i] = &s
	}
	return build(reagents, solvents)
}

// mergeNames returns a followed by the names of b not already in a.
func mergeNames(a, b []string) []string {
	out := append([]string(nil), a...)
	for _, n := range b {
		if !contains(out, n) {
			out = append(out, n)
		}
	}
	return out
}

func (d *Dictionary) indexOfReagent(r *Reagent) int32 {
	for i, x := range d.reagents {
		if x == r {
			return int32(i)
		}
	}
	return -1
}

func (d *Dictionary) indexOfSolvent(s *Solvent) int32 {
	for i, x := range d.solvents {
		if x == s {
			return int32(i)
		}
	}
	return -1
}
