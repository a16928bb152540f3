package cases

import (
	"fmt"
	"math"
	"math/cmplx"
	"testing"

	"gonum.org/v1/gonum/cmplxs/cscalar"

	"github.com/turnpoint/turnpoint/connect/direct"
	"github.com/turnpoint/turnpoint/wkb"
)

// gradedCase parses a [graded] case with the given medium line (index = … or
// permittivity = …), parameter a, wavelength, angle and polarization.
func gradedCase(t *testing.T, medium string, params string, wavelength, angle float64, pol string, a, b float64) *Case {
	t.Helper()
	src := fmt.Sprintf("form = \"graded\"\n[parameters]\n%s\n[graded]\n%s\nwavelength = %.17g\nangle = %.17g\npolarization = %q\n[region]\nx = [%.17g, %.17g]\n",
		params, medium, wavelength, angle, pol, a, b)
	c, err := Parse("tm.toml", []byte(src))
	if err != nil {
		if l, ok := err.(ErrorList); ok {
			t.Fatalf("Parse:\n%s\n%s", l.Detail(), src)
		}
		t.Fatal(err)
	}
	return c
}

func mustProblem(t *testing.T, c *Case) wkb.Problem {
	t.Helper()
	p, err := c.Problem()
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestPolarizationSpellings checks that every spelling of the two
// polarisations is accepted and normalised, and that only p waves get a Q1.
func TestPolarizationSpellings(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		spelling, want string
	}{{"s", "s"}, {"TE", "s"}, {"te", "s"}, {"p", "p"}, {"TM", "p"}, {"tm", "p"}} {
		c := gradedCase(t, `index = "1 + 0.5*tanh(x)"`, "c = 1", 1, 30, tc.spelling, -3, 3)
		if c.Graded.Polarization != tc.want {
			t.Errorf("polarization %q: Polarization = %q, want %q", tc.spelling, c.Graded.Polarization, tc.want)
		}
		if p := mustProblem(t, c); (p.Q1 != nil) != (tc.want == "p") {
			t.Errorf("polarization %q: Q1 = %v, want it set only for p waves", tc.spelling, p.Q1)
		}
	}
}

// TestTMQ1Constant checks that Q1 vanishes identically in a homogeneous
// medium, given by its index or its permittivity.
func TestTMQ1Constant(t *testing.T) {
	t.Parallel()
	for _, medium := range []string{`index = "1.5"`, `permittivity = "2.25 + 0*x"`, `index = "1.2 + 0.1*i"`} {
		p := mustProblem(t, gradedCase(t, medium, "c = 1", 1, 20, "p", -1, 1))
		for _, z := range testPoints {
			for k, c := range p.Q1.Taylor(z, 6) {
				if c != 0 {
					t.Errorf("%s: Q1 coefficient %d at %v = %v, want 0", medium, k, z, c)
				}
			}
		}
	}
}

// tmQ1Quadratic is Q1 for ε = 1 + a x², derived by hand: ε′ = 2ax, ε″ = 2a,
// so with D = ε,
//
//	Q1 = a/D − 3a²x²/D² = (a − 2a²x²)/D² = 3a/D² − 2a/D
//
// (using 2a²x² = 2a(D − 1)), whence
//
//	Q1′  = −12a²x/D³ + 4a²x/D²,
//	Q1″  = −12a²/D³ + 72a³x²/D⁴ + 4a²/D² − 16a³x²/D³.
func tmQ1Quadratic(a, x complex128) (q, dq, d2q complex128) {
	d := 1 + a*x*x
	q = 3*a/(d*d) - 2*a/d
	dq = -12*a*a*x/(d*d*d) + 4*a*a*x/(d*d)
	d2q = -12*a*a/(d*d*d) + 72*a*a*a*x*x/(d*d*d*d) + 4*a*a/(d*d) - 16*a*a*a*x*x/(d*d*d)
	return q, dq, d2q
}

// TestTMQ1ClosedForm compares Q1 and its first two derivatives with the
// closed form of tmQ1Quadratic at complex points, for the permittivity
// given directly and as the square of an index, and checks the higher
// coefficients by summing the series at a nearby point.
func TestTMQ1ClosedForm(t *testing.T) {
	t.Parallel()
	const a = 0.5 // poles of Q1 at x = ±i√2, away from the test points
	for _, medium := range []string{`permittivity = "1 + a*x^2"`, `index = "sqrt(1 + a*x^2)"`} {
		p := mustProblem(t, gradedCase(t, medium, fmt.Sprintf("a = %v", a), 1, 0, "p", -1, 1))
		for _, z := range testPoints {
			q, dq, d2q := tmQ1Quadratic(a, z)
			if got := p.Q1.Eval(z); !cscalar.EqualWithinAbsOrRel(got, q, 1e-14, 1e-13) {
				t.Errorf("%s: Q1(%v) = %v, want %v", medium, z, got, q)
			}
			d := p.Q1.Taylor(z, 8).Derivs()
			for k, want := range []complex128{q, dq, d2q} {
				if !cscalar.EqualWithinAbsOrRel(d[k], want, 1e-13, 1e-12) {
					t.Errorf("%s: Q1 derivative %d at %v = %v, want %v", medium, k, z, d[k], want)
				}
			}
			// The series of order 8 summed at h = 0.05 misses O((h/ρ)⁹) of
			// the value, ρ ≥ 1 being the distance to the nearest pole.
			const h = 0.05
			s := p.Q1.Taylor(z, 8)
			if got, want := s.At(h), p.Q1.Eval(z+h); !cscalar.EqualWithinAbsOrRel(got, want, 1e-9, 1e-9) {
				t.Errorf("%s: series at %v summed at +%v = %v, want Q1 = %v", medium, z, h, got, want)
			}
		}
	}
}

// TestTMQ1Pole checks that the double pole of Q1 at a zero of ε is kept:
// for ε = x, ε″ = 0 and Q1 = −(3/4)/x² exactly.
func TestTMQ1Pole(t *testing.T) {
	t.Parallel()
	p := mustProblem(t, gradedCase(t, `permittivity = "x"`, "c = 1", 1, 0, "p", 1, 2))
	for _, z := range []complex128{0.3, 1e-3, 0.2 + 0.4i, -2.5 - 0.1i} {
		if got, want := p.Q1.Eval(z), -0.75/(z*z); !cscalar.EqualWithinAbsOrRel(got, want, 0, 1e-14) {
			t.Errorf("Q1(%v) = %v, want −3/(4x²) = %v", z, got, want)
		}
	}
	if v := p.Q1.Eval(0); !cmplx.IsInf(v) && !cmplx.IsNaN(v) {
		t.Errorf("Q1(0) = %v at the zero of ε, want a non-finite value", v)
	}
}

// The thin and thick layers below are the step n(x) = 1.25 + 0.25 tanh(x/w)
// from n1 = 1 to n2 = 1.5, written as 1 + 0.5/(1 + exp(−2x/w)), the same
// function: the series of tanh far out in its tails comes out flat (its
// derivative is formed as 1 − tanh², which rounds to 0 once tanh rounds to
// ±1), while that of the logistic form keeps its tiny tail, which the
// numerical solver needs to see the layer from the ends. On [−30w, 30w]
// ε is constant to e^(−60) ≈ 1e-26 at both ends.
const stepIndex = `index = "1 + 0.5/(1 + exp(-2*x/w))"`

func stepN(x, w float64) float64 { return 1.25 + 0.25*math.Tanh(x/w) }

// fresnel returns |r_s|² and |r_p|² of a sharp interface from n1 to n2 at
// tangential index s = n1 sin θ (Born & Wolf, Principles of Optics §1.5.2,
// written with k_iz = k0 √(n_i² − s²)): r_s = (k1z − k2z)/(k1z + k2z) and,
// for the amplitude of the magnetic field, r_p = (n2² k1z − n1² k2z)/(n2² k1z
// + n1² k2z); Born & Wolf's r_∥ for the electric field differs from this by
// at most a sign, so |r_p|² is the same. r_p = 0 at tan θ_B = n2/n1.
func fresnel(n1, n2, s float64) (rs2, rp2 float64) {
	k1, k2 := math.Sqrt(n1*n1-s*s), math.Sqrt(n2*n2-s*s)
	rs := (k1 - k2) / (k1 + k2)
	rp := (n2*n2*k1 - n1*n1*k2) / (n2*n2*k1 + n1*n1*k2)
	return rs * rs, rp * rp
}

// scatterStep returns the direct result for the tanh step of width w.
func scatterStep(t *testing.T, w, wavelength, angle float64, pol string, set *direct.Settings) *direct.Result {
	t.Helper()
	c := gradedCase(t, stepIndex, fmt.Sprintf("w = %.17g", w), wavelength, angle, pol, -30*w, 30*w)
	a, b := c.Interval()
	res, err := direct.Scatter(mustProblem(t, c), a, b, set)
	if err != nil {
		t.Fatalf("w = %g, angle %g, %s: %v", w, angle, pol, err)
	}
	if res.Unitarity > 1e-12 {
		t.Errorf("w = %g, angle %g, %s: |R + T − 1| = %.1e, want below 1e-12", w, angle, pol, res.Unitarity)
	}
	return res
}

// TestTMThinStepFresnel checks that a step much thinner than the wavelength
// reflects as a sharp interface. Its reflectance is analytic in the width
// w and depends on it through k0 w; the O(k0 w) term of r is in quadrature
// with the Fresnel amplitude (real ε), so R = R_F + c (k0 w)² + O((k0 w)⁴).
// With w and w/2 the deviation must then shrink four-fold (to within
// O((k0 w)²) ≈ 4e-5 of 4; 1% is asked), and the Richardson value
// (4R(w/2) − R(w))/3 must agree with R_F to a small fraction of the
// deviation (the next term is O((k0 w)²) smaller; 1e-3 of it is allowed),
// both up to the solver's error estimates. At Brewster's angle R_F = 0 for p
// waves, so R_p itself is the O((k0 w)²) term, which the same checks see
// go to zero, and it must be far below R_s there and agree with Drude's
// thin-layer formula (drudeBrewster).
func TestTMThinStepFresnel(t *testing.T) {
	t.Parallel()
	const (
		w          = 1e-3 // in units of the vacuum wavelength 1: k0 w = 2π·1e-3
		n1, n2     = 1.0, 1.5
		wavelength = 1.0
	)
	brewster := math.Atan(n2/n1) * 180 / math.Pi
	for _, angle := range []float64{0, 30, 45, brewster, 70} {
		s := n1 * math.Sin(angle*math.Pi/180)
		rs2, rp2 := fresnel(n1, n2, s)
		if angle == brewster && rp2 > 1e-30 {
			t.Fatalf("Fresnel |r_p|² = %g at Brewster's angle, want 0", rp2)
		}
		got := map[string]float64{}
		for _, pol := range []string{"s", "p"} {
			rf := rs2
			if pol == "p" {
				rf = rp2
			}
			r1 := scatterStep(t, w, wavelength, angle, pol, nil)
			r2 := scatterStep(t, w/2, wavelength, angle, pol, nil)
			errs := 3 * (r1.ErrR + r2.ErrR)
			d1, d2 := r1.R-rf, r2.R-rf
			if ratio := d1 / d2; math.Abs(ratio-4) > 0.04 {
				t.Errorf("angle %.4f, %s: R − R_F = %.4e at w, %.4e at w/2: ratio %.4f, want 4 (O((k0 w)²))", angle, pol, d1, d2, ratio)
			}
			if x := (4*r2.R - r1.R) / 3; math.Abs(x-rf) > 1e-3*math.Abs(d1)+errs {
				t.Errorf("angle %.4f, %s: Richardson R = %.12e, want Fresnel %.12e to within %.1e", angle, pol, x, rf, 1e-3*math.Abs(d1)+errs)
			}
			if angle == brewster && pol == "p" {
				for _, r := range []struct {
					w float64
					R *direct.Result
				}{{w, r1}, {w / 2, r2}} {
					k0w := 2 * math.Pi / wavelength * r.w
					want := drudeBrewster(n1, n2, 2*math.Pi/wavelength, r.w)
					if math.Abs(r.R.R-want) > k0w*want+3*r.R.ErrR {
						t.Errorf("Brewster's angle, w = %g: R_p = %.6e, Drude's formula %.6e, want within k0 w = %.1e relative", r.w, r.R.R, want, k0w)
					}
					t.Logf("Brewster's angle, w = %g: R_p = %.6e, Drude's formula %.6e", r.w, r.R.R, want)
				}
			}
			got[pol] = r1.R
			t.Logf("angle %7.4f %s: R(w) = %.10e  R(w/2) = %.10e  Fresnel %.10e  ErrR %.1e", angle, pol, r1.R, r2.R, rf, r1.ErrR)
		}
		if angle == 0 && math.Abs(got["s"]-got["p"]) > 1e-12 {
			t.Errorf("normal incidence: R_s = %.15e, R_p = %.15e, want equal (s and p coincide)", got["s"], got["p"])
		}
		if angle == brewster && got["p"] > 1e-4*got["s"] {
			t.Errorf("Brewster's angle: R_p = %.3e, want far below R_s = %.3e", got["p"], got["s"])
		}
	}
}

// drudeBrewster returns the p reflectance at Brewster's angle of the tanh
// step from n1 to n2 of width w to lowest order in k0 w, derived here in
// the way of Drude's thin-layer theory. Over a layer much thinner than the
// wavelength, H′ = εG and G′ = −k0²(1 − s²/ε)H (G = H′/ε) integrate to
// first order into jumps at x = 0 relative to a sharp step ε0 (ε1 for
// x < 0, ε2 for x > 0): [H] = I·G, [G] = k0² s² J·H with I = ∫(ε − ε0),
// J = ∫(1/ε − 1/ε0). With H = e^(ik1x) + r e^(−ik1x) on the left and t e^(ik2x)
// on the right, α_j = i k_j/ε_j, and α1 = α2 = α at Brewster's angle (r0 = 0,
// t0 = 1), the jumps give t − r − 1 = Iα and α(t + r − 1) = k0²s²J, so
// r = ½(k0²s²J/α − Iα). There s² = ε1ε2/(ε1 + ε2) and k1 = k0 ε1/√(ε1 + ε2),
// which makes
//
//	r = −(i k0/2) η/√(ε1 + ε2),   η = I + ε1ε2 J = ∫ (ε − ε1)(ε − ε2)/ε dx,
//
// Drude's integral, independent of where the sharp step is put, and
// R_p = k0² η²/(4(ε1 + ε2)). For n = n̄ + Δ tanh(x/w) (n̄ = (n1 + n2)/2,
// Δ = (n2 − n1)/2), with t = tanh(x/w): (n − n1)(n − n2) = −Δ²(1 − t²),
// dx = w dt/(1 − t²) and dn = Δ dt, so
//
//	η = −wΔ ∫_{n1}^{n2} (n + n1)(n + n2)/n² dn = −wΔ [2(n2 − n1) + (n1 + n2) ln(n2/n1)].
//
// The neglected terms are of relative order k0 w.
func drudeBrewster(n1, n2, k0, w float64) float64 {
	d := (n2 - n1) / 2
	eta := -w * d * (2*(n2-n1) + (n1+n2)*math.Log(n2/n1))
	return k0 * k0 * eta * eta / (4 * (n1*n1 + n2*n2))
}

// tmReference integrates the TM field equations themselves, without the
// Liouville transformation: with G = H′/ε,
//
//	H′ = ε G,   G′ = −k0² (1 − s²/ε) H,
//
// from b, where H = e^(i k2z x) leaves the layer, back to a, where
// H = A e^(i k1z x) + B e^(−i k1z x) (phases referred to a) and
// G = (i k1z/ε1)(A e^(…) − B e^(…)); it returns |B/A|² by classical
// Runge-Kutta with n steps.
func tmReference(eps func(float64) float64, k0, s, a, b float64, n int) float64 {
	e1, e2 := eps(a), eps(b)
	k1, k2 := k0*math.Sqrt(e1-s*s), k0*math.Sqrt(e2-s*s)
	f := func(x float64, h, g complex128) (complex128, complex128) {
		e := eps(x)
		return complex(e, 0) * g, -complex(k0*k0*(1-s*s/e), 0) * h
	}
	hh, gg := complex(1, 0), complex(0, k2/e2)
	dx := (a - b) / float64(n)
	for i := 0; i < n; i++ {
		x := b + float64(i)*dx
		dx2 := complex(dx/2, 0)
		h1, g1 := f(x, hh, gg)
		h2, g2 := f(x+dx/2, hh+dx2*h1, gg+dx2*g1)
		h3, g3 := f(x+dx/2, hh+dx2*h2, gg+dx2*g2)
		h4, g4 := f(x+dx, hh+complex(dx, 0)*h3, gg+complex(dx, 0)*g3)
		c := complex(dx/6, 0)
		hh += c * (h1 + 2*h2 + 2*h3 + h4)
		gg += c * (g1 + 2*g2 + 2*g3 + g4)
	}
	v := gg * complex(e1, 0) / complex(0, k1)
	A, B := (hh+v)/2, (hh-v)/2
	return real(B*cmplx.Conj(B)) / real(A*cmplx.Conj(A))
}

// TestTMThickLayer checks a step of width 0.1 λ0 at 45° incidence, where
// the thin-layer limit does not apply: R_p of the transformed problem
// agrees with an integration of the untransformed field equations, R_p <
// R_s (p waves reflect less below Brewster's angle, 56.3° here), R_p = R_s
// at normal incidence, and the solver's error estimates at two tolerances
// cover the difference of the two results.
func TestTMThickLayer(t *testing.T) {
	t.Parallel()
	const (
		w          = 0.1
		wavelength = 1.0
		angle      = 45.0
	)
	s := math.Sin(angle * math.Pi / 180)
	k0 := 2 * math.Pi / wavelength
	rp := scatterStep(t, w, wavelength, angle, "p", nil)
	rs := scatterStep(t, w, wavelength, angle, "s", nil)
	eps := func(x float64) float64 { n := stepN(x, w); return n * n }
	// RK4 with 6000 and 12000 steps over [−3, 3] (k0 h ≤ 6.3e-3): the error
	// of the finer run is about 1/15 of their difference.
	ref1 := tmReference(eps, k0, s, -30*w, 30*w, 6000)
	ref2 := tmReference(eps, k0, s, -30*w, 30*w, 12000)
	refErr := math.Abs(ref2-ref1) / 15
	if d := math.Abs(rp.R - ref2); d > 3*(refErr+rp.ErrR)+1e-13 {
		t.Errorf("R_p = %.12e, field equations give %.12e ± %.1e (ErrR %.1e)", rp.R, ref2, refErr, rp.ErrR)
	}
	t.Logf("R_p = %.12e (ErrR %.1e), field equations %.12e ± %.1e; R_s = %.12e", rp.R, rp.ErrR, ref2, refErr, rs.R)
	if !(rp.R < rs.R) {
		t.Errorf("R_p = %.6e, R_s = %.6e at %g°, want R_p < R_s", rp.R, rs.R, angle)
	}
	if p0, s0 := scatterStep(t, w, wavelength, 0, "p", nil), scatterStep(t, w, wavelength, 0, "s", nil); math.Abs(p0.R-s0.R) > p0.ErrR+s0.ErrR+1e-15 {
		t.Errorf("normal incidence: R_p = %.15e, R_s = %.15e, want equal within %.1e", p0.R, s0.R, p0.ErrR+s0.ErrR)
	}
	coarse := scatterStep(t, w, wavelength, angle, "p", &direct.Settings{Tol: 1e-6})
	fine := scatterStep(t, w, wavelength, angle, "p", &direct.Settings{Tol: 1e-13})
	if d := math.Abs(coarse.R - fine.R); d > coarse.ErrR+fine.ErrR {
		t.Errorf("R_p = %.12e at Tol 1e-6 and %.12e at 1e-13: difference %.1e exceeds the error estimates %.1e + %.1e",
			coarse.R, fine.R, d, coarse.ErrR, fine.ErrR)
	}
	if !(fine.ErrR <= coarse.ErrR) {
		t.Errorf("ErrR = %.1e at Tol 1e-13, %.1e at 1e-6: want the finer run no less accurate", fine.ErrR, coarse.ErrR)
	}
	t.Logf("Tol 1e-6: R_p = %.12e ± %.1e; Tol 1e-13: %.12e ± %.1e", coarse.R, coarse.ErrR, fine.R, fine.ErrR)
}

// TestGradedTMFile loads testdata/graded_tm.toml and checks that its
// expected reflectance, taken from the field-equation integration of
// TestTMThickLayer, holds for the numerical solution of its problem at the
// base values and along its angle scan at 45°.
func TestGradedTMFile(t *testing.T) {
	t.Parallel()
	c := load(t, "graded_tm.toml")
	if c.Graded.Polarization != "p" || len(c.Expect) != 1 {
		t.Fatalf("Graded = %+v with %d expectations, want polarization p and one expectation", c.Graded, len(c.Expect))
	}
	p := mustProblem(t, c)
	q, err := c.ProblemAt(45)
	if err != nil {
		t.Fatal(err)
	}
	if p.Q1 == nil || q.Q1 == nil {
		t.Fatal("p-polarised problem without Q1")
	}
	a, b := c.Interval()
	for _, pr := range []wkb.Problem{p, q} {
		res, err := direct.Scatter(pr, a, b, nil)
		if err != nil {
			t.Fatal(err)
		}
		if e := c.Expect[0]; !e.Holds(res.R) {
			t.Errorf("R = %.12e ± %.1e, want %v (rel_tol %g, %s)", res.R, res.ErrR, e.Value, e.RelTol, e.Source)
		}
	}
	// The same reference from scratch: the step of the file is that of
	// TestTMThickLayer.
	eps := func(x float64) float64 { n := stepN(x, 0.1); return n * n }
	ref := tmReference(eps, 2*math.Pi, math.Sin(math.Pi/4), a, b, 12000)
	if e := c.Expect[0]; !e.Holds(ref) {
		t.Errorf("field equations give R = %.12e, the file expects %v", ref, e.Value)
	}
}
