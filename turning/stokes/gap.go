package stokes

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"sort"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// ErrEverywhereDegenerate is returned by FindDegeneracy when Re Gap
// vanishes within its error estimate at every sample of the range: the two
// turning points are joined by a Stokes line throughout (as for any real
// barrier), so there is no crossing to locate.
var ErrEverywhereDegenerate = errors.New("stokes: Re Gap vanishes within its error at every sample: the pair stays joined by a Stokes line")

// nearFraction is the distance from the segment t1–t2, relative to its
// length, within which a zero or pole of Q makes Gap detour around it.
const nearFraction = 0.1

// Gap returns ∫_{t1}^{t2} √Q dx, the difference of w between two turning
// points, so that a Stokes line can join them only where Re Gap = 0 and an
// anti-Stokes line only where Im Gap = 0.
//
// The path is the straight segment from t1 to t2 unless a zero or pole of Q
// lies within a tenth of its length from the segment's interior; then the
// path detours around each such point, on the side on which the segment
// passes it (a point on the segment itself is kept to the right of the
// path, which goes round it on the left),
// so that Gap stays continuous as a point approaches the segment. The root
// √Q is the principal one at the middle of the path, continued along it;
// the overall sign of Gap therefore follows that choice, while Re Gap = 0
// does not depend on it.
func Gap(q jet.Func, t1, t2 complex128) (complex128, error) {
	g, _, err := GapEstimate(q, t1, t2, nil)
	return g, err
}

// GapEstimate is Gap with the error estimate of the quadrature, and with
// the zeros and poles of Q to avoid given in others (points at t1 or t2
// are ignored). When others is nil, the interior of the segment is scanned
// for nearby zeros and poles of Q instead.
func GapEstimate(q jet.Func, t1, t2 complex128, others []turning.Point) (g complex128, errEst float64, err error) {
	if q == nil {
		return 0, 0, errors.New("stokes: nil Q")
	}
	if cmplx.IsNaN(t1) || cmplx.IsInf(t1) || cmplx.IsNaN(t2) || cmplx.IsInf(t2) {
		return 0, 0, errors.New("stokes: Gap end points must be finite")
	}
	if t1 == t2 {
		return 0, 0, nil
	}
	var obs []complex128
	if others == nil {
		obs = scanSingular(q, t1, t2)
	} else {
		for _, p := range others {
			obs = append(obs, p.Z)
		}
	}
	path := detour(t1, t2, obs)
	return pathIntegral(q, path)
}

// detour returns the polyline from t1 to t2 that keeps clear of the
// obstacles near the segment, passing each on the side the segment does.
func detour(t1, t2 complex128, obs []complex128) []complex128 {
	L := cmplx.Abs(t2 - t1)
	u := (t2 - t1) / complex(L, 0) // unit tangent
	type near struct{ s, n float64 }
	var ns []near
	for _, z := range obs {
		if cmplx.IsNaN(z) || cmplx.IsInf(z) {
			continue
		}
		// Coordinates along (s) and to the left of (n) the segment.
		r := (z - t1) / u
		s, n := real(r), imag(r)
		if s <= 0.02*L || s >= 0.98*L || math.Abs(n) >= nearFraction*L {
			continue
		}
		ns = append(ns, near{s, n})
	}
	if len(ns) == 0 {
		return []complex128{t1, t2}
	}
	sort.Slice(ns, func(i, j int) bool { return ns[i].s < ns[j].s })
	path := []complex128{t1}
	c := 2 * nearFraction * L // clearance
	for _, o := range ns {
		side := 1.0 // obstacle on the right or on the segment: keep to its left
		if o.n > 0 {
			side = -1 // obstacle on the left: keep to its right
		}
		path = append(path, t1+u*complex(o.s, o.n+side*c))
	}
	return append(path, t2)
}

// pathIntegral returns ∫ √Q along the polyline, the root principal at the
// point of half arc length and continued along the path both ways.
func pathIntegral(q jet.Func, path []complex128) (complex128, float64, error) {
	total := 0.0
	for k := 1; k < len(path); k++ {
		total += cmplx.Abs(path[k] - path[k-1])
	}
	// Split at the middle m into a forward and a backward polyline from m.
	acc := 0.0
	var fwd, back []complex128
	for k := 1; k < len(path); k++ {
		l := cmplx.Abs(path[k] - path[k-1])
		if acc+l >= total/2 {
			m := path[k-1] + (path[k]-path[k-1])*complex((total/2-acc)/l, 0)
			fwd = append([]complex128{m}, path[k:]...)
			back = []complex128{m}
			for j := k - 1; j >= 0; j-- {
				back = append(back, path[j])
			}
			break
		}
		acc += l
	}
	if fwd == nil {
		return 0, 0, errors.New("stokes: path of Gap is not finite")
	}
	qm := q.Eval(fwd[0])
	if qm == 0 || cmplx.IsNaN(qm) || cmplx.IsInf(qm) {
		return 0, 0, fmt.Errorf("stokes: Q is %v at the middle %v of the path", qm, fwd[0])
	}
	fm := cmplx.Sqrt(qm)
	walk := func(p []complex128) (complex128, float64) {
		var s complex128
		var e float64
		f := fm
		for k := 1; k < len(p); k++ {
			ds, de, fb := segment(q, p[k-1], p[k], f)
			s += ds
			e += de
			f = fb
		}
		return s, e
	}
	s2, e2 := walk(fwd)
	s1, e1 := walk(back)
	g := s2 - s1
	if cmplx.IsNaN(g) || cmplx.IsInf(g) {
		return 0, 0, errors.New("stokes: ∫√Q along the path is not finite")
	}
	return g, e1 + e2, nil
}

// scanSingular looks for zeros and poles of Q near the interior of the
// segment t1–t2: it samples |Q| along it, and from each interior local
// minimum (maximum) runs Newton's method for a zero of Q (of 1/Q).
func scanSingular(q jet.Func, t1, t2 complex128) []complex128 {
	const n = 64
	L := cmplx.Abs(t2 - t1)
	var zs [n + 1]complex128
	var a [n + 1]float64
	for k := range zs {
		zs[k] = t1 + (t2-t1)*complex(float64(k)/n, 0)
		a[k] = cmplx.Abs(q.Eval(zs[k]))
	}
	var out []complex128
	for k := 2; k < n-1; k++ {
		isMin := a[k] <= a[k-1] && a[k] <= a[k+1]
		isMax := a[k] >= a[k-1] && a[k] >= a[k+1] || math.IsInf(a[k], 0) || math.IsNaN(a[k])
		if !isMin && !isMax {
			continue
		}
		z := zs[k]
		ok := false
		for it := 0; it < 50; it++ {
			s := q.Taylor(z, 1)
			if s[0] == 0 || cmplx.IsInf(s[0]) || cmplx.IsNaN(s[0]) {
				ok = true
				break
			}
			if s[1] == 0 {
				break
			}
			step := s[0] / s[1] // Newton for Q; for 1/Q the step is −(this)
			if isMax {
				step = -step
			}
			z -= step
			if cmplx.Abs(step) < 1e-13*(L+cmplx.Abs(z)) {
				ok = true
				break
			}
			if cmplx.Abs(z-zs[k]) > L {
				break
			}
		}
		if ok && !cmplx.IsNaN(z) && !cmplx.IsInf(z) {
			out = append(out, z)
		}
	}
	return out
}

// Crossing is a parameter value where two turning points of a family are
// joined by a Stokes line: a root of Re Gap(p).
type Crossing struct {
	P   float64    // the parameter
	Err float64    // error estimate of P: last root-finding step, or |Re Gap| error over the slope
	Gap complex128 // Gap at P (Re Gap ≈ 0), on the branch continued from the first sample
	T1  complex128 // the turning points at P, ordered by real then imaginary part
	T2  complex128
	Its int // evaluations of the family in the root finding
}

// FindDegeneracy scans the parameter p over [lo, hi] for the values where
// the two nearest turning points of the family are joined by a Stokes line:
// the roots of Re Gap(p) between them. family returns Q and its zeros and
// poles at p. It is ScanDegeneracy with 32 intervals, returning the
// parameters only. Nothing is returned when there is no sign change;
// ErrEverywhereDegenerate when Re Gap vanishes at every sample.
func FindDegeneracy(family func(p float64) (jet.Func, []turning.Point, error), lo, hi float64) ([]float64, error) {
	cs, err := ScanDegeneracy(family, lo, hi, 32)
	var ps []float64
	for _, c := range cs {
		ps = append(ps, c.P)
	}
	return ps, err
}

// ScanDegeneracy samples [lo, hi] at n+1 equally spaced points (n ≤ 0
// means 32) and, between consecutive samples where Re Gap, on a branch
// continued from sample to sample, has opposite signs (each larger than
// its error estimate), refines the root by the Illinois variant of regula
// falsi. The pair is the two nearest zeros at each p; poles and other
// zeros of the family are avoided by Gap's detour. A root between two
// samples closer than the sampling cannot be seen (an even number of sign
// changes); sample more finely when that matters.
func ScanDegeneracy(family func(p float64) (jet.Func, []turning.Point, error), lo, hi float64, n int) ([]Crossing, error) {
	if family == nil {
		return nil, errors.New("stokes: nil family")
	}
	if !(hi > lo) || math.IsInf(lo, 0) || math.IsInf(hi, 0) {
		return nil, fmt.Errorf("stokes: bad parameter range [%g, %g]", lo, hi)
	}
	if n <= 0 {
		n = 32
	}
	type sample struct {
		p   float64
		g   complex128
		sgn int
	}
	var prev complex128
	var samples []sample
	for k := 0; k <= n; k++ {
		p := lo + (hi-lo)*float64(k)/float64(n)
		fg, err := familyGap(family, p)
		if err != nil {
			return nil, err
		}
		g := fg.g
		if k > 0 && cmplx.Abs(g-prev) > cmplx.Abs(g+prev) {
			g = -g
		}
		prev = g
		samples = append(samples, sample{p, g, sign(real(g), fg.err)})
	}
	var out []Crossing
	last := -1
	for k, s := range samples {
		if s.sgn == 0 {
			continue
		}
		if last >= 0 && samples[last].sgn != s.sgn {
			c, err := refine(family, samples[last].p, samples[last].g, s.p, s.g)
			if err != nil {
				return out, err
			}
			out = append(out, c)
		}
		last = k
	}
	if last < 0 {
		return nil, ErrEverywhereDegenerate
	}
	return out, nil
}

// sign returns the sign of v, or 0 when |v| is within e.
func sign(v, e float64) int {
	switch {
	case v > e:
		return 1
	case v < -e:
		return -1
	}
	return 0
}

type famGap struct {
	g      complex128
	err    float64
	t1, t2 complex128
}

// familyGap returns Gap and its error between the two nearest zeros of the
// family at p, ordered by real then imaginary part.
func familyGap(family func(p float64) (jet.Func, []turning.Point, error), p float64) (famGap, error) {
	q, pts, err := family(p)
	if err != nil {
		return famGap{}, fmt.Errorf("stokes: family at %g: %w", p, err)
	}
	if q == nil {
		return famGap{}, fmt.Errorf("stokes: family at %g: nil Q", p)
	}
	bi, bj, bd := -1, -1, math.Inf(1)
	for i := range pts {
		for j := i + 1; j < len(pts); j++ {
			if !pts[i].IsZero() || !pts[j].IsZero() {
				continue
			}
			if d := cmplx.Abs(pts[i].Z - pts[j].Z); d < bd {
				bi, bj, bd = i, j, d
			}
		}
	}
	if bi < 0 {
		return famGap{}, fmt.Errorf("stokes: family at %g has fewer than two turning points", p)
	}
	t1, t2 := pts[bi].Z, pts[bj].Z
	if real(t2) < real(t1) || real(t2) == real(t1) && imag(t2) < imag(t1) {
		t1, t2 = t2, t1
	}
	others := make([]turning.Point, 0, len(pts))
	for k, pt := range pts {
		if k != bi && k != bj {
			others = append(others, pt)
		}
	}
	g, e, err := GapEstimate(q, t1, t2, others)
	if err != nil {
		return famGap{}, fmt.Errorf("stokes: family at %g: %w", p, err)
	}
	return famGap{g: g, err: e + 1e-13*cmplx.Abs(g), t1: t1, t2: t2}, nil
}

// refine finds the root of Re Gap in [a, b], where the aligned Gap values
// ga, gb have real parts of opposite signs.
func refine(family func(p float64) (jet.Func, []turning.Point, error), a float64, ga complex128, b float64, gb complex128) (Crossing, error) {
	fa, fb := real(ga), real(gb)
	side := 0
	cPrev := math.NaN()
	var cr Crossing
	for it := 1; it <= 100; it++ {
		c := (a*fb - b*fa) / (fb - fa)
		if !(c > math.Min(a, b) && c < math.Max(a, b)) {
			c = (a + b) / 2
		}
		fg, err := familyGap(family, c)
		if err != nil {
			return Crossing{P: c, Err: math.Abs(b - a), Its: it}, err
		}
		g := fg.g
		// Align the sign with the Gap interpolated between the ends.
		ref := ga + (gb-ga)*complex((c-a)/(b-a), 0)
		if cmplx.Abs(g-ref) > cmplx.Abs(g+ref) {
			g = -g
		}
		fc := real(g)
		slope := math.Abs((real(gb) - real(ga)) / (b - a))
		cr = Crossing{P: c, Gap: g, T1: fg.t1, T2: fg.t2, Its: it, Err: math.Max(math.Abs(c-cPrev), fg.err/slope)}
		if math.IsNaN(cPrev) {
			cr.Err = math.Abs(b - a)
		}
		if math.Abs(fc) <= fg.err {
			cr.Err = fg.err / slope
			return cr, nil
		}
		if math.Abs(c-cPrev) <= 1e-14*(math.Abs(c)+math.Abs(b-a)) {
			return cr, nil
		}
		cPrev = c
		if (fc > 0) == (fb > 0) {
			b, gb, fb = c, g, fc
			if side == 1 {
				fa /= 2
			}
			side = 1
		} else {
			a, ga, fa = c, g, fc
			if side == -1 {
				fb /= 2
			}
			side = -1
		}
	}
	return cr, fmt.Errorf("stokes: root of Re Gap not converged in [%g, %g] after 100 iterations", a, b)
}
