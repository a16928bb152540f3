package levels

import (
	"math"
	"strconv"
	"testing"

	"github.com/turnpoint/turnpoint/connect/eigen"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

func cubicV() jet.Func { // V = x³
	return jet.Map(func(x jet.Series) jet.Series { return jet.PowInt(x, 3) })
}

// coulombV is V = −1/x + ħ²l(l+1)/(2x²) (m = 1).
func coulombV(l, hbar float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series {
		one := make(jet.Series, len(x))
		one[0] = 1
		inv := jet.Div(one, x)
		return jet.Add(jet.Neg(inv), jet.Scale(complex(hbar*hbar*l*(l+1)/2, 0), jet.Mul(inv, inv)))
	})
}

// coulombLevel is E_n = −1/(2ħ²(n + l + 1)²) for V = −1/x + ħ²l(l+1)/(2x²),
// m = 1 (hydrogen-like radial levels; Landau & Lifshitz, QM §36).
func coulombLevel(n int, l, hbar float64) float64 {
	nu := float64(n) + l + 1
	return -1 / (2 * hbar * hbar * nu * nu)
}

func TestWallsBeyondSoftEnds(t *testing.T) {
	t.Parallel()
	// Low levels between soft turning points with hard walls further out:
	// the series is that of the open well, and the error is the walls'
	// exponentially small rise, stated as 2·Wall. References:
	// connect/eigen (shooting, ~1e-14).
	for _, tc := range []struct {
		name string
		w    wkb.Well
		ns   []int
	}{
		{"3x² on [−1, 1], ħ = 0.1", wkb.Well{V: harmonic(6), Mass: 1, Hbar: 0.1, A: -1, B: 1, LeftWall: true, RightWall: true}, []int{0, 2, 4}},
		{"3x² on [−0.6, 0.6], ħ = 0.05", wkb.Well{V: harmonic(6), Mass: 1, Hbar: 0.05, A: -0.6, B: 0.6, LeftWall: true, RightWall: true}, []int{0, 3}},
		{"3x² on [−1.2, 1.5], ħ = 0.2", wkb.Well{V: harmonic(6), Mass: 1, Hbar: 0.2, A: -1.2, B: 1.5, LeftWall: true, RightWall: true}, []int{0, 1, 3}},
		{"x² on [−0.8, 3], left wall only, ħ = 0.1", wkb.Well{V: harmonic(2), Mass: 1, Hbar: 0.1, A: -0.8, B: 3, LeftWall: true}, []int{0, 2}},
		{"0.7x on [0, 2], walls, m = 1.2, ħ = 0.15", wkb.Well{V: linear(0.7), Mass: 1.2, Hbar: 0.15, A: 0, B: 2, LeftWall: true, RightWall: true}, []int{1, 3}},
	} {
		lv, err := Solve(tc.w, tc.ns, &Settings{MaxOrder: 6})
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		refs, err := eigen.Levels(tc.w, tc.ns, nil)
		if err != nil {
			t.Fatalf("%s: eigen: %v", tc.name, err)
		}
		for i, l := range lv {
			if !(l.Wall > 0) {
				t.Errorf("%s E[%d]: no wall term (Maslov %d)", tc.name, l.N, l.Maslov)
			}
			floor := 1e-13 * math.Max(1, math.Abs(l.E))
			checkEstimate(t, tc.name+" E["+strconv.Itoa(l.N)+"]", l.E, l.Err, refs[i].E, refs[i].Err, floor, true)
		}
	}
}

func TestFlatWall(t *testing.T) {
	t.Parallel()
	// V = x³ with a wall at x = 0, where V′ = V″ = 0: the wall's endpoint
	// terms appear only at orders 4, 10, 16, … so the next term after order
	// 6 understates the remainder. Reference: connect/eigen.
	w := wkb.Well{V: cubicV(), Mass: 1, Hbar: 0.1, A: 0, B: 3.2, LeftWall: true}
	ns := []int{0, 4}
	lv, err := Solve(w, ns, &Settings{MaxOrder: 6})
	if err != nil {
		t.Fatal(err)
	}
	refs, err := eigen.Levels(w, ns, nil)
	if err != nil {
		t.Fatalf("eigen: %v", err)
	}
	for i, l := range lv {
		checkEstimate(t, "x³ wall E["+strconv.Itoa(l.N)+"]", l.E, l.Err, refs[i].E, refs[i].Err, 1e-13, true)
	}
	if !hasWarning(lv[0], "irregular") {
		t.Errorf("E[0]: no warning about the irregular endpoint terms: %v", lv[0].Warnings)
	}
}

func TestCoulombHighLevel(t *testing.T) {
	t.Parallel()
	// The centrifugal pole at x = 0 lies beside the inner turning point; for
	// n = 10 no ellipse about the pair avoids it and the split loops serve.
	const l, hbar = 4.0, 0.2
	w := wkb.Well{V: coulombV(l, hbar), Mass: 1, Hbar: hbar, A: 0.01, B: 60}
	ns := []int{0, 3, 10}
	lv, err := Solve(w, ns, &Settings{MaxOrder: 6})
	if err != nil {
		t.Fatal(err)
	}
	for _, lev := range lv {
		ref := coulombLevel(lev.N, l, hbar)
		checkEstimate(t, "Coulomb l=4 E["+strconv.Itoa(lev.N)+"]", lev.E, lev.Err, ref, 1e-16, 1e-13, true)
		if lev.Order != 6 {
			t.Errorf("E[%d]: order %d, want 6 (warnings %v)", lev.N, lev.Order, lev.Warnings)
		}
	}
}

func TestFirstOrderBound(t *testing.T) {
	t.Parallel()
	// The estimate a first-order level falls back on brackets its true
	// error: Coulomb l = 4, n = 10 (closed form coulombLevel) and a linear
	// potential with a wall (Airy zeros, bisection on mathext.AiryAi).
	const l, hbar = 4.0, 0.2
	cw := wkb.Well{V: coulombV(l, hbar), Mass: 1, Hbar: hbar, A: 0.01, B: 60}
	lw := wkb.Well{V: linear(0.7), Mass: 1.2, Hbar: 0.15, A: 0, B: 5, LeftWall: true}
	ll := math.Cbrt(0.15 * 0.15 / (2 * 1.2 * 0.7))
	zs := airyZeros(3)
	for _, tc := range []struct {
		name string
		w    wkb.Well
		n    int
		ref  float64
	}{
		{"Coulomb n=10", cw, 10, coulombLevel(10, l, hbar)},
		{"Coulomb n=3", cw, 3, coulombLevel(3, l, hbar)},
		{"linear wall n=2", lw, 2, -zs[2] * 0.7 * ll},
	} {
		lv, err := Solve(tc.w, []int{tc.n}, nil) // Bohr–Sommerfeld
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		g, err := newGeometry(tc.w)
		if err != nil {
			t.Fatal(err)
		}
		a, b, err := g.region(lv[0].E, g.xmin)
		if err != nil {
			t.Fatal(err)
		}
		_, dph, _, err := firstOrder(tc.w, lv[0].E, a, b)
		if err != nil {
			t.Fatal(err)
		}
		est, how := firstOrderBound(tc.w, lv[0].E, a, b, dph)
		if how != "twice the order-2 term" {
			t.Errorf("%s: estimate by %s", tc.name, how)
		}
		checkEstimate(t, tc.name, lv[0].E, est, tc.ref, 1e-14, 0, true)
	}
}

func TestPairSplitMatchesEllipse(t *testing.T) {
	t.Parallel()
	// The split loops and wkb.PairPhase's ellipse compute the same
	// closed-contour terms where both work.
	for _, tc := range []struct {
		name string
		w    wkb.Well
		E    float64
	}{
		{"quartic", wkb.Well{V: quartic(), Mass: 1, Hbar: 0.3, A: -5, B: 5}, 0.7},
		{"Morse", wkb.Well{V: morse(6, 0.8), Mass: 1.3, Hbar: 0.2, A: -2, B: 12}, 2.5},
	} {
		g, err := newGeometry(tc.w)
		if err != nil {
			t.Fatal(err)
		}
		a, b, err := g.region(tc.E, g.xmin)
		if err != nil {
			t.Fatal(err)
		}
		p := tc.w.Problem(tc.E)
		r, err := wkb.PairPhase(p, complex(a.x, 0), complex(b.x, 0), 6, nil)
		if err != nil {
			t.Fatal(err)
		}
		ts, es, _, err := pairSplit(p, a.x, b.x, 3)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		for k := range ts {
			d := math.Abs(ts[k] - real(r.Terms[k]))
			if d > 10*(es[k]+r.TermErr[k])+1e-13*math.Abs(ts[k]) {
				t.Errorf("%s order %d: split %.15g, ellipse %.15g (errors %.2g, %.2g)", tc.name, 2*k, ts[k], real(r.Terms[k]), es[k], r.TermErr[k])
			}
		}
	}
}
