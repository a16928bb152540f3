package stokes

import (
	"math"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Test problems with closed-form turning points.

// poly returns Q(x) = Σ c[k] x^k.
func poly(c ...complex128) jet.Func {
	return jet.Map(func(s jet.Series) jet.Series {
		r := jet.Const(0, s.Order())
		for k := len(c) - 1; k >= 0; k-- { // Horner
			r = jet.Mul(r, s)
			r[0] += c[k]
		}
		return r
	})
}

// doubleWell returns Q = E + x² − 0.3x⁴ and its four real turning points,
// from 0.3x⁴ − x² − E = 0: x² = (1 ± √(1 + 1.2E))/0.6 (real for
// −1/1.2 < E < 0).
func doubleWell(E float64) (jet.Func, []turning.Point) {
	q := poly(complex(E, 0), 0, 1, 0, -0.3)
	d := math.Sqrt(1 + 1.2*E)
	o, i := math.Sqrt((1+d)/0.6), math.Sqrt((1-d)/0.6)
	return q, []turning.Point{
		{Z: complex(-o, 0), Order: 1, Kind: turning.RealSimple},
		{Z: complex(-i, 0), Order: 1, Kind: turning.RealSimple},
		{Z: complex(i, 0), Order: 1, Kind: turning.RealSimple},
		{Z: complex(o, 0), Order: 1, Kind: turning.RealSimple},
	}
}

// sechBarrier returns Q = E − U0 sech²x with E > U0 > 0 and its zeros and
// poles with |Im x| < 3: cosh²x = U0/E < 1 gives x = ±i a, ±i(π − a) with
// a = arccos √(U0/E); sech² has double poles at x = ±iπ/2.
func sechBarrier(E, U0 float64) (jet.Func, []turning.Point) {
	q := jet.Map(func(s jet.Series) jet.Series {
		c := jet.Sech(s)
		r := jet.Scale(complex(-U0, 0), jet.Mul(c, c))
		r[0] += complex(E, 0)
		return r
	})
	a := math.Acos(math.Sqrt(U0 / E))
	return q, []turning.Point{
		{Z: complex(0, -math.Pi+a), Order: 1, Kind: turning.ComplexPair},
		{Z: complex(0, -a), Order: 1, Kind: turning.ComplexPair},
		{Z: complex(0, a), Order: 1, Kind: turning.ComplexPair},
		{Z: complex(0, math.Pi-a), Order: 1, Kind: turning.ComplexPair},
		{Z: complex(0, math.Pi/2), Order: -2, Kind: turning.Pole},
		{Z: complex(0, -math.Pi/2), Order: -2, Kind: turning.Pole},
	}
}
