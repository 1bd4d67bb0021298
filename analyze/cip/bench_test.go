package cip

import (
	"errors"
	"os"
	"strings"
	"testing"

	"walden/analyze/molecule"
	"walden/analyze/smiles"
)

func generatedMolecules(tb testing.TB, n int) []*molecule.Molecule {
	gen := newStereoGenerator(99)
	var ms []*molecule.Molecule
	for len(ms) < n {
		m, err := smiles.Parse(gen.next())
		if err == nil {
			ms = append(ms, m)
		}
	}
	return ms
}

// BenchmarkLabelGenerated labels small generated stereo molecules (the
// kind the differential test uses), reusing one Labeller.
func BenchmarkLabelGenerated(b *testing.B) {
	ms := generatedMolecules(b, 1000)
	var l Labeller
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := l.Label(ms[i%len(ms)]); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.N)/b.Elapsed().Seconds(), "molecules/s")
}

// BenchmarkParseLabelGenerated reads and labels the same molecules.
func BenchmarkParseLabelGenerated(b *testing.B) {
	gen := newStereoGenerator(99)
	var ss []string
	for len(ss) < 1000 {
		s := gen.next()
		if _, err := smiles.Parse(s); err == nil {
			ss = append(ss, s)
		}
	}
	var l Labeller
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		m, _ := smiles.Parse(ss[i%len(ss)])
		if _, err := l.Label(m); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.N)/b.Elapsed().Seconds(), "molecules/s")
}

// BenchmarkLabelSuite labels the 150 entries of the CIP validation suite
// (Hanson et al. 2018), which include the hard rule 4 to 6 cases.
func BenchmarkLabelSuite(b *testing.B) {
	var ms []*molecule.Molecule
	for _, e := range readSuite(b) {
		m, err := smiles.Parse(e.smiles)
		if err != nil {
			b.Fatal(err)
		}
		ms = append(ms, m)
	}
	var l Labeller
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := l.Label(ms[i%len(ms)]); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(b.N)/b.Elapsed().Seconds(), "molecules/s")
}

// FuzzLabel feeds whatever smiles.Parse accepts to the labeller: it must
// never panic, and stop at its node budget with a *BudgetError.
func FuzzLabel(f *testing.F) {
	if b, err := os.ReadFile(suitePath); err == nil {
		for _, line := range strings.Split(string(b), "\n") {
			if s, _, ok := strings.Cut(line, "\t"); ok {
				f.Add(s)
			}
		}
	}
	for _, s := range []string{"C[C@H](O)CC", "F/C=C/F", "NC(=[C@]=C(C)O)Br", "C[S@](=O)c1ccccc1", "[C@H]1(F)CC[C@H](F)CC1"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		m, err := smiles.Parse(s)
		if err != nil || m == nil {
			return
		}
		l := Labeller{NodeLimit: 20000}
		ds, err := l.Label(m)
		var be *BudgetError
		if err != nil && !errors.As(err, &be) {
			t.Fatalf("%q: unexpected error %v", s, err)
		}
		for _, d := range ds {
			if d.Atoms[0] < 0 || d.Atoms[0] >= len(m.Atoms) || d.Atoms[1] >= len(m.Atoms) || d.Label == None {
				t.Fatalf("%q: bad descriptor %+v", s, d)
			}
		}
		_ = Undecideds(m)
	})
}

// BenchmarkLabelCyclohexane labels 1,4-disubstituted cyclohexanes, the
// costliest kind in the `walden stereo --file` benchmark: both ring
// branches are constitutionally identical, so every rule explores the
// whole ring and the other centre needs an auxiliary descriptor.
func BenchmarkLabelCyclohexane(b *testing.B) {
	var ms []*molecule.Molecule
	for _, s := range []string{
		"[C@H]1(C=C)CC[C@H](c2ccccc2)CC1", "[C@@H]1(N)CC[C@@H](CC(C)C)CC1",
		"[C@H]1(Cl)CC[C@@H](C(=O)O)CC1", "[C@@H]1(OC)CC[C@H](C#N)CC1",
	} {
		m, err := smiles.Parse(s)
		if err != nil {
			b.Fatal(err)
		}
		ms = append(ms, m)
	}
	var l Labeller
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		l.Label(ms[i%len(ms)])
	}
}
