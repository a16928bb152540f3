package main

import (
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"github.com/spf13/pflag"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/cases/library"
	"github.com/turnpoint/turnpoint/cases/study"
)

// loadCase reads a case file, or a bundled case named "lib:NAME".
func loadCase(arg string) (*cases.Case, error) {
	if name, ok := strings.CutPrefix(arg, "lib:"); ok {
		src, err := library.Read(name)
		if err != nil {
			return nil, badInput(err)
		}
		c, err := cases.Parse(name, src)
		if err != nil {
			return nil, badInput(err)
		}
		return c, nil
	}
	c, err := cases.Load(arg)
	if err != nil {
		return nil, badInput(err)
	}
	return c, nil
}

func oneCase(name string, args []string) (*cases.Case, error) {
	if len(args) != 1 {
		return nil, badInput(fmt.Errorf("%s: want one case file, got %d arguments", name, len(args)))
	}
	return loadCase(args[0])
}

// progressBar returns a progress callback drawing on stderr when it is a
// terminal and the scan is long enough to be worth watching.
func progressBar(e *env, c *cases.Case) func(done, total int) {
	if !e.stderrIsTTY || c.Scan == nil || c.Scan.Points < 20 {
		return nil
	}
	return func(done, total int) {
		const width = 40
		n := done * width / total
		fmt.Fprintf(e.stderr, "\r  scan [%s%s] %d/%d", strings.Repeat("#", n), strings.Repeat(".", width-n), done, total)
		if done == total {
			fmt.Fprint(e.stderr, "\r\033[K")
		}
	}
}

func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// reportStatus turns a report into the command's result: a failed check
// gives exit status 1.
func reportStatus(r *study.Report) error {
	if len(r.Errors) > 0 || !r.Summary.OK() {
		return checkFailed(errSilentFailure)
	}
	return nil
}

func writeReport(w io.Writer, r *study.Report) {
	writeHeader(w, r)
	writePoints(w, r.Points)
	writeStokes(w, r, false)
	writeScan(w, r.Scan)
	writeLevels(w, r.Levels)
	writeChecks(w, r)
	writeSummary(w, r)
}

var runCommand = &command{
	Name:      "run",
	UsageLine: "run [--json] [--out DIR] CASE.toml",
	Short:     "run every study of a case: turning points, Stokes geometry, scattering, levels, checks",
	Long: `Run computes everything the case file asks for. Turning points and singularities of Q
are found in the search box; the Stokes geometry is traced from them; a [scan] table gives
a scattering study and a [levels] table a bound-state study. Every WKB figure is shown
beside its direct numerical check, with both error estimates, their relative difference
and a verdict: "agree" when the difference is within the sum of the two estimates.
Expectations recorded in the case file are checked too.

CASE.toml may also name a bundled case as lib:NAME (see "turnpoint cases").
The exit status is 1 when any verdict or expectation fails.`,
}

func init() {
	runCommand.Flags = func(fs *pflag.FlagSet) func(*env, []string) error {
		asJSON := fs.Bool("json", false, "write the report as JSON on stdout")
		out := fs.String("out", "", "write figures and result.json into `DIR`")
		return func(e *env, args []string) error {
			c, err := oneCase("run", args)
			if err != nil {
				return err
			}
			return runStudies(e, c, study.All, *asJSON, *out)
		}
	}
}

func runStudies(e *env, c *cases.Case, what study.Study, asJSON bool, out string) error {
	opt := &study.Options{Progress: progressBar(e, c)}
	if out != "" {
		if err := os.MkdirAll(out, 0o755); err != nil {
			return badInput(err)
		}
		opt.FigureDir = out
	}
	r := study.Run(c, what, opt)
	if out != "" {
		path := filepath.Join(out, "result.json")
		f, err := os.Create(path)
		if err != nil {
			return badInput(err)
		}
		werr := writeJSON(f, r)
		if cerr := f.Close(); werr == nil {
			werr = cerr
		}
		if werr != nil {
			return werr
		}
		r.Figures = append(r.Figures, path)
	}
	if asJSON {
		if err := writeJSON(e.stdout, r); err != nil {
			return err
		}
	} else {
		writeReport(e.stdout, r)
		for _, f := range r.Figures {
			fmt.Fprintf(e.stdout, "wrote %s\n", f)
		}
	}
	return reportStatus(r)
}

var demoCommand = &command{
	Name:      "demo",
	UsageLine: "demo [--json] [--out DIR]",
	Short:     "run the bundled demo case (" + library.Demo + ")",
	Long: `Demo runs "turnpoint run" on the bundled demo case, a scenario of the project's own:
an electron crossing an asymmetric graded barrier, scanned in energy from deep tunnelling,
through the barrier top, to above-barrier reflection. "turnpoint cases ` + library.Demo + `" prints the file.`,
}

func init() {
	demoCommand.Flags = func(fs *pflag.FlagSet) func(*env, []string) error {
		asJSON := fs.Bool("json", false, "write the report as JSON on stdout")
		out := fs.String("out", "", "write figures and result.json into `DIR`")
		return func(e *env, args []string) error {
			if len(args) != 0 {
				return badInput(fmt.Errorf("demo: takes no arguments"))
			}
			c, err := loadCase("lib:" + library.Demo)
			if err != nil {
				return err
			}
			return runStudies(e, c, study.All, *asJSON, *out)
		}
	}
}

var pointsCommand = &command{
	Name:      "points",
	UsageLine: "points [--json] CASE.toml",
	Short:     "list the turning points and singularities of Q in the search box",
	Long: `Points finds every zero (turning point) and pole (singularity) of Q in the search box
by the argument principle, subdivision and Newton polishing, and prints position,
multiplicity, residual and class. The winding number of Q on the box boundary must equal
zeros minus poles found; the output says when it does not.`,
}

var stokesCommand = &command{
	Name:      "stokes",
	UsageLine: "stokes [--json] [-o FILE.svg|FILE.png] CASE.toml",
	Short:     "trace the Stokes and anti-Stokes lines and draw the complex plane",
	Long: `Stokes traces, from every turning point, the Stokes lines (Re w = 0) and anti-Stokes
lines (Im w = 0) of w(x) = ∫_t^x sqrt(Q) and reports where each ends, and every
degeneracy (a Stokes line joining two turning points). Some texts swap the two names;
turnpoint's convention is printed with the output. -o draws the figure.`,
}

var scatterCommand = &command{
	Name:      "scatter",
	UsageLine: "scatter [--json] [--csv FILE] [-o FILE.svg|FILE.png] [--log] CASE.toml",
	Short:     "reflection and transmission over the case's scan, WKB beside numerics",
	Long: `Scatter computes the reflection and transmission coefficients R = |r|^2 and T = |t|^2
of a wave incident from the left at every point of the case's [scan], by WKB connection
formulae and by direct integration of the same equation, with error estimates and a
verdict. The scan runs on all cores; a progress bar is drawn on a terminal.`,
}

var levelsCommand = &command{
	Name:      "levels",
	UsageLine: "levels [--json] [-o FILE.svg|FILE.png] CASE.toml",
	Short:     "bound-state energies by WKB (with Maslov index and higher orders) and numerics",
	Long: `Levels computes the energies of the case's [levels] table by quantum number n: WKB
quantisation with the Maslov index of the ends (soft turning point or hard wall) and the
higher-order terms of the series truncated at the least term (reported as the error
estimate), beside direct numerical eigenvalues identified by node count.`,
}

func init() {
	single := func(name string, what study.Study, figFlag bool) func(fs *pflag.FlagSet) func(*env, []string) error {
		return func(fs *pflag.FlagSet) func(*env, []string) error {
			asJSON := fs.Bool("json", false, "write the result as JSON on stdout")
			var fig, csvPath *string
			var logR *bool
			if figFlag {
				fig = fs.StringP("output", "o", "", "draw the figure into `FILE` (.svg or .png)")
			}
			if what == study.Scattering {
				csvPath = fs.String("csv", "", "also write the scan as CSV into `FILE`")
				logR = fs.Bool("log", false, "logarithmic R axis in the figure (automatic when R spans decades)")
			}
			return func(e *env, args []string) error {
				c, err := oneCase(name, args)
				if err != nil {
					return err
				}
				if what == study.Scattering && c.Scan == nil {
					return badInput(fmt.Errorf("%s: the case has no [scan] table", c.Path))
				}
				if what == study.Levels && c.Levels == nil {
					return badInput(fmt.Errorf("%s: the case has no [levels] table", c.Path))
				}
				opt := &study.Options{Progress: progressBar(e, c)}
				var tmp string
				if fig != nil && *fig != "" {
					if tmp, err = os.MkdirTemp("", "turnpoint-fig"); err != nil {
						return err
					}
					defer os.RemoveAll(tmp)
					opt.FigureDir = tmp
					opt.FigureExt = strings.ToLower(filepath.Ext(*fig))
					if opt.FigureExt != ".svg" && opt.FigureExt != ".png" {
						return badInput(fmt.Errorf("%s: -o wants a .svg or .png file name, got %q", name, *fig))
					}
				}
				if logR != nil {
					opt.LogR = *logR
				}
				r := study.Run(c, what, opt)
				if tmp != "" {
					if err := moveFigure(tmp, *fig); err != nil {
						r.Errors = append(r.Errors, err.Error())
					}
					r.Figures = []string{*fig}
					if r.Stokes != nil {
						r.Stokes.Figure = *fig
					}
					if r.Levels != nil {
						r.Levels.Figure = *fig
					}
				}
				if csvPath != nil && *csvPath != "" && r.Scan != nil {
					if err := writeCSV(*csvPath, r.Scan); err != nil {
						return err
					}
				}
				if *asJSON {
					if err := writeJSON(e.stdout, r); err != nil {
						return err
					}
					return reportStatus(r)
				}
				writeHeader(e.stdout, r)
				writePoints(e.stdout, r.Points)
				writeStokes(e.stdout, r, what&study.Geometry != 0 && what&study.Scattering == 0)
				writeScan(e.stdout, r.Scan)
				writeLevels(e.stdout, r.Levels)
				writeSummary(e.stdout, r)
				return reportStatus(r)
			}
		}
	}
	pointsCommand.Flags = single("points", study.Points, false)
	stokesCommand.Flags = single("stokes", study.Points|study.Geometry, true)
	scatterCommand.Flags = single("scatter", study.Scattering, true)
	levelsCommand.Flags = single("levels", study.Levels, true)
}

// moveFigure moves the figure the study drew into dir to the wanted name.
func moveFigure(dir, target string) error {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return err
	}
	for _, en := range entries {
		if strings.EqualFold(filepath.Ext(en.Name()), filepath.Ext(target)) {
			data, err := os.ReadFile(filepath.Join(dir, en.Name()))
			if err != nil {
				return err
			}
			return os.WriteFile(target, data, 0o644)
		}
	}
	return fmt.Errorf("no figure was drawn")
}

func writeCSV(path string, s *study.ScanReport) error {
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	w := csv.NewWriter(f)
	w.Write([]string{s.Over, "R_wkb", "err_R_wkb", "T_wkb", "err_T_wkb", "R_numeric", "err_R_numeric", "T_numeric", "err_T_numeric", "agree", "wkb_method"})
	g := func(x study.Number) string { return strconv.FormatFloat(float64(x), 'g', 12, 64) }
	for _, r := range s.Rows {
		if r.WKB == nil || r.Numeric == nil {
			w.Write([]string{g(study.Number(r.At)), "", "", "", "", "", "", "", "", "false", r.Error})
			continue
		}
		agree := r.R.Agree && r.T.Agree
		w.Write([]string{g(study.Number(r.At)), g(r.WKB.R), g(r.WKB.ErrR), g(r.WKB.T), g(r.WKB.ErrT),
			g(r.Numeric.R), g(r.Numeric.ErrR), g(r.Numeric.T), g(r.Numeric.ErrT), strconv.FormatBool(agree), r.WKB.Method})
	}
	w.Flush()
	if err := w.Error(); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}
