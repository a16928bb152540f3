package connect

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"sort"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Settings controls Scatter. A nil *Settings means all defaults.
type Settings struct {
	// MaxOrder is the highest even order 2N of the Riccati terms included in
	// the barrier integrals θ (terms of size λ^(1−2N)) and in the phases
	// (order 2 at most at a forbidden right end). Zero means 2, the first
	// correction to leading-order WKB; 4 is often much more accurate; a
	// negative value means 0 (leading order only). The orders 2N+2 and 2N+4
	// of θ and the next phase order are computed for the error estimate,
	// and θ is cut earlier at its least term.
	MaxOrder int
	// Tol is the relative tolerance of every quadrature. Zero means 1e-11.
	Tol float64
}

// Barrier is one element of the composition: a barrier between two real
// simple turning points, or a complex-conjugate pair of turning points above
// the top of a barrier.
type Barrier struct {
	Left, Right complex128 // the turning points; for a pair Left is the upper one, Right its conjugate
	Pair        bool       // complex-conjugate pair (θ < 0)
	Theta       float64    // barrier integral θ with the included higher-order terms
	Terms       []float64  // θ_{2k} = λ^(1−2k) × order-2k term, k = 0…N+2 (the last two make the error estimate)
	ThetaErr    float64    // error estimate of Theta: first excluded term plus quadrature error
	// FirstOrder marks a complex pair composed at leading order only
	// (Theta = −2λS, Terms of length 1): its whole effect on R, T and the
	// phases is below a tenth of their other errors and is added to the
	// error estimates instead of being refined (see Scatter).
	FirstOrder bool
}

// Singularity is a complex zero or pole of Q weighed for its share of the
// reflection: S = Im ∫_x^z √Q along the vertical from x = Re z, and the
// estimate |r| ≈ Prefactor · exp(−2λS).
type Singularity struct {
	Point     turning.Point
	S         float64
	Prefactor float64 // NaN when no prefactor is known for its kind
	blocked   bool    // weighed beside another singularity; error estimate only
}

// Result is the outcome of Scatter.
type Result struct {
	R, T        float64    // reflection and transmission coefficients, R + T = 1
	Refl, Trans complex128 // amplitudes r, t (package comment: phases relative to a and b)
	ErrR, ErrT  float64    // error estimates, relative to R and T (next-order term, quadrature, weak pairs, neglected singularities, rounding 1e-14)
	ErrPhase    float64    // error estimate of arg r and arg t in radians (next-order term, quadrature)
	Method      string     // the formula that produced R and T
	Order       int        // highest even Riccati order 2N included in θ and the phases
	// Dominant is the complex singularity that governs the reflection when
	// no real turning point lies in (a, b); nil otherwise.
	Dominant *turning.Point
	Barriers []Barrier     // the elements composed, left to right
	Singular []Singularity // the complex singularities weighed, by increasing S
	Warnings []string      // where the result is outside the formulae's range
}

// element is one barrier of the composition with its reference points.
type element struct {
	b           Barrier
	left, right anchor
	thetaTerms  []float64
	thetaQuad   []float64 // quadrature error of each term
	weak        bool      // complex pair composed at leading order, its effect counted as error
	omit        bool      // left out of the composition (to measure its effect)
}

// anchor is a reference point of the coefficient vectors: an interval end
// (g = 0) or a turning point z reached from the real base point base.
type anchor struct {
	z    complex128
	base float64
	g    []complex128 // FP ∫_base^z −iφ_{2k} dz
	gErr []float64
}

// Scatter returns the reflection and transmission of a wave incident from
// the left on [a, b] for the problem p, from the WKB connection formulae
// composed along the real axis. points are the zeros and poles of Q found
// by the caller (a search box about [a, b]); Scatter uses the real simple
// zeros in (a, b) as barrier turning points, the complex simple zeros above
// allowed parts of the axis as complex pairs, and weighs every complex
// singularity by S = Im ∫ √Q from the real axis.
//
// Barriers (real pairs) and complex pairs are connected by the uniform
// parabolic-cylinder matrix (ParabolicBarrierOrder), the allowed stretches
// between them by Propagation with the higher-order phase. When no turning
// point is real and the complex singularity of least S is a simple pole of
// Q (or a double zero), the reflection is the estimate
// |r| ≈ Prefactor·exp(−2λS) instead, with the nominal prefactor of the
// local Stokes multiplier (2 for a simple pole), which is not verified: its
// ErrR is a stated rule of thumb (see poleEstimate and Result.Warnings).
//
// The result is taken to order Settings.MaxOrder, or less where the series
// of amplitude changes stops decreasing (least term; a warning says so).
// Complex pairs whose effect on R, T and the phases is below a tenth of the
// other errors are composed at leading order only, their whole effect added
// to the error estimates (see the package comment); no warning is given
// for them, since they do not change the figures.
//
// At or within |ε| < 0.02 of a barrier top (a double zero of Q on the
// axis, or two simple zeros that close) R, T and the phases are
// extrapolated from Q shifted by ±δ (see scatterTop and the package
// comment), where the composition of the two zeros cannot be used. A loop
// round a turning point that encloses a zero or pole not listed (one
// outside the search box) is shrunk, up to four times.
//
// Q must be positive at a; Scatter returns an error otherwise, and if the
// signs of Q on the axis do not match the listed real turning points. If Q
// is not positive at b, the wave is taken to decay into the forbidden
// region there (total reflection, t = 0, with a warning; ErrT is the leak
// exp(−2λ∫√|Q|) from the last turning point to b).
func Scatter(p wkb.Problem, a, b float64, points []turning.Point, s *Settings) (*Result, error) {
	return scatter(p, a, b, points, s, true)
}

// scatter is Scatter; top enables the barrier-top treatment of two simple
// zeros within |ε| < nearTopEps of a top (see nearTop).
func scatter(p wkb.Problem, a, b float64, points []turning.Point, s *Settings, top bool) (*Result, error) {
	set := Settings{MaxOrder: 2, Tol: 1e-11}
	if s != nil {
		if s.MaxOrder != 0 {
			set.MaxOrder = s.MaxOrder
		}
		if s.Tol != 0 {
			set.Tol = s.Tol
		}
	}
	if set.MaxOrder < 0 {
		set.MaxOrder = 0
	}
	N := set.MaxOrder / 2
	switch {
	case p.Q == nil:
		return nil, errors.New("connect: problem has no Q")
	case !(p.Lambda > 0) || math.IsInf(p.Lambda, 0):
		return nil, fmt.Errorf("connect: lambda must be positive and finite, got %g", p.Lambda)
	case math.IsNaN(a) || math.IsNaN(b) || math.IsInf(a, 0) || math.IsInf(b, 0) || !(a < b):
		return nil, fmt.Errorf("connect: need a finite interval a < b, got [%g, %g]", a, b)
	case !(set.Tol > 0 && set.Tol < 1):
		return nil, fmt.Errorf("connect: tolerance must lie in (0, 1), got %g", set.Tol)
	}
	if x, ok := complexOnAxis(p, a, b); ok {
		return nil, fmt.Errorf("connect: Q or Q1 is complex on the real axis (at x = %.4g): an absorbing or gaining medium, for which these connection formulae (which assume Q real on the axis) do not hold", x)
	}
	lam := p.Lambda
	res := &Result{}
	warn := func(format string, args ...any) { res.Warnings = append(res.Warnings, fmt.Sprintf(format, args...)) }

	qa, qb := p.Q.Eval(complex(a, 0)), p.Q.Eval(complex(b, 0))
	if !(real(qa) > 0) {
		return nil, fmt.Errorf("connect: Q(a) = %.6g is not positive: the left end must be classically allowed", real(qa))
	}
	closedRight := !(real(qb) > 0)
	if closedRight {
		warn("Q(b) = %.4g is not positive: total reflection assumed (the wave decays into the forbidden region up to b), T = 0 up to the leak through it", real(qb))
	}
	for _, x := range []float64{a, b} {
		q := p.Q.Taylor(complex(x, 0), 1)
		if math.Abs(imag(q[0])) > 1e-10*cmplx.Abs(q[0]) {
			return nil, fmt.Errorf("connect: Q(%g) = %v is not real: complex Q on the axis is not supported", x, q[0])
		}
		if eta := cmplx.Abs(q[1]) / (lam * math.Pow(math.Abs(real(q[0])), 1.5)); eta > 0.2 {
			warn("λ·(length scale) small at x = %g: |Q′|/(λQ^(3/2)) = %.2g, the waves at the end are far from WKB waves, so R, T and their estimates are unreliable", x, eta)
		}
	}

	// Classify the points.
	scale := b - a
	imTol := 1e-9 * scale
	if drop, xm, q2, eps, ok := nearTop(p, a, b, points, imTol); ok && top {
		// Close to the top the composition of the two zeros is tried first
		// (it is the more accurate where it works, down to |ε| ≈ 1e-3 for
		// the order-2 terms); the extrapolation from the shifted problems
		// takes over where it fails or ε is smaller still.
		if eps >= nearTopDirect {
			if res, err := scatter(p, a, b, points, s, false); err == nil {
				return res, nil
			}
		}
		return scatterTop(p, a, b, points, drop, xm, q2, &set)
	}
	var real1 []float64
	var others []complex128 // every listed point (with conjugates), for contour sizes
	var upper []turning.Point
	for i, pt := range points {
		z := pt.Z
		if cmplx.IsNaN(z) || cmplx.IsInf(z) {
			return nil, fmt.Errorf("connect: point %v is not finite", z)
		}
		others = append(others, z)
		if math.Abs(imag(z)) <= math.Max(imTol, 10*pt.Err) {
			others = append(others, complex(real(z), 0))
			x := real(z)
			if pt.Order > 0 && x > a && x < b {
				if pt.Order == 2 {
					q2 := real(p.Q.Taylor(complex(x, 0), 2)[2])
					return scatterTop(p, a, b, points, []int{i}, x, q2, &set)
				}
				if pt.Order != 1 {
					return nil, fmt.Errorf("connect: zero of order %d at x = %.6g on the axis: no connection formula for it", pt.Order, x)
				}
				real1 = append(real1, x)
			}
			if pt.Order < 0 && x >= a && x <= b {
				return nil, fmt.Errorf("connect: pole of Q at x = %.6g on the interval", x)
			}
			continue
		}
		others = append(others, cmplx.Conj(z))
		if imag(z) < 0 {
			pt.Z = cmplx.Conj(z)
		}
		if pt.Kind == turning.Coalescing && real(pt.Z) > a && real(pt.Z) < b && imag(pt.Z) < 0.05*scale {
			warn("coalescing zeros of Q near the axis at %.4g: the connection formulae are not uniform near a coalescence, so the figures may be off by more than their estimates", pt.Z)
		}
		upper = append(upper, pt)
	}
	sort.Float64s(real1)
	upper = dedupe(upper, imTol)
	others = dedupeC(others, imTol)

	// The signs of Q must alternate at the listed real turning points.
	bounds := append(append([]float64{a}, real1...), b)
	for i := 0; i+1 < len(bounds); i++ {
		m := 0.5 * (bounds[i] + bounds[i+1])
		q := real(p.Q.Eval(complex(m, 0)))
		want := i%2 == 0
		if (q > 0) != want {
			return nil, fmt.Errorf("connect: Q(%.6g) = %.4g has the wrong sign for the listed real turning points: a turning point is missing or double", m, q)
		}
	}
	if len(real1)%2 == 0 && closedRight {
		return nil, errors.New("connect: Q is forbidden at b but the real turning points come in pairs: a turning point is missing")
	}
	if len(real1)%2 != 0 && !closedRight {
		return nil, errors.New("connect: odd number of real turning points with both ends allowed: a turning point is missing")
	}
	var lone float64 // the last turning point before a forbidden right end
	if closedRight {
		lone = real1[len(real1)-1]
		real1 = real1[:len(real1)-1]
	}

	// Weigh the complex singularities, lowest first. One whose vertical
	// passes another singularity lo is weighed as S(lo) + |Im ∫_lo^z √Q| and
	// enters the error estimate only.
	sort.Slice(upper, func(i, j int) bool { return imag(upper[i].Z) < imag(upper[j].Z) })
	weighed := map[complex128]float64{}
	for _, pt := range upper {
		sg := Singularity{Point: pt, Prefactor: prefactor(pt.Order)}
		x := real(pt.Z)
		if x <= a || x >= b {
			continue
		}
		if lo, ok := blockedBy(pt.Z, upper); ok {
			Slo, known := weighed[lo]
			if !known || pt.Order < -1 || pt.Order > 2 {
				continue
			}
			dS, err := aboveS(p, pt.Z, lo, set.Tol)
			if err != nil {
				continue
			}
			sg.S, sg.blocked = Slo+dS, true
			weighed[pt.Z] = sg.S
			res.Singular = append(res.Singular, sg)
			continue
		}
		if q := real(p.Q.Eval(complex(x, 0))); !(q > 1e-8*real(qa)) {
			continue // foot in a forbidden region or on a real turning point: part of that barrier's connection
		}
		switch {
		case pt.Order == -2:
			// No Stokes jump of its own (its local solutions are pure powers
			// of z − z₀): the zeros of Q around it carry its share of the
			// reflection (checked for Q = 1 + β/(x²+1)², TestDoublePole). Only
			// a double pole with no listed zero near it is out of reach.
			if !zeroNear(pt.Z, upper, imag(pt.Z)) {
				warn("double pole of Q at %.4g with no zero of Q listed within %.3g of it: left out of the reflection (it has no Stokes jump of its own), its share through zeros outside the search box is neither in the figure nor in its error estimate", pt.Z, imag(pt.Z))
			}
			continue
		case pt.Order < -2:
			warn("pole of Q of order %d at %.4g above an allowed stretch of the axis: no connection formula for it, its share of the reflection is neither in the figure nor in its error estimate", -pt.Order, pt.Z)
			continue
		case pt.Order > 2:
			warn("zero of Q of order %d at %.4g above an allowed stretch of the axis: no connection formula for it, its share of the reflection is neither in the figure nor in its error estimate", pt.Order, pt.Z)
			continue
		}
		w, err := verticalS(p, pt.Z, set.Tol)
		if err != nil {
			warn("singularity at %.4g not weighed (%v): its share of the reflection is neither in the figure nor in its error estimate", pt.Z, err)
			continue
		}
		sg.S = imag(w)
		weighed[pt.Z] = sg.S
		res.Singular = append(res.Singular, sg)
	}
	sort.Slice(res.Singular, func(i, j int) bool { return res.Singular[i].S < res.Singular[j].S })

	// Elements: real barriers and complex pairs, by position.
	var elems []*element
	for i := 0; i < len(real1); i += 2 {
		elems = append(elems, &element{b: Barrier{Left: complex(real1[i], 0), Right: complex(real1[i+1], 0)}})
	}
	for _, sg := range res.Singular {
		if sg.Point.Order == 1 && !sg.blocked && !(closedRight && real(sg.Point.Z) > lone) {
			t := sg.Point.Z
			elems = append(elems, &element{b: Barrier{Left: t, Right: cmplx.Conj(t), Pair: true}})
		}
	}
	sort.Slice(elems, func(i, j int) bool { return real(elems[i].b.Left) < real(elems[j].b.Left) })

	K := N + 2 // orders computed: 0 … 2K; the two beyond 2N give the error estimate
	var feet []float64
	for _, e := range elems {
		if e.b.Pair {
			feet = append(feet, real(e.b.Left))
		}
	}
	for _, e := range elems {
		if err := e.setupAnchors(p, a, b, others, feet, K, set.Tol, res); err != nil {
			return nil, err
		}
		if e.b.Pair {
			// Complex pairs start at leading order; Scatter refines the
			// ones whose effect matters below.
			e.weak = true
			if err := e.firstOrder(p); err != nil {
				return nil, err
			}
			continue
		}
		if err := e.setupTheta(p, others, K, set.Tol, res); err != nil {
			return nil, err
		}
	}

	// Real-axis integrals between consecutive anchors.
	anchors := []anchor{{z: complex(a, 0), base: a}}
	for _, e := range elems {
		anchors = append(anchors, e.left, e.right)
	}
	var terminal *[2]complex128
	if closedRight {
		// The decaying forbidden wave, connected by AllowedLeft; its
		// higher-order reference is the finite part at the turning point,
		// which needs no φ-type correction: for the Airy comparison Q ∝ x
		// every −iφ_{2k} is a pure power of x, whose finite-part integral
		// from the turning point to infinity vanishes.
		t0 := complex(lone, 0)
		rho := 0.45 * math.Min(nearest(t0, others), lone-a)
		if n := len(anchors); n > 1 {
			rho = math.Min(rho, 0.45*(lone-anchors[n-1].base))
		}
		fp, c, err := finitePartShrink(p, t0, rho, func(rho float64) (complex128, complex128, error) {
			c := complex(lone-rho, 0)
			return c, cmplx.Sqrt(p.Q.Eval(c)), nil
		}, K, set.Tol)
		if err != nil {
			return nil, err
		}
		anchors = append(anchors, anchor{z: t0, base: real(c), g: fp.val, gErr: fp.err})
		v := AllowedLeft().Apply([2]complex128{0, 1})
		terminal = &v
	} else {
		anchors = append(anchors, anchor{z: complex(b, 0), base: b})
	}
	gaps := make([]*pathResult, 0, len(elems)+1)
	for i := 0; i+1 < len(anchors); i += 2 {
		lo, hi := anchors[i].base, anchors[i+1].base
		if !(hi >= lo) {
			return nil, fmt.Errorf("connect: reference points out of order at %.6g and %.6g: turning points overlap", lo, hi)
		}
		r0 := cmplx.Sqrt(p.Q.Eval(complex(lo, 0)))
		pr, err := integratePath(p, segment(complex(lo, 0), complex(hi, 0)), r0, K, set.Tol)
		if err != nil {
			return nil, err
		}
		gaps = append(gaps, pr)
	}
	comp := composer{lam: lam, anchors: anchors, gaps: gaps, elems: elems, terminal: terminal}

	// Which complex pairs matter. Every pair starts at leading order; its
	// effect on the result is measured by leaving it out of the
	// composition. While the weak pairs together move R, T or the phases by
	// more than a tenth of the error estimate of the rest, the one with the
	// largest effect is refined to higher order (wkb.PairPhase). The
	// effects of the pairs left at leading order (their coupling e^θ is
	// below the accuracy of the figure) are added to the error estimates.
	var ev *evaluation
	for {
		var err error
		ev, err = comp.evaluate(N, K)
		if err != nil {
			return nil, err
		}
		var sumW effect
		best, bestScore := -1, 0.0
		for i, e := range elems {
			if !e.weak {
				continue
			}
			d := comp.effect(i, ev)
			sumW = sumW.add(d)
			if sc := d.score(ev); sc > bestScore {
				best, bestScore = i, sc
			}
		}
		if best < 0 || (sumW.R <= 0.1*ev.errR && sumW.T <= 0.1*ev.errT && sumW.Phase <= 0.1*ev.errPh) {
			ev.errR += sumW.R
			ev.errT += sumW.T
			ev.errPh += sumW.Phase
			break
		}
		if err := elems[best].setupTheta(p, others, K, set.Tol, res); err != nil {
			return nil, err
		}
	}
	nInc := ev.nInc
	res.Warnings = append(res.Warnings, ev.warns...)
	r, t := ev.r, ev.t
	res.Order = 2 * nInc
	res.Refl, res.Trans = r, t
	res.R, res.T = sq(r), sq(t)
	res.ErrR, res.ErrT, res.ErrPhase = ev.errR, ev.errT, ev.errPh
	for _, e := range elems {
		e.b.Terms = e.thetaTerms
		e.b.FirstOrder = e.weak
		e.b.Theta = 0
		for k := 0; k <= nInc && k < len(e.thetaTerms); k++ {
			e.b.Theta += e.thetaTerms[k]
		}
		for k := nInc + 1; k <= nInc+2 && k < len(e.thetaTerms); k++ {
			e.b.ThetaErr += math.Abs(e.thetaTerms[k])
		}
		for k := 0; k <= nInc && k < len(e.thetaQuad); k++ {
			e.b.ThetaErr += e.thetaQuad[k]
		}
		res.Barriers = append(res.Barriers, e.b)
	}

	nReal, nPair, nWeak := len(real1)/2, 0, 0
	for _, e := range elems {
		switch {
		case e.b.Pair && e.weak:
			nWeak++
		case e.b.Pair:
			nPair++
		}
	}
	switch {
	case closedRight:
		leak := math.Exp(-2 * thetaEnd(p, lone, b))
		res.Method = fmt.Sprintf("total reflection at the turning point %.6g (Airy connection)", lone)
		if nReal > 0 {
			res.Method += fmt.Sprintf(" behind %d uniform barrier connections", nReal)
		}
		res.ErrR += leak
		res.ErrT = leak
	case nReal > 0:
		res.Method = fmt.Sprintf("uniform parabolic connection, %d turning points", 2*nReal)
		if nReal > 1 {
			res.Method = fmt.Sprintf("uniform parabolic connections composed, %d barriers", nReal)
		}
		if nPair > 0 {
			res.Method += fmt.Sprintf(" and %s", pairs(nPair, "complex pair"))
		}
	case len(res.Singular) == 0:
		res.Method = "no turning point or singularity near the axis"
		res.ErrR = math.NaN()
		warn("no complex singularity listed above the allowed axis: the reflection is beyond all orders of the listed points and not estimated")
	default:
		d := res.Singular[0] // never blocked: a blocked one has S above its blocker
		if len(res.Singular) > 1 {
			// Two composed pairs interfere in the composition itself; the
			// warning is for an estimate from one singularity.
			if d2 := res.Singular[1]; lam*(d2.S-d.S) < 1 && !(d.Point.Order == 1 && d2.Point.Order == 1 && !d2.blocked) {
				warn("the singularities at %.4g and %.4g have nearly equal weight (λΔS = %.2g) and interfere: the estimate from one of them alone may be off by a factor of order 2", d.Point.Z, d2.Point.Z, lam*(d2.S-d.S))
			}
		}
		pt := d.Point
		res.Dominant = &pt
		if pt.Order == 1 {
			res.Method = "uniform parabolic connection, complex pair of turning points (dominant)"
			if nPair > 1 {
				res.Method = fmt.Sprintf("uniform parabolic connections composed, %d complex pairs", nPair)
			}
		} else {
			if err := poleEstimate(p, a, b, d, res, set.Tol); err != nil {
				return nil, err
			}
		}
	}
	if nWeak > 0 {
		res.Method += fmt.Sprintf(" (and %s at leading order, their effect in the error)", pairs(nWeak, "weak complex pair"))
	}
	// Singularities not in the composition add reflection of their own, of
	// amplitude ρ = Prefactor·e^{−2λS}: |δR| ≤ 2ρ√R + ρ². R + T = 1 makes
	// |δT| = |δR|; with at most one barrier (no cavity to resonate in) a
	// reflection ρ beside it changes t by the relative factor 1/(1 − ρ r′)
	// at most, |r′| ≤ 1, so |δT| ≤ Tρ(2 − ρ)/(1 − ρ)² as well, which is the
	// bound where T is exponentially small.
	if !closedRight && (res.Dominant != nil || nReal > 0) {
		for _, sg := range res.Singular {
			if (sg.Point.Order == 1 && !sg.blocked) || (res.Dominant != nil && sg.Point.Z == res.Dominant.Z) {
				continue
			}
			pf := sg.Prefactor
			if math.IsNaN(pf) {
				pf = 1
			}
			ra := pf * math.Exp(-2*lam*sg.S)
			d := ra*ra + 2*ra*math.Sqrt(res.R)
			if nReal <= 1 && ra < 0.5 {
				d = math.Min(d, res.T*ra*(2-ra)/((1-ra)*(1-ra)))
			}
			res.ErrR += d
			res.ErrT += d
		}
	}
	return res, nil
}

// tail bounds the remainder of a series whose first omitted terms are d1,
// d2 by 2(|d1| + |d2|/(1 − q)), q = |d2/d1| (a geometric tail), or by 2|d1|
// when |d2| ≥ |d1| (d1 is then the least term). The factor 2 is a safety
// factor (a rule of thumb): the geometric tail is an asymptotically exact
// estimate, which the truth exceeds half the time.
func tail(d1, d2 float64) float64 {
	a1, a2 := math.Abs(d1), math.Abs(d2)
	if !(a2 < a1) {
		return 2 * a1
	}
	return 2 * (a1 + a2/(1-a2/a1))
}

// pairs returns "n what" with the plural s when n ≠ 1.
func pairs(n int, what string) string {
	if n == 1 {
		return "1 " + what
	}
	return fmt.Sprintf("%d %ss", n, what)
}

func bad(z complex128) bool { return cmplx.IsNaN(z) || cmplx.IsInf(z) }

func sq(z complex128) float64 { return real(z)*real(z) + imag(z)*imag(z) }

// prefactor returns |Stokes multiplier| of the local problem Q ∝ (z−z0)^m,
// 2|cos(π/(m+2))| (Heading, An Introduction to Phase-Integral Methods,
// ch. 3, typed from memory): 1 for a simple zero (the
// Pokrovskii–Khalatnikov prefactor), √2 for a double zero, 2 for a simple
// pole; NaN where the formula fails (m = −2).
func prefactor(order int) float64 {
	m := float64(order)
	if order == -2 {
		return math.NaN()
	}
	return 2 * math.Abs(math.Cos(math.Pi/(m+2)))
}

// zeroNear reports whether a simple zero of Q among pts lies within r of z.
func zeroNear(z complex128, pts []turning.Point, r float64) bool {
	for _, q := range pts {
		if q.Order == 1 && q.Z != z && cmplx.Abs(q.Z-z) < r {
			return true
		}
	}
	return false
}

// blockedBy returns the highest listed singularity below z within 5% of
// Im z of its vertical.
func blockedBy(z complex128, pts []turning.Point) (complex128, bool) {
	var lo complex128
	ok := false
	for _, q := range pts {
		if q.Z == z || imag(q.Z) >= imag(z) {
			continue
		}
		if math.Abs(real(q.Z)-real(z)) < 0.05*imag(z) && (!ok || imag(q.Z) > imag(lo)) {
			lo, ok = q.Z, true
		}
	}
	return lo, ok
}

func dedupe(pts []turning.Point, tol float64) []turning.Point {
	var out []turning.Point
	for _, p := range pts {
		dup := false
		for _, q := range out {
			if cmplx.Abs(p.Z-q.Z) <= tol {
				dup = true
				break
			}
		}
		if !dup {
			out = append(out, p)
		}
	}
	return out
}

func dedupeC(zs []complex128, tol float64) []complex128 {
	var out []complex128
	for _, z := range zs {
		dup := false
		for _, w := range out {
			if cmplx.Abs(z-w) <= tol {
				dup = true
				break
			}
		}
		if !dup {
			out = append(out, z)
		}
	}
	return out
}

// complexOnAxis reports whether Q or Q1 has an imaginary part on [a, b]
// (sampled at 128 points), and where.
func complexOnAxis(p wkb.Problem, a, b float64) (float64, bool) {
	for i := 0; i <= 128; i++ {
		x := a + (b-a)*float64(i)/128
		for _, f := range []jet.Func{p.Q, p.Q1} {
			if f == nil {
				continue
			}
			v := f.Eval(complex(x, 0))
			if math.Abs(imag(v)) > 1e-12*math.Max(1, cmplx.Abs(v)) {
				return x, true
			}
		}
	}
	return 0, false
}
