package eigen

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/mathext"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Potentials as jet.Map closures over wkb/jet operations.

// harmonic is ½ m ω² x².
func harmonic(m, omega float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series { return jet.Scale(complex(0.5*m*omega*omega, 0), jet.Mul(x, x)) })
}

// morse is D (1 − e^(−a x))².
func morse(d, a float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series {
		e := jet.Exp(jet.Scale(complex(-a, 0), x))
		one := jet.Const(1, x.Order())
		u := jet.Sub(one, e)
		return jet.Scale(complex(d, 0), jet.Mul(u, u))
	})
}

// poschlTeller is −V0 / cosh²(α x).
func poschlTeller(v0, alpha float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series {
		s := jet.Sech(jet.Scale(complex(alpha, 0), x))
		return jet.Scale(complex(-v0, 0), jet.Mul(s, s))
	})
}

// linear is F x.
func linear(f float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series { return jet.Scale(complex(f, 0), x) })
}

// quartic is x⁴.
func quartic() jet.Func {
	return jet.Map(func(x jet.Series) jet.Series { return jet.PowInt(x, 4) })
}

// doubleWell is (x² − d²)² / (8 d²): minima at ±d with ω = 1 for m = 1.
func doubleWell(d float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series {
		u := jet.Sub(jet.Mul(x, x), jet.Const(complex(d*d, 0), x.Order()))
		return jet.Scale(complex(1/(8*d*d), 0), jet.Mul(u, u))
	})
}

// checkLevel compares a computed level with an exact energy: relative error
// below tol, the node count equal to n, and the error estimate honest (the
// true error within three estimates, or at rounding).
func checkLevel(t *testing.T, name string, lv Level, err error, n int, want, tol float64) {
	t.Helper()
	if err != nil {
		t.Errorf("%s n=%d: %v", name, n, err)
		return
	}
	scale := math.Max(math.Abs(want), 1)
	if d := math.Abs(lv.E - want); d > tol*scale {
		t.Errorf("%s n=%d: E = %.17g, want %.17g (rel. error %.3g > %.3g)", name, n, lv.E, want, d/scale, tol)
	}
	if d := math.Abs(lv.E - want); d > 3*lv.Err+1e-14*scale {
		t.Errorf("%s n=%d: error %.3g exceeds the estimate %.3g", name, n, d, lv.Err)
	}
	if lv.Nodes != n || lv.N != n {
		t.Errorf("%s n=%d: N = %d, nodes = %d", name, n, lv.N, lv.Nodes)
	}
	if lv.Status != Converged {
		t.Errorf("%s n=%d: status %v, warnings %q", name, n, lv.Status, lv.Warnings)
	}
}

func TestHarmonic(t *testing.T) {
	t.Parallel()
	// E_n = ħω(n + ½) exactly (any textbook; Landau & Lifshitz §23).
	const m, omega, hbar = 2.0, 1.3, 0.7
	w := wkb.Well{V: harmonic(m, omega), Mass: m, Hbar: hbar, A: -11, B: 11}
	var ns []int
	for n := 0; n <= 20; n++ {
		ns = append(ns, n)
	}
	ns = append(ns, 100)
	lvs, err := Levels(w, ns, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, n := range ns {
		checkLevel(t, "harmonic", lvs[i], nil, n, hbar*omega*(float64(n)+0.5), 1e-10)
	}
}

func TestHarmonicHighN(t *testing.T) {
	t.Parallel()
	// E_n = ħω(n + ½) exactly; n up to 10⁴ on one interval that holds them all.
	w := wkb.Well{V: harmonic(1, 1), Mass: 1, Hbar: 1, A: -150, B: 150}
	sv, err := NewSolver(w, nil)
	if err != nil {
		t.Fatal(err)
	}
	lvs, err := sv.Levels([]int{1000, 10000})
	for i, n := range []int{1000, 10000} {
		checkLevel(t, "harmonic", lvs[i], err, n, float64(n)+0.5, 1e-10)
	}
}

func TestMorse(t *testing.T) {
	t.Parallel()
	// Morse (1929): V = D(1 − e^(−ax))², ω = a√(2D/m),
	// E_n = ħω(n+½) − [ħω(n+½)]²/(4D), for n + ½ < √(2mD)/(aħ).
	const d, a, m, hbar = 1.0, 1.3, 1.0, 0.05
	omega := a * math.Sqrt(2*d/m)
	w := wkb.Well{V: morse(d, a), Mass: m, Hbar: hbar, A: -1.5, B: 10}
	ns := []int{0, 1, 2, 5, 10, 15}
	lvs, err := Levels(w, ns, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, n := range ns {
		x := hbar * omega * (float64(n) + 0.5)
		checkLevel(t, "morse", lvs[i], nil, n, x-x*x/(4*d), 1e-10)
	}
}

func TestPoschlTeller(t *testing.T) {
	t.Parallel()
	// Landau & Lifshitz, Quantum Mechanics, §23 problem 4: for −V0/cosh²(αx),
	// E_n = −(ħ²α²/8m)[−(1+2n) + √(1 + 8mV0/(ħ²α²))]², n < s.
	const v0, alpha, m, hbar = 50.0, 1.0, 1.0, 1.0
	exact := func(n int) float64 {
		r := -(1 + 2*float64(n)) + math.Sqrt(1+8*m*v0/(hbar*hbar*alpha*alpha))
		return -hbar * hbar * alpha * alpha / (8 * m) * r * r
	}
	for _, tc := range []struct {
		l  float64
		ns []int
	}{
		{40, []int{0, 3, 6, 8}},
		{90, []int{9}}, // E_9 ≈ −0.13: slow decay, wider interval
	} {
		w := wkb.Well{V: poschlTeller(v0, alpha), Mass: m, Hbar: hbar, A: -tc.l, B: tc.l}
		lvs, err := Levels(w, tc.ns, nil)
		if err != nil {
			t.Fatal(err)
		}
		for i, n := range tc.ns {
			checkLevel(t, "pöschl-teller", lvs[i], nil, n, exact(n), 1e-10)
		}
	}
	// Only ten levels are bound (s ≈ 9.5).
	w := wkb.Well{V: poschlTeller(v0, alpha), Mass: m, Hbar: hbar, A: -40, B: 40}
	if _, err := Solve(w, 10, nil); err == nil {
		t.Errorf("level 10 of a well with 10 levels: no error")
	}
	// Too short an interval is reported.
	w.A, w.B = -8, 8
	lv, err := Solve(w, 8, nil)
	if err != nil || lv.Status != IntervalShort || len(lv.Warnings) == 0 {
		t.Errorf("short interval: status %v, warnings %q, err %v", lv.Status, lv.Warnings, err)
	}
}

// airyZeros returns the first k zeros a_1 > a_2 > … of Ai by bisection on
// gonum's mathext.AiryAi (an independent library).
func airyZeros(k int) []float64 {
	ai := func(x float64) float64 { return real(mathext.AiryAi(complex(x, 0))) }
	var zs []float64
	const dx = 0.05
	for x := 0.0; len(zs) < k; x -= dx {
		a, b := x-dx, x
		fa, fb := ai(a), ai(b)
		if (fa > 0) == (fb > 0) {
			continue
		}
		for range 100 {
			c := 0.5 * (a + b)
			fc := ai(c)
			if (fc > 0) == (fb > 0) {
				b, fb = c, fc
			} else {
				a = c
			}
		}
		zs = append(zs, 0.5*(a+b))
	}
	return zs
}

func TestAiryZeros(t *testing.T) {
	// Abramowitz & Stegun Table 10.13 (typed from memory).
	for i, want := range []float64{-2.33810741, -4.08794944, -5.52055983} {
		if got := airyZeros(3)[i]; math.Abs(got-want) > 2e-8 {
			t.Errorf("a_%d = %.10g, want %.10g", i+1, got, want)
		}
	}
}

func TestLinearWall(t *testing.T) {
	t.Parallel()
	// V = Fx with a hard wall at 0: E_n = (ħ²F²/2m)^(1/3) (−a_{n+1}), a_k the
	// zeros of Ai (DLMF §9.9), here from mathext.AiryAi.
	const f, m, hbar = 1.7, 0.8, 1.1
	w := wkb.Well{V: linear(f), Mass: m, Hbar: hbar, A: 0, B: 25, LeftWall: true}
	zs := airyZeros(10)
	ns := []int{0, 1, 2, 3, 4, 5, 6, 7, 8, 9}
	lvs, err := Levels(w, ns, nil)
	if err != nil {
		t.Fatal(err)
	}
	e0 := math.Cbrt(hbar * hbar * f * f / (2 * m))
	for i, n := range ns {
		checkLevel(t, "linear", lvs[i], nil, n, -e0*zs[n], 1e-10)
	}
}

func TestQuartic(t *testing.T) {
	t.Parallel()
	// −y″ + x⁴y = Ey (m = ½, ħ = 1). Reference values typed from memory
	// (published high-precision quartic oscillator eigenvalues); they are
	// cross-checked here against a second, looser tolerance and a coarser
	// base mesh.
	w := wkb.Well{V: quartic(), Mass: 0.5, Hbar: 1, A: -6, B: 6}
	want := []float64{1.0603620904841829, 3.7996730298013941, 7.4556979379867383}
	ns := []int{0, 1, 2}
	lvs, err := Levels(w, ns, nil)
	if err != nil {
		t.Fatal(err)
	}
	loose, err := Levels(w, ns, &Settings{Tol: 1e-9, Step: 0.8})
	if err != nil {
		t.Fatal(err)
	}
	for i, n := range ns {
		checkLevel(t, "quartic", lvs[i], nil, n, want[i], 1e-10)
		if d := math.Abs(lvs[i].E - loose[i].E); d > lvs[i].Err+loose[i].Err+1e-14 {
			t.Errorf("quartic n=%d: tolerances disagree by %.3g, estimates %.3g and %.3g", n, d, lvs[i].Err, loose[i].Err)
		}
	}
}

func TestDoubleWellSplitting(t *testing.T) {
	t.Parallel()
	// Symmetric double well with a barrier of ≈ 5.8ħω: the ground doublet is
	// split by ~1e-12 of its energy. No closed form: the splitting must agree
	// between two tolerances and base meshes within the error estimates, and
	// the two members must carry 0 and 1 nodes.
	w := wkb.Well{V: doubleWell(6.8), Mass: 1, Hbar: 1, A: -15, B: 15}
	var split, serr [2]float64
	for k, s := range []*Settings{nil, {Tol: 1e-13, Step: 0.15}} {
		lvs, err := Levels(w, []int{0, 1}, s)
		if err != nil {
			t.Fatal(err)
		}
		for n, lv := range lvs {
			if lv.Nodes != n || lv.Status != Converged {
				t.Errorf("double well n=%d: nodes %d, status %v", n, lv.Nodes, lv.Status)
			}
		}
		split[k] = lvs[1].E - lvs[0].E
		serr[k] = lvs[0].Err + lvs[1].Err
		if !(split[k] > 3*serr[k]) || split[k] > 1e-11*lvs[0].E {
			t.Errorf("double well: splitting %.3g ± %.3g of E0 = %.6g", split[k], serr[k], lvs[0].E)
		}
	}
	if d := math.Abs(split[0] - split[1]); d > serr[0]+serr[1] || d > 0.05*split[0] {
		t.Errorf("double well: splittings %.6g ± %.2g and %.6g ± %.2g disagree", split[0], serr[0], split[1], serr[1])
	}
	// On an interval that is not symmetric the mesh is not either: each
	// level must then be either right within its estimate or flagged.
	w.B = 15.5
	lvs, _ := Levels(w, []int{0, 1}, nil)
	for n, lv := range lvs {
		want := lvs[0].E // either member: the doublet is far below any tolerance
		if lv.Status == Converged && math.Abs(lv.E-want) > lv.Err+1e-11 {
			t.Errorf("asymmetric mesh n=%d: E = %.17g ± %.3g, doublet at %.17g", n, lv.E, lv.Err, want)
		}
		if lv.Status != Converged && lv.Status != NearDegenerate {
			t.Errorf("asymmetric mesh n=%d: status %v", n, lv.Status)
		}
		t.Logf("asymmetric n=%d: %.17g ± %.3g %v", n, lv.E, lv.Err, lv.Status)
	}
}

func TestAsymmetricDoubleWell(t *testing.T) {
	t.Parallel()
	// (x² − 4)² + 0.3x with ħ = 0.3: levels alternate between the two wells
	// (n = 1 and 3 live in the upper one). No closed form: two base meshes
	// must agree within the error estimates, with n nodes each.
	v := jet.Map(func(x jet.Series) jet.Series {
		u := jet.Sub(jet.Mul(x, x), jet.Const(4, x.Order()))
		return jet.Add(jet.Mul(u, u), jet.Scale(0.3, x))
	})
	w := wkb.Well{V: v, Mass: 1, Hbar: 0.3, A: -5, B: 5}
	ns := []int{0, 1, 2, 3, 10, 20}
	a, err := Levels(w, ns, nil)
	if err != nil {
		t.Fatal(err)
	}
	b, err := Levels(w, ns, &Settings{Step: 0.15})
	if err != nil {
		t.Fatal(err)
	}
	for i, n := range ns {
		if a[i].Nodes != n || b[i].Nodes != n || a[i].Status != Converged || b[i].Status != Converged {
			t.Errorf("n=%d: nodes %d, %d, status %v, %v", n, a[i].Nodes, b[i].Nodes, a[i].Status, b[i].Status)
		}
		if d := math.Abs(a[i].E - b[i].E); d > a[i].Err+b[i].Err || d > 1e-10*a[i].E {
			t.Errorf("n=%d: E = %.15g ± %.2g and %.15g ± %.2g", n, a[i].E, a[i].Err, b[i].E, b[i].Err)
		}
		if i > 0 && !(a[i].E > a[i-1].E) {
			t.Errorf("n=%d: E = %.15g not above level %d", n, a[i].E, ns[i-1])
		}
	}
}

func TestBox(t *testing.T) {
	t.Parallel()
	// Hard walls at 0 and L, V = 0: E_n = ħ²π²(n+1)²/(2mL²) (any textbook);
	// the discretised problem is exact here, at every n.
	zero := jet.Map(func(x jet.Series) jet.Series { return jet.Scale(0, x) })
	const l, m, hbar = 2.5, 0.7, 1.2
	w := wkb.Well{V: zero, Mass: m, Hbar: hbar, A: 0, B: l, LeftWall: true, RightWall: true}
	ns := []int{0, 1, 7, 1000}
	lvs, err := Levels(w, ns, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, n := range ns {
		k := math.Pi * float64(n+1) / l
		checkLevel(t, "box", lvs[i], nil, n, hbar*hbar*k*k/(2*m), 1e-12)
	}
}

func TestCount(t *testing.T) {
	t.Parallel()
	// Harmonic levels ħω(n+½) with ħω = 1: E = n lies between n−1 and n.
	w := wkb.Well{V: harmonic(1, 1), Mass: 1, Hbar: 1, A: -10, B: 10}
	for _, tc := range []struct {
		e    float64
		want int
	}{{0.25, 0}, {1, 1}, {5, 5}, {12.9, 13}} {
		got, err := Count(w, tc.e)
		if err != nil || got != tc.want {
			t.Errorf("Count(%g) = %d, %v, want %d", tc.e, got, err, tc.want)
		}
	}
}

func TestErrors(t *testing.T) {
	t.Parallel()
	v := harmonic(1, 1)
	logV := jet.Map(func(x jet.Series) jet.Series { return jet.Log(x) })
	for _, tc := range []struct {
		name string
		w    wkb.Well
		n    int
	}{
		{"no potential", wkb.Well{Mass: 1, Hbar: 1, A: -1, B: 1}, 0},
		{"mass", wkb.Well{V: v, Mass: 0, Hbar: 1, A: -1, B: 1}, 0},
		{"hbar", wkb.Well{V: v, Mass: 1, Hbar: math.NaN(), A: -1, B: 1}, 0},
		{"empty", wkb.Well{V: v, Mass: 1, Hbar: 1, A: 1, B: 1}, 0},
		{"infinite", wkb.Well{V: v, Mass: 1, Hbar: 1, A: math.Inf(-1), B: 1}, 0},
		{"negative n", wkb.Well{V: v, Mass: 1, Hbar: 1, A: -8, B: 8}, -1},
		{"complex potential", wkb.Well{V: logV, Mass: 1, Hbar: 1, A: -1, B: 1, LeftWall: true, RightWall: true}, 0},
	} {
		if _, err := Solve(tc.w, tc.n, nil); err == nil {
			t.Errorf("%s: no error", tc.name)
		}
	}
	// Not converging within the refinement limit is an error value.
	w := wkb.Well{V: quartic(), Mass: 0.5, Hbar: 1, A: -6, B: 6}
	_, err := Solve(w, 3, &Settings{Tol: 1e-15, MaxRefine: 2})
	var ce *ConvergenceError
	if !errors.As(err, &ce) || !errors.Is(err, ErrNotConverged) || ce.Iterations == 0 {
		t.Errorf("refinement limit: err = %v", err)
	}
}

func TestSplit(t *testing.T) {
	t.Parallel()
	// Harmonic oscillator: E_{n+1} − E_n = ħω exactly.
	const m, omega, hbar = 1.5, 0.8, 0.9
	w := wkb.Well{V: harmonic(m, omega), Mass: m, Hbar: hbar, A: -12, B: 12}
	for _, n := range []int{0, 7} {
		sp, err := Split(w, n, nil)
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(sp.Delta - hbar*omega); d > 1e-11 || d > 3*sp.Err+1e-15 {
			t.Errorf("harmonic split(%d) = %.17g ± %.3g, want %.17g", n, sp.Delta, sp.Err, hbar*omega)
		}
		if sp.Lower.Nodes != n || sp.Upper.Nodes != n+1 {
			t.Errorf("harmonic split(%d): nodes %d and %d", n, sp.Lower.Nodes, sp.Upper.Nodes)
		}
	}
	// Double-well doublets of ~1e-11 and ~1e-12 of the level: two
	// settings agree within the error estimates, which are a small fraction
	// of the splitting.
	for _, d := range []float64{6.5, 6.8} {
		w := wkb.Well{V: doubleWell(d), Mass: 1, Hbar: 1, A: -2.2 * d, B: 2.2 * d}
		a, err := Split(w, 0, nil)
		if err != nil {
			t.Fatal(err)
		}
		b, err := Split(w, 0, &Settings{Tol: 1e-13, Step: 0.3})
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("d = %g: splitting %.6g ± %.2g and %.6g ± %.2g", d, a.Delta, a.Err, b.Delta, b.Err)
		if diff := math.Abs(a.Delta - b.Delta); diff > a.Err+b.Err || a.Err > 0.05*a.Delta || !(a.Delta > 0) {
			t.Errorf("d = %g: splittings %.6g ± %.2g and %.6g ± %.2g", d, a.Delta, a.Err, b.Delta, b.Err)
		}
	}
}
