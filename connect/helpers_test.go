package connect

import (
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Test problems are built from jet operations (not the formula package).

// parabolicQ is Q = x²/4 − A.
func parabolicQ(A float64) jet.Func {
	return jet.Map(func(s jet.Series) jet.Series {
		return jet.Add(jet.Scale(0.25, jet.Mul(s, s)), jet.Const(complex(-A, 0), s.Order()))
	})
}

// sech2 is U/cosh²(α(x − c)).
func sech2(U, alpha, c float64) jet.Func {
	return jet.Map(func(s jet.Series) jet.Series {
		u := jet.Scale(complex(alpha, 0), jet.Add(s, jet.Const(complex(-c, 0), s.Order())))
		h := jet.Sech(u)
		return jet.Scale(complex(U, 0), jet.Mul(h, h))
	})
}

// directAmplitudes integrates y″ = −(λ²Q + Q1) y from b to a with the
// transmitted wave (t = 1) and higher-order WKB derivatives at both ends,
// and returns r, t in the package convention. Classical RK4 at step h and
// h/2 with Richardson extrapolation; err is the extrapolation change.
func directAmplitudes(p wkb.Problem, a, b float64, steps int) (r, t complex128, err float64) {
	r1, t1 := rk4Amplitudes(p, a, b, steps)
	r2, t2 := rk4Amplitudes(p, a, b, 2*steps)
	r = r2 + (r2-r1)/15
	t = t2 + (t2-t1)/15
	err = cmplx.Abs(r2-r1)/15 + cmplx.Abs(t2-t1)/15
	return r, t, err
}

// logDeriv returns y′/y of the WKB wave Q^(−1/4) exp(±iλ∫√Q) continued to
// order 3 (φ0 … φ3), sign = ±1.
func logDeriv(p wkb.Problem, x float64, sign float64) complex128 {
	q := p.Q.Eval(complex(x, 0))
	phi := wkb.RiccatiAt(p, complex(x, 0), complex(sign, 0)*cmplx.Sqrt(q), 3)
	l := p.Lambda
	return complex(l, 0)*phi[0] + phi[1] + phi[2]/complex(l, 0) + phi[3]/complex(l*l, 0)
}

func rk4Amplitudes(p wkb.Problem, a, b float64, steps int) (r, t complex128) {
	f := func(x float64, y [2]complex128) [2]complex128 {
		q := p.Q.Eval(complex(x, 0)) * complex(p.Lambda*p.Lambda, 0)
		if p.Q1 != nil {
			q += p.Q1.Eval(complex(x, 0))
		}
		return [2]complex128{y[1], -q * y[0]}
	}
	qb := p.Q.Eval(complex(b, 0))
	y := [2]complex128{cmplx.Pow(qb, -0.25), 0}
	y[1] = logDeriv(p, b, 1) * y[0]
	h := (a - b) / float64(steps)
	x := b
	for i := 0; i < steps; i++ {
		k1 := f(x, y)
		k2 := f(x+h/2, add(y, k1, h/2))
		k3 := f(x+h/2, add(y, k2, h/2))
		k4 := f(x+h, add(y, k3, h))
		for j := 0; j < 2; j++ {
			y[j] += complex(h/6, 0) * (k1[j] + 2*k2[j] + 2*k3[j] + k4[j])
		}
		x = b + float64(i+1)*h
	}
	// y = A w₊ + B w₋ at a, w± = Q^(−1/4) with log-derivatives d±.
	qa := p.Q.Eval(complex(a, 0))
	w := cmplx.Pow(qa, -0.25)
	dp, dm := logDeriv(p, a, 1), logDeriv(p, a, -1)
	// A + B = y/w, A dp + B dm = y′/w.
	u0, u1 := y[0]/w, y[1]/w
	A := (u1 - dm*u0) / (dp - dm)
	B := u0 - A
	return B / A, 1 / A
}

func add(y, k [2]complex128, h float64) [2]complex128 {
	return [2]complex128{y[0] + complex(h, 0)*k[0], y[1] + complex(h, 0)*k[1]}
}
