package cases

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"
	"time"
	"unicode/utf8"

	"github.com/BurntSushi/toml"
)

// decoder checks a decoded TOML document against the case-file format and
// collects every problem with its position.
type decoder struct {
	filename   string
	src        string
	spans      map[string]srcSpan
	errs       ErrorList
	lineStarts []int    // byte offset of each line, computed on the first error
	paramNames []string // the parameters with a usable name, sorted
}

// line returns the text of line n (1-based) without its line end, and
// whether the source has such a line.
func (d *decoder) line(n int) (string, bool) {
	if d.lineStarts == nil {
		d.lineStarts = []int{0}
		for i := 0; i < len(d.src); i++ {
			if d.src[i] == '\n' {
				d.lineStarts = append(d.lineStarts, i+1)
			}
		}
	}
	if n < 1 || n > len(d.lineStarts) {
		return "", false
	}
	start, end := d.lineStarts[n-1], len(d.src)
	if n < len(d.lineStarts) {
		end = d.lineStarts[n] - 1
	}
	return strings.TrimSuffix(d.src[start:end], "\r"), true
}

// table is one TOML table being read: its path, its contents and the keys the
// format knows in it.
type table struct {
	d     *decoder
	path  string // "" for the document, "graded", "expect[0]", "region.box"
	name  string // for messages: "graded", "expect", "region.box"
	m     map[string]any
	known []string
}

// decodeTOML parses src as TOML. A syntax error becomes an Error placed where
// the TOML decoder put it.
func (d *decoder) decodeTOML() map[string]any {
	var m map[string]any
	_, err := toml.Decode(d.src, &m)
	if err == nil {
		return m
	}
	var pe toml.ParseError
	if errors.As(err, &pe) {
		line := pe.Position.Line
		col := 0
		start := pe.Position.Start
		for start > 0 && start < len(d.src) && !utf8.RuneStart(d.src[start]) {
			start-- // the decoder may point into the middle of a character
		}
		if start >= 0 && start <= len(d.src) && (start > 0 || line <= 1) {
			ls := strings.LastIndexByte(d.src[:start], '\n') + 1
			col = utf8.RuneCountInString(d.src[ls:start]) + 1
			line = strings.Count(d.src[:ls], "\n") + 1
		}
		n := 1
		if e := pe.Position.Start + pe.Position.Len; pe.Position.Len > 0 && e <= len(d.src) && start >= 0 && start <= e {
			n = max(utf8.RuneCountInString(d.src[start:e]), 1)
		}
		d.errorSpan(line, col, n, "invalid TOML: "+pe.Message)
		return nil
	}
	d.errorAt(Position{}, "invalid TOML: "+strings.TrimPrefix(err.Error(), "toml: "))
	return nil
}

// errorAt adds an error at a position of the file, with its excerpt.
func (d *decoder) errorAt(p Position, msg string) {
	d.errorSpan(p.Line, p.Column, 1, msg)
}

// errorSpan adds an error spanning n characters from line:col.
func (d *decoder) errorSpan(line, col, n int, msg string) {
	text, ok := d.line(line)
	if !ok {
		line, col = 0, 0 // never report a place outside the file
	}
	e := &Error{Pos: Position{Filename: d.filename, Line: line, Column: col}, Msg: msg}
	if line > 0 {
		e.Excerpt = excerpt(text, line, col, n)
	}
	d.errs = append(d.errs, e)
}

// valuePos returns the position of the value of key in t, or of t itself
// when the key was not found in the source.
func (t *table) valuePos(key string) Position {
	if sp, ok := t.d.spans[join(t.path, key)]; ok {
		return Position{Filename: t.d.filename, Line: sp.valLine, Column: sp.valCol}
	}
	return t.pos()
}

// keyPos returns the position of key in t, or of t itself.
func (t *table) keyPos(key string) Position {
	if sp, ok := t.d.spans[join(t.path, key)]; ok {
		return Position{Filename: t.d.filename, Line: sp.line, Column: sp.col}
	}
	return t.pos()
}

// pos returns the position of the table's header (or first key).
func (t *table) pos() Position {
	if sp, ok := t.d.spans[t.path]; ok && t.path != "" {
		return Position{Filename: t.d.filename, Line: sp.line, Column: sp.col}
	}
	return Position{Filename: t.d.filename}
}

func (t *table) errorf(pos Position, format string, args ...any) {
	t.d.errorAt(pos, fmt.Sprintf(format, args...))
}

// valueErrorf reports a problem with the value of key, with carets under
// the whole value when it lies on one line.
func (t *table) valueErrorf(key, format string, args ...any) {
	msg := fmt.Sprintf(format, args...)
	sp, ok := t.d.spans[join(t.path, key)]
	if k := strings.IndexByte(key, '['); !ok && k > 0 {
		sp, ok = t.d.spans[join(t.path, key[:k])] // the whole array
	}
	if !ok {
		t.d.errorAt(t.pos(), msg)
		return
	}
	n := 1
	if end := min(sp.valEnd, len(t.d.src)); sp.valOff < end {
		v := t.d.src[sp.valOff:end]
		if k := strings.IndexAny(v, "\r\n"); k >= 0 {
			v = v[:k]
		}
		n = max(utf8.RuneCountInString(strings.TrimRight(v, " \t")), 1)
	}
	t.d.errorSpan(sp.valLine, sp.valCol, n, msg)
}

// qualified returns the name of key for messages: "graded.index".
func (t *table) qualified(key string) string {
	if t.path == "" {
		return key
	}
	return t.label() + "." + key
}

// label is the path with array indices shown 1-based: "expect[2]".
func (t *table) label() string { return t.name }

// has reports whether key is present.
func (t *table) has(key string) bool {
	_, ok := t.m[key]
	return ok
}

// finish reports the keys of t that the format does not know, suggesting the
// closest known key. Only the key itself is reported, not what it holds.
func (t *table) finish() {
	keys := make([]string, 0, len(t.m))
	for k := range t.m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		if contains(t.known, k) {
			continue
		}
		where := "at the top level"
		if t.path != "" {
			where = "in " + t.describe()
		}
		msg := fmt.Sprintf("unknown key %q %s", k, where)
		if s := suggest(k, t.known); s != "" {
			msg += fmt.Sprintf("; did you mean %q?", s)
		} else {
			msg += "; known keys: " + strings.Join(t.known, ", ")
		}
		p := t.keyPos(k)
		t.d.errorSpan(p.Line, p.Column, utf8.RuneCountInString(k), msg)
	}
}

// describe names the table for messages: "[graded]", "region.box".
func (t *table) describe() string {
	if strings.HasPrefix(t.path, "expect[") {
		return "[[expect]]"
	}
	if strings.Contains(t.name, ".") || strings.HasPrefix(t.name, "[") {
		return t.name
	}
	return "[" + t.name + "]"
}

func contains(list []string, s string) bool {
	for _, k := range list {
		if k == s {
			return true
		}
	}
	return false
}

// sub returns the table under key, or nil (reporting an error if the value
// is not a table).
func (t *table) sub(key string, known ...string) *table {
	v, ok := t.m[key]
	if !ok {
		return nil
	}
	m, ok := v.(map[string]any)
	if !ok {
		t.valueErrorf(key, "%s must be a table, not %s", t.qualified(key), typeName(v))
		return nil
	}
	name := key
	if t.path != "" {
		name = t.label() + "." + key
	}
	return &table{d: t.d, path: join(t.path, key), name: name, m: m, known: known}
}

// typeName names the TOML type of a decoded value, with its article.
func typeName(v any) string {
	switch v.(type) {
	case string:
		return "a string"
	case int64:
		return "an integer"
	case float64:
		return "a number"
	case bool:
		return "a boolean"
	case time.Time:
		return "a date or time"
	case map[string]any:
		return "a table"
	case []any, []map[string]any:
		return "an array"
	}
	return fmt.Sprintf("a %T", v)
}

// number returns key as a finite float64 (TOML integers are accepted). ok is
// false when the key is absent or the value is wrong; wrong values are
// reported.
func (t *table) number(key string) (x float64, ok bool) {
	v, present := t.m[key]
	if !present {
		return 0, false
	}
	return t.toNumber(v, t.qualified(key), key)
}

// toNumber converts v, the value of key or an element of it, named name in
// messages.
func (t *table) toNumber(v any, name, key string) (float64, bool) {
	var x float64
	switch v := v.(type) {
	case float64:
		x = v
	case int64:
		x = float64(v)
	default:
		t.valueErrorf(key, "%s must be a number, not %s", name, typeName(v))
		return 0, false
	}
	if math.IsNaN(x) || math.IsInf(x, 0) {
		t.valueErrorf(key, "%s must be a finite number, got %v", name, x)
		return 0, false
	}
	return x, true
}

// required is number for a key that must be present.
func (t *table) required(key, what string) (float64, bool) {
	if !t.has(key) {
		t.errorf(t.pos(), "%s needs %s (%s)", t.describe(), key, what)
		return 0, false
	}
	return t.number(key)
}

// positive is required with x > 0.
func (t *table) positive(key, what string) (float64, bool) {
	x, ok := t.required(key, what)
	if ok && x <= 0 {
		t.valueErrorf(key, "%s must be positive, got %v", t.qualified(key), x)
		return x, false
	}
	return x, ok
}

// integer returns key as an int. A float is refused, even an integral one,
// so that 2.5 cannot silently become 2.
func (t *table) integer(key string) (int, bool) {
	v, present := t.m[key]
	if !present {
		return 0, false
	}
	return t.toInteger(v, t.qualified(key), key)
}

// toInteger converts v, the value of key or an element of it, named name in
// messages.
func (t *table) toInteger(v any, name, key string) (int, bool) {
	n, ok := v.(int64)
	if !ok {
		t.valueErrorf(key, "%s must be an integer, not %s", name, typeName(v))
		return 0, false
	}
	if n > math.MaxInt32 || n < math.MinInt32 {
		t.valueErrorf(key, "%s is out of range: %d", name, n)
		return 0, false
	}
	return int(n), true
}

// str returns key as a string.
func (t *table) str(key string) (string, bool) {
	v, present := t.m[key]
	if !present {
		return "", false
	}
	s, ok := v.(string)
	if !ok {
		t.valueErrorf(key, "%s must be a string, not %s", t.qualified(key), typeName(v))
		return "", false
	}
	return s, true
}

// choice returns key as one of the allowed strings, def when absent.
func (t *table) choice(key, def string, allowed ...string) (string, bool) {
	s, ok := t.str(key)
	if !ok {
		return def, !t.has(key)
	}
	if contains(allowed, s) {
		return s, true
	}
	msg := fmt.Sprintf("%s must be %s, got %q", t.qualified(key), orList(allowed), s)
	if sug := suggest(s, allowed); sug != "" {
		msg += fmt.Sprintf("; did you mean %q?", sug)
	}
	t.valueErrorf(key, "%s", msg)
	return def, false
}

// orList quotes the strings and joins them: "a", "b" or "c".
func orList(list []string) string {
	q := make([]string, len(list))
	for i, s := range list {
		q[i] = strconv.Quote(s)
	}
	if len(q) == 1 {
		return q[0]
	}
	return strings.Join(q[:len(q)-1], ", ") + " or " + q[len(q)-1]
}

// array returns key as an array of values.
func (t *table) array(key string) ([]any, bool) {
	v, present := t.m[key]
	if !present {
		return nil, false
	}
	switch v := v.(type) {
	case []any:
		return v, true
	case []map[string]any:
		a := make([]any, len(v))
		for i := range v {
			a[i] = v[i]
		}
		return a, true
	}
	t.valueErrorf(key, "%s must be an array, not %s", t.qualified(key), typeName(v))
	return nil, false
}

// pair returns key as an array [lo, hi] of two finite numbers with lo < hi.
func (t *table) pair(key string) (lo, hi float64, ok bool) {
	a, ok := t.array(key)
	if !ok {
		return 0, 0, false
	}
	name := t.qualified(key)
	if len(a) != 2 {
		t.valueErrorf(key, "%s must be an array of two numbers [lo, hi], got %d elements", name, len(a))
		return 0, 0, false
	}
	lo, ok1 := t.toNumber(a[0], name+"[0]", key+"[0]")
	hi, ok2 := t.toNumber(a[1], name+"[1]", key+"[1]")
	if !ok1 || !ok2 {
		return 0, 0, false
	}
	switch {
	case lo == hi:
		t.valueErrorf(key, "%s is empty: both ends are %v", name, lo)
		return 0, 0, false
	case lo > hi:
		t.valueErrorf(key, "%s is reversed: %v > %v; write [%v, %v]", name, lo, hi, hi, lo)
		return 0, 0, false
	case math.IsInf(hi-lo, 0):
		t.valueErrorf(key, "%s is too wide: its length %v - (%v) overflows", name, hi, lo)
		return 0, 0, false
	}
	return lo, hi, true
}

// suggest returns the candidate closest to name if it is close enough to be
// a likely misspelling, or "".
func suggest(name string, candidates []string) string {
	best, bestD := "", -1
	for _, c := range candidates {
		if strings.EqualFold(c, name) {
			return c
		}
		d := editDistance(name, c)
		if bestD < 0 || d < bestD {
			best, bestD = c, d
		}
	}
	limit := 2
	if n := utf8.RuneCountInString(name); n <= 3 {
		limit = 1
	}
	if bestD >= 0 && bestD <= limit {
		return best
	}
	if utf8.RuneCountInString(name) >= 3 {
		for _, c := range candidates {
			if strings.HasPrefix(c, name) {
				return c // an abbreviation
			}
		}
	}
	return ""
}

// editDistance returns the Levenshtein distance of a and b in runes.
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}
