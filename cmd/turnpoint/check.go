package main

import (
	"encoding/json"
	"encoding/xml"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"runtime"
	"sort"
	"strconv"
	"strings"
	"sync"
	"time"

	"github.com/spf13/pflag"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/cases/library"
	"github.com/turnpoint/turnpoint/cases/study"
)

var checkCommand = &command{
	Name:      "check",
	UsageLine: "check [--junit FILE] [--jsonl FILE] [--shard K/N] [--update] [PATH...]",
	Short:     "run a folder of cases as a regression suite",
	Long: `Check runs every case under the given paths (files, or folders searched for *.toml),
in parallel across cores, and prints one line per case and a summary. A case fails when
an expectation recorded in it left its tolerance, or when a WKB figure and its numerical
check no longer agree within their error estimates. Without paths it runs the bundled
case library.

--shard K/N runs the K-th of N deterministic slices (K = 1..N) of the sorted case list,
so a large suite can be spread over the jobs of a batch system and the JSON lines
concatenated. --update rewrites each expected value that left its tolerance with the
current result, changing only the number in the file, and prints what changed; values
that still hold (closed-form references among them) are left as written.

Exit status: 0 all passed, 1 something regressed, 2 bad input.`,
}

func init() {
	checkCommand.Flags = func(fs *pflag.FlagSet) func(*env, []string) error {
		junit := fs.String("junit", "", "write a JUnit XML report into `FILE`")
		jsonl := fs.String("jsonl", "", "write one JSON object per case into `FILE` (- for stdout)")
		asJSON := fs.Bool("json", false, "write the JSON lines on stdout instead of the table (same as --jsonl -)")
		shard := fs.String("shard", "", "run only slice `K/N` of the sorted case list")
		update := fs.Bool("update", false, "rewrite the expected values from the current results")
		workers := fs.Int("jobs", runtime.NumCPU(), "cases run at once")
		return func(e *env, args []string) error {
			opt := checkOptions{junit: *junit, jsonl: *jsonl, shard: *shard, update: *update, workers: *workers}
			if *asJSON {
				opt.jsonl, opt.quiet = "-", true
			}
			return runCheck(e, args, opt)
		}
	}
}

type checkOptions struct {
	junit, jsonl, shard string
	update              bool
	workers             int
	quiet               bool // no table: --json writes only the JSON lines
}

// caseFile is one case to check: a path on disk or a bundled name.
type caseFile struct {
	name    string // as printed
	path    string // on disk, "" for bundled
	bundled bool
}

// caseResult is the outcome of one case.
type caseResult struct {
	file    caseFile
	report  *study.Report
	err     error // loading failed
	elapsed time.Duration
	changes []study.Change
}

func (r *caseResult) ok() bool {
	return r.err == nil && len(r.report.Errors) == 0 && r.report.Summary.OK()
}

func collectCases(args []string) ([]caseFile, error) {
	if len(args) == 0 {
		var out []caseFile
		for _, n := range library.Names() {
			out = append(out, caseFile{name: "lib:" + n, bundled: true})
		}
		return out, nil
	}
	var out []caseFile
	seen := map[string]bool{}
	for _, a := range args {
		if strings.HasPrefix(a, "lib:") {
			if _, err := library.Read(strings.TrimPrefix(a, "lib:")); err != nil {
				return nil, err
			}
			out = append(out, caseFile{name: a, bundled: true})
			continue
		}
		fi, err := os.Stat(a)
		if err != nil {
			return nil, err
		}
		if !fi.IsDir() {
			if !seen[a] {
				seen[a] = true
				out = append(out, caseFile{name: a, path: a})
			}
			continue
		}
		err = filepath.WalkDir(a, func(p string, d fs.DirEntry, err error) error {
			if err != nil {
				return err
			}
			if d.IsDir() && p != a && (strings.HasPrefix(d.Name(), ".") || d.Name() == "testdata") {
				return filepath.SkipDir
			}
			if !d.IsDir() && strings.HasSuffix(p, ".toml") && !seen[p] {
				seen[p] = true
				out = append(out, caseFile{name: p, path: p})
			}
			return nil
		})
		if err != nil {
			return nil, err
		}
	}
	if len(out) == 0 {
		return nil, fmt.Errorf("no case files (*.toml) under %s", strings.Join(args, ", "))
	}
	return out, nil
}

// parseShard reads "K/N" with 1 ≤ K ≤ N.
func parseShard(s string) (k, n int, err error) {
	ks, ns, ok := strings.Cut(s, "/")
	if ok {
		k, err = strconv.Atoi(ks)
		if err == nil {
			n, err = strconv.Atoi(ns)
		}
	}
	if !ok || err != nil || n < 1 || k < 1 || k > n {
		return 0, 0, fmt.Errorf("--shard wants K/N with 1 <= K <= N, got %q", s)
	}
	return k, n, nil
}

// shardOf returns the cases of slice k of n: after sorting by name, every
// n-th case starting at k-1, so the slices partition the suite exactly.
func shardOf(files []caseFile, k, n int) []caseFile {
	sort.Slice(files, func(i, j int) bool { return files[i].name < files[j].name })
	var out []caseFile
	for i := k - 1; i < len(files); i += n {
		out = append(out, files[i])
	}
	return out
}

func runCheck(e *env, args []string, opt checkOptions) error {
	files, err := collectCases(args)
	if err != nil {
		return badInput(fmt.Errorf("check: %v", err))
	}
	if opt.shard != "" {
		k, n, err := parseShard(opt.shard)
		if err != nil {
			return badInput(fmt.Errorf("check: %v", err))
		}
		files = shardOf(files, k, n)
	} else {
		sort.Slice(files, func(i, j int) bool { return files[i].name < files[j].name })
	}
	if opt.update {
		for _, f := range files {
			if f.bundled {
				return badInput(fmt.Errorf("check: --update needs case files on disk; %s is bundled (run it on cases/library instead)", f.name))
			}
		}
	}
	if opt.workers < 1 {
		opt.workers = 1
	}
	start := time.Now()
	results := make([]*caseResult, len(files))
	var wg sync.WaitGroup
	jobs := make(chan int)
	for range opt.workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range jobs {
				results[i] = checkOne(files[i], opt)
			}
		}()
	}
	for i := range files {
		jobs <- i
	}
	close(jobs)
	wg.Wait()

	failed, broken := 0, 0
	table := e.stdout
	if opt.quiet {
		table = io.Discard
	}
	for _, r := range results {
		printCaseLine(table, r)
		switch {
		case r.err != nil:
			broken++
		case !r.ok():
			failed++
		}
		for _, c := range r.changes {
			fmt.Fprintf(table, "  updated %s: %s %.10g -> %.10g\n", c.Where, c.Figure, c.Old, c.New)
		}
	}
	noun := "cases"
	if len(results) == 1 {
		noun = "case"
	}
	fmt.Fprintf(table, "\n%d %s: %d passed, %d failed, %d could not be loaded (%.1fs)\n",
		len(results), noun, len(results)-failed-broken, failed, broken, time.Since(start).Seconds())
	if opt.junit != "" {
		if err := writeJUnit(opt.junit, results, time.Since(start)); err != nil {
			return err
		}
	}
	if opt.jsonl != "" {
		if err := writeJSONLines(e.stdout, opt.jsonl, results); err != nil {
			return err
		}
	}
	switch {
	case broken > 0:
		return badInput(fmt.Errorf("check: %d case files could not be loaded", broken))
	case failed > 0 && !opt.update:
		return checkFailed(fmt.Errorf("check: %d of %d cases failed", failed, len(results)))
	}
	return nil
}

func checkOne(f caseFile, opt checkOptions) *caseResult {
	t0 := time.Now()
	r := &caseResult{file: f}
	var c *cases.Case
	if f.bundled {
		c, r.err = loadCase(f.name)
	} else {
		c, r.err = cases.Load(f.path)
	}
	if r.err != nil {
		r.elapsed = time.Since(t0)
		return r
	}
	r.report = study.Run(c, study.All, &study.Options{Workers: 1})
	if opt.update && len(c.Expect) > 0 {
		src, changes, err := study.Rewrite(c, r.report)
		if err != nil {
			r.err = err
		} else if len(changes) > 0 {
			if err := os.WriteFile(f.path, src, 0o644); err != nil {
				r.err = err
			}
			r.changes = changes
		}
	}
	r.elapsed = time.Since(t0)
	return r
}

func printCaseLine(w io.Writer, r *caseResult) {
	switch {
	case r.err != nil:
		fmt.Fprintf(w, "ERROR  %s\n       %v\n", r.file.name, strings.ReplaceAll(r.err.Error(), "\n", "\n       "))
	case r.ok():
		s := r.report.Summary
		verb := "hold"
		if s.Checks == 1 {
			verb = "holds"
		}
		fmt.Fprintf(w, "ok     %-44s %3d %s agree, %2d %s %s  (%.1fs)\n", r.file.name, s.Agree, plural(s.Agree, "figure"), s.Checks, plural(s.Checks, "expectation"), verb, r.elapsed.Seconds())
	default:
		s := r.report.Summary
		fmt.Fprintf(w, "FAIL   %-44s %d of %d figures disagree, %d of %d expectations regressed  (%.1fs)\n",
			r.file.name, s.Disagree, s.Figures, s.Regressed, s.Checks, r.elapsed.Seconds())
		for _, m := range r.report.Errors {
			fmt.Fprintf(w, "       error: %s\n", m)
		}
		for _, m := range r.report.Failures {
			fmt.Fprintf(w, "       %s\n", m)
		}
	}
}

// jsonLine is one line of the --jsonl output; fields are stable.
type jsonLine struct {
	Case    string        `json:"case"`
	Pass    bool          `json:"pass"`
	Seconds float64       `json:"seconds"`
	Error   string        `json:"error,omitempty"`
	Summary study.Summary `json:"summary"`
	Fail    []string      `json:"failures,omitempty"`
	Checks  []study.Check `json:"checks,omitempty"`
}

func writeJSONLines(stdout io.Writer, path string, results []*caseResult) error {
	var w io.Writer = stdout
	var f *os.File
	if path != "-" {
		var err error
		if f, err = os.Create(path); err != nil {
			return err
		}
		w = f
	}
	enc := json.NewEncoder(w)
	for _, r := range results {
		l := jsonLine{Case: r.file.name, Pass: r.ok(), Seconds: r.elapsed.Seconds()}
		if r.err != nil {
			l.Error = r.err.Error()
		} else {
			l.Summary, l.Fail, l.Checks = r.report.Summary, r.report.Failures, r.report.Checks
			if len(r.report.Errors) > 0 {
				l.Error = strings.Join(r.report.Errors, "; ")
			}
		}
		if err := enc.Encode(l); err != nil {
			return err
		}
	}
	if f != nil {
		return f.Close()
	}
	return nil
}

// JUnit XML, the format CI systems read: one testsuite, one testcase per case.
type junitSuites struct {
	XMLName  xml.Name     `xml:"testsuites"`
	Tests    int          `xml:"tests,attr"`
	Failures int          `xml:"failures,attr"`
	Errors   int          `xml:"errors,attr"`
	Time     string       `xml:"time,attr"`
	Suites   []junitSuite `xml:"testsuite"`
}

type junitSuite struct {
	Name     string      `xml:"name,attr"`
	Tests    int         `xml:"tests,attr"`
	Failures int         `xml:"failures,attr"`
	Errors   int         `xml:"errors,attr"`
	Time     string      `xml:"time,attr"`
	Cases    []junitCase `xml:"testcase"`
}

type junitCase struct {
	Name      string        `xml:"name,attr"`
	Classname string        `xml:"classname,attr"`
	Time      string        `xml:"time,attr"`
	Failure   *junitMessage `xml:"failure,omitempty"`
	Error     *junitMessage `xml:"error,omitempty"`
	SystemOut string        `xml:"system-out,omitempty"`
}

type junitMessage struct {
	Message string `xml:"message,attr"`
	Type    string `xml:"type,attr"`
	Body    string `xml:",chardata"`
}

func secs(d time.Duration) string { return strconv.FormatFloat(d.Seconds(), 'f', 3, 64) }

func buildJUnit(results []*caseResult, total time.Duration) junitSuites {
	s := junitSuite{Name: "turnpoint check", Time: secs(total)}
	for _, r := range results {
		tc := junitCase{Name: r.file.name, Classname: "turnpoint", Time: secs(r.elapsed)}
		switch {
		case r.err != nil:
			tc.Error = &junitMessage{Message: "case could not be loaded", Type: "input", Body: r.err.Error()}
			s.Errors++
		case !r.ok():
			body := strings.Join(append(append([]string{}, r.report.Errors...), r.report.Failures...), "\n")
			tc.Failure = &junitMessage{Message: fmt.Sprintf("%d figures disagree, %d expectations regressed",
				r.report.Summary.Disagree, r.report.Summary.Regressed), Type: "regression", Body: body}
			s.Failures++
		default:
			tc.SystemOut = fmt.Sprintf("%d figures agree, %d expectations hold", r.report.Summary.Agree, r.report.Summary.Checks)
		}
		s.Cases = append(s.Cases, tc)
		s.Tests++
	}
	return junitSuites{Tests: s.Tests, Failures: s.Failures, Errors: s.Errors, Time: s.Time, Suites: []junitSuite{s}}
}

func writeJUnit(path string, results []*caseResult, total time.Duration) error {
	data, err := xml.MarshalIndent(buildJUnit(results, total), "", "  ")
	if err != nil {
		return err
	}
	return os.WriteFile(path, append([]byte(xml.Header), append(data, '\n')...), 0o644)
}

// plural returns word with an s unless n is 1.
func plural(n int, word string) string {
	if n == 1 {
		return word
	}
	return word + "s"
}
