package stokes

import (
	"testing"

	"github.com/turnpoint/turnpoint/turning"
)

// BenchmarkTraceFour traces the full geometry (24 lines, degeneracies,
// cuts) of the double well E + x² − 0.3x⁴ with four turning points.
func BenchmarkTraceFour(b *testing.B) {
	q, pts := doubleWell(-0.4)
	box := turning.DefaultBox(-2.5, 2.5)
	for b.Loop() {
		if _, err := Trace(q, pts, box, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkGap is one Gap between the two inner turning points of the
// double well.
func BenchmarkGap(b *testing.B) {
	q, pts := doubleWell(-0.4)
	for b.Loop() {
		if _, err := Gap(q, pts[1].Z, pts[2].Z); err != nil {
			b.Fatal(err)
		}
	}
}
