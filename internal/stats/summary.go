package stats

import "math"

// Summary is the five numbers a range chart can draw, with the quartiles
// and the count.
type Summary struct {
	N                        int
	Min, Max                 float64
	Mean                     float64
	P10, Q1, Median, Q3, P90 float64 // type 7 quantiles
}

// Summarize returns the summary of xs, which may be in any order. It
// returns ErrEmpty or ErrNotFinite for data it cannot summarise.
func Summarize(xs []float64) (Summary, error) {
	s, err := Sorted(xs)
	if err != nil {
		return Summary{}, err
	}
	return SummarizeSorted(s), nil
}

// SummarizeSorted is Summarize for values already sorted and finite.
func SummarizeSorted(sorted []float64) Summary {
	if len(sorted) == 0 {
		nan := math.NaN()
		return Summary{Min: nan, Max: nan, Mean: nan, P10: nan, Q1: nan, Median: nan, Q3: nan, P90: nan}
	}
	return Summary{
		N:      len(sorted),
		Min:    sorted[0],
		Max:    sorted[len(sorted)-1],
		Mean:   Mean(sorted),
		P10:    Quantile(sorted, 0.1),
		Q1:     Quantile(sorted, 0.25),
		Median: Quantile(sorted, 0.5),
		Q3:     Quantile(sorted, 0.75),
		P90:    Quantile(sorted, 0.9),
	}
}

// Mean is the arithmetic mean of xs, summed with Neumaier's compensation so
// that a long column of similar values loses no digits, and scaled first
// when the sum would overflow. It is NaN for no values.
func Mean(xs []float64) float64 {
	if len(xs) == 0 {
		return math.NaN()
	}
	scale := 1.0
	for _, x := range xs {
		if math.Abs(x) > math.MaxFloat64/float64(len(xs)) {
			scale = float64(len(xs))
			break
		}
	}
	var sum, c float64
	for _, x := range xs {
		x /= scale
		t := sum + x
		if math.Abs(sum) >= math.Abs(x) {
			c += (sum - t) + x
		} else {
			c += (x - t) + sum
		}
		sum = t
	}
	m := (sum + c) / float64(len(xs)) * scale
	// The mean of finite values lies between their extremes; rounding must
	// not put it outside (a range mark's middle beyond its ends).
	lo, hi := xs[0], xs[0]
	for _, x := range xs {
		lo, hi = min(lo, x), max(hi, x)
	}
	return min(max(m, lo), hi)
}

// Box is one Tukey box plot (Tukey 1977) drawn with type 7 quartiles: the
// box from Q1 to Q3, whiskers to the most extreme values within the inner
// fences, and every value beyond them an outlier.
type Box struct {
	N                   int
	Q1, Median, Q3      float64
	IQR                 float64 // Q3 − Q1
	LowFence, HighFence float64 // Q1 − 1.5·IQR and Q3 + 1.5·IQR
	// LowWhisker and HighWhisker are the most extreme values inside the
	// fences. One may lie inside the box, when a quartile is interpolated
	// between a value beyond its fence and one inside it: the box then
	// has no whisker on that side.
	LowWhisker, HighWhisker float64
	// Outliers are the values beyond the inner fences, ascending; FarOut
	// counts those beyond the outer fences (3·IQR), Tukey's "far out".
	Outliers []float64
	FarOut   int
}

// FenceFactor is Tukey's 1.5: inner fences lie 1.5·IQR beyond the
// quartiles (Tukey 1977; methods.md §8).
const FenceFactor = 1.5

// TukeyBox returns the box plot of xs, which may be in any order.
func TukeyBox(xs []float64) (Box, error) {
	s, err := Sorted(xs)
	if err != nil {
		return Box{}, err
	}
	return TukeyBoxSorted(s), nil
}

// TukeyBoxSorted is TukeyBox for values already sorted and finite; it
// returns the zero Box for no values.
func TukeyBoxSorted(sorted []float64) Box {
	n := len(sorted)
	if n == 0 {
		return Box{}
	}
	b := Box{N: n, Q1: Quantile(sorted, 0.25), Median: Quantile(sorted, 0.5), Q3: Quantile(sorted, 0.75)}
	b.IQR = b.Q3 - b.Q1
	b.LowFence = b.Q1 - FenceFactor*b.IQR
	b.HighFence = b.Q3 + FenceFactor*b.IQR
	farLo, farHi := b.Q1-2*FenceFactor*b.IQR, b.Q3+2*FenceFactor*b.IQR
	b.LowWhisker, b.HighWhisker = b.Q1, b.Q3
	for _, x := range sorted {
		if x >= b.LowFence {
			b.LowWhisker = x
			break
		}
	}
	for i := n - 1; i >= 0; i-- {
		if x := sorted[i]; x <= b.HighFence {
			b.HighWhisker = x
			break
		}
	}
	for _, x := range sorted {
		if x < b.LowFence || x > b.HighFence {
			b.Outliers = append(b.Outliers, x)
			if x < farLo || x > farHi {
				b.FarOut++
			}
		}
	}
	return b
}
