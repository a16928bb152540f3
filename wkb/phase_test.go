package wkb

import (
	"math"
	"math/cmplx"
	"testing"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// poly returns Q(x) = Σ c[k] x^k as a jet.Func.
func poly(c ...float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series {
		q := jet.Const(0, x.Order())
		for k := len(c) - 1; k >= 0; k-- {
			q = jet.Mul(q, x)
			q[0] += complex(c[k], 0)
		}
		return q
	})
}

func TestRiccatiAiry(t *testing.T) {
	t.Parallel()
	// Q = x: φ_0 = i√x, φ_1 = −Q′/(4Q) = −1/(4x) and, from the recursion,
	// φ_2 = (i/2)(−Q″/(4Q^{3/2}) + 5Q′²/(16Q^{5/2})) = 5i/(32 x^{5/2})
	// (derived by hand from φ_2 = −(φ_1′ + φ_1²)/(2φ_0)).
	for _, x := range []complex128{2, 0.5 + 1i, -3 + 0.1i} {
		phi := RiccatiAt(Problem{Q: poly(0, 1), Lambda: 1}, x, 0, 2)
		want := []complex128{1i * cmplx.Sqrt(x), -1 / (4 * x), 5i / (32 * cmplx.Pow(x, 2.5))}
		for k := range want {
			if cmplx.Abs(phi[k]-want[k]) > 1e-14*cmplx.Abs(want[k]) {
				t.Errorf("RiccatiAt(Q=x, %v)[%d] = %v, want %v", x, k, phi[k], want[k])
			}
		}
	}
}

func TestPairPhaseHarmonic(t *testing.T) {
	t.Parallel()
	// Q = E − x²: λ∫√Q = λπE/2 and every higher term vanishes (the
	// quantisation condition of the oscillator is exact at first order).
	for _, tc := range []struct{ e, lambda float64 }{{1, 1}, {3, 1}, {0.5, 20}, {7, 0.3}} {
		p := Problem{Q: poly(tc.e, 0, -1), Lambda: tc.lambda}
		r := math.Sqrt(tc.e)
		ps, err := PairPhase(p, complex(-r, 0), complex(r, 0), 10, nil)
		if err != nil {
			t.Fatalf("PairPhase(E=%g): %v", tc.e, err)
		}
		want := tc.lambda * math.Pi * tc.e / 2
		if d := cmplx.Abs(ps.Terms[0] - complex(want, 0)); d > 1e-13*want {
			t.Errorf("E=%g λ=%g: Terms[0] = %v, want %g", tc.e, tc.lambda, ps.Terms[0], want)
		}
		for k := 1; k < len(ps.Terms); k++ {
			if a := cmplx.Abs(ps.Terms[k]); a > 1e-12*want {
				t.Errorf("E=%g λ=%g: Terms[%d] = %v, want 0", tc.e, tc.lambda, k, ps.Terms[k])
			}
		}
		if ps.ErrEst > 1e-12*want {
			t.Errorf("E=%g: ErrEst = %g, want rounding level", tc.e, ps.ErrEst)
		}
	}
}

func TestPairPhaseBarrier(t *testing.T) {
	t.Parallel()
	// Q = x² − E: λ∫√Q = iθ with θ = λπE/2, corrections zero; the turning
	// points may be given in either order, the branch convention being
	// the principal root at the midpoint.
	p := Problem{Q: poly(-2, 0, 1), Lambda: 3}
	r := math.Sqrt2
	for _, ends := range [][2]complex128{{complex(-r, 0), complex(r, 0)}, {complex(r, 0), complex(-r, 0)}} {
		ps, err := PairPhase(p, ends[0], ends[1], 6, nil)
		if err != nil {
			t.Fatal(err)
		}
		want := complex(0, 3*math.Pi) // sign flips with the direction of the segment
		if real(ends[0]) > 0 {
			want = -want
		}
		if cmplx.Abs(ps.Terms[0]-want) > 1e-13*cmplx.Abs(want) {
			t.Errorf("PairPhase(%v→%v) Terms[0] = %v, want %v", ends[0], ends[1], ps.Terms[0], want)
		}
		for k := 1; k < len(ps.Terms); k++ {
			if cmplx.Abs(ps.Terms[k]) > 1e-12 {
				t.Errorf("Terms[%d] = %v, want 0", k, ps.Terms[k])
			}
		}
	}
}

func TestPairPhaseQuartic(t *testing.T) {
	t.Parallel()
	// Q = E − x⁴, λ = 1. Closed forms derived here: with x = E^{1/4}u,
	//   σ_0 = E^{3/4} K0,  K0 = ∫_{−1}^{1} √(1−u⁴) du = B(1/4, 3/2)/2;
	// σ_2 = −(1/96)∮ Q″ Q^{−3/2} dx (φ_2 = (i/2)(−Q″/(4Q^{3/2}) + 5Q′²/(16Q^{5/2}))
	// and an integration by parts), and Q^{−3/2} = −4 ∂²_E √Q give
	//   σ_2 = −(1/12) ∂²_E ∫ V″ √(E−V) dx = −(5/16) J E^{−3/4},
	//   J = ∫_{−1}^{1} u² √(1−u⁴) du = B(3/4, 3/2)/2,
	// the second-order term of the x^{2N} series of Bender & Orszag,
	// Advanced Mathematical Methods, §10.7.
	beta := func(a, b float64) float64 { return math.Gamma(a) * math.Gamma(b) / math.Gamma(a+b) }
	k0 := beta(0.25, 1.5) / 2
	j := beta(0.75, 1.5) / 2
	for _, e := range []float64{1, 3, 10, 50} {
		p := Problem{Q: poly(e, 0, 0, 0, -1), Lambda: 1}
		r := math.Pow(e, 0.25)
		ps, err := PairPhase(p, complex(-r, 0), complex(r, 0), 2, nil)
		if err != nil {
			t.Fatal(err)
		}
		want0 := k0 * math.Pow(e, 0.75)
		want2 := -5.0 / 16 * j * math.Pow(e, -0.75)
		if cmplx.Abs(ps.Terms[0]-complex(want0, 0)) > 1e-12*want0 {
			t.Errorf("E=%g: Terms[0] = %v, want %g", e, ps.Terms[0], want0)
		}
		if cmplx.Abs(ps.Terms[1]-complex(want2, 0)) > 1e-10*math.Abs(want2) {
			t.Errorf("E=%g: Terms[1] = %v, want %g", e, ps.Terms[1], want2)
		}
	}
}

func TestPairPhaseContourIndependence(t *testing.T) {
	t.Parallel()
	// The integrals do not depend on the contour as long as it holds only
	// the two turning points: Q = E − x⁴ has further zeros at ±iE^{1/4}, at
	// elliptic radius 1 + √2; radii 1.6 and 2.2 must agree within the
	// quadrature errors reported.
	e := 5.0
	p := Problem{Q: poly(e, 0, 0, 0, -1), Lambda: 2}
	r := math.Pow(e, 0.25)
	var ref []complex128
	var refErr []float64
	for _, rad := range []float64{2.2, 1.6} {
		ps, err := PairPhase(p, complex(-r, 0), complex(r, 0), 8, &PhaseSettings{Radius: rad})
		if err != nil {
			t.Fatal(err)
		}
		if ref == nil {
			ref, refErr = ps.Terms, ps.TermErr
			continue
		}
		for k := range ref {
			if d := cmplx.Abs(ps.Terms[k] - ref[k]); (k <= 2 && d > 1e-9*cmplx.Abs(ref[k])) || d > refErr[k]+ps.TermErr[k] {
				t.Errorf("radius %g: Terms[%d] = %v ± %.2g, radius 2.2 gave %v ± %.2g", rad, k, ps.Terms[k], ps.TermErr[k], ref[k], refErr[k])
			}
		}
	}
}

func TestPairPhasePoleDetection(t *testing.T) {
	t.Parallel()
	// Q = E + V0 sech²x has double poles at ±iπ/2 and more zeros off the
	// axis; not passing them must give the result of passing them.
	v0, e := 4.0, -1.0
	q := jet.Map(func(x jet.Series) jet.Series {
		s := jet.Sech(x)
		v := jet.Scale(complex(v0, 0), jet.Mul(s, s))
		v[0] += complex(e, 0)
		return v
	})
	p := Problem{Q: q, Lambda: 1.5}
	tp := math.Acosh(math.Sqrt(v0 / -e))
	auto, err := PairPhase(p, complex(-tp, 0), complex(tp, 0), 6, nil)
	if err != nil {
		t.Fatal(err)
	}
	given, err := PairPhase(p, complex(-tp, 0), complex(tp, 0), 6,
		&PhaseSettings{Others: []complex128{complex(0, math.Pi/2), complex(0, -math.Pi/2)}})
	if err != nil {
		t.Fatal(err)
	}
	// Closed form of the leading term: λ∫√(E + V0 sech²x) = λπ(√V0 − √−E)
	// (Landau & Lifshitz, QM §23 problem 4, via the substitution sinh x = …).
	want0 := 1.5 * math.Pi * (math.Sqrt(v0) - math.Sqrt(-e))
	if cmplx.Abs(auto.Terms[0]-complex(want0, 0)) > 1e-11*want0 {
		t.Errorf("Terms[0] = %v, want %g", auto.Terms[0], want0)
	}
	for k := range auto.Terms {
		d := cmplx.Abs(auto.Terms[k] - given.Terms[k])
		if (k <= 2 && d > 1e-8*cmplx.Abs(given.Terms[k])) || d > auto.TermErr[k]+given.TermErr[k]+1e-15 {
			t.Errorf("Terms[%d]: automatic %v ± %.2g, with Others %v ± %.2g", k, auto.Terms[k], auto.TermErr[k], given.Terms[k], given.TermErr[k])
		}
	}
}

func TestPairPhaseQ1(t *testing.T) {
	t.Parallel()
	// A constant Q1 = c shifts E by c/λ² in Q = E − x², so the order-2 term
	// is λ^{−1} c π/2 exactly and the rest vanish.
	lambda, c := 4.0, 0.7
	p := Problem{Q: poly(2, 0, -1), Q1: poly(c), Lambda: lambda}
	ps, err := PairPhase(p, -math.Sqrt2, math.Sqrt2, 4, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want := c * math.Pi / 2 / lambda; cmplx.Abs(ps.Terms[1]-complex(want, 0)) > 1e-13 {
		t.Errorf("Terms[1] = %v, want %g", ps.Terms[1], want)
	}
	if cmplx.Abs(ps.Terms[2]) > 1e-13 {
		t.Errorf("Terms[2] = %v, want 0", ps.Terms[2])
	}
}

func TestPairPhaseErrors(t *testing.T) {
	t.Parallel()
	p := Problem{Q: poly(1, 0, -1), Lambda: 1}
	for _, tc := range []struct {
		name   string
		p      Problem
		t1, t2 complex128
		order  int
		s      *PhaseSettings
	}{
		{"nil Q", Problem{Lambda: 1}, -1, 1, 2, nil},
		{"zero lambda", Problem{Q: p.Q}, -1, 1, 2, nil},
		{"coincident", p, 1, 1, 2, nil},
		{"negative order", p, -1, 1, -2, nil},
		{"nan", p, cmplx.NaN(), 1, 2, nil},
		{"singularity on segment", p, -1, 1, 2, &PhaseSettings{Others: []complex128{0}}},
		{"node limit too small", p, -1, 1, 2, &PhaseSettings{MaxNodes: 8}},
	} {
		if _, err := PairPhase(tc.p, tc.t1, tc.t2, tc.order, tc.s); err == nil {
			t.Errorf("%s: no error", tc.name)
		}
	}
}

func TestPairPhaseComplexPair(t *testing.T) {
	t.Parallel()
	// Q = 1 + x² (above a parabolic barrier top): turning points ±i; with
	// the principal root at the midpoint 0, λ∫_{−i}^{i}√Q dx = iλπ/2
	// (x = is: ∫_{−1}^{1}√(1−s²) i ds), and the corrections vanish.
	p := Problem{Q: poly(1, 0, 1), Lambda: 2}
	ps, err := PairPhase(p, -1i, 1i, 6, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want := complex(0, math.Pi); cmplx.Abs(ps.Terms[0]-want) > 1e-13 {
		t.Errorf("Terms[0] = %v, want %v", ps.Terms[0], want)
	}
	for k := 1; k < len(ps.Terms); k++ {
		if cmplx.Abs(ps.Terms[k]) > 1e-12 {
			t.Errorf("Terms[%d] = %v, want 0", k, ps.Terms[k])
		}
	}
}
