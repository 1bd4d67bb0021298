package smiles

import (
	"fmt"
	"sort"
	"strings"

	"walden/analyze/molecule"
)

// Error is one problem in a SMILES string: the bytes it concerns and a
// message saying what was found, what was expected and, where one exists,
// the fix.
type Error struct {
	Span molecule.Span
	Msg  string
}

// Error formats e as "start-end: message", byte offsets.
func (e Error) Error() string {
	return fmt.Sprintf("%d-%d: %s", e.Span.Start, e.Span.End, e.Msg)
}

// ErrorList is every problem found in one string, sortable by position
// like go/scanner's ErrorList.
type ErrorList []*Error

// Add appends an error for span with message msg.
func (l *ErrorList) Add(span molecule.Span, msg string) {
	*l = append(*l, &Error{span, msg})
}

// Len, Swap and Less make ErrorList a sort.Interface: by start, then end,
// then message.
func (l ErrorList) Len() int { return len(l) }

// Swap exchanges two errors.
func (l ErrorList) Swap(i, j int) { l[i], l[j] = l[j], l[i] }

// Less orders errors by position.
func (l ErrorList) Less(i, j int) bool {
	a, b := l[i].Span, l[j].Span
	if a.Start != b.Start {
		return a.Start < b.Start
	}
	if a.End != b.End {
		return a.End < b.End
	}
	return l[i].Msg < l[j].Msg
}

// Sort orders the list by position.
func (l ErrorList) Sort() { sort.Stable(l) }

// Error joins the messages; the first comes first so that a one-line
// display stays useful.
func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	var b strings.Builder
	b.WriteString(l[0].Error())
	fmt.Fprintf(&b, " (and %d more errors)", len(l)-1)
	return b.String()
}

// Err returns l as an error, or nil when l is empty.
func (l ErrorList) Err() error {
	if len(l) == 0 {
		return nil
	}
	return l
}
