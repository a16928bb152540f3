package stokes

import (
	"math"
	"math/cmplx"
	"testing"

	"github.com/turnpoint/turnpoint/turning"
)

// FuzzTrace feeds cubic Q with arbitrary coefficients and arbitrary (often
// wrong) points: Trace, Gap and WriteSummary must not panic, and every
// line must end with a known kind and a finite path inside the box.
func FuzzTrace(f *testing.F) {
	f.Add(1.0, 0.0, -1.0, 0.0, 0.0, 1.0, 1.0, 0.0, 1)
	f.Add(0.0, 1.0, 0.0, 0.0, 0.0, 0.0, 0.3, 0.2, 2)
	f.Add(1e-300, 1e300, math.NaN(), 0.0, 1.0, 1.0, 0.0, 0.0, -1)
	f.Add(0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 3)
	f.Fuzz(func(t *testing.T, c0, c1, c2, c3, zr, zi, z2r, z2i float64, order int) {
		if order == 0 || order > 6 || order < -3 {
			order = 1
		}
		q := poly(complex(c0, 0), complex(c1, 0), complex(c2, c3), 1)
		pts := []turning.Point{{Z: complex(zr, zi), Order: order}, {Z: complex(z2r, z2i), Order: 1}}
		box := turning.Box{Lo: -2 - 2i, Hi: 2 + 2i}
		set := &Settings{MaxSteps: 2000}
		g, err := Trace(q, pts, box, set)
		if err != nil {
			return
		}
		for _, ln := range g.Lines {
			if ln.End < EndTurningPoint || ln.End > EndFailed {
				t.Fatalf("line end %v", ln.End)
			}
			for _, z := range ln.Path {
				if cmplx.IsNaN(z) || !box.Contains(z) && ln.End != EndFailed {
					t.Fatalf("path point %v outside the box (end %v)", z, ln.End)
				}
			}
		}
		_, _ = Gap(q, pts[0].Z, pts[1].Z)
		_ = g.WriteSummary(discard{})
	})
}

type discard struct{}

func (discard) Write(b []byte) (int, error) { return len(b), nil }
