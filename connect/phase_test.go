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

// TestPhaseSeries checks S_n of phaseSeries against its
// expansion by hand: with 1/(ε₀+δ) = 1/ε₀ − δ/ε₀² + δ²/ε₀³ − … and
// (ε₀+δ)^(−3) = ε₀^(−3) − 3δ/ε₀⁴ + …, δ = ε₂ + ε₄ cut at total order,
//
//	S_1 = c₁/ε₀,
//	S_2 = c₁(1/ε₀ − ε₂/ε₀²) + c₂/ε₀³,
//	S_3 = c₁(1/ε₀ − ε₂/ε₀² + ε₂²/ε₀³ − ε₄/ε₀²) + c₂(1/ε₀³ − 3ε₂/ε₀⁴) + c₃/ε₀⁵,
//
// c₁ = 1/24, c₂ = 7/2880, c₃ = 31/40320 (the series of φ in ParabolicPhase).
func TestPhaseSeries(t *testing.T) {
	t.Parallel()
	const c1, c2, c3 = 1.0 / 24, 7.0 / 2880, 31.0 / 40320
	for _, e := range [][3]float64{{3, 0.1, -0.01}, {-2.5, 0.3, 0.02}, {10, -0.05, 0.001}} {
		e0, e2, e4 := e[0], e[1], e[2]
		want := []float64{
			c1 / e0,
			c1*(1/e0-e2/(e0*e0)) + c2/math.Pow(e0, 3),
			c1*(1/e0-e2/(e0*e0)+e2*e2/math.Pow(e0, 3)-e4/(e0*e0)) + c2*(1/math.Pow(e0, 3)-3*e2/math.Pow(e0, 4)) + c3/math.Pow(e0, 5),
		}
		for n := 1; n <= 3; n++ {
			if got := phaseSeries(e[:], n); math.Abs(got-want[n-1]) > 1e-15*math.Abs(want[n-1]) {
				t.Errorf("ε = %v: S_%d = %.16g, want %.16g", e, n, got, want[n-1])
			}
		}
	}
}

// TestHigherOrderPhases: the phases of r and t at orders 2 and 4 against
// connect/direct (accurate to ~1e-12, its amplitude errors beside it), for
// U/cosh²x (ħ = 0.1 and 0.3) and the Gaussian barrier e^{−(x/0.4)²}
// (ħ = 0.1), below and above the top: each within ErrPhase, ErrPhase at
// most 100× the true error, and order 4 more accurate than order 2 where
// the series is well converged (cosh, ħ = 0.1: at least 30× here).
func TestHigherOrderPhases(t *testing.T) {
	t.Parallel()
	gauss := jet.Map(func(s jet.Series) jet.Series {
		u := jet.Scale(1/0.4, s)
		return jet.Exp(jet.Neg(jet.Mul(u, u)))
	})
	type problem struct {
		name   string
		p      wkb.Problem
		pts    []turning.Point
		a, b   float64
		better float64 // required ratio of the order-2 to the order-4 phase error (0: none)
	}
	var cs []problem
	for _, E := range []float64{0.7, 0.97, 1.2} {
		p, pts := coshBarrier(1, 1, 1, 0.1, E)
		cs = append(cs, problem{"cosh ħ=0.1", p, pts, -8, 8, 30})
		p, pts = coshBarrier(1, 1, 1, 0.3, E)
		cs = append(cs, problem{"cosh ħ=0.3", p, pts, -8, 8, 0})
	}
	for _, E := range []float64{0.3, 0.7, 1.1} {
		p := wkb.Well{V: gauss, Mass: 1, Hbar: 0.1}.Problem(E)
		fr, err := turning.Find(p.Q, turning.Box{Lo: complex(-4, -1.5), Hi: complex(4, 1.5)}, nil)
		if err != nil {
			t.Fatal(err)
		}
		cs = append(cs, problem{"gauss", p, fr.Points, -4, 4, 0})
	}
	for _, c := range cs {
		n, err := direct.Scatter(c.p, c.a, c.b, nil)
		if err != nil {
			t.Fatal(err)
		}
		var errs [2]float64
		for i, order := range []int{2, 4} {
			res, err := Scatter(c.p, c.a, c.b, c.pts, &Settings{MaxOrder: order})
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			d := math.Max(math.Abs(cmplx.Phase(res.Trans/n.Trans)), math.Abs(cmplx.Phase(res.Refl/n.Refl)))
			num := n.ErrTrans/cmplx.Abs(n.Trans) + n.ErrRefl/cmplx.Abs(n.Refl)
			errs[i] = d
			t.Logf("%s T = %.3g order %d: phase error %.2g, ErrPhase %.2g", c.name, n.T, res.Order, d, res.ErrPhase)
			if d > res.ErrPhase+num || res.ErrPhase > 100*math.Max(d, 1e-9) {
				t.Errorf("%s (T = %.3g) order %d: phase error %.3g, ErrPhase %.3g, numeric %.2g", c.name, n.T, res.Order, d, res.ErrPhase, num)
			}
		}
		if c.better > 0 && !(errs[0] > c.better*errs[1]) {
			t.Errorf("%s (T = %.3g): order-4 phase error %.3g not %g× below order 2 (%.3g)", c.name, n.T, errs[1], c.better, errs[0])
		}
	}
}
