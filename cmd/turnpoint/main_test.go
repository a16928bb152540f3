package main

import (
	"bytes"
	"encoding/json"
	"encoding/xml"
	"errors"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/turnpoint/turnpoint/cases/library"
)

var update = flag.Bool("update", false, "update golden files")

// runCLI runs the command line with args and returns stdout, stderr and the
// exit status.
func runCLI(t *testing.T, args ...string) (string, string, int) {
	t.Helper()
	var out, errb bytes.Buffer
	err := route(args, &out, &errb)
	code := exitStatus(err, &errb)
	return out.String(), errb.String(), code
}

func TestHelpGolden(t *testing.T) {
	var b strings.Builder
	out, _, code := runCLI(t, "help")
	if code != 0 {
		t.Fatalf("help: exit %d, want 0", code)
	}
	b.WriteString(out)
	for _, c := range commands {
		out, _, code := runCLI(t, "help", c.Name)
		if code != 0 {
			t.Fatalf("help %s: exit %d, want 0", c.Name, code)
		}
		b.WriteString("\n==== " + c.Name + "\n" + out)
	}
	golden := filepath.Join("testdata", "help.golden")
	if *update {
		if err := os.WriteFile(golden, []byte(b.String()), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if got := b.String(); got != string(want) {
		gl, wl := strings.Split(got, "\n"), strings.Split(string(want), "\n")
		for i := 0; i < len(gl) && i < len(wl); i++ {
			if gl[i] != wl[i] {
				t.Fatalf("%s:%d: help text differs:\n got %q\nwant %q", golden, i+1, gl[i], wl[i])
			}
		}
		t.Fatalf("%s: help text differs in length: got %d lines, want %d", golden, len(gl), len(wl))
	}
}

func TestExitStatus(t *testing.T) {
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.toml")
	os.WriteFile(bad, []byte("form = \"general\"\n[general]\nQ = \"sinn(x)\"\nlambda = 3\n[region]\nx = [0, 1]\n"), 0o644)
	for _, tc := range []struct {
		args    []string
		code    int
		message string // must appear on stderr or stdout
	}{
		{[]string{}, 2, "no command"},
		{[]string{"frobnicate"}, 2, "unknown command"},
		{[]string{"pionts"}, 2, `did you mean "points"`},
		{[]string{"help", "nosuch"}, 2, "unknown command"},
		{[]string{"points"}, 2, "want one case file"},
		{[]string{"points", "--bogus", "x.toml"}, 2, "unknown flag"},
		{[]string{"points", filepath.Join(dir, "missing.toml")}, 2, "missing.toml"},
		{[]string{"points", bad}, 2, "bad.toml:3:6"},
		{[]string{"points", "--help"}, 0, "usage: turnpoint points"},
		{[]string{"cases", "nosuch"}, 2, "no bundled case"},
		{[]string{"check", "--shard", "3/2"}, 2, "--shard"},
		{[]string{"version"}, 0, "turnpoint"},
	} {
		out, errOut, code := runCLI(t, tc.args...)
		if code != tc.code {
			t.Errorf("turnpoint %v: exit %d, want %d\nstdout: %s\nstderr: %s", tc.args, code, tc.code, out, errOut)
		}
		if !strings.Contains(out+errOut, tc.message) {
			t.Errorf("turnpoint %v: output does not mention %q\nstdout: %s\nstderr: %s", tc.args, tc.message, out, errOut)
		}
	}
}

func TestShardsPartition(t *testing.T) {
	var files []caseFile
	for _, n := range library.Names() {
		files = append(files, caseFile{name: n})
	}
	for n := 1; n <= 5; n++ {
		seen := map[string]int{}
		for k := 1; k <= n; k++ {
			for _, f := range shardOf(append([]caseFile(nil), files...), k, n) {
				seen[f.name]++
			}
		}
		if len(seen) != len(files) {
			t.Errorf("%d shards cover %d of %d cases", n, len(seen), len(files))
		}
		for name, c := range seen {
			if c != 1 {
				t.Errorf("%d shards: case %s runs %d times", n, name, c)
			}
		}
	}
}

// copyCase writes a bundled case into dir and returns its path.
func copyCase(t *testing.T, dir, name string) string {
	t.Helper()
	src, err := library.Read(name)
	if err != nil {
		t.Fatal(err)
	}
	p := filepath.Join(dir, name+".toml")
	if err := os.WriteFile(p, src, 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// TestCheckCatchesWrongExpectation plants a wrong expected value in a copy
// of a bundled case: check must exit 1 and say which figure, by how much and
// against which tolerance; --update must then repair the file so that check
// passes, changing nothing but the number.
func TestCheckCatchesWrongExpectation(t *testing.T) {
	if testing.Short() {
		t.Skip("runs a full case")
	}
	dir := t.TempDir()
	p := copyCase(t, dir, "floor-field")
	orig, _ := os.ReadFile(p)
	const good = "value = 1.8557570814892385"
	if !bytes.Contains(orig, []byte(good)) {
		t.Fatalf("floor-field.toml no longer holds %q", good)
	}
	broken := bytes.Replace(orig, []byte(good), []byte("value = 1.9"), 1)
	os.WriteFile(p, broken, 0o644)

	junit := filepath.Join(dir, "report.xml")
	jsonl := filepath.Join(dir, "report.jsonl")
	out, errOut, code := runCLI(t, "check", "--junit", junit, "--jsonl", jsonl, p)
	if code != 1 {
		t.Fatalf("check with a wrong expectation: exit %d, want 1\n%s%s", code, out, errOut)
	}
	for _, want := range []string{"FAIL", "E[0] (numeric)", "expected 1.9", "off by", "tolerance"} {
		if !strings.Contains(out, want) {
			t.Errorf("check output lacks %q:\n%s", want, out)
		}
	}

	// The JUnit report parses back and records the failure.
	data, err := os.ReadFile(junit)
	if err != nil {
		t.Fatal(err)
	}
	var js junitSuites
	if err := xml.Unmarshal(data, &js); err != nil {
		t.Fatalf("JUnit XML does not parse: %v", err)
	}
	if js.Tests != 1 || js.Failures != 1 || len(js.Suites) != 1 || len(js.Suites[0].Cases) != 1 ||
		js.Suites[0].Cases[0].Failure == nil || !strings.Contains(js.Suites[0].Cases[0].Failure.Body, "expected 1.9") {
		t.Errorf("JUnit report does not record the failure: %+v", js)
	}

	// One JSON object per line.
	lines, _ := os.ReadFile(jsonl)
	var l jsonLine
	if err := json.Unmarshal(bytes.TrimSpace(lines), &l); err != nil || l.Pass || l.Summary.Regressed != 1 {
		t.Errorf("JSON line %s: err %v, pass %v, regressed %d", lines, err, l.Pass, l.Summary.Regressed)
	}

	// --update repairs the value and nothing else.
	out, errOut, code = runCLI(t, "check", "--update", p)
	if code != 0 {
		t.Fatalf("check --update: exit %d\n%s%s", code, out, errOut)
	}
	if !strings.Contains(out, "updated") {
		t.Errorf("check --update does not say what changed:\n%s", out)
	}
	fixed, _ := os.ReadFile(p)
	ol, fl := strings.Split(string(orig), "\n"), strings.Split(string(fixed), "\n")
	if len(ol) != len(fl) {
		t.Fatalf("--update changed the number of lines: %d -> %d", len(ol), len(fl))
	}
	var changed []string
	for i := range ol {
		if ol[i] != fl[i] {
			changed = append(changed, fl[i])
		}
	}
	if len(changed) > 1 || (len(changed) == 1 && !strings.HasPrefix(changed[0], "value = 1.85575708")) {
		t.Errorf("--update changed more than the value: %q", changed)
	}
	if out, errOut, code := runCLI(t, "check", p); code != 0 {
		t.Errorf("check after --update: exit %d\n%s%s", code, out, errOut)
	}
}

func TestCommandTable(t *testing.T) {
	// The command table is the single source of the help listing: every entry
	// must be complete and names unique.
	seen := map[string]bool{}
	for _, c := range commands {
		if c.Flags == nil || c.Short == "" || c.Long == "" || c.UsageLine == "" {
			t.Errorf("command %s is incomplete", c.Name)
		}
		if seen[c.Name] {
			t.Errorf("command %s listed twice", c.Name)
		}
		seen[c.Name] = true
	}
	var ee *exitError
	if !errors.As(badInput(errors.New("x")), &ee) || ee.code != exitBadInput {
		t.Error("badInput does not carry exit status 2")
	}
	if !errors.As(checkFailed(errors.New("x")), &ee) || ee.code != exitCheckFailed {
		t.Error("checkFailed does not carry exit status 1")
	}
}

// BenchmarkCheckLibrary runs the whole bundled library as "turnpoint check"
// does (all cores); the README quotes its time.
func BenchmarkCheckLibrary(b *testing.B) {
	for range b.N {
		var out, errb bytes.Buffer
		if err := route([]string{"check"}, &out, &errb); err != nil {
			b.Fatalf("%v\n%s", err, out.String())
		}
	}
}

// TestRunOut runs a small bundled case with --out and --json and checks the
// figures and the result file are written and the JSON has its stable keys.
func TestRunOut(t *testing.T) {
	if testing.Short() {
		t.Skip("runs a full case")
	}
	dir := t.TempDir()
	out, errOut, code := runCLI(t, "run", "--json", "--out", dir, "lib:harmonic-trap")
	if code != 0 {
		t.Fatalf("run: exit %d\n%s", code, errOut)
	}
	var rep map[string]any
	if err := json.Unmarshal([]byte(out), &rep); err != nil {
		t.Fatalf("run --json is not JSON: %v", err)
	}
	for _, key := range []string{"case", "form", "lambda", "convention", "turning_points", "levels", "checks", "summary", "assumptions"} {
		if _, ok := rep[key]; !ok {
			t.Errorf("JSON report lacks %q", key)
		}
	}
	for _, name := range []string{"levels.svg", "stokes.svg", "result.json"} {
		if fi, err := os.Stat(filepath.Join(dir, name)); err != nil || fi.Size() == 0 {
			t.Errorf("--out did not write %s: %v", name, err)
		}
	}
}
