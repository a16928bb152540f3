package levels

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
)

// beyondAllOrders estimates the exponentially small contributions to the
// phase of the pair (t1, t2) that no order of the asymptotic series sees:
// those of the other zeros s of Q near the pair. The exact quantisation
// condition couples the pair to s through the cycle integral
// 2λ∫_{t}^{s}√Q (t the nearer turning point), and the coupling enters the
// phase as exp(−|Im 2λ∫_t^s √Q|) times a factor of modulus at most about 1
// (exact WKB, e.g. Voros, Ann. Inst. H. Poincaré A 39, 211 (1983), for the
// quartic oscillator, whose imaginary turning points ±iE^(1/4) cause the
// deviation of all-orders WKB from the exact levels). It returns that
// exponential for the dominant zero, and the zero (0 and false if none was
// found). Zeros are found by Newton's method from starting points on
// ellipses about the pair.
func beyondAllOrders(p wkb.Problem, t1, t2 float64) (float64, complex128, bool) {
	zs := otherZeros(p, complex(t1, 0), complex(t2, 0))
	best, bestZ, found := 0.0, complex128(0), false
	for _, s := range zs {
		for _, t := range []float64{t1, t2} {
			if !isolatedPair(p, complex(t, 0), s) || isPeriod(p, s-complex(t1, 0)) || isPeriod(p, s-complex(t2, 0)) {
				continue
			}
			I, ok := segmentPhase(p, complex(t, 0), s)
			if !ok {
				continue
			}
			v := math.Exp(-2 * math.Abs(imag(I)))
			if v > best {
				best, bestZ, found = v, s, true
			}
		}
	}
	return best, bestZ, found
}

// isolatedPair reports whether the ellipse with foci t and s of radius 2
// holds no zero or pole of Q besides them (winding number 2). A pole next to
// the segment (a double pole of a sech² well, say) ends the Stokes lines
// that would couple t to s, and the straight-segment exponent would mean
// nothing; such zeros are left out of the estimate.
func isolatedPair(p wkb.Problem, t, s complex128) bool {
	c, h := (t+s)/2, (s-t)/2
	const n = 256
	var wind float64
	prev := p.Q.Eval(c + h*(2+0.5)/2)
	for j := 1; j <= n; j++ {
		w := 2 * cmplx.Exp(complex(0, 2*math.Pi*float64(j)/n))
		q := p.Q.Eval(c + h*(w+1/w)/2)
		d := cmplx.Phase(q / prev)
		if math.Abs(d) > math.Pi/2 || cmplx.IsNaN(q) {
			return false
		}
		wind += d
		prev = q
	}
	return math.Round(wind/(2*math.Pi)) == 2
}

// isPeriod reports whether Q(x + d) = Q(x) at a few points: then a zero at
// t + d is t itself on another sheet of the uniformising variable (e^(−ax)
// for a Morse well, e^(2x) for sech²), where the equation has a regular
// singular point rather than a second turning point, and it does not
// couple to t through a barrier.
func isPeriod(p wkb.Problem, d complex128) bool {
	for _, x := range []complex128{0.1, -0.37 + 0.2i, 0.73 - 0.11i} {
		a, b := p.Q.Eval(x), p.Q.Eval(x+d)
		if cmplx.Abs(a-b) > 1e-9*(cmplx.Abs(a)+cmplx.Abs(b)) {
			return false
		}
	}
	return true
}

// otherZeros returns zeros of Q other than t1, t2 found by Newton's method
// from 36 starting points on three ellipses with foci t1, t2.
func otherZeros(p wkb.Problem, t1, t2 complex128) []complex128 {
	c, h := (t1+t2)/2, (t2-t1)/2
	scale := cmplx.Abs(h)
	var out []complex128
	for _, r := range []float64{1.5, 2.5, 4} {
		for j := 0; j < 12; j++ {
			w := complex(r, 0) * cmplx.Exp(complex(0, 2*math.Pi*(float64(j)+0.5)/12))
			z := c + h*(w+1/w)/2
			ok := false
			for it := 0; it < 60; it++ {
				t := p.Q.Taylor(z, 1)
				if t[1] == 0 || !t.IsFinite() {
					break
				}
				dz := t[0] / t[1]
				z -= dz
				if cmplx.Abs(dz) < 1e-13*scale {
					ok = true
					break
				}
			}
			if !ok || cmplx.Abs(z-t1) < 1e-6*scale || cmplx.Abs(z-t2) < 1e-6*scale || cmplx.Abs(z-c) > 20*scale {
				continue
			}
			dup := false
			for _, o := range out {
				if cmplx.Abs(o-z) < 1e-6*scale {
					dup = true
					break
				}
			}
			if !dup {
				out = append(out, z)
			}
		}
	}
	return out
}

// segmentPhase returns λ∫_t^s √Q along the straight segment, both ends
// zeros of Q, with x = t + (s−t)(1−cos α)/2 removing both square-root
// singularities. The root is continued from the t end.
func segmentPhase(p wkb.Problem, t, s complex128) (complex128, bool) {
	d := (s - t) / 2
	var branch complex128
	f := func(a float64, first bool, out []complex128) bool {
		sn, co := math.Sincos(a)
		x := t + d*complex(1-co, 0)
		r := cmplx.Sqrt(p.Q.Eval(x))
		if first || branch == 0 {
			branch = r
		}
		if cmplx.Abs(r+branch) < cmplx.Abs(r-branch) {
			r = -r
		}
		branch = r
		out[0] = r * d * complex(sn, 0)
		return !cmplx.IsNaN(r)
	}
	val, _, _, _, def := integrate(f, 1, 0, math.Pi, []float64{1e-8}, 512)
	if !def {
		return 0, false
	}
	return complex(p.Lambda, 0) * val[0], true
}

// wallShift returns the phase shift by which hard walls beyond soft ends
// move the quantisation condition, and the largest single-wall exponent
// e^(−2S). Beyond a soft end t the WKB solution that decays from t into the
// barrier is ψ ∝ κ^(−1/2)(e^(−∫_t^x κ) − e^(−2S) e^(+∫_t^x κ)), κ = √(−Q),
// S = λ∫_t^w √(−Q) dx, so that ψ(w) = 0 at the wall w; the decaying wave
// connects to 2k^(−1/2)cos(∫_x^t k − π/4) and the growing one to
// −k^(−1/2)sin(∫_x^t k − π/4) (the linear-turning-point connection
// formulae, e.g. Landau & Lifshitz, QM §47 and §50; typed from memory), so the admixture turns the allowed-side wave into
// cos(∫_x^t k − π/4 − e^(−2S)/2) to first order: the end's phase π/4
// becomes π/4 + e^(−2S)/2, and the level rises by
// ΔE = (e^(−2S)/2)/(∂Phase/∂E) = (ħω/π)e^(−2S)/2 per wall. It is the wall's
// analogue of Beyond: exponentially small, invisible to every order of the
// series of the pair. Forbidden stretches only count (where another
// allowed region lies between, the level carries a several-wells warning).
func wallShift(w wkb.Well, E float64, a, b end) (shift, largest float64) {
	var ends [][2]float64
	if !a.wall && w.LeftWall && w.A < a.x {
		ends = append(ends, [2]float64{a.x, w.A})
	}
	if !b.wall && w.RightWall && w.B > b.x {
		ends = append(ends, [2]float64{b.x, w.B})
	}
	q := w.Problem(E).Q
	for _, e := range ends {
		t, xw := e[0], e[1]
		d := xw - t
		// x = t + d u²: the square-root zero of −Q at t becomes smooth.
		f := func(u float64, _ bool, out []complex128) bool {
			v := -real(q.Eval(complex(t+d*u*u, 0)))
			if v < 0 {
				v = 0
			}
			out[0] = complex(math.Sqrt(v)*2*math.Abs(d)*u, 0)
			return !math.IsNaN(v) && !math.IsInf(v, 0)
		}
		val, _, _, _, def := integrate(f, 1, 0, 1, []float64{1e-8}, maxQuadNodes)
		if !def {
			continue
		}
		v := math.Exp(-2 * w.Problem(E).Lambda * real(val[0]))
		shift += v / 2
		largest = math.Max(largest, v)
	}
	return shift, largest
}
