package notation

// Inspect calls f for every node of st in source order, depth first,
// starting with st itself; when f returns false for a node its children
// are skipped. Nil parts are not visited.
func Inspect(st *Step, f func(Node) bool) {
	if !f(st) {
		return
	}
	if st.Mark != nil {
		f(st.Mark)
	}
	if st.Label != nil {
		f(st.Label)
	}
	terms := func(ts []*Term) {
		for _, t := range ts {
			inspectTerm(t, f)
		}
	}
	terms(st.Reactants)
	terms(st.Conditions)
	if st.Arrow != nil {
		f(st.Arrow)
	}
	terms(st.Products)
	if st.Comment != nil {
		f(st.Comment)
	}
}

func inspectTerm(t *Term, f func(Node) bool) {
	if t.Sep != nil {
		f(t.Sep)
	}
	if !f(t) {
		return
	}
	// Children in source order: amounts may stand before the substance.
	var kids []Node
	if t.Substance != nil {
		kids = append(kids, t.Substance)
	}
	for _, q := range t.Quantities {
		kids = append(kids, q)
	}
	for _, n := range t.Notes {
		kids = append(kids, n)
	}
	for i := 1; i < len(kids); i++ {
		for j := i; j > 0 && kids[j].Pos() < kids[j-1].Pos(); j-- {
			kids[j], kids[j-1] = kids[j-1], kids[j]
		}
	}
	for _, k := range kids {
		switch k := k.(type) {
		case *Substance:
			inspectSubstance(k, f)
		case *Quantity:
			inspectQuantity(k, f)
		default:
			f(k)
		}
	}
}

func inspectSubstance(s *Substance, f func(Node) bool) {
	if !f(s) {
		return
	}
	for _, p := range s.Parts {
		inspectSubstance(p, f)
	}
	if s.Ratio != nil {
		inspectQuantity(s.Ratio, f)
	}
}

func inspectQuantity(q *Quantity, f func(Node) bool) {
	if f(q) && q.To != nil {
		inspectQuantity(q.To, f)
	}
}
