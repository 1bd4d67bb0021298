package caution

import "strings"

// nameSet is a list of names that a substance's text or names are
// matched against, ignoring case and surrounding space. Every step of a
// page asks several rules about each of its substances, so the list is
// also kept in ASCII lower case: a plain-ASCII name is then one map
// look-up (no allocation: the lowered name lives in a stack buffer)
// instead of a case-folding comparison with every entry, and most names
// are turned away by their length alone. Every set also has a bit in
// nameBits, so that setsOf answers for all sets with one look-up.
type nameSet struct {
	want  []string            // as written
	lower map[string]struct{} // want in ASCII lower case; nil when an entry is not plain ASCII
	lens  uint64              // bit k set when an entry is k bytes long (k < 64)
	bit   uint32              // this set's bit in nameBits and in setsOf's answers
}

// nameSets are the sets made, in order; the set at index k has bit 1<<k.
var nameSets []*nameSet

// nameBits maps each name of a set, in ASCII lower case, to the bits of
// the sets that hold it.
var nameBits = map[string]uint32{}

// nameSetOf makes the set of names want.
func nameSetOf(want ...string) *nameSet {
	if len(nameSets) == 32 {
		panic("caution: more name sets than bits in a uint32")
	}
	ns := &nameSet{want: want, lower: map[string]struct{}{}, bit: 1 << len(nameSets)}
	nameSets = append(nameSets, ns)
	for _, w := range want {
		if !isASCII(w) {
			ns.lower = nil
			break
		}
		ns.lower[strings.ToLower(w)] = struct{}{}
		if len(w) < 64 {
			ns.lens |= 1 << len(w)
		}
	}
	for k := range ns.lower {
		nameBits[k] |= ns.bit
	}
	return ns
}

// setsOf returns the bits of the sets that n belongs to: for every set
// ns, what ns.has(n) says. A plain-ASCII n takes one look-up in nameBits.
func setsOf(n string) uint32 {
	n = strings.TrimSpace(n)
	var bits uint32
	ascii := false
	if len(n) <= lowerRoom {
		var buf [lowerRoom]byte
		var k int
		if k, ascii = asciiLower(&buf, n); ascii {
			bits = nameBits[string(buf[:k])]
		}
	}
	for _, ns := range nameSets {
		if ascii && ns.lower != nil {
			continue // nameBits answered for it
		}
		if ns.has(n) {
			bits |= ns.bit
		}
	}
	return bits
}

// lowerRoom is the longest name lowered in a stack buffer.
const lowerRoom = 64

// has reports whether n, trimmed, equals one of the names as
// strings.EqualFold judges. For two plain-ASCII strings that is equality
// after ASCII lower-casing; anything else takes the comparison itself.
func (ns *nameSet) has(n string) bool {
	n = strings.TrimSpace(n)
	if ns.lower != nil && len(n) < 64 && ns.lens&(1<<len(n)) == 0 && isASCII(n) {
		return false // ASCII strings of different lengths never fold equal
	}
	if ns.lower != nil && len(n) <= lowerRoom {
		var buf [lowerRoom]byte
		if k, ok := asciiLower(&buf, n); ok {
			_, ok := ns.lower[string(buf[:k])]
			return ok
		}
	}
	for _, w := range ns.want {
		if strings.EqualFold(n, w) {
			return true
		}
	}
	return false
}

// asciiLower writes n in ASCII lower case to buf and reports its length,
// or false when n is not plain ASCII.
func asciiLower(buf *[lowerRoom]byte, n string) (int, bool) {
	for i := 0; i < len(n); i++ {
		c := n[i]
		if c >= 0x80 {
			return 0, false
		}
		if 'A' <= c && c <= 'Z' {
			c += 'a' - 'A'
		}
		buf[i] = c
	}
	return len(n), true
}

func isASCII(s string) bool {
	for i := 0; i < len(s); i++ {
		if s[i] >= 0x80 {
			return false
		}
	}
	return true
}
