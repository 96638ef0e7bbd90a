package render

import (
	"fmt"
	"io"
	"math"
	"strings"

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
	Percent  bool // show each value as a share of the total
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
	if err != nil {
		return nil, err
	}
	return s.Notes, WriteSVG(w, s)
}

// BarsScene builds the bar chart's scene without writing it.
func BarsScene(labels []string, values []float64, opt BarsOptions) (*Scene, error) {
	c := rowChart{opt: opt}
	return c.build(labels, values)
}

// Dots draws a dot plot of values by label and writes it as SVG to w.
func Dots(w io.Writer, labels []string, values []float64, opt DotsOptions) ([]Note, error) {
	s, err := DotsScene(labels, values, opt)
	if err != nil {
		return nil, err
	}
	return s.Notes, WriteSVG(w, s)
}

// DotsScene builds the dot plot's scene without writing it.
func DotsScene(labels []string, values []float64, opt DotsOptions) (*Scene, error) {
	c := rowChart{opt: BarsOptions{Common: opt.Common, RowOptions: opt.RowOptions}, dots: true}
	return c.build(labels, values)
}

// rowChart is what bars and dots share: one row (or column) per category,
// one value axis.
type rowChart struct {
	opt  BarsOptions // a dot plot's options, with the bar-only fields zero
	dots bool

	f        *frame
	rows     []row
	d0, d1   float64 // value domain
	lo0, hi0 float64 // the domain before it was widened to nice ticks
	ax       axis    // the value axis
	vfmt     scale.Format
}

// additive reports whether values are parts of a whole, which Other may sum.
func (c *rowChart) additive() bool {
	return (c.opt.Additive && !c.opt.Averages) || c.opt.Percent
}

func (c *rowChart) build(labels []string, values []float64) (*Scene, error) {
	// " pts" from a shell quote would print "( pts)" in the axis title.
	c.opt.Unit = strings.TrimSpace(c.opt.Unit)
	if err := checkRows(labels, values); err != nil {
		return nil, err
	}
	if err := firstError(checkFinite("From", c.opt.From), checkFinite("To", c.opt.To), checkSpan("values and bounds", values, bounds(c.opt.From, c.opt.To))); err != nil {
		return nil, err
	}
	f, err := newFrame(c.opt.Common)
	if err != nil {
		return nil, err
	}
	c.f = f
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
	}
	if c.opt.Percent {
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
	if err := c.domain(); err != nil {
		return nil, err
	}
	c.vfmt = scale.ValueFormat(c.values(), c.opt.Unit)
	var bottom float64
	if c.opt.Vertical {
		bottom, err = c.layoutColumns()
	} else {
		bottom, err = c.layoutRows()
	}
	if err != nil {
		return nil, err
	}
	f.scene.Desc = c.describe()
	if f.scene.Title == "" {
		// Untitled figures still need an accessible name.
		f.scene.Title = c.accessibleTitle()
	}
	return f.finish(bottom), nil
}

// fitTicks chooses the ticks for an axis of the given length (see
// fitValue) and settles the domain: bars and dots without From/To end on
// the outer ticks.
func (c *rowChart) fitTicks(length float64, horizontal bool) {
	c.d0, c.d1 = c.lo0, c.hi0
	c.ax = c.f.fitValue(c.d0, c.d1, length, horizontal, valueKind{
		zero: !c.dots, from: c.opt.From != nil, to: c.opt.To != nil,
		integer: !c.opt.Percent && scale.IsInteger(c.values()), label: c.tickLabels,
	})
	if t := c.ax.ticks; c.opt.From == nil && len(t) > 0 {
		c.d0 = math.Min(c.d0, t[0])
	}
	if t := c.ax.ticks; c.opt.To == nil && len(t) > 0 {
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

// layoutRows draws horizontal bars or dots, one row per category, and
// returns the y under the axis.
func (c *rowChart) layoutRows() (float64, error) {
	f, sp := c.f, c.f.spec
	lh := lineHeight(sp.text)
	unit := c.unitLine()
	top := f.plotTop() + c.unitLineH()
	axisH := sp.gap + lh
	// Rows: two lines of label where height allows, else one.
	maxLines, band := 2, 0.0
	if fb := f.fixedPlotBottom(); fb > 0 {
		n := len(c.rows)
		band = (fb - axisH - top) / float64(n)
		if band < 2*lh+sp.gap {
			maxLines = 1
		}
		if band < lh+sp.gap/2 {
			return 0, fmt.Errorf("%d %s not fit in a %g px high figure with %g px text: show fewer with %s, or give a taller canvas (%s)", n, plural(n, "row does", "rows do"), f.spec.height, sp.text, c.opt.name("Top"), c.opt.name("Height"))
		}
	}
	wrapped, labelCol, linesUsed := c.wrapLabels((f.width-2*sp.pad)*0.38, maxLines)
	if band == 0 && c.dots {
		// A dot needs no thickness: rows only as tall as their labels.
		band = math.Max(float64(linesUsed)*lh+sp.gap, sp.text*1.8)
	} else if band == 0 {
		band = math.Max(float64(linesUsed)*lh+sp.gap*1.5, sp.text*2.1)
	}
	g := rowGeom{top: top, band: band, radius: sp.text * 0.36, plotL: sp.pad + labelCol + sp.gap*1.5}
	g.markH = math.Min(math.Max(band*0.7, sp.text*0.9), band-sp.gap/2)
	g.markH = math.Min(g.markH, math.Max(sp.text*2.4, band*0.5))
	vtext, vw := c.valueTexts()
	inside := c.fitValueAxis(&g, vw)
	g.xs = scale.Linear{D0: c.d0, D1: c.d1, R0: g.x0, R1: g.x1}
	g.zero = round2(g.xs.Map(0))
	bottom := top + float64(len(c.rows))*band
	c.drawUnitLine(&g, unit)
	axisBottom := c.drawAxisBelow(&g, bottom)
	for i, r := range c.rows {
		c.drawRow(&g, i, r, wrapped[i], vtext[i], inside[i])
	}
	return axisBottom, nil
}

// rowGeom is the geometry shared by the rows of a horizontal chart.
type rowGeom struct {
	top, band     float64 // first row's top and each row's height
	markH, radius float64 // bar thickness, dot radius
	plotL         float64 // left edge of the plot; labels end just before it
	x0, x1        float64 // pixel ends of the value domain
	xs            scale.Linear
	zero          float64 // pixel x of value 0
}

// wrapLabels wraps every category label to at most maxLines lines of
// width, noting each shortened one, and returns the lines with the widest
// line's width and the most lines any label needs.
func (c *rowChart) wrapLabels(width float64, maxLines int) ([][]string, float64, int) {
	f, size := c.f, c.f.spec.text
	wrapped := make([][]string, len(c.rows))
	widest, most := 0.0, 1
	for i, r := range c.rows {
		text := r.label
		if r.short != "" {
			text = r.short
		}
		lines, cut := f.wrap(text, size, r.highlight, width, maxLines)
		wrapped[i] = lines
		if cut {
			f.scene.Note("label-shortened", false, fmt.Sprintf("shortened the label %q to fit; the full text is in its tooltip", r.label))
		}
		most = max(most, len(lines))
		for _, l := range lines {
			widest = math.Max(widest, f.measure(l, size, r.highlight))
		}
	}
	return wrapped, widest, most
}

// wrapLabelsQuiet is wrapLabels without its notes, for estimates.
func (c *rowChart) wrapLabelsQuiet(width float64, maxLines int) ([][]string, float64, int) {
	notes := len(c.f.scene.Notes)
	w, widest, most := c.wrapLabels(width, maxLines)
	c.f.scene.Notes = c.f.scene.Notes[:notes]
	return w, widest, most
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

// fitValueAxis sets the pixel ends of the value domain (g.x0, g.x1) and the
// ticks, leaving room beyond the domain ends for the value labels outside
// the marks and for the outer tick labels. It first assumes every value
// label is outside; the labels that then fit inside their bars give their
// room back (which only lengthens the bars). It reports which labels sit
// inside.
func (c *rowChart) fitValueAxis(g *rowGeom, vw []float64) []bool {
	f, sp := c.f, c.f.spec
	right := f.width - sp.pad
	inside := make([]bool, len(c.rows))
	reserve := func() (l, r float64) {
		for i, row := range c.rows {
			if inside[i] {
				continue
			}
			need := vw[i] + sp.gap
			if c.dots {
				need += g.radius
			}
			if row.value < 0 && !c.dots {
				l = math.Max(l, need)
			} else {
				r = math.Max(r, need)
			}
		}
		return l, r
	}
	place := func() {
		rl, rr := reserve()
		for pass := 0; pass < 3; pass++ {
			g.x0, g.x1 = g.plotL+rl, right-rr
			c.fitTicks(g.x1-g.x0, true)
			// The end tick labels are centred on their ticks: keep them on the canvas.
			labels := c.ax.labels
			if k := len(labels); k > 0 {
				lastHalf := f.measure(labels[k-1], sp.text, false) / 2
				if g.x1+lastHalf > right {
					rr = math.Max(rr, lastHalf)
					continue
				}
				// A bound far below zero (a first label like "−1000×10²⁷")
				// beside short category labels reaches past the left edge.
				if firstHalf := f.measure(labels[0], sp.text, false) / 2; g.x0-firstHalf < sp.pad {
					rl = math.Max(rl, sp.pad+firstHalf-g.plotL)
					continue
				}
			}
			break
		}
	}
	place()
	if c.dots {
		return inside
	}
	// Value labels sit outside the bar ends, in the text colour: the bar
	// keeps its full length and one colour, and the label reads as text on
	// the page like every other label. Only when the room they take would
	// cost the bars more than a quarter of their row (maxLabelShare) do the
	// labels of the bars long enough to hold them move inside, which gives
	// that room back where it is taken: at the longest bars.
	row := right - g.plotL
	for {
		rl, rr := reserve()
		if row <= 0 || rl+rr <= maxLabelShare*row {
			return inside
		}
		// The labels that set the room on the side taking more of it go
		// in, if their bars hold them: the fewest labels move, and a label
		// that cannot move leaves the others outside.
		side := math.Max(rl, rr)
		k := (g.x1 - g.x0) / (c.d1 - c.d0)
		var move []int
		for i, r := range c.rows {
			if inside[i] || (r.value < 0) != (rl > rr) || vw[i]+sp.gap < side-1e-9 {
				continue
			}
			if math.Abs(r.value)*k < vw[i]+2*sp.gap || c.insideColour(c.fill(r)).IsNone() {
				return inside
			}
			move = append(move, i)
		}
		if len(move) == 0 {
			return inside
		}
		for _, i := range move {
			inside[i] = true
		}
		place()
	}
}

// maxLabelShare is the most of a bar row the value labels outside the bars
// may take. The row's length is the bar chart's resolution: every pixel
// given to labels shortens every bar and the differences between them by
// the same factor. A quarter is the trade plumb makes (its own choice): at
// 640 px a label of eight characters stays outside; on a narrow canvas the
// labels move inside rather than shrink the bars further.
const maxLabelShare = 0.25

// unitLine is the value axis title (what is measured, in what unit) of a
// chart with horizontal rows, wrapped to the room right of the widest
// category label column (38% of the inner width, see layoutRows).
func (c *rowChart) unitLine() axisTitleText {
	title := c.axisTitle()
	if title == "" {
		return axisTitleText{}
	}
	sp := c.f.spec
	return c.f.axisTitle(title, (c.f.width-2*sp.pad)*0.62-sp.gap*1.5)
}

// unitLineH is the height the unit line takes above the rows, with the gap
// that joins it to them.
func (c *rowChart) unitLineH() float64 {
	t := c.unitLine()
	if len(t.lines) == 0 {
		return 0
	}
	return t.height(lineHeight(c.f.spec.text)) + c.f.spec.gap
}

// drawUnitLine sets the unit line above the rows, starting where the value
// axis starts: it is read before the data, as the heading of the bars'
// column, and it names the axis whose ticks run below. A line longer than
// the room right of that point moves left, never past the plot's edge.
func (c *rowChart) drawUnitLine(g *rowGeom, t axisTitleText) {
	if len(t.lines) == 0 {
		return
	}
	f, sp := c.f, c.f.spec
	widest := 0.0
	for _, l := range t.lines {
		widest = math.Max(widest, f.measure(l, sp.text, false))
	}
	x := math.Max(math.Min(g.x0, f.width-sp.pad-widest), math.Min(g.plotL, f.width-sp.pad-widest))
	f.drawAxisTitle(t, round2(math.Max(x, sp.pad)), f.plotTop())
}

// drawAxisBelow draws the grid, the tick labels under the rows and the
// zero baseline, and returns the y under the axis. The grid comes first so
// that marks draw over it.
func (c *rowChart) drawAxisBelow(g *rowGeom, bottom float64) float64 {
	f, sp := c.f, c.f.spec
	d := axisDraw{pos: g.xs, from: g.top, to: bottom, labelAt: bottom + sp.gap + f.fonts.Face(false).Ascent(sp.text), labels: true, baseline: !c.dots}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.draw(c.ax, d)
	f.scene.Add(Mark{Kind: GroupEnd})
	if !c.dots {
		f.drawBaseline(d)
	}
	return bottom + sp.gap + lineHeight(sp.text)
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

// tooltip is the full label when the drawn lines shortened it.
func tooltip(label string, lines []string) string {
	if strings.Join(lines, " ") != label {
		return label
	}
	return ""
}

// drawRow draws row i: its label right-aligned against the plot, its bar or
// dot, and its value label.
func (c *rowChart) drawRow(g *rowGeom, i int, r row, lines []string, vtext string, inside bool) {
	f, sp := c.f, c.f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	cy := g.top + (float64(i)+0.5)*g.band
	textY := cy + (face.Ascent(sp.text)-face.Descent(sp.text))/2
	tip := tooltip(r.label, lines)
	for j, l := range lines {
		y := textY + (float64(j)-float64(len(lines)-1)/2)*lh
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: g.plotL - sp.gap*1.5, Y: y, Text: l, Size: sp.text, Bold: r.highlight, Fill: c.labelFill(r), Anchor: End, Tooltip: tip})
	}
	xv := round2(g.xs.Map(r.value))
	if c.dots {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-guide", Lines: [][]Point{{{g.x0, round2(cy)}, {xv, round2(cy)}}}, Stroke: f.th.context, StrokeWidth: 1, Join: JoinRound, Cap: CapRound, Dash: []float64{1, 3}})
		f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark", X: xv, Y: cy, R: g.radius, Fill: c.fill(r), Attrs: c.markAttrs(r)})
		f.text(xv+g.radius+sp.gap, textY, vtext, sp.text, false, f.th.text, "plumb-value", Start)
		return
	}
	lo, hi := g.zero, xv
	if r.value < 0 {
		lo, hi = xv, g.zero
	}
	f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark", X: lo, Y: cy - g.markH/2, W: hi - lo, H: g.markH, Fill: c.fill(r), Attrs: c.markAttrs(r)})
	fill := f.th.text
	if inside {
		fill = c.insideColour(c.fill(r))
	}
	// Inside a bar the label sits against its end; outside, beyond it.
	if (r.value < 0) != inside {
		f.text(xv-sp.gap, textY, vtext, sp.text, false, fill, "plumb-value", End)
	} else {
		f.text(xv+sp.gap, textY, vtext, sp.text, false, fill, "plumb-value", Start)
	}
}

// axisTitle names the value axis: what is measured and its unit.
func (c *rowChart) axisTitle() string {
	name := c.opt.ValueName
	if c.opt.Percent {
		if name == "" {
			return "Share of total (%)"
		}
		return "Share of total " + name + " (%)"
	}
	// A currency sign is on every tick already (see tickLabels).
	if c.opt.Unit != "" && name != "" && !scale.IsCurrency(c.opt.Unit) && !namesUnit(name, c.opt.Unit) {
		return name + " (" + c.opt.Unit + ")"
	}
	return name
}

// namesUnit reports whether a value name already says its unit, as
// "Weight (g)" or a column called "rainfall_mm" does, so the axis title
// does not say it twice.
func namesUnit(name, unit string) bool {
	n, u := strings.ToLower(name), strings.ToLower(unit)
	for _, form := range []string{"(" + u + ")", "_" + u, " " + u, "[" + u + "]"} {
		if strings.Contains(n, form+" ") || strings.HasSuffix(n, form) {
			return true
		}
	}
	return false
}

// values returns the plotted values of the rows.
func (c *rowChart) values() []float64 {
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
