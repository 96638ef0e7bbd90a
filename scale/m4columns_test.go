package scale

import (
	"math"
	"slices"
	"testing"
)

func TestM4Columns(t *testing.T) {
	nan := math.NaN()
	cases := []struct {
		name    string
		xs, ys  []float64
		w       int
		want    []int
		bridged int
	}{
		// Ten points over [0, 10) in 2 columns of 5: the missing values share
		// columns with values, so the line is drawn through them.
		{name: "missing inside columns are bridged", xs: m4SeqX(10), ys: []float64{1, nan, 3, nan, 2, nan, 4, nan, 0, 5},
			w: 2, want: []int{0, 2, 4, 6, 8, 9}, bridged: 4},
		// Columns of width 1: column 2 and 3 hold only missing values, a
		// whole empty column, so the line breaks at the first of them.
		{name: "a whole empty column breaks the line", xs: m4SeqX(6), ys: []float64{1, 2, nan, nan, 3, 4},
			w: 6, want: []int{0, 1, 2, 4, 5}, bridged: 0},
		// Missing values between two neighbouring columns: no empty column.
		{name: "neighbouring columns join", xs: []float64{0, 0.9, 1.2}, ys: []float64{1, nan, 2},
			w: 3, want: []int{0, 2}, bridged: 1},
		// Sparse sampling without missing values joins across empty columns.
		{name: "empty columns without missing values join", xs: []float64{0, 5}, ys: []float64{1, 2},
			w: 6, want: []int{0, 1}, bridged: 0},
		{name: "leading and trailing missing", xs: m4SeqX(5), ys: []float64{nan, 1, 2, 3, nan},
			w: 5, want: []int{0, 1, 2, 3, 4}, bridged: 0},
		{name: "isolated value between gaps", xs: m4SeqX(7), ys: []float64{1, nan, nan, 5, nan, nan, 2},
			w: 7, want: []int{0, 1, 3, 4, 6}, bridged: 0},
		{name: "all missing", xs: m4SeqX(3), ys: []float64{nan, nan, nan}, w: 3, want: []int{0}},
		{name: "w zero", xs: m4SeqX(3), ys: []float64{1, 2, 3}, w: 0, want: nil},
	}
	for _, c := range cases {
		x1 := 0.0
		if len(c.xs) > 0 {
			x1 = c.xs[len(c.xs)-1] + 1
		}
		if c.name == "neighbouring columns join" || c.name == "empty columns without missing values join" {
			x1 = float64(c.w)
		}
		got, bridged := M4Columns(nil, c.xs, c.ys, 0, x1, c.w)
		if !slices.Equal(got, c.want) || bridged != c.bridged {
			t.Errorf("%s: got %v bridged %d, want %v bridged %d", c.name, got, bridged, c.want, c.bridged)
		}
	}
}

// TestM4ColumnsAlternatingGaps is the case that defeated M4: a million
// points with every other value missing. Every column holds values, so
// the reduced line has at most four points per column and no break.
func TestM4ColumnsAlternatingGaps(t *testing.T) {
	const n, w = 1_000_000, 600
	xs, ys := make([]float64, n), make([]float64, n)
	for i := range xs {
		xs[i] = float64(i)
		ys[i] = math.Sin(float64(i) / 1000)
		if i%2 == 1 {
			ys[i] = math.NaN()
		}
	}
	got, bridged := M4Columns(nil, xs, ys, 0, n, w)
	if len(got) > 4*w {
		t.Errorf("kept %d points, want at most 4w = %d", len(got), 4*w)
	}
	for _, i := range got[:len(got)-1] {
		if math.IsNaN(ys[i]) {
			t.Fatalf("kept missing point %d: the line breaks although every column has values", i)
		}
	}
	// The last point is missing: a trailing gap marker.
	if want := n/2 - 1; bridged != want {
		t.Errorf("bridged %d missing values, want %d", bridged, want)
	}
}

func BenchmarkM4ColumnsAlternatingGaps(b *testing.B) {
	const n, w = 1_000_000, 600
	xs, ys := make([]float64, n), make([]float64, n)
	for i := range xs {
		xs[i], ys[i] = float64(i), float64(i%97)
		if i%2 == 1 {
			ys[i] = math.NaN()
		}
	}
	dst := make([]int, 0, 4*w+8)
	for b.Loop() {
		dst, _ = M4Columns(dst[:0], xs, ys, 0, n, w)
	}
}

// FuzzM4Columns: the kept indices increase, at most four values per pixel
// column are kept, and no more missing values are bridged than there are.
func FuzzM4Columns(f *testing.F) {
	f.Add([]byte{1, 0, 3, 255, 4, 9}, 3)
	f.Add([]byte{255, 255, 7}, 1)
	f.Fuzz(func(t *testing.T, data []byte, w int) {
		w = w % 64
		xs, ys := make([]float64, len(data)), make([]float64, len(data))
		missing := 0
		for i, b := range data {
			xs[i] = float64(i)
			ys[i] = float64(b)
			if b == 255 {
				ys[i] = math.NaN()
				missing++
			}
		}
		got, bridged := M4Columns(nil, xs, ys, 0, float64(len(data)), w)
		if bridged > missing {
			t.Fatalf("bridged %d of %d missing", bridged, missing)
		}
		perCol := map[int]int{}
		for i, k := range got {
			if i > 0 && k <= got[i-1] {
				t.Fatalf("indices not increasing: %v", got)
			}
			if !math.IsNaN(ys[k]) {
				perCol[PixelColumn(xs[k], 0, float64(len(data)), w)]++
			}
		}
		for c, n := range perCol {
			if n > 4 {
				t.Fatalf("column %d keeps %d values", c, n)
			}
		}
	})
}
