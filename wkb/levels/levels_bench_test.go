package levels

import (
	"testing"

	"github.com/turnpoint/turnpoint/wkb"
)

// BenchmarkQuartic100WKB2 solves the first 100 levels of −ψ″ + x⁴ψ = Eψ at
// second order.
func BenchmarkQuartic100WKB2(b *testing.B) {
	w := wkb.Well{V: quartic(), Mass: 0.5, Hbar: 1, A: -8, B: 8}
	ns := make([]int, 100)
	for i := range ns {
		ns[i] = i
	}
	for b.Loop() {
		if _, err := Solve(w, ns, &Settings{MaxOrder: 2}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkQuartic100BS is the same at first order, for the ratio.
func BenchmarkQuartic100BS(b *testing.B) {
	w := wkb.Well{V: quartic(), Mass: 0.5, Hbar: 1, A: -8, B: 8}
	ns := make([]int, 100)
	for i := range ns {
		ns[i] = i
	}
	for b.Loop() {
		if _, err := Solve(w, ns, nil); err != nil {
			b.Fatal(err)
		}
	}
}
