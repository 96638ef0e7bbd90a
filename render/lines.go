package render

import (
	"errors"
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
	// Agg draws, for series whose x values repeat (repeated measurements),
	// one summary line each through the AggMean or AggMedian of the values
	// at each x; "" refuses repeated x values.
	Agg string
	// Spread draws a band around each summary line: SpreadRange,
	// SpreadIQR, SpreadSD or SpreadNone. "" is SpreadIQR around a median
	// and SpreadNone around a mean. Bands that overlap over most of x are
	// drawn translucent, with a note; an entry "By" in Names says there
	// how to draw one panel per series.
	Spread string
}

// MaxTogether is how many series one panel shows before a line chart
// becomes small multiples: people hold three to five objects in working
// memory (Cowan 2001), and four lines still read apart.
const MaxTogether = 4

// Lines draws a line chart and writes it as SVG to w. It returns the notes
// that record what was decided for the caller.
func Lines(w io.Writer, series []Series, opt LinesOptions) ([]Note, error) {
	s, err := LinesScene(series, opt)
	return writeScene(w, s, err)
}

// LinesScene builds the line chart's scene without writing it: one panel,
// or small multiples of one panel per series in a grid with shared scales.
func LinesScene(series []Series, opt LinesOptions) (*Scene, error) {
	c, err := newLineChart(series, opt, false)
	if err != nil {
		return nil, err
	}
	o := gridOptions{above: c.yTitle, describe: func() (string, string) { return c.describe(c.multiples), c.accessibleTitle() }}
	if !c.multiples {
		return figureScene(opt.Common, o, []Panel{c.panel(-1, "")})
	}
	o.shareX, o.shareY, o.below = true, true, opt.XName
	o.cols = c.multipleColumns()
	panels := make([]Panel, len(c.series))
	for i, s := range c.series {
		panels[i] = c.panel(i, s.Name)
	}
	return figureScene(opt.Common, o, panels)
}

// LinesPanel plans a line chart for a cell of a figure. Its series stay on
// one panel: small multiples are a figure of their own (LinesScene).
func LinesPanel(series []Series, opt LinesOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		c, err := newLineChart(series, opt, true)
		if err != nil {
			return nil, err
		}
		c.start(f)
		return c.plan(-1, true), nil
	})
}

// lineChart is a line chart's data, checked and prepared once for all its
// panels: cleaned, rebased, its extent and axis kinds found, and what was
// decided recorded for the notes.
type lineChart struct {
	opt    LinesOptions
	series []Series
	bank   banking // how heights are chosen; each panel banks a copy
	unit   string  // unit on the y ticks ("%" only; others go in the title)
	yTitle string
	// The data's extent over all series, found once: each pass over a
	// million points costs as much as the rest of the layout.
	xlo, xhi, ylo, yhi float64
	xk                 xKind
	yk                 yKind
	missing            int // missing values over all series
	multiples          bool
	// Notes decided before there is a frame, added to it by start.
	cleanNotes, notes []Note
	started           bool
	joint             *jointPanels // the shared height and band of small multiples
	spread            string       // the band around summary lines (Agg), or SpreadNone
}

// newLineChart checks and prepares the series. inFigure keeps every series
// on one panel, with a note when small multiples would read better.
func newLineChart(in []Series, opt LinesOptions, inFigure bool) (*lineChart, error) {
	c := &lineChart{opt: opt}
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
	if c.spread, err = c.opt.aggSpread(); err != nil {
		return nil, err
	}
	var sum summary
	if c.opt.Agg != "" {
		if in, sum, err = summarise(in, c.opt.Agg, c.spread); err != nil {
			return nil, err
		}
	}
	series, notes, err := cleanSeries(in)
	if errors.Is(err, errRepeatedX) {
		return nil, &RefusalError{Reason: err.Error(),
			Instead: fmt.Sprintf("for repeated measurements draw a summary line through the mean or median at each x, with a band for the spread (%s mean or median, %s)", c.opt.name("Agg"), c.opt.name("Spread"))}
	}
	if err != nil {
		return nil, err
	}
	c.cleanNotes = notes
	c.series = series
	c.xk = xKindOf(c.xs(), c.opt.Time)
	if c.opt.Index || c.opt.IndexAt != nil {
		if series, err = c.rebase(series); err != nil {
			return nil, err
		}
	}
	c.series = series
	c.axisTitle()
	var ok bool
	if c.ylo, c.yhi, ok = dataRange(append(c.ys(), c.bands()...)...); !ok {
		return nil, fmt.Errorf("no values to draw: every value is missing")
	}
	c.xlo, c.xhi, _ = dataRange(c.xs()...)
	if err := firstError(checkSpan("y values", append(c.ys(), c.bands()...)...), checkSpan("x values", c.xs()...)); err != nil {
		return nil, err
	}
	c.missing = countMissing(series)
	c.kinds()
	c.multiples = len(series) > MaxTogether && !c.opt.Together && !inFigure
	if c.multiples && len(series) > MaxPanels {
		return nil, &RefusalError{Reason: fmt.Sprintf("%d series are too many to compare, on one panel or in a grid of %d small multiples (at most %d panels)", len(series), len(series), MaxPanels),
			Instead: "highlight a few: draw the ones that matter (choose the series, or filter the rows) and leave the rest out with a note; aggregate: draw a mean or median per x; or filter the series into groups and draw one figure per group"}
	}
	switch {
	case c.multiples:
		c.note("multiples", false, fmt.Sprintf("%d series are too many for one panel: drew one panel per series with shared scales, the range of all series as a faint band behind each (%s keeps one panel)", len(series), c.opt.name("Together")))
	case len(series) > MaxTogether && inFigure && !c.opt.Together:
		c.note("together", false, fmt.Sprintf("kept %d series on one panel of the figure; small multiples, a figure of their own, would read more easily", len(series)))
	case len(series) > MaxTogether:
		c.note("together", false, fmt.Sprintf("kept %d series on one panel as asked (%s); small multiples would read more easily", len(series), c.opt.name("Together")))
	}
	if c.opt.Agg != "" {
		c.aggNotes(sum)
	}
	if !c.multiples && !c.opt.Index && c.opt.IndexAt == nil {
		if n := magnitudeNote(series, c.opt.name("Index")); n != "" {
			c.note("magnitude", false, n)
		}
	}
	return c, nil
}

// multipleColumns is the column count of small multiples: a grid about
// square in panels, so that the columns grow with the count, with fewer
// columns when a panel would be narrower than minPanelChars characters
// beside the y tick labels.
func (c *lineChart) multipleColumns() int {
	sp, err := c.opt.Medium.spec()
	if err != nil {
		return 0 // the frame reports the medium
	}
	width := sp.width
	if c.opt.Width > 0 {
		width = c.opt.Width
	}
	n := len(c.series)
	cols := min(n, int(math.Ceil(math.Sqrt(float64(n)))))
	gutter := math.Ceil(sp.text)
	for cols > 1 && (width-2*sp.pad-float64(cols-1)*gutter)/float64(cols) < sp.text*(minPanelChars+4) {
		cols--
	}
	return cols
}

// note records a decision for the frame that start will be given.
func (c *lineChart) note(code string, changed bool, text string) {
	c.notes = append(c.notes, Note{Code: code, Changed: changed, Text: text})
}

// start adds the chart's notes to the frame, once, in the order they were
// decided.
func (c *lineChart) start(f *frame) {
	if c.started {
		return
	}
	c.started = true
	f.scene.Notes = append(f.scene.Notes, c.cleanNotes...)
	if c.opt.Time {
		f.noteMilliseconds(dataRange(c.xs()...))
	}
	for _, n := range c.notes {
		f.scene.Note(n.Code, n.Changed, n.Text)
	}
}

// panel is the Panel of the whole chart (i < 0) or of series i's small
// multiple, with its heading.
func (c *lineChart) panel(i int, title string) Panel {
	return Panel{Title: title, layers: c.opt.Annotations.layers(), plan: func(f *frame) (panelPlan, error) {
		c.start(f)
		return c.plan(i, false), nil
	}}
}

// kinds decides what the axes must respect: see xKindOf; whole-number
// values get no fractional ticks either, and an index includes its base
// of 100, which is always a tick.
func (c *lineChart) kinds() {
	if c.xk.years {
		c.note("years", false, yearsNote)
	}
	c.yk.unit = c.unit
	if c.indexed() {
		base := 100.0
		c.yk.include = &base
		return
	}
	c.yk.integer = wholeNumbers(append(c.ys(), c.bands()...)...)
}

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
		out[i] = Series{Name: s.Name, X: s.X, Y: y, n: s.n}
		if s.lo != nil {
			out[i].lo, out[i].hi = make([]float64, len(s.lo)), make([]float64, len(s.hi))
			for j := range s.lo {
				out[i].lo[j], out[i].hi[j] = 100*(s.lo[j]/base), 100*(s.hi[j]/base)
			}
		}
	}
	at := "its first value"
	if c.opt.IndexAt != nil {
		at = "x = " + c.xText(*c.opt.IndexAt)
	}
	c.note("index", true, fmt.Sprintf("rebased every series to 100 at %s (%s), so that the lines compare change, not size", at, c.opt.name("Index")))
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
func (c *lineChart) seriesColors(f *frame) []Colour {
	n := len(c.series)
	out := make([]Colour, n)
	if n == 1 {
		out[0] = f.th.neutral
		return out
	}
	p, user, ok := f.categorical(n, "series")
	for i := range out {
		// More series than colours that stay apart (--together with many
		// series): all in the neutral colour, for none is told apart.
		if !ok || (!user && n > palette.MaxCategorical) || i >= len(p) {
			out[i] = f.th.neutral
			continue
		}
		out[i] = p[i]
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
func (c *lineChart) reduceAll(f *frame, g lineGeom) ([]scale.Polyline, int, error) {
	return c.reduceWithin(f, g, MaxDrawnPoints)
}

// reduceWithin is reduceAll with the bound on drawn points as a parameter.
func (c *lineChart) reduceWithin(f *frame, g lineGeom, limit int) ([]scale.Polyline, int, error) {
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
		f.scene.Note("reduced", false, reduceNote(before, after))
	}
	return polys, bridged, nil
}

// drawBase draws the base of an index, 100, as a labelled reference line
// across the plot: every line is read against it.
func (c *lineChart) drawBase(f *frame, ys scale.Linear, left, right float64) {
	if !c.indexed() {
		return
	}
	y := round2(ys.Map(100))
	f.scene.Add(Mark{Kind: Path, Class: "plumb-ref", Lines: [][]Point{{{left, y}, {right, y}}}, Stroke: f.th.baseline, StrokeWidth: 1, Join: JoinRound, Cap: CapRound,
		Attrs: []Attr{{"label", "index base"}, {"value", "100"}}})
}

func (c *lineChart) indexed() bool { return c.opt.Index || c.opt.IndexAt != nil }

// MaxPanels is the most series a line chart splits into small multiples:
// six rows of five panels still fit a screen or a page with every panel
// wide enough for its x labels and tall enough to read. Past it the chart
// is declined: a grid of more panels is a wall no reader compares across,
// and an honest figure highlights a few series, aggregates them, or
// filters them first.
const MaxPanels = 30

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
	if c.opt.Agg != "" {
		fmt.Fprintf(&b, " Each line is the %s of the values at each x", c.opt.Agg)
		if t := spreadText(c.spread); t != "" {
			b.WriteString(", with a band for " + t)
		}
		b.WriteString(".")
	}
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
