package cases

import (
	"strconv"
	"strings"
	"unicode/utf8"
)

// The TOML decoder does not export where keys and values are, so the case
// loader finds them with this small scanner of its own. It runs only on
// sources the decoder has accepted, but it never indexes past the input
// whatever it is given.
//
// Key paths are the dotted keys joined with ".", with "[i]" after the name of
// an array of tables for its i-th element: "graded.index", "region.box.re",
// "expect[1].value". A table header is recorded under the table's path.

// srcSpan locates a key and its value.
type srcSpan struct {
	line, col int // of the key (or of the table header)
	valLine   int // of the value
	valCol    int // column of the value's first character
	valOff    int // byte offset of the value in the source
	valEnd    int // byte offset just past the value
}

// keyScanner walks a TOML source and records the span of every key.
type keyScanner struct {
	src       string
	pos       int // byte offset of the next character
	line      int // line of pos, 1-based
	lineStart int // byte offset of the start of that line
	spans     map[string]srcSpan
	arrays    map[string]int // number of elements seen of each array of tables
}

// scanKeys returns the span of every key of src.
func scanKeys(src string) map[string]srcSpan {
	s := &keyScanner{src: src, line: 1, spans: map[string]srcSpan{}, arrays: map[string]int{}}
	if strings.HasPrefix(src, "\uFEFF") { // a byte-order mark is not a column
		s.pos, s.lineStart = 3, 3
	}
	s.run()
	return s.spans
}

func (s *keyScanner) eof() bool { return s.pos >= len(s.src) }

func (s *keyScanner) peek() byte {
	if s.eof() {
		return 0
	}
	return s.src[s.pos]
}

func (s *keyScanner) hasPrefix(p string) bool { return strings.HasPrefix(s.src[s.pos:], p) }

// advance moves past one byte, keeping the line count.
func (s *keyScanner) advance() {
	if s.eof() {
		return
	}
	if s.src[s.pos] == '\n' {
		s.line++
		s.lineStart = s.pos + 1
	}
	s.pos++
}

// col returns the character column of byte offset off on the current line.
func (s *keyScanner) col(off int) int {
	if off < s.lineStart || off > len(s.src) {
		return 0
	}
	return utf8.RuneCountInString(s.src[s.lineStart:off]) + 1
}

// skipSpace skips blanks; with newlines it also skips line ends and comments.
func (s *keyScanner) skipSpace(newlines bool) {
	for !s.eof() {
		switch c := s.peek(); {
		case c == ' ' || c == '\t':
			s.advance()
		case newlines && (c == '\n' || c == '\r'):
			s.advance()
		case newlines && c == '#':
			s.skipLine()
		default:
			return
		}
	}
}

// skipLine moves to the start of the next line.
func (s *keyScanner) skipLine() {
	for !s.eof() && s.peek() != '\n' {
		s.advance()
	}
	s.advance()
}

func (s *keyScanner) record(path string, sp srcSpan) {
	if _, ok := s.spans[path]; !ok {
		s.spans[path] = sp
	}
}

func (s *keyScanner) run() {
	table := ""
	for !s.eof() {
		s.skipSpace(true)
		if s.eof() {
			return
		}
		start := s.pos
		line, col := s.line, s.col(start)
		if s.peek() == '[' {
			array := s.hasPrefix("[[")
			s.advance()
			if array {
				s.advance()
			}
			parts := s.key()
			table = s.tablePath(parts, array)
			s.record(table, srcSpan{line: line, col: col, valLine: line, valCol: col, valOff: start, valEnd: s.pos})
			s.skipLine()
			continue
		}
		parts := s.key()
		if len(parts) == 0 {
			s.skipLine() // not a key: cannot happen in accepted TOML
			continue
		}
		s.keyValue(table, parts, line, col)
		s.skipLine()
	}
}

// tablePath returns the path of a table header, counting the elements of
// arrays of tables.
func (s *keyScanner) tablePath(parts []string, array bool) string {
	path := ""
	for i, p := range parts {
		path = join(path, p)
		if i == len(parts)-1 && array {
			n := s.arrays[path]
			s.arrays[path] = n + 1
			path += "[" + strconv.Itoa(n) + "]"
		} else if n := s.arrays[path]; n > 0 {
			path += "[" + strconv.Itoa(n-1) + "]"
		}
	}
	return path
}

// keyValue records the key (whose dotted parts have been read) and its
// value, then skips the value.
func (s *keyScanner) keyValue(table string, parts []string, line, col int) {
	path := table
	for i, p := range parts {
		path = join(path, p)
		if i < len(parts)-1 {
			s.record(path, srcSpan{line: line, col: col, valLine: line, valCol: col, valOff: s.pos, valEnd: s.pos})
		}
	}
	s.skipSpace(false)
	if s.peek() != '=' {
		return
	}
	s.advance()
	s.skipSpace(false)
	vl, vc, off := s.line, s.col(s.pos), s.pos
	s.value(path)
	s.record(path, srcSpan{line: line, col: col, valLine: vl, valCol: vc, valOff: off, valEnd: s.pos})
}

func join(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

// key reads a dotted key and returns its parts; it stops after the key and
// the blanks that follow it, or at the first character that cannot be part of
// a key (then returning what it has).
func (s *keyScanner) key() []string {
	var parts []string
	for {
		s.skipSpace(false)
		var part string
		switch c := s.peek(); {
		case c == '"':
			part = s.quotedKey()
		case c == '\'':
			s.advance()
			k := s.pos
			for !s.eof() && s.peek() != '\'' && s.peek() != '\n' {
				s.advance()
			}
			part = s.src[k:s.pos]
			s.advance()
		case isBare(c):
			k := s.pos
			for !s.eof() && isBare(s.peek()) {
				s.advance()
			}
			part = s.src[k:s.pos]
		default:
			return parts
		}
		parts = append(parts, part)
		s.skipSpace(false)
		if s.peek() != '.' {
			return parts
		}
		s.advance()
	}
}

// quotedKey reads a basic-string key and returns its value.
func (s *keyScanner) quotedKey() string {
	k := s.pos
	s.advance()
	for !s.eof() && s.peek() != '"' && s.peek() != '\n' {
		if s.peek() == '\\' {
			s.advance()
		}
		s.advance()
	}
	s.advance()
	raw := s.src[k:min(s.pos, len(s.src))]
	if v, err := strconv.Unquote(raw); err == nil {
		return v
	}
	return strings.Trim(raw, `"`)
}

func isBare(c byte) bool {
	return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_' || c == '-'
}

// value skips one value, recording the keys of inline tables under path.
func (s *keyScanner) value(path string) {
	switch {
	case s.hasPrefix(`"""`):
		s.pos += 3
		s.multiline(`"""`, true)
	case s.hasPrefix(`'''`):
		s.pos += 3
		s.multiline(`'''`, false)
	case s.peek() == '"':
		s.advance()
		for !s.eof() && s.peek() != '"' && s.peek() != '\n' {
			if s.peek() == '\\' {
				s.advance()
			}
			s.advance()
		}
		if s.peek() == '"' {
			s.advance()
		}
	case s.peek() == '\'':
		s.advance()
		for !s.eof() && s.peek() != '\'' && s.peek() != '\n' {
			s.advance()
		}
		if s.peek() == '\'' {
			s.advance()
		}
	case s.peek() == '[':
		s.advance()
		for i := 0; ; i++ {
			s.skipSpace(true)
			if s.eof() {
				return
			}
			if s.peek() == ']' {
				s.advance()
				return
			}
			before := s.pos
			vl, vc := s.line, s.col(s.pos)
			elem := path + "[" + strconv.Itoa(i) + "]"
			s.value(elem)
			s.record(elem, srcSpan{line: vl, col: vc, valLine: vl, valCol: vc, valOff: before, valEnd: s.pos})
			s.skipSpace(true)
			if s.peek() == ',' {
				s.advance()
			} else if s.pos == before {
				s.advance() // make progress on input the decoder would refuse
			}
		}
	case s.peek() == '{':
		s.advance()
		for {
			s.skipSpace(true)
			if s.eof() {
				return
			}
			if s.peek() == '}' {
				s.advance()
				return
			}
			if s.peek() == ',' {
				s.advance()
				continue
			}
			line, col := s.line, s.col(s.pos)
			before := s.pos
			parts := s.key()
			if len(parts) == 0 {
				if s.pos == before {
					s.advance()
				}
				continue
			}
			s.keyValue(path, parts, line, col)
		}
	default:
		for !s.eof() {
			switch s.peek() {
			case ',', ']', '}', '#', '\n', '\r':
				return
			}
			s.advance()
		}
	}
}

// multiline skips the rest of a multi-line string closed by delim; basic
// strings have backslash escapes. Up to two quotes of the delimiter's kind
// may precede the closing delimiter.
func (s *keyScanner) multiline(delim string, escapes bool) {
	for !s.eof() {
		if escapes && s.peek() == '\\' {
			s.advance()
			s.advance()
			continue
		}
		if s.hasPrefix(delim) {
			s.pos += 3
			for i := 0; i < 2 && s.peek() == delim[0]; i++ {
				s.pos++
			}
			return
		}
		s.advance()
	}
}
