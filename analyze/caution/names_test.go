package caution

import (
	"strings"
	"testing"
)

// TestNameSetMatchesEqualFold checks the look-up against the comparison
// it stands for, on names where lower-casing and case folding could part
// ways (the Kelvin sign and the long s fold to ASCII letters).
func TestNameSetMatchesEqualFold(t *testing.T) {
	sets := append(nameSets[:len(nameSets):len(nameSets)], &nameSet{want: []string{"KH", "Straße", "sodium azide"}}) // the last unregistered, with no bit
	inputs := []string{"nan3", " NaN3 ", "NAN3\t", "\u212aH", "kh", "KH", "sodium azide", "\u017fodium azide", "SODIUM AZIDE",
		"dcm", "DcM ", "N,N-Dimethylformamide", "straße", "STRASSE", "", " ", strings.Repeat("a", 70), "dmso\u00a0", "methylene chloride"}
	for _, ns := range sets {
		for _, in := range inputs {
			want := false
			for _, w := range ns.want {
				if strings.EqualFold(strings.TrimSpace(in), w) {
					want = true
				}
			}
			if got := ns.has(in); got != want {
				t.Errorf("%v.has(%q) = %v, EqualFold says %v", ns.want, in, got, want)
			}
			if ns.bit != 0 { // a registered set: setsOf must agree
				if got := setsOf(in)&ns.bit != 0; got != want {
					t.Errorf("setsOf(%q) & bit of %v = %v, EqualFold says %v", in, ns.want, got, want)
				}
			}
		}
	}
}
