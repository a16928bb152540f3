package connect

import (
	"fmt"
	"math"
	"math/cmplx"
	"sync"

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

// scatterTop handles a double zero of Q on the axis, points[idx], an
// energy exactly at a barrier top (θ = 0, where the finite-part phases and
// the reduced parabolic phase both diverge and cancel). Q is shifted to
// Q + δ for δ = ±δ₀, ±2δ₀, which splits the double zero t into a real pair
// (δ < 0) or a complex pair (δ > 0), t ± √(−δ/q₂) polished by Newton's
// method, q₂ = Q″(t)/2; δ₀ makes |ε| = 0.05 for the split barrier
// (ε ≈ λδ/(2√q₂)). The results are averaged symmetrically at δ₀ and 2δ₀ and
// extrapolated, X(0) ≈ (4X̄(δ₀) − X̄(2δ₀))/3 (Richardson, error O(δ₀⁴));
// the error adds |X̄(δ₀) − X̄(2δ₀)|/3 to the largest error of the four.
func scatterTop(p wkb.Problem, a, b float64, points []turning.Point, idx int, set *Settings) (*Result, error) {
	t := points[idx].Z
	t = complex(real(t), 0)
	q2 := real(p.Q.Taylor(t, 2)[2])
	if !(q2 > 0) {
		return nil, fmt.Errorf("connect: double zero of Q at x = %.6g is not a barrier top (Q″/2 = %.4g): no connection formula for it", real(t), q2)
	}
	d0 := 0.1 * math.Sqrt(q2) / p.Lambda
	// The four shifted problems are independent: they run concurrently.
	var res [4]*Result
	var errs [4]error
	var wg sync.WaitGroup
	for k, d := range []float64{-d0, d0, -2 * d0, 2 * d0} {
		wg.Add(1)
		go func() {
			defer wg.Done()
			res[k], errs[k] = scatterShifted(p, a, b, points, idx, t, q2, d, set)
		}()
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return nil, err
		}
	}
	avg := func(i, j int, f func(*Result) complex128) complex128 { return (f(res[i]) + f(res[j])) / 2 }
	extra := func(f func(*Result) complex128) (complex128, float64) {
		x1, x2 := avg(0, 1, f), avg(2, 3, f)
		return (4*x1 - x2) / 3, cmplx.Abs(x1-x2) / 3
	}
	out := *res[0]
	var eR, eT, eRefl, eTrans float64
	var v complex128
	v, eR = extra(func(r *Result) complex128 { return complex(r.R, 0) })
	out.R = real(v)
	v, eT = extra(func(r *Result) complex128 { return complex(r.T, 0) })
	out.T = real(v)
	out.Refl, eRefl = extra(func(r *Result) complex128 { return r.Refl })
	out.Trans, eTrans = extra(func(r *Result) complex128 { return r.Trans })
	out.ErrR, out.ErrT, out.ErrPhase = eR, eT, 0
	for _, r := range res {
		out.ErrR = math.Max(out.ErrR, r.ErrR+eR)
		out.ErrT = math.Max(out.ErrT, r.ErrT+eT)
		out.ErrPhase = math.Max(out.ErrPhase, r.ErrPhase)
	}
	if a := cmplx.Abs(out.Refl); a > 0 {
		out.ErrPhase += eRefl / a
	}
	if a := cmplx.Abs(out.Trans); a > 0 {
		out.ErrPhase = math.Max(out.ErrPhase, out.ErrPhase+eTrans/a)
	}
	out.Method = "uniform parabolic connection at the barrier top (double zero split by ±δ and extrapolated)"
	out.Barriers = nil
	out.Warnings = append(append([]string(nil), res[0].Warnings...),
		fmt.Sprintf("energy at the top of the barrier at x = %.6g (a double zero of Q): R and T extrapolated from Q shifted by ±%.3g and ±%.3g, the extrapolation change is in the error estimate", real(t), d0, 2*d0))
	return &out, nil
}

// scatterShifted is Scatter for Q + d, the double zero points[idx] at t
// (Q″(t)/2 = q2) replaced by the two simple zeros it splits into.
func scatterShifted(p wkb.Problem, a, b float64, points []turning.Point, idx int, t complex128, q2, d float64, set *Settings) (*Result, error) {
	ps := p
	ps.Q = shifted{q: p.Q, delta: complex(d, 0)}
	pts := make([]turning.Point, 0, len(points)+1)
	for j, pt := range points {
		if j != idx {
			pts = append(pts, pt)
		}
	}
	h := cmplx.Sqrt(complex(-d/q2, 0))
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
			return nil, fmt.Errorf("connect: splitting the double zero at %.6g: Newton residual %.3g", real(t), r)
		}
		kind := turning.ComplexPair
		if d < 0 {
			z = complex(real(z), 0)
			kind = turning.RealSimple
		}
		pts = append(pts, turning.Point{Z: z, Order: 1, Kind: kind})
	}
	return Scatter(ps, a, b, pts, set)
}
