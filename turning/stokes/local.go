package stokes

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// leading returns the coefficient a of the leading term Q ≈ a(x−t)^m at a
// point of order m (m < 0 for a pole). For a zero it is the Taylor
// coefficient Q^(m)(t)/m!; for a pole of order k = −m it is the mean of
// Q(x)(x−t)^k over a circle of radius r around t, the trapezoid rule for
// (1/2πi)∮ Q (x−t)^(k−1) dx, which converges geometrically.
func leading(q jet.Func, p turning.Point, r float64) (complex128, error) {
	m := p.Order
	switch {
	case m > 0:
		a := q.Taylor(p.Z, m)[m]
		if a == 0 || cmplx.IsNaN(a) || cmplx.IsInf(a) {
			return 0, fmt.Errorf("stokes: leading coefficient of Q at %v (order %d) is %v", p.Z, m, a)
		}
		return a, nil
	case m < 0:
		const n = 64
		var s complex128
		for j := 0; j < n; j++ {
			u := cmplx.Rect(r, 2*math.Pi*(float64(j)+0.5)/n)
			s += q.Eval(p.Z+u) * cmplx.Pow(u, complex(float64(-m), 0))
		}
		a := s / n
		if a == 0 || cmplx.IsNaN(a) || cmplx.IsInf(a) {
			return 0, fmt.Errorf("stokes: leading coefficient of Q at the pole %v (order %d) is %v", p.Z, m, a)
		}
		return a, nil
	}
	return 0, errors.New("stokes: point of order 0")
}

// anglesFor returns the directions, in (−π, π], in which the lines of the
// family leave a point of order m where Q ≈ a(x−t)^m. With x − t = r e^(iθ),
//
//	w ≈ (2/(m+2)) √a r^((m+2)/2) e^(i(m+2)θ/2),
//
// so arg w = arg(a)/2 + (m+2)θ/2 (mod π). Re w = 0 needs arg w = π/2 (mod π),
// Im w = 0 needs arg w = 0 (mod π):
//
//	θ_k = (π + 2kπ − arg a)/(m+2)   (Stokes),
//	θ_k = (2kπ − arg a)/(m+2)       (anti-Stokes),   k = 0 … m+1.
//
// The two families interleave, π/(m+2) apart. Poles of order 2 or more emit
// no lines (w diverges there); a simple pole (m = −1) emits one of each.
func anglesFor(a complex128, m int, f Family) []float64 {
	n := m + 2
	if n <= 0 {
		return nil
	}
	phi0 := 0.0
	if f == Stokes {
		phi0 = math.Pi
	}
	out := make([]float64, n)
	for k := range out {
		th := (phi0 + 2*math.Pi*float64(k) - cmplx.Phase(a)) / float64(n)
		out[k] = wrap(th)
	}
	return out
}

// wrap maps an angle to (−π, π].
func wrap(th float64) float64 {
	th = math.Mod(th, 2*math.Pi)
	if th <= -math.Pi {
		th += 2 * math.Pi
	} else if th > math.Pi {
		th -= 2 * math.Pi
	}
	return th
}

// Angles returns the directions in which the lines of family f leave the
// point p of Q, from the leading term of the local expansion of Q at p: m+2
// lines for a zero of order m, one for a simple pole, none for a pole of
// higher order. The angles are in (−π, π], in the order k = 0, 1, … of the
// formula in the package documentation.
func Angles(q jet.Func, p turning.Point, f Family) ([]float64, error) {
	if q == nil {
		return nil, errors.New("stokes: nil Q")
	}
	if p.Order == 0 {
		return nil, fmt.Errorf("stokes: point %v has order 0", p.Z)
	}
	if p.Order < -1 {
		return nil, nil
	}
	r := 1e-3 * math.Max(1, cmplx.Abs(p.Z))
	a, err := leading(q, p, r)
	if err != nil {
		return nil, err
	}
	return anglesFor(a, p.Order, f), nil
}
