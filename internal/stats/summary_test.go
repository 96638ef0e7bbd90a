package stats

import (
	"math"
	"math/rand/v2"
	"testing"
)

func TestTukeyBox(t *testing.T) {
	tests := []struct {
		name                    string
		data                    []float64
		q1, median, q3          float64
		lowFence, highFence     float64
		lowWhisker, highWhisker float64
		outliers                []float64
		farOut                  int
	}{
		// methods.md §8 (R 4.2.2 quantile type 7, IQR): IQR 4.5, inner fences
		// −2.5 and 15.5, 30 an outlier, whiskers at 2 and 11; outer fences
		// −9.25 and 22.25, so 30 is far out.
		{"methods x", methodsX, 4.25, 6.5, 8.75, -2.5, 15.5, 2, 11, []float64{30}, 1},
		// methods.md §8: IQR 5, fences −4 and 16, 100 an outlier.
		{"methods y", methodsY, 3.5, 6, 8.5, -4, 16, 1, 10, []float64{100}, 1},
		// Invented: no outliers, whiskers at the extremes.
		{"no outliers", []float64{1, 2, 3, 4, 5}, 2, 3, 4, -1, 7, 1, 5, nil, 0},
		// Invented: a value exactly on the high fence is inside (Tukey's
		// "within"): Q1 = 3.25, Q3 = 7.75, fence 7.75 + 1.5·4.5 = 14.5.
		{"on the fence", []float64{1, 2, 3, 4, 5, 6, 7, 8, 9, 14.5}, 3.25, 5.5, 7.75, -3.5, 14.5, 1, 14.5, nil, 0},
		{"all equal", []float64{5, 5, 5, 5}, 5, 5, 5, 5, 5, 5, 5, nil, 0},
		{"equal but one", []float64{5, 5, 5, 5, 9}, 5, 5, 5, 5, 5, 5, 5, []float64{9}, 1},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			b, err := TukeyBox(tc.data)
			if err != nil {
				t.Fatal(err)
			}
			near := func(what string, got, want float64) {
				if math.Abs(got-want) > 1e-9 {
					t.Errorf("%s = %v, want %v", what, got, want)
				}
			}
			near("Q1", b.Q1, tc.q1)
			near("median", b.Median, tc.median)
			near("Q3", b.Q3, tc.q3)
			near("low fence", b.LowFence, tc.lowFence)
			near("high fence", b.HighFence, tc.highFence)
			near("low whisker", b.LowWhisker, tc.lowWhisker)
			near("high whisker", b.HighWhisker, tc.highWhisker)
			if len(b.Outliers) != len(tc.outliers) {
				t.Fatalf("outliers %v, want %v", b.Outliers, tc.outliers)
			}
			for i := range b.Outliers {
				near("outlier", b.Outliers[i], tc.outliers[i])
			}
			if b.FarOut != tc.farOut {
				t.Errorf("far out %d, want %d", b.FarOut, tc.farOut)
			}
		})
	}
}

// TestTukeyBoxProperties checks on random data that every value is either
// between the whiskers or an outlier, that whiskers are data values inside
// the fences, and that the box lies inside the whiskers.
func TestTukeyBoxProperties(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := range 300 {
		n := 1 + rng.IntN(60)
		xs := make([]float64, n)
		for i := range xs {
			xs[i] = math.Round(rng.NormFloat64()*10) + float64(rng.IntN(3))*rng.ExpFloat64()*30
		}
		b, err := TukeyBox(xs)
		if err != nil {
			t.Fatal(err)
		}
		inside, isLow, isHigh := 0, false, false
		for _, x := range xs {
			if x >= b.LowWhisker && x <= b.HighWhisker {
				inside++
			}
			isLow = isLow || x == b.LowWhisker
			isHigh = isHigh || x == b.HighWhisker
		}
		if inside+len(b.Outliers) != n {
			t.Fatalf("trial %d: %d inside the whiskers + %d outliers != %d values", trial, inside, len(b.Outliers), n)
		}
		if !isLow || !isHigh {
			t.Fatalf("trial %d: whiskers %v, %v are not data values", trial, b.LowWhisker, b.HighWhisker)
		}
		if b.LowWhisker < b.LowFence || b.HighWhisker > b.HighFence || b.Q1 > b.Q3 {
			t.Fatalf("trial %d: whiskers %v..%v, fences %v..%v, box %v..%v", trial, b.LowWhisker, b.HighWhisker, b.LowFence, b.HighFence, b.Q1, b.Q3)
		}
		for _, o := range b.Outliers {
			if o >= b.LowFence && o <= b.HighFence {
				t.Fatalf("trial %d: outlier %v inside the fences %v..%v", trial, o, b.LowFence, b.HighFence)
			}
		}
	}
}

func TestSummarize(t *testing.T) {
	s, err := Summarize(methodsX)
	if err != nil {
		t.Fatal(err)
	}
	// methods.md §8 quartiles; mean 86/10 by hand; p10 and p90 by the type 7
	// formula (h = 1.9 and 9.1).
	want := Summary{N: 10, Min: 2, Max: 30, Mean: 8.6, P10: 3.8, Q1: 4.25, Median: 6.5, Q3: 8.75, P90: 12.9}
	got := []float64{s.Min, s.Max, s.Mean, s.P10, s.Q1, s.Median, s.Q3, s.P90}
	exp := []float64{want.Min, want.Max, want.Mean, want.P10, want.Q1, want.Median, want.Q3, want.P90}
	for i := range got {
		if math.Abs(got[i]-exp[i]) > 1e-12 {
			t.Errorf("summary %+v, want %+v", s, want)
			break
		}
	}
	if s.N != 10 {
		t.Errorf("N = %d", s.N)
	}
}

func TestMeanStaysInRange(t *testing.T) {
	tests := [][]float64{
		{math.MaxFloat64, math.MaxFloat64},     // the sum overflows
		{0.1, 0.1, 0.1, 0.1, 0.1, 0.1, 0.1},    // repeated inexact values
		{1e16, 1, -1e16},                       // cancellation
		{-math.MaxFloat64, math.MaxFloat64, 1}, // extremes of both signs
	}
	wants := []float64{math.MaxFloat64, 0.1, 1.0 / 3, 1.0 / 3}
	for i, xs := range tests {
		m := Mean(xs)
		lo, hi := xs[0], xs[0]
		for _, x := range xs {
			lo, hi = min(lo, x), max(hi, x)
		}
		if math.IsNaN(m) || m < lo || m > hi {
			t.Errorf("Mean(%v) = %v outside the data", xs, m)
		}
		if math.Abs(m-wants[i]) > 1e-9*math.Max(1, math.Abs(wants[i])) {
			t.Errorf("Mean(%v) = %v, want %v", xs, m, wants[i])
		}
	}
}
