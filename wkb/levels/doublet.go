package levels

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/special"
)

// Doublet is a pair of consecutive levels N = 2n, 2n+1 of two wells coupled
// through a barrier. For symmetric wells they are the tunnelling doublet
// and Splitting is the tunnel splitting; for asymmetric wells they are
// simply neighbours in the common spectrum.
type Doublet struct {
	N            int // doublet index n: levels 2n and 2n+1
	Lower, Upper Level
	Splitting    float64 // Upper.E − Lower.E
	SplittingErr float64 // error estimate of Splitting: its own change with order (twice the next; near the top plus the previous), plus the root tolerances
	Method       string
}

// twoWell is the geometry of two wells about minima xl < xr separated by a
// barrier whose top is at xb.
type twoWell struct {
	g            *geometry
	xl, xr, xb   float64
	vl, vr, vtop float64
}

func newTwoWell(w wkb.Well) (*twoWell, error) {
	g, err := newGeometry(w)
	if err != nil {
		return nil, err
	}
	// Local minima of the grid (interior, or at a wall).
	var mins []int
	for i := 0; i < gridPoints; i++ {
		left := i == 0 && w.LeftWall || i > 0 && g.vs[i] < g.vs[i-1]
		right := i == gridPoints-1 && w.RightWall || i < gridPoints-1 && g.vs[i] <= g.vs[i+1]
		if left && right {
			mins = append(mins, i)
		}
	}
	ig := g.index(g.xmin)
	best, bestDepth, bestTop := -1, 0.0, 0
	for _, m := range mins {
		if m == ig || math.Abs(float64(m-ig)) < 2 {
			continue
		}
		lo, hi := min(m, ig), max(m, ig)
		top := lo
		for i := lo; i <= hi; i++ {
			if g.vs[i] > g.vs[top] {
				top = i
			}
		}
		if depth := g.vs[top] - g.vs[m]; depth > bestDepth {
			best, bestDepth, bestTop = m, depth, top
		}
	}
	if best < 0 {
		return nil, errors.New("levels: the potential has a single well on [A, B]: use Solve")
	}
	tw := &twoWell{g: g}
	xo, vo := g.xs[best], g.vs[best]
	if best > 0 && best < gridPoints-1 {
		xo, vo = g.refineMin(g.xs[best-1], g.xs[best+1])
	}
	tw.xb, tw.vtop = g.refineMax(g.xs[bestTop-1], g.xs[bestTop+1])
	if xo < g.xmin {
		tw.xl, tw.vl, tw.xr, tw.vr = xo, vo, g.xmin, g.vmin
	} else {
		tw.xl, tw.vl, tw.xr, tw.vr = g.xmin, g.vmin, xo, vo
	}
	return tw, nil
}

// refineMax finds the maximum of V in [lo, hi] by golden section and Newton.
func (g *geometry) refineMax(lo, hi float64) (float64, float64) {
	neg := &geometry{w: g.w}
	neg.w.V = negFunc{g.w.V}
	x, v := neg.refineMin(lo, hi)
	return x, -v
}

// coupled holds the phase integrals of the two wells and the barrier at E.
type coupled struct {
	s1, s2, theta float64 // λ∫√Q over each well, λ∫√(−Q) over the barrier
	d1, d2        float64 // energy derivatives of s1, s2 (half periods over ħ)
	t             [4]float64
	wallL, wallR  bool
	noPhi         bool // leave out the barrier-top phase (for the error estimate above the top)
}

// phases computes the integrals at E to order 2j (partial sums of the
// phase series for each well and the barrier).
func (tw *twoWell) phases(E float64, j int, ps *wkb.PhaseSettings, hints *[3]radiusHint) (coupled, error) {
	var c coupled
	w := tw.g.w
	a1, b1, err := tw.g.region(E, tw.xl)
	if err != nil {
		return c, err
	}
	a2, b2, err := tw.g.region(E, tw.xr)
	if err != nil {
		return c, err
	}
	// The grid may step over a barrier top that is barely above E: the
	// inner turning points are then sought between the minima and the top.
	if !(E < tw.vtop) {
		return c, errors.New("levels: energy above the barrier top")
	}
	if b1.wall || b1.x > tw.xb {
		b1 = end{x: tw.g.crossing(tw.xl, tw.xb, E)}
	}
	if a2.wall || a2.x < tw.xb {
		a2 = end{x: tw.g.crossing(tw.xb, tw.xr, E)}
	}
	if a1.x > b1.x || a2.x > b2.x {
		return c, errors.New("levels: turning points of the wells out of order")
	}
	if b1.x >= a2.x {
		return c, errors.New("levels: no barrier between the wells at this energy")
	}
	c.t = [4]float64{a1.x, b1.x, a2.x, b2.x}
	c.wallL, c.wallR = a1.wall, b2.wall
	var hl, hr, hb *radiusHint
	if hints != nil {
		hl, hr, hb = &hints[0], &hints[1], &hints[2]
	}
	wellPhase := func(a, b end, hint *radiusHint) (float64, float64, error) {
		ph, d, _, err := firstOrder(w, E, a, b)
		if err != nil || j == 0 {
			return ph, d, err
		}
		t, _, _, err := series(w, E, a, b, j, ps, hint)
		if err != nil {
			return 0, 0, err
		}
		ph = 0
		for k := 0; k <= j; k++ {
			ph += t[k]
		}
		return ph, d, nil
	}
	if c.s1, c.d1, err = wellPhase(a1, b1, hl); err != nil {
		return c, err
	}
	if c.s2, c.d2, err = wellPhase(a2, b2, hr); err != nil {
		return c, err
	}
	if c.theta, err = barrierPhase(w, E, b1.x, a2.x, j, ps, hb); err != nil {
		return c, err
	}
	return c, nil
}

// barrierPhase returns θ = λ∫_{t2}^{t3}√(−Q) dx, to order 2j the imaginary
// part of the PairPhase series of the barrier's turning points.
func barrierPhase(w wkb.Well, E, t2, t3 float64, j int, ps *wkb.PhaseSettings, hint *radiusHint) (float64, error) {
	q := w.Problem(E).Q
	c, h := (t2+t3)/2, (t3-t2)/2
	f := func(t float64, _ bool, out []complex128) bool {
		s, co := math.Sincos(t)
		qq := -real(q.Eval(complex(c-h*co, 0)))
		if qq < 0 {
			qq = 0
		}
		out[0] = complex(math.Sqrt(qq)*h*s, 0)
		return !math.IsNaN(qq)
	}
	val, _, _, _, def := integrate(f, 1, 0, math.Pi, []float64{quadTol}, maxQuadNodes)
	if !def {
		return 0, errors.New("levels: potential not finite under the barrier")
	}
	theta := real(val[0]) / w.Hbar
	if j == 0 {
		return theta, nil
	}
	r, err := pairPhase(w.Problem(E), complex(t2, 0), complex(t3, 0), 2*j, ps, hint)
	if err != nil {
		return 0, err
	}
	// Terms[0] = iθ; keep the quadrature value of θ (accurate near the top)
	// and add the corrections.
	for k := 1; k <= j && k < len(r.Terms); k++ {
		theta += imag(r.Terms[k])
	}
	return theta, nil
}

// wellFactor returns F(a) = Γ(a + ½) e^a a^(−a) / √(2π), a = S/π: the ratio
// of the exact growing-wave coefficient of the parabolic-cylinder function
// D_ν, a = ν + ½, to its first-order WKB value 2cos(πa). Derivation: with
// Q = a − z²/4, D_ν(z) ≈ z^ν e^(−z²/4) for z → +∞ and
// D_ν(−x) ≈ cos(πν) x^ν e^(−x²/4) + √(2π)/Γ(−ν) x^(−ν−1) e^(x²/4)
// (DLMF 12.9.1, 12.2.15); the WKB waves |Q|^(−1/4)exp(∓∫√(−Q)) from the
// turning points ±2√a tend to √2 e^(∓a/2) a^(±a/2) z^ν e^(−z²/4) and
// √2 e^(−a/2) a^(a/2) x^(−ν−1) e^(x²/4); with 1/Γ(−ν) = −sin(πν)Γ(ν+1)/π the
// ratio is F. F → 1 for large a (Stirling) and F(½) = √(e/π): the
// splitting scales as 1/F, so the textbook ground-state splitting
// (ħω/π)e^(−θ) is too small by √(π/e) (Garg, Am. J. Phys. 68, 430 (2000)).
//
// At order 2j of the phase integrals the first j terms of the Stirling
// series ln F ~ Σ_k c_k a^(1−2k), c_k = B_2k(½)/(2k(2k−1)) (DLMF 5.11.8),
// are part of the barrier integral's own corrections and are divided out.
func wellFactor(s float64, j int) float64 {
	a := s / math.Pi
	if !(a > 0) {
		return 1 / math.Sqrt2 // the limit a → 0
	}
	lg := real(special.LogGamma(complex(a+0.5, 0)))
	lf := lg + a - a*math.Log(a) - 0.5*math.Log(2*math.Pi)
	for k := 1; k <= j && k <= len(stirlingHalf); k++ {
		lf -= stirlingHalf[k-1] * math.Pow(a, float64(1-2*k))
	}
	return math.Exp(lf)
}

// stirlingHalf holds c_k = B_2k(½)/(2k(2k−1)), B_2k(½) = −(1 − 2^(1−2k))B_2k
// (DLMF 24.4.27): the coefficients of ln Γ(z+½) − (z ln z − z + ½ ln 2π).
var stirlingHalf = []float64{-1.0 / 24, 7.0 / 2880, -31.0 / 40320, 127.0 / 215040, -511.0 / 608256, 1414477.0 / 738017280}

// topMappingUncertainty estimates, for levels above the barrier top where
// no higher order is available, the error of the barrier-top comparison
// mapping: the phase φ at ε = −θ/π versus at the local harmonic value
// (E − V_top)/(ħω_b), equally valid to leading order; half the difference
// is the estimate (on the phases). Below the top it is not used: there the
// terms of the asymptotic expansions of φ and of the well-bottom factor F
// in which the two arguments differ are part of the phase series, and what
// remains is seen by the change at the next order.
func (tw *twoWell) topMappingUncertainty(E float64, c coupled) (phiUnc float64) {
	w := tw.g.w
	harm := func(x, v float64) float64 {
		t := w.V.Taylor(complex(x, 0), 2)
		om := math.Sqrt(math.Abs(2*real(t[2])) / w.Mass)
		if om == 0 {
			return math.NaN()
		}
		return (E - v) / (w.Hbar * om)
	}
	if eb := harm(tw.xb, tw.vtop); !math.IsNaN(eb) {
		phiUnc = 0.5 * math.Abs(special.ParabolicPhase(-c.theta/math.Pi)-special.ParabolicPhase(eb))
	}
	return phiUnc
}

// countPhase returns the monotone functions Ψ − h and Ψ + h whose values
// πN (N even) and π(N+1) (N odd) give level N of the coupled wells.
//
// Derivation. Near t2 the left well's solution, decaying beyond t1, is
// cos(S1 − w − π/4) with w = λ∫_x^{t2}√Q, i.e. incoming and outgoing waves
// of phases ±(S1 − π/4) (S1 − π/2 for a wall at A); likewise the right
// well. The parabolic connection through the barrier (Miller & Good 1953;
// Connor, Mol. Phys. 15, 37 (1968); Child, Semiclassical Mechanics with
// Molecular Applications (1991) §4) is the symmetric unitary S-matrix
// t = e^(−iφ)/√(1+κ²), r = −iκ t, κ = e^θ, φ = φ(−θ/π) (the sign of φ,
// i.e. of arg t, fixed by the finite-difference check in the tests: the
// other sign makes levels near the top worse than first order). Equating
// outgoing waves to S times incoming ones gives, with A = S1 − φ/2,
// B = S2 − φ/2,
//
//	cot A cot B = K(θ),  K = (√(1+e^(−2θ)) − 1)/(√(1+e^(−2θ)) + 1) ≈ e^(−2θ)/4.
//
// The comparison of each well's bottom with a parabolic well replaces, as
// in the derivation of wellFactor, 2cos S_i by 2F_i cos S_i in the
// growing-wave coefficient, hence K → r² = K/(F1F2). With
// ρ = (1 − r²)/(1 + r²) the condition is cos(A+B) = −ρ cos(A−B), whose
// roots are Ψ = A + B = πN + h (N even), π(N+1) − h (N odd),
// h = arccos(−ρ cos(A−B)) ∈ [0, π]; |dh/dE| ≤ |A′ − B′| ≤ Ψ′ keeps Ψ ∓ h
// monotone. Far below the top (θ → ∞, φ → 0) cos A cos B = 0: each well
// alone. Above the top the condition tends to cos(A+B) = 0: one well.
func countPhase(c coupled, j int) (minus, plus float64) {
	eps := -c.theta / math.Pi
	phi := special.ParabolicPhase(eps)
	if c.noPhi {
		phi = 0
	}
	// At order 2j the phase integrals already hold the first j terms of
	// the asymptotic expansions of φ and ln F: subtract them.
	for k := 1; k <= j && k <= len(stirlingHalf); k++ {
		sg := 1.0
		if k%2 == 1 {
			sg = -1
		}
		phi -= sg * stirlingHalf[k-1] * math.Pow(eps, float64(1-2*k))
	}
	a := c.s1 - phi/2
	b := c.s2 - phi/2
	f1, f2 := 1.0, 1.0
	if c.wallL {
		a -= math.Pi / 4
	} else {
		f1 = wellFactor(c.s1, j)
	}
	if c.wallR {
		b -= math.Pi / 4
	} else {
		f2 = wellFactor(c.s2, j)
	}
	x := math.Exp(-c.theta)
	root := math.Sqrt(1 + x*x)
	k := x * x / ((root + 1) * (root + 1))
	r2 := k / (f1 * f2)
	return a + b - halfGap(a-b, r2), a + b + halfGap(a-b, r2)
}

// halfGap returns h = arccos(−ρ cos d), ρ = (1 − r²)/(1 + r²), without the
// cancellation of 1 − ρ against 1 that arccos would suffer for the tiny r²
// of deep doublets (r² ≈ e^(−2θ)/4 is below rounding of 1 for θ ≳ 17, and
// the splitting, ∝ r, would be lost): with 1 − ρ = 2r²/(1 + r²) and
// 1 ∓ cos d = 2 sin²(d/2), 2 cos²(d/2),
//
//	π − h = 2 arcsin √(sin²(d/2) + r² cos d/(1 + r²))   (ρ cos d ≥ 0),
//	h     = 2 arcsin √(cos²(d/2) − r² cos d/(1 + r²))   (ρ cos d < 0).
func halfGap(d, r2 float64) float64 {
	c := math.Cos(d)
	u := r2 / (1 + r2) * c
	rho := (1 - r2) / (1 + r2)
	if rho*c >= 0 {
		s := math.Sin(d / 2)
		return math.Pi - 2*math.Asin(math.Sqrt(math.Max(0, math.Min(1, s*s+u))))
	}
	co := math.Cos(d / 2)
	return 2 * math.Asin(math.Sqrt(math.Max(0, math.Min(1, co*co-u))))
}

// Doublets returns, for each n in ns, the levels 2n and 2n+1 of two wells
// coupled through a barrier (the two lowest-lying wells of V on [A, B]
// separated by the highest barrier), from the uniform quantisation
// condition of countPhase at orders 0 … MaxOrder of the phase integrals.
// Levels below the bottom of the shallower well belong to the deeper well
// alone and come from Solve. Levels above the barrier top come from the
// same condition continued through the top (complex turning points, first
// order only): near the top they are much better than Solve's, far above it
// Solve's higher orders are better.
func Doublets(w wkb.Well, ns []int, s *Settings) ([]Doublet, error) {
	set, err := s.defaults()
	if err != nil {
		return nil, err
	}
	tw, err := newTwoWell(w)
	if err != nil {
		return nil, err
	}
	var out []Doublet
	for _, n := range ns {
		if n < 0 {
			return out, fmt.Errorf("levels: negative doublet index %d", n)
		}
		lo, err := tw.level(2*n, set)
		if err != nil {
			return out, err
		}
		hi, err := tw.level(2*n+1, set)
		if err != nil {
			return out, err
		}
		if coupledPair(lo, hi) {
			// One truncation order for both levels, judged by the larger
			// of their changes, so that the splitting is that of one order.
			m := min(len(lo.es), len(hi.es))
			ds := make([]float64, m)
			for k := 1; k < m; k++ {
				ds[k] = ds[k-1] + math.Max(math.Abs(lo.es[k]-lo.es[k-1]), math.Abs(hi.es[k]-hi.es[k-1]))
			}
			kk := leastOrder(ds, ds, lo.maxK)
			lo.setOrder(kk)
			hi.setOrder(kk)
		}
		if tunnelPair(lo, hi, w.Hbar) {
			// A tunnelling doublet may be split far below the root
			// tolerance: the energies at the order used and the next are
			// re-solved to rounding, so that the splitting and its change
			// with order are not lost in it.
			lo.polishOrders()
			hi.polishOrders()
			// A tunnelling doublet: the errors of its levels are a common
			// part plus and minus half the splitting's; the next change of
			// one level may have the two nearly cancel where the other has
			// them add, so each level takes the larger estimate.
			e := math.Max(lo.errOrd, hi.errOrd)
			lo.Err += e - lo.errOrd
			hi.Err += e - hi.errOrd
		}
		d := Doublet{N: n, Lower: lo.Level, Upper: hi.Level, Splitting: hi.E - lo.E}
		// The splitting's error: its change with the next order (by the
		// rule of orderErr) and the root tolerances. The common error of
		// the two levels cancels in the change, which is that of the
		// splitting itself (relative to it for a tunnelling doublet).
		split := make([]float64, min(len(lo.es), len(hi.es)))
		for j := range split {
			split[j] = hi.es[j] - lo.es[j]
		}
		kk := min(lo.Order, hi.Order) / 2
		var se float64
		if len(split) > kk+1 && lo.Order == hi.Order && !lo.above && !hi.above {
			// A level of the deeper well alone (single) carries, besides
			// its series, the coupling beyond all orders: kept.
			se = orderErr(split, kk, lo.nearTop || hi.nearTop) + lo.Beyond + hi.Beyond
		} else {
			se = lo.errOrd + hi.errOrd // no next order for both, or levels from different methods
		}
		d.SplittingErr = se + lo.rootTol + hi.rootTol
		d.Method = lo.Method
		out = append(out, d)
	}
	return out, nil
}

// tunnelPair reports whether levels lo and hi, both from the coupled
// condition below the barrier top with the same orders, form a tunnelling
// doublet: split by less than a quarter of the level spacing ħω.
func tunnelPair(lo, hi levelX, hbar float64) bool {
	if !coupledPair(lo, hi) || len(lo.es) != len(hi.es) {
		return false
	}
	return hi.E-lo.E < 0.25*hbar*math.Min(lo.Omega, hi.Omega)
}

// polishOrders re-solves the energies at the order used and the next to
// rounding, and lowers the root tolerance to what was reached: 8 ulp of E.
func (lv *levelX) polishOrders() {
	if lv.polish == nil {
		return
	}
	k := lv.Order / 2
	for j := k; j <= k+1 && j < len(lv.es); j++ {
		e, ok := lv.polish(j, lv.es[j])
		if !ok {
			return
		}
		lv.es[j] = e
	}
	lv.rootTol = 8 * eps * math.Abs(lv.es[k])
	lv.setOrder(k)
}

// coupledPair reports whether both levels come from the coupled condition
// below the barrier top.
func coupledPair(lo, hi levelX) bool {
	return !(lo.above || hi.above || lo.single || hi.single)
}

// levelX is a Level with the signed change at the next order, used for
// the splitting error.
type levelX struct {
	Level
	es      []float64 // energies at orders 0, 2, …, including the one beyond Order
	nearTop bool
	errOrd  float64 // error from the change between orders
	above   bool    // from levelAbove
	maxK    int     // MaxOrder/2
	// polish re-solves the energy e at order 2j to rounding.
	polish func(j int, e float64) (float64, bool)
	// firstErr is the estimate of a level with no higher order.
	firstErr float64
	single   bool // from solveOne (below the other well's bottom)
	rootTol  float64
}

// orderErr returns the error estimate of es[k] from the changes between
// orders: twice the next change, i.e. the next term of the series plus its
// remainder beyond, which while the terms still decrease is at most about
// the next term again; near the barrier top, where the corrections are not
// uniform and need not decrease, that plus the previous change; without a
// next order twice the previous change (or +Inf at first order).
func orderErr(es []float64, k int, nearTop bool) float64 {
	var prev float64
	if k >= 1 {
		prev = math.Abs(es[k] - es[k-1])
	}
	if len(es) <= k+1 {
		if k == 0 {
			return math.Inf(1)
		}
		return 2 * prev
	}
	next := math.Abs(es[k+1] - es[k])
	if nearTop {
		return 2*next + prev
	}
	return 2 * next
}

// level returns global level N of the coupled wells.
func (tw *twoWell) level(N int, set Settings) (levelX, error) {
	w := tw.g.w
	ec := math.Max(tw.vl, tw.vr)
	span := tw.vtop - ec
	if !(span > 0) {
		return levelX{}, errors.New("levels: the barrier top is not above the shallower well's bottom")
	}
	lo := ec + 1e-7*span
	hi := tw.vtop - 1e-9*span
	K := set.MaxOrder / 2
	xtol := set.Tol * math.Max(math.Abs(tw.vtop), span)
	var hints [3]radiusHint
	gPhi := func(E float64, j int, noPhi bool) float64 {
		c, err := tw.phases(E, j, set.Phase, &hints)
		if err != nil {
			return math.NaN()
		}
		c.noPhi = noPhi
		m, p := countPhase(c, j)
		if N%2 == 0 {
			return m - math.Pi*float64(N)
		}
		return p - math.Pi*float64(N+1)
	}
	g := func(E float64, j int) float64 { return gPhi(E, j, false) }
	polish := func(j int, e float64) (float64, bool) {
		f := func(E float64) float64 { return g(E, j) }
		a, b := e-2*xtol, e+2*xtol
		if !(f(a) <= 0 && f(b) >= 0) {
			return e, false
		}
		return root(f, a, b, 0)
	}
	if v := g(lo, 0); v > 0 {
		// Below the shallower well: the deeper well alone.
		lv, next, err := solveNext(tw.g, N, set)
		if err != nil {
			return levelX{}, err
		}
		lv.Method = "single well below the bottom of the other well: " + lv.Method
		// Energies by order up to the one used, and the next, so that a
		// neighbour's difference from it can be judged order by order.
		es := append([]float64(nil), lv.ByOrder[:lv.Order/2+1]...)
		if !math.IsNaN(next) {
			es = append(es, next)
		}
		return levelX{Level: lv, es: es, errOrd: lv.Err, single: true}, nil
	}
	if v := g(hi, 0); !(v >= 0) {
		if math.IsNaN(v) {
			return levelX{}, fmt.Errorf("levels: level %d: phase integrals fail just below the barrier top %g", N, tw.vtop)
		}
		return tw.levelAbove(N, set)
	}
	var lv levelX
	lv.N = N
	lv.polish = polish
	var es []float64
	for j := 0; j <= K+1; j++ {
		f := func(E float64) float64 { return g(E, j) }
		a, b := lo, hi
		if j > 0 {
			// Bracket about the previous order's energy, widening.
			prev := es[j-1]
			d := 1e-6 * span
			if j > 1 {
				d = math.Max(d, 4*math.Abs(es[j-1]-es[j-2]))
			}
			// Beyond the second order a root farther than a few hundred
			// times the last change means the series has diverged: the
			// search stops there (and at the ends of the range) rather
			// than evaluate the costly higher orders across the range.
			dmax := math.Inf(1)
			if j > 1 {
				dmax = 64 * d
			}
			ok := false
			for k := 0; k < 30 && d <= dmax; k++ {
				a, b = math.Max(lo, prev-d), math.Min(hi, prev+d)
				if f(a) <= 0 && f(b) >= 0 {
					ok = true
					break
				}
				if a == lo && b == hi {
					break
				}
				d *= 2
			}
			if !ok {
				lv.Warnings = append(lv.Warnings, fmt.Sprintf("no root at order %d", 2*j))
				break
			}
		}
		e, ok := root(f, a, b, xtol)
		if !ok {
			if j == K+1 {
				break
			}
			lv.Status = RootLimit
		}
		es = append(es, e)
	}
	lv.rootTol = xtol
	lv.es = es
	lv.maxK = K
	kk := leastOrder(es, es, K)
	lv.E = es[kk]
	c, err := tw.phases(lv.E, 0, set.Phase, nil)
	if err != nil {
		return levelX{}, err
	}
	// Within about two ħω_b of the barrier top (|ε| = θ/π < 2) the barrier
	// corrections, powers of 1/ε, are not yet small and need not decrease
	// (at θ ≈ 4 the true error of order 6 is still three times the change
	// to order 8): there the estimate also takes the previous change.
	lv.nearTop = c.theta < 2*math.Pi
	if len(es) == 1 {
		// First order only (the higher orders have no root, as happens
		// just below the top, where their barrier corrections grow like
		// powers of 1/ε): as above the top, the estimate is the change
		// when the barrier-top phase φ, the uniform correction, is left
		// out.
		f := func(E float64) float64 { return gPhi(E, 0, true) }
		a, b := lo, hi
		if f(a) <= 0 && f(b) >= 0 {
			if e0, ok := root(f, a, b, xtol); ok {
				lv.firstErr = math.Abs(lv.E - e0)
				lv.Warnings = append(lv.Warnings, "first order only: the estimate is the size of the barrier-top correction")
			}
		}
	}
	lv.setOrder(kk)
	lv.Turning = [2]float64{c.t[0], c.t[3]}
	lv.Maslov = maslov(end{wall: c.wallL}, end{wall: c.wallR})
	lv.Period = 2 * w.Hbar * c.d1
	lv.Omega = 2 * math.Pi / lv.Period
	return lv, nil
}

// leastOrder returns the index of the order at which to truncate the
// energies es (orders 0, 2, …), judged by the changes ds between orders
// (es itself, or for a doublet the larger change of its two levels). With
// the energy beyond kmax found, kmax: near the top the changes are not yet
// terms of an asymptotic series (a small change may be a cancellation,
// and the order after a large one still better), which orderErr's
// previous-change term covers. When the series broke down before (a
// higher order had no root), the last order found if the changes decrease
// up to it, otherwise the order before the least change (optimal
// truncation, as in Solve).
func leastOrder(es, ds []float64, kmax int) int {
	if len(es) >= kmax+2 {
		return kmax
	}
	m := len(es) - 1
	if m < 1 {
		return 0
	}
	least := 1
	for k := 2; k <= m; k++ {
		if math.Abs(ds[k]-ds[k-1]) < math.Abs(ds[least]-ds[least-1]) {
			least = k
		}
	}
	if least == m {
		return m
	}
	return least - 1
}

// setOrder truncates the level at es[kk] and sets its estimate.
func (lv *levelX) setOrder(kk int) {
	lv.ByOrder = lv.es[:kk+1]
	lv.E = lv.es[kk]
	lv.Order = 2 * kk
	if len(lv.es) == 1 && lv.firstErr > 0 {
		lv.errOrd = lv.firstErr
	} else {
		lv.errOrd = orderErr(lv.es, kk, lv.nearTop)
	}
	lv.Err = lv.errOrd + lv.rootTol
	const noNext = "no next-order energy: the estimate uses the last change"
	var ws []string
	for _, w := range lv.Warnings {
		if w != noNext {
			ws = append(ws, w)
		}
	}
	if len(lv.es) > 1 && len(lv.es) <= kk+1 {
		ws = append(ws, noNext)
	}
	lv.Warnings = ws
	lv.Method = fmt.Sprintf("two wells, uniform parabolic connection through the barrier, phase integrals to order %d", lv.Order)
	if kk < lv.maxK && kk+1 < len(lv.es) && lv.Status == Success {
		lv.Status = LeastTerm
	}
}

// phasesAbove computes the phase integrals above the barrier top, where the
// barrier's turning points are a complex-conjugate pair t3 = xr + iy,
// t2 = conj(t3): θ continues to −λ∫_{−y}^{y} √Q(xr + is) ds < 0, and
// S1 + S2 to the real-axis integral over the whole allowed interval, split
// at xr. (For a parabolic top both continuations are exact: the integrals
// have the same form e·ln|e| on both sides, which φ's −ε ln|ε| + ε
// cancels; so the condition is continuous through the top.) First order.
func (tw *twoWell) phasesAbove(E float64, usePhi bool) (coupled, error) {
	var c coupled
	w := tw.g.w
	a, b, err := tw.g.region(E, tw.xb)
	if err != nil {
		return c, err
	}
	p := w.Problem(E)
	// Newton from the parabolic estimate of the upper turning point.
	t := w.V.Taylor(complex(tw.xb, 0), 2)
	k := -real(t[2]) // V ≈ Vtop − k(x − xb)²
	if !(k > 0) {
		return c, errors.New("levels: barrier top is not quadratic")
	}
	z := complex(tw.xb, math.Sqrt((E-tw.vtop)/k))
	// Just above the top the pair is nearly double and rounding limits z to
	// about eps·|Q|/|Q′| ≫ 1e-14 of the interval: Newton is also done when
	// its steps stop shrinking at a small fraction of Im z.
	ok := false
	prev := math.Inf(1)
	for it := 0; it < 60; it++ {
		q := p.Q.Taylor(z, 1)
		if q[1] == 0 {
			break
		}
		dz := q[0] / q[1]
		z -= dz
		adz := cmplx.Abs(dz)
		if adz < 1e-14*(math.Abs(b.x-a.x)) || it >= 3 && adz > prev/2 && adz < 1e-8*math.Abs(imag(z)) {
			ok = true
			break
		}
		prev = adz
	}
	if !ok || !(imag(z) > 0) || real(z) <= a.x || real(z) >= b.x {
		return c, errors.New("levels: complex turning points above the barrier top not found")
	}
	ph, good := segmentPhase(p, cmplx.Conj(z), z)
	if !good {
		return c, errors.New("levels: barrier integral above the top failed")
	}
	c.theta = -math.Abs(imag(ph))
	xr := real(z)
	if c.s1, c.d1, _, err = firstOrder(w, E, a, end{x: xr}); err != nil {
		return c, err
	}
	if c.s2, c.d2, _, err = firstOrder(w, E, end{x: xr}, b); err != nil {
		return c, err
	}
	c.t = [4]float64{a.x, xr, xr, b.x}
	c.wallL, c.wallR = a.wall, b.wall
	c.noPhi = !usePhi
	return c, nil
}

// levelAbove returns level N above the barrier top from the continued
// uniform condition. Its error estimate is the mapping uncertainty plus the
// change when the barrier-top phase φ is left out (the size of the uniform
// correction, as no higher order is available here).
func (tw *twoWell) levelAbove(N int, set Settings) (levelX, error) {
	w := tw.g.w
	span := tw.vtop - math.Max(tw.vl, tw.vr)
	xtol := set.Tol * math.Max(math.Abs(tw.vtop), span)
	solve := func(usePhi bool) (float64, error) {
		g := func(E float64) float64 {
			c, err := tw.phasesAbove(E, usePhi)
			if err != nil {
				return math.NaN()
			}
			m, p := countPhase(c, 0)
			if N%2 == 0 {
				return m - math.Pi*float64(N)
			}
			return p - math.Pi*float64(N+1)
		}
		// Right at the top the nearly double turning points may not be
		// resolved: start a little higher then.
		lo := tw.vtop + 1e-9*span
		for k := 0; k < 5 && math.IsNaN(g(lo)); k++ {
			lo = tw.vtop + (lo-tw.vtop)*10
		}
		if v := g(lo); !(v < 0) {
			return 0, fmt.Errorf("levels: level %d: no root at the barrier top", N)
		}
		step := span
		hi := lo + step
		bad := math.Inf(1)
		for k := 0; ; k++ {
			if k > 200 {
				return 0, fmt.Errorf("levels: level %d: no energy bracket above the barrier top", N)
			}
			v := g(hi)
			if math.IsNaN(v) {
				bad = hi
				if bad-lo < xtol {
					return 0, fmt.Errorf("levels: level %d is not bound in [A, B]", N)
				}
				hi = (lo + bad) / 2
				continue
			}
			if v > 0 {
				break
			}
			lo = hi
			if math.IsInf(bad, 1) {
				step *= 2
				hi = lo + step
			} else {
				hi = (lo + bad) / 2
			}
		}
		e, ok := root(g, lo, hi, xtol)
		if !ok {
			return e, fmt.Errorf("levels: level %d: root finder failed above the barrier top", N)
		}
		return e, nil
	}
	e, err := solve(true)
	if err != nil {
		return levelX{}, err
	}
	e0, err := solve(false)
	if err != nil {
		return levelX{}, err
	}
	c, err := tw.phasesAbove(e, true)
	if err != nil {
		return levelX{}, err
	}
	var lv levelX
	lv.N, lv.E, lv.ByOrder, lv.Order = N, e, []float64{e}, 0
	lv.es = []float64{e}
	lv.nearTop = true
	lv.above = true
	lv.rootTol = xtol
	phiUnc := tw.topMappingUncertainty(e, c)
	dA := c.d1 + c.d2
	lv.errOrd = math.Abs(e - e0)
	lv.Err = lv.errOrd + xtol
	if dA > 0 {
		lv.Err += 2 * phiUnc / dA
	}
	lv.Turning = [2]float64{c.t[0], c.t[3]}
	lv.Maslov = maslov(end{wall: c.wallL}, end{wall: c.wallR})
	lv.Period = 2 * w.Hbar * dA
	lv.Omega = 2 * math.Pi / lv.Period
	lv.Method = "above the barrier top: uniform parabolic connection continued through the top (complex turning points), first order"
	return lv, nil
}
