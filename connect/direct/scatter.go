package direct

import (
	"errors"
	"math"
	"math/cmplx"

	"github.com/turnpoint/turnpoint/wkb"
)

const (
	defaultTol      = 1e-12
	defaultMaxSteps = 2000000
	heightFraction  = 0.65 // automatic height, as a fraction of the distance to the nearest singularity
	checkHeight     = 0.75 // the error check reruns at this fraction of the height
	targetSigma     = 1e3  // largest size of the free reflected wave aimed at on the raised path
	searchTol       = 1e-6 // tolerance of the runs that search the height
	minHeight       = 0.1  // lowest path, as a fraction of the automatic height
	maxHeight       = 1.35 // highest path, same (0.88 of the distance to the singularity)
)

// amplitudes is the outcome of one integration.
type amplitudes struct {
	r, t      complex128
	logT      float64 // ln |t|², kept apart from t so that it cannot underflow
	roundR    float64 // rounding estimate of r
	roundT    float64 // rounding estimate of t, relative
	steps     int
	lastError float64
	maxSigma  float64 // largest |σ| on the complex path
	maxImS    float64 // largest Im ∫_b K on it
	kAtMax    float64 // |K| there
	jumped    int     // WKB jumps taken
	phase     float64 // phase ∫|Re K| covered
}

// Scatter computes the reflection and transmission of a wave incident from
// the left on [a, b] for y″ + (λ²Q + Q1) y = 0, in the end-wave convention
// of the package documentation. Q must be real and positive at a and b.
//
// The method is chosen by s.Method (Auto by default, see MethodChoice); each
// method runs twice, at Tol/1000 (the result) and at Tol (the check), and
// ComplexPath also at two path heights, and the errors reported are the differences plus an accumulated
// rounding estimate plus the truncation of the end waves.
//
// Scatter returns an error wrapping ErrInput for an invalid problem, and a
// *ConvergenceError when an integration does not complete.
func Scatter(p wkb.Problem, a, b float64, s *Settings) (*Result, error) {
	var set Settings
	if s != nil {
		set = *s
	}
	if err := validate(p, a, b, &set); err != nil {
		return nil, err
	}
	if set.Tol == 0 {
		set.Tol = defaultTol
	}
	if set.MaxSteps == 0 {
		set.MaxSteps = defaultMaxSteps
	}
	fine := math.Max(set.Tol/1000, 1e-15)

	ea, eb, M, endErr := endPair(p, a, b)
	for _, e := range []endWave{ea, eb} {
		if !finite(e.k) || !finite(e.dk) || !finite(e.c) || !finite(e.dc) || math.IsNaN(endErr) {
			return nil, inputError("Taylor coefficients of Q at %g are not finite (overflow in the formula?)", e.x)
		}
	}

	method := set.Method
	height, hTop, hLow := 0.0, 0.0, 0.0
	if method != RealAxis {
		var g geometry
		g = scanAxis(p, a, b)
		if len(set.Singularities) > 0 {
			// The caller's list sharpens the scan but cannot replace it: a
			// list of the zeros and poles of Q misses those of λ²Q + Q1
			// (the zeros a double pole of Q1 brings, for p waves), and a
			// path raised past them returns nonsense.
			given := givenGeometry(p, a, b, set.Singularities)
			if given.dmin < g.dmin {
				g.dmin, g.at = given.dmin, given.at
			}
			g.realZero = g.realZero || given.realZero
			g.qmin = math.Min(g.qmin, given.qmin)
		}
		if method == Auto {
			method = RealAxis
			// K·d is about Im ∫K up to the nearest singularity: R ≲ e^(−4Kd)
			// is then small enough that the raised path pays off.
			if !g.realZero && math.Sqrt(g.qmin)*g.dmin >= 1 {
				method = ComplexPath
			}
		}
		if method == ComplexPath {
			if g.realZero {
				return nil, inputError("complex-path method needs Q free of zeros on or near [%g, %g]; use real-axis", a, b)
			}
			height = set.Height
			if height == 0 {
				height = heightFraction * g.dmin
				height = math.Min(height, (b-a)/2)
				hTop = maxHeight * height
				hLow = minHeight * height
				// The search starts lower when λ is large, at 2K·H = 40:
				// errors made near b grow as e^(2K·H) on the way up, and
				// there is no point in more before a probe has measured r.
				height = math.Min(height, 20/math.Sqrt(g.qmin))
				hLow = math.Min(hLow, 0.5*height)
			}
		}
	}

	var main, check amplitudes
	var err error
	switch method {
	case ComplexPath:
		steps, rEst := 0, 0.0
		// Search the height with coarse runs (only |r| and Im S matter).
		for try := 0; set.Height == 0 && try < 3; try++ {
			probe, err := complexPath(p, ea, eb, height, searchTol, set.MaxSteps, rEst, true)
			if err != nil {
				return nil, err
			}
			steps += probe.steps
			// On the raised path the free reflected wave is |r| e^(2 Im S)
			// relative to the incident one, largest where Im S is (at the ends
			// of the raised segment when K is largest in the tails). Aim at
			// targetSigma there: the higher the path, the more an error made
			// near the singularities is suppressed before it reaches a, but
			// beyond |σ| ≈ 1e6 the logarithm of the incident coefficient, and
			// with it T, loses digits (measured on the sech² barrier).
			ar := cmplx.Abs(probe.r)
			rEst = 0.1 * ar // a probe can be off; a low estimate only costs steps
			if probe.kAtMax == 0 {
				break
			}
			want := (math.Log(targetSigma/ar) - 2*probe.maxImS) / (2 * probe.kAtMax)
			if ar < 1e-290 {
				// r is below the range of float64 (or the probe lost it):
				// nothing to resolve, so keep only a moderate suppression,
				// e^(2 Im S) = e^60, of the errors made at b.
				want = (60 - 2*probe.maxImS) / (2 * probe.kAtMax)
			}
			next := math.Min(math.Max(height+want, hLow), hTop)
			if math.Abs(next-height) <= 0.1*height || math.IsNaN(next) {
				break
			}
			height = next
		}
		// Main and check runs; if R is not resolved (the check at 0.75 of the
		// height disagrees) and the path may go higher, climb half-way to the
		// highest path and keep the better of the results: the answer must
		// not depend on the path, and on a higher one rounding is more
		// strongly suppressed.
		var best *Result
		for try := 0; try < 3; try++ {
			main, err = complexPath(p, ea, eb, height, fine, set.MaxSteps, rEst, true)
			if err != nil {
				return nil, err
			}
			// The check path is lower by 0.25 H, or by as much as costs two
			// digits of suppression e^(−2 Im S) where K is largest, if less:
			// near the limit of resolution a much lower check would measure
			// its own error, not that of the main run.
			hc := math.Max(checkHeight*height, height-math.Log(100)/(2*main.kAtMax))
			// As on the real axis (realAxisPair), the check takes no
			// jumps when that is affordable, so that a feature a jump
			// stepped over shows up in the difference; the main run is
			// then repeated without jumps if they disagree beyond √Tol.
			noJump := false
			if est := int(main.phase/3) + main.steps; main.jumped > 0 && est <= noJumpBudget {
				check, err = complexPath(p, ea, eb, hc, set.Tol, min(set.MaxSteps, 2*est+1000), rEst, false)
				var ce *ConvergenceError
				switch {
				case err == nil:
					noJump = true
				case errors.As(err, &ce) && ce.Status == StepLimit:
					steps += ce.Steps
				default:
					return nil, err
				}
			}
			if noJump && disagree(main, check, math.Sqrt(set.Tol)) {
				redo, err := complexPath(p, ea, eb, height, fine, set.MaxSteps, rEst, false)
				if err != nil {
					return nil, err
				}
				redo.steps += main.steps
				main = redo
			}
			if !noJump {
				check, err = complexPath(p, ea, eb, hc, set.Tol, set.MaxSteps, rEst, true)
				if err != nil {
					return nil, err
				}
			}
			res := combine(main, check, set.Tol, method, height, M, endErr)
			steps += res.Steps
			if best == nil || res.ErrR/res.R+res.ErrT/res.T < best.ErrR/best.R+best.ErrT/best.T {
				best = res
			}
			top := hTop
			// Beyond |σ| ≈ 1e6 on the path T loses digits, and below the
			// floor set by the ends no height helps: do not climb then.
			if set.Height != 0 || !(best.ErrR > 1e-3*best.R) || height >= 0.98*top || best.R == 0 || main.maxSigma > 1e6 ||
				endFloor(ea, eb) > 0.01*math.Sqrt(best.R) {
				break
			}
			height += 0.5 * (top - height)
		}
		best.Steps = steps
		return checkFinite(best)
	default:
		main, check, err = realAxisPair(p, ea, eb, fine, &set)
		if err != nil {
			return nil, err
		}
	}
	return checkFinite(combine(main, check, set.Tol, method, height, M, endErr))
}

// checkFinite turns a result with NaN or infinite numbers into an error.
func checkFinite(res *Result) (*Result, error) {
	for _, v := range []float64{res.R, res.T, res.ErrR, res.ErrT} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, &ConvergenceError{Status: NonFinite, Method: res.Method, Steps: res.Steps, Residual: math.NaN()}
		}
	}
	return res, nil
}

// endFloor is the rounding of the end conversions, which cancel the local
// (adiabatic) part of σ, of size |c/K| and |D/K|, against the higher-order
// waves: an absolute error of r that no path can remove.
func endFloor(ea, eb endWave) float64 {
	f := 0.0
	for _, e := range []endWave{ea, eb} {
		f += 4 * eps * (cmplx.Abs(e.c/e.k) + cmplx.Abs(e.mixD()/e.k))
	}
	return f
}

// combine forms the result and its error estimates from the main and the
// check integration.
// diffSafety multiplies the main-versus-check difference in the error
// estimates (see combine).
const diffSafety = 3

func combine(main, check amplitudes, tol float64, method MethodChoice, height float64, M int, endErr float64) *Result {
	res := &Result{
		Refl: main.r, Trans: main.t,
		Method: method.String(), Height: height,
		Steps: main.steps + check.steps, EndOrder: M, EndErr: endErr,
	}
	ar, at := cmplx.Abs(main.r), cmplx.Abs(main.t)
	res.R, res.T, res.LogT = ar*ar, at*at, main.logT
	res.Unitarity = math.Abs(res.R + res.T - 1)
	cr, ct := cmplx.Abs(check.r), cmplx.Abs(check.t)
	res.ErrRefl = cmplx.Abs(main.r-check.r) + main.roundR + endErr
	// A mismatch ε of the end waves mixes the incident and reflected waves
	// at a (δr ≈ ε, δt/t ≈ ε r) and the outgoing and incoming ones at b
	// (δt/t ≈ ε), so t is affected relatively and r absolutely.
	res.ErrTrans = cmplx.Abs(main.t-check.t) + (main.roundT+endErr*(1+ar))*at
	dr := main.roundR + endErr
	// The main-versus-check difference measures the check's error more than
	// the main run's, and the two share part of their rounding (same
	// formula, nearby paths): it is tripled, a safety factor of common
	// practice for such estimates (validation found a complex-path case at
	// λ = 1000 where the true error was 1.95× the plain difference).
	res.ErrR = diffSafety*math.Abs(res.R-cr*cr) + 2*ar*dr + dr*dr
	res.ErrT = diffSafety*math.Abs(res.T-ct*ct) + 2*(main.roundT+endErr*(1+ar))*res.T
	res.Status = Converged
	tolS := math.Sqrt(tol)
	if res.ErrT > tolS*res.T || res.ErrR > tolS*res.R {
		res.Status = Inaccurate
	}
	return res
}

// validate checks what a case file or a caller can get wrong.
func validate(p wkb.Problem, a, b float64, s *Settings) error {
	switch {
	case p.Q == nil:
		return inputError("problem has no Q")
	case math.IsNaN(p.Lambda) || math.IsInf(p.Lambda, 0) || p.Lambda <= 0:
		return inputError("lambda = %g, want a positive finite number", p.Lambda)
	case math.IsNaN(a) || math.IsNaN(b) || math.IsInf(a, 0) || math.IsInf(b, 0):
		return inputError("interval [%g, %g] is not finite", a, b)
	case !(a < b):
		return inputError("interval [%g, %g] is empty, want a < b", a, b)
	case s.Tol < 0 || math.IsNaN(s.Tol) || s.Tol >= 1:
		return inputError("tolerance %g, want 0 < tol < 1", s.Tol)
	case s.Height < 0 || math.IsNaN(s.Height) || math.IsInf(s.Height, 0):
		return inputError("path height %g, want a finite height ≥ 0", s.Height)
	case s.MaxSteps < 0:
		return inputError("max steps %d, want ≥ 0", s.MaxSteps)
	case s.Method < Auto || s.Method > ComplexPath:
		return inputError("unknown method %v", s.Method)
	}
	for _, x := range []float64{a, b} {
		q := p.Q.Eval(complex(x, 0))
		if !finite(q) || !(real(q) > 0) || math.Abs(imag(q)) > 1e-12*real(q) {
			return inputError("Q(%g) = %v, want Q real and positive at both ends", x, q)
		}
		k2 := kSquared(p, complex(x, 0), 0)[0]
		if !finite(k2) || !(real(k2) > 0) || math.Abs(imag(k2)) > 1e-12*real(k2) {
			return inputError("λ²Q + Q1 = %v at %g, want it real and positive at both ends", k2, x)
		}
	}
	return nil
}

// noJumpBudget is the largest number of Taylor steps spent on the
// jump-free check run of the real-axis method.
const noJumpBudget = 20000

// realAxisPair runs the real-axis method at tolerance fine (the result)
// and at set.Tol (the check).
//
// A WKB jump is judged from local data at its start and re-checked at a
// few points along it, which an isolated feature of an entire K² that is
// invisible there (a narrow Gaussian far from the jump's start) can still
// slip through; both tolerances would jump alike. So when the main run
// jumped, the check run takes no jumps when that is affordable (its cost,
// about a step per three radians of phase, within noJumpBudget), and
// otherwise caps the jumps at 1/16 of the interval, so that the two runs
// land at different points. If the jump-free check disagrees with the main
// run by more than √Tol, the main run is repeated without jumps; otherwise
// the difference enters the error estimate as usual.
func realAxisPair(p wkb.Problem, ea, eb endWave, fine float64, set *Settings) (main, check amplitudes, err error) {
	main, err = realAxis(p, ea, eb, fine, set.MaxSteps, true, 0)
	if err != nil {
		return main, check, err
	}
	if main.jumped > 0 {
		est := int(main.phase/3) + main.steps
		if est <= noJumpBudget {
			check, err = realAxis(p, ea, eb, set.Tol, min(set.MaxSteps, 2*est+1000), false, 0)
			if err == nil {
				if disagree(main, check, math.Sqrt(set.Tol)) {
					redo, err := realAxis(p, ea, eb, fine, set.MaxSteps, false, 0)
					if err != nil {
						return main, check, err
					}
					redo.steps += main.steps
					main = redo
				}
				return main, check, nil
			}
			var ce *ConvergenceError
			if !errors.As(err, &ce) || ce.Status != StepLimit {
				return main, check, err
			}
			main.steps += ce.Steps
		}
	}
	check, err = realAxis(p, ea, eb, set.Tol, set.MaxSteps, true, (eb.x-ea.x)/16)
	return main, check, err
}

// disagree reports whether two runs differ by more than tol in r
// (absolutely) or in t (relatively).
func disagree(u, v amplitudes, tol float64) bool {
	at := math.Max(cmplx.Abs(u.t), cmplx.Abs(v.t))
	return cmplx.Abs(u.r-v.r) > tol || cmplx.Abs(u.t-v.t) > tol*at || math.Abs(u.logT-v.logT) > tol
}

// realAxis integrates y from b, where it is the transmitted higher-order
// wave, back to a along the real axis, and decomposes it there:
// A = W(y, v₋)/W(v₊, v₋), B = W(v₊, y)/W(v₊, v₋), r = B/A, t = 1/A.
// With jumps set it takes WKB jumps where they are valid, of length at
// most jumpCap if that is positive.
func realAxis(p wkb.Problem, ea, eb endWave, tol float64, maxSteps int, jumps bool, jumpCap float64) (amplitudes, error) {
	r := &run{method: RealAxis.String(), tol: tol, maxSteps: maxSteps, jumps: jumps, jumpCap: jumpCap}
	y, dy := eb.higherWave(p.Lambda, 1)
	y, dy, err := integrateY(p, complex(eb.x, 0), complex(ea.x, 0), y, dy, r)
	if err != nil {
		return amplitudes{}, err
	}
	vp, dvp := ea.higherWave(p.Lambda, 1)
	vm, dvm := ea.higherWave(p.Lambda, -1)
	w := -2i * complex(p.Lambda, 0)
	A := (y*dvm - dy*vm) / w
	B := (vp*dy - dvp*y) / w
	rel := r.round
	// y was divided by e^logScale: the true A is A e^logScale, r = B/A
	// is unchanged and t = e^(−logScale)/A (it underflows to 0 when T is
	// below the range of float64).
	out := amplitudes{r: B / A, t: complex(math.Exp(-r.logScale), 0) / A, steps: r.steps, lastError: r.lastErr,
		jumped: r.jumped, phase: r.phase}
	out.logT = -2 * (r.logScale + math.Log(cmplx.Abs(A)))
	// A relative error rel of (y, y′) moves A and B by about rel·(|A|+|B|).
	spread := rel * (cmplx.Abs(A) + cmplx.Abs(B)) / cmplx.Abs(A)
	// Conditioning: a relative error made where y is larger than at a (in
	// the well between two barriers, near a resonance) comes back to a
	// with the growth of the other solution from there, about the same
	// factor again: rounding times (max |y| / |y(a)|)², the condition
	// number E/Γ of T at a narrow resonance, from the steps' random walk.
	if g := r.logMax - r.logEnd; g > 0 {
		cond := math.Exp(math.Min(2*g, 700))
		spread += 4 * eps * cond * math.Sqrt(float64(r.steps))
	}
	out.roundR = spread * (1 + cmplx.Abs(out.r))
	out.roundT = spread
	return out, nil
}

// complexPath integrates the reflection Riccati equation along
// b → b+iH → a+iH → a.
//
// rEst is an estimate of |r| (0 if none): an error δ made at z reaches a as
// about δ e^(−2 Im S(z)), so the steps may err by tol·rRef·e^(2 Im S) with
// rRef = max(rEst, floor) besides tol·|σ|, floor being the resolution limit
// set by the ends (endFloor).
func complexPath(p wkb.Problem, ea, eb endWave, H, tol float64, maxSteps int, rEst float64, jumps bool) (amplitudes, error) {
	r := &run{method: ComplexPath.String(), tol: tol, maxSteps: maxSteps, jumps: jumps,
		rRef: math.Max(rEst, endFloor(ea, eb))}
	// At b the solution is the transmitted higher-order wave, amplitude 1.
	apb, amb := eb.toFirst(1, 0)
	st := &sigmaState{sigma: amb / apb}
	za, zb := complex(ea.x, 0), complex(eb.x, 0)
	ih := complex(0, H)
	for _, seg := range [][2]complex128{{zb, zb + ih}, {zb + ih, za + ih}, {za + ih, za}} {
		if err := integrateSigma(p, seg[0], seg[1], st, r); err != nil {
			return amplitudes{}, err
		}
	}
	// α₊(a) = α₊(b) exp(ℓ + iS), α₋(a) = σ(a) α₊(a), with S = ∫_b^a K
	// taken on the real axis (same value, exact imaginary part).
	Sab, err := phaseIntegral(p, ea.x, eb.x, r)
	if err != nil {
		return amplitudes{}, err
	}
	apa := apb * cmplx.Exp(st.ell-1i*Sab)
	ama := st.sigma * apa
	A, B := ea.toHigher(apa, ama)
	out := amplitudes{r: B / A, t: 1 / A, logT: -2 * math.Log(cmplx.Abs(A)), steps: r.steps, lastError: r.lastErr,
		maxSigma: st.maxSigma, maxImS: st.maxImS, kAtMax: st.kAtMax, jumped: r.jumped, phase: r.phase}
	// The per-step estimate plus a floor for the relative rounding of the
	// end conversion and the exponentials.
	ar := cmplx.Abs(out.r)
	out.roundR = r.round + 16*eps*math.Sqrt(float64(r.steps))*ar
	// The conversions at the ends cancel the local (adiabatic) part of σ,
	// of size |c/K| and |D/K|, against the higher-order waves: an absolute
	// error ε times that, the floor below which r cannot be resolved.
	out.roundR += endFloor(ea, eb) + 4*eps*cmplx.Abs(st.sigma)
	out.roundT = 16 * eps * math.Sqrt(float64(r.steps)) * (1 + cmplx.Abs(st.ell))
	return out, nil
}
