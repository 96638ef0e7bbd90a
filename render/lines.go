package render

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strings"

	"plumb/palette"
	"plumb/scale"
)

// LinesOptions configures a line chart. The zero value draws the honest
// default: one panel banked to 45° by median absolute slope, series named
// at their line ends, more than four series as small multiples.
type LinesOptions struct {
	Common
	// Time says X holds instants as Unix seconds (UTC): the x axis then gets
	// calendar ticks. Series made by TimeSeries need no flag.
	Time bool
	// Aspect chooses the plot's height for its width: "" banks to 45° by
	// median absolute slope (Cleveland, McGill & McGill 1988),
	// "orientation" by length-weighted mean orientation (Cleveland 1993),
	// and "W:H" (such as "16:9") forces a ratio.
	Aspect string
	// Together keeps more than four series on one panel.
	Together bool
	// Index rebases every series to 100 at its first value, or at x =
	// *IndexAt when IndexAt is set (which implies Index).
	Index   bool
	IndexAt *float64
	Unit    string // unit of the values, for the axis and description
	XName   string // what x is, for the axis title and description
	YName   string // what the values measure
}

// MaxTogether is how many series one panel shows before a line chart
// becomes small multiples: people hold three to five objects in working
// memory (Cowan 2001), and four lines still read apart.
const MaxTogether = 4

// Lines draws a line chart and writes it as SVG to w. It returns the notes
// that record what was decided for the caller.
func Lines(w io.Writer, series []Series, opt LinesOptions) ([]Note, error) {
	s, err := LinesScene(series, opt)
	if err != nil {
		return nil, err
	}
	return s.Notes, WriteSVG(w, s)
}

// LinesScene builds the line chart's scene without writing it.
func LinesScene(series []Series, opt LinesOptions) (*Scene, error) {
	c := &lineChart{opt: opt}
	return c.build(series)
}

type lineChart struct {
	opt    LinesOptions
	f      *frame
	series []Series
	bank   banking
	unit   string // unit on the y ticks ("%" only; others go in the title)
	yTitle string
	// The data's extent over all series, found once: each pass over a
	// million points costs as much as the rest of the layout.
	xlo, xhi, ylo, yhi float64
	xk                 xKind
	yk                 yKind
	missing            int // missing values over all series
}

func (c *lineChart) build(in []Series) (*Scene, error) {
	method, forced, err := parseAspect(c.opt.Aspect)
	if err != nil {
		return nil, err
	}
	if err := checkFinite("IndexAt", c.opt.IndexAt); err != nil {
		return nil, err
	}
	c.bank = banking{method: method, forced: forced}
	if c.opt.Time, err = timeAxis(c.opt.Time, in...); err != nil {
		return nil, err
	}
	series, notes, err := cleanSeries(in)
	if err != nil {
		return nil, err
	}
	f, err := newFrame(c.opt.Common)
	if err != nil {
		return nil, err
	}
	c.f = f
	f.scene.Notes = append(f.scene.Notes, notes...)
	c.series = series
	c.xk = xKindOf(c.xs(), c.opt.Time)
	if c.opt.Time {
		f.noteMilliseconds(dataRange(c.xs()...))
	}
	if c.opt.Index || c.opt.IndexAt != nil {
		if series, err = c.rebase(series); err != nil {
			return nil, err
		}
	}
	c.series = series
	c.axisTitle()
	var ok bool
	if c.ylo, c.yhi, ok = dataRange(c.ys()...); !ok {
		return nil, fmt.Errorf("no values to draw: every value is missing")
	}
	c.xlo, c.xhi, _ = dataRange(c.xs()...)
	if err := firstError(checkSpan("y values", c.ys()...), checkSpan("x values", c.xs()...)); err != nil {
		return nil, err
	}
	c.missing = countMissing(series)
	c.kinds()
	multiples := len(series) > MaxTogether && !c.opt.Together
	if multiples && len(series) > MaxPanels {
		return nil, &RefusalError{Reason: fmt.Sprintf("%d series are too many to compare, on one panel or in a grid of %d small multiples (at most %d panels)", len(series), len(series), MaxPanels),
			Instead: "highlight a few: draw the ones that matter (choose the series, or filter the rows) and leave the rest out with a note; aggregate: draw a mean or median per x; or filter the series into groups and draw one figure per group"}
	}
	switch {
	case multiples:
		f.scene.Note("multiples", false, fmt.Sprintf("%d series are too many for one panel: drew one panel per series with shared scales, the range of all series as a faint band behind each (%s keeps one panel)", len(series), c.opt.name("Together")))
	case len(series) > MaxTogether:
		f.scene.Note("together", false, fmt.Sprintf("kept %d series on one panel as asked (%s); small multiples would read more easily", len(series), c.opt.name("Together")))
	}
	if !multiples && !c.opt.Index && c.opt.IndexAt == nil {
		if n := magnitudeNote(series, c.opt.name("Index")); n != "" {
			f.scene.Note("magnitude", false, n)
		}
	}
	var bottom float64
	if multiples {
		bottom, err = c.layoutMultiples()
	} else {
		bottom, err = c.layoutSingle()
	}
	if err != nil {
		return nil, err
	}
	f.scene.Desc = c.describe(multiples)
	if f.scene.Title == "" {
		// Untitled figures still need an accessible name.
		f.scene.Title = c.accessibleTitle()
	}
	return f.finish(bottom), nil
}

// kinds decides what the axes must respect: see xKindOf; whole-number
// values get no fractional ticks either, and an index includes its base
// of 100, which is always a tick.
func (c *lineChart) kinds() {
	if c.xk.years {
		c.f.scene.Note("years", false, yearsNote)
	}
	c.yk.unit = c.unit
	if c.indexed() {
		base := 100.0
		c.yk.include = &base
		return
	}
	c.yk.integer = wholeNumbers(c.ys()...)
}

// yearsNote says that whole-number x values were read as years.
const yearsNote = "read the x values, whole numbers from 1800 to 2100, as years: ticks fall on whole years and print without a thousands separator"

func (c *lineChart) ys() [][]float64 {
	out := make([][]float64, len(c.series))
	for i, s := range c.series {
		out[i] = s.Y
	}
	return out
}

func (c *lineChart) xs() [][]float64 {
	out := make([][]float64, len(c.series))
	for i, s := range c.series {
		out[i] = s.X
	}
	return out
}

// magnitudeNote suggests an index or panels when one axis must show series
// more than ten times apart in size, which flattens the smaller ones.
func magnitudeNote(series []Series, index string) string {
	if len(series) < 2 {
		return ""
	}
	lo, hi := math.Inf(1), 0.0
	var loName, hiName string
	for _, s := range series {
		m := 0.0
		for _, y := range s.Y {
			if !math.IsNaN(y) {
				m = math.Max(m, math.Abs(y))
			}
		}
		if m < lo {
			lo, loName = m, s.Name
		}
		if m > hi {
			hi, hiName = m, s.Name
		}
	}
	if lo > 0 && hi/lo <= 10 {
		return ""
	}
	return fmt.Sprintf("%q reaches more than ten times the size of %q, which looks flat on a shared axis: compare changes with %s, or draw each in its own figure (plumb draws no second y axis)", hiName, loName, index)
}

// rebase turns every series into an index, 100 at its first value or at x
// = IndexAt (interpolated linearly between neighbouring points).
func (c *lineChart) rebase(series []Series) ([]Series, error) {
	out := make([]Series, len(series))
	for i, s := range series {
		base, err := indexBase(s, c.opt.IndexAt, c.opt.Time)
		if err != nil {
			return nil, err
		}
		y := make([]float64, len(s.Y))
		for j, v := range s.Y {
			y[j] = 100 * v / base
			if math.IsInf(y[j], 0) { // 100 * v overflowed, or v / base did
				y[j] = 100 * (v / base)
			}
			if math.IsInf(y[j], 0) {
				return nil, &RefusalError{Reason: fmt.Sprintf("cannot index series %q at %v: its values reach more than %.1e times that base, beyond the range of numbers", s.Name, base, math.MaxFloat64/100),
					Instead: "index at a larger value of the series (IndexAt), or compare the values themselves"}
			}
		}
		out[i] = Series{Name: s.Name, X: s.X, Y: y}
	}
	at := "its first value"
	if c.opt.IndexAt != nil {
		at = "x = " + c.xText(*c.opt.IndexAt)
	}
	c.f.scene.Note("index", true, fmt.Sprintf("rebased every series to 100 at %s (%s), so that the lines compare change, not size", at, c.opt.name("Index")))
	return out, nil
}

func indexBase(s Series, at *float64, isTime bool) (float64, error) {
	var base float64
	if at == nil {
		base = math.NaN()
		for _, v := range s.Y {
			if !math.IsNaN(v) {
				base = v
				break
			}
		}
	} else {
		base = interpolateAt(s, *at)
		if math.IsNaN(base) {
			return 0, &RefusalError{Reason: fmt.Sprintf("series %q has no value at the index point (outside its range, or missing there)", s.Name),
				Instead: "choose an index point inside every series where both neighbours have values"}
		}
	}
	if base == 0 || math.IsNaN(base) {
		return 0, &RefusalError{Reason: fmt.Sprintf("cannot index series %q to 100 at a value of %v", s.Name, base),
			Instead: "index at a point where every series is non-zero, or compare the values themselves"}
	}
	if base < 0 {
		return 0, &RefusalError{Reason: fmt.Sprintf("cannot index series %q at a negative value: the index would run backwards", s.Name),
			Instead: "index at a point where every series is positive, or plot the differences with plumb diff"}
	}
	return base, nil
}

// interpolateAt is s at x, linear between the two neighbouring points, or
// NaN outside the series or next to a missing value.
func interpolateAt(s Series, x float64) float64 {
	j, found := slices.BinarySearch(s.X, x)
	if found {
		return s.Y[j]
	}
	if j == 0 || j == len(s.X) {
		return math.NaN()
	}
	x0, x1, y0, y1 := s.X[j-1], s.X[j], s.Y[j-1], s.Y[j]
	return y0 + (y1-y0)*(x-x0)/(x1-x0)
}

// axisTitle sets the y axis title and which unit goes on the ticks.
func (c *lineChart) axisTitle() {
	name, unit := c.opt.YName, strings.TrimSpace(c.opt.Unit)
	if c.opt.Index || c.opt.IndexAt != nil {
		at := "first value = 100"
		if c.opt.IndexAt != nil {
			at = "value at " + c.xText(*c.opt.IndexAt) + " = 100"
		}
		c.yTitle = "index, " + at
		if name != "" {
			c.yTitle = name + " (index, " + at + ")"
		}
		return
	}
	if unit == "%" {
		c.unit = "%"
		c.yTitle = name
		return
	}
	switch {
	case name != "" && unit != "":
		c.yTitle = name + " (" + unit + ")"
	case unit != "":
		c.yTitle = unit
	default:
		c.yTitle = name
	}
}

// xText formats an x value for notes and the description.
func (c *lineChart) xText(x float64) string { return xValueText(x, c.xk) }

// seriesColors gives each series its colour: one series in Neutral, a few
// in the categorical palette.
func (c *lineChart) seriesColors() []Colour {
	n := len(c.series)
	out := make([]Colour, n)
	if n == 1 {
		out[0] = c.f.th.neutral
		return out
	}
	p, err := palette.Categorical(n)
	for i := range out {
		// More series than colours that stay apart (--together with many
		// series): all in the neutral colour, for none is told apart.
		if err != nil || n > palette.MaxCategorical || i >= len(p) {
			out[i] = c.f.th.neutral
			continue
		}
		out[i] = RGB(p[i])
	}
	return out
}

// MaxDrawnPoints bounds the vertices one line chart draws after reduction:
// about 60 MB of SVG, far more than any reader can see, and far below what
// runs a machine out of memory. Past it the chart is declined with the
// alternatives.
const MaxDrawnPoints = 4_000_000

// reduceAll turns every series into the polyline to draw for plot width w,
// each reduced per pixel column when it has more than four points per
// column, and notes the reduction. It declines a chart past MaxDrawnPoints.
func (c *lineChart) reduceAll(g lineGeom) ([]scale.Polyline, int, error) {
	return c.reduceWithin(g, MaxDrawnPoints)
}

// reduceWithin is reduceAll with the bound on drawn points as a parameter.
func (c *lineChart) reduceWithin(g lineGeom, limit int) ([]scale.Polyline, int, error) {
	polys := make([]scale.Polyline, len(c.series))
	before, after, bridged := 0, 0, 0
	for i, s := range c.series {
		g.reduce = shouldReduce(c.series[i:i+1], g.w)
		var b int
		polys[i], b = g.polyline(s.X, s.Y)
		before, after, bridged = before+len(s.X), after+len(polys[i].X), bridged+b
	}
	if after > limit {
		return nil, 0, &RefusalError{Reason: fmt.Sprintf("%s series draw %s points even after reduction to the pixel columns, more than the %s one figure draws",
			scale.Format{Group: true}.Format(float64(len(c.series))), scale.Format{Group: true}.Format(float64(after)), scale.Format{Group: true}.Format(float64(limit))),
			Instead: "aggregate the series (a mean or median per x), filter to the few that matter, or draw groups of them in separate figures"}
	}
	if after < before {
		c.f.scene.Note("reduced", false, reduceNote(before, after))
	}
	return polys, bridged, nil
}

// noteMissing records what the missing values did to the drawn lines.
func (c *lineChart) noteMissing(bridged int, drawn []drawnLine) {
	if n := missingNote(c.missing, bridged, drawn); n != "" {
		c.f.scene.Note("missing", true, n)
	}
}

// drawBase draws the base of an index, 100, as a labelled reference line
// across the plot: every line is read against it.
func (c *lineChart) drawBase(ys scale.Linear, left, right float64) {
	if !c.indexed() {
		return
	}
	y := round2(ys.Map(100))
	c.f.scene.Add(Mark{Kind: Path, Class: "plumb-ref", Lines: [][]Point{{{left, y}, {right, y}}}, Stroke: c.f.th.baseline, StrokeWidth: 1, Join: JoinRound, Cap: CapRound,
		Attrs: []Attr{{"label", "index base"}, {"value", "100"}}})
}

func (c *lineChart) indexed() bool { return c.opt.Index || c.opt.IndexAt != nil }

// layoutSingle draws every series on one panel and returns the y under it.
func (c *lineChart) layoutSingle() (float64, error) {
	f, sp := c.f, c.f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	inner := f.width - 2*sp.pad
	top := f.plotTop()
	if c.yTitle != "" {
		t := f.axisTitle(c.yTitle, f.width-2*sp.pad)
		f.drawAxisTitle(t, sp.pad, top)
		top += t.height(lh) + sp.gap
	}
	plotTop := top + math.Ceil((asc+desc)/2)
	colors := c.seriesColors()
	var labels []endLabel
	labelW := 0.0
	switch {
	case len(c.series) > palette.MaxCategorical:
		f.scene.Note("unnamed", false, fmt.Sprintf("%d series are more than colours or names can tell apart: drew them alike in one colour, without names; highlight a few, aggregate them, or draw small multiples of fewer", len(c.series)))
	case len(c.series) > 1:
		names := make([]string, len(c.series))
		for i, s := range c.series {
			names[i] = s.Name
		}
		labels, labelW = f.directLabels(names, colors, inner*0.3)
	}
	left := math.Ceil(sp.pad + f.yLabelWidth(c.ylo, c.yhi, c.yk) + sp.gap)
	left, w, _, ax := f.fitPanelsX(left, labelW, 1, 0, c.xlo, c.xhi, c.xk)
	if w < sp.text*8 {
		return 0, fmt.Errorf("the plot is too narrow at this width: give a wider canvas (%s) or shorter series names", c.opt.name("Width"))
	}
	g := lineGeom{left: left, w: int(w), ax: ax}
	polys, bridged, err := c.reduceAll(g)
	if err != nil {
		return 0, err
	}
	room := 0.0
	if fb := f.fixedPlotBottom(); fb > 0 {
		room = fb - plotTop - (f.xLabelTop(0) + lh)
		if c.opt.XName != "" {
			room -= lh
		}
	}
	h, ay, err := f.plotHeight(&c.bank, polys, c.opt.Time, ax.d1-ax.d0, w, c.ylo, c.yhi, c.yk, room, false)
	if err != nil {
		return 0, err
	}
	f.scene.Note("aspect", false, c.bank.note(w, h))
	bottom := plotTop + h
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: bottom, R1: plotTop}

	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.drawYAxis(ay, ys, left, left+w, true)
	axisBottom := f.drawXAxis(ax, left, int(w), bottom, true)
	if c.opt.XName != "" {
		f.text(left+w/2, axisBottom+asc, c.opt.XName, sp.text, false, f.th.muted, "plumb-axis-title", Middle)
		axisBottom += lh
	}
	f.scene.Add(Mark{Kind: GroupEnd})
	c.drawBase(ys, left, left+w)

	width := strokeWidth(sp)
	drawn := make([]drawnLine, len(c.series))
	for i, s := range c.series {
		g.reduce = shouldReduce(c.series[i:i+1], g.w)
		drawn[i] = g.screen(polys[i], ys)
		f.addSeries("plumb-mark", s.Name, polys[i], drawn[i], colors[i], width, c.opt.Time)
		if labels != nil {
			if p, ok := drawn[i].last(); ok {
				labels[i].ex, labels[i].ey = p.X, p.Y
			}
		}
	}
	c.noteMissing(bridged, drawn)
	if labels != nil && !f.placeLabels(labels, left+w, plotTop, bottom) {
		f.scene.Note("legend", false, "the series names do not fit beside the line ends: named them in a legend below the chart")
		axisBottom = f.legend(labels, left, axisBottom)
	}
	return axisBottom, nil
}

// MaxPanels is the most series a line chart splits into small multiples:
// six rows of five panels still fit a screen or a page with every panel
// wide enough for its x labels and tall enough to read. Past it the chart
// is declined: a grid of more panels is a wall no reader compares across,
// and an honest figure highlights a few series, aggregates them, or
// filters them first.
const MaxPanels = 30

// minPanelChars is the narrowest panel of small multiples, in characters
// of text: room for two or three x tick labels.
const minPanelChars = 7

// describe writes the plain-language description: what is plotted, over
// what range, each series' first and last values and extremes.
func (c *lineChart) describe(multiples bool) string {
	var b strings.Builder
	what := c.opt.YName
	if what == "" {
		what = "values"
	}
	if c.opt.Index || c.opt.IndexAt != nil {
		what += " as an index (" + strings.TrimPrefix(c.yTitle, "index, ") + ")"
	}
	over := overText(c.opt.XName, c.opt.Time)
	kind := "Line chart"
	if multiples {
		kind = "Small multiples of line charts, one panel per series,"
	}
	fmt.Fprintf(&b, "%s of %s %s, %d %s, from %s to %s.", kind, what, over, len(c.series),
		plural(len(c.series), "series", "series"), c.xText(c.xlo), c.xText(c.xhi))
	vf := scale.ValueFormat(shownValues(c.series), c.unitText())
	for _, s := range c.series {
		b.WriteString(" " + describeSeries(s, vf, c.xk))
	}
	return b.String()
}

func (c *lineChart) unitText() string {
	if c.opt.Index || c.opt.IndexAt != nil {
		return ""
	}
	return c.opt.Unit
}

// accessibleTitle names an untitled chart by what it plots.
func (c *lineChart) accessibleTitle() string {
	what := c.opt.YName
	if what == "" {
		names := make([]string, 0, 3)
		for _, s := range c.series[:min(3, len(c.series))] {
			names = append(names, s.Name)
		}
		what = strings.Join(names, ", ")
		if len(c.series) > 3 {
			what += fmt.Sprintf(" and %d more", len(c.series)-3)
		}
	}
	if c.opt.XName != "" {
		return "Line chart of " + what + " by " + c.opt.XName
	}
	return "Line chart of " + what
}
