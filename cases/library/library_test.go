package library_test

import (
	"fmt"
	"strings"
	"testing"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/cases/library"
)

// TestLibraryLoads checks that every bundled case loads, says what it models
// in its first comment line, and that the library is as large as promised.
func TestLibraryLoads(t *testing.T) {
	names := library.Names()
	if len(names) < 12 {
		t.Errorf("library has %d cases, want at least 12", len(names))
	}
	demo := false
	for _, n := range names {
		src, err := library.Read(n)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := cases.Parse(n, src); err != nil {
			t.Errorf("%s: %v", n, err)
		}
		if library.Summary(n) == "" {
			t.Errorf("%s: no leading comment saying what it models", n)
		}
		if !strings.Contains(string(src), "source =") && strings.Contains(string(src), "[[expect]]") {
			t.Errorf("%s: an expectation without a source", n)
		}
		demo = demo || n == library.Demo
	}
	if !demo {
		t.Errorf("demo case %q is not in the library", library.Demo)
	}
	if _, err := library.Read("no-such-case"); err == nil {
		t.Error("Read of a missing case gave no error")
	}
}

// BenchmarkLoadLibrary loads every bundled case once per iteration.
func BenchmarkLoadLibrary(b *testing.B) {
	names := library.Names()
	srcs := make([][]byte, len(names))
	for i, n := range names {
		srcs[i], _ = library.Read(n)
	}
	b.ResetTimer()
	for range b.N {
		for i, n := range names {
			if _, err := cases.Parse(n, srcs[i]); err != nil {
				b.Fatal(err)
			}
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*len(names))/1e6, "ms/case")
}

func ExampleNames() {
	for _, n := range library.Names()[:3] {
		fmt.Println(n)
	}
	// Output:
	// cosh-barrier
	// double-barrier
	// double-well
}
