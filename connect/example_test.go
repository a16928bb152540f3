package connect_test

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/connect"
	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// ExampleScatter: the parabolic barrier Q = x²/4 − 1/2, λ = 1, whose
// transmission 1/(1 + e^{π}) the uniform connection gives exactly.
func ExampleScatter() {
	q := jet.Map(func(s jet.Series) jet.Series {
		return jet.Add(jet.Scale(0.25, jet.Mul(s, s)), jet.Const(-0.5, s.Order()))
	})
	x := math.Sqrt2
	pts := []turning.Point{
		{Z: complex(-x, 0), Order: 1, Kind: turning.RealSimple},
		{Z: complex(x, 0), Order: 1, Kind: turning.RealSimple},
	}
	res, err := connect.Scatter(wkb.Problem{Q: q, Lambda: 1}, -8, 8, pts, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("T = %.8f (Kemble %.8f), R + T = %.6f\n", res.T, 1/(1+math.Exp(math.Pi)), res.R+res.T)
	fmt.Println(res.Method)
	// Output:
	// T = 0.04142383 (Kemble 0.04142383), R + T = 1.000000
	// uniform parabolic connection, 2 turning points
}

func ExampleParabolicBarrier() {
	m := connect.ParabolicBarrier(1.5)
	r, t := m.Amplitudes()
	fmt.Printf("R = %.6f T = %.6f\n", real(r*conj(r)), real(t*conj(t)))
	// Output: R = 0.952574 T = 0.047426
}

func conj(z complex128) complex128 { return complex(real(z), -imag(z)) }
