package turning

import (
	"math"
	"math/cmplx"
	"testing"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

func newTestFinder(q jet.Func) *finder {
	set, _ := (*Settings)(nil).resolved(1)
	return &finder{q: q, set: set, scale: 1, vals: map[complex128]complex128{}, sides: map[sideKey]*sideData{}}
}

// TestGaussKronrodNodes: the 15-point Kronrod rule integrates xᵏ over
// [−1, 1] exactly for k ≤ 22 (degree 3n+1 for n = 7), the 7-point Gauss
// rule for k ≤ 13 (Piessens et al., QUADPACK, 1983, §2.2); ∫ xᵏ = 2/(k+1)
// for even k, 0 for odd k.
func TestGaussKronrodNodes(t *testing.T) {
	t.Parallel()
	for k := 0; k <= 22; k++ {
		want := 0.0
		if k%2 == 0 {
			want = 2 / float64(k+1)
		}
		var kr, ga float64
		for i := 0; i < 8; i++ {
			v := math.Pow(xgk[i], float64(k))
			if i < 7 {
				v += math.Pow(-xgk[i], float64(k))
			}
			kr += wgk[i] * v
			if i%2 == 1 {
				ga += wg[i/2] * v
			}
		}
		if math.Abs(kr-want) > 1e-15 {
			t.Errorf("Kronrod ∫x^%d = %.17g, want %.17g", k, kr, want)
		}
		if k <= 13 && math.Abs(ga-want) > 1e-15 {
			t.Errorf("Gauss ∫x^%d = %.17g, want %.17g", k, ga, want)
		}
	}
}

// TestCircleWinding: the winding number of zᵐ about 0 is m (argument
// principle); a zero and a pole both inside give 0, one inside gives ±1.
func TestCircleWinding(t *testing.T) {
	t.Parallel()
	one := func(s jet.Series, c complex128) jet.Series { return jet.Const(c, s.Order()) }
	dipole := jet.Map(func(s jet.Series) jet.Series { return jet.Div(jet.Sub(s, one(s, 0.5)), jet.Add(s, one(s, 0.5))) })
	for _, tc := range []struct {
		name string
		q    jet.Func
		z    complex128
		r    float64
		want int
	}{
		{"z^3", jet.Map(func(s jet.Series) jet.Series { return jet.PowInt(s, 3) }), 0.1, 1, 3},
		{"z^-2", jet.Map(func(s jet.Series) jet.Series { return jet.PowInt(s, -2) }), -0.2i, 1, -2},
		{"dipole, both inside", dipole, 0, 1, 0},
		{"dipole, zero inside", dipole, 0.5, 0.2, 1},
		{"dipole, pole inside", dipole, -0.5, 0.2, -1},
		{"exp, none", jet.Map(jet.Exp), 0, 3, 0},
	} {
		w, fail := newTestFinder(tc.q).circleWinding(tc.z, tc.r)
		if fail != nil || w != tc.want {
			t.Errorf("%s: winding %d (fail %v), want %d", tc.name, w, fail, tc.want)
		}
	}
}

// TestSideMoments: for Q = z − z0, J_0 = ∫_a^b dz/(z − z0) = log((b − z0)/(a − z0))
// on a segment that does not pass z0, and J_1 = ∫ u/(z − z0) dz with
// u = (z − m)/ℓ is (b − a)/ℓ + (m0/ℓ)·J_0, m0 = z0 − m (partial fractions).
func TestSideMoments(t *testing.T) {
	t.Parallel()
	z0 := 0.3 + 0.05i
	q := jet.Map(func(s jet.Series) jet.Series { return jet.Sub(s, jet.Const(z0, s.Order())) })
	a, b := complex(-1, 0), complex(1, 0)
	f := newTestFinder(q)
	j, qerr, ok := f.sideMoments(a, b, 4)
	if !ok {
		t.Fatal("quadrature failed")
	}
	l := cmplx.Abs(b - a)
	m := (a + b) / 2
	j0 := cmplx.Log((b - z0) / (a - z0))
	j1 := (b-a)/complex(l, 0) + (z0-m)/complex(l, 0)*j0
	if cmplx.Abs(j[0]-j0) > 1e-10 || cmplx.Abs(j[1]-j1) > 1e-10 {
		t.Errorf("J0 = %v, J1 = %v, want %v, %v", j[0], j[1], j0, j1)
	}
	if qerr > 1e-10 {
		t.Errorf("error estimate %.2g above tolerance", qerr)
	}
	d, fail := f.sideArg(a, b, baseSegs)
	if fail != nil || math.Abs(d-imag(j0)) > 1e-12 {
		t.Errorf("sampled change of arg %v (fail %v), want %v", d, fail, imag(j0))
	}
}
