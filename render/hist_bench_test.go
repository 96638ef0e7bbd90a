package render

import (
	"io"
	"math/rand/v2"
	"testing"
)

func benchValues(n int) []float64 {
	rng := rand.New(rand.NewPCG(2, 2))
	v := make([]float64, n)
	for i := range v {
		v[i] = rng.NormFloat64()*8 + rng.ExpFloat64()*4
	}
	return v
}

// BenchmarkHist measures a histogram of a million values, from the slice
// to the SVG: sorting dominates.
func BenchmarkHist(b *testing.B) {
	v := benchValues(1_000_000)
	for b.Loop() {
		if _, err := Hist(io.Discard, v, HistOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBox measures box plots of 20 groups of 450 values (9,000 in all).
func BenchmarkBox(b *testing.B) {
	v := benchValues(9000)
	groups := make([]Group, 20)
	for i := range groups {
		groups[i] = Group{Label: "Group " + string(rune('A'+i)), Values: v[i*450 : (i+1)*450]}
	}
	for b.Loop() {
		if _, err := Box(io.Discard, groups, BoxOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSpan measures ranges computed from 9,000 values in 12 groups.
func BenchmarkSpan(b *testing.B) {
	v := benchValues(9000)
	groups := make([]Group, 12)
	for i := range groups {
		groups[i] = Group{Label: "Month " + string(rune('A'+i)), Values: v[i*750 : (i+1)*750]}
	}
	for b.Loop() {
		r, err := RangesFromGroups(groups, StatQuartiles)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := Span(io.Discard, r, SpanOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}
