package formula

import (
	"math"
	"math/big"
	"math/cmplx"
	"strings"
	"sync"
	"testing"

	"gonum.org/v1/gonum/cmplxs/cscalar"
	"gonum.org/v1/gonum/floats/scalar"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// bind parses src with the parameters of vals and binds them.
func bind(t *testing.T, src string, vals map[string]complex128) jet.Func {
	t.Helper()
	var names []string
	for name := range vals {
		names = append(names, name)
	}
	e, err := Parse(src, names)
	if err != nil {
		t.Fatalf("Parse(%q): %v", src, err)
	}
	f, err := e.Bind(vals)
	if err != nil {
		t.Fatalf("Bind(%q): %v", src, err)
	}
	return f
}

var testPoints = []complex128{0.3 + 0.7i, -1.2 + 0.4i, 2.5 - 1.5i, -0.8 - 2.1i, 1.1}

func TestEvalFunctions(t *testing.T) {
	t.Parallel()
	// The reference is math/cmplx itself, or the definition in terms of it.
	ref := map[string]func(complex128) complex128{
		"sin":  cmplx.Sin,
		"cos":  cmplx.Cos,
		"tan":  cmplx.Tan,
		"cot":  func(z complex128) complex128 { return cmplx.Cos(z) / cmplx.Sin(z) },
		"sec":  func(z complex128) complex128 { return 1 / cmplx.Cos(z) },
		"csc":  func(z complex128) complex128 { return 1 / cmplx.Sin(z) },
		"sinh": cmplx.Sinh,
		"cosh": cmplx.Cosh,
		"tanh": cmplx.Tanh,
		"coth": func(z complex128) complex128 { return cmplx.Cosh(z) / cmplx.Sinh(z) },
		"sech": func(z complex128) complex128 { return 1 / cmplx.Cosh(z) },
		"csch": func(z complex128) complex128 { return 1 / cmplx.Sinh(z) },
		"exp":  cmplx.Exp,
		"log":  cmplx.Log,
		"sqrt": cmplx.Sqrt,
	}
	if got, want := strings.Join(Functions(), " "), "cos cosh cot coth csc csch exp log sec sech sin sinh sqrt tan tanh"; got != want {
		t.Errorf("Functions() = %q, want %q", got, want)
	}
	for _, name := range Functions() {
		want := ref[name]
		if want == nil {
			t.Errorf("no reference for %s", name)
			continue
		}
		f := bind(t, name+"(x)", nil)
		for _, z := range testPoints {
			if got, w := f.Eval(z), want(z); !cscalar.EqualWithinAbsOrRel(got, w, 1e-15, 1e-15) {
				t.Errorf("%s(%v) = %v, want %v", name, z, got, w)
			}
			if got, w := f.Taylor(z, 3)[0], f.Eval(z); got != w {
				t.Errorf("%s: Taylor(%v)[0] = %v, Eval = %v", name, z, got, w)
			}
		}
	}
}

func TestEvalFormulas(t *testing.T) {
	t.Parallel()
	vals := map[string]complex128{"E": 0.7, "V0": 2, "a": 1.5 - 0.5i, "n": 3, "h": 0.5}
	E, V0, a := complex(0.7, 0), complex(2, 0), complex(1.5, -0.5)
	for _, test := range []struct {
		src  string
		want func(z complex128) complex128 // the formula typed in Go
	}{
		{"2*(E - V0/cosh(x)^2)", func(z complex128) complex128 { c := cmplx.Cosh(z); return 2 * (E - V0/(c*c)) }},
		{"-x^2", func(z complex128) complex128 { return -z * z }},
		{"2^3^2", func(complex128) complex128 { return 512 }},
		{"x^-2", func(z complex128) complex128 { return 1 / (z * z) }},
		{"x^n", func(z complex128) complex128 { return z * z * z }},
		{"x^h", cmplx.Sqrt},
		{"x^a", func(z complex128) complex128 { return cmplx.Pow(z, a) }},
		{"x^x", func(z complex128) complex128 { return cmplx.Exp(z * cmplx.Log(z)) }},
		{"2^x", func(z complex128) complex128 { return cmplx.Exp(z * math.Ln2) }},
		{"a - x - 1", func(z complex128) complex128 { return a - z - 1 }},
		{"1 - x", func(z complex128) complex128 { return 1 - z }},
		{"1/x + x/2", func(z complex128) complex128 { return 1/z + z/2 }},
		{"exp(i*pi*x)", func(z complex128) complex128 { return cmplx.Exp(1i * math.Pi * z) }},
		{"sqrt(1 + x^2)*log(x)", func(z complex128) complex128 { return cmplx.Sqrt(1+z*z) * cmplx.Log(z) }},
		{"a", func(complex128) complex128 { return a }},
		{"1e-3*x", func(z complex128) complex128 { return 1e-3 * z }},
	} {
		f := bind(t, test.src, vals)
		for _, z := range testPoints {
			if got, w := f.Eval(z), test.want(z); !cscalar.EqualWithinAbsOrRel(got, w, 1e-14, 1e-14) {
				t.Errorf("%s at %v = %v, want %v", test.src, z, got, w)
			}
			if got, w := f.Taylor(z, 2)[0], f.Eval(z); !cscalar.EqualWithinAbsOrRel(got, w, 1e-15, 1e-15) {
				t.Errorf("%s: Taylor(%v)[0] = %v, Eval = %v", test.src, z, got, w)
			}
		}
	}
}

func TestTaylorOperators(t *testing.T) {
	t.Parallel()
	// Each operator with a constant on either side, and constant subtrees
	// folded at Bind: values and first two derivatives written out by hand.
	c := (2 + 1i) * (3 - math.Pi) / cmplx.Sqrt(2) * cmplx.Exp(1i*math.Ln2) // (2+i)*(3-pi)/(1+1)^0.5*2^i
	for _, test := range []struct {
		src    string
		derivs func(z complex128) []complex128
	}{
		{"2 - x", func(z complex128) []complex128 { return []complex128{2 - z, -1, 0} }},
		{"x - 2", func(z complex128) []complex128 { return []complex128{z - 2, 1, 0} }},
		{"2 + x", func(z complex128) []complex128 { return []complex128{2 + z, 1, 0} }},
		{"x + 2", func(z complex128) []complex128 { return []complex128{z + 2, 1, 0} }},
		{"2*x", func(z complex128) []complex128 { return []complex128{2 * z, 2, 0} }},
		{"x*2", func(z complex128) []complex128 { return []complex128{2 * z, 2, 0} }},
		{"x/2", func(z complex128) []complex128 { return []complex128{z / 2, 0.5, 0} }},
		{"2/x", func(z complex128) []complex128 { return []complex128{2 / z, -2 / (z * z), 4 / (z * z * z)} }},
		{"x*x - x/x", func(z complex128) []complex128 { return []complex128{z*z - 1, 2 * z, 2} }},
		{"-x + 0.0", func(z complex128) []complex128 { return []complex128{-z, -1, 0} }},
		{"(2+i)*(3-pi)/(1+1)^0.5*2^i - -(1) + sin(2) + 3^2 + x", func(z complex128) []complex128 {
			return []complex128{c + 1 + cmplx.Sin(2) + 9 + z, 1, 0}
		}},
	} {
		f := bind(t, test.src, nil)
		for _, z := range testPoints {
			want := test.derivs(z)
			if got := f.Eval(z); !cscalar.EqualWithinAbsOrRel(got, want[0], 1e-14, 1e-14) {
				t.Errorf("%s at %v = %v, want %v", test.src, z, got, want[0])
			}
			got := f.Taylor(z, len(want)-1).Derivs()
			for k := range want {
				if !cscalar.EqualWithinAbsOrRel(got[k], want[k], 1e-14, 1e-14) {
					t.Errorf("%s: derivative %d at %v = %v, want %v", test.src, k, z, got[k], want[k])
				}
			}
		}
	}
	if s := bind(t, "x + 1", nil).(interface{ String() string }).String(); s != "x + 1" {
		t.Errorf("bound function String() = %q, want %q", s, "x + 1")
	}
}

func TestBindMissing(t *testing.T) {
	t.Parallel()
	e, err := Parse("E - V0*x + a", []string{"E", "V0", "a"})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := e.Bind(map[string]complex128{"E": 1, "a": 1}); err == nil || err.Error() != `parameter "V0" has no value` {
		t.Errorf("Bind without V0: %v", err)
	}
	if _, err := e.Bind(nil); err == nil || err.Error() != `parameters "E", "V0", "a" have no value` {
		t.Errorf("Bind without values: %v", err)
	}
	if _, err := e.Bind(map[string]complex128{"E": 1, "V0": 2, "a": 3, "unused": 4}); err != nil {
		t.Errorf("Bind with an extra value: %v", err)
	}
}

// expSinRat returns the Taylor coefficients of exp(sin h) at h = 0 up to
// order n in exact rational arithmetic, by composing the series
// sin h = Σ (-1)^k h^(2k+1)/(2k+1)! and exp u = Σ u^m/m! (u has no constant
// term, so u^m starts at h^m and m ≤ n suffices).
func expSinRat(n int) []*big.Rat {
	mul := func(a, b []*big.Rat) []*big.Rat {
		c := make([]*big.Rat, n+1)
		for k := range c {
			c[k] = new(big.Rat)
			for j := 0; j <= k; j++ {
				c[k].Add(c[k], new(big.Rat).Mul(a[j], b[k-j]))
			}
		}
		return c
	}
	fact := func(k int) *big.Int { return new(big.Int).MulRange(1, int64(max(k, 1))) }
	sin := make([]*big.Rat, n+1)
	for k := range sin {
		sin[k] = new(big.Rat)
		if k%2 == 1 {
			sin[k].SetFrac(big.NewInt(1), fact(k))
			if k%4 == 3 {
				sin[k].Neg(sin[k])
			}
		}
	}
	sum := make([]*big.Rat, n+1)
	pow := make([]*big.Rat, n+1) // u^m
	for k := range sum {
		sum[k], pow[k] = new(big.Rat), new(big.Rat)
	}
	pow[0].SetInt64(1)
	for m := 0; m <= n; m++ {
		inv := new(big.Rat).SetFrac(big.NewInt(1), fact(m))
		for k := range sum {
			sum[k].Add(sum[k], new(big.Rat).Mul(pow[k], inv))
		}
		pow = mul(pow, sin)
	}
	return sum
}

func TestTaylorExpSinAtZero(t *testing.T) {
	t.Parallel()
	const n = 12
	want := expSinRat(n)
	// Cross-check of the composition: the first coefficients of exp(sin x),
	// typed from memory (e.g.f. numerators 1, 1, 1, 0, -3, -8, -3, 56, 217,
	// 64, -2951, OEIS A002017, divided by k!).
	memory := []string{"1", "1", "1/2", "0", "-1/8", "-1/15", "-1/240", "1/90", "31/5760", "1/5670", "-2951/3628800"}
	for k, s := range memory {
		r, _ := new(big.Rat).SetString(s)
		if r.Cmp(want[k]) != 0 {
			t.Errorf("exact coefficient %d of exp(sin x) = %s, want %s", k, want[k].RatString(), s)
		}
	}
	got := bind(t, "exp(sin(x))", nil).Taylor(0, n)
	for k := range got {
		w, _ := want[k].Float64()
		if !cscalar.EqualWithinAbsOrRel(got[k], complex(w, 0), 1e-16, 1e-14) {
			t.Errorf("exp(sin(x)) coefficient %d at 0 = %v, want %v (%s)", k, got[k], w, want[k].RatString())
		}
	}
}

// polyMul returns the product of two polynomials truncated to len(a).
func polyMul(a, b []complex128) []complex128 {
	c := make([]complex128, len(a))
	for i := range a {
		for j := 0; i+j < len(c); j++ {
			c[i+j] += a[i] * b[j]
		}
	}
	return c
}

func TestTaylorExpSinComplex(t *testing.T) {
	t.Parallel()
	// exp(sin(z0 + h)) = exp(sin z0)·exp(u), u = sin z0 (cos h - 1) + cos z0 sin h,
	// with the series of cos h and sin h from their definitions and exp(u)
	// summed as Σ u^m/m! by polynomial products: a route independent of the
	// recurrences of package jet.
	const n = 10
	f := bind(t, "exp(sin(x))", nil)
	for _, z0 := range testPoints {
		u := make([]complex128, n+1)
		fact := 1.0
		for k := 1; k <= n; k++ {
			fact *= float64(k)
			switch k % 4 {
			case 1:
				u[k] = cmplx.Cos(z0) / complex(fact, 0)
			case 2:
				u[k] = -cmplx.Sin(z0) / complex(fact, 0)
			case 3:
				u[k] = -cmplx.Cos(z0) / complex(fact, 0)
			case 0:
				u[k] = cmplx.Sin(z0) / complex(fact, 0)
			}
		}
		want := make([]complex128, n+1)
		pow := make([]complex128, n+1)
		pow[0] = 1
		mfact := 1.0
		for m := 0; m <= n; m++ {
			if m > 0 {
				mfact *= float64(m)
			}
			for k := range want {
				want[k] += pow[k] / complex(mfact, 0)
			}
			pow = polyMul(pow, u)
		}
		scale := cmplx.Exp(cmplx.Sin(z0))
		got := f.Taylor(z0, n)
		for k := range got {
			w := scale * want[k]
			if !cscalar.EqualWithinAbsOrRel(got[k], w, 1e-14*cmplx.Abs(scale), 1e-12) {
				t.Errorf("exp(sin(x)) coefficient %d at %v = %v, want %v", k, z0, got[k], w)
			}
		}
	}
}

func TestTaylorClosedForms(t *testing.T) {
	t.Parallel()
	// Closed-form derivatives, derived by hand:
	//  f = sech²z, S = sech z, T = tanh z, S′ = -ST, T′ = S²:
	//   f′ = -2S²T, f″ = S²(6T² - 2), f‴ = S²(16T - 24T³).
	//  f = √(1+z²) = r: f′ = z/r, f″ = 1/r³, f‴ = -3z/r⁵, f⁗ = (12z² - 3)/r⁷.
	//  f = z^z: f′ = z^z(log z + 1), f″ = z^z((log z + 1)² + 1/z).
	//  f = 2^z: f⁽ᵏ⁾ = (ln 2)ᵏ 2^z.
	//  f = tan z: f′ = sec²z, f″ = 2 sec²z tan z.
	//  f = log(z): f⁽ᵏ⁾ = (-1)^(k-1)(k-1)!/zᵏ.
	for _, test := range []struct {
		src    string
		derivs func(z complex128) []complex128
	}{
		{"1/cosh(x)^2", func(z complex128) []complex128 {
			s := 1 / cmplx.Cosh(z)
			s2, tt := s*s, cmplx.Tanh(z)
			return []complex128{s2, -2 * s2 * tt, s2 * (6*tt*tt - 2), s2 * (16*tt - 24*tt*tt*tt)}
		}},
		{"sech(x)^2", func(z complex128) []complex128 {
			s := 1 / cmplx.Cosh(z)
			s2, tt := s*s, cmplx.Tanh(z)
			return []complex128{s2, -2 * s2 * tt, s2 * (6*tt*tt - 2), s2 * (16*tt - 24*tt*tt*tt)}
		}},
		{"sqrt(1+x^2)", func(z complex128) []complex128 {
			r := cmplx.Sqrt(1 + z*z)
			return []complex128{r, z / r, 1 / (r * r * r), -3 * z / cmplx.Pow(r, 5), (12*z*z - 3) / cmplx.Pow(r, 7)}
		}},
		{"(1+x^2)^0.5", func(z complex128) []complex128 {
			r := cmplx.Sqrt(1 + z*z)
			return []complex128{r, z / r, 1 / (r * r * r), -3 * z / cmplx.Pow(r, 5), (12*z*z - 3) / cmplx.Pow(r, 7)}
		}},
		{"x^x", func(z complex128) []complex128 {
			p, l := cmplx.Pow(z, z), cmplx.Log(z)+1
			return []complex128{p, p * l, p * (l*l + 1/z)}
		}},
		{"2^x", func(z complex128) []complex128 {
			p := cmplx.Exp(z * math.Ln2)
			return []complex128{p, math.Ln2 * p, math.Ln2 * math.Ln2 * p}
		}},
		{"tan(x)", func(z complex128) []complex128 {
			s := 1 / cmplx.Cos(z)
			return []complex128{cmplx.Tan(z), s * s, 2 * s * s * cmplx.Tan(z)}
		}},
		{"log(x)", func(z complex128) []complex128 {
			return []complex128{cmplx.Log(z), 1 / z, -1 / (z * z), 2 / (z * z * z), -6 / (z * z * z * z)}
		}},
	} {
		f := bind(t, test.src, nil)
		for _, z := range testPoints {
			want := test.derivs(z)
			got := f.Taylor(z, len(want)-1).Derivs()
			for k := range want {
				if !cscalar.EqualWithinAbsOrRel(got[k], want[k], 1e-13, 1e-12) {
					t.Errorf("%s: derivative %d at %v = %v, want %v", test.src, k, z, got[k], want[k])
				}
			}
		}
	}
}

func TestTaylorExactAtZero(t *testing.T) {
	t.Parallel()
	// Integer powers go through repeated multiplication, so the jets of
	// polynomials are exact where the base vanishes; == is the property
	// tested here. x^n with n = 3 bound later must behave the same.
	for _, src := range []string{"x^3", "x^n", "x^(6/2)", "x*x*x"} {
		f := bind(t, src, map[string]complex128{"n": 3})
		got := f.Taylor(0, 6)
		want := jet.Series{0, 0, 0, 1, 0, 0, 0}
		for k := range want {
			if got[k] != want[k] {
				t.Errorf("%s: coefficient %d at 0 = %v, want %v", src, k, got[k], want[k])
			}
		}
		if v := f.Eval(0); v != 0 {
			t.Errorf("%s at 0 = %v, want 0", src, v)
		}
	}
	// x^-2 is a pole at 0, and x^0.5 a branch point: their coefficients are
	// not finite there, but Taylor must not panic.
	for _, src := range []string{"x^-2", "x^0.5", "sqrt(x)", "x^x"} {
		if s := bind(t, src, nil).Taylor(0, 3); s.IsFinite() {
			t.Errorf("%s: Taylor at 0 = %v, want non-finite coefficients", src, s)
		}
	}
}

func TestConcurrent(t *testing.T) {
	t.Parallel()
	f := bind(t, "2*(E - V0/cosh(x)^2) + x^x", map[string]complex128{"E": 1, "V0": 2})
	z := complex(0.4, 0.3)
	want, wantS := f.Eval(z), f.Taylor(z, 6)
	var wg sync.WaitGroup
	for range 4 {
		wg.Go(func() {
			for range 200 {
				if got := f.Eval(z); got != want {
					t.Errorf("concurrent Eval = %v, want %v", got, want)
					return
				}
				s := f.Taylor(z, 6)
				for k := range s {
					if s[k] != wantS[k] {
						t.Errorf("concurrent Taylor[%d] = %v, want %v", k, s[k], wantS[k])
						return
					}
				}
			}
		})
	}
	wg.Wait()
}

func TestPowInt(t *testing.T) {
	t.Parallel()
	// Reference: cmplx.Pow on the same integer exponents.
	for _, w := range testPoints {
		for _, n := range []int{-7, -2, -1, 0, 1, 2, 3, 10, 33} {
			got, want := powInt(w, n), cmplx.Pow(w, complex(float64(n), 0))
			if !cscalar.EqualWithinAbsOrRel(got, want, 1e-300, 1e-13) {
				t.Errorf("powInt(%v, %d) = %v, want %v", w, n, got, want)
			}
		}
	}
	if !scalar.EqualWithinAbsOrRel(real(powInt(2, 10)), 1024, 0, 0) {
		t.Errorf("powInt(2, 10) = %v, want 1024", powInt(2, 10))
	}
}
