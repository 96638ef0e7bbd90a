package render

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"plumb/palette"
)

// RowSeries is one series of a chart with several values per category: its
// name and one value per category label, NaN where the category has none.
type RowSeries struct {
	Name   string
	Values []float64
}

// SeriesLayout says how a bar chart draws several values per category.
type SeriesLayout string

// Series layouts. The zero SeriesLayout is LayoutDots.
const (
	// LayoutDots draws one row per category with one dot per series on a
	// shared axis: positions along one scale, the comparison a reader
	// makes most accurately (Cleveland & McGill 1984).
	LayoutDots SeriesLayout = "dots"
	// LayoutStack draws the series as segments of one bar, in the order
	// given, for parts of a whole; the total is labelled at the bar's end.
	LayoutStack SeriesLayout = "stack"
	// LayoutSide draws the series as bars side by side in each row, for at
	// most MaxSideSeries series.
	LayoutSide SeriesLayout = "side"
)

// MaxSideSeries is the most series LayoutSide draws. A fourth bar per row
// makes every row a chart of its own, and the reader compares bars of one
// series across rows by skipping over the others (common practice); dots
// on one axis hold more.
const MaxSideSeries = 3

// SeriesBars draws several values per category as a bar chart (see
// BarsOptions.Layout) and writes it as SVG to w.
func SeriesBars(w io.Writer, labels []string, series []RowSeries, opt BarsOptions) ([]Note, error) {
	s, err := SeriesBarsScene(labels, series, opt)
	return writeScene(w, s, err)
}

// SeriesBarsScene builds the chart of SeriesBars without writing it.
func SeriesBarsScene(labels []string, series []RowSeries, opt BarsOptions) (*Scene, error) {
	return figureScene(opt.Common, gridOptions{}, []Panel{seriesPanel(labels, series, opt, false, true)})
}

// SeriesBarsPanel plans the chart of SeriesBars for a cell of a figure.
func SeriesBarsPanel(labels []string, series []RowSeries, opt BarsOptions) Panel {
	return seriesPanel(labels, series, opt, false, false)
}

// SeriesDots draws several values per category as a dot plot: one row per
// category, one dot per series, and writes it as SVG to w.
func SeriesDots(w io.Writer, labels []string, series []RowSeries, opt DotsOptions) ([]Note, error) {
	s, err := SeriesDotsScene(labels, series, opt)
	return writeScene(w, s, err)
}

// SeriesDotsScene builds the chart of SeriesDots without writing it.
func SeriesDotsScene(labels []string, series []RowSeries, opt DotsOptions) (*Scene, error) {
	return figureScene(opt.Common, gridOptions{}, []Panel{seriesPanel(labels, series, BarsOptions{Common: opt.Common, RowOptions: opt.RowOptions}, true, true)})
}

// SeriesDotsPanel plans the chart of SeriesDots for a cell of a figure.
func SeriesDotsPanel(labels []string, series []RowSeries, opt DotsOptions) Panel {
	return seriesPanel(labels, series, BarsOptions{Common: opt.Common, RowOptions: opt.RowOptions}, true, false)
}

func seriesPanel(labels []string, series []RowSeries, opt BarsOptions, dots, alone bool) Panel {
	return rowChartPanel(opt, alone, func(f *frame, opt BarsOptions) (*rowChart, error) {
		return newSeriesChart(f, labels, series, opt, dots)
	})
}

// newSeriesChart plans a chart of several values per category: the rows
// of a bar chart, each carrying one value per series, ordered and folded
// into Other by a key (the total of a stack, else the mean of the row).
func newSeriesChart(f *frame, labels []string, series []RowSeries, opt BarsOptions, dots bool) (*rowChart, error) {
	layout := opt.Layout
	if dots {
		layout = LayoutDots
	}
	switch layout {
	case "", LayoutDots:
		layout = LayoutDots
		dots = true
	case LayoutStack, LayoutSide:
	default:
		return nil, &OptionError{Option: "Layout", Value: strconv.Quote(string(opt.Layout)), Err: errors.New("use dots, stack or side")}
	}
	if len(series) == 0 {
		return nil, errors.New("no series to draw: give at least one")
	}
	if len(series) > palette.MaxCategorical {
		return nil, &RefusalError{Reason: fmt.Sprintf("%d series are more than colours can tell apart", len(series)),
			Instead: "draw fewer series, or one panel per series"}
	}
	if layout == LayoutSide && len(series) > MaxSideSeries {
		return nil, &OptionError{Option: "Layout", Value: string(LayoutSide), Err: &RefusalError{
			Reason:  fmt.Sprintf("%d series side by side make each row a chart of its own; at most %d compare", len(series), MaxSideSeries),
			Instead: "draw one dot per series on one axis (the default layout), stack them if they are parts of a whole, or one panel per series"}}
	}
	if opt.Vertical {
		return nil, &OptionError{Option: "Vertical", Err: errors.New("several values per category are drawn in horizontal rows; leave it out")}
	}
	if opt.Percent && layout != LayoutStack {
		return nil, &OptionError{Option: "Percent", Err: fmt.Errorf("shares of a row are drawn as a stack: use %s stack", opt.name("Layout"))}
	}
	names := make([]string, len(series))
	for s, ser := range series {
		names[s] = strings.TrimSpace(ser.Name)
		if names[s] == "" {
			names[s] = fmt.Sprintf("Series %d", s+1)
		}
		if len(ser.Values) != len(labels) {
			return nil, fmt.Errorf("series %q has %d values for %d labels: give one value per label, NaN where there is none", names[s], len(ser.Values), len(labels))
		}
		for i, v := range ser.Values {
			if math.IsInf(v, 0) {
				return nil, fmt.Errorf("series %q, label %q: the value is %v; give finite numbers, or NaN where there is none", names[s], labels[i], v)
			}
			if layout == LayoutStack && v < 0 {
				return nil, &OptionError{Option: "Layout", Value: string(LayoutStack), Err: &RefusalError{
					Reason:  fmt.Sprintf("cannot stack the negative value %s of %q in %q: segments of a whole have one sign", dataNumber(v), names[s], labels[i]),
					Instead: "draw one dot per series (the default layout), or bars side by side"}}
			}
		}
	}
	key := make([]float64, len(labels))
	for i := range labels {
		sum, n := 0.0, 0
		for _, ser := range series {
			if v := ser.Values[i]; !math.IsNaN(v) {
				sum += v
				n++
			}
		}
		switch {
		case n == 0:
			return nil, fmt.Errorf("label %q has no value in any series: leave it out", labels[i])
		case layout == LayoutStack && math.IsInf(sum, 0):
			return nil, &OptionError{Option: "Layout", Value: string(LayoutStack), Err: &RefusalError{
				Reason:  fmt.Sprintf("the parts of %q add up to more than the largest number, %.1e", labels[i], math.MaxFloat64),
				Instead: "draw one dot per series (the default layout), or give the values in a larger unit"}}
		case layout == LayoutStack:
			key[i] = sum
		default:
			// The mean as a sum of parts, which no two large values overflow.
			for _, ser := range series {
				if v := ser.Values[i]; !math.IsNaN(v) {
					key[i] += v / float64(n)
				}
			}
		}
	}
	c := &rowChart{opt: opt, dots: dots, f: f, names: names, layout: layout}
	c.opt.Layout = layout
	if layout == LayoutStack {
		c.opt.Additive = true // segments are parts of a whole: Other sums them
	}
	rowValues := make([][]float64, len(labels))
	for i := range labels {
		rowValues[i] = make([]float64, len(series))
		for s, ser := range series {
			rowValues[i][s] = ser.Values[i]
		}
	}
	return c.plan(labels, key, rowValues)
}

// foldSeries adds r's series values into the Other row o.
func foldSeries(o *row, r row) {
	if r.series == nil {
		return
	}
	if o.series == nil {
		o.series, o.seen = make([]float64, len(r.series)), make([]int, len(r.series))
	}
	for s, v := range r.series {
		if !math.IsNaN(v) {
			o.series[s] += v
			o.seen[s]++
		}
	}
}

// meanSeries finishes the Other row's series: sums, or means when the
// values do not add up; NaN for a series none of the rows had.
func meanSeries(o *row, sum bool) {
	for s := range o.series {
		switch {
		case o.seen[s] == 0:
			o.series[s] = math.NaN()
		case !sum:
			o.series[s] /= float64(o.seen[s])
		}
	}
}

// valueRange is the extent of what the value axis must show: the rows'
// values, or every series value (a stack's totals).
func (c *rowChart) valueRange() (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range c.values() {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	return lo, hi
}

// rowShares turns every stacked row into shares of its own total: rows of
// 100%, still ordered by their amounts.
func (c *rowChart) rowShares() error {
	for i := range c.rows {
		r := &c.rows[i]
		total := 0.0
		for _, v := range r.series {
			if !math.IsNaN(v) {
				total += v
			}
		}
		if total == 0 {
			return &RefusalError{Reason: fmt.Sprintf("cannot show the parts of %q as shares: they add up to zero", r.label), Instead: "drop " + c.opt.name("Percent")}
		}
		for s, v := range r.series {
			r.series[s] = 100 * v / total
		}
	}
	c.opt.Unit = "%"
	c.f.scene.Note("percent", true, "showing each segment as a percentage of its row's total; every row is 100%")
	return nil
}

// seriesColours are the series' colours in the categorical palette.
func (c *rowChart) seriesColours() []Colour {
	out := make([]Colour, len(c.names))
	if len(out) == 1 {
		out[0] = c.f.th.neutral
		return out
	}
	p, _, ok := c.f.categorical(len(out), "series")
	for i := range out {
		if !ok || i >= len(p) {
			out[i] = c.f.th.neutral
			continue
		}
		out[i] = p[i]
	}
	return out
}

// seriesText is the text colour of a series' name: its hue, darkened to
// 4.5:1 against the page so that it reads as text (WCAG 2.x contrast).
func (c *rowChart) seriesText(col Colour) Colour {
	if dark, ok := palette.DarkenToContrast(col.SRGB(), palette.SRGB{R: 1, G: 1, B: 1}, 4.5); ok {
		return RGB(dark)
	}
	return c.f.th.text
}

// describeSeries writes the description of a chart of several series.
func (c *rowChart) describeSeries() string {
	kind := map[SeriesLayout]string{LayoutDots: "Dot plot", LayoutStack: "Stacked bar chart", LayoutSide: "Grouped bar chart"}[c.layout]
	what := c.opt.ValueName
	if what == "" {
		what = "values"
	}
	by := c.opt.LabelName
	if by == "" {
		by = "category"
	}
	var b strings.Builder
	per := map[SeriesLayout]string{LayoutDots: "one dot", LayoutStack: "one segment", LayoutSide: "one bar"}[c.layout]
	// The kind comes first and ends at the first comma: it is the
	// accessible name of an untitled chart.
	fmt.Fprintf(&b, "%s of %s by %s, %d %s, %s per series (%s)", kind, what, by, len(c.rows), plural(len(c.rows), "category", "categories"), per, strings.Join(c.names, ", "))
	if c.opt.Order == ByValue || c.opt.Order == "" {
		if c.layout == LayoutStack {
			b.WriteString(", largest total first")
		} else {
			b.WriteString(", largest mean first")
		}
	}
	b.WriteString(".")
	for s, name := range c.names {
		hi, lo := -1, -1
		for i, r := range c.rows {
			v := r.series[s]
			if math.IsNaN(v) || r.other > 0 {
				continue
			}
			if hi < 0 || v > c.rows[hi].series[s] {
				hi = i
			}
			if lo < 0 || v < c.rows[lo].series[s] {
				lo = i
			}
		}
		if hi >= 0 {
			fmt.Fprintf(&b, " %s: largest %s at %s, smallest %s at %s.", name, spokenLabel(c.rows[hi].label), c.vfmt.Format(c.rows[hi].series[s]), spokenLabel(c.rows[lo].label), c.vfmt.Format(c.rows[lo].series[s]))
		}
	}
	if last := c.rows[len(c.rows)-1]; last.other > 0 {
		fmt.Fprintf(&b, " %d smaller categories are combined in %s.", last.other, last.label)
	}
	return b.String()
}
