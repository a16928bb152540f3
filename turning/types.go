package turning

import "fmt"

// Box is a closed rectangle of the complex plane, Lo the lower-left and Hi
// the upper-right corner.
type Box struct {
	Lo, Hi complex128
}

// Contains reports whether z lies in the closed box.
func (b Box) Contains(z complex128) bool {
	return real(z) >= real(b.Lo) && real(z) <= real(b.Hi) &&
		imag(z) >= imag(b.Lo) && imag(z) <= imag(b.Hi)
}

// Kind classifies a point of the complex plane where Q vanishes or is singular.
type Kind int

const (
	RealSimple  Kind = iota // simple zero on the real axis
	ComplexPair             // simple zero off the axis, with its conjugate (Q real on the axis)
	Complex                 // simple zero off the axis without a conjugate partner
	Coalescing              // zero of order ≥ 2, or a cluster of zeros closer than the coalescence radius
	Pole                    // pole of Q (Order < 0)
)

var kindNames = [...]string{"real simple", "complex pair", "complex", "coalescing", "pole"}

// String returns the label used in tables and JSON.
func (k Kind) String() string {
	if k < 0 || int(k) >= len(kindNames) {
		return fmt.Sprintf("Kind(%d)", int(k))
	}
	return kindNames[k]
}

// Point is one zero (turning point) or pole of Q.
type Point struct {
	Z        complex128 // position
	Order    int        // multiplicity: m > 0 for a zero of order m, -m for a pole of order m
	Kind     Kind       // classification
	Residual float64    // |Q(Z)| for a zero, |1/Q(Z)| for a pole, after polishing
	Err      float64    // estimated error of Z (last Newton step or cluster radius)
}

// IsZero reports whether p is a turning point (Order > 0).
func (p Point) IsZero() bool { return p.Order > 0 }

// DefaultBox returns the search box used when a case gives none: the real
// interval [a, b] in real part and ±(b−a)/2 in imaginary part, wide enough to
// hold the complex turning points that govern above-barrier reflection on
// the scale of the interval.
func DefaultBox(a, b float64) Box {
	h := (b - a) / 2
	return Box{Lo: complex(a, -h), Hi: complex(b, h)}
}
