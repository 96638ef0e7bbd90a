package scale

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

func m4SeqX(n int) []float64 {
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = float64(i)
	}
	return xs
}

func TestM4Examples(t *testing.T) {
	nan := math.NaN()
	cases := []struct {
		name   string
		xs, ys []float64
		x0, x1 float64
		w      int
		want   []int
	}{
		// methods.md §5 Example 1 [D]: t = 0..11, w = 2 over [0,12), column ⌊2t/12⌋;
		// M4 output (0,5) (2,2) (3,9) (5,6) (6,3) (8,8) (9,1) (11,4).
		{name: "methods §5 example 1", xs: m4SeqX(12), ys: []float64{5, 7, 2, 9, 4, 6, 3, 3, 8, 1, 6, 4},
			x0: 0, x1: 12, w: 2, want: []int{0, 2, 3, 5, 6, 8, 9, 11}},
		// methods.md §5 Example 2 [D]: a column with a single tuple keeps exactly it;
		// an empty column contributes nothing. Columns of width 1 over [0,4): points
		// at x = 0 and 3 only, columns 1 and 2 empty.
		{name: "methods §5 example 2: singles and empty columns", xs: []float64{0, 3}, ys: []float64{1, 2},
			x0: 0, x1: 4, w: 4, want: []int{0, 1}},
		// methods.md §5 Example 2 [D]: n ≤ 4w tuples may pass through unchanged.
		{name: "methods §5 example 2: few points pass", xs: m4SeqX(8), ys: []float64{3, 1, 4, 1, 5, 9, 2, 6},
			x0: 0, x1: 8, w: 2, want: []int{0, 1, 2, 3, 4, 5, 6, 7}},
		// Ties keep the earliest extreme (methods.md §5, "Ties").
		{name: "ties keep earliest", xs: m4SeqX(6), ys: []float64{2, 1, 1, 3, 3, 2}, x0: 0, x1: 6, w: 1,
			want: []int{0, 1, 3, 5}},
		// First is also the minimum: no duplicate index.
		{name: "first is min", xs: m4SeqX(5), ys: []float64{0, 2, 5, 3, 4}, x0: 0, x1: 5, w: 1,
			want: []int{0, 2, 4}},
		// A gap keeps the points on both sides and one index of the NaN run.
		{name: "gap", xs: m4SeqX(10), ys: []float64{1, 5, 2, 3, nan, nan, 4, 0, 6, 2}, x0: 0, x1: 10, w: 1,
			want: []int{0, 1, 3, 4, 6, 7, 8, 9}},
		// Points outside [x0, x1] are clamped into the edge columns.
		{name: "clamped", xs: []float64{-5, -1, 0.5, 2, 9}, ys: []float64{1, 9, 3, 0, 4}, x0: 0, x1: 2, w: 2,
			want: []int{0, 1, 2, 3, 4}},
		// x1 == x0: everything in column 0.
		{name: "degenerate range", xs: m4SeqX(6), ys: []float64{2, 1, 7, 3, 0, 4}, x0: 3, x1: 3, w: 10,
			want: []int{0, 2, 4, 5}},
		{name: "w zero", xs: m4SeqX(3), ys: []float64{1, 2, 3}, x0: 0, x1: 3, w: 0, want: nil},
		{name: "empty", x0: 0, x1: 1, w: 5, want: nil},
		{name: "mismatched lengths", xs: m4SeqX(3), ys: []float64{1}, x0: 0, x1: 3, w: 3, want: []int{0}},
	}
	for _, c := range cases {
		got := M4(nil, c.xs, c.ys, c.x0, c.x1, c.w)
		if !slices.Equal(got, c.want) {
			t.Errorf("%s: M4 = %v, want %v", c.name, got, c.want)
		}
	}
}

func TestM4AppendsToDst(t *testing.T) {
	dst := make([]int, 1, 64)
	dst[0] = -7
	got := M4(dst, m4SeqX(12), []float64{5, 7, 2, 9, 4, 6, 3, 3, 8, 1, 6, 4}, 0, 12, 2)
	if !slices.Equal(got, []int{-7, 0, 2, 3, 5, 6, 8, 9, 11}) || &got[0] != &dst[0] {
		t.Errorf("M4 did not append into the caller's buffer: %v", got)
	}
}

func TestPixelColumn(t *testing.T) {
	cases := []struct {
		x, x0, x1 float64
		w, want   int
	}{
		{0, 0, 12, 2, 0},
		{5.999, 0, 12, 2, 0},
		{6, 0, 12, 2, 1},
		{12, 0, 12, 2, 1}, // the right edge belongs to the last column
		{13, 0, 12, 2, 1},
		{-1, 0, 12, 2, 0},
		{math.Inf(1), 0, 1, 4, 3},
		{math.NaN(), 0, 1, 4, 0},
		{5, 5, 5, 4, 0},
		{0.5, 0, 1, 0, 0},
	}
	for _, c := range cases {
		if got := PixelColumn(c.x, c.x0, c.x1, c.w); got != c.want {
			t.Errorf("PixelColumn(%g, %g, %g, %d) = %d, want %d", c.x, c.x0, c.x1, c.w, got, c.want)
		}
	}
}

// m4Raster draws the polyline through the given indices the way methods.md §5
// describes its simulation: x = the pixel column, y = round((h−1)(v−vmin)/
// (vmax−vmin)), one-pixel Bresenham segments between consecutive drawable
// points, a NaN breaking the line. It returns the set of lit pixels.
func m4Raster(xs, ys []float64, idx []int, x0, x1 float64, w, h int, vmin, vmax float64) map[[2]int]bool {
	lit := map[[2]int]bool{}
	havePrev := false
	var px, py int
	for _, i := range idx {
		if math.IsNaN(ys[i]) {
			havePrev = false
			continue
		}
		cx := PixelColumn(xs[i], x0, x1, w)
		cy := int(math.Round(float64(h-1) * (ys[i] - vmin) / (vmax - vmin)))
		if havePrev {
			m4Bresenham(px, py, cx, cy, lit)
		} else {
			lit[[2]int{cx, cy}] = true
		}
		px, py, havePrev = cx, cy, true
	}
	return lit
}

// m4Bresenham lights the pixels of the segment (x0,y0)-(x1,y1), all octants.
func m4Bresenham(x0, y0, x1, y1 int, lit map[[2]int]bool) {
	dx, dy := m4Abs(x1-x0), -m4Abs(y1-y0)
	sx, sy := 1, 1
	if x0 > x1 {
		sx = -1
	}
	if y0 > y1 {
		sy = -1
	}
	err := dx + dy
	for {
		lit[[2]int{x0, y0}] = true
		if x0 == x1 && y0 == y1 {
			return
		}
		e2 := 2 * err
		if e2 >= dy {
			err += dy
			x0 += sx
		}
		if e2 <= dx {
			err += dx
			y0 += sy
		}
	}
}

func m4Abs(v int) int {
	if v < 0 {
		return -v
	}
	return v
}

// TestM4RasterEquality is the property of Jugel et al. (2014) as simulated in
// methods.md §5: random walks of varied n and w rasterise identically from
// the full data and from M4's output, with at most four points per column.
func TestM4RasterEquality(t *testing.T) {
	r := rand.New(rand.NewPCG(2014, 797))
	var idx []int
	for trial := range 300 {
		n := 50 + r.IntN(2951) // methods.md §5: n = 50–3000
		w := 5 + r.IntN(76)    // w = 5–80
		h := 5 + r.IntN(56)    // h = 5–60
		xs, ys := make([]float64, n), make([]float64, n)
		v := 0.0
		x := 0.0
		for i := range n {
			v += r.NormFloat64()
			x += 0.1 + r.Float64() // irregular spacing
			xs[i], ys[i] = x, v
		}
		if trial%3 == 0 {
			// Gaps: short runs of missing values.
			for g := 0; g < 1+r.IntN(4); g++ {
				at := r.IntN(n)
				for k := at; k < min(n, at+1+r.IntN(5)); k++ {
					ys[k] = math.NaN()
				}
			}
		}
		x0, x1 := xs[0], xs[n-1]
		if trial%4 == 1 {
			// A domain padded beyond the data, as after nice ticks.
			x0, x1 = x0-5, x1+7
		}
		vmin, vmax := math.Inf(1), math.Inf(-1)
		for _, y := range ys {
			if !math.IsNaN(y) {
				vmin, vmax = min(vmin, y), max(vmax, y)
			}
		}
		idx = M4(idx[:0], xs, ys, x0, x1, w)
		all := m4SeqInts(n)
		full := m4Raster(xs, ys, all, x0, x1, w, h, vmin, vmax)
		red := m4Raster(xs, ys, idx, x0, x1, w, h, vmin, vmax)
		if !m4SameSet(full, red) {
			t.Fatalf("trial %d (n=%d w=%d h=%d): raster differs: full %d px, M4 %d px", trial, n, w, h, len(full), len(red))
		}
		perCol := map[int]int{}
		for i, k := range idx {
			if i > 0 && k <= idx[i-1] {
				t.Fatalf("trial %d: indices not increasing at %d", trial, i)
			}
			if !math.IsNaN(ys[k]) {
				perCol[PixelColumn(xs[k], x0, x1, w)]++
			}
		}
		for c, k := range perCol {
			// A gap may split a column into two runs of up to four each.
			if k > 4 && trial%3 != 0 {
				t.Fatalf("trial %d: column %d keeps %d points", trial, c, k)
			}
		}
	}
}

func m4SeqInts(n int) []int {
	s := make([]int, n)
	for i := range s {
		s[i] = i
	}
	return s
}

func m4SameSet(a, b map[[2]int]bool) bool {
	if len(a) != len(b) {
		return false
	}
	for k := range a {
		if !b[k] {
			return false
		}
	}
	return true
}

func FuzzM4(f *testing.F) {
	f.Add(12, 2, 0.0, 12.0, int64(1))
	f.Add(1, 1, 0.0, 0.0, int64(2))
	f.Add(100, 7, -3.0, 1e300, int64(3))
	f.Fuzz(func(t *testing.T, n, w int, x0, x1 float64, seed int64) {
		n = min(max(n, 0), 5000)
		w = min(w, 10000)
		r := rand.New(rand.NewPCG(uint64(seed), 1))
		xs, ys := make([]float64, n), make([]float64, n)
		for i := range n {
			xs[i] = float64(i) + r.Float64()
			ys[i] = r.NormFloat64()
			if r.IntN(20) == 0 {
				ys[i] = math.NaN()
			}
		}
		idx := M4(nil, xs, ys, x0, x1, w)
		if w < 1 && len(idx) != 0 {
			t.Fatalf("w=%d kept %d", w, len(idx))
		}
		for i, k := range idx {
			if k < 0 || k >= n || i > 0 && k <= idx[i-1] {
				t.Fatalf("bad index sequence %v", idx)
			}
		}
		if len(idx) > n {
			t.Fatalf("kept %d of %d", len(idx), n)
		}
	})
}

func BenchmarkM4(b *testing.B) {
	const n = 1_000_000
	r := rand.New(rand.NewPCG(7, 8))
	xs, ys := make([]float64, n), make([]float64, n)
	v := 0.0
	for i := range n {
		v += r.NormFloat64()
		xs[i], ys[i] = float64(i), v
	}
	dst := make([]int, 0, 4*600)
	b.ReportAllocs()
	for b.Loop() {
		dst = M4(dst[:0], xs, ys, 0, n-1, 600)
	}
	b.ReportMetric(float64(len(dst)), "kept")
}
