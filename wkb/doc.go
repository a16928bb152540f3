// Package wkb holds the canonical equation y″ + (λ²Q + Q1) y = 0 and the
// phase-integral (WKB) machinery built on it.
//
// # Phase integrals to higher order
//
// Riccati gives the terms φ_k of the WKB series of φ = y′/y at a point, by
// series arithmetic on the Taylor coefficients of Q (package jet), so every
// term is exact up to rounding. PairPhase integrates the even terms around a
// closed contour about two turning points and the cut between them — an
// ellipse with the turning points as foci — where they are analytic, so the
// trapezoid rule converges geometrically; the result is the asymptotic
// series of λ∫_{t1}^{t2}√Q, optimally truncated at its least term, which is
// the error estimate. Wells (quantisation) and barriers (tunnelling
// exponents) both use it.
package wkb
