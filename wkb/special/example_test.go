package special_test

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/wkb/special"
)

func ExampleLogGamma() {
	// |Γ(½ + 2i)|² = π/cosh 2π.
	lg := special.LogGamma(0.5 + 2i)
	fmt.Printf("%.10f %.10f\n", math.Exp(2*real(lg)), math.Pi/math.Cosh(2*math.Pi))
	// Output: 0.0117334478 0.0117334478
}

func ExampleParabolicPhase() {
	for _, eps := range []float64{-1, 0, 0.5, 10} {
		fmt.Printf("φ(%g) = %.6f\n", eps, special.ParabolicPhase(eps))
	}
	fmt.Printf("1/(24·10) = %.6f\n", 1.0/240)
	// Output:
	// φ(-1) = -0.044992
	// φ(0) = 0.000000
	// φ(0.5) = 0.095844
	// φ(10) = 0.004169
	// 1/(24·10) = 0.004167
}
