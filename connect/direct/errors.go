package direct

import (
	"errors"
	"fmt"
)

// ErrInput is wrapped by every error caused by an invalid problem or
// interval (check with errors.Is).
var ErrInput = errors.New("invalid scattering problem")

func inputError(format string, args ...any) error {
	return fmt.Errorf("direct: %s: %w", fmt.Sprintf(format, args...), ErrInput)
}

// ConvergenceError reports an integration that did not complete.
type ConvergenceError struct {
	Status   Status     // StepLimit, StepUnderflow or NonFinite
	Method   string     // method that failed
	Steps    int        // steps taken when it stopped
	At       complex128 // point of the path where it stopped
	Residual float64    // last local error estimate relative to the solution
}

// Error describes the failure.
func (e *ConvergenceError) Error() string {
	return fmt.Sprintf("direct: %s integration stopped (%v) at %v after %d steps, local error %.3g",
		e.Method, e.Status, e.At, e.Steps, e.Residual)
}
