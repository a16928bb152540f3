package cases

import (
	"os"
	"path/filepath"
	"testing"
)

// BenchmarkLoad measures Parse of a typical case file and the building of
// its problem at one scan point.
func BenchmarkLoad(b *testing.B) {
	src, err := os.ReadFile(filepath.Join("testdata", "schrodinger.toml"))
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		c, err := Parse("schrodinger.toml", src)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := c.ProblemAt(0.5); err != nil {
			b.Fatal(err)
		}
	}
}
