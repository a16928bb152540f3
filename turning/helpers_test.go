package turning

import (
	"math"
	"math/cmplx"
	"sort"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// polyFunc returns the polynomial with coefficients c (increasing powers),
// evaluated by Horner's rule on jets.
func polyFunc(c []complex128) jet.Func {
	return jet.Map(func(s jet.Series) jet.Series {
		r := jet.Const(c[len(c)-1], s.Order())
		for k := len(c) - 2; k >= 0; k-- {
			r = jet.Add(jet.Mul(r, s), jet.Const(c[k], s.Order()))
		}
		return r
	})
}

// fromRoots returns the coefficients (increasing powers) of Π (x − r).
func fromRoots(roots []complex128) []complex128 {
	c := []complex128{1}
	for _, r := range roots {
		n := make([]complex128, len(c)+1)
		for k, v := range c {
			n[k+1] += v
			n[k] -= r * v
		}
		c = n
	}
	return c
}

// productFunc returns Π (x − r)^m over the given roots and orders,
// evaluated as a product (so multiple zeros are exact).
func productFunc(roots []complex128, orders []int) jet.Func {
	return jet.Map(func(s jet.Series) jet.Series {
		r := jet.Const(1, s.Order())
		for i, z := range roots {
			r = jet.Mul(r, jet.PowInt(jet.Sub(s, jet.Const(z, s.Order())), orders[i]))
		}
		return r
	})
}

// expand lists each point's position Order times (|Order| for poles).
func expand(pts []Point) []complex128 {
	var z []complex128
	for _, p := range pts {
		m := p.Order
		if m < 0 {
			m = -m
		}
		for k := 0; k < m; k++ {
			z = append(z, p.Z)
		}
	}
	return z
}

// matchError pairs every reference with the nearest unused candidate and
// returns the largest distance, or +Inf when the counts differ.
func matchError(got, want []complex128) float64 {
	if len(got) != len(want) {
		return math.Inf(1)
	}
	used := make([]bool, len(got))
	w := append([]complex128(nil), want...)
	sort.Slice(w, func(i, j int) bool { return real(w[i]) < real(w[j]) })
	worst := 0.0
	for _, z := range w {
		best, bd := -1, math.Inf(1)
		for i, g := range got {
			if !used[i] && cmplx.Abs(g-z) < bd {
				best, bd = i, cmplx.Abs(g-z)
			}
		}
		used[best] = true
		if bd > worst {
			worst = bd
		}
	}
	return worst
}
