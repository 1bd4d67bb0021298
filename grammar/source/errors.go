package source

import (
	"fmt"
	"sort"
	"strings"
)

// Error is one problem found in a host document, positioned by its byte
// span, in the manner of go/scanner.Error. Code is a short stable name for
// the kind of problem (e.g. "missing-unit"), so that callers can offer a
// fix or let users silence it without matching on the wording.
type Error struct {
	Span Span
	Code string
	Msg  string
}

// Error returns the message with its byte offsets, for logs and tests;
// the command line and the server format positions through a Mapper.
func (e *Error) Error() string {
	return fmt.Sprintf("%d-%d: %s", e.Span.Start, e.Span.End, e.Msg)
}

// ErrorList is a list of *Error, sortable by position, in the manner of
// go/scanner.ErrorList. The zero value is an empty list ready to use.
type ErrorList []*Error

// Add appends an error with the given span, code and message.
func (l *ErrorList) Add(span Span, code, msg string) {
	*l = append(*l, &Error{Span: span, Code: code, Msg: msg})
}

// Addf appends an error whose message is formatted as by fmt.Sprintf.
func (l *ErrorList) Addf(span Span, code, format string, args ...any) {
	l.Add(span, code, fmt.Sprintf(format, args...))
}

// Len returns the number of errors (sort.Interface).
func (l ErrorList) Len() int { return len(l) }

// Swap exchanges two errors (sort.Interface).
func (l ErrorList) Swap(i, j int) { l[i], l[j] = l[j], l[i] }

// Less orders errors by start, then end, then message (sort.Interface).
func (l ErrorList) Less(i, j int) bool {
	a, b := l[i], l[j]
	if a.Span.Start != b.Span.Start {
		return a.Span.Start < b.Span.Start
	}
	if a.Span.End != b.Span.End {
		return a.Span.End < b.Span.End
	}
	return a.Msg < b.Msg
}

// Sort sorts the list by position.
func (l ErrorList) Sort() { sort.Stable(l) }

// Error joins the messages, one per line.
func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	var b strings.Builder
	for i, e := range l {
		if i > 0 {
			b.WriteByte('\n')
		}
		b.WriteString(e.Error())
	}
	return b.String()
}

// Err returns l as an error, or nil when l is empty, so that a function
// returning an ErrorList never yields a non-nil error holding no errors.
func (l ErrorList) Err() error {
	if len(l) == 0 {
		return nil
	}
	return l
}
