package outcome

import (
	"bufio"
	_ "embed"
	"strconv"
	"strings"
)

//go:embed weights.tsv
var weightTable string

// Weight is one weight of the rules with its source.
type Weight struct {
	Name   string
	Value  float64
	Source string
}

var weights = func() map[string]Weight {
	out := map[string]Weight{}
	sc := bufio.NewScanner(strings.NewReader(weightTable))
	header := true
	for sc.Scan() {
		line := sc.Text()
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		if header {
			header = false
			continue
		}
		c := strings.Split(line, "\t")
		if len(c) < 3 {
			continue
		}
		v, err := strconv.ParseFloat(c[1], 64)
		if err != nil {
			continue
		}
		out[c[0]] = Weight{c[0], v, c[2]}
	}
	return out
}()

// w returns a weight; an unknown name is a programming error caught by
// the package tests (every name used is listed in TestWeightsExist).
func w(name string) float64 { return weights[name].Value }

// Weights lists the rule weights.
func Weights() map[string]Weight { return weights }
