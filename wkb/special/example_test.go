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

func ExampleParabolicPhaseCoeff() {
	// φ(ε) ~ c₁/ε + c₂/ε³ + c₃/ε⁵ + …: the first coefficients and the series at ε = 10.
	c1, c2, c3 := special.ParabolicPhaseCoeff(1), special.ParabolicPhaseCoeff(2), special.ParabolicPhaseCoeff(3)
	fmt.Printf("c1 = %.6f = 1/24, c2 = %.8f = 7/2880\n", c1, c2)
	fmt.Printf("φ(10) = %.9f, series %.9f\n", special.ParabolicPhase(10), c1/10+c2/1e3+c3/1e5)
	// Output:
	// c1 = 0.041667 = 1/24, c2 = 0.00243056 = 7/2880
	// φ(10) = 0.004169105, series 0.004169105
}
