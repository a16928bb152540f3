package stokes

import (
	"fmt"
	"io"
	"math"
	"text/tabwriter"
)

// WriteSummary writes a plain-text account of the geometry to w: the
// convention, the points, one row per line (family, start point and angle
// in degrees, how and where it ends, w at its end and its arc length),
// the degeneracies with their Gap and its error, the crossings of the real
// axis, the cuts, and the warnings.
func (g *Geometry) WriteSummary(w io.Writer) error {
	ew := &errWriter{w: w}
	ew.printf("# %s\n", Convention)
	ew.printf("points:\n")
	tw := tabwriter.NewWriter(ew, 2, 4, 2, ' ', 0)
	fmt.Fprintf(tw, "  #\tz\torder\tkind\n")
	for i, p := range g.Points {
		fmt.Fprintf(tw, "  %d\t%s\t%d\t%v\n", i, fmtC(p.Z, 8), p.Order, p.Kind)
	}
	tw.Flush()
	ew.printf("lines:\n")
	tw = tabwriter.NewWriter(ew, 2, 4, 2, ' ', 0)
	fmt.Fprintf(tw, "  family\tfrom\tangle°\tend\tto\tw(end)\tlength\n")
	for _, ln := range g.Lines {
		to := "-"
		if ln.To >= 0 {
			to = fmt.Sprint(ln.To)
		}
		fmt.Fprintf(tw, "  %v\t%d\t%.2f\t%v\t%s\t%s\t%.4g\n", ln.Family, ln.From, ln.StartAngle*180/math.Pi, ln.End, to, fmtC(ln.EndW, 6), ln.Length)
	}
	tw.Flush()
	if len(g.Degeneracies) == 0 {
		ew.printf("degeneracies: none\n")
	} else {
		ew.printf("degeneracies (Stokes line joining two turning points):\n")
		for _, d := range g.Degeneracies {
			ew.printf("  %d–%d  Gap = %s ± %.2g\n", d.From, d.To, fmtC(d.Gap, 10), d.Err)
		}
	}
	if cs := g.AxisCrossings(); len(cs) == 0 {
		ew.printf("real-axis crossings: none\n")
	} else {
		ew.printf("real-axis crossings:\n")
		for _, c := range cs {
			ew.printf("  x = %.10g  %v line %d from point %d, w = %s\n", c.X, c.Family, c.Line, c.From, fmtC(c.W, 8))
		}
	}
	ew.printf("cuts: %d, from points %v\n", len(g.Cuts), g.CutFrom)
	for _, s := range g.Warnings {
		ew.printf("warning: %s\n", s)
	}
	return ew.err
}

// fmtC formats z with prec significant digits, printing a part smaller
// than 1e-12 of |z| (rounding noise of a real or imaginary quantity) as 0.
func fmtC(z complex128, prec int) string {
	a := math.Hypot(real(z), imag(z))
	re, im := real(z), imag(z)
	if math.Abs(re) < 1e-12*a {
		re = 0
	}
	if math.Abs(im) < 1e-12*a {
		im = 0
	}
	return fmt.Sprintf("%.*g%+.*gi", prec, re, prec, im)
}

// errWriter keeps the first write error.
type errWriter struct {
	w   io.Writer
	err error
}

func (e *errWriter) Write(b []byte) (int, error) {
	if e.err != nil {
		return 0, e.err
	}
	n, err := e.w.Write(b)
	e.err = err
	return n, err
}

func (e *errWriter) printf(format string, args ...any) {
	fmt.Fprintf(e, format, args...)
}
