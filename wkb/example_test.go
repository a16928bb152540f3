package wkb_test

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// The phase integral of the quartic well Q = E − x⁴ between its real turning
// points, to sixth order: the series is asymptotic and is cut at its least
// term.
func ExamplePairPhase() {
	e := 20.0
	q := jet.Map(func(x jet.Series) jet.Series {
		q := jet.Neg(jet.PowInt(x, 4))
		q[0] += complex(e, 0)
		return q
	})
	p := wkb.Problem{Q: q, Lambda: 1}
	t := complex(math.Pow(e, 0.25), 0)
	ps, err := wkb.PairPhase(p, -t, t, 6, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	for k, v := range ps.Terms {
		fmt.Printf("order %d: %.6e\n", 2*k, real(v))
	}
	fmt.Printf("sum %.8f ± %.1e (%v)\n", real(ps.Sum), ps.ErrEst, ps.Status)
	// Output:
	// order 0: 1.653193e+01
	// order 2: -1.583599e-02
	// order 4: 4.439726e-05
	// order 6: 1.210639e-06
	// sum 16.51613461 ± 1.2e-06 (success)
}
