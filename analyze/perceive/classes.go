package perceive

import _ "embed"

//go:embed substrate_classes.tsv
var classTable string

// ClassEffect is a row of the substrate-class table: log10 contributions
// to the SN2 rate and to the ease of ionisation.
type ClassEffect struct {
	Key      string
	SN2, SN1 float64
	Source   string
}

var classEffects = func() map[string]ClassEffect {
	out := map[string]ClassEffect{}
	for _, r := range readTSV(classTable) {
		e := ClassEffect{Key: r["key"], Source: r["source"]}
		e.SN2, _ = num(r["sn2"])
		e.SN1, _ = num(r["sn1"])
		out[e.Key] = e
	}
	return out
}()

// baseKeys are the table keys of the base rows, by Degree ("base:" and
// the degree's name), made once rather than per look-up.
var baseKeys = [...]string{"base:methyl", "base:primary", "base:secondary", "base:tertiary"}

// ClassEffects returns the rows that apply to site s, base row first.
func ClassEffects(s Site) []ClassEffect {
	return classRows(nil, s)
}

// classRows appends the rows of ClassEffects to out; ClassRate gives it
// room on its stack, since it only sums them.
func classRows(out []ClassEffect, s Site) []ClassEffect {
	if !s.Flags.Has(Sp3) {
		return out
	}
	out = append(out, classEffects[baseKeys[s.Degree]])
	add := func(k string) { out = append(out, classEffects[k]) }
	f := s.Flags
	if f.Has(Neopentyl) {
		add("neopentyl")
	} else if f.Has(BetaBranched) {
		add("beta-branched")
	}
	aryl := 0
	switch {
	case f.Has(Benzylic):
		add("benzylic")
		aryl = 1
		if s.Degree == Tertiary {
			add("benzylic:tertiary")
		}
	case f.Has(Allylic):
		add("allylic")
	case f.Has(Propargylic):
		add("propargylic")
	}
	for range s.Aryls - aryl {
		add("extra-aryl")
	}
	if f.Has(AlphaCarbonyl) {
		add("alpha-carbonyl")
		if s.Degree == Tertiary {
			add("tertiary-alpha-carbonyl")
		}
	}
	if f.Has(AlphaHetero) {
		add("alpha-hetero")
	}
	if f.Has(SmallRing) {
		add("small-ring")
	}
	if f.Has(Bridgehead) {
		add("bridgehead")
	}
	if f.Has(BetaHetero) {
		add("beta-sulfur")
	}
	return out
}

// ClassRate sums the class effects of site s.
func ClassRate(s Site) (ClassEffect, bool) {
	var buf [16]ClassEffect
	rows := classRows(buf[:0], s)
	if len(rows) == 0 {
		return ClassEffect{}, false
	}
	sum := ClassEffect{Key: "sum"}
	for _, r := range rows {
		sum.SN2 += r.SN2
		sum.SN1 += r.SN1
	}
	return sum, true
}
