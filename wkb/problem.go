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
