package analyze

import "fmt"

// inlayText is the short text at the end of a step line:
// "→ <product> (2R→2S, inverted)".
func inlayText(pred *prediction) string {
	if pred.notAnalysed != "" {
		return "not analysed"
	}
	if len(pred.products) == 0 {
		if pred.mechanism == "none" {
			return "→ no reaction"
		}
		return ""
	}
	s := "→ " + pred.products[0].smiles
	if c, ok := reactingChange(pred); ok {
		n := c.atom + 1
		switch {
		case c.before != "" && c.after != "":
			s += fmt.Sprintf(" (%d%s→%d%s, %s)", n, c.before, n, c.after, c.outcome)
		case c.before != "":
			s += fmt.Sprintf(" (%d%s, %s)", n, c.before, c.outcome)
		default:
			s += " (" + c.outcome + ")"
		}
	}
	return s
}

func orDash(s string) string {
	if s == "" {
		return "–"
	}
	return s
}
