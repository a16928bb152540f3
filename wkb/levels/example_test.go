package levels_test

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
	"github.com/turnpoint/turnpoint/wkb/levels"
)

// Levels of the quartic oscillator −ψ″ + x⁴ψ = Eψ (ħ = 1, m = ½) to
// fourth order; the error estimate is the least term plus the coupling to
// the imaginary turning points that limits the asymptotic series.
func ExampleSolve() {
	w := wkb.Well{
		V:    jet.Map(func(x jet.Series) jet.Series { return jet.PowInt(x, 4) }),
		Mass: 0.5, Hbar: 1, A: -6, B: 6,
	}
	lv, err := levels.Solve(w, []int{0, 3, 10}, &levels.Settings{MaxOrder: 4})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, l := range lv {
		fmt.Printf("n=%2d  E=%.6f ± %.1e  order %d  μ=%d  ω=%.4f\n", l.N, l.E, l.Err, l.Order, l.Maslov, l.Omega)
	}
	// Output:
	// n= 0  E=0.980766 ± 1.7e-01  order 2  μ=2  ω=2.3847
	// n= 3  E=11.644779 ± 4.9e-05  order 4  μ=2  ω=4.4266
	// n=10  E=50.256255 ± 1.6e-07  order 4  μ=2  ω=6.3802
}

// The tunnel splitting of the double well V = (x² − 1)² for ħ = 0.15, m = 1,
// from the uniform quantisation condition.
func ExampleDoublets() {
	w := wkb.Well{
		V: jet.Map(func(x jet.Series) jet.Series {
			u := jet.Mul(x, x)
			u[0] -= 1
			return jet.Mul(u, u)
		}),
		Mass: 1, Hbar: 0.15, A: -3, B: 3,
	}
	ds, err := levels.Doublets(w, []int{0}, &levels.Settings{MaxOrder: 2})
	if err != nil {
		fmt.Println(err)
		return
	}
	d := ds[0]
	fmt.Printf("E = %.8f, %.8f\n", d.Lower.E, d.Upper.E)
	fmt.Printf("splitting %.5e ± %.1e\n", d.Splitting, d.SplittingErr)
	fmt.Printf("ħω = %.4f\n", w.Hbar*math.Sqrt(8))
	// Output:
	// E = 0.20611358, 0.20612682
	// splitting 1.32455e-05 ± 3.1e-08
	// ħω = 0.4243
}
