package cases

import (
	"fmt"
	"math"

	"github.com/turnpoint/turnpoint/cases/formula"
	"github.com/turnpoint/turnpoint/turning"
)

// Form is the way a case writes its equation.
type Form int

const (
	Schrodinger Form = iota + 1 // −(ħ²/2m)ψ″ + Vψ = Eψ: λ = 1/ħ, Q = 2m(E − V)
	Graded                      // s/TE or p/TM waves in planar layers: λ = k0, Q = n² − n_in² sin²θ
	General                     // y″ + (λ²Q + Q1)y = 0 as written
)

var formNames = map[Form]string{Schrodinger: "schrodinger", Graded: "graded", General: "general"}

// String returns the name of the form as a case file spells it.
func (f Form) String() string {
	if s, ok := formNames[f]; ok {
		return s
	}
	return fmt.Sprintf("Form(%d)", int(f))
}

// Case is a loaded and checked case file. Exactly one of Schrodinger, Graded
// and General is set, the one Form names. Its methods do not modify it, so a
// Case may be used by several goroutines at once.
type Case struct {
	Path   string             // file name given to Load or Parse
	Title  string             // the title key, "" when absent
	Form   Form               // how the equation is written
	Params map[string]float64 // the [parameters] table, never nil

	Schrodinger *SchrodingerForm
	Graded      *GradedForm
	General     *GeneralForm

	Region Region
	Scan   *Scan   // nil without a [scan] table
	Levels *Levels // nil without a [levels] table
	Expect []Expectation

	Source []byte // the file's bytes, for excerpts
}

// Formula is a formula of a case file with the place it was written.
type Formula struct {
	Text string        // the formula as written
	Expr *formula.Expr // parsed, with the case's parameters as its names
	Pos  Position      // of the string's first character (its opening quote)
}

// SchrodingerForm is the [schrodinger] table.
type SchrodingerForm struct {
	Potential Formula  // V(x)
	Mass      float64  // m > 0
	Hbar      float64  // ħ > 0, so λ = 1/ħ
	Energy    *float64 // base energy, nil when not given
}

// GradedForm is the [graded] table: s (TE) or p (TM) waves in a planar
// graded medium. The medium is given by exactly one of Index and
// Permittivity.
type GradedForm struct {
	Index        *Formula // refractive index n(x), possibly complex; or nil
	Permittivity *Formula // relative permittivity ε(x) = n(x)²; or nil
	K0           float64  // vacuum wave number 2π/λ0 > 0
	Wavelength   float64  // vacuum wavelength λ0 = 2π/K0
	Angle        float64  // incidence angle θ in degrees, −90 < θ < 90
	NIn          float64  // index of the incidence medium, > 0
	Polarization string   // "s" (TE) or "p" (TM); the spellings TE, te, TM and tm are normalised to these
}

// GeneralForm is the [general] table.
type GeneralForm struct {
	Q      Formula
	Q1     *Formula // nil when not given (zero)
	Lambda float64  // λ > 0
}

// Region is the [region] table.
type Region struct {
	A, B      float64      // the real interval of interest, A < B
	Box       *turning.Box // the search box, nil for turning.DefaultBox(A, B)
	LeftWall  bool         // a hard wall at A
	RightWall bool         // a hard wall at B
}

// Scan is the [scan] table: a study over one variable.
type Scan struct {
	Over     string // energy, hbar, wavelength, k0, angle, lambda or a parameter name
	From, To float64
	Points   int  // ≥ 1
	Log      bool // logarithmic spacing (From and To positive)
}

// Values returns the Points values of the scan, From and To included
// exactly; a single point is From.
func (s *Scan) Values() []float64 {
	if s.Points < 1 {
		return nil
	}
	v := make([]float64, s.Points)
	v[0] = s.From
	if s.Points == 1 {
		return v
	}
	n := float64(s.Points - 1)
	for i := 1; i < s.Points-1; i++ {
		t := float64(i) / n
		if s.Log {
			v[i] = math.Exp((1-t)*math.Log(s.From) + t*math.Log(s.To))
		} else {
			v[i] = (1-t)*s.From + t*s.To
		}
	}
	v[s.Points-1] = s.To
	return v
}

// Levels is the [levels] table: which bound states to compute.
type Levels struct {
	N        []int // quantum numbers, ascending, without repeats
	MaxOrder int   // highest WKB order, even, 0 ≤ MaxOrder ≤ 20 (default 6)
}

// Expectation is one [[expect]] entry: a value the case's results must
// reproduce within a tolerance.
type Expectation struct {
	Quantity string   // "R", "T", "E", "splitting" or "turning_points"
	At       *float64 // scan value for R and T; nil means the base values
	N        *int     // quantum number for E and splitting
	Method   string   // "wkb" or "numeric"; "" for turning_points
	Value    float64
	RelTol   float64 // ≥ 0; at least one of RelTol and AbsTol is positive
	AbsTol   float64 // ≥ 0
	Source   string  // where Value comes from
	Pos      Position
}

// Holds reports whether got agrees with the expected value: within AbsTol,
// or within RelTol relative to the expected value. A turning_points count must
// be equal.
func (e *Expectation) Holds(got float64) bool {
	if math.IsNaN(got) {
		return false
	}
	d := math.Abs(got - e.Value)
	if e.Quantity == "turning_points" && e.RelTol == 0 && e.AbsTol == 0 {
		return d < 0.5
	}
	return d <= e.AbsTol || d <= e.RelTol*math.Abs(e.Value)
}
