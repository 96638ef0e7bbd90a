package stats

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

func TestSturgesBins(t *testing.T) {
	// methods.md §8, Sturges (1926): k = ⌈log₂ n⌉ + 1 [D, python3].
	for _, tc := range []struct{ n, k int }{{10, 5}, {11, 5}, {20, 6}, {50, 7}, {100, 8}, {1000, 11}, {1024, 11}, {1000000, 21}, {1, 1}, {2, 2}} {
		if got := SturgesBins(tc.n); got != tc.k {
			t.Errorf("SturgesBins(%d) = %d, want %d", tc.n, got, tc.k)
		}
	}
}

func TestFreedmanDiaconisWidth(t *testing.T) {
	// methods.md §8, Freedman & Diaconis (1981) with type 7 IQR [V: R 4.2.2,
	// python3]: x gives h = 4.177430 and k = ⌈28/h⌉ = 7; y gives h =
	// 4.496443 and k = ⌈99/h⌉ = 23.
	for _, tc := range []struct {
		name string
		data []float64
		h    float64
		k    int
	}{{"x", methodsX, 4.177430, 7}, {"y", methodsY, 4.496443, 23}} {
		s, _ := Sorted(tc.data)
		h := FreedmanDiaconisWidth(s)
		if math.Abs(h-tc.h) > 5e-7 {
			t.Errorf("%s: h = %.6f, want %.6f", tc.name, h, tc.h)
		}
		if k := int(math.Ceil((s[len(s)-1] - s[0]) / h)); k != tc.k {
			t.Errorf("%s: k = %d, want %d", tc.name, k, tc.k)
		}
	}
}

func TestBinValues(t *testing.T) {
	tests := []struct {
		name   string
		data   []float64
		o      BinOptions
		rule   Rule
		width  float64
		edges  []float64
		counts []int
	}{
		// FD width 4.18 (methods.md §8) rounds to the nice 5; 30 lies on the
		// last edge and stays in the last bin, which is closed.
		{"methods x by FD", methodsX, BinOptions{}, FreedmanDiaconis, 5,
			[]float64{0, 5, 10, 15, 20, 25, 30}, []int{3, 5, 1, 0, 0, 1}},
		// FD width 4.50 (methods.md §8) also rounds to 5.
		{"methods y by FD", methodsY, BinOptions{}, FreedmanDiaconis, 5,
			nil, nil},
		// More than half the values equal: IQR 0, so Sturges (5 bins for
		// n = 10) over 0..10 gives width 2.
		{"IQR zero", []float64{0, 3, 3, 3, 3, 3, 3, 3, 3, 10}, BinOptions{}, Sturges, 2,
			[]float64{0, 2, 4, 6, 8, 10}, []int{1, 8, 0, 0, 1}},
		// Ten bins asked over 0..30: width 3 rounds to 2.5.
		{"bin count", methodsX, BinOptions{Bins: 10}, BinCount, 2.5,
			nil, nil},
		// A given width is used as given, edges at its multiples.
		{"given width", methodsX, BinOptions{Width: 3}, BinWidth, 3,
			[]float64{0, 3, 6, 9, 12, 15, 18, 21, 24, 27, 30}, []int{1, 3, 3, 2, 0, 0, 0, 0, 0, 1}},
		// Left-closed bins: 6 opens the second bin.
		{"left edge", []float64{0, 6, 12}, BinOptions{Width: 6}, BinWidth, 6,
			[]float64{0, 6, 12}, []int{1, 2}},
		{"one value", []float64{42}, BinOptions{}, SingleValue, 5,
			[]float64{40, 45}, []int{1}},
		{"zeros", []float64{0, 0}, BinOptions{}, SingleValue, 1,
			[]float64{0, 1}, []int{2}},
		// Decimal widths give exact decimal edges (0.3, not 0.30000000000000004).
		{"decimals", []float64{0.1, 0.2, 0.3, 0.35, 0.5}, BinOptions{Bins: 4}, BinCount, 0.1,
			[]float64{0.1, 0.2, 0.3, 0.4, 0.5}, []int{1, 1, 2, 1}},
		// Whole-number data: width 3 would round to 2.5, which splits the
		// integers unevenly; the next whole nice width is 5.
		{"integers", methodsX, BinOptions{Bins: 10, Integer: true}, BinCount, 5,
			[]float64{0, 5, 10, 15, 20, 25, 30, 35}, []int{3, 5, 1, 0, 0, 0, 1}},
		// A width below 1 for integers becomes 1, and the maximum has a bin
		// of its own: every bin is closed on the left only.
		{"integers narrow", []float64{1, 2, 2, 3}, BinOptions{Bins: 20, Integer: true}, BinCount, 1,
			[]float64{1, 2, 3, 4}, []int{1, 2, 1}},
		{"negative", []float64{-7, -3, -1}, BinOptions{Width: 2}, BinWidth, 2,
			[]float64{-8, -6, -4, -2, 0}, []int{1, 0, 1, 1}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, _ := Sorted(tc.data)
			h, err := BinValues(s, tc.o)
			if err != nil {
				t.Fatal(err)
			}
			if h.Rule != tc.rule || h.Width != tc.width {
				t.Errorf("rule %q width %v, want %q %v", h.Rule, h.Width, tc.rule, tc.width)
			}
			if tc.edges != nil && !slices.Equal(h.Edges, tc.edges) {
				t.Errorf("edges %v, want %v", h.Edges, tc.edges)
			}
			if tc.counts != nil && !slices.Equal(h.Counts, tc.counts) {
				t.Errorf("counts %v, want %v", h.Counts, tc.counts)
			}
			checkHistogram(t, s, h)
		})
	}
}

// checkHistogram checks what every histogram must satisfy: edges
// increasing by the width, covering the data, counts summing to n, each
// value counted in the bin the stated rule puts it in.
func checkHistogram(t *testing.T, sorted []float64, h Histogram) {
	t.Helper()
	k := len(h.Counts)
	if k == 0 || len(h.Edges) != k+1 {
		t.Fatalf("%d counts, %d edges", k, len(h.Edges))
	}
	if h.Edges[0] > sorted[0] || h.Edges[k] < sorted[len(sorted)-1] {
		t.Fatalf("edges %v..%v do not cover %v..%v", h.Edges[0], h.Edges[k], sorted[0], sorted[len(sorted)-1])
	}
	for i := 1; i <= k; i++ {
		if d := h.Edges[i] - h.Edges[i-1]; !(d > 0) || math.Abs(d-h.Width) > 1e-9*math.Max(h.Width, math.Abs(h.Edges[i])) {
			t.Fatalf("bin %d is %v wide, want %v", i-1, d, h.Width)
		}
	}
	want := make([]int, k)
	for _, x := range sorted {
		b := k - 1
		for i := range k {
			if x < h.Edges[i+1] {
				b = i
				break
			}
		}
		want[b]++
	}
	if !slices.Equal(h.Counts, want) {
		t.Fatalf("counts %v, by the edges %v", h.Counts, want)
	}
	sum, area := 0, 0.0
	for i, c := range h.Counts {
		sum += c
		area += h.Density(i) * h.Width
	}
	if sum != len(sorted) || h.N != len(sorted) {
		t.Fatalf("counts sum to %d, N %d, want %d", sum, h.N, len(sorted))
	}
	if math.Abs(area-1) > 1e-9 {
		t.Fatalf("density area %v, want 1", area)
	}
}

func TestBinProperties(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	for trial := range 400 {
		n := 1 + rng.IntN(300)
		xs := make([]float64, n)
		scale := math.Pow(10, float64(rng.IntN(16)-8))
		for i := range xs {
			switch trial % 4 {
			case 0:
				xs[i] = rng.NormFloat64() * scale
			case 1:
				xs[i] = rng.ExpFloat64() * scale
			case 2:
				xs[i] = float64(rng.IntN(6)) * scale
			default:
				xs[i] = 1e6 + rng.Float64()*scale
			}
		}
		s, _ := Sorted(xs)
		o := BinOptions{}
		if trial%5 == 4 {
			o.Bins = 1 + rng.IntN(40)
		}
		h, err := BinValues(s, o)
		if err != nil {
			t.Fatalf("trial %d: %v", trial, err)
		}
		checkHistogram(t, s, h)
		if len(h.Counts) > DefaultMaxBins {
			t.Fatalf("trial %d: %d bins", trial, len(h.Counts))
		}
	}
}

func TestBinWidens(t *testing.T) {
	// A long tail: FD gives a width for the bulk, which over the whole
	// range makes far more bins than allowed; the width grows to fit.
	xs := make([]float64, 1000)
	for i := range xs {
		xs[i] = float64(i%10) / 10
	}
	xs[999] = 1e6
	s, _ := Sorted(xs)
	h, err := BinValues(s, BinOptions{MaxBins: 50})
	if err != nil {
		t.Fatal(err)
	}
	if !h.Widened || len(h.Counts) > 50 {
		t.Errorf("widened %v, %d bins", h.Widened, len(h.Counts))
	}
	checkHistogram(t, s, h)
}

func TestBinErrors(t *testing.T) {
	s := []float64{1, 2, 3}
	for _, o := range []BinOptions{
		{Bins: 3, Width: 1},
		{Bins: -1},
		{Bins: 5000},
		{Width: -1},
		{Width: math.Inf(1)},
		{Width: 1e-9},
	} {
		if o.Width == 1e-9 {
			if _, err := BinValues(s, o); !errors.Is(err, ErrTooManyBins) {
				t.Errorf("BinValues(%+v) error %v, want ErrTooManyBins", o, err)
			}
		}
		if _, err := BinValues(s, o); !errors.Is(err, ErrBinOptions) {
			t.Errorf("BinValues(%+v) error %v, want ErrBinOptions", o, err)
		}
	}
	if _, err := BinValues(nil, BinOptions{}); !errors.Is(err, ErrEmpty) {
		t.Errorf("Bin(nil) error %v", err)
	}
	if _, err := BinValues([]float64{1e20, 1e20}, BinOptions{Width: 0.5}); !errors.Is(err, ErrPrecision) {
		t.Errorf("binning 1e20 at width 0.5: error %v, want ErrPrecision", err)
	}
	if _, err := BinValues([]float64{-math.MaxFloat64, math.MaxFloat64}, BinOptions{}); err == nil {
		t.Errorf("binning the whole float64 range should fail, not overflow")
	}
}
