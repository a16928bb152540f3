package direct

import (
	"math"
	"testing"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/turning"
)

// TestIncompleteSingularities gives Scatter only the zeros and poles of Q for
// a p-polarised Epstein layer, whose λ²Q + Q1 has further zeros beside the
// double poles of Q1 (ε = 0): the axis scan must still keep the path below
// them. Reference: R = 2.636945647244524e-09 at normal incidence, from
// cases/validate/testdata/round2.txt (epstein-p, made by
// cases/validate/reference/round2.py with mpmath at 40 digits).
func TestIncompleteSingularities(t *testing.T) {
	src := []byte(`form = "graded"
[parameters]
w = 0.25
[graded]
permittivity = "1 + 1.25/(1 + exp(-x/w))"
wavelength = 1.0
angle = 0.0
n_in = 1.0
polarization = "p"
[region]
x = [-10.5, 10.5]
box = { re = [-10.5, 10.5], im = [-1.0, 1.0] }
`)
	c, err := cases.Parse("epstein-p.toml", src)
	if err != nil {
		t.Fatal(err)
	}
	p, err := c.Problem()
	if err != nil {
		t.Fatal(err)
	}
	res, err := turning.Find(p.Q, c.SearchBox(), nil)
	if err != nil {
		t.Fatal(err)
	}
	var sing []complex128
	for _, pt := range res.Points {
		sing = append(sing, pt.Z)
	}
	r, err := Scatter(p, -10.5, 10.5, &Settings{Singularities: sing})
	if err != nil {
		t.Fatal(err)
	}
	const want = 2.636945647244524e-09
	if d := math.Abs(r.R - want); d > r.ErrR || d > 1e-4*want {
		t.Errorf("R = %.12g ± %.2g, want %.12g (error %.2g)", r.R, r.ErrR, want, d)
	}
}
