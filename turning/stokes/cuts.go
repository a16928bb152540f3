package stokes

import (
	"math"
	"math/cmplx"
	"sort"
)

// cuts chooses the branch cuts of √Q, one from each point of odd order
// inside the box (zeros of odd order and poles of odd order), by one rule:
//
//  1. the "away" direction of a point is straight up when Im Z > 0 and
//     straight down otherwise (real points included), so that no cut lies
//     along the real axis;
//  2. the cut is the anti-Stokes line leaving the point within 90° of the
//     away direction, nearest to it, that ends at the edge of the box or at
//     another odd point that has no cut yet;
//  3. failing such a line, the cut is the straight ray in the away
//     direction, up to the first odd point without a cut on it or else to
//     the edge of the box.
//
// A cut that ends at another odd point serves that point as well, so √Q
// changes sign around every odd point and around no other. Points are taken
// in order of increasing |Im Z|, so that a pair on one vertical line (as for
// a symmetric barrier above its top) is joined by a single cut.
func (tr *tracer) cuts() {
	g := tr.g
	served := make([]bool, len(tr.pts))
	odd := func(j int) bool { return tr.pts[j].Order%2 != 0 }
	order := make([]int, len(tr.pts))
	for i := range order {
		order[i] = i
	}
	sort.SliceStable(order, func(a, b int) bool {
		return math.Abs(imag(tr.pts[order[a]].Z)) < math.Abs(imag(tr.pts[order[b]].Z))
	})
	for _, i := range order {
		p := tr.pts[i]
		if served[i] || !odd(i) || !tr.box.Contains(p.Z) {
			continue
		}
		served[i] = true
		want := -math.Pi / 2
		if imag(p.Z) > 0 {
			want = math.Pi / 2
		}
		best, bestD := -1, math.Pi/2
		for k, ln := range g.Lines {
			if ln.From != i || ln.Family != AntiStokes {
				continue
			}
			ok := ln.End == EndBox || ln.End != EndFailed && ln.To >= 0 && ln.To != i && odd(ln.To) && !served[ln.To]
			if !ok {
				continue
			}
			if d := math.Abs(wrap(ln.StartAngle - want)); d < bestD {
				best, bestD = k, d
			}
		}
		if best >= 0 {
			ln := g.Lines[best]
			g.Cuts = append(g.Cuts, ln.Path)
			g.CutFrom = append(g.CutFrom, i)
			if ln.To >= 0 {
				served[ln.To] = true
			}
			continue
		}
		// Straight ray: the first unserved odd point on it, else the edge.
		u := cmplx.Rect(1, want)
		end := clip(tr.box, p.Z, p.Z+u*complex(2*tr.diag, 0))
		hit, hitS := -1, math.Inf(1)
		for j, pj := range tr.pts {
			if j == i || served[j] || !odd(j) {
				continue
			}
			r := (pj.Z - p.Z) / u
			if s := real(r); s > 0 && math.Abs(imag(r)) <= 1e-9*tr.diag+pj.Err+p.Err && s < hitS && tr.box.Contains(pj.Z) {
				hit, hitS = j, s
			}
		}
		if hit >= 0 {
			end = tr.pts[hit].Z
			served[hit] = true
		}
		g.Cuts = append(g.Cuts, []complex128{p.Z, end})
		g.CutFrom = append(g.CutFrom, i)
	}
}
