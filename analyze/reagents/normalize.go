package reagents

import "unicode/utf8"

// maxKey bounds a normalised name, so that Lookup can work in a buffer on
// the stack; no name in the dictionary comes near it.
const maxKey = 96

// normalize appends to dst the lookup key of name:
//
//   - spaces, hyphens and dashes of every kind (‐ ‑ ‒ – — −), underscores,
//     full stops, middle dots and apostrophes are dropped, so "t-BuOK" and
//     "tBuOK", "BF3·OEt2" and "BF3.OEt2", "Hünig's base" and "Hünigs base"
//     meet;
//   - subscript and superscript digits become digits (NaN₃ → NaN3);
//   - with fold, ASCII letters are lower-cased. Case is folded only at the
//     second try of a lookup (see Dictionary.Lookup), because formula case
//     can carry meaning (CO is not Co).
//
// It reports false when the key would exceed maxKey bytes.
func normalize(dst []byte, name string, fold bool) ([]byte, bool) {
	for i := 0; i < len(name); {
		c := name[i]
		if c < utf8.RuneSelf {
			i++
			switch {
			case c == ' ' || c == '\t' || c == '-' || c == '_' || c == '.' || c == '\'':
				continue
			case fold && 'A' <= c && c <= 'Z':
				c += 'a' - 'A'
			}
			if len(dst) >= maxKey {
				return dst, false
			}
			dst = append(dst, c)
			continue
		}
		r, size := utf8.DecodeRuneInString(name[i:])
		i += size
		switch {
		case r == '\u2010' || r == '\u2011' || r == '\u2012' || r == '\u2013' || r == '\u2014' || r == '\u2212' ||
			r == '\u00b7' || r == '\u2022' || r == '\u22c5' || r == '\u2019' || r == '\u2018' || r == '\u02bc' ||
			r == '\u00a0' || r == '\u207b' || r == '\u208b':
			continue
		case '\u2080' <= r && r <= '\u2089':
			r = '0' + (r - '\u2080')
		case r == '\u2070':
			r = '0'
		case r == '\u00b9':
			r = '1'
		case r == '\u00b2' || r == '\u00b3':
			r = '2' + (r - '\u00b2')
		case '\u2074' <= r && r <= '\u2079':
			r = '4' + (r - '\u2074')
		case r == '\u207a' || r == '\u208a':
			r = '+'
		}
		if len(dst)+utf8.RuneLen(r) > maxKey {
			return dst, false
		}
		dst = utf8.AppendRune(dst, r)
	}
	return dst, true
}

func utf8Valid(s string) bool { return utf8.ValidString(s) }
