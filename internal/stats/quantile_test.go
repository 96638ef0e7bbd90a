package stats

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// Worked examples of methods.md §8, verified there with R 4.2.2
// quantile(type = 7), IQR and Python statistics.quantiles(method =
// 'inclusive') (Hyndman & Fan 1996, type 7).
var (
	methodsX = []float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30}     // n = 10
	methodsY = []float64{1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 100} // n = 11
)

func TestQuantileType7(t *testing.T) {
	tests := []struct {
		name string
		data []float64
		p    float64
		want float64
	}{
		// methods.md §8, x: Q1 = 4.25, median = 6.5, Q3 = 8.75 [R quantile type 7]
		{"x Q1", methodsX, 0.25, 4.25},
		{"x median", methodsX, 0.5, 6.5},
		{"x Q3", methodsX, 0.75, 8.75},
		// methods.md §8, y: Q1 = 3.5, median = 6, Q3 = 8.5 [R quantile type 7]
		{"y Q1", methodsY, 0.25, 3.5},
		{"y median", methodsY, 0.5, 6},
		{"y Q3", methodsY, 0.75, 8.5},
		// Type 7 definition (Hyndman & Fan 1996): Q(0) and Q(1) are the
		// extremes, and h = (n−1)p + 1 interpolates between neighbours.
		{"minimum", methodsX, 0, 2},
		{"maximum", methodsX, 1, 30},
		{"p10 of x", methodsX, 0.1, 3.8},  // h = 1.9: 2 + 0.9·(4−2)
		{"p90 of x", methodsX, 0.9, 12.9}, // h = 9.1: 11 + 0.1·(30−11)
		{"one value", []float64{7}, 0.3, 7},
		{"two values", []float64{1, 3}, 0.25, 1.5},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, err := Sorted(tc.data)
			if err != nil {
				t.Fatal(err)
			}
			if got := Quantile(s, tc.p); math.Abs(got-tc.want) > 1e-12 {
				t.Errorf("Quantile(%v) = %v, want %v", tc.p, got, tc.want)
			}
		})
	}
}

func TestQuantileRejects(t *testing.T) {
	for _, p := range []float64{-0.1, 1.1, math.NaN()} {
		if q := Quantile([]float64{1, 2}, p); !math.IsNaN(q) {
			t.Errorf("Quantile(p=%v) = %v, want NaN", p, q)
		}
	}
	if q := Quantile(nil, 0.5); !math.IsNaN(q) {
		t.Errorf("Quantile of nothing = %v, want NaN", q)
	}
	if _, err := Sorted(nil); !errors.Is(err, ErrEmpty) {
		t.Errorf("Sorted(nil) error %v, want ErrEmpty", err)
	}
	for _, bad := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		if _, err := Sorted([]float64{1, bad}); !errors.Is(err, ErrNotFinite) {
			t.Errorf("Sorted with %v: error %v, want ErrNotFinite", bad, err)
		}
	}
}

// TestQuantileMonotone checks on random data, including ties and values of
// wildly different sizes, that quantiles never decrease with p and stay
// within the data.
func TestQuantileMonotone(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := range 300 {
		n := 1 + rng.IntN(40)
		xs := make([]float64, n)
		for i := range xs {
			switch trial % 3 {
			case 0:
				xs[i] = float64(rng.IntN(5)) // many ties
			case 1:
				xs[i] = rng.NormFloat64() * 1e300 // near overflow
			default:
				xs[i] = rng.ExpFloat64() * math.Pow(10, float64(rng.IntN(20)-10))
			}
		}
		s, err := Sorted(xs)
		if err != nil {
			t.Fatal(err)
		}
		prev := math.Inf(-1)
		for i := 0; i <= 200; i++ {
			q := Quantile(s, float64(i)/200)
			if q < prev || q < s[0] || q > s[n-1] {
				t.Fatalf("trial %d: Q(%v) = %v after %v, data %v..%v", trial, float64(i)/200, q, prev, s[0], s[n-1])
			}
			prev = q
		}
	}
}

func TestSortedDoesNotTouchInput(t *testing.T) {
	in := []float64{3, 1, 2}
	if _, err := Sorted(in); err != nil {
		t.Fatal(err)
	}
	if !slices.Equal(in, []float64{3, 1, 2}) {
		t.Errorf("input changed to %v", in)
	}
}
