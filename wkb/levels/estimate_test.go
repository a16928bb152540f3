package levels

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"github.com/turnpoint/turnpoint/connect/eigen"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// The error estimates must bracket the true error by a modest factor:
// true ≤ stated ≤ estimateSpan·true, where true is measured against an
// independent reference. Where the true error is at rounding level the
// upper check is against the floor instead (stated ≤ estimateSpan·floor).
const estimateSpan = 30

// checkEstimate reports whether stated brackets the error |got − ref| of a
// figure whose reference carries the error refErr.
func checkEstimate(t *testing.T, what string, got, stated, ref, refErr, floor float64, upper bool) {
	t.Helper()
	tr := math.Abs(got - ref)
	if tr > stated+refErr {
		t.Errorf("%s: %.15g, reference %.15g ± %.1g: true error %.2g above the estimate %.2g", what, got, ref, refErr, tr, stated)
	}
	if upper && stated > estimateSpan*math.Max(tr, floor) {
		t.Errorf("%s: estimate %.2g overstates the true error %.2g (floor %.1g) by %.3g×", what, stated, tr, floor, stated/math.Max(tr, floor))
	}
}

// doubleWell is V = v0(x² − 1)² + cx.
func doubleWell(v0, c float64) jet.Func {
	return jet.Map(func(x jet.Series) jet.Series {
		u := jet.Mul(x, x)
		u[0] -= 1
		return jet.Add(jet.Scale(complex(v0, 0), jet.Mul(u, u)), jet.Scale(complex(c, 0), x))
	})
}

func TestDoubletEstimates(t *testing.T) {
	t.Parallel()
	// Symmetric and asymmetric double wells, m = 1, ħ = 0.25 … 0.05, levels
	// from the bottom to just below the barrier top (V = 1 + …), mostly at
	// the default order of the command line (6). Reference: connect/eigen's
	// Split, a direct numerical solver accurate to ~1e-13 (its own Err is
	// used as the reference error).
	for _, tc := range []doubletCase{
		{"symmetric ħ=0.25", 1, 0, 0.25, 3, 6, []int{0, 1}},
		{"symmetric V0=1.5 ħ=0.15", 1.5, 0, 0.15, 2.6, 6, []int{0, 1}},
		// Levels 6 and 7 straddle the top (order 2 keeps the test short).
		{"symmetric V0=1.5 ħ=0.15 at the top", 1.5, 0, 0.15, 2.8, 2, []int{3}},
		{"symmetric ħ=0.1", 1, 0, 0.1, 3, 6, []int{0, 1, 2, 3}},
		{"symmetric ħ=0.05", 1, 0, 0.05, 3, 6, []int{0, 2, 3, 5}},
		{"asymmetric c=0.08 ħ=0.1", 1, 0.08, 0.1, 2.5, 6, []int{0, 1}},
		{"asymmetric c=0.05 ħ=0.15", 1, 0.05, 0.15, 3, 6, []int{0, 2}},
		{"asymmetric c=0.1 ħ=0.05", 1, 0.1, 0.05, 3, 6, []int{0, 1, 5}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			doubletEstimates(t, tc)
		})
	}
}

// doubletCase is V = v0(x² − 1)² + cx, m = 1, on [−l, l], doublets ns at
// MaxOrder order.
type doubletCase struct {
	name           string
	v0, c, hbar, l float64
	order          int
	ns             []int
}

func doubletEstimates(t *testing.T, tc doubletCase) {
	w := wkb.Well{V: doubleWell(tc.v0, tc.c), Mass: 1, Hbar: tc.hbar, A: -tc.l, B: tc.l}
	set := &Settings{MaxOrder: tc.order}
	ds, err := Doublets(w, tc.ns, set)
	if err != nil {
		t.Fatalf("%s: %v", tc.name, err)
	}
	for _, d := range ds {
		ref, err := eigen.Split(w, 2*d.N, nil)
		if err != nil {
			t.Fatalf("%s doublet %d: reference: %v", tc.name, d.N, err)
		}
		// Floor: the root tolerance of the levels, 1e-13 of max(|V_top|,
		// V_top − V_min) (Settings.Tol), which the estimates include.
		floor := 1e-13 * (tc.v0 + math.Abs(tc.c))
		for _, p := range []struct {
			l Level
			r eigen.Level
		}{{d.Lower, ref.Lower}, {d.Upper, ref.Upper}} {
			// A level without a next-order energy (the series had no root
			// there) states twice the last change: a bound only.
			upper := !hasWarning(p.l, "no next-order energy")
			checkEstimate(t, tc.name+" E["+strconv.Itoa(p.l.N)+"]", p.l.E, p.l.Err, p.r.E, p.r.Err, floor, upper)
		}
		// The splitting is its own figure, judged by its own change with
		// order (for neighbours in two wells, one below the other well's
		// bottom, too). Where one level lacks the next order or lies above
		// the barrier top (first order only) the estimate is the sum of the
		// two levels' and only a bound.
		above := func(l Level) bool { return strings.HasPrefix(l.Method, "above the barrier top") }
		bound := above(d.Lower) != above(d.Upper) ||
			hasWarning(d.Lower, "no next-order energy") || hasWarning(d.Upper, "no next-order energy")
		// Floor: the two root tolerances; the levels of a tunnelling
		// doublet (symmetric wells, below the top) are re-solved to
		// rounding, and there the floor is the reference's error or 16 ulp.
		sfloor := 2 * floor
		if tc.c == 0 && !above(d.Lower) && !above(d.Upper) {
			sfloor = math.Max(ref.Err, 16*0x1p-52*d.Upper.E)
		}
		checkEstimate(t, tc.name+" splitting["+strconv.Itoa(d.N)+"]", d.Splitting, d.SplittingErr, ref.Delta, ref.Err, sfloor, !bound)
	}
}

func TestSingleWellEstimates(t *testing.T) {
	t.Parallel()
	// Single wells at order 6 (the command line's default) against closed
	// forms and connect/eigen.
	pt := wkb.Well{V: poschlTeller(3, 0.9), Mass: 0.8, Hbar: 0.25, A: -12, B: 12}
	quart := wkb.Well{V: quartic(), Mass: 0.5, Hbar: 1, A: -6, B: 6}
	lin := wkb.Well{V: linear(0.7), Mass: 1.2, Hbar: 0.15, A: 0, B: 5, LeftWall: true}
	ms := wkb.Well{V: morse(6, 0.8), Mass: 1.3, Hbar: 0.2, A: -2, B: 12}
	ho := wkb.Well{V: harmonic(4.5), Mass: 2, Hbar: 0.3, A: -4, B: 4}
	zs := airyZeros(6)
	for _, tc := range []struct {
		name string
		w    wkb.Well
		ns   []int
		ref  func(n int) (float64, float64) // reference and its error
	}{
		{"Pöschl–Teller", pt, []int{0, 1, 3}, func(n int) (float64, float64) {
			// Landau & Lifshitz, QM §23 problem 4 (closed form).
			s := math.Sqrt(1 + 8*0.8*3/(0.25*0.25*0.9*0.9))
			return -0.25 * 0.25 * 0.9 * 0.9 / (8 * 0.8) * math.Pow(s-(1+2*float64(n)), 2), 1e-15
		}},
		{"quartic", quart, []int{1, 4, 10}, eigenRef(quart)},
		{"linear with wall", lin, []int{1, 5}, func(n int) (float64, float64) {
			// ψ = Ai((x − E/F)/ℓ), ℓ = (ħ²/2mF)^(1/3): E_n = −a_{n+1} F ℓ,
			// a_k the zeros of Ai (bisection on gonum's mathext.AiryAi).
			l := math.Cbrt(0.15 * 0.15 / (2 * 1.2 * 0.7))
			return -zs[n] * 0.7 * l, 1e-14
		}},
		{"Morse", ms, []int{0, 2, 7}, func(n int) (float64, float64) {
			// Morse, Phys. Rev. 34, 57 (1929), closed form.
			x := 0.2 * 0.8 * math.Sqrt(2*6/1.3) * (float64(n) + 0.5)
			return x - x*x/24, 1e-15
		}},
		{"harmonic", ho, []int{0, 3, 8}, func(n int) (float64, float64) {
			return 0.3 * math.Sqrt(4.5/2) * (float64(n) + 0.5), 1e-15 // ħω(n + ½)
		}},
	} {
		lv, err := Solve(tc.w, tc.ns, &Settings{MaxOrder: 6})
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		for _, l := range lv {
			ref, rerr := tc.ref(l.N)
			// Floor: the root tolerance (Settings.Tol = 1e-13, relative).
			floor := 1e-13 * math.Max(1, math.Abs(l.E))
			checkEstimate(t, tc.name+" E["+strconv.Itoa(l.N)+"]", l.E, l.Err, ref, rerr, floor, true)
		}
	}
}

func eigenRef(w wkb.Well) func(int) (float64, float64) {
	return func(n int) (float64, float64) {
		l, err := eigen.Solve(w, n, nil)
		if err != nil {
			return math.NaN(), 0
		}
		return l.E, l.Err
	}
}

func hasWarning(l Level, s string) bool {
	for _, w := range l.Warnings {
		if strings.Contains(w, s) {
			return true
		}
	}
	return false
}
