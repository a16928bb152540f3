package formula

import (
	"errors"
	"fmt"
	"sort"
	"strings"
)

// maxDepth bounds the nesting of a formula, so that a pathological input
// cannot exhaust the stack of the recursive parser, printer and compiler.
const maxDepth = 200

// maxLen bounds the length of a formula in bytes, which also bounds the
// depth of long chains such as x+x+…+x.
const maxLen = 1 << 16

// Grammar, in EBNF; ^ binds tighter than unary minus and is right-associative,
// and an exponent may carry its own sign (x^-2):
//
//	expr    = term { ("+" | "-") term } .
//	term    = unary { ("*" | "/") unary } .
//	unary   = ("+" | "-") unary | power .
//	power   = primary [ "^" expo ] .
//	expo    = ("+" | "-") expo | power .
//	primary = number | name | name "(" expr ")" | "(" expr ")" .

// parser is a recursive-descent parser. Syntax errors end the parse (through
// a bailout panic recovered in Parse); errors of meaning, such as an unknown
// name, are collected and parsing goes on, so that one call reports them all.
type parser struct {
	// immutable state
	src    string
	params map[string]bool

	// parsing state
	sc    scanner
	tok   token // current token
	prev  token // previous token
	depth int   // current nesting
	errs  ErrorList
}

// bailout is the panic value that ends a parse at a syntax error.
type bailout struct{}

func (p *parser) error(offs, n int, msg string) {
	p.errs.Add(newError(p.src, offs, n, msg))
}

func (p *parser) fatal(offs, n int, msg string) {
	p.error(offs, n, msg)
	panic(bailout{})
}

func (p *parser) next() {
	p.prev = p.tok
	p.tok = p.sc.next()
}

func (p *parser) text(t token) string { return p.src[t.offs:t.end] }

// Parse parses a formula in the variable x. params are the names of the
// case's parameters; each must be an identifier and may not be x, pi, i or
// the name of a function.
//
// The error is a *Error, or an ErrorList when there are several; errors.As
// with a *Error target finds the first in either case. Errors about params
// themselves have Offset -1.
func Parse(src string, params []string) (*Expr, error) {
	p := &parser{src: src, params: make(map[string]bool, len(params))}
	for _, name := range params {
		if msg := checkParam(name); msg != "" {
			p.errs.Add(&Error{Offset: -1, Msg: msg})
			continue
		}
		p.params[name] = true
	}
	if len(p.errs) > 0 {
		return nil, p.result()
	}
	if len(src) > maxLen {
		return nil, newError(src, 0, 0, fmt.Sprintf("formula longer than %d bytes", maxLen))
	}
	root, err := p.parse()
	if err != nil {
		return nil, err
	}
	return newExpr(root), nil
}

func (p *parser) parse() (root *node, err error) {
	defer func() {
		if r := recover(); r != nil {
			if _, ok := r.(bailout); !ok {
				panic(r)
			}
			root, err = nil, p.result()
		}
	}()
	p.sc = scanner{src: p.src, err: p.fatal}
	p.next()
	if p.tok.kind == tokEOF {
		p.fatal(0, len(p.src), "empty formula")
	}
	root = p.expr()
	if p.tok.kind != tokEOF {
		// expr stops only at ")" or at the end: every other token
		// continues it or is a scanning error.
		p.fatal(p.tok.offs, 1, `unmatched ")"`)
	}
	if len(p.errs) > 0 {
		return nil, p.result()
	}
	return root, nil
}

// result returns the collected errors as a *Error or an ErrorList.
func (p *parser) result() error {
	p.errs.Sort()
	if len(p.errs) == 1 {
		return p.errs[0]
	}
	return p.errs
}

// CheckParam returns an error if name cannot be the name of a parameter: it
// must be an identifier ([A-Za-z_][A-Za-z0-9_]*) other than x, pi, i and the
// function names. Parse applies the same check to its params; a case loader
// can call it first to report a bad name where the name is defined.
func CheckParam(name string) error {
	if msg := checkParam(name); msg != "" {
		return errors.New(msg)
	}
	return nil
}

// checkParam returns why name cannot be a parameter, or "".
func checkParam(name string) string {
	if name == "" {
		return "empty parameter name"
	}
	for i := 0; i < len(name); i++ {
		c := name[i]
		if !isLetter(c) && !(i > 0 && isDigit(c)) {
			return fmt.Sprintf("parameter name %q is not an identifier (letters, digits and _, not starting with a digit)", name)
		}
	}
	switch {
	case name == "x":
		return `a parameter may not be called "x": it is the variable`
	case name == "pi" || name == "i":
		return fmt.Sprintf("a parameter may not be called %q: it is a constant", name)
	case functions[name] != nil:
		return fmt.Sprintf("a parameter may not be called %q: it is a function", name)
	}
	return ""
}

// enter goes one level deeper at the token t.
func (p *parser) enter(t token) {
	p.depth++
	if p.depth > maxDepth {
		p.fatal(t.offs, t.end-t.offs, fmt.Sprintf("formula nested too deeply: more than %d levels of parentheses, signs and exponents", maxDepth))
	}
}

func (p *parser) leave() { p.depth-- }

// expr = term { ("+" | "-") term } .
func (p *parser) expr() *node {
	n := p.term()
	for p.tok.kind == tokPlus || p.tok.kind == tokMinus {
		kind := nodeAdd
		if p.tok.kind == tokMinus {
			kind = nodeSub
		}
		p.next()
		n = &node{kind: kind, a: n, b: p.term()}
	}
	return n
}

// term = unary { ("*" | "/") unary } .
func (p *parser) term() *node {
	n := p.unary()
	for {
		switch p.tok.kind {
		case tokStar, tokSlash:
			kind := nodeMul
			if p.tok.kind == tokSlash {
				kind = nodeDiv
			}
			p.next()
			n = &node{kind: kind, a: n, b: p.unary()}
		case tokNumber, tokIdent, tokLParen:
			// Two factors side by side: report, then read on as a product
			// to find further errors.
			p.implicit()
			n = &node{kind: nodeMul, a: n, b: p.unary()}
		default:
			return n
		}
	}
}

// implicit reports a missing operator before the current token.
func (p *parser) implicit() {
	hint := "insert * to multiply"
	if (p.prev.kind == tokNumber || p.prev.kind == tokIdent) && (p.tok.kind == tokNumber || p.tok.kind == tokIdent) {
		hint = fmt.Sprintf("use %s*%s", p.text(p.prev), p.text(p.tok))
	}
	p.error(p.tok.offs, p.tok.end-p.tok.offs, "missing operator: implicit multiplication is not supported; "+hint)
}

// unary = ("+" | "-") unary | power .
func (p *parser) unary() *node {
	switch p.tok.kind {
	case tokMinus, tokPlus:
		neg := p.tok.kind == tokMinus
		p.enter(p.tok)
		p.next()
		n := p.unary()
		p.leave()
		if neg {
			n = &node{kind: nodeNeg, a: n}
		}
		return n
	}
	return p.power()
}

// power = primary [ "^" expo ] .
func (p *parser) power() *node {
	n := p.primary()
	if p.tok.kind == tokCaret {
		p.next()
		n = &node{kind: nodePow, a: n, b: p.expo()}
	}
	return n
}

// expo = ("+" | "-") expo | power .
func (p *parser) expo() *node {
	p.enter(p.tok)
	defer p.leave()
	switch p.tok.kind {
	case tokMinus:
		p.next()
		return &node{kind: nodeNeg, a: p.expo()}
	case tokPlus:
		p.next()
		return p.expo()
	}
	return p.power()
}

// primary = number | name | name "(" expr ")" | "(" expr ")" .
func (p *parser) primary() *node {
	t := p.tok
	switch t.kind {
	case tokNumber:
		p.next()
		return &node{kind: nodeNumber, val: t.val}
	case tokIdent:
		p.next()
		if p.tok.kind == tokLParen {
			return p.call(t)
		}
		return p.name(t)
	case tokLParen:
		p.next()
		n := p.group(t)
		return n
	}
	p.missing()
	return nil // not reached
}

// group parses the rest of "(" expr ")" after the opening parenthesis open.
func (p *parser) group(open token) *node {
	if p.tok.kind == tokRParen {
		p.fatal(open.offs, p.tok.end-open.offs, "empty parentheses")
	}
	p.enter(open)
	n := p.expr()
	p.leave()
	if p.tok.kind != tokRParen {
		// expr stops only at ")" or at the end: every other token
		// continues it or is a scanning error.
		p.fatal(open.offs, 1, `unclosed "(": missing ")"`)
	}
	p.next()
	return n
}

// missing reports an operand missing at the current token.
func (p *parser) missing() {
	t := p.tok
	after := ""
	if p.prev.end > 0 {
		after = fmt.Sprintf(" after %q", p.text(p.prev))
	}
	switch t.kind {
	case tokEOF:
		p.fatal(t.offs, 0, "missing operand"+after+" at the end of the formula")
	case tokRParen:
		p.fatal(t.offs, 1, "missing operand"+after+" before \")\"")
	case tokCaret:
		p.fatal(t.offs, 1, `missing base before "^"`)
	}
	p.fatal(t.offs, t.end-t.offs, fmt.Sprintf("missing operand%s before %q", after, p.text(t)))
}

// call parses a function call whose name is the token t; the current token
// is the opening parenthesis.
func (p *parser) call(t token) *node {
	name := p.text(t)
	open := p.tok
	p.next()
	arg := p.group(open)
	n := &node{kind: nodeCall, a: arg}
	if fn := functions[name]; fn != nil {
		n.fn = fn
		return n
	}
	// Go on with a placeholder so that later errors are found too.
	n.fn = functions["exp"]
	span := t.end - t.offs
	switch {
	case name == "x" || name == "pi" || name == "i" || p.params[name]:
		p.error(open.offs, 1, fmt.Sprintf("%q is not a function; implicit multiplication is not supported: use %s*(…)", name, name))
	case nonAnalytic[name]:
		p.error(t.offs, span, fmt.Sprintf("function %q is not supported: it is not analytic, and Q must be evaluated in the complex plane", name))
	case aliases[name] != "":
		p.error(t.offs, span, fmt.Sprintf("unknown function %q; did you mean %q?", name, aliases[name]))
	case name == "pow":
		p.error(t.offs, span, `unknown function "pow"; write a^b for powers`)
	default:
		msg := fmt.Sprintf("unknown function %q", name)
		if s := suggest(name, Functions()); s != "" {
			msg += fmt.Sprintf("; did you mean %q?", s)
		} else {
			msg += "; the functions are " + strings.Join(Functions(), ", ")
		}
		p.error(t.offs, span, msg)
	}
	return n
}

// name resolves an identifier t that is not followed by "(".
func (p *parser) name(t token) *node {
	name := p.text(t)
	switch {
	case name == "x":
		return &node{kind: nodeX}
	case name == "pi":
		return &node{kind: nodePi}
	case name == "i":
		return &node{kind: nodeImag}
	case p.params[name]:
		return &node{kind: nodeParam, name: name}
	}
	span := t.end - t.offs
	placeholder := &node{kind: nodeNumber}
	switch {
	case functions[name] != nil:
		arg := "…"
		if p.tok.kind == tokNumber || p.tok.kind == tokIdent {
			// sin x: read the argument on, so as not to report a missing
			// operator as well.
			arg = p.text(p.tok)
			p.power()
		}
		p.error(t.offs, span, fmt.Sprintf("function %q needs its argument in parentheses: %s(%s)", name, name, arg))
	case name == "e":
		p.error(t.offs, span, `unknown name "e"; write exp(1) for Euler's number, or declare e as a parameter`)
	default:
		known := []string{"x", "pi", "i"}
		for q := range p.params {
			known = append(known, q)
		}
		sort.Strings(known)
		msg := fmt.Sprintf("unknown name %q", name)
		if s := suggest(name, known); s != "" {
			msg += fmt.Sprintf("; did you mean %q?", s)
		} else if len(p.params) == 0 {
			msg += "; declare it as a parameter of the case"
		} else {
			msg += "; it is neither x, pi, i nor a parameter of the case"
		}
		p.error(t.offs, span, msg)
	}
	return placeholder
}
