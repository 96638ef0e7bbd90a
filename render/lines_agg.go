package render

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"time"

	"plumb/internal/stats"
	"plumb/scale"
)

// The summaries a line chart draws over repeated measurements (Agg), and
// the spreads it draws around them (Spread).
const (
	AggMean   = "mean"
	AggMedian = "median"

	SpreadRange = "range" // lowest to highest value at each x
	SpreadIQR   = "iqr"   // first to third quartile (type 7)
	SpreadSD    = "sd"    // mean ± one sample standard deviation
	SpreadNone  = "none"  // no band
)

// bandOpacity is the alpha of a spread band over white: light enough that
// the line drawn over it keeps its contrast, and translucent so that two
// bands show through each other where they overlap (common practice).
const bandOpacity = 0.22

// errRepeatedX marks a series with two points at one x, so that the line
// chart can name its summary options as the alternative.
var errRepeatedX = errors.New("a line needs one value per x; combine them first")

// aggSpread checks Agg and Spread and returns the spread to draw: by
// default the interquartile range around a median (the spread that goes
// with it) and none around a mean.
func (o LinesOptions) aggSpread() (string, error) {
	switch o.Agg {
	case "", AggMean, AggMedian:
	default:
		return "", &OptionError{Option: "Agg", Value: strconv.Quote(o.Agg), Err: errors.New("use mean or median")}
	}
	switch o.Spread {
	case "":
		if o.Agg == AggMedian {
			return SpreadIQR, nil
		}
		return SpreadNone, nil
	case SpreadRange, SpreadIQR, SpreadSD, SpreadNone:
	default:
		return "", &OptionError{Option: "Spread", Value: strconv.Quote(o.Spread), Err: errors.New("use range, iqr, sd or none")}
	}
	if o.Agg == "" && o.Spread != SpreadNone {
		return "", &OptionError{Option: "Spread", Value: strconv.Quote(o.Spread), Err: fmt.Errorf("a spread is drawn around a summary line: give %s mean or median too", o.name("Agg"))}
	}
	return o.Spread, nil
}

// meanSD is the mean and the sample standard deviation (n-1 in the
// denominator; NaN for one value), from the deviations about the mean,
// scaled by the largest of them so that no square overflows, so that
// large values of small spread keep their digits.
func meanSD(v []float64) (mean, sd float64) {
	for _, x := range v {
		mean += x
	}
	mean /= float64(len(v))
	if math.IsInf(mean, 0) { // the sum overflowed
		mean = 0
		for _, x := range v {
			mean += x / float64(len(v))
		}
	}
	if len(v) < 2 {
		return mean, math.NaN()
	}
	big := 0.0
	for _, x := range v {
		big = math.Max(big, math.Abs(x/2-mean/2))
	}
	if big == 0 {
		return mean, 0
	}
	ss := 0.0
	for _, x := range v {
		d := (x/2 - mean/2) / big
		ss += d * d
	}
	return mean, 2 * big * math.Sqrt(ss/float64(len(v)-1))
}

// summary is what summarising did, for the notes: the fewest and most
// values at one x, and the x values that hold a single value.
type summary struct {
	agg, spread string
	nlo, nhi    int
	single      []float64 // x values with n = 1, in order, each once
	left        int       // missing values beside values at their x, left out
}

// summarise turns every series into its summary line: one point per
// distinct x, at the mean or median of the values there (missing ones left
// out), carrying the band of the spread and the count n of each x. An x
// whose values are all missing is a missing point of the summary.
func summarise(in []Series, agg, spread string) ([]Series, summary, error) {
	sum := summary{agg: agg, spread: spread, nlo: math.MaxInt}
	out := make([]Series, len(in))
	single := map[float64]bool{}
	var vals []float64
	for i, s := range in {
		if s.Name == "" {
			s.Name = fmt.Sprintf("series %d", i+1)
		}
		if len(s.X) != len(s.Y) {
			return nil, sum, fmt.Errorf("series %q has %d x values but %d y values: give one x per y", s.Name, len(s.X), len(s.Y))
		}
		for j, x := range s.X {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return nil, sum, fmt.Errorf("series %q: x value %d is %v: give finite x values", s.Name, j+1, x)
			}
			if math.IsInf(s.Y[j], 0) {
				return nil, sum, fmt.Errorf("series %q: y value %d is infinite: give finite values, or NaN for a missing one", s.Name, j+1)
			}
		}
		idx := make([]int, len(s.X))
		for j := range idx {
			idx[j] = j
		}
		slices.SortStableFunc(idx, func(a, b int) int { return cmp.Compare(s.X[a], s.X[b]) })
		o := Series{Name: s.Name, times: s.times}
		for a := 0; a < len(idx); {
			b := a
			vals = vals[:0]
			for b < len(idx) && s.X[idx[b]] == s.X[idx[a]] {
				if y := s.Y[idx[b]]; !math.IsNaN(y) {
					vals = append(vals, y)
				}
				b++
			}
			x := s.X[idx[a]]
			if len(vals) > 0 {
				sum.left += b - a - len(vals)
			}
			centre, lo, hi := summariseAt(vals, agg, spread)
			if math.IsInf(lo, 0) || math.IsInf(hi, 0) {
				return nil, sum, fmt.Errorf("series %q: the band of the %s at x = %g reaches beyond the largest number (%.1e): divide the values by a power of ten first, or draw another spread", s.Name, spread, x, math.MaxFloat64)
			}
			o.X, o.Y = append(o.X, x), append(o.Y, centre)
			o.lo, o.hi, o.n = append(o.lo, lo), append(o.hi, hi), append(o.n, len(vals))
			if n := len(vals); n > 0 {
				sum.nlo, sum.nhi = min(sum.nlo, n), max(sum.nhi, n)
				if n == 1 && !single[x] {
					single[x] = true
					sum.single = append(sum.single, x)
				}
			}
			a = b
		}
		if spread == SpreadNone {
			o.lo, o.hi = nil, nil
		}
		out[i] = o
	}
	if sum.nlo == math.MaxInt {
		sum.nlo = 0
	}
	slices.Sort(sum.single)
	return out, sum, nil
}

// summariseAt is the centre and the band of the values at one x; all NaN
// when there are none, and a band of no width around a single value
// (except a standard deviation, which one value does not have).
func summariseAt(vals []float64, agg, spread string) (centre, lo, hi float64) {
	nan := math.NaN()
	if len(vals) == 0 {
		return nan, nan, nan
	}
	slices.Sort(vals)
	mean, sd := meanSD(vals)
	centre = mean
	if agg == AggMedian {
		centre = stats.Quantile(vals, 0.5)
	}
	switch spread {
	case SpreadRange:
		return centre, vals[0], vals[len(vals)-1]
	case SpreadIQR:
		return centre, stats.Quantile(vals, 0.25), stats.Quantile(vals, 0.75)
	case SpreadSD:
		// mean ± sd around the mean, whatever the centre: the standard
		// deviation measures spread about the mean.
		return centre, mean - sd, mean + sd
	}
	return centre, nan, nan
}

// spreadText names a spread for notes and descriptions.
func spreadText(spread string) string {
	switch spread {
	case SpreadRange:
		return "the range (lowest to highest value)"
	case SpreadIQR:
		return "the interquartile range (first to third quartile, type 7 of Hyndman & Fan 1996)"
	case SpreadSD:
		return "the mean ± one standard deviation (sample, n − 1)"
	}
	return ""
}

// aggNotes records what summarising did: the summary and its band, n per
// x, the x values with a single value, and the bands that overlap.
func (c *lineChart) aggNotes(s summary) {
	g := scale.Format{Group: true}
	n := g.Format(float64(s.nlo))
	if s.nhi != s.nlo {
		n += " to " + g.Format(float64(s.nhi))
	}
	text := fmt.Sprintf("drew the %s of the values at each x (n = %s per x", s.agg, n)
	if s.nhi <= 1 {
		text = fmt.Sprintf("drew the %s of the values at each x, but no x value repeats (n = 1 at every x): the line is the values themselves", s.agg)
	} else {
		if k := len(s.single); k > 0 {
			xs := xTexts(s.single[:min(k, 6)], c.xk)
			more := ""
			if k > 6 {
				more = fmt.Sprintf(" and %d more", k-6)
			}
			text += fmt.Sprintf("; n = 1 at %s%s", strings.Join(xs, ", "), more)
		}
		text += ")"
		if s.left > 0 {
			text += fmt.Sprintf("; left out %s missing %s at x values that hold others", g.Format(float64(s.left)), plural(s.left, "value", "values"))
		}
		if b := spreadText(s.spread); b != "" {
			text += "; the band is " + b
			if s.spread == SpreadSD && len(s.single) > 0 {
				text += ", left open where n = 1"
			}
		}
	}
	c.note("agg", true, text)
	if a, b, ok := overlappingBands(c.series); ok && !c.multiples {
		by := ""
		if name, ok := c.opt.Names["By"]; ok && name != "" {
			by = " (" + name + ")"
		}
		c.note("band-overlap", false, fmt.Sprintf("the bands of %q and %q overlap over most of their common x values: drew every band translucent so that each shows through; one panel per series would read them apart%s", a, b, by))
	}
}

// overlappingBands finds the first two series whose bands overlap a lot:
// at their common x values, the shared part of the two bands is on
// average more than half of the two together.
func overlappingBands(series []Series) (string, string, bool) {
	for i := range series {
		for j := i + 1; j < len(series); j++ {
			if bandOverlap(series[i], series[j]) > 0.5 {
				return series[i].Name, series[j].Name, true
			}
		}
	}
	return "", "", false
}

// bandOverlap is the mean over common x of |A ∩ B| / |A ∪ B| of two
// bands, 0 when they share no x with a band.
func bandOverlap(a, b Series) float64 {
	if a.lo == nil || b.lo == nil {
		return 0
	}
	total, n := 0.0, 0
	for i, x := range a.X {
		j, ok := slices.BinarySearch(b.X, x)
		if !ok || math.IsNaN(a.lo[i]) || math.IsNaN(b.lo[j]) {
			continue
		}
		union := math.Max(a.hi[i], b.hi[j]) - math.Min(a.lo[i], b.lo[j])
		inter := math.Min(a.hi[i], b.hi[j]) - math.Max(a.lo[i], b.lo[j])
		n++
		if union > 0 && inter > 0 {
			total += inter / union
		}
	}
	if n == 0 {
		return 0
	}
	return total / float64(n)
}

// bands are the lows and highs of every band, for the value axis.
func (c *lineChart) bands() [][]float64 {
	var out [][]float64
	for _, s := range c.series {
		if s.lo != nil {
			out = append(out, s.lo, s.hi)
		}
	}
	return out
}

// bandOutline is a series' band on screen: one closed outline per run of
// x values with a band, along the highs left to right and back along the
// lows. A run of one x has no area and is left out.
func bandOutline(s Series, xs, ys scale.Linear) [][]Point {
	var out [][]Point
	for a := 0; a < len(s.X); {
		if math.IsNaN(s.lo[a]) {
			a++
			continue
		}
		b := a
		for b < len(s.X) && !math.IsNaN(s.lo[b]) {
			b++
		}
		if b-a > 1 {
			piece := make([]Point, 0, 2*(b-a))
			for k := a; k < b; k++ {
				piece = append(piece, Point{round2(xs.Map(s.X[k])), round2(ys.Map(s.hi[k]))})
			}
			for k := b - 1; k >= a; k-- {
				piece = append(piece, Point{round2(xs.Map(s.X[k])), round2(ys.Map(s.lo[k]))})
			}
			out = append(out, piece)
		}
		a = b
	}
	return out
}

// bandColumns is a band of more than four x values per pixel column as
// the lowest low and highest high in each column, as the line over it is
// reduced (M4): the outline then has at most four vertices per column
// however many x values there are.
func bandColumns(s Series, xs, ys scale.Linear) [][]Point {
	w := int(xs.R1 - xs.R0)
	r := columnRange{lo: make([]float64, w), hi: make([]float64, w)}
	for c := range r.lo {
		r.lo[c], r.hi[c] = math.NaN(), math.NaN()
	}
	for i, x := range s.X {
		if math.IsNaN(s.lo[i]) {
			continue
		}
		c := scale.PixelColumn(x, xs.D0, xs.D1, w)
		if math.IsNaN(r.lo[c]) || s.lo[i] < r.lo[c] {
			r.lo[c] = s.lo[i]
		}
		if math.IsNaN(r.hi[c]) || s.hi[i] > r.hi[c] {
			r.hi[c] = s.hi[i]
		}
	}
	pieces := bandPieces(r, ys)
	for _, p := range pieces {
		for k := range p {
			p[k].X = round2(p[k].X + xs.R0)
		}
	}
	return pieces
}

// drawBand draws a series' spread band behind its line, in the line's
// colour made translucent.
func (c *lineChart) drawBand(f *frame, s Series, color Colour, xs, ys scale.Linear) {
	if s.lo == nil {
		return
	}
	outline := bandOutline
	if len(s.X) > 4*int(xs.R1-xs.R0) {
		outline = bandColumns
	}
	if pieces := outline(s, xs, ys); len(pieces) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-band", Lines: pieces, Closed: true, Fill: color, Opacity: bandOpacity,
			Attrs: []Attr{{"series", s.Name}, {"spread", c.spread}}})
	}
}

// xTexts writes x values for one list in one form: on a time axis, the
// finest any of them needs (a bare year beside days would read as
// another kind of value).
func xTexts(xs []float64, k xKind) []string {
	out := make([]string, len(xs))
	if !k.time {
		for i, x := range xs {
			out[i] = xValueText(x, k)
		}
		return out
	}
	layout := "2006"
	for _, x := range xs {
		t := unixTime(x)
		switch {
		case t.Hour() != 0 || t.Minute() != 0 || t.Second() != 0:
			layout = "2006-01-02 15:04"
		case t.Day() != 1 && layout != "2006-01-02 15:04":
			layout = "2 Jan 2006"
		case t.Month() != time.January && layout == "2006":
			layout = "Jan 2006"
		}
	}
	for i, x := range xs {
		out[i] = unixTime(x).Format(layout)
	}
	return out
}
