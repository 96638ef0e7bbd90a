package render

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strconv"
	"time"

	"plumb/scale"
)

// Series is one line of a line chart: Y over X, in X order. A NaN in Y is a
// missing value: the line breaks there and is never joined across. Make a
// series over time with TimeSeries.
type Series struct {
	Name  string
	X, Y  []float64
	times bool // X holds instants as Unix seconds: made by TimeSeries
	// Set by summarising repeated measurements (LinesOptions.Agg): the
	// band of the spread at each x (nil for none) and the count of values.
	lo, hi []float64
	n      []int
}

// xKindOf says what x values are: instants, or whole numbers (no tick
// falls between two of them), which when they all lie from 1800 to 2100
// look like calendar years and are printed as years (2018, never 2,018).
func xKindOf(xs [][]float64, isTime bool) xKind {
	if isTime {
		return xKind{time: true, grain: grainOf(xs)}
	}
	k := xKind{integer: wholeNumbers(xs...), years: true}
	for _, v := range xs {
		for _, x := range v {
			if x < 1800 || x > 2100 {
				k.years = false
			}
		}
	}
	k.years = k.years && k.integer
	return k
}

// wholeNumbers reports whether every non-missing value is a whole number.
func wholeNumbers(vs ...[]float64) bool {
	for _, v := range vs {
		for _, y := range v {
			if !math.IsNaN(y) && y != math.Trunc(y) {
				return false
			}
		}
	}
	return true
}

// cleanSeries validates the series, sorts any out of x order (with a note)
// and refuses duplicate x values, which a line cannot draw.
func cleanSeries(in []Series) ([]Series, []Note, error) {
	if len(in) == 0 {
		return nil, nil, fmt.Errorf("no series to draw")
	}
	var notes []Note
	out := make([]Series, 0, len(in))
	for i, s := range in {
		if s.Name == "" {
			s.Name = fmt.Sprintf("series %d", i+1)
		}
		if len(s.X) != len(s.Y) {
			return nil, nil, fmt.Errorf("series %q has %d x values but %d y values: give one x per y", s.Name, len(s.X), len(s.Y))
		}
		if len(s.X) == 0 {
			return nil, nil, fmt.Errorf("series %q has no points", s.Name)
		}
		for j := range s.X {
			if math.IsNaN(s.X[j]) || math.IsInf(s.X[j], 0) {
				return nil, nil, fmt.Errorf("series %q: x value %d is %v: give finite x values", s.Name, j+1, s.X[j])
			}
			if math.IsInf(s.Y[j], 0) {
				return nil, nil, fmt.Errorf("series %q: y value %d is infinite: give finite values, or NaN for a missing one", s.Name, j+1)
			}
		}
		if !slices.IsSorted(s.X) {
			idx := make([]int, len(s.X))
			for j := range idx {
				idx[j] = j
			}
			slices.SortStableFunc(idx, func(a, b int) int { return cmp.Compare(s.X[a], s.X[b]) })
			x, y := make([]float64, len(idx)), make([]float64, len(idx))
			for j, k := range idx {
				x[j], y[j] = s.X[k], s.Y[k]
			}
			s.X, s.Y = x, y
			notes = append(notes, Note{Code: "sorted", Text: fmt.Sprintf("sorted series %q by x: a line joins its points in x order", s.Name)})
		}
		for j := 1; j < len(s.X); j++ {
			if s.X[j] == s.X[j-1] {
				return nil, nil, fmt.Errorf("series %q has two points at x = %g: %w", s.Name, s.X[j], errRepeatedX)
			}
		}
		if !slices.ContainsFunc(s.Y, func(v float64) bool { return !math.IsNaN(v) }) {
			notes = append(notes, Note{Code: "series-dropped", Changed: true, Text: fmt.Sprintf("left out series %q: every value is missing", s.Name)})
			continue
		}
		out = append(out, s)
	}
	if len(out) == 0 {
		return nil, nil, fmt.Errorf("no values to draw: every value is missing")
	}
	return out, notes, nil
}

// countMissing is the number of missing values over all series.
func countMissing(series []Series) int {
	n := 0
	for _, s := range series {
		for _, y := range s.Y {
			if math.IsNaN(y) {
				n++
			}
		}
	}
	return n
}

// missingNote says what the missing values did to the drawn lines: the
// pieces they break them into, the values between two gaps that are drawn
// as dots, and, when the line was reduced to pixel columns, how many fell
// inside columns that also hold values and were drawn through.
func missingNote(missing, bridged int, drawn []drawnLine) string {
	if missing == 0 {
		return ""
	}
	g := scale.Format{Group: true}
	if bridged >= missing {
		return fmt.Sprintf("%s missing %s fall inside pixel columns that also hold values, so at this width the line is drawn through them (a gap is drawn only where a whole pixel column has no value)",
			g.Format(float64(missing)), plural(missing, "value", "values"))
	}
	pieces, dots := 0, 0
	for _, d := range drawn {
		pieces += len(d.pieces)
		for _, p := range d.pieces {
			if len(p) == 1 {
				dots++
			}
		}
	}
	gaps := missing - bridged
	text := fmt.Sprintf("%s missing %s: drawn in %s %s, never joined across a gap", g.Format(float64(gaps)), plural(gaps, "value leaves a gap", "values leave gaps"),
		g.Format(float64(pieces)), plural(pieces, "piece", "pieces"))
	if dots > 0 {
		text += fmt.Sprintf("; %s %s between two gaps drawn as %s as wide as the line", g.Format(float64(dots)), plural(dots, "value", "values"), plural(dots, "a dot", "dots"))
	}
	if bridged > 0 {
		text += fmt.Sprintf("; %s more missing %s fall inside pixel columns that also hold values and are drawn through (a gap is drawn only where a whole pixel column has no value)",
			g.Format(float64(bridged)), plural(bridged, "value", "values"))
	}
	return text
}

// yearsNote says that whole-number x values were read as years.
const yearsNote = "read the x values, whole numbers from 1800 to 2100, as years: ticks fall on whole years and print without a thousands separator"

// noteMissing records what the missing values did to the drawn lines.
func (f *frame) noteMissing(missing, bridged int, drawn []drawnLine) {
	if n := missingNote(missing, bridged, drawn); n != "" {
		f.scene.Note("missing", true, n)
	}
}

// xValueText writes an x value for a note or a description: a date on a
// time axis, a year as a year (2018, never 2,018), else a number.
func xValueText(x float64, k xKind) string {
	if k.years {
		return strconv.FormatFloat(x, 'f', 0, 64)
	}
	if !k.time {
		return scale.ValueFormat([]float64{x}, "").Format(x)
	}
	t := unixTime(x)
	g := k.grain
	if g == 0 {
		g = grainOf([][]float64{{x}})
	}
	switch g {
	case grainMinute:
		return t.Format("2 Jan 2006 15:04")
	case grainDay:
		return t.Format("2 Jan 2006")
	case grainMonth:
		return t.Format("Jan 2006")
	}
	return t.Format("2006")
}

// dateGrain is the finest calendar unit a set of instants uses.
type dateGrain int

const (
	grainYear   dateGrain = iota + 1 // every instant is 1 January, midnight
	grainMonth                       // first days of months
	grainDay                         // midnights
	grainMinute                      // times of day
)

// grainOf is the finest calendar unit the instants (Unix seconds, UTC)
// use: a series of first days of months is monthly even where it passes
// through January, so that its first value is "Jan 2024", not "2024".
func grainOf(xs [][]float64) dateGrain {
	g := grainYear
	for _, v := range xs {
		for _, x := range v {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				continue
			}
			t := unixTime(x)
			switch {
			case t.Hour() != 0 || t.Minute() != 0 || t.Second() != 0:
				return grainMinute
			case t.Day() != 1:
				g = max(g, grainDay)
			case t.Month() != time.January:
				g = max(g, grainMonth)
			}
		}
	}
	return g
}

// addSeries draws one series: its pieces of two or more points as one
// path, and every piece of a single point (a value between two missing
// ones, which a path would not show) as a dot as wide as the line, with
// the value it stands for.
func (f *frame) addSeries(class, name string, p scale.Polyline, d drawnLine, color Colour, width float64, isTime bool) {
	width = round2(width)
	var lines [][]Point
	var dots []Mark
	for k, piece := range d.pieces {
		if len(piece) > 1 {
			lines = append(lines, piece)
			continue
		}
		j := d.first[k]
		dots = append(dots, Mark{Kind: Circle, Class: class, X: piece[0].X, Y: piece[0].Y, R: width / 2, Fill: color,
			Attrs: []Attr{{"series", name}, {"x", xData(p.X[j], isTime)}, {"value", dataNumber(p.Y[j])}}})
	}
	if len(lines) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: class, Lines: lines, Stroke: color, StrokeWidth: width, Join: JoinRound, Cap: CapRound, Attrs: []Attr{{"series", name}}})
	}
	f.scene.Add(dots...)
}

// xData is an x value for a data attribute: the number, or the instant in
// RFC 3339.
func xData(x float64, isTime bool) string {
	if isTime {
		return unixTime(x).Format(time.RFC3339)
	}
	return dataNumber(x)
}

// shouldReduce applies M4 when a series holds more than four points per
// pixel column (Jugel et al. 2014): beyond that its drawn line cannot show
// more, and the file only grows. M4 works per polyline, so the count is
// per series, not per panel.
func shouldReduce(series []Series, w int) bool {
	for _, s := range series {
		if len(s.X) > 4*w {
			return true
		}
	}
	return false
}

func reduceNote(before, after int) string {
	return fmt.Sprintf("reduced %s points to %s that draw the same line (M4: first, last, lowest and highest point per pixel column; Jugel et al. 2014)",
		scale.Format{Group: true}.Format(float64(before)), scale.Format{Group: true}.Format(float64(after)))
}

// shownValues are the values a description prints (each series' first,
// last, highest and lowest, and its change), so that their format is
// chosen from them alone: formatting a million values to print eight
// cost more than the rest of a render.
func shownValues(series []Series) []float64 {
	var out []float64
	for _, s := range series {
		first, last, lo, hi := extremes(s.Y)
		if first < 0 {
			continue
		}
		out = append(out, s.Y[first], s.Y[last], s.Y[lo], s.Y[hi], s.Y[last]-s.Y[first])
	}
	return out
}

// extremes returns the indices of the first, last, lowest and highest
// non-missing values, or -1s when all are missing.
func extremes(y []float64) (first, last, lo, hi int) {
	first, last, lo, hi = -1, -1, -1, -1
	for i, v := range y {
		if math.IsNaN(v) {
			continue
		}
		if first < 0 {
			first = i
		}
		last = i
		if lo < 0 || v < y[lo] {
			lo = i
		}
		if hi < 0 || v > y[hi] {
			hi = i
		}
	}
	return first, last, lo, hi
}

// describeSeries says one series' first and last values, its change, and
// its extremes.
func describeSeries(s Series, vf scale.Format, k xKind) string {
	first, last, lo, hi := extremes(s.Y)
	if first < 0 {
		return fmt.Sprintf("%s: no values.", s.Name)
	}
	d := s.Y[last] - s.Y[first]
	change := "no change"
	// A change of a percentage is said in percentage points: "up 3.6%"
	// would read as a relative change, which for 84% to 87.6% is 4%.
	points := vf.Unit == "%"
	df := vf
	if points {
		df.Unit = ""
	}
	switch {
	case d > 0:
		change = "up " + df.Format(d)
	case d < 0:
		change = "down " + df.Format(-d)
	}
	if points && d != 0 {
		if df.Format(math.Abs(d)) == "1" {
			change += " percentage point"
		} else {
			change += " percentage points"
		}
	}
	if !points && d != 0 && s.Y[first] != 0 {
		pct := 100 * d / math.Abs(s.Y[first])
		if math.IsInf(pct, 0) { // 100 * d overflowed, or the ratio did
			pct = 100 * (d / math.Abs(s.Y[first]))
		}
		if !math.IsInf(pct, 0) {
			change += fmt.Sprintf(" (%+.0f%%)", pct)
		}
	}
	return fmt.Sprintf("%s: %s at %s, %s at %s, %s; highest %s at %s, lowest %s at %s.", s.Name,
		vf.Format(s.Y[first]), xValueText(s.X[first], k), vf.Format(s.Y[last]), xValueText(s.X[last], k), change,
		vf.Format(s.Y[hi]), xValueText(s.X[hi], k), vf.Format(s.Y[lo]), xValueText(s.X[lo], k))
}

// overText says what the x axis is for a description: the x column's
// name, "over time" for instants, or "in x order" when nothing names it;
// never a bare "over x".
func overText(name string, isTime bool) string {
	switch {
	case name != "":
		return "over " + name
	case isTime:
		return "over time"
	}
	return "in x order"
}

// strokeWidth is the width of a data line: 2 px beside 13 px text on
// screen, growing with the medium's text so that a slide's lines are not
// hairlines, and never under 1.5 px (common practice).
func strokeWidth(sp mediumSpec) float64 { return math.Max(1.5, 2*sp.text/13) }

// lineGeom maps data to the screen of one panel, with M4 reduction when a
// panel has more than four points per pixel column.
type lineGeom struct {
	left   float64 // the plot's left edge, a whole pixel so columns line up
	w      int     // plot width in whole pixels
	ax     axis
	reduce bool
}

// keep returns the indices of the points of (x, y) to draw: all of them, or
// the per-column M4 selection (Jugel et al. 2014) over the panel's pixel
// columns, which also reports how many missing values it drew through.
func (g lineGeom) keep(x, y []float64) ([]int, int) {
	if !g.reduce {
		idx := make([]int, len(x))
		for i := range idx {
			idx[i] = i
		}
		return idx, 0
	}
	return scale.M4Columns(make([]int, 0, 4*g.w+8), x, y, g.ax.d0, g.ax.d1, g.w)
}

// polyline is the kept points in data units, NaN where the line breaks, for
// banking and drawing alike, and the count of missing values drawn through.
func (g lineGeom) polyline(x, y []float64) (scale.Polyline, int) {
	idx, bridged := g.keep(x, y)
	p := scale.Polyline{X: make([]float64, len(idx)), Y: make([]float64, len(idx))}
	for i, j := range idx {
		p.X[i], p.Y[i] = x[j], y[j]
	}
	return p, bridged
}

// drawnLine is a polyline on screen: its pieces between gaps, and for each
// piece the index in the polyline of its first point, so that a piece of
// one point (a value between two missing ones) can be drawn as a dot that
// carries its data.
type drawnLine struct {
	pieces [][]Point
	first  []int
}

// last is the line's rightmost drawn point.
func (d drawnLine) last() (Point, bool) {
	if len(d.pieces) == 0 {
		return Point{}, false
	}
	p := d.pieces[len(d.pieces)-1]
	return p[len(p)-1], true
}

// screen maps a polyline to pixel polylines, broken at missing values. When
// reduced, every vertex stays inside the pixel column M4 grouped it in (the
// linear position moved by under 0.01 px at most), so that rounding to two
// decimals never carries a vertex into the next column.
func (g lineGeom) screen(p scale.Polyline, ys scale.Linear) drawnLine {
	xs := scale.Linear{D0: g.ax.d0, D1: g.ax.d1, R0: g.left, R1: g.left + float64(g.w)}
	var out drawnLine
	var cur []Point
	for i := range p.X {
		if math.IsNaN(p.Y[i]) || math.IsNaN(p.X[i]) {
			if len(cur) > 0 {
				out.pieces = append(out.pieces, cur)
				cur = nil
			}
			continue
		}
		x := xs.Map(p.X[i])
		if g.reduce {
			c := float64(scale.PixelColumn(p.X[i], g.ax.d0, g.ax.d1, g.w))
			x = math.Min(math.Max(x, g.left+c), g.left+c+0.99)
		}
		if len(cur) == 0 {
			out.first = append(out.first, i)
		}
		cur = append(cur, Point{round2(x), round2(ys.Map(p.Y[i]))})
	}
	if len(cur) > 0 {
		out.pieces = append(out.pieces, cur)
	}
	return out
}

// dataRange returns the smallest and largest finite values of vs, and
// false when there are none.
func dataRange(vs ...[]float64) (lo, hi float64, ok bool) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		for _, x := range v {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				continue
			}
			lo, hi = math.Min(lo, x), math.Max(hi, x)
		}
	}
	return lo, hi, lo <= hi
}

// unixTime turns seconds since 1970 UTC into a time.
func unixTime(s float64) time.Time {
	sec := math.Floor(s)
	return time.Unix(int64(sec), int64(math.Round((s-sec)*1e9))).UTC()
}

// forLayers adds to what a panel of series placed what the annotation
// layers read: every finite value on its value axis (for a line at their
// mean or median), the value axis's way of writing a value, and whether x
// holds instants.
func forLayers(p placed, ay axis, isTime bool, ys ...[]float64) placed {
	for _, y := range ys {
		for _, v := range y {
			if !math.IsNaN(v) && !math.IsInf(v, 0) {
				p.values = append(p.values, v)
			}
		}
	}
	if ay.label != nil {
		p.valueText = func(v float64) string {
			if l := ay.label([]float64{v}); len(l) == 1 {
				return l[0]
			}
			return dataNumber(v)
		}
	}
	p.xTime = isTime
	return p
}
