package turning

import (
	"math"
	"math/cmplx"
)

// realSymmetric reports whether Q(conj z) = conj Q(z) to 1e-10 relative at
// fixed points of the box (at least three where Q is finite), that is,
// whether Q is real on the real axis.
func (f *finder) realSymmetric(b Box) bool {
	fr := [...]complex128{0.2137 + 0.3119i, 0.6571 + 0.8233i, 0.9013 + 0.1447i, 0.3779 + 0.5531i, 0.7243 + 0.0613i}
	w := b.Hi - b.Lo
	n := 0
	for _, t := range fr {
		z := b.Lo + complex(real(t)*real(w), imag(t)*imag(w))
		v, vc := f.eval(z), f.eval(cmplx.Conj(z))
		if !isFinite(v) || !isFinite(vc) {
			continue
		}
		if cmplx.Abs(vc-cmplx.Conj(v)) > 1e-10*cmplx.Abs(v) {
			return false
		}
		n++
	}
	return n >= 3
}

// snapReal moves p onto the real axis when Q is real there and Newton's
// method in real arithmetic converges near Re p.Z; it reports whether it did.
func (f *finder) snapReal(p *Point) bool {
	m, pole := p.Order, false
	if m < 0 {
		m, pole = -m, true
	}
	x := real(p.Z)
	tol := f.set.Tol * f.scale
	reach := math.Max(f.set.RealTol*f.scale, 10*p.Err)
	prev := math.Inf(1)
	for it := 0; it < maxNewton; it++ {
		s, at, good := f.local(complex(x, 0), m, pole)
		if !good {
			return false
		}
		var d float64
		if !at {
			dc, ok := newtonStep(s, m)
			if !ok {
				return false
			}
			d = real(dc)
		}
		x -= d
		a := math.Abs(d)
		if math.Abs(x-real(p.Z)) > 2*reach {
			return false
		}
		if a <= tol || at || (it >= 6 && a >= 0.5*prev) {
			e := f.stepSize(complex(x, 0), m, pole)
			p.Err = math.Max(math.Max(e, a), 4*eps*math.Max(math.Abs(x), tol))
			p.Z = complex(x, 0)
			return true
		}
		prev = a
	}
	return false
}

// finish snaps, merges and classifies the points, notes those on the box
// boundary and sorts them.
func (f *finder) finish(box Box) {
	f.realQ = f.realSymmetric(box)
	realTol := f.set.RealTol * f.scale
	if f.realQ {
		for i := range f.points {
			p := &f.points[i]
			if imag(p.Z) != 0 && math.Abs(imag(p.Z)) <= math.Max(realTol, 10*p.Err) {
				if f.snapReal(p) {
					f.setResidual(p)
				}
			}
		}
	}
	f.points = mergeCoincident(f.points)
	for i := range f.points {
		p := &f.points[i]
		f.setResidual(p)
		switch {
		case p.Order < 0:
			p.Kind = Pole
		case p.Order >= 2:
			p.Kind = Coalescing
		case f.hasNeighbour(i):
			p.Kind = Coalescing
		case math.Abs(imag(p.Z)) <= realTol:
			p.Kind = RealSimple
		case f.realQ:
			p.Kind = ComplexPair
		default:
			p.Kind = Complex
		}
		if p.Kind == ComplexPair && box.Contains(cmplx.Conj(p.Z)) && !f.hasPoint(cmplx.Conj(p.Z), p.Order, p.Err) {
			f.setStatus(CountMismatch)
			f.warnf("zero at %s has no conjugate partner in the box although q is real on the axis", fmtZ(p.Z))
		}
		margin := math.Max(10*p.Err, 1e-12*f.scale)
		if !insideBy(box, p.Z, margin) {
			f.warnf("%s of order %d at %s lies on the box boundary", kindWord(p.Order), p.Order, fmtZ(p.Z))
		}
	}
	sortPoints(f.points, realTol)
}

// hasNeighbour reports whether zero i has another zero within the
// coalescence radius.
func (f *finder) hasNeighbour(i int) bool {
	p := f.points[i]
	for j, q := range f.points {
		if j != i && q.Order > 0 && cmplx.Abs(p.Z-q.Z) < f.set.CoalesceRadius {
			return true
		}
	}
	return false
}

// hasPoint reports whether a point of the given order lies within
// max(100·err, 1e-9·L) of z.
func (f *finder) hasPoint(z complex128, order int, err float64) bool {
	for _, q := range f.points {
		if q.Order == order && cmplx.Abs(q.Z-z) <= math.Max(100*(err+q.Err), 1e-9*f.scale) {
			return true
		}
	}
	return false
}

// mergeCoincident joins points of the same sign that coincide within their
// error estimates (found twice, or a pair made one by snapping).
func mergeCoincident(pts []Point) []Point {
	out := pts[:0]
	for _, p := range pts {
		merged := false
		for k := range out {
			q := &out[k]
			if (p.Order > 0) == (q.Order > 0) && cmplx.Abs(p.Z-q.Z) <= 2*(p.Err+q.Err) {
				q.Order += p.Order
				q.Err = math.Max(math.Max(q.Err, p.Err), cmplx.Abs(p.Z-q.Z))
				merged = true
				break
			}
		}
		if !merged {
			out = append(out, p)
		}
	}
	return out
}

// insideBy reports whether z lies inside b at least margin from its boundary.
func insideBy(b Box, z complex128, margin float64) bool {
	return real(z) > real(b.Lo)+margin && real(z) < real(b.Hi)-margin &&
		imag(z) > imag(b.Lo)+margin && imag(z) < imag(b.Hi)-margin
}

func kindWord(order int) string {
	if order < 0 {
		return "pole"
	}
	return "zero"
}
