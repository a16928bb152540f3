package cases

import (
	"errors"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "update golden files")

// TestGoldenErrors pins the full report (positions, messages and excerpts)
// of testdata/errors.toml in testdata/errors.golden.
func TestGoldenErrors(t *testing.T) {
	t.Parallel()
	name := filepath.Join("testdata", "errors.toml")
	golden := filepath.Join("testdata", "errors.golden")
	src, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	_, err = Parse("errors.toml", src) // the base name keeps the file portable
	var list ErrorList
	if !errors.As(err, &list) {
		t.Fatalf("Parse(%s) = %v, want an ErrorList", name, err)
	}
	got := list.Detail()
	if *update {
		if err := os.WriteFile(golden, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatalf("%v (run go test -run TestGoldenErrors -update to create it)", err)
	}
	if got == string(want) {
		return
	}
	gl, wl := strings.Split(got, "\n"), strings.Split(string(want), "\n")
	for i := 0; i < max(len(gl), len(wl)); i++ {
		var g, w string
		if i < len(gl) {
			g = gl[i]
		}
		if i < len(wl) {
			w = wl[i]
		}
		if g != w {
			col := 1
			for col <= min(len(g), len(w)) && g[col-1] == w[col-1] {
				col++
			}
			t.Fatalf("%s:%d:%d: output differs:\ngot  %q\nwant %q", golden, i+1, col, g, w)
		}
	}
}
