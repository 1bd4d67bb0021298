package outcome

import (
	"fmt"
	"strings"

	"walden/analyze/cip"
	"walden/analyze/molecule"
	"walden/analyze/smiles"
)

// Comparison says how a product the chemist wrote relates to the
// predicted one.
type Comparison struct {
	Same             bool   // identical, configuration included
	SameConstitution bool   // same atoms and bonds, configuration aside
	Explanation      string // one sentence for the diagnostic; "" when Same
}

// Compare compares a written product with a predicted one by canonical
// SMILES, and when only the configuration differs says where, in CIP
// terms (e.g. "written (R) at C2, predicted (S): SN2 inverts this
// carbon").
func Compare(written, predicted *molecule.Molecule) Comparison {
	if written == nil || predicted == nil {
		return Comparison{Explanation: "nothing to compare"}
	}
	w, p := smiles.Canonical(written), smiles.Canonical(predicted)
	if w == p {
		return Comparison{Same: true, SameConstitution: true}
	}
	if flat(written) != flat(predicted) {
		return Comparison{Explanation: fmt.Sprintf("the written product %s is not the predicted %s", w, p)}
	}
	c := Comparison{SameConstitution: true}
	lw, lp := letterList(written), letterList(predicted)
	switch {
	case lw != lp && lw != "" && lp != "":
		c.Explanation = fmt.Sprintf("same constitution but different configuration: written %s, predicted %s (%s)", lw, lp, p)
	case lw == "" && lp != "":
		c.Explanation = fmt.Sprintf("the written product has no configuration; predicted %s (%s)", lp, p)
	case lp == "" && lw != "":
		c.Explanation = fmt.Sprintf("the written product has configuration %s but the prediction is racemic or unassigned (%s)", lw, p)
	default:
		c.Explanation = fmt.Sprintf("same constitution but different stereo: predicted %s", p)
	}
	return c
}

// letterList lists the CIP labels of m as "(2R,3S)" with atoms numbered
// from 1 in m's order.
func letterList(m *molecule.Molecule) string {
	l := cip.Labeller{NodeLimit: cipNodeLimit}
	ds, _ := l.Label(m)
	var parts []string
	for _, d := range ds {
		if d.Atoms[1] < 0 {
			parts = append(parts, fmt.Sprintf("%d%s", d.Atoms[0]+1, d.Label))
		} else {
			parts = append(parts, fmt.Sprintf("%d-%d%s", d.Atoms[0]+1, d.Atoms[1]+1, d.Label))
		}
	}
	if len(parts) == 0 {
		return ""
	}
	return "(" + strings.Join(parts, ",") + ")"
}
