package stokes

import (
	"math"
	"math/cmplx"
	"testing"

	"gonum.org/v1/gonum/mathext"

	"github.com/turnpoint/turnpoint/turning"
)

// airyWaves returns the two WKB waves of Ai″ = z Ai and their derivatives
// at z, with their asymptotic series (DLMF 9.7.5–9.7.8) truncated at the
// least term:
//
//	u∓(z) = z^(−1/4) e^(∓ζ) Σ (∓1)^k u_k ζ^(−k) / (2√π),
//	u∓′(z) = ∓z^(1/4) e^(∓ζ) Σ (∓1)^k v_k ζ^(−k) / (2√π),   ζ = (2/3) z^(3/2),
//
// u_k = (6k−5)(6k−3)(6k−1)/((2k−1) 216 k) u_{k−1}, v_k = −(6k+1)/(6k−1) u_k
// (DLMF 9.7.2), principal powers. Written as y″ + λ²Q y = 0 the equation
// has Q = −z, λ = 1; with √Q = i z^(1/2), w = ∫_0^z √Q = iζ, so u∓ are the
// waves Q^(−1/4) exp(±iλw) up to constant factors. It also returns the
// size of the least term, the relative truncation error.
func airyWaves(z complex128) (um, ump, up, upp complex128, trunc float64) {
	zeta := 2.0 / 3 * cmplx.Pow(z, 1.5)
	z4 := cmplx.Pow(z, 0.25)
	var sm, smd, sp, spd complex128 // Σ for u−, u−′, u+, u+′
	u := 1.0
	pw := complex(1, 0) // ζ^(−k)
	trunc = math.Inf(1)
	for k := 0; k < 60; k++ {
		if k > 0 {
			fk := float64(k)
			u *= (6*fk - 5) * (6*fk - 3) * (6*fk - 1) / ((2*fk - 1) * 216 * fk)
			pw /= zeta
		}
		v := u
		if k > 0 {
			fk := float64(k)
			v = -(6*fk + 1) / (6*fk - 1) * u
		}
		term := cmplx.Abs(complex(u, 0) * pw)
		if term > trunc {
			break // past the least term
		}
		trunc = term
		sg := complex(1-2*float64(k%2), 0) // (−1)^k
		sm += sg * complex(u, 0) * pw
		smd += sg * complex(v, 0) * pw
		sp += complex(u, 0) * pw
		spd += complex(v, 0) * pw
	}
	c := complex(1/(2*math.Sqrt(math.Pi)), 0)
	em, ep := cmplx.Exp(-zeta), cmplx.Exp(zeta)
	um = c * em * sm / z4
	ump = -c * z4 * em * smd
	up = c * ep * sp / z4
	upp = c * z4 * ep * spd
	return um, ump, up, upp, trunc
}

// TestAiryStokesMultiplier decomposes Ai (gonum mathext.AiryAi and
// AiryAiDeriv, an independent library) into the two WKB waves,
// Ai = c− u− + c+ u+, by solving the 2×2 system for (Ai, Ai′) at |z| = 8,
// where the series are good to about e^(−2|ζ|) ≈ 1e−13.
//
// The Stokes lines of Q = −z leave 0 at arg z = 0, ±2π/3 (TestAnglesAiry,
// and traced below). On arg z = 2π/3, ζ < 0: u− ∝ e^(−ζ) is maximally
// dominant and u+ subdominant. DLMF 9.7.5 gives Ai ~ u− (c− = 1, c+ = 0)
// for |arg z| < 2π/3 with no e^(+ζ) part; continuing to arg z = π,
// Ai(−r) ~ cos(ξ − π/4)/(√π r^(1/4)) (DLMF 9.7.9, ξ = (2/3) r^(3/2)) equals
// (z^(−1/4)/(2√π))(e^(−ζ) + i e^(ζ)) with the principal powers (z^(1/4) =
// r^(1/4) e^(iπ/4), ζ = −iξ): c+ = i there. So crossing the Stokes line
// arg z = 2π/3 counterclockwise the coefficient of the subdominant wave
// jumps by +i times the dominant one; by Ai(z̄) = conj Ai(z), crossing
// arg z = −2π/3 clockwise it jumps by −i (counterclockwise again +i).
//
// Between the lines the fitted c+ is meaningful only to the truncation
// error divided by the subdominance |e^(2ζ)|, which sets the tolerance;
// the points on the anti-Stokes lines (arg z = ±π/3, ±π, |e^(2ζ)| = 1) are
// the sharp ones.
func TestAiryStokesMultiplier(t *testing.T) {
	t.Parallel()
	// The Stokes line the test crosses, from the tracer.
	g, err := Trace(poly(0, -1), []turning.Point{{Z: 0, Order: 1}}, turning.Box{Lo: -10 - 10i, Hi: 10 + 10i}, nil)
	if err != nil {
		t.Fatal(err)
	}
	var line float64 = math.NaN()
	for _, ln := range g.Lines {
		if ln.Family == Stokes && math.Abs(ln.StartAngle-2*math.Pi/3) < 1e-12 {
			line = ln.StartAngle
			for _, z := range ln.Path[1:] {
				zeta := 2.0 / 3 * cmplx.Pow(z, 1.5)
				if math.Abs(imag(zeta)) > 1e-8*cmplx.Abs(zeta) {
					t.Errorf("traced Stokes line at %v has Im ζ = %g, want ζ real", z, imag(zeta))
					break
				}
			}
		}
	}
	if math.IsNaN(line) {
		t.Fatalf("no traced Stokes line at arg z = 2π/3")
	}
	const R = 8.0
	for _, tc := range []struct {
		arg  float64
		want complex128 // c+/c−
	}{
		{math.Pi / 3, 0},         // anti-Stokes line before
		{line - math.Pi/6, 0},    // between, before the Stokes line
		{line + math.Pi/6, 1i},   // after it
		{math.Pi, 1i},            // anti-Stokes line after
		{-math.Pi / 3, 0},        // mirror images
		{-line + math.Pi/6, 0},   //
		{-line - math.Pi/6, -1i}, //
		{-math.Pi, -1i},          //
	} {
		z := cmplx.Rect(R, tc.arg)
		um, ump, up, upp, trunc := airyWaves(z)
		ai, aip := mathext.AiryAi(z), mathext.AiryAiDeriv(z)
		det := um*upp - up*ump
		cm := (ai*upp - up*aip) / det
		cp := (um*aip - ai*ump) / det
		ratio := cp / cm
		zeta := 2.0 / 3 * cmplx.Pow(z, 1.5)
		sub := math.Exp(2 * real(zeta)) // |u+/u−|²-like subdominance factor |e^(2ζ)|
		tol := 10*trunc/math.Min(1, sub) + 1e-12
		if cmplx.Abs(ratio-tc.want) > tol {
			t.Errorf("arg z = %.4f: c+/c− = %.3e, want %v (tol %.1e)", tc.arg, ratio, tc.want, tol)
		}
		if cmplx.Abs(cm-1) > tol {
			t.Errorf("arg z = %.4f: c− = %.6g, want 1", tc.arg, cm)
		}
	}
}
