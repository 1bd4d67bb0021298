package notation

import (
	_ "embed"
	"strconv"
	"strings"
	"unicode/utf8"
	"unsafe"
)

// The unit and word tables are data, not code: units.tsv lists every unit
// spelling accepted after a number and words.tsv every word standing for a
// quantity, each row with its source.
var (
	//go:embed units.tsv
	unitsTSV string
	//go:embed words.tsv
	wordsTSV string

	units                  wordTable // exact spelling
	foldedUnits            wordTable // lower-cased spelling, for rows marked fold
	quantityWords          wordTable // lower-cased word or words joined by one space
	quantityWordStarts     [256]bool // first bytes of quantityWords, to skip most lookups
	maxWordsInQuantityWord = 1

	// quantityWordLens and quantityWordPairs hold the lengths and the
	// first two bytes of the quantityWords: most words that start like
	// one ("CCBr", "EtOH") fail these before a lookup.
	quantityWordLens  [64]bool
	quantityWordPairs [1 << 16 / 64]uint64

	// quantityStart classes the first bytes for mayStartQuantity: qsAlways
	// for digits, signs, the point and non-ASCII bytes, qsPair for the
	// first letters of the words of words.tsv in either case and 'a', 'f'
	// for "at" and "for", whose second byte decides. Most names and
	// SMILES start otherwise ('N', '[') and fail at this one lookup.
	quantityStart [256]uint8

	// quantityStartPairs holds the first two bytes, lower-cased, of the
	// words of words.tsv and of "at" and "for".
	quantityStartPairs [1 << 16 / 64]uint64

	// unitNames and wordNames are the canonical units and words, indexed
	// by unit.id: a Tree keeps the index, not the string.
	unitNames = []string{""}
	wordNames = []string{""}
)

// unit is one row of units.tsv or words.tsv.
type unit struct {
	kind QuantityKind
	id   uint8 // index of the canonical unit or word in unitNames or wordNames
}

// nameID returns the index of name in *names, adding it if new.
func nameID(names *[]string, name string) uint8 {
	for i, n := range *names {
		if n == name {
			return uint8(i)
		}
	}
	if len(*names) == 256 {
		panic("notation: more than 255 canonical units or words")
	}
	*names = append(*names, name)
	return uint8(len(*names) - 1)
}

func init() {
	kinds := map[string]QuantityKind{}
	for k := Bare; k <= Ratio; k++ {
		kinds[k.String()] = k
	}
	for _, row := range tsvRows(unitsTSV) {
		u := unit{kind: kinds[row[1]], id: nameID(&unitNames, row[2])}
		if u.kind == 0 || len(row) < 5 {
			panic("notation: bad row in units.tsv: " + strings.Join(row, "\t"))
		}
		units.put(row[0], u)
		if row[3] == "yes" {
			foldedUnits.put(strings.ToLower(row[0]), u)
		}
	}
	for _, row := range tsvRows(wordsTSV) {
		u := unit{kind: kinds[row[1]], id: nameID(&wordNames, row[2])}
		if u.kind == 0 || len(row) < 4 {
			panic("notation: bad row in words.tsv: " + strings.Join(row, "\t"))
		}
		for _, w := range strings.Split(row[0], "|") {
			quantityWords.put(w, u)
			quantityWordStarts[w[0]] = true
			if len(w) < 2 || len(w) >= len(quantityWordLens) {
				panic("notation: quantity word of unexpected length in words.tsv: " + w)
			}
			quantityWordLens[len(w)] = true
			pair := uint16(lowerByte(w[0]))<<8 | uint16(lowerByte(w[1]))
			quantityWordPairs[pair/64] |= 1 << (pair % 64)
			maxWordsInQuantityWord = max(maxWordsInQuantityWord, strings.Count(w, " ")+1)
		}
	}
	quantityStartPairs = quantityWordPairs
	for _, w := range []string{"at", "for"} {
		pair := uint16(w[0])<<8 | uint16(w[1])
		quantityStartPairs[pair/64] |= 1 << (pair % 64)
	}
	for c := range quantityStart {
		b := byte(c)
		switch {
		case isDigitByte(b) || b == '-' || b == '+' || b == '.' || b >= utf8.RuneSelf:
			quantityStart[c] = qsAlways
		case mayStartWord(b) || lowerByte(b) == 'a' || lowerByte(b) == 'f':
			quantityStart[c] = qsPair
		}
	}
}

// tsvRows splits an embedded table into rows of fields, skipping comments
// and blank lines.
func tsvRows(tsv string) [][]string {
	var rows [][]string
	for _, line := range strings.Split(tsv, "\n") {
		if line == "" || line[0] == '#' {
			continue
		}
		rows = append(rows, strings.Split(line, "\t"))
	}
	return rows
}

// lookupUnit returns the unit spelled s.
func lookupUnit(s string) (unit, bool) {
	if u, ok := units.get(s); ok {
		return u, true
	}
	var buf [24]byte
	if len(s) > len(buf) {
		return unit{}, false
	}
	return foldedUnits.get(bufString(lowerASCII(buf[:0], s)))
}

// bufString returns the bytes of b, a buffer on the caller's stack, as
// a string without copying them: the string is only looked up in a
// table and does not outlive the buffer.
func bufString(b []byte) string { return unsafe.String(unsafe.SliceData(b), len(b)) }

// wordTable finds a spelling among the few dozen of a table. It is an
// open-addressing hash table whose hash reads only the length and the
// first and last bytes, which is enough to tell these spellings apart
// mostly at the first probe: a lookup is made for nearly every number in
// a line, and a map's general hash costs several times as much.
type wordTable struct {
	slots [256]uint8 // an index in keys plus one, or 0 for none
	keys  []string
	vals  []unit
}

// wordHash is the first slot to probe for the non-empty spelling s.
func wordHash(s string) uint8 {
	return uint8(len(s)*37 + int(s[0])*11 + int(s[len(s)-1]))
}

// put adds s, or replaces its unit if it is there, as a map would.
func (t *wordTable) put(s string, u unit) {
	if s == "" || len(t.keys) >= len(t.slots)/2 {
		panic("notation: empty spelling or too many spellings in a table: " + s)
	}
	for h := wordHash(s); ; h++ {
		k := t.slots[h]
		if k == 0 {
			t.keys, t.vals = append(t.keys, s), append(t.vals, u)
			t.slots[h] = uint8(len(t.keys))
			return
		}
		if t.keys[k-1] == s {
			t.vals[k-1] = u
			return
		}
	}
}

// get returns the unit of s.
func (t *wordTable) get(s string) (unit, bool) {
	if s == "" {
		return unit{}, false
	}
	for h := wordHash(s); ; h++ {
		k := t.slots[h]
		if k == 0 {
			return unit{}, false
		}
		if sameBytes(t.keys[k-1], s) {
			return t.vals[k-1], true
		}
	}
}

// sameBytes is a == b for the short spellings of the tables, compared
// byte by byte: == calls the runtime's memequal once the lengths agree.
func sameBytes(a, b string) bool {
	if len(a) != len(b) {
		return false
	}
	for i := 0; i < len(a); i++ {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// quantityWordPair reports whether a word of words.tsv starts with the
// bytes a, b, regardless of ASCII case.
func quantityWordPair(a, b byte) bool {
	pair := uint16(lowerByte(a))<<8 | uint16(lowerByte(b))
	return quantityWordPairs[pair/64]&(1<<(pair%64)) != 0
}

// The classes of quantityStart.
const (
	qsNever  = iota // starts no quantity
	qsAlways        // may start a number
	qsPair          // may start a word of words.tsv, "at" or "for"
)

// quantityStartPair reports whether a word of words.tsv, "at" or "for"
// starts with the bytes a, b, regardless of ASCII case.
func quantityStartPair(a, b byte) bool {
	pair := uint16(lowerByte(a))<<8 | uint16(lowerByte(b))
	return quantityStartPairs[pair/64]&(1<<(pair%64)) != 0
}

// lowerByte returns c in lower case if it is an ASCII letter.
func lowerByte(c byte) byte {
	if 'A' <= c && c <= 'Z' {
		c += 'a' - 'A'
	}
	return c
}

// foldsTo reports whether s is word, which is in lower case, in any
// ASCII case. For the words it is given, which hold no 'k' or 's' (the
// only ASCII letters other characters fold to), it is strings.EqualFold;
// it is asked of nearly every word of a line, and mostly fails on the
// length alone.
func foldsTo(s, word string) bool {
	if len(s) != len(word) {
		return false
	}
	for i := 0; i < len(s); i++ {
		if lowerByte(s[i]) != word[i] {
			return false
		}
	}
	return true
}

// lowerASCII appends s to b with ASCII letters in lower case; the unit
// and word tables hold no other letters that fold.
func lowerASCII(b []byte, s string) []byte {
	for i := 0; i < len(s); i++ {
		c := s[i]
		if 'A' <= c && c <= 'Z' {
			c += 'a' - 'A'
		}
		b = append(b, c)
	}
	return b
}

// mayStartWord reports whether a word of words.tsv may start with c,
// regardless of ASCII case.
func mayStartWord(c byte) bool { return quantityWordStarts[c|0x20] || quantityWordStarts[c] }

// quantityWord looks up the words ws, joined by one space, in words.tsv,
// without regard to ASCII case.
func (p *parser) quantityWord(ws []tok) (unit, bool) {
	if !mayStartWord(p.str[ws[0].start]) {
		return unit{}, false
	}
	n := len(ws) - 1 // the spaces joining the words
	for _, w := range ws {
		n += int(w.end - w.start)
	}
	if n >= len(quantityWordLens) || !quantityWordLens[n] {
		return unit{}, false
	}
	second := byte(' ')
	if first := ws[0]; first.end-first.start > 1 {
		second = p.str[first.start+1]
	}
	if !quantityWordPair(p.str[ws[0].start], second) {
		return unit{}, false
	}
	var buf [48]byte
	b := buf[:0]
	for i, w := range ws {
		if i > 0 {
			b = append(b, ' ')
		}
		if len(b)+int(w.end-w.start) > len(buf) {
			return unit{}, false
		}
		b = lowerASCII(b, p.str[w.start:w.end])
	}
	return quantityWords.get(bufString(b))
}

// number is where a number read from the start of a word ends, with an
// optional range ("0–25", "12-16"). Its values are not kept: the Tree
// reads them again from the text (Quantity.Value).
type number struct {
	hasTo   bool
	end     int // bytes of the word used
	toStart int // where the upper end starts in the word
}

// readNumber reads an optionally signed decimal number, and an optional
// range to a second, unsigned one ("0–25", "12-16"), from the start of w
// into n. It accepts the hyphen, the Unicode minus sign (U+2212) and the
// en dash (U+2013) as a leading minus, because all three reach notebooks
// through copying from documents. n is filled in place rather than
// returned: a returned struct is copied through memory twice.
func readNumber(w string, n *number) bool {
	_, end, ok := readSigned(w)
	if !ok {
		return false
	}
	*n = number{end: end}
	if end == len(w) || w[end] != '-' && w[end] != '~' && w[end] != 0xE2 {
		return true // no range: the common case
	}
	rest := w[end:]
	dash := 0 // the length of the dash: "-", "~", "–" or "−"
	switch {
	case rest[0] == '-' || rest[0] == '~':
		dash = 1
	case strings.HasPrefix(rest, "–") || strings.HasPrefix(rest, "−"):
		dash = 3
	}
	if dash > 0 {
		after := rest[dash:]
		if len(after) > 0 && (isDigitByte(after[0]) || after[0] == '.') {
			if _, e, ok := readSigned(after); ok {
				n.hasTo, n.toStart = true, end+dash
				n.end = end + dash + e
			}
		}
	}
	return true
}

func isDigitByte(c byte) bool { return '0' <= c && c <= '9' }

// readSigned reads a decimal number with an optional sign.
func readSigned(w string) (float64, int, bool) {
	i, neg := 0, false
	if w != "" && !isDigitByte(w[0]) { // a digit first: the common case
		switch {
		case w[0] == '-':
			i, neg = 1, true
		case w[0] == '+':
			i = 1
		case strings.HasPrefix(w, "−") || strings.HasPrefix(w, "–"):
			i, neg = 3, true
		}
	}
	// The digits are gathered into m as they are read, as exactDecimal
	// would gather them, so that they are read once.
	start, digits, frac := i, 0, -1
	var m uint64
	for i < len(w) && isDigitByte(w[i]) {
		m = m*10 + uint64(w[i]-'0')
		i++
		digits++
	}
	if i < len(w) && w[i] == '.' && i+1 < len(w) && isDigitByte(w[i+1]) {
		i++
		frac = 0
		for i < len(w) && isDigitByte(w[i]) {
			m = m*10 + uint64(w[i]-'0')
			i++
			digits++
			frac++
		}
	}
	if digits == 0 || digits > 30 {
		return 0, 0, false
	}
	var v float64
	if digits <= 15 {
		v = exactValue(m, frac)
	} else {
		f, err := strconv.ParseFloat(w[start:i], 64)
		if err != nil {
			return 0, 0, false
		}
		v = f
	}
	if neg {
		v = -v
	}
	return v, i, true
}

// exactPow10 holds the powers of ten a float64 holds exactly.
var exactPow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15}

// exactDecimal converts the digits, with at most one '.', of a number of
// at most 15 digits, as every amount in a notebook is. The digits as an
// integer and the power of ten are then both exact, and one IEEE
// division rounds correctly, so the result is the one strconv.ParseFloat
// gives, without its general machinery; ok is false for longer numbers.
func exactDecimal(s string, digits int) (float64, bool) {
	if digits > 15 {
		return 0, false
	}
	var m uint64
	frac := -1
	for i := 0; i < len(s); i++ {
		if s[i] == '.' {
			frac = 0
			continue
		}
		m = m*10 + uint64(s[i]-'0')
		if frac >= 0 {
			frac++
		}
	}
	return exactValue(m, frac), true
}

// exactValue is the number of at most 15 digits m with frac of them
// after the point (-1 or 0: none), as exactDecimal tells.
func exactValue(m uint64, frac int) float64 {
	if frac <= 0 {
		return float64(m) // a whole number: no division
	}
	return float64(m) / exactPow10[frac]
}

// ratioParts appends the parts of the ratio w ("4:1", "1:1:2") to out
// and reports whether w is one: unsigned numbers joined by ':'.
func ratioParts(w string, out []float64) ([]float64, bool) {
	if strings.IndexByte(w, ':') < 0 {
		return out, false
	}
	n := len(out)
	for rest := w; ; {
		part := rest
		k := strings.IndexByte(rest, ':')
		if k >= 0 {
			part = rest[:k]
		}
		v, end, ok := readSigned(part)
		if !ok || end != len(part) || strings.ContainsAny(part[:1], "-−–+") {
			return out[:n], false
		}
		out = append(out, v)
		if k < 0 {
			return out, true
		}
		rest = rest[k+1:]
	}
}

// isLabelByte reports whether c may appear in a step label: ASCII letters,
// digits, '_', '-' and the prime "'" ("3a'"), none of which lets a label
// be taken for the SMILES that may follow it.
func isLabelByte(c byte) bool { return labelBytes[c] }

// labelBytes marks the bytes isLabelByte accepts: every label and
// reference is checked byte by byte.
var labelBytes = func() (t [256]bool) {
	for c := range t {
		t[c] = c == '_' || c == '-' || c == '\'' || '0' <= c && c <= '9' || 'a' <= c && c <= 'z' || 'A' <= c && c <= 'Z'
	}
	return t
}()
