package cases

import (
	"errors"
	"fmt"
	"io/fs"
	"path/filepath"
	"strings"
	"testing"
)

// generalHead is a valid case of six lines; snippets appended to it start
// on line 7.
const generalHead = `form = "general"
[general]
Q = "x^2 - 1"
lambda = 10
[region]
x = [-3, 3]
`

// schrodingerHead is a valid case of eight lines without a [region] table.
const schrodingerHead = `form = "schrodinger"
[parameters]
V0 = 1
[schrodinger]
potential = "V0/cosh(x)^2"
mass = 1
hbar = 0.1
energy = 0.5
`

// gradedHead is a valid [graded] table of three lines, starting on line 2.
const gradedHead = `form = "graded"
[graded]
index = "1 + 0.5*tanh(x)"
wavelength = 1
`

const region = "[region]\nx = [-3, 3]\n"

// expectHead starts a [[expect]] table on line 7 of a general case.
const expectHead = generalHead + "[[expect]]\n"

var badCases = []struct {
	name string
	src  string
	pos  string // "line:col" of the first error
	msg  string // substring of its message
}{
	// TOML syntax, placed by the decoder.
	{"syntax unterminated string", "form = \"general\ntitle = 1\n", "1:16", "invalid TOML"},
	{"syntax duplicate key", generalHead + "x = 1\nx = 2\n", "7:1", "invalid TOML"},
	{"syntax bad value", "title = \n", "1:", "invalid TOML"},
	{"empty file", "", "", "missing form"},

	// Types, placed on the value.
	{"type string for number", strings.Replace(generalHead, "lambda = 10", `lambda = "ten"`, 1), "4:10", `general.lambda must be a number, not a string`},
	{"type number for string", strings.Replace(generalHead, `form = "general"`, `form = 3`, 1), "1:8", "form must be a string, not an integer"},
	{"type float for integer", generalHead + "[scan]\nover = \"lambda\"\nfrom = 1\nto = 2\npoints = 5.0\n", "11:10", "scan.points must be an integer, not a number"},
	{"type table for number", "title = { a = 1 }\n" + generalHead, "1:9", "title must be a string, not a table"},
	{"type array for formula", strings.Replace(generalHead, `Q = "x^2 - 1"`, `Q = [1, 2]`, 1), "3:5", "general.Q must be a string, not an array"},
	{"type region not a table", "region = 4\n" + strings.Replace(generalHead, "[region]\nx = [-3, 3]\n", "", 1), "1:10", "region must be a table, not an integer"},

	// Unknown keys: the top-most only, with a suggestion.
	{"unknown key suggestion", "titel = \"a\"\n" + generalHead, "1:1", `unknown key "titel" at the top level; did you mean "title"?`},
	{"unknown key in table", strings.Replace(generalHead, "lambda = 10", "lambda = 10\nlamda = 3", 1), "5:1", `unknown key "lamda" in [general]; did you mean "lambda"?`},
	{"unknown table", generalHead + "[extra]\nlambda = 3\n", "7:1", `unknown key "extra" at the top level`},
	{"unknown key case", strings.Replace(generalHead, "lambda = 10", "lambda = 10\nq1 = \"0\"", 1), "5:1", `did you mean "Q1"?`},
	{"unknown key in inline table", generalHead + "box = { re = [-4, 4], im = [-1, 1], imag = 2 }\n", "7:37", `unknown key "imag" in region.box; did you mean "im"?`},

	// Missing required keys.
	{"missing form", "[general]\nQ = \"x\"\nlambda = 1\n" + region, "1:1", `missing form: add form = "general"`},
	{"missing form without table", region, "", `missing form: set form = "schrodinger", "graded" or "general"`},
	{"missing form table", "form = \"general\"\n" + region, "1:1", `form "general" needs a [general] table`},
	{"missing hbar", strings.Replace(schrodingerHead, "hbar = 0.1\n", "", 1) + region, "4:1", "[schrodinger] needs hbar"},
	{"missing mass", strings.Replace(schrodingerHead, "mass = 1\n", "", 1) + region, "4:1", "[schrodinger] needs mass"},
	{"missing potential", strings.Replace(schrodingerHead, "potential = \"V0/cosh(x)^2\"\n", "", 1) + region, "4:1", "[schrodinger] needs potential"},
	{"missing wavelength", strings.Replace(gradedHead, "wavelength = 1\n", "", 1) + region, "2:1", "needs wavelength (the vacuum wavelength) or k0"},
	{"missing index", strings.Replace(gradedHead, "index = \"1 + 0.5*tanh(x)\"\n", "", 1) + region, "2:1", "[graded] needs index (the refractive index n(x), or permittivity"},
	{"index and permittivity", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\npermittivity = \"2\"", 1) + region, "5:1", "give either graded.index or graded.permittivity, not both"},
	{"formula permittivity", strings.Replace(gradedHead, `index = "1 + 0.5*tanh(x)"`, `permittivity = "1 + 0.5*tanh(x"`, 1) + region, "3:", ""},
	{"missing lambda", strings.Replace(generalHead, "lambda = 10\n", "", 1), "2:1", "[general] needs lambda"},
	{"missing region", strings.Replace(generalHead, "[region]\nx = [-3, 3]\n", "", 1), "", "missing [region] table"},
	{"missing region x", strings.Replace(generalHead, "x = [-3, 3]\n", "left = \"wall\"\n", 1), "5:1", "[region] needs x = [a, b]"},
	{"missing box im", generalHead + "box = { re = [-4, 4] }\n", "7:1", "region.box needs im"},
	{"missing scan over", generalHead + "[scan]\nfrom = 1\nto = 2\npoints = 3\n", "7:1", "[scan] needs over"},
	{"missing scan points", generalHead + "[scan]\nover = \"lambda\"\nfrom = 1\nto = 2\n", "7:1", "[scan] needs points"},
	{"missing levels n", schrodingerHead + region + "[levels]\nmax_order = 2\n", "11:1", "[levels] needs n = [quantum numbers] or count"},
	{"missing expect quantity", expectHead + "value = 1\n", "7:1", "[[expect]] needs quantity"},
	{"missing expect n", schrodingerHead + region + "[[expect]]\nquantity = \"E\"\nmethod = \"wkb\"\nvalue = 0.1\nrel_tol = 1e-3\nsource = \"s\"\n", "11:1", "[[expect]] of E needs n"},
	{"missing expect method", expectHead + "quantity = \"T\"\nvalue = 0.5\nabs_tol = 1e-3\nsource = \"s\"\n", "7:1", "needs method"},
	{"missing expect source", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1e-3\n", "7:1", "needs source"},

	// Wrong form tables, wrong form names.
	{"other form table", generalHead + "[graded]\nindex = \"1\"\nwavelength = 1\n", "7:1", `[graded] does not belong in a case of form "general"`},
	{"unknown form", strings.Replace(generalHead, `form = "general"`, `form = "generl"`, 1), "1:8", `did you mean "general"?`},

	// Unphysical values.
	{"mass zero", strings.Replace(schrodingerHead, "mass = 1", "mass = 0", 1) + region, "6:8", "schrodinger.mass must be positive, got 0"},
	{"mass negative", strings.Replace(schrodingerHead, "mass = 1", "mass = -2", 1) + region, "6:8", "must be positive, got -2"},
	{"hbar zero", strings.Replace(schrodingerHead, "hbar = 0.1", "hbar = 0.0", 1) + region, "7:8", "schrodinger.hbar must be positive"},
	{"wavelength negative", strings.Replace(gradedHead, "wavelength = 1", "wavelength = -0.5", 1) + region, "4:14", "graded.wavelength must be positive, got -0.5"},
	{"k0 zero", strings.Replace(gradedHead, "wavelength = 1", "k0 = 0", 1) + region, "4:6", "graded.k0 must be positive, got 0"},
	{"wavelength and k0", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\nk0 = 6", 1) + region, "5:1", "give either graded.wavelength or graded.k0, not both"},
	{"lambda negative", strings.Replace(generalHead, "lambda = 10", "lambda = -1", 1), "4:10", "general.lambda must be positive"},
	{"interval empty", strings.Replace(generalHead, "x = [-3, 3]", "x = [2, 2]", 1), "6:5", "region.x is empty"},
	{"interval too wide", strings.Replace(generalHead, "x = [-3, 3]", "x = [-1e308, 1e308]", 1), "6:5", "region.x is too wide"},
	{"interval reversed", strings.Replace(generalHead, "x = [-3, 3]", "x = [3, -3]", 1), "6:5", "region.x is reversed"},
	{"interval one number", strings.Replace(generalHead, "x = [-3, 3]", "x = [3]", 1), "6:5", "region.x must be an array of two numbers"},
	{"interval element string", strings.Replace(generalHead, "x = [-3, 3]", `x = [-3, "3"]`, 1), "6:10", "region.x[1] must be a number, not a string"},
	{"nan", strings.Replace(generalHead, "lambda = 10", "lambda = nan", 1), "4:10", "general.lambda must be a finite number, got NaN"},
	{"inf in interval", strings.Replace(generalHead, "x = [-3, 3]", "x = [-inf, 3]", 1), "6:6", "region.x[0] must be a finite number, got -Inf"},
	{"inf parameter", generalHead + "[parameters]\nq = +inf\n", "8:5", "parameter q must be a finite number, got +Inf"},
	{"nan scan", generalHead + "[scan]\nover = \"lambda\"\nfrom = nan\nto = 2\npoints = 3\n", "9:8", "scan.from must be a finite number"},
	{"nan expect value", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = nan\nabs_tol = 1e-3\nsource = \"s\"\n", "10:9", "expect.value must be a finite number"},
	{"points zero", generalHead + "[scan]\nover = \"lambda\"\nfrom = 1\nto = 2\npoints = 0\n", "11:10", "scan.points must be at least 1, got 0"},
	{"points huge", generalHead + "[scan]\nover = \"lambda\"\nfrom = 1\nto = 2\npoints = 100000000\n", "11:10", "scan.points must be at most"},
	{"scan equal ends", generalHead + "[scan]\nover = \"lambda\"\nfrom = 2\nto = 2\npoints = 3\n", "10:6", "scan.from and scan.to are both 2"},
	{"log spacing negative", generalHead + "[parameters]\nc = 1\n[scan]\nover = \"c\"\nfrom = -1\nto = 2\npoints = 3\nspacing = \"log\"\n", "14:11", "log spacing needs positive from and to"},
	{"spacing unknown", generalHead + "[scan]\nover = \"lambda\"\nfrom = 1\nto = 2\npoints = 3\nspacing = \"logarithmic\"\n", "12:11", `scan.spacing must be "linear" or "log"`},
	{"scan over unknown", generalHead + "[scan]\nover = \"energy\"\nfrom = 1\nto = 2\npoints = 3\n", "8:8", `scan.over = "energy" is neither a variable of form "general"`},
	{"scan wavelength negative", gradedHead + region + "[scan]\nover = \"wavelength\"\nfrom = -1\nto = 2\npoints = 3\n", "9:8", "scan.from: wavelength must be positive"},
	{"scan angle range", gradedHead + region + "[scan]\nover = \"angle\"\nfrom = 0\nto = 90\npoints = 3\n", "10:6", "scan.to: angle must lie strictly between -90 and 90"},
	{"box re too small", generalHead + "box = { re = [-2, 4], im = [-1, 1] }\n", "7:14", "region.box.re = [-2, 4] must contain the interval region.x = [-3, 3]"},
	{"box im without zero", generalHead + "box = { re = [-4, 4], im = [0.5, 1] }\n", "7:28", "region.box.im = [0.5, 1] must have 0 strictly inside"},
	{"box im edge on the axis", generalHead + "box = { re = [-4, 4], im = [0, 1] }\n", "7:28", "region.box.im = [0, 1] must have 0 strictly inside"},
	{"box re and im both wrong", generalHead + "box = { re = [-1, 1], im = [0, 1] }\n", "7:14", "must contain the interval"},
	{"box inline table on two lines", generalHead + "box = { re = [-4, 4],\n  im = [0.5, 1] }\n", "8:8", "region.box.im = [0.5, 1] must have 0 strictly inside"},
	{"box reversed", generalHead + "box = { re = [4, -4], im = [-1, 1] }\n", "7:14", "region.box.re is reversed"},
	{"wall unknown", generalHead + "left = \"hard\"\n", "7:8", `region.left must be "open" or "wall", got "hard"`},
	{"angle 90", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\nangle = 90", 1) + region, "5:9", "graded.angle must lie strictly between -90 and 90 degrees, got 90"},
	{"angle -95", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\nangle = -95.5", 1) + region, "5:9", "got -95.5"},
	{"n_in zero", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\nn_in = 0", 1) + region, "5:8", "graded.n_in must be positive"},
	{"polarization unknown", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\npolarization = \"q\"", 1) + region, "5:16", `graded.polarization must be "s" (TE) or "p" (TM), got "q"`},
	{"polarization case", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\npolarization = \"P\"", 1) + region, "5:16", `got "P"`},
	{"polarization empty", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\npolarization = \"\"", 1) + region, "5:16", `got ""`},
	{"polarization not a string", strings.Replace(gradedHead, "wavelength = 1", "wavelength = 1\npolarization = 1", 1) + region, "5:16", "graded.polarization must be a string"},
	{"levels n negative", schrodingerHead + region + "[levels]\nn = [0, 1, -2]\n", "12:12", "levels.n[2] = -2: quantum numbers start at 0"},
	{"levels n repeated", schrodingerHead + region + "[levels]\nn = [0, 1, 1]\n", "12:12", "levels.n lists 1 twice"},
	{"levels n empty", schrodingerHead + region + "[levels]\nn = []\n", "12:5", "levels.n is empty"},
	{"levels n and count", schrodingerHead + region + "[levels]\nn = [0]\ncount = 3\n", "13:1", "give either levels.n or levels.count"},
	{"levels count zero", schrodingerHead + region + "[levels]\ncount = 0\n", "12:9", "levels.count must be between 1 and"},
	{"max_order odd", schrodingerHead + region + "[levels]\ncount = 2\nmax_order = 5\n", "13:13", "levels.max_order must be even"},
	{"max_order too high", schrodingerHead + region + "[levels]\ncount = 2\nmax_order = 22\n", "13:13", "levels.max_order must be between 0 and 20, got 22"},
	{"levels other form", generalHead + "[levels]\ncount = 2\n", "7:1", `[levels] needs form "schrodinger"`},

	// Expectations.
	{"expect no tolerance", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = 0.5\nsource = \"s\"\n", "7:1", "[[expect]] needs a tolerance: rel_tol or abs_tol"},
	{"expect zero tolerances", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = 0.5\nrel_tol = 0\nabs_tol = 0\nsource = \"s\"\n", "7:1", "needs a tolerance"},
	{"expect negative tolerance", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = 0.5\nrel_tol = -1e-3\nsource = \"s\"\n", "11:11", "expect.rel_tol must be 0 or more"},
	{"expect unknown quantity", expectHead + "quantity = \"Trans\"\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1\nsource = \"s\"\n", "8:12", `expect.quantity must be "R", "T", "E", "splitting" or "turning_points", got "Trans"`},
	{"expect unknown method", expectHead + "quantity = \"T\"\nmethod = \"exact\"\nvalue = 0.5\nabs_tol = 1\nsource = \"s\"\n", "9:10", `expect.method must be "wkb" or "numeric", got "exact"`},
	{"expect T above one", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = 1.5\nabs_tol = 1\nsource = \"s\"\n", "10:9", "T is a fraction of the flux"},
	{"expect at without scan", expectHead + "quantity = \"T\"\nat = 1\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1\nsource = \"s\"\n", "9:1", "the case has no [scan] table"},
	{"expect at for E", schrodingerHead + region + "[levels]\ncount = 1\n[[expect]]\nquantity = \"E\"\nn = 0\nat = 1\nmethod = \"wkb\"\nvalue = 0.1\nrel_tol = 1e-3\nsource = \"s\"\n", "16:1", "expect.at does not apply to E"},
	{"expect T without energy", strings.Replace(schrodingerHead, "energy = 0.5\n", "", 1) + region + "[[expect]]\nquantity = \"T\"\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1\nsource = \"s\"\n", "10:1", "schrodinger.energy is not set"},
	{"scan over ambiguous", generalHead + "[parameters]\nlambda = 2\n[scan]\nover = \"lambda\"\nfrom = 1\nto = 2\npoints = 3\n", "10:8", "is ambiguous"},
	{"expect n for T", expectHead + "quantity = \"T\"\nn = 1\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1\nsource = \"s\"\n", "9:1", "expect.n does not apply to T"},
	{"expect E without levels", schrodingerHead + region + "[[expect]]\nquantity = \"E\"\nn = 1\nmethod = \"wkb\"\nvalue = 0.1\nrel_tol = 1e-3\nsource = \"s\"\n", "13:5", "expect of E needs a [levels] table"},
	{"expect E not among levels", schrodingerHead + region + "[levels]\ncount = 2\n[[expect]]\nquantity = \"E\"\nn = 2\nmethod = \"wkb\"\nvalue = 0.1\nrel_tol = 1e-3\nsource = \"s\"\n", "15:5", "expect.n = 2 is not among the levels computed"},
	{"expect n negative", schrodingerHead + region + "[[expect]]\nquantity = \"E\"\nn = -1\nmethod = \"wkb\"\nvalue = 0.1\nrel_tol = 1e-3\nsource = \"s\"\n", "13:5", "expect.n must be 0 or more"},
	{"expect E in general form", expectHead + "quantity = \"E\"\nn = 0\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1\nsource = \"s\"\n", "8:12", `expect quantity "E" needs form "schrodinger"`},
	{"expect count fractional", expectHead + "quantity = \"turning_points\"\nvalue = 2.5\nsource = \"s\"\n", "9:9", "a count of turning points is a whole number"},
	{"expect method for count", expectHead + "quantity = \"turning_points\"\nmethod = \"wkb\"\nvalue = 2\nsource = \"s\"\n", "9:1", "expect.method does not apply to turning_points"},
	{"expect empty source", expectHead + "quantity = \"T\"\nmethod = \"wkb\"\nvalue = 0.5\nabs_tol = 1\nsource = \" \"\n", "12:10", "expect.source is empty"},
	{"expect inline array", "expect = [{ quantity = \"T\", method = \"wkb\", value = 2, abs_tol = 1, source = \"s\" }]\n" + generalHead, "1:53", "T is a fraction of the flux"},
	{"expect not tables", "expect = [1, 2]\n" + generalHead, "1:11", "expect must be an array of tables ([[expect]]), element 1 is an integer"},
	{"expect single brackets", generalHead + "[expect]\nquantity = \"T\"\n", "7:1", "write [[expect]]"},

	// Parameter names.
	{"param x", generalHead + "[parameters]\nx = 1\n", "8:1", `a parameter may not be called "x"`},
	{"param pi", generalHead + "[parameters]\npi = 3\n", "8:1", `a parameter may not be called "pi"`},
	{"param i", generalHead + "[parameters]\ni = 3\n", "8:1", `a parameter may not be called "i"`},
	{"param E", generalHead + "[parameters]\nE = 3\n", "8:1", `a parameter may not be called "E"`},
	{"param function", generalHead + "[parameters]\ncosh = 3\n", "8:1", `a parameter may not be called "cosh"`},
	{"param not identifier", generalHead + "[parameters]\n\"a b\" = 3\n", "8:1", `parameter name "a b" is not an identifier`},
	{"param string", generalHead + "[parameters]\nq = \"3\"\n", "8:5", "parameter q must be a number, not a string"},

	// Formulas: the column inside the TOML string.
	{"formula unknown function", strings.Replace(generalHead, `Q = "x^2 - 1"`, `Q = "x^2 - coshh(x)"`, 1), "3:12", `unknown function "coshh"`},
	{"formula unknown parameter", strings.Replace(schrodingerHead, `potential = "V0/cosh(x)^2"`, `potential = "V1/cosh(x)^2"`, 1) + region, "5:14", `"V1"`},
	{"formula literal string", strings.Replace(generalHead, `Q = "x^2 - 1"`, `Q = 'x^2 - * 1'`, 1), "3:12", ""},
	{"formula indented", strings.Replace(generalHead, `Q = "x^2 - 1"`, "  Q  =   \"x^2 - sinn(x)\"", 1), "3:17", `unknown function "sinn"`},
	{"formula after unicode", strings.Replace(generalHead, `Q = "x^2 - 1"`, `"Qé" = 1`+"\n"+`Q = "x^2 - 1"`, 1), "3:1", `unknown key "Qé"`},
	{"formula escapes fall back", strings.Replace(generalHead, `Q = "x^2 - 1"`, `Q = "x^2 \u002d coshh(x)"`, 1), "3:5", `general.Q: unknown function "coshh"`},
	{"formula multiline", strings.Replace(generalHead, `Q = "x^2 - 1"`, "Q = \"\"\"\nx^2 - coshh(x)\"\"\"", 1), "4:7", `unknown function "coshh"`},
	{"formula multiline literal", strings.Replace(generalHead, `Q = "x^2 - 1"`, "Q = '''x^2 -\n  coshh(x)'''", 1), "4:3", `unknown function "coshh"`},
	{"formula line-ending backslash falls back", strings.Replace(generalHead, `Q = "x^2 - 1"`, "Q = \"\"\"x^2 - \\\n  coshh(x)\"\"\"", 1), "3:5", `general.Q: unknown function "coshh"`},
	{"formula empty", strings.Replace(generalHead, `Q = "x^2 - 1"`, `Q = ""`, 1), "3:6", "empty formula"},
	{"formula Q1", strings.Replace(generalHead, "lambda = 10", "lambda = 10\nQ1 = \"1/(x\"", 1), "5:", ""},
	{"formula index", strings.Replace(gradedHead, `index = "1 + 0.5*tanh(x)"`, `index = "1 + 0.5*tanh(x, 2)"`, 1) + region, "3:", ""},
}

func TestParseErrors(t *testing.T) {
	t.Parallel()
	for _, tc := range badCases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			c, err := Parse("case.toml", []byte(tc.src))
			if err == nil {
				t.Fatalf("Parse accepted the case: %+v\n%s", c, tc.src)
			}
			var list ErrorList
			if !errors.As(err, &list) || len(list) == 0 {
				t.Fatalf("Parse returned %T %v, want a non-empty ErrorList", err, err)
			}
			first := list[0]
			got := first.Pos.String()
			want := "case.toml"
			if tc.pos != "" {
				want += ":" + tc.pos
			}
			exact := !strings.HasSuffix(tc.pos, ":") // "1:" checks the line only
			if !strings.HasPrefix(got, want) || exact && got != want {
				t.Errorf("position %s, want %s (error %q)\n%s", got, want, first.Msg, list.Detail())
			}
			if !strings.Contains(first.Msg, tc.msg) {
				t.Errorf("message %q, want it to contain %q\n%s", first.Msg, tc.msg, list.Detail())
			}
			if first.Pos.Line > 0 && first.Excerpt == "" {
				t.Errorf("error at %s has no excerpt", got)
			}
		})
	}
}

// TestParseReportsAll checks that one pass reports every problem of a file,
// not only the first, and sorts them by position.
func TestParseReportsAll(t *testing.T) {
	t.Parallel()
	src := `form = "schrodinger"
[schrodinger]
potential = "sinn(x)"
mass = -1
hbar = 0
[region]
x = [1, 0]
rigth = "wall"
`
	_, err := Parse("all.toml", []byte(src))
	var list ErrorList
	if !errors.As(err, &list) {
		t.Fatalf("Parse returned %v, want an ErrorList", err)
	}
	want := []string{"all.toml:3:14", "all.toml:4:8", "all.toml:5:8", "all.toml:7:5", "all.toml:8:1"}
	var got []string
	for _, e := range list {
		got = append(got, e.Pos.String())
	}
	if fmt.Sprint(got) != fmt.Sprint(want) {
		t.Errorf("positions %v, want %v\n%s", got, want, list.Detail())
	}
	if s := list.Error(); !strings.HasSuffix(s, "(and 4 more errors)") {
		t.Errorf("Error() = %q, want the count of the others", s)
	}
}

// TestParseNoCascade checks that a parameter with a bad value is reported
// once, not again in every formula that uses it.
func TestParseNoCascade(t *testing.T) {
	t.Parallel()
	src := strings.Replace(schrodingerHead, "V0 = 1", `V0 = "one"`, 1) + region
	_, err := Parse("c.toml", []byte(src))
	var list ErrorList
	if !errors.As(err, &list) || len(list) != 1 || list[0].Pos.String() != "c.toml:3:6" {
		t.Errorf("Parse reported %v, want the one error at c.toml:3:6", err)
	}
}

// TestUnknownTopMost checks that an unknown table is reported once, not
// with each of its keys.
func TestUnknownTopMost(t *testing.T) {
	t.Parallel()
	src := generalHead + "[extra]\nlambda = 3\nfoo = { bar = 1 }\n[extra.sub]\nbaz = 2\n"
	_, err := Parse("u.toml", []byte(src))
	var list ErrorList
	if !errors.As(err, &list) || len(list) != 1 || list[0].Pos.String() != "u.toml:7:1" {
		t.Errorf("Parse reported %v, want one error at u.toml:7:1", err)
	}
}

func TestLoadMissingFile(t *testing.T) {
	t.Parallel()
	_, err := Load(filepath.Join("testdata", "no-such-case.toml"))
	var list ErrorList
	if err == nil || errors.As(err, &list) || !errors.Is(err, fs.ErrNotExist) {
		t.Errorf("Load of a missing file = %v, want the error of os.ReadFile", err)
	}
}

func TestPositionString(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		p    Position
		want string
	}{
		{Position{"a.toml", 3, 9}, "a.toml:3:9"},
		{Position{"a.toml", 3, 0}, "a.toml:3"},
		{Position{"a.toml", 0, 0}, "a.toml"},
		{Position{"", 3, 9}, "3:9"},
		{Position{}, ""},
	} {
		if got := tc.p.String(); got != tc.want {
			t.Errorf("%#v.String() = %q, want %q", tc.p, got, tc.want)
		}
	}
	e := &Error{Msg: "bad"}
	if got := e.Error(); got != "bad" {
		t.Errorf("Error() without position = %q, want %q", got, "bad")
	}
	var l ErrorList
	if l.Err() != nil {
		t.Errorf("empty ErrorList.Err() = %v, want nil", l.Err())
	}
}

func TestSuggest(t *testing.T) {
	t.Parallel()
	known := []string{"potential", "mass", "hbar", "energy"}
	for _, tc := range []struct{ in, want string }{
		{"potentail", "potential"},
		{"Mass", "mass"},
		{"hbar_", "hbar"},
		{"ener", "energy"},
		{"zzz", ""},
		{"temperature", ""},
	} {
		if got := suggest(tc.in, known); got != tc.want {
			t.Errorf("suggest(%q) = %q, want %q", tc.in, got, tc.want)
		}
	}
}
