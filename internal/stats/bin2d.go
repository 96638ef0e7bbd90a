package stats

import (
	"cmp"
	"math"
	"slices"
)

// A Bin is one cell of a two-dimensional binning: its centre and how many
// points fell in it.
type Bin struct {
	X, Y  float64 // the cell's centre, in the points' units
	Count int
}

// HexBin counts points in a lattice of regular hexagons with circumradius
// r (pointy side up, rows 1.5·r apart, every other row shifted by half a
// hexagon), the binning of Carr et al. (1987, "Scatterplot matrix
// techniques for large N", JASA 82: 424-436): hexagons tile the plane
// with the cells closest to circles, so a cell's count depends less on the
// direction in which points spread than a square's. A point belongs to the
// nearest hexagon centre; the hexagon lattice is the union of two
// rectangular lattices of centres, so the nearest centre is the nearer of
// each lattice's nearest. Points with a value that is not finite are
// skipped. Bins come in row order, then column order: deterministic.
func HexBin(x, y []float64, r float64) []Bin {
	if !(r > 0) || math.IsInf(r, 0) {
		return nil
	}
	dx, dy := math.Sqrt(3)*r, 1.5*r
	type key struct{ row, col int }
	counts := map[key]int{}
	for i := range min(len(x), len(y)) {
		px, py := x[i], y[i]
		if !finite(px) || !finite(py) {
			continue
		}
		// Even rows: centres at (col·dx, row·dy); odd rows shifted by dx/2.
		ra := 2 * int(math.Round(py/(2*dy)))
		ca := int(math.Round(px / dx))
		rb := 2*int(math.Floor(py/(2*dy))) + 1
		cb := int(math.Floor(px / dx))
		ax, ay := float64(ca)*dx, float64(ra)*dy
		bx, by := (float64(cb)+0.5)*dx, float64(rb)*dy
		if sq(px-ax)+sq(py-ay) <= sq(px-bx)+sq(py-by) {
			counts[key{ra, ca}]++
		} else {
			counts[key{rb, cb}]++
		}
	}
	keys := make([]key, 0, len(counts))
	for k := range counts {
		keys = append(keys, k)
	}
	slices.SortFunc(keys, func(a, b key) int {
		return cmp.Or(cmp.Compare(a.row, b.row), cmp.Compare(a.col, b.col))
	})
	out := make([]Bin, len(keys))
	for i, k := range keys {
		cx := float64(k.col) * dx
		if k.row%2 != 0 {
			cx += dx / 2
		}
		out[i] = Bin{X: cx, Y: float64(k.row) * dy, Count: counts[k]}
	}
	return out
}

// HexCorners are the six corners of the hexagon of circumradius r centred
// at (cx, cy) that HexBin uses, pointy side up, clockwise from the top in
// a y-down frame.
func HexCorners(cx, cy, r float64) [6][2]float64 {
	var c [6][2]float64
	for i := range c {
		a := math.Pi/2 + float64(i)*math.Pi/3
		c[i] = [2]float64{cx + r*math.Cos(a), cy - r*math.Sin(a)}
	}
	return c
}

// SquareBin counts points in squares of side size with corners on
// multiples of size; a bin's X and Y are its square's centre. Points with
// a value that is not finite are skipped. Bins come in row order, then
// column order.
func SquareBin(x, y []float64, size float64) []Bin {
	if !(size > 0) || math.IsInf(size, 0) {
		return nil
	}
	type key struct{ row, col int }
	counts := map[key]int{}
	for i := range min(len(x), len(y)) {
		if !finite(x[i]) || !finite(y[i]) {
			continue
		}
		counts[key{int(math.Floor(y[i] / size)), int(math.Floor(x[i] / size))}]++
	}
	keys := make([]key, 0, len(counts))
	for k := range counts {
		keys = append(keys, k)
	}
	slices.SortFunc(keys, func(a, b key) int {
		return cmp.Or(cmp.Compare(a.row, b.row), cmp.Compare(a.col, b.col))
	})
	out := make([]Bin, len(keys))
	for i, k := range keys {
		out[i] = Bin{X: (float64(k.col) + 0.5) * size, Y: (float64(k.row) + 0.5) * size, Count: counts[k]}
	}
	return out
}

func sq(v float64) float64 { return v * v }
