package formula

import (
	"errors"
	"math"
	"math/cmplx"
	"testing"
)

var fuzzParams = []string{"a", "b", "E", "V0"}

// sameValue reports whether u and v are equal, NaN parts counting as equal.
func sameValue(u, v complex128) bool {
	eq := func(x, y float64) bool { return x == y || math.IsNaN(x) && math.IsNaN(y) }
	return eq(real(u), real(v)) && eq(imag(u), imag(v))
}

func FuzzParse(f *testing.F) {
	for _, src := range []string{
		"2*(E - V0/cosh(x)^2)",
		"-x^2", "2^3^2", "x^-2", "a-b-c", "a/b/c",
		"exp(sin(x))", "sqrt(1 + x^2)", "1/cosh(x)^2",
		"x^x + 2^x - i*pi", ".5e-3*x", "((a))", "--x", "x^-(a*b)",
		"2x", "sinn(x)", "(x+1", "x+1)", "", "abs(x)", "1e400", "é", "x**2",
	} {
		f.Add(src)
	}
	vals := map[string]complex128{"a": 1.5 - 0.5i, "b": -0.25, "E": 0.7, "V0": 2}
	z := complex(0.37, 0.61)
	f.Fuzz(func(t *testing.T, src string) {
		e, err := Parse(src, fuzzParams)
		if err != nil {
			if e != nil {
				t.Fatalf("Parse(%q) returned both an expression and %v", src, err)
			}
			var list ErrorList
			if !errors.As(err, &list) {
				var one *Error
				if !errors.As(err, &one) {
					t.Fatalf("Parse(%q) error %T is neither *Error nor ErrorList", src, err)
				}
				list = ErrorList{one}
			}
			for _, e := range list {
				if e.Offset < 0 || e.Len < 0 || e.Offset+e.Len > len(src) {
					t.Fatalf("Parse(%q): error %q spans [%d, %d), outside the source", src, e.Msg, e.Offset, e.Offset+e.Len)
				}
				_ = e.Excerpt(src)
				_ = e.Error()
			}
			return
		}
		s := e.String()
		back, err := Parse(s, fuzzParams)
		if err != nil {
			t.Fatalf("Parse(%q) = %q, which does not parse: %v", src, s, err)
		}
		if s2 := back.String(); s2 != s {
			t.Fatalf("Parse(%q) = %q, Parse of that = %q", src, s, s2)
		}
		if a, b := sexpr(e.root), sexpr(back.root); a != b {
			t.Fatalf("Parse(%q) tree %s, after String %s", src, a, b)
		}
		f1, err1 := e.Bind(vals)
		f2, err2 := back.Bind(vals)
		if err1 != nil || err2 != nil {
			t.Fatalf("Bind(%q): %v, %v", src, err1, err2)
		}
		if u, v := f1.Eval(z), f2.Eval(z); !sameValue(u, v) {
			t.Fatalf("%q at %v = %v, after String %v", src, z, u, v)
		}
		s1 := f1.Taylor(z, 3)
		if len(s1) != 4 {
			t.Fatalf("Taylor(%q, 3) has %d coefficients", src, len(s1))
		}
		if v := f1.Eval(z); !sameValue(s1[0], v) && !(cmplx.IsNaN(v) || cmplx.IsInf(v)) {
			// Taylor[0] and Eval follow the same operations except that a
			// varying power goes through exp(b log a) on series; allow rounding.
			if cmplx.Abs(s1[0]-v) > 1e-9*(1+cmplx.Abs(v)) {
				t.Fatalf("%q at %v: Eval %v, Taylor[0] %v", src, z, v, s1[0])
			}
		}
	})
}
