// Package smiles reads and writes SMILES (the OpenSMILES specification,
// http://opensmiles.org/opensmiles.html) and computes the canonical form
// used to compare structures exactly.
//
// Parse builds a molecule.Molecule with atoms in input order, kekulises
// aromatic input and records tetrahedral, allene-type and double-bond
// stereo. Write produces readable SMILES, Canonical a unique one.
package smiles

import (
	"fmt"

	"walden/analyze/molecule"
)

// Parse reads one SMILES string. Atoms are numbered in input order
// (explicit atoms only; a written [H] is an atom). On error it returns the
// molecule read so far (nil only when nothing could be read) and an
// ErrorList, sorted by position, with every problem found.
func Parse(s string) (*molecule.Molecule, error) {
	p := parser{src: s, m: &molecule.Molecule{}}
	for i := range p.rings {
		p.rings[i].atom = -1
	}
	if len(s) > MaxLength {
		p.errs.Add(molecule.Span{Start: MaxLength, End: len(s)}, fmt.Sprintf(
			"SMILES of %d bytes is longer than the limit of %d; split the structure or check that this is one SMILES", len(s), MaxLength))
		return nil, p.errs
	}
	// Size the molecule once: no more atoms than letters and '*'.
	letters := 0
	for i := 0; i < len(s); i++ {
		if c := s[i]; c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' || c == '*' {
			letters++
		}
	}
	letters = min(letters, MaxAtoms)
	p.m.Grow(letters, letters+4)
	p.notes = make([]bondNote, 0, letters+4)
	p.read()
	if !p.stopped {
		// After a syntax error the molecule is partial (an unclosed ring,
		// a lost atom), so what kekulisation and stereo would say about it
		// is noise: the molecule is still completed, their messages are
		// dropped.
		syntax := len(p.errs)
		p.kekulise()
		p.implicitHydrogens()
		p.stereo()
		if syntax > 0 {
			p.errs = p.errs[:syntax]
		}
	}
	p.errs.Sort()
	return p.m, p.errs.Err()
}

// bondNote is what the reader keeps about a bond beyond molecule.Bond.
type bondNote struct {
	// keyA and keyB order the bond among the neighbours of A and of B as
	// OpenSMILES reads them for stereo, by twice the offset where the bond
	// is written: the bond from the preceding atom comes before the atom,
	// an implicit hydrogen at the atom's own offset, ring closures and
	// branches after it. One scale for all atoms, so the neighbours of
	// both ends of an allene can be ordered together.
	keyA, keyB int
	// dir is +1 for '/' and -1 for '\', read as "A dir B".
	dir int8
}

type ringOpen struct {
	atom  int // -1 when the label is free
	sym   byte
	sspan molecule.Span
	digit molecule.Span
}

type chiralMark struct {
	atom    int
	winding molecule.Winding
	span    molecule.Span
}

type branch struct {
	prev, atoms, open int
}

type parser struct {
	src     string
	pos     int
	m       *molecule.Molecule
	errs    ErrorList
	notes   []bondNote
	chiral  []chiralMark
	rings   [100]ringOpen
	stopped bool
}

func (p *parser) errorf(start, end int, format string, args ...any) {
	if p.stopped {
		return
	}
	if len(p.errs) >= MaxErrors {
		p.errs.Add(molecule.Span{Start: start, End: end}, fmt.Sprintf("more than %d errors; stopped reading", MaxErrors))
		p.stopped = true
		return
	}
	p.errs.Add(molecule.Span{Start: start, End: end}, fmt.Sprintf(format, args...))
}

func isBondSymbol(c byte) bool {
	switch c {
	case '-', '=', '#', '$', ':', '/', '\\':
		return true
	}
	return false
}

// read is the main loop over the string: atoms, bonds, branches, ring
// closures and dots, recovering after each error at the next character.
func (p *parser) read() {
	s := p.src
	prev := -1
	var bsym byte
	var bspan molecule.Span
	var stack []branch
	if len(s) == 0 {
		p.errorf(0, 0, "empty SMILES; expected at least one atom")
		return
	}
	for p.pos < len(s) && !p.stopped {
		c := s[p.pos]
		start := p.pos
		switch {
		case c == '[' || c == '*' || isOrganicStart(c):
			a := p.atom()
			if a < 0 {
				if p.stopped {
					return
				}
				bsym = 0
				continue
			}
			if prev >= 0 {
				p.chainBond(prev, a, bsym, bspan)
			}
			prev, bsym = a, 0
		case isBondSymbol(c):
			p.pos++
			switch {
			case bsym != 0:
				p.errorf(start, p.pos, "found bond symbol '%c' right after '%c'; expected an atom or ring-closure digit; keep one of the two", c, bsym)
			case prev < 0:
				p.errorf(start, p.pos, "found bond symbol '%c' with no atom before it; expected an atom first", c)
			default:
				bsym, bspan = c, molecule.Span{Start: start, End: p.pos}
			}
		case c >= '0' && c <= '9' || c == '%':
			label, ok := p.ringLabel()
			span := molecule.Span{Start: start, End: p.pos}
			if !ok {
				bsym = 0
				continue
			}
			if prev < 0 {
				p.errorf(start, p.pos, "found ring-closure label %s with no atom before it; expected an atom first", s[start:p.pos])
				bsym = 0
				continue
			}
			p.ring(prev, label, bsym, bspan, span)
			bsym = 0
		case c == '(':
			p.pos++
			switch {
			case prev < 0:
				p.errorf(start, p.pos, "found '(' with no atom before it; a branch must follow the atom it hangs from")
			case bsym != 0:
				p.errorf(bspan.Start, p.pos, "found bond symbol '%c' before '('; expected it inside the branch, as in C(=O)", bsym)
				bsym = 0
			}
			if len(stack) >= MaxBranchDepth {
				p.errorf(start, p.pos, "branches nested deeper than the limit of %d; stopped reading", MaxBranchDepth)
				p.stopped = true
				return
			}
			stack = append(stack, branch{prev: prev, atoms: len(p.m.Atoms), open: start})
		case c == ')':
			p.pos++
			if bsym != 0 {
				p.errorf(bspan.Start, bspan.End, "found bond symbol '%c' at the end of a branch; expected an atom after it", bsym)
				bsym = 0
			}
			if len(stack) == 0 {
				p.errorf(start, p.pos, "found ')' with no '(' open; remove it or add the missing '('")
				continue
			}
			b := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			if b.atoms == len(p.m.Atoms) {
				p.errorf(b.open, p.pos, "found an empty branch '()'; expected atoms inside it or no parentheses")
			}
			prev = b.prev
		case c == '.':
			p.pos++
			if bsym != 0 {
				p.errorf(bspan.Start, p.pos, "found bond symbol '%c' before '.'; a dot separates unbonded parts, so drop one of the two", bsym)
				bsym = 0
			}
			if prev < 0 && len(p.m.Atoms) == 0 {
				p.errorf(start, p.pos, "found '.' before any atom; expected an atom")
			}
			prev = -1
		case c == ' ' || c == '\t' || c == '\n' || c == '\r':
			p.pos++
			p.errorf(start, p.pos, "found white space inside the SMILES; expected an atom, bond, branch or ring closure (SMILES has no spaces)")
		default:
			p.unexpected()
			bsym = 0
		}
	}
	if p.stopped {
		return
	}
	if bsym != 0 {
		p.errorf(bspan.Start, bspan.End, "SMILES ends with bond symbol '%c'; expected an atom after it", bsym)
	}
	for i := len(stack) - 1; i >= 0; i-- {
		p.errorf(stack[i].open, stack[i].open+1, "found '(' that is never closed; add ')'")
	}
	for label, r := range p.rings {
		if r.atom >= 0 {
			p.errorf(r.digit.Start, r.digit.End, "ring closure %s is opened here and never closed; close it on a later atom or remove it", ringName(label))
		}
	}
}

func ringName(label int) string {
	if label < 10 {
		return fmt.Sprint(label)
	}
	return fmt.Sprintf("%%%02d", label)
}

// unexpected reports a character that cannot start any SMILES element and
// skips it, with a hint for the common slips.
func (p *parser) unexpected() {
	s := p.src
	start := p.pos
	c := s[start]
	// Skip a whole UTF-8 sequence so the span covers one character.
	n := 1
	if c >= 0x80 {
		for n < 4 && start+n < len(s) && s[start+n]&0xC0 == 0x80 {
			n++
		}
	}
	p.pos += n
	if c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' {
		end := p.pos
		if end < len(s) && s[end] >= 'a' && s[end] <= 'z' {
			end++
		}
		if e, ok := molecule.ElementBySymbol(s[start:end]); ok {
			p.pos = end
			p.errorf(start, end, "found %s outside brackets; only B C N O P S F Cl Br I and aromatic b c n o p s may be written bare; write [%s]", e.Symbol(), e.Symbol())
			return
		}
		if start > 0 && c >= 'a' && s[start-1] >= 'A' && s[start-1] <= 'Z' {
			if e, ok := molecule.ElementBySymbol(s[start-1 : start+1]); ok {
				p.errorf(start-1, p.pos, "found %s outside brackets; only B C N O P S F Cl Br I and aromatic b c n o p s may be written bare; write [%s]", e.Symbol(), e.Symbol())
				return
			}
		}
		if c == 'H' {
			p.errorf(start, p.pos, "found 'H' outside brackets; write hydrogens inside the bracket of their atom, as [CH3], or as the atom [H]")
			return
		}
		p.errorf(start, p.pos, "found '%s', which is not an element symbol; expected an atom", s[start:p.pos])
		return
	}
	if c == ']' {
		p.errorf(start, p.pos, "found ']' with no '[' open; remove it or add the missing '['")
		return
	}
	p.errorf(start, p.pos, "found %q; expected an atom, a bond symbol (- = # $ : / \\), a branch, a ring-closure digit or '.'", s[start:p.pos])
}

func isOrganicStart(c byte) bool {
	switch c {
	case 'B', 'C', 'N', 'O', 'P', 'S', 'F', 'I', 'b', 'c', 'n', 'o', 'p', 's':
		return true
	}
	return false
}

// ringLabel reads a digit or %nn and returns the label.
func (p *parser) ringLabel() (int, bool) {
	s := p.src
	start := p.pos
	if s[start] != '%' {
		p.pos++
		return int(s[start] - '0'), true
	}
	p.pos++
	if p.pos+1 < len(s) && isDigit(s[p.pos]) && isDigit(s[p.pos+1]) {
		p.pos += 2
		return int(s[start+1]-'0')*10 + int(s[start+2]-'0'), true
	}
	for p.pos < len(s) && p.pos < start+3 && isDigit(s[p.pos]) {
		p.pos++
	}
	p.errorf(start, p.pos, "found '%s'; expected '%%' followed by exactly two digits, as %%12", s[start:p.pos])
	return 0, false
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func (p *parser) addAtom(a molecule.Atom) int {
	if len(p.m.Atoms) >= MaxAtoms {
		p.errorf(a.Span.Start, a.Span.End, "more than %d atoms; the limit keeps reading bounded, stopped reading", MaxAtoms)
		p.stopped = true
		return -1
	}
	return p.m.AddAtom(a)
}

// atom reads an organic-subset atom, '*' or a bracket atom.
func (p *parser) atom() int {
	s := p.src
	start := p.pos
	c := s[start]
	if c == '[' {
		return p.bracketAtom()
	}
	a := molecule.Atom{}
	p.pos++
	switch c {
	case '*':
		a.Element = 0
	case 'B':
		a.Element = molecule.B
		if p.pos < len(s) && s[p.pos] == 'r' {
			a.Element = molecule.Br
			p.pos++
		}
	case 'C':
		a.Element = molecule.C
		if p.pos < len(s) && s[p.pos] == 'l' {
			a.Element = molecule.Cl
			p.pos++
		}
	case 'N':
		a.Element = molecule.N
	case 'O':
		a.Element = molecule.O
	case 'P':
		a.Element = molecule.P
	case 'S':
		a.Element = molecule.S
	case 'F':
		a.Element = molecule.F
	case 'I':
		a.Element = molecule.I
	case 'b', 'c', 'n', 'o', 'p', 's':
		a.Element, _ = molecule.ElementBySymbol(string(c - 'a' + 'A'))
		a.Aromatic = true
	}
	a.Span = molecule.Span{Start: start, End: p.pos}
	return p.addAtom(a)
}

// bracketAtom reads [isotope symbol chirality hcount charge class].
func (p *parser) bracketAtom() int {
	s := p.src
	start := p.pos
	p.pos++ // '['
	a := molecule.Atom{Bracket: true}
	bad := false
	fail := func(format string, args ...any) {
		if !bad {
			p.errorf(p.pos, min(p.pos+1, len(s)), format, args...)
		}
		bad = true
	}
	// isotope
	n := 0
	for p.pos < len(s) && isDigit(s[p.pos]) {
		if n < 4 {
			a.Isotope = a.Isotope*10 + int(s[p.pos]-'0')
		}
		n++
		p.pos++
	}
	if n > 3 {
		p.errorf(start+1, p.pos, "isotope with %d digits; expected a mass number of at most 3 digits", n)
		a.Isotope = 0
	}
	// element
	if p.pos >= len(s) {
		fail("SMILES ends inside a bracket atom; expected an element symbol and ']'")
	} else {
		c := s[p.pos]
		switch {
		case c == '*':
			p.pos++
		case c >= 'A' && c <= 'Z':
			if p.pos+1 < len(s) && s[p.pos+1] >= 'a' && s[p.pos+1] <= 'z' {
				if e, ok := molecule.ElementBySymbol(s[p.pos : p.pos+2]); ok {
					a.Element = e
					p.pos += 2
					break
				}
			}
			if e, ok := molecule.ElementBySymbol(s[p.pos : p.pos+1]); ok {
				a.Element = e
				p.pos++
			} else {
				fail("found '%c', which is not an element symbol; expected an element such as C, N or Fe", c)
			}
		case c >= 'a' && c <= 'z':
			two := ""
			if p.pos+1 < len(s) {
				two = s[p.pos : p.pos+2]
			}
			switch {
			case two == "se" || two == "as" || two == "te":
				a.Element, _ = molecule.ElementBySymbol(string(two[0]-'a'+'A') + two[1:])
				p.pos += 2
			case c == 'b' || c == 'c' || c == 'n' || c == 'o' || c == 'p' || c == 's':
				a.Element, _ = molecule.ElementBySymbol(string(c - 'a' + 'A'))
				p.pos++
			default:
				fail("found '%c'; only b c n o p s se as te may be written in aromatic (lower-case) form", c)
			}
			a.Aromatic = true
		default:
			fail("found %q; expected an element symbol after '['", string(c))
		}
	}
	// chirality
	var mark *chiralMark
	if !bad && p.pos < len(s) && s[p.pos] == '@' {
		cs := p.pos
		w := molecule.Anticlockwise
		p.pos++
		if p.pos < len(s) && s[p.pos] == '@' {
			w = molecule.Clockwise
			p.pos++
			if p.pos < len(s) && s[p.pos] >= 'A' && s[p.pos] <= 'Z' && s[p.pos] != 'H' {
				e := p.pos + 1
				for e < len(s) && (s[e] >= 'A' && s[e] <= 'Z' || isDigit(s[e])) {
					e++
				}
				p.errorf(cs, e, "found '%s'; a chirality class follows a single '@', as @TH1, and only @TH1, @TH2, @AL1 and @AL2 are read", s[cs:e])
				p.pos = e
				w = 0
			}
		} else if p.pos+1 < len(s) && s[p.pos] >= 'A' && s[p.pos] <= 'Z' && s[p.pos+1] >= 'A' && s[p.pos+1] <= 'Z' {
			class := s[p.pos : p.pos+2]
			p.pos += 2
			num := 0
			ds := p.pos
			for p.pos < len(s) && isDigit(s[p.pos]) && p.pos-ds < 3 {
				num = num*10 + int(s[p.pos]-'0')
				p.pos++
			}
			switch {
			case (class == "TH" || class == "AL") && (num == 1 || num == 2):
				if num == 2 {
					w = molecule.Clockwise
				}
			case class == "TH" || class == "AL":
				p.errorf(cs, p.pos, "found @%s%s; expected @%s1 or @%s2", class, s[ds:p.pos], class, class)
			case class == "SP" || class == "TB" || class == "OH":
				p.errorf(cs, p.pos, "found @%s%s: square-planar, trigonal-bipyramidal and octahedral stereo are not read; only tetrahedral (@, @@, @TH1, @TH2) and allene (@AL1, @AL2) stereo are; drop the mark", class, s[ds:p.pos])
				w = 0
			default:
				p.errorf(cs, p.pos, "found unknown chirality class @%s; expected @, @@, @TH1, @TH2, @AL1 or @AL2", class)
				w = 0
			}
		}
		if w != 0 {
			mark = &chiralMark{winding: w, span: molecule.Span{Start: cs, End: p.pos}}
		}
	}
	// hydrogen count
	if !bad && p.pos < len(s) && s[p.pos] == 'H' {
		p.pos++
		a.ImplicitH = 1
		if p.pos < len(s) && isDigit(s[p.pos]) {
			a.ImplicitH = int(s[p.pos] - '0')
			p.pos++
			if p.pos < len(s) && isDigit(s[p.pos]) {
				fail("hydrogen count with two digits; expected at most H9")
			}
		}
	}
	// charge
	if !bad && p.pos < len(s) && (s[p.pos] == '+' || s[p.pos] == '-') {
		cs := p.pos
		sign := 1
		if s[p.pos] == '-' {
			sign = -1
		}
		sc := s[p.pos]
		p.pos++
		q := 1
		if p.pos < len(s) && isDigit(s[p.pos]) {
			q = 0
			for p.pos < len(s) && isDigit(s[p.pos]) && p.pos-cs <= 2 {
				q = q*10 + int(s[p.pos]-'0')
				p.pos++
			}
		} else {
			for p.pos < len(s) && s[p.pos] == sc {
				q++
				p.pos++
			}
		}
		if q > 15 {
			p.errorf(cs, p.pos, "charge %c%d is beyond the limit of 15; expected a charge from -15 to +15", sc, q)
			q = 0
		}
		a.Charge = sign * q
	}
	// atom class
	if !bad && p.pos < len(s) && s[p.pos] == ':' {
		cs := p.pos
		p.pos++
		n := 0
		for p.pos < len(s) && isDigit(s[p.pos]) {
			if n < 9 {
				a.Class = a.Class*10 + int(s[p.pos]-'0')
			}
			n++
			p.pos++
		}
		if n == 0 {
			fail("found ':' with no number after it in a bracket atom; expected an atom class such as :1")
		} else if n > 9 {
			p.errorf(cs, p.pos, "atom class with %d digits; expected at most 9", n)
			a.Class = 0
		}
	}
	if !bad && (p.pos >= len(s) || s[p.pos] != ']') {
		if p.pos >= len(s) {
			p.errorf(start, p.pos, "bracket atom is never closed; expected ']'")
			bad = true
		} else {
			fail("found %q inside a bracket atom; expected ']' (order: isotope, symbol, chirality, H count, charge, class)", string(s[p.pos]))
		}
	}
	// Recover at the closing bracket, or just before the next '[' or end.
	if bad {
		for p.pos < len(s) && s[p.pos] != ']' && s[p.pos] != '[' {
			p.pos++
		}
		if p.pos < len(s) && s[p.pos] == ']' {
			p.pos++
		}
		return -1
	}
	p.pos++ // ']'
	a.Span = molecule.Span{Start: start, End: p.pos}
	i := p.addAtom(a)
	if i >= 0 && mark != nil {
		mark.atom = i
		p.chiral = append(p.chiral, *mark)
	}
	return i
}

// orderOf gives the Kekulé order of a bond symbol and whether it is
// aromatic; implicit bonds between aromatic atoms are aromatic.
func (p *parser) orderOf(sym byte, a, b int) (int, bool) {
	arom := p.m.Atoms[a].Aromatic && p.m.Atoms[b].Aromatic
	switch sym {
	case '=':
		return 2, false
	case '#':
		return 3, false
	case '$':
		return 4, false
	case ':':
		return 1, true
	case '-':
		return 1, false
	}
	return 1, arom
}

func dirOf(sym byte) int8 {
	switch sym {
	case '/':
		return 1
	case '\\':
		return -1
	}
	return 0
}

func (p *parser) chainBond(a, b int, sym byte, span molecule.Span) {
	order, arom := p.orderOf(sym, a, b)
	if sym == 0 {
		span = molecule.Span{Start: p.m.Atoms[b].Span.Start, End: p.m.Atoms[b].Span.Start}
	}
	p.m.AddBond(molecule.Bond{A: a, B: b, Order: order, Aromatic: arom, Span: span})
	// Keys are twice the byte offset, so an implicit bond can sit between
	// the preceding character and the atom it leads to.
	key := 2 * span.Start
	if sym == 0 {
		key--
	}
	p.notes = append(p.notes, bondNote{keyA: key, keyB: key, dir: dirOf(sym)})
}

// ring opens or closes ring-closure label at atom.
func (p *parser) ring(atom, label int, sym byte, sspan, digit molecule.Span) {
	r := &p.rings[label]
	key := 2 * digit.Start
	if sym != 0 {
		key = 2 * sspan.Start
	}
	if r.atom < 0 {
		*r = ringOpen{atom: atom, sym: sym, sspan: sspan, digit: digit}
		return
	}
	opener := r.atom
	rs, rsspan, rdigit := r.sym, r.sspan, r.digit
	r.atom = -1
	span := digit
	if sym != 0 {
		span.Start = sspan.Start
	}
	if opener == atom {
		p.errorf(rdigit.Start, digit.End, "ring closure %s opens and closes on the same atom; expected it to close on another atom", ringName(label))
		return
	}
	if p.m.BondBetween(opener, atom) >= 0 {
		p.errorf(span.Start, span.End, "ring closure %s joins two atoms that are already bonded; remove it", ringName(label))
		return
	}
	okey := 2 * rdigit.Start
	if rs != 0 {
		okey = 2 * rsspan.Start
	}
	d1, d2 := dirOf(rs), dirOf(sym)
	dir := d1
	if d2 != 0 {
		dir = -d2 // "atom sym opener" read from the opener's side
		if d1 != 0 && d1 != dir {
			p.errorf(rsspan.Start, span.End, "ring closure %s has '%c' at both ends, which place the neighbours on opposite sides; write '%c' at the closing end or mark only one end", ringName(label), sym, flip(sym))
			dir = 0
		}
	}
	use := sym
	if d1 != 0 || d2 != 0 {
		use = '/'
	} else if rs != 0 && sym != 0 && rs != sym && !(isSingle(rs) && isSingle(sym)) {
		p.errorf(rsspan.Start, span.End, "ring closure %s is written '%c' at one end and '%c' at the other; expected the same bond symbol at both ends, or one symbol only", ringName(label), rs, sym)
	} else if sym == 0 {
		use = rs
	}
	order, arom := p.orderOf(use, opener, atom)
	if use == '/' {
		order, arom = 1, false
		if p.m.Atoms[opener].Aromatic && p.m.Atoms[atom].Aromatic {
			arom = true
		}
	}
	p.m.AddBond(molecule.Bond{A: opener, B: atom, Order: order, Aromatic: arom, Span: span})
	p.notes = append(p.notes, bondNote{keyA: okey, keyB: key, dir: dir})
}

func isSingle(c byte) bool { return c == '-' || c == '/' || c == '\\' }

func flip(c byte) byte {
	if c == '/' {
		return '\\'
	}
	return '/'
}
