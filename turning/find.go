package turning

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"sort"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

const eps = 0x1p-52

// splitFracs are the fractions of the longer side at which a cell is cut,
// tried in turn when a zero or pole lies on the cut. None is 1/2, so a zero
// at the centre of a symmetric box (on the real or imaginary axis) does not
// lie on the first cut.
var splitFracs = [...]float64{0.4873, 0.5391, 0.4419, 0.5827, 0.3961}

// unstableCells is the number of cells whose halves' windings do not add
// up to their own beyond which Q is declared not meromorphic: a meromorphic
// Q resolved by the sampling never shows one.
const unstableCells = 3

// Thresholds on the scaled moments of a cell (see nMom).
const (
	emptyTol   = 1e-12 // |t_k| below this (and winding 0): the cell is empty
	clusterTol = 1e-6  // |t_k/W − (t_1/W)ᵏ| below this: a single cluster
)

// evalLimitPanic is raised (as a panic inside the package only) when the
// evaluation budget is spent; Find recovers it.
type evalLimitPanic struct{}

type sideKey struct{ a, b complex128 }

// sideData is the memoised result of one cell side, a to b.
type sideData struct {
	darg float64   // change of arg Q
	fail *sideFail // non-nil if the side could not be sampled
	mom  momVec    // J_j, see sideMoments
	qerr float64   // quadrature error estimate of mom
	qok  bool      // Q′/Q finite at every node, quadrature and sampling agree
}

// cell is a rectangle of the subdivision with its winding number and scaled
// moments t_k = (1/2πi)∮ ((z−c)/h)ᵏ Q′/Q dz.
type cell struct {
	lo, hi complex128
	depth  int
	c      complex128 // centre
	h      float64    // half the longer side
	w      int        // winding number
	t      momVec     // scaled moments, t[0] ≈ w
	qerr   float64    // error estimate of t
	qok    bool       // every side's quadrature is finite and agrees with its sampling
}

// finder holds the state of one Find call.
type finder struct {
	q        jet.Func
	set      Settings
	scale    float64
	evals    int
	strict   bool // raise evalLimitPanic at the budget
	vals     map[complex128]complex128
	sides    map[sideKey]*sideData
	points   []Point
	warn     []string
	status   Status
	realQ    bool
	dropped  int // warnings beyond maxWarnings
	mismatch int // cells whose halves do not add up to their winding
}

func (f *finder) count() {
	f.evals++
	if f.strict && f.evals > f.set.MaxEvals {
		panic(evalLimitPanic{})
	}
}

// eval returns Q(z), cached.
func (f *finder) eval(z complex128) complex128 {
	if v, ok := f.vals[z]; ok {
		return v
	}
	f.count()
	v := f.q.Eval(z)
	f.vals[z] = v
	return v
}

// taylor returns the Taylor coefficients of Q at z up to order n.
func (f *finder) taylor(z complex128, n int) jet.Series {
	f.count()
	return f.q.Taylor(z, n)
}

// maxWarnings bounds the warnings kept; the rest are counted.
const maxWarnings = 20

func (f *finder) warnf(format string, args ...any) {
	if len(f.warn) >= maxWarnings {
		f.dropped++
		return
	}
	f.warn = append(f.warn, fmt.Sprintf(format, args...))
}

// setStatus raises the status to s if s is more severe.
func (f *finder) setStatus(s Status) {
	if s > f.status {
		f.status = s
	}
}

// side returns the data of the side from a to b, computing it once for both
// orientations.
func (f *finder) side(a, b complex128) *sideData {
	if d, ok := f.sides[sideKey{a, b}]; ok {
		return d
	}
	if d, ok := f.sides[sideKey{b, a}]; ok {
		r := &sideData{darg: -d.darg, fail: d.fail, qerr: d.qerr, qok: d.qok}
		for j := range d.mom {
			r.mom[j] = -d.mom[j]
		}
		return r
	}
	d := &sideData{}
	// The sampled change of log Q, ln|Q(b)/Q(a)| + i·darg, must agree with
	// the quadrature of Q′/Q. A feature narrower than the sample spacing
	// (a zero next to a pole beside the side) can escape either; refine
	// both until they agree, else mark the side so that its cells are
	// split rather than trusted.
	for try, n := 0, 1; try < 3; try, n = try+1, n*8 {
		d.darg, d.fail = f.sideArg(a, b, baseSegs*n)
		if d.fail != nil {
			break
		}
		d.mom, d.qerr, d.qok = f.sideMoments(a, b, 4*n)
		if !d.qok {
			break
		}
		dl := math.Log(cmplx.Abs(f.eval(b))) - math.Log(cmplx.Abs(f.eval(a)))
		if cmplx.Abs(d.mom[0]-complex(dl, d.darg)) <= 1e-6+100*d.qerr {
			break
		}
		if try == 2 {
			d.qok = false
		}
	}
	f.sides[sideKey{a, b}] = d
	return d
}

// newCell computes the winding number and moments of the rectangle [lo, hi].
func (f *finder) newCell(lo, hi complex128, depth int) (*cell, *sideFail) {
	c := &cell{lo: lo, hi: hi, depth: depth, c: (lo + hi) / 2, qok: true}
	c.h = math.Max(real(hi-lo), imag(hi-lo)) / 2
	corners := [4]complex128{lo, complex(real(hi), imag(lo)), hi, complex(real(lo), imag(hi))}
	var darg float64
	for i := range corners {
		a, b := corners[i], corners[(i+1)%4]
		d := f.side(a, b)
		if d.fail != nil {
			return nil, d.fail
		}
		darg += d.darg
		c.qok = c.qok && d.qok
		// (z−c)/h = (l/h)·u + (z_e−c)/h, expanded binomially.
		l := complex(cmplx.Abs(b-a)/c.h, 0)
		e := ((a+b)/2 - c.c) / complex(c.h, 0)
		for k := 0; k <= nMom; k++ {
			var s complex128
			binom := 1.0
			for j := 0; j <= k; j++ {
				s += complex(binom, 0) * pow(l, j) * pow(e, k-j) * d.mom[j]
				binom = binom * float64(k-j) / float64(j+1)
			}
			c.t[k] += s / complex(0, 2*math.Pi)
		}
		c.qerr += d.qerr * math.Pow(1+cmplx.Abs(l)+cmplx.Abs(e), nMom) / (2 * math.Pi)
	}
	c.w = int(math.Round(darg / (2 * math.Pi)))
	return c, nil
}

func pow(z complex128, n int) complex128 {
	r := complex(1, 0)
	for ; n > 0; n-- {
		r *= z
	}
	return r
}

// contains reports whether z lies in the cell enlarged by a rounding margin.
func (c *cell) contains(z complex128) bool {
	m := 1e-9 * c.h
	return real(z) >= real(c.lo)-m && real(z) <= real(c.hi)+m &&
		imag(z) >= imag(c.lo)-m && imag(z) <= imag(c.hi)+m
}

// edgeDist returns the distance from z (inside) to the cell boundary.
func (c *cell) edgeDist(z complex128) float64 {
	return math.Min(math.Min(real(z)-real(c.lo), real(c.hi)-real(z)),
		math.Min(imag(z)-imag(c.lo), imag(c.hi)-imag(z)))
}

func (c *cell) String() string {
	return fmt.Sprintf("[%.6g, %.6g]×[%.6g, %.6g]", real(c.lo), real(c.hi), imag(c.lo), imag(c.hi))
}

// empty reports whether the cell holds neither zeros nor poles: winding 0
// and vanishing moments.
func (c *cell) empty() bool {
	if c.w != 0 || !c.qok {
		return false
	}
	tol := math.Max(emptyTol, 10*c.qerr)
	for _, v := range c.t {
		if cmplx.Abs(v) > tol {
			return false
		}
	}
	return true
}

// single reports whether the moments are those of one point (or a tight
// cluster) of total order w, and returns its scaled position.
func (c *cell) single() (complex128, bool) {
	if c.w == 0 || !c.qok || math.Abs(real(c.t[0])-float64(c.w)) > 1e-3 {
		return 0, false
	}
	w := complex(float64(c.w), 0)
	zeta := c.t[1] / w
	if cmplx.Abs(zeta) > 2 {
		return 0, false
	}
	tol := clusterTol + 100*c.qerr
	for k := 2; k <= nMom; k++ {
		if cmplx.Abs(c.t[k]/w-pow(zeta, k)) > tol {
			return 0, false
		}
	}
	return zeta, true
}

// Find returns all zeros and poles of the meromorphic function q in the
// closed box, with their orders, positions polished by Newton's method on
// exact Taylor coefficients, residuals, error estimates and classes.
//
// The winding number of q along the box boundary (argument principle,
// sampled with Eval so that arg q changes by less than π/4 between samples)
// counts zeros minus poles. The box is bisected until each cell is empty or
// holds a single zero or pole (or a tight cluster). Which of the two is read
// off the moments (1/2πi)∮ zᵏ q′/q dz, computed by Gauss–Kronrod quadrature,
// so that a cell with winding 0 holding a zero and a pole is not taken for
// empty.
// Each point is polished by Newton's method (for order m on the (m−1)-th
// derivative of q, or of 1/q for a pole) and confirmed by the winding number
// along a small circle, which also gives its order. Clusters are split by
// the roots of the local Taylor polynomial when Newton tells them apart.
//
// A zero or pole on a cutting line moves the cut; one on the box boundary
// moves that side of the boundary outward past it and is reported with a
// warning. A q that jumps (a branch cut) ends the search of the cell with
// status NotMeromorphic. The result says whether the reported orders add up
// to the boundary winding.
//
// Find returns an error for an invalid box or settings, or when q is NaN on
// the box boundary even after moving it.
func Find(q jet.Func, box Box, s *Settings) (res *Result, err error) {
	if q == nil {
		return nil, errors.New("turning: nil function")
	}
	for _, z := range []complex128{box.Lo, box.Hi} {
		if !isFinite(z) {
			return nil, fmt.Errorf("turning: box corner %v is not finite", z)
		}
	}
	if !(real(box.Hi) > real(box.Lo)) || !(imag(box.Hi) > imag(box.Lo)) {
		return nil, fmt.Errorf("turning: empty box: lower corner %v is not below and left of upper corner %v", box.Lo, box.Hi)
	}
	scale := math.Max(real(box.Hi-box.Lo), imag(box.Hi-box.Lo))
	set, err := s.resolved(scale)
	if err != nil {
		return nil, err
	}
	f := &finder{q: q, set: set, scale: scale, strict: true,
		vals: make(map[complex128]complex128), sides: make(map[sideKey]*sideData)}
	res = &Result{Box: box}
	root, err := f.rootCell(box)
	if err != nil {
		return nil, err
	}
	if root != nil {
		res.Winding = root.w
		f.search(root)
	}
	f.strict = false
	if f.mismatch >= unstableCells {
		f.setStatus(NotMeromorphic)
		f.warnf("winding numbers changed under subdivision in %d cells: q is not meromorphic here (essential singularity?) or too noisy to count", f.mismatch)
	}
	f.finish(box)
	res.Points = f.points
	for _, p := range f.points {
		if p.Order > 0 {
			res.Zeros += p.Order
		} else {
			res.Poles -= p.Order
		}
	}
	res.Balanced = root != nil && res.Zeros-res.Poles == res.Winding
	if root != nil && !res.Balanced {
		f.setStatus(CountMismatch)
		f.warnf("reported orders add up to %d but the boundary winding is %d", res.Zeros-res.Poles, res.Winding)
	}
	res.Status = f.status
	res.Warnings = f.warn
	if f.dropped > 0 {
		res.Warnings = append(res.Warnings, fmt.Sprintf("(and %d more warnings)", f.dropped))
	}
	res.Evals = f.evals
	return res, nil
}

// rootCell computes the cell of the whole box, moving a side outward past a
// zero or pole that lies on it. A nil cell with a nil error means the search
// could not start (status and warning set).
func (f *finder) rootCell(box Box) (root *cell, err error) {
	defer func() {
		if r := recover(); r != nil {
			if _, ok := r.(evalLimitPanic); !ok {
				panic(r)
			}
			f.setStatus(EvalLimit)
			f.warnf("evaluation limit %d reached on the box boundary", f.set.MaxEvals)
			root = nil
		}
	}()
	work := box
	for try := 0; try < 4; try++ {
		c, fail := f.newCell(work.Lo, work.Hi, 0)
		if fail == nil {
			return c, nil
		}
		switch fail.kind {
		case failJump:
			f.setStatus(NotMeromorphic)
			f.warnf("q jumps on the box boundary near %s: not meromorphic (branch cut?), argument principle not applicable", fmtZ(fail.z))
			return nil, nil
		case failNaN:
			if try == 3 {
				return nil, fmt.Errorf("turning: q is NaN on the box boundary near %s", fmtZ(fail.z))
			}
		}
		d := f.scale * 1e-7 * math.Pow(100, float64(try))
		z := fail.z
		dl, dr := real(z)-real(work.Lo), real(work.Hi)-real(z)
		db, dt := imag(z)-imag(work.Lo), imag(work.Hi)-imag(z)
		switch math.Min(math.Min(dl, dr), math.Min(db, dt)) {
		case dl:
			work.Lo -= complex(d, 0)
		case dr:
			work.Hi += complex(d, 0)
		case db:
			work.Lo -= complex(0, d)
		default:
			work.Hi += complex(0, d)
		}
		if fail.kind != failNaN {
			f.warnf("zero or pole of q on the box boundary near %s: boundary moved outward by %.2g", fmtZ(z), d)
		}
	}
	return nil, fmt.Errorf("turning: cannot place the box boundary clear of zeros and poles of q")
}

// search processes the subdivision tree from root.
func (f *finder) search(root *cell) {
	defer func() {
		if r := recover(); r != nil {
			if _, ok := r.(evalLimitPanic); !ok {
				panic(r)
			}
			f.setStatus(EvalLimit)
			f.warnf("evaluation limit %d reached: the search is incomplete", f.set.MaxEvals)
		}
	}()
	stack := []*cell{root}
	for len(stack) > 0 {
		c := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if c.empty() {
			continue
		}
		if zeta, ok := c.single(); ok {
			if pts, ok := f.resolve(c, c.c+complex(c.h, 0)*zeta); ok {
				f.points = append(f.points, pts...)
				continue
			}
		}
		stack = append(stack, f.split(c)...)
	}
}

// split bisects c across its longer side and returns the children, or
// handles a cell that cannot be split.
func (f *finder) split(c *cell) []*cell {
	if c.depth >= f.set.MaxDepth {
		f.unresolved(c)
		return nil
	}
	wide := real(c.hi-c.lo) >= imag(c.hi-c.lo)
	var lastFail *sideFail
	for _, fr := range splitFracs {
		var alo, ahi, blo, bhi complex128
		if wide {
			x := real(c.lo) + fr*real(c.hi-c.lo)
			alo, ahi = c.lo, complex(x, imag(c.hi))
			blo, bhi = complex(x, imag(c.lo)), c.hi
		} else {
			y := imag(c.lo) + fr*imag(c.hi-c.lo)
			alo, ahi = c.lo, complex(real(c.hi), y)
			blo, bhi = complex(real(c.lo), y), c.hi
		}
		a, fail := f.newCell(alo, ahi, c.depth+1)
		if fail == nil {
			var b *cell
			b, fail = f.newCell(blo, bhi, c.depth+1)
			if fail == nil {
				if a.w+b.w != c.w {
					f.mismatch++
					f.warnf("cell %v: windings of the halves %d + %d differ from %d", c, a.w, b.w, c.w)
				}
				return []*cell{a, b}
			}
		}
		lastFail = fail
		if fail.kind == failJump {
			f.setStatus(NotMeromorphic)
			f.warnf("q jumps near %s: not meromorphic (branch cut?), cell %v not searched", fmtZ(fail.z), c)
			return nil
		}
	}
	f.setStatus(DepthLimit)
	f.warnf("cell %v not searched: every cut meets a zero, pole or singularity of q (last near %s)", c, fmtZ(lastFail.z))
	return nil
}

// unresolved reports a cell at the depth limit. If its moments say it holds
// a net order, the centroid is reported with the cell size as error.
func (f *finder) unresolved(c *cell) {
	f.setStatus(DepthLimit)
	f.warnf("cell %v not resolved at depth %d (winding %d)", c, c.depth, c.w)
	if c.w == 0 {
		return
	}
	z := c.c + complex(c.h, 0)*c.t[1]/complex(float64(c.w), 0)
	p := Point{Z: z, Order: c.w, Err: 2 * c.h}
	f.setResidual(&p)
	f.points = append(f.points, p)
}

// setResidual sets |Q(Z)| for a zero, |1/Q(Z)| for a pole.
func (f *finder) setResidual(p *Point) {
	v := f.eval(p.Z)
	switch {
	case p.Order > 0:
		p.Residual = cmplx.Abs(v)
	case isFinite(v):
		p.Residual = 1 / cmplx.Abs(v)
	default:
		p.Residual = 0 // Q overflows: Z is the pole to rounding
	}
}

func fmtZ(z complex128) string {
	return fmt.Sprintf("%.6g%+.6gi", real(z), imag(z))
}

// sortPoints orders points: those on the real axis (|Im z| ≤ realTol) first
// by real part, then the others by imaginary, then real part. Imaginary
// parts that agree within the error estimates (a point and its mirror image)
// count as equal, so that such points are ordered by real part.
func sortPoints(p []Point, realTol float64) {
	onAxis := func(z complex128) bool { return math.Abs(imag(z)) <= realTol }
	sort.SliceStable(p, func(i, j int) bool {
		ri, rj := onAxis(p[i].Z), onAxis(p[j].Z)
		if ri != rj {
			return ri
		}
		if !ri {
			yi, yj := imag(p[i].Z), imag(p[j].Z)
			if math.Abs(yi-yj) > 10*(p[i].Err+p[j].Err)+realTol {
				return yi < yj
			}
		}
		return real(p[i].Z) < real(p[j].Z)
	})
}
