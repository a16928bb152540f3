package formula

import (
	"math"
	"math/cmplx"
	"sort"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// function is a one-argument analytic function of the language, with its value
// on complex numbers and on series.
type function struct {
	name   string
	eval   func(complex128) complex128
	series func(jet.Series) jet.Series
}

// functions are the functions the language knows. Each is analytic apart
// from isolated poles (tan, sech, …) and the branch cuts of log and sqrt,
// which lie where their argument is negative real (principal branch).
//
// The quotient functions (tan, tanh, cot, coth, sec, sech, csc, csch) are
// evaluated without forming the overflowing sin, cos, sinh and cosh of a
// large argument, on series too: tanh(800) is 1 and sech(800) is 0, not NaN.
var functions = map[string]*function{
	"sin":  {"sin", cmplx.Sin, jet.Sin},
	"cos":  {"cos", cmplx.Cos, jet.Cos},
	"tan":  {"tan", tan, tanSeries},
	"cot":  {"cot", cot, cotSeries},
	"sec":  {"sec", sec, func(a jet.Series) jet.Series { return reciprocal(a, sec(a[0]), 1, tanSeries(a)) }},
	"csc":  {"csc", csc, func(a jet.Series) jet.Series { return reciprocal(a, csc(a[0]), -1, cotSeries(a)) }},
	"sinh": {"sinh", cmplx.Sinh, jet.Sinh},
	"cosh": {"cosh", cmplx.Cosh, jet.Cosh},
	"tanh": {"tanh", tanh, tanhSeries},
	"coth": {"coth", coth, cothSeries},
	"sech": {"sech", sech, func(a jet.Series) jet.Series { return reciprocal(a, sech(a[0]), -1, tanhSeries(a)) }},
	"csch": {"csch", csch, func(a jet.Series) jet.Series { return reciprocal(a, csch(a[0]), -1, cothSeries(a)) }},
	"exp":  {"exp", cmplx.Exp, jet.Exp},
	"log":  {"log", cmplx.Log, jet.Log},
	"sqrt": {"sqrt", cmplx.Sqrt, sqrtSeries},
}

// tan returns tan z. Past |Im z| = 20, where cmplx.Tan forms the
// overflowing sinh and cosh of 2 Im z, tan z = ±i(1 - q)/(1 + q) with
// q = exp(±2iz) tiny is exact to rounding.
func tan(z complex128) complex128 {
	switch y := imag(z); {
	case y > 20:
		q := cmplx.Exp(2i * z)
		return 1i * (1 - q) / (1 + q)
	case y < -20:
		q := cmplx.Exp(-2i * z)
		return -1i * (1 - q) / (1 + q)
	}
	return cmplx.Tan(z)
}

// tanh returns tanh z = -i tan(iz). cmplx.Tanh is not used: besides the
// overflow, it loses accuracy near its poles iπ(k+½), where the denominator
// cosh 2x + cos 2y cancels; cmplx.Tan sums that denominator as a series.
func tanh(z complex128) complex128 { return -1i * tan(1i*z) }

// cot returns cot z, from cmplx.Cot (which avoids the cancellation near its
// poles) or, past |Im z| = 20, 1/tan z.
func cot(z complex128) complex128 {
	if math.Abs(imag(z)) > 20 {
		return 1 / tan(z)
	}
	return cmplx.Cot(z)
}

// coth returns coth z = i cot(iz).
func coth(z complex128) complex128 { return 1i * cot(1i*z) }

func sec(z complex128) complex128 { return 1 / cmplx.Cos(z) }
func csc(z complex128) complex128 { return 1 / cmplx.Sin(z) }

// sech returns 1/cosh z; past |Re z| = 20 through exp(−|Re z|), which does
// not overflow (nearer the axis 1/cmplx.Cosh keeps its accuracy by the
// poles iπ(k+½), where 1 + exp(−2z) would cancel).
func sech(z complex128) complex128 {
	if math.Abs(real(z)) <= 20 {
		return 1 / cmplx.Cosh(z)
	}
	if real(z) < 0 {
		z = -z
	}
	e := cmplx.Exp(-z)
	return 2 * e / (1 + e*e)
}

// csch returns 1/sinh z, likewise.
func csch(z complex128) complex128 {
	if math.Abs(real(z)) <= 20 {
		return 1 / cmplx.Sinh(z)
	}
	if real(z) < 0 {
		return -csch(-z)
	}
	e := cmplx.Exp(-z)
	return 2 * e / (1 - e*e)
}

// The derivatives of tan, cot, tanh and coth are given by the Riccati
// equations f′ = α + βf²; at the expansion point the value α + βf0² is
// passed as sec², −csc², sech², −csch² computed directly, because forming
// 1 − tanh² by subtraction loses every digit where tanh is within rounding
// of ±1 (|Re z| ≳ 18), while sech² there is tiny but exact.
func tanSeries(a jet.Series) jet.Series {
	s := sec(a[0])
	return riccati(a, tan(a[0]), s*s, 1, 1)
}

func cotSeries(a jet.Series) jet.Series {
	s := csc(a[0])
	return riccati(a, cot(a[0]), -s*s, -1, -1)
}

func tanhSeries(a jet.Series) jet.Series {
	s := sech(a[0])
	return riccati(a, tanh(a[0]), s*s, 1, -1)
}

func cothSeries(a jet.Series) jet.Series {
	s := csch(a[0])
	return riccati(a, coth(a[0]), -s*s, 1, -1)
}

// riccati returns the series of f∘a where f′ = α + βf² and f(a₀) = f0: tan
// (α = β = 1), tanh and coth (α = 1, β = -1), cot (α = β = -1). From
// (f∘a)′ = a′·w, w = α + β(f∘a)², comparing coefficients of h^(k-1):
//
//	k f_k = Σ_{j=1..k} j a_j w_{k-j},  w_m = α δ_{m0} + β Σ_{i=0..m} f_i f_{m-i}.
//
// Unlike sin/cos, it stays finite where f is bounded but sin and cos overflow.
func riccati(a jet.Series, f0, w0, alpha, beta complex128) jet.Series {
	f := make(jet.Series, len(a))
	w := make(jet.Series, len(a))
	f[0] = f0
	w[0] = w0 // α + βf0², passed in computed without cancellation
	for k := 1; k < len(a); k++ {
		var sum complex128
		for j := 1; j <= k; j++ {
			sum += complex(float64(j), 0) * a[j] * w[k-j]
		}
		f[k] = sum / complex(float64(k), 0)
		var sq complex128
		for i := 0; i <= k; i++ {
			sq += f[i] * f[k-i]
		}
		w[k] = beta * sq
	}
	return f
}

// reciprocal returns the series of f∘a where f′ = σ f g and f(a₀) = f0, g∘a
// given: sech (σ = -1, g = tanh), csch (σ = -1, g = coth), sec (σ = 1,
// g = tan), csc (σ = -1, g = cot). From (f∘a)′ = σ a′ p, p = (f∘a)(g∘a):
//
//	k f_k = σ Σ_{j=1..k} j a_j p_{k-j},  p_m = Σ_{i=0..m} f_i g_{m-i}.
func reciprocal(a jet.Series, f0, sigma complex128, g jet.Series) jet.Series {
	f := make(jet.Series, len(a))
	p := make(jet.Series, len(a))
	f[0] = f0
	p[0] = f0 * g[0]
	for k := 1; k < len(a); k++ {
		var sum complex128
		for j := 1; j <= k; j++ {
			sum += complex(float64(j), 0) * a[j] * p[k-j]
		}
		f[k] = sigma * sum / complex(float64(k), 0)
		var q complex128
		for i := 0; i <= k; i++ {
			q += f[i] * g[k-i]
		}
		p[k] = q
	}
	return f
}

// nonAnalytic are names users may expect that cannot be supported, because Q
// must be evaluated in the complex plane.
var nonAnalytic = map[string]bool{
	"abs": true, "sign": true, "sgn": true, "step": true, "heaviside": true, "theta": true,
	"min": true, "max": true, "floor": true, "ceil": true, "round": true, "trunc": true,
	"mod": true, "re": true, "im": true, "real": true, "imag": true, "conj": true, "arg": true,
}

// aliases map function names of other notations to the language's own.
var aliases = map[string]string{"ln": "log"}

// Functions returns the names of the functions a formula may call, sorted.
func Functions() []string {
	names := make([]string, 0, len(functions))
	for name := range functions {
		names = append(names, name)
	}
	sort.Strings(names)
	return names
}

// sqrtSeries returns the principal square root of a, with its value from
// cmplx.Sqrt so that it agrees with Eval to the last bit.
func sqrtSeries(a jet.Series) jet.Series {
	s := jet.Sqrt(a)
	s[0] = cmplx.Sqrt(a[0])
	return s
}
