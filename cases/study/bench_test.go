package study

import (
	"testing"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/cases/library"
	"github.com/turnpoint/turnpoint/connect"
	"github.com/turnpoint/turnpoint/turning"
)

func benchCase(b *testing.B, name string) *cases.Case {
	src, err := library.Read(name)
	if err != nil {
		b.Fatal(err)
	}
	c, err := cases.Parse(name, src)
	if err != nil {
		b.Fatal(err)
	}
	return c
}

// BenchmarkScatterPoint compares one scattering point by WKB alone with the
// full point the tool computes: turning points, WKB and the numerical check.
func BenchmarkScatterPoint(b *testing.B) {
	c := benchCase(b, "cosh-barrier")
	p, err := c.ProblemAt(0.8)
	if err != nil {
		b.Fatal(err)
	}
	a, bb := c.Interval()
	res, err := turning.Find(p.Q, c.SearchBox(), nil)
	if err != nil {
		b.Fatal(err)
	}
	b.Run("wkb", func(b *testing.B) {
		for range b.N {
			if _, err := connect.Scatter(p, a, bb, res.Points, nil); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("wkb+points+numeric", func(b *testing.B) {
		for range b.N {
			if row := scatterAt(c, 0.8, false, nil); row.Error != "" {
				b.Fatal(row.Error)
			}
		}
	})
}

// BenchmarkScan1000 runs a 1000-point energy scan of the cosh^-2 barrier on
// all cores (run with -benchtime=1x: one iteration is the whole scan).
func BenchmarkScan1000(b *testing.B) {
	c := benchCase(b, "cosh-barrier")
	c.Scan = &cases.Scan{Over: "energy", From: 0.5, To: 1.5, Points: 1000}
	for range b.N {
		sr := runScan(c, nil, &Report{})
		if len(sr.Rows) != 1000 {
			b.Fatalf("%d rows", len(sr.Rows))
		}
	}
}
