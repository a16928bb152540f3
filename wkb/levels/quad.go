package levels

import (
	"math"
	"math/cmplx"
	"sort"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"
)

const eps = 0x1p-52

// glCache holds Gauss–Legendre rules on [0, 1] by node count.
var glCache sync.Map

type glRule struct{ x, w []float64 }

func gaussLegendre(n int) glRule {
	if r, ok := glCache.Load(n); ok {
		return r.(glRule)
	}
	r := glRule{x: make([]float64, n), w: make([]float64, n)}
	quad.Legendre{}.FixedLocations(r.x, r.w, 0, 1)
	sort.Sort(byNode(r))
	glCache.Store(n, r)
	return r
}

// integrate returns ∫_lo^hi f for an integrand with m components, doubling
// the Gauss–Legendre nodes from 16 until each component changes by less than
// tol[k] (the last entry for the rest) relative to itself plus its rounding
// scale. f fills out at t and
// reports false where it cannot be evaluated. ok is false if the rule did
// not converge within maxNodes (the values are then the last ones).
//
// f is called on ascending t so that it may continue a branch of √Q from
// one node to the next; it is told when a new rule starts (first = true).
func integrate(f func(t float64, first bool, out []complex128) bool, m int, lo, hi float64, tol []float64, maxNodes int) (val []complex128, change []float64, n int, ok bool, defined bool) {
	out := make([]complex128, m)
	change = make([]float64, m)
	var old []complex128
	for n = 16; n <= maxNodes; n *= 2 {
		r := gaussLegendre(n)
		val = make([]complex128, m)
		mag := make([]float64, m)
		for i := range r.x {
			t := lo + (hi-lo)*r.x[i]
			if !f(t, i == 0, out) {
				return nil, nil, n, false, false
			}
			w := r.w[i] * (hi - lo)
			for k := range out {
				val[k] += complex(w, 0) * out[k]
				mag[k] += w * cmplx.Abs(out[k])
			}
		}
		if old != nil {
			done := true
			for k := range val {
				change[k] = cmplx.Abs(val[k] - old[k])
				tk := tol[min(k, len(tol)-1)]
				if change[k] > tk*cmplx.Abs(val[k])+16*eps*mag[k] {
					done = false
				}
			}
			if done {
				for k := range change {
					change[k] += 16 * eps * mag[k]
				}
				return val, change, n, true, true
			}
		}
		old = val
	}
	for k := range change {
		if math.IsNaN(change[k]) {
			change[k] = math.Inf(1)
		}
	}
	return old, change, n / 2, false, true
}

type byNode glRule

func (b byNode) Len() int           { return len(b.x) }
func (b byNode) Less(i, j int) bool { return b.x[i] < b.x[j] }
func (b byNode) Swap(i, j int) {
	b.x[i], b.x[j] = b.x[j], b.x[i]
	b.w[i], b.w[j] = b.w[j], b.w[i]
}
