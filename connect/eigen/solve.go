package eigen

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"sync"

	"github.com/turnpoint/turnpoint/wkb"
)

// Solver holds the meshes of one well, which do not depend on the energy, so
// that many levels and counts share them. A Solver is safe for concurrent use.
type Solver struct {
	w   wkb.Well
	set Settings
	c   float64 // 2m/ħ²

	xs   []float64 // base mesh nodes
	ic0  int       // default matching node of the base mesh
	vmin float64   // smallest cell mean of V on the base mesh
	emax float64   // lowest potential at an open end (+Inf if both are walls)

	ends      [2]endData
	symmetric bool // mirror-symmetric potential and mesh

	mu     sync.Mutex
	meshes []*mesh
}

// endData is the potential at an end, for the decaying boundary condition.
type endData struct {
	open   bool
	v, dv  float64 // V and dV/dx at the end
	d2v    float64 // d²V/dx² at the end (NaN if not finite)
	x      float64
	inward float64 // +1 at A, −1 at B
}

// NewSolver checks the well and builds its base mesh.
func NewSolver(w wkb.Well, s *Settings) (*Solver, error) {
	set := s.withDefaults()
	switch {
	case w.V == nil:
		return nil, errors.New("eigen: well has no potential")
	case !(w.Mass > 0) || math.IsInf(w.Mass, 0):
		return nil, fmt.Errorf("eigen: mass must be positive and finite, got %g", w.Mass)
	case !(w.Hbar > 0) || math.IsInf(w.Hbar, 0):
		return nil, fmt.Errorf("eigen: hbar must be positive and finite, got %g", w.Hbar)
	case math.IsNaN(w.A) || math.IsNaN(w.B) || math.IsInf(w.A, 0) || math.IsInf(w.B, 0):
		return nil, fmt.Errorf("eigen: interval ends must be finite, got [%g, %g]", w.A, w.B)
	case !(w.A < w.B):
		return nil, fmt.Errorf("eigen: interval [%g, %g] is empty", w.A, w.B)
	}
	if set.Tol < 1e-15 {
		return nil, fmt.Errorf("eigen: tolerance %g is below what double precision can reach", set.Tol)
	}
	sv := &Solver{w: w, set: set, c: 2 * w.Mass / (w.Hbar * w.Hbar), emax: math.Inf(1)}
	var xs []float64
	var err error
	if w.LeftWall == w.RightWall && symmetric(w.V, w.A, w.B) {
		sv.symmetric = true
		xs, err = mirrored(w.V, sv.c, w.A, w.B, set.Step, set.MaxCells)
	} else {
		xs, err = baseMesh(w.V, sv.c, w.A, w.B, set.Step, set.MaxCells)
	}
	if err != nil {
		return nil, err
	}
	sv.xs = xs
	m0, err := newMesh(w.V, sv.c, xs, 0)
	if err != nil {
		return nil, err
	}
	// Matching node: an end of the cell with the lowest mean potential,
	// which is classically allowed for every bound state; never an end of
	// the interval.
	imin := 0
	for i, q := range m0.q {
		if q < m0.q[imin] {
			imin = i
		}
	}
	sv.vmin = m0.q[imin] / sv.c
	ic := imin
	if ic == 0 {
		ic = 1
	}
	if ic >= len(m0.q) {
		ic = len(m0.q) - 1
	}
	sv.ic0 = ic
	sv.meshes = []*mesh{m0}
	for k, e := range []struct {
		x      float64
		wall   bool
		inward float64
	}{{w.A, w.LeftWall, 1}, {w.B, w.RightWall, -1}} {
		d := endData{open: !e.wall, x: e.x, inward: e.inward}
		if d.open {
			t := w.V.Taylor(complex(e.x, 0), 2)
			d.v, d.dv, d.d2v = real(t[0]), real(t[1]), 2*real(t[2])
			if math.IsNaN(d.v) || math.IsInf(d.v, 0) || math.IsNaN(d.dv) || math.IsInf(d.dv, 0) {
				return nil, fmt.Errorf("eigen: potential is not finite at the open end x = %g", e.x)
			}
			if math.IsNaN(d.d2v) || math.IsInf(d.d2v, 0) {
				d.d2v = math.NaN() // not usable: the second correction is left out
			}
			sv.emax = math.Min(sv.emax, d.v)
		}
		sv.ends[k] = d
	}
	return sv, nil
}

// mesh returns mesh j (the base mesh with every cell split into 2^j parts),
// building it on first use.
func (sv *Solver) mesh(j int) (*mesh, error) {
	sv.mu.Lock()
	defer sv.mu.Unlock()
	for len(sv.meshes) <= j {
		m, err := newMesh(sv.w.V, sv.c, sv.xs, len(sv.meshes))
		if err != nil {
			return nil, err
		}
		sv.meshes = append(sv.meshes, m)
	}
	return sv.meshes[j], nil
}

// start returns the initial state at end k (0 = A, 1 = B; for B in the
// reflected coordinate) at energy E: ψ = 0 at a wall, the decaying WKB
// solution at an open end. With q = 2m(V − E)/ħ² and ′ the derivative
// inwards, the Riccati series of ψ′/ψ for ψ″ = qψ (φ′ + φ² = q, φ₀ = √q,
// 2φ₀φ_j = −φ′_(j−1) − Σ φ_l φ_(j−l)) gives
//
//	ψ′/ψ = √q − q′/(4q) + q″/(8q^(3/2)) − 5q′²/(32q^(5/2)) + … ,
//
// taken as far as the terms decrease (the first correction only if it
// leaves more than half of √q). ok is false if the open end is classically
// allowed at E.
//
// With alt set, the last term used is dropped (ψ = 0 if only √q was used):
// the change of E it causes bounds the error of the end condition (see
// endShift).
func (sv *Solver) start(k int, e float64, alt bool) (s state, ok bool) {
	d := sv.ends[k]
	if !d.open {
		return state{0, 1}, true
	}
	q := sv.c * (d.v - e)
	if !(q > 0) {
		return state{0, 1}, false
	}
	dq := sv.c * d.dv * d.inward // derivative along the inward direction
	d2q := sv.c * d.d2v
	r := math.Sqrt(q)
	terms := []float64{r}
	if t1 := -dq / (4 * q); r+t1 > 0.5*r {
		terms = append(terms, t1)
		t2 := d2q/(8*q*r) - 5*dq*dq/(32*q*q*r)
		if math.Abs(t2) < 0.5*math.Abs(t1) {
			terms = append(terms, t2)
		}
	}
	if alt {
		if len(terms) == 1 {
			return state{0, 1}, true
		}
		terms = terms[:len(terms)-1]
	}
	var kap float64
	for _, t := range terms {
		kap += t
	}
	n := math.Hypot(1, kap)
	return state{1 / n, kap / n}, true
}

// shot is the result of shooting at one energy on one mesh.
type shot struct {
	d     float64 // θ_L(c) − θ_R(c), continuous and increasing in E
	count int     // number of eigenvalues below E
	ok    bool    // both open ends forbidden at E
}

// shoot integrates from both ends to the matching node ic0 (a base-mesh
// index) at energy e. With the Prüfer angles θ_L(A) ∈ [0, π), θ_R(B) ∈ (0, π],
// the eigenvalue E_n is the root of D(E) = θ_L(c) − θ_R(c) = nπ and the number
// of eigenvalues below E is ⌈D/π⌉ (Sturm oscillation; Pryce, Numerical
// Solution of Sturm–Liouville Problems, 1993, ch. 5).
func (sv *Solver) shoot(m *mesh, ic0 int, e float64) shot {
	return sv.shootEnd(m, ic0, e, false)
}

// shootEnd is shoot, with the alternative end condition of start if alt
// is set.
func (sv *Solver) shootEnd(m *mesh, ic0 int, e float64, alt bool) shot {
	ce := sv.c * e
	ic := ic0 * m.parts
	sl, okl := sv.start(0, e, alt)
	sr, okr := sv.start(1, e, alt)
	i0, i1 := 0, len(m.h)
	if j, s, ok := m.skip(ce, ic, false); ok {
		i0, sl = j, s
	}
	if j, s, ok := m.skip(ce, ic, true); ok {
		i1, sr = j, s
	}
	sl, zl := m.sweep(sl, ce, i0, ic, false)
	sr, zr := m.sweep(sr, ce, ic, i1, true)
	sr.v = -sr.v // back from the reflected coordinate
	// Scale of the angles at c: the local wave number, bounded below by the
	// inverse interval length.
	qe := 0.5 * (m.q[ic] + m.q[ic-1] - 2*ce)
	k := math.Max(math.Sqrt(math.Abs(qe)), 1/(sv.w.B-sv.w.A))
	al := sl.reduced(k)
	ar := sr.reduced(k)
	var d float64
	var cnt int
	if ar == 0 { // ψ_R(c) = 0, counted in zr
		d = float64(zl+zr-1)*math.Pi + al
		cnt = zl + zr - 1
		if al > 0 {
			cnt++
		}
	} else {
		d = float64(zl+zr)*math.Pi + al - ar
		cnt = zl + zr
		if al > ar {
			cnt++
		}
	}
	return shot{d: d, count: cnt, ok: okl && okr}
}

// Count returns the number of levels of the well below E, the Prüfer node
// count of the discretised problem on the base mesh halved twice. That
// count is exact for the discretised problem; it is the true count unless E
// lies within the discretisation error of a level (of the order of 1e-4 of
// the level spacing with the default Step), where Level's extrapolated
// energies are the ones to compare with.
func (sv *Solver) Count(e float64) (int, error) {
	if math.IsNaN(e) || math.IsInf(e, 0) {
		return 0, fmt.Errorf("eigen: energy must be finite, got %g", e)
	}
	m, err := sv.mesh(min(2, sv.set.MaxRefine))
	if err != nil {
		return 0, err
	}
	r := sv.shoot(m, sv.ic0, e)
	if !r.ok {
		return r.count, fmt.Errorf("eigen: an open end is classically allowed at E = %g: widen the interval", e)
	}
	return r.count, nil
}

// Count returns the number of levels of the well below E (see Solver.Count).
func Count(w wkb.Well, e float64) (int, error) {
	sv, err := NewSolver(w, nil)
	if err != nil {
		return 0, err
	}
	return sv.Count(e)
}

// Solve computes level n of the well (n interior nodes): see Solver.Level.
func Solve(w wkb.Well, n int, s *Settings) (Level, error) {
	sv, err := NewSolver(w, s)
	if err != nil {
		return Level{N: n}, err
	}
	return sv.Level(n)
}

// Levels computes the levels ns of the well, sharing the meshes, two at a
// time in parallel. All levels are returned, in the order of ns, with the
// errors of those that failed joined (see errors.Join); a failed level
// carries its status and best estimate.
func Levels(w wkb.Well, ns []int, s *Settings) ([]Level, error) {
	sv, err := NewSolver(w, s)
	if err != nil {
		return nil, err
	}
	return sv.Levels(ns)
}

// Levels computes the levels ns, two at a time in parallel (see Levels).
func (sv *Solver) Levels(ns []int) ([]Level, error) {
	out := make([]Level, len(ns))
	errs := make([]error, len(ns))
	workers := min(2, runtime.GOMAXPROCS(0), len(ns))
	next := make(chan int)
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				out[i], errs[i] = sv.Level(ns[i])
			}
		}()
	}
	for i := range ns {
		next <- i
	}
	close(next)
	wg.Wait()
	return out, errors.Join(errs...)
}
