package cases

import "github.com/turnpoint/turnpoint/wkb/jet"

// p (TM) waves in a planar graded medium.
//
// Take the layers normal to x, the wave travelling in the (x, z) plane with
// fields ∝ exp(i(k0 s z − ωt)), s = n_in sin θ the conserved tangential
// index, and the tangential magnetic field H = H_y(x). With μ = 1, Maxwell's
// equation ∇×H = −iωε0 ε E gives E_x = (s/ε) H and E_z = (i/(k0 ε)) H′ (in
// units of the vacuum impedance), and ∇×E = iωμ0 H then reads
//
//	(H′/ε)′ + k0² (1 − s²/ε) H = 0,   i.e.   H″ − (ε′/ε) H′ + k0² (ε − s²) H = 0.
//
// Liouville transformation. For y″ + P y′ + R y = 0 the substitution
// y = g u with g = exp(−½∫P) removes the first derivative and leaves
//
//	u″ + (R − P²/4 − P′/2) u = 0.
//
// Here P = −ε′/ε, so g = exp(½ ln ε) = √ε, and
//
//	P²/4  = (1/4) (ε′/ε)²,
//	P′/2  = −ε″/(2ε) + (1/2) (ε′/ε)²,
//
// hence, with H = √ε u,
//
//	u″ + [k0² (ε − s²) + Q1] u = 0,   Q1 = ε″/(2ε) − (3/4) (ε′/ε)²,
//
// the canonical form with λ = k0, Q = ε − s² (the same Q as for s waves)
// and the λ-free term Q1. Direct check: u = H ε^(−1/2) gives
// u″ = ε^(−1/2) [H″ − (ε′/ε) H′ + ((3/4)(ε′/ε)² − ε″/(2ε)) H], and inserting
// H″ from the field equation returns the u equation above.
//
// Flux. The x-component of the time-averaged Poynting vector is
// proportional to Im(H* H′/ε). With H = √ε u and H′ = √ε u′ + (ε′/(2√ε)) u,
//
//	H* H′/ε = (√ε*/√ε) [u* u′ + (ε′/(2ε)) |u|²].
//
// For real ε (a lossless medium, ε > 0 where the solver needs Q > 0) the
// prefactor is 1 and the second term is real, so Im(H* H′/ε) = Im(u* u′)
// exactly, at every x: the flux of the u problem is the TM power flux. Where
// ε is constant the two fields differ by a constant factor, so the
// amplitude ratios of reflected to incident waves agree too; R and T of the
// u problem (package connect/direct's flux-normalised |r|², |t|²) are then
// the TM power reflectance and transmittance when ε is constant near both
// ends of the interval. When ε still varies at an end, Q1 ≠ 0 there and the
// split into incident and reflected waves is the WKB one of the u problem
// (defined to O(ε′/(k0 ε))), which differs from a split of H by terms of
// that order: R + T = 1 still holds, but R and T are reflectances only to
// the accuracy with which ε has settled. When ε is complex at an end, the
// medium absorbs there, Im(u* u′) is not the Poynting flux and R, T are
// amplitude ratios, not power coefficients.
//
// Singularities. Q1 has double poles where ε = 0 (plasma resonance,
// epsilon-near-zero points), with Q1 ≈ −(3/4)/(x − x0)² for a simple zero x0
// of ε: these are genuine singular points of the p equation (the field E_x
// = sH/ε diverges there), not artefacts of the transformation, and they
// are left in Q1 for the turning-point search and the solvers to see.

// tmQ1 is Q1 = ε″/(2ε) − (3/4)(ε′/ε)² of the p (TM) problem, with ε = n²
// (square) or ε given directly. Its Taylor series to order n uses the series
// of ε to order n + 2, so it is exact to the order asked.
type tmQ1 struct {
	n      jet.Func // n(x), or ε(x) when !square
	square bool
}

func (q tmQ1) Eval(z complex128) complex128 { return q.Taylor(z, 0)[0] }

func (q tmQ1) Taylor(z complex128, n int) jet.Series {
	if n < 0 {
		n = 0
	}
	e := q.n.Taylor(z, n+2)
	if q.square {
		e = jet.Mul(e, e)
	}
	// d/dh Σ c_k h^k = Σ (k+1) c_(k+1) h^k, applied once and twice, each
	// truncated at order n.
	e0 := make(jet.Series, n+1)
	e1 := make(jet.Series, n+1)
	e2 := make(jet.Series, n+1)
	for k := 0; k <= n; k++ {
		e0[k] = e[k]
		e1[k] = complex(float64(k+1), 0) * e[k+1]
		e2[k] = complex(float64((k+1)*(k+2)), 0) * e[k+2]
	}
	r := jet.Div(e1, e0) // ε′/ε
	return jet.Sub(jet.Scale(0.5, jet.Div(e2, e0)), jet.Scale(0.75, jet.Mul(r, r)))
}
