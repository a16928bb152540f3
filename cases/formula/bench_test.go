package formula

import (
	"math/cmplx"
	"testing"

	"github.com/turnpoint/turnpoint/wkb/jet"
)

// typicalQ is the Schrödinger Q of a cosh⁻² barrier.
const typicalQ = "2*(E - V0/cosh(x)^2)"

func benchFunc(b *testing.B) jet.Func {
	e, err := Parse(typicalQ, []string{"E", "V0"})
	if err != nil {
		b.Fatal(err)
	}
	f, err := e.Bind(map[string]complex128{"E": 0.5, "V0": 1})
	if err != nil {
		b.Fatal(err)
	}
	return f
}

var sinkC complex128

func BenchmarkEval(b *testing.B) {
	f := benchFunc(b)
	z := complex(0.3, 0.1)
	b.ReportAllocs()
	for b.Loop() {
		sinkC = f.Eval(z)
	}
}

// BenchmarkEvalDirect is the same Q written in Go, the floor for Eval.
func BenchmarkEvalDirect(b *testing.B) {
	z := complex(0.3, 0.1)
	E, V0 := complex(0.5, 0), complex(1, 0)
	b.ReportAllocs()
	for b.Loop() {
		c := cmplx.Cosh(z)
		sinkC = 2 * (E - V0/(c*c))
	}
}

func BenchmarkTaylor8(b *testing.B) {
	f := benchFunc(b)
	z := complex(0.3, 0.1)
	b.ReportAllocs()
	for b.Loop() {
		sinkC = f.Taylor(z, 8)[8]
	}
}

func BenchmarkParse(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Parse(typicalQ, []string{"E", "V0"}); err != nil {
			b.Fatal(err)
		}
	}
}
