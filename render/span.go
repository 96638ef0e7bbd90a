package render

import (
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/scale"
)

// Range is one category's range: low to high with a middle, and an
// optional value to overlay (this year against the range of all years).
type Range struct {
	Label          string
	Low, Mid, High float64
	Mark           *float64 // drawn as a distinct dot; nil for none
}

// SpanStat says how ranges are computed from raw values.
type SpanStat string

// The statistics a span computes from raw values.
const (
	StatRange     SpanStat = "range"     // minimum, mean, maximum (the default)
	StatQuartiles SpanStat = "quartiles" // Q1, median, Q3 (type 7)
	StatP10P90    SpanStat = "p10-p90"   // 10th percentile, median, 90th percentile (type 7)
)

// SpanOptions configures a range chart. The zero value draws one
// horizontal range per category, ordered by its middle (largest first),
// on a value axis that fits the data.
type SpanOptions struct {
	Common
	Order     Order  // ByValue (by the middle, largest first; default), ByLabel or ByData
	Unit      string // unit of the values, said once in the unit line; a currency sign leads every tick
	ValueName string // what the values measure
	LabelName string // what the categories are, for the description
	// Stat says what Low, Mid and High are, for the note and the
	// description: a computed statistic, or "" when the ranges were given.
	Stat SpanStat
	// MarkName names the overlaid values ("2025"); it labels the first
	// row's dot directly. Empty with marks present: "marked".
	MarkName string
}

// RangesFromGroups computes one Range per group by stat: the minimum, mean
// and maximum (StatRange, the default), the quartiles with the median
// (StatQuartiles) or the 10th and 90th percentiles with the median
// (StatP10P90), all quantiles by Hyndman & Fan (1996) type 7.
func RangesFromGroups(groups []Group, stat SpanStat) ([]Range, error) {
	out := make([]Range, len(groups))
	for i, g := range groups {
		s, err := stats.Summarize(g.Values)
		if err != nil {
			return nil, fmt.Errorf("group %q: %w", g.Label, err)
		}
		r := Range{Label: g.Label}
		switch stat {
		case StatRange, "":
			r.Low, r.Mid, r.High = s.Min, s.Mean, s.Max
		case StatQuartiles:
			r.Low, r.Mid, r.High = s.Q1, s.Median, s.Q3
		case StatP10P90:
			r.Low, r.Mid, r.High = s.P10, s.Median, s.P90
		default:
			return nil, &OptionError{Option: "Stat", Value: string(stat), Err: fmt.Errorf("use %s, %s or %s", StatRange, StatQuartiles, StatP10P90)}
		}
		out[i] = r
	}
	return out, nil
}

// Span draws a range chart and writes it as SVG to w. It returns the notes
// that record what was decided.
func Span(w io.Writer, ranges []Range, opt SpanOptions) ([]Note, error) {
	s, err := SpanScene(ranges, opt)
	return writeScene(w, s, err)
}

// SpanScene builds the range chart's scene without writing it.
func SpanScene(ranges []Range, opt SpanOptions) (*Scene, error) {
	return chartScene(opt.Common, SpanPanel(ranges, opt))
}

// SpanPanel plans a range chart for a cell of a figure.
func SpanPanel(ranges []Range, opt SpanOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		return planSpan(f, ranges, opt)
	})
}

func planSpan(f *frame, ranges []Range, opt SpanOptions) (*valueRows, error) {
	labels := make([]string, len(ranges))
	var vals []float64
	marks := 0
	for i, r := range ranges {
		labels[i] = r.Label
		for _, v := range []float64{r.Low, r.Mid, r.High} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, fmt.Errorf("range %q: %g is not a finite number", r.Label, v)
			}
		}
		if !(r.Low <= r.Mid && r.Mid <= r.High) {
			return nil, fmt.Errorf("range %q: low %g, middle %g and high %g are out of order; a range needs low ≤ middle ≤ high", r.Label, r.Low, r.Mid, r.High)
		}
		vals = append(vals, r.Low, r.Mid, r.High)
		if r.Mark != nil {
			if math.IsNaN(*r.Mark) || math.IsInf(*r.Mark, 0) {
				return nil, fmt.Errorf("range %q: the mark %g is not a finite number", r.Label, *r.Mark)
			}
			vals = append(vals, *r.Mark)
			marks++
		}
	}
	if err := checkLabels("category", labels); err != nil {
		return nil, err
	}
	if err := checkSpan("values", vals); err != nil {
		return nil, err
	}
	opt.Unit = strings.TrimSpace(opt.Unit)
	p := &valueRows{unit: opt.Unit, axisTitle: unitTitle(opt.ValueName, opt.Unit), integer: scale.IsInteger(vals)}
	p.vfmt = scale.ValueFormat(vals, opt.Unit)
	for _, r := range ranges {
		p.values = append(p.values, r.Mid)
	}
	markName := opt.MarkName
	if markName == "" {
		markName = "marked"
	}
	for _, r := range ranges {
		lo, hi := r.Low, r.High
		if r.Mark != nil {
			lo, hi = math.Min(lo, *r.Mark), math.Max(hi, *r.Mark)
		}
		p.rows = append(p.rows, valueRow{label: r.Label, key: r.Mid, lo: lo, hi: hi,
			draw: func(f *frame, xs scale.Linear, cy, thick float64, _ bool) ([]layout.Box, float64) {
				return drawRange(f, r, markName, xs, cy, thick)
			}})
	}
	if err := orderRows(p.rows, opt.Order); err != nil {
		return nil, err
	}
	// The first row with an overlaid value names it directly; the rest
	// read by analogy, so no legend is needed.
	for i := range p.rows {
		if rangeOf(ranges, p.rows[i].label).Mark != nil {
			p.rows[i].direct = markName
			break
		}
	}
	switch opt.Order {
	case ByValue, "":
		f.scene.Note("order", false, fmt.Sprintf("ordered the categories by their middle value, largest first (%s label or data for another order)", opt.name("Order")))
	}
	if opt.Stat != "" {
		f.scene.Note("span-stat", false, "ranges show "+statWords(opt.Stat))
	}
	if marks > 0 && marks < len(ranges) {
		f.scene.Note("span-marks", false, fmt.Sprintf("%d of %d categories have a %s value to overlay", marks, len(ranges), markName))
	}
	p.desc, p.name = describeSpan(ranges, opt, p.vfmt, markName)
	return p, nil
}

func rangeOf(ranges []Range, label string) Range {
	for _, r := range ranges {
		if r.Label == label {
			return r
		}
	}
	return Range{}
}

// statWords says what a computed range shows.
func statWords(s SpanStat) string {
	switch s {
	case StatQuartiles:
		return "the quartiles, with the median marked (Hyndman & Fan type 7)"
	case StatP10P90:
		return "the 10th to 90th percentiles, with the median marked (Hyndman & Fan type 7)"
	}
	return "the minimum to the maximum, with the mean marked"
}

// drawRange draws one range: a bar from low to high, a tick across it at
// the middle, and the overlaid value as a dot in the accent colour.
func drawRange(f *frame, r Range, markName string, xs scale.Linear, cy, thick float64) ([]layout.Box, float64) {
	sp := f.spec
	x := func(v float64) float64 { return round2(xs.Map(v)) }
	h := math.Max(3, thick*0.45)
	top := round2(cy - h/2)
	xl, xh := x(r.Low), x(r.High)
	w := math.Max(xh-xl, 1) // a range of one value still shows
	f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark plumb-range", X: xl, Y: top, W: round2(w), H: round2(h), Fill: f.th.neutral,
		Attrs: []Attr{{"label", r.Label}, {"low", dataNumber(r.Low)}, {"mid", dataNumber(r.Mid)}, {"high", dataNumber(r.High)}}})
	// The middle: a tick in the text colour, taller than the bar, so it
	// reads against it without a second hue.
	xm := x(r.Mid)
	th := round2(math.Max(h*2, sp.text*0.9))
	f.scene.Add(Mark{Kind: Path, Class: "plumb-mid", Lines: [][]Point{{{xm, round2(cy - th/2)}, {xm, round2(cy + th/2)}}}, Stroke: f.th.text, StrokeWidth: math.Max(2, 2*sp.text/13)})
	boxes := []layout.Box{{X: xl, Y: cy - th/2, W: w, H: th}}
	end := xl + w
	if r.Mark != nil {
		radius := math.Max(3, sp.text*0.36)
		xk := x(*r.Mark)
		f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark plumb-overlay", X: xk, Y: round2(cy), R: radius, Fill: f.th.accent, Stroke: pageWhite(), StrokeWidth: 1,
			Attrs: []Attr{{"label", r.Label}, {"value", dataNumber(*r.Mark)}, {"series", markName}}})
		boxes = append(boxes, layout.Box{X: xk - radius, Y: cy - radius, W: 2 * radius, H: 2 * radius})
		end = math.Max(end, xk+radius)
	}
	return boxes, end
}

// describeSpan says what the ranges show: how many, the widest and
// narrowest, and where the overlaid values fall.
func describeSpan(ranges []Range, opt SpanOptions, vf scale.Format, markName string) (desc, name string) {
	what := opt.ValueName
	if what == "" {
		what = "values"
	}
	name = "Ranges of " + what
	if opt.LabelName != "" {
		name += " by " + opt.LabelName
	}
	wide, narrow, hi, lo := 0, 0, 0, 0
	for i, r := range ranges {
		if r.High-r.Low > ranges[wide].High-ranges[wide].Low {
			wide = i
		}
		if r.High-r.Low < ranges[narrow].High-ranges[narrow].Low {
			narrow = i
		}
		if r.Mid > ranges[hi].Mid {
			hi = i
		}
		if r.Mid < ranges[lo].Mid {
			lo = i
		}
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%s for %d %s", name, len(ranges), plural(len(ranges), "category", "categories"))
	if opt.Stat != "" {
		fmt.Fprintf(&b, ", each showing %s", statWords(opt.Stat))
	}
	b.WriteString(". ")
	if len(ranges) > 1 {
		fmt.Fprintf(&b, "The middle is highest for %s (%s) and lowest for %s (%s). ", ranges[hi].Label, vf.Format(ranges[hi].Mid), ranges[lo].Label, vf.Format(ranges[lo].Mid))
		fmt.Fprintf(&b, "The widest range is %s (%s to %s), the narrowest %s (%s to %s).", ranges[wide].Label, vf.Format(ranges[wide].Low), vf.Format(ranges[wide].High),
			ranges[narrow].Label, vf.Format(ranges[narrow].Low), vf.Format(ranges[narrow].High))
	} else {
		fmt.Fprintf(&b, "It runs from %s to %s, middle %s.", vf.Format(ranges[0].Low), vf.Format(ranges[0].High), vf.Format(ranges[0].Mid))
	}
	above, below, n := 0, 0, 0
	for _, r := range ranges {
		if r.Mark == nil {
			continue
		}
		n++
		// A range computed from rows that include the marked one holds
		// it: its top then means "the highest of all".
		if *r.Mark >= r.High {
			above++
		}
		if *r.Mark <= r.Low {
			below++
		}
	}
	if n > 0 {
		fmt.Fprintf(&b, " The %s value is at or above the top of its range in %d and at or below the bottom in %d of %d %s.", markName, above, below, n, plural(n, "category", "categories"))
	}
	return b.String(), name
}
