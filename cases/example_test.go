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
