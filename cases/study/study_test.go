package study

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/turnpoint/turnpoint/cases"
)

func TestCompare(t *testing.T) {
	for _, tc := range []struct {
		wkb, errW, num, errN float64
		agree                bool
		reason               string
	}{
		{1.0, 0.1, 1.05, 0.01, true, ""},
		{1.0, 0.01, 1.05, 0.01, false, "differ"},
		{1e-20, 1e-22, 1.01e-20, 1e-24, true, ""},
		{1e-20, 1e-23, 1.1e-20, 1e-24, false, "combined estimate"},
		{1, math.Inf(1), 1, 0, false, "no finite error estimate"},
		{math.NaN(), 0, 1, 0, false, "missing"},
		{0.5, 0.1, 0.6, 0.2, false, "did not resolve"},
	} {
		v := compare(tc.wkb, tc.errW, tc.num, tc.errN)
		if v.Agree != tc.agree || !strings.Contains(v.Reason, tc.reason) {
			t.Errorf("compare(%g ± %g, %g ± %g) = %+v, want agree %v and reason containing %q",
				tc.wkb, tc.errW, tc.num, tc.errN, v, tc.agree, tc.reason)
		}
	}
}

const harmonicCase = `# harmonic
form = "schrodinger"
[schrodinger]
potential = "x^2/2"
mass = 1.0
hbar = 0.1
[region]
x = [-3.0, 3.0]
[levels]
n = [0, 2]

[[expect]]
quantity = "E"
n = 2
method = "numeric"
value = 0.26   # a wrong value: exact is 0.25
rel_tol = 1e-9
source = "exact: hbar omega (n + 1/2)"

[[expect]]
quantity = "E"
n = 0
method = "wkb"
value = 0.05
rel_tol = 1e-9
source = "exact: hbar omega (n + 1/2)"
`

// TestRewrite checks that a regressed expectation is reported with figure,
// difference and tolerance, and that Rewrite changes only its number.
func TestRewrite(t *testing.T) {
	c, err := cases.Parse("h.toml", []byte(harmonicCase))
	if err != nil {
		t.Fatal(err)
	}
	rep := Run(c, All, nil)
	if rep.Summary.Regressed != 1 || rep.Summary.Checks != 2 {
		t.Fatalf("summary %+v, want 1 of 2 expectations regressed", rep.Summary)
	}
	msg := rep.Checks[0].Message
	for _, want := range []string{"h.toml:16:9", "E[2] (numeric)", "expected 0.26", "off by 0.01", "tolerance 2.6e-10"} {
		if !strings.Contains(msg, want) {
			t.Errorf("message %q lacks %q", msg, want)
		}
	}
	src, changes, err := Rewrite(c, rep)
	if err != nil {
		t.Fatal(err)
	}
	if len(changes) != 1 {
		t.Fatalf("changes %+v, want one", changes)
	}
	want := strings.Replace(harmonicCase, "value = 0.26   #", "value = "+formatValue(float64(rep.Checks[0].Got))+"   #", 1)
	if string(src) != want {
		t.Errorf("rewritten source:\n%s\nwant:\n%s", src, want)
	}
	c2, err := cases.Parse("h.toml", src)
	if err != nil {
		t.Fatalf("rewritten case does not load: %v", err)
	}
	if rep2 := Run(c2, All, nil); rep2.Summary.Regressed != 0 {
		t.Errorf("after Rewrite: %+v", rep2.Summary)
	}
}

func TestFigures(t *testing.T) {
	c, err := cases.Parse("h.toml", []byte(harmonicCase))
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	for _, ext := range []string{".svg", ".png"} {
		rep := Run(c, Levels|Points|Geometry, &Options{FigureDir: dir, FigureExt: ext})
		if len(rep.Errors) > 0 {
			t.Fatalf("errors: %v", rep.Errors)
		}
		for _, name := range []string{"levels", "stokes"} {
			fi, err := os.Stat(filepath.Join(dir, name+ext))
			if err != nil || fi.Size() < 1000 {
				t.Errorf("figure %s%s: %v (size %v)", name, ext, err, fi)
			}
		}
	}
}
