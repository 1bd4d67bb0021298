package reagents

import (
	"sort"
	"sync"
)

// Dictionary maps the names chemists write to reagents and solvents. It is
// immutable once built and safe for concurrent use. Builtin returns the
// embedded one; Load returns it extended by a lab's own names.
type Dictionary struct {
	reagents []*Reagent
	solvents []*Solvent
	exact    map[string]ref // normalised name, case kept
	folded   map[string]ref // normalised name, ASCII case folded
	names    []nameRec      // every name once, sorted, for Suggest and Names
	problems ErrorList      // problems in the built-in tables (a test insists on none)
}

// ref points at the entries one name stands for: a reagent, a solvent, or
// both (pyridine, water, MeOH are each a reagent and a solvent). Indexes
// are 1-based so that the zero ref means "nothing"; ambiguous marks a
// case-folded key shared by names that differ only in case.
type ref struct {
	r, s      int32
	ambiguous bool
}

type nameRec struct {
	text string // as written in the dictionary
	key  string // normalised and folded
	ref  ref
}

// Entry is what a name stands for. Reagent or Solvent (or both) is set.
type Entry struct {
	Reagent *Reagent
	Solvent *Solvent
}

// Name returns the display name: the reagent's, else the solvent's.
func (e Entry) Name() string {
	if e.Reagent != nil {
		return e.Reagent.Name()
	}
	if e.Solvent != nil {
		return e.Solvent.Name()
	}
	return ""
}

// IsZero reports whether e stands for nothing.
func (e Entry) IsZero() bool { return e.Reagent == nil && e.Solvent == nil }

var (
	builtinOnce sync.Once
	builtin     *Dictionary
)

// Builtin returns the dictionary of the embedded tables, parsed on first
// use (a few milliseconds; nothing runs at package initialisation).
func Builtin() *Dictionary {
	builtinOnce.Do(func() {
		bt := loadTables()
		builtin = build(bt.reagents, bt.solvents)
		builtin.problems = bt.errs
	})
	return builtin
}

// Problems returns the problems found in the built-in tables; it is empty
// in a correct build.
func (d *Dictionary) Problems() ErrorList { return d.problems }

// Lookup finds name in the built-in dictionary; see Dictionary.Lookup.
func Lookup(name string) (Entry, bool) { return Builtin().Lookup(name) }

// Suggest offers close built-in names; see Dictionary.Suggest.
func Suggest(name string, n int) []string { return Builtin().Suggest(name, n) }

// Reagents returns the reagents, built-in ones first, in table order.
func (d *Dictionary) Reagents() []*Reagent { return append([]*Reagent(nil), d.reagents...) }

// Solvents returns the solvents, built-in ones first, in table order.
func (d *Dictionary) Solvents() []*Solvent { return append([]*Solvent(nil), d.solvents...) }

// Lookup returns what name stands for. Spaces, hyphens, dashes, dots and
// apostrophes are ignored and subscript digits read as digits (see
// normalize); the spelling is first tried as written, then with ASCII case
// folded, unless two dictionary names differ only in case. It does not
// allocate.
func (d *Dictionary) Lookup(name string) (Entry, bool) {
	var buf [maxKey]byte
	k, ok := normalize(buf[:0], name, false)
	if !ok || len(k) == 0 {
		return Entry{}, false
	}
	if r, ok := d.exact[string(k)]; ok {
		return d.entry(r), true
	}
	k, _ = normalize(buf[:0], name, true)
	if r, ok := d.folded[string(k)]; ok && !r.ambiguous {
		return d.entry(r), true
	}
	return Entry{}, false
}

func (d *Dictionary) entry(r ref) Entry {
	var e Entry
	if r.r > 0 {
		e.Reagent = d.reagents[r.r-1]
	}
	if r.s > 0 {
		e.Solvent = d.solvents[r.s-1]
	}
	return e
}

// build indexes reagents and solvents by every name. When two entries of
// the same kind claim one name, the later one keeps it (a lab entry wins
// over a built-in one; Load reports real clashes before calling build).
func build(reagents []*Reagent, solvents []*Solvent) *Dictionary {
	n := 0
	for _, g := range reagents {
		n += len(g.Names)
	}
	for _, s := range solvents {
		n += len(s.Names)
	}
	d := &Dictionary{
		reagents: reagents,
		solvents: solvents,
		exact:    make(map[string]ref, n),
		folded:   make(map[string]ref, n),
		names:    make([]nameRec, 0, n),
	}
	at := make(map[string]int, n) // exact key → index in d.names
	add := func(name string, ri, si int32) {
		var buf [maxKey]byte
		k, ok := normalize(buf[:0], name, false)
		if !ok || len(k) == 0 {
			return
		}
		r := d.exact[string(k)]
		if ri > 0 {
			r.r = ri
		}
		if si > 0 {
			r.s = si
		}
		if i, seen := at[string(k)]; seen {
			d.names[i].ref = r
		} else {
			key := string(k)
			at[key] = len(d.names)
			d.names = append(d.names, nameRec{text: name, key: foldASCII(key), ref: r})
		}
		d.exact[string(k)] = r
	}
	for i, g := range reagents {
		for _, n := range g.Names {
			add(n, int32(i+1), 0)
		}
	}
	for i, s := range solvents {
		for _, n := range s.Names {
			add(n, 0, int32(i+1))
		}
	}
	// The folded index: a folded key reached from names that stand for
	// different things is ambiguous.
	for _, rec := range d.names {
		if old, ok := d.folded[rec.key]; ok && (old.r != rec.ref.r || old.s != rec.ref.s) {
			old.ambiguous = true
			d.folded[rec.key] = old
			continue
		}
		d.folded[rec.key] = rec.ref
	}
	sort.Slice(d.names, func(i, j int) bool {
		a, b := d.names[i], d.names[j]
		if a.key != b.key {
			return a.key < b.key
		}
		return a.text < b.text
	})
	return d
}

// foldASCII lower-cases the ASCII letters of a key (keys are already
// normalised, so this equals normalising with fold).
func foldASCII(s string) string {
	for i := 0; i < len(s); i++ {
		if 'A' <= s[i] && s[i] <= 'Z' {
			b := []byte(s)
			for j := i; j < len(b); j++ {
				if 'A' <= b[j] && b[j] <= 'Z' {
					b[j] += 'a' - 'A'
				}
			}
			return string(b)
		}
	}
	return s
}
