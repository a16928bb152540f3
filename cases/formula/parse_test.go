package formula

import (
	"strconv"
	"strings"
	"testing"
)

// sexpr writes the tree under n as an S-expression, so that tests can state
// the structure the parser must produce independently of String.
func sexpr(n *node) string {
	switch n.kind {
	case nodeNumber:
		return strconv.FormatFloat(n.val, 'g', -1, 64)
	case nodeImag:
		return "i"
	case nodePi:
		return "pi"
	case nodeX:
		return "x"
	case nodeParam:
		return "$" + n.name
	case nodeNeg:
		return "(neg " + sexpr(n.a) + ")"
	case nodeCall:
		return "(" + n.fn.name + " " + sexpr(n.a) + ")"
	}
	op := map[nodeKind]string{nodeAdd: "+", nodeSub: "-", nodeMul: "*", nodeDiv: "/", nodePow: "^"}[n.kind]
	return "(" + op + " " + sexpr(n.a) + " " + sexpr(n.b) + ")"
}

var testParams = []string{"a", "b", "c", "E", "V0", "k_1"}

func TestParseTree(t *testing.T) {
	t.Parallel()
	for _, test := range []struct {
		src, tree, str string
	}{
		// Numbers.
		{"2", "2", "2"},
		{"1.5", "1.5", "1.5"},
		{".5", "0.5", "0.5"},
		{"5.", "5", "5"},
		{"1e-3", "0.001", "0.001"},
		{"2.5E+4", "25000", "25000"},
		{"1e21", "1e+21", "1e+21"},
		{"0.000001", "1e-06", "1e-06"},
		// Names.
		{"x", "x", "x"},
		{"pi", "pi", "pi"},
		{"i", "i", "i"},
		{"V0", "$V0", "V0"},
		{"k_1", "$k_1", "k_1"},
		// Precedence and associativity.
		{"-x^2", "(neg (^ x 2))", "-x^2"},
		{"2^3^2", "(^ 2 (^ 3 2))", "2^3^2"},
		{"(2^3)^2", "(^ (^ 2 3) 2)", "(2^3)^2"},
		{"x^-2", "(^ x (neg 2))", "x^-2"},
		{"x^+2", "(^ x 2)", "x^2"},
		{"x^-2^2", "(^ x (neg (^ 2 2)))", "x^-2^2"},
		{"x^--2", "(^ x (neg (neg 2)))", "x^--2"},
		{"a-b-c", "(- (- $a $b) $c)", "a - b - c"},
		{"a-(b-c)", "(- $a (- $b $c))", "a - (b - c)"},
		{"a+(b+c)", "(+ $a (+ $b $c))", "a + (b + c)"},
		{"a/b/c", "(/ (/ $a $b) $c)", "a/b/c"},
		{"a/(b/c)", "(/ $a (/ $b $c))", "a/(b/c)"},
		{"a*b/c", "(/ (* $a $b) $c)", "a*b/c"},
		{"a+b*c", "(+ $a (* $b $c))", "a + b*c"},
		{"(a+b)*c", "(* (+ $a $b) $c)", "(a + b)*c"},
		{"-a*b", "(* (neg $a) $b)", "-a*b"},
		{"-(a*b)", "(neg (* $a $b))", "-(a*b)"},
		{"a*-b", "(* $a (neg $b))", "a*-b"},
		{"a - -b", "(- $a (neg $b))", "a - -b"},
		{"+a", "$a", "a"},
		{"--a", "(neg (neg $a))", "--a"},
		{"(-x)^2", "(^ (neg x) 2)", "(-x)^2"},
		{"2^-x^2", "(^ 2 (neg (^ x 2)))", "2^-x^2"},
		{"x^-(a*b)", "(^ x (neg (* $a $b)))", "x^-(a*b)"},
		{"x^(a+b)", "(^ x (+ $a $b))", "x^(a + b)"},
		{"((x))", "x", "x"},
		// Functions.
		{"sin(x)", "(sin x)", "sin(x)"},
		{"sin(x)^2", "(^ (sin x) 2)", "sin(x)^2"},
		{"-cosh(x)^-2", "(neg (^ (cosh x) (neg 2)))", "-cosh(x)^-2"},
		{"exp(-x^2/2)", "(exp (/ (neg (^ x 2)) 2))", "exp(-x^2/2)"},
		{"2*(E - V0/cosh(x)^2)", "(* 2 (- $E (/ $V0 (^ (cosh x) 2))))", "2*(E - V0/cosh(x)^2)"},
		{"sqrt(1+x^2)", "(sqrt (+ 1 (^ x 2)))", "sqrt(1 + x^2)"},
		{" 1 +\tx\n", "(+ 1 x)", "1 + x"},
		{"i*pi", "(* i pi)", "i*pi"},
	} {
		e, err := Parse(test.src, testParams)
		if err != nil {
			t.Errorf("Parse(%q): %v", test.src, err)
			continue
		}
		if got := sexpr(e.root); got != test.tree {
			t.Errorf("Parse(%q) = %s, want %s", test.src, got, test.tree)
		}
		str := e.String()
		if str != test.str {
			t.Errorf("Parse(%q).String() = %q, want %q", test.src, str, test.str)
		}
		back, err := Parse(str, testParams)
		if err != nil {
			t.Errorf("Parse(%q) of String of %q: %v", str, test.src, err)
			continue
		}
		if got := sexpr(back.root); got != test.tree {
			t.Errorf("Parse(String(%q)) = %s, want %s", test.src, got, test.tree)
		}
	}
}

func TestParamsUsesX(t *testing.T) {
	t.Parallel()
	for _, test := range []struct {
		src    string
		params string
		usesX  bool
	}{
		{"2*(E - V0/cosh(x)^2)", "E V0", true},
		{"V0*b + a*V0", "V0 a b", false},
		{"sin(pi*i)", "", false},
		{"x", "", true},
	} {
		e, err := Parse(test.src, testParams)
		if err != nil {
			t.Errorf("Parse(%q): %v", test.src, err)
			continue
		}
		if got := strings.Join(e.Params(), " "); got != test.params {
			t.Errorf("Parse(%q).Params() = %q, want %q", test.src, got, test.params)
		}
		if got := e.UsesX(); got != test.usesX {
			t.Errorf("Parse(%q).UsesX() = %v, want %v", test.src, got, test.usesX)
		}
	}
}

func TestScanNumbers(t *testing.T) {
	t.Parallel()
	// Values typed from the literals themselves.
	for _, test := range []struct {
		src string
		val float64
		end int
	}{
		{"2", 2, 1},
		{"1.5", 1.5, 3},
		{".5", 0.5, 2},
		{"1e-3", 1e-3, 4},
		{"2.5E+4", 2.5e4, 6},
		{"007", 7, 3},
		{"3+", 3, 1},
		{"1e5x", 1e5, 3},
	} {
		var msg string
		s := scanner{src: test.src, err: func(_, _ int, m string) { msg = m; panic(bailout{}) }}
		tok := s.next()
		if msg != "" || tok.kind != tokNumber || tok.val != test.val || tok.end != test.end {
			t.Errorf("scan %q = %v (kind %d, end %d, err %q), want %v (end %d)", test.src, tok.val, tok.kind, tok.end, msg, test.val, test.end)
		}
	}
}

func TestEditDistance(t *testing.T) {
	t.Parallel()
	// Distances counted by hand.
	for _, test := range []struct {
		a, b string
		d    int
	}{
		{"", "", 0},
		{"sin", "sin", 0},
		{"sinn", "sin", 1},
		{"kitten", "sitting", 3},
		{"ln", "log", 2},
		{"", "abc", 3},
		{"cosh", "sech", 3}, // c→s, o→e, s→c; no alignment of the shared "h" does better
	} {
		if got := editDistance(test.a, test.b); got != test.d {
			t.Errorf("editDistance(%q, %q) = %d, want %d", test.a, test.b, got, test.d)
		}
		if got := editDistance(test.b, test.a); got != test.d {
			t.Errorf("editDistance(%q, %q) = %d, want %d", test.b, test.a, got, test.d)
		}
	}
}
