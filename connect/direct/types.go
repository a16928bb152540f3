package direct

import "fmt"

// MethodChoice selects the integration method of Scatter.
type MethodChoice int

const (
	// Auto uses ComplexPath when no zero or pole of λ²Q + Q1 lies on or
	// near the real interval and RealAxis otherwise.
	Auto MethodChoice = iota
	// RealAxis integrates y″ = −(λ²Q + Q1) y along the real axis.
	RealAxis
	// ComplexPath integrates the reflection Riccati equation along a path
	// raised into the upper half plane.
	ComplexPath
)

var methodNames = [...]string{"auto", "real-axis", "complex-path"}

// String returns the name used in reports.
func (m MethodChoice) String() string {
	if m < 0 || int(m) >= len(methodNames) {
		return fmt.Sprintf("MethodChoice(%d)", int(m))
	}
	return methodNames[m]
}

// Settings tunes Scatter. A nil *Settings means all defaults; a zero field
// means the default of that field.
type Settings struct {
	// Tol is the relative local error allowed per step of the coarser of the
	// two integrations (the finer one uses Tol/1000, at least 1e-15).
	// Default 1e-12.
	Tol float64
	// Height is the height of the raised part of the ComplexPath contour.
	// Zero means automatic (see the package documentation); a positive
	// value is used as given. The error check reruns on a lower path
	// (0.75 of the height, or less far below near the resolution limit).
	Height float64
	// Singularities are zeros and poles of λ²Q + Q1 known to the caller
	// (for Q1 = 0 those of Q). When given they replace the scan along the
	// real axis; only points with non-negative imaginary part matter, and
	// one on the interval selects RealAxis under Auto.
	Singularities []complex128
	// MaxSteps bounds the number of Taylor steps of one integration.
	// Default 2,000,000.
	MaxSteps int
	// Method selects the method; the zero value is Auto.
	Method MethodChoice
}

// Result is the outcome of Scatter.
type Result struct {
	R, T        float64    // reflection and transmission coefficients |r|², |t|²
	LogT        float64    // ln T, finite also where T underflows (deep tunnelling)
	Refl, Trans complex128 // amplitudes r and t in the end-wave convention of the package
	ErrR, ErrT  float64    // error estimates of R and T
	// ErrRefl and ErrTrans estimate the errors of the amplitudes.
	ErrRefl, ErrTrans float64
	Unitarity         float64 // |R + T − 1|, a check for real Q
	Method            string  // "real-axis" or "complex-path"
	Height            float64 // height of the raised path (0 for real-axis)
	Steps             int     // Taylor steps and WKB jumps of all integrations (height search included)
	EndOrder          int     // number of correction terms p_2m kept in the end waves
	EndErr            float64 // contribution of the truncated end waves to ErrRefl
	Status            Status
}

// Status reports how Scatter ended.
type Status int

const (
	// Converged means both integrations completed and the error estimates
	// of R and T are below √Tol relative to R and T.
	Converged Status = iota
	// Inaccurate means both integrations completed but an error estimate
	// exceeds that (typically a tiny R on the real axis); the numbers and
	// their error estimates are still returned.
	Inaccurate
	// StepLimit means an integration needed more than MaxSteps steps.
	StepLimit
	// StepUnderflow means the step size collapsed, typically at a
	// singularity of Q on the path.
	StepUnderflow
	// NonFinite means the solution overflowed or became NaN.
	NonFinite
)

var statusNames = [...]string{"converged", "inaccurate", "step limit", "step underflow", "non-finite"}

// String returns the name of the status.
func (s Status) String() string {
	if s < 0 || int(s) >= len(statusNames) {
		return fmt.Sprintf("Status(%d)", int(s))
	}
	return statusNames[s]
}
