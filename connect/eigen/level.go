package eigen

import (
	"fmt"
	"math"
)

const eps = 0x1p-52

// Level computes level n (n interior nodes) of the well.
//
// On every mesh the level is bracketed by the node count and refined by
// Brent's method on the matching function D(E) − nπ; the energies of the
// nested meshes (cell halved each time) are Richardson-extrapolated in
// h⁴, h⁶, …, until the error estimate is below the tolerance (three meshes
// at least).
// A level that did not meet the tolerance is returned with its best estimate
// together with a *ConvergenceError; an open end too close to the level's
// turning point gives Status IntervalShort and a warning, not an error.
func (sv *Solver) Level(n int) (Level, error) {
	lv, _, err := sv.level(n)
	return lv, err
}

// run is what a level computation leaves behind for a splitting: the root
// on every mesh and the rounding floor of the last.
type run struct {
	es    []float64
	floor float64
}

// level is Level, also returning the run.
func (sv *Solver) level(n int) (Level, run, error) {
	var rn run
	lv := Level{N: n}
	if n < 0 {
		return lv, rn, fmt.Errorf("eigen: quantum number must be non-negative, got %d", n)
	}
	m0, err := sv.mesh(0)
	if err != nil {
		return lv, rn, err
	}
	target := float64(n) * math.Pi
	ic := sv.ic0
	lo, hi, flo, fhi, err := sv.bracket(m0, ic, n, &lv)
	if err != nil {
		return lv, rn, err
	}
	e, _, err := sv.root(m0, ic, target, lo, hi, flo, fhi, &lv)
	if err != nil {
		return lv, rn, err
	}
	// Match in the level's own well: one that lives in another well than the
	// default matching node makes D(E) a near-step, slow for the root finder
	// on the finer meshes.
	ic = sv.matchNode(m0, ic, e)
	es := []float64{e}
	table := [][]float64{{e}}
	best, errEst := e, math.Inf(1)
	var lastMesh *mesh = m0
	lv.Status = RefineLimit
	var absTol float64
	for j := 1; j <= sv.maxRefine(); j++ {
		m, err := sv.mesh(j)
		if err != nil {
			return lv, rn, err
		}
		prev := es[j-1]
		pred, w := prev, 1e-4*sv.scale(prev)
		if j >= 2 {
			diff := prev - es[j-2]
			pred = prev + diff/16 // E(h/2) − E(h) ≈ (E(h) − E(2h))/16 once the error is ∝ h⁴
			w = math.Abs(diff)    // a margin for meshes outside that range
		}
		w = math.Max(w, 64*eps*sv.scale(prev))
		lo, hi, flo, fhi, err := sv.localBracket(m, ic, target, pred, w, &lv)
		if err != nil {
			return lv, rn, err
		}
		var slope float64
		e, slope, err = sv.root(m, ic, target, lo, hi, flo, fhi, &lv)
		if err != nil {
			return lv, rn, err
		}
		es = append(es, e)
		row := []float64{e}
		for i := 1; i <= j; i++ {
			f := math.Pow(4, float64(i+1)) // eliminates h^(2i+2): h⁴, h⁶, …
			row = append(row, row[i-1]+(row[i-1]-table[j-1][i-1])/(f-1))
		}
		table = append(table, row)
		lastMesh = m
		best, errEst = extrapolant(table)
		// Rounding floor: the error of D accumulated over the cells, turned
		// into energy by the slope of D.
		if slope > 0 {
			dd := eps * (math.Pi*math.Sqrt(float64(len(m.h))) + math.Abs(target))
			rn.floor = dd / slope
			errEst = math.Max(errEst, rn.floor)
		}
		absTol = sv.set.Tol * sv.scale(best)
		if j >= 2 && errEst <= absTol {
			lv.Status = Converged
			break
		}
	}
	lv.E, lv.Err = best, errEst
	rn.es = es
	lv.Meshes = len(es)
	lv.Cells = len(lastMesh.h)

	// Node count on the finest mesh on both sides of its root, at distances
	// growing from a few ulps until they clear the rounding of D.
	root := es[len(es)-1]
	var ca, cb int
	for k, delta := 0, 16*eps*sv.scale(root); k < 12; k, delta = k+1, 4*delta {
		ca, cb = sv.shoot(lastMesh, ic, root-delta).count, sv.shoot(lastMesh, ic, root+delta).count
		lv.Iterations += 2
		if ca == n && cb == n+1 {
			break
		}
	}
	lv.Nodes = ca
	if ca != n || cb != n+1 {
		lv.Warnings = append(lv.Warnings, fmt.Sprintf("node count %d below and %d above the root, want %d and %d", ca, cb, n, n+1))
	}
	converged := lv.Status == Converged
	// Another level within the change of E over the last halving makes the
	// extrapolation of this one unreliable, unless the mesh is symmetric (an
	// exact doublet on every mesh): then the error becomes at least that
	// change.
	if !sv.symmetric && len(es) >= 2 {
		g := 4 * math.Abs(es[len(es)-1]-es[len(es)-2])
		cl, ch := sv.shoot(lastMesh, ic, lv.E-g).count, sv.shoot(lastMesh, ic, lv.E+g).count
		lv.Iterations += 2
		if cl < n || ch > n+1 {
			converged = false
			lv.Status = NearDegenerate
			lv.Err = math.Max(lv.Err, g)
			lv.Warnings = append(lv.Warnings, fmt.Sprintf("another level lies within %.3g (the discretisation change) of E: extrapolation unreliable, reduce Step", g))
		}
	}
	st := RefineLimit
	if lv.Status == NearDegenerate {
		st = NearDegenerate
	}
	sv.checkEnds(m0, &lv)
	// The end condition is exact only to the next WKB term: fold the shift
	// of E it causes into Err wherever it can matter (the warning of
	// checkEnds stays).
	if lv.Decay > endDecayMin {
		shift, err := sv.endShift(lastMesh, ic, target, root, &lv)
		if err != nil {
			return lv, rn, err
		}
		lv.Err += shift
	}
	if !converged {
		return lv, rn, &ConvergenceError{N: n, E: lv.E, Err: lv.Err, Tol: absTol, Iterations: lv.Iterations, Status: st}
	}
	return lv, rn, nil
}

// maxCells bounds the cells of any refined mesh (two float64 arrays of 4M
// entries: 64 MB).
const maxCells = 1 << 22

// maxRefine is the number of halvings allowed: Settings.MaxRefine, fewer if
// the finest mesh would exceed maxCells, but at least 2.
func (sv *Solver) maxRefine() int {
	j := sv.set.MaxRefine
	for j > 2 && (len(sv.xs)-1)<<j > maxCells {
		j--
	}
	return j
}

// scale is the energy scale against which the relative tolerance is taken.
func (sv *Solver) scale(e float64) float64 {
	return math.Max(math.Abs(e), math.Abs(e-sv.vmin))
}

// f evaluates the matching function D(E) − nπ on m.
func (sv *Solver) f(m *mesh, ic int, target, e float64, lv *Level) float64 {
	lv.Iterations++
	r := sv.shoot(m, ic, e)
	f := r.d - target
	// Where the node count contradicts the sign of f, D is within rounding
	// of nπ: E is a root to working precision, and f = 0 says so (a tiny
	// value of the count's sign would stall the interpolation of the root
	// finder instead).
	n := int(math.Round(target / math.Pi))
	if (r.count <= n) != (f <= 0) {
		f = 0
	}
	return f
}

// bracket finds lo < hi with D(lo) ≤ nπ < D(hi) on the base mesh, from the
// bottom of the potential upwards by doubling steps.
func (sv *Solver) bracket(m *mesh, ic, n int, lv *Level) (lo, hi, flo, fhi float64, err error) {
	target := float64(n) * math.Pi
	l := sv.w.B - sv.w.A
	d := math.Pow(math.Pi*float64(n+1)/l, 2) / sv.c // box level n: a lower bound of the spacing scale
	lo = sv.vmin
	flo = sv.f(m, ic, target, lo, lv)
	for k := 0; flo > 0; k++ { // a decaying-end condition may pull a level below min V
		if k > 200 {
			return 0, 0, 0, 0, fmt.Errorf("eigen: cannot bracket level %d from below", n)
		}
		lo -= d * math.Pow(2, float64(k))
		flo = sv.f(m, ic, target, lo, lv)
	}
	for k := 0; ; k++ {
		if k > 400 {
			return 0, 0, 0, 0, fmt.Errorf("eigen: cannot bracket level %d from above", n)
		}
		hi = lo + d
		capped := false
		if hi >= sv.emax {
			hi = sv.emax - 4*eps*math.Max(1, math.Abs(sv.emax))
			capped = true
		}
		fhi = sv.f(m, ic, target, hi, lv)
		if fhi > 0 {
			return lo, hi, flo, fhi, nil
		}
		if capped {
			cnt := sv.shoot(m, sv.ic0, hi).count
			return 0, 0, 0, 0, fmt.Errorf("eigen: level %d is not bound below the open-end potential V = %g (%d levels are): widen the interval if the well continues", n, sv.emax, cnt)
		}
		lo, flo = hi, fhi
		d *= 2
	}
}

// localBracket finds a bracket of the root of D − target around pred,
// widening ±w geometrically.
func (sv *Solver) localBracket(m *mesh, ic int, target, pred, w float64, lv *Level) (lo, hi, flo, fhi float64, err error) {
	lo, hi = pred-w, pred+w
	if hi >= sv.emax {
		hi = sv.emax - 4*eps*math.Max(1, math.Abs(sv.emax))
	}
	flo = sv.f(m, ic, target, lo, lv)
	for k := 0; flo > 0; k++ {
		if k > 200 {
			return 0, 0, 0, 0, fmt.Errorf("eigen: lost the bracket of the level near E = %g", pred)
		}
		hi, fhi = lo, flo
		w *= 4
		lo = pred - w
		flo = sv.f(m, ic, target, lo, lv)
	}
	if fhi <= 0 || hi <= lo {
		fhi = sv.f(m, ic, target, hi, lv)
	}
	for k := 0; fhi <= 0; k++ {
		if k > 200 || hi >= sv.emax {
			return 0, 0, 0, 0, fmt.Errorf("eigen: lost the bracket of the level near E = %g", pred)
		}
		lo, flo = hi, fhi
		w *= 4
		hi = math.Min(pred+w, sv.emax-4*eps*math.Max(1, math.Abs(sv.emax)))
		fhi = sv.f(m, ic, target, hi, lv)
	}
	return lo, hi, flo, fhi, nil
}

// root solves D(E) = target in [a, b] (f(a) ≤ 0 < f(b)) by Brent's method
// (Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4) to
// rounding. It returns the root and the slope of D across the final
// bracket.
func (sv *Solver) root(m *mesh, ic int, target, a, b, fa, fb float64, lv *Level) (x, slope float64, err error) {
	c, fc := a, fa
	d := b - a
	e := d
	// Rounding of D accumulated over the cells: below it in energy the sign
	// of f is noise, and the root is as good as it gets.
	noise := eps * (math.Pi*math.Sqrt(float64(len(m.h))) + math.Abs(target))
	for it := 0; it < sv.set.MaxIter; it++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2 * eps * sv.scale(b)
		if sl := math.Abs((fc - fb) / (c - b)); sl > 0 {
			tol = math.Max(tol, 0.5*noise/sl)
		}
		xm := 0.5 * (c - b)
		if math.Abs(xm) <= tol || fb == 0 {
			slope = 0
			if c != b {
				slope = (fc - fb) / (c - b)
			}
			return b, slope, nil
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			s := fb / fa
			var p, q float64
			if a == c {
				p = 2 * xm * s
				q = 1 - s
			} else {
				q = fa / fc
				r := fb / fc
				p = s * (2*xm*q*(q-r) - (b-a)*(r-1))
				q = (q - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			}
			p = math.Abs(p)
			if 2*p < math.Min(3*xm*q-math.Abs(tol*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d = xm
				e = d
			}
		} else {
			d = xm
			e = d
		}
		a, fa = b, fb
		if math.Abs(d) > tol {
			b += d
		} else {
			b += math.Copysign(tol, xm)
		}
		fb = sv.f(m, ic, target, b, lv)
	}
	lv.Status = RootFailure
	return b, 0, fmt.Errorf("eigen: level %d: root finder did not converge in %d iterations on a mesh of %d cells (bracket [%.17g, %.17g])",
		lv.N, sv.set.MaxIter, len(m.h), math.Min(b, c), math.Max(b, c))
}

// checkEnds measures, at the level's energy, the decay factor
// exp(−∫√(2m(V−E))/ħ dx) from the outermost turning point to each open end
// and flags the level when it exceeds the tolerance.
func (sv *Solver) checkEnds(m *mesh, lv *Level) {
	ce := sv.c * lv.E
	for k, d := range sv.ends {
		if !d.open {
			continue
		}
		var integral float64
		allowedEnd := sv.c*(d.v-lv.E) <= 0
		turn := d.x
		nc := len(m.h)
		x := d.x
		for j := range nc {
			i := j
			if k == 1 {
				i = nc - 1 - j
			}
			qe := m.q[i] - ce
			if qe <= 0 {
				break
			}
			integral += math.Sqrt(qe) * m.h[i]
			x += d.inward * m.h[i]
			turn = x
		}
		decay := math.Exp(-integral)
		if allowedEnd {
			decay = 1
		}
		lv.Decay = math.Max(lv.Decay, decay)
		if decay > sv.set.Tol {
			lv.Status = IntervalShort
			lv.Warnings = append(lv.Warnings, fmt.Sprintf("open end x = %g: decay factor %.3g from the turning point near x = %.6g exceeds the tolerance %.3g: the level's sensitivity to the end condition is measured and included in its error estimate; widen the interval to reduce it",
				d.x, decay, turn, sv.set.Tol))
		}
	}
}

// extrapolant chooses, in the last row j ≥ 1 of the Richardson table
// T[j][i] (i-fold elimination of h⁴, h⁶, …), the column i < j whose error
// estimate
//
//	max(|T[j][i] − T[j][i−1]|, |T[j][i] − T[j−1][i]|)
//
// (the last correction, and the change from the previous mesh at the same
// order) is smallest, and returns that entry and its estimate; with j = 1
// only the first term exists. Coarse meshes outside the asymptotic range of
// the expansion show large corrections and changes, so their columns are
// not chosen.
func extrapolant(t [][]float64) (best, err float64) {
	j := len(t) - 1
	best, err = t[j][0], math.Inf(1)
	if j == 1 {
		return t[1][1], math.Abs(t[1][1] - t[1][0])
	}
	for i := 1; i < j; i++ {
		e := math.Max(math.Abs(t[j][i]-t[j][i-1]), math.Abs(t[j][i]-t[j-1][i]))
		if e < err {
			best, err = t[j][i], e
		}
	}
	return best, err
}

// endDecayMin is the decay factor to an open end below which its end
// condition cannot move E above rounding (the shift goes as its square).
const endDecayMin = 1e-9

// endShift returns the change of the root e0 of D(E) = target on m when the
// open ends start from the next coarser end condition (start with alt: the
// last WKB term of ψ′/ψ dropped). The error of the start is that of the
// first omitted term, in practice an order of the WKB small parameter below
// the last one kept, so the change bounds it.
func (sv *Solver) endShift(m *mesh, ic int, target, e0 float64, lv *Level) (float64, error) {
	g := func(e float64) float64 {
		lv.Iterations++
		return sv.shootEnd(m, ic, e, true).d - target
	}
	top := sv.emax - 4*eps*math.Max(1, math.Abs(sv.emax))
	w := 64 * eps * sv.scale(e0)
	lo, hi := e0-w, math.Min(e0+w, top)
	flo, fhi := g(lo), g(hi)
	for k := 0; flo > 0 || fhi <= 0; k++ {
		if k > 200 || hi >= top && fhi <= 0 {
			return 0, fmt.Errorf("eigen: level %d: cannot bracket it with the coarser end condition near E = %g", lv.N, e0)
		}
		w *= 4
		if flo > 0 {
			lo = e0 - w
			flo = g(lo)
		}
		if fhi <= 0 {
			hi = math.Min(e0+w, top)
			fhi = g(hi)
		}
	}
	// Bisection with secant steps (Illinois): D is smooth and increasing.
	for it := 0; it < 200 && hi-lo > 4*eps*sv.scale(e0); it++ {
		x := lo - flo*(hi-lo)/(fhi-flo)
		if !(x > lo && x < hi) {
			x = 0.5 * (lo + hi)
		}
		fx := g(x)
		if fx <= 0 {
			lo, flo = x, fx
			fhi /= 2
		} else {
			hi, fhi = x, fx
			flo /= 2
		}
		if math.Abs(fx) < 4*eps*(math.Abs(target)+math.Pi) {
			return math.Abs(x - e0), nil
		}
	}
	return math.Abs(0.5*(lo+hi) - e0), nil
}
