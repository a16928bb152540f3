package cases

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"unicode/utf8"
)

// FuzzLoad checks that no input makes Parse panic, that every error it
// reports is placed inside the input, and that an accepted case builds its
// problems without panicking.
func FuzzLoad(f *testing.F) {
	for _, name := range []string{"schrodinger.toml", "graded.toml", "graded_tm.toml", "general.toml", "errors.toml"} {
		src, err := os.ReadFile(filepath.Join("testdata", name))
		if err != nil {
			f.Fatal(err)
		}
		f.Add(src)
	}
	for _, tc := range badCases {
		f.Add([]byte(tc.src))
	}
	f.Fuzz(func(t *testing.T, src []byte) {
		c, err := Parse("fuzz.toml", src)
		if err != nil {
			var list ErrorList
			if !errors.As(err, &list) || len(list) == 0 {
				t.Fatalf("Parse returned %T %v, want a non-empty ErrorList", err, err)
			}
			lines := strings.Split(string(src), "\n")
			for _, e := range list {
				p := e.Pos
				if p.Filename != "fuzz.toml" {
					t.Errorf("error %q names file %q", e.Error(), p.Filename)
				}
				if p.Line < 0 || p.Line > len(lines) || p.Column < 0 {
					t.Fatalf("error %q placed outside the input of %d lines", e.Error(), len(lines))
				}
				if p.Line > 0 && p.Column > utf8.RuneCountInString(lines[p.Line-1])+1 {
					t.Fatalf("error %q placed past the end of line %d (%q)", e.Error(), p.Line, lines[p.Line-1])
				}
				if e.Msg == "" {
					t.Fatalf("error at %s without a message", p)
				}
			}
			return
		}
		a, b := c.Interval()
		if !(a < b) {
			t.Fatalf("accepted interval [%v, %v]", a, b)
		}
		box := c.SearchBox()
		if !box.Contains(complex(a, 0)) || !box.Contains(complex(b, 0)) {
			t.Fatalf("search box %v does not contain [%v, %v]", box, a, b)
		}
		if p, err := c.Problem(); err == nil {
			p.Q.Eval(complex((a+b)/2, 0.1))
			p.Q.Taylor(complex(a, 0), 4)
		}
		if c.Scan != nil {
			if v := c.Scan.Values(); len(v) != c.Scan.Points {
				t.Fatalf("Scan.Values() has %d values, want %d", len(v), c.Scan.Points)
			}
			if _, err := c.ProblemAt(c.Scan.From); err != nil && !(c.Form == Schrodinger && c.Schrodinger.Energy == nil && c.Scan.Over != "energy") {
				t.Fatalf("ProblemAt(from = %v): %v", c.Scan.From, err)
			}
		}
		if c.Form == Schrodinger {
			if _, err := c.Well(); err != nil {
				t.Fatalf("Well(): %v", err)
			}
		}
	})
}
