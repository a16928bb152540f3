package formula

import (
	"math"
	"math/cmplx"
	"testing"

	"gonum.org/v1/gonum/cmplxs/cscalar"
)

// cauchyCoeffs returns the Taylor coefficients of f at z0 up to order n from
// Cauchy's integral formula, c_k = (1/2πi)∮ f(z)/(z-z0)^(k+1) dz on the circle
// |z - z0| = r, by the trapezoid rule with m points, which converges
// geometrically for f analytic on a larger disc (Trefethen & Weideman, SIAM
// Review 56 (2014) 385, §3). It uses values of f only, so it checks the
// series recurrences independently.
func cauchyCoeffs(f func(complex128) complex128, z0 complex128, r float64, m, n int) []complex128 {
	c := make([]complex128, n+1)
	for j := range m {
		w := cmplx.Rect(1, 2*math.Pi*float64(j)/float64(m))
		v := f(z0 + complex(r, 0)*w)
		for k := range c {
			c[k] += v * cmplx.Pow(w, complex(-float64(k), 0))
		}
	}
	for k := range c {
		c[k] /= complex(float64(m)*math.Pow(r, float64(k)), 0)
	}
	return c
}

func TestTaylorFunctionsCauchy(t *testing.T) {
	t.Parallel()
	const (
		n = 8
		r = 0.25
		m = 96
	)
	for _, name := range Functions() {
		f := bind(t, name+"(x)", nil)
		for _, z0 := range testPoints {
			want := cauchyCoeffs(f.Eval, z0, r, m, n)
			got := f.Taylor(z0, n)
			// Rounding in the sum is amplified by r^-k.
			var fmax float64
			for j := range m {
				fmax = max(fmax, cmplx.Abs(f.Eval(z0+complex(r, 0)*cmplx.Rect(1, 2*math.Pi*float64(j)/float64(m)))))
			}
			for k := range got {
				tol := 1e-13 * fmax / math.Pow(r, float64(k))
				if !cscalar.EqualWithinAbs(got[k], want[k], tol) {
					t.Errorf("%s: coefficient %d at %v = %v, want %v (Cauchy integral)", name, k, z0, got[k], want[k])
				}
			}
		}
	}
}

func TestFunctionsFirstDerivative(t *testing.T) {
	t.Parallel()
	// Derivatives from any table of elementary derivatives (e.g. Abramowitz &
	// Stegun 4.3.105–4.3.110, 4.5.77–4.5.82), written with cmplx.
	sq := func(z complex128) complex128 { return z * z }
	for _, test := range []struct {
		name string
		d    func(z complex128) complex128
	}{
		{"sin", cmplx.Cos},
		{"cos", func(z complex128) complex128 { return -cmplx.Sin(z) }},
		{"tan", func(z complex128) complex128 { return 1 / sq(cmplx.Cos(z)) }},
		{"cot", func(z complex128) complex128 { return -1 / sq(cmplx.Sin(z)) }},
		{"sec", func(z complex128) complex128 { return cmplx.Sin(z) / sq(cmplx.Cos(z)) }},
		{"csc", func(z complex128) complex128 { return -cmplx.Cos(z) / sq(cmplx.Sin(z)) }},
		{"sinh", cmplx.Cosh},
		{"cosh", cmplx.Sinh},
		{"tanh", func(z complex128) complex128 { return 1 / sq(cmplx.Cosh(z)) }},
		{"coth", func(z complex128) complex128 { return -1 / sq(cmplx.Sinh(z)) }},
		{"sech", func(z complex128) complex128 { return -cmplx.Sinh(z) / sq(cmplx.Cosh(z)) }},
		{"csch", func(z complex128) complex128 { return -cmplx.Cosh(z) / sq(cmplx.Sinh(z)) }},
		{"exp", cmplx.Exp},
		{"log", func(z complex128) complex128 { return 1 / z }},
		{"sqrt", func(z complex128) complex128 { return 1 / (2 * cmplx.Sqrt(z)) }},
	} {
		f := bind(t, test.name+"(x)", nil)
		for _, z := range testPoints {
			if got, want := f.Taylor(z, 1)[1], test.d(z); !cscalar.EqualWithinAbsOrRel(got, want, 1e-14, 1e-13) {
				t.Errorf("%s′(%v) = %v, want %v", test.name, z, got, want)
			}
		}
	}
}

func TestLargeArguments(t *testing.T) {
	t.Parallel()
	// Where sinh, cosh (or sin, cos of a large imaginary part) overflow, the
	// quotients are still finite: references from the definitions with
	// exponentials of negative real part, e.g. tanh z = (1 - e^(-2z))/(1 + e^(-2z)).
	e := func(z complex128) complex128 { return cmplx.Exp(z) }
	for _, test := range []struct {
		src  string
		z    complex128
		want []complex128 // value, first derivative
	}{
		{"tanh(x)", 800, []complex128{1, 0}},
		{"tanh(x)", -800 + 1i, []complex128{-1, 0}},
		{"tanh(x)", 30 + 0.5i, []complex128{(1 - e(-60-1i)) / (1 + e(-60-1i)), 4 * e(-60-1i) / ((1 + e(-60-1i)) * (1 + e(-60-1i)))}},
		{"coth(x)", 800, []complex128{1, 0}},
		{"sech(x)", 800, []complex128{0, 0}},
		{"sech(x)", 300 + 2i, []complex128{2 * e(-300-2i), -2 * e(-300-2i)}},
		{"csch(x)", -300, []complex128{-2 * e(-300), -2 * e(-300)}},
		{"tan(x)", 1 + 800i, []complex128{1i, 0}},
		{"cot(x)", 1 - 800i, []complex128{1i, 0}},
		{"sec(x)", 1 + 300i, []complex128{2 * e(-300+1i), 2i * e(-300+1i)}},
		{"1/cosh(x)^2", 20, []complex128{4 * e(-40) / ((1 + e(-40)) * (1 + e(-40))), -8 * e(-40) * (1 - e(-40)) / cmplx.Pow(1+e(-40), 3)}},
	} {
		f := bind(t, test.src, nil)
		s := f.Taylor(test.z, 4)
		if !s.IsFinite() {
			t.Errorf("%s: Taylor at %v = %v, want finite", test.src, test.z, s)
			continue
		}
		for k, w := range test.want {
			scale := max(cmplx.Abs(test.want[0]), 1e-300)
			if !cscalar.EqualWithinAbsOrRel(s[k], w, 1e-14*scale, 1e-13) {
				t.Errorf("%s: coefficient %d at %v = %v, want %v", test.src, k, test.z, s[k], w)
			}
		}
		if v := f.Eval(test.z); v != s[0] {
			t.Errorf("%s at %v: Eval = %v, Taylor[0] = %v", test.src, test.z, v, s[0])
		}
	}
}

func TestNearPoles(t *testing.T) {
	t.Parallel()
	// tanh(x + iy) = coth(x + i(y - π/2)), and y - π/2 is accurate as
	// (y - fl(π/2)) - 6.123233995736766e-17, π/2 - fl(π/2) typed from memory
	// (it is cos(fl(π/2)) in float64); coth of a small argument has no
	// cancellation. Likewise tan(x + iy) near π/2 is -cot(x - π/2 + iy), and
	// cosh(w + iπ/2) = i sinh w.
	const halfPiLo = 6.123233995736766e-17
	coth := func(w complex128) complex128 { return cmplx.Cosh(w) / cmplx.Sinh(w) }
	cot := func(w complex128) complex128 { return cmplx.Cos(w) / cmplx.Sin(w) }
	// off returns y - π/2 for y near π/2: y - fl(π/2) is exact (Sterbenz).
	halfPi := math.Pi / 2
	off := func(y float64) float64 { return (y - halfPi) - halfPiLo }
	y1, y2 := halfPi-1e-6, halfPi+3e-7
	for _, test := range []struct {
		src  string
		z    complex128
		want complex128
	}{
		{"tanh(x)", complex(1e-3, y1), coth(complex(1e-3, off(y1)))},
		{"tanh(x)", complex(-2e-7, y2), coth(complex(-2e-7, off(y2)))},
		{"tan(x)", complex(y1, 1e-3), -cot(complex(off(y1), 1e-3))},
		{"coth(x)", complex(1e-3, y1), 1 / coth(complex(1e-3, off(y1)))},
		{"sech(x)^2", complex(-2e-7, y2), -1 / (cmplx.Sinh(complex(-2e-7, off(y2))) * cmplx.Sinh(complex(-2e-7, off(y2))))},
	} {
		f := bind(t, test.src, nil)
		if got := f.Eval(test.z); !cscalar.EqualWithinRel(got, test.want, 1e-13) {
			t.Errorf("%s at %v = %v, want %v", test.src, test.z, got, test.want)
		}
	}
}

// TestTanhFarOut checks the derivatives of tanh and coth where tanh is within
// rounding of ±1: tanh′ = sech² = 4/(eˣ + e⁻ˣ)² must keep its relative
// accuracy (closed form; the subtraction 1 − tanh² would give 0 or 2.2e-16).
func TestTanhFarOut(t *testing.T) {
	for _, x := range []float64{19, 25, -30} {
		for _, src := range []string{"tanh(x)", "-coth(x)"} {
			e, err := Parse(src, nil)
			if err != nil {
				t.Fatal(err)
			}
			f, _ := e.Bind(nil)
			got := real(f.Taylor(complex(x, 0), 2)[1])
			c := math.Exp(x) + math.Exp(-x)
			want := 4 / (c * c) // sech² for tanh; −(−csch²) ≈ sech² for coth this far out
			if src == "-coth(x)" {
				sh := math.Exp(x) - math.Exp(-x)
				want = 4 / (sh * sh)
			}
			if math.Abs(got-want) > 1e-13*math.Abs(want) {
				t.Errorf("%s: derivative at %g = %g, want %g", src, x, got, want)
			}
		}
	}
}
