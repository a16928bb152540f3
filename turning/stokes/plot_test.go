package stokes

import (
	"bytes"
	"encoding/xml"
	"flag"
	"image/png"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/recorder"

	"github.com/turnpoint/turnpoint/turning"
)

var figures = flag.String("figures", "", "write the demo figures (PNG and SVG) into this directory")

// demoGeometries are the two figures of the package: a double well with
// four real turning points and a sech² barrier above its top.
func demoGeometries(t testing.TB) []struct {
	name string
	g    *Geometry
	opt  PlotOptions
} {
	q1, p1 := doubleWell(-0.4)
	g1, err := Trace(q1, p1, turning.DefaultBox(-2.5, 2.5), nil)
	if err != nil {
		t.Fatal(err)
	}
	q2, p2 := sechBarrier(1.2, 1)
	g2, err := Trace(q2, p2, turning.DefaultBox(-3, 3), nil)
	if err != nil {
		t.Fatal(err)
	}
	return []struct {
		name string
		g    *Geometry
		opt  PlotOptions
	}{
		{"doublewell", g1, PlotOptions{Title: "double well Q = E + x² − 0.3x⁴, E = −0.4", Interval: [2]float64{-2.5, 2.5}}},
		{"sech", g2, PlotOptions{Title: "barrier Q = E − U₀ sech²x above the top, E/U₀ = 1.2", Interval: [2]float64{-3, 3}}},
	}
}

// TestPlotFiles writes each demo as SVG and PNG and checks that the SVG is
// well-formed XML naming the convention, and that the PNG decodes with the
// size the layout asked for.
func TestPlotFiles(t *testing.T) {
	t.Parallel()
	dir := *figures
	if dir == "" {
		dir = t.TempDir()
	}
	for _, d := range demoGeometries(t) {
		svg := filepath.Join(dir, d.name+".svg")
		if err := Plot(d.g, d.opt, svg); err != nil {
			t.Fatal(err)
		}
		b, err := os.ReadFile(svg)
		if err != nil {
			t.Fatal(err)
		}
		dec := xml.NewDecoder(bytes.NewReader(b))
		for {
			if _, err := dec.Token(); err == io.EOF {
				break
			} else if err != nil {
				t.Fatalf("%s: not well-formed XML: %v", svg, err)
			}
		}
		for _, s := range []string{"Stokes line: Re w = 0", "anti-Stokes: Im w = 0", "Re x", "Im x"} {
			if !bytes.Contains(b, []byte(s)) {
				t.Errorf("%s lacks %q", svg, s)
			}
		}
		pngPath := filepath.Join(dir, d.name+".png")
		opt := d.opt
		opt.DPI = 100
		if err := Plot(d.g, opt, pngPath); err != nil {
			t.Fatal(err)
		}
		f, err := os.Open(pngPath)
		if err != nil {
			t.Fatal(err)
		}
		img, err := png.Decode(f)
		f.Close()
		if err != nil {
			t.Fatalf("%s: %v", pngPath, err)
		}
		// 16 cm at 100 dpi.
		if w := img.Bounds().Dx(); math.Abs(float64(w)-16/2.54*100) > 2 {
			t.Errorf("%s: width %d px, want 630", pngPath, w)
		}
	}
	// An empty geometry, off the real axis, still draws.
	empty := &Geometry{Box: turning.Box{Lo: -1 + 1i, Hi: 1 + 3i}}
	if err := Plot(empty, PlotOptions{Interval: [2]float64{-1, 1}}, filepath.Join(dir, "empty.png")); err != nil {
		t.Errorf("empty geometry: %v", err)
	}
	if err := Plot(empty, PlotOptions{}, filepath.Join(dir, "x.pdf")); err == nil || !strings.Contains(err.Error(), "format") {
		t.Errorf("PDF: error %v, want unsupported format", err)
	}
}

// TestPlotAspect checks the equal scaling: in the data area one unit of
// Re x and one of Im x have the same length.
func TestPlotAspect(t *testing.T) {
	t.Parallel()
	for _, d := range demoGeometries(t) {
		p, _, err := build(d.g, d.opt)
		if err != nil {
			t.Fatal(err)
		}
		w := 16 * vg.Centimeter
		h := plotHeight(p, w)
		da := p.DataCanvas(draw.NewCanvas(new(recorder.Canvas), w, h))
		sx := float64(da.Max.X-da.Min.X) / (p.X.Max - p.X.Min)
		sy := float64(da.Max.Y-da.Min.Y) / (p.Y.Max - p.Y.Min)
		if math.Abs(sx/sy-1) > 1e-3 {
			t.Errorf("%s: %g pt per unit of Re x, %g of Im x", d.name, sx, sy)
		}
	}
}
