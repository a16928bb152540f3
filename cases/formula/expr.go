package formula

import (
	"sort"
	"strconv"
	"strings"
)

// nodeKind is the kind of a node of the syntax tree.
type nodeKind int

const (
	nodeNumber nodeKind = iota // a real literal, val
	nodeImag                   // the imaginary unit i
	nodePi                     // the constant pi
	nodeX                      // the variable x
	nodeParam                  // the parameter name
	nodeNeg                    // -a
	nodeAdd                    // a + b
	nodeSub                    // a - b
	nodeMul                    // a*b
	nodeDiv                    // a/b
	nodePow                    // a^b
	nodeCall                   // fn(a)
)

// node is a node of the syntax tree. Unary nodes use a, binary nodes a and b.
type node struct {
	kind nodeKind
	val  float64   // nodeNumber
	name string    // nodeParam
	fn   *function // nodeCall
	a, b *node
}

// Expr is a parsed formula in the variable x. An Expr is immutable and safe
// for concurrent use; Bind turns it into a jet.Func for given parameter values.
type Expr struct {
	root   *node
	params []string // parameters used, sorted
	usesX  bool
}

// String returns the formula in canonical form: numbers in shortest form,
// spaces around + and - only, and just the parentheses the precedence rules
// require. Parse reads the result back to the same tree.
func (e *Expr) String() string {
	var b strings.Builder
	write(&b, e.root, ctxTop)
	return b.String()
}

// Params returns the names of the parameters the formula uses, sorted.
func (e *Expr) Params() []string { return append([]string(nil), e.params...) }

// UsesX reports whether the formula uses the variable x. A formula that does
// not is a constant.
func (e *Expr) UsesX() bool { return e.usesX }

// ctx is the syntactic position a node is printed in; each admits the nodes
// the grammar allows there without parentheses.
type ctx int

const (
	ctxTop  ctx = iota // anything
	ctxAddR            // right operand of + or -: a term
	ctxMulL            // left operand of * or /: a term
	ctxMulR            // right operand of * or /: a unary
	ctxNeg             // operand of unary minus: a unary
	ctxPowL            // base of ^: a primary
	ctxPowR            // exponent of ^: a signed power
)

// level returns the precedence of n: 1 sums, 2 products, 3 negations,
// 4 powers, 5 primaries.
func level(n *node) int {
	switch n.kind {
	case nodeAdd, nodeSub:
		return 1
	case nodeMul, nodeDiv:
		return 2
	case nodeNeg:
		return 3
	case nodePow:
		return 4
	}
	return 5
}

// fits reports whether n may be printed in context c without parentheses.
func fits(n *node, c ctx) bool {
	l := level(n)
	switch c {
	case ctxAddR, ctxMulL:
		return l >= 2
	case ctxMulR, ctxNeg, ctxPowR:
		return l >= 3
	case ctxPowL:
		return l >= 5
	}
	return true
}

func write(b *strings.Builder, n *node, c ctx) {
	if !fits(n, c) {
		b.WriteByte('(')
		write(b, n, ctxTop)
		b.WriteByte(')')
		return
	}
	switch n.kind {
	case nodeNumber:
		b.WriteString(strconv.FormatFloat(n.val, 'g', -1, 64))
	case nodeImag:
		b.WriteString("i")
	case nodePi:
		b.WriteString("pi")
	case nodeX:
		b.WriteString("x")
	case nodeParam:
		b.WriteString(n.name)
	case nodeNeg:
		b.WriteByte('-')
		if c == ctxPowR {
			// In an exponent a sign applies to a signed power only.
			write(b, n.a, ctxPowR)
		} else {
			write(b, n.a, ctxNeg)
		}
	case nodeAdd, nodeSub:
		write(b, n.a, ctxTop)
		if n.kind == nodeAdd {
			b.WriteString(" + ")
		} else {
			b.WriteString(" - ")
		}
		write(b, n.b, ctxAddR)
	case nodeMul, nodeDiv:
		write(b, n.a, ctxMulL)
		if n.kind == nodeMul {
			b.WriteByte('*')
		} else {
			b.WriteByte('/')
		}
		write(b, n.b, ctxMulR)
	case nodePow:
		write(b, n.a, ctxPowL)
		b.WriteByte('^')
		write(b, n.b, ctxPowR)
	case nodeCall:
		b.WriteString(n.fn.name)
		b.WriteByte('(')
		write(b, n.a, ctxTop)
		b.WriteByte(')')
	}
}

// collect records the parameters and the use of x in the tree under n.
func (e *Expr) collect(n *node, seen map[string]bool) {
	switch n.kind {
	case nodeX:
		e.usesX = true
	case nodeParam:
		if !seen[n.name] {
			seen[n.name] = true
			e.params = append(e.params, n.name)
		}
	}
	if n.a != nil {
		e.collect(n.a, seen)
	}
	if n.b != nil {
		e.collect(n.b, seen)
	}
}

func newExpr(root *node) *Expr {
	e := &Expr{root: root}
	e.collect(root, map[string]bool{})
	sort.Strings(e.params)
	return e
}
