package cases

import (
	"math"
	"math/cmplx"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/cmplxs/cscalar"
	"gonum.org/v1/gonum/floats/scalar"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
)

func load(t *testing.T, name string) *Case {
	t.Helper()
	c, err := Load(filepath.Join("testdata", name))
	if err != nil {
		if l, ok := err.(ErrorList); ok {
			t.Fatalf("Load(%s):\n%s", name, l.Detail())
		}
		t.Fatalf("Load(%s): %v", name, err)
	}
	return c
}

// Points at which the problems are compared, on and off the real axis.
var testPoints = []complex128{0.3, -1.7, 0.2 + 0.4i, -2.5 - 0.1i}

// The references below are the closed forms of each file written out with
// math/cmplx, independently of the formula package.

// schrodingerV is V(x) = V0/cosh(x/a)² of testdata/schrodinger.toml (V0 = 1,
// a = 1), and dV its derivative −2 V0 sinh(x/a)/(a cosh(x/a)³).
func schrodingerV(x complex128) complex128 { c := cmplx.Cosh(x); return 1 / (c * c) }
func schrodingerDV(x complex128) complex128 {
	c := cmplx.Cosh(x)
	return -2 * cmplx.Sinh(x) / (c * c * c)
}

// gradedN is n(x) = 1.25 + dn tanh(x/w) of testdata/graded.toml (w = 0.4,
// dn = 0.25), and dN its derivative dn/(w cosh(x/w)²).
func gradedN(x complex128) complex128 { return 1.25 + 0.25*cmplx.Tanh(x/0.4) }
func gradedDN(x complex128) complex128 {
	c := cmplx.Cosh(x / 0.4)
	return 0.25 / (0.4 * c * c)
}

// checkQ compares p.Q (value and first derivative) with want and dwant.
func checkQ(t *testing.T, label string, p wkb.Problem, want, dwant func(complex128) complex128) {
	t.Helper()
	for _, z := range testPoints {
		if got := p.Q.Eval(z); !cscalar.EqualWithinAbsOrRel(got, want(z), 1e-14, 1e-13) {
			t.Errorf("%s: Q(%v) = %v, want %v", label, z, got, want(z))
		}
		s := p.Q.Taylor(z, 2)
		if !cscalar.EqualWithinAbsOrRel(s[0], want(z), 1e-14, 1e-13) {
			t.Errorf("%s: Taylor(%v)[0] = %v, want %v", label, z, s[0], want(z))
		}
		if !cscalar.EqualWithinAbsOrRel(s[1], dwant(z), 1e-13, 1e-12) {
			t.Errorf("%s: Q'(%v) = %v, want %v", label, z, s[1], dwant(z))
		}
	}
}

func TestSchrodingerProblem(t *testing.T) {
	t.Parallel()
	c := load(t, "schrodinger.toml")
	if c.Form != Schrodinger || c.Form.String() != "schrodinger" {
		t.Fatalf("Form = %v, want schrodinger", c.Form)
	}
	if a, b := c.Interval(); a != -6 || b != 6 {
		t.Errorf("Interval() = %v, %v, want -6, 6", a, b)
	}
	if box := c.SearchBox(); box != (turning.Box{Lo: -7 - 1i, Hi: 7 + 1i}) {
		t.Errorf("SearchBox() = %v, want the box of the file", box)
	}
	if c.Levels == nil || len(c.Levels.N) != 3 || c.Levels.N[2] != 2 || c.Levels.MaxOrder != 4 {
		t.Errorf("Levels = %+v, want n = 0, 1, 2 and max_order 4", c.Levels)
	}
	if len(c.Expect) != 1 || c.Expect[0].Quantity != "turning_points" || c.Expect[0].Value != 2 ||
		c.Expect[0].Pos.Line != 36 || c.Expect[0].Pos.Column != 9 {
		t.Errorf("Expect = %+v, want one turning_points count of 2 placed at 36:9", c.Expect)
	}
	const m, hbar, E = 1.0, 0.1, 0.8 // the values of the file
	p, err := c.Problem()
	if err != nil {
		t.Fatal(err)
	}
	if !scalar.EqualWithinAbsOrRel(p.Lambda, 1/hbar, 0, 1e-15) || p.Q1 != nil {
		t.Errorf("Lambda = %v, Q1 = %v, want 1/hbar = %v and no Q1", p.Lambda, p.Q1, 1/hbar)
	}
	// Q = 2m(E − V), Q′ = −2m V′.
	checkQ(t, "schrodinger", p,
		func(x complex128) complex128 { return 2 * m * (E - schrodingerV(x)) },
		func(x complex128) complex128 { return -2 * m * schrodingerDV(x) })

	w, err := c.Well()
	if err != nil {
		t.Fatal(err)
	}
	if w.Mass != m || w.Hbar != hbar || w.A != -6 || w.B != 6 || w.LeftWall || w.RightWall {
		t.Errorf("Well() = %+v, want the values of the file", w)
	}
	if got := w.V.Eval(0.3); !cscalar.EqualWithinAbsOrRel(got, schrodingerV(0.3), 1e-15, 1e-14) {
		t.Errorf("Well().V(0.3) = %v, want %v", got, schrodingerV(0.3))
	}
	if c.ScanLabel() != "E" {
		t.Errorf("ScanLabel() = %q, want E", c.ScanLabel())
	}
}

func TestGradedProblem(t *testing.T) {
	t.Parallel()
	c := load(t, "graded.toml")
	if c.Form != Graded {
		t.Fatalf("Form = %v, want graded", c.Form)
	}
	if f := c.Graded.Index; f.Text != "1.25 + dn*tanh(x/w)" || f.Pos.String() != filepath.Join("testdata", "graded.toml")+":13:9" {
		t.Errorf("Index = %q at %s, want the formula of line 13 at column 9", f.Text, f.Pos)
	}
	if c.Graded.NIn != 1 || c.Graded.Angle != 30 || c.Graded.Polarization != "s" {
		t.Errorf("Graded = %+v, want n_in 1, angle 30, polarization s", c.Graded)
	}
	if c.Region.Box != nil || c.SearchBox() != turning.DefaultBox(-5, 5) {
		t.Errorf("SearchBox() = %v, want turning.DefaultBox(-5, 5)", c.SearchBox())
	}
	p, err := c.Problem()
	if err != nil {
		t.Fatal(err)
	}
	// λ = k0 = 2π/λ0 with λ0 = 0.55.
	if k0 := 2 * math.Pi / 0.55; !scalar.EqualWithinAbsOrRel(p.Lambda, k0, 0, 1e-15) {
		t.Errorf("Lambda = %v, want 2π/0.55 = %v", p.Lambda, k0)
	}
	// Q = n² − n_in² sin²θ with n_in = 1, θ = 30°: sin²30° = 1/4 exactly.
	checkQ(t, "graded", p,
		func(x complex128) complex128 { n := gradedN(x); return n*n - 0.25 },
		func(x complex128) complex128 { return 2 * gradedN(x) * gradedDN(x) })
	if c.ScanLabel() != "theta (deg)" {
		t.Errorf("ScanLabel() = %q, want theta (deg)", c.ScanLabel())
	}
}

// TestGradedPermittivity checks that permittivity = n(x)² gives the same
// problem as index = n(x).
func TestGradedPermittivity(t *testing.T) {
	t.Parallel()
	src := replaceOnce(t, string(mustRead(t, "graded.toml")), "index = '1.25 + dn*tanh(x/w)'", "permittivity = '(1.25 + dn*tanh(x/w))^2'")
	c, err := Parse("eps.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if c.Graded.Index != nil || c.Graded.Permittivity == nil {
		t.Fatalf("Graded = %+v, want the permittivity only", c.Graded)
	}
	p, err := c.ProblemAt(45)
	if err != nil {
		t.Fatal(err)
	}
	// sin²45° = 1/2.
	checkQ(t, "permittivity", p,
		func(x complex128) complex128 { n := gradedN(x); return n*n - 0.5 },
		func(x complex128) complex128 { return 2 * gradedN(x) * gradedDN(x) })
}

func TestGeneralProblem(t *testing.T) {
	t.Parallel()
	c := load(t, "general.toml")
	p, err := c.Problem()
	if err != nil {
		t.Fatal(err)
	}
	if p.Lambda != 12 {
		t.Errorf("Lambda = %v, want 12", p.Lambda)
	}
	// Q = x²/4 − a with a = 0.5 (a multi-line string), Q1 = c sech²x with c = 0.1.
	checkQ(t, "general", p,
		func(x complex128) complex128 { return x*x/4 - 0.5 },
		func(x complex128) complex128 { return x / 2 })
	if p.Q1 == nil {
		t.Fatal("Q1 is nil, want c*sech(x)^2")
	}
	for _, z := range testPoints {
		ch := cmplx.Cosh(z)
		if got, want := p.Q1.Eval(z), 0.1/(ch*ch); !cscalar.EqualWithinAbsOrRel(got, want, 1e-15, 1e-14) {
			t.Errorf("Q1(%v) = %v, want %v", z, got, want)
		}
	}
	// The log scan from 1 to 100 in 5 points is 1, √10, 10, 10√10, 100.
	want := []float64{1, math.Sqrt(10), 10, 10 * math.Sqrt(10), 100}
	got := c.Scan.Values()
	for i := range want {
		if !scalar.EqualWithinAbsOrRel(got[i], want[i], 0, 1e-14) {
			t.Errorf("Scan.Values()[%d] = %v, want %v", i, got[i], want[i])
		}
	}
	if _, err := c.Well(); err == nil {
		t.Error("Well() of a general case succeeded, want an error")
	}
}

// TestProblemAt checks, for every kind of scan variable, that ProblemAt
// changes what the variable governs and nothing else.
func TestProblemAt(t *testing.T) {
	t.Parallel()
	schrodinger := string(mustRead(t, "schrodinger.toml"))
	graded := string(mustRead(t, "graded.toml"))
	general := string(mustRead(t, "general.toml"))
	const z = 0.3 + 0.2i
	const m, hbar, E = 1.0, 0.1, 0.8
	for _, tc := range []struct {
		over   string
		src    string // the case, with its [scan] over "energy", "angle" or "lambda" replaced
		from   string
		v      float64
		lambda float64
		q      func(z complex128) complex128
	}{
		{"energy", schrodinger, `over = "energy"`, 1.3, 1 / hbar,
			func(z complex128) complex128 { return 2 * m * (1.3 - schrodingerV(z)) }},
		{"hbar", schrodinger, `over = "energy"`, 0.02, 1 / 0.02,
			func(z complex128) complex128 { return 2 * m * (E - schrodingerV(z)) }},
		{"mass", schrodinger, `over = "energy"`, 3, 1 / hbar,
			func(z complex128) complex128 { return 2 * 3 * (E - schrodingerV(z)) }},
		{"V0", schrodinger, `over = "energy"`, 2.5, 1 / hbar,
			func(z complex128) complex128 { return 2 * m * (E - 2.5*schrodingerV(z)) }},
		{"wavelength", graded, `over = "angle"`, 0.8, 2 * math.Pi / 0.8,
			func(z complex128) complex128 { n := gradedN(z); return n*n - 0.25 }},
		{"k0", graded, `over = "angle"`, 7, 7,
			func(z complex128) complex128 { n := gradedN(z); return n*n - 0.25 }},
		// sin²(45°) = 1/2.
		{"angle", graded, `over = "angle"`, 45, 2 * math.Pi / 0.55,
			func(z complex128) complex128 { n := gradedN(z); return n*n - 0.5 }},
		{"dn", graded, `over = "angle"`, 0.5, 2 * math.Pi / 0.55,
			func(z complex128) complex128 { n := 1.25 + 0.5*cmplx.Tanh(z/0.4); return n*n - 0.25 }},
		{"lambda", general, `over = "lambda"`, 40, 40,
			func(z complex128) complex128 { return z*z/4 - 0.5 }},
		{"a", general, `over = "lambda"`, -1, 12,
			func(z complex128) complex128 { return z*z/4 + 1 }},
	} {
		src := replaceOnce(t, tc.src, tc.from, `over = "`+tc.over+`"`)
		switch tc.over {
		case "a": // a log scan cannot cover a = -1
			src = replaceOnce(t, src, `spacing = "log"`, "")
		case "wavelength", "k0": // the angle scan starts at 0
			src = replaceOnce(t, src, "from = 0\n", "from = 0.5\n")
		}
		c, err := Parse(tc.over+".toml", []byte(src))
		if err != nil {
			t.Fatalf("over %s: %v", tc.over, err)
		}
		base, err := c.Problem()
		if err != nil {
			t.Fatalf("over %s: Problem: %v", tc.over, err)
		}
		p, err := c.ProblemAt(tc.v)
		if err != nil {
			t.Fatalf("over %s: ProblemAt(%v): %v", tc.over, tc.v, err)
		}
		if !scalar.EqualWithinAbsOrRel(p.Lambda, tc.lambda, 0, 1e-14) {
			t.Errorf("over %s: ProblemAt(%v).Lambda = %v, want %v", tc.over, tc.v, p.Lambda, tc.lambda)
		}
		if got, want := p.Q.Eval(z), tc.q(z); !cscalar.EqualWithinAbsOrRel(got, want, 1e-14, 1e-13) {
			t.Errorf("over %s: ProblemAt(%v).Q(%v) = %v, want %v", tc.over, tc.v, z, got, want)
		}
		// ProblemAt(BaseValue()) is Problem().
		bv, ok := c.BaseValue()
		if !ok {
			t.Fatalf("over %s: BaseValue() not ok", tc.over)
		}
		if pb, err := c.ProblemAt(bv); err != nil || !scalar.EqualWithinAbsOrRel(pb.Lambda, base.Lambda, 0, 1e-15) ||
			!cscalar.EqualWithinAbsOrRel(pb.Q.Eval(z), base.Q.Eval(z), 1e-15, 1e-14) {
			t.Errorf("over %s: ProblemAt(BaseValue() = %v) differs from Problem()", tc.over, bv)
		}
		// The base problem is untouched by ProblemAt (no shared state).
		again, _ := c.Problem()
		if again.Lambda != base.Lambda || again.Q.Eval(z) != base.Q.Eval(z) {
			t.Errorf("over %s: ProblemAt changed the base problem", tc.over)
		}
	}
}

func TestProblemAtErrors(t *testing.T) {
	t.Parallel()
	c := load(t, "graded.toml")
	for _, v := range []float64{90, -90, math.NaN(), math.Inf(1)} {
		if _, err := c.ProblemAt(v); err == nil {
			t.Errorf("ProblemAt(%v) over angle succeeded, want an error", v)
		}
	}
	g := load(t, "general.toml")
	if _, err := g.ProblemAt(-1); err == nil {
		t.Error("ProblemAt(-1) over lambda succeeded, want an error")
	}
	g.Scan = nil
	if _, err := g.ProblemAt(1); err == nil {
		t.Error("ProblemAt without a scan succeeded, want an error")
	}
	// A Schrödinger case without energy has no base problem.
	src := replaceOnce(t, string(mustRead(t, "schrodinger.toml")), "energy = 0.8\n", "")
	src = replaceOnce(t, src, "value = 2\n", "at = 0.8\nvalue = 2\n")
	s, err := Parse("noenergy.toml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	if _, err := s.Problem(); err == nil {
		t.Error("Problem() without energy succeeded, want an error")
	}
	if _, err := s.ProblemAt(0.5); err != nil {
		t.Errorf("ProblemAt(0.5) over energy: %v", err)
	}
}

func TestScanValues(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		s    Scan
		want []float64
	}{
		{Scan{From: 2, To: 2, Points: 1}, []float64{2}},
		{Scan{From: 0, To: 1, Points: 5}, []float64{0, 0.25, 0.5, 0.75, 1}},
		{Scan{From: 1, To: -1, Points: 3}, []float64{1, 0, -1}},
		{Scan{From: 1e-3, To: 1e3, Points: 4, Log: true}, []float64{1e-3, 1e-1, 1e1, 1e3}},
	} {
		got := tc.s.Values()
		if len(got) != len(tc.want) {
			t.Errorf("%+v.Values() = %v, want %v", tc.s, got, tc.want)
			continue
		}
		for i := range got {
			if !scalar.EqualWithinAbsOrRel(got[i], tc.want[i], 1e-15, 1e-13) {
				t.Errorf("%+v.Values()[%d] = %v, want %v", tc.s, i, got[i], tc.want[i])
			}
		}
	}
}

func TestExpectationHolds(t *testing.T) {
	t.Parallel()
	e := Expectation{Quantity: "T", Value: 0.5, RelTol: 1e-3}
	for _, tc := range []struct {
		got  float64
		want bool
	}{{0.5004, true}, {0.4996, true}, {0.5006, false}, {math.NaN(), false}} {
		if e.Holds(tc.got) != tc.want {
			t.Errorf("Holds(%v) = %v, want %v", tc.got, !tc.want, tc.want)
		}
	}
	n := Expectation{Quantity: "turning_points", Value: 2}
	if !n.Holds(2) || n.Holds(3) {
		t.Error("a turning_points count must hold exactly")
	}
}

func mustRead(t *testing.T, name string) []byte {
	t.Helper()
	c := load(t, name)
	return c.Source
}

func replaceOnce(t *testing.T, s, old, new string) string {
	t.Helper()
	i := strings.Index(s, old)
	if i < 0 {
		t.Fatalf("%q not found", old)
	}
	return s[:i] + new + s[i+len(old):]
}
