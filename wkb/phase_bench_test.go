package wkb

import (
	"math"
	"testing"
)

func benchmarkPairPhase(b *testing.B, order int) {
	p := Problem{Q: poly(20, 0, 0, 0, -1), Lambda: 1}
	t := complex(math.Pow(20, 0.25), 0)
	for b.Loop() {
		if _, err := PairPhase(p, -t, t, order, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkPairPhaseQuartic2 and …8 time the quartic well's phase series
// to orders 2 and 8 (automatic contour).
func BenchmarkPairPhaseQuartic2(b *testing.B) { benchmarkPairPhase(b, 2) }
func BenchmarkPairPhaseQuartic8(b *testing.B) { benchmarkPairPhase(b, 8) }
