package wkb

import (
	"errors"
	"fmt"
)

// Status reports how a phase-integral computation ended. The zero value,
// Success, means that every requested term converged to tolerance and the
// asymptotic series was still decreasing at its last term.
type Status int

const (
	// Success: the quadrature converged and the terms decreased up to the
	// highest order computed, so the least term is the last one and the true
	// least term may lie beyond MaxOrder.
	Success Status = iota
	// LeastTerm: the asymptotic series reached its least term before the
	// highest order computed; the sum is optimally truncated there.
	LeastTerm
	// NodeLimit: the trapezoid rule did not reach the tolerance within
	// MaxNodes; the figures carry the last change as their quadrature error.
	NodeLimit
	// ContourMismatch: two contours of different size gave results differing
	// by more than the tolerance, a sign of a zero or pole of Q between them
	// that the caller did not pass in Others.
	ContourMismatch
)

var statusNames = [...]string{"success", "least term reached", "node limit", "contour mismatch"}

// String returns a short lower-case description of s.
func (s Status) String() string {
	if s < 0 || int(s) >= len(statusNames) {
		return fmt.Sprintf("Status(%d)", int(s))
	}
	return statusNames[s]
}

// Err returns nil for Success and LeastTerm (both are normal ends of an
// asymptotic series) and an error naming the status otherwise.
func (s Status) Err() error {
	switch s {
	case Success, LeastTerm:
		return nil
	case NodeLimit:
		return ErrNodeLimit
	case ContourMismatch:
		return ErrContourMismatch
	}
	return fmt.Errorf("wkb: unknown status %d", int(s))
}

// ErrNodeLimit is the error of a contour quadrature that did not converge
// within the allowed number of nodes.
var ErrNodeLimit = errors.New("wkb: contour quadrature did not converge within the node limit")

// ErrContourMismatch is the error of a phase integral whose value depends on
// the size of the contour: a singularity of Q lies near the turning points.
var ErrContourMismatch = errors.New("wkb: phase integral depends on the contour size")

// QuadratureError is returned when a contour quadrature cannot be carried
// out at all, carrying the last change between node doublings and the number
// of nodes used.
type QuadratureError struct {
	Reason string  // what went wrong
	Change float64 // last change between two node counts (NaN if none)
	Nodes  int     // nodes of the last attempt
}

func (e *QuadratureError) Error() string {
	return fmt.Sprintf("wkb: %s (last change %.3g with %d nodes)", e.Reason, e.Change, e.Nodes)
}
