package direct

import (
	"math"
	"testing"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// barrierQ1 returns Q = 1 + 0.3 tanh x − 1.2 e^(−x²), Q1 = 2 e^(−x²): a
// barrier (and a Q1 bump) near x = 0 between flat stretches.
func barrierQ1(lambda float64) wkb.Problem {
	q := jet.Map(func(s jet.Series) jet.Series {
		g := jet.Exp(jet.Neg(jet.Mul(s, s)))
		v := jet.Sub(jet.Scale(0.3, jet.Tanh(s)), jet.Scale(1.2, g))
		v[0] += 1
		return v
	})
	q1 := jet.Map(func(s jet.Series) jet.Series {
		return jet.Scale(2, jet.Exp(jet.Neg(jet.Mul(s, s))))
	})
	return wkb.Problem{Q: q, Q1: q1, Lambda: lambda}
}

// tanhLayer returns Q = 1.625 + 0.625 tanh(x/w), a layer from Q = 1 to
// Q = 2.25 (index 1 → 1.5) of width w, which is the smooth step
// q1 + (q2 − q1)/(1 + e^(−2x/w)) of smoothStep with width w/2.
func tanhLayer(w, lambda float64) wkb.Problem {
	q := jet.Map(func(s jet.Series) jet.Series {
		v := jet.Scale(0.625, jet.Tanh(jet.Scale(complex(1/w, 0), s)))
		v[0] += 1.625
		return v
	})
	return wkb.Problem{Q: q, Lambda: lambda}
}

// narrowGauss returns Q = 1 + 0.3 e^(−((x−c)/w)²), entire: far from c its
// jets underflow to those of a constant.
func narrowGauss(w, c, lambda float64) wkb.Problem {
	q := jet.Map(func(s jet.Series) jet.Series {
		s = append(jet.Series(nil), s...)
		s[0] -= complex(c, 0)
		x := jet.Scale(complex(1/w, 0), s)
		v := jet.Scale(0.3, jet.Exp(jet.Neg(jet.Mul(x, x))))
		v[0] += 1
		return v
	})
	return wkb.Problem{Q: q, Lambda: lambda}
}

// A feature in the middle of a long flat stretch must not be jumped over:
// the jets far out carry no information about it.
func TestLongIntervalFeature(t *testing.T) {
	t.Parallel()
	// 40-digit reference of cases/validate (testdata, general-q1 at
	// λ = 12, computed with mpmath on [−20, 20]); Q is flat to 1e-17 at
	// the ends of every interval below.
	const wantT = 0.000624907549276165656
	for _, c := range []struct {
		a, b   float64
		method MethodChoice
	}{
		{-20, 20, RealAxis},
		{-8, 18, RealAxis},
		{-8, 19, RealAxis}, // was T = 0.97643 ± 1e-13: the barrier jumped over
		{-8, 30, RealAxis},
		{-8, 60, RealAxis},
		{-60, 60, RealAxis},
		{-60, 60, Auto},
	} {
		res, err := Scatter(barrierQ1(12), c.a, c.b, &Settings{Method: c.method})
		if err != nil {
			t.Errorf("[%g, %g]: %v", c.a, c.b, err)
			continue
		}
		if d := math.Abs(res.T-wantT) / wantT; d > 1e-10 || res.Status != Converged {
			t.Errorf("[%g, %g] %v: T = %.12g (%v), want %.12g", c.a, c.b, c.method, res.T, res.Status, wantT)
		}
		checkBracket(t, "T", res.T, wantT, res.ErrT)
	}
}

func TestThinLayerFarEnds(t *testing.T) {
	t.Parallel()
	// Reference: smoothStepR, the exact R of the smooth step (Landau &
	// Lifshitz §25) with width w/2 (tanh(x/w) = 2/(1 + e^(−2x/w)) − 1);
	// the sharp-interface (Fresnel) value would be ((1 − 1.5)/(1 + 1.5))² = 0.04.
	for _, c := range []struct {
		w, lambda float64
		L         float64 // ends at ±L (at least 60 w: tanh flat to 1e-52)
		method    MethodChoice
	}{
		{0.05, 20, 3, RealAxis}, // R ≈ 1.17e-3
		{0.05, 20, 20, RealAxis},
		{0.05, 20, 60, RealAxis}, // was R = 0.04 ± 2e-13
		{0.05, 20, 3, Auto},
		{0.05, 20, 60, Auto},
		{0.01, 200, 60, RealAxis}, // R ≈ 3.19e-6
		{0.01, 200, 60, Auto},     // the scan must find the poles at ±iπw/2 for the path height
	} {
		want := smoothStepR(1, 2.25, c.w/2, c.lambda)
		res, err := Scatter(tanhLayer(c.w, c.lambda), -c.L, c.L, &Settings{Method: c.method})
		if err != nil {
			t.Errorf("w=%g L=%g %v: %v", c.w, c.L, c.method, err)
			continue
		}
		if d := math.Abs(res.R-want) / want; d > 1e-10 || res.Status != Converged {
			t.Errorf("w=%g L=%g %v: R = %.12g (%v), want %.12g", c.w, c.L, c.method, res.R, res.Status, want)
		}
		checkBracket(t, "R", res.R, want, res.ErrR)
	}
}

func TestNarrowEntireFeature(t *testing.T) {
	t.Parallel()
	// A Gaussian of width 0.05 whose jets vanish in float64 beyond 1.4 from
	// its centre c, and a jump from x = 60 would land at −60; c = 1.37 is
	// off every grid of the scan. Reference: the same problem on
	// [c − 1.5, c + 1.5], where Q is flat to e^(−900) at the ends and
	// nothing can be jumped over (compared within both estimates).
	const w = 0.05
	for _, c := range []struct{ centre, lambda float64 }{{0, 20}, {0, 100}, {1.37, 20}, {1.37, 100}} {
		lambda := c.lambda
		short, err := Scatter(narrowGauss(w, c.centre, lambda), c.centre-1.5, c.centre+1.5, nil)
		if err != nil {
			t.Fatal(err)
		}
		for _, m := range []MethodChoice{RealAxis, Auto} {
			long, err := Scatter(narrowGauss(w, c.centre, lambda), -60, 60, &Settings{Method: m})
			if err != nil {
				t.Errorf("λ=%g %v: %v", lambda, m, err)
				continue
			}
			if d := math.Abs(long.R - short.R); d > long.ErrR+short.ErrR {
				t.Errorf("c=%g λ=%g %v: R = %.12g ± %.3g (%v) on [−60, 60], %.12g ± %.3g near c", c.centre,
					lambda, m, long.R, long.ErrR, long.Status, short.R, short.ErrR)
			}
			if d := math.Abs(long.T - short.T); d > long.ErrT+short.ErrT || d > 1e-10 {
				t.Errorf("c=%g λ=%g %v: T = %.15g ± %.3g on [−60, 60], %.15g ± %.3g near c", c.centre,
					lambda, m, long.T, long.ErrT, short.T, short.ErrT)
			}
		}
	}
}

// doubleGauss returns Q = 2(E − V0(e^(−((x−d)/s)²) + e^(−((x+d)/s)²))),
// two Gaussian barriers (m = 1).
func doubleGauss(v0, d, s, e, lambda float64) wkb.Problem {
	q := jet.Map(func(z jet.Series) jet.Series {
		g := func(c float64) jet.Series {
			u := append(jet.Series(nil), z...)
			u[0] -= complex(c, 0)
			u = jet.Scale(complex(1/s, 0), u)
			return jet.Exp(jet.Neg(jet.Mul(u, u)))
		}
		v := jet.Scale(complex(-2*v0, 0), jet.Add(g(d), g(-d)))
		v[0] += complex(2*e, 0)
		return v
	})
	return wkb.Problem{Q: q, Lambda: lambda}
}

// At the half-height point of a narrow resonance (Γ ≈ 7e-6) T is ill
// conditioned, ≈ E/Γ ≈ 7e4: rounding made between the barriers is
// amplified by that much, and the estimate must say so.
func TestNarrowResonance(t *testing.T) {
	t.Parallel()
	// 30-digit references of cases/validate (testdata/references.txt,
	// double-barrier, mpmath on [−5, 5]): V0 = 0.8, d = 1.2, s = 0.35,
	// ħ = 0.08 (λ = 12.5); E is the T = 1/2 point above the resonance.
	const E = 0.4680556828588
	const wantR, wantT = 0.500000263438131852986969579418, 0.499999736561868147013030420582
	res, err := Scatter(doubleGauss(0.8, 1.2, 0.35, E, 12.5), -4, 4, nil)
	if err != nil {
		t.Fatal(err)
	}
	checkBracket(t, "T", res.T, wantT, res.ErrT)
	checkBracket(t, "R", res.R, wantR, res.ErrR)
	if d := math.Abs(res.T - wantT); d > 1e-9 || res.ErrT > 1e3*d {
		t.Errorf("T = %.15g ± %.3g, want %.15g", res.T, res.ErrT, wantT)
	}
}
