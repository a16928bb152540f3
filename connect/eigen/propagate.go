package eigen

import "math"

// state is the direction of (ψ, ψ′), of moderate length; its amplitude is
// never needed.
type state struct{ u, v float64 }

// class returns ⌊θ/π⌋ for the representative θ ∈ (−π, π] of the Prüfer
// angle of s (tan θ = ψ/ψ′ up to a positive scale): −1 below the axis, 0 on
// or above it, 1 on the negative ψ′ axis. It depends on signs only, so that
// every scale gives the same class and the node bookkeeping of consecutive
// cells agrees.
func (s state) class() int {
	switch {
	case s.u < 0:
		return -1
	case s.u > 0:
		return 0
	case s.v < 0:
		return 1
	}
	return 0
}

// angle returns the representative in (−π, π] of the Prüfer angle of s with
// scale k, tan θ = kψ/ψ′, consistent with class.
func (s state) angle(k float64) float64 {
	if s.u == 0 {
		if s.v < 0 {
			return math.Pi
		}
		return 0
	}
	return math.Atan2(k*s.u, s.v)
}

// reduced returns the Prüfer angle of s with scale k modulo π: 0 exactly
// when ψ = 0, otherwise in (0, π) even where rounding would give 0 or π, so
// that it stays consistent with the zero count (which changes only when ψ
// changes sign).
func (s state) reduced(k float64) float64 {
	if s.u == 0 {
		return 0
	}
	a := math.Atan2(k*s.u, s.v)
	if a < 0 {
		a += math.Pi
	}
	if a <= 0 {
		a = math.SmallestNonzeroFloat64
	}
	if a >= math.Pi {
		a = math.Nextafter(math.Pi, 0)
	}
	return a
}

// classMiddle is a Prüfer angle within π/2 of every angle of class −1, 0, 1.
var classMiddle = [3]float64{-math.Pi / 2, math.Pi / 2, math.Pi}

// step advances s over a cell of length h on which ψ″ = qe ψ with qe
// constant, and returns the new state and the number of zeros of ψ in (0, h].
//
// For qe < 0 the solution is ρ sin(θ + kx), k = √(−qe), with the scaled Prüfer
// angle tan θ = kψ/ψ′: the angle advances by exactly kh, so any number of
// oscillations in the cell is counted exactly. For qe ≥ 0 the solution is a
// combination of cosh and sinh and has at most one zero, detected by a
// change of sign.
func step(s state, qe, h float64) (state, int) {
	if qe < 0 {
		k := math.Sqrt(-qe)
		if k > 1e-150 {
			phi := s.angle(k) + k*h
			sn, cs := math.Sincos(phi)
			// No normalisation: |(sin, k cos)| lies between min(1, k) and
			// max(1, k), and only the direction is used.
			n := state{u: sn, v: k * cs}
			// The angle of the stored state, continued by whole turns to the
			// one reached: count = ⌊Φ/π⌋ − ⌊θ0/π⌋ with Φ = φ1 + 2πM, where φ1
			// is the representative of n's class; M is the nearest integer
			// to (Φ − φ1)/2π, for which the middle of the class (within π/2
			// of φ1) is enough.
			c1 := n.class()
			m := math.Round((phi - classMiddle[c1+1]) / (2 * math.Pi))
			return n, 2*int(m) + c1 - s.class()
		}
		qe = 0
	}
	kap := math.Sqrt(qe)
	x := kap * h
	var n state
	if x < 1 {
		c := math.Cosh(x)
		sh := h // sinh(κh)/κ
		if kap > 0 {
			sh = math.Sinh(x) / kap
		}
		n = state{u: c*s.u + sh*s.v, v: qe*sh*s.u + c*s.v}
	} else {
		// Divided by e^(κh)/2 to avoid overflow: only the direction matters.
		e2 := math.Exp(-2 * x)
		c := 1 + e2
		sm := -math.Expm1(-2 * x)
		n = state{u: c*s.u + sm/kap*s.v, v: kap*sm*s.u + c*s.v}
	}
	if nv := math.Max(math.Abs(n.u), math.Abs(n.v)); nv > 0 {
		n.u /= nv
		n.v /= nv
	}
	cnt := 0
	if s.u != 0 && (n.u == 0 || (n.u < 0) != (s.u < 0)) {
		cnt = 1
	}
	return n, cnt
}

// cell advances s over a cell of length h on which ψ″ = (qe + a·u) ψ, u the
// distance from the middle of the cell, and returns the new state and the
// number of zeros of ψ in (0, h].
//
// The constant part is propagated exactly (step) over each half cell; the
// slope enters through its first-order effect in the interaction picture
// of the constant problem centred on the cell, a symmetric modified-Magnus
// step in the spirit of the constant-perturbation methods (Ixaru, Numerical
// Methods for Differential Equations and Applications, 1984):
//
//	T = T₀(h/2) exp(Ω) T₀(h/2),  Ω = ∫ T₀(−u) [0 0; a·u 0] T₀(u) du over |u| ≤ h/2.
//
// With T₀(u) = [C S; qe·S C], C = cos ku, S = sin(ku)/k (k² = −qe), the
// integrand is a·u [−SC −S²; C² SC]; only the even entries survive, so
// Ω = diag(−aP, aP) with P = ∫ u S C du = (sin kh − kh cos kh)/(4k³)
// (sinh/cosh for qe > 0), and exp(Ω) rescales ψ and ψ′ by positive factors:
// it never moves ψ through zero, so the node count of the two exact half
// steps is the count of the cell. The eigenvalue error drops from O(h²) to
// O(h⁴), and stays an expansion in even powers since the step is symmetric.
// In a forbidden cell P grows like e^(κh); there the correction is faded out
// between κh = 1 and 3, where the solution has decayed by e^(−κh) per cell
// and the correction has no measurable effect on the energy.
func cell(s state, qe, h, a float64) (state, int) {
	var p float64
	if qe < 0 {
		k := math.Sqrt(-qe)
		x := k * h
		if x < 0.1 {
			x2 := x * x
			p = h * h * h / 12 * (1 - x2/10 + x2*x2/280) // (sin x − x cos x)/(4k³) = h³/12 (1 − x²/10 + x⁴/280 − …)
		} else {
			sn, cs := math.Sincos(x)
			p = (sn - x*cs) / (4 * k * k * k)
		}
	} else {
		kap := math.Sqrt(qe)
		x := kap * h
		switch {
		case x < 0.1:
			x2 := x * x
			p = h * h * h / 12 * (1 + x2/10 + x2*x2/280)
		case x < 3:
			p = (x*math.Cosh(x) - math.Sinh(x)) / (4 * kap * kap * kap)
			if x > 1 { // smooth fade-out: 1 at κh = 1, 0 at κh = 3
				t := (x - 1) / 2
				p *= 1 - t*t*(3-2*t)
			}
		}
	}
	n, c1 := step(s, qe, h/2)
	if f := math.Exp(a * p); f != 1 {
		n.u /= f
		n.v *= f
	}
	n, c2 := step(n, qe, h/2)
	return n, c1 + c2
}

// sweep advances s over cells [i0, i1) (i0 ≤ i1, forwards) or, with
// reverse, over cells i1−1 down to i0 in the reflected coordinate −x, at the
// scaled energy ce = cE, and returns the final state and the number of zeros.
func (m *mesh) sweep(s state, ce float64, i0, i1 int, reverse bool) (state, int) {
	zeros := 0
	var z int
	if !reverse {
		for i := i0; i < i1; i++ {
			s, z = cell(s, m.q[i]-ce, m.h[i], m.a[i])
			zeros += z
		}
		return s, zeros
	}
	for i := i1 - 1; i >= i0; i-- {
		s, z = cell(s, m.q[i]-ce, m.h[i], -m.a[i]) // the slope changes sign in −x
		zeros += z
	}
	return s, zeros
}

// skipAction is the forbidden-region action ∫√(q − cE) dx beyond which the
// solution shot inwards has forgotten its end condition: the other solution
// is suppressed by e^(−2·skipAction) ≈ 4e-18 relative to the kept one.
const skipAction = 20

// skip finds, from the end (not beyond the matching node ic) (the left one, or the right one with reverse),
// the point where the action measured outwards from the first classically
// allowed cell exceeds skipAction, and returns its node index (the first
// cell to sweep from the left, or one past the last from the right) with the
// decaying solution of the cell there as starting state. ok is false if no
// such point exists (the end is within reach of the turning point); the
// sweep then starts at the end. The rounding-level jumps of the starting
// point with E are far below the accuracy of the angles.
func (m *mesh) skip(ce float64, ic int, reverse bool) (int, state, bool) {
	n := len(m.h)
	if !reverse {
		t := 0
		for t < ic && m.q[t]-ce > 0 {
			t++
		}
		var action float64
		for i := t - 1; i >= 0; i-- {
			qe := m.q[i] - ce
			action += math.Sqrt(qe) * m.h[i]
			if action > skipAction {
				return i, decaying(qe), true
			}
		}
		return 0, state{}, false
	}
	t := n - 1
	for t >= ic && m.q[t]-ce > 0 {
		t--
	}
	var action float64
	for i := t + 1; i < n; i++ {
		qe := m.q[i] - ce
		action += math.Sqrt(qe) * m.h[i]
		if action > skipAction {
			return i + 1, decaying(qe), true
		}
	}
	return n, state{}, false
}

// decaying is the direction (1, κ), κ = √qe, of the solution that decays
// outwards in a forbidden cell (in the reflected coordinate on the right).
func decaying(qe float64) state {
	k := math.Sqrt(qe)
	r := math.Hypot(1, k)
	return state{1 / r, k / r}
}
