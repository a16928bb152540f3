package stokes

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// eps is the unit roundoff of float64.
const eps = 0x1p-53

// Trace traces the Stokes and anti-Stokes lines leaving every zero of Q in
// points (and every simple pole) that lies inside box, and returns them with
// the degeneracies found and the branch cuts. points are the zeros and poles
// of Q, as turning.Find reports them; lines end at any of them. s may be nil
// for the defaults.
//
// Trace returns an error only for unusable input (nil Q, an empty box, a
// point of order 0 or at a non-finite position); a line that could not be
// completed ends with EndFailed or EndLimit and a warning says why.
func Trace(q jet.Func, points []turning.Point, box turning.Box, s *Settings) (*Geometry, error) {
	if q == nil {
		return nil, errors.New("stokes: nil Q")
	}
	if !(real(box.Hi) > real(box.Lo)) || !(imag(box.Hi) > imag(box.Lo)) ||
		cmplx.IsInf(box.Lo) || cmplx.IsInf(box.Hi) {
		return nil, fmt.Errorf("stokes: empty or infinite box %v … %v", box.Lo, box.Hi)
	}
	for i, p := range points {
		if p.Order == 0 {
			return nil, fmt.Errorf("stokes: point %d at %v has order 0", i, p.Z)
		}
		if cmplx.IsNaN(p.Z) || cmplx.IsInf(p.Z) {
			return nil, fmt.Errorf("stokes: point %d is not finite", i)
		}
	}
	set := s.withDefaults()
	tr := &tracer{q: q, pts: points, box: box, set: set, diag: cmplx.Abs(box.Hi - box.Lo)}
	tr.sep = make([]float64, len(points))
	for i := range points {
		d := math.Inf(1)
		for j := range points {
			if j != i {
				d = math.Min(d, cmplx.Abs(points[i].Z-points[j].Z))
			}
		}
		tr.sep[i] = d
	}
	g := &Geometry{Points: append([]turning.Point(nil), points...), Box: box, q: q}
	tr.g = g
	for i, p := range points {
		if p.Order < -1 {
			continue
		}
		if !box.Contains(p.Z) {
			g.Warnings = append(g.Warnings, fmt.Sprintf("point %d at %v lies outside the box: no lines traced from it", i, p.Z))
			continue
		}
		a, err := leading(q, p, math.Min(tr.startRadius(i), 1e-3*tr.diag))
		if err != nil {
			g.Warnings = append(g.Warnings, fmt.Sprintf("point %d: %v", i, err))
			continue
		}
		if p.Order > 0 {
			// At the start distance r0 the leading term is |a| r0^m; Q(t)
			// must be far below it for the start directions to hold.
			lead := cmplx.Abs(a) * math.Pow(tr.startRadius(i), float64(p.Order))
			if r := cmplx.Abs(q.Eval(p.Z)); r > 1e-3*lead {
				tr.warnf("point %d: |Q(t)| = %.3g is not small against the leading term %.3g at the start distance: t may not be a zero of order %d", i, r, lead, p.Order)
			}
		}
		for _, fam := range []Family{Stokes, AntiStokes} {
			for _, th := range anglesFor(a, p.Order, fam) {
				g.Lines = append(g.Lines, tr.line(i, fam, th))
			}
		}
	}
	tr.degeneracies()
	tr.cuts()
	return g, nil
}

type tracer struct {
	q    jet.Func
	pts  []turning.Point
	box  turning.Box
	set  Settings
	diag float64
	sep  []float64 // distance from each point to its nearest neighbour
	g    *Geometry
}

func (tr *tracer) warnf(format string, args ...any) {
	tr.g.Warnings = append(tr.g.Warnings, fmt.Sprintf(format, args...))
}

// startRadius is the distance from point i at which its lines start.
func (tr *tracer) startRadius(i int) float64 {
	r := math.Min(tr.set.Start*tr.diag, tr.sep[i]/20)
	return math.Max(r, 4*tr.pts[i].Err)
}

// captureRadius is the radius within which a line is taken to reach point j.
func (tr *tracer) captureRadius(j int) float64 {
	return math.Max(math.Min(tr.set.Capture*tr.diag, tr.sep[j]/4), 2*tr.startRadius(j))
}

// part returns the quantity the family keeps at zero: Re w or Im w.
func part(f Family, w complex128) float64 {
	if f == Stokes {
		return real(w)
	}
	return imag(w)
}

// dir is the unit direction of the family for the root f: i·conj(f)/|f|
// for Stokes lines (dw = i|f| ds), conj(f)/|f| for anti-Stokes (dw = |f| ds).
func dir(fam Family, f complex128) complex128 {
	d := cmplx.Conj(f) / complex(cmplx.Abs(f), 0)
	if fam == Stokes {
		d *= 1i
	}
	return d
}

// state is a point of the line: position x, w there, and the root f = √Q(x)
// on the continued branch.
type state struct {
	x, w, f complex128
}

// rk4 advances st by one classical Runge–Kutta step of arc length h for
// dx/ds = dir(√Q), dw/ds = √Q dx/ds, continuing the root from st.f.
func (tr *tracer) rk4(fam Family, st state, h float64) (state, bool) {
	ev := func(x, ref complex128) (dx, dw, f complex128) {
		f = nearRoot(tr.q.Eval(x), ref)
		d := dir(fam, f)
		return d, f * d, f
	}
	hc := complex(h, 0)
	k1x, k1w := dir(fam, st.f), st.f*dir(fam, st.f)
	k2x, k2w, f2 := ev(st.x+hc/2*k1x, st.f)
	k3x, k3w, f3 := ev(st.x+hc/2*k2x, f2)
	k4x, k4w, _ := ev(st.x+hc*k3x, f3)
	x := st.x + hc/6*(k1x+2*k2x+2*k3x+k4x)
	w := st.w + hc/6*(k1w+2*k2w+2*k3w+k4w)
	f := track(tr.q, st.x, x, st.f)
	ok := !cmplx.IsNaN(x) && !cmplx.IsNaN(w) && !cmplx.IsNaN(f) && f != 0 && !cmplx.IsInf(f)
	return state{x, w, f}, ok
}

// newton moves st across the line so that Re w (Stokes) or Im w
// (anti-Stokes) vanishes: dx = −Re(w)/f changes w by −Re w to first order.
func (tr *tracer) newton(fam Family, st state) state {
	for it := 0; it < 3; it++ {
		r := part(fam, st.w)
		if r == 0 {
			break
		}
		var dw complex128
		if fam == Stokes {
			dw = complex(-r, 0)
		} else {
			dw = complex(0, -r)
		}
		dx := dw / st.f
		x := st.x + dx
		f := track(tr.q, st.x, x, st.f)
		// Second-order update of w by the trapezoid rule over the short
		// correction segment.
		st.w += dx * (st.f + f) / 2
		st.x, st.f = x, f
		if cmplx.Abs(dx) < 1e-15*tr.diag {
			break
		}
	}
	return st
}

// nearest returns the distance from x to the nearest point.
func (tr *tracer) nearest(x complex128) float64 {
	d := math.Inf(1)
	for _, p := range tr.pts {
		d = math.Min(d, cmplx.Abs(x-p.Z))
	}
	return d
}

// line traces one line of family fam leaving point i at angle th.
func (tr *tracer) line(i int, fam Family, th float64) Line {
	t := tr.pts[i].Z
	ln := Line{Family: fam, From: i, To: -1, StartAngle: th, Path: []complex128{t}, W: []complex128{0}}
	// Start at distance r0 in direction th; choose the root whose direction
	// field points away from t, and take w there by quadrature from t.
	r0 := tr.startRadius(i)
	x := t + cmplx.Rect(r0, th)
	f := nearRoot(tr.q.Eval(x), 0)
	if real(dir(fam, f)*cmplx.Rect(1, -th)) < 0 {
		f = -f
	}
	w0, e0, _ := segment(tr.q, x, t, f)
	ln.WErr = e0
	st := state{x: x, w: -w0, f: f}
	st = tr.newton(fam, st)
	if math.Abs(part(fam, st.w)) > 1e-6*cmplx.Abs(st.w) {
		tr.warnf("point %d: %s line at angle %.4g did not settle on its level at the start (residual %.3g)", i, fam, th, math.Abs(part(fam, st.w)))
	}
	if !tr.box.Contains(st.x) {
		// A point on the edge whose line leaves the box at once.
		c := clip(tr.box, t, st.x)
		fc := track(tr.q, st.x, c, st.f)
		wc, _, _ := segment(tr.q, c, t, fc)
		ln.Path, ln.W = append(ln.Path, c), append(ln.W, -wc)
		ln.Length = cmplx.Abs(c - t)
		ln.End, ln.EndW = EndBox, -wc
		return ln
	}
	ln.Path, ln.W = append(ln.Path, st.x), append(ln.W, st.w)
	ln.Length = cmplx.Abs(st.x - t)

	tol := tr.set.Tol * tr.diag
	hmax := tr.set.MaxStep * tr.diag
	hmin := tr.set.MinStep * tr.diag
	maxLen := tr.set.MaxLength * tr.diag
	h := math.Min(hmax, tr.set.StepFraction*r0)
	inside := make([]bool, len(tr.pts)) // within the capture radius at the last check
	for j := range tr.pts {
		inside[j] = cmplx.Abs(st.x-tr.pts[j].Z) < tr.captureRadius(j)
	}
	for {
		if ln.Steps >= tr.set.MaxSteps || ln.Length >= maxLen {
			ln.End = EndLimit
			tr.warnf("point %d: %s line at angle %.4g stopped at %v after length %.4g in %d steps (limit)", i, fam, th, st.x, ln.Length, ln.Steps)
			break
		}
		h = math.Min(h, math.Min(hmax, tr.set.StepFraction*tr.nearest(st.x)))
		if h < hmin {
			ln.End = EndFailed
			tr.warnf("point %d: %s line at angle %.4g: step %.3g below the minimum at %v after %d steps", i, fam, th, h, st.x, ln.Steps)
			break
		}
		big, ok1 := tr.rk4(fam, st, h)
		half, ok2 := tr.rk4(fam, st, h/2)
		var two state
		ok3 := false
		if ok2 {
			two, ok3 = tr.rk4(fam, half, h/2)
		}
		if !ok1 || !ok2 || !ok3 {
			h /= 4
			continue
		}
		fs := cmplx.Abs(st.f)
		e := math.Max(cmplx.Abs(big.x-two.x), cmplx.Abs(big.w-two.w)/fs)
		if e > tol {
			h *= math.Max(0.2, 0.9*math.Pow(tol/e, 0.2))
			continue
		}
		prevSt := st
		prev := st.x
		// Local extrapolation: two half steps are in error by about
		// (two − big)/15 (fifth-order local error of RK4).
		two.x += (two.x - big.x) / 15
		two.w += (two.w - big.w) / 15
		// Plus rounding: a few units in the last place of w per step.
		ln.WErr += cmplx.Abs(two.w-big.w)/15 + 4*eps*cmplx.Abs(two.w)
		two.f = track(tr.q, st.x, two.x, st.f)
		ln.Drift = math.Max(ln.Drift, math.Abs(part(fam, two.w)))
		st = tr.newton(fam, two)
		ln.Steps++
		ln.Length += cmplx.Abs(st.x - prev)
		if e > 0 {
			h *= math.Min(2, 0.9*math.Pow(tol/e, 0.2))
		} else {
			h *= 2
		}
		if !tr.box.Contains(st.x) {
			c, wc := tr.edgePoint(fam, prevSt, clip(tr.box, prev, st.x))
			ln.Path, ln.W = append(ln.Path, c), append(ln.W, wc)
			ln.Length += cmplx.Abs(c-prev) - cmplx.Abs(st.x-prev)
			ln.End = EndBox
			ln.EndW = wc
			return ln
		}
		ln.Path, ln.W = append(ln.Path, st.x), append(ln.W, st.w)
		if j, wj, ej, done := tr.capture(fam, i, &ln, st, inside); done {
			ln.WErr += ej
			ln.To = j
			ln.EndW = wj
			if tr.pts[j].Order < -1 {
				wj = cmplx.Inf() // w diverges at a pole of order ≥ 2
			}
			ln.Path, ln.W = append(ln.Path, tr.pts[j].Z), append(ln.W, wj)
			if tr.pts[j].IsZero() {
				ln.End = EndTurningPoint
			} else {
				ln.End = EndPole
			}
			return ln
		}
	}
	ln.EndW = st.w
	return ln
}

// capture reports whether the line has reached a point. On entering the
// capture radius of a zero or a simple pole j it continues w to the point
// itself; the line ends there when w(t_j) lies on the line's level to
// within Settings.Degenerate, and otherwise passes by. A pole of higher
// order ends the line on entry.
func (tr *tracer) capture(fam Family, from int, ln *Line, st state, inside []bool) (int, complex128, float64, bool) {
	for j, p := range tr.pts {
		d := cmplx.Abs(st.x - p.Z)
		rc := tr.captureRadius(j)
		if d >= rc {
			inside[j] = false
			continue
		}
		if inside[j] {
			continue
		}
		inside[j] = true
		if j == from && ln.Length < 4*rc {
			continue
		}
		if p.Order < -1 {
			return j, st.w, 0, true
		}
		dw, errEst, _ := segment(tr.q, st.x, p.Z, st.f)
		wj := st.w + dw
		if math.Abs(part(fam, wj)) <= tr.set.Degenerate*cmplx.Abs(wj)+errEst {
			return j, wj, errEst, true
		}
	}
	return -1, 0, 0, false
}

// edgePoint moves c, where the chord of the last step crosses the edge of
// the box, along that edge onto the line itself (the chord misses the
// curve by about h²κ/8), by Newton's method on Re w (Stokes) or Im w
// (anti-Stokes) as a function of the position on the edge. It returns the
// point and w there, continued from prev.
func (tr *tracer) edgePoint(fam Family, prev state, c complex128) (complex128, complex128) {
	lo, hi := tr.box.Lo, tr.box.Hi
	eps := 1e-12 * tr.diag
	e := complex(1, 0) // along a horizontal edge
	if math.Abs(real(c)-real(lo)) <= eps || math.Abs(real(c)-real(hi)) <= eps {
		e = 1i // along a vertical edge
	}
	dw, f := smooth(tr.q, prev.x, c, prev.f)
	w := prev.w + dw
	for it := 0; it < 6; it++ {
		d := part(fam, f*e)
		if d == 0 {
			break
		}
		ds := -part(fam, w) / d
		n := c + e*complex(ds, 0)
		// Stay on the edge, inside the box.
		n = complex(math.Max(real(lo), math.Min(real(hi), real(n))), math.Max(imag(lo), math.Min(imag(hi), imag(n))))
		if n == c {
			break
		}
		dw, fn := smooth(tr.q, c, n, f)
		w += dw
		c, f = n, fn
		if math.Abs(ds) < eps {
			break
		}
	}
	return c, w
}

// alongPath returns ∫ √Q over the polygon of a traced path that runs from
// one turning point to another, the root principal at path[1] and
// continued: tanh-sinh on the first and last chords (singular at their
// outer ends), 12-point Gauss–Legendre on the others, which are no longer
// than a step and so at least four lengths from any singularity. The error
// estimate is that of the two tanh-sinh pieces; the caller compares the
// result with the tracer's own w.
func alongPath(q jet.Func, path []complex128) (complex128, float64, bool) {
	n := len(path)
	if n < 3 {
		s, e, _ := segment(q, path[0], path[n-1], cmplx.Sqrt(q.Eval((path[0]+path[n-1])/2)))
		return s, e, !cmplx.IsNaN(s) && !cmplx.IsInf(s)
	}
	f := cmplx.Sqrt(q.Eval(path[1]))
	s0, e0, _ := segment(q, path[1], path[0], f)
	w := -s0
	for k := 1; k+2 < n; k++ {
		var dw complex128
		dw, f = smooth(q, path[k], path[k+1], f)
		w += dw
	}
	s1, e1, _ := segment(q, path[n-2], path[n-1], f)
	w += s1
	return w, e0 + e1, !cmplx.IsNaN(w) && !cmplx.IsInf(w)
}

// clip returns the point where the segment from a (inside the box) to b
// (outside) crosses the edge of the box.
func clip(box turning.Box, a, b complex128) complex128 {
	s := 1.0
	d := b - a
	lim := func(a0, d0, lo, hi float64) {
		if d0 > 0 && a0+s*d0 > hi {
			s = (hi - a0) / d0
		} else if d0 < 0 && a0+s*d0 < lo {
			s = (lo - a0) / d0
		}
	}
	lim(real(a), real(d), real(box.Lo), real(box.Hi))
	lim(imag(a), imag(d), imag(box.Lo), imag(box.Hi))
	s = math.Max(0, math.Min(1, s))
	return a + complex(s, 0)*d
}

// degeneracies collects the Stokes lines that run between two zeros, each
// unordered pair once.
func (tr *tracer) degeneracies() {
	seen := map[[2]int]bool{}
	for _, ln := range tr.g.Lines {
		if ln.Family != Stokes || ln.End != EndTurningPoint || ln.To == ln.From || !tr.pts[ln.From].IsZero() {
			continue
		}
		key := [2]int{min(ln.From, ln.To), max(ln.From, ln.To)}
		if seen[key] {
			continue
		}
		seen[key] = true
		d := Degeneracy{From: ln.From, To: ln.To, Gap: ln.EndW, Err: math.Inf(1)}
		if g, e, ok := alongPath(tr.q, ln.Path); ok {
			if cmplx.Abs(g+ln.EndW) < cmplx.Abs(g-ln.EndW) {
				g = -g // the root principal at Path[1] is on the other branch
			}
			d.Gap = g
			d.Err = cmplx.Abs(g-ln.EndW) + e
		} else {
			tr.warnf("degeneracy %d–%d: ∫√Q along the traced path is not finite", ln.From, ln.To)
		}
		tr.g.Degeneracies = append(tr.g.Degeneracies, d)
	}
}
