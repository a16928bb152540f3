// Package turning finds the turning points (zeros) and singularities (poles)
// of Q in a rectangle of the complex plane, by the argument principle with
// subdivision and Newton polishing on exact Taylor derivatives.
//
// # Method
//
// Find counts with the argument principle: the winding number of Q along
// the box boundary, sampled with Q.Eval and bisected until arg Q changes by
// less than π/4 between neighbouring samples and log Q is locally linear,
// is the number of zeros minus the number of poles inside. The box is then
// bisected across its longer side. For every cell the moments
//
//	t_k = (1/2πi) ∮ ((z − c)/h)ᵏ Q′(z)/Q(z) dz = Σ_j m_j ((z_j − c)/h)ᵏ,  k = 0…4,
//
// (c the centre, h the half-width, z_j the zeros and poles of orders m_j,
// negative for poles; Delves & Lyness, Math. Comp. 21, 543 (1967)) are
// computed by adaptive Gauss–Kronrod quadrature and cross-checked against
// the sampled change of log Q on each side. A cell is empty when its winding
// and all its moments vanish, so a zero next to a pole (winding 0) is not
// missed; it holds a single cluster of order W when t_k/W = (t_1/W)ᵏ.
// Such a cluster is polished by Newton's method on the (m−1)-th derivative
// of Q, or of 1/Q for a pole, split into its members by the roots of the
// local Taylor polynomial where they can be told apart, and confirmed by the
// winding number along a small circle, which gives each point its order.
// Every other cell is bisected again, up to Settings.MaxDepth times.
//
// A zero or pole on a cutting line moves the cut; one on the box boundary
// moves that side outward past it and is reported with a warning. A Q with a
// branch cut (a square root or a logarithm of something that changes sign)
// jumps across it; the sampling detects the jump and Find reports the status
// NotMeromorphic instead of a count.
//
// # Classes
//
// A zero of order ≥ 2, or one closer than Settings.CoalesceRadius to another
// zero, is Coalescing; otherwise a zero on the real axis is RealSimple, one
// off the axis is ComplexPair when Q(conj z) = conj Q(z) (so its conjugate
// is a zero too, inside the box or not) and Complex otherwise. Poles are
// Pole with Order < 0. Zeros and poles within Settings.RealTol of the real
// axis are moved onto it when Q is real there and a real Newton iteration
// converges.
//
// # Limits
//
// Zeros and poles whose moments about a cell cancel below about 1e-12 may
// be taken for nothing: a zero and a pole closer together than about 1e-12
// of the cell size, or a double pole flanked by two zeros closer than about
// 1e-5 of it (E − V0/cosh²x on a box of size 5 finds all its points up to
// E/V0 = 1e9 and misses some from 1e10 on). So may a feature narrower than the sample spacing that straddles a
// cutting line so closely that neither the sampling nor the quadrature
// nodes come near it. A multiple zero of a Q evaluated with rounding noise
// splits into a cluster of radius about noise^(1/m); when Newton's method
// cannot tell its members apart, Find reports one point of order m with the
// cluster radius as its error.
// Essential singularities (exp(1/x)) end in DepthLimit.
package turning
