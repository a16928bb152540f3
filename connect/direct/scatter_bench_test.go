package direct

import (
	"fmt"
	"testing"
)

// BenchmarkScatterPoint is one complex-path result (both integrations and
// the height search) for the sech² barrier above its top.
func BenchmarkScatterPoint(b *testing.B) {
	p := sechBarrier(1, 1, 1.5, 30)
	for b.Loop() {
		if _, err := Scatter(p, -20, 20, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkScatterLambda measures the growth of the cost with λ on the
// Epstein step (complex path) and the sech² barrier below its top (real
// axis), at a fixed interval; the steps/op metric shows the growth
// directly.
func BenchmarkScatterLambda(b *testing.B) {
	for _, lam := range []float64{1e1, 1e2, 1e3, 1e4} {
		for _, c := range []struct {
			name string
			run  func() (*Result, error)
		}{
			{"step", func() (*Result, error) { return Scatter(smoothStep(1, 0.5, 1, lam), -40, 40, nil) }},
			{"barrier", func() (*Result, error) { return Scatter(sechBarrier(1, 1, 0.5, lam), -20, 20, nil) }},
		} {
			b.Run(fmt.Sprintf("%s/%.0e", c.name, lam), func(b *testing.B) {
				steps := 0
				for b.Loop() {
					res, err := c.run()
					if err != nil {
						b.Fatal(err)
					}
					steps = res.Steps
				}
				b.ReportMetric(float64(steps), "steps/op")
			})
		}
	}
}
