package connect

import (
	"fmt"
	"math"
	"math/cmplx"
)

// evaluation is the composed result at the orders chosen by optimal
// truncation, with its error estimates (before the effects of the pairs
// composed at leading order are added).
type evaluation struct {
	nInc, nPh         int // θ to order 2nInc, phases to order 2nPh
	r, t              complex128
	errR, errT, errPh float64
	warns             []string
}

// evaluate composes the elements of c at the orders of optimal truncation
// (at most 2N) and estimates the errors of R, T and the phases from the
// next two θ orders (K ≥ N+2 computed), the next phase order and the
// quadrature errors. Weak pairs (at leading order) do not take part in the
// truncation: their θ has no higher terms.
func (c composer) evaluate(N, K int) (*evaluation, error) {
	ev := &evaluation{nInc: N}
	// Optimal truncation: the least term τ_L of the corrections
	// τ_k = θ_{2k}, k ≥ 1 (θ₀ itself may vanish at a barrier top) is the
	// first one not larger than its successor; the sum stops before it, so
	// that it and the next one give the error estimate.
	for _, e := range c.elems {
		if e.weak {
			continue
		}
		L := len(e.thetaTerms) - 1
		for k := 1; k+1 < len(e.thetaTerms); k++ {
			// Terms at the level of rounding or quadrature error are a
			// converged series, not a least term.
			negl := 10*e.thetaQuad[k+1] + 1e-13*math.Max(1, math.Abs(e.thetaTerms[0]))
			if a := math.Abs(e.thetaTerms[k+1]); a >= math.Abs(e.thetaTerms[k]) && a > negl {
				L = k
				break
			}
		}
		if L-1 < ev.nInc {
			ev.nInc = max(L-1, 0)
			ev.warns = append(ev.warns, fmt.Sprintf("asymptotic series of θ at %.4g has its least term at order %d: the result is taken to order %d, and the least term makes its error estimate", e.b.Left, 2*L, 2*ev.nInc))
		}
	}
	nInc := ev.nInc
	// θ and the phases are taken to order 2·nInc (θ's least term); the
	// parabolic phases subtract the part of φ's series the finite parts
	// hold, cross terms with θ₂, θ₄, … included (phaseSeries).
	// The next phase order makes the phase error estimate.
	ev.nPh = nInc
	if c.terminal != nil {
		// The Airy terminal's reference (a finite part with no φ-type
		// correction) is derived to order 2 only: against Ai (TestTotalReflection)
		// its order-4 phase is worse than order 2.
		ev.nPh = min(nInc, 1)
	}
	nPh := ev.nPh
	r, t := c.amplitudes(nInc, nPh, 0)
	if bad(r) || bad(t) {
		return nil, fmt.Errorf("connect: connection amplitudes not finite (r = %v, t = %v)", r, t)
	}
	ev.r, ev.t = r, t
	dph := func(x, y complex128) float64 {
		if y == 0 || x == 0 || bad(x) {
			return 0
		}
		return cmplx.Phase(x / y)
	}
	// Error of R and T: the changes the next two θ orders make, the tail
	// beyond bounded as a geometric series (see tail); the change from the
	// next phase order (it moves resonances of several barriers); the change
	// when every quadrature error is added; the rounding of R and T, which
	// is relative: |r|² and |t|² are products and quotients of the matrix
	// elements, however small they are.
	var th [3]struct{ r, t complex128 }
	for k := range th {
		n := min(nInc+k, K)
		th[k].r, th[k].t = c.amplitudes(n, nPh, 0)
		if bad(th[k].r) || bad(th[k].t) {
			return nil, fmt.Errorf("connect: amplitudes at θ order %d not finite", 2*n)
		}
	}
	rq, tq := c.amplitudes(nInc, nPh, 1)
	rph, tph := c.amplitudes(nInc, nPh+1, 0)
	if bad(rph) || bad(tph) {
		rph, tph = r, t
		ev.warns = append(ev.warns, "the next phase order is not finite: the phase error estimate excludes it")
	}
	// The sensitivity to the phases: every phase moved by its error
	// estimate (twice the next order) either way (amplitudesShift). Beside a
	// narrow resonance between barriers R and T change fast with the phase,
	// and at its peak only to second order, where the change from the next
	// phase order alone is no bound.
	rP, tP := c.amplitudesShift(nInc, nPh, 0, 2)
	rM, tM := c.amplitudesShift(nInc, nPh, 0, -2)
	if bad(rP) || bad(tP) || bad(rM) || bad(tM) {
		rP, tP, rM, tM = rph, tph, rph, tph
	}
	errOf := func(f func(r, t complex128) float64) float64 {
		e := tail(f(th[1].r, th[1].t)-f(th[0].r, th[0].t), f(th[2].r, th[2].t)-f(th[1].r, th[1].t))
		// The next phase order's change is an asymptotically exact
		// estimate, like the geometric θ tail: it carries the same safety
		// factor 2 (see tail); the spread under the phase moved by that
		// much either way is taken where it is larger.
		ph := math.Max(2*math.Abs(f(rph, tph)-f(r, t)), math.Max(math.Abs(f(rP, tP)-f(r, t)), math.Abs(f(rM, tM)-f(r, t))))
		return e + ph + math.Abs(f(rq, tq)-f(r, t))
	}
	ev.errR = errOf(func(r, _ complex128) float64 { return sq(r) }) + 1e-14*sq(r)
	ev.errT = errOf(func(_, t complex128) float64 { return sq(t) }) + 1e-14*sq(t)
	ev.errPh = math.Max(2*math.Abs(dph(rph, r))+math.Abs(dph(rq, r)), 2*math.Abs(dph(tph, t))+math.Abs(dph(tq, t))) +
		math.Max(math.Abs(dph(th[1].r, r)), math.Abs(dph(th[1].t, t))) + 1e-14
	if nInc == 0 {
		// Leading order: the phase error is the change the first correction makes.
		ev.errPh += math.Max(math.Abs(dph(th[1].r, r)), math.Abs(dph(th[1].t, t)))
	}
	return ev, nil
}

// effect is the change of R, T and the phases (radians) an element makes.
type effect struct{ R, T, Phase float64 }

func (d effect) add(e effect) effect { return effect{d.R + e.R, d.T + e.T, d.Phase + e.Phase} }

// score is the largest ratio of d to the error estimates of ev.
func (d effect) score(ev *evaluation) float64 {
	ratio := func(x, e float64) float64 {
		if x == 0 {
			return 0
		}
		if !(e > 0) {
			return math.Inf(1)
		}
		return x / e
	}
	return math.Max(ratio(d.R, ev.errR), math.Max(ratio(d.T, ev.errT), ratio(d.Phase, ev.errPh)))
}

// effect returns the change in R, T and the phases of r and t when element
// i is left out of the composition at the orders of ev. A complex pair left
// out is the identity: its anchor's phase integrals cancel between the gaps
// on either side.
func (c composer) effect(i int, ev *evaluation) effect {
	c.elems[i].omit = true
	r, t := c.amplitudes(ev.nInc, ev.nPh, 0)
	c.elems[i].omit = false
	if bad(r) || bad(t) {
		return effect{math.Inf(1), math.Inf(1), math.Inf(1)}
	}
	ph := 0.0
	if ev.r != 0 && r != 0 {
		ph = math.Abs(cmplx.Phase(ev.r / r))
	}
	if ev.t != 0 && t != 0 {
		ph = math.Max(ph, math.Abs(cmplx.Phase(ev.t/t)))
	}
	// Changes at the level of rounding (a few ulp of |r|² and |t|²) are not
	// an effect.
	above := func(d, x float64) float64 { return math.Max(0, d-1e-15*x) }
	return effect{above(math.Abs(sq(ev.r)-sq(r)), sq(ev.r)), above(math.Abs(sq(ev.t)-sq(t)), sq(ev.t)), above(ph, 1)}
}
