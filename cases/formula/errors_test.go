package formula

import (
	"errors"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "update golden files")

// errorTests pairs a bad formula with the column (1-based, in runes) of its
// first error and a string that must appear in that error's message. Columns
// are counted on the source by hand.
var errorTests = []struct {
	name, src string
	col       int
	msg       string
}{
	{"empty", "", 1, "empty formula"},
	{"blank", "   ", 1, "empty formula"},
	{"implicit number name", "2x", 2, "use 2*x"},
	{"implicit with space", "2 x", 3, "use 2*x"},
	{"implicit names", "a b", 3, "use a*b"},
	{"implicit paren", "(a)(b)", 4, "insert * to multiply"},
	{"implicit number paren", "2(x+1)", 2, "implicit multiplication is not supported"},
	{"x as function", "x(1+x)", 2, `"x" is not a function`},
	{"parameter as function", "a(x)", 2, `"a" is not a function`},
	{"unknown function", "sinn(x)", 1, `unknown function "sinn"; did you mean "sin"?`},
	{"unknown function case", "Cos(x)", 1, `did you mean "cos"?`},
	{"unknown function far", "1 + bessel(x)", 5, "the functions are cos, cosh"},
	{"ln", "ln(x)", 1, `did you mean "log"?`},
	{"pow", "pow(x)", 1, "write a^b for powers"},
	{"unknown name", "x + V1", 5, `unknown name "V1"; did you mean "V0"?`},
	{"unknown name case", "2*PI", 3, `did you mean "pi"?`},
	{"unknown name far", "x*zeta", 3, "neither x, pi, i nor a parameter"},
	{"euler", "e^x", 1, "exp(1)"},
	{"abs", "abs(x)", 1, "not analytic"},
	{"step", "1 + step(x - 1)", 5, "Q must be evaluated in the complex plane"},
	{"min", "min(x)", 1, `function "min" is not supported`},
	{"function without parens", "sin x", 1, "needs its argument in parentheses: sin(x)"},
	{"function alone", "2*sqrt", 3, "sqrt(…)"},
	{"unclosed", "(x+1", 1, `unclosed "("`},
	{"unclosed call", "2*sin(x", 6, `unclosed "("`},
	{"unclosed inner", "((x)", 1, `unclosed "("`},
	{"closing bracket", "(x+1 ]", 6, "use ( ) for grouping"},
	{"unmatched", "x+1)", 4, `unmatched ")"`},
	{"empty parens", "sin()", 4, "empty parentheses"},
	{"two arguments", "sin(x,y)", 6, "functions take one argument"},
	{"trailing operator", "x +", 4, `missing operand after "+" at the end`},
	{"leading operator", "*x", 1, `missing operand before "*"`},
	{"double operator", "x*/2", 3, `missing operand after "*" before "/"`},
	{"caret without base", "^2", 1, `missing base before "^"`},
	{"missing exponent", "x^", 3, "missing operand"},
	{"operand before paren", "(x-)", 4, `before ")"`},
	{"star star", "x**2", 2, "use ^ for powers"},
	{"bracket", "[x]", 1, "use ( ) for grouping"},
	{"equals", "Q = x", 3, `give the right-hand side only`},
	{"unicode minus", "1 − x", 3, "unicode minus"},
	{"unicode pi", "2π", 2, "write pi"},
	{"unicode times", "x·2", 2, "use * for multiplication"},
	{"unicode letter", "2*é", 3, `unexpected character 'é'`},
	{"bad utf8", "x + \xff", 5, "invalid utf-8"},
	{"exponent digits", "1e", 1, `malformed number "1e": the exponent has no digits`},
	{"exponent sign", "2*1e+", 3, "the exponent has no digits"},
	{"two points", "1.2.3", 1, `malformed number "1.2.3"`},
	{"lone point", "x + .", 5, `malformed number "."`},
	{"overflow", "1e400*x", 1, "number 1e400 is out of range"},
	{"underflow", "1e-400*x", 1, "too small"},
	{"second line", "x +\n  sinn(x)", 3, `did you mean "sin"?`},
	{"too deep", strings.Repeat("(", 300) + "x" + strings.Repeat(")", 300), 201, "nested too deeply"},
	{"too deep minus", strings.Repeat("-", 300) + "x", 201, "nested too deeply"},
	{"too long", strings.Repeat("x+", 40000) + "x", 1, "formula longer than 65536 bytes"},
	{"too deep powers", strings.Repeat("x^", 300) + "x", 403, "nested too deeply"},
}

func TestErrors(t *testing.T) {
	t.Parallel()
	for _, test := range errorTests {
		_, err := Parse(test.src, testParams)
		if err == nil {
			t.Errorf("%s: Parse(%q) succeeded, want an error", test.name, test.src)
			continue
		}
		var e *Error
		if !errors.As(err, &e) {
			t.Errorf("%s: Parse(%q) error %T is not a *Error", test.name, test.src, err)
			continue
		}
		if e.Column != test.col || !strings.Contains(e.Msg, test.msg) {
			t.Errorf("%s: Parse(%q) error at column %d: %q, want column %d: ...%q...", test.name, test.src, e.Column, e.Msg, test.col, test.msg)
		}
		if e.Offset < 0 || e.Offset+e.Len > len(test.src) {
			t.Errorf("%s: Parse(%q) error span [%d, %d) outside the source", test.name, test.src, e.Offset, e.Offset+e.Len)
		}
		if m := e.Msg; m != strings.ToLower(m[:1])+m[1:] || strings.HasSuffix(m, ".") {
			t.Errorf("%s: message %q must start in lower case and not end in a period", test.name, m)
		}
	}
}

func TestErrorList(t *testing.T) {
	t.Parallel()
	// Errors of meaning do not stop the parse: all three names are reported,
	// in source order.
	src := "foo*x + sinn(x) + abs(x)"
	_, err := Parse(src, testParams)
	var list ErrorList
	if !errors.As(err, &list) {
		t.Fatalf("Parse(%q) error %T, want an ErrorList", src, err)
	}
	cols := []int{}
	for _, e := range list {
		cols = append(cols, e.Column)
	}
	if len(cols) != 3 || cols[0] != 1 || cols[1] != 9 || cols[2] != 19 {
		t.Errorf("Parse(%q) error columns %v, want [1 9 19]", src, cols)
	}
	want := `column 1: unknown name "foo"; it is neither x, pi, i nor a parameter of the case (and 2 more errors)`
	if got := err.Error(); got != want {
		t.Errorf("Error() = %q, want %q", got, want)
	}
	var first *Error
	if !errors.As(err, &first) || first != list[0] {
		t.Errorf("errors.As(ErrorList, *Error) did not find the first error")
	}

	var l ErrorList
	if l.Err() != nil {
		t.Errorf("empty ErrorList.Err() = %v, want nil", l.Err())
	}
	l.Add(&Error{Offset: 5, Msg: "b"})
	l.Add(&Error{Offset: 2, Msg: "a"})
	l.Sort()
	if l[0].Msg != "a" || l.Err() == nil || l.Error() != "column 3: a (and 1 more errors)" {
		t.Errorf("ErrorList after Add, Sort: %v", l)
	}
}

func TestNewErrorColumn(t *testing.T) {
	t.Parallel()
	// Positions counted by hand: "é" is two bytes and one rune.
	for _, test := range []struct {
		src       string
		offs      int
		line, col int
	}{
		{"éé + x ?", 9, 1, 8},
		{"ab\ncé?", 6, 2, 3},
		{"x", 1, 1, 2},
	} {
		e := newError(test.src, test.offs, 1, "m")
		if e.Line != test.line || e.Column != test.col {
			t.Errorf("newError(%q, %d) at %d:%d, want %d:%d", test.src, test.offs, e.Line, e.Column, test.line, test.col)
		}
	}
}

func TestBadParams(t *testing.T) {
	t.Parallel()
	for _, test := range []struct {
		name, msg string
	}{
		{"sin", "it is a function"},
		{"x", "it is the variable"},
		{"pi", "it is a constant"},
		{"i", "it is a constant"},
		{"2a", "not an identifier"},
		{"a-b", "not an identifier"},
		{"", "empty parameter name"},
	} {
		_, err := Parse("x", []string{"a", test.name})
		var e *Error
		if !errors.As(err, &e) || e.Offset != -1 || !strings.Contains(e.Msg, test.msg) {
			t.Errorf("Parse with parameter %q: %v, want ...%q... at offset -1", test.name, err, test.msg)
			continue
		}
		if err := CheckParam(test.name); err == nil || err.Error() != e.Msg {
			t.Errorf("CheckParam(%q) = %v, want %q", test.name, err, e.Msg)
		}
		if e.Error() != e.Msg || e.Excerpt("x") != "" {
			t.Errorf("parameter error %q prints a position", e.Error())
		}
	}
	if err := CheckParam("V0"); err != nil {
		t.Errorf("CheckParam(V0) = %v", err)
	}
	// Names that are not analytic functions may be parameters.
	if _, err := Parse("theta*step + x", []string{"theta", "step"}); err != nil {
		t.Errorf("parameters theta, step: %v", err)
	}
}

// TestExcerpt compares the excerpts of the errors of a few formulas with
// testdata/excerpt.golden; run with -update to rewrite it.
func TestExcerpt(t *testing.T) {
	var b strings.Builder
	for _, src := range []string{
		"2*sinn(x) + 1",
		"2x",
		"(1 + x^2",
		"\tx + abs(x)",
		"2*é",
		"x +\n  1e",
		"",
		"x + ",
	} {
		_, err := Parse(src, testParams)
		var e *Error
		if !errors.As(err, &e) {
			t.Fatalf("Parse(%q) = %v, want a *Error", src, err)
		}
		b.WriteString(e.Error() + "\n" + e.Excerpt(src) + "\n\n")
	}
	golden := filepath.Join("testdata", "excerpt.golden")
	if *update {
		if err := os.WriteFile(golden, []byte(b.String()), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatal(err)
	}
	if got := b.String(); got != string(want) {
		t.Errorf("excerpts differ from %s:\n%s\nwant:\n%s", golden, got, want)
	}
}
