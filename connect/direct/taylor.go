package direct

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// order is the degree of the Taylor polynomials of every step. With a
// relative local tolerance near 1e-14 a step of order 30 spans about four
// radians of oscillation (the step is (tol·30!)^(1/30) ≈ 4.1 over the local
// wave number), and its cost, quadratic in the order, stays small; higher
// orders gain little step length per unit of work.
const order = 30

// stepSamples is the number of points along a Taylor step at which K² is
// compared with its series (see alongCheck).
const stepSamples = 4

// stepRadians bounds the phase spanned by a Taylor step of the complex-path
// method.
const stepRadians = 8

// run holds the bookkeeping of one integration.
type run struct {
	method   string
	tol      float64
	maxSteps int
	steps    int
	lastErr  float64 // local error estimate of the last step, relative
	round    float64 // accumulated rounding estimate (summed linearly: a bound, not a random walk)
	logScale float64 // ln of the factor divided out of y by rescaling
	jumps    bool    // try WKB jumps (real-axis method)
	jumped   int     // WKB jumps taken
	skip     int     // Taylor steps to take before the next jump attempt
	rRef     float64 // complex path: |r| scale for the weighted absolute error budget
	backoff  int     // current back-off length
	jumpCap  float64 // largest jump length (0: none beyond the local limits)
	phase    float64 // phase ∫|Re K| covered so far, a measure of the cost of a run without jumps
	logMax   float64 // largest ln(|y| + |y′|/κ) met, scaling included (real axis)
	logEnd   float64 // its value at the end of the last step
}

// track records the size m of (y, y′) after a step, before rescaling.
func (r *run) track(m float64) {
	l := math.Log(m) + r.logScale
	if r.steps == 0 || l > r.logMax {
		r.logMax = l
	}
	r.logEnd = l
}

func (r *run) fail(st Status, z complex128) error {
	return &ConvergenceError{Status: st, Method: r.method, Steps: r.steps, At: z, Residual: r.lastErr}
}

// stepFor returns the largest h ≤ hmax with |c_j| h^j ≤ tol·scale for the
// last two coefficients j = n−1, n of c, times a safety factor. Using two
// coefficients guards against one of them vanishing by accident (a series
// even or odd in h).
func stepFor(c []complex128, scale, tol, hmax float64) float64 {
	n := len(c) - 1
	h := hmax
	for j := n - 1; j <= n; j++ {
		m := cmplx.Abs(c[j])
		if m == 0 {
			continue
		}
		if hj := 0.7 * math.Pow(tol*scale/m, 1/float64(j)); hj < h {
			h = hj
		}
	}
	return h
}

// horner evaluates Σ c_j d^j and returns also max_j |c_j| |d|^j, the size of
// the largest term, which sets the rounding error of the sum.
func horner(c []complex128, d complex128) (v complex128, maxTerm float64) {
	ad := cmplx.Abs(d)
	p := 1.0
	for j := range c {
		if t := cmplx.Abs(c[j]) * p; t > maxTerm {
			maxTerm = t
		}
		p *= ad
	}
	for j := len(c) - 1; j >= 0; j-- {
		v = v*d + c[j]
	}
	return v, maxTerm
}

func finite(z complex128) bool {
	return !cmplx.IsNaN(z) && !cmplx.IsInf(z)
}

// integrateY advances (y, y′) of y″ + (λ²Q + Q1) y = 0 along the straight
// segment z0 → z1 by Taylor steps. With K² = λ²Q + Q1 = Σ K_j Δ^j at the
// step origin and y = Σ y_j Δ^j, the equation gives
//
//	y_(j+2) = −Σ_{l=0}^{j} K_l y_(j−l) / ((j+1)(j+2)).
//
// The step makes the last two terms of y and of y′ smaller than tol times
// |y| + |y′|/κ, κ = |K_0|^½ (relative control, so exponentially growing and
// oscillating solutions are both followed to the same relative accuracy).
func integrateY(p wkb.Problem, z0, z1 complex128, y, dy complex128, r *run) (complex128, complex128, error) {
	length := cmplx.Abs(z1 - z0)
	if length == 0 {
		return y, dy, nil
	}
	dir := (z1 - z0) / complex(length, 0)
	ys := make([]complex128, order+1)
	dys := make([]complex128, order)
	s := 0.0
	for s < length {
		z := z0 + dir*complex(s, 0)
		if r.steps >= r.maxSteps {
			return y, dy, r.fail(StepLimit, z)
		}
		if r.jumps && r.skip == 0 {
			if h, yn, dyn, ok := wkbJump(p, z, dir, length-s, y, dy, r); ok {
				y, dy = yn, dyn
				s += h
				r.steps++
				r.jumped++
				r.backoff = 0
				continue
			}
			// A failed attempt costs a few Taylor steps: back off
			// exponentially (1, 2, 4, … 64 steps) before trying again.
			r.backoff = min(max(2*r.backoff, 1), 64)
			r.skip = r.backoff
		}
		if r.skip > 0 {
			r.skip--
		}
		K := kSquared(p, z, order)
		ys[0], ys[1] = y, dy
		for j := 0; j <= order-2; j++ {
			var sum complex128
			for l := 0; l <= j; l++ {
				sum += K[l] * ys[j-l]
			}
			ys[j+2] = -sum / complex(float64((j+1)*(j+2)), 0)
		}
		for j := range dys {
			dys[j] = complex(float64(j+1), 0) * ys[j+1] // y′ = dy/dz
		}
		// Coefficients along the path parameter t, z = z0 + dir·t.
		dj := complex(1, 0)
		for j := range ys {
			ys[j] *= dj
			if j < len(dys) {
				dys[j] *= dj
			}
			dj *= dir
		}
		kappa := math.Max(math.Sqrt(cmplx.Abs(K[0])), 1/length)
		scale := cmplx.Abs(y) + cmplx.Abs(dy)/kappa
		rem := length - s
		// The step is valid within the radius of convergence of the jets
		// of K² only, however flat they look (a tanh tail far out).
		h := stepFor(ys, scale, r.tol, math.Min(rem, jumpRadius*radius(K)))
		h = stepFor(dys, scale*kappa, r.tol, h)
		h = alongCheck(p, z, dir, K, h, r.tol, stepSamples)
		if h < 1e-12*length && h < rem {
			return y, dy, r.fail(StepUnderflow, z)
		}
		if rem-h < 1e-12*length {
			h = rem
		}
		hc := complex(h, 0)
		yn, m1 := horner(ys, hc)
		dyn, m2 := horner(dys, hc)
		if !finite(yn) || !finite(dyn) {
			return y, dy, r.fail(NonFinite, z)
		}
		ns := cmplx.Abs(yn) + cmplx.Abs(dyn)/kappa
		e := cmplx.Abs(ys[order])*math.Pow(h, order) + cmplx.Abs(ys[order-1])*math.Pow(h, order-1)
		r.lastErr = e / ns
		rr := eps * (m1 + m2/kappa) / ns
		r.round += rr
		r.track(ns)
		y, dy = rescale(yn, dyn, ns, r)
		r.phase += math.Sqrt(cmplx.Abs(K[0])) * h
		s += h
		r.steps++
	}
	return y, dy, nil
}

// rescale divides (y, y′) by their size m when it leaves [1e-150, 1e150]
// and adds ln m to r.logScale: the equation is linear, and tunnelling
// through a wide barrier must not overflow.
func rescale(y, dy complex128, m float64, r *run) (complex128, complex128) {
	if m <= 1e150 && m >= 1e-150 || m == 0 {
		return y, dy
	}
	f := complex(1/m, 0)
	r.logScale += math.Log(m)
	return y * f, dy * f
}

// eps is the unit roundoff of float64.
const eps = 0x1p-53

// sigmaState is the state of the complex-path integration: σ = α₋/α₊ the
// ratio of the local reflected to incident first-order amplitude, ℓ = ∫ iγ(1+σ)
// the logarithm of the incident coefficient, S = ∫ k the phase, both from b.
type sigmaState struct {
	sigma, ell, S complex128
	sqPrev        complex128 // √Q predicted at the current point by the previous step
	havePrev      bool
	maxSigma      float64 // largest |σ| met
	maxImS        float64 // largest Im S met (S from b)
	kAtMax        float64 // |k| where Im S was largest
}

// integrateSigma advances the state along the segment z0 → z1.
//
// Derivation. Write y = c₊u₊ + c₋u₋ with u± = √(λ/k) e^(±iS), k = K =
// √(λ²Q + Q1), S = ∫k, and require y′ = c₊u₊′ + c₋u₋′ (exact derivatives of
// the waves). The waves solve u″ + (k² − k^½(k^(−½))″) u = 0, so the
// equation y″ + K²y = 0 leaves the defect
//
//	δ = K² − k² + k^½(k^(−½))″ = (K²)^¼ ((K²)^(−¼))″ = ℓ²/16 − ℓ′/4,   ℓ = (K²)′/K²,
//
// (the Q1 term sits in K²; with k = λ√Q instead it would appear as the
// extra term Q1 in δ). Variation of constants with W(u₊, u₋) = −2iλ gives
// the exact coupled amplitude equations
//
//	c₊′ =  iγ (c₊ + c₋ e^(−2iS)),   c₋′ = −iγ (c₋ + c₊ e^(2iS)),   γ = δ/(2k),
//
// whose coupling is O(1/λ), unlike the O(1) term k′/(2k) of the Bremmer
// form that keeps y′ = ik(c₊u₊ − c₋u₋). For the local amplitude ratio
// σ = c₋e^(−iS)/(c₊e^(iS)) they give
//
//	σ′ = −2ikσ − iγ (1+σ)²,   (ln c₊)′ = iγ (1+σ).
//
// Integrated from b towards a, the homogeneous factor of σ is e^(2i(S(x)−S(a)))
// at a, of modulus e^(−2 Im S(x)): on a path raised into the upper half plane
// an error made at x reaches a multiplied by that small number, so the
// exponentially small reflection is computed to relative accuracy.
// All coefficients are Taylor series in z − z0 from the jets of K²; the
// branch of K is continued from step to step.
func integrateSigma(p wkb.Problem, z0, z1 complex128, st *sigmaState, r *run) error {
	length := cmplx.Abs(z1 - z0)
	if length == 0 {
		return nil
	}
	dir := (z1 - z0) / complex(length, 0)
	n := order
	sg := make([]complex128, n+1) // σ coefficients
	w := make([]complex128, n+1)  // (1+σ)² coefficients
	el := make([]complex128, n+1) // ℓ coefficients
	ph := make([]complex128, n+1) // S coefficients
	s := 0.0
	hPrev := length / 16
	for s < length {
		z := z0 + dir*complex(s, 0)
		if r.steps >= r.maxSteps {
			return r.fail(StepLimit, z)
		}
		if r.jumps && r.skip == 0 {
			if h, ok := sigmaJump(p, z, dir, length-s, st, r); ok {
				s += h
				r.steps++
				r.jumped++
				r.backoff = 0
				continue
			}
			r.backoff = min(max(2*r.backoff, 1), 64)
			r.skip = r.backoff
		}
		if r.skip > 0 {
			r.skip--
		}
		q := kSquared(p, z, n+2)
		sq := jet.Sqrt(q)
		if st.havePrev && cmplx.Abs(sq[0]-st.sqPrev) > cmplx.Abs(sq[0]+st.sqPrev) {
			sq = jet.Neg(sq)
		}
		k := append(jet.Series(nil), sq[:n+1]...) // scaled below; sq is kept for the branch
		lq := jet.Div(deriv(q), trunc(q, n+1))
		dlq := deriv(lq)
		lqn := trunc(lq, n)
		l2 := jet.Mul(lqn, lqn)
		delta := make(jet.Series, n+1)
		for j := range delta {
			delta[j] = l2[j]/16 - dlq[j]/4
		}
		g := jet.Div(delta, jet.Scale(2, k))
		// Change to the path parameter t, z = z0 + dir·t: dσ/dt = dir·dσ/dz.
		dj := dir
		for j := 0; j <= n; j++ {
			k[j] *= dj
			g[j] *= dj
			dj *= dir
		}
		// Coefficient recursion (Cauchy products, σ_j known up to j).
		sg[0], el[0], ph[0] = st.sigma, st.ell, st.S
		for j := 0; j < n; j++ {
			// w_j = δ_j0 + 2σ_j + Σ σ_l σ_(j−l)
			var sq2 complex128
			for l := 0; l <= j; l++ {
				sq2 += sg[l] * sg[j-l]
			}
			w[j] = 2*sg[j] + sq2
			if j == 0 {
				w[j]++
			}
			var ks, gw, gu complex128
			for l := 0; l <= j; l++ {
				ks += k[l] * sg[j-l]
				gw += g[l] * w[j-l]
				u := sg[j-l]
				if j == l {
					u++
				}
				gu += g[l] * u
			}
			f := complex(float64(j+1), 0)
			sg[j+1] = (-2i*ks - 1i*gw) / f
			el[j+1] = 1i * gu / f
			ph[j+1] = k[j] / f
		}
		rem := length - s
		h := stepFor(el[1:], 1, r.tol, rem)
		h = stepFor(ph[1:], 1+cmplx.Abs(ph[1])*h, r.tol, h)
		scale := math.Max(cmplx.Abs(sg[0]), cmplx.Abs(sg[1])*math.Min(h, hPrev))
		scale = math.Max(scale, r.rRef*math.Exp(2*imag(st.S)))
		// Below tiny σ has no digits to control (and tol·scale would
		// underflow to a zero step).
		scale = math.Max(scale, tiny)
		h = stepFor(sg, scale, r.tol, h)
		// Valid within the radius of the jets only, and as far as their
		// series predicts K² along the step.
		h = math.Min(h, jumpRadius*radius(q))
		// Where σ and γ vanish to rounding (K² flat) the series above set
		// no limit: keep to a few radians of phase, as the steps of
		// integrateY do, so that the samples below are dense enough.
		h = math.Min(h, stepRadians/cmplx.Abs(k[0]))
		h = alongCheck(p, z, dir, q, h, r.tol, stepSamples)
		if h < 1e-12*length && h < rem {
			return r.fail(StepUnderflow, z)
		}
		if rem-h < 1e-12*length {
			h = rem
		}
		hc := complex(h, 0)
		sn, mt := horner(sg, hc)
		en, _ := horner(el, hc)
		pn, _ := horner(ph, hc)
		if !finite(sn) || !finite(en) || !finite(pn) {
			return r.fail(NonFinite, z)
		}
		e := cmplx.Abs(sg[n])*math.Pow(h, float64(n)) + cmplx.Abs(sg[n-1])*math.Pow(h, float64(n-1))
		r.lastErr = e / scale
		// Rounding: of the Taylor sum and of γ (δ is a sum of terms that may
		// cancel), weighted by the factor e^(−2 Im S) with which an error
		// at z reaches a.
		wt := math.Exp(-2 * imag(st.S))
		gs := (cmplx.Abs(l2[0])/16 + cmplx.Abs(dlq[0])/4) / (2 * cmplx.Abs(k[0]))
		rr := eps * (mt + 4*gs*h) * wt
		r.round += rr
		st.maxSigma = math.Max(st.maxSigma, cmplx.Abs(st.sigma))
		if v := imag(st.S); v > st.maxImS {
			st.maxImS, st.kAtMax = v, cmplx.Abs(k[0])
		}
		st.sqPrev = sq.At(dir * hc)
		st.havePrev = true
		st.sigma, st.ell, st.S = sn, en, pn
		r.phase += cmplx.Abs(k[0]) * h
		hPrev = h
		s += h
		r.steps++
	}
	return nil
}

// phaseIntegral returns ∫_a^b K dx along the real axis by Taylor steps
// on the series of K = √(λ²Q + Q1), whose radius, not the wavelength, sets
// the step, so the cost does not grow with λ. Its imaginary part is exact
// (zero for real Q), unlike that of the phase accumulated along the raised
// path, whose rounding would otherwise spoil |t|.
func phaseIntegral(p wkb.Problem, a, b float64, r *run) (complex128, error) {
	length := b - a
	var S, prev complex128
	have := false
	x := a
	for x < b {
		z := complex(x, 0)
		if r.steps >= r.maxSteps {
			return S, r.fail(StepLimit, z)
		}
		q := kSquared(p, z, order)
		sk := jet.Sqrt(q)
		if have && cmplx.Abs(sk[0]-prev) > cmplx.Abs(sk[0]+prev) {
			sk = jet.Neg(sk)
		}
		// ∫_0^h K = Σ K_j h^(j+1)/(j+1): control the last two terms.
		c := make([]complex128, order+2)
		for j, v := range sk {
			c[j+1] = v / complex(float64(j+1), 0)
		}
		rem := b - x
		h := stepFor(sk, cmplx.Abs(sk[0]), r.tol, math.Min(rem, jumpRadius*radius(q)))
		h = alongCheck(p, z, 1, q, h, r.tol, stepSamples)
		if h < 1e-12*length && h < rem {
			return S, r.fail(StepUnderflow, z)
		}
		if rem-h < 1e-12*length {
			h = rem
		}
		v, _ := horner(c, complex(h, 0))
		if !finite(v) {
			return S, r.fail(NonFinite, z)
		}
		S += v
		prev, have = sk.At(complex(h, 0)), true
		x += h
		r.steps++
	}
	return S, nil
}
