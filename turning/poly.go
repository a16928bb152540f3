package turning

import (
	"errors"
	"math"
	"math/cmplx"

	"gonum.org/v1/gonum/mat"
)

// PolyRoots returns the roots of the polynomial
//
//	p(x) = coeffs[0] + coeffs[1] x + … + coeffs[n] xⁿ
//
// (coefficients in increasing powers) as the eigenvalues of its companion
// matrix, computed by gonum's mat.Eigen. Trailing zero coefficients lower
// the degree; a polynomial of degree 0 has no roots and returns an empty
// slice. The roots come in the order of the eigenvalue solver.
//
// mat.Eigen factorizes real matrices only. Real coefficients give the real
// companion matrix directly. For complex coefficients C = A + iB the real
// matrix [[A, −B], [B, A]] of order 2n is factorized instead: its spectrum is
// that of C together with the conjugates. The n roots are picked one at a
// time as the candidate with the least relative residual in the polynomial
// deflated by the roots already picked, so conjugate pairs of genuine roots
// and repeated roots are kept with their multiplicity; each pick is polished
// by at most three Newton steps on p that must lower its residual.
//
// PolyRoots returns an error for an empty, all-zero or non-finite
// coefficient list, or when the eigenvalue solver fails.
func PolyRoots(coeffs []complex128) ([]complex128, error) {
	for _, c := range coeffs {
		if !isFinite(c) {
			return nil, errors.New("turning: polynomial coefficient is not finite")
		}
	}
	n := len(coeffs) - 1
	for n >= 0 && coeffs[n] == 0 {
		n--
	}
	if n < 0 {
		return nil, errors.New("turning: zero polynomial has no isolated roots")
	}
	if n == 0 {
		return []complex128{}, nil
	}
	// Monic coefficients a[0..n-1] of xⁿ + a[n-1] xⁿ⁻¹ + … + a[0].
	a := make([]complex128, n)
	isReal := true
	for k := range a {
		a[k] = coeffs[k] / coeffs[n]
		if imag(a[k]) != 0 {
			isReal = false
		}
	}
	if isReal {
		c := mat.NewDense(n, n, nil)
		companion(c, a, re, 0, 0)
		var eig mat.Eigen
		if !eig.Factorize(c, mat.EigenNone) {
			return nil, errors.New("turning: companion matrix eigenvalue solver failed")
		}
		return eig.Values(nil), nil
	}
	// Real embedding [[A, −B], [B, A]] of the complex companion matrix A + iB.
	m := mat.NewDense(2*n, 2*n, nil)
	companion(m, a, re, 0, 0)
	companion(m, a, re, n, n)
	companion(m, a, func(z complex128) float64 { return -imag(z) }, 0, n)
	companion(m, a, im, n, 0)
	var eig mat.Eigen
	if !eig.Factorize(m, mat.EigenNone) {
		return nil, errors.New("turning: companion matrix eigenvalue solver failed")
	}
	cand := eig.Values(nil)
	full := append(append([]complex128(nil), a...), 1) // monic p, increasing powers
	defl := append([]complex128(nil), full...)
	roots := make([]complex128, 0, n)
	for len(roots) < n {
		best, bestRes := -1, math.Inf(1)
		for i, z := range cand {
			if r := relResidual(defl, z); r < bestRes {
				best, bestRes = i, r
			}
		}
		z := polishPoly(full, cand[best])
		cand = append(cand[:best], cand[best+1:]...)
		roots = append(roots, z)
		defl = deflate(defl, z)
	}
	return roots, nil
}

// companion writes the real part part(·) of the companion matrix of the
// monic polynomial with lower coefficients a into m at offset (r0, c0): ones
// on the subdiagonal (only for the real part) and −a in the last column.
func companion(m *mat.Dense, a []complex128, part func(complex128) float64, r0, c0 int) {
	n := len(a)
	diag := r0 == c0
	for i := 0; i < n; i++ {
		if i > 0 && diag {
			m.Set(r0+i, c0+i-1, 1)
		}
		m.Set(r0+i, c0+n-1, -part(a[i]))
	}
}

// relResidual returns |p(z)| / Σ|p_k||z|ᵏ, the residual relative to the
// size of the terms, for coefficients p in increasing powers.
func relResidual(p []complex128, z complex128) float64 {
	var v complex128
	var s float64
	az := cmplx.Abs(z)
	for k := len(p) - 1; k >= 0; k-- {
		v = v*z + p[k]
		s = s*az + cmplx.Abs(p[k])
	}
	if s == 0 {
		return 0
	}
	return cmplx.Abs(v) / s
}

// hornerD returns p(z) and p′(z) for coefficients in increasing powers.
func hornerD(p []complex128, z complex128) (v, d complex128) {
	for k := len(p) - 1; k >= 0; k-- {
		d = d*z + v
		v = v*z + p[k]
	}
	return v, d
}

// polishPoly applies up to three Newton steps to the root z of p, keeping
// only steps that lower |p|.
func polishPoly(p []complex128, z complex128) complex128 {
	v, d := hornerD(p, z)
	for it := 0; it < 3 && v != 0 && d != 0; it++ {
		w := z - v/d
		vw, dw := hornerD(p, w)
		if !(cmplx.Abs(vw) < cmplx.Abs(v)) {
			break
		}
		z, v, d = w, vw, dw
	}
	return z
}

// deflate divides p (increasing powers) by (x − z) and drops the remainder.
func deflate(p []complex128, z complex128) []complex128 {
	n := len(p) - 1
	q := make([]complex128, n)
	var c complex128
	for k := n; k >= 1; k-- {
		c = p[k] + c*z
		q[k-1] = c
	}
	return q
}

func isFinite(z complex128) bool {
	return !math.IsNaN(real(z)) && !math.IsNaN(imag(z)) && !math.IsInf(real(z), 0) && !math.IsInf(imag(z), 0)
}

func re(z complex128) float64 { return real(z) }
func im(z complex128) float64 { return imag(z) }
