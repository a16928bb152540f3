package eigen

import "math"

// matchNode returns the base-mesh node at which to match the shots for the
// level of energy e (a root found on the base mesh m): of the deepest node
// of each classically allowed region at e, the one across which the matching
// function D varies least steeply with E. Matching in a well where the
// eigenfunction is exponentially small (a level of the other well of an
// asymmetric double well) makes D a near-step, which the root finder can
// only bisect; in the level's own well D is smooth.
func (sv *Solver) matchNode(m *mesh, ic int, e float64) int {
	ce := sv.c * e
	nc := len(m.h)
	var cands []int
	for i := 0; i < nc; {
		if m.q[i]-ce >= 0 {
			i++
			continue
		}
		deep := i
		for ; i < nc && m.q[i]-ce < 0; i++ {
			if m.q[i] < m.q[deep] {
				deep = i
			}
		}
		cands = append(cands, min(max(deep, 1), nc-1))
	}
	if len(cands) < 2 {
		if len(cands) == 1 {
			return cands[0]
		}
		return ic
	}
	d := 1e-7 * sv.scale(e)
	best, bestSlope := ic, math.Inf(1)
	for _, c := range cands {
		slope := math.Abs(sv.shoot(m, c, e+d).d - sv.shoot(m, c, e-d).d)
		if slope < bestSlope {
			best, bestSlope = c, slope
		}
	}
	return best
}
