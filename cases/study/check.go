package study

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/cases"
)

// runChecks evaluates the expectations of the case file against the report,
// computing any figure the studies did not already produce.
func runChecks(c *cases.Case, rep *Report, opt *Options) {
	for i := range c.Expect {
		e := &c.Expect[i]
		got, err := expectedFigure(c, e, rep, opt)
		ch := Check{Quantity: e.Quantity, At: e.At, N: e.N, Method: e.Method, Want: e.Value,
			Got: Number(got), Source: e.Source, Where: e.Pos.String(), Tol: tolerance(e)}
		name := figureName(e)
		switch {
		case err != nil:
			ch.Got = Number(math.NaN())
			ch.Diff = Number(math.NaN())
			ch.Message = fmt.Sprintf("%s: %s could not be computed: %v", ch.Where, name, err)
		default:
			ch.Diff = Number(math.Abs(got - e.Value))
			ch.Pass = e.Holds(got)
			if !ch.Pass {
				ch.Message = fmt.Sprintf("%s: %s = %.10g, expected %.10g: off by %.3g (relative %.3g), tolerance %.3g",
					ch.Where, name, got, e.Value, math.Abs(got-e.Value), relative(got, e.Value), ch.Tol)
			}
		}
		rep.Checks = append(rep.Checks, ch)
	}
}

// tolerance is the absolute tolerance an expectation allows.
func tolerance(e *cases.Expectation) float64 {
	return math.Max(e.AbsTol, e.RelTol*math.Abs(e.Value))
}

func relative(got, want float64) float64 {
	if want == 0 {
		return math.Inf(1)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// figureName is how an expectation's figure is named in messages.
func figureName(e *cases.Expectation) string {
	s := e.Quantity
	if e.N != nil {
		s += fmt.Sprintf("[%d]", *e.N)
	}
	if e.At != nil {
		s += fmt.Sprintf(" at %g", *e.At)
	}
	if e.Method != "" {
		s += " (" + e.Method + ")"
	}
	return s
}

func expectedFigure(c *cases.Case, e *cases.Expectation, rep *Report, opt *Options) (float64, error) {
	switch e.Quantity {
	case "R", "T":
		row, err := rowFor(c, e, rep)
		if err != nil {
			return 0, err
		}
		amp := row.WKB
		if e.Method == "numeric" {
			amp = row.Numeric
		}
		if amp == nil {
			return 0, fmt.Errorf("%s", row.Error)
		}
		if e.Quantity == "R" {
			return float64(amp.R), nil
		}
		return float64(amp.T), nil
	case "E":
		if e.N == nil {
			return 0, fmt.Errorf("an expectation of E needs n")
		}
		if rep.Levels == nil {
			return 0, fmt.Errorf("the case has no [levels] study")
		}
		for _, r := range rep.Levels.Rows {
			if r.N == *e.N {
				if e.Method == "numeric" {
					return float64(r.Numeric), nil
				}
				return float64(r.WKB), nil
			}
		}
		return 0, fmt.Errorf("level n = %d is not among the levels studied", *e.N)
	case "splitting":
		if e.N == nil {
			return 0, fmt.Errorf("an expectation of a splitting needs n")
		}
		if rep.Levels == nil {
			return 0, fmt.Errorf("the case has no [levels] study")
		}
		for _, d := range rep.Levels.Doublets {
			if d.N == *e.N {
				if e.Method == "numeric" {
					return float64(d.Numeric), nil
				}
				return float64(d.Splitting), nil
			}
		}
		return 0, fmt.Errorf("no doublet with n = %d", *e.N)
	case "turning_points":
		if rep.Points == nil {
			return 0, fmt.Errorf("turning points were not computed")
		}
		n := 0
		for _, p := range rep.Points.Points {
			if p.Order > 0 {
				n += p.Order
			}
		}
		return float64(n), nil
	}
	return 0, fmt.Errorf("unknown quantity %q", e.Quantity)
}

// rowFor finds the scan row of an expectation, computing it when the scan
// does not contain that value.
func rowFor(c *cases.Case, e *cases.Expectation, rep *Report) (ScanRow, error) {
	if e.At == nil {
		return scatterAt(c, 0, true, nil), nil
	}
	if rep.Scan != nil {
		for _, r := range rep.Scan.Rows {
			if math.Abs(r.At-*e.At) <= 1e-12*math.Max(1, math.Abs(*e.At)) {
				return r, nil
			}
		}
	}
	if c.Scan == nil {
		return ScanRow{}, fmt.Errorf("the expectation gives at = %g but the case has no [scan]", *e.At)
	}
	return scatterAt(c, *e.At, false, nil), nil
}
