package stokes_test

import (
	"fmt"
	"math"
	"os"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/turning/stokes"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// The parabolic barrier Q = x² − E below its top: the two real turning
// points ±√E are joined by a Stokes line along the real axis, a degeneracy
// with Gap = iπE/2.
func ExampleTrace() {
	const E = 1.0
	q := jet.Map(func(x jet.Series) jet.Series {
		r := jet.Mul(x, x)
		r[0] -= E
		return r
	})
	pts := []turning.Point{{Z: -1, Order: 1}, {Z: 1, Order: 1}}
	g, err := stokes.Trace(q, pts, turning.DefaultBox(-2, 2), nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, ln := range g.Lines {
		if ln.From == 0 {
			fmt.Printf("%-11v leaves at %4.0f°, ends: %v\n", ln.Family, ln.StartAngle*180/math.Pi, ln.End)
		}
	}
	for _, d := range g.Degeneracies {
		fmt.Printf("degeneracy %d–%d, Gap = %.6f\n", d.From, d.To, d.Gap)
	}
	// Output:
	// Stokes      leaves at    0°, ends: turning point
	// Stokes      leaves at  120°, ends: box
	// Stokes      leaves at -120°, ends: box
	// anti-Stokes leaves at  -60°, ends: box
	// anti-Stokes leaves at   60°, ends: box
	// anti-Stokes leaves at  180°, ends: box
	// degeneracy 0–1, Gap = (0.000000+1.570796i)
}

// For Q = E − x², Gap between ±√E is πE/2: the turning points are joined
// by a Stokes line exactly when E crosses the imaginary axis.
func ExampleFindDegeneracy() {
	family := func(p float64) (jet.Func, []turning.Point, error) {
		E := complex(p-0.25, 0.5) // Re E = p − 0.25
		q := jet.Map(func(x jet.Series) jet.Series {
			r := jet.Neg(jet.Mul(x, x))
			r[0] += E
			return r
		})
		r := jet.Sqrt(jet.Const(E, 0))[0]
		return q, []turning.Point{{Z: -r, Order: 1}, {Z: r, Order: 1}}, nil
	}
	roots, err := stokes.FindDegeneracy(family, -1, 1)
	fmt.Printf("%.6f %v\n", roots, err)
	// Output:
	// [0.250000] <nil>
}

// The summary of the Airy geometry Q = x.
func ExampleGeometry_WriteSummary() {
	q := jet.Map(func(x jet.Series) jet.Series { return x })
	g, err := stokes.Trace(q, []turning.Point{{Z: 0, Order: 1}}, turning.Box{Lo: -1 - 1i, Hi: 1 + 1i}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	if err := g.WriteSummary(os.Stdout); err != nil {
		fmt.Println(err)
	}
	// Output:
	// # Stokes line: Re w = 0 (one wave maximally dominant); anti-Stokes line: Im w = 0 (waves of equal size); w = ∫_t^x sqrt(Q) dx
	// points:
	//   #  z     order  kind
	//   0  0+0i  1      real simple
	// lines:
	//   family       from  angle°   end  to  w(end)       length
	//   Stokes       0     60.00    box  -   0+0.827204i  1.155
	//   Stokes       0     180.00   box  -   0+0.666667i  1
	//   Stokes       0     -60.00   box  -   0+0.827204i  1.155
	//   anti-Stokes  0     0.00     box  -   0.666667+0i  1
	//   anti-Stokes  0     120.00   box  -   0.827204+0i  1.155
	//   anti-Stokes  0     -120.00  box  -   0.827204+0i  1.155
	// degeneracies: none
	// real-axis crossings: none
	// cuts: 1, from points [0]
}
