package analyze

import (
	"fmt"

	"walden/analyze/molecule"
)

// compareProducts checks the products the chemist wrote after '->'
// against the prediction, stereo included: a different constitution is a
// product-mismatch, the same constitution with another configuration a
// product-stereo finding. Both offer to replace the written product by the
// predicted one.
func compareProducts(in *stepInput, pred *prediction) []Diagnostic {
	if len(in.products) == 0 || pred.notAnalysed != "" || len(pred.products) == 0 {
		return nil
	}
	w := in.products[0]
	if w.mol == nil {
		return nil // unreadable: already reported
	}
	major := pred.products[0]
	got, want := canonical(w.mol), major.smiles
	if got == "" || want == "" || got == want {
		return nil
	}
	fix := []Fix{{Title: "Replace with the predicted product " + want, Edits: []Edit{{Span: w.span, NewText: want}}, Preferred: true}}
	for _, p := range pred.products[1:] {
		if p.smiles == got {
			return []Diagnostic{{Code: CodeProductMismatch, Severity: Warning, Span: w.span, Fixes: fix,
				Message: fmt.Sprintf("the product written is predicted only as a minor product (%s, %s); the major product is %s (%s)", p.mechanism, percent(p.fraction), want, major.mechanism)}}
		}
	}
	if flat(w.mol) == flat(major.mol) {
		msg := fmt.Sprintf("the product written has the predicted constitution but not the predicted configuration; predicted: %s", want)
		if c, ok := reactingChange(pred); ok {
			msg += fmt.Sprintf(" (%s at the reacting carbon, %s → %s)", c.outcome, orDash(c.before), orDash(c.after))
		}
		return []Diagnostic{{Code: CodeProductStereo, Severity: Warning, Span: w.span, Message: msg, Fixes: fix}}
	}
	return []Diagnostic{{Code: CodeProductMismatch, Severity: Warning, Span: w.span, Fixes: fix,
		Message: fmt.Sprintf("the product written is not the predicted major product %s (%s)", want, pred.mechanism)}}
}

// flat is the canonical SMILES of m without any stereo.
func flat(m *molecule.Molecule) string {
	if m == nil {
		return ""
	}
	c := m.Clone()
	c.Tetrahedral, c.CisTrans, c.Axial = nil, nil, nil
	return canonical(c)
}
