package connect

import (
	"fmt"
	"math"
	"math/cmplx"
	"slices"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// shifted is Q + δ.
type shifted struct {
	q     jet.Func
	delta complex128
}

func (s shifted) Eval(z complex128) complex128 { return s.q.Eval(z) + s.delta }

func (s shifted) Taylor(z complex128, n int) jet.Series {
	t := append(jet.Series(nil), s.q.Taylor(z, n)...)
	t[0] += s.delta
	return t
}

// nearTopEps is the largest |ε| of a barrier (or of a complex pair just
// above its top) for which scatterTop may be used: the finite-part phases
// and the 1/ε series of the reduced parabolic phase both diverge as ε → 0,
// and the loops round turning points this close together become too small
// for the higher-order terms (at |ε| ≈ 1e-7 the quadrature diverges). It is below half the shift ε = ±0.05 of
// scatterTop, so that no shifted problem is near a top again.
const nearTopEps = 0.02

// nearTopDirect is the |ε| below which scatterTop is used at once, without
// trying the composition of the two simple zeros first.
const nearTopDirect = 1e-3

// barrierTop returns the point xm near x0 where Q′ = 0 (Newton's method on
// Q′) with q2 = Q″(xm)/2 and the parabolic ε = λ|Q(xm)|/(2√q2) of the
// turning points about it; ok is false if Newton's method does not settle
// within r of x0 or Q″ ≤ 0 there.
func barrierTop(p wkb.Problem, x0, r float64) (xm, q2, eps float64, ok bool) {
	xm = x0
	for it := 0; it < 30; it++ {
		s := p.Q.Taylor(complex(xm, 0), 2)
		q1, qq := real(s[1]), real(s[2])
		if !(qq > 0) {
			return 0, 0, 0, false
		}
		step := q1 / (2 * qq)
		xm -= step
		if math.Abs(xm-x0) > r || math.IsNaN(xm) {
			return 0, 0, 0, false
		}
		if math.Abs(step) <= 1e-15*(1+math.Abs(xm)) {
			break
		}
	}
	s := p.Q.Taylor(complex(xm, 0), 2)
	q2 = real(s[2])
	if !(q2 > 0) {
		return 0, 0, 0, false
	}
	return xm, q2, p.Lambda * math.Abs(real(s[0])) / (2 * math.Sqrt(q2)), true
}

// nearTop looks among points for two simple zeros of Q that form a barrier
// within |ε| < nearTopEps of its top: two real zeros in (a, b) next to
// each other, or a complex zero with its conjugate (listed or not) above
// an allowed stretch. It returns the indices of the zeros listed, the top
// xm (Q′(xm) = 0), q2 = Q″(xm)/2 and the barrier's |ε|.
func nearTop(p wkb.Problem, a, b float64, points []turning.Point, imTol float64) (drop []int, xm, q2, eps float64, ok bool) {
	isReal := func(pt turning.Point) bool { return math.Abs(imag(pt.Z)) <= math.Max(imTol, 10*pt.Err) }
	for i, pi := range points {
		x := real(pi.Z)
		if pi.Order != 1 || !(x > a && x < b) {
			continue
		}
		var partner complex128
		drop = []int{i}
		if isReal(pi) {
			// The nearest real simple zero to the right.
			j := -1
			for k, pk := range points {
				if k != i && pk.Order == 1 && isReal(pk) && real(pk.Z) > x && real(pk.Z) < b && (j < 0 || real(pk.Z) < real(points[j].Z)) {
					j = k
				}
			}
			if j < 0 {
				continue
			}
			partner = complex(real(points[j].Z), 0)
			drop = append(drop, j)
		} else {
			if imag(pi.Z) < 0 && listed(points, cmplx.Conj(pi.Z), math.Max(imTol, 10*pi.Err)) {
				continue // taken with its upper partner
			}
			partner = cmplx.Conj(pi.Z)
			for k, pk := range points {
				if k != i && cmplx.Abs(pk.Z-partner) <= math.Max(imTol, 10*(pk.Err+pi.Err)) {
					drop = append(drop, k)
				}
			}
		}
		mid := (real(pi.Z) + real(partner)) / 2
		half := cmplx.Abs(pi.Z-partner) / 2
		m, qq, eps, found := barrierTop(p, mid, half+1e-12*(1+math.Abs(mid)))
		if !found || eps >= nearTopEps {
			continue
		}
		if q := real(p.Q.Eval(complex(m, 0))); isReal(pi) != (q < 0) {
			continue // not the pair of a barrier about m
		}
		return drop, m, qq, eps, true
	}
	return nil, 0, 0, 0, false
}

// listed reports whether a point of points lies within tol of z.
func listed(points []turning.Point, z complex128, tol float64) bool {
	for _, p := range points {
		if cmplx.Abs(p.Z-z) <= tol {
			return true
		}
	}
	return false
}

// scatterTop handles an energy at or within |ε| < nearTopEps of a barrier
// top: a double zero of Q on the axis, or two simple zeros so close
// (points[drop]) that the finite-part phases and the reduced parabolic
// phase, which diverge and cancel as ε → 0, are beyond reach. xm is the top
// (Q′(xm) = 0) and q2 = Q″(xm)/2 > 0. Q is shifted to Q + δ for δ = ±jδ₀,
// j = 1 … topLevels, which splits the zeros into a real pair (δ < 0) or a
// complex pair (δ > 0), xm ± √(−(Q(xm)+δ)/q₂) polished by Newton's method;
// δ₀ makes |ε| = 0.05 for the shift alone (ε ≈ λδ/(2√q₂)). R, T and the
// phases of r and t (continued from those at −δ₀) are averaged
// symmetrically at each jδ₀, which leaves a series in δ², and extrapolated
// to δ = 0 through all the levels (Lagrange in δ², error O(δ₀⁸)); the
// error adds the change from the extrapolation through one level fewer to
// the largest error of the shifted results. The amplitudes are √R and √T
// with the extrapolated phases, so that |r|² = R and |t|² = T: the phases
// turn by about λ∫dx/(2√Q) per unit δ (the time delay across [a, b]), which
// makes an extrapolation of the complex amplitudes themselves inaccurate;
// that part, from the allowed stretches away from the top (drift), is
// taken out of the phases before they are extrapolated.
func scatterTop(p wkb.Problem, a, b float64, points []turning.Point, drop []int, xm, q2 float64, set *Settings) (*Result, error) {
	if !(q2 > 0) {
		return nil, fmt.Errorf("connect: double zero of Q at x = %.6g is not a barrier top (Q″/2 = %.4g): no connection formula for it", xm, q2)
	}
	t := complex(xm, 0)
	d0 := 0.1 * math.Sqrt(q2) / p.Lambda
	// The shifted problems are independent: they run concurrently.
	var shifts []float64
	for j := 1; j <= topLevels; j++ {
		shifts = append(shifts, -float64(j)*d0, float64(j)*d0)
	}
	res := make([]*Result, len(shifts))
	errs := make([]error, len(shifts))
	var wg sync.WaitGroup
	for k, d := range shifts {
		wg.Add(1)
		go func() {
			defer wg.Done()
			res[k], errs[k] = scatterShifted(p, a, b, points, drop, t, q2, d, set)
		}()
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return nil, err
		}
	}
	// Symmetric averages X̄(jδ₀) = X(0) + c₂(jδ₀)² + c₄(jδ₀)⁴ + …, j = 1 …
	// topLevels, extrapolated to 0 in δ² through all of them (Lagrange, error
	// O(δ₀^(2·topLevels))); its error estimate is the change from the
	// extrapolation through the first topLevels−1.
	extra := func(f func(k int) float64) (float64, float64) {
		xs := make([]float64, topLevels)
		for j := range xs {
			xs[j] = (f(2*j) + f(2*j+1)) / 2
		}
		all, fewer := atZero(xs), atZero(xs[:topLevels-1])
		return all, math.Abs(all - fewer)
	}
	// phase of z relative to z0 (the sample at −δ₀), in (−π, π].
	rel := func(z, z0 complex128) float64 {
		if z == 0 || z0 == 0 {
			return 0
		}
		return cmplx.Phase(z / z0)
	}
	out := *res[0]
	var eR, eT float64
	out.R, eR = extra(func(k int) float64 { return res[k].R })
	out.T, eT = extra(func(k int) float64 { return res[k].T })
	// The phases turn fast with δ (the time delay across [a, b]); the part
	// the allowed stretches away from the top make, Ψ, is taken out before
	// the phases are compared and extrapolated, so that what is left turns
	// by much less than π between the samples. Ψ(0) = 0.
	w := math.Sqrt(10 * topLevels * d0 / q2)
	psiR, psiT := make([]float64, len(shifts)), make([]float64, len(shifts))
	for k, d := range shifts {
		l := drift(p.Q, a, xm-w, d, 4*topLevels*d0)
		psiT[k] = p.Lambda * (l + drift(p.Q, xm+w, b, d, 4*topLevels*d0))
		psiR[k] = 2 * p.Lambda * l
	}
	r0, t0 := res[0].Refl, res[0].Trans
	phR, ePhR := extra(func(k int) float64 { return remainder(rel(res[k].Refl, r0) - (psiR[k] - psiR[0])) })
	phT, ePhT := extra(func(k int) float64 { return remainder(rel(res[k].Trans, t0) - (psiT[k] - psiT[0])) })
	phR -= psiR[0]
	phT -= psiT[0]
	unit := func(z complex128) complex128 {
		if z == 0 {
			return 0
		}
		return z / complex(cmplx.Abs(z), 0)
	}
	out.Refl = complex(math.Sqrt(math.Max(out.R, 0)), 0) * unit(r0) * cmplx.Exp(complex(0, phR))
	out.Trans = complex(math.Sqrt(math.Max(out.T, 0)), 0) * unit(t0) * cmplx.Exp(complex(0, phT))
	out.ErrR, out.ErrT, out.ErrPhase = eR, eT, 0
	for _, r := range res {
		out.ErrR = math.Max(out.ErrR, r.ErrR+eR)
		out.ErrT = math.Max(out.ErrT, r.ErrT+eT)
		out.ErrPhase = math.Max(out.ErrPhase, r.ErrPhase)
	}
	out.ErrPhase += math.Max(ePhR, ePhT)
	out.Method = "uniform parabolic connection at the barrier top (double zero split by ±δ and extrapolated)"
	what := "at the top of the barrier"
	if len(drop) > 1 {
		out.Method = "uniform parabolic connection at the barrier top (turning points within |ε| < 0.02 of it, shifted by ±δ and extrapolated)"
		what = "within |ε| < 0.02 of the top of the barrier"
	}
	out.Barriers = nil
	out.Warnings = append(append([]string(nil), res[0].Warnings...),
		fmt.Sprintf("energy %s at x = %.6g: R and T extrapolated from Q shifted by ±%.3g … ±%.3g, the extrapolation change is in the error estimate", what, xm, d0, topLevels*d0))
	return &out, nil
}

// topLevels is the number of shifts ±jδ₀, j = 1 … topLevels, scatterTop
// extrapolates from.
const topLevels = 4

// atZero extrapolates xs[j] = X((j+1)²h), a function of h = δ², to h = 0
// through all the points (Lagrange).
func atZero(xs []float64) float64 {
	var v float64
	for j := range xs {
		hj := float64((j + 1) * (j + 1))
		w := 1.0
		for m := range xs {
			if m != j {
				hm := float64((m + 1) * (m + 1))
				w *= hm / (hm - hj)
			}
		}
		v += w * xs[j]
	}
	return v
}

// remainder is x reduced to (−π, π].
func remainder(x float64) float64 {
	return math.Remainder(x, 2*math.Pi)
}

// drift is ∫_lo^hi (√(Q+d) − √Q) dx = ∫ d/(√(Q+d) + √Q) dx over the
// points where Q > min (well inside allowed stretches; elsewhere the
// integrand is left out), by a fixed 400-point Legendre rule, so that it
// is a smooth function of d for |d| < min/2; 0 if hi ≤ lo.
func drift(q jet.Func, lo, hi, d, min float64) float64 {
	if !(hi > lo) {
		return 0
	}
	f := func(x float64) float64 {
		v := real(q.Eval(complex(x, 0)))
		if !(v > min) {
			return 0
		}
		return d / (math.Sqrt(v+d) + math.Sqrt(v))
	}
	return quad.Fixed(f, lo, hi, 400, quad.Legendre{}, 0)
}

// scatterShifted is Scatter for Q + d, the zeros points[drop] about the
// top t (Q′(t) = 0, Q″(t)/2 = q2) replaced by the two simple zeros Q + d
// has there.
func scatterShifted(p wkb.Problem, a, b float64, points []turning.Point, drop []int, t complex128, q2, d float64, set *Settings) (*Result, error) {
	ps := p
	ps.Q = shifted{q: p.Q, delta: complex(d, 0)}
	pts := make([]turning.Point, 0, len(points)+1)
	for j, pt := range points {
		if !slices.Contains(drop, j) && !(len(drop) > 1 && pt.Order == 1 && isConjOf(pt.Z, points, drop)) {
			pts = append(pts, pt)
		}
	}
	qt := real(ps.Q.Eval(t))
	h := cmplx.Sqrt(complex(-qt/q2, 0))
	for _, z0 := range []complex128{t - h, t + h} {
		z := z0
		for it := 0; it < 50; it++ {
			s := ps.Q.Taylor(z, 1)
			step := s[0] / s[1]
			z -= step
			if cmplx.Abs(step) < 1e-15*(1+cmplx.Abs(z)) {
				break
			}
		}
		if r := cmplx.Abs(ps.Q.Eval(z)); !(r < 1e-10*(1+cmplx.Abs(p.Q.Eval(complex(a, 0))))) {
			return nil, fmt.Errorf("connect: splitting the zeros at the barrier top %.6g: Newton residual %.3g", real(t), r)
		}
		kind := turning.ComplexPair
		if qt < 0 {
			z = complex(real(z), 0)
			kind = turning.RealSimple
		}
		pts = append(pts, turning.Point{Z: z, Order: 1, Kind: kind})
	}
	sub := *set
	if sub.MaxOrder == 0 {
		sub.MaxOrder = -1 // leading order (0 would mean the default)
	}
	return Scatter(ps, a, b, pts, &sub)
}

// isConjOf reports whether z is, to rounding, the conjugate of one of the
// points listed at drop.
func isConjOf(z complex128, points []turning.Point, drop []int) bool {
	for _, j := range drop {
		w := points[j].Z
		if cmplx.Abs(z-cmplx.Conj(w)) <= 1e-9*(1+cmplx.Abs(w)) {
			return true
		}
	}
	return false
}
