package turning

import (
	"math"
	"testing"
)

// BenchmarkFindPoly10: ten zeros of a polynomial with complex roots.
func BenchmarkFindPoly10(b *testing.B) {
	var roots []complex128
	for k := 0; k < 10; k++ {
		roots = append(roots, complex(math.Cos(1.3*float64(k))*1.5, math.Sin(2.1*float64(k))))
	}
	q := polyFunc(fromRoots(roots))
	box := Box{-2 - 2i, 2 + 2i}
	for b.Loop() {
		if res, err := Find(q, box, nil); err != nil || res.Status != Complete || res.Zeros != 10 {
			b.Fatal(err, res.Status, res.Warnings)
		}
	}
}

// BenchmarkFindCosh: Q = E − V0/cosh²x above the barrier, four complex
// zeros and two double poles in the box (winding 0).
func BenchmarkFindCosh(b *testing.B) {
	q := coshQ(1.5, 1)
	box := Box{-2 - 3i, 2 + 3i}
	for b.Loop() {
		if res, err := Find(q, box, nil); err != nil || res.Status != Complete || res.Zeros != 4 || res.Poles != 4 {
			b.Fatal(err, res.Status, res.Warnings)
		}
	}
}
