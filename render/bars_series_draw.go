package render

import (
	"fmt"
	"math"
	"slices"

	"plumb/layout"
	"plumb/scale"
)

// seriesFit is what measuring a chart of several series per category
// decided, kept for drawing.
type seriesFit struct {
	unit      axisTitleText
	unitH     float64
	key       [][]int // the series named on each line of the key
	keyX      float64 // where the key starts, from the cell's left
	keyH      float64 // the room above the rows for the series' names
	labels    bool
	ticks     bool
	maxLines  int
	cat       axis
	labelCol  float64
	linesUsed int
	plotL     float64
	rl, rr    float64
	band      float64
	colours   []Colour
}

// keyLines flows the series' names, each after its swatch, into lines no
// wider than width.
func (c *rowChart) keyLines(width float64) [][]int {
	var lines [][]int
	x := 0.0
	for s := range c.names {
		w := c.keyItemW(s)
		if len(lines) == 0 || (x > 0 && x+w > width) {
			lines = append(lines, nil)
			x = 0
		}
		lines[len(lines)-1] = append(lines[len(lines)-1], s)
		x += w + c.f.spec.gap*1.5
	}
	return lines
}

// keyItemW is the width of series s in the key: swatch, gap, name.
func (c *rowChart) keyItemW(s int) float64 {
	sp := c.f.spec
	return sp.text*0.8 + sp.gap/2 + c.f.measure(c.names[s], sp.text, false)
}

// measureSeries lays out rows of several series in a cell cellW wide: the
// unit line and the series' names above the rows, the label column left,
// the value labels (a stack's totals, side-by-side bars' values) beyond the
// value domain's ends, the tick labels below.
func (c *rowChart) measureSeries(cellW float64, e edges) insets {
	f, sp, h := c.f, c.f.spec, &c.sr
	lh := lineHeight(sp.text)
	h.colours = c.seriesColours()
	h.unit, h.unitH = c.unitLine(cellW), c.unitLineH(cellW)
	h.ticks, h.labels = c.valueLabels(e), c.catLabels(e)
	axisH := sp.gap + lh
	h.maxLines = 2
	if fb := f.fixedPlotBottom(); fb > 0 {
		if band := (fb - axisH - (f.plotTop() + h.unitH + lh + sp.gap/2)) / float64(len(c.rows)); band < 2*lh+sp.gap {
			h.maxLines = 1
		}
	}
	h.cat, h.labelCol, h.linesUsed, h.plotL = axis{}, 0, 1, 0
	if h.labels {
		h.cat, h.labelCol, h.linesUsed = c.wrapLabels(cellW*0.38, h.maxLines, true)
		h.plotL = h.labelCol + sp.gap*1.5
	}
	rl, rr := 0.0, 0.0
	texts := c.seriesValueTexts()
	for i, r := range c.rows {
		for s, t := range texts[i] {
			if t == "" {
				continue
			}
			need := f.measure(t, sp.text, false) + sp.gap
			if c.layout == LayoutSide && r.series[s] < 0 {
				rl = math.Max(rl, need)
			} else {
				rr = math.Max(rr, need)
			}
		}
	}
	if c.layout == LayoutDots {
		rl, rr = sp.text*0.36, sp.text*0.36 // a dot at a domain end
	}
	x0, x1 := c.placeAxis(h.plotL, cellW, rl, rr)
	h.rl, h.rr = x0-h.plotL, cellW-x1
	// The key starts where the value axis does, under the unit line, or
	// at the cell's edge when it would need more lines there.
	h.key, h.keyX = c.keyLines(cellW-x0), x0
	if all := c.keyLines(cellW); len(all) < len(h.key) {
		h.key, h.keyX = all, 0
	}
	h.keyH = float64(max(1, len(h.key)))*lh + sp.gap/2
	if len(c.names) == 1 {
		h.key, h.keyH = nil, 0 // one series needs no name beside the unit line
	}
	in := insets{left: h.plotL + h.rl, right: h.rr, top: h.unitH + h.keyH}
	if h.ticks {
		in.bottom = axisH
	}
	return in
}

// seriesValueTexts are the value labels of each row: a stack's total
// (none for rows of 100%), each side-by-side bar's value, none for dots,
// whose values the axis carries. The unit is said on the first.
func (c *rowChart) seriesValueTexts() [][]string {
	out := make([][]string, len(c.rows))
	bare := c.vfmt
	if !scale.IsCurrency(bare.Unit) {
		bare.Unit = ""
	}
	first := true
	say := func(v float64) string {
		if first {
			first = false
			return c.vfmt.Format(v)
		}
		return bare.Format(v)
	}
	for i, r := range c.rows {
		out[i] = make([]string, len(r.series))
		switch c.layout {
		case LayoutStack:
			if !c.opt.Percent {
				out[i] = []string{say(rowTotal(r))}
			}
		case LayoutSide:
			for s, v := range r.series {
				if !math.IsNaN(v) {
					out[i][s] = say(v)
				}
			}
		}
	}
	return out
}

// rowTotal is the sum of a row's series values.
func rowTotal(r row) float64 {
	t := 0.0
	for _, v := range r.series {
		if !math.IsNaN(v) {
			t += v
		}
	}
	return t
}

// seriesBand is the height a row of this layout needs.
func (c *rowChart) seriesBand(lines int) (want, least float64) {
	sp := c.f.spec
	lh := lineHeight(sp.text)
	switch c.layout {
	case LayoutDots:
		return math.Max(float64(lines)*lh+sp.gap, sp.text*1.8), lh + sp.gap/2
	case LayoutSide:
		k := float64(len(c.names))
		return math.Max(float64(lines)*lh, k*lh) + sp.gap*1.5, k*sp.text*0.6 + sp.gap/2
	}
	return math.Max(float64(lines)*lh+sp.gap*1.5, sp.text*2.1), lh + sp.gap/2
}

func (c *rowChart) heightSeries(room float64) (float64, error) {
	f, sp, h := c.f, c.f.spec, &c.sr
	lh := lineHeight(sp.text)
	n := len(c.rows)
	want, least := c.seriesBand(h.linesUsed)
	if room <= 0 {
		h.band = want
		h.cat.band = h.band
		return float64(n) * h.band, nil
	}
	h.band = room / float64(n)
	if h.band < least {
		return 0, fmt.Errorf("%d %s not fit in a %g px high figure with %g px text: show fewer with %s, or give a taller canvas (%s)", n, plural(n, "row does", "rows do"), f.spec.height, sp.text, c.opt.name("Top"), c.opt.name("Height"))
	}
	if h.band < 2*lh+sp.gap && h.linesUsed > 1 && h.labels {
		h.cat, _, h.linesUsed = c.wrapLabelsQuiet(h.labelCol, 1, true)
	}
	h.cat.band = h.band
	return room, nil
}

// drawSeries draws the rows of several series into the plot box.
func (c *rowChart) drawSeries(plot layout.Box) placed {
	f, sp, h := c.f, c.f.spec, &c.sr
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	c.fitTicks(plot.W, true)
	g := rowGeom{top: plot.Y, band: h.band, radius: sp.text * 0.36, plotL: plot.X - h.rl, x0: plot.X, x1: plot.X + plot.W}
	g.markH = math.Min(math.Max(g.band*0.7, sp.text*0.9), g.band-sp.gap/2)
	g.markH = math.Min(g.markH, math.Max(sp.text*2.4, g.band*0.5))
	g.xs = scale.Linear{D0: c.d0, D1: c.d1, R0: g.x0, R1: g.x1}
	g.zero = round2(g.xs.Map(0))
	left, right := g.plotL-h.plotL, plot.X+plot.W+h.rr
	bottom := g.top + float64(len(c.rows))*g.band
	c.drawUnitLine(&g, h.unit, plot.Y-h.keyH-h.unitH, left, right)
	c.drawAxisBelow(&g, bottom, h.ticks)
	if h.keyH > 0 {
		c.drawSeriesNames(&g, plot.Y-h.keyH, left, right)
	}
	texts := c.seriesValueTexts()
	k := float64(len(c.names))
	inner := g.band - sp.gap*1.5
	sub := inner / k
	showSide := sub >= asc+desc
	if c.layout == LayoutSide && !showSide {
		f.scene.Note("value-labels-dropped", false, "left out the value labels: the rows are too short for one line per bar; the axis carries the values")
	}
	p := placed{xs: g.xs, horizontal: true, cats: make([]catPlace, len(c.rows))}
	for i, r := range c.rows {
		if h.labels {
			f.drawTick(h.cat, axisDraw{vertical: true, pos: scale.Linear{R0: g.top}, labelAt: g.plotL - sp.gap*1.5, labels: true}, i)
		}
		cy := g.top + (float64(i)+0.5)*g.band
		textY := cy + (asc-desc)/2
		end := g.zero
		switch c.layout {
		case LayoutDots:
			end = c.drawDotsRow(&g, r, cy)
		case LayoutStack:
			cum := 0.0
			for s, v := range r.series {
				if math.IsNaN(v) || v == 0 {
					continue
				}
				x0, x1 := round2(g.xs.Map(cum)), round2(g.xs.Map(cum+v))
				// data-start is where the segment starts on the value axis.
				attrs := append(c.seriesAttrs(r, s), Attr{"start", dataNumber(cum)})
				f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark", X: x0, Y: cy - g.markH/2, W: x1 - x0, H: g.markH, Fill: h.colours[s], Attrs: attrs})
				cum += v
			}
			end = round2(g.xs.Map(cum))
			if t := texts[i]; len(t) > 0 && t[0] != "" {
				f.text(end+sp.gap, textY, t[0], sp.text, false, f.th.text, "plumb-value", Start)
			}
		case LayoutSide:
			for s, v := range r.series {
				if math.IsNaN(v) {
					continue
				}
				ys := cy - inner/2 + float64(s)*sub
				xv := round2(g.xs.Map(v))
				lo, hi := g.zero, xv
				if v < 0 {
					lo, hi = xv, g.zero
				}
				f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark", X: lo, Y: round2(ys + sub*0.05), W: hi - lo, H: round2(sub * 0.9), Fill: h.colours[s], Attrs: c.seriesAttrs(r, s)})
				if showSide && texts[i][s] != "" {
					ty := ys + sub/2 + (asc-desc)/2
					if v < 0 {
						f.text(xv-sp.gap, ty, texts[i][s], sp.text, false, f.th.text, "plumb-value", End)
					} else {
						f.text(xv+sp.gap, ty, texts[i][s], sp.text, false, f.th.text, "plumb-value", Start)
					}
				}
				if math.Abs(xv-g.zero) > math.Abs(end-g.zero) {
					end = xv
				}
			}
		}
		p.cats[i] = catPlace{label: r.label, centre: cy, size: g.band, end: end}
	}
	return p
}

// drawDotsRow draws one row of dots: a dotted guide from the axis start to
// the lowest, a line from the lowest to the highest (the row's spread, read
// at a glance), and a dot per series. It returns the highest dot's far edge.
func (c *rowChart) drawDotsRow(g *rowGeom, r row, cy float64) float64 {
	f, h := c.f, &c.sr
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range r.series {
		if !math.IsNaN(v) {
			x := round2(g.xs.Map(v))
			lo, hi = math.Min(lo, x), math.Max(hi, x)
		}
	}
	y := round2(cy)
	f.scene.Add(Mark{Kind: Path, Class: "plumb-guide", Lines: [][]Point{{{g.x0, y}, {lo, y}}}, Stroke: f.th.context, StrokeWidth: 1, Join: JoinRound, Cap: CapRound, Dash: []float64{1, 3}})
	if hi > lo {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-range", Lines: [][]Point{{{lo, y}, {hi, y}}}, Stroke: f.th.context, StrokeWidth: 2, Join: JoinRound, Cap: CapRound})
	}
	for s, v := range r.series {
		if !math.IsNaN(v) {
			f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark", X: round2(g.xs.Map(v)), Y: cy, R: g.radius, Fill: h.colours[s], Attrs: c.seriesAttrs(r, s)})
		}
	}
	return hi + g.radius
}

// seriesAttrs are the data attributes of one series' mark in a row.
func (c *rowChart) seriesAttrs(r row, s int) []Attr {
	attrs := []Attr{{"label", r.label}, {"series", c.names[s]}, {"value", dataNumber(r.series[s])}}
	if r.other > 0 {
		attrs = append(attrs, Attr{"combined", fmt.Sprint(r.other)})
	}
	return attrs
}

// drawSeriesNames names the series above the rows: for dots, each name
// over its dot in the first row, in its colour, where the names keep apart
// near their dots; else (and for bars) a key of swatches and names.
func (c *rowChart) drawSeriesNames(g *rowGeom, top, left, right float64) {
	f, sp, h := c.f, c.f.spec, &c.sr
	face := f.fonts.Face(false)
	asc := face.Ascent(sp.text)
	lh := lineHeight(sp.text)
	if c.layout == LayoutDots && c.directNames(g, top+asc, left, right) {
		return
	}
	for j, line := range h.key {
		x := left + h.keyX
		base := top + asc + float64(j)*lh
		for _, s := range line {
			sw := sp.text * 0.8
			mid := base - (asc-face.Descent(sp.text))/2
			if c.layout == LayoutDots {
				f.scene.Add(Mark{Kind: Circle, Class: "plumb-swatch", X: round2(x + sw/2), Y: round2(mid), R: sw / 2, Fill: h.colours[s], Attrs: []Attr{{"series", c.names[s]}}})
			} else {
				f.scene.Add(Mark{Kind: Rect, Class: "plumb-swatch", X: round2(x), Y: round2(mid - sw/2), W: round2(sw), H: round2(sw), Fill: h.colours[s], Attrs: []Attr{{"series", c.names[s]}}})
			}
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: x + sw + sp.gap/2, Y: base, Text: c.names[s], Size: sp.text, Fill: f.th.text, Anchor: Start, Attrs: []Attr{{"series", c.names[s]}}})
			x += c.keyItemW(s) + sp.gap*1.5
		}
	}
}

// directNames sets each series' name over its dot in the first row, moved
// apart as little as keeps them a gap apart (layout.Spread); it draws
// nothing and reports false when a dot is missing, the names do not fit
// between left and right, or one would end up away from its dot.
func (c *rowChart) directNames(g *rowGeom, base, left, right float64) bool {
	f, sp, h := c.f, c.f.spec, &c.sr
	r := c.rows[0]
	order := make([]int, len(c.names))
	widest := 0.0
	for s := range order {
		order[s] = s
		if math.IsNaN(r.series[s]) {
			return false
		}
		widest = math.Max(widest, f.measure(c.names[s], sp.text, false))
	}
	slices.SortStableFunc(order, func(a, b int) int {
		if r.series[a] < r.series[b] {
			return -1
		}
		if r.series[a] > r.series[b] {
			return 1
		}
		return 0
	})
	want := make([]float64, len(order))
	for j, s := range order {
		want[j] = g.xs.Map(r.series[s])
	}
	got, ok := layout.Spread(want, widest+sp.gap, left+widest/2, right-widest/2)
	if !ok {
		return false
	}
	for j := range got {
		if math.Abs(got[j]-want[j]) > widest {
			return false
		}
	}
	for j, s := range order {
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: got[j], Y: base, Text: c.names[s], Size: sp.text, Fill: c.seriesText(h.colours[s]), Anchor: Middle, Attrs: []Attr{{"series", c.names[s]}}})
	}
	return true
}
