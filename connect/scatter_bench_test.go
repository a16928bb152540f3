package connect

import "testing"

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
