package notebook

// FindPlan finds the step lines of a plan file: every line that is not
// blank and does not start with "//" is a step.
func FindPlan(text []byte) *Page {
	pg := &Page{}
	if binary(text, pg) {
		return pg
	}
	it := newLineIter(text)
	pg.Lines = make([]Line, 0, it.lines)
	for {
		start, end, ok := it.line()
		if !ok {
			break
		}
		a, b := trimLine(text, start, end)
		switch {
		case a == b:
		case isComment(text, a, b):
			pg.Comments = append(pg.Comments, span(a, b))
		default:
			pg.Lines = append(pg.Lines, Line{Span: span(a, b), Block: -1})
		}
	}
	return pg
}
