package formula

import (
	"fmt"
	"sort"
	"strings"
	"unicode/utf8"
)

// Error is a mistake in a formula, placed on a span of its source.
//
// Offset and Len are in bytes. Line and Column, both 1-based, locate Offset for
// people: Column counts runes from the start of its line, so a caller that
// embeds the formula in a larger file can add it to the column where the
// formula starts. Parse fills in every field; an Error made elsewhere with
// Line and Column left zero is reported at column Offset+1.
//
// An Offset of -1 means the error is not in the source at all (a parameter
// name given to Parse is unusable); Error then prints only Msg.
type Error struct {
	Offset, Len  int
	Line, Column int
	Msg          string
}

// newError returns the error for the span [offs, offs+n) of src.
func newError(src string, offs, n int, msg string) *Error {
	e := &Error{Offset: offs, Len: n, Msg: msg}
	if offs < 0 {
		return e
	}
	offs = min(offs, len(src))
	start := strings.LastIndexByte(src[:offs], '\n') + 1
	e.Line = strings.Count(src[:start], "\n") + 1
	e.Column = utf8.RuneCountInString(src[start:offs]) + 1
	return e
}

// Error returns "column N: msg", or "line L, column N: msg" past the first
// line of a multi-line formula.
func (e *Error) Error() string {
	switch {
	case e.Offset < 0:
		return e.Msg
	case e.Line > 1:
		return fmt.Sprintf("line %d, column %d: %s", e.Line, e.Column, e.Msg)
	case e.Column > 0:
		return fmt.Sprintf("column %d: %s", e.Column, e.Msg)
	}
	return fmt.Sprintf("column %d: %s", e.Offset+1, e.Msg)
}

// Excerpt returns the line of src that holds the error and, below it, a line
// of carets under the offending span (one caret for an empty span, carets up
// to the end of the line for a span that continues on the next one). Tabs
// before the span are kept so that the carets line up. The result has no
// trailing newline; it is empty if the error lies outside src.
func (e *Error) Excerpt(src string) string {
	if e.Offset < 0 || e.Offset > len(src) {
		return ""
	}
	start := strings.LastIndexByte(src[:e.Offset], '\n') + 1
	end := strings.IndexByte(src[e.Offset:], '\n')
	if end < 0 {
		end = len(src)
	} else {
		end += e.Offset
	}
	line := src[start:end]
	var b strings.Builder
	b.WriteString(line)
	b.WriteByte('\n')
	for _, r := range src[start:e.Offset] {
		if r == '\t' {
			b.WriteByte('\t')
		} else {
			b.WriteByte(' ')
		}
	}
	spanEnd := min(e.Offset+max(e.Len, 0), end)
	n := max(utf8.RuneCountInString(src[e.Offset:spanEnd]), 1)
	b.WriteString(strings.Repeat("^", n))
	return b.String()
}

// ErrorList is a list of formula errors. The zero value is an empty list ready
// to use. Parse returns an ErrorList when it finds more than one error.
type ErrorList []*Error

// Add appends e to the list.
func (l *ErrorList) Add(e *Error) { *l = append(*l, e) }

// Len returns the number of errors.
func (l ErrorList) Len() int { return len(l) }

// Swap swaps errors i and j.
func (l ErrorList) Swap(i, j int) { l[i], l[j] = l[j], l[i] }

// Less orders errors by offset, then by length.
func (l ErrorList) Less(i, j int) bool {
	if l[i].Offset != l[j].Offset {
		return l[i].Offset < l[j].Offset
	}
	return l[i].Len < l[j].Len
}

// Sort sorts the list by source position, keeping the order of errors at the
// same position.
func (l ErrorList) Sort() { sort.Stable(l) }

// Err returns nil if the list is empty and the list itself otherwise.
func (l ErrorList) Err() error {
	if len(l) == 0 {
		return nil
	}
	return l
}

// Error returns the first error followed by the count of the others.
func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	return fmt.Sprintf("%s (and %d more errors)", l[0], len(l)-1)
}

// Unwrap returns the errors of the list, so that errors.As finds the first
// *Error in it.
func (l ErrorList) Unwrap() []error {
	errs := make([]error, len(l))
	for i, e := range l {
		errs[i] = e
	}
	return errs
}
