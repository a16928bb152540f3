package direct

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// maxEndOrder bounds the number of higher-order terms λ^(1−2m) p_2m kept in
// the end waves.
const maxEndOrder = 6

// deriv returns the series of f′ from that of f; its order is one lower.
func deriv(s jet.Series) jet.Series {
	if len(s) < 2 {
		panic("direct: derivative of a series of order 0")
	}
	d := make(jet.Series, len(s)-1)
	for k := range d {
		d[k] = complex(float64(k+1), 0) * s[k+1]
	}
	return d
}

// trunc returns the first n+1 coefficients of s (s itself when it is no longer).
func trunc(s jet.Series, n int) jet.Series {
	if len(s) <= n+1 {
		return s
	}
	return s[:n+1]
}

// kSquared returns the Taylor coefficients of K² = λ²Q + Q1 at z.
func kSquared(p wkb.Problem, z complex128, n int) jet.Series {
	k2 := jet.Scale(complex(p.Lambda*p.Lambda, 0), p.Q.Taylor(z, n))
	if p.Q1 != nil {
		k2 = jet.Add(k2, p.Q1.Taylor(z, n))
	}
	return k2
}

// riccati returns φ_0 … φ_n of the Riccati series of φ = y′/y for
// y″ + K² y = 0, ordered by the number of derivatives (each φ_j is of
// order λ^(1−j) when K² = λ²Q + Q1 with λ large, so for Q1 = 0 this is the
// series in powers of 1/λ, and a Q1 that is constant near the ends is
// absorbed exactly). Substituting φ = Σ φ_j into φ′ + φ² + K² = 0 gives
//
//	φ_0 = iK,   2φ_0 φ_j = −φ′_(j−1) − Σ_{l=1}^{j−1} φ_l φ_(j−l).
//
// sk is the branch of K to use; φ_j comes out of order len(sk)−1−j. Terms
// of even j change sign with the branch, odd ones do not; the odd part of
// φ in the sense of ±iK is i·p with p = Σ_m φ_2m / i, and the odd terms
// sum to −p′/(2p), which makes the waves p^(−½) exp(±i∫p).
func riccati(sk jet.Series, n int) []jet.Series {
	phi := make([]jet.Series, n+1)
	phi[0] = jet.Scale(1i, sk)
	for j := 1; j <= n; j++ {
		o := len(sk) - 1 - j
		rhs := trunc(jet.Neg(deriv(phi[j-1])), o)
		for l := 1; l < j; l++ {
			rhs = jet.Sub(rhs, jet.Mul(trunc(phi[l], o), trunc(phi[j-l], o)))
		}
		phi[j] = jet.Div(rhs, jet.Scale(2, trunc(phi[0], o)))
	}
	return phi
}

// endWave holds the first-order and higher-order wave numbers at one end:
// k = K = √(λ²Q + Q1) and p = k + c, with c the kept higher-order terms,
// and their derivatives.
type endWave struct {
	x     float64
	k, dk complex128
	c, dc complex128
	terms []float64 // |p_2m(x)| = |φ_2m(x)|, m = 1 … maxEndOrder+1
	phi   []jet.Series
}

// setOrder keeps the terms m = 1 … M in c.
func (e *endWave) setOrder(M int) {
	e.c, e.dc = 0, 0
	for m := 1; m <= M; m++ {
		e.c += e.phi[2*m][0] / 1i
		e.dc += e.phi[2*m][1] / 1i
	}
}

// newEndWave evaluates the Riccati terms at the end point x.
func newEndWave(p wkb.Problem, x float64) endWave {
	n := 2*maxEndOrder + 2 // highest φ_j needed
	L := n + 1             // φ_n then has order 1 (value and derivative)
	sk := jet.Sqrt(kSquared(p, complex(x, 0), L))
	e := endWave{x: x, k: sk[0], dk: sk[1], phi: riccati(sk, n)}
	e.terms = make([]float64, maxEndOrder+1)
	for m := 1; m <= maxEndOrder+1; m++ {
		e.terms[m-1] = cmplx.Abs(e.phi[2*m][0])
	}
	return e
}

// endPair evaluates both ends and chooses the common order M of the end
// waves at the least term: the M ≤ maxEndOrder minimising the larger of the
// first omitted terms at a and b. It returns the ends and the truncation
// error of the reflection amplitude, Σ |first omitted term| / (2|k|) (a
// relative error ε of p mixes the waves by about ε/2).
func endPair(p wkb.Problem, a, b float64) (ea, eb endWave, M int, errRefl float64) {
	ea, eb = newEndWave(p, a), newEndWave(p, b)
	best := math.Inf(1)
	for m := 0; m <= maxEndOrder; m++ {
		t := math.Max(ea.terms[m], eb.terms[m])
		if t < best {
			best, M = t, m
		}
	}
	ea.setOrder(M)
	eb.setOrder(M)
	errRefl = ea.terms[M]/(2*cmplx.Abs(ea.k)) + eb.terms[M]/(2*cmplx.Abs(eb.k))
	return ea, eb, M, errRefl
}

// mixD returns ½ (ln(p/k))′ = ½ (c′k − ck′)/(k p), computed without
// cancellation.
func (e endWave) mixD() complex128 {
	p := e.k + e.c
	return 0.5 * (e.dc*e.k - e.c*e.dk) / (e.k * p)
}

// toHigher converts local first-order amplitudes (α₊, α₋) at the end, the
// coefficients of √(λ/k) exp(± i ∫_x k) with phase zero at the end, into the
// amplitudes (A, B) of the higher-order waves √(λ/p) exp(± i ∫_x p). With
// D = ½ (ln(p/k))′ and the Wronskian W(v₊, v₋) = −2iλ,
//
//	A = [α₊(−i(p+k) − D) + α₋(−ic − D)] / (−2i√(kp)),
//	B = [α₊(−ic + D) + α₋(−i(p+k) + D)] / (−2i√(kp)).
//
// The mixing terms c and D are formed directly, so a tiny B is not lost in
// the cancellation of two nearly equal wave numbers.
func (e endWave) toHigher(ap, am complex128) (A, B complex128) {
	k, c := e.k, e.c
	p := k + c
	D := e.mixD()
	den := -2i * k * cmplx.Sqrt(p/k) // √(kp) on the branch of k (p/k ≈ 1)
	A = (ap*(-1i*(p+k)-D) + am*(-1i*c-D)) / den
	B = (ap*(-1i*c+D) + am*(-1i*(p+k)+D)) / den
	return A, B
}

// toFirst is the inverse of toHigher (k and p exchange roles, so c and D
// change sign).
func (e endWave) toFirst(A, B complex128) (ap, am complex128) {
	k, c := e.k, e.c
	p := k + c
	D := e.mixD()
	den := -2i * k * cmplx.Sqrt(p/k)
	ap = (A*(-1i*(p+k)+D) + B*(1i*c+D)) / den
	am = (A*(1i*c-D) + B*(-1i*(p+k)-D)) / den
	return ap, am
}

// higherWave returns y and y′ at the end of the higher-order wave
// √(λ/p) exp(± i ∫_x p) (sign = ±1) with phase zero there.
func (e endWave) higherWave(lam float64, sign float64) (y, dy complex128) {
	p := e.k + e.c
	dp := e.dk + e.dc
	y = cmplx.Sqrt(complex(lam, 0) / p)
	dy = (complex(0, sign)*p - dp/(2*p)) * y
	return y, dy
}
