package eigen_test

import (
	"fmt"

	"github.com/turnpoint/turnpoint/connect/eigen"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// The anharmonic well V = x²/2 + x⁴/10, with open ends far in the
// forbidden region: each level is found by its node count.
func ExampleLevels() {
	v := jet.Map(func(x jet.Series) jet.Series {
		x2 := jet.Mul(x, x)
		return jet.Add(jet.Scale(0.5, x2), jet.Scale(0.1, jet.Mul(x2, x2)))
	})
	w := wkb.Well{V: v, Mass: 1, Hbar: 1, A: -8, B: 8}
	lvs, err := eigen.Levels(w, []int{0, 1, 2, 10}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, lv := range lvs {
		fmt.Printf("n=%-2d nodes=%-2d E=%.9f error below 1e-11: %v (%v)\n", lv.N, lv.Nodes, lv.E, lv.Err < 1e-11, lv.Status)
	}
	below, _ := eigen.Count(w, 5)
	fmt.Println("levels below E = 5:", below)
	// Output:
	// n=0  nodes=0  E=0.559146327 error below 1e-11: true (converged)
	// n=1  nodes=1  E=1.769502644 error below 1e-11: true (converged)
	// n=2  nodes=2  E=3.138624308 error below 1e-11: true (converged)
	// n=10 nodes=10 E=17.351907636 error below 1e-11: true (converged)
	// levels below E = 5: 4
}

// A symmetric double well, (x² − d²)²/(8d²) with d = 6.5: its ground
// doublet is split by about 2e-11 of the level, and the two members are
// told apart by their node counts.
func ExampleSplit() {
	const d = 6.5
	v := jet.Map(func(x jet.Series) jet.Series {
		u := jet.Sub(jet.Mul(x, x), jet.Const(d*d, x.Order()))
		return jet.Scale(1/(8*d*d), jet.Mul(u, u))
	})
	w := wkb.Well{V: v, Mass: 1, Hbar: 1, A: -15, B: 15}
	sp, err := eigen.Split(w, 0, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("E0 = %.10f with %d nodes, E1 with %d nodes\n", sp.Lower.E, sp.Lower.Nodes, sp.Upper.Nodes)
	fmt.Printf("splitting %.2g, error below 1%%: %v\n", sp.Delta, sp.Err < 0.01*sp.Delta)
	// Output:
	// E0 = 0.4939152037 with 0 nodes, E1 with 1 nodes
	// splitting 8.3e-12, error below 1%: true
}
