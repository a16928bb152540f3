package cases

import "testing"

// BenchmarkTMQ1Taylor measures the series of Q1 to order 30 (the order of
// the numerical solver's Taylor steps) for the logistic index step.
func BenchmarkTMQ1Taylor(b *testing.B) {
	src := "form = \"graded\"\n[parameters]\nw = 0.1\n[graded]\n" + stepIndex + "\nwavelength = 1\npolarization = \"p\"\n[region]\nx = [-3, 3]\n"
	c, err := Parse("bench.toml", []byte(src))
	if err != nil {
		b.Fatal(err)
	}
	p, err := c.Problem()
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		p.Q1.Taylor(0.05, 30)
	}
}
