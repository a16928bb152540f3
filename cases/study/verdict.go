package study

import (
	"fmt"
	"math"
)

// roundingFloor is the relative difference below which a WKB figure and
// its numerical check count as equal whatever their estimates say: about
// 10⁴ units of rounding, the accuracy to which a long double-precision
// computation can be trusted (common practice, not a derived bound).
const roundingFloor = 2e-12

// compare judges a WKB figure against its numerical check: they agree when
// their difference is within the sum of the two stated error estimates.
func compare(wkb, errWKB, num, errNum float64) *Verdict {
	diff := math.Abs(wkb - num)
	// Two double-precision figures are not compared beyond roundingFloor
	// relative: below it the difference is rounding, which neither error
	// estimate (next term, two tolerances) is built to see.
	allowed := errWKB + errNum + roundingFloor*math.Abs(num)
	scale := math.Abs(num)
	if scale == 0 {
		scale = 1
	}
	v := &Verdict{RelDiff: Number(diff / scale), Allowed: Number(allowed / scale)}
	switch {
	case math.IsNaN(wkb) || math.IsNaN(num):
		v.Reason = "a figure is missing"
	case wkb == 0 && num == 0:
		// Identical figures (a reflectionless case: both exactly 0) agree
		// whatever the estimates say.
		v.Agree = true
	case math.IsNaN(errWKB) || math.IsInf(errWKB, 0):
		v.Reason = "the WKB figure has no finite error estimate"
	case math.IsNaN(errNum) || math.IsInf(errNum, 0):
		v.Reason = "the numerical figure has no finite error estimate"
	case errNum > 0.1*math.Abs(num):
		// A check that is not good to one digit checks nothing.
		v.Reason = fmt.Sprintf("the numerical check did not resolve the figure (its estimate is %.2g relative)", errNum/scale)
	case diff <= allowed:
		v.Agree = true
	default:
		v.Reason = fmt.Sprintf("differ by %.2g relative, %.1f× the combined estimate %.2g",
			diff/scale, diff/allowed, allowed/scale)
	}
	return v
}
