package eigen

import (
	"errors"
	"fmt"
)

// Settings control a computation. A nil *Settings means all defaults; a zero
// field means the default of that field.
type Settings struct {
	// Tol is the relative accuracy sought for each energy, relative to
	// max(|E|, |E − min V|). Default 1e-12.
	Tol float64
	// MaxIter is the largest number of energy evaluations of the root finder
	// on one mesh. Default 200.
	MaxIter int
	// MaxRefine is the largest number of mesh halvings after the base mesh.
	// Default 6 (seven meshes); fewer (but at least 2) where the finest mesh
	// would exceed 4M cells.
	MaxRefine int
	// Step scales the base mesh: a cell is Step times the local length scale
	// of the potential, min(|q′|^(-1/3), |q″|^(-1/4), |q‴|^(-1/5)) with
	// q = 2mV/ħ². Default 0.5.
	Step float64
	// MaxCells bounds the number of cells of the base mesh. Default 200000.
	MaxCells int
}

func (s *Settings) withDefaults() Settings {
	var r Settings
	if s != nil {
		r = *s
	}
	if r.Tol <= 0 {
		r.Tol = 1e-12
	}
	if r.MaxIter <= 0 {
		r.MaxIter = 200
	}
	if r.MaxRefine <= 0 {
		r.MaxRefine = 6
	}
	if r.Step <= 0 {
		r.Step = 0.5
	}
	if r.MaxCells <= 0 {
		r.MaxCells = 200000
	}
	return r
}

// Status says how a level computation ended.
type Status int

const (
	// Converged: the Richardson error estimate met the tolerance.
	Converged Status = iota
	// RefineLimit: the finest mesh allowed was reached before the error
	// estimate met the tolerance; E and Err are still the best available.
	RefineLimit
	// IntervalShort: an open end is too close to the turning point, or is
	// classically allowed, so that the truncation of the interval may spoil
	// the tolerance; the interval must be widened.
	IntervalShort
	// RootFailure: the root finder did not converge on some mesh.
	RootFailure
	// NearDegenerate: on a mesh that is not mirror-symmetric another level
	// lies within the discretisation error, so that the extrapolation is not
	// trusted; Err is at least the change of E over the last halving.
	NearDegenerate
)

var statusNames = [...]string{
	Converged:      "converged",
	RefineLimit:    "mesh refinement limit reached",
	IntervalShort:  "interval too short at an open end",
	RootFailure:    "root finder did not converge",
	NearDegenerate: "near-degenerate level on an asymmetric mesh",
}

// String returns a short description of the status.
func (s Status) String() string {
	if s < 0 || int(s) >= len(statusNames) {
		return fmt.Sprintf("status(%d)", int(s))
	}
	return statusNames[s]
}

// Level is one bound state.
type Level struct {
	N          int      // quantum number asked for
	E          float64  // energy, Richardson-extrapolated over the meshes
	Err        float64  // error estimate: smallest change among the Richardson extrapolants (at least the rounding of the angles) plus the effect of the end condition at open ends
	Nodes      int      // interior nodes of the eigenfunction by the Prüfer count on the finest mesh
	Iterations int      // number of shooting sweeps (energy evaluations) over all meshes
	Meshes     int      // number of meshes used
	Cells      int      // cells of the finest mesh
	Decay      float64  // largest decay factor exp(−∫√(2m(V−E))/ħ) from an outer turning point to an open end; 0 if both ends are walls
	Status     Status   // how the computation ended
	Warnings   []string // human-readable remarks (interval too short, counting anomalies)
}

// ErrNotConverged is wrapped by every ConvergenceError.
var ErrNotConverged = errors.New("eigen: not converged")

// ConvergenceError reports a level whose computation did not meet the
// tolerance: the estimate reached, and the work spent.
type ConvergenceError struct {
	N          int
	E, Err     float64 // best energy and its error estimate
	Tol        float64 // the absolute tolerance that was sought
	Iterations int
	Status     Status
}

// Error returns the message, with the estimate and the work spent.
func (e *ConvergenceError) Error() string {
	return fmt.Sprintf("eigen: level %d not converged (%v): E = %.17g, error estimate %.3g > tolerance %.3g after %d sweeps",
		e.N, e.Status, e.E, e.Err, e.Tol, e.Iterations)
}

// Unwrap returns ErrNotConverged.
func (e *ConvergenceError) Unwrap() error { return ErrNotConverged }
