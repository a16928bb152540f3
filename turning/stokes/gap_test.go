package stokes

import (
	"errors"
	"math"
	"math/cmplx"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// TestGapClosedForm: for Q = E − x² and t = ±√E, x = √E s gives
// √(E − x²) = √E √(1 − s²) on the branch that is principal at x = 0, so
//
//	Gap = E ∫_{−1}^{1} √(1 − s²) ds = πE/2,
//
// analytic in E (off the negative real axis). Hence Re Gap = 0, a Stokes
// line between the turning points, exactly when E is imaginary; for real E
// Im Gap = 0, an anti-Stokes line. For the barrier Q = x² − E the same
// substitution gives √(x² − E) = √(−E) √(1 − s²) and Gap = √(−E) √E π/2,
// which is iπE/2 for real E > 0: purely imaginary, a Stokes line for every
// real E ≠ 0.
func TestGapClosedForm(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		name string
		E    complex128
		bar  bool // Q = x² − E instead of E − x²
		want complex128
	}{
		{"well 1", 1, false, math.Pi / 2},
		{"well 2", 2, false, math.Pi},
		{"well i", 1i, false, 1i * math.Pi / 2},
		{"well 1+0.5i", 1 + 0.5i, false, (1 + 0.5i) * math.Pi / 2},
		{"well -0.3+2i", -0.3 + 2i, false, (-0.3 + 2i) * math.Pi / 2},
		{"well 0.5-1i", 0.5 - 1i, false, (0.5 - 1i) * math.Pi / 2},
		{"barrier 1", 1, true, 1i * math.Pi / 2},
		{"barrier 0.2", 0.2, true, 0.2i * math.Pi / 2},
		{"barrier 3", 3, true, 3i * math.Pi / 2},
	} {
		var q jet.Func
		if tc.bar {
			q = poly(-tc.E, 0, 1)
		} else {
			q = poly(tc.E, 0, -1)
		}
		r := cmplx.Sqrt(tc.E)
		got, est, err := GapEstimate(q, -r, r, nil)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if cmplx.Abs(got-tc.want) > 1e-12*cmplx.Abs(tc.want) {
			t.Errorf("%s: Gap = %.15g, want %.15g", tc.name, got, tc.want)
		}
		if est > 1e-8*cmplx.Abs(tc.want) || est < 0 {
			t.Errorf("%s: error estimate %g", tc.name, est)
		}
	}
}

// legendre integrates a complex function over [a, b] with gonum's fixed
// Gauss–Legendre rule (an independent quadrature), composite on 40 panels
// so that integrands with a singularity close to the interval converge.
func legendre(f func(float64) complex128, a, b float64, n int) complex128 {
	const panels = 40
	var s complex128
	for k := 0; k < panels; k++ {
		lo := a + (b-a)*float64(k)/panels
		hi := a + (b-a)*float64(k+1)/panels
		re := quad.Fixed(func(x float64) float64 { return real(f(x)) }, lo, hi, n, nil, 0)
		im := quad.Fixed(func(x float64) float64 { return imag(f(x)) }, lo, hi, n, nil, 0)
		s += complex(re, im)
	}
	return s
}

// TestGapDetour: Q = (x² − 1)(x − c) with a third zero c close to the
// segment [−1, 1]. Gap must detour around c without changing the value of
// the straight-segment integral (the detour passes c on the side the
// segment does, so Cauchy's theorem applies). Reference: with x = −cos θ,
// √(x² − 1) = ±i sin θ and x − c never crosses the negative real axis
// (Im(x − c) = −Im c has one sign), so
//
//	Gap = ±i ∫_0^π sin²θ √(−cos θ − c) dθ,
//
// a smooth integrand, by gonum Gauss–Legendre; the sign is that of the
// principal root of Q(0) = c at the middle of the path.
func TestGapDetour(t *testing.T) {
	t.Parallel()
	for _, c := range []complex128{0.05i, -0.05i, 0.3 + 0.02i, -0.6 - 0.08i} {
		q := poly(c, -1, -c, 1) // (x² − 1)(x − c) = x³ − c x² − x + c
		f := func(th float64) complex128 {
			s := math.Sin(th)
			return 1i * complex(s*s, 0) * cmplx.Sqrt(complex(-math.Cos(th), 0)-c)
		}
		ref := legendre(f, 0, math.Pi, 60)
		// Sign: the integrand at θ = π/2 (x = 0) must be the principal √Q(0).
		if real(f(math.Pi/2)*cmplx.Conj(cmplx.Sqrt(q.Eval(0)))) < 0 {
			ref = -ref
		}
		for _, others := range [][]turning.Point{nil, {{Z: c, Order: 1}}} {
			got, est, err := GapEstimate(q, -1, 1, others)
			if err != nil {
				t.Fatal(err)
			}
			if cmplx.Abs(got-ref) > 1e-10 {
				t.Errorf("c = %v, others %v: Gap = %.14g, want %.14g (estimate %.2g)", c, others, got, ref, est)
			}
		}
	}
}

// TestGapSech: Q = E − U0 sech²x above the top (sechBarrier).
//
// Between −ia and ia: on x = iy, Q = E − U0 sec²y ≥ 0 for |y| ≤ a, so with
// y = a sin φ, Gap = i a ∫_{−π/2}^{π/2} √(E − U0 sec²(a sin φ)) cos φ dφ,
// purely imaginary (reference: gonum Gauss–Legendre).
//
// Between −i(π−a) and −ia the segment runs through the double pole −iπ/2
// where √Q ≈ √U0/(x + iπ/2). Q(iy) is symmetric about y = −π/2, and √Q dx
// is real on the axis with opposite signs on the two sides of the pole once
// the root is continued round a small half circle, so the real parts cancel
// and only the half circle remains: |Gap| = π√U0, Re Gap = 0.
func TestGapSech(t *testing.T) {
	t.Parallel()
	const E, U0 = 1.2, 1.0
	q, pts := sechBarrier(E, U0)
	a := math.Acos(math.Sqrt(U0 / E))
	ref := 1i * complex(a, 0) * legendre(func(phi float64) complex128 {
		c := math.Cos(a * math.Sin(phi))
		return complex(math.Sqrt(math.Max(0, E-U0/(c*c)))*math.Cos(phi), 0)
	}, -math.Pi/2, math.Pi/2, 30)
	got, err := Gap(q, pts[1].Z, pts[2].Z)
	if err != nil {
		t.Fatal(err)
	}
	if cmplx.Abs(got-ref) > 1e-9*cmplx.Abs(ref) {
		t.Errorf("Gap(−ia, ia) = %.14g, want %.14g", got, ref)
	}
	got, err = Gap(q, pts[0].Z, pts[1].Z)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(real(got)) > 1e-9 || math.Abs(cmplx.Abs(got)-math.Pi*math.Sqrt(U0)) > 1e-9 {
		t.Errorf("Gap(−i(π−a), −ia) = %.14g, want ±iπ√U0", got)
	}
}

// TestFindDegeneracy scans families of Q = E(p) − x² (turning points
// ±√E, Gap = πE/2 by TestGapClosedForm): a Stokes line joins them where
// Re E(p) = 0.
func TestFindDegeneracy(t *testing.T) {
	t.Parallel()
	well := func(E func(p float64) complex128) func(p float64) (jet.Func, []turning.Point, error) {
		return func(p float64) (jet.Func, []turning.Point, error) {
			e := E(p)
			r := cmplx.Sqrt(e)
			return poly(e, 0, -1), []turning.Point{{Z: r, Order: 1}, {Z: -r, Order: 1}}, nil
		}
	}
	for _, tc := range []struct {
		name   string
		family func(p float64) (jet.Func, []turning.Point, error)
		lo, hi float64
		want   []float64
		err    error
	}{
		// Re E = p − 0.3: root 0.3.
		{"shift", well(func(p float64) complex128 { return complex(p-0.3, 0.8) }), -1, 1, []float64{0.3}, nil},
		// E = e^(ip): Re E = cos p = 0 at p = π/2.
		{"circle", well(func(p float64) complex128 { return cmplx.Rect(1, p) }), 0.5, 2.5, []float64{math.Pi / 2}, nil},
		// E = 2 e^(ip) on [−2, 2]: roots ±π/2.
		{"circle both", well(func(p float64) complex128 { return cmplx.Rect(2, p) }), -2, 2, []float64{-math.Pi / 2, math.Pi / 2}, nil},
		// Re E > 0 throughout: nothing.
		{"none", well(func(p float64) complex128 { return complex(p, 0.8) }), 0.5, 2, nil, nil},
		// Barrier x² − E with real E: Re Gap ≡ 0.
		{"barrier", func(p float64) (jet.Func, []turning.Point, error) {
			r := math.Sqrt(p)
			return poly(complex(-p, 0), 0, 1), []turning.Point{{Z: complex(-r, 0), Order: 1}, {Z: complex(r, 0), Order: 1}}, nil
		}, 0.5, 2, nil, ErrEverywhereDegenerate},
	} {
		got, err := FindDegeneracy(tc.family, tc.lo, tc.hi)
		if !errors.Is(err, tc.err) {
			t.Errorf("%s: error %v, want %v", tc.name, err, tc.err)
			continue
		}
		if len(got) != len(tc.want) {
			t.Errorf("%s: roots %v, want %v", tc.name, got, tc.want)
			continue
		}
		for k := range got {
			if math.Abs(got[k]-tc.want[k]) > 1e-10 {
				t.Errorf("%s: roots %.15g, want %.15g", tc.name, got, tc.want)
			}
		}
	}
	// The crossing reports its error, the pair and Re Gap ≈ 0.
	cs, err := ScanDegeneracy(well(func(p float64) complex128 { return complex(p-0.3, 0.8) }), -1, 1, 8)
	if err != nil || len(cs) != 1 {
		t.Fatalf("ScanDegeneracy: %v, %v", cs, err)
	}
	c := cs[0]
	r := cmplx.Sqrt(complex(c.P-0.3, 0.8))
	if math.Abs(c.P-0.3) > c.Err+1e-15 || c.Err > 1e-10 || math.Abs(real(c.Gap)) > 1e-12 ||
		cmplx.Abs(c.T1+r) > 1e-15 || cmplx.Abs(c.T2-r) > 1e-15 {
		t.Errorf("crossing %+v, want P = 0.3 within Err, T1,2 = ∓%v", c, r)
	}
	// Errors of the family are passed on.
	bad := func(p float64) (jet.Func, []turning.Point, error) { return nil, nil, errors.New("no points") }
	if _, err := FindDegeneracy(bad, 0, 1); err == nil {
		t.Error("FindDegeneracy with a failing family: no error")
	}
	one := func(p float64) (jet.Func, []turning.Point, error) {
		return poly(0, 1), []turning.Point{{Z: 0, Order: 1}}, nil
	}
	if _, err := FindDegeneracy(one, 0, 1); err == nil {
		t.Error("FindDegeneracy with one turning point: no error")
	}
}
