package turning

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

const maxNewton = 80

// local returns the Taylor coefficients up to order m at z of Q (for a zero)
// or of 1/Q (for a pole). at is true when z is the pole itself to rounding
// (Q not finite there); good is false when the series is unusable.
func (f *finder) local(z complex128, m int, pole bool) (s jet.Series, at, good bool) {
	s = f.taylor(z, m)
	if pole {
		if !isFinite(s[0]) {
			return nil, true, true
		}
		if s[0] == 0 {
			return nil, false, false
		}
		s = jet.Div(jet.Const(1, m), s)
	}
	return s, false, s.IsFinite()
}

// newtonStep returns the modified Newton step for a zero of order m of the
// function with Taylor coefficients s: Newton on the (m−1)-th derivative,
// whose zero is simple,
//
//	δ = f⁽ᵐ⁻¹⁾/f⁽ᵐ⁾ = s[m−1] / (m·s[m]).
func newtonStep(s jet.Series, m int) (complex128, bool) {
	den := complex(float64(m), 0) * s[m]
	if s[m-1] == 0 {
		return 0, true
	}
	if den == 0 {
		return 0, false
	}
	d := s[m-1] / den
	return d, isFinite(d)
}

// newton polishes a zero (or pole) of order m from z, steps limited to
// maxStep. It returns the point, an error estimate (the size of the next
// step, or of the last steps where rounding stalls the iteration, at least
// a few ulps of |z|) and whether it converged.
func (f *finder) newton(z complex128, m int, pole bool, maxStep float64) (complex128, float64, bool) {
	tol := f.set.Tol * f.scale
	floor := 4 * eps * math.Max(cmplx.Abs(z), tol)
	prev := math.Inf(1)
	for it := 0; it < maxNewton; it++ {
		s, at, good := f.local(z, m, pole)
		if !good {
			return z, 0, false
		}
		if at {
			// Q overflowed: z is the pole to rounding (or within the last step).
			if math.IsInf(prev, 1) {
				prev = 0
			}
			return z, math.Max(floor, prev), true
		}
		d, ok := newtonStep(s, m)
		if !ok {
			return z, 0, false
		}
		a := cmplx.Abs(d)
		if a > maxStep {
			d *= complex(maxStep/a, 0)
			a = maxStep
		}
		z -= d
		stalled := it >= 6 && a >= 0.5*prev && a < 1e-6*f.scale
		if a <= tol || stalled {
			e := f.stepSize(z, m, pole)
			if stalled {
				e = math.Max(e, a)
			}
			return z, math.Max(e, floor), true
		}
		prev = a
	}
	return z, prev, false
}

// stepSize returns the size of the Newton step from z (0 if it cannot be
// formed because z is the point itself).
func (f *finder) stepSize(z complex128, m int, pole bool) float64 {
	s, at, good := f.local(z, m, pole)
	if at || !good {
		return 0
	}
	d, ok := newtonStep(s, m)
	if !ok {
		return 0
	}
	return cmplx.Abs(d)
}

// confirmRadius returns the radius of the circle on which a point of cell c
// at z is confirmed: well inside the cell, but not at rounding level.
func (c *cell) confirmRadius(z complex128) float64 {
	r := 0.8 * c.edgeDist(z)
	return math.Max(1e-3*c.h, math.Min(r, c.h/2))
}

// confirm returns the winding number of Q along a circle of radius r about
// z, shrinking r when a sample hits a zero; ok is false when it cannot be
// formed (a jump sets the status NotMeromorphic).
func (f *finder) confirm(z complex128, r float64) (int, bool) {
	for try := 0; try < 3; try++ {
		w, fail := f.circleWinding(z, r)
		if fail == nil {
			return w, true
		}
		if fail.kind == failJump {
			f.setStatus(NotMeromorphic)
			f.warnf("q jumps near %s: not meromorphic (branch point?)", fmtZ(fail.z))
			return 0, false
		}
		r *= 0.7
	}
	return 0, false
}

// confirmOrder reports whether the winding number of Q about z is want on
// a circle of radius r and, when much smaller, also on one of radius
// max(1000·err, 1e-7·h): a zero and a pole closer together than the large
// circle would otherwise pass for one point of their net order.
func (f *finder) confirmOrder(z complex128, r, err, h float64, want int) bool {
	if w, ok := f.confirm(z, r); !ok || w != want {
		return false
	}
	if r1 := math.Max(1e3*err, 1e-7*h); r1 < r/4 {
		if w, ok := f.confirm(z, r1); !ok || w != want {
			return false
		}
	}
	return true
}

// resolve polishes the single cluster of total order c.w seen by the moments
// of cell c near z0 and confirms it; ok false means the cell must be split.
func (f *finder) resolve(c *cell, z0 complex128) ([]Point, bool) {
	m, pole, sign := c.w, false, 1
	if m < 0 {
		m, pole, sign = -m, true, -1
	}
	z, e, ok := f.newton(z0, m, pole, c.h)
	if !ok || !c.contains(z) {
		return nil, false
	}
	if m == 1 {
		if !f.confirmOrder(z, c.confirmRadius(z), e, c.h, c.w) {
			return nil, false
		}
		p := Point{Z: z, Order: c.w, Err: e}
		f.setResidual(&p)
		return []Point{p}, true
	}
	if pts, ok := f.splitCluster(c, z, m, pole, sign); ok {
		return pts, true
	}
	// One point of order m: the spread of the local Taylor roots (rounding
	// noise for a true multiple zero) bounds its position error.
	spread := 0.0
	if s, at, good := f.local(z, m, pole); good && !at {
		if roots, err := PolyRoots(s); err == nil {
			for _, r := range roots {
				spread = math.Max(spread, cmplx.Abs(r))
			}
		}
	}
	e = math.Max(e, spread)
	if !f.confirmOrder(z, math.Max(c.confirmRadius(z), 4*spread), e, c.h, c.w) {
		return nil, false
	}
	p := Point{Z: z, Order: c.w, Err: e}
	f.setResidual(&p)
	return []Point{p}, true
}

// splitCluster tries to tell apart the members of a cluster of order m
// centred at z (the zero of the (m−1)-th derivative): the roots of the
// Taylor polynomial of degree m at z seed simple Newton iterations; the
// limits that differ by more than ten times their error estimates are
// separate points, those that do not are grouped, and each group is
// confirmed by a circle winding number. ok is false if the cluster does not
// split into more than one confirmed group.
func (f *finder) splitCluster(c *cell, z complex128, m int, pole bool, sign int) ([]Point, bool) {
	s, at, good := f.local(z, m, pole)
	if at || !good {
		return nil, false
	}
	roots, err := PolyRoots(s)
	if err != nil || len(roots) != m {
		return nil, false
	}
	zs := make([]complex128, m)
	es := make([]float64, m)
	for i, r := range roots {
		var ok bool
		zs[i], es[i], ok = f.newton(z+r, 1, pole, c.h)
		if !ok || !c.contains(zs[i]) {
			return nil, false
		}
	}
	// Group limits closer than ten times their error estimates.
	group := make([]int, m)
	for i := range group {
		group[i] = i
	}
	var find func(int) int
	find = func(i int) int {
		for group[i] != i {
			i = group[i]
		}
		return i
	}
	for i := 0; i < m; i++ {
		for j := i + 1; j < m; j++ {
			if cmplx.Abs(zs[i]-zs[j]) <= 10*(es[i]+es[j]) {
				group[find(j)] = find(i)
			}
		}
	}
	type grp struct {
		sum    complex128
		n      int
		err    float64
		center complex128
	}
	gs := map[int]*grp{}
	var order []int
	for i := 0; i < m; i++ {
		g := find(i)
		if gs[g] == nil {
			gs[g] = &grp{}
			order = append(order, g)
		}
		gs[g].sum += zs[i]
		gs[g].n++
		gs[g].err = math.Max(gs[g].err, es[i])
	}
	if len(order) < 2 {
		return nil, false
	}
	var pts []Point
	for _, k := range order {
		g := gs[k]
		g.center = g.sum / complex(float64(g.n), 0)
		zc, ec := g.center, g.err
		if g.n > 1 {
			var ok bool
			zc, ec, ok = f.newton(g.center, g.n, pole, c.h)
			if !ok {
				return nil, false
			}
			for i := 0; i < m; i++ {
				if find(i) == k {
					ec = math.Max(ec, cmplx.Abs(zs[i]-zc))
				}
			}
		}
		pts = append(pts, Point{Z: zc, Order: sign * g.n, Err: ec})
	}
	// Confirm each group on a circle that excludes the others.
	for i, p := range pts {
		r := c.confirmRadius(p.Z)
		for j, q := range pts {
			if j != i {
				r = math.Min(r, 0.4*cmplx.Abs(p.Z-q.Z))
			}
		}
		if r <= 4*p.Err {
			return nil, false
		}
		if !f.confirmOrder(p.Z, r, p.Err, c.h, p.Order) {
			return nil, false
		}
		f.setResidual(&pts[i])
	}
	return pts, true
}
