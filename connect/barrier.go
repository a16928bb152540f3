package connect

import (
	"fmt"
	"math"
	"math/cmplx"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/special"
)

// nearest returns the distance from z to the closest of others other than z.
func nearest(z complex128, others []complex128) float64 {
	d := math.Inf(1)
	for _, o := range others {
		if r := cmplx.Abs(o - z); r > 1e-12*(1+cmplx.Abs(z)) && r < d {
			d = r
		}
	}
	return d
}

func without(zs []complex128, drop ...complex128) []complex128 {
	var out []complex128
outer:
	for _, z := range zs {
		for _, d := range drop {
			if cmplx.Abs(z-d) <= 1e-12*(1+cmplx.Abs(d)) {
				continue outer
			}
		}
		out = append(out, z)
	}
	return out
}

// setupAnchors computes the reference anchors of e. feet are the real feet
// of the complex pairs composed beside it: the outer reference points of a
// real barrier are kept between them and its turning points, so that the
// anchors stay in order along the axis.
func (e *element) setupAnchors(p wkb.Problem, a, b float64, others []complex128, feet []float64, K int, tol float64, res *Result) error {
	lam := p.Lambda
	warn := func(format string, args ...any) { res.Warnings = append(res.Warnings, fmt.Sprintf(format, args...)) }
	t1 := e.b.Left
	if !e.b.Pair {
		t2 := e.b.Right
		x1, x2 := real(t1), real(t2)
		for _, x := range []float64{x1, x2} {
			ell := math.Pow(lam*cmplx.Abs(p.Q.Taylor(complex(x, 0), 1)[1]), -1.0/3)
			if x-a < 3*ell || b-x < 3*ell {
				warn("turning point %.6g lies within 3 Airy lengths (%.3g) of an end: the waves there are not yet WKB waves, so R, T and the phases may be off by more than their estimates", x, ell)
			}
		}
		left, right := x1-a, b-x2
		for _, f := range feet {
			if f < x1 {
				left = math.Min(left, x1-f)
			}
			if f > x2 {
				right = math.Min(right, f-x2)
			}
		}
		rho1 := 0.45 * math.Min(nearest(t1, others), left)
		rho2 := 0.45 * math.Min(nearest(t2, others), right)
		onAxis := func(x, dir float64) func(float64) (complex128, complex128, error) {
			return func(rho float64) (complex128, complex128, error) {
				c := complex(x+dir*rho, 0)
				return c, cmplx.Sqrt(p.Q.Eval(c)), nil
			}
		}
		fp1, c1, err := finitePartShrink(p, t1, rho1, onAxis(x1, -1), K, tol)
		if err != nil {
			return err
		}
		fp2, c2, err := finitePartShrink(p, t2, rho2, onAxis(x2, +1), K, tol)
		if err != nil {
			return err
		}
		e.left = anchor{z: t1, base: real(c1), g: fp1.val, gErr: fp1.err}
		e.right = anchor{z: t2, base: real(c2), g: fp2.val, gErr: fp2.err}
		return nil
	}
	x := real(t1)
	r0 := cmplx.Sqrt(p.Q.Eval(complex(x, 0)))
	var vert *pathResult
	fp, _, err := finitePartShrink(p, t1, 0.45*nearest(t1, others), func(rho float64) (complex128, complex128, error) {
		c := t1 - complex(0, rho)
		var err error
		vert, err = integratePath(p, segment(complex(x, 0), c), r0, K, tol)
		if err != nil {
			return 0, 0, err
		}
		return c, vert.root, nil
	}, K, tol)
	if err != nil {
		return err
	}
	g := make([]complex128, K+1)
	ge := make([]float64, K+1)
	for k := range g {
		g[k] = vert.val[k] + fp.val[k]
		ge[k] = vert.err[k] + fp.err[k]
	}
	e.left = anchor{z: t1, base: x, g: g, gErr: ge}
	e.right = e.left
	return nil
}

// pairTheta returns the terms θ_{2k}, k = 0…n, of the barrier integral
// of a complex pair t, t̄ with their quadrature errors, from the anchor of
// e: the finite parts g_k = FP∫_x^t −iφ_{2k} dz from the foot x = Re t. The
// segment from t̄ to t is the vertical through x, and for Q real on the axis
// the integrand at z̄ is the conjugate of that at z, so the closed contour
// round both turning points, twice FP∫_{t̄}^{t}, is 4i Im g_k and
//
//	θ_{2k} = −2 λ^(1−2k) Im g_k   (θ₀ = −2λS).
//
// This is the contour wkb.PairPhase integrates (an ellipse with foci t, t̄
// round the same segment), at no further cost.
func (e *element) pairTheta(lam float64, n int) (terms, quadErr []float64) {
	terms = make([]float64, n+1)
	quadErr = make([]float64, n+1)
	for k := 0; k <= n; k++ {
		f := 2 * math.Pow(lam, float64(1-2*k))
		terms[k] = -f * imag(e.left.g[k])
		quadErr[k] = f * e.left.gErr[k]
	}
	return terms, quadErr
}

// firstOrder sets the barrier integral of e to its leading order alone: for
// a complex pair −2λS from its anchor (pairTheta), for a real barrier
// λ∫_{x1}^{x2} √(−Q) dx by thetaReal at 64 and 128 nodes (their difference
// is the quadrature error).
func (e *element) firstOrder(p wkb.Problem) error {
	if e.b.Pair {
		e.thetaTerms, e.thetaQuad = e.pairTheta(p.Lambda, 0)
		return nil
	}
	v64, v128 := thetaReal(p, real(e.b.Left), real(e.b.Right), 64), thetaReal(p, real(e.b.Left), real(e.b.Right), 128)
	e.thetaTerms = []float64{v128}
	e.thetaQuad = []float64{math.Abs(v128 - v64)}
	return nil
}

// setupTheta computes the barrier integral θ of e to order 2K: for a real
// barrier by wkb.PairPhase, for a complex pair from its anchor
// (pairTheta). If PairPhase fails, θ is taken at leading order with a
// warning (optimal truncation then stops the whole result there).
func (e *element) setupTheta(p wkb.Problem, others []complex128, K int, tol float64, res *Result) error {
	warn := func(format string, args ...any) { res.Warnings = append(res.Warnings, fmt.Sprintf(format, args...)) }
	t1, t2 := e.b.Left, e.b.Right
	e.weak = false
	if e.b.Pair {
		e.thetaTerms, e.thetaQuad = e.pairTheta(p.Lambda, len(e.left.g)-1)
		return nil
	}
	ps, err := wkb.PairPhase(p, t1, t2, 2*K, &wkb.PhaseSettings{Others: without(others, t1, t2), Tol: tol})
	if err == nil && ps.Status.Err() != nil {
		q := 0.0
		for k, e := range ps.TermErr {
			if math.IsNaN(e) || math.IsInf(e, 0) {
				e = cmplx.Abs(ps.Terms[k]) // no estimate: the term's own size, as in thetaQuad
			}
			q = math.Max(q, e)
		}
		warn("the barrier integral θ of the barrier [%.6g, %.6g] is less accurate than asked (%v): its quadrature error, up to %.2g in θ, is counted in the error estimates", real(t1), real(t2), ps.Status, q)
	}
	if err != nil || len(ps.Terms) < 1 {
		warn("the barrier integral θ of the barrier [%.6g, %.6g] could not be taken beyond leading order (%v): the result is at leading order and its error estimate lacks the θ correction of this barrier", real(t1), real(t2), err)
		return e.firstOrder(p)
	}
	e.thetaTerms = make([]float64, len(ps.Terms))
	e.thetaQuad = make([]float64, len(ps.Terms))
	for k, v := range ps.Terms {
		th := -1i * v
		if math.Abs(imag(th)) > 1e-6*math.Abs(real(th))+10*ps.TermErr[k]+1e-12 {
			warn("barrier integral term %d at %.4g is not real (%.3g): Q is not real near the barrier", 2*k, t1, th)
		}
		e.thetaTerms[k] = real(th)
		q := ps.TermErr[k]
		if math.IsNaN(q) || math.IsInf(q, 0) {
			q = math.Abs(real(th)) // no quadrature estimate: the term's own size
		}
		e.thetaQuad[k] = q
	}
	return nil
}

// thetaReal is λ∫_{x1}^{x2} √(−Q) dx by an n-point Legendre rule after the
// substitution x = x1 + (x2−x1)(1 − cos u)/2, u ∈ [0, π].
func thetaReal(p wkb.Problem, x1, x2 float64, n int) float64 {
	h := (x2 - x1) / 2
	f := func(u float64) float64 {
		x := x1 + h*(1-math.Cos(u))
		q := -real(p.Q.Eval(complex(x, 0)))
		if q < 0 {
			q = 0
		}
		return math.Sqrt(q) * h * math.Sin(u)
	}
	return p.Lambda * quad.Fixed(f, 0, math.Pi, n, quad.Legendre{}, 0)
}

// composer multiplies the connection matrices at a given order.
type composer struct {
	lam      float64
	anchors  []anchor
	gaps     []*pathResult
	elems    []*element
	terminal *[2]complex128 // coefficients at the last anchor when b is forbidden; nil: transmitted wave
}

// amplitudes returns r and t with the barrier integrals θ to order 2nθ and
// the phases to order 2nφ; pert = 1 adds the quadrature errors to every
// phase and θ (to measure their effect). The parabolic phase is
// φ(ε) − S_nφ (phaseSeries), ε = −θ/π, the subtracted series
// being the part of φ's large-ε expansion the finite-part phases hold, to
// the same order in 1/λ.
func (c composer) amplitudes(nTheta, nPhase int, pert float64) (r, t complex128) {
	return c.amplitudesShift(nTheta, nPhase, pert, 0)
}

// gapTerm returns λ^(1−2k) times the order-2k phase of gap i between its
// anchors, and its quadrature error.
func (c composer) gapTerm(i, k int) (v, e float64) {
	gap := c.gaps[i]
	if k >= len(gap.val) {
		return 0, 0
	}
	A, B := c.anchors[2*i], c.anchors[2*i+1]
	z := gap.val[k]
	e = gap.err[k]
	if A.g != nil {
		z -= A.g[k]
		e += A.gErr[k]
	}
	if B.g != nil {
		z += B.g[k]
		e += B.gErr[k]
	}
	f := math.Pow(c.lam, float64(1-2*k))
	return f * real(z), f * e
}

// amplitudesShift is amplitudes with the next phase order (2nPhase+2)
// added shift times, in every gap and every parabolic phase: shift = 1 is
// amplitudes at order nPhase+1, and shift = ±2 moves all the phases by
// their error estimate either way, which measures how sensitive R and T
// are to them (beside a narrow resonance between barriers they change
// fast with the phase, and at its peak only to second order, where the
// change at shift 1 alone is no bound).
func (c composer) amplitudesShift(nTheta, nPhase int, pert, shift float64) (r, t complex128) {
	m := Identity
	for i := range c.gaps {
		var delta float64
		for k := 0; k <= nPhase; k++ {
			v, e := c.gapTerm(i, k)
			delta += v + pert*e
		}
		if shift != 0 {
			v, _ := c.gapTerm(i, nPhase+1)
			delta += shift * v
		}
		m = m.Mul(Propagation(complex(delta, 0)))
		if i < len(c.elems) && !c.elems[i].omit {
			el := c.elems[i]
			var th float64
			for k := 0; k <= nTheta && k < len(el.thetaTerms); k++ {
				th += el.thetaTerms[k] + pert*el.thetaQuad[k]
			}
			series := func(n int) float64 {
				eps := make([]float64, 0, n)
				for k := 0; k < n && k <= nTheta && k < len(el.thetaTerms); k++ {
					eps = append(eps, -(el.thetaTerms[k]+pert*el.thetaQuad[k])/math.Pi)
				}
				if n > 0 && len(eps) > 0 {
					return phaseSeries(eps, n)
				}
				return 0
			}
			phi := special.ParabolicPhase(-th/math.Pi) - series(nPhase)
			if shift != 0 {
				phi -= shift * (series(nPhase+1) - series(nPhase))
			}
			m = m.Mul(parabolicWithPhase(th, phi))
		}
	}
	if c.terminal != nil {
		v := m.Apply(*c.terminal)
		return v[1] / v[0], 0
	}
	return m.Amplitudes()
}

// thetaEnd is λ∫_t^b √|Q| dx from a turning point t to the forbidden end b,
// with x = t + (b−t)u² removing the square-root behaviour at t (Legendre,
// 64 nodes).
func thetaEnd(p wkb.Problem, t, b float64) float64 {
	h := b - t
	f := func(u float64) float64 {
		x := t + h*u*u
		return math.Sqrt(math.Abs(real(p.Q.Eval(complex(x, 0))))) * 2 * h * u
	}
	return p.Lambda * quad.Fixed(f, 0, 1, 64, quad.Legendre{}, 0)
}

// poleEstimate replaces the reflection by the estimate of the dominant
// singularity d (a simple pole or a double zero of Q):
//
//	r ≈ −2i cos(π/(m+2)) exp(2iλ ∫_a^z √Q),
//
// −T with T the local Stokes multiplier of Q ∝ (z−z0)^m; for m = 1 this is
// the −i of ParabolicBarrier far above the top. The phase of this estimate
// agrees with direct integration to 1e-3 rad for Q = 1 + β/(x² + 1)
// (β = 0.25, 1; λ = 1.5…3), but |r|·exp(2λS) there ranged from 0.9 to 5.5
// without settling in λ, so the prefactor is an order of magnitude only
// and its error estimate 10·R is a rule of thumb.
func poleEstimate(p wkb.Problem, a, b float64, d Singularity, res *Result, tol float64) error {
	z := d.Point.Z
	x := real(z)
	r0 := cmplx.Sqrt(p.Q.Eval(complex(a, 0)))
	along, err := integratePath(p, segment(complex(a, 0), complex(x, 0)), r0, 0, tol)
	if err != nil {
		return err
	}
	w, err := verticalS(p, z, tol)
	if err != nil {
		return err
	}
	m := float64(d.Point.Order)
	W := along.val[0] + w
	r := complex(0, -2*math.Cos(math.Pi/(m+2))) * cmplx.Exp(complex(0, 2*p.Lambda)*W)
	R := sq(r)
	if R >= 1 {
		return fmt.Errorf("connect: reflection estimate %.3g of the singularity at %v is not small: λ too small", R, z)
	}
	kind := "simple pole"
	if d.Point.Order == 2 {
		kind = "double zero"
	}
	res.Method = fmt.Sprintf("dominant %s of Q: |r| ≈ %.3g·exp(−2λS), prefactor from the local Stokes multiplier (unverified, order of magnitude)", kind, d.Prefactor)
	res.Warnings = append(res.Warnings, fmt.Sprintf("reflection from the %s at %.4g: prefactor %.3g not verified; ErrR = 10 R is a rule of thumb, not a computed bound", kind, z, d.Prefactor))
	tmag := cmplx.Abs(res.Trans)
	res.ErrR += 10*R + res.R
	res.ErrT += 10*R + res.R
	res.Refl = r
	res.R = R
	res.T = 1 - R
	if tmag > 0 {
		res.Trans *= complex(math.Sqrt(1-R)/tmag, 0)
	}
	return nil
}
