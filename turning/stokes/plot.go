package stokes

import (
	"errors"
	"fmt"
	"image/color"
	"math"
	"math/cmplx"
	"os"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/recorder"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

// PlotOptions controls the figure drawn by Plot.
type PlotOptions struct {
	// Title heads the figure; empty means "Stokes geometry".
	Title string
	// Interval is the real interval of the problem, drawn as a thick line
	// on the real axis; none is drawn when Interval[0] == Interval[1].
	Interval [2]float64
	// Width is the width of the figure; zero means 16 cm. The height
	// follows from the box so that one unit of Re x and of Im x have the
	// same length on the page; for a box more than about twice as tall as
	// wide the width is reduced instead, to keep the plot within 2·Width.
	Width vg.Length
	// DPI is the resolution of a PNG figure; zero means 150.
	DPI int
	// NoCuts leaves out the branch cuts.
	NoCuts bool
}

// Figure styles.
var (
	stokesColor = color.RGBA{R: 200, G: 30, B: 30, A: 255}
	antiColor   = color.RGBA{R: 30, G: 80, B: 200, A: 255}
	cutColor    = color.RGBA{R: 140, G: 140, B: 140, A: 255}
	axisColor   = color.RGBA{R: 190, G: 190, B: 190, A: 255}
	poleColor   = color.RGBA{R: 0, G: 140, B: 60, A: 255}
	// intervalColor is translucent so that lines along the axis show.
	intervalColor = color.RGBA{R: 0, G: 0, B: 0, A: 80}
)

// Plot draws the geometry into the file at path, as SVG or PNG according
// to its extension (.svg, .png): the real interval as a thick translucent
// band on the axis (under the lines), turning points (filled discs, rings
// for zeros of higher order) and poles (green crosses), Stokes lines solid red, anti-Stokes lines dashed blue,
// branch cuts as grey zig-zags, and a legend below the plot that states the
// convention. The axes are Re x and Im x with equal scales.
func Plot(g *Geometry, opt PlotOptions, path string) error {
	if g == nil {
		return errors.New("stokes: nil geometry")
	}
	ext := strings.ToLower(filepath.Ext(path))
	if ext != ".svg" && ext != ".png" {
		return fmt.Errorf("stokes: unsupported figure format %q (want .svg or .png)", ext)
	}
	if opt.Width <= 0 {
		opt.Width = 16 * vg.Centimeter
	}
	if opt.DPI <= 0 {
		opt.DPI = 150
	}
	if opt.Title == "" {
		opt.Title = "Stokes geometry"
	}
	p, legs, err := build(g, opt)
	if err != nil {
		return err
	}

	// Legend strip: two columns below the plot.
	rows := (len(legs) + 1) / 2
	legH := vg.Length(rows)*vg.Points(15) + vg.Points(12)
	w := opt.Width
	h := plotHeight(p, w)
	if h > 2*opt.Width {
		// A tall box: narrow the figure rather than make it huge.
		w *= 2 * opt.Width / h
		h = plotHeight(p, w)
	}
	H := h + legH

	var cw vg.CanvasWriterTo
	if ext == ".svg" {
		cw = vgsvg.New(w, H)
	} else {
		cw = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(w, H), vgimg.UseDPI(opt.DPI), vgimg.UseBackgroundColor(color.White))}
	}
	dc := draw.NewCanvas(cw, w, H)
	p.Draw(draw.Crop(dc, 0, 0, legH, 0))
	strip := draw.Crop(dc, 0, 0, 0, -h)
	half := w / 2
	cols := []draw.Canvas{draw.Crop(strip, 0, -half, 0, 0), draw.Crop(strip, half, 0, 0, 0)}
	for c := 0; c < 2; c++ {
		l := plot.NewLegend()
		l.Top, l.Left = true, true
		l.Padding = vg.Points(3)
		l.XOffs = vg.Points(30)
		l.YOffs = -vg.Points(6)
		for k := c * rows; k < min(len(legs), (c+1)*rows); k++ {
			l.Add(legs[k].name, legs[k].thumb...)
		}
		l.Draw(cols[c])
	}

	f, err := os.Create(path)
	if err != nil {
		return fmt.Errorf("stokes: %w", err)
	}
	if _, err := cw.WriteTo(f); err != nil {
		f.Close()
		return fmt.Errorf("stokes: writing %s: %w", path, err)
	}
	if err := f.Close(); err != nil {
		return fmt.Errorf("stokes: %w", err)
	}
	return nil
}

// plotHeight returns the height of the plot part of a figure of width w
// such that its data area has the aspect of the data ranges. The axes' own
// sizes hardly depend on the height, so a few fixed-point iterations
// settle it.
func plotHeight(p *plot.Plot, w vg.Length) vg.Length {
	xr := p.X.Max - p.X.Min
	yr := p.Y.Max - p.Y.Min
	h := w * vg.Length(yr/xr)
	for it := 0; it < 8; it++ {
		da := p.DataCanvas(draw.NewCanvas(new(recorder.Canvas), w, h))
		dw := da.Max.X - da.Min.X
		dh := da.Max.Y - da.Min.Y
		h += dw*vg.Length(yr/xr) - dh
		if h < vg.Centimeter {
			h = vg.Centimeter
		}
	}
	return h
}

type legendEntry struct {
	name  string
	thumb []plot.Thumbnailer
}

// build assembles the plot and its legend entries.
func build(g *Geometry, opt PlotOptions) (*plot.Plot, []legendEntry, error) {
	p := plot.New()
	p.Title.Text = opt.Title
	p.Title.Padding = vg.Points(8)
	p.X.Label.Text = "Re x"
	p.Y.Label.Text = "Im x"
	b := g.Box
	span := math.Max(real(b.Hi-b.Lo), imag(b.Hi-b.Lo))
	pad := 0.03 * span
	p.X.Min, p.X.Max = real(b.Lo)-pad, real(b.Hi)+pad
	p.Y.Min, p.Y.Max = imag(b.Lo)-pad, imag(b.Hi)+pad
	var legs []legendEntry

	add := func(pts []complex128, sty draw.LineStyle) (*plotter.Line, error) {
		xy := make(plotter.XYs, len(pts))
		for i, z := range pts {
			xy[i] = plotter.XY{X: real(z), Y: imag(z)}
		}
		l, err := plotter.NewLine(xy)
		if err != nil {
			return nil, fmt.Errorf("stokes: %w", err)
		}
		l.LineStyle = sty
		p.Add(l)
		return l, nil
	}

	// Real axis, thin.
	if p.Y.Min < 0 && p.Y.Max > 0 {
		if _, err := add([]complex128{complex(p.X.Min, 0), complex(p.X.Max, 0)}, draw.LineStyle{Color: axisColor, Width: vg.Points(0.6)}); err != nil {
			return nil, nil, err
		}
	}
	// The interval under the lines, so that lines along it stay visible.
	if opt.Interval[0] != opt.Interval[1] {
		a, c := math.Min(opt.Interval[0], opt.Interval[1]), math.Max(opt.Interval[0], opt.Interval[1])
		label := fmt.Sprintf("real interval [%.4g, %.4g]", a, c)
		// Draw the part inside the box only.
		a, c = math.Max(a, real(b.Lo)), math.Min(c, real(b.Hi))
		if imag(b.Lo) > 0 || imag(b.Hi) < 0 {
			c = a
		}
		if c > a {
			l, err := add([]complex128{complex(a, 0), complex(c, 0)}, draw.LineStyle{Color: intervalColor, Width: vg.Points(6)})
			if err != nil {
				return nil, nil, err
			}
			legs = append(legs, legendEntry{label, []plot.Thumbnailer{l}})
		}
	}
	if !opt.NoCuts && len(g.Cuts) > 0 {
		sty := draw.LineStyle{Color: cutColor, Width: vg.Points(0.8)}
		for _, c := range g.Cuts {
			if _, err := add(zigzag(c, 0.012*span, 0.005*span), sty); err != nil {
				return nil, nil, err
			}
		}
		legs = append(legs, legendEntry{"branch cut of √Q", []plot.Thumbnailer{zigzagThumb{sty}}})
	}
	stokesSty := draw.LineStyle{Color: stokesColor, Width: vg.Points(1.6)}
	antiSty := draw.LineStyle{Color: antiColor, Width: vg.Points(1.2), Dashes: []vg.Length{vg.Points(5), vg.Points(3)}}
	var haveS, haveA bool
	for _, ln := range g.Lines {
		sty := antiSty
		if ln.Family == Stokes {
			sty = stokesSty
			haveS = true
		} else {
			haveA = true
		}
		if _, err := add(ln.Path, sty); err != nil {
			return nil, nil, err
		}
	}
	if haveS {
		l, _ := plotter.NewLine(plotter.XYs{{}, {}})
		l.LineStyle = stokesSty
		legs = append(legs, legendEntry{"Stokes line: Re w = 0", []plot.Thumbnailer{l}})
	}
	if haveA {
		l, _ := plotter.NewLine(plotter.XYs{{}, {}})
		l.LineStyle = antiSty
		legs = append(legs, legendEntry{"anti-Stokes: Im w = 0", []plot.Thumbnailer{l}})
	}
	// Points last, on top.
	var simple, multi, poles plotter.XYs
	for _, pt := range g.Points {
		if !b.Contains(pt.Z) {
			continue
		}
		xy := plotter.XY{X: real(pt.Z), Y: imag(pt.Z)}
		switch {
		case pt.Order == 1:
			simple = append(simple, xy)
		case pt.Order > 1:
			multi = append(multi, xy)
		default:
			poles = append(poles, xy)
		}
	}
	scatter := func(xy plotter.XYs, shape draw.GlyphDrawer, clr color.Color, name string) error {
		if len(xy) == 0 {
			return nil
		}
		s, err := plotter.NewScatter(xy)
		if err != nil {
			return fmt.Errorf("stokes: %w", err)
		}
		s.GlyphStyle = draw.GlyphStyle{Shape: shape, Color: clr, Radius: vg.Points(4)}
		p.Add(s)
		legs = append(legs, legendEntry{name, []plot.Thumbnailer{s}})
		return nil
	}
	if err := scatter(simple, discGlyph{}, color.Black, "simple turning point"); err != nil {
		return nil, nil, err
	}
	if err := scatter(multi, ringGlyph{}, color.Black, "turning point of order ≥ 2"); err != nil {
		return nil, nil, err
	}
	if err := scatter(poles, crossGlyph{}, poleColor, "pole of Q"); err != nil {
		return nil, nil, err
	}
	legs = append(legs, legendEntry{"w = ∫ₜˣ √Q dx from a turning point t", nil})
	// Adding plotters widens the axes to their data; keep the box.
	p.X.Min, p.X.Max = real(b.Lo)-pad, real(b.Hi)+pad
	p.Y.Min, p.Y.Max = imag(b.Lo)-pad, imag(b.Hi)+pad
	return p, legs, nil
}

// zigzag returns a zig-zag polyline following path, with teeth spaced by
// step and of half height amp.
func zigzag(path []complex128, step, amp float64) []complex128 {
	if len(path) < 2 {
		return path
	}
	out := []complex128{path[0]}
	side := 1.0
	next := step / 2
	acc := 0.0
	for k := 1; k < len(path); k++ {
		a, b := path[k-1], path[k]
		l := cmplx.Abs(b - a)
		if l == 0 {
			continue
		}
		u := (b - a) / complex(l, 0)
		for next <= acc+l {
			z := a + u*complex(next-acc, 0) + u*complex(0, side*amp)
			out = append(out, z)
			side = -side
			next += step / 2
		}
		acc += l
	}
	return append(out, path[len(path)-1])
}

// zigzagThumb is the legend thumbnail of a cut.
type zigzagThumb struct{ sty draw.LineStyle }

// Thumbnail implements plot.Thumbnailer.
func (z zigzagThumb) Thumbnail(c *draw.Canvas) {
	y := (c.Min.Y + c.Max.Y) / 2
	a := (c.Max.Y - c.Min.Y) / 4
	n := 8
	pts := make([]vg.Point, 0, n+1)
	for k := 0; k <= n; k++ {
		x := c.Min.X + (c.Max.X-c.Min.X)*vg.Length(k)/vg.Length(n)
		dy := a
		if k%2 == 1 {
			dy = -a
		}
		if k == 0 || k == n {
			dy = 0
		}
		pts = append(pts, vg.Point{X: x, Y: y + dy})
	}
	c.StrokeLines(z.sty, pts)
}

// Markers with a white halo, so that they stand out on the lines.
type (
	discGlyph  struct{} // filled disc: simple turning point
	ringGlyph  struct{} // white disc with a ring: turning point of order ≥ 2
	crossGlyph struct{} // bold ×: pole
)

func circle(pt vg.Point, r vg.Length) vg.Path {
	p := make(vg.Path, 0, 3)
	p.Move(vg.Point{X: pt.X + r, Y: pt.Y})
	p.Arc(pt, r, 0, 2*math.Pi)
	p.Close()
	return p
}

// DrawGlyph implements draw.GlyphDrawer.
func (discGlyph) DrawGlyph(c *draw.Canvas, sty draw.GlyphStyle, pt vg.Point) {
	c.SetColor(color.White)
	c.Fill(circle(pt, sty.Radius+vg.Points(1)))
	c.SetColor(sty.Color)
	c.Fill(circle(pt, sty.Radius))
}

// DrawGlyph implements draw.GlyphDrawer.
func (ringGlyph) DrawGlyph(c *draw.Canvas, sty draw.GlyphStyle, pt vg.Point) {
	c.SetColor(color.White)
	c.Fill(circle(pt, sty.Radius+vg.Points(1)))
	c.SetLineStyle(draw.LineStyle{Color: sty.Color, Width: vg.Points(1.5)})
	c.Stroke(circle(pt, sty.Radius))
}

// DrawGlyph implements draw.GlyphDrawer.
func (crossGlyph) DrawGlyph(c *draw.Canvas, sty draw.GlyphStyle, pt vg.Point) {
	r := sty.Radius * 0.8
	for _, ls := range []draw.LineStyle{
		{Color: color.White, Width: vg.Points(4)},
		{Color: sty.Color, Width: vg.Points(2)},
	} {
		c.SetLineStyle(ls)
		p := make(vg.Path, 0, 2)
		p.Move(vg.Point{X: pt.X - r, Y: pt.Y - r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y + r})
		c.Stroke(p)
		p = p[:0]
		p.Move(vg.Point{X: pt.X - r, Y: pt.Y + r})
		p.Line(vg.Point{X: pt.X + r, Y: pt.Y - r})
		c.Stroke(p)
	}
}
