package turning

import (
	"math"
	"testing"
)

func TestPolyRoots(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		name  string
		roots []complex128 // the polynomial is Π (x − r), expanded
		tol   float64
	}{
		{"real distinct", []complex128{1, 2, 3}, 1e-13},                     // x³ − 6x² + 11x − 6
		{"real with complex pair", []complex128{-1, 1 + 2i, 1 - 2i}, 1e-13}, // real coefficients
		{"complex coefficients", []complex128{1i, -2 + 1i, 0.5}, 1e-13},
		{"complex with conjugate roots", []complex128{1i, -1i, 2 + 1i}, 1e-13},
		{"complex with double root", []complex128{1i, 1i, -1}, 1e-7}, // double root: error ~ sqrt(eps)
		{"root at zero", []complex128{0, 1 + 1i}, 1e-14},
	} {
		got, err := PolyRoots(fromRoots(tc.roots))
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if e := matchError(got, tc.roots); e > tc.tol {
			t.Errorf("%s: PolyRoots = %v, want %v (error %.2g)", tc.name, got, tc.roots, e)
		}
	}
}

func TestPolyRootsEdgeCases(t *testing.T) {
	t.Parallel()
	if r, err := PolyRoots([]complex128{3}); err != nil || len(r) != 0 {
		t.Errorf("constant: PolyRoots = %v, %v, want no roots", r, err)
	}
	if r, err := PolyRoots([]complex128{-2, 1, 0, 0}); err != nil || len(r) != 1 || math.Abs(real(r[0])-2) > 1e-15 {
		t.Errorf("trailing zeros: PolyRoots = %v, %v, want [2]", r, err)
	}
	for _, c := range [][]complex128{nil, {0, 0}, {1, complex(math.NaN(), 0)}, {complex(math.Inf(1), 0), 1}} {
		if _, err := PolyRoots(c); err == nil {
			t.Errorf("PolyRoots(%v): no error", c)
		}
	}
}
