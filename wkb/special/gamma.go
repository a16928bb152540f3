package special

import (
	"math"
	"math/big"
	"math/cmplx"
)

// The Stirling series is summed directly once |w| ≥ stirlingShift or
// Re w ≥ stirlingShiftRe; smaller arguments are shifted up by the recurrence
// first. The remainder after the k-th term is bounded by the next term times
// sec^{2k+2}(arg w / 2) (DLMF 5.11.2 with Olver's bound); with 17 terms that
// is below 1e-19 in both regions (|arg w| ≤ 58° in the second), and the
// smaller shift in the second region halves the rounding error of the
// recurrence near the real axis.
const (
	stirlingShift   = 15
	stirlingShiftRe = 8
)

// maxBernoulli is the number of even Bernoulli numbers B₂ … B₃₄ kept.
const maxBernoulli = 17

// bernoulli[k] = B_{2k+2} as float64, computed once from the exact recurrence
// Σ_{j=0}^{m} C(m+1, j) B_j = 0 in rational arithmetic so that no constant
// has to be typed in.
var bernoulli = bernoulliEven(maxBernoulli)

// stirling[k] = B_{2k+2}/((2k+2)(2k+1)), the coefficients of the Stirling
// series lnΓ(w) ~ (w−½)ln w − w + ½ln 2π + Σ stirling[k] w^{−(2k+1)}
// (DLMF 5.11.1).
var stirling = func() []float64 {
	c := make([]float64, len(bernoulli))
	for k, b := range bernoulli {
		n := float64(2*k + 2)
		c[k] = b / (n * (n - 1))
	}
	return c
}()

// bernoulliEven returns B₂, B₄, …, B_{2n}.
func bernoulliEven(n int) []float64 {
	m := 2 * n
	b := make([]*big.Rat, m+1)
	b[0] = big.NewRat(1, 1)
	for j := 1; j <= m; j++ {
		// B_j = −1/(j+1) Σ_{i<j} C(j+1, i) B_i.
		s := new(big.Rat)
		for i := 0; i < j; i++ {
			c := new(big.Rat).SetInt(new(big.Int).Binomial(int64(j+1), int64(i)))
			s.Add(s, c.Mul(c, b[i]))
		}
		b[j] = s.Mul(s, big.NewRat(-1, int64(j+1)))
	}
	out := make([]float64, n)
	for k := range out {
		out[k], _ = b[2*k+2].Float64()
	}
	return out
}

var (
	halfLog2Pi = 0.5 * math.Log(2*math.Pi)
	logPi      = math.Log(math.Pi)
)

// LogGamma returns the principal branch of ln Γ(z): the function analytic in
// the plane cut along the non-positive real axis that is real on the
// positive real axis, so that its imaginary part is continuous there (it is
// not the principal logarithm of Γ(z)). On the cut the value is the limit
// from above; LogGamma(conj(z)) = conj(LogGamma(z)) off the cut. At the poles
// z = 0, −1, −2, … it returns +Inf.
//
// For Re z ≥ ½ the argument is shifted by the recurrence
//
//	ln Γ(z) = ln Γ(z+n) − Σ_{k<n} ln(z+k)
//
// (principal logarithms, which keeps the branch) until |z+n| ≥ 15 or
// Re(z+n) ≥ 8, where the Stirling series (DLMF 5.11.1) is summed to rounding.
// On the real axis the real part is math.Lgamma. For Re z < ½ the
// reflection formula Γ(z)Γ(1−z) = π/sin πz (DLMF 5.5.3) is used with a
// logarithm of sin πz that is continuous in the upper half plane. The
// absolute error is below about 1e-14·max(1, |ln Γ(z)|) off the real axis
// (rounding in the recurrence), so Gamma has a relative error of that size.
func LogGamma(z complex128) complex128 {
	if cmplx.IsNaN(z) {
		return cmplx.NaN()
	}
	if imag(z) < 0 {
		return cmplx.Conj(LogGamma(cmplx.Conj(z)))
	}
	x := real(z)
	if imag(z) == 0 {
		return logGammaReal(x)
	}
	if x < 0.5 {
		return complex(logPi, 0) - LogGamma(1-z) - logSinPi(z)
	}
	return logGammaRight(z)
}

// logGammaReal returns ln Γ(x + i0): math.Lgamma for the real part, and for
// x < 0 the imaginary part −kπ, k the number of poles in [x, 0), since each
// pole passed above on the way from the positive axis turns arg Γ by −π.
func logGammaReal(x float64) complex128 {
	if x <= 0 && x == math.Floor(x) {
		return complex(math.Inf(1), 0)
	}
	lg, _ := math.Lgamma(x)
	if x > 0 {
		return complex(lg, 0)
	}
	return complex(lg, -math.Pi*math.Ceil(-x))
}

// logSinPi returns a logarithm of sin πz for Im z ≥ 0, continuous in the
// closed upper half plane and zero at z = ½:
//
//	sin πz = (i/2) e^{−iπz} (1 − e^{2πiz}),
//
// where |e^{2πiz}| ≤ 1, so the principal logarithm of the last factor is
// continuous away from the zeros of sin πz.
func logSinPi(z complex128) complex128 {
	u := cmplx.Exp(complex(0, 2*math.Pi) * z)
	return complex(-math.Ln2, math.Pi/2) - complex(0, math.Pi)*z + cmplx.Log(1-u)
}

// logGammaRight evaluates ln Γ(z) for Re z ≥ ½.
func logGammaRight(z complex128) complex128 {
	w := z
	var shift complex128
	if cmplx.Abs(w) < stirlingShift && real(w) < stirlingShiftRe {
		// ln Π(z+k) = ln|Π(z+k)| + i Σ arg(z+k): the sum of principal
		// arguments is the continuous branch since every z+k lies in
		// the right half plane.
		p := complex(1, 0)
		var arg float64
		for cmplx.Abs(w) < stirlingShift && real(w) < stirlingShiftRe {
			p *= w
			arg += cmplx.Phase(w)
			w++
		}
		shift = complex(math.Log(cmplx.Abs(p)), arg)
	}
	return stirlingSeries(w) - shift
}

// stirlingSeries sums the Stirling series of ln Γ(w) for w in the region
// described at stirlingShift.
func stirlingSeries(w complex128) complex128 {
	s := (w-0.5)*cmplx.Log(w) - w + complex(halfLog2Pi, 0)
	inv := 1 / w
	inv2 := inv * inv
	p := inv
	for _, c := range stirling {
		t := complex(c, 0) * p
		s += t
		if cmplx.Abs(t) < 1e-18*cmplx.Abs(s) {
			break
		}
		p *= inv2
	}
	return s
}

// Gamma returns Γ(z). On the real axis it is math.Gamma; elsewhere
// exp(LogGamma(z)), with a relative error of about 1e-15·max(1, |ln Γ(z)|).
// At the poles z = 0, −1, −2, … it returns complex infinity.
func Gamma(z complex128) complex128 {
	if imag(z) == 0 {
		x := real(z)
		if x <= 0 && x == math.Floor(x) {
			return cmplx.Inf()
		}
		return complex(math.Gamma(x), 0)
	}
	return cmplx.Exp(LogGamma(z))
}
