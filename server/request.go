package server

import (
	"context"

	"go.lsp.dev/protocol"

	"walden/analyze"
	"walden/grammar/source"
)

// target is what a request about one text document works on: the
// document as of the request's arrival and its report.
type target struct {
	doc *document
	rep *analyze.Report
}

// targetOf returns the document uri names and its analysis. ok is false
// (and err nil) for a document walden does not analyse, which gets an
// empty answer rather than an error: editors send requests for every
// Markdown file.
func targetOf(ctx context.Context, uri protocol.DocumentURI) (t target, ok bool, err error) {
	return targetBy(ctx, uri, (*snapshot).report)
}

// pointTargetOf is targetOf for the requests about one position (hover,
// completion), which read the Report as published: the first of them
// after an edit does not wait for Report.Full to lay out the whole page.
func pointTargetOf(ctx context.Context, uri protocol.DocumentURI) (t target, ok bool, err error) {
	return targetBy(ctx, uri, (*snapshot).lineReport)
}

func targetBy(ctx context.Context, uri protocol.DocumentURI, report func(*snapshot, context.Context, int) (*analyze.Report, error)) (t target, ok bool, err error) {
	snap, i, found := worldOf(ctx).lookup(uri)
	if !found {
		return target{}, false, nil
	}
	rep, err := report(snap, ctx, i)
	if err != nil {
		return target{}, false, err
	}
	return target{doc: snap.docs[i], rep: rep}, true, nil
}

// at returns the byte offset of a request's position, or an InvalidParams
// error naming the document's size.
func (t target) at(p protocol.Position) (source.Pos, error) {
	pos, err := offset(t.doc.mapper, p)
	if err != nil {
		return 0, invalidParams("%v (%s has %d lines)", err, t.doc.uri, t.doc.mapper.LineCount())
	}
	return pos, nil
}

// within returns the byte span of a request's range, with at's errors.
func (t target) within(r protocol.Range) (source.Span, error) {
	sp, err := span(t.doc.mapper, r)
	if err != nil {
		return sp, invalidParams("%v (%s has %d lines)", err, t.doc.uri, t.doc.mapper.LineCount())
	}
	return sp, nil
}

// overlaps reports whether a and b share a byte or touch, so that a
// cursor (an empty range) at either end of a span counts as inside it.
func overlaps(a, b source.Span) bool { return a.Start <= b.End && b.Start <= a.End }

// lineEnd returns the end of a step's text without a trailing line end.
func lineEnd(d *document, sp source.Span) source.Pos {
	text := d.text()
	end := min(int(sp.End), len(text))
	for end > int(sp.Start) && (text[end-1] == '\n' || text[end-1] == '\r') {
		end--
	}
	return source.Pos(end)
}
