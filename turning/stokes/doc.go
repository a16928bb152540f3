// Package stokes traces the Stokes geometry of y″ + λ²Q(x) y = 0 in the
// complex plane: the Stokes and anti-Stokes lines that leave each turning
// point, the degeneracies where a Stokes line runs from one turning point
// into another, the branch cuts of √Q, and a figure of it all.
//
// # Convention
//
// With w(x) = ∫_t^x √Q(s) ds taken from a turning point t, the WKB waves are
// Q^(-1/4) exp(±iλw). A Stokes line is a curve Re w = 0 (one wave maximally
// dominant over the other; crossing it the coefficient of the subdominant
// wave jumps by ±i times that of the dominant one at a simple turning
// point); an anti-Stokes line is a curve Im w = 0 (both waves of equal size).
// Some texts swap the two names; Convention states the one used here and
// every figure prints it.
//
// # Method
//
// Near a zero of order m, Q ≈ a(x−t)^m and w ≈ 2√a (x−t)^((m+2)/2)/(m+2), so
// m+2 lines of each family leave t at the angles where arg w is an odd
// multiple of π/2 (Stokes) or a multiple of π (anti-Stokes); see Angles.
// Each line is then followed as the solution of
//
//	dx/ds = i·conj(√Q)/|√Q|  (Stokes),   dx/ds = conj(√Q)/|√Q|  (anti-Stokes),
//
// with unit speed s, together with dw/ds = √Q dx/ds, by the classical
// fourth-order Runge–Kutta method with step doubling for the error control.
// The branch of √Q is continued from step to step (never taken as the
// principal value), and after each step a Newton correction across the line
// restores Re w = 0 (or Im w = 0) exactly. A line ends at another turning
// point, at a pole, at the edge of the box, or when its length or step
// budget is spent; Line.End says which.
//
// # Degeneracies and Gap
//
// A Stokes line from t1 can end at t2 only if Re w(t2) = 0, i.e. where
// Re Gap = 0 with Gap = ∫_{t1}^{t2} √Q. Trace reports every such line as
// a Degeneracy, with Gap recomputed by quadrature along the traced path and
// an error estimate; Gap computes the criterion directly along a segment
// (detouring around nearby singularities), and FindDegeneracy and
// ScanDegeneracy locate the parameter values of a family of problems where
// Re Gap changes sign. For Q = E − x², Gap = πE/2 between ±√E: the points
// are Stokes-joined exactly when E is imaginary; for a real barrier
// (Q = x² − E, or any real Q with a real or a complex-conjugate pair of
// turning points and no singularity between) Gap is imaginary and the pair
// is Stokes-joined for every real E.
//
// # Stokes multiplier
//
// At a simple turning point the coefficient of the subdominant wave jumps,
// crossing a Stokes line, by ±i times that of the dominant one. For the
// Airy function (Ai″ = z Ai, Q = −z, Stokes lines arg z = 0, ±2π/3), with
// the waves z^(−1/4) e^(∓ζ), ζ = (2/3) z^(3/2), on principal branches (the
// cut on the anti-Stokes line arg z = π), the jump is +i crossing either
// line arg z = ±2π/3 counterclockwise: Ai ~ e^(−ζ) for |arg z| < 2π/3 and
// Ai ~ e^(−ζ) ± i e^(ζ) beyond (DLMF §9.7); the tests check this against
// gonum's mathext.AiryAi.
//
// # Figures
//
// Plot draws a Geometry as SVG or PNG with equal scales on both axes;
// WriteSummary prints it as text. Both state Convention. The package's
// demo figures (a double well with four turning points, a sech² barrier
// above its top) are written by
//
//	go test -run TestPlotFiles -figures DIR ./turning/stokes/
package stokes
