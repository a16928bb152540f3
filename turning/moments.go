package turning

import (
	"math"
	"math/cmplx"
)

// nMom is the highest moment (1/2πi)∮ ζᵏ Q′/Q dz computed on a cell. For the
// zeros and poles z_j of orders m_j inside, in the cell's scaled coordinate
// ζ = (z − c)/h, the moments are Σ m_j ζ_jᵏ (Delves & Lyness, Math. Comp.
// 21, 543 (1967)): k = 0 is the winding number, k = 1…nMom tell an empty
// cell from one holding a zero next to a pole, and a single cluster from
// several.
const nMom = 4

// quadTol is the absolute tolerance of the side integrals; quadPanels
// bounds the number of panels of one side.
const (
	quadTol    = 1e-13
	quadPanels = 300
	noiseErr   = 1e-6 // a panel error this small that bisection does not halve is rounding noise
)

// Gauss–Kronrod 7–15 nodes and weights on [−1, 1] (QUADPACK qk15; Piessens
// et al., QUADPACK, Springer 1983). xgk[1], xgk[3], xgk[5] and xgk[7] = 0 are
// the Gauss nodes with weights wg.
var (
	xgk = [8]float64{
		0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
		0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
		0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
		0.207784955007898467600689403773245, 0,
	}
	wgk = [8]float64{
		0.022935322010529224963732008058970, 0.063092092629978553290700663189204,
		0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
		0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
		0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
	}
	wg = [4]float64{
		0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
		0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
	}
)

type momVec [nMom + 1]complex128

// sideMoments returns J_j = ∫_a^b uʲ Q′(z)/Q(z) dz, u = (z − (a+b)/2)/|b − a|,
// j = 0…nMom, starting from n equal panels, by globally adaptive Gauss–Kronrod quadrature (the panel with
// the largest error is bisected next, as in QUADPACK's qag), with the
// estimated absolute error (the Gauss–Kronrod differences added up). The
// panel budget bounds the work where rounding noise in Q′/Q keeps the
// estimate above the tolerance. ok is false when Q′/Q is not finite at a node.
func (f *finder) sideMoments(a, b complex128, n int) (momVec, float64, bool) {
	type panel struct {
		t0, t1 float64
		k      momVec
		err    float64
		noisy  bool // bisection did not lower the error: rounding level
	}
	mid := (a + b) / 2
	l := cmplx.Abs(b - a)
	eval := func(t0, t1 float64) (panel, bool) {
		k, g, good := f.gk15(a, b, mid, l, t0, t1)
		p := panel{t0: t0, t1: t1, k: k}
		for j := range k {
			p.err = math.Max(p.err, cmplx.Abs(k[j]-g[j]))
		}
		return p, good
	}
	var ps []panel
	for i := 0; i < n; i++ {
		p, good := eval(float64(i)/float64(n), float64(i+1)/float64(n))
		if !good {
			return momVec{}, 0, false
		}
		ps = append(ps, p)
	}
	for {
		worst, total := -1, 0.0
		for i, p := range ps {
			total += p.err
			if !p.noisy && (worst < 0 || p.err > ps[worst].err) {
				worst = i
			}
		}
		if total <= quadTol || worst < 0 || len(ps) >= quadPanels+n {
			var sum momVec
			for _, p := range ps {
				for j := range sum {
					sum[j] += p.k[j]
				}
			}
			return sum, total, true
		}
		w := ps[worst]
		tm := (w.t0 + w.t1) / 2
		p1, good1 := eval(w.t0, tm)
		p2, good2 := eval(tm, w.t1)
		if !good1 || !good2 {
			return momVec{}, 0, false
		}
		if p1.err+p2.err > 0.5*w.err && w.err < noiseErr {
			p1.noisy, p2.noisy = true, true
		}
		ps[worst] = p1
		ps = append(ps, p2)
	}
}

// gk15 returns the Kronrod and Gauss estimates of the moment integrals over
// the parameter interval [t0, t1] of the side from a to b.
func (f *finder) gk15(a, b, mid complex128, l, t0, t1 float64) (kr, ga momVec, ok bool) {
	half := (t1 - t0) / 2
	cen := (t0 + t1) / 2
	dz := (b - a) * complex(half, 0)
	node := func(t float64) (momVec, bool) {
		z := a + (b-a)*complex(t, 0)
		s := f.taylor(z, 1)
		ld := s[1] / s[0]
		if !isFinite(ld) {
			return momVec{}, false
		}
		u := (z - mid) / complex(l, 0)
		var v momVec
		p := ld * dz
		for j := range v {
			v[j] = p
			p *= u
		}
		return v, true
	}
	for i := 0; i < 8; i++ {
		pts := []float64{cen - half*xgk[i], cen + half*xgk[i]}
		if i == 7 {
			pts = pts[:1]
		}
		for _, t := range pts {
			v, good := node(t)
			if !good {
				return kr, ga, false
			}
			for j := range v {
				kr[j] += complex(wgk[i], 0) * v[j]
				if i%2 == 1 {
					ga[j] += complex(wg[i/2], 0) * v[j]
				}
			}
		}
	}
	return kr, ga, true
}
