package levels

import (
	"errors"
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// gridPoints is the number of samples of V used to locate minima and the
// classically allowed intervals; features narrower than (B−A)/gridPoints
// may be missed.
const gridPoints = 4001

// geometry samples a well's potential on a grid and finds turning points.
type geometry struct {
	w      wkb.Well
	xs, vs []float64
	xmin   float64 // position of the global minimum of V on [A, B]
	vmin   float64
}

func checkWell(w wkb.Well) error {
	switch {
	case w.V == nil:
		return errors.New("levels: well has no potential")
	case !(w.Mass > 0) || math.IsInf(w.Mass, 0):
		return errors.New("levels: mass must be positive and finite")
	case !(w.Hbar > 0) || math.IsInf(w.Hbar, 0):
		return errors.New("levels: hbar must be positive and finite")
	case !(w.A < w.B) || math.IsInf(w.A, 0) || math.IsInf(w.B, 0):
		return errors.New("levels: the interval [A, B] must be finite with A < B")
	}
	return nil
}

func newGeometry(w wkb.Well) (*geometry, error) {
	if err := checkWell(w); err != nil {
		return nil, err
	}
	g := &geometry{w: w, xs: make([]float64, gridPoints), vs: make([]float64, gridPoints)}
	imin := 0
	for i := range g.xs {
		x := w.A + (w.B-w.A)*float64(i)/(gridPoints-1)
		if i == gridPoints-1 {
			x = w.B
		}
		v := g.v(x)
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("levels: potential is not finite at x = %g", x)
		}
		g.xs[i], g.vs[i] = x, v
		if v < g.vs[imin] {
			imin = i
		}
	}
	if (imin == 0 && !w.LeftWall) || (imin == gridPoints-1 && !w.RightWall) {
		return nil, errors.New("levels: the potential is lowest at an open end of [A, B]: no bound states there")
	}
	g.xmin, g.vmin = g.xs[imin], g.vs[imin]
	if imin > 0 && imin < gridPoints-1 {
		g.xmin, g.vmin = g.refineMin(g.xs[imin-1], g.xs[imin+1])
	}
	return g, nil
}

func (g *geometry) v(x float64) float64 { return real(g.w.V.Eval(complex(x, 0))) }

// refineMin finds the minimum of V in [lo, hi] by Newton on V′ with a
// golden-section fallback.
func (g *geometry) refineMin(lo, hi float64) (float64, float64) {
	// Golden section first (robust), Newton polish after.
	const r = 0.6180339887498949
	a, b := lo, hi
	c, d := b-r*(b-a), a+r*(b-a)
	fc, fd := g.v(c), g.v(d)
	for i := 0; i < 60 && b-a > 1e-9*(math.Abs(a)+math.Abs(b)+1e-300); i++ {
		if fc < fd {
			b, d, fd = d, c, fc
			c = b - r*(b-a)
			fc = g.v(c)
		} else {
			a, c, fc = c, d, fd
			d = a + r*(b-a)
			fd = g.v(d)
		}
	}
	x := (a + b) / 2
	for i := 0; i < 8; i++ {
		t := g.w.V.Taylor(complex(x, 0), 2)
		d1, d2 := real(t[1]), 2*real(t[2])
		if !(d2 > 0) {
			break
		}
		nx := x - d1/d2
		if nx < lo || nx > hi {
			break
		}
		if nx == x {
			break
		}
		x = nx
	}
	return x, g.v(x)
}

// end is one end of a classically allowed interval.
type end struct {
	x    float64
	wall bool
}

// region returns the classically allowed interval about x0 at energy E
// (V(x0) < E): the nearest turning points on either side, or the walls.
func (g *geometry) region(E, x0 float64) (a, b end, err error) {
	if !(g.v(x0) < E) {
		return a, b, fmt.Errorf("levels: energy %g is below the potential at x = %g", E, x0)
	}
	// Left.
	i := g.index(x0)
	for i >= 0 && g.xs[i] >= x0 {
		i--
	}
	for i >= 0 && g.vs[i] < E {
		i--
	}
	if i < 0 {
		if !g.w.LeftWall {
			return a, b, fmt.Errorf("levels: energy %g exceeds V at the open end A = %g: not bound in [A, B]", E, g.w.A)
		}
		a = end{x: g.w.A, wall: true}
	} else {
		hi := x0
		if i+1 < gridPoints && g.xs[i+1] < x0 {
			hi = g.xs[i+1]
		}
		a = end{x: g.crossing(g.xs[i], hi, E)}
	}
	j := g.index(x0)
	for j < gridPoints && g.xs[j] <= x0 {
		j++
	}
	for j < gridPoints && g.vs[j] < E {
		j++
	}
	if j >= gridPoints {
		if !g.w.RightWall {
			return a, b, fmt.Errorf("levels: energy %g exceeds V at the open end B = %g: not bound in [A, B]", E, g.w.B)
		}
		b = end{x: g.w.B, wall: true}
	} else {
		lo := x0
		if j-1 >= 0 && g.xs[j-1] > x0 {
			lo = g.xs[j-1]
		}
		b = end{x: g.crossing(lo, g.xs[j], E)}
	}
	return a, b, nil
}

// index returns the grid index nearest x.
func (g *geometry) index(x float64) int {
	i := int(math.Round((x - g.w.A) / (g.w.B - g.w.A) * (gridPoints - 1)))
	return min(max(i, 0), gridPoints-1)
}

// crossing returns the point in [lo, hi] where V = E, V − E changing sign
// there: bisection to a small bracket, then Newton on the jet derivative.
func (g *geometry) crossing(lo, hi, E float64) float64 {
	flo := g.v(lo) - E
	for k := 0; k < 200 && hi-lo > 4*eps*(math.Abs(lo)+math.Abs(hi))+1e-300; k++ {
		m := (lo + hi) / 2
		fm := g.v(m) - E
		if (fm < 0) == (flo < 0) {
			lo, flo = m, fm
		} else {
			hi = m
		}
	}
	x := (lo + hi) / 2
	a, b := lo, hi
	for k := 0; k < 10; k++ {
		t := g.w.V.Taylor(complex(x, 0), 1)
		f, d := real(t[0])-E, real(t[1])
		if d == 0 {
			break
		}
		nx := x - f/d
		if nx < a || nx > b || nx == x {
			break
		}
		x = nx
	}
	return x
}

// otherAllowed reports whether V < E somewhere in [A, B] outside [a, b].
func (g *geometry) otherAllowed(E, a, b float64) bool {
	for i, x := range g.xs {
		if (x < a || x > b) && g.vs[i] < E {
			return true
		}
	}
	return false
}

// negFunc is −f.
type negFunc struct{ f jet.Func }

func (n negFunc) Eval(z complex128) complex128 { return -n.f.Eval(z) }

func (n negFunc) Taylor(z complex128, k int) jet.Series { return jet.Neg(n.f.Taylor(z, k)) }

// innerMaximum reports whether V has a local maximum strictly inside (a, b)
// on the grid.
func (g *geometry) innerMaximum(a, b float64) bool {
	for i := 1; i < gridPoints-1; i++ {
		if g.xs[i] > a && g.xs[i] < b && g.vs[i] > g.vs[i-1] && g.vs[i] >= g.vs[i+1] {
			return true
		}
	}
	return false
}
