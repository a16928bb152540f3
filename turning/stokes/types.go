package stokes

import (
	"fmt"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Convention names the meaning of the two families of lines, for output.
const Convention = "Stokes line: Re w = 0 (one wave maximally dominant); anti-Stokes line: Im w = 0 (waves of equal size); w = ∫_t^x sqrt(Q) dx"

// Family is the kind of a line: Stokes (Re w = 0) or anti-Stokes (Im w = 0).
type Family int

const (
	Stokes     Family = iota // Re w = 0: one wave maximally dominant
	AntiStokes               // Im w = 0: both waves of equal size
)

// String returns "Stokes" or "anti-Stokes".
func (f Family) String() string {
	switch f {
	case Stokes:
		return "Stokes"
	case AntiStokes:
		return "anti-Stokes"
	}
	return fmt.Sprintf("Family(%d)", int(f))
}

// EndKind says why the tracing of a line stopped.
type EndKind int

const (
	EndTurningPoint EndKind = iota // reached another turning point (Line.To)
	EndPole                        // reached a pole of Q (Line.To)
	EndBox                         // left the box; the last point lies on its edge
	EndLimit                       // the length or step budget was spent
	EndFailed                      // the step size fell below Settings.MinStep
)

var endNames = [...]string{"turning point", "pole", "box", "limit", "failed"}

// String returns a short label of the end.
func (e EndKind) String() string {
	if e < 0 || int(e) >= len(endNames) {
		return fmt.Sprintf("EndKind(%d)", int(e))
	}
	return endNames[e]
}

// Line is one traced Stokes or anti-Stokes line. It is traced on the
// branch of √Q for which w grows along it: on a Stokes line w = i|w|, with
// |w| increasing away from the turning point, so that exp(iλw) is the wave
// that decays along the line (subdominant) and exp(−iλw) the one that grows
// (dominant); on an anti-Stokes line w = |w| > 0, real and increasing.
type Line struct {
	Family     Family
	From       int          // index into Geometry.Points of the point it leaves
	Path       []complex128 // the curve, starting at Points[From].Z
	End        EndKind
	To         int     // index into Points where it ends, -1 if none
	StartAngle float64 // direction in which it leaves Points[From], radians in (-π, π]
	// W[k] is w = ∫ √Q from Points[From] to Path[k], continued along the
	// line (W[0] = 0); at a pole of order ≥ 2, where w diverges, the last
	// entry is complex infinity.
	W []complex128
	// EndW is w at the end of the line; for a line into a pole of order
	// ≥ 2, at the last traced point before it.
	EndW complex128
	// WErr estimates the error of W: the sum over the steps of the
	// step-doubling corrections |w₂ − w₁|/15 (the error of the result
	// before local extrapolation, an upper estimate of that after it) and
	// of a few rounding units of |w| per step, plus the quadrature
	// estimates of the first and last pieces.
	WErr   float64
	Length float64 // arc length traced
	Steps  int     // accepted steps
	// Drift is the largest |Re w| (Stokes) or |Im w| (anti-Stokes) found
	// after a step before its Newton correction: a computed measure of how
	// well the path stays on the line.
	Drift float64
}

// Degeneracy is a Stokes line that runs from one turning point into
// another. Gap is ∫_{From}^{To} √Q along that line; its sign follows the
// branch of √Q the line was traced on. |Re Gap| ≤ Settings.Degenerate·|Gap|
// by construction: a Re Gap larger than Err marks a near-degeneracy (the
// exact line passes the point at a distance of order |Re Gap|^(2/3)),
// where uniform connection formulae are needed just the same.
type Degeneracy struct {
	From, To int
	Gap      complex128
	// Err estimates the error of Gap: the difference between w continued
	// along the line by the tracer and a tanh-sinh quadrature of √Q along
	// the polygon of the traced path, plus that quadrature's own estimate.
	Err float64
}

// Geometry is the traced Stokes geometry in a box.
type Geometry struct {
	Points       []turning.Point
	Box          turning.Box
	Lines        []Line
	Degeneracies []Degeneracy
	// Cuts are the branch cuts of √Q: from each zero or pole of odd order,
	// the anti-Stokes line leaving it nearest to the direction away from
	// the real axis (up for Im Z > 0, down otherwise), or the straight ray
	// in that direction; a cut may join two odd points (see the rule in
	// cuts.go). CutFrom[i] is the point Cuts[i] starts from.
	Cuts     [][]complex128
	CutFrom  []int
	Warnings []string

	q jet.Func // the Q traced, for AxisCrossings
}

// Settings controls the tracing. A nil *Settings, or a zero field, means
// the default given with each field; lengths are relative to the diagonal D
// of the box.
type Settings struct {
	// Tol is the local error allowed per Runge–Kutta step, relative to D.
	// Default 1e-9.
	Tol float64
	// MaxStep is the largest step, relative to D. Default 1/100.
	MaxStep float64
	// MinStep is the smallest step, relative to D, below which a line ends
	// with EndFailed. Default 1e-12.
	MinStep float64
	// StepFraction bounds the step by this fraction of the distance to the
	// nearest turning point or pole, so that no line jumps over one.
	// Default 0.25.
	StepFraction float64
	// Start is the distance from its turning point at which a line starts,
	// relative to D; it is reduced to a twentieth of the distance to the
	// nearest other point when that is smaller, and raised to four times
	// the point's position error Point.Err when that is larger. The start
	// is exact whatever its size: w there comes from quadrature and a
	// Newton correction puts it on the line. Default 1e-4.
	Start float64
	// Capture is the radius, relative to D, within which a line is taken to
	// reach a point; it is reduced to a quarter of the distance from that
	// point to its nearest neighbour (but kept at least twice the point's
	// start distance). A line entering it ends at a pole of order ≥ 2; at a
	// zero or simple pole only if the point lies on the line's level (see
	// Degenerate), and otherwise passes by. Default 1e-2.
	Capture float64
	// Degenerate is the relative size |Re w(t)|/|w(t)| (Stokes) or
	// |Im w(t)|/|w(t)| (anti-Stokes), w continued along the line to the
	// point t, below which (plus the quadrature error of that last piece) a
	// line that comes within the capture radius of t is taken to end there.
	// Default 1e-5.
	Degenerate float64
	// MaxLength is the longest line, relative to D. Default 10.
	MaxLength float64
	// MaxSteps is the step budget per line. Default 20000.
	MaxSteps int
}

func (s *Settings) withDefaults() Settings {
	var r Settings
	if s != nil {
		r = *s
	}
	def := func(v *float64, d float64) {
		if !(*v > 0) {
			*v = d
		}
	}
	def(&r.Tol, 1e-9)
	def(&r.MaxStep, 1e-2)
	def(&r.MinStep, 1e-12)
	def(&r.StepFraction, 0.25)
	def(&r.Start, 1e-4)
	def(&r.Capture, 1e-2)
	def(&r.Degenerate, 1e-5)
	def(&r.MaxLength, 10)
	if r.MaxSteps <= 0 {
		r.MaxSteps = 20000
	}
	return r
}
