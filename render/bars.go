package render

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strings"

	"plumb/layout"
	"plumb/scale"
)

// RowOptions are the options bars and dots share: one row (or column) per
// category on one value axis. A bar chart that should be a dot plot (values
// far from zero) passes its RowOptions on unchanged.
type RowOptions struct {
	Order     Order     // ByValue (default), ByLabel or ByData
	Top       int       // most rows to draw; 0 chooses (DefaultTop or DefaultDotsTop), negative draws all
	Other     OtherMode // what becomes of the categories beyond Top; OtherAuto by default (dots: OtherSum is refused, a dot is a position, not an amount)
	Highlight []string  // labels drawn in the accent colour
	From, To  *float64  // widen the value domain, never hide a value; bars always include zero
	Unit      string    // "%", "kg": said once, in the axis title and on the first value label; a currency sign leads every value ("$5")
	ValueName string    // what the values measure, for the axis and the description
	LabelName string    // what the categories are, for the description
	Averages  bool      // values are means, medians or extremes: never Additive, and an automatic Other averages them
}

// BarsOptions configures a bar chart. The zero value draws the honest
// default: horizontal bars from zero, largest first, one neutral colour,
// values at the bar ends, every category unless the values are parts of a
// whole (then at most DefaultTop bars, the rest summed into Other).
type BarsOptions struct {
	Common
	RowOptions
	Additive bool // the values are parts of a whole (counts, sums), so Other may sum them
	Vertical bool // stand the bars up; labels then sit under narrow columns
	Percent  bool // show each value as a share of the total (with series stacked: of its row's total)
	// Layout says how SeriesBars draws several values per category:
	// LayoutDots (the default), LayoutStack or LayoutSide.
	Layout SeriesLayout
}

// DotsOptions configures a dot plot: like bars, but values are positions, so
// the domain fits the data and need not include zero, at most
// DefaultDotsTop dots are drawn unless Top says otherwise, and an Other dot
// (OtherMean) is always a mean.
type DotsOptions struct {
	Common
	RowOptions
}

// Bars draws a bar chart of values by label and writes it as SVG to w. It
// returns the notes that record what was decided for the caller.
func Bars(w io.Writer, labels []string, values []float64, opt BarsOptions) ([]Note, error) {
	s, err := BarsScene(labels, values, opt)
	return writeScene(w, s, err)
}

// BarsScene builds the bar chart's scene without writing it: a figure of
// one untitled panel, the options' title heading the figure.
func BarsScene(labels []string, values []float64, opt BarsOptions) (*Scene, error) {
	return figureScene(opt.Common, gridOptions{}, []Panel{rowPanel(labels, values, opt, false, true)})
}

// Dots draws a dot plot of values by label and writes it as SVG to w.
func Dots(w io.Writer, labels []string, values []float64, opt DotsOptions) ([]Note, error) {
	s, err := DotsScene(labels, values, opt)
	return writeScene(w, s, err)
}

// DotsScene builds the dot plot's scene without writing it.
func DotsScene(labels []string, values []float64, opt DotsOptions) (*Scene, error) {
	return figureScene(opt.Common, gridOptions{}, []Panel{rowPanel(labels, values, BarsOptions{Common: opt.Common, RowOptions: opt.RowOptions}, true, true)})
}

// BarsPanel plans a bar chart for a cell of a figure; the options' title
// is the panel's heading.
func BarsPanel(labels []string, values []float64, opt BarsOptions) Panel {
	return rowPanel(labels, values, opt, false, false)
}

// DotsPanel plans a dot plot for a cell of a figure.
func DotsPanel(labels []string, values []float64, opt DotsOptions) Panel {
	return rowPanel(labels, values, BarsOptions{Common: opt.Common, RowOptions: opt.RowOptions}, true, false)
}

// rowPanel is the Panel of a bar chart or dot plot. A chart drawn alone is
// the whole body of its figure: no heading of its own (the figure's title
// says what it is), the caller's notes already in the frame, and nothing
// above it but the frame's gap.
func rowPanel(labels []string, values []float64, opt BarsOptions, dots, alone bool) Panel {
	return rowChartPanel(opt, alone, func(f *frame, opt BarsOptions) (*rowChart, error) {
		return newRowChart(f, labels, values, opt, dots)
	})
}

// rowChartPanel makes the Panel of a row chart (one value or several per
// category) planned by plan.
func rowChartPanel(opt BarsOptions, alone bool, plan func(f *frame, opt BarsOptions) (*rowChart, error)) Panel {
	if alone {
		opt.Notes = nil
	}
	p := newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		c, err := plan(f, opt)
		if c != nil {
			c.alone = alone
		}
		return c, err
	})
	if alone {
		p.Title = ""
	}
	return p
}

// rowChart is what bars and dots share: one row (or column) per category,
// one value axis. It is the panel plan of both.
type rowChart struct {
	opt  BarsOptions // a dot plot's options, with the bar-only fields zero
	dots bool
	// alone: the chart is its figure's only panel, under the frame's gap
	// rather than a panel's heading.
	alone bool

	f        *frame
	rows     []row
	lo0, hi0 float64    // the panel's own value domain: data, zero for bars, From and To
	dom      axisDomain // the value domain to draw, given by the grid
	cats     axisDomain // the category domain the grid gave
	d0, d1   float64    // the value domain widened to its outer ticks
	ax       axis       // the value axis
	vfmt     scale.Format

	hz rowsFit // horizontal rows, as measured
	vc colsFit // vertical columns, as measured

	// names are the series of a chart of several values per category
	// (nil for one value per category), drawn as layout says.
	names  []string
	layout SeriesLayout
	sr     seriesFit
}

// newRowChart plans a bar chart or dot plot: it validates the data, applies
// Percent, the order, Top and Other, and fixes the panel's own domain.
func newRowChart(f *frame, labels []string, values []float64, opt BarsOptions, dots bool) (*rowChart, error) {
	c := &rowChart{opt: opt, dots: dots, f: f}
	return c.plan(labels, values, nil)
}

// plan builds the rows of the chart from parallel labels and values (and
// with several series, each row's value in each series): the steps bars,
// dots and their series share.
func (c *rowChart) plan(labels []string, values []float64, series [][]float64) (*rowChart, error) {
	f, opt := c.f, c.opt
	if c.opt.Names == nil {
		c.opt.Names = f.c.Names
	}
	// " pts" from a shell quote would print "( pts)" in the axis title.
	c.opt.Unit = strings.TrimSpace(c.opt.Unit)
	if err := checkRows(labels, values); err != nil {
		return nil, err
	}
	all := slices.Clone(values)
	for _, vs := range series {
		for _, v := range vs {
			if !math.IsNaN(v) {
				all = append(all, v)
			}
		}
	}
	if err := firstError(checkFinite("From", c.opt.From), checkFinite("To", c.opt.To), checkSpan("values and bounds", all, bounds(c.opt.From, c.opt.To))); err != nil {
		return nil, err
	}
	for _, n := range opt.Notes {
		f.scene.Note(n.Code, n.Changed, n.Text)
	}
	if err := findLabels(c.opt.Highlight, labels); err != nil {
		return nil, err
	}
	hl := make(map[string]bool, len(c.opt.Highlight))
	for _, h := range c.opt.Highlight {
		hl[h] = true
	}
	c.rows = make([]row, len(labels))
	for i := range labels {
		c.rows[i] = row{label: labels[i], value: values[i], raw: values[i], highlight: hl[labels[i]]}
		if series != nil {
			c.rows[i].series = series[i]
		}
	}
	if c.opt.Percent && series == nil {
		if err := c.toShares(); err != nil {
			return nil, err
		}
	}
	if err := arrange(c.rows, c.opt.Order); err != nil {
		return nil, err
	}
	if err := c.limitRows(); err != nil {
		return nil, err
	}
	if slices.ContainsFunc(c.values(), func(v float64) bool { return math.IsInf(v, 0) }) {
		return nil, &RefusalError{Reason: fmt.Sprintf("the values combined into Other, or a stack's parts, add up to more than the largest number, %.1e", math.MaxFloat64),
			Instead: fmt.Sprintf("show every category with %s -1, combine them with %s mean, or give the values in a larger unit", c.opt.name("Top"), c.opt.name("Other"))}
	}
	// Rows of 100% are ordered and folded by their amounts, then each is
	// made shares of its own total (Other's too, from its summed parts).
	if c.opt.Percent && series != nil {
		if err := c.rowShares(); err != nil {
			return nil, err
		}
	}
	if err := c.domain(); err != nil {
		return nil, err
	}
	c.vfmt = scale.ValueFormat(c.values(), c.opt.Unit)
	x, y := c.domains()
	c.share(x, y)
	return c, nil
}

// additive reports whether values are parts of a whole, which Other may sum.
func (c *rowChart) additive() bool {
	return (c.opt.Additive && !c.opt.Averages) || c.opt.Percent
}

// domains are the value domain (along x for rows, y for columns) and the
// categories along the other axis.
func (c *rowChart) domains() (x, y axisDomain) {
	v := axisDomain{kind: domainNumber, lo: c.lo0, hi: c.hi0, integer: !c.opt.Percent && scale.IsInteger(c.values())}
	k := axisDomain{kind: domainCategory, labels: c.labels()}
	if c.opt.Vertical {
		return k, v
	}
	return v, k
}

// share takes the value domain to draw: with shared scales the grid's
// union, so that the ticks, the nice widening and whole-number steps come
// from it alone and a bar of 100 has one length in every panel.
func (c *rowChart) share(x, y axisDomain) {
	v, k := x, y
	if c.opt.Vertical {
		v, k = y, x
	}
	if v.kind == domainNumber {
		c.dom = v
	}
	if k.kind == domainCategory {
		c.cats = k
	}
}

// catLabels reports whether this panel labels its categories: always,
// unless every panel of the grid has the same list and a panel on the
// outer side says it.
func (c *rowChart) catLabels(e edges) bool {
	if !c.cats.shared || c.cats.mixed {
		return true
	}
	if c.opt.Vertical {
		return e.bottom
	}
	return e.left
}

// valueLabels reports whether this panel labels its value axis: always on
// its own scale, on a shared one only on the grid's outer side.
func (c *rowChart) valueLabels(e edges) bool {
	if !c.dom.shared {
		return true
	}
	if c.opt.Vertical {
		return e.left
	}
	return e.bottom
}

func (c *rowChart) measure(f *frame, cellW float64, e edges) insets {
	if c.names != nil {
		return c.measureSeries(cellW, e)
	}
	if c.opt.Vertical {
		return c.measureColumns(cellW, e)
	}
	return c.measureRows(cellW, e)
}

func (c *rowChart) height(f *frame, plotW, room float64) (float64, error) {
	if c.names != nil {
		return c.heightSeries(room)
	}
	if c.opt.Vertical {
		return c.heightColumns(plotW, room)
	}
	return c.heightRows(room)
}

func (c *rowChart) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	first := len(f.scene.Marks)
	var p placed
	switch {
	case c.names != nil:
		p = c.drawSeries(plot)
	case c.opt.Vertical:
		p = c.drawColumns(plot, e)
	default:
		p = c.drawRows(plot, e)
	}
	p.text, p.marks = c.f.boxesSince(first)
	if c.dots && (c.d0 > 0 || c.d1 < 0) {
		f.scene.Note("dots-domain", false, fmt.Sprintf("the value axis runs from %s to %s, not from zero: a dot's position carries its value, not a length from zero (draw bars to compare amounts)",
			c.vfmt.Format(c.d0), c.vfmt.Format(c.d1)))
	}
	// What the annotation layers read: the values drawn, for a line at
	// their mean or median, written as the value labels write them.
	p.values, p.valueText = c.values(), c.numText
	return p, nil
}

func (c *rowChart) describe() (string, string) {
	d := c.describeText()
	if c.names != nil {
		d = c.describeSeries()
	}
	kind, _, _ := strings.Cut(d, ",")
	return d, kind
}

// exactRoom says that bars and dots round their own marks to pixels (see
// pixelRounding), so a lone chart keeps the room it measured.
func (c *rowChart) exactRoom() {}

// fitTicks chooses the ticks for a value axis of the given length (see
// fitValue) over the domain the grid gave, and settles the domain: bars
// and dots without From/To end on the outer ticks.
func (c *rowChart) fitTicks(length float64, horizontal bool) {
	c.d0, c.d1 = c.dom.lo, c.dom.hi
	// An end the user set is kept where it is, unless a shared domain
	// reaches past it for another panel's data.
	from := c.opt.From != nil && *c.opt.From == c.dom.lo
	to := c.opt.To != nil && *c.opt.To == c.dom.hi
	c.ax = c.f.fitValue(c.d0, c.d1, length, horizontal, valueKind{
		zero: !c.dots, from: from, to: to, integer: c.dom.integer, label: c.tickLabels,
	})
	if t := c.ax.ticks; !from && len(t) > 0 {
		c.d0 = math.Min(c.d0, t[0])
	}
	if t := c.ax.ticks; !to && len(t) > 0 {
		c.d1 = math.Max(c.d1, t[len(t)-1])
	}
}

func (c *rowChart) fill(r row) Colour {
	if r.highlight {
		return c.f.th.accent
	}
	return c.f.th.neutral
}

// insideColour is the colour for value text inside a bar of this fill,
// derived from the bar's hue with 4.5:1 against it (insideLabel); None when
// no such colour exists and the value must sit outside.
func (c *rowChart) insideColour(fill Colour) Colour {
	col, _ := insideLabel(fill)
	return col
}

// wrapLabels writes the category axis: every label wrapped to at most
// maxLines lines of width, each shortened one noted. It returns the axis
// (its band still to be set) with the widest line's width and the most
// lines any label needs.
func (c *rowChart) wrapLabels(width float64, maxLines int, upright bool) (axis, float64, int) {
	cats := make([]catLabel, len(c.rows))
	for i, r := range c.rows {
		cats[i] = catLabel{text: r.label, full: r.label, bold: r.highlight, fill: c.labelFill(r)}
		if r.short != "" {
			cats[i].text = r.short
		}
	}
	a, widest, most, cut := c.f.categoryAxis(cats, 0, width, maxLines, upright)
	for i, r := range c.rows {
		if cut[i] {
			c.f.scene.Note("label-shortened", false, fmt.Sprintf("shortened the label %q to fit; the full text is in its tooltip", r.label))
		}
	}
	return a, widest, most
}

// wrapLabelsQuiet is wrapLabels without its notes, for estimates.
func (c *rowChart) wrapLabelsQuiet(width float64, maxLines int, upright bool) (axis, float64, int) {
	notes := len(c.f.scene.Notes)
	a, widest, most := c.wrapLabels(width, maxLines, upright)
	c.f.scene.Notes = c.f.scene.Notes[:notes]
	return a, widest, most
}

// valueTexts formats every row's value label and measures it.
func (c *rowChart) valueTexts() ([]string, []float64) {
	text := make([]string, len(c.rows))
	width := make([]float64, len(c.rows))
	bare := c.vfmt
	if !scale.IsCurrency(bare.Unit) {
		bare.Unit = ""
	}
	for i, r := range c.rows {
		// The unit is said once, on the first label, where the reader starts
		// (on columns, whose labels must be narrow, the axis title says it).
		text[i] = bare.Format(r.value)
		if i == 0 && (!c.opt.Vertical || c.axisTitle() == "") {
			text[i] = c.vfmt.Format(r.value)
		}
		width[i] = c.f.measure(text[i], c.f.spec.text, false)
	}
	return text, width
}

// markAttrs are the data attributes of a row's mark.
func (c *rowChart) markAttrs(r row) []Attr {
	attrs := []Attr{{"label", r.label}, {"value", dataNumber(r.value)}}
	if c.opt.Percent {
		attrs = append(attrs, Attr{"amount", dataNumber(r.raw)})
	}
	if r.other > 0 {
		attrs = append(attrs, Attr{"combined", fmt.Sprint(r.other)})
	}
	return attrs
}

// labelFill is the colour of a category label: muted for the Other row.
func (c *rowChart) labelFill(r row) Colour {
	if r.other > 0 {
		return c.f.th.muted
	}
	return c.f.th.text
}

// axisTitle names the value axis: what is measured and its unit.
func (c *rowChart) axisTitle() string {
	name := c.opt.ValueName
	if c.opt.Percent {
		total := "total"
		if c.names != nil {
			total = "row total" // a stack of 100% rows
		}
		if name == "" {
			return "Share of " + total + " (%)"
		}
		return "Share of " + total + " " + name + " (%)"
	}
	// A currency sign is on every tick already (see tickLabels).
	if c.opt.Unit != "" && name != "" && !scale.IsCurrency(c.opt.Unit) && !namesUnit(name, c.opt.Unit) {
		return name + " (" + c.opt.Unit + ")"
	}
	return name
}

// labels returns the categories in drawing order.
func (c *rowChart) labels() []string {
	l := make([]string, len(c.rows))
	for i, r := range c.rows {
		l[i] = r.label
	}
	return l
}

// values returns the plotted values of the rows: with series, every
// series value and a stack's totals.
func (c *rowChart) values() []float64 {
	if c.names != nil {
		var v []float64
		for _, r := range c.rows {
			total := 0.0
			for _, x := range r.series {
				if !math.IsNaN(x) {
					v = append(v, x)
					total += x
				}
			}
			if c.layout == LayoutStack {
				v = append(v, total)
			}
		}
		return v
	}
	v := make([]float64, len(c.rows))
	for i, r := range c.rows {
		v[i] = r.value
	}
	return v
}

// tickLabels prints the ticks of the value axis. A unit is said once per
// axis: in the axis title when there is one, else on the outermost tick,
// never on every tick ("3700 g ... 5100 g" makes the reader skip the same
// word at every tick). A currency sign stays on every tick: it is part of
// how an amount is written ("$5"), one character wide, and a bare 5 beside
// $10 would read as another quantity (common practice).
func (c *rowChart) tickLabels(ticks []float64) []string {
	tf := scale.TickFormat(ticks, c.opt.Unit)
	if scale.IsCurrency(c.opt.Unit) {
		return formatAll(tf, ticks)
	}
	bare := tf
	bare.Unit = ""
	out := formatAll(bare, ticks)
	if c.opt.Unit != "" && c.axisTitle() == "" && len(ticks) > 0 {
		out[len(out)-1] = tf.Format(ticks[len(ticks)-1])
	}
	return out
}
