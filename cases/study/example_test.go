package study_test

import (
	"fmt"

	"github.com/turnpoint/turnpoint/cases"
	"github.com/turnpoint/turnpoint/cases/study"
)

// A harmonic well: WKB is exact at every order and the numerical levels
// agree, so every verdict is "agree".
func ExampleRun() {
	src := []byte(`
form = "schrodinger"
[schrodinger]
potential = "x^2/2"
mass = 1.0
hbar = 0.1
[region]
x = [-3.0, 3.0]
[levels]
n = [0, 3]
`)
	c, err := cases.Parse("harmonic.toml", src)
	if err != nil {
		fmt.Println(err)
		return
	}
	rep := study.Run(c, study.Levels, nil)
	for _, r := range rep.Levels.Rows {
		fmt.Printf("n=%d  WKB %.10f  numeric %.10f  agree %v\n", r.N, float64(r.WKB), float64(r.Numeric), r.Verdict.Agree)
	}
	// Output:
	// n=0  WKB 0.0500000000  numeric 0.0500000000  agree true
	// n=3  WKB 0.3500000000  numeric 0.3500000000  agree true
}
