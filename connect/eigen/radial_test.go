package eigen

import (
	"math"
	"strings"
	"testing"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// radialHarmonic returns V = r²/2 + ħ²l(l+1)/(2r²) (m = ω = 1): the radial
// equation of the 3-D isotropic oscillator with the centrifugal barrier.
func radialHarmonic(hbar float64, l int) jet.Func {
	b := hbar * hbar * float64(l*(l+1)) / 2
	return jet.Map(func(s jet.Series) jet.Series {
		r2 := jet.Mul(s, s)
		return jet.Add(jet.Scale(0.5, r2), jet.Scale(complex(b, 0), jet.Div(jet.Const(1, s.Order()), r2)))
	})
}

// An open end inside the centrifugal barrier: the end condition, not the
// mesh, limits the accuracy, and Err must say so.
func TestRadialOpenEnd(t *testing.T) {
	t.Parallel()
	const hbar, l = 0.2, 3
	w := wkb.Well{V: radialHarmonic(hbar, l), Mass: 1, Hbar: hbar, A: 0.05, B: 6}
	for _, n := range []int{0, 2, 5} {
		// E = ħω(2n_r + l + 3/2), exact: 3-D isotropic oscillator
		// (Landau & Lifshitz, Quantum Mechanics, §33, problem 4).
		want := hbar * (2*float64(n) + l + 1.5)
		lv, err := Solve(w, n, nil)
		if err != nil {
			t.Errorf("n=%d: %v", n, err)
			continue
		}
		d := math.Abs(lv.E - want)
		if d > lv.Err+1e-15*want {
			t.Errorf("n=%d: |E − E_exact| = %.3g exceeds the estimate %.3g", n, d, lv.Err)
		}
		// The estimate is of the size of the error, not arbitrarily large.
		if lv.Err > 1e3*d+1e-12*want {
			t.Errorf("n=%d: estimate %.3g far above the error %.3g", n, lv.Err, d)
		}
		if lv.Decay > 1e-12 && (lv.Status != IntervalShort || len(lv.Warnings) == 0 || !strings.Contains(lv.Warnings[len(lv.Warnings)-1], "widen")) {
			t.Errorf("n=%d: decay %.3g without the interval warning (status %v)", n, lv.Decay, lv.Status)
		}
		t.Logf("n=%d E=%.15g err=%.3g est=%.3g decay=%.3g %v", n, lv.E, d, lv.Err, lv.Decay, lv.Status)
	}
}
