package jet

// Func is a function analytic in a region of the complex plane (apart from
// isolated poles and branch points) that can report its value and its Taylor
// coefficients. Q(x) of a case, a potential V(x) and a refractive index n(x)
// are all Funcs. Implementations must be safe for concurrent use.
type Func interface {
	// Eval returns f(z).
	Eval(z complex128) complex128
	// Taylor returns the coefficients f⁽ᵏ⁾(z)/k!, k = 0…n.
	Taylor(z complex128, n int) Series
}

// Map is a Func built from a function on series; Eval uses a series of order 0.
type Map func(s Series) Series

// Eval returns f(z).
func (m Map) Eval(z complex128) complex128 { return m(Const(z, 0))[0] }

// Taylor returns the Taylor coefficients of f at z up to order n.
func (m Map) Taylor(z complex128, n int) Series { return m(Var(z, n)) }

// Derivative returns f′ at z, exactly (to rounding).
func Derivative(f Func, z complex128) complex128 { return f.Taylor(z, 1)[1] }
