package connect

import (
	"math"
	"math/cmplx"
	"testing"

	"github.com/turnpoint/turnpoint/connect/direct"
	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// coshExactR is the reflection of U/cosh²(αx) above the top, Landau &
// Lifshitz, Quantum Mechanics, §25 problem 4 (R = 1 − T of coshExactT),
// written so that an exponentially small R keeps its digits:
//
//	R = cosh²y / (sinh²x + cosh²y) = 1/(1 + e^{2x−2y}((1−e^{−2x})/(1+e^{−2y}))²).
func coshExactR(U, alpha, m, hbar, E float64) float64 {
	k := math.Sqrt(2*m*E) / hbar
	x := math.Pi * k / alpha
	y := math.Pi / 2 * math.Sqrt(8*m*U/(hbar*hbar*alpha*alpha)-1)
	ratio := math.Exp(2*x-2*y) * math.Pow(-math.Expm1(-2*x)/(1+math.Exp(-2*y)), 2) // sinh²x/cosh²y
	return 1 / (1 + ratio)
}

// TestErrorEstimateRelative checks that the error estimates of
// exponentially small R (above-barrier reflection) and T (deep tunnelling)
// are relative to the figure: each must bracket the true error, taken from
// the closed forms of Landau & Lifshitz, Quantum Mechanics, §25 (smooth
// step, problem 2: stepExactR; cosh⁻² barrier, problem 4: coshExactT,
// coshExactR), without overstating it by more than 100×. The closed forms
// in float64 carry a relative rounding of about 1e-14 (exponents up to 70),
// so the overstatement is judged against max(true error, 1e-13·X).
func TestErrorEstimateRelative(t *testing.T) {
	t.Parallel()
	const U, alpha, m, hbar = 1.0, 1.0, 1.0, 0.1 // the cosh-barrier case of the library
	for _, c := range []struct {
		name string
		x    float64 // E
		run  func(E float64) (*Result, float64, error)
		isT  bool
	}{
		// Smooth step E − U/(1 + e^{−x}) (2m = ħ = 1): the higher θ terms
		// vanish; the true error is the share of the pole at iπ,
		// relative 2e^{−2ΔS}, ΔS its height above the dominant turning point.
		{"step U=20", 20.5, stepRun(20), false},
		{"step U=20", 23, stepRun(20), false},
		{"step U=20", 30, stepRun(20), false},
		{"step U=20", 40, stepRun(20), false},
		{"step U=50", 51, stepRun(50), false},
		{"step U=50", 56, stepRun(50), false},
		{"step U=50", 65, stepRun(50), false},
		{"step U=50", 80, stepRun(50), false},
		// cosh⁻² above the top, R from 2e-4 down to 1e-30: the true error
		// is the θ term of order 4 (√(s² − 1) of the closed form).
		{"cosh R", 1.2, coshRun(U, alpha, m, hbar, false), false},
		{"cosh R", 1.5, coshRun(U, alpha, m, hbar, false), false},
		{"cosh R", 2, coshRun(U, alpha, m, hbar, false), false},
		{"cosh R", 2.6, coshRun(U, alpha, m, hbar, false), false},
		{"cosh R", 3.2, coshRun(U, alpha, m, hbar, false), false},
		// cosh⁻² below the top, T from 1e-2 down to 1e-18.
		{"cosh T", 0.9, coshRun(U, alpha, m, hbar, true), true},
		{"cosh T", 0.7, coshRun(U, alpha, m, hbar, true), true},
		{"cosh T", 0.5, coshRun(U, alpha, m, hbar, true), true},
		{"cosh T", 0.3, coshRun(U, alpha, m, hbar, true), true},
	} {
		res, want, err := c.run(c.x)
		if err != nil {
			t.Fatalf("%s E = %g: %v", c.name, c.x, err)
		}
		got, est := res.R, res.ErrR
		if c.isT {
			got, est = res.T, res.ErrT
		}
		d := math.Abs(got - want)
		t.Logf("%s E = %g: X = %.4g, |X − exact|/X = %.2g, estimate/X = %.2g", c.name, c.x, want, d/want, est/want)
		if d > est {
			t.Errorf("%s E = %g: X = %.10g, exact %.10g, |diff| %.3g above the estimate %.3g", c.name, c.x, got, want, d, est)
		}
		if est > 100*math.Max(d, 1e-13*want) {
			t.Errorf("%s E = %g: estimate %.3g overstates |diff| = %.3g (X = %.3g) by more than 100×", c.name, c.x, est, d, want)
		}
	}
}

func stepRun(U float64) func(E float64) (*Result, float64, error) {
	return func(E float64) (*Result, float64, error) {
		p, pts := stepProblem(U, 1, E)
		res, err := Scatter(p, -25, 25, pts, nil)
		return res, stepExactR(U, 1, E), err
	}
}

func coshRun(U, alpha, m, hbar float64, isT bool) func(E float64) (*Result, float64, error) {
	return func(E float64) (*Result, float64, error) {
		p, pts := coshBarrier(U, alpha, m, hbar, E)
		res, err := Scatter(p, -8, 8, pts, nil)
		if isT {
			return res, coshExactT(U, alpha, m, hbar, E), err
		}
		return res, coshExactR(U, alpha, m, hbar, E), err
	}
}

// TestWeakPairs: below the top of the Gaussian barrier e^{−(x/0.4)²}
// (ħ = 0.1, m = 1, the barriers of the library's double-barrier case) Q has
// complex zeros in the Gaussian's tails, near Im z ≈ ±0.6 and ±0.95, whose
// coupling e^θ is far below the accuracy of T. They must be composed at
// leading order (Barrier.FirstOrder) without warnings, and T must still
// agree with connect/direct (accurate to ~1e-12, its ErrT beside it) within
// the estimates, the estimate no more than 100× the true error.
func TestWeakPairs(t *testing.T) {
	t.Parallel()
	v := jet.Map(func(s jet.Series) jet.Series {
		u := jet.Scale(1/0.4, s)
		return jet.Exp(jet.Neg(jet.Mul(u, u)))
	})
	for _, E := range []float64{0.3, 0.6, 0.8} {
		p := wkb.Well{V: v, Mass: 1, Hbar: 0.1}.Problem(E)
		fr, err := turning.Find(p.Q, turning.Box{Lo: complex(-4, -1), Hi: complex(4, 1)}, nil)
		if err != nil {
			t.Fatal(err)
		}
		res, err := Scatter(p, -4, 4, fr.Points, nil)
		if err != nil {
			t.Fatalf("E = %g: %v", E, err)
		}
		weak := 0
		for _, b := range res.Barriers {
			if b.FirstOrder {
				weak++
				if len(b.Terms) != 1 || !b.Pair {
					t.Errorf("E = %g: weak element %v has terms %v, pair %v", E, b.Left, b.Terms, b.Pair)
				}
			}
		}
		if weak == 0 || len(res.Warnings) != 0 {
			t.Errorf("E = %g: %d weak pairs, warnings %q; want some and none", E, weak, res.Warnings)
		}
		n, err := direct.Scatter(p, -4, 4, nil)
		if err != nil {
			t.Fatal(err)
		}
		d := math.Abs(res.T - n.T)
		t.Logf("E = %g: T = %.6g, |T − direct|/T = %.2g, ErrT/T = %.2g, %d weak pairs", E, n.T, d/n.T, res.ErrT/n.T, weak)
		if d > res.ErrT+n.ErrT || res.ErrT > 100*math.Max(d, 1e-13*n.T) {
			t.Errorf("E = %g: T = %.10g, direct %.10g ± %.2g, |diff| %.3g, ErrT %.3g", E, res.T, n.T, n.ErrT, d, res.ErrT)
		}
	}
}

// TestNoSpuriousWarnings: the double pole of U/cosh²x at iπ/2 lies above
// the barrier (below the top) or behind the complex pair (above it), so it
// belongs to that connection and must not raise a warning; nor may the
// complex zeros at ±x + iπ (coshBarrier lists them) or the poles of the
// smooth step behind its dominant pair. Warnings are for what changes the
// figures.
func TestNoSpuriousWarnings(t *testing.T) {
	t.Parallel()
	for _, E := range []float64{0.5, 0.8, 0.95, 1.05, 1.3} {
		p, pts := coshBarrier(1, 1, 1, 0.1, E)
		res, err := Scatter(p, -8, 8, pts, nil)
		if err != nil {
			t.Fatal(err)
		}
		if len(res.Warnings) != 0 {
			t.Errorf("cosh E = %g: warnings %q", E, res.Warnings)
		}
	}
	for _, E := range []float64{21, 30} {
		p, pts := stepProblem(20, 1, E)
		res, err := Scatter(p, -25, 25, pts, nil)
		if err != nil {
			t.Fatal(err)
		}
		if len(res.Warnings) != 0 {
			t.Errorf("step E = %g: warnings %q", E, res.Warnings)
		}
	}
}

// TestDoublePole: Q = 1 + β/(x² + 1)² has double poles at ±i (Q ≈
// 1 − (β/4)/(z − i)²) and simple zeros where (x² + 1)² = −β, i.e.
// x² = −1 ± i√β, beside the pole (closed form). The double pole has no
// Stokes jump of its own; the two complex pairs around it carry the
// reflection. R must agree with connect/direct within the estimates (not
// overstated by more than 100×), without warnings.
func TestDoublePole(t *testing.T) {
	t.Parallel()
	for _, beta := range []float64{1, 4} {
		q := jet.Map(func(s jet.Series) jet.Series {
			n := s.Order()
			d := jet.Add(jet.Mul(s, s), jet.Const(1, n))
			return jet.Add(jet.Const(1, n), jet.Div(jet.Const(complex(beta, 0), n), jet.Mul(d, d)))
		})
		z := cmplx.Sqrt(complex(-1, math.Sqrt(beta))) // upper right zero
		pts := append(pair(1i, -2, turning.Pole), pair(z, 1, turning.ComplexPair)...)
		pts = append(pts, pair(-cmplx.Conj(z), 1, turning.ComplexPair)...)
		for _, lam := range []float64{4, 8} {
			p := wkb.Problem{Q: q, Lambda: lam}
			res, err := Scatter(p, -20, 20, pts, nil)
			if err != nil {
				t.Fatal(err)
			}
			n, err := direct.Scatter(p, -20, 20, nil)
			if err != nil {
				t.Fatal(err)
			}
			d := math.Abs(res.R - n.R)
			t.Logf("β = %g λ = %g: R = %.4g, |R − direct|/R = %.2g, ErrR/R = %.2g", beta, lam, n.R, d/n.R, res.ErrR/n.R)
			if d > res.ErrR+n.ErrR || res.ErrR > 100*math.Max(d, 1e-13*n.R) || len(res.Warnings) != 0 {
				t.Errorf("β = %g λ = %g: R = %.6g, direct %.6g, ErrR %.3g, warnings %q", beta, lam, res.R, n.R, res.ErrR, res.Warnings)
			}
		}
	}
}
