package main

import (
	"fmt"
	"io"
	"math"
	"regexp"
	"strings"
	"text/tabwriter"

	"github.com/turnpoint/turnpoint/cases/study"
)

// fmtC formats a complex number compactly.
func fmtC(z study.Complex) string {
	// Parts below rounding relative to the other part are printed as zero.
	scale := math.Max(math.Abs(z.Re), math.Abs(z.Im))
	if math.Abs(z.Re) < 1e-14*scale {
		z.Re = 0
	}
	if math.Abs(z.Im) < 1e-14*scale {
		z.Im = 0
	}
	if z.Im == 0 {
		return fmt.Sprintf("%.10g", z.Re)
	}
	sign := "+"
	im := z.Im
	if im < 0 {
		sign, im = "-", -im
	}
	return fmt.Sprintf("%.10g %s %.10gi", z.Re, sign, im)
}

func fmtN(n study.Number, digits int) string {
	f := float64(n)
	if math.IsNaN(f) {
		return "—"
	}
	return fmt.Sprintf("%.*g", digits, f)
}

func fmtErr(n study.Number) string {
	f := float64(n)
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return "±?"
	}
	return fmt.Sprintf("±%.1e", f)
}

func verdictWord(v *study.Verdict) string {
	switch {
	case v == nil:
		return "—"
	case v.Agree:
		return "agree"
	}
	return "DIFFER"
}

func newTable(w io.Writer) *tabwriter.Writer {
	return tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
}

// writeHeader prints the case's identity and conventions.
func writeHeader(w io.Writer, r *study.Report) {
	title := r.Title
	if title == "" {
		title = "(untitled)"
	}
	fmt.Fprintf(w, "case      %s — %s\n", r.Case, title)
	fmt.Fprintf(w, "equation  y'' + (lambda^2 Q(x) + Q1(x)) y = 0, form %s, lambda = %s, interval [%g, %g]\n",
		r.Form, fmtN(r.Lambda, 8), r.Interval[0], r.Interval[1])
}

func writePoints(w io.Writer, p *study.PointsReport) {
	if p == nil {
		return
	}
	at := ""
	if p.At != nil {
		at = fmt.Sprintf(" at %s = %.8g", p.AtWhat, *p.At)
	}
	fmt.Fprintf(w, "\nturning points and singularities of Q%s\nsearch box Re x in [%g, %g], Im x in [%g, %g]\n",
		at, p.Box[0].Re, p.Box[1].Re, p.Box[0].Im, p.Box[1].Im)
	tw := newTable(w)
	fmt.Fprintln(tw, "  #\tposition\torder\tkind\t|residual|\tposition error")
	for i, q := range p.Points {
		fmt.Fprintf(tw, "  %d\t%s\t%d\t%s\t%s\t%s\n", i, fmtC(q.Z), q.Order, q.Kind, fmtN(q.Residual, 2), fmtN(q.Err, 2))
	}
	tw.Flush()
	state := "complete: every zero and pole counted by the argument principle is listed"
	if !p.Complete {
		state = "INCOMPLETE (" + p.Status + "): the list may miss points"
	}
	fmt.Fprintf(w, "argument principle: winding %d = %d zeros - %d poles; %s\n", p.Winding, p.Zeros, p.Poles, state)
	for _, z := range p.Q1Poles {
		fmt.Fprintf(w, "singularity of the lambda-free term Q1 (not a zero or pole of Q): pole at %s\n", fmtC(z))
	}
	for _, s := range p.Warnings {
		fmt.Fprintf(w, "warning: %s\n", s)
	}
}

// writeStokes prints the Stokes geometry: every line when full, else one
// line per turning point saying where its lines end.
func writeStokes(w io.Writer, r *study.Report, full bool) {
	s := r.Stokes
	if s == nil {
		return
	}
	fmt.Fprintf(w, "\nStokes geometry (%s)\n", r.Convention)
	tw := newTable(w)
	if full {
		fmt.Fprintln(tw, "  from\tfamily\tstart angle\tends on\tend point")
		for _, l := range s.Lines {
			to := l.EndsOn
			if l.To >= 0 {
				to = fmt.Sprintf("%s #%d", l.EndsOn, l.To)
			}
			fmt.Fprintf(tw, "  #%d\t%s\t%s°\t%s\t%s\n", l.From, l.Family, fmtN(l.StartAngle, 4), to, fmtC(l.End))
		}
	} else {
		fmt.Fprintln(tw, "  from\tStokes lines end on\tanti-Stokes lines end on")
		var order []int
		ends := map[int]*[2][]string{}
		for _, l := range s.Lines {
			e := ends[l.From]
			if e == nil {
				e = &[2][]string{}
				ends[l.From] = e
				order = append(order, l.From)
			}
			to := l.EndsOn
			if l.To >= 0 {
				to = fmt.Sprintf("#%d", l.To)
			}
			k := 0
			if l.Family != "Stokes" {
				k = 1
			}
			e[k] = append(e[k], to)
		}
		for _, from := range order {
			e := ends[from]
			fmt.Fprintf(tw, "  #%d\t%s\t%s\n", from, strings.Join(e[0], ", "), strings.Join(e[1], ", "))
		}
	}
	tw.Flush()
	if len(s.Degeneracies) == 0 {
		fmt.Fprintln(w, "no Stokes line joins two turning points")
	}
	for _, d := range s.Degeneracies {
		fmt.Fprintf(w, "DEGENERACY: a Stokes line joins turning points #%d and #%d (integral of sqrt Q between them %s %s)\n",
			d.From, d.To, fmtC(d.Gap), fmtErr(d.GapErr))
	}
	if len(s.Degeneracies) > 0 {
		note := "across a degeneracy a first-order connection formula is not valid"
		if r.Scan != nil {
			note += ": scattering uses the uniform parabolic-cylinder connection for such a pair"
		} else if r.Levels != nil {
			note += ": double wells are quantised with the uniform connection through their barrier"
		}
		fmt.Fprintf(w, "  (%s)\n", note)
	}
	for _, x := range s.Warnings {
		fmt.Fprintf(w, "warning: %s\n", x)
	}
	if s.Figure != "" {
		fmt.Fprintf(w, "figure: %s\n", s.Figure)
	}
}

func writeScan(w io.Writer, s *study.ScanReport) {
	if s == nil {
		return
	}
	fmt.Fprintf(w, "\nscattering, wave incident from the left, R = |r|^2, T = |t|^2 flux-normalised; scan over %s\n", s.Label)
	tw := newTable(w)
	fmt.Fprintf(tw, "  %s\tR (WKB)\t\tR (numerical)\t\tdiff\tT (WKB)\t\tT (numerical)\t\tdiff\tverdict\tformula\n", s.Label)
	var formulas []string
	key := func(method string) string {
		for i, f := range formulas {
			if f == method {
				return string(rune('A' + i%26))
			}
		}
		formulas = append(formulas, method)
		return string(rune('A' + (len(formulas)-1)%26))
	}
	for _, r := range s.Rows {
		if r.WKB == nil && r.Numeric != nil {
			// The numerical figure stands alone; the reason follows the table.
			fmt.Fprintf(tw, "  %.6g\t—\t\t%.10g\t%s\t\t—\t\t%.10g\t%s\t\tnot compared\t—\n", r.At,
				float64(r.Numeric.R), fmtErr(r.Numeric.ErrR), float64(r.Numeric.T), fmtErr(r.Numeric.ErrT))
			continue
		}
		if r.WKB == nil || r.Numeric == nil {
			fmt.Fprintf(tw, "  %.6g\tnot computed: %s\n", r.At, r.Error)
			continue
		}
		verdict := "agree"
		if !r.R.Agree || !r.T.Agree {
			verdict = "DIFFER"
		}
		fmt.Fprintf(tw, "  %.6g\t%.6g\t%s\t%.10g\t%s\t%.1e\t%.6g\t%s\t%.10g\t%s\t%.1e\t%s\t%s\n", r.At,
			float64(r.WKB.R), fmtErr(r.WKB.ErrR), float64(r.Numeric.R), fmtErr(r.Numeric.ErrR), float64(r.R.RelDiff),
			float64(r.WKB.T), fmtErr(r.WKB.ErrT), float64(r.Numeric.T), fmtErr(r.Numeric.ErrT), float64(r.T.RelDiff),
			verdict, key(fmt.Sprintf("%s; to order %d in 1/lambda", r.WKB.Method, r.WKB.Order)))
	}
	tw.Flush()
	for i, f := range formulas {
		fmt.Fprintf(w, "  formula %c: %s\n", 'A'+i%26, f)
	}
	for _, r := range s.Rows {
		if r.WKB == nil && r.Numeric != nil && r.Error != "" {
			fmt.Fprintf(w, "  no WKB figure at %s = %.6g: %s\n", s.Label, r.At, r.Error)
		}
	}
	if len(s.Rows) > 0 {
		fmt.Fprintln(w, "  numerical check: "+numericMethods(s))
	}
	for _, d := range s.Degeneracies {
		fmt.Fprintf(w, "Stokes degeneracy near %s = %.8g %s: a Stokes line joins the turning points %s and %s; first-order connection formulae change there\n",
			s.Label, d.At, fmtErr(d.Err), fmtC(d.T1), fmtC(d.T2))
	}
	if s.EverywhereDegenerate {
		fmt.Fprintln(w, "a Stokes line joins the two turning points nearest the axis across the whole scan (as across any real barrier): the uniform connection is used throughout")
	}
	type group struct {
		first  string
		at     float64
		points int
	}
	var groups []*group
	byShape := map[string]*group{}
	for _, r := range s.Rows {
		if r.WKB == nil {
			continue
		}
		seenHere := map[string]bool{}
		for _, x := range r.WKB.Warnings {
			// Warnings that differ only in their numbers are one kind.
			shape := numberPattern.ReplaceAllString(x, "#")
			g := byShape[shape]
			if g == nil {
				g = &group{first: x, at: r.At}
				byShape[shape] = g
				groups = append(groups, g)
			}
			if !seenHere[shape] {
				seenHere[shape] = true
				g.points++
			}
		}
	}
	for _, g := range groups {
		fmt.Fprintf(w, "warning (WKB, at %d of %d scan points, first at %s = %.6g): %s\n", g.points, len(s.Rows), s.Label, g.at, g.first)
	}
}

// numberPattern matches the numbers inside a message.
var numberPattern = regexp.MustCompile(`[-+]?[0-9]*\.?[0-9]+([eE][-+]?[0-9]+)?`)

func writeLevels(w io.Writer, l *study.LevelsReport) {
	if l == nil {
		return
	}
	fmt.Fprintln(w, "\nbound states by quantum number n (number of nodes)")
	tw := newTable(w)
	fmt.Fprintln(tw, "  n\tE (WKB)\t\torder\tMaslov\tE (numerical)\t\tdiff\tverdict\tturning points")
	for _, r := range l.Rows {
		fmt.Fprintf(tw, "  %d\t%s\t%s\t%d\t%d\t%s\t%s\t%s\t%s\t[%.6g, %.6g]\n", r.N,
			fmtN(r.WKB, 12), fmtErr(r.WKBErr), r.Order, r.Maslov, fmtN(r.Numeric, 14), fmtErr(r.NumErr),
			relDiff(r.Verdict), verdictWord(r.Verdict), r.Turning[0], r.Turning[1])
	}
	tw.Flush()
	if len(l.Doublets) > 0 {
		fmt.Fprintln(w, "tunnel splittings")
		tw = newTable(w)
		fmt.Fprintln(tw, "  n\tsplitting (WKB)\t\tsplitting (numerical)\t\tdiff\tverdict\tformula")
		for _, d := range l.Doublets {
			fmt.Fprintf(tw, "  %d\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", d.N, fmtN(d.Splitting, 8), fmtErr(d.SplittingErr),
				fmtN(d.Numeric, 10), fmtErr(d.NumericErr), relDiff(d.Verdict), verdictWord(d.Verdict), d.Method)
		}
		tw.Flush()
	}
	for _, x := range l.Warnings {
		fmt.Fprintf(w, "warning: %s\n", x)
	}
	for _, r := range l.Rows {
		for _, x := range r.Warnings {
			fmt.Fprintf(w, "warning (n = %d): %s\n", r.N, x)
		}
		if r.Error != "" {
			fmt.Fprintf(w, "error (n = %d): %s\n", r.N, r.Error)
		}
	}
	if l.Figure != "" {
		fmt.Fprintf(w, "figure: %s\n", l.Figure)
	}
}

func relDiff(v *study.Verdict) string {
	if v == nil {
		return "—"
	}
	return fmt.Sprintf("%.1e", float64(v.RelDiff))
}

func writeChecks(w io.Writer, r *study.Report) {
	if len(r.Checks) == 0 {
		return
	}
	fmt.Fprintln(w, "\nexpectations of the case file")
	for _, c := range r.Checks {
		if c.Pass {
			fmt.Fprintf(w, "  ok      %s %s = %.10g (expected %.10g ± %.2g; %s)\n", c.Where, c.Quantity, float64(c.Got), c.Want, c.Tol, c.Source)
		} else {
			fmt.Fprintf(w, "  FAILED  %s\n", c.Message)
		}
	}
}

func writeSummary(w io.Writer, r *study.Report) {
	fmt.Fprintln(w)
	for _, e := range r.Errors {
		fmt.Fprintf(w, "error: %s\n", e)
	}
	s := r.Summary
	if s.Figures == 0 && s.Checks == 0 && s.Missing == 0 {
		return
	}
	fmt.Fprintf(w, "summary: %d WKB figures compared with numerics, %d agree within the stated estimates, %d do not; %d expectations, %d outside tolerance",
		s.Figures, s.Agree, s.Disagree, s.Checks, s.Regressed)
	if s.Missing > 0 {
		fmt.Fprintf(w, "; %d figures could not be computed", s.Missing)
	}
	fmt.Fprintln(w)
	for _, f := range r.Failures {
		fmt.Fprintf(w, "  - %s\n", f)
	}
	fmt.Fprintf(w, "assumes: %s\n", strings.Join(r.Assumes, "; "))
}

// numericMethods lists the numerical methods used across a scan.
func numericMethods(s *study.ScanReport) string {
	var ms []string
	seen := map[string]bool{}
	for _, r := range s.Rows {
		if r.Numeric != nil && !seen[r.Numeric.Method] {
			seen[r.Numeric.Method] = true
			ms = append(ms, r.Numeric.Method)
		}
	}
	return strings.Join(ms, "; ")
}
