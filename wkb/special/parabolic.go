package special

import "math"

// ParabolicPhase returns the phase of the parabolic-cylinder (Weber)
// connection through a barrier top,
//
//	φ(ε) = arg Γ(½ + iε) − ε ln|ε| + ε,    φ(0) = 0,
//
// where arg Γ is the continuous branch Im LogGamma(½ + iε), not a principal
// argument. φ is odd, continuous, vanishes like −ε ln|ε| at 0 and decays
// like 1/(24ε) for large |ε|; it is the correction that makes the
// first-order phase ε ln|ε| − ε of a barrier uniform through its top.
//
// For |ε| ≥ 5 the asymptotic series below is summed (its terms are below
// 1e-17 there before they grow); for smaller |ε| the phase comes from
// LogGamma, with an absolute error of about 1e-14.
//
// Derivation of the series: with z = iε the generalised Stirling series
// (DLMF 5.11.8 with h = ½) reads
//
//	ln Γ(z + ½) ~ z ln z − z + ½ ln 2π + Σ_{k≥1} B_{2k}(½) / (2k(2k−1) z^{2k−1}),
//
// B_{2k}(½) = −(1 − 2^{1−2k}) B_{2k} (DLMF 24.4.27). For ε > 0,
// Im(z ln z − z) = ε ln ε − ε, and Im z^{1−2k} = (−1)^k ε^{1−2k}, so
//
//	φ(ε) ~ Σ_{k≥1} (−1)^k B_{2k}(½) / (2k(2k−1)) ε^{1−2k}
//	     = 1/(24ε) + 7/(2880ε³) + 31/(40320ε⁵) + …
func ParabolicPhase(eps float64) float64 {
	switch {
	case math.IsNaN(eps):
		return math.NaN()
	case eps == 0:
		return 0
	case eps < 0:
		return -ParabolicPhase(-eps)
	case math.IsInf(eps, 1):
		return 0
	}
	if eps >= 5 {
		return parabolicAsymptotic(eps, 0)
	}
	return imag(LogGamma(complex(0.5, eps))) - eps*math.Log(eps) + eps
}

// ParabolicPhaseReduced returns φ(ε) less the first n terms of its
// large-ε series (see ParabolicPhase),
//
//	φ_n(ε) = φ(ε) − Σ_{j=1}^{n} (−1)^j B_{2j}(½) / (2j(2j−1)) ε^{1−2j},
//
// the phase of the parabolic connection when the phases are taken to the
// higher order 2n: the finite-part phase integrals to the turning points
// already hold the subtracted terms. φ_0 = φ. For n ≥ 1 it diverges like
// −1/(24ε) at ε = 0 and returns ±Inf there. n is capped at 17.
func ParabolicPhaseReduced(eps float64, n int) float64 {
	if n <= 0 {
		return ParabolicPhase(eps)
	}
	if n > maxBernoulli {
		n = maxBernoulli
	}
	switch {
	case math.IsNaN(eps):
		return math.NaN()
	case eps == 0:
		return math.Inf(-1)
	case eps < 0:
		return -ParabolicPhaseReduced(-eps, n)
	case math.IsInf(eps, 1):
		return 0
	}
	if eps >= 5 {
		return parabolicAsymptotic(eps, n)
	}
	s := ParabolicPhase(eps)
	for j := 0; j < n; j++ {
		s -= parabolicTerm(eps, j)
	}
	return s
}

// ParabolicPhaseCoeff returns the coefficient c_j of ε^(1−2j) in the
// large-ε series of φ (see ParabolicPhase), j ≥ 1:
//
//	c_j = (−1)^j B_{2j}(½) / (2j(2j−1)),   c_1 = 1/24, c_2 = 7/2880, c_3 = 31/40320.
//
// It returns NaN for j < 1 or j > 17.
func ParabolicPhaseCoeff(j int) float64 {
	if j < 1 || j > maxBernoulli {
		return math.NaN()
	}
	return parabolicTerm(1, j-1)
}

// parabolicTerm returns the term j (from 0) of the large-ε series of φ.
func parabolicTerm(eps float64, j int) float64 {
	n := float64(2*j + 2)
	bh := -(1 - math.Pow(2, 1-n)) * bernoulli[j] // B_{2j+2}(½)
	sign := 1.0
	if j%2 == 0 {
		sign = -1
	}
	return sign * bh / (n * (n - 1)) * math.Pow(eps, 1-n)
}

// parabolicAsymptotic sums the large-ε series of φ(ε) for ε ≥ 5 from its
// term `from` (counted from 0), stopping when the terms fall below 1e-17 of
// the sum or start to grow.
func parabolicAsymptotic(eps float64, from int) float64 {
	var s float64
	prev := math.Inf(1)
	for j := from; j < len(bernoulli); j++ {
		t := parabolicTerm(eps, j)
		if math.Abs(t) > prev {
			break
		}
		s += t
		if math.Abs(t) < 1e-17*math.Abs(s) {
			break
		}
		prev = math.Abs(t)
	}
	return s
}
