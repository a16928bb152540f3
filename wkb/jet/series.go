package jet

import (
	"math"
	"math/cmplx"
)

// Series is a truncated Taylor series: s[k] is the coefficient of hᵏ.
type Series []complex128

// Const returns the series of the constant c truncated at order n.
func Const(c complex128, n int) Series {
	s := make(Series, n+1)
	s[0] = c
	return s
}

// Var returns the series of the identity z0 + h truncated at order n.
func Var(z0 complex128, n int) Series {
	s := make(Series, n+1)
	s[0] = z0
	if n >= 1 {
		s[1] = 1
	}
	return s
}

// Order returns the truncation order of s (its length minus one).
func (s Series) Order() int { return len(s) - 1 }

// Deriv returns the k-th derivative f⁽ᵏ⁾(z0) = k! s[k].
func (s Series) Deriv(k int) complex128 {
	if k < 0 || k >= len(s) {
		panic("jet: derivative order out of range")
	}
	f := 1.0
	for i := 2; i <= k; i++ {
		f *= float64(i)
	}
	return complex(f, 0) * s[k]
}

// Derivs returns all derivatives f, f′, …, f⁽ⁿ⁾ at z0.
func (s Series) Derivs() []complex128 {
	d := make([]complex128, len(s))
	f := 1.0
	for k := range s {
		if k > 1 {
			f *= float64(k)
		}
		d[k] = complex(f, 0) * s[k]
	}
	return d
}

// At evaluates the truncated polynomial at offset h from the expansion point.
func (s Series) At(h complex128) complex128 {
	var v complex128
	for k := len(s) - 1; k >= 0; k-- {
		v = v*h + s[k]
	}
	return v
}

func same(a, b Series) {
	if len(a) != len(b) {
		panic("jet: series of different orders")
	}
}

// Add returns a + b.
func Add(a, b Series) Series {
	same(a, b)
	c := make(Series, len(a))
	for k := range a {
		c[k] = a[k] + b[k]
	}
	return c
}

// Sub returns a - b.
func Sub(a, b Series) Series {
	same(a, b)
	c := make(Series, len(a))
	for k := range a {
		c[k] = a[k] - b[k]
	}
	return c
}

// Neg returns -a.
func Neg(a Series) Series {
	c := make(Series, len(a))
	for k := range a {
		c[k] = -a[k]
	}
	return c
}

// Scale returns c·a.
func Scale(c complex128, a Series) Series {
	r := make(Series, len(a))
	for k := range a {
		r[k] = c * a[k]
	}
	return r
}

// Mul returns the Cauchy product a·b.
func Mul(a, b Series) Series {
	same(a, b)
	c := make(Series, len(a))
	for k := range c {
		var sum complex128
		for j := 0; j <= k; j++ {
			sum += a[j] * b[k-j]
		}
		c[k] = sum
	}
	return c
}

// Div returns a/b. The leading coefficient of b must be non-zero; otherwise
// the result is filled with complex infinities or NaNs, as for scalar division.
func Div(a, b Series) Series {
	same(a, b)
	c := make(Series, len(a))
	for k := range c {
		sum := a[k]
		for j := 1; j <= k; j++ {
			sum -= b[j] * c[k-j] // c_k b_0 = a_k - Σ_{j≥1} b_j c_{k-j}
		}
		c[k] = sum / b[0]
	}
	return c
}

// Exp returns exp(a), from e′ = a′e.
func Exp(a Series) Series {
	e := make(Series, len(a))
	e[0] = cmplx.Exp(a[0])
	for k := 1; k < len(a); k++ {
		var sum complex128
		for j := 1; j <= k; j++ {
			sum += complex(float64(j), 0) * a[j] * e[k-j]
		}
		e[k] = sum / complex(float64(k), 0)
	}
	return e
}

// Log returns the principal logarithm of a, from a·l′ = a′.
func Log(a Series) Series {
	l := make(Series, len(a))
	l[0] = cmplx.Log(a[0])
	for k := 1; k < len(a); k++ {
		sum := a[k]
		for j := 1; j < k; j++ {
			sum -= complex(float64(j)/float64(k), 0) * l[j] * a[k-j]
		}
		l[k] = sum / a[0]
	}
	return l
}

// Pow returns a^p for a complex exponent p on the principal branch, from
// a·b′ = p·a′·b. The leading coefficient of a must be non-zero (a^p has a
// branch point at a zero of a); use PowInt for integer exponents.
func Pow(a Series, p complex128) Series {
	b := make(Series, len(a))
	b[0] = cmplx.Pow(a[0], p)
	if a[0] == 0 {
		for k := 1; k < len(b); k++ {
			b[k] = cmplx.NaN()
		}
		return b
	}
	for k := 1; k < len(a); k++ {
		var sum complex128
		for j := 1; j <= k; j++ {
			sum += (p*complex(float64(j), 0) - complex(float64(k-j), 0)) * a[j] * b[k-j]
		}
		b[k] = sum / (complex(float64(k), 0) * a[0])
	}
	return b
}

// PowInt returns aⁿ by repeated squaring; exact also where a vanishes.
// A negative n gives 1/a⁻ⁿ.
func PowInt(a Series, n int) Series {
	if n < 0 {
		return Div(Const(1, a.Order()), PowInt(a, -n))
	}
	r := Const(1, a.Order())
	x := a
	for n > 0 {
		if n&1 == 1 {
			r = Mul(r, x)
		}
		n >>= 1
		if n > 0 {
			x = Mul(x, x)
		}
	}
	return r
}

// Sqrt returns the principal square root of a.
func Sqrt(a Series) Series { return Pow(a, 0.5) }

// sincos returns sin(a) and cos(a) (hyperbolic when sign = +1) from
// s′ = c·a′, c′ = ∓s·a′.
func sincos(a Series, hyperbolic bool) (s, c Series) {
	s = make(Series, len(a))
	c = make(Series, len(a))
	if hyperbolic {
		s[0], c[0] = cmplx.Sinh(a[0]), cmplx.Cosh(a[0])
	} else {
		s[0], c[0] = cmplx.Sin(a[0]), cmplx.Cos(a[0])
	}
	sign := complex(-1, 0)
	if hyperbolic {
		sign = 1
	}
	for k := 1; k < len(a); k++ {
		var ss, cc complex128
		for j := 1; j <= k; j++ {
			w := complex(float64(j), 0) * a[j]
			ss += w * c[k-j]
			cc += w * s[k-j]
		}
		kk := complex(float64(k), 0)
		s[k] = ss / kk
		c[k] = sign * cc / kk
	}
	return s, c
}

// Sin returns sin(a).
func Sin(a Series) Series { s, _ := sincos(a, false); return s }

// Cos returns cos(a).
func Cos(a Series) Series { _, c := sincos(a, false); return c }

// Tan returns tan(a).
func Tan(a Series) Series { s, c := sincos(a, false); return Div(s, c) }

// Sinh returns sinh(a).
func Sinh(a Series) Series { s, _ := sincos(a, true); return s }

// Cosh returns cosh(a).
func Cosh(a Series) Series { _, c := sincos(a, true); return c }

// Tanh returns tanh(a), from t′ = (1 − t²)a′. The leading value uses
// exp(−2|Re a|), so it stays finite where cosh overflows.
func Tanh(a Series) Series {
	t, _ := tanhSech(a)
	return t
}

// Sech returns 1/cosh(a), from s′ = −s·t·a′; finite for large |Re a|.
func Sech(a Series) Series {
	_, s := tanhSech(a)
	return s
}

// tanhSech returns the series of tanh(a) and sech(a) together.
func tanhSech(a Series) (t, s Series) {
	n := len(a)
	t = make(Series, n)
	s = make(Series, n)
	t[0], s[0] = stableTanhSech(a[0])
	// t′ = s²·a′ rather than (1 − t²)·a′: the subtraction loses every digit
	// where t is within rounding of ±1, while s² there is tiny but exact.
	ss := make(Series, n) // s², built as s grows
	st := make(Series, n) // s·t
	ss[0] = s[0] * s[0]
	st[0] = s[0] * t[0]
	for k := 1; k < n; k++ {
		var dt, ds complex128
		for j := 1; j <= k; j++ {
			w := complex(float64(j), 0) * a[j]
			dt += w * ss[k-j]
			ds -= w * st[k-j]
		}
		kk := complex(float64(k), 0)
		t[k], s[k] = dt/kk, ds/kk
		for j := 0; j <= k; j++ {
			ss[k] += s[j] * s[k-j]
			st[k] += s[j] * t[k-j]
		}
	}
	return t, s
}

// stableTanhSech evaluates tanh z and sech z through e = exp(−2|Re z|·…),
// which never overflows: for Re z ≥ 0, tanh z = (1 − e)/(1 + e) and
// sech z = 2 exp(−z)/(1 + e) with e = exp(−2z); odd/even symmetry for Re z < 0.
func stableTanhSech(z complex128) (complex128, complex128) {
	neg := real(z) < 0
	if neg {
		z = -z
	}
	e := cmplx.Exp(-2 * z)
	t := (1 - e) / (1 + e)
	s := 2 * cmplx.Exp(-z) / (1 + e)
	if neg {
		t = -t
	}
	return t, s
}

// IsFinite reports whether every coefficient of s is finite.
func (s Series) IsFinite() bool {
	for _, v := range s {
		if math.IsNaN(real(v)) || math.IsNaN(imag(v)) || math.IsInf(real(v), 0) || math.IsInf(imag(v), 0) {
			return false
		}
	}
	return true
}
