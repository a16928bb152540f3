package stokes

import (
	"math"
	"math/cmplx"
	"sort"
)

// AxisCrossing is a point where a traced line crosses the real axis.
type AxisCrossing struct {
	X      float64    // where it crosses
	W      complex128 // w there, continued along the line
	Line   int        // index into Geometry.Lines
	Family Family
	From   int // the point the line leaves
}

// AxisCrossings returns the points where lines cross the real axis,
// ordered by X: where Stokes lines cross the real interval the WKB
// coefficients of a real problem change (above-barrier reflection is
// carried by the Stokes line from the complex turning point nearest the
// axis). Lines that run along the axis without crossing it are not listed.
// Each crossing is located on the line itself, by Newton's method on
// Re w (Stokes) or Im w (anti-Stokes) along the real axis from the path
// point before it; for a Geometry not made by Trace, by linear
// interpolation between path points.
func (g *Geometry) AxisCrossings() []AxisCrossing {
	var out []AxisCrossing
	for k, ln := range g.Lines {
		last := -1 // last path point off the axis
		for i, z := range ln.Path {
			if imag(z) == 0 {
				continue
			}
			if last >= 0 && imag(ln.Path[last])*imag(z) < 0 {
				c := AxisCrossing{X: real(ln.Path[last+1]), Line: k, Family: ln.Family, From: ln.From, W: cmplx.NaN()}
				if last == i-1 {
					a, b := ln.Path[last], z
					s := imag(a) / (imag(a) - imag(b))
					c.X = real(a) + s*(real(b)-real(a))
					if g.q != nil && len(ln.W) == len(ln.Path) {
						c.X, c.W = g.onLine(ln, last, c.X)
					}
				}
				out = append(out, c)
			}
			last = i
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return out[i].X < out[j].X })
	return out
}

// onLine refines x0 on the real axis to the line's crossing, continuing w
// from Path[k] (where the root's sign is taken from the chord to Path[k+1]).
func (g *Geometry) onLine(ln Line, k int, x0 float64) (float64, complex128) {
	a, b := ln.Path[k], ln.Path[k+1]
	ref := (ln.W[k+1] - ln.W[k]) / (b - a) // mean of √Q over the chord
	wAt := func(x complex128) (complex128, complex128) {
		if k == 0 {
			// a is the turning point itself: integrate from x back to it.
			fx := nearRoot(g.q.Eval(x), ref)
			s, _, _ := segment(g.q, x, a, fx)
			return -s, fx
		}
		fa := nearRoot(g.q.Eval(a), ref)
		dw, fx := smooth(g.q, a, x, fa)
		return ln.W[k] + dw, fx
	}
	x := x0
	w, f := wAt(complex(x, 0))
	for it := 0; it < 8; it++ {
		d := part(ln.Family, f) // d part(w)/dx along the real axis
		if d == 0 {
			break
		}
		dx := -part(ln.Family, w) / d
		if math.Abs(dx) > 2*cmplx.Abs(b-a) {
			return x0, w // Newton left the chord: keep the interpolation
		}
		x += dx
		w, f = wAt(complex(x, 0))
		if math.Abs(dx) <= 1e-15*(math.Abs(x)+cmplx.Abs(b-a)) {
			break
		}
	}
	return x, w
}
