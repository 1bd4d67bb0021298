package notation

// Inspect calls f for every node of st in source order, depth first,
// starting with st itself; when f returns false for a node its children
// are skipped. Absent parts are not visited. The nodes are values: Step,
// Mark, Label, Sep, Term, Substance, Quantity, Note, Arrow and Comment.
func Inspect(st Step, f func(Node) bool) {
	if !f(st) {
		return
	}
	if m, ok := st.Mark(); ok {
		f(m)
	}
	if l, ok := st.Label(); ok {
		f(l)
	}
	terms := func(ts Terms) {
		for k := range ts.Len() {
			inspectTerm(ts.At(k), f)
		}
	}
	terms(st.Reactants())
	terms(st.Conditions())
	if a, ok := st.Arrow(); ok {
		f(a)
	}
	terms(st.Products())
	if c, ok := st.Comment(); ok {
		f(c)
	}
}

func inspectTerm(t Term, f func(Node) bool) {
	if sep, ok := t.Sep(); ok {
		f(sep)
	}
	if !f(t) {
		return
	}
	// Children in source order: amounts may stand before the substance.
	var kids []Node
	if s, ok := t.Substance(); ok {
		kids = append(kids, s)
	}
	qs := t.Quantities()
	for k := range qs.Len() {
		kids = append(kids, qs.At(k))
	}
	ns := t.Notes()
	for k := range ns.Len() {
		kids = append(kids, ns.At(k))
	}
	for i := 1; i < len(kids); i++ {
		for j := i; j > 0 && kids[j].Pos() < kids[j-1].Pos(); j-- {
			kids[j], kids[j-1] = kids[j-1], kids[j]
		}
	}
	for _, k := range kids {
		switch k := k.(type) {
		case Substance:
			inspectSubstance(k, f)
		case Quantity:
			inspectQuantity(k, f)
		default:
			f(k)
		}
	}
}

func inspectSubstance(s Substance, f func(Node) bool) {
	if !f(s) {
		return
	}
	parts := s.Parts()
	for k := range parts.Len() {
		inspectSubstance(parts.At(k), f)
	}
	if r, ok := s.Ratio(); ok {
		inspectQuantity(r, f)
	}
}

func inspectQuantity(q Quantity, f func(Node) bool) {
	if !f(q) {
		return
	}
	if to, ok := q.To(); ok {
		inspectQuantity(to, f)
	}
}
