package cip

import (
	_ "embed"
	"strconv"
	"strings"

	"walden/analyze/molecule"
)

//go:embed masses.tsv
var massesTSV string

//go:embed isotopes.tsv
var isotopesTSV string

// nuclideMass holds the atomic mass of single nuclides, keyed by atomic
// number and mass number.
var nuclideMass = func() map[[2]int]float64 {
	out := make(map[[2]int]float64)
	for i, line := range strings.Split(isotopesTSV, "\n") {
		if line == "" || line[0] == '#' || strings.HasPrefix(line, "symbol\t") {
			continue
		}
		f := strings.Split(line, "\t")
		if len(f) != 4 {
			panic("cip: isotopes.tsv line " + strconv.Itoa(i+1) + ": want 4 columns")
		}
		e, ok := molecule.ElementBySymbol(f[0])
		a, err1 := strconv.Atoi(f[1])
		v, err2 := strconv.ParseFloat(f[2], 64)
		if !ok || err1 != nil || err2 != nil {
			panic("cip: isotopes.tsv line " + strconv.Itoa(i+1) + ": bad row")
		}
		out[[2]int{int(e), a}] = v
	}
	return out
}()

// standardWeight holds, by atomic number, the standard atomic weight of
// an element of natural isotopic composition; 0 where none is tabulated.
var standardWeight = func() [molecule.MaxElement + 1]float64 {
	var w [molecule.MaxElement + 1]float64
	for i, line := range strings.Split(massesTSV, "\n") {
		if line == "" || line[0] == '#' || strings.HasPrefix(line, "symbol\t") {
			continue
		}
		f := strings.Split(line, "\t")
		if len(f) != 3 {
			panic("cip: masses.tsv line " + strconv.Itoa(i+1) + ": want 3 columns")
		}
		e, ok := molecule.ElementBySymbol(f[0])
		if !ok {
			panic("cip: masses.tsv line " + strconv.Itoa(i+1) + ": unknown element " + f[0])
		}
		v, err := strconv.ParseFloat(f[1], 64)
		if err != nil {
			panic("cip: masses.tsv line " + strconv.Itoa(i+1) + ": " + err.Error())
		}
		w[e] = v
	}
	return w
}()
