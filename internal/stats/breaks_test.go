package stats

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// classCost is the summed squared deviation of sorted values from their
// class means under edges (values on an inner edge in the lower class).
func classCost(sorted, edges []float64) float64 {
	sums := make([]float64, len(edges)-1)
	counts := make([]float64, len(edges)-1)
	for _, v := range sorted {
		c := ClassOf(edges, v)
		sums[c] += v
		counts[c]++
	}
	cost := 0.0
	for _, v := range sorted {
		c := ClassOf(edges, v)
		d := v - sums[c]/counts[c]
		cost += d * d
	}
	return cost
}

// bruteBest tries every way to cut sorted values into k contiguous
// non-empty classes.
func bruteBest(sorted []float64, k int) float64 {
	n := len(sorted)
	best := math.Inf(1)
	var rec func(start, left int, edges []float64)
	rec = func(start, left int, edges []float64) {
		if left == 1 {
			e := append(slices.Clone(edges), sorted[n-1])
			best = math.Min(best, classCost(sorted, e))
			return
		}
		for end := start + 1; end <= n-left+1; end++ {
			rec(end, left-1, append(slices.Clone(edges), sorted[end-1]))
		}
	}
	rec(0, k, []float64{sorted[0]})
	return best
}

// Fisher's natural breaks are the optimal partition: checked against brute
// force over every contiguous partition of small random data sets.
func TestNaturalBreaksOptimal(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for trial := range 300 {
		n := 3 + r.IntN(9)
		v := make([]float64, n)
		for i := range v {
			v[i] = math.Round(r.NormFloat64()*20+float64(r.IntN(3))*50) / 2
		}
		s := slices.Clone(v)
		slices.Sort(s)
		k := 1 + r.IntN(min(5, distinct(s)))
		edges := NaturalBreaks(v, k)
		require.Len(t, edges, k+1, "trial %d", trial)
		assert.True(t, slices.IsSorted(edges))
		assert.InDelta(t, bruteBest(s, k), classCost(s, edges), 1e-6, "trial %d: %v into %d", trial, s, k)
	}
}

func TestNaturalBreaksSeparatesClusters(t *testing.T) {
	// Three clear groups: the breaks fall between them (hand computation).
	v := []float64{1, 2, 3, 50, 51, 52, 100, 101, 102}
	assert.Equal(t, []float64{1, 3, 52, 102}, NaturalBreaks(v, 3))
	assert.Equal(t, []float64{5, 5}, NaturalBreaks([]float64{5, 5, 5}, 4))
	assert.Nil(t, NaturalBreaks(nil, 3))
}

func TestOtherBreaks(t *testing.T) {
	v := []float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30}
	// Type 7 quartiles of this set are 4.25, 6.5 and 8.75 (methods.md §8,
	// Hyndman & Fan (1996) type 7 via R quantile()).
	assert.Equal(t, []float64{2, 4.25, 6.5, 8.75, 30}, QuantileBreaks(v, 4))
	assert.Equal(t, []float64{2, 9, 16, 23, 30}, EqualBreaks(v, 4))
	nice := NiceBreaks(v, 4)
	assert.Equal(t, 2.0, nice[0])
	assert.Equal(t, 30.0, nice[len(nice)-1])
	for _, e := range nice[1 : len(nice)-1] {
		assert.Equal(t, math.Round(e/5)*5, e, "inner edges on a nice step: %v", nice)
	}
	assert.Equal(t, 0, ClassOf([]float64{0, 10, 20}, 10), "an inner edge belongs to the lower class")
	assert.Equal(t, 1, ClassOf([]float64{0, 10, 20}, 10.5))
	assert.Equal(t, 1, ClassOf([]float64{0, 10, 20}, 99))
}

func BenchmarkNaturalBreaks3000(b *testing.B) {
	r := rand.New(rand.NewPCG(1, 1))
	v := make([]float64, 3000)
	for i := range v {
		v[i] = r.ExpFloat64() * 100
	}
	for b.Loop() {
		NaturalBreaks(v, 5)
	}
}
