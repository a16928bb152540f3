package levels

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// quadTol is the relative tolerance of the real-axis and loop quadratures.
const quadTol = 1e-12

// maxQuadNodes bounds the Gauss–Legendre rules.
const maxQuadNodes = 2048

// firstOrder returns λ∫_a^b √Q dx and its energy derivative
// λ∫_a^b m/√Q dx = T/(2ħ), T the classical period, on the interval [a, b]
// (soft or hard ends). With x = c − h cos α the square-root endpoint
// singularities of soft ends become smooth (√Q ∝ sin α there), so
// Gauss–Legendre in α converges geometrically for every kind of end.
func firstOrder(w wkb.Well, E float64, a, b end) (phase, dphase, errPhase float64, err error) {
	q := w.Problem(E).Q
	c, h := (a.x+b.x)/2, (b.x-a.x)/2
	m := w.Mass
	f := func(t float64, _ bool, out []complex128) bool {
		s, co := math.Sincos(t)
		x := c - h*co
		qq := real(q.Eval(complex(x, 0)))
		if qq < 0 {
			qq = 0 // rounding next to a turning point
		}
		r := math.Sqrt(qq)
		out[0] = complex(r*h*s, 0)
		if r > 0 {
			out[1] = complex(m*h*s/r, 0)
		} else {
			out[1] = 0
		}
		return !math.IsNaN(r)
	}
	// The derivative only scales error estimates and the period: 1e-9.
	val, ch, _, _, def := integrate(f, 2, 0, math.Pi, []float64{quadTol, 1e-9}, maxQuadNodes)
	if !def {
		return 0, 0, 0, errors.New("levels: potential not finite inside the allowed interval")
	}
	lam := 1 / w.Hbar
	phase, dphase = lam*real(val[0]), lam*real(val[1])
	errPhase = lam * ch[0]
	// Only the phase must converge: next to a barrier top the period grows
	// logarithmically and its integrand is nearly singular.
	if !(ch[0] <= 1e-8*math.Abs(real(val[0]))+1e-300) {
		return phase, dphase, errPhase, fmt.Errorf("levels: phase integral did not converge at E = %g (change %.3g)", E, errPhase)
	}
	return phase, dphase, errPhase, nil
}

// series returns the terms λ^(1−2k)σ_{2k}, k = 0…kmax, of the phase at E on
// [a, b] and their quadrature errors, by the method that fits the ends (see
// the package comment).
func series(w wkb.Well, E float64, a, b end, kmax int, ps *wkb.PhaseSettings, hint *radiusHint) (terms, errs []float64, status wkb.Status, err error) {
	p := w.Problem(E)
	switch {
	case !a.wall && !b.wall:
		if hint != nil && hint.split {
			return pairSplit(p, a.x, b.x, kmax)
		}
		r, err := pairPhase(p, complex(a.x, 0), complex(b.x, 0), 2*kmax, ps, hint)
		if err != nil {
			// No ellipse about the pair serves: split it into two loops.
			t, e, st, serr := pairSplit(p, a.x, b.x, kmax)
			if serr != nil {
				return nil, nil, 0, fmt.Errorf("%w; split loops: %v", err, serr)
			}
			if hint != nil {
				hint.fails++
				hint.split = hint.fails >= 2
			}
			return t, e, st, nil
		}
		terms = make([]float64, kmax+1)
		errs = make([]float64, kmax+1)
		for k := range terms {
			terms[k] = real(r.Terms[k])
			errs[k] = r.TermErr[k] + math.Abs(imag(r.Terms[k]))
		}
		st := r.Status
		if st == wkb.LeastTerm {
			st = wkb.Success // the least term is chosen by the caller
		}
		if r.Status.Err() != nil {
			// The ellipse fell short of its tolerance: the split loops
			// replace it where their quadrature errors are smaller.
			if t, e, sst, serr := pairSplit(p, a.x, b.x, kmax); serr == nil && sumErr(e) < sumErr(errs) {
				return t, e, sst, nil
			}
		}
		return terms, errs, st, nil
	case a.wall && b.wall:
		return wallWall(p, a.x, b.x, kmax)
	case a.wall:
		return wallSoft(p, a.x, b.x, kmax, -1)
	default:
		return wallSoft(p, b.x, a.x, kmax, +1)
	}
}

// radiusHint remembers the contour radius PairPhase chose for a pair of
// turning points, to skip its probe at nearby energies, and how often no
// ellipse served (the split loops of pairSplit did): after two such
// failures the pair is split without trying an ellipse, which costs the
// most when it fails; nil means none.
type radiusHint struct {
	r     float64
	fails int
	split bool
}

// pairPhase is wkb.PairPhase with the radius taken from and stored in hint;
// a fixed radius that fails (the turning points moved too far) is retried
// with the automatic choice.
func pairPhase(p wkb.Problem, t1, t2 complex128, order int, ps *wkb.PhaseSettings, hint *radiusHint) (*wkb.PhaseSeries, error) {
	if hint == nil {
		return wkb.PairPhase(p, t1, t2, order, ps)
	}
	var set wkb.PhaseSettings
	if ps != nil {
		set = *ps
	}
	if hint.r > 1 && set.Radius == 0 {
		set.Radius = hint.r
		r, err := wkb.PairPhase(p, t1, t2, order, &set)
		if err == nil && r.Status.Err() == nil {
			return r, nil
		}
		set.Radius = 0
	}
	r, err := wkb.PairPhase(p, t1, t2, order, &set)
	if err == nil && r.Status.Err() == nil {
		hint.r = r.Radius
	}
	return r, err
}

// riccatiNode evaluates φ_{2k}/i · dx at x with dx = dxdt, continuing √Q
// from branch; it returns the root used.
func riccatiNode(p wkb.Problem, x, dxdt, branch complex128, kmax int, out []complex128) (complex128, bool) {
	n := 2 * kmax
	q := p.Q.Taylor(x, n)
	var q1 jet.Series
	if p.Q1 != nil {
		q1 = p.Q1.Taylor(x, n)
	}
	if len(q) != n+1 || !q.IsFinite() || q[0] == 0 || (q1 != nil && (len(q1) != n+1 || !q1.IsFinite())) {
		return 0, false
	}
	phi := wkb.Riccati(q, q1, branch, n)
	for k := 0; k <= kmax; k++ {
		out[k] = phi[2*k][0] / 1i * dxdt
	}
	return phi[0][0] / 1i, true
}

// wallWall integrates φ_{2k}/i along the real axis between two walls, Q > 0
// throughout (ψ = Im exp∫φ vanishes at both ends when the even part of the
// phase, Σλ^(1−2k)∫φ_{2k}/i, is a multiple of π).
func wallWall(p wkb.Problem, a, b float64, kmax int) ([]float64, []float64, wkb.Status, error) {
	c, h := (a+b)/2, (b-a)/2
	f := func(t float64, _ bool, out []complex128) bool {
		s, co := math.Sincos(t)
		_, ok := riccatiNode(p, complex(c-h*co, 0), complex(h*s, 0), 1, kmax, out)
		return ok
	}
	val, ch, _, ok, def := integrate(f, kmax+1, 0, math.Pi, []float64{quadTol}, maxQuadNodes)
	if !def {
		return nil, nil, 0, errors.New("levels: Q vanishes or is singular between the walls")
	}
	return scaleTerms(p.Lambda, val, ch, 1, ok)
}

// wallSoft computes the terms for a wall at xw and a soft turning point at
// s as half a loop integral: x = s + (xw − s)ζ², ζ = cos α + iδ sin α from
// ζ = 1 (the wall, √Q > 0) to ζ = −1 (the wall on the other sheet) about
// ζ = 0 (the turning point). The loop integral is −2 × the finite part of
// ∫_{xw}^{s}; sign converts it to the integral from the left end to the
// right end. Two values of δ check that no singularity lies inside the loop.
func wallSoft(p wkb.Problem, xw, s float64, kmax int, sign float64) ([]float64, []float64, wkb.Status, error) {
	d := complex(xw-s, 0)
	var res [2][]complex128
	var chs [2][]float64
	allOK := true
	for i, delta := range []float64{0.5, 0.3} {
		var branch complex128
		f := func(t float64, first bool, out []complex128) bool {
			sn, co := math.Sincos(t)
			zeta := complex(co, delta*sn)
			dz := complex(-sn, delta*co)
			x := complex(s, 0) + d*zeta*zeta
			if first {
				branch = 1 // √Q > 0 at the wall
			}
			b, ok := riccatiNode(p, x, 2*d*zeta*dz, branch, kmax, out)
			branch = b
			return ok
		}
		val, ch, _, ok, def := integrate(f, kmax+1, 0, math.Pi, []float64{quadTol}, maxQuadNodes)
		if !def {
			return nil, nil, 0, errors.New("levels: Q singular on the loop about the turning point next to the wall")
		}
		allOK = allOK && ok
		res[i], chs[i] = val, ch
	}
	// The loop runs from ζ = 1 to ζ = −1, i.e. −(loop from −1 to 1): so the
	// finite part of ∫_{xw}^{s} is +(1/2)∮ here, and ∫_left^right is
	// −sign·(1/2)∮ with sign = −1 for a left wall.
	for k := range res[0] {
		chs[0][k] = math.Max(chs[0][k], cmplx.Abs(res[0][k]-res[1][k]))
	}
	return scaleTerms(p.Lambda, res[0], chs[0], -sign*0.5, allOK)
}

func scaleTerms(lambda float64, val []complex128, ch []float64, f float64, ok bool) ([]float64, []float64, wkb.Status, error) {
	terms := make([]float64, len(val))
	errs := make([]float64, len(val))
	for k := range val {
		lp := math.Pow(lambda, float64(1-2*k))
		terms[k] = f * lp * real(val[k])
		errs[k] = math.Abs(f) * lp * (ch[k] + math.Abs(imag(val[k])))
	}
	st := wkb.Success
	if !ok {
		st = wkb.NodeLimit
	}
	return terms, errs, st, nil
}

// pairSplit is the closed-contour series of two soft ends t1 < t2 computed
// without one contour about both: the finite part of ∫_{t1}^{t2} φ_{2k}/i
// is additive, so it is split as
//
//	FP∫_{t1}^{m1} + ∫_{m1}^{m2} + FP∫_{m2}^{t2},
//
// the outer pieces half loops about each turning point as for a wall
// (wallSoft, with the loop starting at m1 or m2 instead of a wall) and the
// middle one a real-axis integral as between two walls (wallWall). Each
// loop is shrunk, halving its reach ρ = |m − t| from (t2 − t1)/2, until Q
// winds exactly once about it for both loop widths, i.e. no other zero or
// pole of Q lies inside, and the two widths agree; this serves where a pole
// sits close outside the pair (the centrifugal pole at r = 0 beside the
// inner turning point of a high Coulomb level), which no ellipse about the
// pair can avoid without passing too close to the turning points.
func pairSplit(p wkb.Problem, t1, t2 float64, kmax int) ([]float64, []float64, wkb.Status, error) {
	return pairSplitFrom(p, t1, t2, kmax, (t2-t1)/2)
}

// pairSplitFrom is pairSplit with the first reach half ≤ (t2 − t1)/2.
func pairSplitFrom(p wkb.Problem, t1, t2 float64, kmax int, half float64) ([]float64, []float64, wkb.Status, error) {
	loop := func(t, dir float64) (float64, []float64, []float64, wkb.Status, error) {
		rho := half
		var lastErr error
		for it := 0; it < 10; it++ {
			m := t + dir*rho
			if loopWinding(p, t, m-t) {
				terms, errs, st, err := wallSoft(p, m, t, kmax, dir)
				if err == nil && resolvedLow(terms, errs) {
					return m, terms, errs, st, nil
				}
				if err != nil {
					lastErr = err
				}
			}
			rho /= 2
		}
		if lastErr == nil {
			lastErr = errors.New("levels: no loop about the turning point excludes the other singularities")
		}
		return 0, nil, nil, 0, lastErr
	}
	m1, ta, ea, sa, err := loop(t1, +1)
	if err != nil {
		return nil, nil, 0, err
	}
	m2, tb, eb, sb, err := loop(t2, -1)
	if err != nil {
		return nil, nil, 0, err
	}
	terms := make([]float64, kmax+1)
	errs := make([]float64, kmax+1)
	for k := range terms {
		terms[k] = ta[k] + tb[k]
		errs[k] = ea[k] + eb[k]
	}
	st := wkb.Success
	if sa != wkb.Success || sb != wkb.Success {
		st = wkb.NodeLimit
	}
	if m2 > m1 {
		tm, em, sm, err := wallWall(p, m1, m2, kmax)
		if err != nil {
			return nil, nil, 0, err
		}
		for k := range terms {
			terms[k] += tm[k]
			errs[k] += em[k]
		}
		if sm != wkb.Success {
			st = sm
		}
	}
	return terms, errs, st, nil
}

func sumErr(e []float64) float64 {
	var s float64
	for _, v := range e {
		s += v
	}
	return s
}

// resolvedLow reports whether the order-0 and order-2 terms of a loop are
// resolved (quadrature error below a millionth of their size): a loop that
// passes too near a singularity fails it.
func resolvedLow(terms, errs []float64) bool {
	for k := 0; k < min(2, len(terms)); k++ {
		if !(errs[k] <= 1e-6*math.Abs(terms[k])) {
			return false
		}
	}
	return true
}

// loopWinding reports whether Q winds exactly once about the loops
// x = t + d ζ², ζ = cos α + iδ sin α, α ∈ [0, π], of both widths δ used by
// wallSoft: only the turning point t lies inside.
func loopWinding(p wkb.Problem, t, d float64) bool {
	const n = 512
	for _, delta := range []float64{0.5, 0.3} {
		var wind float64
		prev := p.Q.Eval(complex(t+d, 0))
		for j := 1; j <= n; j++ {
			sn, co := math.Sincos(math.Pi * float64(j) / n)
			zeta := complex(co, delta*sn)
			q := p.Q.Eval(complex(t, 0) + complex(d, 0)*zeta*zeta)
			dp := cmplx.Phase(q / prev)
			if cmplx.IsNaN(q) || cmplx.IsInf(q) || math.Abs(dp) > math.Pi/2 {
				return false
			}
			wind += dp
			prev = q
		}
		if math.Round(wind/(2*math.Pi)) != 1 {
			return false
		}
	}
	return true
}
