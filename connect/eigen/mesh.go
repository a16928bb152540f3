package eigen

import (
	"fmt"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// mesh is a partition of [A, B] into cells on which the potential is replaced
// by its mean and slope. All quantities are scaled by c = 2m/ħ², so that the
// equation on cell i is ψ″ = (q[i] + a[i]·u − cE) ψ, u the distance from the
// middle of the cell.
type mesh struct {
	h     []float64 // cell lengths
	q     []float64 // c times the mean of V over each cell
	a     []float64 // slope of c·V over each cell (Legendre projection on x − mid)
	parts int       // cells of this mesh per base cell; base node i is node i·parts here
}

// gauss3 are the 3-point Gauss–Legendre nodes and weights on [−1/2, 1/2]
// (weights sum to 1), exact for polynomials of degree 5 (Abramowitz &
// Stegun 25.4.29).
var gauss3 = [3][2]float64{
	{-0.5 * 0.7745966692414834, 5.0 / 18},
	{0, 8.0 / 18},
	{0.5 * 0.7745966692414834, 5.0 / 18},
}

// evalV returns V(x) on the real axis, or an error if it is not a finite
// real number there.
func evalV(v jet.Func, x float64) (float64, error) {
	z := v.Eval(complex(x, 0))
	if cmplx.IsNaN(z) || cmplx.IsInf(z) {
		return 0, fmt.Errorf("eigen: potential is not finite at x = %g", x)
	}
	if math.Abs(imag(z)) > 1e-12*math.Max(1, math.Abs(real(z))) {
		return 0, fmt.Errorf("eigen: potential is not real at x = %g (V = %g)", x, z)
	}
	return real(z), nil
}

// lengthScale returns min(|q′|^(-1/3), |q″|^(-1/4), |q‴|^(-1/5)) at x, with
// q = cV: the length over which replacing q by a constant costs a fixed
// fraction of a radian of phase (Airy scale for a slope, oscillator length
// for a curvature).
func lengthScale(v jet.Func, c, x float64) (float64, error) {
	t := v.Taylor(complex(x, 0), 3)
	ell := math.Inf(1)
	fact := 1.0
	for k := 1; k <= 3; k++ {
		fact *= float64(k)
		d := c * fact * cmplx.Abs(t[k])
		if math.IsNaN(d) || math.IsInf(d, 0) {
			return 0, fmt.Errorf("eigen: derivative %d of the potential is not finite at x = %g", k, x)
		}
		if d > 0 {
			ell = math.Min(ell, math.Pow(d, -1/float64(k+2)))
		}
	}
	return ell, nil
}

// baseMesh builds the coarsest mesh on [a, b]: steps of step times the local
// length scale, at least 16 cells, at most maxCells.
func baseMesh(v jet.Func, c, a, b, step float64, maxCells int) ([]float64, error) {
	hmax := (b - a) / 16
	hmin := (b - a) * 1e-9
	xs := []float64{a}
	x := a
	for x < b {
		l0, err := lengthScale(v, c, x)
		if err != nil {
			return nil, err
		}
		h := math.Min(step*l0, hmax)
		// Look ahead once, so that a steep rise inside the step is seen.
		if x+h < b {
			l1, err := lengthScale(v, c, x+h)
			if err != nil {
				return nil, err
			}
			h = math.Min(h, step*l1)
		}
		if h < hmin {
			return nil, fmt.Errorf("eigen: potential varies on a scale below %.3g near x = %g (singular?)", h, x)
		}
		if x+h >= b {
			h = b - x
		}
		if x+h > b-0.25*h && x+h < b { // avoid a sliver: stretch this cell to b
			h = b - x
		}
		x += h
		if x > b {
			x = b
		}
		xs = append(xs, x)
		if len(xs)-1 > maxCells {
			return nil, fmt.Errorf("eigen: base mesh needs more than %d cells", maxCells)
		}
	}
	xs[len(xs)-1] = b
	return xs, nil
}

// symmetric reports whether V is mirror-symmetric about the midpoint of
// [a, b], judged at 32 points to rounding.
func symmetric(v jet.Func, a, b float64) bool {
	mid, half := 0.5*(a+b), 0.5*(b-a)
	for i := 1; i <= 32; i++ {
		t := half * math.Mod(float64(i)*0.6180339887498949, 1) // spread over (0, half)
		l, err1 := evalV(v, mid-t)
		r, err2 := evalV(v, mid+t)
		if err1 != nil || err2 != nil {
			return false
		}
		if math.Abs(l-r) > 1e-13*math.Max(math.Abs(l), math.Abs(r)) {
			return false
		}
	}
	return true
}

// mirrored builds the base mesh of a symmetric potential from its right
// half, so that the two halves of the discretised problem are mirror
// images and nearly degenerate pairs (double wells) stay exact doublets on
// every mesh.
func mirrored(v jet.Func, c, a, b, step float64, maxCells int) ([]float64, error) {
	mid := 0.5 * (a + b)
	right, err := baseMesh(v, c, mid, b, step, maxCells/2)
	if err != nil {
		return nil, err
	}
	xs := make([]float64, 0, 2*len(right)-1)
	for i := len(right) - 1; i > 0; i-- {
		xs = append(xs, mid-(right[i]-mid))
	}
	xs = append(xs, right...)
	xs[0] = a
	return xs, nil
}

// newMesh returns the mesh whose cells are those of the nodes xs each split
// into 2^level equal parts, with the cell means of cV.
func newMesh(v jet.Func, c float64, xs []float64, level int) (*mesh, error) {
	parts := 1 << level
	n := (len(xs) - 1) * parts
	m := &mesh{h: make([]float64, 0, n), q: make([]float64, 0, n), a: make([]float64, 0, n), parts: parts}
	for i := 0; i+1 < len(xs); i++ {
		a, b := xs[i], xs[i+1]
		hc := (b - a) / float64(parts)
		for p := 0; p < parts; p++ {
			xl := a + float64(p)*hc
			xr := a + float64(p+1)*hc
			if p == parts-1 {
				xr = b
			}
			h := xr - xl
			mid := 0.5 * (xl + xr)
			var mean, slope float64
			for _, g := range gauss3 {
				vx, err := evalV(v, mid+g[0]*h)
				if err != nil {
					return nil, err
				}
				mean += g[1] * vx
				slope += 12 * g[1] * g[0] * vx / h // ∫u V du / ∫u² du, u = x − mid
			}
			m.h = append(m.h, h)
			m.q = append(m.q, c*mean)
			m.a = append(m.a, c*slope)
		}
	}
	return m, nil
}
