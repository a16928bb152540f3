package jet_test

import (
	"fmt"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// The derivatives of Q(x) = 1/cosh²(x) at x = 0.5, exactly to rounding
// (the printed values agree with mpmath.diff to all digits shown).
func Example() {
	q := jet.Map(func(x jet.Series) jet.Series { return jet.PowInt(jet.Sech(x), 2) })
	for k, d := range q.Taylor(0.5, 3).Derivs() {
		fmt.Printf("Q^(%d)(0.5) = %.6f\n", k, real(d))
	}
	// Output:
	// Q^(0)(0.5) = 0.786448
	// Q^(1)(0.5) = -0.726862
	// Q^(2)(0.5) = -0.565209
	// Q^(3)(0.5) = 3.952220
}
