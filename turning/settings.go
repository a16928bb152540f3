package turning

import (
	"errors"
	"fmt"
	"math"
)

// Settings controls Find. A nil *Settings selects every default; so does a
// zero field. Lengths are relative to the box scale L, the longer side of
// the search box, unless stated otherwise.
type Settings struct {
	// MaxDepth bounds the subdivision: a cell is bisected (across its longer
	// side) at most MaxDepth times, so the smallest cell has sides of about
	// L·2^(−MaxDepth/2). Default 50.
	MaxDepth int
	// Tol is the Newton stopping tolerance on a step, relative to L.
	// Default 1e-13.
	Tol float64
	// CoalesceRadius is the absolute distance below which two zeros are
	// classified Coalescing (each keeps its own Point). Default 1e-3·L;
	// a negative value turns the pairing off (zeros of order ≥ 2 are still
	// Coalescing).
	CoalesceRadius float64
	// MaxEvals bounds the number of evaluations of Q (Eval and Taylor calls
	// together); on reaching it Find stops with status EvalLimit.
	// Default 2,000,000.
	MaxEvals int
	// RealTol: a zero or pole with |Im z| ≤ RealTol·L (or within ten times its
	// error estimate) is moved onto the real axis when Q is real there and a
	// real Newton iteration converges. Default 1e-9.
	RealTol float64
}

// Defaults of Settings.
const (
	DefaultMaxDepth     = 50
	DefaultTol          = 1e-13
	DefaultCoalesceRel  = 1e-3
	DefaultMaxEvals     = 2000000
	DefaultRealTol      = 1e-9
	defaultMaxDepthHard = 200
)

// resolved returns the settings with defaults filled in, scale being L.
func (s *Settings) resolved(scale float64) (Settings, error) {
	var r Settings
	if s != nil {
		r = *s
	}
	if r.MaxDepth < 0 || r.MaxDepth > defaultMaxDepthHard {
		return r, fmt.Errorf("turning: max depth %d outside [0, %d]", r.MaxDepth, defaultMaxDepthHard)
	}
	if r.MaxEvals < 0 {
		return r, fmt.Errorf("turning: negative evaluation limit %d", r.MaxEvals)
	}
	for _, v := range []float64{r.Tol, r.CoalesceRadius, r.RealTol} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return r, errors.New("turning: settings contain a non-finite tolerance")
		}
	}
	if r.Tol < 0 || r.RealTol < 0 {
		return r, errors.New("turning: negative tolerance")
	}
	if r.MaxDepth == 0 {
		r.MaxDepth = DefaultMaxDepth
	}
	if r.Tol == 0 {
		r.Tol = DefaultTol
	}
	if r.CoalesceRadius == 0 {
		r.CoalesceRadius = DefaultCoalesceRel * scale
	}
	if r.MaxEvals == 0 {
		r.MaxEvals = DefaultMaxEvals
	}
	if r.RealTol == 0 {
		r.RealTol = DefaultRealTol
	}
	return r, nil
}

// Status says how far Find got.
type Status int

const (
	// Complete: the search finished and the reported orders add up to the
	// winding number of Q along the box boundary (Result.Balanced).
	Complete Status = iota
	// CountMismatch: the search finished but the reported orders do not add
	// up to the boundary winding; a warning gives both numbers.
	CountMismatch
	// DepthLimit: some cell could not be resolved within MaxDepth bisections;
	// the warnings name the cells.
	DepthLimit
	// EvalLimit: the evaluation budget MaxEvals ran out; the points found so
	// far are reported.
	EvalLimit
	// NotMeromorphic: Q jumps somewhere (a branch cut of a square root or
	// logarithm in its formula), so the argument principle does not apply;
	// the warnings say where.
	NotMeromorphic
)

var statusNames = [...]string{"complete", "count mismatch", "depth limit", "evaluation limit", "not meromorphic"}

// String returns the status as used in reports.
func (s Status) String() string {
	if s < 0 || int(s) >= len(statusNames) {
		return fmt.Sprintf("Status(%d)", int(s))
	}
	return statusNames[s]
}

// Result is the outcome of Find.
type Result struct {
	// Box is the search box as given.
	Box Box
	// Points are the zeros and poles found, sorted: those on the real axis
	// first by real part, then the others by imaginary and then real part.
	Points []Point
	// Winding is the winding number of Q along the box boundary, the number
	// of zeros minus the number of poles inside, counted with multiplicity.
	// When a zero or pole lies on the boundary, the boundary is moved outward
	// past it and the point is reported with a warning. Winding is 0 when the
	// boundary could not be sampled (status NotMeromorphic or EvalLimit with
	// a warning saying so).
	Winding int
	// Zeros and Poles are the total orders of the reported zeros and poles
	// (multiplicities added).
	Zeros, Poles int
	// Balanced reports whether Zeros − Poles equals Winding (false also when
	// the boundary could not be sampled); when it does not, a warning says so.
	Balanced bool
	// Status says whether the search is complete.
	Status Status
	// Warnings explain every status other than Complete and note points on
	// the box boundary.
	Warnings []string
	// Evals is the number of evaluations of Q (Eval and Taylor calls).
	Evals int
}
