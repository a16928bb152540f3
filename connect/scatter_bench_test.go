package connect

import (
	"math"
	"testing"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// BenchmarkScatterCosh is one scattering point of U/cosh²(x) above the top
// (a complex pair, orders 0…6 computed), WKB alone.
func BenchmarkScatterCosh(b *testing.B) {
	p, pts := coshBarrier(1, 1, 1, 0.1, 1.1)
	for i := 0; i < b.N; i++ {
		if _, err := Scatter(p, -6, 6, pts, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkScatterBarrierFirstOrder is a real barrier at leading order.
func BenchmarkScatterBarrierFirstOrder(b *testing.B) {
	p, pts := coshBarrier(1, 1, 1, 0.1, 0.8)
	for i := 0; i < b.N; i++ {
		if _, err := Scatter(p, -6, 6, pts, &Settings{MaxOrder: -1}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkScatterTop is U/cosh²(x) exactly at the top (a double zero on
// the axis, split and extrapolated by scatterTop: 2·topLevels compositions).
func BenchmarkScatterTop(b *testing.B) {
	w := wkb.Well{V: sech2(1, 1, 0), Mass: 1, Hbar: 0.1}
	p := w.Problem(1)
	pts := append([]turning.Point{{Z: 0, Order: 2, Kind: turning.Coalescing}}, pair(complex(0, math.Pi/2), -2, turning.Pole)...)
	for i := 0; i < b.N; i++ {
		if _, err := Scatter(p, -6, 6, pts, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkScatterPairs is a real barrier beside a complex pair whose
// coupling e^θ ≈ 1e-10 is far below the accuracy of T (composed at leading
// order, its effect in the error estimate).
func BenchmarkScatterPairs(b *testing.B) {
	q := jet.Map(func(s jet.Series) jet.Series {
		n := s.Order()
		f := jet.Mul(jet.Add(s, jet.Const(1, n)), jet.Add(s, jet.Const(-2, n)))
		d := jet.Add(s, jet.Const(-3, n))
		return jet.Mul(f, jet.Add(jet.Const(1, n), jet.Scale(0.2, jet.Mul(d, d))))
	})
	p := wkb.Problem{Q: q, Lambda: 3}
	pts := append([]turning.Point{realPoint(-1), realPoint(2)}, pair(complex(3, math.Sqrt(5)), 1, turning.ComplexPair)...)
	for i := 0; i < b.N; i++ {
		if _, err := Scatter(p, -2.6, 3.6, pts, nil); err != nil {
			b.Fatal(err)
		}
	}
}
