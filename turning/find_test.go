package turning

import (
	"math"
	"math/cmplx"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// cauchyBox returns a square box holding every root of the polynomial c:
// all roots lie in |z| < 1 + max|c_k/c_n| (Cauchy's bound).
func cauchyBox(c []complex128) Box {
	n := len(c) - 1
	r := 0.0
	for _, v := range c[:n] {
		r = math.Max(r, cmplx.Abs(v/c[n]))
	}
	r = 1.05 * (1 + r)
	return Box{complex(-r, -r), complex(r, r)}
}

// TestFindPolynomials compares Find with the companion-matrix eigenvalues
// (PolyRoots, gonum mat.Eigen) for random polynomials of degree 1 to 10.
func TestFindPolynomials(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	for deg := 1; deg <= 10; deg++ {
		for _, cplx := range []bool{false, true} {
			c := make([]complex128, deg+1)
			for k := range c {
				c[k] = complex(rng.NormFloat64(), 0)
				if cplx {
					c[k] += complex(0, rng.NormFloat64())
				}
			}
			want, err := PolyRoots(c)
			if err != nil {
				t.Fatal(err)
			}
			res, err := Find(polyFunc(c), cauchyBox(c), nil)
			if err != nil {
				t.Fatal(err)
			}
			if res.Status != Complete || res.Winding != deg || res.Zeros != deg || res.Poles != 0 {
				t.Errorf("degree %d complex %v: status %v winding %d zeros %d poles %d, want complete %d %d 0; %v",
					deg, cplx, res.Status, res.Winding, res.Zeros, res.Poles, deg, deg, res.Warnings)
			}
			scale := 1.0
			for _, z := range want {
				scale = math.Max(scale, cmplx.Abs(z))
			}
			if e := matchError(expand(res.Points), want); e > 1e-10*scale {
				t.Errorf("degree %d complex %v: Find roots differ from companion eigenvalues by %.2g\n got %v\nwant %v",
					deg, cplx, e, expand(res.Points), want)
			}
		}
	}
}

// TestFindSymmetricRing: ten zeros evenly spaced on the unit circle
// (rotated off the axes) have vanishing moments t_1…t_4 about the centre,
// so the box looks like one cluster of order 10; the cluster must still be
// split into its ten zeros, exp(2πi(k + 0.3)/10) by construction.
func TestFindSymmetricRing(t *testing.T) {
	t.Parallel()
	var roots []complex128
	for k := 0; k < 10; k++ {
		roots = append(roots, cmplx.Rect(1, 2*math.Pi*(float64(k)+0.3)/10))
	}
	res, err := Find(polyFunc(fromRoots(roots)), Box{-2 - 2i, 2 + 2i}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if e := matchError(expand(res.Points), roots); e > 1e-13 || res.Status != Complete || len(res.Points) != 10 {
		t.Errorf("status %v, %d points, error %.2g: %+v", res.Status, len(res.Points), e, res.Points)
	}
}

// TestFindRational: random rational functions Π (x − z_j)^m_j with zeros
// and poles of orders −2…2 placed by construction.
func TestFindRational(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(3, 4))
	for trial := 0; trial < 12; trial++ {
		var zs []complex128
		var orders []int
		net := 0
		for k := 0; k < 6; k++ {
			zs = append(zs, complex(1.8*rng.Float64()-0.9, 1.8*rng.Float64()-0.9))
			orders = append(orders, []int{-2, -1, 1, 1, 2}[rng.IntN(5)])
			net += orders[k]
		}
		res, err := Find(productFunc(zs, orders), Box{-1 - 1i, 1 + 1i}, nil)
		if err != nil {
			t.Fatal(err)
		}
		if res.Status != Complete || res.Winding != net || len(res.Points) != len(zs) {
			t.Errorf("trial %d: status %v winding %d (want %d), %d points (want %d); %v",
				trial, res.Status, res.Winding, net, len(res.Points), len(zs), res.Warnings)
			continue
		}
		for k, z := range zs {
			found := false
			for _, p := range res.Points {
				if cmplx.Abs(p.Z-z) < 1e-13 && p.Order == orders[k] {
					found = true
				}
			}
			if !found {
				t.Errorf("trial %d: %v of order %d not found in %+v", trial, z, orders[k], res.Points)
			}
		}
	}
}

// TestFindWilkinson checks Π_{k=1}^{10} (x − k), expanded: its integer
// coefficients are exact in float64 (all below 2⁵³), so the roots are
// exactly 1…10 (Wilkinson, Rounding Errors in Algebraic Processes, 1963,
// for the degree-20 original).
func TestFindWilkinson(t *testing.T) {
	t.Parallel()
	var roots []complex128
	for k := 1; k <= 10; k++ {
		roots = append(roots, complex(float64(k), 0))
	}
	c := fromRoots(roots)
	res, err := Find(polyFunc(c), Box{-1 - 3i, 12 + 3i}, nil)
	if err != nil {
		t.Fatal(err)
	}
	eig, err := PolyRoots(c)
	if err != nil {
		t.Fatal(err)
	}
	got := expand(res.Points)
	// Rounding in Horner's rule limits Find to about 3e-10 here; the
	// companion eigenvalues are off by up to about 8e-9 (both measured).
	if e := matchError(got, roots); e > 1e-9 {
		t.Errorf("Find: roots off by %.2g: %v", e, got)
	}
	if e := matchError(eig, roots); e > 3e-8 {
		t.Errorf("PolyRoots: roots off by %.2g: %v", e, eig)
	}
	if e := matchError(got, eig); e > 3e-8 {
		t.Errorf("Find vs PolyRoots: %.2g", e)
	}
	for _, p := range res.Points {
		if p.Kind != RealSimple || imag(p.Z) != 0 {
			t.Errorf("point %v: kind %v, want real simple on the axis", p.Z, p.Kind)
		}
		if e := math.Abs(real(p.Z) - math.Round(real(p.Z))); e > 10*p.Err+1e-15 {
			t.Errorf("point %v: error %.2g not covered by estimate %.2g", p.Z, e, p.Err)
		}
	}
	if res.Status != Complete {
		t.Errorf("status %v, %v", res.Status, res.Warnings)
	}
}

// coshQ returns Q = 2m(E − V0/cosh²x) for m = 1/2, the Schrödinger Q of the
// barrier V0/cosh²x.
func coshQ(e, v0 float64) jet.Func {
	return jet.Map(func(s jet.Series) jet.Series {
		c := jet.Cosh(s)
		return jet.Sub(jet.Const(complex(e, 0), s.Order()),
			jet.Scale(complex(v0, 0), jet.Div(jet.Const(1, s.Order()), jet.Mul(c, c))))
	})
}

// TestFindCosh checks the turning points and poles of Q = E − V0/cosh²x.
//
// Q = 0 ⇔ cosh x = ±s, s = √(V0/E). Writing x = a + ib, cosh x = cosh a cos b
// + i sinh a sin b is real only for a = 0 or sin b = 0.
//   - E > V0 (s < 1): sin b = 0 would need cosh a = s < 1, so every zero is on
//     the imaginary axis: cos b = ±s, b = ±arccos s, ±(π − arccos s) (+2kπ).
//   - E < V0 (s > 1): a = 0 needs |cos b| = s > 1, impossible; sin b = 0 gives
//     x = ±acosh s + ikπ: real zeros ±acosh s, and copies at Im x = ±π.
//
// The poles are the zeros of cosh, x = iπ/2 + ikπ, each double (sech² has
// a double pole). In the box |Re x| ≤ 2, |Im x| ≤ 3 lie the zeros with
// |b| < 3 and the poles ±iπ/2; for E > V0 the winding is 4 − 4 = 0.
func TestFindCosh(t *testing.T) {
	t.Parallel()
	box := Box{-2 - 3i, 2 + 3i}
	// E = 1e8 puts the zeros ±1e-4 beside the poles: the cell holding a
	// pole and its two zeros has winding 0 and moments of order 1e-9.
	for _, e := range []float64{1.5, 3, 100, 1e8, 0.5, 0.9} {
		const v0 = 1
		s := math.Sqrt(v0 / e)
		var zeros []complex128
		kind := ComplexPair
		if e > v0 {
			a := math.Acos(s)
			zeros = []complex128{complex(0, a), complex(0, -a), complex(0, math.Pi-a), complex(0, a-math.Pi)}
			if math.Pi-2*a < DefaultCoalesceRel*6 { // the zeros flanking a pole are 2(π/2 − a) apart
				kind = Coalescing
			}
		} else {
			a := math.Acosh(s)
			zeros = []complex128{complex(a, 0), complex(-a, 0)}
			kind = RealSimple
		}
		poles := []complex128{complex(0, math.Pi/2), complex(0, -math.Pi/2)}
		res, err := Find(coshQ(e, v0), box, nil)
		if err != nil {
			t.Fatal(err)
		}
		if res.Status != Complete {
			t.Errorf("E = %g: status %v %v", e, res.Status, res.Warnings)
		}
		var gz, gp []complex128
		for _, p := range res.Points {
			switch {
			case p.Order == 1 && p.Kind == kind:
				gz = append(gz, p.Z)
			case p.Order == -2 && p.Kind == Pole:
				gp = append(gp, p.Z)
			default:
				t.Errorf("E = %g: unexpected point %v order %d kind %v", e, p.Z, p.Order, p.Kind)
			}
		}
		if d := matchError(gz, zeros); d > 1e-12 {
			t.Errorf("E = %g: zeros %v, want %v (error %.2g)", e, gz, zeros, d)
		}
		if d := matchError(gp, poles); d > 1e-12 {
			t.Errorf("E = %g: poles %v, want %v (error %.2g)", e, gp, poles, d)
		}
		if want := len(zeros) - 4; res.Winding != want {
			t.Errorf("E = %g: winding %d, want %d", e, res.Winding, want)
		}
	}
}

// pt is an expected point of a table test.
type pt struct {
	z     complex128
	order int
	kind  Kind
	tol   float64
}

func TestFindCases(t *testing.T) {
	t.Parallel()
	one := func(s jet.Series, c complex128) jet.Series { return jet.Const(c, s.Order()) }
	x0 := -2 + splitFracs[0]*4  // the first cut of the box [−2, 2]×[−1, 1]
	r := cmplx.Sqrt(0.5 + 0.5i) // x⁴ − x² + 1/2 = 0 ⇔ x² = (1 ± i)/2
	rc := cmplx.Conj(r)
	for _, tc := range []struct {
		name string
		q    jet.Func
		box  Box
		want []pt // in the documented order
		warn string
		set  *Settings
	}{
		{"E - x^2", jet.Map(func(s jet.Series) jet.Series { return jet.Sub(one(s, 2), jet.Mul(s, s)) }),
			DefaultBox(-3, 3), []pt{{-math.Sqrt2, 1, RealSimple, 1e-15}, {math.Sqrt2, 1, RealSimple, 1e-15}}, "", nil},
		{"double zero (x-1)^2(x+2)", productFunc([]complex128{1, -2}, []int{2, 1}), Box{-3 - 3i, 3 + 3i},
			[]pt{{-2, 1, RealSimple, 1e-15}, {1, 2, Coalescing, 1e-15}}, "", nil},
		// x³ − 3x + 2 = (x − 1)²(x + 2) expanded: rounding splits the double zero by ~√eps.
		{"double zero expanded", polyFunc([]complex128{2, -3, 0, 1}), Box{-3 - 3i, 3 + 3i},
			[]pt{{-2, 1, RealSimple, 1e-15}, {1, 2, Coalescing, 1e-7}}, "", nil},
		{"triple zero", productFunc([]complex128{0.3, -1}, []int{3, 1}), Box{-3 - 3i, 3 + 3i},
			[]pt{{-1, 1, RealSimple, 1e-15}, {0.3, 3, Coalescing, 1e-15}}, "", nil},
		{"near-double pair", productFunc([]complex128{1, 1 + 1e-4, -2}, []int{1, 1, 1}), Box{-3 - 3i, 3 + 3i},
			[]pt{{-2, 1, RealSimple, 1e-15}, {1, 1, Coalescing, 1e-14}, {1 + 1e-4, 1, Coalescing, 1e-14}}, "", nil},
		{"double pole 1/x^2", jet.Map(func(s jet.Series) jet.Series { return jet.PowInt(s, -2) }), Box{-1 - 1i, 1 + 1i},
			[]pt{{0, -2, Pole, 1e-15}}, "", nil},
		{"complex pair x^2+2x+5", polyFunc([]complex128{5, 2, 1}), Box{-3 - 3i, 3 + 3i},
			[]pt{{-1 - 2i, 1, ComplexPair, 1e-15}, {-1 + 2i, 1, ComplexPair, 1e-15}}, "", nil},
		{"complex zero", productFunc([]complex128{0.5 + 0.7i}, []int{1}), Box{-1 - 1i, 1 + 1i},
			[]pt{{0.5 + 0.7i, 1, Complex, 1e-15}}, "", nil},
		// 1 − x² − 1/(2x²): a centrifugal-type double pole and four complex zeros.
		{"centrifugal", jet.Map(func(s jet.Series) jet.Series {
			return jet.Sub(jet.Sub(one(s, 1), jet.Mul(s, s)), jet.Scale(0.5, jet.PowInt(s, -2)))
		}), Box{-2 - 2i, 2 + 2i},
			[]pt{{0, -2, Pole, 1e-15}, {-r, 1, ComplexPair, 1e-14}, {rc, 1, ComplexPair, 1e-14}, {-rc, 1, ComplexPair, 1e-14}, {r, 1, ComplexPair, 1e-14}}, "", nil},
		// (x − 0.1)/(x + 0.1): winding 0, a zero next to a pole.
		{"zero-pole pair", jet.Map(func(s jet.Series) jet.Series { return jet.Div(jet.Sub(s, one(s, 0.1)), jet.Add(s, one(s, 0.1))) }),
			Box{-1 - 1i, 1 + 1i}, []pt{{-0.1, -1, Pole, 1e-15}, {0.1, 1, RealSimple, 1e-15}}, "", nil},
		{"empty box", polyFunc([]complex128{1, 0, 1}), Box{2 - 1i, 3 + 1i}, nil, "", nil},
		{"exp has no zeros", jet.Map(jet.Exp), Box{-2 - 2i, 2 + 2i}, nil, "", nil},
		{"zero on the first cut", productFunc([]complex128{complex(x0, 0.3)}, []int{1}), Box{-2 - 1i, 2 + 1i},
			[]pt{{complex(x0, 0.3), 1, Complex, 1e-15}}, "", nil},
		{"zeros on the first cut, real", productFunc([]complex128{complex(x0, 0), 1.5}, []int{1, 1}), Box{-2 - 1i, 2 + 1i},
			[]pt{{complex(x0, 0), 1, RealSimple, 1e-15}, {1.5, 1, RealSimple, 1e-15}}, "", nil},
		{"zero on the box boundary", productFunc([]complex128{1, 0.2}, []int{1, 1}), Box{-1 - 1i, 1 + 1i},
			[]pt{{0.2, 1, RealSimple, 1e-15}, {1, 1, RealSimple, 1e-15}}, "box boundary", nil},
		{"analytic branch of sqrt", jet.Map(jet.Sqrt), Box{0.5 - 1i, 2 + 1i}, nil, "", nil},
		{"pole on the box boundary", jet.Map(func(s jet.Series) jet.Series { return jet.Div(jet.Sub(s, one(s, 0.2)), jet.Sub(s, one(s, 1i))) }),
			Box{-1 - 1i, 1 + 1i}, []pt{{0.2, 1, RealSimple, 1e-15}, {1i, -1, Pole, 1e-15}}, "box boundary", nil},
		// Winding −1 from a zero 1e-4 beside a double pole: the moments of a
		// large cell look like one simple pole.
		{"zero beside a double pole", productFunc([]complex128{0.3001 + 0.1i, 0.3 + 0.1i}, []int{1, -2}), Box{-1 - 1i, 1 + 1i},
			[]pt{{0.3 + 0.1i, -2, Pole, 1e-15}, {0.3001 + 0.1i, 1, Complex, 1e-15}}, "", nil},
		{"triple zero beside a pole", productFunc([]complex128{0.3000001 + 0.1i, 0.3 + 0.1i}, []int{3, -1}), Box{-1 - 1i, 1 + 1i},
			[]pt{{0.3 + 0.1i, -1, Pole, 1e-15}, {0.3000001 + 0.1i, 3, Coalescing, 1e-15}}, "", nil},
		{"near-double pair, pairing off", productFunc([]complex128{1, 1 + 1e-4, -2}, []int{1, 1, 1}), Box{-3 - 3i, 3 + 3i},
			[]pt{{-2, 1, RealSimple, 1e-15}, {1, 1, RealSimple, 1e-14}, {1 + 1e-4, 1, RealSimple, 1e-14}}, "", &Settings{CoalesceRadius: -1}},
	} {
		res, err := Find(tc.q, tc.box, tc.set)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if res.Status != Complete || !res.Balanced {
			t.Errorf("%s: status %v balanced %v, want complete; %v", tc.name, res.Status, res.Balanced, res.Warnings)
		}
		if tc.warn == "" && len(res.Warnings) > 0 || tc.warn != "" && !strings.Contains(strings.Join(res.Warnings, "\n"), tc.warn) {
			t.Errorf("%s: warnings %q, want %q", tc.name, res.Warnings, tc.warn)
		}
		if len(res.Points) != len(tc.want) {
			t.Errorf("%s: %d points %+v, want %d", tc.name, len(res.Points), res.Points, len(tc.want))
			continue
		}
		sum := 0
		for i, w := range tc.want {
			p := res.Points[i]
			sum += p.Order
			d := cmplx.Abs(p.Z - w.z)
			if d > w.tol || p.Order != w.order || p.Kind != w.kind {
				t.Errorf("%s: point %d = %v order %d %v, want %v order %d %v (error %.2g)",
					tc.name, i, p.Z, p.Order, p.Kind, w.z, w.order, w.kind, d)
			}
			if d > 10*p.Err+4e-16 {
				t.Errorf("%s: point %d error %.2g not covered by its estimate %.2g", tc.name, i, d, p.Err)
			}
		}
		if sum != res.Winding {
			t.Errorf("%s: orders add up to %d, winding %d", tc.name, sum, res.Winding)
		}
	}
}

// TestNotMeromorphic: square roots and logarithms jump across their branch
// cuts; Find must say so instead of miscounting.
func TestNotMeromorphic(t *testing.T) {
	t.Parallel()
	one := func(s jet.Series, c complex128) jet.Series { return jet.Const(c, s.Order()) }
	for _, tc := range []struct {
		name string
		q    jet.Func
		box  Box
	}{
		{"sqrt x", jet.Map(jet.Sqrt), Box{-1 - 1i, 1 + 1i}},
		{"log x", jet.Map(jet.Log), Box{-2 - 2i, 2 + 2i}},
		// √(x−1)·√(x+1) is continuous across (−∞, −1): the cut [−1, 1] lies inside.
		{"cut inside the box", jet.Map(func(s jet.Series) jet.Series {
			return jet.Mul(jet.Sqrt(jet.Sub(s, one(s, 1))), jet.Sqrt(jet.Add(s, one(s, 1))))
		}), Box{-2 - 2i, 2 + 2i}},
		{"sqrt of a polynomial", jet.Map(func(s jet.Series) jet.Series {
			return jet.Sqrt(jet.Add(jet.Mul(s, s), one(s, 1)))
		}), Box{-2 - 2i, 2 + 2i}},
	} {
		res, err := Find(tc.q, tc.box, nil)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if res.Status != NotMeromorphic || len(res.Warnings) == 0 {
			t.Errorf("%s: status %v, warnings %q, want not meromorphic", tc.name, res.Status, res.Warnings)
		}
	}
}

// TestEssentialSingularity: exp(1/x) and sin(1/x) are not meromorphic at 0
// (sin(1/x) has the zeros 1/(kπ) accumulating there); the search must end,
// within its budget, with a status other than Complete and a warning.
func TestEssentialSingularity(t *testing.T) {
	t.Parallel()
	one := func(s jet.Series, c complex128) jet.Series { return jet.Const(c, s.Order()) }
	for _, tc := range []struct {
		name string
		q    jet.Func
	}{
		{"exp(1/x)", jet.Map(func(s jet.Series) jet.Series { return jet.Exp(jet.Div(one(s, 1), s)) })},
		{"sin(1/x)", jet.Map(func(s jet.Series) jet.Series { return jet.Sin(jet.Div(one(s, 1), s)) })},
	} {
		res, err := Find(tc.q, Box{-1 - 1i, 1 + 1i}, &Settings{MaxEvals: 300000})
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if res.Status == Complete || len(res.Warnings) == 0 || res.Evals > 310000 {
			t.Errorf("%s: status %v after %d evaluations, warnings %q", tc.name, res.Status, res.Evals, res.Warnings)
		}
	}
}

func TestFindErrors(t *testing.T) {
	t.Parallel()
	q := polyFunc([]complex128{-1, 0, 1})
	nan := jet.Map(func(s jet.Series) jet.Series { return jet.Const(cmplx.NaN(), s.Order()) })
	for _, tc := range []struct {
		name string
		q    jet.Func
		box  Box
		set  *Settings
		msg  string
	}{
		{"nil function", nil, Box{-1 - 1i, 1 + 1i}, nil, "nil function"},
		{"flat box", q, Box{-1, 1}, nil, "empty box"},
		{"reversed box", q, Box{1 + 1i, -1 - 1i}, nil, "empty box"},
		{"infinite corner", q, Box{complex(math.Inf(-1), -1), 1 + 1i}, nil, "not finite"},
		{"negative depth", q, Box{-1 - 1i, 1 + 1i}, &Settings{MaxDepth: -1}, "max depth"},
		{"negative evals", q, Box{-1 - 1i, 1 + 1i}, &Settings{MaxEvals: -1}, "evaluation limit"},
		{"NaN tolerance", q, Box{-1 - 1i, 1 + 1i}, &Settings{Tol: math.NaN()}, "non-finite"},
		{"NaN everywhere", nan, Box{-1 - 1i, 1 + 1i}, nil, "NaN on the box boundary"},
		{"identically zero", jet.Map(func(s jet.Series) jet.Series { return jet.Const(0, s.Order()) }), Box{-1 - 1i, 1 + 1i}, nil, "cannot place the box boundary"},
	} {
		_, err := Find(tc.q, tc.box, tc.set)
		if err == nil || !strings.Contains(err.Error(), tc.msg) {
			t.Errorf("%s: error %v, want %q", tc.name, err, tc.msg)
		}
	}
}

func TestFindLimits(t *testing.T) {
	t.Parallel()
	var roots []complex128
	for k := 1; k <= 10; k++ {
		roots = append(roots, complex(float64(k), 0.1*float64(k%3)))
	}
	q := polyFunc(fromRoots(roots))
	box := Box{-1 - 2i, 12 + 2i}
	res, err := Find(q, box, &Settings{MaxEvals: 300})
	if err != nil {
		t.Fatal(err)
	}
	if res.Status != EvalLimit || len(res.Warnings) == 0 {
		t.Errorf("MaxEvals 300: status %v, want evaluation limit", res.Status)
	}
	res, err = Find(q, box, &Settings{MaxDepth: 2})
	if err != nil {
		t.Fatal(err)
	}
	if res.Status != DepthLimit || len(res.Warnings) == 0 {
		t.Errorf("MaxDepth 2: status %v, want depth limit", res.Status)
	}
	if res.Winding != 10 || res.Zeros != 10 {
		t.Errorf("MaxDepth 2: winding %d zeros %d, want 10 and 10 (unresolved cells reported)", res.Winding, res.Zeros)
	}
}

func TestStatusString(t *testing.T) {
	t.Parallel()
	for s, want := range map[Status]string{Complete: "complete", NotMeromorphic: "not meromorphic", Status(42): "Status(42)"} {
		if s.String() != want {
			t.Errorf("Status(%d).String() = %q, want %q", int(s), s.String(), want)
		}
	}
}
