package reagents

import (
	"fmt"
	"sort"
	"strings"

	"walden/grammar/source"
)

// Error is one problem in a lab's names file (or in a built-in table),
// positioned like go/scanner.Error: the byte span in the file, and the
// 1-based line and byte column of its start for people to read.
type Error struct {
	File string
	Line int
	Col  int
	Span source.Span
	Msg  string
}

// Error returns "file:line:col: message".
func (e *Error) Error() string {
	if e.File == "" {
		return fmt.Sprintf("%d:%d: %s", e.Line, e.Col, e.Msg)
	}
	return fmt.Sprintf("%s:%d:%d: %s", e.File, e.Line, e.Col, e.Msg)
}

// ErrorList is a list of *Error, sortable by position.
type ErrorList []*Error

// Len, Swap and Less make ErrorList a sort.Interface ordered by file,
// then position, then message.
func (l ErrorList) Len() int      { return len(l) }
func (l ErrorList) Swap(i, j int) { l[i], l[j] = l[j], l[i] }
func (l ErrorList) Less(i, j int) bool {
	a, b := l[i], l[j]
	if a.File != b.File {
		return a.File < b.File
	}
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
	if len(l) == 0 {
		return "no errors"
	}
	parts := make([]string, len(l))
	for i, e := range l {
		parts[i] = e.Error()
	}
	return strings.Join(parts, "\n")
}

// Err returns l as an error, or nil when l is empty.
func (l ErrorList) Err() error {
	if len(l) == 0 {
		return nil
	}
	return l
}

func sortStrings(s []string) { sort.Strings(s) }
