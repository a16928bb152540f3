package direct

import (
	"math"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// sechBarrier returns y″ + λ²(E − U0 sech²(αx)) y = 0, the Schrödinger
// equation with 2m = 1 and ħ = 1/λ, built from jet operations.
func sechBarrier(U0, alpha, E, lambda float64) wkb.Problem {
	q := jet.Map(func(s jet.Series) jet.Series {
		c := jet.Sech(jet.Scale(complex(alpha, 0), s))
		v := jet.Scale(complex(-U0, 0), jet.Mul(c, c))
		v[0] += complex(E, 0)
		return v
	})
	return wkb.Problem{Q: q, Lambda: lambda}
}

// sechBarrierRT is the exact transmission of U0/cosh²(αx) (Landau &
// Lifshitz, Quantum Mechanics, §25, problem on this barrier):
//
//	T = sinh²(πk/α) / (sinh²(πk/α) + cosh²((π/2)√(8mU0/(ħ²α²) − 1))),
//
// with cos² replacing cosh² of the modulus of the root when 8mU0/(ħ²α²) < 1.
// Here 2m = 1, ħ = 1/λ, k = λ√E, so 8mU0/(ħ²α²) = 4U0λ²/α². R = 1 − T is
// formed as cosh²/(sinh² + cosh²) directly, with logarithms of sinh and cosh,
// so that an exponentially small R is not lost to cancellation.
func sechBarrierRT(U0, alpha, E, lambda float64) (R, T float64) {
	A := math.Pi * lambda * math.Sqrt(E) / alpha
	d := 4*U0*lambda*lambda/(alpha*alpha) - 1
	lsA := logSinh(A)
	var lcB float64
	if d >= 0 {
		lcB = logCosh(math.Pi / 2 * math.Sqrt(d))
	} else {
		lcB = math.Log(math.Abs(math.Cos(math.Pi / 2 * math.Sqrt(-d))))
	}
	x := math.Exp(2 * (lcB - lsA)) // R/T = cosh²B / sinh²A
	return x / (1 + x), 1 / (1 + x)
}

// logSinh returns ln sinh(x) for x > 0 without overflow.
func logSinh(x float64) float64 {
	if x < 20 {
		return math.Log(math.Sinh(x))
	}
	return x - math.Ln2 + math.Log1p(-math.Exp(-2*x))
}

// logCosh returns ln cosh(x) without overflow.
func logCosh(x float64) float64 {
	x = math.Abs(x)
	return x - math.Ln2 + math.Log1p(math.Exp(-2*x))
}

// smoothStep returns Q(x) = q1 + (q2 − q1)/(1 + e^(−x/w)), built from jet
// operations: the smooth step of Landau & Lifshitz §25 in λ-form, and the
// Epstein graded layer at normal incidence with q = n².
func smoothStep(q1, q2, w, lambda float64) wkb.Problem {
	q := jet.Map(func(s jet.Series) jet.Series {
		n := s.Order()
		one := jet.Const(1, n)
		den := jet.Add(one, jet.Exp(jet.Scale(complex(-1/w, 0), s)))
		v := jet.Scale(complex(q2-q1, 0), jet.Div(one, den))
		v[0] += complex(q1, 0)
		return v
	})
	return wkb.Problem{Q: q, Lambda: lambda}
}

// smoothStepR is the exact reflection of the smooth step U0/(1 + e^(−αx))
// (Landau & Lifshitz, Quantum Mechanics, §25, problem on this potential):
//
//	R = [sinh(π(k1 − k2)/α) / sinh(π(k1 + k2)/α)]²,
//
// k1, k2 the wave numbers on the two sides. In λ-form k = λ√q and
// α = 1/w. As α → ∞ it tends to the Fresnel value ((k1−k2)/(k1+k2))² of
// a sharp step, as it must; the same formula with k = k0 n is the
// reflectance of the Epstein layer at normal incidence. Logarithms keep a
// tiny R from underflowing in the intermediate sinh.
func smoothStepR(q1, q2, w, lambda float64) float64 {
	k1, k2 := lambda*math.Sqrt(q1), lambda*math.Sqrt(q2)
	d := math.Abs(k1 - k2)
	if d == 0 {
		return 0
	}
	return math.Exp(2 * (logSinh(math.Pi*w*d) - logSinh(math.Pi*w*(k1+k2))))
}
