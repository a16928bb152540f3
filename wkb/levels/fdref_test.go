package levels

import "math"

// fdLevel returns eigenvalue n (counting from 0) of the three-point finite
// difference form of −(ħ²/2m)ψ″ + Vψ on [a, b] with ψ(a) = ψ(b) = 0 and
// m intervals, by bisection on the Sturm count of the tridiagonal matrix
// (the number of negative pivots of T − xI is the number of eigenvalues
// below x; Wilkinson, The Algebraic Eigenvalue Problem, 1965, §5.37). The
// eigenvalues are identified by index, i.e. by node count. This is the
// independent reference of the tests.
func fdLevel(v func(float64) float64, mass, hbar, a, b float64, m, n int) float64 {
	h := (b - a) / float64(m)
	k := hbar * hbar / (2 * mass * h * h)
	d := make([]float64, m-1)
	lo, hi := math.Inf(1), math.Inf(-1)
	for i := range d {
		d[i] = 2*k + v(a+float64(i+1)*h)
		lo = math.Min(lo, d[i]-2*k)
		hi = math.Max(hi, d[i]+2*k)
	}
	count := func(x float64) int {
		c := 0
		q := 1.0
		for i := range d {
			if i == 0 {
				q = d[0] - x
			} else {
				q = d[i] - x - k*k/q
			}
			if q == 0 {
				q = -1e-300
			}
			if q < 0 {
				c++
			}
		}
		return c
	}
	for it := 0; it < 200 && hi-lo > 4e-16*math.Max(math.Abs(lo), math.Abs(hi)); it++ {
		mid := (lo + hi) / 2
		if count(mid) > n {
			hi = mid
		} else {
			lo = mid
		}
	}
	return (lo + hi) / 2
}

// fdRichardson returns eigenvalue n extrapolated from m, 2m and 4m
// intervals (error h², h⁴ removed) and an error estimate: the last
// extrapolation's change plus the rounding floor of the bisection, about
// eps·‖T‖ on the finest grid, amplified by the extrapolation.
func fdRichardson(v func(float64) float64, mass, hbar, a, b float64, m, n int) (float64, float64) {
	e1 := fdLevel(v, mass, hbar, a, b, m, n)
	e2 := fdLevel(v, mass, hbar, a, b, 2*m, n)
	e4 := fdLevel(v, mass, hbar, a, b, 4*m, n)
	r1 := (4*e2 - e1) / 3
	r2 := (4*e4 - e2) / 3
	r := (16*r2 - r1) / 15
	h := (b - a) / float64(4*m)
	norm := 2 * hbar * hbar / (mass * h * h)
	for i := 0; i <= 100; i++ {
		norm = math.Max(norm, 2*hbar*hbar/(mass*h*h)+math.Abs(v(a+(b-a)*float64(i)/100)))
	}
	return r, math.Abs(r-r2) + 16*0x1p-52*norm
}
