package cases

import (
	"errors"
	"fmt"
	"math"
	"os"
	"slices"
	"sort"
	"strings"
	"unicode/utf8"

	"github.com/turnpoint/turnpoint/cases/formula"
	"github.com/turnpoint/turnpoint/turning"
)

// Keys the format knows, table by table.
var (
	rootKeys        = []string{"title", "form", "parameters", "schrodinger", "graded", "general", "region", "scan", "levels", "expect"}
	schrodingerKeys = []string{"potential", "mass", "hbar", "energy"}
	gradedKeys      = []string{"index", "permittivity", "wavelength", "k0", "angle", "n_in", "polarization"}
	generalKeys     = []string{"Q", "Q1", "lambda"}
	regionKeys      = []string{"x", "box", "left", "right"}
	boxKeys         = []string{"re", "im"}
	scanTableKeys   = []string{"over", "from", "to", "points", "spacing"}
	levelsKeys      = []string{"n", "count", "max_order"}
	expectKeys      = []string{"quantity", "at", "n", "method", "value", "rel_tol", "abs_tol", "source"}

	quantities = []string{"R", "T", "E", "splitting", "turning_points"}
	methods    = []string{"wkb", "numeric"}
)

// Limits that keep a case file from asking for absurd work.
const (
	maxPoints   = 1000000 // scan.points
	maxCount    = 10000   // levels.count and the largest quantum number
	maxMaxOrder = 20      // levels.max_order
)

// Load reads and checks the case file at path. Problems with the file's
// contents come back as an ErrorList; a file that cannot be read gives the
// error of os.ReadFile.
func Load(path string) (*Case, error) {
	src, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return Parse(path, src)
}

// Parse checks src as a case file named filename (used in positions only).
// It reports every problem it finds, sorted by position, as an ErrorList.
func Parse(filename string, src []byte) (*Case, error) {
	d := &decoder{filename: filename, src: string(src)}
	m := d.decodeTOML()
	if m == nil {
		if len(d.errs) == 0 {
			d.errorAt(Position{Filename: filename}, "empty case file")
		}
		return nil, d.errs
	}
	d.spans = scanKeys(d.src)
	c := &Case{Path: filename, Source: src, Params: map[string]float64{}}
	d.fill(c, m)
	if len(d.errs) > 0 {
		d.errs.Sort()
		return nil, d.errs
	}
	return c, nil
}

// fill checks the document and fills c.
func (d *decoder) fill(c *Case, m map[string]any) {
	root := &table{d: d, m: m, known: rootKeys}
	root.finish()
	if s, ok := root.str("title"); ok {
		c.Title = s
	}

	names := d.params(c, root)

	form, formOK := d.form(root)
	c.Form = form
	for f, key := range formNames {
		if f != form && root.has(key) && formOK {
			root.errorf(root.keyPos(key), "[%s] does not belong in a case of form %q; remove it or set form = %q", key, form, key)
		}
	}
	switch form {
	case Schrodinger:
		c.Schrodinger = d.schrodinger(root, names)
	case Graded:
		c.Graded = d.graded(root, names)
	case General:
		c.General = d.general(root, names)
	}

	d.region(c, root)
	if t := root.sub("scan", scanTableKeys...); t != nil {
		c.Scan = d.scan(c, t, formOK)
	}
	if t := root.sub("levels", levelsKeys...); t != nil {
		c.Levels = d.levels(c, t, formOK)
	}
	d.expect(c, root, formOK)
}

// params reads [parameters] and returns the usable names, sorted. A
// parameter with a bad value keeps its name, so that formulas using it are
// not reported as well.
func (d *decoder) params(c *Case, root *table) []string {
	t := root.sub("parameters")
	if t == nil {
		return nil
	}
	var names []string
	for name, v := range t.m {
		if msg := paramNameProblem(name); msg != "" {
			t.errorf(t.keyPos(name), "%s", msg)
			continue
		}
		names = append(names, name)
		if x, ok := t.toNumber(v, "parameter "+name, name); ok {
			c.Params[name] = x
		}
	}
	sort.Strings(names)
	d.paramNames = names
	return names
}

// reservedNames may not be parameters although the formula language would
// accept them: E is the energy of the Schrödinger form.
var reservedNames = map[string]string{
	"E": `a parameter may not be called "E": it is the energy`,
}

// paramNameProblem returns why name cannot be a parameter, or "". The rules of
// the formula language are asked by parsing a formula with that one name.
func paramNameProblem(name string) string {
	if msg, ok := reservedNames[name]; ok {
		return msg
	}
	_, err := formula.Parse("0", []string{name})
	if err == nil {
		return ""
	}
	var fe *formula.Error
	if errors.As(err, &fe) {
		return fe.Msg
	}
	return err.Error()
}

// form reads the form key. ok is false when it is missing or wrong.
func (d *decoder) form(root *table) (Form, bool) {
	if !root.has("form") {
		var present []string
		for _, k := range []string{"schrodinger", "graded", "general"} {
			if root.has(k) {
				present = append(present, k)
			}
		}
		msg, pos := `missing form: set form = "schrodinger", "graded" or "general"`, root.pos()
		if len(present) == 1 {
			msg = fmt.Sprintf("missing form: add form = %q at the top of the file for this table", present[0])
			pos = root.keyPos(present[0])
		}
		root.errorf(pos, "%s", msg)
		return 0, false
	}
	s, ok := root.choice("form", "", "schrodinger", "graded", "general")
	if !ok {
		return 0, false
	}
	for f, name := range formNames {
		if name == s {
			return f, true
		}
	}
	return 0, false
}

// formTable returns the table of the form, reporting it when missing.
func (d *decoder) formTable(root *table, key, example string, known []string) *table {
	t := root.sub(key, known...)
	if t == nil && !root.has(key) {
		root.errorf(root.keyPos("form"), "form %q needs a [%s] table (%s)", key, key, example)
	}
	return t
}

func (d *decoder) schrodinger(root *table, names []string) *SchrodingerForm {
	t := d.formTable(root, "schrodinger", "potential, mass and hbar", schrodingerKeys)
	if t == nil {
		return nil
	}
	t.finish()
	s := &SchrodingerForm{}
	s.Potential, _ = t.formula("potential", "the potential V(x)", names)
	s.Mass, _ = t.positive("mass", "the particle's mass m > 0")
	s.Hbar, _ = t.positive("hbar", "the reduced Planck constant ħ > 0; λ = 1/ħ")
	if e, ok := t.number("energy"); ok {
		s.Energy = &e
	}
	return s
}

func (d *decoder) graded(root *table, names []string) *GradedForm {
	t := d.formTable(root, "graded", "index or permittivity, and wavelength or k0", gradedKeys)
	if t == nil {
		return nil
	}
	t.finish()
	g := &GradedForm{NIn: 1, Polarization: "s"}
	switch hasN, hasE := t.has("index"), t.has("permittivity"); {
	case hasN && hasE:
		t.errorf(t.keyPos("permittivity"), "give either %s or %s, not both", t.qualified("index"), t.qualified("permittivity"))
	case hasE:
		if f, ok := t.formula("permittivity", "", names); ok {
			g.Permittivity = &f
		}
	default:
		if f, ok := t.formula("index", "the refractive index n(x), or permittivity = ε(x) = n(x)²", names); ok {
			g.Index = &f
		}
	}
	switch hasW, hasK := t.has("wavelength"), t.has("k0"); {
	case hasW && hasK:
		t.errorf(t.keyPos("k0"), "give either %s or %s, not both", t.qualified("wavelength"), t.qualified("k0"))
	case hasW:
		if w, ok := t.positive("wavelength", "the vacuum wavelength"); ok {
			g.Wavelength, g.K0 = w, 2*math.Pi/w
		}
	case hasK:
		if k, ok := t.positive("k0", "the vacuum wave number"); ok {
			g.K0, g.Wavelength = k, 2*math.Pi/k
		}
	default:
		t.errorf(t.pos(), "%s needs wavelength (the vacuum wavelength) or k0 (the vacuum wave number 2π/wavelength)", t.describe())
	}
	if a, ok := t.number("angle"); ok {
		if a <= -90 || a >= 90 {
			t.valueErrorf("angle", "%s must lie strictly between -90 and 90 degrees, got %v", t.qualified("angle"), a)
		} else {
			g.Angle = a
		}
	}
	if n, ok := t.number("n_in"); ok {
		if n <= 0 {
			t.valueErrorf("n_in", "%s must be positive, got %v", t.qualified("n_in"), n)
		} else {
			g.NIn = n
		}
	}
	if t.has("polarization") {
		if p, ok := t.str("polarization"); ok {
			switch p {
			case "s", "TE", "te":
				g.Polarization = "s"
			case "p", "TM", "tm":
				g.Polarization = "p"
			default:
				t.valueErrorf("polarization", "%s must be \"s\" (TE) or \"p\" (TM), got %q", t.qualified("polarization"), p)
			}
		}
	}
	return g
}

func (d *decoder) general(root *table, names []string) *GeneralForm {
	t := d.formTable(root, "general", "Q and lambda", generalKeys)
	if t == nil {
		return nil
	}
	t.finish()
	g := &GeneralForm{}
	g.Q, _ = t.formula("Q", "the formula Q(x) of y'' + (lambda^2 Q + Q1) y = 0", names)
	if t.has("Q1") {
		if q1, ok := t.formula("Q1", "", names); ok {
			g.Q1 = &q1
		}
	}
	g.Lambda, _ = t.positive("lambda", "the large parameter λ > 0")
	return g
}

func (d *decoder) region(c *Case, root *table) {
	t := root.sub("region", regionKeys...)
	if t == nil {
		if !root.has("region") {
			root.errorf(root.pos(), "missing [region] table: give at least x = [a, b], the real interval of interest")
		}
		return
	}
	t.finish()
	okX := false
	if !t.has("x") {
		t.errorf(t.pos(), "%s needs x = [a, b], the real interval of interest", t.describe())
	} else {
		c.Region.A, c.Region.B, okX = t.pair("x")
	}
	if bt := t.sub("box", boxKeys...); bt != nil {
		bt.finish()
		c.Region.Box = d.box(bt, c.Region.A, c.Region.B, okX)
	}
	if s, ok := t.choice("left", "open", "open", "wall"); ok {
		c.Region.LeftWall = s == "wall"
	}
	if s, ok := t.choice("right", "open", "open", "wall"); ok {
		c.Region.RightWall = s == "wall"
	}
}

// box reads region.box and checks that it contains the interval [a, b] when
// that is known (okX).
func (d *decoder) box(t *table, a, b float64, okX bool) *turning.Box {
	var ok [2]bool
	var lo, hi [2]float64
	for i, k := range boxKeys {
		if !t.has(k) {
			t.errorf(t.pos(), "%s needs %s = [lo, hi]", t.describe(), k)
			continue
		}
		lo[i], hi[i], ok[i] = t.pair(k)
	}
	if !ok[0] || !ok[1] || !okX {
		return nil
	}
	good := true
	if lo[0] > a || hi[0] < b {
		t.valueErrorf("re", "%s = [%v, %v] must contain the interval region.x = [%v, %v]", t.qualified("re"), lo[0], hi[0], a, b)
		good = false
	}
	if lo[1] >= 0 || hi[1] <= 0 {
		t.valueErrorf("im", "%s = [%v, %v] must have 0 strictly inside, so that the real axis is not on the edge of the box", t.qualified("im"), lo[1], hi[1])
		good = false
	}
	if !good {
		return nil
	}
	return &turning.Box{Lo: complex(lo[0], lo[1]), Hi: complex(hi[0], hi[1])}
}

// scanVariables returns the variables a case of form f can scan besides its
// parameters.
func scanVariables(f Form) []string {
	switch f {
	case Schrodinger:
		return []string{"energy", "hbar", "mass"}
	case Graded:
		return []string{"wavelength", "k0", "angle"}
	case General:
		return []string{"lambda"}
	}
	return nil
}

func (d *decoder) scan(c *Case, t *table, formOK bool) *Scan {
	t.finish()
	s := &Scan{}
	okAll := true
	if !t.has("over") {
		t.errorf(t.pos(), "[scan] needs over, the variable to scan (%s, or a parameter)", strings.Join(scanVariables(c.Form), ", "))
		okAll = false
	} else if over, ok := t.str("over"); ok {
		s.Over = over
		allowed := scanVariables(c.Form)
		isParam := contains(d.paramNames, over)
		if isParam && contains(allowed, over) {
			t.valueErrorf("over", "scan.over = %q is ambiguous: it is a variable of form %q and a parameter; rename the parameter", over, c.Form)
			okAll = false
		} else if formOK && !isParam && !contains(allowed, over) {
			cand := append(append([]string(nil), allowed...), d.paramNames...)
			msg := fmt.Sprintf("scan.over = %q is neither a variable of form %q (%s) nor a parameter", over, c.Form, strings.Join(allowed, ", "))
			if sug := suggest(over, cand); sug != "" {
				msg += fmt.Sprintf("; did you mean %q?", sug)
			}
			t.valueErrorf("over", "%s", msg)
			okAll = false
		}
	} else {
		okAll = false
	}
	var ok1, ok2 bool
	if s.From, ok1 = t.required("from", "the first value of the scan"); ok1 && okAll {
		ok1 = d.checkValue(c, t, "from", s.Over, s.From)
	}
	if s.To, ok2 = t.required("to", "the last value of the scan"); ok2 && okAll {
		ok2 = d.checkValue(c, t, "to", s.Over, s.To)
	}
	s.Points = 1
	if t.has("points") {
		if n, ok := t.integer("points"); ok {
			switch {
			case n < 1:
				t.valueErrorf("points", "scan.points must be at least 1, got %d", n)
			case n > maxPoints:
				t.valueErrorf("points", "scan.points must be at most %d, got %d", maxPoints, n)
			default:
				s.Points = n
			}
		}
	} else {
		t.errorf(t.pos(), "[scan] needs points, the number of scan values (1 or more)")
	}
	if sp, ok := t.choice("spacing", "linear", "linear", "log"); ok && sp == "log" {
		s.Log = true
		if ok1 && ok2 && (s.From <= 0 || s.To <= 0) {
			t.valueErrorf("spacing", "log spacing needs positive from and to, got %v and %v", s.From, s.To)
		}
	}
	if ok1 && ok2 && s.Points > 1 && s.From == s.To {
		t.valueErrorf("to", "scan.from and scan.to are both %v with %d points; use points = 1 or different ends", s.From, s.Points)
	}
	return s
}

// checkValue reports a value of the scan variable over that no case could
// use, such as a negative wavelength.
func (d *decoder) checkValue(c *Case, t *table, key, over string, v float64) bool {
	if msg := valueProblem(over, v); msg != "" {
		t.valueErrorf(key, "%s: %s", t.qualified(key), msg)
		return false
	}
	return true
}

// valueProblem returns why v cannot be a value of the scan variable over, or
// "".
func valueProblem(over string, v float64) string {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return fmt.Sprintf("%s must be finite, got %v", over, v)
	case (over == "hbar" || over == "mass" || over == "wavelength" || over == "k0" || over == "lambda") && v <= 0:
		return fmt.Sprintf("%s must be positive, got %v", over, v)
	case over == "angle" && (v <= -90 || v >= 90):
		return fmt.Sprintf("angle must lie strictly between -90 and 90 degrees, got %v", v)
	}
	return ""
}

func (d *decoder) levels(c *Case, t *table, formOK bool) *Levels {
	t.finish()
	if formOK && c.Form != Schrodinger {
		t.errorf(t.pos(), "[levels] needs form \"schrodinger\" (bound-state energies), not %q", c.Form)
	}
	l := &Levels{MaxOrder: 6}
	switch hasN, hasC := t.has("n"), t.has("count"); {
	case hasN && hasC:
		t.errorf(t.keyPos("count"), "give either levels.n or levels.count, not both")
	case hasN:
		a, ok := t.array("n")
		if !ok {
			break
		}
		if len(a) == 0 {
			t.valueErrorf("n", "levels.n is empty: list at least one quantum number")
		}
		seen := map[int]bool{}
		for i, v := range a {
			elem := fmt.Sprintf("n[%d]", i)
			n, ok := t.toInteger(v, "levels."+elem, elem)
			if !ok {
				continue
			}
			switch {
			case n < 0:
				t.valueErrorf(elem, "levels.n[%d] = %d: quantum numbers start at 0", i, n)
			case n >= maxCount:
				t.valueErrorf(elem, "levels.n[%d] = %d: quantum numbers above %d are not supported", i, n, maxCount-1)
			case seen[n]:
				t.valueErrorf(elem, "levels.n lists %d twice", n)
			default:
				seen[n] = true
				l.N = append(l.N, n)
			}
		}
		sort.Ints(l.N)
	case hasC:
		n, ok := t.integer("count")
		if !ok {
			break
		}
		if n < 1 || n > maxCount {
			t.valueErrorf("count", "levels.count must be between 1 and %d, got %d", maxCount, n)
			break
		}
		for k := range n {
			l.N = append(l.N, k)
		}
	default:
		t.errorf(t.pos(), "[levels] needs n = [quantum numbers] or count = number of levels from n = 0")
	}
	if k, ok := t.integer("max_order"); ok {
		switch {
		case k < 0 || k > maxMaxOrder:
			t.valueErrorf("max_order", "levels.max_order must be between 0 and %d, got %d", maxMaxOrder, k)
		case k%2 != 0:
			t.valueErrorf("max_order", "levels.max_order must be even (the odd orders vanish), got %d", k)
		default:
			l.MaxOrder = k
		}
	}
	return l
}

func (d *decoder) expect(c *Case, root *table, formOK bool) {
	if _, ok := root.m["expect"].(map[string]any); ok {
		root.errorf(root.keyPos("expect"), "write [[expect]] (an array of tables, one per expectation), not [expect]")
		return
	}
	a, ok := root.array("expect")
	if !ok {
		return
	}
	for i, v := range a {
		m, ok := v.(map[string]any)
		path := fmt.Sprintf("expect[%d]", i)
		if !ok {
			root.valueErrorf(path, "expect must be an array of tables ([[expect]]), element %d is %s", i+1, typeName(v))
			continue
		}
		t := &table{d: d, path: path, name: "expect", m: m, known: expectKeys}
		if e, ok := d.expectation(c, t, formOK); ok {
			c.Expect = append(c.Expect, e)
		}
	}
}

func (d *decoder) expectation(c *Case, t *table, formOK bool) (Expectation, bool) {
	t.finish()
	e := Expectation{Pos: t.valuePos("value")}
	okAll := true
	bad := func(pos Position, format string, args ...any) {
		t.errorf(pos, format, args...)
		okAll = false
	}
	badValue := func(key, format string, args ...any) {
		t.valueErrorf(key, format, args...)
		okAll = false
	}
	if !t.has("quantity") {
		bad(t.pos(), "[[expect]] needs quantity (%s)", orList(quantities))
		return e, false
	}
	q, ok := t.choice("quantity", "", quantities...)
	if !ok {
		return e, false
	}
	e.Quantity = q

	// at: a value of the scan variable, for R, T and turning_points.
	if t.has("at") {
		switch {
		case q == "E" || q == "splitting":
			bad(t.keyPos("at"), "expect.at does not apply to %s; give n, the quantum number", q)
		case c.Scan == nil:
			bad(t.keyPos("at"), "expect.at is a value of scan.over, but the case has no [scan] table")
		default:
			if x, ok := t.number("at"); ok {
				if msg := valueProblem(c.Scan.Over, x); msg != "" && c.Scan.Over != "" {
					badValue("at", "expect.at: %s", msg)
				} else {
					e.At = &x
				}
			} else {
				okAll = false
			}
		}
	}

	if (q == "R" || q == "T" || q == "turning_points") && e.At == nil && !t.has("at") &&
		c.Schrodinger != nil && c.Schrodinger.Energy == nil {
		bad(t.pos(), "[[expect]] of %s without at refers to the base energy, but schrodinger.energy is not set", q)
	}

	// n: a quantum number, for E and splitting.
	switch {
	case q == "E" || q == "splitting":
		if formOK && c.Form != Schrodinger {
			badValue("quantity", "expect quantity %q needs form \"schrodinger\"", q)
		}
		if !t.has("n") {
			bad(t.pos(), "[[expect]] of %s needs n, the quantum number", q)
		} else if n, ok := t.integer("n"); ok {
			switch {
			case n < 0:
				badValue("n", "expect.n must be 0 or more, got %d", n)
			case c.Levels == nil && formOK && c.Form == Schrodinger:
				badValue("n", "expect of %s needs a [levels] table: bound states are computed for levels.n or levels.count", q)
			case q == "E" && c.Levels != nil && len(c.Levels.N) > 0 && !slices.Contains(c.Levels.N, n):
				badValue("n", "expect.n = %d is not among the levels computed (levels.n or levels.count)", n)
			default:
				e.N = &n
			}
		} else {
			okAll = false
		}
	case t.has("n"):
		bad(t.keyPos("n"), "expect.n does not apply to %s", q)
	}

	// method
	if q == "turning_points" {
		if t.has("method") {
			bad(t.keyPos("method"), "expect.method does not apply to turning_points (a count of zeros of Q)")
		}
	} else if !t.has("method") {
		bad(t.pos(), "[[expect]] of %s needs method (%s)", q, orList(methods))
	} else if m, ok := t.choice("method", "", methods...); ok {
		e.Method = m
	} else {
		okAll = false
	}

	// value
	if !t.has("value") {
		bad(t.pos(), "[[expect]] needs value, the expected %s", q)
	} else if x, ok := t.number("value"); ok {
		e.Value = x
		switch q {
		case "R", "T":
			if x < 0 || x > 1 {
				badValue("value", "expect.value = %v: %s is a fraction of the flux, between 0 and 1", x, q)
			}
		case "splitting":
			if x <= 0 {
				badValue("value", "expect.value = %v: a splitting is positive", x)
			}
		case "turning_points":
			if x < 0 || x != math.Trunc(x) {
				badValue("value", "expect.value = %v: a count of turning points is a whole number, 0 or more", x)
			}
		}
	} else {
		okAll = false
	}

	// tolerances
	okTol := true
	for _, k := range []string{"rel_tol", "abs_tol"} {
		if x, ok := t.number(k); ok {
			if x < 0 {
				okTol = false
				badValue(k, "expect.%s must be 0 or more, got %v", k, x)
			} else if k == "rel_tol" {
				e.RelTol = x
			} else {
				e.AbsTol = x
			}
		} else if t.has(k) {
			okAll, okTol = false, false
		}
	}
	if q != "turning_points" && e.RelTol == 0 && e.AbsTol == 0 && okTol {
		bad(t.pos(), "[[expect]] needs a tolerance: rel_tol or abs_tol, positive")
	}

	// source
	if !t.has("source") {
		bad(t.pos(), "[[expect]] needs source, where the value comes from (book and section, closed form, table)")
	} else if s, ok := t.str("source"); ok {
		if strings.TrimSpace(s) == "" {
			badValue("source", "expect.source is empty: say where the value comes from")
		}
		e.Source = s
	} else {
		okAll = false
	}
	return e, okAll
}

// formula reads key as a formula in x with the case's parameters. A mistake
// in it is reported at its place inside the TOML string.
func (t *table) formula(key, what string, names []string) (Formula, bool) {
	if !t.has(key) {
		t.errorf(t.pos(), "%s needs %s (%s)", t.describe(), key, what)
		return Formula{}, false
	}
	text, ok := t.str(key)
	if !ok {
		return Formula{}, false
	}
	f := Formula{Text: text, Pos: t.valuePos(key)}
	expr, err := formula.Parse(text, names)
	if err == nil {
		f.Expr = expr
		return f, true
	}
	var list formula.ErrorList
	var one *formula.Error
	switch {
	case errors.As(err, &one) && !errors.As(err, &list):
		list = formula.ErrorList{one}
	case errors.As(err, &list):
	default:
		t.errorf(f.Pos, "%s: %v", t.qualified(key), err)
		return f, false
	}
	for _, fe := range list {
		t.formulaError(key, text, fe)
	}
	return f, false
}

// formulaError reports fe, a mistake in the formula text of key. When the
// string's contents in the file are the formula itself (no escapes), the
// formula's offsets map to places in the file, across lines for a multi-line
// string; otherwise the error is placed on the string and its excerpt is the
// formula's own.
func (t *table) formulaError(key, text string, fe *formula.Error) {
	d := t.d
	sp, found := d.spans[join(t.path, key)]
	if !found || fe.Offset < 0 || fe.Offset > len(text) {
		t.valueErrorf(key, "%s: %s", t.qualified(key), fe.Msg)
		return
	}
	start := verbatimStart(d.src[sp.valOff:min(sp.valEnd, len(d.src))], text)
	if start < 0 {
		e := &Error{Pos: Position{Filename: d.filename, Line: sp.valLine, Column: sp.valCol},
			Msg: fmt.Sprintf("%s: %s", t.qualified(key), fe.Msg), Excerpt: fe.Excerpt(text)}
		d.errs = append(d.errs, e)
		return
	}
	off := sp.valOff + start + fe.Offset
	ls := strings.LastIndexByte(d.src[:off], '\n') + 1
	line := strings.Count(d.src[:ls], "\n") + 1
	col := utf8.RuneCountInString(d.src[ls:off]) + 1
	end := min(fe.Offset+max(fe.Len, 0), len(text))
	span := text[fe.Offset:end]
	if k := strings.IndexByte(span, '\n'); k >= 0 {
		span = span[:k]
	}
	d.errorSpan(line, col, utf8.RuneCountInString(span), fe.Msg)
}

// verbatimStart returns the offset in raw, a TOML string as written, at
// which its decoded value text appears verbatim, or -1 when the value differs
// from what is written (escapes, line-ending backslashes).
func verbatimStart(raw, text string) int {
	var open int
	switch {
	case strings.HasPrefix(raw, `"""`) || strings.HasPrefix(raw, "'''"):
		open = 3
		// A newline right after the opening delimiter is not part of the value.
		if strings.HasPrefix(raw[3:], "\r\n") {
			open += 2
		} else if strings.HasPrefix(raw[3:], "\n") {
			open++
		}
	case strings.HasPrefix(raw, `"`) || strings.HasPrefix(raw, "'"):
		open = 1
	default:
		return -1
	}
	if raw[0] == '"' && strings.Contains(raw, `\`) {
		return -1
	}
	if !strings.HasPrefix(raw[open:], text) {
		return -1
	}
	return open
}
