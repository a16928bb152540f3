package eigen

import (
	"errors"
	"math"

	"github.com/turnpoint/turnpoint/wkb"
)

// Splitting is a pair of adjacent levels and the difference of their
// energies, such as the tunnel splitting of a double-well doublet.
type Splitting struct {
	Lower, Upper Level   // levels n and n+1
	Delta        float64 // E_{n+1} − E_n, Richardson-extrapolated mesh by mesh
	Err          float64 // error estimate of Delta (see Split)
}

// Split computes levels n and n+1 and their splitting. Delta is the
// Richardson extrapolation of the per-mesh differences, in which the
// discretisation errors of the two levels, nearly equal for a doublet,
// cancel. Err is the largest of: the change of that extrapolation, the
// rounding floors of the two levels, and the difference from the same
// splitting on a second base mesh 0.7 times as fine, which is the honest
// measure of rounding for splittings near the limit of double precision
// (~1e-13 of the level).
func (sv *Solver) Split(n int) (Splitting, error) {
	var sp Splitting
	var runs [2]run
	var errs [2]error
	done := make(chan struct{})
	go func() {
		sp.Upper, runs[1], errs[1] = sv.level(n + 1)
		close(done)
	}()
	sp.Lower, runs[0], errs[0] = sv.level(n)
	<-done
	if err := errors.Join(errs[0], errs[1]); err != nil {
		sp.Delta = sp.Upper.E - sp.Lower.E
		sp.Err = sp.Lower.Err + sp.Upper.Err
		return sp, err
	}
	sp.Delta, sp.Err = deltaExtrapolation(runs[0], runs[1])
	if math.IsInf(sp.Err, 0) {
		sp.Delta, sp.Err = sp.Upper.E-sp.Lower.E, sp.Lower.Err+sp.Upper.Err
	}
	sp.Err = math.Max(sp.Err, runs[0].floor+runs[1].floor)

	set := sv.set
	set.Step *= 0.7
	other, err := NewSolver(sv.w, &set)
	if err != nil {
		return sp, err
	}
	var r2 [2]run
	_, r2[1], errs[1] = other.level(n + 1)
	_, r2[0], errs[0] = other.level(n)
	if err := errors.Join(errs[0], errs[1]); err != nil {
		return sp, err
	}
	d2, _ := deltaExtrapolation(r2[0], r2[1])
	sp.Err = math.Max(sp.Err, math.Abs(sp.Delta-d2))
	return sp, nil
}

// Split computes levels n and n+1 of the well and their splitting (see
// Solver.Split).
func Split(w wkb.Well, n int, s *Settings) (Splitting, error) {
	sv, err := NewSolver(w, s)
	if err != nil {
		return Splitting{}, err
	}
	return sv.Split(n)
}

// deltaExtrapolation extrapolates the differences of two runs over the
// meshes both used; the error is +Inf if they share fewer than two.
func deltaExtrapolation(lo, hi run) (delta, err float64) {
	j := min(len(lo.es), len(hi.es))
	if j < 2 {
		return 0, math.Inf(1)
	}
	var table [][]float64
	for k := range j {
		row := []float64{hi.es[k] - lo.es[k]}
		for i := 1; i <= k; i++ {
			f := math.Pow(4, float64(i+1))
			row = append(row, row[i-1]+(row[i-1]-table[k-1][i-1])/(f-1))
		}
		table = append(table, row)
	}
	return extrapolant(table)
}
