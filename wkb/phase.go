package wkb

import (
	"errors"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// PhaseSettings controls PairPhase. A nil *PhaseSettings means all defaults.
type PhaseSettings struct {
	// Others are zeros and poles of Q (and poles of Q1) other than the two
	// turning points. The contours are kept inside the ellipse with foci
	// t1, t2 through the nearest of them. Singularities not listed are
	// detected by the winding number of Q on the contour and by comparing
	// contours of different size, and the contour is shrunk until two sizes
	// agree.
	Others []complex128
	// Tol is the relative tolerance of each term in the node doubling and in
	// the comparison of two contour sizes. Zero means 1e-11.
	Tol float64
	// MaxNodes bounds the number of trapezoid nodes on one contour. Zero
	// means 16384.
	MaxNodes int
	// Radius, if greater than 1, fixes the contour: the ellipse is the image
	// of |w| = Radius under x = c + h (w + 1/w)/2 with c = (t1+t2)/2,
	// h = (t2−t1)/2, and the check contour has radius 1 + 0.6(Radius − 1);
	// the probe that otherwise chooses the radius is skipped (pass the
	// Radius of an earlier result for a nearby problem to save it). Zero
	// means automatic: candidates from 4 (or less, from Others) down.
	Radius float64
}

// PhaseSeries is the WKB phase integral between two turning points to higher
// orders,
//
//	λ ∫_{t1}^{t2} √Q dx  →  Σ_k Terms[k],   Terms[k] = λ^(1−2k) σ_{2k},
//	σ_{2k} = (1/2i) ∮ φ_{2k} dx,
//
// the contour encircling t1, t2 and the cut between them anticlockwise, φ_k
// the terms of Riccati with φ_0 = i b and b the branch of √Q on the contour
// for which (1/2)∮ b dx = ∫_{t1}^{t2} √Q, the integral taken along the
// straight segment with the principal root at its midpoint (a midpoint value
// of Q on the negative real axis counts as arg Q = +π). So Terms[0] is
// positive for a classically allowed interval and equals iθ, θ > 0, for a
// barrier. The odd terms beyond φ_1 integrate to zero; φ_1 contributes −π/2
// to the quantisation condition Σ Terms = π(n + ½) of two soft turning
// points, which is not included in Terms.
type PhaseSeries struct {
	Terms   []complex128 // Terms[k]: the order-2k contribution
	TermErr []float64    // quadrature error of each term (node doubling and contour size)
	Least   int          // index k ≥ 1 of the least |Terms[k]|
	Sum     complex128   // Σ_{k<Least} Terms[k] (optimal truncation)
	ErrEst  float64      // |Terms[Least]| plus the quadrature errors of the sum
	Nodes   int          // trapezoid nodes on the contour that was kept
	Radius  float64      // its radius |w| (see PhaseSettings.Radius)
	Status  Status
}

// PairPhase returns the phase integral between the turning points t1 and t2
// of p to order maxOrder (rounded down to even; orders below 2 are raised to
// 2 so that the leading term has a computed error estimate), each term a
// trapezoid sum on an ellipse with foci t1, t2. The integrands are analytic
// on an annulus about the contour, so the rule converges geometrically; the
// nodes are doubled until every term changes by less than the tolerance.
//
// PairPhase returns an error if the input is invalid or no contour holding
// exactly the two turning points could be found; a result that did not meet
// the tolerance is returned with Status NodeLimit or ContourMismatch.
func PairPhase(p Problem, t1, t2 complex128, maxOrder int, s *PhaseSettings) (*PhaseSeries, error) {
	var set PhaseSettings
	if s != nil {
		set = *s
	}
	if set.Tol == 0 {
		set.Tol = 1e-11
	}
	if set.MaxNodes == 0 {
		set.MaxNodes = 1 << 14
	}
	switch {
	case p.Q == nil:
		return nil, errors.New("wkb: problem has no Q")
	case !(p.Lambda > 0) || math.IsInf(p.Lambda, 0):
		return nil, errors.New("wkb: lambda must be positive and finite")
	case cmplx.IsNaN(t1) || cmplx.IsNaN(t2) || cmplx.IsInf(t1) || cmplx.IsInf(t2):
		return nil, errors.New("wkb: turning points must be finite")
	case t1 == t2:
		return nil, errors.New("wkb: coincident turning points need a uniform treatment, not a pair phase")
	case maxOrder < 0:
		return nil, errors.New("wkb: negative maximum order")
	case !(set.Tol > 0) || set.MaxNodes < 32:
		return nil, errors.New("wkb: tolerance must be positive and the node limit at least 32")
	}
	K := maxOrder / 2
	if K < 1 {
		K = 1
	}
	c := (t1 + t2) / 2
	h := (t2 - t1) / 2

	// Largest radius: below the elliptic radius of every other singularity.
	rMax := 4.0
	if set.Radius > 1 {
		rMax = set.Radius
	}
	for _, z := range set.Others {
		if cmplx.Abs(z-t1) < 1e-12*cmplx.Abs(h) || cmplx.Abs(z-t2) < 1e-12*cmplx.Abs(h) {
			continue
		}
		// The probe below picks the radius; ρ^0.9 keeps the largest
		// candidate clear of the singularity itself.
		if rho := ellipticRadius((z - c) / h); math.Pow(rho, 0.9) < rMax {
			rMax = math.Pow(rho, 0.9)
		}
	}
	if !(rMax > 1+1e-9) {
		return nil, errors.New("wkb: another singularity lies on the segment between the turning points")
	}
	if rMax < 1.15 {
		return nil, errors.New("wkb: another singularity lies too close to the segment between the turning points")
	}

	in := contourInput{p: p, c: c, h: h, kmax: 2 * K, lambda: p.Lambda, tol: set.Tol, maxNodes: set.MaxNodes}

	// Candidate radii shrink geometrically towards 1; below minRadius the
	// contour hugs the turning points and the high-order integrands lose all
	// digits to cancellation. A coarse probe of each gives the winding
	// number of Q (which must be 2) and the rounding scale of the highest
	// term; the contour with the least scale is integrated, then the next
	// smaller admissible one as a check of contour-size independence, which
	// also catches pole–zero pairs that the winding number cannot see.
	const minRadius = 1.15
	type cand struct {
		r   float64
		mag float64
	}
	var cands []cand
	if set.Radius > 1 {
		for r := rMax; r >= minRadius && len(cands) < 3; r = 1 + 0.6*(r-1) {
			cands = append(cands, cand{r, 0})
		}
	} else {
		for r := rMax; r >= minRadius; r = 1 + 0.6*(r-1) {
			if m, ok := in.probe(r); ok {
				cands = append(cands, cand{r, m})
			}
		}
	}
	if len(cands) == 0 {
		return nil, &QuadratureError{Reason: "no ellipse about the turning points holds them alone", Change: math.NaN(), Nodes: probeNodes}
	}
	best := 0
	for i := range cands {
		if cands[i].mag < cands[best].mag {
			best = i
		}
	}
	var prev *contourResult
	var firstErr error
	for i := best; i < len(cands); i++ {
		in.r = cands[i].r
		cur, err := in.run()
		if err != nil {
			if firstErr == nil {
				firstErr = err
			}
			continue
		}
		if prev == nil {
			prev = cur
			continue
		}
		out := assemble(prev, cur, K)
		if !agree(prev, cur, set.Tol) {
			out.Status = ContourMismatch
		}
		return out, nil
	}
	if prev != nil {
		// Only one usable contour: no size check was possible.
		out := assemble(prev, nil, K)
		out.Status = ContourMismatch
		return out, nil
	}
	return nil, firstErr
}

const probeNodes = 32

const windingReason = "contour holds zeros or poles of Q besides the two turning points"

// probe integrates on the contour of radius r with probeNodes nodes and
// returns the rounding scale of the highest term, or false if the contour
// does not hold exactly the two turning points or does not resolve Q.
func (in *contourInput) probe(r float64) (float64, bool) {
	in.r = r
	start, ok := in.startBranch()
	if !ok {
		return 0, false
	}
	// Coarse first; more nodes only where Q or its root is not resolved.
	for n := probeNodes; n <= 16*probeNodes; n *= 2 {
		nodes := make([]node, n)
		branch := start
		for i := range nodes {
			j := (n/4 + i) % n
			nd, ok := in.eval(2*math.Pi*float64(j)/float64(n), branch)
			if !ok {
				return 0, false
			}
			nodes[j] = nd
			branch = nd.b
		}
		err := in.checkLoop(nodes)
		if err == nil {
			_, mag := in.sums(nodes)
			return mag[len(mag)-1], true
		}
		if e, ok := err.(*QuadratureError); !ok || e.Reason == windingReason {
			return 0, false
		}
	}
	return 0, false
}

// ellipticRadius returns |w| ≥ 1 for u = (w + 1/w)/2: the ellipse with foci
// ±1 through u is the image of the circle of that radius.
func ellipticRadius(u complex128) float64 {
	s := cmplx.Sqrt(u*u - 1)
	w := u + s
	if cmplx.Abs(w) < 1 {
		w = u - s
	}
	return cmplx.Abs(w)
}

type contourInput struct {
	p        Problem
	c, h     complex128
	r        float64
	kmax     int
	lambda   float64
	tol      float64
	maxNodes int
}

type contourResult struct {
	terms  []complex128
	change []float64 // last change in node doubling
	mag    []float64 // λ^(1−2k)(1/2)∮|φ_2k||dx|: the rounding scale
	nodes  int
	r      float64
	status Status
}

// node holds the integrand values at one contour node.
type node struct {
	b  complex128   // √Q on the continued branch
	q  complex128   // Q
	fk []complex128 // φ_{2k} dx/dθ
}

func (in *contourInput) point(theta float64) (x, dx complex128) {
	w := complex(in.r, 0) * cmplx.Exp(complex(0, theta))
	x = in.c + in.h*(w+1/w)/2
	dx = in.h * complex(0, 1) * (w - 1/w) / 2
	return x, dx
}

func (in *contourInput) eval(theta float64, branch complex128) (node, bool) {
	x, dx := in.point(theta)
	q := in.p.Q.Taylor(x, in.kmax)
	var q1 jet.Series
	if in.p.Q1 != nil {
		q1 = in.p.Q1.Taylor(x, in.kmax)
	}
	if len(q) != in.kmax+1 || !q.IsFinite() || q[0] == 0 || (q1 != nil && (len(q1) != len(q) || !q1.IsFinite())) {
		return node{}, false
	}
	phi := Riccati(q, q1, branch, in.kmax)
	nd := node{b: phi[0][0] / 1i, q: q[0], fk: make([]complex128, in.kmax/2+1)}
	for k := range nd.fk {
		nd.fk[k] = phi[2*k][0] * dx
	}
	return nd, true
}

// startBranch continues the principal √Q at the midpoint c up to the
// contour point at θ = π/2 and returns minus that value: with the
// anticlockwise orientation the upper side of the cut is run from t2 to t1,
// so the branch that is the principal root on the upper side gives
// ∮ b dx = −2∫_{t1}^{t2} √Q.
func (in *contourInput) startBranch() (complex128, bool) {
	top, _ := in.point(math.Pi / 2)
	q := in.p.Q.Eval(in.c)
	if imag(q) == 0 {
		q = complex(real(q), 0) // −0 imaginary part would pick −i√|Q|
	}
	if q == 0 || cmplx.IsNaN(q) || cmplx.IsInf(q) {
		return 0, false
	}
	b0 := cmplx.Sqrt(q)
	// Few steps suffice unless √Q turns quickly; then more.
	for _, steps := range []int{16, 128} {
		b, ok := b0, true
		for m := 1; m <= steps; m++ {
			x := in.c + (top-in.c)*complex(float64(m)/float64(steps), 0)
			nb := cmplx.Sqrt(in.p.Q.Eval(x))
			if cmplx.Abs(nb+b) < cmplx.Abs(nb-b) {
				nb = -nb
			}
			if cmplx.IsNaN(nb) || cmplx.Abs(nb-b) > 0.5*cmplx.Abs(b) {
				ok = false
				break
			}
			b = nb
		}
		if ok {
			return -b, true
		}
	}
	return 0, false
}

// run integrates all terms on the contour of radius in.r with node doubling.
func (in *contourInput) run() (*contourResult, error) {
	start, ok := in.startBranch()
	if !ok {
		return nil, &QuadratureError{Reason: "cannot continue the square root from the midpoint to the contour", Change: math.NaN()}
	}
	K := in.kmax / 2
	n := 16
	nodes := make([]node, n)
	// Nodes θ_j = 2πj/n, starting at j = n/4 (θ = π/2) and continuing √Q.
	branch := start
	for i := 0; i < n; i++ {
		j := (n/4 + i) % n
		nd, ok := in.eval(2*math.Pi*float64(j)/float64(n), branch)
		if !ok {
			return nil, &QuadratureError{Reason: "Q vanishes or is singular on the contour", Change: math.NaN(), Nodes: n}
		}
		nodes[j] = nd
		branch = nd.b
	}
	res := &contourResult{r: in.r, change: make([]float64, K+1), mag: make([]float64, K+1)}
	var old []complex128
	for {
		if err := in.checkLoop(nodes); err != nil {
			if n < in.maxNodes {
				goto refine
			}
			return nil, err
		}
		{
			terms, mag := in.sums(nodes)
			if old != nil {
				done := true
				for k := range terms {
					res.change[k] = cmplx.Abs(terms[k] - old[k])
					if res.change[k] > in.tol*cmplx.Abs(terms[k])+16*eps*mag[k] {
						done = false
					}
				}
				if done && n >= 32 {
					res.terms, res.mag, res.nodes = terms, mag, n
					return res, nil
				}
				if 2*n > in.maxNodes {
					res.terms, res.mag, res.nodes, res.status = terms, mag, n, NodeLimit
					return res, nil
				}
			}
			old = terms
		}
	refine:
		if 2*n > in.maxNodes {
			return nil, &QuadratureError{Reason: "contour too coarse to follow the branch of the square root", Change: math.NaN(), Nodes: n}
		}
		// Double the nodes: new node 2j+1 lies between old nodes j and j+1.
		next := make([]node, 2*n)
		for j := range nodes {
			next[2*j] = nodes[j]
		}
		for j := 0; j < n; j++ {
			nd, ok := in.eval(2*math.Pi*float64(2*j+1)/float64(2*n), nodes[j].b)
			if !ok {
				return nil, &QuadratureError{Reason: "Q vanishes or is singular on the contour", Change: math.NaN(), Nodes: 2 * n}
			}
			next[2*j+1] = nd
		}
		nodes = next
		n *= 2
	}
}

const eps = 0x1p-52

// checkLoop verifies that the nodes resolve the branch (√Q changes by less
// than half its size between neighbours) and that Q winds twice around the
// contour: the two turning points and nothing else of net order.
func (in *contourInput) checkLoop(nodes []node) error {
	n := len(nodes)
	var wind float64
	for j := 0; j < n; j++ {
		a, b := nodes[j], nodes[(j+1)%n]
		if cmplx.Abs(b.b-a.b) > 0.5*math.Min(cmplx.Abs(a.b), cmplx.Abs(b.b)) {
			return &QuadratureError{Reason: "square root not resolved on the contour", Change: math.NaN(), Nodes: n}
		}
		d := cmplx.Phase(b.q / a.q)
		if math.Abs(d) > math.Pi/2 {
			return &QuadratureError{Reason: "Q not resolved on the contour", Change: math.NaN(), Nodes: n}
		}
		wind += d
	}
	if w := math.Round(wind / (2 * math.Pi)); w != 2 {
		return &QuadratureError{Reason: windingReason, Change: math.NaN(), Nodes: n}
	}
	return nil
}

// sums returns the trapezoid sums Terms[k] = λ^(1−2k) (1/2i)∮φ_{2k} dx and
// their rounding scales.
func (in *contourInput) sums(nodes []node) ([]complex128, []float64) {
	K := in.kmax / 2
	terms := make([]complex128, K+1)
	mag := make([]float64, K+1)
	wgt := 2 * math.Pi / float64(len(nodes))
	for k := 0; k <= K; k++ {
		var s complex128
		var m float64
		for _, nd := range nodes {
			s += nd.fk[k]
			m += cmplx.Abs(nd.fk[k])
		}
		lp := math.Pow(in.lambda, float64(1-2*k))
		terms[k] = complex(lp*wgt/2, 0) * s / 1i
		mag[k] = lp * wgt / 2 * m
	}
	return terms, mag
}

func agree(a, b *contourResult, tol float64) bool {
	for k := range a.terms {
		d := cmplx.Abs(a.terms[k] - b.terms[k])
		scale := math.Max(cmplx.Abs(a.terms[k]), cmplx.Abs(b.terms[k]))
		if d > 10*tol*scale+16*eps*math.Max(a.mag[k], b.mag[k])+a.change[k]+b.change[k] {
			return false
		}
	}
	return true
}

// assemble builds the result from the larger contour a and the check b
// (nil if there is none), keeping per term the value with less rounding.
func assemble(a, b *contourResult, K int) *PhaseSeries {
	out := &PhaseSeries{Terms: make([]complex128, K+1), TermErr: make([]float64, K+1), Nodes: a.nodes, Radius: a.r, Status: a.status}
	for k := 0; k <= K; k++ {
		v, m, ch := a.terms[k], a.mag[k], a.change[k]
		e := ch + 16*eps*m
		if b != nil {
			if b.mag[k] < m {
				v, m, ch = b.terms[k], b.mag[k], b.change[k]
			}
			e = math.Max(ch+16*eps*m, cmplx.Abs(a.terms[k]-b.terms[k]))
			if b.status != Success {
				out.Status = b.status
			}
		}
		out.Terms[k], out.TermErr[k] = v, e
	}
	out.Least = 1
	for k := 2; k <= K; k++ {
		if cmplx.Abs(out.Terms[k]) < cmplx.Abs(out.Terms[out.Least]) {
			out.Least = k
		}
	}
	var qerr float64
	for k := 0; k < out.Least; k++ {
		out.Sum += out.Terms[k]
		qerr += out.TermErr[k]
	}
	out.ErrEst = cmplx.Abs(out.Terms[out.Least]) + qerr
	if out.Status == Success && out.Least < K {
		out.Status = LeastTerm
	}
	return out
}
