package formula_test

import (
	"errors"
	"fmt"

	"github.com/turnpoint/turnpoint/cases/formula"
)

// A Schrödinger Q for the barrier V0/cosh²x: parse, bind the parameters,
// then evaluate Q and its derivatives at a complex point.
func Example() {
	e, err := formula.Parse("2*(E - V0/cosh(x)^2)", []string{"E", "V0"})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(e, e.Params(), e.UsesX())
	q, err := e.Bind(map[string]complex128{"E": 0.5, "V0": 1})
	if err != nil {
		fmt.Println(err)
		return
	}
	z := complex(0.5, 0.25)
	d := q.Taylor(z, 2).Derivs()
	fmt.Printf("Q(%v) = %.6f\n", z, q.Eval(z))
	fmt.Printf("Q′ = %.6f\n", d[1])
	fmt.Printf("Q″ = %.6f\n", d[2])
	// Output:
	// 2*(E - V0/cosh(x)^2) [E V0] true
	// Q((0.5+0.25i)) = (-0.607056+0.384614i)
	// Q′ = (1.712760+0.263122i)
	// Q″ = (0.875881-2.170119i)
}

// Errors carry their position; Excerpt shows it under the source.
func ExampleError_Excerpt() {
	src := "2*sinn(x) + 1"
	_, err := formula.Parse(src, nil)
	var e *formula.Error
	if errors.As(err, &e) {
		fmt.Println(e)
		fmt.Println(e.Excerpt(src))
	}
	// Output:
	// column 3: unknown function "sinn"; did you mean "sin"?
	// 2*sinn(x) + 1
	//   ^^^^
}

// String gives the canonical form: precedence decides the parentheses.
func ExampleExpr_String() {
	for _, src := range []string{"-x^2", "2^3^2", "x^-2", "(a-b)-(c-d)", "((x+1))*x"} {
		e, err := formula.Parse(src, []string{"a", "b", "c", "d"})
		if err != nil {
			fmt.Println(err)
			continue
		}
		fmt.Println(e)
	}
	// Output:
	// -x^2
	// 2^3^2
	// x^-2
	// a - b - (c - d)
	// (x + 1)*x
}

func ExampleFunctions() {
	fmt.Println(formula.Functions())
	// Output:
	// [cos cosh cot coth csc csch exp log sec sech sin sinh sqrt tan tanh]
}
