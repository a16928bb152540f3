package stokes

import (
	"math"
	"math/cmplx"
	"sort"
	"testing"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// sorted returns the angles sorted in (−π, π].
func sorted(a []float64) []float64 {
	b := append([]float64(nil), a...)
	sort.Float64s(b)
	return b
}

// TestAnglesLocal checks the start directions against the local expansion
// Q ≈ a(x−t)^m: the closed form w = (2/(m+2))√a (x−t)^((m+2)/2) must have
// Re w = 0 on every Stokes direction and Im w = 0 on every anti-Stokes one;
// directions of one family are 2π/(m+2) apart (120° for a simple zero, 90°
// for a double one) and the families interleave, π/(m+2) apart (60°, 45°).
func TestAnglesLocal(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		name string
		c    []complex128 // Q = Σ c_k x^k
		t    complex128
		m    int
	}{
		{"x", []complex128{0, 1}, 0, 1},
		{"-x", []complex128{0, -1}, 0, 1},
		{"(1+2i)(x-0.5)", []complex128{-0.5 - 1i, 1 + 2i}, 0.5, 1},
		{"x^2-1 at 1", []complex128{-1, 0, 1}, 1, 1},
		{"x^2-1 at -1", []complex128{-1, 0, 1}, -1, 1},
		{"i x^2", []complex128{0, 0, 1i}, 0, 2},
		{"(x-1)^2(x+2)", []complex128{2, -3, 0, 1}, 1, 2},
		{"x^3", []complex128{0, 0, 0, 1}, 0, 3},
	} {
		q := poly(tc.c...)
		p := turning.Point{Z: tc.t, Order: tc.m}
		a := q.Taylor(tc.t, tc.m)[tc.m] // leading coefficient, exact
		ws := func(th float64) complex128 {
			return complex(2/float64(tc.m+2), 0) * cmplx.Sqrt(a) * cmplx.Exp(complex(0, float64(tc.m+2)*th/2))
		}
		st, err := Angles(q, p, Stokes)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		an, err := Angles(q, p, AntiStokes)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if len(st) != tc.m+2 || len(an) != tc.m+2 {
			t.Errorf("%s: %d Stokes and %d anti-Stokes directions, want %d of each", tc.name, len(st), len(an), tc.m+2)
			continue
		}
		for _, th := range st {
			if w := ws(th); math.Abs(real(w)) > 1e-14*cmplx.Abs(w) {
				t.Errorf("%s: Stokes angle %g: local w = %v, want Re w = 0", tc.name, th, w)
			}
		}
		for _, th := range an {
			if w := ws(th); math.Abs(imag(w)) > 1e-14*cmplx.Abs(w) {
				t.Errorf("%s: anti-Stokes angle %g: local w = %v, want Im w = 0", tc.name, th, w)
			}
		}
		// Merged, the 2(m+2) directions are π/(m+2) apart and alternate.
		type dirn struct {
			th float64
			f  Family
		}
		var all []dirn
		for _, th := range st {
			all = append(all, dirn{th, Stokes})
		}
		for _, th := range an {
			all = append(all, dirn{th, AntiStokes})
		}
		sort.Slice(all, func(i, j int) bool { return all[i].th < all[j].th })
		gap := math.Pi / float64(tc.m+2)
		for k := range all {
			next := all[(k+1)%len(all)]
			d := next.th - all[k].th
			if k == len(all)-1 {
				d += 2 * math.Pi
			}
			if math.Abs(d-gap) > 1e-12 || next.f == all[k].f {
				t.Errorf("%s: directions %v (%v) and %v (%v) are %g apart, want %g and alternating families", tc.name, all[k].th, all[k].f, next.th, next.f, d, gap)
			}
		}
	}
}

// TestAnglesAiry checks exact directions. For Q = x, w = (2/3) x^(3/2), so
// arg w = (3/2) arg x: Re w = 0 where (3/2)θ = ±π/2, 3π/2, i.e. θ = π/3,
// −π/3, π; Im w = 0 where (3/2)θ = 0, ±π, i.e. θ = 0, ±2π/3. For the Airy
// equation Ai″ = z Ai, i.e. Q = −z, arg a = π shifts both sets by π/3:
// Stokes lines at 0, ±2π/3 (where ζ = (2/3) z^(3/2) is real, so e^(±ζ) are
// maximally dominant or subdominant, DLMF §9.7), anti-Stokes at ±π/3, π.
func TestAnglesAiry(t *testing.T) {
	t.Parallel()
	p := turning.Point{Z: 0, Order: 1}
	for _, tc := range []struct {
		name string
		q    []complex128
		f    Family
		want []float64
	}{
		{"x Stokes", []complex128{0, 1}, Stokes, []float64{-math.Pi / 3, math.Pi / 3, math.Pi}},
		{"x anti-Stokes", []complex128{0, 1}, AntiStokes, []float64{-2 * math.Pi / 3, 0, 2 * math.Pi / 3}},
		{"-z Stokes", []complex128{0, -1}, Stokes, []float64{-2 * math.Pi / 3, 0, 2 * math.Pi / 3}},
		{"-z anti-Stokes", []complex128{0, -1}, AntiStokes, []float64{-math.Pi / 3, math.Pi / 3, math.Pi}},
	} {
		got, err := Angles(poly(tc.q...), p, tc.f)
		if err != nil {
			t.Fatal(err)
		}
		got = sorted(got)
		for k := range tc.want {
			if math.Abs(got[k]-tc.want[k]) > 1e-14 {
				t.Errorf("%s: angles %v, want %v", tc.name, got, tc.want)
				break
			}
		}
	}
}

// TestAnglesPoles: a simple pole, Q ≈ b/(x−p), has w ≈ 2√b (x−p)^(1/2) and
// one line of each family (θ = π − arg b for Stokes, −arg b for
// anti-Stokes); a double pole none.
func TestAnglesPoles(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		name  string
		order int
		b     complex128
		want  []float64 // Stokes
	}{
		{"1/x", -1, 1, []float64{math.Pi}},
		{"i/x", -1, 1i, []float64{math.Pi / 2}},
		{"1/x^2", -2, 1, nil},
	} {
		b, k := tc.b, -tc.order
		qq := jet.Map(func(s jet.Series) jet.Series { // Q = 1 + b/x^k
			r := jet.Scale(b, jet.PowInt(s, -k))
			r[0]++
			return r
		})
		got, err := Angles(qq, turning.Point{Z: 0, Order: tc.order}, Stokes)
		if err != nil {
			t.Fatal(err)
		}
		if len(got) != len(tc.want) {
			t.Errorf("%s: angles %v, want %v", tc.name, got, tc.want)
			continue
		}
		for k := range got {
			if math.Abs(got[k]-tc.want[k]) > 1e-12 {
				t.Errorf("%s: angles %v, want %v", tc.name, got, tc.want)
			}
		}
	}
}
