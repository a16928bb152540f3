package wkb

import "github.com/turnpoint/turnpoint/wkb/jet"

// Problem is the canonical equation of every case,
//
//	y″(x) + (λ² Q(x) + Q1(x)) y(x) = 0,
//
// with a large parameter λ = Lambda. Q1 is an optional λ-free term (a Langer
// shift or a centrifugal term); nil means zero.
type Problem struct {
	Q      jet.Func
	Q1     jet.Func
	Lambda float64
}

// Well is a one-dimensional Schrödinger problem on the interval [A, B],
//
//	−(ħ²/2m) ψ″ + V(x) ψ = E ψ,
//
// whose ends are either hard walls (ψ = 0 there) or open, in which case the
// interval must reach into the classically forbidden region on that side.
type Well struct {
	V          jet.Func
	Mass, Hbar float64
	A, B       float64
	LeftWall   bool // ψ(A) = 0 is imposed by a hard wall at A
	RightWall  bool // ψ(B) = 0 is imposed by a hard wall at B
}

// Problem returns the canonical form at energy E: λ = 1/ħ, Q = 2m(E − V).
func (w Well) Problem(E float64) Problem {
	return Problem{Q: kinetic{v: w.V, m2: complex(2*w.Mass, 0), e: complex(E, 0)}, Lambda: 1 / w.Hbar}
}

// kinetic is Q = 2m(E − V) as a jet.Func.
type kinetic struct {
	v     jet.Func
	m2, e complex128
}

func (k kinetic) Eval(z complex128) complex128 { return k.m2 * (k.e - k.v.Eval(z)) }

func (k kinetic) Taylor(z complex128, n int) jet.Series {
	q := jet.Scale(-k.m2, k.v.Taylor(z, n))
	q[0] += k.m2 * k.e
	return q
}
