package eigen

import (
	"fmt"
	"testing"

	"github.com/turnpoint/turnpoint/wkb"
)

// BenchmarkQuartic100 computes the first 100 levels of −y″ + x⁴y = Ey,
// meshes included.
func BenchmarkQuartic100(b *testing.B) {
	w := wkb.Well{V: quartic(), Mass: 0.5, Hbar: 1, A: -8, B: 8}
	ns := make([]int, 100)
	for i := range ns {
		ns[i] = i
	}
	for b.Loop() {
		if _, err := Levels(w, ns, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkLevelN computes one level of the harmonic oscillator on an
// interval that holds all of them, the meshes built beforehand. A sweep
// costs the same at every n (the mesh does not depend on E); low levels are
// cheaper because the deep forbidden region is skipped, and high ones may
// need one or two more halvings before Richardson extrapolation applies.
func BenchmarkLevelN(b *testing.B) {
	w := wkb.Well{V: harmonic(1, 1), Mass: 1, Hbar: 1, A: -150, B: 150}
	sv, err := NewSolver(w, nil)
	if err != nil {
		b.Fatal(err)
	}
	for j := 0; j <= sv.set.MaxRefine; j++ {
		if _, err := sv.mesh(j); err != nil {
			b.Fatal(err)
		}
	}
	for _, n := range []int{10, 100, 1000, 10000} {
		b.Run(fmt.Sprintf("n=%d", n), func(b *testing.B) {
			var lv Level
			for b.Loop() {
				if lv, err = sv.Level(n); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(lv.Iterations), "sweeps/op")
			b.ReportMetric(float64(lv.Meshes), "meshes/op")
		})
	}
}
