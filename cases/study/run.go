package study

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"path/filepath"
	"runtime"
	"sort"
	"strings"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/connect"
	"github.com/turnpoint/turnpoint/connect/direct"
	"github.com/turnpoint/turnpoint/connect/eigen"
	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/turning/stokes"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
	"github.com/turnpoint/turnpoint/wkb/levels"
)

// Study selects what Run computes.
type Study uint

// The studies; All is every study the case file lists.
const (
	Points     Study = 1 << iota // turning points and singularities
	Geometry                     // Stokes and anti-Stokes lines
	Scattering                   // the [scan] table
	Levels                       // the [levels] table
	All        = Points | Geometry | Scattering | Levels
)

// Options says how to run. A nil *Options means the defaults.
type Options struct {
	Workers   int                   // parallel scan points; 0 means runtime.NumCPU()
	Progress  func(done, total int) // called as scan points finish; nil for none
	FigureDir string                // directory for figures; "" writes none
	FigureExt string                // ".svg" (the default) or ".png"
	LogR      bool                  // logarithmic R axis in the scan figure (default: automatic)
}

func (o *Options) figurePath(name string) string {
	ext := ".svg"
	if o.FigureExt != "" {
		ext = o.FigureExt
	}
	return filepath.Join(o.FigureDir, name+ext)
}

func (o *Options) workers() int {
	if o == nil || o.Workers <= 0 {
		return runtime.NumCPU()
	}
	return o.Workers
}

// Assumptions printed with every report: what the figures rest on.
var assumptions = []string{
	"WKB figures are asymptotic in 1/lambda; their error estimates are the next (or least) term of the series, not rigorous bounds",
	"numerical figures come from direct integration of the same equation; their error estimates compare two tolerances",
	"Q is taken to be analytic in the search box apart from the poles reported; a branch point of the formula invalidates complex-plane results",
	"results are for validation and design exploration; safety-critical designs need independent validation",
}

// Run runs the selected studies of c. It does not stop at the first failure:
// a study that could not be computed is recorded in Report.Errors.
func Run(c *cases.Case, what Study, opt *Options) *Report {
	a, b := c.Interval()
	rep := &Report{
		Case:       c.Path,
		Title:      c.Title,
		Form:       c.Form.String(),
		Interval:   [2]float64{a, b},
		Convention: stokes.Convention,
		Assumes:    assumptions,
	}
	if p, err := c.Problem(); err == nil {
		rep.Lambda = Number(p.Lambda)
	} else if c.Schrodinger != nil {
		rep.Lambda = Number(1 / c.Schrodinger.Hbar)
	} else {
		rep.Lambda = Number(math.NaN())
	}
	var levelsRep *LevelsReport
	if what&Levels != 0 && c.Levels != nil {
		levelsRep = runLevels(c, opt, rep)
		rep.Levels = levelsRep
	}
	if what&(Points|Geometry) != 0 {
		lv := levelsRep
		if _, err := c.Problem(); err != nil && lv == nil && c.Levels != nil && c.Scan == nil {
			// The geometry of a bound-state case is drawn at its lowest level.
			lv = runLevels(c, nil, &Report{})
		}
		p, at, atWhat, err := geometryProblem(c, lv)
		if err != nil {
			rep.Errors = append(rep.Errors, fmt.Sprintf("turning points: %v", err))
		} else {
			pts, res := findPoints(p, c.SearchBox())
			pts.At, pts.AtWhat = at, atWhat
			for _, z := range q1Singularities(p, c.SearchBox()) {
				pts.Q1Poles = append(pts.Q1Poles, C(z))
			}
			rep.Points = pts
			if what&Geometry != 0 && res != nil {
				rep.Stokes = traceGeometry(c, p, res, opt, rep)
			}
		}
	}
	if what&Scattering != 0 && c.Scan != nil {
		rep.Scan = runScan(c, opt, rep)
	}
	if what == All {
		runChecks(c, rep, opt)
	}
	rep.Summary = summarise(rep)
	return rep
}

// geometryProblem picks the problem whose turning points are reported: the
// file's base values, else the middle of the scan, else the lowest level.
func geometryProblem(c *cases.Case, lv *LevelsReport) (wkb.Problem, *float64, string, error) {
	p, err := c.Problem()
	if err == nil {
		return p, nil, "", nil
	}
	if c.Scan != nil {
		vals := c.Scan.Values()
		v := vals[len(vals)/2]
		p, err2 := c.ProblemAt(v)
		if err2 == nil {
			return p, &v, fmt.Sprintf("the middle of the scan, %s", c.ScanLabel()), nil
		}
	}
	if lv != nil && c.Schrodinger != nil {
		for _, r := range lv.Rows {
			e := float64(r.WKB)
			if math.IsNaN(e) {
				e = float64(r.Numeric)
			}
			if math.IsNaN(e) {
				continue
			}
			w, err := c.Well()
			if err != nil {
				return wkb.Problem{}, nil, "", err
			}
			return w.Problem(e), &e, fmt.Sprintf("the energy of level n = %d, E", r.N), nil
		}
	}
	return wkb.Problem{}, nil, "", err
}

func findPoints(p wkb.Problem, box turning.Box) (*PointsReport, *turning.Result) {
	rep := &PointsReport{Box: [2]Complex{C(box.Lo), C(box.Hi)}}
	res, err := turning.Find(p.Q, box, nil)
	if err != nil {
		rep.Status = "failed"
		rep.Warnings = append(rep.Warnings, err.Error())
		return rep, nil
	}
	for _, pt := range res.Points {
		rep.Points = append(rep.Points, PointEntry{
			Z: C(pt.Z), Order: pt.Order, Kind: pt.Kind.String(),
			Residual: Number(pt.Residual), Err: Number(pt.Err),
		})
	}
	rep.Winding, rep.Zeros, rep.Poles = res.Winding, res.Zeros, res.Poles
	rep.Status = res.Status.String()
	rep.Complete = res.Status == turning.Complete
	rep.Warnings = append(rep.Warnings, res.Warnings...)
	return rep, res
}

func traceGeometry(c *cases.Case, p wkb.Problem, res *turning.Result, opt *Options, rep *Report) *StokesReport {
	g, err := stokes.Trace(p.Q, res.Points, res.Box, nil)
	if err != nil {
		rep.Errors = append(rep.Errors, fmt.Sprintf("stokes geometry: %v", err))
		return nil
	}
	sr := &StokesReport{Warnings: g.Warnings}
	for _, l := range g.Lines {
		e := LineEntry{Family: l.Family.String(), From: l.From, EndsOn: l.End.String(), To: l.To,
			StartAngle: Number(l.StartAngle * 180 / math.Pi), Samples: len(l.Path)}
		if len(l.Path) > 0 {
			e.Start, e.End = C(l.Path[0]), C(l.Path[len(l.Path)-1])
		}
		sr.Lines = append(sr.Lines, e)
	}
	for _, d := range g.Degeneracies {
		sr.Degeneracies = append(sr.Degeneracies, DegeneracyEntry{From: d.From, To: d.To, Gap: C(d.Gap), GapErr: Number(d.Err)})
	}
	if opt != nil && opt.FigureDir != "" {
		a, b := c.Interval()
		path := opt.figurePath("stokes")
		if err := stokes.Plot(g, stokes.PlotOptions{Title: figureTitle(c, "Stokes geometry"), Interval: [2]float64{a, b}}, path); err != nil {
			rep.Errors = append(rep.Errors, fmt.Sprintf("stokes figure: %v", err))
		} else {
			sr.Figure = path
			rep.Figures = append(rep.Figures, path)
		}
	}
	return sr
}

func figureTitle(c *cases.Case, what string) string {
	if c.Title != "" {
		return c.Title + ": " + what
	}
	return what
}

// scatterAt computes one scan point by WKB and numerically.
func scatterAt(c *cases.Case, v float64, base bool, pc *pointCache) ScanRow {
	row := ScanRow{At: v}
	var p wkb.Problem
	var err error
	if base {
		p, err = c.Problem()
	} else {
		p, err = c.ProblemAt(v)
	}
	if err != nil {
		row.Error = err.Error()
		return row
	}
	a, b := c.Interval()
	res, err := pc.find(p.Q, c.SearchBox(), v, !base)
	var pts []turning.Point
	if err != nil {
		row.Error = fmt.Sprintf("turning points: %v", err)
	} else {
		pts = res.Points
	}
	// The poles of Q1 go to the connection formulae with the points of Q:
	// the contour integrals of the higher orders must not enclose them.
	q1poles := q1Singularities(p, c.SearchBox())
	wkbPts := append([]turning.Point(nil), pts...)
	for _, z := range q1poles {
		wkbPts = append(wkbPts, turning.Point{Z: z, Order: -2, Kind: turning.Pole})
	}
	if w, err := connect.Scatter(p, a, b, wkbPts, &connect.Settings{MaxOrder: scatterOrder}); err != nil {
		row.Error = joinErr(row.Error, fmt.Sprintf("wkb: %v", err))
	} else {
		amp := &Amplitude{R: Number(w.R), T: Number(w.T), ErrR: Number(w.ErrR), ErrT: Number(w.ErrT),
			Refl: C(w.Refl), Trans: C(w.Trans), Method: w.Method, Order: w.Order, Warnings: w.Warnings}
		if w.Dominant != nil {
			d := C(w.Dominant.Z)
			amp.Dominant = &d
		}
		boundQ1Poles(p, q1poles, amp)
		row.WKB = amp
	}
	var sing []complex128
	for _, pt := range pts {
		sing = append(sing, pt.Z)
	}
	// The λ-free term (the Liouville term of p waves, a centrifugal term)
	// has singularities of its own, which the complex path must avoid too.
	sing = append(sing, q1poles...)
	if n, err := direct.Scatter(p, a, b, &direct.Settings{Singularities: sing}); err != nil {
		row.Error = joinErr(row.Error, fmt.Sprintf("numeric: %v", err))
	} else {
		row.Numeric = &Amplitude{R: Number(n.R), T: Number(n.T), ErrR: Number(n.ErrR), ErrT: Number(n.ErrT),
			Refl: C(n.Refl), Trans: C(n.Trans), Method: n.Method, Unitarity: Number(n.Unitarity)}
	}
	if row.WKB != nil && row.Numeric != nil {
		row.R = compare(float64(row.WKB.R), float64(row.WKB.ErrR), float64(row.Numeric.R), float64(row.Numeric.ErrR))
		row.T = compare(float64(row.WKB.T), float64(row.WKB.ErrT), float64(row.Numeric.T), float64(row.Numeric.ErrT))
	}
	return row
}

func joinErr(a, b string) string {
	if a == "" {
		return b
	}
	return a + "; " + b
}

func runScan(c *cases.Case, opt *Options, rep *Report) *ScanReport {
	vals := c.Scan.Values()
	sr := &ScanReport{Over: c.Scan.Over, Label: c.ScanLabel(), Rows: make([]ScanRow, len(vals))}
	pc := &pointCache{} // shared by the rows and the degeneracy scan
	var wg sync.WaitGroup
	jobs := make(chan int)
	var mu sync.Mutex
	done := 0
	for range opt.workers() {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				sr.Rows[i] = scatterAt(c, vals[i], false, pc)
				if opt != nil && opt.Progress != nil {
					mu.Lock()
					done++
					opt.Progress(done, len(vals))
					mu.Unlock()
				}
			}
		}()
	}
	for i := range vals {
		jobs <- i
	}
	close(jobs)
	wg.Wait()
	if len(vals) > 1 {
		family := func(v float64) (jet.Func, []turning.Point, error) {
			p, err := c.ProblemAt(v)
			if err != nil {
				return nil, nil, err
			}
			res, err := pc.find(p.Q, c.SearchBox(), v, true)
			if err != nil {
				return nil, nil, err
			}
			return p.Q, res.Points, nil
		}
		// Sample the scan no more finely than its own points: each sample
		// costs a turning-point search.
		n := min(len(vals)-1, 12)
		crossings, err := stokes.ScanDegeneracy(family, vals[0], vals[len(vals)-1], n)
		switch {
		case errors.Is(err, stokes.ErrEverywhereDegenerate):
			sr.EverywhereDegenerate = true
		case err != nil:
			rep.Warnings = append(rep.Warnings, fmt.Sprintf("degeneracy scan: %v", err))
		}
		for _, x := range crossings {
			// A root where the nearest pair changes identity is a jump of
			// Re Gap, not a zero: keep only true zeros.
			if math.Abs(real(x.Gap)) > 1e-6*cmplx.Abs(x.Gap) {
				continue
			}
			// A conjugate pair of a Q real on the axis is joined through
			// the axis at every value (Schwarz reflection makes Gap purely
			// imaginary): a sign change of Re Gap there is rounding.
			if cmplx.Abs(x.T1-cmplx.Conj(x.T2)) <= 1e-8*cmplx.Abs(x.T1) {
				continue
			}
			sr.Degeneracies = append(sr.Degeneracies, ScanDegeneracy{At: x.P, Err: Number(x.Err), T1: C(x.T1), T2: C(x.T2), Gap: C(x.Gap)})
		}
	}
	if opt != nil && opt.FigureDir != "" {
		path := opt.figurePath("scan")
		if err := plotScan(c, sr, opt.LogR, path); err != nil {
			rep.Errors = append(rep.Errors, fmt.Sprintf("scan figure: %v", err))
		} else {
			rep.Figures = append(rep.Figures, path)
		}
	}
	return sr
}

func runLevels(c *cases.Case, opt *Options, rep *Report) *LevelsReport {
	lr := &LevelsReport{}
	w, err := c.Well()
	if err != nil {
		rep.Errors = append(rep.Errors, fmt.Sprintf("levels: %v", err))
		return lr
	}
	ns := c.Levels.N
	rows := make([]LevelRow, len(ns))
	for i, n := range ns {
		rows[i] = LevelRow{N: n, WKB: Number(math.NaN()), WKBErr: Number(math.NaN()),
			Numeric: Number(math.NaN()), NumErr: Number(math.NaN())}
	}
	set := &levels.Settings{MaxOrder: c.Levels.MaxOrder}
	wl, doublets, err := wkbLevels(w, ns, set)
	if err != nil {
		lr.Warnings = append(lr.Warnings, fmt.Sprintf("wkb: %v", err))
	}
	for _, l := range wl {
		i := sort.SearchInts(ns, l.N)
		if i >= len(ns) || ns[i] != l.N {
			continue
		}
		r := &rows[i]
		r.WKB, r.WKBErr, r.Order, r.Maslov, r.Turning, r.Omega, r.Method = Number(l.E), Number(l.Err), l.Order, l.Maslov, l.Turning, Number(l.Omega), l.Method
		for _, e := range l.ByOrder {
			r.ByOrder = append(r.ByOrder, Number(e))
		}
		r.Warnings = append(r.Warnings, l.Warnings...)
	}
	for i := range rows {
		if math.IsNaN(float64(rows[i].WKB)) {
			rows[i].Error = "no WKB level computed (see the warnings)"
		}
	}
	// A doublet's numerical splitting needs both of its levels.
	numNs := append([]int(nil), ns...)
	for _, d := range doublets {
		numNs = append(numNs, 2*d.N, 2*d.N+1)
	}
	numNs = uniqueSorted(numNs)
	numE := map[int][2]float64{}
	// Level by level, so that a level that fails is known by its own error
	// (the solver's meshes are shared between the calls).
	var nl []eigen.Level
	if sv, err := eigen.NewSolver(w, nil); err != nil {
		lr.Warnings = append(lr.Warnings, fmt.Sprintf("numeric: %v", err))
	} else {
		for _, n := range numNs {
			l, err := sv.Level(n)
			if err != nil {
				lr.Warnings = append(lr.Warnings, fmt.Sprintf("numeric, n = %d: %v", n, err))
				continue
			}
			nl = append(nl, l)
		}
	}
	for _, l := range nl {
		numE[l.N] = [2]float64{l.E, l.Err}
		i := sort.SearchInts(ns, l.N)
		if i >= len(ns) || ns[i] != l.N {
			continue
		}
		rows[i].Numeric, rows[i].NumErr = Number(l.E), Number(l.Err)
		rows[i].Warnings = append(rows[i].Warnings, l.Warnings...)
	}
	for _, d := range doublets {
		row := DoubletRow{N: d.N, Splitting: Number(d.Splitting), SplittingErr: Number(d.SplittingErr),
			Numeric: Number(math.NaN()), NumericErr: Number(math.NaN()), Method: d.Method}
		// The splitting comes from the solver directly: on its mirror-
		// symmetric mesh the two levels share their discretisation error,
		// so their difference is good far below the levels' own accuracy.
		if sp, err := eigen.Split(w, 2*d.N, nil); err == nil {
			row.Numeric, row.NumericErr = Number(sp.Delta), Number(sp.Err)
			row.Verdict = compare(d.Splitting, d.SplittingErr, sp.Delta, sp.Err)
		} else if lo, okLo := numE[2*d.N]; okLo {
			if hi, okHi := numE[2*d.N+1]; okHi {
				row.Numeric, row.NumericErr = Number(hi[0]-lo[0]), Number(hi[1]+lo[1])
				row.Verdict = compare(d.Splitting, d.SplittingErr, hi[0]-lo[0], hi[1]+lo[1])
			}
		}
		lr.Doublets = append(lr.Doublets, row)
	}
	for i := range rows {
		r := &rows[i]
		if !math.IsNaN(float64(r.WKB)) && !math.IsNaN(float64(r.Numeric)) {
			r.Verdict = compare(float64(r.WKB), float64(r.WKBErr), float64(r.Numeric), float64(r.NumErr))
		}
	}
	lr.Rows = rows
	if opt != nil && opt.FigureDir != "" {
		path := opt.figurePath("levels")
		if err := plotLevels(c, w, lr, path); err != nil {
			rep.Errors = append(rep.Errors, fmt.Sprintf("levels figure: %v", err))
		} else {
			lr.Figure = path
			rep.Figures = append(rep.Figures, path)
		}
	}
	return lr
}

func summarise(rep *Report) Summary {
	var s Summary
	count := func(v *Verdict, what string) {
		if v == nil {
			return
		}
		s.Figures++
		if v.Agree {
			s.Agree++
		} else {
			s.Disagree++
			rep.Failures = append(rep.Failures, what+": "+v.Reason)
		}
	}
	if rep.Scan != nil {
		for _, r := range rep.Scan.Rows {
			if r.WKB == nil && r.Numeric == nil {
				s.Missing++
				rep.Failures = append(rep.Failures, fmt.Sprintf("%s = %g: not computed: %s", rep.Scan.Label, r.At, r.Error))
			}
			count(r.R, fmt.Sprintf("R at %s = %g", rep.Scan.Label, r.At))
			count(r.T, fmt.Sprintf("T at %s = %g", rep.Scan.Label, r.At))
		}
	}
	if rep.Levels != nil {
		for _, r := range rep.Levels.Rows {
			if math.IsNaN(float64(r.WKB)) && math.IsNaN(float64(r.Numeric)) {
				s.Missing++
				rep.Failures = append(rep.Failures, fmt.Sprintf("E[%d]: not computed (see the warnings)", r.N))
			}
			count(r.Verdict, fmt.Sprintf("E[%d]", r.N))
		}
		for _, d := range rep.Levels.Doublets {
			count(d.Verdict, fmt.Sprintf("splitting[%d]", d.N))
		}
	}
	for _, ch := range rep.Checks {
		s.Checks++
		if !ch.Pass {
			s.Regressed++
			rep.Failures = append(rep.Failures, ch.Message)
		}
	}
	return s
}

// wkbLevels computes the WKB levels ns of w. A double well is quantised by
// the uniform connection through its barrier, doublet by doublet (doublet d
// holds levels 2d and 2d+1), so that levels are numbered by their node count
// in the whole well as the numerics number them; a single well by
// Bohr–Sommerfeld with its higher orders.
func wkbLevels(w wkb.Well, ns []int, s *levels.Settings) ([]levels.Level, []levels.Doublet, error) {
	var ds []int
	for _, n := range ns {
		ds = append(ds, n/2)
	}
	ds = uniqueSorted(ds)
	doublets, err := levels.Doublets(w, ds, s)
	if err != nil && len(doublets) == 0 && strings.Contains(err.Error(), "single well") {
		wl, err := levels.Solve(w, ns, s)
		return wl, nil, err
	}
	var out []levels.Level
	for _, d := range doublets {
		out = append(out, d.Lower, d.Upper)
	}
	return out, doublets, err
}

func uniqueSorted(xs []int) []int {
	sort.Ints(xs)
	out := xs[:0]
	for i, x := range xs {
		if i == 0 || x != xs[i-1] {
			out = append(out, x)
		}
	}
	return out
}

// scatterOrder is the WKB order of the scattering figures: the barrier
// integrals θ and the connection phases to order 4 in 1/λ, each truncated
// earlier at its least term.
const scatterOrder = 4

// q1Singularities returns the poles of the λ-free term Q1 in the box.
func q1Singularities(p wkb.Problem, box turning.Box) []complex128 {
	if p.Q1 == nil {
		return nil
	}
	res, err := turning.Find(p.Q1, box, nil)
	if err != nil {
		return nil
	}
	var out []complex128
	for _, pt := range res.Points {
		if pt.Order < 0 {
			out = append(out, pt.Z)
		}
	}
	return out
}

// boundQ1Poles widens the WKB error estimates by the reflection the poles of
// Q1 could cause. No connection formula here treats them (for p waves they
// are the ε = 0 points, where λ²Q + Q1 has zeros of its own a distance ≈ 1/λ
// away); a singularity at height Im p over the axis reflects with
// |r| ≈ c·exp(−2λ|Im ∫_{Re p}^{p} √Q|), and with the prefactor c unknown the
// bound takes c = 2, the Stokes multiplier's modulus doubled (a rule of
// thumb, stated in the warning).
func boundQ1Poles(p wkb.Problem, poles []complex128, amp *Amplitude) {
	worst := 0.0
	var at complex128
	for _, z := range poles {
		s, ok := verticalPhase(p.Q, z)
		if !ok {
			continue
		}
		if dr := 2 * math.Exp(-2*p.Lambda*s); dr > worst {
			worst, at = dr, z
		}
	}
	if worst == 0 {
		return
	}
	r := math.Sqrt(math.Max(float64(amp.R), 0))
	bound := 2*r*worst + worst*worst
	if bound < 1e-3*float64(amp.ErrR) {
		return
	}
	amp.ErrR = Number(float64(amp.ErrR) + bound)
	amp.ErrT = Number(float64(amp.ErrT) + bound)
	amp.Warnings = append(amp.Warnings, fmt.Sprintf(
		"the pole of Q1 at %.4g%+.4gi (for p waves a point where ε = 0) is not treated by the connection formulae: its reflection, bounded by 2·exp(−2λ Im∫√Q) = %.2g in |r| (a rule of thumb), is added to the error estimates",
		real(at), imag(at), worst))
}

// verticalPhase returns |Im ∫ √Q dz| from the real axis straight up (or
// down) to z, by 32-point Gauss–Legendre on the segment, the root continued
// from the principal one on the axis; ok is false when Q vanishes on the way.
func verticalPhase(q jet.Func, z complex128) (float64, bool) {
	x0 := complex(real(z), 0)
	h := z - x0
	if h == 0 {
		return 0, false
	}
	xs, ws := gaussLegendre32()
	var sum complex128
	prev := cmplx.Sqrt(q.Eval(x0))
	for i := range xs {
		t := 0.5 * (xs[i] + 1)
		v := q.Eval(x0 + complex(t, 0)*h)
		if v == 0 || cmplx.IsNaN(v) || cmplx.IsInf(v) {
			return 0, false
		}
		root := cmplx.Sqrt(v)
		if cmplx.Abs(root-prev) > cmplx.Abs(root+prev) {
			root = -root // continue the branch along the segment
		}
		prev = root
		sum += complex(0.5*ws[i], 0) * root
	}
	return math.Abs(imag(sum * h)), true
}

// gaussLegendre32 returns the nodes (ascending) and weights of the 32-point
// Gauss–Legendre rule on [−1, 1], from gonum's fixed-location rule.
func gaussLegendre32() ([]float64, []float64) {
	xs := make([]float64, 32)
	ws := make([]float64, 32)
	quad.Legendre{}.FixedLocations(xs, ws, -1, 1)
	return xs, ws
}

// pointCache remembers the turning-point searches of a scan by scan value,
// so that the degeneracy scan, which samples the same values when the scan
// has at most 13 points, does not search again. A nil cache finds afresh.
type pointCache struct {
	mu  sync.Mutex
	at  []float64
	res []*turning.Result
}

// find returns the zeros and poles of q in box at scan value v, from the
// cache when a search within 1e-12 relative of v was done (and keep says
// the value is a scan value rather than the file's base values).
func (pc *pointCache) find(q jet.Func, box turning.Box, v float64, keep bool) (*turning.Result, error) {
	if pc == nil || !keep {
		return turning.Find(q, box, nil)
	}
	pc.mu.Lock()
	for i, x := range pc.at {
		if math.Abs(x-v) <= 1e-12*math.Max(1, math.Abs(v)) {
			r := pc.res[i]
			pc.mu.Unlock()
			return r, nil
		}
	}
	pc.mu.Unlock()
	res, err := turning.Find(q, box, nil)
	if err != nil {
		return nil, err
	}
	pc.mu.Lock()
	pc.at = append(pc.at, v)
	pc.res = append(pc.res, res)
	pc.mu.Unlock()
	return res, nil
}
