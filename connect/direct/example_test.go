package direct_test

import (
	"fmt"

	"github.com/turnpoint/turnpoint/connect/direct"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// A smooth step Q(x) = 1 − 0.5/(1 + e^(−x)) at λ = 6 reflects about seven
// parts in 1e24 (the closed form of Landau & Lifshitz §25 gives 7.010541e-24):
// the raised path resolves it to many digits.
func ExampleScatter() {
	q := jet.Map(func(s jet.Series) jet.Series {
		one := jet.Const(1, s.Order())
		v := jet.Scale(-0.5, jet.Div(one, jet.Add(one, jet.Exp(jet.Neg(s)))))
		v[0]++
		return v
	})
	res, err := direct.Scatter(wkb.Problem{Q: q, Lambda: 6}, -40, 40, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("method %s, status %v\n", res.Method, res.Status)
	fmt.Printf("R = %.6e, T = %.12f\n", res.R, res.T)
	fmt.Printf("relative error of R below 1e-6: %v\n", res.ErrR < 1e-6*res.R)
	// Output:
	// method complex-path, status converged
	// R = 7.010541e-24, T = 1.000000000000
	// relative error of R below 1e-6: true
}

// Below the top of a sech² barrier the wave tunnels; real turning points
// make Scatter integrate along the real axis (the closed form of Landau &
// Lifshitz §25 gives T = 1.80058994e-06).
func ExampleScatter_tunnelling() {
	q := jet.Map(func(s jet.Series) jet.Series {
		c := jet.Sech(s)
		v := jet.Neg(jet.Mul(c, c))
		v[0] += 0.8
		return v
	})
	res, err := direct.Scatter(wkb.Problem{Q: q, Lambda: 20}, -20, 20, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("method %s: T = %.8e, |R+T-1| < 1e-12: %v\n", res.Method, res.T, res.Unitarity < 1e-12)
	// Output:
	// method real-axis: T = 1.80058994e-06, |R+T-1| < 1e-12: true
}
