package direct

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

const (
	jumpOrder   = 4  // higher-order terms p_2 … p_2M kept in the waves of a WKB jump
	jumpSeries  = 16 // degree of the Taylor series of p and γ over a jump
	jumpMinRad  = 60 // a jump must span at least this many radians of phase to pay off
	jumpMaxGrow = 200.0
	// jumpRadius is the largest jump, as a fraction of the radius of
	// convergence of the jets of K² at its start: beyond that radius the
	// local data say nothing about K², however flat they look.
	jumpRadius = 0.5
	// jumpSamples is the number of points along a jump at which K² is
	// evaluated and compared with its Taylor series from the start (the
	// last one is the landing point), so that a feature of an entire K²
	// that is invisible in the jets at the start (a Gaussian far away,
	// whose coefficients underflow) cannot be stepped over.
	jumpSamples = 16
)

// wkbJump tries to carry (y, y′) from z over a distance of up to hmax in
// direction dir (|dir| = 1) in one step, by the higher-order WKB waves
// v± = √(λ/p) exp(±i∫p), p = K + p₂ + … + p_2M (M = jumpOrder), taken as
// exact. In that basis the coefficients c± of y = c₊v₊ + c₋v₋ obey the
// amplitude equations of integrateSigma with the defect
//
//	δ = K² − p² + p^½(p^(−½))″ = −2Kc − c² + ¾(p′/p)² − ½ p″/p,   c = p − K,
//
// (formed from c, without the cancellation of K² − p²), so over the jump
// they change by at most ∫|γ|, γ = δ/(2p) = O(λ^(−2M−1)). The jump is taken
// when the majorant Σ|γ_j| h^(j+1)/(j+1) of that integral is below tol;
// otherwise (near turning points, or at small λ) ok is false and the caller
// takes an ordinary Taylor step. The cost of a jump does not depend on the
// number of wavelengths it spans, which is what removes the growth of the
// cost with λ from the real-axis method away from turning points.
func wkbJump(p wkb.Problem, z, dir complex128, hmax float64, y, dy complex128, r *run) (h float64, yn, dyn complex128, ok bool) {
	ho, ok := newHOSeries(p, z, 0, false, hmax)
	if !ok {
		return 0, y, dy, false
	}
	pw, dp, gamma := ho.p, ho.dp, ho.gamma
	pn := trunc(pw, jumpSeries)
	// Along the path parameter t: coefficients times dir^j.
	pt := make([]complex128, len(pw))
	d := complex(1, 0)
	for j := range pw {
		pt[j] = pw[j] * d
		d *= dir
	}
	p0 := pw[0]
	h = stepFor(pt, cmplx.Abs(p0), r.tol, ho.limit(hmax, r))
	// y′/y = ±ip − p′/(2p) needs p′ to tol·|p|².
	h = stepFor(alongPath(dp, dir), cmplx.Abs(p0*p0), r.tol, h)
	if ip := math.Abs(imag(p0)); ip*h > jumpMaxGrow {
		h = jumpMaxGrow / ip // keep e^(±i∫p) far from overflow
	}
	bound := func(h float64) float64 { return math.Max(0, majorant(gamma, h)-ho.noise*h) }
	for i := 0; bound(h) > r.tol; i++ {
		if i == 20 {
			return 0, y, dy, false
		}
		h /= 2
	}
	h = ho.sampled(p, z, dir, h, r.tol)
	if cmplx.Abs(p0)*h < jumpMinRad {
		return 0, y, dy, false
	}
	// Decompose at z: c± = W(y, v∓)·(∓1)/W(v₊, v₋), W(v₊, v₋) = −2iλ.
	lam := complex(p.Lambda, 0)
	v0 := cmplx.Sqrt(lam / p0)
	lg0 := dp[0] / (2 * p0)
	dvp := (1i*p0 - lg0) * v0
	dvm := (-1i*p0 - lg0) * v0
	w := -2i * lam
	cp := (y*dvm - dy*v0) / w
	cm := (v0*dy - dvp*y) / w
	// Phase Φ = ∫p and ln p at the end of the jump, from the series.
	delt := dir * complex(h, 0)
	ph := make([]complex128, len(pw)+1)
	for j, v := range pw {
		ph[j+1] = v / complex(float64(j+1), 0)
	}
	Phi, _ := horner(ph, delt)
	l1 := jet.Log(pn)
	l1[0] = 0
	lnRatio, _ := horner(l1, delt) // ln(p(Δ)/p0)
	p1, _ := horner(pw, delt)
	dp1, _ := horner(dp, delt)
	amp := v0 * cmplx.Exp(-0.5*lnRatio) // √(λ/p) continued along the jump
	ep, em := cmplx.Exp(1i*Phi), cmplx.Exp(-1i*Phi)
	lg1 := dp1 / (2 * p1)
	yn = amp * (cp*ep + cm*em)
	dyn = amp * (cp*(1i*p1-lg1)*ep + cm*(-1i*p1-lg1)*em)
	if !finite(yn) || !finite(dyn) {
		return 0, y, dy, false
	}
	// Rounding: the exponentials carry an absolute phase error ε|Φ|.
	kappa := cmplx.Abs(p1)
	ns1 := cmplx.Abs(yn) + cmplx.Abs(dyn)/kappa
	big := cmplx.Abs(amp) * (cmplx.Abs(cp*ep) + cmplx.Abs(cm*em)) * 2
	rr := (eps*(4+cmplx.Abs(Phi)) + ho.noise*h) * big / ns1
	r.round += rr
	r.lastErr = bound(h)
	r.phase += math.Abs(real(Phi))
	r.track(ns1)
	yn, dyn = rescale(yn, dyn, ns1, r)
	return h, yn, dyn, true
}

// hoSeries holds the Taylor series at a point of the higher-order wave
// number p = K + c (c = p₂ + … + p_2M) and of the defect γ of its waves.
type hoSeries struct {
	K, c, p jet.Series // order jumpSeries+2
	dp      jet.Series // order jumpSeries+1
	gamma   jet.Series // order jumpSeries
	k2      jet.Series // K² itself, order 2·jumpOrder+2+jumpSeries
	radius  float64    // radius of convergence of the jets of K² at the start (zeros and poles)
	// noise bounds the rounding of γ: δ is a sum of O(1) terms that cancel
	// to O(λ^(−2M)), so |γ| computed below noise says only that the true γ
	// is no larger than about that.
	noise float64
}

// newHOSeries expands p and γ at z. If flip is set the branch −√(K²) is
// used (sign continuity along a path is the caller's business, against
// prev). It reports false when the expansion is not finite or a jump of
// length hmax could not span jumpMinRad radians.
func newHOSeries(p wkb.Problem, z complex128, prev complex128, havePrev bool, hmax float64) (hoSeries, bool) {
	const M, ns = jumpOrder, jumpSeries
	L := 2*M + 2 + ns
	k2 := kSquared(p, z, L)
	sk := jet.Sqrt(k2)
	if havePrev && cmplx.Abs(sk[0]-prev) > cmplx.Abs(sk[0]+prev) {
		sk = jet.Neg(sk)
	}
	if cmplx.Abs(sk[0])*hmax < jumpMinRad || sk[0] == 0 {
		return hoSeries{}, false
	}
	phi := riccati(sk, 2*M)
	o := ns + 2
	c := make(jet.Series, o+1)
	for m := 1; m <= M; m++ {
		for j := range c {
			c[j] += phi[2*m][j] / 1i
		}
	}
	K := trunc(sk, o)
	pw := jet.Add(K, c)
	if !pw.IsFinite() {
		return hoSeries{}, false
	}
	dp := deriv(pw)
	ddp := deriv(dp)
	pn, dpn, cn, Kn := trunc(pw, ns), trunc(dp, ns), trunc(c, ns), trunc(K, ns)
	lp := jet.Div(dpn, pn)
	delta := jet.Sub(jet.Scale(-2, jet.Mul(Kn, cn)), jet.Mul(cn, cn))
	delta = jet.Add(delta, jet.Scale(0.75, jet.Mul(lp, lp)))
	delta = jet.Sub(delta, jet.Scale(0.5, jet.Div(ddp, pn)))
	gamma := jet.Div(delta, jet.Scale(2, pn))
	if !gamma.IsFinite() {
		return hoSeries{}, false
	}
	noise := 8 * eps * (2*cmplx.Abs(Kn[0]*cn[0]) + cmplx.Abs(cn[0]*cn[0]) +
		0.75*cmplx.Abs(lp[0]*lp[0]) + 0.5*cmplx.Abs(ddp[0]/pn[0])) / (2 * cmplx.Abs(pn[0]))
	rad := radius(jet.Div(deriv(k2), trunc(k2, L-1)))
	return hoSeries{K: K, c: c, p: pw, dp: dp, gamma: gamma, k2: k2, radius: rad, noise: noise}, true
}

// limit caps the length of a jump: at jumpRadius of the radius of
// convergence of the jets at its start (the local information is valid no
// further) and at the cap of the run.
func (ho *hoSeries) limit(h float64, r *run) float64 {
	h = math.Min(h, jumpRadius*ho.radius)
	if r.jumpCap > 0 {
		h = math.Min(h, r.jumpCap)
	}
	return h
}

// sampled re-checks a jump of length h against K² evaluated at
// jumpSamples points along it (see alongCheck).
func (ho *hoSeries) sampled(p wkb.Problem, z, dir complex128, h, tol float64) float64 {
	return alongCheck(p, z, dir, ho.k2, h, tol, jumpSamples)
}

// alongCheck re-checks a step of length h from z in direction dir against
// K² evaluated at n points along it and (K²)′ at the landing point: the
// step is valid only as far as k2, the Taylor series of K² at z, predicts
// them to within tol (relative to the size of the terms, at least 1e-14
// for the rounding of the evaluation). It returns the length up to the
// last point that passed, rechecking a shortened step a few times.
func alongCheck(p wkb.Problem, z, dir complex128, k2 jet.Series, h, tol float64, n int) float64 {
	tol = math.Max(10*tol, 1e-14)
	d1 := deriv(k2)
	for iter := 0; iter < 3; iter++ {
		fail := 0
		for j := 1; j <= n; j++ {
			t := dir * complex(h*float64(j)/float64(n), 0)
			m := 0
			if j == n {
				m = 1
			}
			got := kSquared(p, z+t, m)
			want, big := horner(k2, t)
			scale := cmplx.Abs(got[0]) + big
			ok := finite(got[0]) && cmplx.Abs(got[0]-want) <= tol*scale
			if ok && m == 1 {
				dw, dbig := horner(d1, t)
				ds := cmplx.Abs(got[1]) + dbig + scale/h
				ok = finite(got[1]) && cmplx.Abs(got[1]-dw) <= tol*ds
			}
			if !ok {
				fail = j
				break
			}
		}
		if fail == 0 {
			return h
		}
		h *= math.Max(float64(fail-1), 0.5) / float64(n)
	}
	return h
}

// majorant returns Σ |γ_j| h^(j+1)/(j+1), a bound of ∫_0^h |γ| along any
// direction within the disc of convergence.
func majorant(gamma jet.Series, h float64) float64 {
	var s, hp float64 = 0, h
	for j, g := range gamma {
		s += cmplx.Abs(g) * hp / float64(j+1)
		hp *= h
	}
	return s
}

// integral returns the coefficients of ∫_0^Δ f.
func integral(f jet.Series) jet.Series {
	g := make(jet.Series, len(f)+1)
	for j, v := range f {
		g[j+1] = v / complex(float64(j+1), 0)
	}
	return g
}

// sigmaJump is the WKB jump of the complex-path method: it carries the
// state of integrateSigma from z over up to hmax in direction dir in one
// step. The first-order amplitudes (1, σ) are converted at z to those of
// the higher-order waves, (A, B) = toHigher(1, σ); there the ratio
// σ_p = B/A only turns with the phase, σ_p ← σ_p e^(−2iΦ), Φ = ∫p, up to
// the neglected ∫γ(1+σ_p)², bounded by the majorant of γ; at the end they
// are converted back, (f₊, f₋) = toFirst(1, σ_p), σ = f₋/f₊. The incident
// coefficient follows from α₊ = c₊e^(iS): ℓ ← ℓ + i∫c + ln A + ln f₊.
// The jump is taken when the neglected change is below tol relative to σ
// (and tol absolutely in ℓ).
func sigmaJump(p wkb.Problem, z, dir complex128, hmax float64, st *sigmaState, r *run) (float64, bool) {
	ho, ok := newHOSeries(p, z, st.sqPrev, st.havePrev, hmax)
	if !ok {
		return 0, false
	}
	K0, p0 := ho.K[0], ho.p[0]
	pt := make([]complex128, len(ho.p))
	d := complex(1, 0)
	for j := range ho.p {
		pt[j] = ho.p[j] * d
		d *= dir
	}
	h := stepFor(pt, cmplx.Abs(p0), r.tol, ho.limit(hmax, r))
	// The conversions at the far end need c = p − K and c′ to relative
	// accuracy (they carry the local, adiabatic part of σ), which in a
	// tail where c ∝ e^(−x/w) limits the jump far more than p does.
	dK := deriv(ho.K)
	dc := deriv(ho.c)
	h = stepFor(alongPath(ho.c, dir), math.Max(cmplx.Abs(ho.c[0]), tiny), r.tol, h)
	h = stepFor(alongPath(dc, dir), math.Max(cmplx.Abs(dc[0]), tiny), r.tol, h)
	grow := math.Abs(imag(dir * p0)) // |d Im Φ/dt|
	if 2*grow*h > jumpMaxGrow {
		h = jumpMaxGrow / (2 * grow)
	}
	e0 := endWave{k: K0, dk: dK[0], c: ho.c[0], dc: dc[0]}
	A0, B0 := e0.toHigher(1, st.sigma)
	sp := B0 / A0
	scale := math.Max(cmplx.Abs(st.sigma), cmplx.Abs(sp))
	if scale == 0 {
		scale = math.SmallestNonzeroFloat64
	}
	// Weighted budget: an error reaches a times e^(−2 Im S), and Im S
	// changes by at most grow·h within the jump.
	budget := func(h float64) float64 {
		return math.Max(scale, r.rRef*math.Exp(2*(imag(st.S)-grow*h)))
	}
	u := 1 + cmplx.Abs(sp)
	// The part of the majorant at the rounding level of γ is not an error
	// of the jump: the Taylor steps see rounding of the same size in their
	// first-order γ. It is booked as rounding below, with the weight with
	// which it reaches a.
	excess := func(h float64) float64 { return math.Max(0, majorant(ho.gamma, h)-ho.noise*h) }
	for i := 0; ; i++ {
		m := excess(h)
		if m*u*u*math.Exp(2*grow*h) <= r.tol*budget(h) && m*u <= r.tol {
			break
		}
		if i == 20 {
			return 0, false
		}
		h /= 2
	}
	h = ho.sampled(p, z, dir, h, r.tol)
	if cmplx.Abs(p0)*h < jumpMinRad {
		return 0, false
	}
	delt := dir * complex(h, 0)
	phiP, _ := horner(integral(ho.p), delt)
	phiC, _ := horner(integral(ho.c), delt)
	phiK, _ := horner(integral(ho.K), delt)
	sp1 := sp * cmplx.Exp(-2i*phiP)
	K1, _ := horner(ho.K, delt)
	dK1, _ := horner(dK, delt)
	c1, _ := horner(ho.c, delt)
	dc1, _ := horner(dc, delt)
	e1 := endWave{k: K1, dk: dK1, c: c1, dc: dc1}
	fp, fm := e1.toFirst(1, sp1)
	s1 := fm / fp
	ell := st.ell + 1i*phiC + cmplx.Log(A0) + cmplx.Log(fp)
	S := st.S + phiK
	if !finite(s1) || !finite(ell) || !finite(S) {
		return 0, false
	}
	// Rounding: the conversions (cancellation of the adiabatic parts, of
	// size |c/K|) and the phase error ε|Φ| of e^(−2iΦ), weighted as in
	// integrateSigma.
	wt := math.Max(math.Exp(-2*imag(st.S)), math.Exp(-2*imag(S)))
	rr := eps*(4*(cmplx.Abs(st.sigma)+cmplx.Abs(s1)+cmplx.Abs(ho.c[0]/K0))+2*cmplx.Abs(phiP)*cmplx.Abs(sp1))*wt +
		ho.noise*h*u*u*math.Exp(2*grow*h)*wt
	r.round += rr
	r.lastErr = excess(h) * u * u / budget(h)
	r.phase += math.Abs(real(phiP))
	st.sigma, st.ell, st.S = s1, ell, S
	st.sqPrev, st.havePrev = K1, true
	st.maxSigma = math.Max(st.maxSigma, cmplx.Abs(s1))
	if v := imag(S); v > st.maxImS {
		st.maxImS, st.kAtMax = v, cmplx.Abs(K1)
	}
	return h, true
}

// tiny is a floor for scales of relative error control.
const tiny = 1e-300

// alongPath returns the coefficients of f(z + dir·t) in t.
func alongPath(f jet.Series, dir complex128) []complex128 {
	g := make([]complex128, len(f))
	d := complex(1, 0)
	for j := range f {
		g[j] = f[j] * d
		d *= dir
	}
	return g
}
