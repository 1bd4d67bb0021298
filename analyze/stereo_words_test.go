package analyze

import (
	"strings"
	"testing"
)

// TestStereoWordsThroughTheEngine runs one step for each way the
// configuration at the reacting carbon can end, and checks that the
// words are the same in the report (Describe, used by walden predict)
// and in the hover, and never say of a lost centre that its letter stays.
// The CIP letters of every substrate and product below were checked with
// RDKit 2022.09 (rdCIPLabeler.AssignCIPLabels).
func TestStereoWordsThroughTheEngine(t *testing.T) {
	tests := []struct {
		line    string
		outcome string
		words   string
		source  string
	}{
		// SN2 inverts; (S)-2-bromobutane gives (R)-2-azidobutane.
		{"C[C@H](Br)CC + NaN3, DMF", "inverted", "S → R, inverted (the CIP letter changes)",
			"Walden inversion in SN2: Hughes, Ingold et al. J. Chem. Soc. 1935, 1525 (from memory); letters RDKit"},
		// SN2 inverts but cyanide ranks below OMe where bromide ranked
		// above it, so the letter stays S (RDKit: C[C@H](Br)OC is S,
		// C[C@@H](C#N)OC is S).
		{"C[C@H](Br)OC + NaCN, DMSO", "inverted", "S → S, inverted (the CIP letter stays)",
			"inversion at carbon does not imply a change of CIP letter (IUPAC 2013 P-92.1, common practice); letters RDKit"},
		// Sulfonylation does not touch the C–O bond: configuration kept.
		{"C[C@H](O)CCc1ccccc1 + TsCl + pyridine, DCM, 0 °C", "retained", "S → S, retained (the CIP letter stays)",
			"Phillips, J. Chem. Soc. 1923, 123, 44; Tipson, J. Org. Chem. 1944, 9, 235 (from memory); letters RDKit"},
		// A bulky base eliminates: the carbon ends in the alkene.
		{"C[C@H](Br)CC + KOtBu, tBuOH", "lost", "S → –, lost (the carbon becomes part of the double bond)",
			"Brown, Moritani, Okamoto J. Am. Chem. Soc. 1956, 78, 2193: tert-butoxide gives E2 (from memory)"},
		// A tertiary benzylic bromide solvolyses through the planar cation.
		{"CC[C@@](C)(Br)c1ccccc1 + H2O, EtOH, reflux", "lost", "R → –, lost (racemised through the planar carbocation)",
			"SN1 racemisation: Hughes & Ingold J. Chem. Soc. 1935, 244 (common practice)"},
		// Iodide on a secondary iodide exchanges back and forth: racemic.
		{"C[C@H](I)CCCCCC + NaI, acetone", "lost", "S → –, lost (racemised: the halide displaces the same halide again and again)",
			"Hughes, Juliusburger, Masterman, Topley, Weiss J. Chem. Soc. 1935, 1525: 2-iodooctane racemises twice as fast as it exchanges (from memory)"},
	}
	for _, tc := range tests {
		t.Run(tc.line, func(t *testing.T) {
			src := Source{Name: "s.steps", Kind: PlanFile, Text: []byte(tc.line + "\n")}
			rep := analyse(t, NewEngine(Config{}), src)[0]
			if len(rep.Steps) != 1 || rep.Steps[0].Prediction == nil {
				t.Fatalf("no prediction for %q", tc.line)
			}
			p := rep.Steps[0].Prediction
			if len(p.Stereo) != 1 {
				t.Fatalf("stereo %+v, want one centre", p.Stereo)
			}
			c := p.Stereo[0]
			if c.Outcome != tc.outcome { // source: tc.source
				t.Errorf("outcome %q, want %q (%s)", c.Outcome, tc.outcome, tc.source)
			}
			if got := c.Describe(); got != tc.words {
				t.Errorf("Describe() = %q, want %q", got, tc.words)
			}
			if c.Outcome == "lost" && c.LetterChanged {
				t.Errorf("a lost centre reports a letter change: %+v", c)
			}
			md, _, ok := rep.Hover(rep.Steps[0].Span.Start)
			if !ok || !strings.Contains(md, tc.words) {
				t.Errorf("hover does not say %q:\n%s", tc.words, md)
			}
			if c.Outcome == "lost" && strings.Contains(md, "letter stays") {
				t.Errorf("hover says the letter stays at a lost centre:\n%s", md)
			}
		})
	}
}

// TestStereoWordsEveryPath covers the wordings no short step reaches
// reliably: a retention that changes the letter (the groups' priorities
// change while the geometry stays) and centres with a letter missing.
// These are statements about the words, not chemistry.
func TestStereoWordsEveryPath(t *testing.T) {
	tests := []struct {
		c    StereoChange
		want string
	}{
		{StereoChange{Before: "S", After: "R", Outcome: "retained", LetterChanged: true}, "S → R, retained (the CIP letter changes)"},
		{StereoChange{Before: "R", After: "R", Outcome: "retained"}, "R → R, retained (the CIP letter stays)"},
		{StereoChange{Before: "R", After: "S", Outcome: "inverted", LetterChanged: true}, "R → S, inverted (the CIP letter changes)"},
		{StereoChange{Before: "S", Outcome: "inverted"}, "S → –, inverted (no CIP letter after the step: the carbon may no longer be a stereocentre)"},
		{StereoChange{After: "R", Outcome: "inverted"}, "– → R, inverted (no CIP letter before the step to compare)"},
		{StereoChange{Outcome: "retained"}, "– → –, retained (no CIP letter before or after to compare)"},
		{StereoChange{Before: "S", Outcome: "lost", Why: "the carbon becomes part of the double bond"}, "S → –, lost (the carbon becomes part of the double bond)"},
		{StereoChange{Before: "S", Outcome: "lost"}, "S → –, lost (the configuration is not kept)"},
	}
	for _, tc := range tests {
		if got := tc.c.Describe(); got != tc.want {
			t.Errorf("%+v: %q, want %q", tc.c, got, tc.want)
		}
	}
}
