// Package direct computes reflection and transmission amplitudes of
// y″ + (λ²Q + Q1) y = 0 by direct numerical integration, the independent
// check of the WKB connection results of package connect.
//
// # Convention
//
// A wave is incident from the left on [a, b], where Q > 0 at both ends.
// Near the ends the solution is expanded in higher-order WKB waves
//
//	v±(x) = √(λ/p(x)) exp(± i ∫ p),   p = K + p₂ + p₄ + … ,   K = √(λ²Q + Q1),
//
// p being the odd part of the Riccati series of φ = y′/y (ordered by the
// number of derivatives of K², so p_2m = O(λ^(1−2m)) and, for Q1 = 0, the
// series in powers of 1/λ) evaluated from the exact Taylor coefficients of
// Q at the end point and truncated at its least term (at most six terms).
// With phases referred to the end points,
//
//	y = v₊ + r v₋ near a,   y = t v₊ near b,
//
// and R = |r|², T = |t|² are flux-normalised (R + T = 1 for real Q). When Q
// and Q1 are constant near the ends, v± are the plane waves and r, t the
// usual amplitudes; in general |r| and |t| agree with the first-order
// convention of DEVELOPERS.md to the accuracy with which Q has settled at
// the ends, while their phases differ from it at O(λ⁻¹). The first omitted
// term of p is reported as Result.EndErr and included in the errors.
//
// # Methods
//
// RealAxis integrates y from b back to a along the real axis with a Taylor
// series method built from the exact jets of Q (order 30, step chosen from
// the decay of the coefficients, rescaling against overflow in deep
// tunnelling). Where the higher-order WKB waves (four correction terms) are
// exact to within the tolerance, i.e. where the majorant of the neglected
// coupling ∫|γ| is below it, it jumps over many wavelengths at once
// (WKB/Taylor switching), so that away from turning points the cost does not
// grow with λ. It handles real turning points; T comes out to about 1e-13
// relative, r to about 1e-15 absolute, so a tiny R is not resolved.
//
// Jets at a point describe K² only within their radius of convergence,
// however flat they look (the tail of a tanh layer has poles at π/2 of its
// width from every real point), so every jump and every Taylor step is kept
// within half the radius estimated from the decay of the coefficients of
// (K²)′/K², and K² is evaluated at points along it (16 for a jump, 4 for a
// step, the landing point with its derivative) and compared with the series
// from the start: a feature in the middle of a flat-looking stretch ends
// the step before it. An entire K² whose feature is invisible in the jets
// (a narrow Gaussian far away, whose coefficients underflow) could still
// fall between the samples, so when the main run jumped the check run takes
// no jumps at all, if that costs at most 20000 steps (about a step per
// three radians of phase), and otherwise caps its jumps at 1/16 of the
// interval; when the jump-free check disagrees with the main run by more
// than √Tol, the main run is repeated without jumps.
//
// ComplexPath integrates the Riccati equation for the local ratio σ of the
// reflected to the incident first-order wave along a path that rises from
// b into the upper half plane, runs at a height H below the nearest zero or
// pole of K² and comes back to the axis at a. An error made on the raised
// part reaches a multiplied by e^(−2 Im ∫K), so an exponentially small r
// (R = 1e-30 and far below) is obtained to nearly full relative accuracy
// instead of drowning in rounding. H starts at 0.65 of the distance to the
// nearest singularity (given by the caller or found by a scan of the radius
// of convergence of (K²)′/K² along the axis, with samples of K² between
// the scan points and a finer search around the closest approach) and is
// then adjusted by coarse
// runs so that the free reflected wave on the path stays near 1e3 times the
// incident one: more height would cost digits of T, less would cost digits
// of R.
//
// If the check run at a lower path disagrees by more than 1e-3 in R, the
// path climbs half-way to 0.88 of the distance to the singularity (twice at
// most) and the better result is kept. The same WKB jumps as on the real
// axis are taken where the neglected coupling, weighted by the factor
// e^(−2 Im S) with which it reaches a, is below the tolerance relative to σ
// or to the |r| measured by the height search (coupling at the rounding
// level of γ counts as rounding). This makes the cost nearly independent of
// λ wherever Q is smooth on the scale of a wavelength, which at large λ is
// everywhere but near the singularities; see BenchmarkScatterLambda.
//
// The smallest |r| that can be resolved is about the unit roundoff times
// the first-order mismatch |c/K| of the waves at the ends, where c is the
// higher-order correction to the wave number: put the ends where Q has
// settled far below |r|/1e-16. The floor is part of ErrRefl and ErrR.
//
// Auto picks ComplexPath when K² has no zero on or near [a, b] and
// K·d ≥ 1 for the distance d to the nearest singularity, RealAxis
// otherwise.
//
// Every result is computed twice (two tolerances; for ComplexPath also two
// path heights) and the difference, plus an accumulated rounding estimate
// and the truncation of the end waves, is reported as its error. On the
// real axis the rounding estimate includes the conditioning of the
// problem: rounding made where y is larger than at a (between two barriers
// near a narrow resonance, where T's condition number is about E/Γ) is
// multiplied by (max |y| / |y(a)|)².
package direct
