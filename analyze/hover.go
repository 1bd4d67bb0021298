package analyze

import (
	"fmt"
	"strings"

	"walden/analyze/caution"
	"walden/analyze/reagents"
	"walden/grammar/source"
)

// Hover returns Markdown describing what is at pos: an atom of a SMILES
// (its CIP label and role), a reagent or solvent (its data and sources),
// or the step (predicted product, configuration before and after,
// mechanism, distribution, reasons, cautions, configuration through the
// plan). ok is false where there is nothing to say. A Report made by
// AnalyzeLines answers without Full.
func (r *Report) Hover(pos source.Pos) (markdown string, span source.Span, ok bool) {
	ps := r.stepAt(pos)
	if ps == nil {
		return "", source.Span{}, false
	}
	res := ps.res
	rel := pos - ps.span.Start
	var parts []partHover
	if res.in != nil {
		parts = substanceHovers(res.in)
		chem := res.chem
		if chem == nil {
			chem = &prediction{reacting: -1}
		}
		parts = append(parts, atomHovers(res.in, chem)...)
	}
	best := -1
	for i, p := range parts {
		if p.span.Contains(rel) && (best < 0 || p.span.Len() < parts[best].span.Len()) {
			best = i
		}
	}
	if best >= 0 {
		p := parts[best]
		return p.markdown, p.span.Shift(ps.span.Start), true
	}
	md := res.hover
	if res.chem != nil {
		var through []string
		if res.pred != nil {
			through = res.pred.Through
		}
		md = stepHover(res.in, res.chem, res.cautions, res.handOn, through)
	}
	if md == "" {
		return "", source.Span{}, false
	}
	return md, ps.span, true
}

// stepHover is the Markdown shown over a step.
func stepHover(in *stepInput, pred *prediction, cs []caution.Caution, h *handOn, through []string) string {
	var b strings.Builder
	if pred.notAnalysed != "" {
		fmt.Fprintf(&b, "**not analysed**: %s\n", pred.notAnalysed)
	} else if len(pred.products) > 0 {
		p := pred.products[0]
		mech := pred.mechanism
		if mech == "" || mech == "none" {
			mech = "no substitution at carbon" // e.g. O-sulfonylation: the C–O bond stays
		}
		fmt.Fprintf(&b, "**%s** → `%s` (major, %s)\n", mech, p.smiles, percent(p.fraction))
	} else if pred.mechanism == "" || pred.mechanism == "none" {
		b.WriteString("**no reaction** predicted\n")
	} else {
		fmt.Fprintf(&b, "**%s**: no product predicted\n", pred.mechanism)
	}
	if len(pred.stereo) > 0 {
		b.WriteString("\n**Configuration**\n\n")
		for _, c := range pred.stereo {
			fmt.Fprintf(&b, "- atom %d: %s\n", c.atom+1, c.describe())
		}
	}
	if len(pred.distribution) > 1 {
		b.WriteString("\n**Distribution**: ")
		var parts []string
		for _, s := range pred.distribution {
			parts = append(parts, fmt.Sprintf("%s %s", s.mechanism, percent(s.fraction)))
		}
		b.WriteString(strings.Join(parts, " · ") + "\n")
	}
	if len(pred.products) > 1 {
		b.WriteString("\n**Minor products**\n\n")
		for _, p := range pred.products[1:] {
			fmt.Fprintf(&b, "- `%s` (%s, %s)%s\n", p.smiles, p.mechanism, percent(p.fraction), prefixed(" — ", p.note))
		}
	}
	if len(pred.reasons) > 0 {
		b.WriteString("\n**Why**\n\n")
		for i, r := range pred.reasons {
			src := ""
			if i < len(pred.sources) && pred.sources[i] != "" {
				src = " — *" + pred.sources[i] + "*"
			}
			fmt.Fprintf(&b, "- %s%s\n", r, src)
		}
	}
	if len(cs) > 0 {
		b.WriteString("\n**Cautions**\n\n")
		for _, c := range cs {
			fmt.Fprintf(&b, "- %s\n", c.Message)
		}
	}
	if in.solventAssumed != "" {
		fmt.Fprintf(&b, "\nNo solvent given: predicted for %s.\n", in.solventAssumed)
	}
	if len(through) > 1 {
		fmt.Fprintf(&b, "\n**Through the plan**: %s\n", strings.Join(through, " → "))
	}
	if h != nil && h.written {
		b.WriteString("\nLater steps naming this label use the product written after '->'.\n")
	}
	return b.String()
}

func orNone(s string) string {
	if s == "" {
		return "none"
	}
	return s
}

func prefixed(p, s string) string {
	if s == "" {
		return ""
	}
	return p + s
}

// substanceHovers describes each reagent and solvent of a step.
func substanceHovers(in *stepInput) []partHover {
	var out []partHover
	all := append([]*substance{in.substrate}, in.reagents...)
	all = append(all, in.solvents...)
	for _, s := range all {
		if s == nil || s.span.End <= s.span.Start {
			continue
		}
		var md string
		switch {
		case s.reagent != nil || s.solvent != nil:
			md = reagents.Doc(reagents.Entry{Reagent: s.reagent, Solvent: s.solvent})
		case s.ref != "" && s.from != nil:
			md = fmt.Sprintf("**@%s**: the product of step %s, `%s`", s.ref, s.ref, s.from.smiles)
			if s.from.written {
				md += " (as written after '->')"
			}
			if len(s.from.history) > 0 {
				md += "\n\nConfiguration through the plan: " + strings.Join(s.from.history, " → ")
			}
		default:
			continue
		}
		out = append(out, partHover{span: s.span, markdown: md})
	}
	return out
}

// atomHovers describes the atoms of the substances written as SMILES in
// the line: the CIP label of each stereocentre, and for the substrate
// each atom's role in the step (reacting carbon, leaving group) and what
// happens to its configuration.
func atomHovers(in *stepInput, pred *prediction) []partHover {
	var out []partHover
	all := append([]*substance{in.substrate}, in.reagents...)
	all = append(all, in.products...)
	for _, s := range all {
		if s == nil || !s.asSMILES || s.mol == nil {
			continue
		}
		isSubstrate := s == in.substrate
		labels := cipLabels(s.mol)
		for i, a := range s.mol.Atoms {
			sp, ok := smilesAtomSpan(s, i)
			if !ok {
				continue
			}
			role := ""
			if isSubstrate {
				role = pred.role(i)
			}
			l := labels[i]
			if role == "" && l == "" {
				continue
			}
			md := fmt.Sprintf("**atom %d** (%s)", i+1, a.Element.Symbol())
			if l != "" {
				md += fmt.Sprintf(" — CIP **%s**", l)
			}
			if role != "" {
				md += "\n\n" + role
			}
			if isSubstrate {
				for _, c := range pred.stereo {
					if c.atom == i {
						md += fmt.Sprintf("\n\nIn this step: %s → %s (%s)", orDash(c.before), orDash(c.after), c.outcome)
					}
				}
			}
			out = append(out, partHover{span: sp, markdown: md})
		}
	}
	return out
}
