package reagents

import (
	"fmt"
	"sort"
	"strconv"
	"strings"
)

// Name is one name the dictionary knows, for completion lists.
type Name struct {
	Text   string // the name as written in the dictionary
	Detail string // one line: "reagent · nucleophile · [N-]=[N+]=[N-]"
	Doc    string // Doc(Entry), made once for every name of the entry
	Entry  Entry
}

// Names returns every name the dictionary knows with a one-line detail,
// sorted case-insensitively.
func (d *Dictionary) Names() []Name {
	out := make([]Name, 0, len(d.names))
	docs := make(map[Entry]string) // an entry has several names
	for _, n := range d.names {
		e := d.entry(n.ref)
		doc, ok := docs[e]
		if !ok {
			doc = Doc(e)
			docs[e] = doc
		}
		out = append(out, Name{Text: n.text, Detail: Detail(e), Doc: doc, Entry: e})
	}
	sort.SliceStable(out, func(i, j int) bool {
		a, b := strings.ToLower(out[i].Text), strings.ToLower(out[j].Text)
		if a != b {
			return a < b
		}
		return out[i].Text < out[j].Text
	})
	return out
}

// Detail returns one line describing e: kind, roles or class, and the
// SMILES or the key numbers.
func Detail(e Entry) string {
	var parts []string
	if g := e.Reagent; g != nil {
		parts = append(parts, "reagent · "+g.Roles.String()+" · "+g.Species)
	}
	if s := e.Solvent; s != nil {
		d := "solvent · " + s.Class
		if s.Dielectric.Known {
			d += " · ε " + num(s.Dielectric.V)
		}
		if s.BoilingC.Known {
			d += " · bp " + num(s.BoilingC.V) + " °C"
		}
		parts = append(parts, d)
	}
	return strings.Join(parts, "; ")
}

func num(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }

// Doc returns Markdown describing e with every value and its source, for
// hover and completion documentation.
func Doc(e Entry) string {
	var b strings.Builder
	if g := e.Reagent; g != nil {
		fmt.Fprintf(&b, "**%s** — reagent (%s)\n\n", g.Name(), g.Roles)
		if len(g.Names) > 1 {
			fmt.Fprintf(&b, "Also written: %s\n\n", strings.Join(g.Names[1:], ", "))
		}
		fmt.Fprintf(&b, "- active species: `%s`", g.Species)
		if g.NeedsBase {
			b.WriteString(" (forms only after a base deprotonates the reagent)")
		}
		b.WriteString("\n")
		if g.Counterion != "" {
			fmt.Fprintf(&b, "- counter-ion: `%s`\n", g.Counterion)
		}
		if g.Whole != g.Species {
			fmt.Fprintf(&b, "- as weighed out: `%s`\n", g.Whole)
		}
		if g.PKaH.Known {
			what := "pKa of the conjugate acid"
			if g.Roles.Has(Acid) && !g.Roles.Has(Base) {
				what = "pKa of the acid"
			}
			fmt.Fprintf(&b, "- %s: %s — %s\n", what, num(g.PKaH.V), g.PKaH.Source)
		}
		if g.Nucleo.Known {
			fmt.Fprintf(&b, "- nucleophilicity n(CH3I, methanol; Pearson–Sobel–Songstad): %s — %s\n", num(g.Nucleo.V), g.Nucleo.Source)
		}
		fmt.Fprintf(&b, "- bulk: %s\n", g.Bulk)
		if g.Soluble != "" {
			fmt.Fprintf(&b, "- dissolves in: %s (common practice)\n", strings.ReplaceAll(g.Soluble, ",", ", "))
		}
		if g.Notes != "" {
			fmt.Fprintf(&b, "- note: %s\n", g.Notes)
		}
		if len(g.Hazards) > 0 {
			fmt.Fprintf(&b, "- hazards: %s. Follow the lab's safety rules, the safety data sheet and local regulations.\n", strings.Join(g.Hazards, ", "))
		}
		fmt.Fprintf(&b, "- entry: %s (%s)\n", g.Source, g.Origin)
	}
	if s := e.Solvent; s != nil {
		if e.Reagent != nil {
			b.WriteString("\n")
		}
		fmt.Fprintf(&b, "**%s** — solvent (%s)\n\n", s.Name(), s.Class)
		if len(s.Names) > 1 {
			fmt.Fprintf(&b, "Also written: %s\n\n", strings.Join(s.Names[1:], ", "))
		}
		fmt.Fprintf(&b, "- SMILES: `%s`\n", s.SMILES)
		if s.Dielectric.Known {
			fmt.Fprintf(&b, "- dielectric constant: %s at %s °C — %s\n", num(s.Dielectric.V), num(s.DielectricTempC), s.Dielectric.Source)
		}
		if s.Protic {
			b.WriteString("- protic: yes (hydrogen-bonds to anions, slowing anionic nucleophiles)\n")
		} else {
			b.WriteString("- protic: no\n")
		}
		if s.BoilingC.Known {
			fmt.Fprintf(&b, "- boiling point: %s °C — %s\n", num(s.BoilingC.V), s.BoilingC.Source)
		}
		if s.Notes != "" {
			fmt.Fprintf(&b, "- note: %s\n", s.Notes)
		}
		if len(s.Hazards) > 0 {
			fmt.Fprintf(&b, "- hazards: %s. Follow the lab's safety rules, the safety data sheet and local regulations.\n", strings.Join(s.Hazards, ", "))
		}
		fmt.Fprintf(&b, "- entry: %s (%s)\n", s.Source, s.Origin)
	}
	return b.String()
}
