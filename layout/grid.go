package layout

import "math"

// A Grid places panels of one size in rows and columns inside a box, row by
// row from the top left, with gutters between them. Small multiples, the
// panels of a difference chart and figure grids are all Grids.
type Grid struct {
	Cols, Rows int
	Cells      []Box // one per panel, in reading order
}

// GridSpec says what a grid must fit. Its zero value is not useful: N and
// Box.W must be positive.
type GridSpec struct {
	N       int     // number of panels
	Box     Box     // the space for the whole grid; H <= 0 means the grid may grow downwards
	Aspect  float64 // preferred panel height / width; 0 means 0.75
	GutterX float64 // space between columns
	GutterY float64 // space between rows
	MinW    float64 // narrowest readable panel; 0 means no limit
	// MaxRatio bounds the whole grid's height / width when Box.H <= 0, so
	// that many panels add columns instead of an ever taller page; 0
	// means 1.5.
	MaxRatio float64
	Cols     int // a fixed column count; 0 chooses one
}

// LayoutGrid chooses the column count and places the cells.
//
// On a fixed box it takes the column count whose panels, kept at the
// preferred aspect, come out largest (the panel that fits both the cell's
// width and its height). On a box that may grow downwards it takes the
// fewest columns that keep the grid within MaxRatio, so that panels stay as
// wide as possible until the page would become a strip, and never makes a
// panel narrower than MinW if fewer columns avoid it.
func LayoutGrid(s GridSpec) Grid {
	if s.N <= 0 || !(s.Box.W > 0) {
		return Grid{}
	}
	if s.Aspect <= 0 {
		s.Aspect = 0.75
	}
	if s.MaxRatio <= 0 {
		s.MaxRatio = 1.5
	}
	cols := s.Cols
	if cols <= 0 {
		cols = chooseCols(s)
	}
	cols = min(cols, s.N)
	rows := (s.N + cols - 1) / cols
	cw := (s.Box.W - float64(cols-1)*s.GutterX) / float64(cols)
	var ch float64
	if s.Box.H > 0 {
		ch = (s.Box.H - float64(rows-1)*s.GutterY) / float64(rows)
	} else {
		ch = cw * s.Aspect
	}
	g := Grid{Cols: cols, Rows: rows, Cells: make([]Box, s.N)}
	for i := range g.Cells {
		r, c := i/cols, i%cols
		g.Cells[i] = Box{
			X: s.Box.X + float64(c)*(cw+s.GutterX),
			Y: s.Box.Y + float64(r)*(ch+s.GutterY),
			W: cw, H: ch,
		}
	}
	return g
}

func chooseCols(s GridSpec) int {
	cellW := func(c int) float64 { return (s.Box.W - float64(c-1)*s.GutterX) / float64(c) }
	if s.Box.H > 0 {
		best, bestW := 1, -1.0
		for c := 1; c <= s.N; c++ {
			r := (s.N + c - 1) / c
			cw := cellW(c)
			ch := (s.Box.H - float64(r-1)*s.GutterY) / float64(r)
			pw := math.Min(cw, ch/s.Aspect) // the largest panel of the preferred shape
			if pw > bestW+1e-9 {
				best, bestW = c, pw
			}
		}
		return best
	}
	last := 1
	for c := 1; c <= s.N; c++ {
		cw := cellW(c)
		if s.MinW > 0 && cw < s.MinW {
			break
		}
		last = c
		r := (s.N + c - 1) / c
		h := float64(r)*cw*s.Aspect + float64(r-1)*s.GutterY
		if h <= s.MaxRatio*s.Box.W {
			return c
		}
	}
	return last
}
