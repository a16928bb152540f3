package cases_test

import (
	"fmt"

	"github.com/turnpoint/turnpoint/cases"
)

func ExampleParse() {
	src := `
# A demo: a particle meeting a Gaussian bump.
title = "Gaussian bump"
form = "schrodinger"

[parameters]
V0 = 2.0

[schrodinger]
potential = "V0*exp(-x^2)"
mass = 0.5
hbar = 0.1
energy = 1.0

[region]
x = [-4, 4]
`
	c, err := cases.Parse("bump.toml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	a, b := c.Interval()
	p, err := c.Problem()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: form %s on [%g, %g], lambda = %.4g\n", c.Title, c.Form, a, b, p.Lambda)
	fmt.Printf("Q(0) = %.4g\n", real(p.Q.Eval(0)))
	fmt.Printf("Q(1) = %.4g\n", real(p.Q.Eval(1)))
	// Output:
	// Gaussian bump: form schrodinger on [-4, 4], lambda = 10
	// Q(0) = -1
	// Q(1) = 0.2642
}

func ExampleParse_errors() {
	src := `form = "general"
[general]
Q = "x^2 - sinn(x)"
lambda = -3
[region]
x = [1, -1]
`
	_, err := cases.Parse("bad.toml", []byte(src))
	if list, ok := err.(cases.ErrorList); ok {
		fmt.Print(list.Detail())
	}
	// Output:
	// bad.toml:3:12: unknown function "sinn"; did you mean "sin"?
	//     3 | Q = "x^2 - sinn(x)"
	//       |            ^^^^
	// bad.toml:4:10: general.lambda must be positive, got -3
	//     4 | lambda = -3
	//       |          ^^
	// bad.toml:6:5: region.x is reversed: 1 > -1; write [-1, 1]
	//     6 | x = [1, -1]
	//       |     ^^^^^^^
}

func ExampleCase_ProblemAt() {
	src := `
# A demo: a linear index ramp seen at three angles.
form = "graded"

[graded]
index = "1.5 + 0.1*x"
k0 = 10
angle = 0

[region]
x = [-1, 1]

[scan]
over = "angle"
from = 0
to = 60
points = 3
`
	c, err := cases.Parse("ramp.toml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, theta := range c.Scan.Values() {
		p, err := c.ProblemAt(theta)
		if err != nil {
			fmt.Println(err)
			return
		}
		// Q(0) = n(0)² − sin²θ = 2.25 − sin²θ.
		fmt.Printf("%s = %g: lambda = %g, Q(0) = %.4f\n", c.ScanLabel(), theta, p.Lambda, real(p.Q.Eval(0)))
	}
	// Output:
	// theta (deg) = 0: lambda = 10, Q(0) = 2.2500
	// theta (deg) = 30: lambda = 10, Q(0) = 2.0000
	// theta (deg) = 60: lambda = 10, Q(0) = 1.5000
}

// A p-polarised (TM) case: the problem carries the λ-free term
// Q1 = ε″/(2ε) − (3/4)(ε′/ε)² of the equation for H/√ε, which vanishes where
// the medium is uniform and has a double pole where ε = 0; here
// Q1 = (a − 2a²x²)/(1 + ax²)² with a = 0.5.
func ExampleCase_Problem_tm() {
	src := `
# A demo: a permittivity ramp at oblique p incidence.
form = "graded"

[graded]
permittivity = "1 + 0.5*x^2"
wavelength = 1.0
angle = 30
polarization = "TM"

[region]
x = [-1, 1]
`
	c, err := cases.Parse("ramp.toml", []byte(src))
	if err != nil {
		fmt.Println(err)
		return
	}
	p, err := c.Problem()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("polarization %s, lambda = %.4f\n", c.Graded.Polarization, p.Lambda)
	fmt.Printf("Q(0) = %.4f, Q1(0) = %.4f, Q1(2) = %.4f\n",
		real(p.Q.Eval(0)), real(p.Q1.Eval(0)), real(p.Q1.Eval(2)))
	// Output:
	// polarization p, lambda = 6.2832
	// Q(0) = 0.7500, Q1(0) = 0.5000, Q1(2) = -0.1667
}
