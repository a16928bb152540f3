package stokes

import (
	"math"
	"math/cmplx"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// TestTraceRays: for Q = a x^m every line is a straight ray, since
// w = (2/(m+2)) √a x^((m+2)/2) has constant argument on rays. The traced
// paths must stay on their ray, m+2 of each family, end on the box, and
// carry |w| = (2/(m+2)) √|a| |x|^((m+2)/2) at the end (closed form). m = 1
// with a = 1 is the Airy case of TestAnglesAiry.
func TestTraceRays(t *testing.T) {
	t.Parallel()
	box := turning.Box{Lo: -2 - 2i, Hi: 2 + 2i}
	for _, tc := range []struct {
		a complex128
		m int
	}{{1, 1}, {-1, 1}, {1 + 2i, 1}, {1, 2}, {-0.5i, 2}, {1, 3}, {2, 4}} {
		c := make([]complex128, tc.m+1)
		c[tc.m] = tc.a
		g, err := Trace(poly(c...), []turning.Point{{Z: 0, Order: tc.m}}, box, nil)
		if err != nil {
			t.Fatal(err)
		}
		if len(g.Lines) != 2*(tc.m+2) {
			t.Fatalf("a=%v m=%d: %d lines, want %d", tc.a, tc.m, len(g.Lines), 2*(tc.m+2))
		}
		for _, ln := range g.Lines {
			if ln.End != EndBox {
				t.Errorf("a=%v m=%d: %v line at %g ends with %v, want box", tc.a, tc.m, ln.Family, ln.StartAngle, ln.End)
			}
			for _, z := range ln.Path[1:] {
				if d := math.Abs(wrap(cmplx.Phase(z) - ln.StartAngle)); d > 1e-9 {
					t.Errorf("a=%v m=%d: %v line at %g: point %v is %g off its ray", tc.a, tc.m, ln.Family, ln.StartAngle, z, d)
					break
				}
			}
			end := ln.Path[len(ln.Path)-1]
			onEdge := math.Abs(math.Abs(real(end))-2) < 1e-12 || math.Abs(math.Abs(imag(end))-2) < 1e-12
			if !onEdge || !box.Contains(end) {
				t.Errorf("a=%v m=%d: %v line at %g ends at %v, not on the box edge", tc.a, tc.m, ln.Family, ln.StartAngle, end)
			}
			p := float64(tc.m+2) / 2
			want := math.Sqrt(cmplx.Abs(tc.a)) / p * math.Pow(cmplx.Abs(end), p)
			got := cmplx.Abs(ln.EndW)
			if math.Abs(got-want) > 1e-9*want { // the default Tol
				t.Errorf("a=%v m=%d: %v line at %g: |w(end)| = %.12g, want %.12g", tc.a, tc.m, ln.Family, ln.StartAngle, got, want)
			}
			if math.Abs(got-want) > ln.WErr+1e-15*want {
				t.Errorf("a=%v m=%d: %v line at %g: |w(end)| error %.2g exceeds its estimate %.2g", tc.a, tc.m, ln.Family, ln.StartAngle, math.Abs(got-want), ln.WErr)
			}
		}
		wantCuts := tc.m % 2
		if len(g.Cuts) != wantCuts || len(g.Degeneracies) != 0 {
			t.Errorf("a=%v m=%d: %d cuts and %d degeneracies, want %d and 0", tc.a, tc.m, len(g.Cuts), len(g.Degeneracies), wantCuts)
		}
	}
}

// TestTraceDoubleZero: Q = x²(x−3)·(−1) near 0 is −(−3)x² = 3x², a double
// zero: four lines of each family leave it, and three of each the simple
// zero at 3.
func TestTraceDoubleZero(t *testing.T) {
	t.Parallel()
	q := poly(0, 0, 3, -1) // 3x² − x³ = x²(3 − x)
	pts := []turning.Point{{Z: 0, Order: 2, Kind: turning.Coalescing}, {Z: 3, Order: 1, Kind: turning.RealSimple}}
	g, err := Trace(q, pts, turning.Box{Lo: -2 - 3i, Hi: 5 + 3i}, nil)
	if err != nil {
		t.Fatal(err)
	}
	count := map[[2]int]int{}
	for _, ln := range g.Lines {
		count[[2]int{ln.From, int(ln.Family)}]++
		if ln.End == EndFailed {
			t.Errorf("line from %d at %g failed", ln.From, ln.StartAngle)
		}
	}
	for _, tc := range []struct {
		from int
		f    Family
		want int
	}{{0, Stokes, 4}, {0, AntiStokes, 4}, {1, Stokes, 3}, {1, AntiStokes, 3}} {
		if got := count[[2]int{tc.from, int(tc.f)}]; got != tc.want {
			t.Errorf("point %d: %d %v lines, want %d", tc.from, got, tc.f, tc.want)
		}
	}
	// Only the simple zero has a cut: the double zero is no branch point.
	if len(g.Cuts) != 1 || g.CutFrom[0] != 1 {
		t.Errorf("cuts from %v, want from point 1 only", g.CutFrom)
	}
}

// TestTraceBarrierJoined: for the barrier Q = x² − E (E − V with V = −x²),
// E > 0 real, the turning points are ±√E and on the segment between them
// Q < 0, √Q = i√(E − x²) and w = ∫_{−√E}^x √Q is purely imaginary: the
// segment is a Stokes line. Its Gap is i∫_{−√E}^{√E} √(E−x²) dx = iπE/2
// (area of a half disc of radius √E). The traced Stokes line from one turning
// point must end on the other, and the degeneracy be reported with that Gap.
// For Q = E − x² (a well) with E > 0 the same segment is an anti-Stokes
// line instead (w real), with Gap πE/2.
func TestTraceBarrierJoined(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		name   string
		sign   float64 // Q = sign·(x² − E)
		E      float64
		family Family
		gap    complex128 // |Gap| along the joining line, closed form above
	}{
		{"barrier E=1", 1, 1, Stokes, complex(0, math.Pi/2)},
		{"barrier E=0.3", 1, 0.3, Stokes, complex(0, math.Pi*0.3/2)},
		{"barrier E=2.5", 1, 2.5, Stokes, complex(0, math.Pi*2.5/2)},
		{"well E=1", -1, 1, AntiStokes, complex(math.Pi/2, 0)},
	} {
		s := complex(tc.sign, 0)
		q := poly(-s*complex(tc.E, 0), 0, s)
		r := math.Sqrt(tc.E)
		pts := []turning.Point{{Z: complex(-r, 0), Order: 1}, {Z: complex(r, 0), Order: 1}}
		g, err := Trace(q, pts, turning.DefaultBox(-2*r, 2*r), nil)
		if err != nil {
			t.Fatal(err)
		}
		joined := 0
		for _, ln := range g.Lines {
			if ln.Family != tc.family || ln.End != EndTurningPoint {
				continue
			}
			joined++
			if ln.To != 1-ln.From {
				t.Errorf("%s: line from %d ends at %d", tc.name, ln.From, ln.To)
			}
			got, want := cmplx.Abs(ln.EndW), cmplx.Abs(tc.gap)
			if math.Abs(got-want) > 1e-9*want || math.Abs(got-want) > ln.WErr+1e-15*want { // the default Tol, and the estimate
				t.Errorf("%s: |w| at the end = %.12g ± %.2g, want %.12g", tc.name, got, ln.WErr, want)
			}
			for _, z := range ln.Path {
				if math.Abs(imag(z)) > 1e-9 {
					t.Errorf("%s: joining line leaves the real axis at %v", tc.name, z)
					break
				}
			}
		}
		if joined != 2 {
			t.Errorf("%s: %d %v lines between the points, want 2 (one each way)", tc.name, joined, tc.family)
		}
		wantDeg := 0
		if tc.family == Stokes {
			wantDeg = 1
		}
		if len(g.Degeneracies) != wantDeg {
			t.Fatalf("%s: degeneracies %v, want %d", tc.name, g.Degeneracies, wantDeg)
		}
		if wantDeg == 1 {
			d := g.Degeneracies[0]
			// Gap comes from quadrature along the traced path: within its
			// own estimate Err of the closed form, and Err within Tol.
			if d.From+d.To != 1 || math.Abs(real(d.Gap)) > d.Err+1e-15 ||
				math.Abs(cmplx.Abs(d.Gap)-cmplx.Abs(tc.gap)) > d.Err+1e-15 || d.Err > 1e-9*cmplx.Abs(tc.gap) {
				t.Errorf("%s: degeneracy %+v, want between 0 and 1 with |Gap| = %g, Re Gap = 0", tc.name, d, cmplx.Abs(tc.gap))
			}
		}
	}
}

// TestTraceComplexE: for Q = E − x² with complex E the turning points are
// ±√E and Gap = πE/2 (TestGapClosedForm). A Stokes line joins them only
// when Re E = 0, an anti-Stokes line only when Im E = 0.
func TestTraceComplexE(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		E            complex128
		stokes, anti bool // joined by a Stokes / anti-Stokes line
	}{
		{1i, true, false},
		{2i, true, false},
		{1, false, true},
		{1 + 0.3i, false, false},
		{0.2 + 1i, false, false},
	} {
		q := poly(tc.E, 0, -1)
		r := cmplx.Sqrt(tc.E)
		pts := []turning.Point{{Z: -r, Order: 1}, {Z: r, Order: 1}}
		g, err := Trace(q, pts, turning.Box{Lo: -3 - 3i, Hi: 3 + 3i}, nil)
		if err != nil {
			t.Fatal(err)
		}
		var st, an bool
		for _, ln := range g.Lines {
			if ln.End == EndTurningPoint && ln.To != ln.From {
				if ln.Family == Stokes {
					st = true
				} else {
					an = true
				}
			}
		}
		if st != tc.stokes || an != tc.anti {
			t.Errorf("E = %v: joined by Stokes %v, anti-Stokes %v; want %v, %v", tc.E, st, an, tc.stokes, tc.anti)
		}
		if (len(g.Degeneracies) == 1) != tc.stokes {
			t.Errorf("E = %v: degeneracies %v", tc.E, g.Degeneracies)
		}
	}
}

// TestTraceFour: the double well E + x² − 0.3x⁴ at E = −0.4 has four real
// turning points a1 < a2 < a3 < a4 (closed form in doubleWell). Q > 0 on
// (a1, a2) and (a3, a4) (anti-Stokes segments, w real) and Q < 0 on
// (a2, a3) (a Stokes segment: the barrier degeneracy).
func TestTraceFour(t *testing.T) {
	t.Parallel()
	q, pts := doubleWell(-0.4)
	g, err := Trace(q, pts, turning.DefaultBox(-2.5, 2.5), nil)
	if err != nil {
		t.Fatal(err)
	}
	if len(g.Lines) != 24 {
		t.Errorf("%d lines, want 24", len(g.Lines))
	}
	joins := map[[3]int]bool{}
	for _, ln := range g.Lines {
		if ln.End == EndFailed || ln.End == EndLimit {
			t.Errorf("line from %d at %g ended with %v", ln.From, ln.StartAngle, ln.End)
		}
		if ln.End == EndTurningPoint {
			joins[[3]int{int(ln.Family), min(ln.From, ln.To), max(ln.From, ln.To)}] = true
		}
	}
	for _, want := range [][3]int{{int(AntiStokes), 0, 1}, {int(Stokes), 1, 2}, {int(AntiStokes), 2, 3}} {
		if !joins[want] {
			t.Errorf("no %v line between %d and %d; joins %v", Family(want[0]), want[1], want[2], joins)
		}
	}
	if len(joins) != 3 {
		t.Errorf("joins %v, want exactly three", joins)
	}
	if len(g.Degeneracies) != 1 || g.Degeneracies[0].From+g.Degeneracies[0].To != 3 {
		t.Errorf("degeneracies %v, want one between 1 and 2", g.Degeneracies)
	}
	if len(g.Cuts) != 4 {
		t.Errorf("%d cuts, want 4", len(g.Cuts))
	}
	for k, c := range g.Cuts {
		for _, z := range c[1:] {
			if imag(z) > 0 {
				t.Errorf("cut %d from a real point enters the upper half plane at %v", k, z)
				break
			}
		}
	}
}

// TestTraceSechPoles: the sech² barrier above its top (sechBarrier) has
// double poles of Q at ±iπ/2 between the turning points ±ia and ±i(π−a).
// Near a double pole Q ≈ U0/(x ∓ iπ/2)², so √Q ≈ √U0/(x ∓ iπ/2) and going
// once around the pole changes w by 2πi√U0: the two Stokes lines from ia
// that pass either side of iπ/2 reach i(π−a) with |Gap| = π√U0 (half the
// loop, by the symmetry x → −conj(x) of the picture), and the segment from
// −ia to ia is a Stokes line (the conjugate-pair argument: Gap = 2i Im I).
func TestTraceSechPoles(t *testing.T) {
	t.Parallel()
	const E, U0 = 1.2, 1.0
	q, pts := sechBarrier(E, U0)
	g, err := Trace(q, pts, turning.DefaultBox(-3, 3), nil)
	if err != nil {
		t.Fatal(err)
	}
	found := map[[2]int]Degeneracy{}
	for _, d := range g.Degeneracies {
		found[[2]int{min(d.From, d.To), max(d.From, d.To)}] = d
	}
	// The Gap from −ia to ia is checked against quadrature in TestGapSech;
	// here only that the degeneracy exists and Re Gap = 0.
	for _, pair := range [][2]int{{0, 1}, {1, 2}, {2, 3}} {
		gp, ok := found[pair]
		if !ok {
			t.Errorf("no degeneracy between %d and %d; got %v", pair[0], pair[1], g.Degeneracies)
			continue
		}
		if math.Abs(real(gp.Gap)) > gp.Err+1e-15 || gp.Err > 1e-9 {
			t.Errorf("pair %v: Gap %v ± %.2g, want Re Gap = 0", pair, gp.Gap, gp.Err)
		}
		if pair != [2]int{1, 2} && math.Abs(cmplx.Abs(gp.Gap)-math.Pi*math.Sqrt(U0)) > gp.Err+1e-15 {
			t.Errorf("pair %v: |Gap| = %.15g ± %.2g, want π√U0 = %.15g", pair, cmplx.Abs(gp.Gap), gp.Err, math.Pi*math.Sqrt(U0))
		}
	}
	poles := 0
	for _, ln := range g.Lines {
		if ln.End == EndPole {
			poles++
			if pts[ln.To].Order != -2 {
				t.Errorf("line ends at %d, not a pole", ln.To)
			}
		}
	}
	if poles != 4 {
		t.Errorf("%d lines end at poles, want 4 (the anti-Stokes lines along the imaginary axis)", poles)
	}
	// Cuts (rule in cuts.go): from ±ia no anti-Stokes line within 90° of
	// the away direction ends acceptably (the one along the axis ends at a
	// double pole, no branch point), so the straight ray is taken, up to
	// the next odd point ±i(π−a): two cuts, each joining a pair through a
	// double pole.
	if len(g.Cuts) != 2 {
		t.Fatalf("cuts %v, want 2", g.Cuts)
	}
	for k, c := range g.Cuts {
		a, b := c[0], c[len(c)-1]
		if len(c) != 2 || real(a) != 0 || real(b) != 0 || math.Abs(math.Abs(imag(a))+math.Abs(imag(b))-math.Pi) > 1e-12 {
			t.Errorf("cut %d = %v, want a segment of the imaginary axis from ±ia to ±i(π−a)", k, c)
		}
	}
}

// TestTraceErrors: unusable input returns an error, never a panic.
func TestTraceErrors(t *testing.T) {
	t.Parallel()
	q := poly(0, 1)
	box := turning.Box{Lo: -1 - 1i, Hi: 1 + 1i}
	for _, tc := range []struct {
		name string
		run  func() error
	}{
		{"nil Q", func() error { _, err := Trace(nil, nil, box, nil); return err }},
		{"empty box", func() error { _, err := Trace(q, nil, turning.Box{Lo: 1, Hi: 1}, nil); return err }},
		{"order 0", func() error { _, err := Trace(q, []turning.Point{{Z: 0}}, box, nil); return err }},
		{"NaN point", func() error {
			_, err := Trace(q, []turning.Point{{Z: cmplx.NaN(), Order: 1}}, box, nil)
			return err
		}},
		{"nil Gap", func() error { _, err := Gap(nil, 0, 1); return err }},
		{"infinite Gap end", func() error { _, err := Gap(q, cmplx.Inf(), 1); return err }},
		{"empty range", func() error { _, err := FindDegeneracy(nil, 0, 1); return err }},
		{"plot nil", func() error { return Plot(nil, PlotOptions{}, "x.svg") }},
		{"plot format", func() error { return Plot(&Geometry{Box: box}, PlotOptions{}, "x.gif") }},
	} {
		if err := tc.run(); err == nil {
			t.Errorf("%s: no error", tc.name)
		}
	}
}

// TestTraceSimplePole: Q = 1 + 1/x has a simple zero at −1 and a simple
// pole at 0 with residue b = 1. On (−1, 0) Q < 0, so the segment is a
// Stokes line, from the zero into the pole, with
// |w| = ∫_0^1 √((1−u)/u) du = B(1/2, 3/2) = π/2 (u = −x). The pole emits
// one line of each family (Angles): Stokes at π − arg b = π (back along the
// segment to the zero), anti-Stokes at −arg b = 0 (along the positive axis,
// where Q > 0).
func TestTraceSimplePole(t *testing.T) {
	t.Parallel()
	q := jet.Map(func(s jet.Series) jet.Series {
		r := jet.PowInt(s, -1)
		r[0]++
		return r
	})
	pts := []turning.Point{{Z: -1, Order: 1}, {Z: 0, Order: -1, Kind: turning.Pole}}
	g, err := Trace(q, pts, turning.Box{Lo: -3 - 2i, Hi: 3 + 2i}, nil)
	if err != nil {
		t.Fatal(err)
	}
	var toPole, fromPole, anti int
	for _, ln := range g.Lines {
		switch {
		case ln.From == 0 && ln.Family == Stokes && ln.End == EndPole:
			toPole++
			// Tolerance: the default Tol of 1e-9 D per step, over ~60 steps.
			if ln.To != 1 || math.Abs(cmplx.Abs(ln.EndW)-math.Pi/2) > 1e-8 || math.Abs(real(ln.EndW)) > 1e-8 {
				t.Errorf("Stokes line into the pole: To %d, w = %v, want ±iπ/2", ln.To, ln.EndW)
			}
		case ln.From == 1 && ln.Family == Stokes:
			fromPole++
			if ln.End != EndTurningPoint || ln.To != 0 || math.Abs(ln.StartAngle-math.Pi) > 1e-9 {
				t.Errorf("Stokes line from the pole leaves at %g and ends with %v at %d, want π and the zero", ln.StartAngle, ln.End, ln.To)
			}
		case ln.From == 1 && ln.Family == AntiStokes:
			anti++
			if ln.End != EndBox || math.Abs(ln.StartAngle) > 1e-9 {
				t.Errorf("anti-Stokes line from the pole leaves at %g and ends with %v, want 0 and the box", ln.StartAngle, ln.End)
			}
		}
	}
	if toPole != 1 || fromPole != 1 || anti != 1 {
		t.Errorf("lines: %d zero→pole, %d Stokes and %d anti-Stokes from the pole; want 1 each", toPole, fromPole, anti)
	}
	if len(g.Degeneracies) != 0 {
		t.Errorf("degeneracies %v, want none (a pole is not a turning point)", g.Degeneracies)
	}
}

// wAlong returns w = ∫ √Q along the polygon of path (path[0] the turning
// point), continuing the root from the principal one at path[1]: the
// first piece by tanh-sinh (segment, singular at the turning point), the
// others by gonum's 8-point Gauss–Legendre rule on each chord, the root
// tracked from node to node. It shares no code with the Runge–Kutta
// integration of w in the tracer.
func wAlong(q jet.Func, path []complex128) complex128 {
	f := cmplx.Sqrt(q.Eval(path[1]))
	s, _, _ := segment(q, path[1], path[0], f)
	w := -s
	x := make([]float64, 8)
	wt := make([]float64, 8)
	quad.Legendre{}.FixedLocations(x, wt, 0, 1)
	for k := 1; k+1 < len(path); k++ {
		a, b := path[k], path[k+1]
		prev, fp := a, f
		for j := range x {
			z := a + (b-a)*complex(x[j], 0)
			fp = track(q, prev, z, fp)
			prev = z
			w += (b - a) * complex(wt[j], 0) * fp
		}
		f = track(q, a, b, f)
	}
	return w
}

// TestTraceRandomPolynomials traces Q = lead · Π (x − r_k) for random
// roots (fixed seed) and checks every line independently of the tracer
// (wAlong): along the traced path Re w = 0 (Stokes) or Im w = 0
// (anti-Stokes) must hold at its end to the tracing tolerance, and every
// line must end properly.
func TestTraceRandomPolynomials(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	box := turning.Box{Lo: -2 - 2i, Hi: 2 + 2i}
	for trial := 0; trial < 5; trial++ {
		n := 2 + trial%3
		roots := make([]complex128, n)
		for k := range roots {
			roots[k] = complex(2.6*rng.Float64()-1.3, 2.6*rng.Float64()-1.3)
		}
		lead := cmplx.Rect(1, 2*math.Pi*rng.Float64())
		q := jet.Map(func(s jet.Series) jet.Series {
			r := jet.Const(lead, s.Order())
			for _, z := range roots {
				d := append(jet.Series(nil), s...)
				d[0] -= z
				r = jet.Mul(r, d)
			}
			return r
		})
		pts := make([]turning.Point, n)
		for k, z := range roots {
			pts[k] = turning.Point{Z: z, Order: 1}
		}
		g, err := Trace(q, pts, box, nil)
		if err != nil {
			t.Fatal(err)
		}
		if len(g.Lines) != 6*n {
			t.Errorf("trial %d: %d lines, want %d", trial, len(g.Lines), 6*n)
		}
		for _, ln := range g.Lines {
			if ln.End == EndFailed || ln.End == EndLimit {
				t.Errorf("trial %d: line from %d at %.3f ended with %v", trial, ln.From, ln.StartAngle, ln.End)
				continue
			}
			if len(ln.W) != len(ln.Path) || ln.W[len(ln.W)-1] != ln.EndW {
				t.Errorf("trial %d: %d values of w for %d path points, last %v, EndW %v", trial, len(ln.W), len(ln.Path), ln.W[len(ln.W)-1], ln.EndW)
			}
			w := wAlong(q, ln.Path)
			// Tolerance: the bound Tol·D (default Tol = 1e-9, D the box
			// diagonal) that the error control puts on one step before
			// local extrapolation, relative to |w|; the whole line, with
			// extrapolation, must stay within one step's bound (observed:
			// about 1e-10). The Gauss–Legendre error on chords of length
			// ≤ MaxStep is negligible (~(h/2)^16).
			tol := 1e-9 * cmplx.Abs(box.Hi-box.Lo) * cmplx.Abs(w)
			if r := math.Abs(part(ln.Family, w)); r > tol {
				t.Errorf("trial %d: %v line from %d at %.3f: at %v w = %v, part %.2g > %.2g", trial, ln.Family, ln.From, ln.StartAngle, ln.Path[len(ln.Path)-1], w, r, tol)
			}
			// And the tracer's own estimate WErr must cover its error
			// (plus rounding of the independent sum, 1e-13 |w|).
			if d := math.Min(cmplx.Abs(w-ln.EndW), cmplx.Abs(w+ln.EndW)); d > tol || d > ln.WErr+1e-13*cmplx.Abs(w) {
				t.Errorf("trial %d: %v line from %d at %.3f: w(end) = %v, tracer %v ± %.2g", trial, ln.Family, ln.From, ln.StartAngle, w, ln.EndW, ln.WErr)
			}
		}
	}
}

// TestTraceWarnings: a point that is not a zero of the stated order, and a
// point outside the box, are traced around with warnings, not errors.
func TestTraceWarnings(t *testing.T) {
	t.Parallel()
	box := turning.Box{Lo: -1 - 1i, Hi: 1 + 1i}
	for _, tc := range []struct {
		name string
		pts  []turning.Point
		want string
	}{
		{"not a zero", []turning.Point{{Z: 0.3, Order: 1}}, "not small"},
		{"outside", []turning.Point{{Z: 0.1, Order: 1}, {Z: 5, Order: 1}}, "outside the box"},
	} {
		g, err := Trace(poly(-0.1, 1), tc.pts, box, nil) // Q = x − 0.1
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		found := false
		for _, w := range g.Warnings {
			found = found || strings.Contains(w, tc.want)
		}
		if !found {
			t.Errorf("%s: warnings %q lack %q", tc.name, g.Warnings, tc.want)
		}
	}
}

// TestTraceNearDegenerate: Q = E − x² with E = δ + i has Re Gap/|Gap| =
// δ/|E| (Gap = πE/2). With δ = 1e-7 the Stokes line from −√E passes within
// about |δ|^(2/3) of √E: within the default Degenerate = 1e-5 it is
// reported as ending there, with Re Gap ≈ πδ/2 showing how near; with
// Degenerate = 1e-9 it passes by and ends on the box.
func TestTraceNearDegenerate(t *testing.T) {
	t.Parallel()
	const delta = 1e-7
	E := complex(delta, 1)
	r := cmplx.Sqrt(E)
	pts := []turning.Point{{Z: -r, Order: 1}, {Z: r, Order: 1}}
	box := turning.Box{Lo: -3 - 3i, Hi: 3 + 3i}
	for _, tc := range []struct {
		tol  float64
		want int // degeneracies
	}{{0, 1}, {1e-9, 0}} {
		g, err := Trace(poly(E, 0, -1), pts, box, &Settings{Degenerate: tc.tol})
		if err != nil {
			t.Fatal(err)
		}
		if len(g.Degeneracies) != tc.want {
			t.Errorf("Degenerate %g: degeneracies %v, want %d", tc.tol, g.Degeneracies, tc.want)
			continue
		}
		if tc.want == 1 {
			d := g.Degeneracies[0]
			if math.Abs(math.Abs(real(d.Gap))-math.Pi*delta/2) > 1e-3*math.Pi*delta/2+d.Err {
				t.Errorf("Re Gap = %.6g ± %.2g, want ±πδ/2 = %.6g", real(d.Gap), d.Err, math.Pi*delta/2)
			}
		}
		for _, ln := range g.Lines {
			if ln.End == EndFailed || ln.End == EndLimit {
				t.Errorf("Degenerate %g: line from %d ended with %v", tc.tol, ln.From, ln.End)
			}
		}
	}
}

// TestAxisCrossings: for Q = E − x² with E = 0.6 + 0.8i the Stokes and
// anti-Stokes lines from ±√E cross the real axis (figure of the package
// tests). At every crossing x0 of a line from t, w(x0) = ∫_t^{x0} √Q must
// have Re w = 0 (Stokes) or Im w = 0 (anti-Stokes), checked with Gap along
// the straight segment from t to x0 (homotopic to the line: Q has no other
// zero nearby, and the segment's far side holds no singularity). For the
// sech² barrier above its top the only crossings are the two Stokes lines
// joining ±ia along the imaginary axis, at x = 0 (symmetry x → −x̄).
func TestAxisCrossings(t *testing.T) {
	t.Parallel()
	E := complex(0.6, 0.8)
	r := cmplx.Sqrt(E)
	q := poly(E, 0, -1)
	pts := []turning.Point{{Z: -r, Order: 1}, {Z: r, Order: 1}}
	g, err := Trace(q, pts, turning.Box{Lo: -3 - 2i, Hi: 3 + 2i}, nil)
	if err != nil {
		t.Fatal(err)
	}
	cs := g.AxisCrossings()
	if len(cs) < 2 {
		t.Fatalf("crossings %v, want some", cs)
	}
	for _, c := range cs {
		w, est, err := GapEstimate(q, pts[c.From].Z, complex(c.X, 0), []turning.Point{})
		if err != nil {
			t.Fatal(err)
		}
		// The crossing is put on the line by Newton's method: the level
		// must hold to the tracing tolerance (default Tol = 1e-9), and the
		// w reported must be Gap's up to the branch sign.
		if r := math.Abs(part(c.Family, w)); r > 1e-9*cmplx.Abs(w)+est {
			t.Errorf("%v line from %d crosses at %.12f with w = %v", c.Family, c.From, c.X, w)
		}
		if math.Min(cmplx.Abs(c.W-w), cmplx.Abs(c.W+w)) > 1e-9*cmplx.Abs(w)+est {
			t.Errorf("%v line from %d: w at the crossing %v, Gap %v", c.Family, c.From, c.W, w)
		}
	}
	qs, ps := sechBarrier(1.2, 1)
	gs, err := Trace(qs, ps, turning.DefaultBox(-3, 3), nil)
	if err != nil {
		t.Fatal(err)
	}
	cs = gs.AxisCrossings()
	if len(cs) != 2 {
		t.Fatalf("sech: crossings %v, want 2", cs)
	}
	for _, c := range cs {
		if c.Family != Stokes || math.Abs(c.X) > 1e-9 || c.From != 1 && c.From != 2 {
			t.Errorf("sech: crossing %+v, want the Stokes lines from 1 and 2 at 0", c)
		}
	}
}

// TestTraceBranch: each line is traced on the branch on which w grows
// along it (Line documentation): along Stokes lines W[k] = i|W[k]|, along
// anti-Stokes lines W[k] = |W[k]|, with |W| increasing, for the double
// well of TestTraceFour.
func TestTraceBranch(t *testing.T) {
	t.Parallel()
	q, pts := doubleWell(-0.4)
	g, err := Trace(q, pts, turning.DefaultBox(-2.5, 2.5), nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, ln := range g.Lines {
		prev := 0.0
		for k, w := range ln.W[1:] {
			var along float64 // the part that must grow
			if ln.Family == Stokes {
				along = imag(w)
			} else {
				along = real(w)
			}
			if along <= prev || math.Abs(part(ln.Family, w)) > 1e-9*along {
				t.Errorf("%v line from %d at %.3f: W[%d] = %v after %g", ln.Family, ln.From, ln.StartAngle, k+1, w, prev)
				break
			}
			prev = along
		}
	}
}
