package special

import "testing"

var sink complex128

func BenchmarkLogGammaSmall(b *testing.B) {
	for i := 0; i < b.N; i++ {
		sink = LogGamma(0.5 + 0.3i)
	}
}

func BenchmarkLogGammaLarge(b *testing.B) {
	for i := 0; i < b.N; i++ {
		sink = LogGamma(30 + 20i)
	}
}

func BenchmarkParabolicPhase(b *testing.B) {
	for i := 0; i < b.N; i++ {
		sink = complex(ParabolicPhase(1.3), 0)
	}
}
