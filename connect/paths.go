package connect

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"sort"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/wkb"
)

// glRule is a cached Gauss–Legendre rule on [0, 1].
type glRule struct{ x, w []float64 }

var (
	glMu    sync.Mutex
	glCache = map[int]glRule{}
)

func legendre(n int) glRule {
	glMu.Lock()
	defer glMu.Unlock()
	if r, ok := glCache[n]; ok {
		return r
	}
	r := glRule{x: make([]float64, n), w: make([]float64, n)}
	quad.Legendre{}.FixedLocations(r.x, r.w, 0, 1)
	// Ascending order: the branch of √Q is continued node by node.
	idx := make([]int, n)
	for i := range idx {
		idx[i] = i
	}
	sort.Slice(idx, func(i, j int) bool { return r.x[idx[i]] < r.x[idx[j]] })
	x, w := make([]float64, n), make([]float64, n)
	for i, k := range idx {
		x[i], w[i] = r.x[k], r.w[k]
	}
	r.x, r.w = x, w
	glCache[n] = r
	return r
}

// path is a parametrised curve z(s), s ∈ [0, 1], with its derivative.
type path func(s float64) (z, dz complex128)

// terms evaluates the even Riccati terms −iφ_{2k}, k = 0…K, at z, with the
// branch of √Q nearest to hint; it returns them and the root used.
func terms(p wkb.Problem, z, hint complex128, K int) ([]complex128, complex128) {
	phi := wkb.RiccatiAt(p, z, hint, 2*K)
	v := make([]complex128, K+1)
	for k := range v {
		v[k] = -1i * phi[2*k]
	}
	return v, v[0]
}

// pathResult is the integral of the even Riccati terms along a path.
type pathResult struct {
	val  []complex128 // ∫ −iφ_{2k} dz, k = 0…K
	err  []float64    // change between the last two panel counts
	root complex128   // branch of √Q at the end of the path
}

// integratePath integrates the even terms along pth by adaptive
// Gauss–Legendre quadrature, the branch of √Q continued from root0 at
// s = 0 node by node: [0, 1] is cut into 4 panels, and a panel whose 16-node
// rule and the sum of the rules on its halves differ, in any term, by more
// than tol relative to the panel's ∫|integrand| is halved again (to panels
// of 2⁻²⁰ at most), or by more than tol·(s1−s0) times the whole path's
// ∫|integrand| (an absolute floor where the integrand is nearly zero); the
// halves' sum is kept and the difference is the error estimate. Near a turning point the higher terms are peaked at one
// end, where this refines, and nowhere else.
func integratePath(p wkb.Problem, pth path, root0 complex128, K int, tol float64) (*pathResult, error) {
	in := &pathIntegrator{p: p, pth: pth, K: K, tol: tol, rule: legendre(16)}
	out := &pathResult{val: make([]complex128, K+1), err: make([]float64, K+1)}
	hint := root0
	const start = 4
	var first [start]panelSum
	var starts [start]complex128
	in.floor = make([]float64, K+1)
	for i := 0; i < start; i++ {
		s0, s1 := float64(i)/start, float64(i+1)/start
		whole, h, err := in.panel(s0, s1, hint)
		if err != nil {
			return nil, err
		}
		first[i], starts[i] = whole, hint
		for k, v := range whole.scale {
			in.floor[k] += v
		}
		hint = h
	}
	// The absolute floor of the acceptance test: a panel of width w may
	// err by tol·w times the path's whole ∫|integrand| (estimated on the
	// first four panels), so that panels where an integrand is nearly zero
	// (relative to its own size elsewhere) are not refined for ever.
	for k := range in.floor {
		in.floor[k] *= tol
	}
	for i := 0; i < start; i++ {
		s0, s1 := float64(i)/start, float64(i+1)/start
		h, err := in.refine(s0, s1, first[i], starts[i], 0, out)
		if err != nil {
			return nil, err
		}
		hint = h
	}
	out.root = hint
	return out, nil
}

// pathIntegrator holds the state of integratePath.
type pathIntegrator struct {
	p     wkb.Problem
	pth   path
	K     int
	tol   float64
	rule  glRule
	floor []float64 // tol × ∫|integrand| over the path, per term
}

// panelSum is the 16-node rule on one panel, per term, with ∫|integrand|.
type panelSum struct {
	val   []complex128
	scale []float64
}

// panel applies the rule on [s0, s1], continuing the branch from hint, and
// returns the sums and the root at the last node.
func (in *pathIntegrator) panel(s0, s1 float64, hint complex128) (panelSum, complex128, error) {
	ps := panelSum{val: make([]complex128, in.K+1), scale: make([]float64, in.K+1)}
	h := s1 - s0
	for j := range in.rule.x {
		z, dz := in.pth(s0 + in.rule.x[j]*h)
		v, r := terms(in.p, z, hint, in.K)
		hint = r
		w := in.rule.w[j] * h
		for k := range v {
			f := v[k] * dz
			if cmplx.IsNaN(f) || cmplx.IsInf(f) {
				return ps, hint, fmt.Errorf("connect: WKB integrand not finite at %v", z)
			}
			ps.val[k] += complex(w, 0) * f
			ps.scale[k] += w * cmplx.Abs(f)
		}
	}
	return ps, hint, nil
}

// refine compares the rule on [s0, s1] (whole) with the rules on its
// halves and adds the accepted sums to out, recursing where they differ;
// hint is the root at s0. It returns the root at s1.
func (in *pathIntegrator) refine(s0, s1 float64, whole panelSum, hint complex128, depth int, out *pathResult) (complex128, error) {
	m := (s0 + s1) / 2
	left, hm, err := in.panel(s0, m, hint)
	if err != nil {
		return hint, err
	}
	right, h1, err := in.panel(m, s1, hm)
	if err != nil {
		return hint, err
	}
	ok := true
	change := 0.0
	for k := range whole.val {
		d := cmplx.Abs(left.val[k] + right.val[k] - whole.val[k])
		change = math.Max(change, d)
		if d > in.tol*(left.scale[k]+right.scale[k])+in.floor[k]*(s1-s0)+1e-300 {
			ok = false
		}
	}
	if ok {
		for k := range whole.val {
			out.val[k] += left.val[k] + right.val[k]
			out.err[k] += cmplx.Abs(left.val[k] + right.val[k] - whole.val[k])
		}
		return h1, nil
	}
	if depth >= 18 {
		return hint, fmt.Errorf("connect: path quadrature did not converge on panels of width %.3g (change %.3g)", s1-s0, change)
	}
	if hm, err = in.refine(s0, m, left, hint, depth+1, out); err != nil {
		return hint, err
	}
	return in.refine(m, s1, right, hm, depth+1, out)
}

// segment is the straight path from z0 to z1.
func segment(z0, z1 complex128) path {
	return func(s float64) (complex128, complex128) { return z0 + complex(s, 0)*(z1-z0), z1 - z0 }
}

// loop is the circle about t through c, once round anticlockwise from c.
func loop(t, c complex128) path {
	return func(s float64) (complex128, complex128) {
		e := cmplx.Exp(complex(0, 2*math.Pi*s))
		return t + (c-t)*e, complex(0, 2*math.Pi) * (c - t) * e
	}
}

// finitePart returns FP∫_c^t −iφ_{2k} dz = ½∮ −iφ_{2k} dz, the loop about the
// simple turning point t starting and ending at c: each integrand is
// (z−t)^{j+½} times a function analytic at t, which changes sign round
// the loop, so half the loop is the (finite part of the) integral from c
// to t. root is the branch of √Q at c.
func finitePart(p wkb.Problem, t, c, root complex128, K int, tol float64) (*pathResult, error) {
	r, err := integratePath(p, loop(t, c), root, K, tol)
	if err != nil {
		return nil, err
	}
	for k := range r.val {
		r.val[k] /= 2
		r.err[k] /= 2
	}
	if cmplx.Abs(r.root+root) > 0.5*cmplx.Abs(root) {
		return nil, &signError{t: t, rho: cmplx.Abs(c - t)}
	}
	return r, nil
}

// signError reports that √Q did not change sign round a loop about a
// turning point: the loop encloses another zero or pole (one outside the
// search box is not listed, so the loop radius did not avoid it).
type signError struct {
	t   complex128
	rho float64
}

func (e *signError) Error() string {
	return fmt.Sprintf("connect: √Q did not change sign round the turning point %v: another zero or pole lies within %.3g of it", e.t, e.rho)
}

// shrinkTries is how often a loop radius is halved when the loop encloses
// an unlisted zero or pole (signError) before Scatter gives up.
const shrinkTries = 4

// finitePartShrink is finitePart with the loop radius halved, up to
// shrinkTries times, while the loop encloses another zero or pole: at(ρ)
// returns the loop start c and the branch of √Q there for radius ρ.
func finitePartShrink(p wkb.Problem, t complex128, rho float64, at func(rho float64) (c, root complex128, err error), K int, tol float64) (*pathResult, complex128, error) {
	var err error
	for try := 0; try <= shrinkTries; try++ {
		var c, root complex128
		c, root, err = at(rho)
		if err != nil {
			return nil, 0, err
		}
		var fp *pathResult
		fp, err = finitePart(p, t, c, root, K, tol)
		if err == nil {
			return fp, c, nil
		}
		var se *signError
		if !errors.As(err, &se) {
			return nil, 0, err
		}
		rho /= 2
	}
	return nil, 0, err
}

// verticalS returns Im ∫_x^z √Q along the vertical segment from x = Re z,
// with √Q > 0 at x, and the complex integral itself. The substitution
// z(s) = x + iY(1 − (1−s)²) makes the integrand smooth at a simple zero or
// simple pole at the end point.
func verticalS(p wkb.Problem, z complex128, tol float64) (complex128, error) {
	x := real(z)
	y := imag(z)
	q0 := p.Q.Eval(complex(x, 0))
	if !(real(q0) > 0) {
		return 0, fmt.Errorf("connect: Q(%g) = %v is not positive below %v", x, q0, z)
	}
	pth := func(s float64) (complex128, complex128) {
		u := 1 - s
		return complex(x, y*(1-u*u)), complex(0, 2*y*u)
	}
	const nodes = 16
	rule := legendre(nodes)
	var prev complex128
	for panels := 2; panels <= 1<<10; panels *= 2 {
		var sum complex128
		scale := 0.0
		hint := cmplx.Sqrt(q0)
		h := 1 / float64(panels)
		for i := 0; i < panels; i++ {
			for j := 0; j < nodes; j++ {
				zz, dz := pth((float64(i) + rule.x[j]) * h)
				r := cmplx.Sqrt(p.Q.Eval(zz))
				if cmplx.Abs(r+hint) < cmplx.Abs(r-hint) {
					r = -r
				}
				hint = r
				sum += complex(rule.w[j]*h, 0) * r * dz
				scale += rule.w[j] * h * cmplx.Abs(r*dz)
			}
		}
		if panels > 2 && cmplx.Abs(sum-prev) <= tol*scale {
			return sum, nil
		}
		prev = sum
	}
	return 0, fmt.Errorf("connect: integral of √Q up to %v did not converge", z)
}

// aboveS returns |Im ∫_lo^z √Q| along the straight segment from the
// singularity lo to the singularity z above it, with the substitution
// z(s) = lo + (z − lo)(1 − cos πs)/2 that makes the integrand smooth at
// simple zeros and poles at both ends. The absolute value is taken because
// the sheet of √Q past lo is not fixed; the farther singularity is the
// weaker one on either sheet.
func aboveS(p wkb.Problem, z, lo complex128, tol float64) (float64, error) {
	d := z - lo
	pth := func(s float64) (complex128, complex128) {
		return lo + d*complex((1-math.Cos(math.Pi*s))/2, 0), d * complex(math.Pi*math.Sin(math.Pi*s)/2, 0)
	}
	z0, _ := pth(1.0 / 64)
	r, err := integratePath(p, pth, cmplx.Sqrt(p.Q.Eval(z0)), 0, tol)
	if err != nil {
		return 0, err
	}
	return math.Abs(imag(r.val[0])), nil
}
