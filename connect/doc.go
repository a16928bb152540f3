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
// (wkb.PairPhase). θ is taken to the order asked for (cut at its least
// term); the phases to order 2 at most, where the parabolic phase φ(ε)
// loses the first term 1/(24ε₀) of its large-ε series, which the finite
// parts already hold (derived at ParabolicBarrierOrder; ε₀ from the
// leading-order θ). The error estimate of every figure is computed from
// the changes the next two θ orders and the next phase order make (a
// geometric tail, times a stated safety factor 2), plus the effect of the
// quadrature errors.
//
// # Exponentially small reflection
//
// With no real turning point, every complex zero and pole of Q above the
// allowed axis is weighed by S = Im ∫ √Q from the axis; the least S
// dominates (|r| ≈ exp(−2λS)). A dominant complex pair of simple zeros
// enters the composition through the same uniform barrier matrix with θ < 0
// (Pokrovskii–Khalatnikov prefactor 1 far above the top); a dominant simple
// pole gives an estimate whose prefactor is not verified (see Scatter).
package connect
