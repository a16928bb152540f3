// Package formula parses and evaluates the formulas of case files, Q(x), V(x)
// and n(x), written in ordinary mathematical notation, on complex numbers and
// on truncated Taylor series (jets), so that every formula gives exact
// derivatives of any order anywhere in the complex plane.
//
// # Language
//
// A formula is an expression in the variable x:
//
//	numbers      2  1.5  .5  1e-3  2.5E+4
//	constants    pi, and i (the imaginary unit)
//	parameters   the names given to Parse, e.g. E, V0, alpha
//	operators    + - * / ^, unary - and +, parentheses
//	functions    sin cos tan cot sec csc sinh cosh tanh coth sech csch exp log sqrt
//
// ^ binds tighter than unary minus and groups to the right, and an exponent
// may carry its own sign: -x^2 = -(x^2), 2^3^2 = 2^9, x^-2 = x^(-2). There is
// no implicit multiplication: 2x and 2 x are errors, write 2*x. log and sqrt
// are principal branches, with their cuts where the argument is negative real.
//
// Only analytic functions exist: turning points are complex, so Q is
// evaluated off the real axis, where abs, step, min and the like have no
// meaning. They are refused with a message that says so.
//
// # Errors
//
// Parse reports every error it can find as a *Error, or an ErrorList of them,
// each placed on a byte span of the source with its 1-based line and rune
// column; Excerpt prints the line with carets under the span. Unknown names
// come with the closest known one by edit distance.
//
// # Evaluation
//
// Expr.Bind sets the parameters and compiles the tree into a jet.Func:
// closures over complex128 for Eval, and the operations of package jet for
// Taylor. Both are safe for concurrent use.
package formula
