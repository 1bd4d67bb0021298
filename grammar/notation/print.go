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
func Fprint(w io.Writer, st *Step) {
	pr := printer{w: w}
	pr.line(0, st.Span.Start, st.Span.End, "step")
	if st.Mark != nil {
		pr.line(1, st.Mark.Span.Start, st.Mark.Span.End, "mark "+st.Mark.State.String())
	}
	if st.Label != nil {
		pr.line(1, st.Label.Span.Start, st.Label.Span.End, "label "+strconv.Quote(st.Label.Name))
	}
	for _, t := range st.Reactants {
		pr.term(1, "reactant", t)
	}
	for _, t := range st.Conditions {
		pr.term(1, "condition", t)
	}
	if st.Arrow != nil {
		pr.line(1, st.Arrow.Span.Start, st.Arrow.Span.End, "arrow")
	}
	for _, t := range st.Products {
		pr.term(1, "product", t)
	}
	if st.Comment != nil {
		pr.line(1, st.Comment.Span.Start, st.Comment.Span.End, "comment "+strconv.Quote(st.Comment.Text))
	}
}

// String returns the outline Fprint writes.
func (s *Step) String() string {
	var b strings.Builder
	Fprint(&b, s)
	return b.String()
}

type printer struct{ w io.Writer }

func (pr printer) line(depth int, start, end source.Pos, text string) {
	fmt.Fprintf(pr.w, "%s%s [%d,%d)\n", strings.Repeat("  ", depth), text, start, end)
}

func (pr printer) term(depth int, what string, t *Term) {
	if t.Sep != nil {
		what += " after " + strconv.Quote(t.Sep.Kind.String())
	}
	pr.line(depth, t.Span.Start, t.Span.End, what)
	if t.Substance != nil {
		pr.substance(depth+1, t.Substance)
	}
	for _, q := range t.Quantities {
		pr.quantity(depth+1, q)
	}
	for _, n := range t.Notes {
		pr.line(depth+1, n.Span.Start, n.Span.End, "note "+strconv.Quote(n.Text))
	}
}

func (pr printer) substance(depth int, s *Substance) {
	pr.line(depth, s.Span.Start, s.Span.End, s.Kind.String()+" "+strconv.Quote(s.Text))
	for _, part := range s.Parts {
		pr.substance(depth+1, part)
	}
	if s.Ratio != nil {
		pr.quantity(depth+1, s.Ratio)
	}
}

func (pr printer) quantity(depth int, q *Quantity) {
	pr.line(depth, q.Span.Start, q.Span.End, q.Kind.String()+" "+q.Describe())
}

// Describe returns the quantity in canonical spelling, such as "60 °C",
// "0 °C to rt", "1.5 eq" or "4:1".
func (q *Quantity) Describe() string {
	var s string
	switch {
	case q.Kind == Ratio:
		parts := make([]string, len(q.Ratio))
		for i, v := range q.Ratio {
			parts[i] = strconv.FormatFloat(v, 'g', -1, 64)
		}
		s = strings.Join(parts, ":")
	case !q.HasValue:
		s = q.Word
	case q.Unit == "":
		s = strconv.FormatFloat(q.Value, 'g', -1, 64)
	default:
		s = strconv.FormatFloat(q.Value, 'g', -1, 64) + " " + q.Unit
	}
	if q.To != nil {
		s += " to " + q.To.Describe()
	}
	return s
}
