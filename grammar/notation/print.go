package notation

import (
	"fmt"
	"io"
	"strconv"
	"strings"

	"walden/grammar/source"
)

// Fprint writes st as an indented outline, one node per line with its
// host offsets, for golden files and for debugging.
func Fprint(w io.Writer, st Step) {
	pr := printer{w: w}
	pr.line(0, st.Span(), "step")
	if m, ok := st.Mark(); ok {
		pr.line(1, m.Span, "mark "+m.State.String())
	}
	if l, ok := st.Label(); ok {
		pr.line(1, l.Span, "label "+strconv.Quote(l.Name))
	}
	pr.terms(1, "reactant", st.Reactants())
	pr.terms(1, "condition", st.Conditions())
	if a, ok := st.Arrow(); ok {
		pr.line(1, a.Span, "arrow")
	}
	pr.terms(1, "product", st.Products())
	if c, ok := st.Comment(); ok {
		pr.line(1, c.Span, "comment "+strconv.Quote(c.Text))
	}
}

// String returns the outline Fprint writes.
func (s Step) String() string {
	var b strings.Builder
	Fprint(&b, s)
	return b.String()
}

type printer struct{ w io.Writer }

func (pr printer) line(depth int, sp source.Span, text string) {
	fmt.Fprintf(pr.w, "%s%s [%d,%d)\n", strings.Repeat("  ", depth), text, sp.Start, sp.End)
}

func (pr printer) terms(depth int, what string, ts Terms) {
	for k := range ts.Len() {
		pr.term(depth, what, ts.At(k))
	}
}

func (pr printer) term(depth int, what string, t Term) {
	if sep, ok := t.Sep(); ok {
		what += " after " + strconv.Quote(sep.Kind.String())
	}
	pr.line(depth, t.Span(), what)
	if s, ok := t.Substance(); ok {
		pr.substance(depth+1, s)
	}
	qs := t.Quantities()
	for k := range qs.Len() {
		pr.quantity(depth+1, qs.At(k))
	}
	ns := t.Notes()
	for k := range ns.Len() {
		n := ns.At(k)
		pr.line(depth+1, n.Span, "note "+strconv.Quote(n.Text))
	}
}

func (pr printer) substance(depth int, s Substance) {
	pr.line(depth, s.Span(), s.Kind().String()+" "+strconv.Quote(s.Text()))
	parts := s.Parts()
	for k := range parts.Len() {
		pr.substance(depth+1, parts.At(k))
	}
	if r, ok := s.Ratio(); ok {
		pr.quantity(depth+1, r)
	}
}

func (pr printer) quantity(depth int, q Quantity) {
	pr.line(depth, q.Span(), q.Kind().String()+" "+q.Describe())
}

// Describe returns the quantity in canonical spelling, such as "60 °C",
// "0 °C to rt", "1.5 eq" or "4:1".
func (q Quantity) Describe() string {
	var s string
	switch {
	case q.Kind() == Ratio:
		parts := q.Ratio()
		texts := make([]string, len(parts))
		for i, v := range parts {
			texts[i] = strconv.FormatFloat(v, 'g', -1, 64)
		}
		s = strings.Join(texts, ":")
	case !q.HasValue():
		s = q.Word()
	case q.Unit() == "":
		s = strconv.FormatFloat(q.Value(), 'g', -1, 64)
	default:
		s = strconv.FormatFloat(q.Value(), 'g', -1, 64) + " " + q.Unit()
	}
	if to, ok := q.To(); ok {
		s += " to " + to.Describe()
	}
	return s
}
