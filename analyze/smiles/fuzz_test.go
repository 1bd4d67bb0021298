package smiles

import (
	"testing"
)

func seedCorpus(f *testing.F) {
	for _, s := range handSet {
		f.Add(s)
	}
	for _, s := range suiteSMILESOrNone() {
		f.Add(s)
	}
	for _, s := range []string{"", "C(", "[C@@SP1]", "c1ccnc1", "C%99C%99", "F/C=C/F", "[nH]1cccc1", "C=[C@]=C", "[C@H]1CC1"} {
		f.Add(s)
	}
}

// FuzzParse: the reader never panics, and every error points inside the
// input.
func FuzzParse(f *testing.F) {
	seedCorpus(f)
	f.Fuzz(func(t *testing.T, s string) {
		m, err := Parse(s)
		if err != nil {
			list, ok := err.(ErrorList)
			if !ok || len(list) == 0 {
				t.Fatalf("error of type %T: %v", err, err)
			}
			for _, e := range list {
				if e.Span.Start < 0 || e.Span.End < e.Span.Start || e.Span.End > len(s) {
					t.Fatalf("span %v outside input of %d bytes: %s", e.Span, len(s), e.Msg)
				}
				if e.Msg == "" {
					t.Fatalf("empty message at %v", e.Span)
				}
			}
			return
		}
		if m == nil {
			t.Fatal("no molecule and no error")
		}
	})
}

// FuzzRoundTrip: for every string that reads without error, the
// canonical SMILES reads back without error to the same canonical SMILES,
// and the plain writer's output reads back to it too.
func FuzzRoundTrip(f *testing.F) {
	seedCorpus(f)
	f.Fuzz(func(t *testing.T, s string) {
		m, err := Parse(s)
		if err != nil {
			return
		}
		c1 := Canonical(m)
		m2, err := Parse(c1)
		if err != nil {
			t.Fatalf("canonical %q of %q does not read back: %v", c1, s, err)
		}
		if c2 := Canonical(m2); c2 != c1 {
			t.Fatalf("canonical of %q: %q, read back and canonicalised: %q", s, c1, c2)
		}
		w := Write(m)
		m3, err := Parse(w)
		if err != nil {
			t.Fatalf("written %q of %q does not read back: %v", w, s, err)
		}
		if c3 := Canonical(m3); c3 != c1 {
			t.Fatalf("canonical of %q: %q; of its written form %q: %q", s, c1, w, c3)
		}
	})
}
