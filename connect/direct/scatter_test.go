package direct

import (
	"errors"
	"math"
	"math/cmplx"
	"testing"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// refRound is the relative rounding of the closed-form references
// (a few exp/log/sinh evaluations in float64), allowed on top of the
// reported error when checking that the estimate brackets the true error.
const refRound = 1e-14

// checkBracket fails if the true error exceeds the reported estimate.
func checkBracket(t *testing.T, name string, got, want, est float64) {
	t.Helper()
	if d := math.Abs(got - want); d > est+refRound*math.Abs(want) {
		t.Errorf("%s: |%.10g − %.10g| = %.3g exceeds the error estimate %.3g", name, got, want, d, est)
	}
}

func TestSechBarrier(t *testing.T) {
	t.Parallel()
	// U0 = α = 1: the top is at E = 1. References: sechBarrierRT, the
	// closed form of Landau & Lifshitz §25.
	for _, c := range []struct {
		E, lambda float64
		method    string
		tolT      float64 // relative, on T
		tolR      float64 // relative, on R
	}{
		{0.5, 10, "real-axis", 1e-10, 1e-10},    // below the top, T ≈ 1.1e-8
		{0.5, 100, "real-axis", 1e-10, 1e-10},   // T ≈ 1e-80
		{0.9, 30, "real-axis", 1e-10, 1e-10},    // just below the top
		{1, 10, "real-axis", 1e-10, 1e-10},      // at the top: T ≈ 0.52, not Kemble's 1/2
		{1, 100, "real-axis", 1e-10, 1e-10},     // at the top
		{1.1, 30, "complex-path", 1e-10, 1e-8},  // just above: pair of turning points close to the axis
		{1.5, 10, "complex-path", 1e-10, 1e-10}, // above: R ≈ 6.8e-7
		{1.5, 30, "complex-path", 1e-10, 1e-8},  // R ≈ 3.9e-19
		{2, 30, "complex-path", 1e-10, 1e-6},    // R ≈ 1.2e-34
		{1.5, 100, "complex-path", 1e-10, 1e-4}, // R ≈ 1e-62
		{0.3, 0.4, "real-axis", 1e-10, 1e-10},   // 4U0λ²/α² < 1: the cos form
		{1, 1000, "real-axis", 1e-10, 1e-10},    // WKB jumps away from the top
		{0.999, 1000, "real-axis", 1e-10, 1e-10},
		{1, 10000, "real-axis", 1e-10, 1e-10},
	} {
		p := sechBarrier(1, 1, c.E, c.lambda)
		res, err := Scatter(p, -20, 20, nil)
		if err != nil {
			t.Errorf("E=%g λ=%g: %v", c.E, c.lambda, err)
			continue
		}
		R, T := sechBarrierRT(1, 1, c.E, c.lambda)
		if res.Method != c.method {
			t.Errorf("E=%g λ=%g: method %s, want %s", c.E, c.lambda, res.Method, c.method)
		}
		if d := math.Abs(res.T-T) / T; d > c.tolT {
			t.Errorf("E=%g λ=%g: T = %.15g, want %.15g (rel. error %.2g)", c.E, c.lambda, res.T, T, d)
		}
		if d := math.Abs(res.R-R) / R; d > c.tolR {
			t.Errorf("E=%g λ=%g: R = %.15g, want %.15g (rel. error %.2g)", c.E, c.lambda, res.R, R, d)
		}
		checkBracket(t, "T", res.T, T, res.ErrT)
		checkBracket(t, "R", res.R, R, res.ErrR)
		if res.Unitarity > 1e-12 {
			t.Errorf("E=%g λ=%g: |R+T−1| = %.3g", c.E, c.lambda, res.Unitarity)
		}
	}
}

func TestDeepTunnelling(t *testing.T) {
	t.Parallel()
	// λ = 500 below the top: T ≈ e^(−920) underflows float64, ln T must not.
	// Reference: ln T = −ln(1 + cosh²B/sinh²A) of sechBarrierRT's closed form
	// (Landau & Lifshitz §25), ≈ −2(ln cosh B − ln sinh A) here.
	const E, lambda = 0.5, 500
	res, err := Scatter(sechBarrier(1, 1, E, lambda), -20, 20, nil)
	if err != nil {
		t.Fatal(err)
	}
	A := math.Pi * lambda * math.Sqrt(E)
	B := math.Pi / 2 * math.Sqrt(4*lambda*lambda-1)
	x := 2 * (logCosh(B) - logSinh(A))
	want := -(x + math.Log1p(math.Exp(-x)))
	if res.T != 0 || math.Abs(res.LogT-want) > 1e-10*math.Abs(want) {
		t.Errorf("T = %g, ln T = %.15g, want 0 (underflow) and %.15g", res.T, res.LogT, want)
	}
	// R = 1 − T = 1 to all digits (T ≈ e^(−920)).
	if d := math.Abs(res.R - 1); d > res.ErrR || d > 1e-13 {
		t.Errorf("R = %.17g ± %.3g, want 1", res.R, res.ErrR)
	}
}

func TestSmoothStepTinyReflection(t *testing.T) {
	t.Parallel()
	// Q = 1 − 0.5/(1 + e^(−x)); reference smoothStepR, the closed form of
	// Landau & Lifshitz §25. λ chosen so that R is near 1e-10, 1e-20, 1e-30.
	// The ends must lie where Q has settled far below |r|/ε (ε the unit
	// roundoff): Q − Q(±∞) ∝ e^(−|x|), hence the longer interval for the
	// smallest R.
	for _, c := range []struct {
		lambda, approxR, L float64
	}{
		{2.6, 1e-10, 40},
		{5.2, 1e-20, 40},
		{7.8, 1e-30, 40},
		{10.4, 1e-40, 40},
		{20, 1e-77, 80},
	} {
		p := smoothStep(1, 0.5, 1, c.lambda)
		res, err := Scatter(p, -c.L, c.L, nil)
		if err != nil {
			t.Errorf("λ=%g: %v", c.lambda, err)
			continue
		}
		R := smoothStepR(1, 0.5, 1, c.lambda)
		if R < c.approxR/20 || R > c.approxR*20 {
			t.Fatalf("λ=%g: reference R = %g is not near %g", c.lambda, R, c.approxR)
		}
		if res.Method != "complex-path" {
			t.Errorf("λ=%g: method %s, want complex-path", c.lambda, res.Method)
		}
		if d := math.Abs(res.R-R) / R; d > 1e-4 {
			t.Errorf("λ=%g: R = %.10g, want %.10g (rel. error %.2g)", c.lambda, res.R, R, d)
		}
		if res.ErrR > 1e-4*R {
			t.Errorf("λ=%g: error estimate %.3g is not below 1e-4 R", c.lambda, res.ErrR)
		}
		checkBracket(t, "R", res.R, R, res.ErrR)
		checkBracket(t, "T", res.T, 1-R, res.ErrT)
	}
}

func TestEpsteinLayer(t *testing.T) {
	t.Parallel()
	// Graded index n²(x) = n1² + (n2² − n1²)/(1 + e^(−x/w)), normal
	// incidence: λ = k0 = 2π/λ0, Q = n². Reference smoothStepR with q = n²
	// (the Epstein layer is the smooth step in optical form).
	const n1, n2 = 1.0, 1.5
	for _, c := range []struct {
		lambda0, w float64
	}{
		{1.0, 0.02},  // thin layer: R close to the Fresnel value 0.04
		{1.0, 0.1},   // R ≈ 1e-4
		{0.633, 0.3}, // R ≈ 1e-16
		{0.5, 0.5},   // R ≈ 1e-35
	} {
		k0 := 2 * math.Pi / c.lambda0
		p := smoothStep(n1*n1, n2*n2, c.w, k0)
		L := 45 * c.w
		res, err := Scatter(p, -L, L, nil)
		if err != nil {
			t.Errorf("λ0=%g w=%g: %v", c.lambda0, c.w, err)
			continue
		}
		R := smoothStepR(n1*n1, n2*n2, c.w, k0)
		if d := math.Abs(res.R-R) / R; d > 1e-6 {
			t.Errorf("λ0=%g w=%g (%s): R = %.10g, want %.10g (rel. error %.2g)", c.lambda0, c.w, res.Method, res.R, R, d)
		}
		checkBracket(t, "R", res.R, R, res.ErrR)
		checkBracket(t, "T", res.T, 1-R, res.ErrT)
	}
}

// asymmetric returns Q = E − 0.8 sech²x − 0.3 tanh x (Q(−∞) = E + 0.3,
// Q(∞) = E − 0.3), optionally mirrored x → −x.
func asymmetric(E, lambda float64, mirror bool) wkb.Problem {
	sgn := complex(1, 0)
	if mirror {
		sgn = -1
	}
	q := jet.Map(func(s jet.Series) jet.Series {
		x := jet.Scale(sgn, s)
		c := jet.Sech(x)
		v := jet.Sub(jet.Scale(-0.8, jet.Mul(c, c)), jet.Scale(0.3, jet.Tanh(x)))
		v[0] += complex(E, 0)
		return v
	})
	return wkb.Problem{Q: q, Lambda: lambda}
}

func TestUnitarityReciprocity(t *testing.T) {
	t.Parallel()
	// Exact identities for real Q: R + T = 1 (flux) and the same T (and R)
	// for incidence from either side (reciprocity), obtained by mirroring.
	for _, c := range []struct {
		E, lambda float64
		method    MethodChoice
	}{
		{0.8, 10, Auto},         // tunnelling, real turning points
		{1.0, 10, Auto},         // near the top
		{1.3, 5, RealAxis},      // above the top
		{1.3, 5, ComplexPath},   // the same on the raised path
		{1.3, 20, ComplexPath},  // tiny R
		{0.5, 20, RealAxis},     // deep tunnelling
		{2.0, 3, Auto},          // weak reflection at small λ
		{1.3, 40, ComplexPath},  // R below 1e-30
		{1.15, 10, ComplexPath}, // complex pair near the axis
	} {
		s := &Settings{Method: c.method}
		fw, err := Scatter(asymmetric(c.E, c.lambda, false), -25, 25, s)
		if err != nil {
			t.Errorf("E=%g λ=%g: %v", c.E, c.lambda, err)
			continue
		}
		bw, err := Scatter(asymmetric(c.E, c.lambda, true), -25, 25, s)
		if err != nil {
			t.Errorf("E=%g λ=%g mirrored: %v", c.E, c.lambda, err)
			continue
		}
		if fw.Unitarity > 1e-12 || bw.Unitarity > 1e-12 {
			t.Errorf("E=%g λ=%g: |R+T−1| = %.3g, %.3g", c.E, c.lambda, fw.Unitarity, bw.Unitarity)
		}
		if d := math.Abs(fw.T - bw.T); d > fw.ErrT+bw.ErrT || d > 1e-10*fw.T {
			t.Errorf("E=%g λ=%g %s: T = %.15g from the left, %.15g from the right", c.E, c.lambda, fw.Method, fw.T, bw.T)
		}
		if d := math.Abs(fw.R - bw.R); d > fw.ErrR+bw.ErrR {
			t.Errorf("E=%g λ=%g %s: R = %.15g from the left, %.15g from the right (errors %.2g, %.2g)",
				c.E, c.lambda, fw.Method, fw.R, bw.R, fw.ErrR, bw.ErrR)
		}
	}
}

func TestLossyReciprocity(t *testing.T) {
	t.Parallel()
	// With absorption (complex Q inside) R + T < 1 and R depends on the side
	// of incidence, but t does not (reciprocity: the Wronskian of the two
	// scattering solutions is conserved for any Q).
	for _, m := range []MethodChoice{RealAxis, ComplexPath} {
		var res [2]*Result
		for i, mirror := range []bool{false, true} {
			sgn := complex(1, 0)
			if mirror {
				sgn = -1
			}
			q := jet.Map(func(s jet.Series) jet.Series {
				x := jet.Scale(sgn, s)
				c := jet.Sech(x)
				v := jet.Sub(jet.Scale(-0.8+0.05i, jet.Mul(c, c)), jet.Scale(0.3, jet.Tanh(x)))
				v[0] += 1.3
				return v
			})
			r, err := Scatter(wkb.Problem{Q: q, Lambda: 6}, -25, 25, &Settings{Method: m})
			if err != nil {
				t.Fatal(err)
			}
			res[i] = r
		}
		if d := cmplx.Abs(res[0].Trans - res[1].Trans); d > res[0].ErrTrans+res[1].ErrTrans || d > 1e-10 {
			t.Errorf("%v: t = %v from the left, %v from the right", m, res[0].Trans, res[1].Trans)
		}
		if res[0].R+res[0].T > 1-1e-3 || math.Abs(res[0].R-res[1].R) < 1e-6 {
			t.Errorf("%v: R = %g, %g, T = %g: want absorption and side-dependent R", m, res[0].R, res[1].R, res[0].T)
		}
	}
}

func TestMethodsAgree(t *testing.T) {
	t.Parallel()
	// Where R is not small both methods are accurate: they must agree in
	// the amplitudes, phases included, within their error estimates.
	for _, c := range []struct{ E, lambda float64 }{{1.3, 3}, {1.6, 4}, {2, 2}} {
		p := asymmetric(c.E, c.lambda, false)
		ra, err := Scatter(p, -25, 25, &Settings{Method: RealAxis})
		if err != nil {
			t.Fatal(err)
		}
		cp, err := Scatter(p, -25, 25, &Settings{Method: ComplexPath})
		if err != nil {
			t.Fatal(err)
		}
		if d := cmplx.Abs(ra.Refl - cp.Refl); d > ra.ErrRefl+cp.ErrRefl || d > 1e-9*cmplx.Abs(ra.Refl) {
			t.Errorf("E=%g λ=%g: r = %v (real axis), %v (complex path)", c.E, c.lambda, ra.Refl, cp.Refl)
		}
		if d := cmplx.Abs(ra.Trans - cp.Trans); d > ra.ErrTrans+cp.ErrTrans || d > 1e-9 {
			t.Errorf("E=%g λ=%g: t = %v (real axis), %v (complex path)", c.E, c.lambda, ra.Trans, cp.Trans)
		}
	}
}

func TestMethodsAgreeLargeLambda(t *testing.T) {
	t.Parallel()
	// At large λ both methods jump over most wavelengths; their
	// transmission amplitudes, phase included, must still agree.
	for _, c := range []struct{ E, lambda float64 }{{1.5, 1000}, {1.2, 300}} {
		p := asymmetric(c.E, c.lambda, false)
		ra, err := Scatter(p, -25, 25, &Settings{Method: RealAxis})
		if err != nil {
			t.Fatal(err)
		}
		cp, err := Scatter(p, -25, 25, &Settings{Method: ComplexPath})
		if err != nil {
			t.Fatal(err)
		}
		if d := cmplx.Abs(ra.Trans - cp.Trans); d > ra.ErrTrans+cp.ErrTrans || d > 1e-10 {
			t.Errorf("E=%g λ=%g: t = %v (real axis), %v (complex path), errors %.2g, %.2g",
				c.E, c.lambda, ra.Trans, cp.Trans, ra.ErrTrans, cp.ErrTrans)
		}
	}
}

func TestQ1Term(t *testing.T) {
	t.Parallel()
	// A constant Q1 = c shifts both sides of a smooth step: λ²Q + c is the
	// step with q_i + c/λ², so R is smoothStepR with those levels (Landau &
	// Lifshitz §25, as above). The end waves absorb c exactly.
	const c, lambda = -6.0, 4.0
	q1 := jet.Map(func(s jet.Series) jet.Series { return jet.Const(c, s.Order()) })
	for _, m := range []MethodChoice{RealAxis, ComplexPath} {
		p := smoothStep(1, 0.6, 0.5, lambda)
		p.Q1 = q1
		res, err := Scatter(p, -25, 25, &Settings{Method: m})
		if err != nil {
			t.Fatal(err)
		}
		R := smoothStepR(1+c/(lambda*lambda), 0.6+c/(lambda*lambda), 0.5, lambda)
		if d := math.Abs(res.R-R) / R; d > 1e-8 {
			t.Errorf("%v: R = %.12g, want %.12g (rel. error %.2g)", m, res.R, R, d)
		}
		checkBracket(t, "R", res.R, R, res.ErrR)
	}
}

func TestEndWavesConstantQ(t *testing.T) {
	t.Parallel()
	// Where Q is constant at the ends the end waves are plane waves: a
	// constant Q reflects nothing and transmits with the phase λ√Q (b − a),
	// t = exp(iλ√Q(b−a)) (the wave is e^(iλ√Q(x−a)) throughout).
	q := jet.Map(func(s jet.Series) jet.Series { return jet.Const(2.25, s.Order()) })
	for _, m := range []MethodChoice{RealAxis, ComplexPath} {
		res, err := Scatter(wkb.Problem{Q: q, Lambda: 3}, -1, 2, &Settings{Method: m})
		if err != nil {
			t.Fatal(err)
		}
		want := cmplx.Exp(complex(0, 3*1.5*3))
		if cmplx.Abs(res.Refl) > 1e-14 || cmplx.Abs(res.Trans-want) > 1e-12 {
			t.Errorf("%v: r = %v, t = %v, want 0, %v", m, res.Refl, res.Trans, want)
		}
	}
}

func TestEndConversionInverse(t *testing.T) {
	t.Parallel()
	// toFirst inverts toHigher (identity of the two wave bases).
	p := smoothStep(1, 0.5, 1, 2)
	ea, _, _, _ := endPair(p, -1, 3)
	for _, v := range [][2]complex128{{1, 0}, {0, 1}, {0.3 - 2i, 1e-5i}} {
		A, B := ea.toHigher(v[0], v[1])
		x, y := ea.toFirst(A, B)
		if cmplx.Abs(x-v[0])+cmplx.Abs(y-v[1]) > 1e-14 {
			t.Errorf("toFirst(toHigher(%v)) = %v, %v", v, x, y)
		}
	}
}

func TestSingularityScan(t *testing.T) {
	t.Parallel()
	// Q = E − sech²x with E = 1.5 has zeros at ±i arccos(1/√E) and poles
	// at ±iπ/2 (sech has poles at iπ/2 + iπn); the nearest is the zero at
	// height arccos(√(2/3)) ≈ 0.6155.
	g := scanAxis(sechBarrier(1, 1, 1.5, 10), -20, 20)
	want := math.Acos(math.Sqrt(2.0 / 3))
	if g.realZero || math.Abs(g.dmin-want) > 0.03*want || math.Abs(g.at) > 0.05 {
		t.Errorf("scan: dmin = %g at %g (real zero %v), want %g at 0", g.dmin, g.at, g.realZero, want)
	}
	// Below the top the zeros are real.
	if g := scanAxis(sechBarrier(1, 1, 0.5, 10), -20, 20); !g.realZero {
		t.Errorf("scan below the top: no real zero found")
	}
}

func TestGivenSingularities(t *testing.T) {
	t.Parallel()
	// Supplying the nearest zero (L&L §25 barrier, as in TestSingularityScan)
	// gives the same result as the scan.
	p := sechBarrier(1, 1, 1.5, 20)
	zt := complex(0, math.Acos(math.Sqrt(2.0/3)))
	res, err := Scatter(p, -20, 20, &Settings{Singularities: []complex128{zt, -zt, complex(0, math.Pi/2)}})
	if err != nil {
		t.Fatal(err)
	}
	R, _ := sechBarrierRT(1, 1, 1.5, 20)
	if res.Method != "complex-path" || math.Abs(res.R-R) > 1e-8*R {
		t.Errorf("%s: R = %.10g, want %.10g", res.Method, res.R, R)
	}
	if res.Height > heightFraction*imag(zt)+1e-12 || res.Height <= 0 {
		t.Errorf("height %g, want in (0, %g]", res.Height, heightFraction*imag(zt))
	}
}

func TestInvalidInput(t *testing.T) {
	t.Parallel()
	good := sechBarrier(1, 1, 1.5, 10)
	neg := sechBarrier(1, 1, 0.5, 10) // Q < 0 at x = 0
	for _, c := range []struct {
		name string
		p    wkb.Problem
		a, b float64
		s    *Settings
	}{
		{"nil Q", wkb.Problem{Lambda: 1}, -1, 1, nil},
		{"lambda", wkb.Problem{Q: good.Q, Lambda: -1}, -1, 1, nil},
		{"lambda NaN", wkb.Problem{Q: good.Q, Lambda: math.NaN()}, -1, 1, nil},
		{"empty interval", good, 1, 1, nil},
		{"infinite end", good, math.Inf(-1), 1, nil},
		{"Q negative at end", neg, -0.1, 0.1, nil},
		{"tolerance", good, -1, 1, &Settings{Tol: 2}},
		{"height", good, -1, 1, &Settings{Height: -1}},
		{"method", good, -1, 1, &Settings{Method: 7}},
		{"complex path with real zeros", neg, -20, 20, &Settings{Method: ComplexPath}},
	} {
		_, err := Scatter(c.p, c.a, c.b, c.s)
		if !errors.Is(err, ErrInput) {
			t.Errorf("%s: error %v, want ErrInput", c.name, err)
		}
	}
}

func TestOverflowingFormula(t *testing.T) {
	t.Parallel()
	// exp(−x/w) overflows at x = −4.2 for w = 0.005: the jets are not
	// finite there, which must be an error, not NaN numbers.
	_, err := Scatter(smoothStep(1, 0.5, 0.005, 1000), -4.2, 4.2, nil)
	if !errors.Is(err, ErrInput) {
		t.Fatalf("error %v, want ErrInput", err)
	}
}

func TestStepLimit(t *testing.T) {
	t.Parallel()
	_, err := Scatter(sechBarrier(1, 1, 1.5, 30), -20, 20, &Settings{MaxSteps: 10})
	var ce *ConvergenceError
	if !errors.As(err, &ce) || ce.Status != StepLimit || ce.Steps != 10 {
		t.Fatalf("error %v, want a step-limit ConvergenceError after 10 steps", err)
	}
}

func TestPoleOnPath(t *testing.T) {
	t.Parallel()
	// Q = 1 + 0.1/x has a pole at 0 on the interval: the real-axis
	// integration cannot pass it and must report so, not return numbers.
	q := jet.Map(func(s jet.Series) jet.Series {
		v := jet.Div(jet.Const(0.1, s.Order()), s)
		v[0]++
		return v
	})
	_, err := Scatter(wkb.Problem{Q: q, Lambda: 5}, -1, 1.5, &Settings{Method: RealAxis})
	var ce *ConvergenceError
	if !errors.As(err, &ce) {
		t.Fatalf("error %v, want a ConvergenceError", err)
	}
}
