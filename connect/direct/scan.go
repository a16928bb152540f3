package direct

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// scanOrder is the order of the jets used to estimate distances to
// singularities.
const scanOrder = 24

// geometry summarises what the method choice needs to know about Q near
// the real interval.
type geometry struct {
	dmin     float64 // distance from [a, b] to the nearest zero or pole of K² (+Inf if none seen)
	at       float64 // real point where dmin was attained
	realZero bool    // a zero or singularity on or very near the interval, or Re K² ≤ 0 somewhere
	qmin     float64 // min |K²| = |λ²Q + Q1| over the sample points
}

// radius estimates the radius of convergence of Σ c_j Δ^j from the decay
// between two pairs of late coefficients, ((|c_k1|+|c_k1+1|)/(|c_k2|+|c_k2+1|))^(1/(k2−k1)).
// Summing neighbours keeps the estimate from failing where a conjugate pair
// of singularities makes single coefficients nearly vanish. +Inf when the
// late coefficients vanish (entire function, or a polynomial) or are too
// close to underflow (below 1e-280, where they have lost their digits) to
// say anything.
func radius(c jet.Series) float64 {
	n := len(c) - 1
	k1, k2 := n/2, n-1
	num := cmplx.Abs(c[k1]) + cmplx.Abs(c[k1+1])
	den := cmplx.Abs(c[k2]) + cmplx.Abs(c[k2+1])
	const floor = 1e-280
	if den < floor || num < floor || den < 1e-300*num {
		return math.Inf(1)
	}
	return math.Pow(num/den, 1/float64(k2-k1))
}

// singDistance estimates the distance from x to the nearest zero or pole
// of K² = λ²Q + Q1: the radius of convergence of (K²)′/K², which has simple
// poles at both. It also returns K²(x).
func singDistance(p wkb.Problem, x float64) (d float64, k20 complex128) {
	d, k2 := singDistanceJet(p, x)
	return d, k2[0]
}

// singDistanceJet is singDistance, returning the jet of K² at x.
func singDistanceJet(p wkb.Problem, x float64) (float64, jet.Series) {
	k2 := kSquared(p, complex(x, 0), scanOrder+1)
	return radius(jet.Div(deriv(k2), trunc(k2, scanOrder))), k2
}

// scanSamples is the number of points along a step of the scan at which K²
// is compared with its series from the start of the step (alongCheck): an
// entire K² with a narrow feature far from x (a Gaussian) has jets at x
// that look constant.
const scanSamples = 16

// scanAxis walks from a to b in steps of half the local distance to the
// nearest singularity, so that no real zero can be stepped over, and records
// the smallest distance. It stops early, with realZero set, when Re Q
// changes sign or the distance falls below 1e-4 (b − a).
func scanAxis(p wkb.Problem, a, b float64) geometry {
	g := geometry{dmin: math.Inf(1), qmin: math.Inf(1)}
	span := b - a
	x := a
	prevSign := 0.0
	for i := 0; i < 100000; i++ {
		d, k2 := singDistanceJet(p, x)
		q0 := k2[0]
		if !finite(q0) || math.IsNaN(d) {
			g.realZero = true
			return g
		}
		if aq := cmplx.Abs(q0); aq < g.qmin {
			g.qmin = aq
		}
		if d < g.dmin {
			g.dmin, g.at = d, x
		}
		sign := math.Copysign(1, real(q0))
		if real(q0) <= 0 || (prevSign != 0 && sign != prevSign) {
			g.realZero = true
			return g
		}
		prevSign = sign
		if d < 1e-4*span {
			g.realZero = true
			return g
		}
		if x >= b {
			return refineMin(p, a, b, g)
		}
		h := math.Min(b-x, math.Min(0.5*d, span/32))
		if hs := alongCheck(p, complex(x, 0), 1, k2, h, 1e-12, scanSamples); hs < h {
			// Something the jets at x did not show: step to just before
			// it, where they will.
			h = math.Max(hs, h/scanSamples)
		}
		x = math.Min(b, x+h)
	}
	g.realZero = true // did not finish: treat as unsafe for the raised path
	return g
}

// givenGeometry uses singularities supplied by the caller: only those with
// Im ≥ 0 matter for a path raised into the upper half plane.
func givenGeometry(p wkb.Problem, a, b float64, pts []complex128) geometry {
	g := geometry{dmin: math.Inf(1), qmin: math.Inf(1)}
	span := b - a
	for _, s := range pts {
		if imag(s) < 0 {
			continue
		}
		xr := math.Min(b, math.Max(a, real(s)))
		d := cmplx.Abs(s - complex(xr, 0))
		if d < g.dmin {
			g.dmin, g.at = d, xr
		}
		if d < 1e-4*span {
			g.realZero = true
		}
	}
	for i := 0; i <= 64; i++ {
		x := a + span*float64(i)/64
		q0 := kSquared(p, complex(x, 0), 0)[0]
		if aq := cmplx.Abs(q0); aq < g.qmin {
			g.qmin = aq
		}
		if real(q0) <= 0 {
			g.realZero = true
		}
	}
	return g
}

// refineMin resamples the neighbourhood of the closest approach found by
// scanAxis on finer and finer grids: stepping by half the local distance
// can pass a singularity at a point where the distance is still about
// twice its height, and the path height is a fraction of that distance.
func refineMin(p wkb.Problem, a, b float64, g geometry) geometry {
	if math.IsInf(g.dmin, 1) {
		return g
	}
	// The estimates of radius scatter by a few per cent: only a clearly
	// closer approach moves the minimum.
	s := g.dmin / 4
	for pass := 0; pass < 3; pass++ {
		c := g.at
		bd, bx := g.dmin, g.at
		for j := -8; j <= 8; j++ {
			x := c + s*float64(j)
			if j == 0 || x < a || x > b {
				continue
			}
			d, q0 := singDistance(p, x)
			if !finite(q0) || math.IsNaN(d) || real(q0) <= 0 || d < 1e-4*(b-a) {
				g.realZero = true
				return g
			}
			if aq := cmplx.Abs(q0); aq < g.qmin {
				g.qmin = aq
			}
			if d < bd {
				bd, bx = d, x
			}
		}
		if bd > 0.95*g.dmin {
			return g
		}
		g.dmin, g.at = bd, bx
		s /= 4
	}
	return g
}
