package turning

import (
	"math"
	"math/cmplx"
)

// The winding number of Q along a closed polygon is the sum of the changes
// of arg Q along its sides (argument principle). Along a side the change is
// accumulated over samples by bisection (segArg) until, between neighbours,
// each change of arg is below argStep and log Q deviates from its linear
// interpolation by less than logDev at the midpoint. The second test holds
// for the analytic log Q once the samples are closer than about the distance
// to the nearest zero or pole; near a jump (a branch cut crossing the side)
// it never holds, which is how non-meromorphic Q are detected.
const (
	argStep   = math.Pi / 4 // largest change of arg Q between samples
	logDev    = 0.1         // largest midpoint deviation of log Q from linear
	baseSegs  = 8           // initial samples per side of a cell
	minRelLen = 1e-11       // bisection stops below this fraction of the side
	zeroRatio = 1e-6        // |Q| below this fraction of the side's typical size: a zero on the side
	poleRatio = 1e6         // |Q| above this multiple of it: a pole on the side
)

// failKind says why the winding along a side could not be computed.
type failKind int

const (
	failZero failKind = iota // a zero of Q on (or within rounding of) the side
	failPole                 // a pole of Q on the side
	failNaN                  // Q is NaN on the side
	failJump                 // Q jumps: a branch cut crosses the side
)

// sideFail records where and why a side failed.
type sideFail struct {
	z    complex128
	kind failKind
}

// phaseDiff returns arg(b/a) in (−π, π] without forming the quotient.
func phaseDiff(a, b complex128) float64 {
	d := cmplx.Phase(b) - cmplx.Phase(a)
	if d > math.Pi {
		d -= 2 * math.Pi
	} else if d <= -math.Pi {
		d += 2 * math.Pi
	}
	return d
}

// sampleKind classifies a sample value that ends the sampling at once.
func sampleKind(q complex128) (failKind, bool) {
	switch {
	case q == 0:
		return failZero, true
	case cmplx.IsNaN(q):
		return failNaN, true
	case cmplx.IsInf(q) || math.IsInf(real(q), 0) || math.IsInf(imag(q), 0):
		return failPole, true
	}
	return 0, false
}

// sideArg returns the continuous change of arg Q along the segment from a
// to b, sampled at no fewer than n sub-segments. On failure it returns the
// place and the kind.
func (f *finder) sideArg(a, b complex128, n int) (float64, *sideFail) {
	pts := make([]complex128, n+1)
	vals := make([]complex128, n+1)
	var logSum float64
	for k := 0; k <= n; k++ {
		pts[k] = a + (b-a)*complex(float64(k)/float64(n), 0)
		if k == n {
			pts[k] = b
		}
		vals[k] = f.eval(pts[k])
		if kind, bad := sampleKind(vals[k]); bad {
			return 0, &sideFail{pts[k], kind}
		}
		logSum += math.Log(cmplx.Abs(vals[k]))
	}
	typ := logSum / float64(n+1) // log of the geometric mean of |Q|
	maxLen := cmplx.Abs(b-a) / float64(n) * (1 + 1e-9)
	minLen := math.Max(minRelLen*cmplx.Abs(b-a), 64*eps*math.Max(cmplx.Abs(a), cmplx.Abs(b)))
	var total float64
	for k := 0; k < n; k++ {
		d, fail := f.segArg(pts[k], pts[k+1], vals[k], vals[k+1], maxLen, minLen, typ)
		if fail != nil {
			return 0, fail
		}
		total += d
	}
	return total, nil
}

// segArg is the recursive step of sideArg.
func (f *finder) segArg(a, b, qa, qb complex128, maxLen, minLen, typ float64) (float64, *sideFail) {
	m := (a + b) / 2
	qm := f.eval(m)
	if kind, bad := sampleKind(qm); bad {
		return 0, &sideFail{m, kind}
	}
	d1, d2 := phaseDiff(qa, qm), phaseDiff(qm, qb)
	la, lm, lb := math.Log(cmplx.Abs(qa)), math.Log(cmplx.Abs(qm)), math.Log(cmplx.Abs(qb))
	dev := math.Hypot((lm-la)-(lb-lm), d1-d2) / 2 // |log qm − (log qa + log qb)/2|
	l := cmplx.Abs(b - a)
	if l <= maxLen && math.Abs(d1) < argStep && math.Abs(d2) < argStep && dev < logDev {
		return d1 + d2, nil
	}
	if l < minLen {
		lmin := math.Min(la, math.Min(lm, lb))
		lmax := math.Max(la, math.Max(lm, lb))
		kind := failJump
		switch {
		case lmin < typ+math.Log(zeroRatio):
			kind = failZero
		case lmax > typ+math.Log(poleRatio):
			kind = failPole
		}
		return 0, &sideFail{m, kind}
	}
	x, fail := f.segArg(a, m, qa, qm, maxLen, minLen, typ)
	if fail != nil {
		return 0, fail
	}
	y, fail := f.segArg(m, b, qm, qb, maxLen, minLen, typ)
	if fail != nil {
		return 0, fail
	}
	return x + y, nil
}

// loopWinding returns the winding number of Q along the closed polygon
// through pts (the last point joins the first), n sub-segments per side at
// least, and the winding as a real number before rounding.
func (f *finder) loopWinding(pts []complex128, n int) (int, float64, *sideFail) {
	var total float64
	for i := range pts {
		d, fail := f.sideArg(pts[i], pts[(i+1)%len(pts)], n)
		if fail != nil {
			return 0, 0, fail
		}
		total += d
	}
	w := total / (2 * math.Pi)
	return int(math.Round(w)), w, nil
}

// circleWinding returns the winding number of Q along a regular 12-gon of
// radius r around z.
func (f *finder) circleWinding(z complex128, r float64) (int, *sideFail) {
	const n = 12
	pts := make([]complex128, n)
	for k := range pts {
		s, c := math.Sincos(2 * math.Pi * float64(k) / n)
		pts[k] = z + complex(r*c, r*s)
	}
	w, _, fail := f.loopWinding(pts, 2)
	return w, fail
}
