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
	SplittingErr float64 // change of the splitting with the next order, plus root tolerances
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

// mappingUncertainty estimates the error of the comparison-equation
// mappings themselves, which no order of the phase integrals sees: the
// parabolic-well factor F is evaluated at the action a = S/π, while the
// local harmonic quantum number (E − V_min)/(ħω) is an equally valid
// argument to leading order; likewise the barrier-top phase φ at
// ε = −θ/π versus (E − V_top)/(ħω_b). The differences of ½ ln F (per
// well, relative on r) and of φ/2 (on the phases) are the estimates.
func (tw *twoWell) mappingUncertainty(E float64, c coupled) (fUnc, phiUnc float64) {
	w := tw.g.w
	harm := func(x, v float64) float64 {
		t := w.V.Taylor(complex(x, 0), 2)
		om := math.Sqrt(math.Abs(2*real(t[2])) / w.Mass)
		if om == 0 {
			return math.NaN()
		}
		return (E - v) / (w.Hbar * om)
	}
	lnF := func(a float64) float64 {
		if !(a > 0) {
			return -0.5 * math.Ln2
		}
		return real(special.LogGamma(complex(a+0.5, 0))) + a - a*math.Log(a) - 0.5*math.Log(2*math.Pi)
	}
	if !c.wallL {
		if ah := harm(tw.xl, tw.vl); !math.IsNaN(ah) {
			fUnc += 0.5 * math.Abs(lnF(c.s1/math.Pi)-lnF(ah))
		}
	}
	if !c.wallR {
		if ah := harm(tw.xr, tw.vr); !math.IsNaN(ah) {
			fUnc += 0.5 * math.Abs(lnF(c.s2/math.Pi)-lnF(ah))
		}
	}
	if eb := harm(tw.xb, tw.vtop); !math.IsNaN(eb) {
		phiUnc = 0.5 * math.Abs(special.ParabolicPhase(-c.theta/math.Pi)-special.ParabolicPhase(eb))
	}
	return fUnc, phiUnc
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
	rho := (1 - r2) / (1 + r2)
	h := math.Acos(math.Max(-1, math.Min(1, -rho*math.Cos(a-b))))
	return a + b - h, a + b + h
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
		d := Doublet{N: n, Lower: lo.Level, Upper: hi.Level, Splitting: hi.E - lo.E}
		// The splitting's error: its change with the next order.
		// The splitting's error: its change with the next order, the
		// uncertainty of the well-bottom comparison (relative, on the
		// splitting) and the root tolerances.
		split := make([]float64, min(len(lo.es), len(hi.es)))
		for j := range split {
			split[j] = hi.es[j] - lo.es[j]
		}
		kk := min(lo.Order, hi.Order) / 2
		var se float64
		if len(split) > kk {
			se = orderErr(split, kk, lo.nearTop || hi.nearTop)
		} else {
			se = lo.errOrd + hi.errOrd // levels from different methods
		}
		d.SplittingErr = se + math.Abs(d.Splitting)*math.Max(lo.fUnc, hi.fUnc) + lo.rootTol + hi.rootTol
		d.Method = lo.Method
		out = append(out, d)
	}
	return out, nil
}

// levelX is a Level with the signed change at the next order, used for
// the splitting error.
type levelX struct {
	Level
	es      []float64 // energies at orders 0, 2, …, including the one beyond Order
	nearTop bool
	errOrd  float64 // error from the change between orders
	rootTol float64
	fUnc    float64 // relative uncertainty of r = √K/√(F1F2) from the comparison mapping
	phiUnc  float64 // uncertainty of the phase A from the barrier-top mapping
}

// orderErr returns the error estimate of es[k] from the changes between
// orders: the next change; near the barrier top twice that plus the
// previous change; without a next order twice the previous change (or
// +Inf at first order).
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
	return next
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
	g := func(E float64, j int) float64 {
		c, err := tw.phases(E, j, set.Phase, &hints)
		if err != nil {
			return math.NaN()
		}
		m, p := countPhase(c, j)
		if N%2 == 0 {
			return m - math.Pi*float64(N)
		}
		return p - math.Pi*float64(N+1)
	}
	if v := g(lo, 0); v > 0 {
		// Below the shallower well: the deeper well alone.
		lv, err := solveOne(tw.g, N, set)
		if err != nil {
			return levelX{}, err
		}
		lv.Method = "single well below the bottom of the other well: " + lv.Method
		return levelX{Level: lv, es: []float64{lv.E}, errOrd: lv.Err, rootTol: lv.Err}, nil
	}
	if v := g(hi, 0); !(v >= 0) {
		if math.IsNaN(v) {
			return levelX{}, fmt.Errorf("levels: level %d: phase integrals fail just below the barrier top %g", N, tw.vtop)
		}
		return tw.levelAbove(N, set)
	}
	var lv levelX
	lv.N = N
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
			ok := false
			for k := 0; k < 30; k++ {
				a, b = math.Max(lo, prev-d), math.Min(hi, prev+d)
				if f(a) <= 0 && f(b) >= 0 {
					ok = true
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
	kk := min(K, len(es)-1)
	lv.ByOrder = es[:kk+1]
	lv.E = es[kk]
	lv.Order = 2 * kk
	lv.rootTol = xtol
	lv.es = es
	c, err := tw.phases(lv.E, 0, set.Phase, nil)
	if err != nil {
		return levelX{}, err
	}
	// Within about one ħω_b of the barrier top (|ε| < 1) the corrections of
	// the phase integrals are not uniform and need not decrease: there the
	// estimate also takes the previous order's change.
	lv.nearTop = c.theta < math.Pi
	lv.errOrd = orderErr(es, kk, lv.nearTop)
	if len(es) <= kk+1 {
		lv.Warnings = append(lv.Warnings, "no next-order energy: the estimate uses the last change")
	}
	lv.fUnc, lv.phiUnc = tw.mappingUncertainty(lv.E, c)
	// An uncertainty δA of the phases moves the level by δA/(dA/dE); a
	// relative uncertainty u of r moves it by about u·r/(dA/dE).
	dA := c.d1 + c.d2
	if dA > 0 {
		lv.Err = lv.errOrd + xtol + 2*lv.phiUnc/dA
	} else {
		lv.Err = math.Inf(1)
	}
	lv.Turning = [2]float64{c.t[0], c.t[3]}
	lv.Maslov = maslov(end{wall: c.wallL}, end{wall: c.wallR})
	lv.Period = 2 * w.Hbar * c.d1
	lv.Omega = 2 * math.Pi / lv.Period
	lv.Method = fmt.Sprintf("two wells, uniform parabolic connection through the barrier, phase integrals to order %d", lv.Order)
	return lv, nil
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
	ok := false
	for it := 0; it < 60; it++ {
		q := p.Q.Taylor(z, 1)
		if q[1] == 0 {
			break
		}
		dz := q[0] / q[1]
		z -= dz
		if cmplx.Abs(dz) < 1e-14*(math.Abs(b.x-a.x)) {
			ok = true
			break
		}
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
		lo := tw.vtop + 1e-9*span
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
	lv.rootTol = xtol
	lv.fUnc, lv.phiUnc = tw.mappingUncertainty(e, c)
	dA := c.d1 + c.d2
	lv.errOrd = math.Abs(e - e0)
	lv.Err = lv.errOrd + xtol
	if dA > 0 {
		lv.Err += 2 * lv.phiUnc / dA
	}
	lv.Turning = [2]float64{c.t[0], c.t[3]}
	lv.Maslov = maslov(end{wall: c.wallL}, end{wall: c.wallR})
	lv.Period = 2 * w.Hbar * dA
	lv.Omega = 2 * math.Pi / lv.Period
	lv.Method = "above the barrier top: uniform parabolic connection continued through the top (complex turning points), first order"
	return lv, nil
}
