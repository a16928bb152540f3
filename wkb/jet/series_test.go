package jet

import (
	"math"
	"math/cmplx"
	"testing"
)

func close(a, b complex128, tol float64) bool {
	return cmplx.Abs(a-b) <= tol*math.Max(1, cmplx.Abs(b))
}

func fact(k int) float64 {
	f := 1.0
	for i := 2; i <= k; i++ {
		f *= float64(i)
	}
	return f
}

// TestElementarySeries checks each operation against Taylor coefficients
// that follow from elementary derivatives (closed forms derived in the
// comments).
func TestElementarySeries(t *testing.T) {
	z0 := complex(0.3, -0.7)
	const n = 10
	x := Var(z0, n)
	for _, tc := range []struct {
		name string
		got  Series
		want func(k int) complex128
	}{
		// (d/dz)^k e^z = e^z.
		{"exp", Exp(x), func(k int) complex128 { return cmplx.Exp(z0) / complex(fact(k), 0) }},
		// log(z0 + h) = log z0 + Σ (−1)^(k+1) h^k / (k z0^k).
		{"log", Log(x), func(k int) complex128 {
			if k == 0 {
				return cmplx.Log(z0)
			}
			return complex(math.Pow(-1, float64(k+1))/float64(k), 0) / cmplx.Pow(z0, complex(float64(k), 0))
		}},
		// (d/dz)^k sin z = sin(z + kπ/2).
		{"sin", Sin(x), func(k int) complex128 { return cmplx.Sin(z0+complex(float64(k)*math.Pi/2, 0)) / complex(fact(k), 0) }},
		{"cos", Cos(x), func(k int) complex128 { return cmplx.Cos(z0+complex(float64(k)*math.Pi/2, 0)) / complex(fact(k), 0) }},
		// (d/dz)^k sinh z alternates sinh, cosh.
		{"sinh", Sinh(x), func(k int) complex128 {
			if k%2 == 0 {
				return cmplx.Sinh(z0) / complex(fact(k), 0)
			}
			return cmplx.Cosh(z0) / complex(fact(k), 0)
		}},
		// (z0 + h)^p = Σ binom(p, k) z0^(p−k) h^k.
		{"pow", Pow(x, 2.5), func(k int) complex128 {
			b := 1.0
			for i := 0; i < k; i++ {
				b *= (2.5 - float64(i)) / float64(i+1)
			}
			return complex(b, 0) * cmplx.Pow(z0, complex(2.5-float64(k), 0))
		}},
		// 1/(z0 + h) = Σ (−1)^k h^k / z0^(k+1).
		{"div", Div(Const(1, n), x), func(k int) complex128 {
			return complex(math.Pow(-1, float64(k)), 0) / cmplx.Pow(z0, complex(float64(k+1), 0))
		}},
		{"powint-3", PowInt(x, -3), func(k int) complex128 {
			// (z0+h)^−3 = Σ binom(−3, k) z0^(−3−k) h^k, binom(−3,k) = (−1)^k (k+1)(k+2)/2.
			return complex(math.Pow(-1, float64(k))*float64((k+1)*(k+2))/2, 0) / cmplx.Pow(z0, complex(float64(3+k), 0))
		}},
	} {
		for k := 0; k <= n; k++ {
			if !close(tc.got[k], tc.want(k), 1e-12) {
				t.Errorf("%s: coefficient %d = %v, want %v", tc.name, k, tc.got[k], tc.want(k))
			}
		}
	}
}

// TestIdentities checks tan = sin/cos, tanh² + sech² = 1 and exp(log a) = a
// on a non-trivial series.
func TestIdentities(t *testing.T) {
	a := Exp(Sin(Var(complex(0.4, 0.2), 9)))
	one := Const(1, 9)
	for name, pair := range map[string][2]Series{
		"tanh^2 + sech^2 = 1": {Add(Mul(Tanh(a), Tanh(a)), Mul(Sech(a), Sech(a))), one},
		"tan = sin/cos":       {Tan(a), Div(Sin(a), Cos(a))},
		"tanh = sinh/cosh":    {Tanh(a), Div(Sinh(a), Cosh(a))},
		"sech = 1/cosh":       {Sech(a), Div(one, Cosh(a))},
		"exp(log a) = a":      {Exp(Log(a)), a},
		"sqrt(a)^2 = a":       {Mul(Sqrt(a), Sqrt(a)), a},
		"a^3 = a·a·a":         {PowInt(a, 3), Mul(a, Mul(a, a))},
	} {
		for k := range pair[0] {
			if !close(pair[0][k], pair[1][k], 1e-12) {
				t.Errorf("%s: coefficient %d: %v vs %v", name, k, pair[0][k], pair[1][k])
			}
		}
	}
}

// TestTanhSechLargeArgument checks that tanh and sech stay finite where
// cosh overflows: at Re z = 800, tanh = 1 and sech = 2e^(−800) underflows to
// 0; their derivatives (1 − tanh², −sech·tanh) vanish likewise.
func TestTanhSechLargeArgument(t *testing.T) {
	for _, z := range []complex128{800, -800 + 1i, 400 - 2i} {
		th := Tanh(Var(z, 4))
		sh := Sech(Var(z, 4))
		if !th.IsFinite() || !sh.IsFinite() {
			t.Fatalf("Tanh/Sech at %v not finite: %v %v", z, th, sh)
		}
		want := complex(1, 0)
		if real(z) < 0 {
			want = -1
		}
		if !close(th[0], want, 1e-15) || cmplx.Abs(sh[0]) > 1e-150 || cmplx.Abs(th[1]) > 1e-150 {
			t.Errorf("at %v: tanh %v, sech %v", z, th, sh)
		}
	}
}

func TestDerivsAndAt(t *testing.T) {
	s := Exp(Var(0, 6)) // e^h: every derivative is 1
	for k, d := range s.Derivs() {
		if !close(d, 1, 1e-14) || !close(s.Deriv(k), 1, 1e-14) {
			t.Errorf("derivative %d of exp at 0 = %v, want 1", k, d)
		}
	}
	// The order-6 truncation of e^h at h = 0.1 matches e^0.1 to O(0.1^7/7!).
	if got := s.At(0.1); !close(got, complex(math.Exp(0.1), 0), 1e-10) {
		t.Errorf("At(0.1) = %v, want %v", got, math.Exp(0.1))
	}
}

func TestMap(t *testing.T) {
	f := Map(func(s Series) Series { return Mul(s, Sin(s)) }) // x sin x
	z := complex(1.1, 0.3)
	if got, want := f.Eval(z), z*cmplx.Sin(z); !close(got, want, 1e-15) {
		t.Errorf("Eval = %v, want %v", got, want)
	}
	// (x sin x)′ = sin x + x cos x.
	if got, want := Derivative(f, z), cmplx.Sin(z)+z*cmplx.Cos(z); !close(got, want, 1e-14) {
		t.Errorf("Derivative = %v, want %v", got, want)
	}
}
