package special

import (
	"math"
	"math/cmplx"
	"testing"
)

// closeC reports whether got and want agree within tol relative to
// max(1, |want|).
func closeC(got, want complex128, tol float64) bool {
	return cmplx.Abs(got-want) <= tol*math.Max(1, cmplx.Abs(want))
}

func TestBernoulli(t *testing.T) {
	t.Parallel()
	// Exact values typed from memory (DLMF Table 24.2.1).
	for _, c := range []struct {
		n    int
		want float64
	}{
		{2, 1.0 / 6}, {4, -1.0 / 30}, {6, 1.0 / 42}, {8, -1.0 / 30}, {10, 5.0 / 66},
		{12, -691.0 / 2730}, {14, 7.0 / 6}, {16, -3617.0 / 510}, {20, -174611.0 / 330},
	} {
		if got := bernoulli[c.n/2-1]; math.Abs(got-c.want) > 1e-15*math.Abs(c.want) {
			t.Errorf("B_%d = %v, want %v", c.n, got, c.want)
		}
	}
}

func TestLogGammaReal(t *testing.T) {
	t.Parallel()
	// Reference: math.Lgamma (standard library).
	for _, x := range []float64{1e-8, 0.1, 0.5, 0.9, 1, 1.5, 2, 2.5, 3.7, 7.25, 14.9, 15, 30.5, 171.3, 1e4, 1e8,
		-0.5, -1.5, -2.25, -7.9, -30.1, -1e-6} {
		want, sign := math.Lgamma(x)
		got := LogGamma(complex(x, 0))
		if math.Abs(real(got)-want) > 2e-15*math.Max(1, math.Abs(want)) {
			t.Errorf("Re LogGamma(%g) = %.17g, want %.17g", x, real(got), want)
		}
		if c := math.Cos(imag(got)); math.Abs(c-float64(sign)) > 1e-12 {
			t.Errorf("Im LogGamma(%g) = %g does not give the sign %d of Γ", x, imag(got), sign)
		}
		if x > 0 && imag(got) != 0 {
			t.Errorf("Im LogGamma(%g) = %g, want 0", x, imag(got))
		}
		g := Gamma(complex(x, 0))
		if wg := math.Gamma(x); real(g) != wg {
			t.Errorf("Gamma(%g) = %v, want %v", x, g, wg)
		}
	}
	if g := LogGamma(-3); !math.IsInf(real(g), 1) {
		t.Errorf("LogGamma(-3) = %v, want +Inf", g)
	}
	if g := Gamma(0); !cmplx.IsInf(g) {
		t.Errorf("Gamma(0) = %v, want Inf", g)
	}
}

var complexPoints = []complex128{
	0.3 + 0.2i, 0.5 + 1i, 1 + 1i, 2 - 3i, 0.49 + 7i, 0.51 + 7i, -0.3 + 0.7i, -2.6 - 1.1i,
	-12.3 + 4i, 5 + 14.99i, 5 + 15.01i, 14.99 + 0.1i, 20 - 40i, -40 + 0.01i, 1e-3i, 100 + 100i,
	-0.5 + 30i, 3 + 120i,
}

func TestLogGammaRecurrence(t *testing.T) {
	t.Parallel()
	// ln Γ(z+1) = ln Γ(z) + ln z on the principal branch (DLMF 5.5.1), which
	// also checks that the branch is continuous across Re z = ½ and |z| = 15.
	for _, z := range complexPoints {
		got := LogGamma(z + 1)
		want := LogGamma(z) + cmplx.Log(z)
		if !closeC(got, want, 1e-14) { // documented accuracy of LogGamma
			t.Errorf("LogGamma(%v+1) = %v, want LogGamma(z)+ln z = %v", z, got, want)
		}
	}
}

func TestGammaIdentities(t *testing.T) {
	t.Parallel()
	for _, z := range complexPoints {
		if cmplx.Abs(z) > 50 {
			continue // Γ under- or overflows the identities' float range
		}
		// Reflection Γ(z)Γ(1−z) = π/sin πz (DLMF 5.5.3).
		// Documented relative accuracy of Gamma: 1e-14·max(1, |ln Γ|) per factor.
		tol := func(zs ...complex128) float64 {
			s := 0.0
			for _, z := range zs {
				s += 1e-14 * math.Max(1, cmplx.Abs(LogGamma(z)))
			}
			return s
		}
		got := Gamma(z) * Gamma(1-z)
		want := math.Pi / cmplx.Sin(math.Pi*z)
		if cmplx.Abs(got-want) > tol(z, 1-z)*cmplx.Abs(want) {
			t.Errorf("Gamma(%v)Gamma(1-z) = %v, want %v", z, got, want)
		}
		// Duplication Γ(z)Γ(z+½) = 2^{1−2z} √π Γ(2z) (DLMF 5.5.5).
		got = Gamma(z) * Gamma(z+0.5)
		want = cmplx.Pow(2, 1-2*z) * math.SqrtPi * Gamma(2*z)
		if cmplx.Abs(got-want) > tol(z, z+0.5, 2*z)*cmplx.Abs(want) {
			t.Errorf("Gamma(%v)Gamma(z+1/2) = %v, want %v", z, got, want)
		}
	}
	// Γ(i) typed from memory: −0.1549498283018106 − 0.4980156681183560i.
	if g, want := Gamma(1i), complex(-0.1549498283018106, -0.4980156681183560); !closeC(g, want, 1e-14) {
		t.Errorf("Gamma(i) = %v, want %v", g, want)
	}
}

func TestGammaModulus(t *testing.T) {
	t.Parallel()
	for _, y := range []float64{1e-4, 0.3, 1, 2.5, 10, 40, 200} {
		// |Γ(½ + iy)|² = π/cosh πy (DLMF 5.4.4), in logarithms to avoid underflow:
		// ln cosh πy = πy + ln((1+e^{−2πy})/2).
		got := 2 * real(LogGamma(complex(0.5, y)))
		want := math.Log(math.Pi) - (math.Pi*y + math.Log1p(math.Exp(-2*math.Pi*y)) - math.Ln2)
		if math.Abs(got-want) > 2e-14*math.Max(1, math.Abs(want)) { // 2 × documented accuracy
			t.Errorf("2 Re LogGamma(1/2+%gi) = %.16g, want %.16g", y, got, want)
		}
		// |Γ(iy)|² = π/(y sinh πy) (DLMF 5.4.3): ln sinh πy = πy + ln((1−e^{−2πy})/2).
		got = 2 * real(LogGamma(complex(0, y)))
		want = math.Log(math.Pi) - math.Log(y) - (math.Pi*y + math.Log(-math.Expm1(-2*math.Pi*y)) - math.Ln2)
		if math.Abs(got-want) > 2e-14*math.Max(1, math.Abs(want)) {
			t.Errorf("2 Re LogGamma(%gi) = %.16g, want %.16g", y, got, want)
		}
	}
}

func TestLogGammaStirling(t *testing.T) {
	t.Parallel()
	// Stirling with two terms, DLMF 5.11.1: the remainder is below the third
	// term 1/(360 z³) in modulus times sec³(arg z / 2) ≤ 2√2 (DLMF 5.11.2).
	for _, z := range []complex128{1e3, 1e3 + 1e3i, -1e3 + 2e3i, 5e2i, 1e5 - 3e4i} {
		st := (z-0.5)*cmplx.Log(z) - z + 0.5*complex(math.Log(2*math.Pi), 0) + 1/(12*z) - 1/(360*z*z*z)
		bound := 2*math.Sqrt2/(1260*math.Pow(cmplx.Abs(z), 5)) + 1e-15*cmplx.Abs(st)
		if got := LogGamma(z); cmplx.Abs(got-st) > bound {
			t.Errorf("LogGamma(%v) = %v, Stirling %v, difference %g > %g", z, got, st, cmplx.Abs(got-st), bound)
		}
	}
}

func TestLogGammaConjugate(t *testing.T) {
	t.Parallel()
	for _, z := range complexPoints {
		if got, want := LogGamma(cmplx.Conj(z)), cmplx.Conj(LogGamma(z)); got != want {
			t.Errorf("LogGamma(conj %v) = %v, want %v", z, got, want)
		}
	}
}

func TestParabolicPhaseSmall(t *testing.T) {
	t.Parallel()
	// Taylor series of Im ln Γ(½ + iε) with ψ⁽ⁿ⁾(½) = (−1)ⁿ⁺¹ n! (2ⁿ⁺¹−1) ζ(n+1)
	// (DLMF 5.15.3) and ψ(½) = −γ − 2 ln 2 (DLMF 5.4.13):
	//	φ(ε) = −ε ln ε + (1 − γ − 2 ln 2) ε + (7ζ(3)/3) ε³ − (31ζ(5)/5) ε⁵ + O(ε⁷),
	// the O(ε⁷) coefficient being (127/7) ζ(7) ≈ 18.3.
	// γ, ζ(3), ζ(5) typed from memory.
	const (
		gamma = 0.5772156649015329
		zeta3 = 1.2020569031595942
		zeta5 = 1.0369277551433699
	)
	for _, eps := range []float64{1e-12, 1e-6, 1e-3, 0.01, 0.03} {
		want := -eps*math.Log(eps) + (1-gamma-2*math.Ln2)*eps + 7*zeta3/3*math.Pow(eps, 3) - 31*zeta5/5*math.Pow(eps, 5)
		tol := 20*math.Pow(eps, 7) + 2e-15
		if got := ParabolicPhase(eps); math.Abs(got-want) > tol {
			t.Errorf("ParabolicPhase(%g) = %.16g, want %.16g (tol %g)", eps, got, want, tol)
		}
		if got, want := ParabolicPhase(-eps), -ParabolicPhase(eps); got != want {
			t.Errorf("ParabolicPhase(%g) = %v, want %v (odd)", -eps, got, want)
		}
	}
	if got := ParabolicPhase(0); got != 0 {
		t.Errorf("ParabolicPhase(0) = %v, want 0", got)
	}
}

func TestParabolicPhaseLarge(t *testing.T) {
	t.Parallel()
	// Large-ε series derived in ParabolicPhase's comment; the first neglected
	// term is 127/(215040 ε⁷) and the next ones are smaller for ε ≥ 2, so
	// twice it bounds the remainder there.
	for _, eps := range []float64{2, 3, 4.5, 4.999999, 5, 7, 20, 1e3, 1e8} {
		want := 1/(24*eps) + 7/(2880*math.Pow(eps, 3)) + 31/(40320*math.Pow(eps, 5))
		tol := 2*127/(215040*math.Pow(eps, 7)) + 1e-14*want
		if got := ParabolicPhase(eps); math.Abs(got-want) > tol {
			t.Errorf("ParabolicPhase(%g) = %.16g, want %.16g (tol %g)", eps, got, want, tol)
		}
	}
	// Both evaluation paths agree at the switch ε = 5: the direct one is
	// Im LogGamma(½+5i) − 5 ln 5 + 5 (definition).
	direct := imag(LogGamma(0.5+5i)) - 5*math.Log(5) + 5
	if got := ParabolicPhase(5); math.Abs(got-direct) > 3e-14 {
		t.Errorf("ParabolicPhase(5) = %.16g, direct %.16g", got, direct)
	}
}

func TestParabolicPhaseReduced(t *testing.T) {
	t.Parallel()
	// φ_n = φ − (first n terms of the series in ParabolicPhase's comment).
	for _, eps := range []float64{0.3, 2, 4.9, 5.1, 12, -3} {
		phi := ParabolicPhase(eps)
		for n, sub := range []float64{0, 1 / (24 * eps), 1/(24*eps) + 7/(2880*math.Pow(eps, 3))} {
			want := phi - sub
			if got := ParabolicPhaseReduced(eps, n); math.Abs(got-want) > 1e-14*math.Max(1, math.Abs(sub)) {
				t.Errorf("ParabolicPhaseReduced(%g, %d) = %.16g, want %.16g", eps, n, got, want)
			}
		}
	}
}

// TestParabolicPhaseCoeff: the first coefficients of φ(ε) ~ Σ c_j ε^(1−2j),
// from B_2(½) = −1/12, B_4(½) = 7/240, B_6(½) = −31/1344 (DLMF 24.4.27 with
// B_2 = 1/6, B_4 = −1/30, B_6 = 1/42): c_j = (−1)^j B_{2j}(½)/(2j(2j−1)).
func TestParabolicPhaseCoeff(t *testing.T) {
	for _, c := range []struct {
		j    int
		want float64
	}{{1, 1.0 / 24}, {2, 7.0 / 2880}, {3, 31.0 / 40320}} {
		if got := ParabolicPhaseCoeff(c.j); math.Abs(got-c.want) > 1e-15*c.want {
			t.Errorf("c_%d = %.17g, want %.17g", c.j, got, c.want)
		}
	}
	for _, j := range []int{0, 18} {
		if !math.IsNaN(ParabolicPhaseCoeff(j)) {
			t.Errorf("c_%d = %g, want NaN", j, ParabolicPhaseCoeff(j))
		}
	}
}
