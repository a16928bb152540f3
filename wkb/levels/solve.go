package levels

import (
	"errors"
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/wkb"
)

// Settings controls Solve and Doublets. A nil *Settings means all defaults.
type Settings struct {
	// MaxOrder is the highest even order of the phase series used; zero,
	// the default, is Bohr–Sommerfeld. The term of the next order is always
	// computed as the error estimate. Odd values are rounded down, values
	// above 12 reduced to 12, negative values are an error.
	MaxOrder int
	// Tol is the relative tolerance of the energies in the root finder;
	// zero means 1e-13.
	Tol float64
	// Phase is passed to wkb.PairPhase; nil means its defaults.
	Phase *wkb.PhaseSettings
}

// Status reports how one level was obtained.
type Status int

const (
	// Success: the series decreased up to the highest order computed; the
	// level uses MaxOrder and the next term is the error estimate.
	Success Status = iota
	// LeastTerm: the series reached its least term below MaxOrder and was
	// truncated there.
	LeastTerm
	// QuadratureLimit: a phase integral did not reach its tolerance; the
	// error estimate includes its last change.
	QuadratureLimit
	// RootLimit: the root finder stopped without reaching the tolerance.
	RootLimit
)

var statusNames = [...]string{"success", "least term reached", "quadrature limit", "root limit"}

// String returns a short lower-case description of s.
func (s Status) String() string {
	if s < 0 || int(s) >= len(statusNames) {
		return fmt.Sprintf("Status(%d)", int(s))
	}
	return statusNames[s]
}

// Level is one bound-state energy. For levels from Doublets, Turning holds
// the outer turning points of the two wells, Maslov counts the outer ends
// only, and Period and Omega are those of the left well (of the whole
// allowed interval above the barrier top).
type Level struct {
	N       int        // quantum number (number of nodes)
	E       float64    // energy at the order used
	Err     float64    // error estimate of E: the least term, or twice the next one while the terms still decrease, converted by dE = δ/(∂Phase/∂E), plus Beyond and 2·Wall; a first-order level whose higher orders failed carries twice its order-2 term, or half the level spacing (see firstOrderBound)
	Order   int        // order of the phase series used (0 is Bohr–Sommerfeld)
	ByOrder []float64  // energies at orders 0, 2, 4, … up to MaxOrder (fewer if the series diverged first)
	Maslov  int        // Maslov index μ: 2, 3 or 4
	Turning [2]float64 // ends of the allowed interval at E (turning points or walls)
	// Beyond estimates, as an energy, the exponentially small coupling to
	// the nearest other zero BeyondZero of Q, which no order of the series
	// sees (see beyondAllOrders); it is included in Err.
	Beyond     float64
	BeyondZero complex128
	// Wall estimates, as an energy, the exponentially small rise caused by
	// hard walls beyond soft ends, (ħω/π)e^(−2S)/2 per wall with S the
	// barrier integral from the turning point to the wall (see wallShift);
	// twice it is included in Err.
	Wall     float64
	Period   float64 // classical period T = 2m∫dx/p at E
	Omega    float64 // 2π/T
	Method   string
	Status   Status
	Warnings []string
}

func (s *Settings) defaults() (Settings, error) {
	var set Settings
	if s != nil {
		set = *s
	}
	if set.MaxOrder < 0 {
		return set, errors.New("levels: negative maximum order")
	}
	if set.MaxOrder > 12 {
		set.MaxOrder = 12
	}
	set.MaxOrder &^= 1
	if set.Tol == 0 {
		set.Tol = 1e-13
	}
	if !(set.Tol > 0) {
		return set, errors.New("levels: tolerance must be positive")
	}
	return set, nil
}

// Solve returns the levels with quantum numbers ns of the single well
// about the global minimum of V on [A, B]. It returns an error for an
// invalid well or settings, and for a level that is not bound in [A, B]
// (then with the levels found before it). A level whose allowed interval
// does not hold every classically allowed point of [A, B] carries a
// warning: several wells need Doublets.
func Solve(w wkb.Well, ns []int, s *Settings) ([]Level, error) {
	set, err := s.defaults()
	if err != nil {
		return nil, err
	}
	g, err := newGeometry(w)
	if err != nil {
		return nil, err
	}
	out := make([]Level, 0, len(ns))
	for _, n := range ns {
		if n < 0 {
			return out, fmt.Errorf("levels: negative quantum number %d", n)
		}
		lv, err := solveOne(g, n, set)
		if err != nil {
			return out, err
		}
		out = append(out, lv)
	}
	return out, nil
}

// maslov returns μ for the ends.
func maslov(a, b end) int {
	mu := 2
	if a.wall {
		mu++
	}
	if b.wall {
		mu++
	}
	return mu
}

// solveOne finds level n: Bohr–Sommerfeld by bracketing, then each higher
// order from the previous one.
func solveOne(g *geometry, n int, set Settings) (Level, error) {
	lv, _, err := solveNext(g, n, set)
	return lv, err
}

// solveNext is solveOne that also returns the energy at the order after
// the one used, E − δ/(∂Phase/∂E) with δ the signed next term (NaN if
// there is none), so that differences of levels can be judged order by
// order.
func solveNext(g *geometry, n int, set Settings) (Level, float64, error) {
	w := g.w
	// Target π(n + μ/4): μ depends on the ends, which depend on E.
	firstAt := func(E float64) (float64, end, end, error) {
		a, b, err := g.region(E, g.xmin)
		if err != nil {
			return 0, a, b, err
		}
		ph, _, _, err := firstOrder(w, E, a, b)
		return ph - math.Pi*(float64(n)+float64(maslov(a, b))/4), a, b, err
	}
	// Bracket: the phase vanishes at the bottom and grows with E; an
	// energy above an open end (not bound) is an error of region, so the
	// search halves back towards the last good energy before giving up.
	lo := g.vmin
	scale := math.Abs(g.vmin) + w.Hbar*w.Hbar/(2*w.Mass*(w.B-w.A)*(w.B-w.A))
	step := w.Hbar * w.Hbar / (2 * w.Mass * (w.B - w.A) * (w.B - w.A))
	if t := w.V.Taylor(complex(g.xmin, 0), 2); real(t[2]) > 0 {
		// Harmonic spacing ħ√(V″/m) as the first step.
		step = math.Max(step, w.Hbar*math.Sqrt(2*real(t[2])/w.Mass))
	}
	hi := lo + step
	bad := math.Inf(1)
	var lastErr error
	for k := 0; ; k++ {
		if k > 400 {
			return Level{}, math.NaN(), fmt.Errorf("levels: level %d: no energy bracket found", n)
		}
		f, _, _, err := firstAt(hi)
		if err != nil {
			lastErr = err
			bad = hi
			if bad-lo <= 1e-12*math.Max(scale, math.Abs(lo)) {
				return Level{}, math.NaN(), fmt.Errorf("levels: level %d: %w", n, lastErr)
			}
			hi = (lo + bad) / 2
			continue
		}
		if f > 0 {
			break
		}
		lo = hi
		if math.IsInf(bad, 1) {
			hi = g.vmin + 2*(hi-g.vmin)
		} else {
			hi = (lo + bad) / 2
			if bad-lo <= 1e-12*math.Max(scale, math.Abs(lo)) {
				return Level{}, math.NaN(), fmt.Errorf("levels: level %d: %w", n, lastErr)
			}
		}
	}
	var lv Level
	lv.N = n
	e0, rootOK := root(func(E float64) float64 {
		if E <= g.vmin {
			return -math.Pi * (float64(n) + 0.5)
		}
		f, _, _, err := firstAt(E)
		if err != nil {
			return math.NaN()
		}
		return f
	}, lo, hi, set.Tol*math.Max(scale, math.Abs(hi)))
	a, b, err := g.region(e0, g.xmin)
	if err != nil {
		return Level{}, math.NaN(), fmt.Errorf("levels: level %d: %w", n, err)
	}
	mu := maslov(a, b)
	lv.Maslov = mu
	target := math.Pi * (float64(n) + float64(mu)/4)
	_, dph, _, err := firstOrder(w, e0, a, b)
	if err != nil {
		return Level{}, math.NaN(), fmt.Errorf("levels: level %d: %w", n, err)
	}
	if !rootOK {
		lv.Status = RootLimit
	}

	// Higher orders: K = MaxOrder/2 orders plus one for the estimate.
	K := set.MaxOrder / 2
	type eval struct {
		terms, errs []float64
		a, b        end
		st          wkb.Status
	}
	cache := map[float64]eval{}
	hint := &radiusHint{}
	at := func(E float64) (eval, error) {
		if ev, ok := cache[E]; ok {
			return ev, nil
		}
		a, b, err := g.region(E, g.xmin)
		if err != nil {
			return eval{}, err
		}
		if maslov(a, b) != mu {
			return eval{}, errors.New("levels: the kind of an end changes near the level")
		}
		t, e, st, err := series(w, E, a, b, K+1, set.Phase, hint)
		if err != nil {
			return eval{}, err
		}
		ev := eval{t, e, a, b, st}
		cache[E] = ev
		return ev, nil
	}
	partial := func(ev eval, j int) float64 {
		var s float64
		for k := 0; k <= j; k++ {
			s += ev.terms[k]
		}
		return s
	}
	lv.ByOrder = []float64{e0}
	// firstOnly is the result when the higher-order phase integrals cannot
	// be computed (a zero of Q too close to the turning points, say): the
	// first-order energy without an error estimate, said plainly.
	firstOnly := func(err error) Level {
		lv.ByOrder = lv.ByOrder[:1]
		lv.E, lv.Order = e0, 0
		lv.Status = QuadratureLimit
		est, how := firstOrderBound(w, e0, a, b, dph)
		lv.Err = est + set.Tol*math.Max(scale, math.Abs(e0))
		lv.Warnings = append(lv.Warnings, "higher-order phase integrals failed ("+err.Error()+"): first order, estimated by "+how)
		lv.Turning = [2]float64{a.x, b.x}
		lv.Period = 2 * w.Hbar * dph
		lv.Omega = 2 * math.Pi / lv.Period
		lv.Method = method(a, b, 0)
		if g.otherAllowed(lv.E, a.x, b.x) {
			lv.Warnings = append(lv.Warnings, severalWells)
		}
		if g.innerMaximum(a.x, b.x) {
			lv.Warnings = append(lv.Warnings, barrierInside)
		}
		return lv
	}
	E := e0
	for j := 1; j <= K; j++ {
		ev, err := at(E)
		if err != nil {
			return firstOnly(err), math.NaN(), nil
		}
		f := func(x float64) float64 {
			ev, err := at(x)
			if err != nil {
				return math.NaN()
			}
			return partial(ev, j) - target
		}
		xtol := set.Tol * math.Max(scale, math.Abs(E))
		// Secant from the previous order's energy with the first-order
		// slope: the correction is small and smooth, so this converges in a
		// few steps; a bracketed search is the fallback.
		ej, ok := secant(f, E, dph, xtol)
		if !ok {
			d := 2*(math.Abs(ev.terms[j])+ev.errs[j])/dph + xtol
			lo, hi := E-d, E+d
			flo, fhi := f(lo), f(hi)
			for k := 0; k < 40 && !(flo <= 0 && fhi >= 0); k++ {
				d *= 2
				if !(flo <= 0) {
					lo = E - d
					if lo <= g.vmin {
						lo = (g.vmin + E) / 2
					}
					flo = f(lo)
				}
				if !(fhi >= 0) {
					hi = E + d
					fhi = f(hi)
				}
			}
			if !(flo <= 0 && fhi >= 0) {
				// The partial sum has no root near the previous energy: the
				// series has diverged, so stop at the previous order.
				lv.Warnings = append(lv.Warnings, fmt.Sprintf("no root at order %d: the series diverges there", 2*j))
				K = j - 1
				break
			}
			ej, ok = root(f, lo, hi, xtol)
			if !ok {
				lv.Status = RootLimit
			}
		}
		E = ej
		lv.ByOrder = append(lv.ByOrder, E)
	}
	// Optimal truncation at the highest-order energy: the least term among
	// orders 2…2K+2.
	evK, err := at(E)
	if err != nil {
		return firstOnly(err), math.NaN(), nil
	}
	least := 1
	for k := 2; k <= K+1; k++ {
		if math.Abs(evK.terms[k]) < math.Abs(evK.terms[least]) {
			least = k
		}
	}
	lv.Order = 2 * (least - 1)
	lv.E = lv.ByOrder[least-1]
	evL, err := at(lv.E)
	if err != nil {
		return firstOnly(err), math.NaN(), nil
	}
	a, b = evL.a, evL.b
	_, dph, _, err = firstOrder(w, lv.E, a, b)
	if err != nil {
		return Level{}, math.NaN(), fmt.Errorf("levels: level %d: %w", n, err)
	}
	var qerr float64
	for k := 0; k < least; k++ {
		qerr += evL.errs[k]
	}
	// Contributions beyond all orders (other zeros of Q) only for two
	// soft ends, where the series is that of an isolated pair.
	if !a.wall && !b.wall {
		if v, z, ok := beyondAllOrders(w.Problem(lv.E), a.x, b.x); ok {
			lv.Beyond = v / dph
			lv.BeyondZero = z
		}
	}
	if sh, _ := wallShift(w, lv.E, a, b); sh > 0 {
		lv.Wall = sh / dph
	}
	// The remainder of the series: at its least term (optimal truncation)
	// about the least term itself; truncated at MaxOrder while the terms
	// still decrease, the next term plus the rest beyond it, which is at
	// most about the next term again.
	tail := math.Abs(evL.terms[least])
	if least == K+1 {
		tail *= 2
	}
	if flatWall(w, lv.E, a, b) {
		if la, ok := wallLookahead(w, lv.E, a, b, least, evL.terms, evL.errs, set.Phase); ok && la > tail {
			tail = la
			lv.Warnings = append(lv.Warnings, fmt.Sprintf("the wall's endpoint terms make the series irregular (a term beyond order %d exceeds it): the estimate is twice that later term", 2*least))
		}
	}
	lv.Err = (tail+qerr)/dph + lv.Beyond + wallFactor*lv.Wall + set.Tol*math.Max(scale, math.Abs(lv.E))
	if least <= K && lv.Status == Success {
		lv.Status = LeastTerm
	}
	if evL.st != wkb.Success && lv.Status == Success {
		lv.Status = QuadratureLimit
	}
	lv.Turning = [2]float64{a.x, b.x}
	lv.Period = 2 * w.Hbar * dph
	lv.Omega = 2 * math.Pi / lv.Period
	lv.Method = method(a, b, lv.Order)
	if g.otherAllowed(lv.E, a.x, b.x) {
		lv.Warnings = append(lv.Warnings, severalWells)
	}
	if g.innerMaximum(a.x, b.x) {
		lv.Warnings = append(lv.Warnings, barrierInside)
	}
	return lv, lv.E - evL.terms[least]/dph, nil
}

// wallFactor multiplies Level.Wall in Err. The shift is a first-order
// connection result; against connect/eigen for harmonic wells cut by one
// or two walls (estimate_test.go) it is within 0.9–1.1 of the true rise
// for n ≤ 5 while the rise is below about 0.1ħω, so twice it bounds the
// rise with that margin.
const wallFactor = 2

// firstOrderBound estimates the error of a first-order energy whose
// higher-order series failed: twice the order-2 term computed alone (for
// two soft ends on the split loops of pairSplit, which need no contour
// about the pair), or, if that fails too, half the level spacing,
// (π/2)/(∂Phase/∂E): the node count fixes the level between its
// neighbours, so Bohr–Sommerfeld is within about that. It returns the
// estimate and how it was obtained.
func firstOrderBound(w wkb.Well, E float64, a, b end, dph float64) (float64, string) {
	var terms, errs []float64
	var err error
	if !a.wall && !b.wall {
		terms, errs, _, err = pairSplit(w.Problem(E), a.x, b.x, 1)
	} else {
		terms, errs, _, err = series(w, E, a, b, 1, nil, nil)
	}
	if err == nil && len(terms) > 1 && errs[1] < 0.5*math.Abs(terms[1]) {
		return 2 * (math.Abs(terms[1]) + errs[1]) / dph, "twice the order-2 term"
	}
	return math.Pi / 2 / dph, "half the level spacing (the order-2 term failed too)"
}

// lookahead is the number of terms beyond the least (or next) one that
// wallLookahead inspects at a flat wall.
const lookahead = 2

// flatWall reports whether an end is a wall at which V′ vanishes (to 1e-8
// of (E − V)/(distance to the other end)): there the endpoint terms of the
// series are intermittent (see wallLookahead).
func flatWall(w wkb.Well, E float64, a, b end) bool {
	for _, e := range []end{a, b} {
		if !e.wall {
			continue
		}
		t := w.V.Taylor(complex(e.x, 0), 1)
		if math.Abs(real(t[1]))*(b.x-a.x) <= 1e-8*math.Abs(E-real(t[0])) {
			return true
		}
	}
	return false
}

// wallLookahead returns twice the largest resolved term among the
// lookahead terms after terms[least] (a term is resolved when its
// quadrature error is below half its size), computing them at E if terms
// stops short, and false if none is resolved. With a wall the terms are
// the turning point's series plus the wall's endpoint terms, local
// derivatives of Q at the wall; where V is flat at the wall (V ∝ (x−w)^p)
// the endpoint terms vanish at most orders and reappear every p orders (for
// V = x³ at orders 4, 10, 16, …: the boundary term of order 2k carries
// 2k − 1 derivatives, nonzero only as products of Q‴), so the next term
// can be small while the one after is not, and the next term alone
// understates the remainder.
func wallLookahead(w wkb.Well, E float64, a, b end, least int, terms, errs []float64, ps *wkb.PhaseSettings) (float64, bool) {
	need := least + lookahead
	if need >= len(terms) {
		t, e, _, err := series(w, E, a, b, need, ps, nil)
		if err != nil {
			return 0, false
		}
		terms, errs = t, e
	}
	var big float64
	found := false
	for j := least + 1; j <= need && j < len(terms); j++ {
		if errs[j] < 0.5*math.Abs(terms[j]) {
			big = math.Max(big, math.Abs(terms[j]))
			found = true
		}
	}
	return 2 * big, found
}

const severalWells = "another classically allowed region exists at this energy (several wells): the single-well result ignores tunnelling; see Doublets"

const barrierInside = "a barrier top lies inside the allowed interval: its complex turning points limit the series; Doublets treats it uniformly"

func method(a, b end, order int) string {
	kind := "two turning points, closed-contour phase integrals"
	switch {
	case a.wall && b.wall:
		kind = "two hard walls, real-axis phase integrals"
	case a.wall || b.wall:
		kind = "hard wall and turning point, loop phase integrals"
	}
	if order == 0 {
		return "Bohr–Sommerfeld (" + kind + ")"
	}
	return fmt.Sprintf("WKB phase series to order %d (%s)", order, kind)
}

// secant iterates x ← x − f(x)/slope, the slope updated by secants, from
// x0 with the initial slope s0 > 0, until the step is below xtol. It
// reports false if f is NaN, the steps do not shrink, or 12 steps pass.
func secant(f func(float64) float64, x0, s0, xtol float64) (float64, bool) {
	x, fx := x0, f(x0)
	slope := s0
	step := math.Inf(1)
	for it := 0; it < 12; it++ {
		if math.IsNaN(fx) || !(slope > 0) {
			return x, false
		}
		d := -fx / slope
		if math.Abs(d) > 2*step {
			return x, false
		}
		nx := x + d
		nf := f(nx)
		if math.Abs(d) <= xtol {
			return nx, !math.IsNaN(nf)
		}
		if nf != fx {
			slope = (nf - fx) / (nx - x)
		}
		x, fx, step = nx, nf, math.Abs(d)
	}
	return x, false
}

// root finds a zero of f in [lo, hi] (f(lo) ≤ 0 ≤ f(hi)) by Brent's
// method (R. P. Brent, Algorithms for Minimization without Derivatives,
// 1973, ch. 4: inverse quadratic interpolation, secant and bisection) to
// |Δx| ≤ xtol. It reports false if f is NaN or the iteration limit is hit.
func root(f func(float64) float64, lo, hi, xtol float64) (float64, bool) {
	a, b := lo, hi
	fa, fb := f(a), f(b)
	if math.IsNaN(fa) || math.IsNaN(fb) {
		return (a + b) / 2, false
	}
	if fa == 0 {
		return a, true
	}
	if fb == 0 {
		return b, true
	}
	c, fc := a, fa
	d := b - a
	e := d
	for it := 0; it < 200; it++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2*eps*math.Abs(b) + xtol/2
		m := (c - b) / 2
		if math.Abs(m) <= tol || fb == 0 {
			return b, true
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			s := fb / fa
			var p, q float64
			if a == c {
				p = 2 * m * s
				q = 1 - s
			} else {
				q0 := fa / fc
				r := fb / fc
				p = s * (2*m*q0*(q0-r) - (b-a)*(r-1))
				q = (q0 - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			} else {
				p = -p
			}
			if 2*p < math.Min(3*m*q-math.Abs(tol*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d, e = m, m
			}
		} else {
			d, e = m, m
		}
		a, fa = b, fb
		if math.Abs(d) > tol {
			b += d
		} else if m > 0 {
			b += tol
		} else {
			b -= tol
		}
		fb = f(b)
		if math.IsNaN(fb) {
			return b, false
		}
	}
	return b, false
}
