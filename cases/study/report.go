package study

import (
	"encoding/json"
	"math"
)

// Complex is a complex number as JSON: {"re": …, "im": …}.
type Complex struct {
	Re float64 `json:"re"`
	Im float64 `json:"im"`
}

// C converts a complex128.
func C(z complex128) Complex { return Complex{real(z), imag(z)} }

// Number is a float64 that encodes NaN and ±Inf as JSON null instead of
// failing, so a report with a failed figure can still be written.
type Number float64

// MarshalJSON writes finite values as numbers and the rest as null.
func (n Number) MarshalJSON() ([]byte, error) {
	f := float64(n)
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return []byte("null"), nil
	}
	return json.Marshal(f)
}

// Report is everything turnpoint computed for one case. Field names in JSON
// are part of the tool's stable interface.
type Report struct {
	Case       string        `json:"case"`
	Title      string        `json:"title,omitempty"`
	Form       string        `json:"form"`
	Lambda     Number        `json:"lambda"`
	Interval   [2]float64    `json:"interval"`
	Convention string        `json:"convention"`
	Points     *PointsReport `json:"turning_points,omitempty"`
	Stokes     *StokesReport `json:"stokes,omitempty"`
	Scan       *ScanReport   `json:"scan,omitempty"`
	Levels     *LevelsReport `json:"levels,omitempty"`
	Checks     []Check       `json:"checks,omitempty"`
	Figures    []string      `json:"figures,omitempty"`
	Warnings   []string      `json:"warnings,omitempty"`
	Summary    Summary       `json:"summary"`
	Failures   []string      `json:"failures,omitempty"`
	Assumes    []string      `json:"assumptions"`
	Errors     []string      `json:"errors,omitempty"`
}

// Summary counts the verdicts of a report.
type Summary struct {
	Figures   int `json:"figures"`   // WKB figures compared with numerics
	Agree     int `json:"agree"`     // of those, agreeing within the estimates
	Disagree  int `json:"disagree"`  // of those, not agreeing
	Checks    int `json:"checks"`    // expectations checked
	Regressed int `json:"regressed"` // expectations outside their tolerance
	// Missing counts scan points and levels for which neither WKB nor the
	// numerical check produced a figure.
	Missing int `json:"missing"`
}

// OK reports whether every comparison and expectation passed.
func (s Summary) OK() bool { return s.Disagree == 0 && s.Regressed == 0 && s.Missing == 0 }

// PointsReport lists the turning points and singularities in the search box.
type PointsReport struct {
	At       *float64     `json:"at,omitempty"`      // value they belong to, nil for the base values
	AtWhat   string       `json:"at_what,omitempty"` // what At is: a scan value or a level's energy
	Box      [2]Complex   `json:"box"`
	Points   []PointEntry `json:"points"`
	Winding  int          `json:"winding"` // zeros minus poles from the argument principle
	Zeros    int          `json:"zeros"`
	Poles    int          `json:"poles"`
	Status   string       `json:"status"`
	Complete bool         `json:"complete"`
	Warnings []string     `json:"warnings,omitempty"`
	// Q1Poles are the poles of the λ-free term Q1 in the box (for p waves,
	// where ε = 0): singularities of the equation that are not zeros or poles of Q.
	Q1Poles []Complex `json:"q1_poles,omitempty"`
}

// PointEntry is one zero or pole of Q.
type PointEntry struct {
	Z        Complex `json:"z"`
	Order    int     `json:"order"`
	Kind     string  `json:"kind"`
	Residual Number  `json:"residual"`
	Err      Number  `json:"error"`
}

// StokesReport is the Stokes geometry as data.
type StokesReport struct {
	Lines        []LineEntry       `json:"lines"`
	Degeneracies []DegeneracyEntry `json:"degeneracies,omitempty"`
	Warnings     []string          `json:"warnings,omitempty"`
	Figure       string            `json:"figure,omitempty"`
}

// LineEntry is one traced Stokes or anti-Stokes line.
type LineEntry struct {
	Family     string  `json:"family"`
	From       int     `json:"from"` // index into turning_points.points
	Start      Complex `json:"start"`
	End        Complex `json:"end"`
	EndsOn     string  `json:"ends_on"`
	To         int     `json:"to"` // index of the point it ends on, -1 if none
	StartAngle Number  `json:"start_angle_deg"`
	Samples    int     `json:"samples"`
}

// DegeneracyEntry is a Stokes line joining two turning points.
type DegeneracyEntry struct {
	From   int     `json:"from"`
	To     int     `json:"to"`
	Gap    Complex `json:"gap"`     // ∫ sqrt(Q) between them; Re gap = 0 at a degeneracy
	GapErr Number  `json:"gap_err"` // error estimate of the gap's quadrature
}

// ScanReport is a scattering scan.
type ScanReport struct {
	Over         string           `json:"over"`
	Label        string           `json:"label"`
	Rows         []ScanRow        `json:"rows"`
	Degeneracies []ScanDegeneracy `json:"degeneracies,omitempty"` // scan values where a Stokes line joins two turning points
	// EverywhereDegenerate says a Stokes line joins the two turning points
	// nearest the axis at every sampled scan value (as across any real barrier).
	EverywhereDegenerate bool `json:"everywhere_degenerate,omitempty"`
}

// ScanDegeneracy is a scan value where a Stokes line joins the two turning
// points nearest each other: Re ∫_{t1}^{t2} sqrt(Q) = 0.
type ScanDegeneracy struct {
	At  float64 `json:"at"`
	Err Number  `json:"err"`
	T1  Complex `json:"t1"`
	T2  Complex `json:"t2"`
	Gap Complex `json:"gap"`
}

// ScanRow is one scan point: WKB, numerics and their comparison.
type ScanRow struct {
	At      float64    `json:"at"`
	WKB     *Amplitude `json:"wkb,omitempty"`
	Numeric *Amplitude `json:"numeric,omitempty"`
	R       *Verdict   `json:"verdict_R,omitempty"`
	T       *Verdict   `json:"verdict_T,omitempty"`
	Error   string     `json:"error,omitempty"`
}

// Amplitude is one method's scattering result.
type Amplitude struct {
	R         Number   `json:"R"`
	T         Number   `json:"T"`
	ErrR      Number   `json:"err_R"`
	ErrT      Number   `json:"err_T"`
	Refl      Complex  `json:"r"`
	Trans     Complex  `json:"t"`
	Method    string   `json:"method"`
	Order     int      `json:"order,omitempty"`
	Unitarity Number   `json:"unitarity,omitempty"` // |R + T − 1| of the numerics
	Dominant  *Complex `json:"dominant,omitempty"`
	Warnings  []string `json:"warnings,omitempty"`
}

// LevelsReport is a bound-state study.
type LevelsReport struct {
	Rows     []LevelRow   `json:"rows"`
	Doublets []DoubletRow `json:"doublets,omitempty"`
	Figure   string       `json:"figure,omitempty"`
	Warnings []string     `json:"warnings,omitempty"`
}

// LevelRow is one level by quantum number.
type LevelRow struct {
	N        int        `json:"n"`
	WKB      Number     `json:"wkb"`
	WKBErr   Number     `json:"wkb_err"`
	Order    int        `json:"order"`
	ByOrder  []Number   `json:"by_order,omitempty"`
	Maslov   int        `json:"maslov"`
	Turning  [2]float64 `json:"turning"`
	Omega    Number     `json:"omega,omitempty"`
	Method   string     `json:"method"`
	Numeric  Number     `json:"numeric"`
	NumErr   Number     `json:"numeric_err"`
	Verdict  *Verdict   `json:"verdict,omitempty"`
	Warnings []string   `json:"warnings,omitempty"`
	Error    string     `json:"error,omitempty"`
}

// DoubletRow is a tunnel-split pair of levels.
type DoubletRow struct {
	N            int      `json:"n"`
	Splitting    Number   `json:"wkb"`
	SplittingErr Number   `json:"wkb_err"`
	Numeric      Number   `json:"numeric"`
	NumericErr   Number   `json:"numeric_err"`
	Method       string   `json:"method"`
	Verdict      *Verdict `json:"verdict,omitempty"`
}

// Verdict compares a WKB figure with its numerical check.
type Verdict struct {
	RelDiff Number `json:"rel_diff"` // |wkb − numeric| / |numeric|
	Allowed Number `json:"allowed"`  // (err_wkb + err_numeric) / |numeric|
	Agree   bool   `json:"agree"`
	Reason  string `json:"reason,omitempty"`
}

// Check is the outcome of one expectation of the case file.
type Check struct {
	Quantity string   `json:"quantity"`
	At       *float64 `json:"at,omitempty"`
	N        *int     `json:"n,omitempty"`
	Method   string   `json:"method,omitempty"`
	Want     float64  `json:"want"`
	Got      Number   `json:"got"`
	Diff     Number   `json:"diff"`
	Tol      float64  `json:"tol"`
	Pass     bool     `json:"pass"`
	Source   string   `json:"source,omitempty"`
	Where    string   `json:"where"` // file:line:col of the expected value
	Message  string   `json:"message,omitempty"`
}
