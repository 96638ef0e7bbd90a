package stats

import (
	"errors"
	"math"
	"slices"
)

// ErrEmpty is returned when there are no values to summarise; a value
// that is NaN or infinite gives ErrNotFinite (cluster.go). Callers name
// the data that caused them.
var ErrEmpty = errors.New("no values")

// Sorted returns a sorted copy of xs, or an error when xs is empty or holds
// a value that is not finite. The other functions of this package that take
// "sorted" expect its result.
func Sorted(xs []float64) ([]float64, error) {
	if len(xs) == 0 {
		return nil, ErrEmpty
	}
	for _, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return nil, ErrNotFinite
		}
	}
	s := slices.Clone(xs)
	slices.Sort(s)
	return s, nil
}

// Quantile returns the p-quantile of sorted values by Hyndman & Fan (1996)
// type 7: with h = (n−1)p + 1, Q(p) = x[⌊h⌋] + (h − ⌊h⌋)(x[⌊h⌋+1] − x[⌊h⌋])
// in 1-based order statistics. It is NaN when sorted is empty or p is not
// in [0, 1]. Q(0) is the minimum and Q(1) the maximum.
func Quantile(sorted []float64, p float64) float64 {
	n := len(sorted)
	if n == 0 || !(p >= 0 && p <= 1) {
		return math.NaN()
	}
	h := float64(n-1) * p // 0-based position
	lo := int(math.Floor(h))
	if lo >= n-1 {
		return sorted[n-1]
	}
	frac := h - float64(lo)
	a, b := sorted[lo], sorted[lo+1]
	if frac == 0 || a == b {
		return a // exact order statistics stay exact
	}
	// a + frac·(b−a) can leave [a, b] by rounding when b−a overflows or
	// frac·(b−a) rounds up; clamp so that quantiles stay monotone in p.
	return min(max(a+frac*(b-a), a), b)
}
