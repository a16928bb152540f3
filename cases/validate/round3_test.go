package validate_test

import (
	"fmt"
	"math"
	"math/cmplx"
	"strconv"
	"sync"
	"testing"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/cases/study"
)

// The third validation round: turning points and poles in the complex plane
// (positions, orders, kinds, stated errors, the argument-principle count),
// the start angles of Stokes and anti-Stokes lines and the degeneracy gap,
// and a few scattering and level figures with parameters unlike rounds 1
// and 2 (Eckart with mass ≠ 1, the parabolic barrier, Morse at high n with
// max_order 8, Pöschl–Teller next to threshold). Every reference is in
// testdata/round3.txt, written by reference/round3.py, which names the
// source of each value.
//
// The Eckart closed form used there reduces, for A = 0 and B = 4V0, to
// T = sinh²(πka)/(sinh²(πka) + cosh²(π sqrt(2mV0a²/ħ² − ¼))) (Landau &
// Lifshitz §25 problem 4) and, for B = 0 (δ = i/2), to 1 − R with
// R = [sinh π(k1−k2)L / sinh π(k1+k2)L]² (§25 problem 2), which fixes its
// 2π factors.

var (
	round3Once sync.Once
	round3Refs map[string]ref
	round3Err  error
)

func mustRound3(t *testing.T, name, qty, at string) ref {
	t.Helper()
	round3Once.Do(func() { round3Refs, round3Err = readRefs("testdata/round3.txt") })
	if round3Err != nil {
		t.Fatalf("round 3 references: %v", round3Err)
	}
	r, ok := round3Refs[refKey(name, qty, at)]
	if !ok {
		t.Fatalf("no round 3 reference for %s %s at %s", name, qty, at)
	}
	return r
}

func generalCase(q, lambda, x, box string) string {
	return fmt.Sprintf(`form = "general"
[general]
Q = %q
lambda = %s
[region]
x = %s
box = %s
`, q, lambda, x, box)
}

// pointCase lists the reference zeros (by index in round3.txt) with their
// order and kind, and the poles.
type pointCase struct {
	name   string
	toml   string
	orders []int    // order of reference zero i
	kinds  []string // kind of reference zero i
	poles  int      // number of reference poles (each of order −2)
}

var round3Points = []pointCase{
	// mpmath.polyroots, all six zeros simple and complex.
	{name: "poly6", toml: generalCase("x^6 + (0.5 + 0.3*i)*x^3 - (1 - 0.2*i)*x + 0.7*i", "5.0", "[-3.0, 3.0]",
		"{ re = [-3.0, 3.0], im = [-3.0, 3.0] }"),
		orders: []int{1, 1, 1, 1, 1, 1}, kinds: []string{"complex", "complex", "complex", "complex", "complex", "complex"}},
	// Exact zeros by construction: a double zero, a simple one and a pair
	// 0.002 apart.
	{name: "double", toml: generalCase("(x - 0.5)^2*(x + 1.2)*((x - 1.5)^2 + 1e-6)", "5.0", "[-3.0, 3.0]",
		"{ re = [-3.0, 3.0], im = [-1.5, 1.5] }"),
		orders: []int{1, 2, 1, 1}, kinds: []string{"real simple", "coalescing", "coalescing", "coalescing"}},
	// A pair 2e-6 apart (exact by construction).
	{name: "near-pair", toml: generalCase("(x + 0.7)*((x - 0.4)^2 + 1e-12)", "5.0", "[-3.0, 3.0]",
		"{ re = [-3.0, 3.0], im = [-1.5, 1.5] }"),
		orders: []int{1, 1, 1}, kinds: []string{"real simple", "coalescing", "coalescing"}},
	// A triple zero: five lines of each family, 72° apart.
	{name: "triple", toml: generalCase("(x - 0.3)^3*(x + 1)", "5.0", "[-3.0, 3.0]",
		"{ re = [-3.0, 3.0], im = [-1.5, 1.5] }"),
		orders: []int{1, 3}, kinds: []string{"real simple", "coalescing"}},
	// A double zero off the axis.
	{name: "cdouble", toml: generalCase("(x - (0.3 + 0.4*i))^2*(x + 1)", "5.0", "[-3.0, 3.0]",
		"{ re = [-3.0, 3.0], im = [-1.5, 1.5] }"),
		orders: []int{1, 2}, kinds: []string{"real simple", "coalescing"}},
	// ±i sqrt(ln 1.5); the next zeros, ±sqrt(−ln 1.5 ± 2πi), have |Im| 1.83.
	{name: "gauss-above", toml: generalCase("1.5 - exp(-x^2)", "5.0", "[-6.0, 6.0]",
		"{ re = [-6.0, 6.0], im = [-1.2, 1.2] }"),
		orders: []int{1, 1}, kinds: []string{"complex pair", "complex pair"}},
	// ±iπ/4, ±3iπ/4 and the double poles ±iπ/2: winding 4 − 2·2 = 0.
	{name: "sech2-above", toml: generalCase("1 - 0.5/cosh(x)^2", "5.0", "[-6.0, 6.0]",
		"{ re = [-6.0, 6.0], im = [-2.6, 2.6] }"),
		orders: []int{1, 1, 1, 1}, kinds: []string{"complex pair", "complex pair", "complex pair", "complex pair"}, poles: 2},
	{name: "sech2-below", toml: generalCase("1 - 1.5/cosh(x)^2", "5.0", "[-6.0, 6.0]",
		"{ re = [-6.0, 6.0], im = [-1.2, 1.2] }"),
		orders: []int{1, 1}, kinds: []string{"real simple", "real simple"}},
}

// angleDiff is the difference of two angles in degrees, reduced to (−180, 180].
func angleDiff(a, b float64) float64 {
	d := math.Mod(a-b, 360)
	if d > 180 {
		d -= 360
	} else if d <= -180 {
		d += 360
	}
	return d
}

// angleTol is the start-angle accuracy asked, in degrees: the angles follow
// from arg Q^(m)(t) and t, both known to about 1e-14, so 1e-8° is generous.
const angleTol = 1e-8

func TestRound3Points(t *testing.T) {
	for _, pc := range round3Points {
		t.Run(pc.name, func(t *testing.T) {
			c, err := cases.Parse(pc.name+".toml", []byte(pc.toml))
			if err != nil {
				t.Fatalf("parse: %v\n%s", err, pc.toml)
			}
			rep := study.Run(c, study.Points|study.Geometry, &study.Options{Workers: 1})
			if len(rep.Errors) > 0 {
				t.Errorf("errors: %v", rep.Errors)
			}
			pr := rep.Points
			if pr == nil {
				t.Fatalf("no turning-point report")
			}
			if !pr.Complete {
				t.Errorf("search not complete: %s %v", pr.Status, pr.Warnings)
			}
			wantZeros, wantWinding := 0, -2*pc.poles
			for _, m := range pc.orders {
				wantZeros += m
				wantWinding += m
			}
			if pr.Winding != wantWinding {
				t.Errorf("winding %d, want %d (zeros minus poles, with multiplicity)", pr.Winding, wantWinding)
			}
			used := make([]bool, len(pr.Points))
			match := func(z complex128, order int) int {
				best, bd := -1, math.Inf(1)
				for j, p := range pr.Points {
					if used[j] || (p.Order < 0) != (order < 0) {
						continue
					}
					if d := cmplx.Abs(complex(p.Z.Re, p.Z.Im) - z); d < bd {
						best, bd = j, d
					}
				}
				return best
			}
			zeros := 0
			for _, p := range pr.Points {
				if p.Order > 0 {
					zeros += p.Order
				}
			}
			if zeros != wantZeros {
				t.Errorf("%d zeros with multiplicity listed, want %d", zeros, wantZeros)
			}
			for i := range pc.orders {
				z := complex(mustRound3(t, pc.name, "re", strconv.Itoa(i)).value, mustRound3(t, pc.name, "im", strconv.Itoa(i)).value)
				j := match(z, pc.orders[i])
				if j < 0 {
					t.Errorf("zero %d at %v: not found", i, z)
					continue
				}
				used[j] = true
				p := pr.Points[j]
				d := cmplx.Abs(complex(p.Z.Re, p.Z.Im) - z)
				if d > float64(p.Err)+roundZ*cmplx.Abs(z) {
					t.Errorf("zero %d: %v ± %.2g, reference %v: true error %.2g exceeds the stated error",
						i, complex(p.Z.Re, p.Z.Im), float64(p.Err), z, d)
				}
				if p.Order != pc.orders[i] {
					t.Errorf("zero %d at %v: order %d, want %d", i, z, p.Order, pc.orders[i])
				}
				if p.Kind != pc.kinds[i] {
					t.Errorf("zero %d at %v: kind %q, want %q", i, z, p.Kind, pc.kinds[i])
				}
				t.Logf("zero %d: error %.2g, stated %.2g, order %d, kind %s", i, d, float64(p.Err), p.Order, p.Kind)
				checkAngles(t, pc.name, i, j, pc.orders[i], rep.Stokes)
			}
			for i := 0; i < pc.poles; i++ {
				z := complex(0, mustRound3(t, pc.name, "pole", strconv.Itoa(i)).value)
				j := match(z, -2)
				if j < 0 {
					t.Errorf("pole %d at %v: not found", i, z)
					continue
				}
				used[j] = true
				p := pr.Points[j]
				d := cmplx.Abs(complex(p.Z.Re, p.Z.Im) - z)
				if d > float64(p.Err)+roundZ*cmplx.Abs(z) {
					t.Errorf("pole %d: %v ± %.2g, reference %v: true error %.2g exceeds the stated error",
						i, complex(p.Z.Re, p.Z.Im), float64(p.Err), z, d)
				}
				if p.Order != -2 || p.Kind != "pole" {
					t.Errorf("pole %d at %v: order %d kind %q, want −2 and \"pole\"", i, z, p.Order, p.Kind)
				}
			}
			for j, u := range used {
				if !u {
					t.Errorf("unexpected point %+v", pr.Points[j])
				}
			}
		})
	}
}

// checkAngles compares the start angles of the lines from point j (the
// reference zero i of order m) with round3.txt: m + 2 Stokes and m + 2
// anti-Stokes lines.
func checkAngles(t *testing.T, name string, i, j, m int, s *study.StokesReport) {
	t.Helper()
	if s == nil {
		t.Errorf("zero %d: no Stokes report", i)
		return
	}
	for _, fam := range []struct{ key, family string }{{"stokes", "Stokes"}, {"anti", "anti-Stokes"}} {
		var got []float64
		for _, l := range s.Lines {
			if l.From == j && l.Family == fam.family {
				got = append(got, float64(l.StartAngle))
			}
		}
		if len(got) != m+2 {
			t.Errorf("zero %d: %d %s lines, want %d", i, len(got), fam.family, m+2)
		}
		for k := 0; k < m+2; k++ {
			want := mustRound3(t, name, fam.key, fmt.Sprintf("%d.%d", i, k)).value
			best := math.Inf(1)
			for _, g := range got {
				best = math.Min(best, math.Abs(angleDiff(g, want)))
			}
			if best > angleTol {
				t.Errorf("zero %d: no %s line starts at %.12g° (nearest off by %.3g°; got %v)", i, fam.family, want, best, got)
			}
		}
	}
}

// TestRound3Gap checks the degeneracy gap of Q = x² − E between its two
// zeros: |Im ∫ sqrt(Q)| = πE/2 and Re = 0 (closed form in round3.py).
func TestRound3Gap(t *testing.T) {
	for _, e := range []string{"1.3", "0.25"} {
		src := generalCase("x^2 - "+e, "5.0", "[-3.0, 3.0]", "{ re = [-3.0, 3.0], im = [-1.5, 1.5] }")
		c, err := cases.Parse("gap.toml", []byte(src))
		if err != nil {
			t.Fatalf("parse: %v", err)
		}
		rep := study.Run(c, study.Points|study.Geometry, &study.Options{Workers: 1})
		if rep.Stokes == nil || len(rep.Stokes.Degeneracies) != 1 {
			t.Fatalf("E = %s: want one degeneracy, got %+v", e, rep.Stokes)
		}
		g := rep.Stokes.Degeneracies[0].Gap
		want := mustRound3(t, "gap", "im", e).value
		if math.Abs(math.Abs(g.Im)-want) > 1e-12*want || math.Abs(g.Re) > 1e-12*want {
			t.Errorf("E = %s: gap %g%+gi, want ±%.16gi", e, g.Re, g.Im, want)
		}
		t.Logf("E = %s: gap %.16g i, reference %.16g", e, g.Im, want)
		// The degenerate Stokes line runs along the axis between the zeros:
		// from −√E at 0° (the Stokes angles of Q' < 0 are 0°, ±120°) to +√E,
		// and from +√E at 180° back to −√E.
		pts := rep.Points.Points
		if len(pts) != 2 {
			t.Fatalf("E = %s: %d points, want 2", e, len(pts))
		}
		left, right := 0, 1
		if pts[0].Z.Re > pts[1].Z.Re {
			left, right = 1, 0
		}
		for _, w := range []struct {
			from, to int
			angle    float64
		}{{left, right, 0}, {right, left, 180}} {
			found := false
			for _, l := range rep.Stokes.Lines {
				if l.Family == "Stokes" && l.From == w.from && math.Abs(angleDiff(float64(l.StartAngle), w.angle)) < angleTol {
					found = true
					if l.EndsOn != "turning point" || l.To != w.to {
						t.Errorf("E = %s: Stokes line from %d at %g° ends on %q (%d), want turning point %d",
							e, w.from, w.angle, l.EndsOn, l.To, w.to)
					}
				}
			}
			if !found {
				t.Errorf("E = %s: no Stokes line from %d at %g°", e, w.from, w.angle)
			}
		}
	}
}

// parabolicEps is y″ + 16(x² − ε) y = 0 (λ = 4) scanned over ε.
func parabolicEps(at string) string {
	return fmt.Sprintf(`form = "general"
[parameters]
eps = 0.0
[general]
Q = "x^2 - eps"
lambda = 4.0
[region]
x = [-9.0, 9.0]
box = { re = [-9.0, 9.0], im = [-1.5, 1.5] }
[scan]
over = "eps"
from = %s
to = %s
points = 1
`, at, at)
}

var round3Scatter = []scatterCase{
	// Eckart closed form; the poles of both terms are at ±iπL = ±1.885i.
	{name: "eckart-m", at: []string{"0.7", "0.83", "0.9"},
		toml: schrodingerScan("A = 0.4\nB = 2.5\nL = 0.6", "A/(1 + exp(-x/L)) + B/(4*cosh(x/(2*L))^2)", "1.7", "0.08",
			"[-26.0, 26.0]", "{ re = [-26.0, 26.0], im = [-1.5, 1.5] }")},
	// Kemble's exact parabolic-barrier transmission; Q grows at the ends,
	// which the end waves must handle.
	{name: "parabolic", at: []string{"0.3", "-0.2", "0.05"}, toml: parabolicEps},
}

func TestRound3Scattering(t *testing.T) {
	for _, sc := range round3Scatter {
		for _, v := range sc.at {
			t.Run(sc.name+"/"+v, func(t *testing.T) {
				row := runScanPoint(t, sc.name, sc.toml(v))
				if row.Error != "" {
					t.Errorf("row error: %s", row.Error)
				}
				w, n := row.WKB, row.Numeric
				for _, q := range []string{"R", "T"} {
					r := mustRound3(t, sc.name, q, v)
					wv, we := pick(w, q)
					nv, ne := pick(n, q)
					judge(t, fmt.Sprintf("r3 %s %s(%s)", sc.name, q, v), r, wv, we, nv, ne, w != nil, n != nil)
				}
			})
		}
	}
}

func schrodingerLevelsOrder(params, potential, mass, hbar, region string, ns []int, maxOrder int) string {
	return schrodingerLevels(params, potential, mass, hbar, region, ns) + fmt.Sprintf("max_order = %d\n", maxOrder)
}

var round3Levels = []levelCase{
	// Morse closed form, 297 levels; n = 250 lies 0.076 below D.
	{name: "morse-m8", ns: []int{150, 250},
		toml: schrodingerLevelsOrder("D = 3.0\na = 1.3", "D*(1 - exp(-a*x))^2", "2.5", "0.01", "x = [-1.0, 9.0]", []int{150, 250}, 8)},
	// Pöschl–Teller closed form, s = 11.36: n = 11 is 0.0019 below threshold,
	// decaying as exp(−0.4|x|).
	{name: "pt-top", ns: []int{10, 11},
		toml: schrodingerLevels("V0 = 2.0\nal = 1.1", "-V0/cosh(al*x)^2", "1.7", "0.2", "x = [-95.0, 95.0]", []int{10, 11})},
}

func TestRound3Levels(t *testing.T) {
	for _, lc := range round3Levels {
		t.Run(lc.name, func(t *testing.T) {
			_, byN := runLevels(t, lc.name, lc.toml)
			judgeLevels(t, "r3 ", lc.name, lc.ns, byN, func(q, at string) ref { return mustRound3(t, lc.name, q, at) })
		})
	}
}

// roundZ is the rounding of a reference position to float64 (half an ulp,
// 2⁻⁵³ relative): a position exact to 30 digits can be no closer than that
// to any float64 the tool returns.
const roundZ = 0x1p-53
