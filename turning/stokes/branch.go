package stokes

import (
	"math"
	"math/cmplx"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// nearRoot returns the square root of v nearer to ref (the principal root
// when ref is zero).
func nearRoot(v, ref complex128) complex128 {
	s := cmplx.Sqrt(v)
	if real(s)*real(ref)+imag(s)*imag(ref) < 0 {
		s = -s
	}
	return s
}

// track continues the root f0 of Q at x0 along the straight segment to x1
// and returns the root at x1. It bisects the segment while the phase of the
// root turns by more than π/4 over a piece, so that the nearest-root choice
// cannot jump branches.
func track(q jet.Func, x0, x1, f0 complex128) complex128 {
	return trackDepth(q, x0, x1, f0, 0)
}

func trackDepth(q jet.Func, x0, x1, f0 complex128, depth int) complex128 {
	f1 := nearRoot(q.Eval(x1), f0)
	if depth < 40 && f0 != 0 && f1 != 0 && math.Abs(cmplx.Phase(f1/f0)) > math.Pi/4 {
		xm := (x0 + x1) / 2
		fm := trackDepth(q, x0, xm, f0, depth+1)
		return trackDepth(q, xm, x1, fm, depth+1)
	}
	return f1
}

// tanh-sinh quadrature: nodes t = kh, |t| ≤ tsMax, finest level h = 2^-L.
const (
	tsMax      = 3.2
	tsMinLevel = 4
	tsMaxLevel = 9
	tsRelTol   = 1e-14
)

// tsNode is one tanh-sinh node of the finest level on [−1, 1]: the weight
// and the distance del from the nearer end (at −1 when lower), computed
// without cancellation.
type tsNode struct {
	wt, del float64
	lower   bool
}

var (
	tsOnce  sync.Once
	tsTable []tsNode // index k + tsK for k = −tsK … tsK at h = 2^−tsMaxLevel
	tsK     int
)

func tsInit() {
	h := math.Ldexp(1, -tsMaxLevel)
	tsK = int(math.Ceil(tsMax / h))
	tsTable = make([]tsNode, 2*tsK+1)
	for k := -tsK; k <= tsK; k++ {
		t := float64(k) * h
		s := math.Pi / 2 * math.Sinh(t)
		ch := math.Cosh(s)
		n := tsNode{wt: math.Pi / 2 * math.Cosh(t) / (ch * ch)}
		if s < 0 {
			n.lower, n.del = true, 2/(1+math.Exp(-2*s)) // 1 + tanh s
		} else {
			n.del = 2 / (1 + math.Exp(2*s)) // 1 − tanh s
		}
		if math.IsInf(ch, 0) || math.IsNaN(n.wt) {
			n.wt = 0
		}
		tsTable[k+tsK] = n
	}
}

// segment returns ∫_a^b √Q dx along the straight segment, the root taken as
// fa at a (a regular point, fa ≠ 0) and continued along the segment; b may
// be a zero or an integrable singularity of Q. It returns the integral, an
// error estimate (the difference between the two finest tanh-sinh levels,
// which converge double-exponentially, so the estimate is pessimistic) and
// the root continued to b (to the node nearest b when Q vanishes or is not
// finite there).
//
// A remainder beyond the last node is added for an integrable singularity
// at b (see tail). Each level halves h; the nodes it adds lie between those of the previous
// level, and their roots are continued from the neighbour on the a side,
// so the branch is followed node by node from a to b.
func segment(q jet.Func, a, b, fa complex128) (sum complex128, errEst float64, fb complex128) {
	hw := (b - a) / 2
	if hw == 0 {
		return 0, 0, fa
	}
	tsOnce.Do(tsInit)
	type node struct {
		x, f  complex128
		wt    float64
		valid bool
	}
	tail := func(nodes []node, b complex128) complex128 {
		// The nodes end a distance d ≈ e^(−π e^tsMax) |b − a| short of b
		// (or where x rounds to b). Where √Q ∝ (b − x)^α, the remainder
		// ∫_{x1}^b √Q dx is f1 (b − x1)/(α + 1), with α from the last two
		// nodes; it matters for α < 0 (a simple pole of Q gives α = −1/2
		// and a remainder of order √d).
		var n1, n2 *node
		for k := len(nodes) - 1; k >= 0 && n2 == nil; k-- {
			if nodes[k].valid {
				if n1 == nil {
					n1 = &nodes[k]
				} else {
					n2 = &nodes[k]
				}
			}
		}
		if n2 == nil {
			return 0
		}
		d1, d2 := cmplx.Abs(b-n1.x), cmplx.Abs(b-n2.x)
		a1, a2 := cmplx.Abs(n1.f), cmplx.Abs(n2.f)
		if d1 == 0 || d2 <= d1 || a1 == 0 || a2 == 0 {
			return 0
		}
		alpha := math.Log(a1/a2) / math.Log(d1/d2)
		if !(alpha > -0.95) {
			return 0
		}
		return n1.f * (b - n1.x) / complex(alpha+1, 0)
	}
	// nodes at level L, in order from a to b
	var nodes []node
	at := func(j, L int) node {
		n := tsTable[j<<(tsMaxLevel-L)+tsK]
		var x complex128
		if n.lower {
			x = a + hw*complex(n.del, 0)
		} else {
			x = b - hw*complex(n.del, 0)
		}
		return node{x: x, wt: n.wt, valid: n.wt > 0 && x != a && x != b}
	}
	var prev complex128
	for L := tsMinLevel; L <= tsMaxLevel; L++ {
		K := tsK >> (tsMaxLevel - L)
		next := make([]node, 0, 2*K+1)
		x0, f := a, fa
		for j := -K; j <= K; j++ {
			var n node
			if L > tsMinLevel && j%2 == 0 {
				n = nodes[j/2+len(nodes)/2]
			} else {
				n = at(j, L)
				if n.valid {
					n.f = track(q, x0, n.x, f)
					if cmplx.IsNaN(n.f) || cmplx.IsInf(n.f) {
						n.valid = false
					}
				}
			}
			if n.valid {
				x0, f = n.x, n.f
			}
			next = append(next, n)
		}
		nodes = next
		var fine complex128
		for _, n := range nodes {
			if n.valid {
				fine += complex(n.wt, 0) * n.f
			}
		}
		fine *= hw * complex(math.Ldexp(1, -L), 0)
		fine += tail(nodes, b)
		fb = f
		sum = fine
		if L > tsMinLevel {
			errEst = cmplx.Abs(fine - prev)
			if errEst <= tsRelTol*cmplx.Abs(fine) {
				break
			}
		}
		prev = fine
	}
	if qb := q.Eval(b); qb != 0 && !cmplx.IsNaN(qb) && !cmplx.IsInf(qb) {
		var xl complex128 = a
		for k := len(nodes) - 1; k >= 0; k-- {
			if nodes[k].valid {
				xl, fb = nodes[k].x, nodes[k].f
				break
			}
		}
		fb = track(q, xl, b, fb)
	}
	return sum, errEst, fb
}

// Gauss–Legendre nodes on [0, 1] for smooth pieces.
const glN = 12

var (
	glOnce sync.Once
	glX    [glN]float64
	glW    [glN]float64
)

// smooth returns ∫_a^b √Q dx over a short segment on which Q is analytic
// and free of zeros (both ends regular), by the 12-point Gauss–Legendre
// rule, the root continued from fa at a; and the root at b. The tracer
// uses it only over pieces no longer than a step, which keeps every
// singularity at least four lengths away (Settings.StepFraction), where
// the rule's error is below (1/8)^24 of the integrand's size.
func smooth(q jet.Func, a, b, fa complex128) (complex128, complex128) {
	glOnce.Do(func() { quad.Legendre{}.FixedLocations(glX[:], glW[:], 0, 1) })
	var s complex128
	x0, f := a, fa
	for j := range glX {
		x := a + (b-a)*complex(glX[j], 0)
		f = track(q, x0, x, f)
		x0 = x
		s += complex(glW[j], 0) * f
	}
	return s * (b - a), track(q, x0, b, f)
}
