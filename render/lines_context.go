package render

import (
	"math"

	"plumb/scale"
)

// columnRange is the band of values every pixel column of a panel holds:
// lo[c]..hi[c], NaN where no series has a value in column c.
type columnRange struct {
	lo, hi []float64
}

// envelope is the range of all the series in every pixel column of a panel
// w px wide over the axis ax: the context small multiples draw behind each
// panel's own series. Each segment between two values counts in every
// column it crosses, at its heights where it enters and leaves the column,
// so the band follows the lines as drawn; a value between two missing ones
// counts in its own column. It costs one pass over the points and the
// columns they span, and is computed once for all panels: drawing the other
// series in every panel made the output grow with the square of their
// number.
func envelope(series []Series, ax axis, w int) columnRange {
	r := columnRange{lo: make([]float64, w), hi: make([]float64, w)}
	for c := range r.lo {
		r.lo[c], r.hi[c] = math.NaN(), math.NaN()
	}
	if w < 1 || !(ax.d1 > ax.d0) {
		return r
	}
	put := func(c int, v float64) {
		if math.IsNaN(r.lo[c]) || v < r.lo[c] {
			r.lo[c] = v
		}
		if math.IsNaN(r.hi[c]) || v > r.hi[c] {
			r.hi[c] = v
		}
	}
	colW := (ax.d1 - ax.d0) / float64(w)
	for _, s := range series {
		for i, y := range s.Y {
			if math.IsNaN(y) {
				continue
			}
			c0 := scale.PixelColumn(s.X[i], ax.d0, ax.d1, w)
			put(c0, y)
			if i+1 >= len(s.Y) || math.IsNaN(s.Y[i+1]) {
				continue
			}
			x0, x1, y1 := s.X[i], s.X[i+1], s.Y[i+1]
			c1 := scale.PixelColumn(x1, ax.d0, ax.d1, w)
			// The segment's height at every column edge it crosses.
			for c := c0 + 1; c <= c1; c++ {
				edge := ax.d0 + float64(c)*colW
				v := y + (y1-y)*(edge-x0)/(x1-x0)
				put(c-1, v)
				put(c, v)
			}
		}
	}
	return r
}

// bandPieces turns the column range into closed outlines on screen, one per
// run of columns with values: along the highest values left to right, then
// back along the lowest. A band never narrower than a hairline stays
// visible where all the series agree.
func bandPieces(r columnRange, ys scale.Linear) [][]Point {
	var out [][]Point
	w := len(r.lo)
	for c := 0; c < w; {
		if math.IsNaN(r.lo[c]) {
			c++
			continue
		}
		end := c
		for end < w && !math.IsNaN(r.lo[end]) {
			end++
		}
		var top, bot []Point
		for k := c; k < end; k++ {
			x0, x1 := float64(k), float64(k+1)
			yt, yb := ys.Map(r.hi[k]), ys.Map(r.lo[k])
			if yb-yt < 0.5 {
				mid := (yt + yb) / 2
				yt, yb = mid-0.25, mid+0.25
			}
			top = append(top, Point{round2(x0), round2(yt)}, Point{round2(x1), round2(yt)})
			bot = append(bot, Point{round2(x0), round2(yb)}, Point{round2(x1), round2(yb)})
		}
		piece := top
		for k := len(bot) - 1; k >= 0; k-- {
			piece = append(piece, bot[k])
		}
		out = append(out, piece)
		c = end
	}
	return out
}
