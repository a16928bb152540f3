package formula

import (
	"fmt"
	"math"
	"math/cmplx"
	"strings"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// maxIntExp is the largest integer exponent evaluated by repeated squaring;
// beyond it a constant exponent goes through the general power.
const maxIntExp = 1 << 20

// Bind returns the formula as a jet.Func of x with the parameters set to
// values. Every parameter the formula uses must have a value; values of
// parameters it does not use are ignored.
//
// Bind compiles the tree once: subtrees without x are folded to constants,
// Eval runs a tree of closures on complex128 that neither looks names up nor
// allocates, and Taylor evaluates the same tree on jet.Series. A constant
// integer exponent (after folding, so x^n with a parameter n = 2 counts) is
// computed by repeated multiplication, exact also where the base vanishes;
// another constant exponent by jet.Pow; a varying exponent as exp(b·log a),
// on the principal branch. The result is safe for concurrent use, and its
// String method returns the canonical form of e.
func (e *Expr) Bind(values map[string]complex128) (jet.Func, error) {
	var missing []string
	for _, name := range e.params {
		if _, ok := values[name]; !ok {
			missing = append(missing, name)
		}
	}
	switch len(missing) {
	case 0:
	case 1:
		return nil, fmt.Errorf("parameter %q has no value", missing[0])
	default:
		return nil, fmt.Errorf("parameters %s have no value", quoteList(missing))
	}
	c := compile(e.root, values)
	return &compiled{c: c, src: e.String()}, nil
}

func quoteList(names []string) string {
	q := make([]string, len(names))
	for i, n := range names {
		q[i] = fmt.Sprintf("%q", n)
	}
	return strings.Join(q, ", ")
}

// compiled is the jet.Func Bind returns.
type compiled struct {
	c   code
	src string
}

// Eval returns the value of the formula at z.
func (f *compiled) Eval(z complex128) complex128 { return f.c.eval(z) }

// Taylor returns the Taylor coefficients of the formula at z up to order n.
func (f *compiled) Taylor(z complex128, n int) jet.Series {
	if n < 0 {
		panic("formula: negative Taylor order")
	}
	return f.c.series(jet.Var(z, n))
}

// String returns the canonical form of the formula it was bound from.
func (f *compiled) String() string { return f.src }

// code is a compiled subtree. A constant subtree has isConst set and its
// value in val; the functions then return it.
type code struct {
	isConst bool
	val     complex128
	eval    func(z complex128) complex128
	series  func(v jet.Series) jet.Series // v is the series of x
}

func constant(c complex128) code {
	return code{
		isConst: true,
		val:     c,
		eval:    func(complex128) complex128 { return c },
		series:  func(v jet.Series) jet.Series { return jet.Const(c, v.Order()) },
	}
}

// compile turns the tree under n into closures; values holds the parameters.
func compile(n *node, values map[string]complex128) code {
	switch n.kind {
	case nodeNumber:
		return constant(complex(n.val, 0))
	case nodeImag:
		return constant(1i)
	case nodePi:
		return constant(math.Pi)
	case nodeParam:
		return constant(values[n.name])
	case nodeX:
		return code{
			eval:   func(z complex128) complex128 { return z },
			series: func(v jet.Series) jet.Series { return append(jet.Series(nil), v...) },
		}
	case nodeNeg:
		a := compile(n.a, values)
		if a.isConst {
			return constant(-a.val)
		}
		ae, as := a.eval, a.series
		return code{
			eval:   func(z complex128) complex128 { return -ae(z) },
			series: func(v jet.Series) jet.Series { return jet.Neg(as(v)) },
		}
	case nodeCall:
		a := compile(n.a, values)
		fe, fs := n.fn.eval, n.fn.series
		if a.isConst {
			return constant(fe(a.val))
		}
		ae, as := a.eval, a.series
		return code{
			eval:   func(z complex128) complex128 { return fe(ae(z)) },
			series: func(v jet.Series) jet.Series { return fs(as(v)) },
		}
	case nodePow:
		return compilePow(compile(n.a, values), compile(n.b, values))
	}
	return compileBinary(n.kind, compile(n.a, values), compile(n.b, values))
}

// compileBinary compiles a + b, a - b, a*b and a/b, with special cases for a
// constant operand so that Taylor does not multiply whole series by
// constants.
func compileBinary(kind nodeKind, a, b code) code {
	if a.isConst && b.isConst {
		switch kind {
		case nodeAdd:
			return constant(a.val + b.val)
		case nodeSub:
			return constant(a.val - b.val)
		case nodeMul:
			return constant(a.val * b.val)
		default:
			return constant(a.val / b.val)
		}
	}
	ae, as, be, bs := a.eval, a.series, b.eval, b.series
	ac, bc := a.val, b.val
	switch kind {
	case nodeAdd:
		switch {
		case a.isConst:
			return code{
				eval:   func(z complex128) complex128 { return ac + be(z) },
				series: func(v jet.Series) jet.Series { s := bs(v); s[0] = ac + s[0]; return s },
			}
		case b.isConst:
			return code{
				eval:   func(z complex128) complex128 { return ae(z) + bc },
				series: func(v jet.Series) jet.Series { s := as(v); s[0] += bc; return s },
			}
		}
		return code{
			eval:   func(z complex128) complex128 { return ae(z) + be(z) },
			series: func(v jet.Series) jet.Series { return jet.Add(as(v), bs(v)) },
		}
	case nodeSub:
		switch {
		case a.isConst:
			return code{
				eval: func(z complex128) complex128 { return ac - be(z) },
				series: func(v jet.Series) jet.Series {
					s := bs(v)
					s[0] = ac - s[0]
					for k := 1; k < len(s); k++ {
						s[k] = -s[k]
					}
					return s
				},
			}
		case b.isConst:
			return code{
				eval:   func(z complex128) complex128 { return ae(z) - bc },
				series: func(v jet.Series) jet.Series { s := as(v); s[0] -= bc; return s },
			}
		}
		return code{
			eval:   func(z complex128) complex128 { return ae(z) - be(z) },
			series: func(v jet.Series) jet.Series { return jet.Sub(as(v), bs(v)) },
		}
	case nodeMul:
		switch {
		case a.isConst:
			return code{
				eval:   func(z complex128) complex128 { return ac * be(z) },
				series: func(v jet.Series) jet.Series { return jet.Scale(ac, bs(v)) },
			}
		case b.isConst:
			return code{
				eval: func(z complex128) complex128 { return ae(z) * bc },
				series: func(v jet.Series) jet.Series {
					s := as(v)
					for k := range s {
						s[k] *= bc
					}
					return s
				},
			}
		}
		return code{
			eval:   func(z complex128) complex128 { return ae(z) * be(z) },
			series: func(v jet.Series) jet.Series { return jet.Mul(as(v), bs(v)) },
		}
	}
	// nodeDiv
	if b.isConst {
		return code{
			eval: func(z complex128) complex128 { return ae(z) / bc },
			series: func(v jet.Series) jet.Series {
				s := as(v)
				for k := range s {
					s[k] /= bc
				}
				return s
			},
		}
	}
	if a.isConst {
		return code{
			eval:   func(z complex128) complex128 { return ac / be(z) },
			series: func(v jet.Series) jet.Series { s := bs(v); return jet.Div(jet.Const(ac, s.Order()), s) },
		}
	}
	return code{
		eval:   func(z complex128) complex128 { return ae(z) / be(z) },
		series: func(v jet.Series) jet.Series { return jet.Div(as(v), bs(v)) },
	}
}

// compilePow compiles a^b.
func compilePow(a, b code) code {
	if a.isConst && b.isConst {
		if n, ok := intExponent(b.val); ok {
			return constant(powInt(a.val, n))
		}
		return constant(cmplx.Pow(a.val, b.val))
	}
	ae, as := a.eval, a.series
	if b.isConst {
		p := b.val
		if n, ok := intExponent(p); ok {
			switch n {
			case 1:
				return a
			case 2:
				return code{
					eval:   func(z complex128) complex128 { w := ae(z); return w * w },
					series: func(v jet.Series) jet.Series { s := as(v); return jet.Mul(s, s) },
				}
			}
			return code{
				eval:   func(z complex128) complex128 { return powInt(ae(z), n) },
				series: func(v jet.Series) jet.Series { return jet.PowInt(as(v), n) },
			}
		}
		return code{
			eval:   func(z complex128) complex128 { return cmplx.Pow(ae(z), p) },
			series: func(v jet.Series) jet.Series { return jet.Pow(as(v), p) },
		}
	}
	be, bs := b.eval, b.series
	if a.isConst {
		// c^b = exp(b log c), with log c computed once.
		c := a.val
		logc := cmplx.Log(c)
		return code{
			// The same operations as the series' leading term, so Eval and
			// Taylor agree to the last bit even where a tower of powers
			// amplifies rounding.
			eval:   func(z complex128) complex128 { return cmplx.Exp(logc * be(z)) },
			series: func(v jet.Series) jet.Series { return jet.Exp(jet.Scale(logc, bs(v))) },
		}
	}
	return code{
		eval:   func(z complex128) complex128 { return cmplx.Exp(be(z) * cmplx.Log(ae(z))) },
		series: func(v jet.Series) jet.Series { return jet.Exp(jet.Mul(bs(v), jet.Log(as(v)))) },
	}
}

// intExponent reports whether p is an integer of modest size, and which.
func intExponent(p complex128) (int, bool) {
	r := real(p)
	if imag(p) != 0 || r != math.Trunc(r) || math.Abs(r) > maxIntExp {
		return 0, false
	}
	return int(r), true
}

// powInt returns wⁿ by repeated squaring, in the same order of operations as
// jet.PowInt so that Eval and Taylor agree to the last bit.
func powInt(w complex128, n int) complex128 {
	if n < 0 {
		return 1 / powInt(w, -n)
	}
	r := complex128(1)
	for n > 0 {
		if n&1 == 1 {
			r *= w
		}
		n >>= 1
		if n > 0 {
			w *= w
		}
	}
	return r
}
