// Package connect composes WKB connection matrices along the real axis to
// give the reflection and transmission of y″ + (λ²Q + Q1) y = 0 on an
// interval whose ends are classically allowed.
//
// # Coefficient vectors
//
// In a classically allowed region a solution is written
//
//	y = A Q^(−1/4) exp(+iλ∫_p^x √Q) + B Q^(−1/4) exp(−iλ∫_p^x √Q),
//
// the vector (A, B) referred to the point p; in a forbidden region
//
//	y = C |Q|^(−1/4) exp(+λ∫_p^x √|Q|) + D |Q|^(−1/4) exp(−λ∫_p^x √|Q|).
//
// A Matrix maps the coefficients on the right of a connection to those on
// its left, v_left = M v_right, so that a structure is the product of its
// pieces from left to right, and the amplitudes of a wave incident from the
// left, v_left = (1, r) and v_right = (t, 0), are t = 1/M₁₁, r = M₂₁/M₁₁.
//
// # Amplitude convention
//
// Near the left end a, y = Q^(−1/4)[exp(iλ∫_a^x √Q) + r exp(−iλ∫_a^x √Q)];
// near the right end b, y = t Q^(−1/4) exp(iλ∫_b^x √Q). R = |r|² and
// T = |t|² are flux-normalised, so R + T = 1 for real Q.
//
// # Higher orders
//
// The phases between reference points and the barrier integrals θ are
// sums of the even terms of the Riccati series φ = y′/y (package wkb); the
// terms that are singular at a turning point are finite parts, computed as
// half a contour integral round the turning point, and the barrier
// integrals as closed contour integrals round the two turning points
// (wkb.PairPhase); for a complex pair t, t̄ that contour is twice the
// finite-part integral up the vertical through Re t, so its θ terms come
// from the pair's reference point at no extra cost. θ is taken to the order
// asked for (cut at its least term), and the phases to the same order. The
// parabolic phase φ(ε), ε = −θ/π, then loses the part S_n of its large-ε
// series that the finite parts already hold: the series expanded in 1/λ
// with ε = ε₀ + ε₂ + … and cut at the same order, S_1 = 1/(24ε₀) (derived
// at ParabolicBarrierOrder), S_2 = S_1 − ε₂/(24ε₀²) + 7/(2880ε₀³) (checked
// against direct integration; see phaseSeries). Only the Airy
// connection at a forbidden right end keeps its phases at order 2. The
// error estimate of every figure is computed from the changes the next two
// θ orders and the next phase order make (a geometric tail, and the phase
// change, each times a stated safety factor 2), plus the effect of the
// quadrature errors.
//
// The sensitivity to the phases is measured as well: every phase (the
// gaps' and the parabolic ones) is moved by twice its next-order change
// either way, and the larger change of R and T is taken where it exceeds
// twice the change at the next order. Beside a narrow transmission
// resonance between barriers the peak moves with the inter-barrier phase,
// and at the peak R and T change only to second order, where the
// next-order change alone is no bound.
//
// # Barrier tops
//
// At a barrier top (a double zero of Q on the axis), or within
// |ε| < 0.02 of it where the composition of the two close simple zeros
// fails (their finite-part loops become too small, and the 1/ε series of
// the parabolic phase diverges; below |ε| = 1e-3 it is not tried), Q is
// shifted by ±δ₀ … ±4δ₀ (|ε| = 0.05 … 0.2 for the shift) and R, T and the
// phases of r and t are extrapolated to δ = 0; r and t are √R and √T with
// those phases, so |r|² = R. The phases turn by about λ∫dx/(2√Q) per unit
// δ (the time delay across the interval); that part, from the allowed
// stretches away from the top, is taken out before the extrapolation.
//
// # Which complex pairs are composed
//
// A complex pair whose coupling e^θ is far below the accuracy of the
// figure contributes nothing visible: every pair is first composed at
// leading order, its effect measured by leaving it out, and pairs are
// refined to higher order, largest effect first, until the ones left at
// leading order together move R, T and the phases by at most a tenth of
// the other errors; their whole effect is then added to the error
// estimates (Barrier.FirstOrder marks them).
//
// # Relative error estimates
//
// Every error estimate of an exponentially small R or T is relative to it:
// it comes from the changes of |r|² and |t|² (products of matrix elements)
// under the next orders, the quadrature errors and the neglected
// singularities, plus a rounding of 1e-14 of the figure itself, never an
// absolute floor.
//
// # Exponentially small reflection
//
// With no real turning point, every complex zero and pole of Q above the
// allowed axis is weighed by S = Im ∫ √Q from the axis; the least S
// dominates (|r| ≈ exp(−2λS)). A dominant complex pair of simple zeros
// enters the composition through the same uniform barrier matrix with θ < 0
// (Pokrovskii–Khalatnikov prefactor 1 far above the top); a dominant simple
// pole gives an estimate whose prefactor is not verified (see Scatter).
// Singularities not composed (poles, blocked points) enter the error
// estimates with their weight exp(−2λS). A double pole of Q has no Stokes
// jump of its own (its local solutions are pure powers): the zeros of Q
// around it carry its share (for U/cosh²x the closed form of Landau &
// Lifshitz §25 is reproduced with it left out), so it is left out, with a
// warning only when no zero is listed within its height above the axis.
package connect
