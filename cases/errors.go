package cases

import (
	"fmt"
	"sort"
	"strconv"
	"strings"
	"unicode/utf8"
)

// Position is a place in a case file. Line and Column are 1-based; Column
// counts characters (Unicode code points) from the start of the line, so it
// matches what an editor shows for the usual ASCII files. A zero Line or
// Column means that part is not known.
type Position struct {
	Filename     string
	Line, Column int
}

// IsValid reports whether the position names a line.
func (p Position) IsValid() bool { return p.Line > 0 }

// String returns "file:line:col", leaving out the parts that are missing:
// "file:line", "file", "line:col", or "" for the zero Position.
func (p Position) String() string {
	var parts []string
	if p.Filename != "" {
		parts = append(parts, p.Filename)
	}
	if p.Line > 0 {
		parts = append(parts, strconv.Itoa(p.Line))
		if p.Column > 0 {
			parts = append(parts, strconv.Itoa(p.Column))
		}
	}
	return strings.Join(parts, ":")
}

// Error is one problem of a case file.
type Error struct {
	Pos Position
	Msg string
	// Excerpt shows the offending line of the file with carets under the
	// offending span, for people; it is empty when Pos has no line.
	Excerpt string
}

// Error returns "file:line:col: msg", or msg alone when the position is empty.
func (e *Error) Error() string {
	if s := e.Pos.String(); s != "" {
		return s + ": " + e.Msg
	}
	return e.Msg
}

// Detail returns Error() followed, when there is one, by the excerpt on the
// next lines.
func (e *Error) Detail() string {
	if e.Excerpt == "" {
		return e.Error()
	}
	return e.Error() + "\n" + e.Excerpt
}

// ErrorList is the list of problems of a case file. The zero value is an
// empty list ready to use. Parse and Load return one whenever a file has any
// problem, sorted by position.
type ErrorList []*Error

// Add appends an error at pos.
func (l *ErrorList) Add(pos Position, msg string) {
	*l = append(*l, &Error{Pos: pos, Msg: msg})
}

// Len returns the number of errors.
func (l ErrorList) Len() int { return len(l) }

// Swap swaps errors i and j.
func (l ErrorList) Swap(i, j int) { l[i], l[j] = l[j], l[i] }

// Less orders errors by file name, line and column; errors without a line
// come first in their file.
func (l ErrorList) Less(i, j int) bool {
	a, b := l[i].Pos, l[j].Pos
	if a.Filename != b.Filename {
		return a.Filename < b.Filename
	}
	if a.Line != b.Line {
		return a.Line < b.Line
	}
	return a.Column < b.Column
}

// Sort sorts the list by position, keeping the order of errors at the same
// position.
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

// Detail returns every error with its excerpt, one after the other, each
// ending in a newline.
func (l ErrorList) Detail() string {
	var b strings.Builder
	for _, e := range l {
		b.WriteString(e.Detail())
		b.WriteByte('\n')
	}
	return b.String()
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

// excerpt returns text, line number line of a file, with a gutter holding
// its number and, below it, n carets starting at column col (a character
// count). Tabs before the column are kept in the caret line so that the
// carets line up whatever the tab width. Without a column there is no caret
// line.
func excerpt(text string, line, col, n int) string {
	gutter := fmt.Sprintf("%5d | ", line)
	var b strings.Builder
	b.WriteString(gutter)
	b.WriteString(printable(text))
	if col < 1 {
		return b.String()
	}
	b.WriteByte('\n')
	b.WriteString(strings.Repeat(" ", len(gutter)-2))
	b.WriteString("| ")
	i := 1
	for _, r := range text {
		if i >= col {
			break
		}
		if r == '\t' {
			b.WriteByte('\t')
		} else {
			b.WriteByte(' ')
		}
		i++
	}
	for ; i < col; i++ {
		b.WriteByte(' ')
	}
	b.WriteString(strings.Repeat("^", max(n, 1)))
	return b.String()
}

// printable replaces control characters other than tab by U+FFFD so that an
// excerpt cannot garble a terminal.
func printable(s string) string {
	return strings.Map(func(r rune) rune {
		if r == '\t' {
			return r
		}
		if r < 0x20 || r == 0x7f || r == utf8.RuneError {
			return '\uFFFD'
		}
		return r
	}, s)
}
