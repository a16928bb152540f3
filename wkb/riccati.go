package wkb

import (
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Riccati returns the terms φ_0, …, φ_kmax of the WKB (Riccati) series as
// Taylor series about one point. For y″ + (λ²Q + Q1) y = 0 the logarithmic
// derivative φ = y′/y satisfies φ′ + φ² + λ²Q + Q1 = 0; with
//
//	φ = Σ_k λ^(1−k) φ_k
//
// the powers of λ separate into
//
//	φ_0 = i √Q,   φ_1 = −φ_0′/(2φ_0),
//	φ_k = −(φ′_{k−1} + Σ_{j=1}^{k−1} φ_j φ_{k−j} + [k=2] Q1) / (2φ_0).
//
// q holds the Taylor coefficients of Q at the point and q1 those of Q1 (nil
// means Q1 = 0; otherwise it must have the length of q). The branch of √Q is
// the one closest to branch (the principal one when branch is 0). Each
// differentiation costs one order, so phi[k] has order q.Order() − k and
// phi[k][0] = φ_k at the point, exact up to rounding. Riccati panics if kmax
// is negative or exceeds q.Order().
func Riccati(q, q1 jet.Series, branch complex128, kmax int) []jet.Series {
	n := q.Order()
	if kmax < 0 || kmax > n {
		panic("wkb: Riccati order out of range")
	}
	if q1 != nil && len(q1) != len(q) {
		panic("wkb: Riccati series of different orders")
	}
	root := jet.Sqrt(q)
	if branch != 0 && cmplx.Abs(root[0]+branch) < cmplx.Abs(root[0]-branch) {
		root = jet.Neg(root)
	}
	phi := make([]jet.Series, kmax+1)
	phi[0] = jet.Scale(1i, root)
	twoPhi0 := jet.Scale(2, phi[0])
	for k := 1; k <= kmax; k++ {
		m := n - k // order of φ_k
		num := make(jet.Series, m+1)
		prev := phi[k-1]
		for i := 0; i <= m; i++ {
			num[i] = complex(float64(i+1), 0) * prev[i+1] // φ′_{k−1}
		}
		for j := 1; j <= k-1; j++ {
			a, b := phi[j], phi[k-j]
			if j > k-j {
				break
			}
			w := complex(2, 0)
			if j == k-j {
				w = 1
			}
			for i := 0; i <= m; i++ {
				var s complex128
				for l := 0; l <= i; l++ {
					s += a[l] * b[i-l]
				}
				num[i] += w * s
			}
		}
		if k == 2 && q1 != nil {
			for i := 0; i <= m; i++ {
				num[i] += q1[i]
			}
		}
		phi[k] = divNeg(num, twoPhi0[:m+1])
	}
	return phi
}

// divNeg returns −a/b for series of the order of a (b may be longer).
func divNeg(a, b jet.Series) jet.Series {
	c := make(jet.Series, len(a))
	for k := range c {
		s := -a[k]
		for j := 1; j <= k; j++ {
			s -= b[j] * c[k-j]
		}
		c[k] = s / b[0]
	}
	return c
}

// RiccatiAt returns the values φ_0(x), …, φ_kmax(x) of the WKB series of p at
// x, with the branch of √Q closest to branch (principal when 0). The values
// are exact up to rounding; see Riccati. RiccatiAt panics if kmax < 0.
func RiccatiAt(p Problem, x, branch complex128, kmax int) []complex128 {
	if kmax < 0 {
		panic("wkb: RiccatiAt order out of range")
	}
	q := p.Q.Taylor(x, kmax)
	var q1 jet.Series
	if p.Q1 != nil {
		q1 = p.Q1.Taylor(x, kmax)
	}
	phi := Riccati(q, q1, branch, kmax)
	v := make([]complex128, kmax+1)
	for k := range phi {
		v[k] = phi[k][0]
	}
	return v
}
