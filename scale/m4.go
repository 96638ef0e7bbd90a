package scale

import "math"

// PixelColumn maps x to the pixel column M4 groups it in:
// floor(w·(x−x0)/(x1−x0)), clamped to [0, w−1]. A renderer that draws M4's
// output must place vertices with this same mapping (and the same w, x0 and
// x1), or the reduced line is no longer guaranteed to rasterise like the full
// one. A degenerate range (x1 == x0, or a non-finite result) maps to column 0.
func PixelColumn(x, x0, x1 float64, w int) int {
	if x1 == x0 {
		return 0
	}
	c := math.Floor(float64(w) * (x - x0) / (x1 - x0))
	switch {
	case c >= float64(w-1):
		return max(w-1, 0)
	case c > 0:
		return int(c)
	}
	// c <= 0, or NaN from a degenerate range.
	return 0
}

// M4 appends to dst the indices of the points of the polyline (xs[i], ys[i])
// that must be kept so that the line drawn w pixels wide over [x0, x1]
// rasterises exactly as the full line does (Jugel, Jerzak, Hackenbroich &
// Markl 2014, "M4: A Visualization-Oriented Time Series Data Aggregation",
// PVLDB 7(10)): for every run of consecutive points in one pixel column (see
// PixelColumn) it keeps the first, the last, one point of minimum y and one of
// maximum y (the earliest on ties), without duplicates, so at most four
// indices per column for x-sorted input and at most 4w in all.
//
// The indices come out in input order, so drawing the kept points in order
// draws the reduced polyline. The guarantee holds for binary rasterisation of
// a one-pixel line with vertices snapped to pixels and a monotone y mapping;
// anti-aliased output is only approximately identical (methods.md §5).
//
// A point with a non-finite x or y is a gap in the line. M4 keeps the points
// on both sides of every gap and, so that a renderer walking the kept points
// sees the break, the index of the first point of each run of gap points.
// Input is expected sorted by x; unsorted input is still reduced correctly
// (a column revisited later starts a new group) but is less compressed.
// Extra elements of the longer of xs and ys are ignored. w < 1 yields
// nothing.
func M4(dst []int, xs, ys []float64, x0, x1 float64, w int) []int {
	n := min(len(xs), len(ys))
	if w < 1 || n == 0 {
		return dst
	}
	var g m4Group
	open := false // g holds a group
	inGap := false
	for i := 0; i < n; i++ {
		x, y := xs[i], ys[i]
		if !m4Drawable(x) || !m4Drawable(y) {
			if open {
				dst = g.flush(dst)
				open = false
			}
			if !inGap {
				dst = append(dst, i)
				inGap = true
			}
			continue
		}
		inGap = false
		c := PixelColumn(x, x0, x1, w)
		if open && c == g.col {
			g.add(i, y, ys)
			continue
		}
		if open {
			dst = g.flush(dst)
		}
		g = m4Group{col: c, first: i, last: i, min: i, max: i}
		open = true
	}
	if open {
		dst = g.flush(dst)
	}
	return dst
}

// m4Group is the running state of one run of points in one column.
type m4Group struct {
	col                   int
	first, last, min, max int
}

// add folds point i, of value y, into the group.
func (g *m4Group) add(i int, y float64, ys []float64) {
	g.last = i
	if y < ys[g.min] {
		g.min = i
	}
	if y > ys[g.max] {
		g.max = i
	}
}

// flush appends the group's distinct indices in increasing order. first is
// the smallest and last the largest by construction, so only min and max
// need ordering.
func (g *m4Group) flush(dst []int) []int {
	dst = append(dst, g.first)
	a, b := g.min, g.max
	if a > b {
		a, b = b, a
	}
	if a != g.first && a != g.last {
		dst = append(dst, a)
	}
	if b != a && b != g.first && b != g.last {
		dst = append(dst, b)
	}
	if g.last != g.first {
		dst = append(dst, g.last)
	}
	return dst
}

func m4Drawable(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// M4Columns is M4 for a line with missing values drawn w pixels wide over
// [x0, x1]: it reduces per pixel column first, so that missing values no
// longer defeat the reduction. A column that holds at least one value keeps
// the first, last, lowest and highest of its values, exactly as M4 does,
// and the missing values inside it do not break the line: at this width
// they share a pixel column with drawn values and a break there could not
// be seen. The line breaks only where missing values leave at least one
// whole pixel column without a value between two columns that have one;
// M4Columns then appends the index of the first missing point there, so
// that a renderer walking the kept points sees the break. Missing values
// before the first or after the last value are gaps too. Points must be
// sorted by x. bridged counts the missing values the line was drawn
// through (inside or between neighbouring drawn columns), for a note.
func M4Columns(dst []int, xs, ys []float64, x0, x1 float64, w int) (kept []int, bridged int) {
	n := min(len(xs), len(ys))
	if w < 1 || n == 0 {
		return dst, 0
	}
	var g m4Group
	open := false
	gapAt, gapCount := -1, 0 // first missing point since the open group's last value, and how many
	for i := 0; i < n; i++ {
		x, y := xs[i], ys[i]
		if !m4Drawable(x) || !m4Drawable(y) {
			if gapAt < 0 {
				gapAt = i
			}
			gapCount++
			continue
		}
		c := PixelColumn(x, x0, x1, w)
		if open && c == g.col {
			bridged += gapCount
			gapAt, gapCount = -1, 0
			g.add(i, y, ys)
			continue
		}
		if open {
			dst = g.flush(dst)
			if gapCount > 0 && c-g.col >= 2 {
				dst = append(dst, gapAt)
			} else {
				bridged += gapCount
			}
		} else if gapAt >= 0 {
			dst = append(dst, gapAt) // missing values before the first value
		}
		gapAt, gapCount = -1, 0
		g = m4Group{col: c, first: i, last: i, min: i, max: i}
		open = true
	}
	if open {
		dst = g.flush(dst)
	}
	if gapAt >= 0 {
		dst = append(dst, gapAt)
	}
	return dst, bridged
}
