package turning_test

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Turning points and singularities of Q(x) = 1 − x² − 0.1/x², a harmonic
// well with a centrifugal term: a double pole at 0 and the zeros of
// x⁴ − x² + 0.1, x² = (1 ± √0.6)/2, four real simple turning points.
func ExampleFind() {
	q := jet.Map(func(x jet.Series) jet.Series {
		one := jet.Const(1, x.Order())
		return jet.Sub(jet.Sub(one, jet.Mul(x, x)), jet.Scale(0.1, jet.PowInt(x, -2)))
	})
	res, err := turning.Find(q, turning.DefaultBox(-2, 2), nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("status:", res.Status, "winding:", res.Winding)
	for _, p := range res.Points {
		fmt.Printf("%.6f%+.6fi order %d %v\n", round6(real(p.Z)), round6(imag(p.Z)), p.Order, p.Kind)
	}
	// Output:
	// status: complete winding: 2
	// -0.941965+0.000000i order 1 real simple
	// -0.335711+0.000000i order 1 real simple
	// 0.000000+0.000000i order -2 pole
	// 0.335711+0.000000i order 1 real simple
	// 0.941965+0.000000i order 1 real simple
}

// Above the top of the barrier V(x) = 1/cosh²x (E = 1.5, 2m = 1) the
// turning points are complex: cosh x = ±√(2/3) on the imaginary axis, with
// the double poles of Q = E − V at ±iπ/2 between them. The winding number
// of the box is 4 − 4 = 0, yet nothing is missed.
func ExampleFind_barrier() {
	q := jet.Map(func(x jet.Series) jet.Series {
		c := jet.Cosh(x)
		return jet.Sub(jet.Const(1.5, x.Order()), jet.Div(jet.Const(1, x.Order()), jet.Mul(c, c)))
	})
	res, err := turning.Find(q, turning.Box{Lo: -2 - 3i, Hi: 2 + 3i}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("status:", res.Status, "winding:", res.Winding, "zeros:", res.Zeros, "poles:", res.Poles)
	for _, p := range res.Points {
		fmt.Printf("%.6fi order %d %v\n", round6(imag(p.Z)), p.Order, p.Kind)
	}
	// Output:
	// status: complete winding: 0 zeros: 4 poles: 4
	// -2.526113i order 1 complex pair
	// -1.570796i order -2 pole
	// -0.615480i order 1 complex pair
	// 0.615480i order 1 complex pair
	// 1.570796i order -2 pole
	// 2.526113i order 1 complex pair
}

// The roots of a polynomial from the eigenvalues of its companion matrix:
// x² + 2x + 5 = (x + 1)² + 4.
func ExamplePolyRoots() {
	roots, err := turning.PolyRoots([]complex128{5, 2, 1})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, r := range roots {
		fmt.Printf("%.4f%+.4fi\n", real(r), imag(r))
	}
	// Output:
	// -1.0000+2.0000i
	// -1.0000-2.0000i
}

// round6 rounds to six decimals, turning −0 into 0 for stable printing.
func round6(x float64) float64 { return math.Round(x*1e6)/1e6 + 0 }
