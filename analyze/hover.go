package analyze

import (
	"fmt"
	"slices"
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
	if res.in != nil {
		chem := res.chem
		if chem == nil {
			chem = &prediction{reacting: -1}
		}
		if md, sp, ok := partHover(res.in, chem, rel); ok {
			return md, sp.Shift(ps.span.Start), true
		}
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

// partHover describes the part of a step's line at rel, if hover has
// something to say of it: an atom of a substance written as SMILES (its
// CIP label, and on the substrate its role in the step and what happens
// to its configuration), else the reagent, solvent or referenced product
// there. Only the part under the cursor is described: a line's CIP
// labels and reagent pages cost more than the rest of a hover.
func partHover(in *stepInput, pred *prediction, rel source.Pos) (string, source.Span, bool) {
	var s *substance
	for _, list := range [][]*substance{{in.substrate}, in.reagents, in.solvents, in.products} {
		for _, x := range list {
			if x != nil && x.span.End > x.span.Start && x.span.Contains(rel) {
				s = x
			}
		}
	}
	if s == nil {
		return "", source.Span{}, false
	}
	isSolvent, isProduct := slices.Contains(in.solvents, s), slices.Contains(in.products, s)
	whole := !isProduct && (s.reagent != nil || s.solvent != nil || s.ref != "" && s.from != nil)
	if !isSolvent {
		// An atom is described before its substance, unless it is the
		// whole of it.
		if md, sp, ok := atomHover(s, s == in.substrate, pred, rel); ok && (!whole || sp.Len() < s.span.Len()) {
			return md, sp, true
		}
	}
	switch {
	case !whole:
		return "", source.Span{}, false
	case s.reagent != nil || s.solvent != nil:
		return reagents.Doc(reagents.Entry{Reagent: s.reagent, Solvent: s.solvent}), s.span, true
	}
	md := fmt.Sprintf("**@%s**: the product of step %s, `%s`", s.ref, s.ref, s.from.smiles)
	if s.from.written {
		md += " (as written after '->')"
	}
	if len(s.from.history) > 0 {
		md += "\n\nConfiguration through the plan: " + strings.Join(s.from.history, " → ")
	}
	return md, s.span, true
}

// atomHover describes the atom of s, written as SMILES, at rel: its CIP
// label, and for the substrate its role in the step and what happens to
// its configuration. ok is false for an atom with nothing to say.
func atomHover(s *substance, isSubstrate bool, pred *prediction, rel source.Pos) (string, source.Span, bool) {
	if !s.asSMILES || s.mol == nil {
		return "", source.Span{}, false
	}
	i := -1
	var sp source.Span
	for k := range s.mol.Atoms {
		if at, ok := smilesAtomSpan(s, k); ok && at.Contains(rel) && (i < 0 || at.Len() < sp.Len()) {
			i, sp = k, at
		}
	}
	if i < 0 {
		return "", source.Span{}, false
	}
	role := ""
	if isSubstrate {
		role = pred.role(i)
	}
	l := cipLabels(s.mol)[i]
	if role == "" && l == "" {
		return "", source.Span{}, false
	}
	md := fmt.Sprintf("**atom %d** (%s)", i+1, s.mol.Atoms[i].Element.Symbol())
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
	return md, sp, true
}
