// Package levels computes bound-state energies of one-dimensional wells by
// phase-integral quantisation: Bohr–Sommerfeld with Maslov indices, the
// higher-order WKB series optimally truncated at its least term, and the
// uniform quantisation of two wells coupled through a barrier, which gives
// doublets and tunnel splittings.
//
// # Conventions
//
// A wkb.Well is −(ħ²/2m)ψ″ + Vψ = Eψ on [A, B], so λ = 1/ħ and
// Q = 2m(E − V). Quantum numbers n count the nodes of the state. A soft end
// is a turning point V = E inside the interval; a hard end is a wall at A or
// B (Well.LeftWall, Well.RightWall) reached while V < E. The Maslov index μ
// is 2 for two soft ends, 3 for one soft end and one wall, 4 for two walls:
//
//	λ ∫_a^b √Q dx = π (n + μ/4)     (first order, "order 0")
//
// and to higher order Σ_k λ^(1−2k) σ_{2k} = π(n + μ/4), where σ_{2k} is
//   - for two soft ends the closed-contour integral (1/2i)∮φ_{2k} of
//     wkb.PairPhase;
//   - for a wall and a soft end the finite part of ∫ φ_{2k}/i from the wall
//     to the turning point, computed as half a loop integral from the wall
//     around the turning point and back on the other sheet (the integrands
//     have half-integer power singularities, so no logarithm spoils the
//     finite part); the order-2 term reproduces the second term of the
//     asymptotic expansion of the Airy zeros (Abramowitz & Stegun 10.4.94);
//   - for two walls the ordinary integral of φ_{2k}/i between them (ψ =
//     Im exp ∫φ vanishes at both; the odd terms only change the amplitude).
//
// # Several wells
//
// Doublets treats four real turning points t1 < t2 < t3 < t4 (two wells
// separated by a barrier) with the condition derived in doublet.go: the
// parabolic (Weber) connection through the barrier, carrying the phase
// φ(ε) of package special, and the comparison with a parabolic well at each
// well's bottom, which supplies the factor that the textbook splitting
// (ħω/π)e^(−θ) lacks for low levels (√(π/e) for the ground state). Above
// the barrier top the same condition continues with the barrier's complex
// turning points (θ < 0).
//
// # Error estimates
//
// Every energy carries Err: the remainder of the phase series converted to
// energy by dE = δ/(∂Phase/∂E) = δ ħω/π — the least term where the series
// reached it, twice the next term while its terms still decrease (the next
// term and the rest beyond it) — plus the quadrature errors, plus (two soft
// ends) Beyond, the exponentially small coupling to the nearest other zero
// of Q that no order of the series sees, plus twice Wall, the rise caused by
// a hard wall beyond a soft end: the wall forces an admixture e^(−2S) of the
// growing wave under the barrier (S = λ∫_t^wall √(−Q)), which shifts the
// end's phase by e^(−2S)/2, so ΔE = (ħω/π)e^(−2S)/2 per wall. At a wall
// where V′ = 0 (V ∝ x^p there) the wall's endpoint terms appear only every
// few orders, so the next term can understate the remainder; there the
// estimate is twice the largest of the next two terms after it, with a
// warning. If the higher orders fail altogether, a first-order level
// carries twice its order-2 term (or, failing that, half the level
// spacing). Where no ellipse about two soft ends avoids a nearby pole (the
// centrifugal pole beside the inner turning point of a high radial level),
// the closed-contour integrals are split into a half loop about each
// turning point and a real-axis piece between them. For coupled wells the series is
// that of the energies order by order: twice the change at the next order,
// and within two ħω_b of the barrier top (θ < 2π), where the barrier
// corrections are powers of 1/ε that are not yet small, also the previous
// change; the two levels of a tunnelling doublet take the larger of their
// two estimates. The asymptotic terms of the barrier-top phase φ and of the
// well-bottom factor F are part of that series and are not counted again.
// A splitting's estimate is the next change of the splitting itself, in
// which the levels' common error cancels, plus the two root tolerances.
package levels
