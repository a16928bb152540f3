package study

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/wkb"
)

var (
	colWKB = color.RGBA{R: 0x1f, G: 0x5f, B: 0xbf, A: 0xff}
	colNum = color.RGBA{R: 0xd0, G: 0x40, B: 0x20, A: 0xff}
)

// newCanvas makes a canvas for path, SVG or PNG by its extension.
func newCanvas(path string, w, h vg.Length) (draw.Canvas, func(io.Writer) error, error) {
	switch strings.ToLower(filepath.Ext(path)) {
	case ".svg":
		c := vgsvg.New(w, h)
		return draw.New(c), func(out io.Writer) error { _, err := c.WriteTo(out); return err }, nil
	case ".png":
		c := vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(w, h), vgimg.UseDPI(144))}
		return draw.New(c), func(out io.Writer) error { _, err := c.WriteTo(out); return err }, nil
	}
	return draw.Canvas{}, nil, fmt.Errorf("figure %s: unknown format %q (use .svg or .png)", path, filepath.Ext(path))
}

func writeFile(path string, write func(io.Writer) error) error {
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	if err := write(f); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}

// logTicks labels a log axis with powers of ten up to Top (the data's
// range; the axis may extend beyond it to leave room for the legend).
type logTicks struct{ Top float64 }

func (lt logTicks) Ticks(lo, hi float64) []plot.Tick {
	var ts []plot.Tick
	if lt.Top > 0 && lt.Top < hi {
		hi = lt.Top
	}
	a, b := math.Floor(math.Log10(lo)), math.Ceil(math.Log10(hi))
	step := math.Max(1, math.Ceil((b-a)/8))
	for e := b; e >= a; e -= step { // from the top, so 1 = 1e0 is labelled
		label := fmt.Sprintf("1e%d", int(e))
		if e == 0 {
			label = "1"
		}
		ts = append([]plot.Tick{{Value: math.Pow(10, e), Label: label}}, ts...)
	}
	return ts
}

// plotScan draws R and T against the scan variable, WKB and numerics, with
// the relative difference and the WKB error estimate in a second panel.
func plotScan(c *cases.Case, sr *ScanReport, forceLog bool, path string) error {
	var rW, tW, rN, tN, dR, dT, eR, eT plotter.XYs
	minR, maxR := math.Inf(1), 0.0
	for _, r := range sr.Rows {
		if r.WKB != nil {
			rW = appendPos(rW, r.At, float64(r.WKB.R))
			tW = appendPos(tW, r.At, float64(r.WKB.T))
		}
		if r.Numeric != nil {
			rN = appendPos(rN, r.At, float64(r.Numeric.R))
			tN = appendPos(tN, r.At, float64(r.Numeric.T))
			if v := float64(r.Numeric.R); v > 0 {
				minR, maxR = math.Min(minR, v), math.Max(maxR, v)
			}
		}
		if r.R != nil {
			dR = appendPos(dR, r.At, float64(r.R.RelDiff))
			if r.WKB != nil && r.Numeric != nil && r.Numeric.R > 0 {
				eR = appendPos(eR, r.At, float64(r.WKB.ErrR)/float64(r.Numeric.R))
			}
		}
		if r.T != nil {
			dT = appendPos(dT, r.At, float64(r.T.RelDiff))
			if r.WKB != nil && r.Numeric != nil && r.Numeric.T > 0 {
				eT = appendPos(eT, r.At, float64(r.WKB.ErrT)/float64(r.Numeric.T))
			}
		}
	}
	logR := forceLog || (maxR > 0 && maxR/minR > 1e3)

	top := plot.New()
	top.Title.Text = figureTitle(c, "reflection and transmission")
	top.X.Label.Text = sr.Label
	top.Legend.Top = true
	// Headroom above the data keeps the legend off the curves.
	if logR {
		lo := math.Inf(1)
		for _, xy := range []plotter.XYs{rW, tW, rN, tN} {
			for _, q := range xy {
				lo = math.Min(lo, q.Y)
			}
		}
		top.Y.Scale = plot.LogScale{}
		top.Y.Tick.Marker = logTicks{Top: 1}
		top.Y.Label.Text = "R, T (log scale)"
		if lo < 1 {
			top.Y.Min = lo / 2
			top.Y.Max = math.Pow(10, 0.45*math.Log10(1/lo))
		}
	} else {
		top.Y.Label.Text = "R, T"
		top.Y.Min, top.Y.Max = 0, 1.6
		top.Y.Tick.Marker = plot.ConstantTicks([]plot.Tick{{Value: 0, Label: "0"}, {Value: 0.25}, {Value: 0.5, Label: "0.5"}, {Value: 0.75}, {Value: 1, Label: "1"}})
	}
	add := func(xy plotter.XYs, col color.Color, dashed bool, name string) {
		if len(xy) == 0 {
			return
		}
		l, err := plotter.NewLine(xy)
		if err != nil {
			return
		}
		l.Color = col
		l.Width = vg.Points(1.3)
		if dashed {
			l.Dashes = []vg.Length{vg.Points(5), vg.Points(3)}
		}
		top.Add(l)
		top.Legend.Add(name, l)
	}
	addPts := func(p *plot.Plot, xy plotter.XYs, col color.Color, shape draw.GlyphDrawer, name string) {
		if len(xy) == 0 {
			return
		}
		s, err := plotter.NewScatter(xy)
		if err != nil {
			return
		}
		s.Color = col
		s.Shape = shape
		s.Radius = vg.Points(2)
		p.Add(s)
		p.Legend.Add(name, s)
	}
	add(rW, colWKB, false, "R (WKB)")
	add(tW, colWKB, true, "T (WKB)")
	addPts(top, rN, colNum, draw.CircleGlyph{}, "R (numerical)")
	addPts(top, tN, colNum, draw.BoxGlyph{}, "T (numerical)")

	bot := plot.New()
	bot.Title.Text = "WKB against numerics"
	bot.X.Label.Text = sr.Label
	bot.Y.Label.Text = "relative difference"
	bot.Y.Scale = plot.LogScale{}
	bot.Legend.Top = true
	addPts(bot, dR, colNum, draw.CircleGlyph{}, "|R_wkb − R_num| / R_num")
	addPts(bot, dT, colWKB, draw.BoxGlyph{}, "|T_wkb − T_num| / T_num")
	for _, e := range []struct {
		xy   plotter.XYs
		col  color.Color
		name string
	}{{eR, colNum, "WKB error estimate of R"}, {eT, colWKB, "WKB error estimate of T"}} {
		if len(e.xy) == 0 {
			continue
		}
		if l, err := plotter.NewLine(e.xy); err == nil {
			l.Color = e.col
			l.Dashes = []vg.Length{vg.Points(2), vg.Points(2)}
			bot.Add(l)
			bot.Legend.Add(e.name, l)
		}
	}
	canvas, write, err := newCanvas(path, 16*vg.Centimeter, 18*vg.Centimeter)
	if err != nil {
		return err
	}
	tiles := draw.Tiles{Rows: 2, Cols: 1, PadX: vg.Millimeter * 4, PadY: vg.Millimeter * 6,
		PadTop: vg.Millimeter * 2, PadBottom: vg.Millimeter * 2, PadLeft: vg.Millimeter * 2, PadRight: vg.Millimeter * 4}
	// Headroom for the lower legend, as above.
	lo, hi := math.Inf(1), 0.0
	for _, xy := range []plotter.XYs{dR, dT, eR, eT} {
		for _, q := range xy {
			lo, hi = math.Min(lo, q.Y), math.Max(hi, q.Y)
		}
	}
	if hi > 0 {
		bot.Y.Min = lo / 2
		bot.Y.Max = hi * math.Pow(hi/lo, 0.45)
		bot.Y.Tick.Marker = logTicks{Top: hi * 2}
	}
	plots := [][]*plot.Plot{{top}, {bot}}
	cs := plot.Align(plots, tiles, canvas)
	top.Draw(cs[0][0])
	if len(dR)+len(dT) > 0 {
		bot.Draw(cs[1][0])
	}
	return writeFile(path, write)
}

// appendPos appends (x, y) when y is positive and finite (log axes).
func appendPos(xy plotter.XYs, x, y float64) plotter.XYs {
	if y > 0 && !math.IsInf(y, 0) && !math.IsNaN(y) {
		xy = append(xy, plotter.XY{X: x, Y: y})
	}
	return xy
}

// plotLevels draws V(x) with each level as a segment between its turning
// points at its WKB energy, the numerical energies as markers.
func plotLevels(c *cases.Case, w wkb.Well, lr *LevelsReport, path string) error {
	p := plot.New()
	p.Title.Text = figureTitle(c, "potential and levels")
	p.X.Label.Text = "x"
	p.Y.Label.Text = "V(x), E"
	a, b := w.A, w.B
	const n = 800
	xs := make([]float64, n+1)
	vs := make([]float64, n+1)
	lo, emax := math.Inf(1), math.Inf(-1)
	for i := range xs {
		xs[i] = a + (b-a)*float64(i)/n
		vs[i] = real(w.V.Eval(complex(xs[i], 0)))
		if !math.IsNaN(vs[i]) && !math.IsInf(vs[i], 0) {
			lo = math.Min(lo, vs[i])
		}
	}
	for _, r := range lr.Rows {
		for _, e := range []float64{float64(r.WKB), float64(r.Numeric)} {
			if !math.IsNaN(e) {
				emax = math.Max(emax, e)
			}
		}
	}
	top := math.Inf(1)
	if !math.IsInf(emax, 0) && !math.IsInf(lo, 0) {
		top = emax + 0.2*(emax-lo)
		// Show a barrier between wells whole, when it is not much higher.
		for i := 1; i < n; i++ {
			if v := vs[i]; v > vs[i-1] && v >= vs[i+1] && v > top && v-lo < 4*(emax-lo) {
				top = v + 0.1*(v-lo)
			}
		}
	}
	// The potential is drawn up to a little above the highest level, in
	// pieces, so the space above stays free for the legend.
	var pieces []plotter.XYs
	var cur plotter.XYs
	for i := range xs {
		if math.IsNaN(vs[i]) || math.IsInf(vs[i], 0) || vs[i] > top {
			if len(cur) > 1 {
				pieces = append(pieces, cur)
			}
			cur = nil
			continue
		}
		cur = append(cur, plotter.XY{X: xs[i], Y: vs[i]})
	}
	if len(cur) > 1 {
		pieces = append(pieces, cur)
	}
	for k, piece := range pieces {
		if l, err := plotter.NewLine(piece); err == nil {
			l.Width = vg.Points(1.5)
			p.Add(l)
			if k == 0 {
				p.Legend.Add("V(x)", l)
			}
		}
	}
	var num plotter.XYs
	first := true
	for _, r := range lr.Rows {
		e := float64(r.WKB)
		if math.IsNaN(e) {
			e = float64(r.Numeric)
		}
		if math.IsNaN(e) {
			continue
		}
		// Each level is drawn over the classically allowed stretches at its
		// energy (one per well), the numerical energy marked in each.
		for _, seg := range allowed(xs, vs, e) {
			if l, err := plotter.NewLine(plotter.XYs{{X: seg[0], Y: float64(r.WKB)}, {X: seg[1], Y: float64(r.WKB)}}); err == nil && !math.IsNaN(float64(r.WKB)) {
				l.Color = colWKB
				l.Width = vg.Points(1)
				p.Add(l)
				if first {
					p.Legend.Add("WKB level over the allowed region", l)
					first = false
				}
			}
			if en := float64(r.Numeric); !math.IsNaN(en) {
				num = append(num, plotter.XY{X: (seg[0] + seg[1]) / 2, Y: en})
			}
		}
	}
	if len(num) > 0 {
		if s, err := plotter.NewScatter(num); err == nil {
			s.Color = colNum
			s.Shape = draw.CrossGlyph{}
			s.Radius = vg.Points(3)
			p.Add(s)
			p.Legend.Add("numerical energy", s)
		}
	}
	p.Legend.Top = true
	if !math.IsInf(top, 0) {
		// Set after the plotters are added, which widen the axes to their data.
		p.Y.Min = lo - 0.05*(top-lo)
		p.Y.Max = top + 0.35*(top-lo)
	}
	canvas, write, err := newCanvas(path, 16*vg.Centimeter, 11*vg.Centimeter)
	if err != nil {
		return err
	}
	p.Draw(canvas)
	return writeFile(path, write)
}

// allowed returns the intervals of the sampled potential where e > V, with
// the ends interpolated linearly between samples.
func allowed(xs, vs []float64, e float64) [][2]float64 {
	var out [][2]float64
	in := false
	var start float64
	for i := range xs {
		ok := vs[i] < e
		switch {
		case ok && !in:
			start = xs[i]
			if i > 0 {
				start = xs[i-1] + (xs[i]-xs[i-1])*(e-vs[i-1])/(vs[i]-vs[i-1])
			}
			in = true
		case !ok && in:
			end := xs[i-1] + (xs[i]-xs[i-1])*(e-vs[i-1])/(vs[i]-vs[i-1])
			out = append(out, [2]float64{start, end})
			in = false
		}
	}
	if in {
		out = append(out, [2]float64{start, xs[len(xs)-1]})
	}
	return out
}
