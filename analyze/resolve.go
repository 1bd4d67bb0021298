package analyze

import (
	"fmt"
	"strings"

	"walden/analyze/smiles"
	"walden/grammar/notation"
	"walden/grammar/source"
)

// resolver turns the substances of one parsed line into chemistry,
// collecting the diagnostics of names that do not resolve. Spans are
// relative to the line.
type resolver struct {
	dict   *dictionary
	memo   *memo              // SMILES read once per Engine
	refs   map[string]*handOn // the labels visible to this step, with their products
	diags  []Diagnostic
	tokens []Token
	slab   []substance // room for the line's substances, made by build
}

// substance resolves one written substance. role is the token kind the
// caller expects (substrate, reagent, solvent, product); a condition
// reagent that turns out to be a solvent is reported as such by the
// caller.
func (r *resolver) substance(s notation.Substance, term notation.Term) *substance {
	text := s.Text()
	var out *substance
	if n := len(r.slab); n < cap(r.slab) {
		r.slab = r.slab[:n+1]
		out = &r.slab[n]
	} else {
		out = new(substance)
	}
	*out = substance{text: text, span: s.Span(), term: term, kind: s.Kind()}
	switch out.kind {
	case notation.Reference:
		out.ref = text
		if h, ok := r.refs[text]; ok && h != nil {
			out.from = h
			out.mol = h.mol
			out.smiles = h.smiles
		}
		return out
	case notation.Mixture:
		// A mixture is resolved part by part by the caller; here the
		// first known part stands for it.
		return out
	}
	if e := r.dict.lookup(text); e.reagent != nil || e.solvent != nil {
		out.reagent, out.solvent = e.reagent, e.solvent
		if out.reagent != nil {
			out.smiles = firstNonEmpty(out.reagent.Whole, out.reagent.Species)
		} else {
			out.smiles = out.solvent.SMILES
		}
		out.mol = r.dict.molecule(out.smiles)
		return out
	}
	if out.kind == notation.Word {
		rs := r.memo.readSMILES(r.dict, text)
		if rs.err == nil {
			out.mol, out.smiles, out.asSMILES = rs.mol, text, true
			// A solvent or reagent written as SMILES is still that entry:
			// "CN(C)C=O" is DMF to the outcome rules.
			if e := rs.entry; e.reagent != nil || e.solvent != nil {
				out.reagent, out.solvent = e.reagent, e.solvent
			}
			return out
		}
		if looksLikeSMILES(text) {
			r.smilesErrors(out, rs.err)
			return out
		}
	}
	r.unknown(out)
	return out
}

// unknown reports a name that is neither in the dictionary nor SMILES,
// with the closest known names and a fix replacing it by the closest.
func (r *resolver) unknown(s *substance) {
	near := r.dict.suggest(s.text, 3)
	msg := fmt.Sprintf("unknown reagent or solvent '%s'", s.text)
	var fixes []Fix
	if len(near) > 0 {
		msg += "; did you mean " + orList(quoteAll(near)) + "?"
		for i, n := range near {
			fixes = append(fixes, Fix{Title: fmt.Sprintf("Replace '%s' with '%s'", s.text, n), Edits: []Edit{{Span: s.span, NewText: n}}, Preferred: i == 0})
		}
	} else {
		msg += "; write it as SMILES, or add it to the lab's names file"
	}
	r.diags = append(r.diags, Diagnostic{Code: CodeUnknownName, Severity: Error, Message: msg, Span: s.span, Fixes: fixes})
}

// smilesErrors reports the errors of a word that looks like SMILES but
// does not read, each on its own characters.
func (r *resolver) smilesErrors(s *substance, err error) {
	list, ok := err.(smiles.ErrorList)
	if !ok || len(list) == 0 {
		r.diags = append(r.diags, Diagnostic{Code: CodeSMILES, Severity: Error, Message: "cannot read SMILES: " + err.Error(), Span: s.span})
		return
	}
	near := r.dict.suggest(s.text, 1)
	for i, e := range list {
		sp := source.Span{Start: s.span.Start + source.Pos(e.Span.Start), End: s.span.Start + source.Pos(e.Span.End)}
		if sp.End > s.span.End {
			sp.End = s.span.End
		}
		if sp.Start > sp.End {
			sp.Start = sp.End
		}
		msg := "SMILES: " + e.Msg
		if i == 0 && len(near) > 0 {
			msg += fmt.Sprintf(" (if a name was meant: the closest known name is '%s')", near[0])
		}
		r.diags = append(r.diags, Diagnostic{Code: CodeSMILES, Severity: Error, Message: msg, Span: sp})
		if i == 4 {
			break // the first few say enough; the rest follow from them
		}
	}
}

// looksLikeSMILES tells a mistyped SMILES from a mistyped name: SMILES
// carries brackets, bonds, ring digits or an organic-subset start, names
// rarely do.
func looksLikeSMILES(s string) bool {
	if strings.ContainsAny(s, "[]()=#@/\\") {
		return true
	}
	// Otherwise only organic-subset letters, ring digits and dots:
	// "CCCBr", "c1ccccc1"; "DMFF" and "NaN3" are names.
	return strings.IndexFunc(s, func(c rune) bool { return !strings.ContainsRune(smilesOnly, c) }) < 0
}

const smilesOnly = "BCNOSPFIbcnosplr0123456789%.+-"

func firstNonEmpty(s ...string) string {
	for _, x := range s {
		if x != "" {
			return x
		}
	}
	return ""
}

func quoteAll(s []string) []string {
	out := make([]string, len(s))
	for i, x := range s {
		out[i] = "'" + x + "'"
	}
	return out
}

// orList joins "a", "b or c".
func orList(s []string) string {
	switch len(s) {
	case 0:
		return ""
	case 1:
		return s[0]
	}
	return strings.Join(s[:len(s)-1], ", ") + " or " + s[len(s)-1]
}
