package connect

import (
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb/jet"
	"github.com/turnpoint/turnpoint/wkb/special"
)

// Matrix is a 2×2 connection (transfer) matrix acting on WKB coefficient
// vectors: v_left = M v_right (see the package comment).
type Matrix [2][2]complex128

// Identity is the identity matrix.
var Identity = Matrix{{1, 0}, {0, 1}}

// Mul returns the product m·n: the connection m followed, further to the
// right, by n.
func (m Matrix) Mul(n Matrix) Matrix {
	var p Matrix
	for i := 0; i < 2; i++ {
		for j := 0; j < 2; j++ {
			p[i][j] = m[i][0]*n[0][j] + m[i][1]*n[1][j]
		}
	}
	return p
}

// Det returns the determinant of m.
func (m Matrix) Det() complex128 { return m[0][0]*m[1][1] - m[0][1]*m[1][0] }

// Inv returns the inverse of m, the connection read from left to right.
// It panics if m is singular (no connection matrix is).
func (m Matrix) Inv() Matrix {
	d := m.Det()
	if d == 0 {
		panic("connect: singular matrix")
	}
	return Matrix{{m[1][1] / d, -m[0][1] / d}, {-m[1][0] / d, m[0][0] / d}}
}

// Apply returns m·v.
func (m Matrix) Apply(v [2]complex128) [2]complex128 {
	return [2]complex128{m[0][0]*v[0] + m[0][1]*v[1], m[1][0]*v[0] + m[1][1]*v[1]}
}

// Amplitudes returns the transmission and reflection amplitudes of a wave
// incident from the left on the structure whose transfer matrix is m:
// t = 1/m₁₁, r = m₂₁/m₁₁.
func (m Matrix) Amplitudes() (r, t complex128) {
	return m[1][0] / m[0][0], 1 / m[0][0]
}

// Propagation returns the matrix that refers allowed-region coefficients
// given at a point q to a point p on its left, with
// delta = λ∫_p^q √Q (plus its higher-order terms):
//
//	(A_p, B_p) = (e^{−iδ} A_q, e^{iδ} B_q).
//
// A complex delta is allowed (a reference point off the axis).
func Propagation(delta complex128) Matrix {
	e := cmplx.Exp(complex(0, 1) * delta)
	return Matrix{{1 / e, 0}, {0, e}}
}

// ForbiddenPropagation is Propagation for forbidden-region coefficients,
// theta = λ∫_p^q √|Q| > 0 for q to the right of p:
//
//	(C_p, D_p) = (e^{−θ} C_q, e^{θ} D_q).
func ForbiddenPropagation(theta float64) Matrix {
	return Matrix{{complex(math.Exp(-theta), 0), 0}, {0, complex(math.Exp(theta), 0)}}
}

var (
	eqp = cmplx.Exp(complex(0, math.Pi/4))  // e^{iπ/4}
	eqm = cmplx.Exp(complex(0, -math.Pi/4)) // e^{−iπ/4}
)

// AllowedLeft is the first-order (Airy) connection at a simple real turning
// point with the allowed region on its left and the forbidden one on its
// right, both vectors referred to the turning point: v_allowed = M v_forbidden.
// Its columns are the images of the two forbidden waves,
//
//	|Q|^(−1/4) exp(−λ∫_t^x √|Q|)   →  2 Q^(−1/4) cos(λ∫_x^t √Q − π/4),
//	|Q|^(−1/4) exp(+λ∫_t^x √|Q|)   →  −Q^(−1/4) sin(λ∫_x^t √Q − π/4),
//
// i.e. (A, B) = (e^{iπ/4}, e^{−iπ/4}) and (e^{−iπ/4}, e^{iπ/4})/2. The first
// holds in both directions; the second only from the forbidden side (a
// growing wave can carry an undetermined small multiple of the decaying
// one), which is why the uniform ParabolicBarrier is used for barriers.
func AllowedLeft() Matrix {
	return Matrix{{eqm / 2, eqp}, {eqp / 2, eqm}}
}

// AllowedRight is AllowedLeft mirrored: the forbidden region on the left of
// the turning point, the allowed one on its right. The forbidden wave
// growing towards the turning point, exp(+λ∫_t^x √|Q|), connects to
// 2 Q^(−1/4) cos(λ∫_t^x √Q − π/4), the other one to −Q^(−1/4) sin(…).
func AllowedRight() Matrix {
	return Matrix{{eqm, eqp / 2}, {eqp, eqm / 2}}
}

// ParabolicBarrier returns the uniform (parabolic-cylinder) connection
// across a barrier, with the left coefficients referred to its left turning
// point and the right ones to its right turning point:
//
//	M = [ κ e^{iφ}   i e^θ    ]      κ = √(1 + e^{2θ}),
//	    [ −i e^θ     κ e^{−iφ} ],    φ = φ(ε), ε = −θ/π,
//
// θ = λ∫ √(−Q) across the barrier (θ < 0 above its top, where the turning
// points are a complex pair and both sides are referred to the real point
// from which the integral to the upper turning point is purely imaginary).
// It gives t = e^{−iφ}/√(1+e^{2θ}), r = −i e^{−iφ}/√(1+e^{−2θ}), so that
// T = 1/(1 + e^{2θ}) (Kemble). The matrix is exact for the parabolic
// barrier Q = x²/4 − a, θ = πa: there it follows from the asymptotics of
// D_ν(e^{−iπ/4}x), ν = −ia − ½ (DLMF 12.9.1 and 12.9.3, derived in
// parabolic_test.go).
func ParabolicBarrier(theta float64) Matrix { return parabolicBarrier(theta, 0) }

// ParabolicBarrierOrder is ParabolicBarrier for phases and θ taken to the
// higher order 2n: its phase is special.ParabolicPhaseReduced(ε, n), φ less
// the first n terms of its large-ε series. Those terms are already held by
// the finite-part phase integrals to the turning points: for the parabolic
// barrier Q = x²/4 − A, −iφ₂ = (3/32)Q^(−3/2) + (5A/32)Q^(−5/2) and
//
//	FP∫_{2√A}^{∞} −iφ₂ dx = (3/32)(−2/A) + (5A/32)(4/(3A²)) = 1/(48A)
//
// (x = 2√A cosh u; FP∫_0^∞ csch²u du = −1, FP∫_0^∞ csch⁴u du = 2/3), which,
// on both sides, shifts the phase by 2/(48A) = −1/(24ε), ε = −A: the first
// term of φ's series.
func ParabolicBarrierOrder(theta float64, n int) Matrix { return parabolicBarrier(theta, n) }

func parabolicBarrier(theta float64, n int) Matrix { return parabolicBarrierRef(theta, theta, n) }

// phaseSeries returns S_n, the part of the parabolic phase φ(ε) that the
// finite-part phases to order 2n already hold, for a barrier whose
// θ = θ₀ + θ₂ + … has higher-order terms: eps[k] = −θ_{2k}/π (k < n at
// least where available). The finite-part phases to order 2n hold the large-ε
// series of φ(ε), ε = −θ/π, expanded in 1/λ and cut at the same order: with
// ε_{2k} = O(λ^(1−2k)) and the terms c_j ε^(1−2j) = O(λ^(1−2j)),
//
//	S_n = Σ_{j=1}^{n} c_j Σ_{m=0}^{n−j} [x^m] (ε₀ + ε₂x + ε₄x² + …)^(1−2j),
//
// e.g. S_1 = c₁/ε₀, S_2 = c₁/ε₀ − c₁ε₂/ε₀² + c₂/ε₀³ (c_j of
// special.ParabolicPhaseCoeff), and the phase of the connection is
// φ(ε) − S_n. S_1 is the subtraction derived at ParabolicBarrierOrder (for
// the parabolic barrier θ₂ = 0 and the two agree). The cross term −c₁ε₂/ε₀²
// at n = 2 is what the order-4 finite parts hold besides c₂/ε₀³: with it
// the phases of U/cosh²x (ħ = 0.1) against connect/direct improve from
// 2e-5 at n = 1 to 3e-8 at n = 2 (E = 0.7U) and from 2e-4 to 3e-6 at 0.97U;
// without it (ε instead of ε₀ in S_2) they get worse than at n = 1.
func phaseSeries(eps []float64, n int) float64 {
	e := make(jet.Series, n)
	for k := range e {
		if k < len(eps) {
			e[k] = complex(eps[k], 0)
		}
	}
	var s float64
	for j := 1; j <= n; j++ {
		pw := jet.PowInt(e, 1-2*j)
		for m := 0; m <= n-j; m++ {
			s += special.ParabolicPhaseCoeff(j) * real(pw[m])
		}
	}
	return s
}

// parabolicBarrierRef is ParabolicBarrierOrder with the subtracted series
// terms taken at ε₀ = −theta0/π (see composer.amplitudes).
func parabolicBarrierRef(theta, theta0 float64, n int) Matrix {
	eps := -theta / math.Pi
	phi := special.ParabolicPhaseReduced(eps, n)
	if n > 0 && theta0 != theta {
		eps0 := -theta0 / math.Pi
		phi = special.ParabolicPhase(eps) - (special.ParabolicPhase(eps0) - special.ParabolicPhaseReduced(eps0, n))
	}
	return parabolicWithPhase(theta, phi)
}

// parabolicWithPhase is the matrix of ParabolicBarrier with the phase φ
// given.
func parabolicWithPhase(theta, phi float64) Matrix {
	var kappa, e float64
	if theta > 0 {
		// κ = e^θ √(1 + e^{−2θ}) avoids overflow of e^{2θ} before that of e^θ.
		e = math.Exp(theta)
		kappa = e * math.Sqrt(1+math.Exp(-2*theta))
	} else {
		e = math.Exp(theta)
		kappa = math.Sqrt(1 + e*e)
	}
	ph := cmplx.Exp(complex(0, phi))
	return Matrix{
		{complex(kappa, 0) * ph, complex(0, e)},
		{complex(0, -e), complex(kappa, 0) / ph},
	}
}
