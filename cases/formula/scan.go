package formula

import (
	"fmt"
	"strconv"
	"strings"
	"unicode/utf8"
)

// tokenKind is the kind of a lexical token.
type tokenKind int

const (
	tokEOF    tokenKind = iota // end of the source
	tokNumber                  // 2, 1.5, .5, 1e-3
	tokIdent                   // x, pi, sin, V0
	tokPlus                    // +
	tokMinus                   // -
	tokStar                    // *
	tokSlash                   // /
	tokCaret                   // ^
	tokLParen                  // (
	tokRParen                  // )
)

// token is one lexical token: its kind, its byte span in the source and, for
// numbers, its value.
type token struct {
	kind tokenKind
	offs int     // byte offset of the first character
	end  int     // byte offset just past the last character
	val  float64 // value of a number
}

// scanner splits a formula into tokens. It reports every error through its
// error method, which the parser turns into a bail-out.
type scanner struct {
	// immutable state
	src string

	// scanning state
	offs int // byte offset of the next unread character

	// err is called for each error; it does not return.
	err func(offs, n int, msg string)
}

func isLetter(c byte) bool { return c == '_' || 'a' <= c && c <= 'z' || 'A' <= c && c <= 'Z' }
func isDigit(c byte) bool  { return '0' <= c && c <= '9' }

// next returns the next token.
func (s *scanner) next() token {
	for s.offs < len(s.src) {
		switch s.src[s.offs] {
		case ' ', '\t', '\n', '\r':
			s.offs++
			continue
		}
		break
	}
	start := s.offs
	if start >= len(s.src) {
		return token{kind: tokEOF, offs: start, end: start}
	}
	c := s.src[start]
	switch {
	case isLetter(c):
		for s.offs < len(s.src) && (isLetter(s.src[s.offs]) || isDigit(s.src[s.offs])) {
			s.offs++
		}
		return token{kind: tokIdent, offs: start, end: s.offs}
	case isDigit(c) || c == '.':
		return s.number()
	}
	s.offs++
	kind := tokEOF
	switch c {
	case '+':
		kind = tokPlus
	case '-':
		kind = tokMinus
	case '*':
		if s.offs < len(s.src) && s.src[s.offs] == '*' {
			s.err(start, 2, `"**" is not an operator; use ^ for powers`)
		}
		kind = tokStar
	case '/':
		kind = tokSlash
	case '^':
		kind = tokCaret
	case '(':
		kind = tokLParen
	case ')':
		kind = tokRParen
	case '[', ']', '{', '}':
		s.err(start, 1, fmt.Sprintf("unexpected %q; use ( ) for grouping", c))
	case ',':
		s.err(start, 1, `unexpected ","; functions take one argument`)
	case '=':
		s.err(start, 1, `unexpected "="; give the right-hand side only`)
	default:
		r, n := utf8.DecodeRuneInString(s.src[start:])
		switch {
		case r == utf8.RuneError && n == 1:
			s.err(start, 1, "invalid utf-8 encoding")
		case r == '−':
			s.err(start, n, `unexpected "−" (unicode minus); use the ascii "-"`)
		case r == '·' || r == '×':
			s.err(start, n, fmt.Sprintf("unexpected %q; use * for multiplication", r))
		case r == 'π':
			s.err(start, n, `unexpected "π"; write pi`)
		}
		s.err(start, n, fmt.Sprintf("unexpected character %q", r))
	}
	return token{kind: kind, offs: start, end: s.offs}
}

// number scans a decimal number: digits, an optional fraction and an optional
// exponent, with at least one digit before the exponent.
func (s *scanner) number() token {
	start := s.offs
	digits := func() int {
		n := 0
		for s.offs < len(s.src) && isDigit(s.src[s.offs]) {
			s.offs++
			n++
		}
		return n
	}
	n := digits()
	if s.offs < len(s.src) && s.src[s.offs] == '.' {
		s.offs++
		n += digits()
	}
	if n == 0 {
		s.err(start, s.offs-start, `malformed number "."`)
	}
	if s.offs < len(s.src) && (s.src[s.offs] == 'e' || s.src[s.offs] == 'E') {
		// An exponent must have digits; "2e" is neither a number nor 2*e.
		s.offs++
		if s.offs < len(s.src) && (s.src[s.offs] == '+' || s.src[s.offs] == '-') {
			s.offs++
		}
		if digits() == 0 {
			s.err(start, s.offs-start, fmt.Sprintf("malformed number %q: the exponent has no digits", s.src[start:s.offs]))
		}
	}
	if s.offs < len(s.src) && (s.src[s.offs] == '.' || isDigit(s.src[s.offs])) {
		end := s.offs
		for end < len(s.src) && (s.src[end] == '.' || isDigit(s.src[end])) {
			end++
		}
		s.err(start, end-start, fmt.Sprintf("malformed number %q", s.src[start:end]))
	}
	text := s.src[start:s.offs]
	v, err := strconv.ParseFloat(text, 64)
	if err != nil {
		// The syntax is checked above, so only the range can be wrong.
		s.err(start, s.offs-start, fmt.Sprintf("number %s is out of range", text))
	}
	if v == 0 && strings.ContainsAny(text[:mantissaLen(text)], "123456789") {
		s.err(start, s.offs-start, fmt.Sprintf("number %s is out of range: it is too small and would be zero", text))
	}
	return token{kind: tokNumber, offs: start, end: s.offs, val: v}
}

// mantissaLen returns the length of the part of a number before its exponent.
func mantissaLen(text string) int {
	if i := strings.IndexAny(text, "eE"); i >= 0 {
		return i
	}
	return len(text)
}
