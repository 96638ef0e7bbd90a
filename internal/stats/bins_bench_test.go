package stats

import (
	"math/rand/v2"
	"testing"
)

func benchData(n int) []float64 {
	rng := rand.New(rand.NewPCG(1, 1))
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = rng.NormFloat64()*12 + rng.ExpFloat64()*5
	}
	return xs
}

// BenchmarkBinValues measures choosing and counting bins for a million sorted values.
func BenchmarkBinValues(b *testing.B) {
	s, _ := Sorted(benchData(1_000_000))
	b.ResetTimer()
	for b.Loop() {
		if _, err := BinValues(s, BinOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSorted measures the sort every summary starts with.
func BenchmarkSorted(b *testing.B) {
	xs := benchData(1_000_000)
	for b.Loop() {
		if _, err := Sorted(xs); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkTukeyBox measures one box plot of 9,000 values, sort included.
func BenchmarkTukeyBox(b *testing.B) {
	xs := benchData(9000)
	for b.Loop() {
		if _, err := TukeyBox(xs); err != nil {
			b.Fatal(err)
		}
	}
}
