package render

import (
	"fmt"
	"math"

	"plumb/layout"
	"plumb/scale"
)

// rowsFit is what measuring horizontal rows decided, kept for drawing.
type rowsFit struct {
	unit      axisTitleText // the unit line above the rows
	unitH     float64       // its height with the gap under it
	labels    bool          // the panel labels its categories
	ticks     bool          // the panel labels its value axis
	maxLines  int           // lines a category label may take
	cat       axis          // the category axis, labels wrapped
	labelCol  float64       // the widest label line
	linesUsed int           // the most lines any label takes
	vtext     []string      // value labels
	vw        []float64     // their widths
	inside    []bool        // which value labels sit inside their bars
	plotL     float64       // where the label column ends (with its gap), from the cell's left
	rl, rr    float64       // room beyond the value domain's ends: value labels, outer tick labels
	band      float64       // each row's height
}

// measureRows lays out horizontal rows in a cell cellW wide: the label
// column left of the plot, the unit line above, the tick labels below, and
// beyond the value domain's ends the value labels outside the marks. The
// value axis is fitted to the length that leaves, so that the room
// reported is the room the drawn axis needs.
func (c *rowChart) measureRows(cellW float64, e edges) insets {
	f, sp := c.f, c.f.spec
	h := &c.hz
	lh := lineHeight(sp.text)
	h.unit = c.unitLine(cellW)
	h.unitH = c.unitLineH(cellW)
	axisH := sp.gap + lh
	h.ticks = c.valueLabels(e)
	// Rows: two lines of label where height allows, else one.
	h.maxLines = 2
	if fb := f.fixedPlotBottom(); fb > 0 {
		if band := (fb - axisH - (f.plotTop() + h.unitH)) / float64(len(c.rows)); band < 2*lh+sp.gap {
			h.maxLines = 1
		}
	}
	h.labels = c.catLabels(e)
	h.cat, h.labelCol, h.linesUsed = axis{}, 0, 1
	h.plotL = 0
	if h.labels {
		h.cat, h.labelCol, h.linesUsed = c.wrapLabels(cellW*0.38, h.maxLines, true)
		h.plotL = h.labelCol + sp.gap*1.5
	}
	h.vtext, h.vw = c.valueTexts()
	h.inside, h.rl, h.rr = c.fitValueAxis(h.plotL, cellW, h.vw)
	in := insets{left: h.plotL + h.rl, right: h.rr, top: h.unitH}
	if h.ticks {
		in.bottom = axisH
	}
	return in
}

// heightRows gives the rows' height: a band per row as tall as its label
// (a bar's thickness for bars), or the fixed room shared among them.
func (c *rowChart) heightRows(room float64) (float64, error) {
	f, sp, h := c.f, c.f.spec, &c.hz
	lh := lineHeight(sp.text)
	n := len(c.rows)
	if room > 0 {
		h.band = room / float64(n)
		if h.band < lh+sp.gap/2 {
			return 0, fmt.Errorf("%d %s not fit in a %g px high figure with %g px text: show fewer with %s, or give a taller canvas (%s)", n, plural(n, "row does", "rows do"), f.spec.height, sp.text, c.opt.name("Top"), c.opt.name("Height"))
		}
		if h.band < 2*lh+sp.gap && h.linesUsed > 1 && h.labels {
			// The room a grid gave is less than the figure's: one line
			// of label, no wider than the column measured for two.
			h.cat, _, h.linesUsed = c.wrapLabelsQuiet(h.labelCol, 1, true)
		}
		h.cat.band = h.band
		return room, nil
	}
	if c.dots {
		// A dot needs no thickness: rows only as tall as their labels.
		h.band = math.Max(float64(h.linesUsed)*lh+sp.gap, sp.text*1.8)
	} else {
		h.band = math.Max(float64(h.linesUsed)*lh+sp.gap*1.5, sp.text*2.1)
	}
	h.cat.band = h.band
	return float64(n) * h.band, nil
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

// drawRows draws horizontal bars or dots, one row per category, with the
// value domain spanning the plot box.
func (c *rowChart) drawRows(plot layout.Box, e edges) placed {
	f, sp, h := c.f, c.f.spec, &c.hz
	c.fitTicks(plot.W, true)
	g := rowGeom{top: plot.Y, band: h.band, radius: sp.text * 0.36, plotL: plot.X - h.rl, x0: plot.X, x1: plot.X + plot.W}
	g.markH = math.Min(math.Max(g.band*0.7, sp.text*0.9), g.band-sp.gap/2)
	g.markH = math.Min(g.markH, math.Max(sp.text*2.4, g.band*0.5))
	g.xs = scale.Linear{D0: c.d0, D1: c.d1, R0: g.x0, R1: g.x1}
	g.zero = round2(g.xs.Map(0))
	bottom := g.top + float64(len(c.rows))*g.band
	c.drawUnitLine(&g, h.unit, plot.Y-h.unitH, plot.X-h.plotL-h.rl, plot.X+plot.W+h.rr)
	c.drawAxisBelow(&g, bottom, h.ticks)
	k := (g.x1 - g.x0) / (c.d1 - c.d0)
	p := placed{xs: g.xs, horizontal: true, cats: make([]catPlace, len(c.rows))}
	dropped := 0
	for i, r := range c.rows {
		inside, vtext := h.inside[i], h.vtext[i]
		if inside && math.Abs(r.value)*k < h.vw[i]+2*sp.gap {
			// The grid gave a shorter axis than measured: beside the bar
			// if the room measured holds it, else the axis says the value.
			inside = false
			xv := g.xs.Map(r.value)
			if r.value < 0 && xv-sp.gap-h.vw[i] < plot.X-h.rl || r.value >= 0 && xv+sp.gap+h.vw[i] > plot.X+plot.W+h.rr {
				vtext = ""
				dropped++
			}
		}
		if h.labels {
			f.drawTick(h.cat, axisDraw{vertical: true, pos: scale.Linear{R0: g.top}, labelAt: g.plotL - sp.gap*1.5, labels: true}, i)
		}
		end := c.drawRow(&g, i, r, vtext, inside)
		p.cats[i] = catPlace{label: r.label, centre: g.top + (float64(i)+0.5)*g.band, size: g.band, end: end}
	}
	if dropped > 0 {
		f.scene.Note("value-labels-dropped", false, fmt.Sprintf("left out %d value %s that fit neither in nor beside %s bars in this panel; the axis carries the values", dropped, plural(dropped, "label", "labels"), plural(dropped, "its", "their")))
	}
	return p
}

// fitValueAxis sets the pixel ends of the value domain in a cell from
// plotL to right, leaving room beyond the domain ends for the value labels
// outside the marks and for the outer tick labels, and returns that room
// (rl, rr). It first assumes every value label is outside; the labels that
// then fit inside their bars give their room back (which only lengthens
// the bars). It reports which labels sit inside.
func (c *rowChart) fitValueAxis(plotL, right float64, vw []float64) (inside []bool, rl, rr float64) {
	sp := c.f.spec
	inside = make([]bool, len(c.rows))
	radius := sp.text * 0.36
	var x0, x1 float64
	reserve := func() (l, r float64) {
		for i, row := range c.rows {
			if inside[i] {
				continue
			}
			need := vw[i] + sp.gap
			if c.dots {
				need += radius
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
		x0, x1 = c.placeAxis(plotL, right, rl, rr)
	}
	place()
	if c.dots {
		return inside, x0 - plotL, right - x1
	}
	// Value labels sit outside the bar ends, in the text colour: the bar
	// keeps its full length and one colour, and the label reads as text on
	// the page like every other label. Only when the room they take would
	// cost the bars more than a quarter of their row (maxLabelShare) do the
	// labels of the bars long enough to hold them move inside, which gives
	// that room back where it is taken: at the longest bars.
	row := right - plotL
	for {
		rl, rr := reserve()
		if row <= 0 || rl+rr <= maxLabelShare*row {
			return inside, x0 - plotL, right - x1
		}
		// The labels that set the room on the side taking more of it go
		// in, if their bars hold them: the fewest labels move, and a label
		// that cannot move leaves the others outside.
		side := math.Max(rl, rr)
		k := (x1 - x0) / (c.d1 - c.d0)
		var move []int
		for i, r := range c.rows {
			if inside[i] || (r.value < 0) != (rl > rr) || vw[i]+sp.gap < side-1e-9 {
				continue
			}
			if math.Abs(r.value)*k < vw[i]+2*sp.gap || c.insideColour(c.fill(r)).IsNone() {
				return inside, x0 - plotL, right - x1
			}
			move = append(move, i)
		}
		if len(move) == 0 {
			return inside, x0 - plotL, right - x1
		}
		for _, i := range move {
			inside[i] = true
		}
		place()
	}
}

// placeAxis sets the pixel ends of the value domain in a cell from plotL
// to right with room rl and rr beyond them, and fits the ticks to the
// length between; the outer tick labels, centred on their ticks, widen
// that room until they stay in the cell.
func (c *rowChart) placeAxis(plotL, right, rl, rr float64) (x0, x1 float64) {
	f, sp := c.f, c.f.spec
	for pass := 0; pass < 3; pass++ {
		x0, x1 = plotL+rl, right-rr
		c.fitTicks(x1-x0, true)
		labels := c.ax.labels
		if k := len(labels); k > 0 {
			lastHalf := f.measure(labels[k-1], sp.text, false) / 2
			if x1+lastHalf > right {
				rr = math.Max(rr, lastHalf)
				continue
			}
			// A bound far below zero (a first label like "−1000×10²⁷")
			// beside short category labels reaches past the left edge.
			if firstHalf := f.measure(labels[0], sp.text, false) / 2; x0-firstHalf < 0 {
				rl = math.Max(rl, firstHalf-plotL)
				continue
			}
		}
		break
	}
	return x0, x1
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
// category label column (38% of the cell's width, see measureRows).
func (c *rowChart) unitLine(cellW float64) axisTitleText {
	title := c.axisTitle()
	if title == "" {
		return axisTitleText{}
	}
	return c.f.axisTitle(title, cellW*0.62-c.f.spec.gap*1.5)
}

// unitLineH is the height the unit line takes above the rows, with the gap
// that joins it to them.
func (c *rowChart) unitLineH(cellW float64) float64 {
	t := c.unitLine(cellW)
	if len(t.lines) == 0 {
		return 0
	}
	return t.height(lineHeight(c.f.spec.text)) + c.f.spec.gap
}

// drawUnitLine sets the unit line at top, starting where the value axis
// starts: it is read before the data, as the heading of the bars' column,
// and it names the axis whose ticks run below. A line longer than the room
// right of that point moves left, never past the cell's left edge.
func (c *rowChart) drawUnitLine(g *rowGeom, t axisTitleText, top, left, right float64) {
	if len(t.lines) == 0 {
		return
	}
	f, sp := c.f, c.f.spec
	widest := 0.0
	for _, l := range t.lines {
		widest = math.Max(widest, f.measure(l, sp.text, false))
	}
	x := math.Max(math.Min(g.x0, right-widest), math.Min(g.plotL, right-widest))
	f.drawAxisTitle(t, round2(math.Max(x, left)), top)
}

// drawAxisBelow draws the grid, the tick labels under the rows when labels
// is set, and the zero baseline. The grid comes first so that marks draw
// over it.
func (c *rowChart) drawAxisBelow(g *rowGeom, bottom float64, labels bool) {
	f, sp := c.f, c.f.spec
	d := axisDraw{pos: g.xs, from: g.top, to: bottom, labelAt: bottom + sp.gap + f.fonts.Face(false).Ascent(sp.text), labels: labels, baseline: !c.dots}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.draw(c.ax, d)
	f.scene.Add(Mark{Kind: GroupEnd})
	if !c.dots {
		f.drawBaseline(d)
	}
}

// drawRow draws row i's bar or dot and its value label, after its label.
// It returns the x of the mark's far end.
func (c *rowChart) drawRow(g *rowGeom, i int, r row, vtext string, inside bool) float64 {
	f, sp := c.f, c.f.spec
	face := f.fonts.Face(false)
	cy := g.top + (float64(i)+0.5)*g.band
	textY := cy + (face.Ascent(sp.text)-face.Descent(sp.text))/2
	xv := round2(g.xs.Map(r.value))
	if c.dots {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-guide", Lines: [][]Point{{{g.x0, round2(cy)}, {xv, round2(cy)}}}, Stroke: f.th.context, StrokeWidth: 1, Join: JoinRound, Cap: CapRound, Dash: []float64{1, 3}})
		f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark", X: xv, Y: cy, R: g.radius, Fill: c.fill(r), Attrs: c.markAttrs(r)})
		f.text(xv+g.radius+sp.gap, textY, vtext, sp.text, false, f.th.text, "plumb-value", Start)
		return xv + g.radius
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
	if vtext == "" {
		return xv
	}
	if (r.value < 0) != inside {
		f.text(xv-sp.gap, textY, vtext, sp.text, false, fill, "plumb-value", End)
	} else {
		f.text(xv+sp.gap, textY, vtext, sp.text, false, fill, "plumb-value", Start)
	}
	return xv
}
