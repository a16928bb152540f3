package cases

import (
	"errors"
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/turning"
	"github.com/turnpoint/turnpoint/wkb"
	"github.com/turnpoint/turnpoint/wkb/jet"
)

// Interval returns the real interval of interest [a, b].
func (c *Case) Interval() (a, b float64) { return c.Region.A, c.Region.B }

// SearchBox returns the complex box in which turning points and poles are
// sought: region.box when the file gives one, turning.DefaultBox(a, b)
// otherwise.
func (c *Case) SearchBox() turning.Box {
	if c.Region.Box != nil {
		return *c.Region.Box
	}
	return turning.DefaultBox(c.Region.A, c.Region.B)
}

// ScanLabel returns the name of the scanned variable for tables and plots:
// "E", "hbar", "m", "lambda0", "k0", "theta (deg)", "lambda" or the
// parameter's name; "" without a scan.
func (c *Case) ScanLabel() string {
	if c.Scan == nil {
		return ""
	}
	switch c.Scan.Over {
	case "energy":
		return "E"
	case "mass":
		return "m"
	case "wavelength":
		return "lambda0"
	case "angle":
		return "theta (deg)"
	}
	return c.Scan.Over
}

// point is the set of values a problem is built from.
type point struct {
	params     map[string]float64
	energy     *float64
	mass, hbar float64
	k0, angle  float64
	lambda     float64
}

// base returns the values of the file.
func (c *Case) base() point {
	p := point{params: c.Params}
	switch {
	case c.Schrodinger != nil:
		p.energy, p.mass, p.hbar = c.Schrodinger.Energy, c.Schrodinger.Mass, c.Schrodinger.Hbar
	case c.Graded != nil:
		p.k0, p.angle = c.Graded.K0, c.Graded.Angle
	case c.General != nil:
		p.lambda = c.General.Lambda
	}
	return p
}

// at returns the values of the file with the scan variable set to v.
func (c *Case) at(v float64) (point, error) {
	if c.Scan == nil {
		return point{}, errors.New("the case has no [scan] table")
	}
	over := c.Scan.Over
	if msg := valueProblem(over, v); msg != "" {
		return point{}, errors.New(msg)
	}
	p := c.base()
	if _, ok := c.Params[over]; ok {
		params := make(map[string]float64, len(c.Params))
		for k, x := range c.Params {
			params[k] = x
		}
		params[over] = v
		p.params = params
		return p, nil
	}
	if !contains(scanVariables(c.Form), over) {
		return point{}, fmt.Errorf("cannot scan over %q in a case of form %q", over, c.Form)
	}
	switch over {
	case "energy":
		p.energy = &v
	case "hbar":
		p.hbar = v
	case "mass":
		p.mass = v
	case "wavelength":
		p.k0 = 2 * math.Pi / v
	case "k0":
		p.k0 = v
	case "angle":
		p.angle = v
	case "lambda":
		p.lambda = v
	}
	return p, nil
}

// Problem returns the canonical problem y″ + (λ²Q + Q1)y = 0 at the values of
// the file: Schrödinger λ = 1/ħ, Q = 2m(E − V) (which needs
// schrodinger.energy); graded λ = k0, Q = ε − n_in² sin²θ with ε = n², and
// for p (TM) waves Q1 = ε″/(2ε) − (3/4)(ε′/ε)², the Liouville form of the
// equation for u = H/√ε, H the tangential magnetic field (Q1 has double
// poles where ε = 0); general as given. Q and Q1 are composed of the bound
// formulas, so their Taylor coefficients are exact.
func (c *Case) Problem() (wkb.Problem, error) { return c.problem(c.base()) }

// ProblemAt returns Problem with the scan variable (c.Scan.Over) set to v. It
// returns an error without a scan or for a value the variable cannot take.
func (c *Case) ProblemAt(v float64) (wkb.Problem, error) {
	p, err := c.at(v)
	if err != nil {
		return wkb.Problem{}, err
	}
	return c.problem(p)
}

// Well returns the Schrödinger problem of the file: V, mass, ħ, the interval
// and its walls. It returns an error for the other forms.
func (c *Case) Well() (wkb.Well, error) { return c.well(c.base()) }

// WellAt returns Well with the scan variable set to v, for a scan over ħ, the
// mass or a parameter.
func (c *Case) WellAt(v float64) (wkb.Well, error) {
	p, err := c.at(v)
	if err != nil {
		return wkb.Well{}, err
	}
	return c.well(p)
}

func (c *Case) well(p point) (wkb.Well, error) {
	s := c.Schrodinger
	if s == nil {
		return wkb.Well{}, fmt.Errorf("a well needs form \"schrodinger\", the case has form %q", c.Form)
	}
	v, err := bind(s.Potential, p.params, "schrodinger.potential")
	if err != nil {
		return wkb.Well{}, err
	}
	return wkb.Well{V: v, Mass: p.mass, Hbar: p.hbar, A: c.Region.A, B: c.Region.B,
		LeftWall: c.Region.LeftWall, RightWall: c.Region.RightWall}, nil
}

func (c *Case) problem(p point) (wkb.Problem, error) {
	switch {
	case c.Schrodinger != nil:
		if p.energy == nil {
			return wkb.Problem{}, errors.New("the case gives no energy: set schrodinger.energy or scan over energy")
		}
		w, err := c.well(p)
		if err != nil {
			return wkb.Problem{}, err
		}
		return w.Problem(*p.energy), nil
	case c.Graded != nil:
		g := c.Graded
		f, name, squared := g.Index, "graded.index", true
		if g.Permittivity != nil {
			f, name, squared = g.Permittivity, "graded.permittivity", false
		}
		if f == nil {
			return wkb.Problem{}, errors.New("the [graded] table gives neither index nor permittivity")
		}
		n, err := bind(*f, p.params, name)
		if err != nil {
			return wkb.Problem{}, err
		}
		s := g.NIn * math.Sin(p.angle*math.Pi/180)
		pr := wkb.Problem{Q: gradedQ{n: n, square: squared, s2: complex(s*s, 0)}, Lambda: p.k0}
		if g.Polarization == "p" {
			pr.Q1 = tmQ1{n: n, square: squared} // see tm.go
		}
		return pr, nil
	case c.General != nil:
		q, err := bind(c.General.Q, p.params, "general.Q")
		if err != nil {
			return wkb.Problem{}, err
		}
		pr := wkb.Problem{Q: q, Lambda: p.lambda}
		if c.General.Q1 != nil {
			if pr.Q1, err = bind(*c.General.Q1, p.params, "general.Q1"); err != nil {
				return wkb.Problem{}, err
			}
		}
		return pr, nil
	}
	return wkb.Problem{}, errors.New("the case has no form table")
}

// bind binds f to the parameter values.
func bind(f Formula, params map[string]float64, name string) (jet.Func, error) {
	if f.Expr == nil {
		return nil, fmt.Errorf("%s has no parsed formula", name)
	}
	values := make(map[string]complex128, len(params))
	for k, x := range params {
		values[k] = complex(x, 0)
	}
	fn, err := f.Expr.Bind(values)
	if err != nil {
		return nil, fmt.Errorf("%s: %v", name, err)
	}
	return fn, nil
}

// gradedQ is Q = n(x)² − s2 (square) or Q = ε(x) − s2, with s2 = n_in² sin²θ.
type gradedQ struct {
	n      jet.Func // n(x), or ε(x) when !square
	square bool
	s2     complex128
}

func (g gradedQ) Eval(z complex128) complex128 {
	v := g.n.Eval(z)
	if g.square {
		v *= v
	}
	return v - g.s2
}

func (g gradedQ) Taylor(z complex128, n int) jet.Series {
	q := g.n.Taylor(z, n)
	if g.square {
		q = jet.Mul(q, q)
	} else {
		q = append(jet.Series(nil), q...) // do not modify a series the Func may keep
	}
	q[0] -= g.s2
	return q
}

// BaseValue returns the value the file gives the scan variable: the energy,
// ħ, mass, wavelength, k0, angle or λ of the form's table, or the
// parameter's value. ok is false without a scan, and for a scan over energy
// when schrodinger.energy is not set.
func (c *Case) BaseValue() (v float64, ok bool) {
	if c.Scan == nil {
		return 0, false
	}
	if x, isParam := c.Params[c.Scan.Over]; isParam {
		return x, true
	}
	p := c.base()
	switch c.Scan.Over {
	case "energy":
		if p.energy == nil {
			return 0, false
		}
		return *p.energy, true
	case "hbar":
		return p.hbar, c.Schrodinger != nil
	case "mass":
		return p.mass, c.Schrodinger != nil
	case "wavelength":
		if c.Graded == nil {
			return 0, false
		}
		return c.Graded.Wavelength, true
	case "k0":
		return p.k0, c.Graded != nil
	case "angle":
		return p.angle, c.Graded != nil
	case "lambda":
		return p.lambda, c.General != nil
	}
	return 0, false
}
