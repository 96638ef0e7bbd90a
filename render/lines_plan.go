package render

import (
	"cmp"
	"fmt"
	"math"
	"slices"

	"plumb/layout"
	"plumb/palette"
	"plumb/scale"
)

// linePlan is one panel of a line chart: every series of the chart, or
// one series of small multiples drawn over the range of all of them.
type linePlan struct {
	c        *lineChart
	idx      int  // the series of a small multiple; -1 draws them all
	inFigure bool // a panel of someone else's figure: it draws its own y axis title
	axes     lineAxes
	title    axisTitleText // the y axis title drawn by the panel itself
	labels   []label       // series names at the line ends
	legend   bool          // the names go in a key under the axis instead
	measured bool
	// Chosen by height for the plot width hw.
	hw, room float64
	polys    []scale.Polyline
	bridged  int
	bank     banking
	h        float64
	ay       axis
}

// plan is the plan of the whole chart (i < 0) or of series i's small
// multiple.
func (c *lineChart) plan(i int, inFigure bool) *linePlan {
	p := &linePlan{c: c, idx: i, inFigure: inFigure, bank: c.bank}
	p.axes = lineAxes{xk: c.xk, yk: c.yk, xName: c.opt.XName}
	if c.multiples {
		p.axes.xName = "" // said once under the grid
	}
	return p
}

func (p *linePlan) domains() (x, y axisDomain) {
	if p.idx < 0 {
		return xyDomains(p.c.xlo, p.c.xhi, p.c.ylo, p.c.yhi, p.c.xk, p.c.yk)
	}
	s := p.c.series[p.idx]
	xlo, xhi, _ := dataRange(s.X)
	ylo, yhi, _ := dataRange(s.Y, s.lo, s.hi)
	return xyDomains(xlo, xhi, ylo, yhi, p.c.xk, p.c.yk)
}

func (p *linePlan) share(x, y axisDomain) { p.axes.x, p.axes.y = x, y }

// measure names the series at their line ends when there are a few, and
// fits the axes to the cell. The names go in a key under the plot instead
// when they cannot be spread apart along the plot's height, which is
// banked here for the width they leave: the grid then asks for the same
// width again and gets the same height.
func (p *linePlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	c := p.c
	in := insets{top: halfLine(f)}
	if p.inFigure && c.yTitle != "" {
		p.title = f.axisTitle(c.yTitle, cellW)
		in.top += p.title.height(lineHeight(sp.text)) + sp.gap
	}
	if p.idx < 0 && !p.measured {
		p.measured = true
		switch {
		case len(c.series) > palette.MaxCategorical:
			f.scene.Note("unnamed", false, fmt.Sprintf("%d series are more than colours or names can tell apart: drew them alike in one colour, without names; highlight a few, aggregate them, or draw small multiples of fewer", len(c.series)))
		case len(c.series) > 1:
			names := make([]string, len(c.series))
			for i, s := range c.series {
				names[i] = s.Name
			}
			p.labels, p.axes.labelW = f.measureLabels(names, c.seriesColors(f), cellW*0.3)
		}
	}
	yw := p.axes.yLabelWidth(f)
	side := p.axes.fit(f, cellW, yw, e)
	if p.labels != nil && !p.legend {
		if h, err := p.height(f, p.axes.w, p.roomEstimate(f, in.top, p.axes.bottom(f, e))); err == nil && !f.labelsFitSpan(p.labels, h) {
			p.legend, p.axes.labelW = true, 0
			side = p.axes.fit(f, cellW, yw, e)
		}
	}
	in.left, in.right = side.left, side.right
	in.bottom = p.axes.bottom(f, e)
	if p.legend {
		in.bottom += f.keyHeight(len(p.labels))
	}
	return in
}

// roomEstimate is the fixed height the grid will leave a single panel on
// a canvas of fixed size, or 0 when the panel chooses its height.
func (p *linePlan) roomEstimate(f *frame, top, bottom float64) float64 {
	fb := f.fixedPlotBottom()
	if fb <= 0 {
		return 0
	}
	y := f.plotTop()
	if p.c.yTitle != "" && !p.inFigure {
		y += f.axisTitle(p.c.yTitle, f.width-2*f.spec.pad).height(lineHeight(f.spec.text)) + f.spec.gap
	}
	return math.Floor(fb - y - math.Ceil(top) - math.Ceil(bottom))
}

// height banks the plot for width plotW (see plotHeight); small multiples
// bank jointly, so that every panel has one height and one scale.
func (p *linePlan) height(f *frame, plotW, room float64) (float64, error) {
	sp := f.spec
	c := p.c
	if p.idx >= 0 {
		j, err := c.jointHeight(f, plotW, room, p.axes.x, p.axes.y)
		if err != nil {
			return 0, err
		}
		return j.h, nil
	}
	if plotW < sp.text*8 {
		return 0, fmt.Errorf("the plot is too narrow at this width: give a wider canvas (%s) or shorter series names", c.opt.name("Width"))
	}
	if p.polys != nil && p.hw == plotW && p.room == room {
		return p.h, nil
	}
	g := lineGeom{w: int(plotW), ax: p.axes.xAxisFor(f, plotW)}
	polys, bridged, err := c.reduceAll(f, g)
	if err != nil {
		return 0, err
	}
	p.bank = c.bank
	h, ay, err := f.plotHeight(&p.bank, polys, c.opt.Time, g.ax.d1-g.ax.d0, plotW, p.axes.y.lo, p.axes.y.hi, c.yk, room, false)
	if err != nil {
		return 0, err
	}
	p.hw, p.room, p.polys, p.bridged, p.h, p.ay = plotW, room, polys, bridged, h, ay
	return h, nil
}

// draw draws the axes, the index base, the lines and their names.
func (p *linePlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	if p.idx >= 0 {
		return p.drawMultiple(f, plot, e)
	}
	sp := f.spec
	c := p.c
	from := len(f.scene.Marks)
	if _, err := p.height(f, plot.W, p.room); err != nil {
		return placed{}, err
	}
	ay := p.ay
	if plot.H != p.h { // the grid gave another height: fill it
		ay = f.fitY(p.axes.y.lo, p.axes.y.hi, plot.H, c.yk)
		p.bank.fill, p.bank.raised, p.bank.alpha = true, false, plot.H/plot.W
	}
	f.scene.Note("aspect", false, p.bank.note(plot.W, plot.H))
	// The y axis is named where its tick labels are: on the panels of
	// the grid's left edge (every panel of a figure whose panels keep
	// their own scales).
	if p.title.lines != nil && e.left {
		f.drawAxisTitle(p.title, plot.X-p.axes.left, plot.Y-halfLine(f)-p.title.height(lineHeight(sp.text))-sp.gap)
	}
	bottom := plot.Y + plot.H
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: bottom, R1: plot.Y}
	axisBottom := p.axes.draw(f, ay, ys, plot, e)
	c.drawBase(f, ys, plot.X, plot.X+plot.W)

	colors := c.seriesColors(f)
	xs := scale.Linear{D0: p.axes.ax.d0, D1: p.axes.ax.d1, R0: plot.X, R1: plot.X + plot.W}
	// Every band before any line, so that no band covers another's line.
	for i, s := range c.series {
		c.drawBand(f, s, colors[i], xs, ys)
	}
	g := lineGeom{left: plot.X, w: int(plot.W), ax: p.axes.ax}
	width := strokeWidth(sp)
	drawn := make([]drawnLine, len(c.series))
	for i, s := range c.series {
		g.reduce = shouldReduce(c.series[i:i+1], g.w)
		drawn[i] = g.screen(p.polys[i], ys)
		f.addSeries("plumb-mark", s.Name, p.polys[i], drawn[i], colors[i], width, c.opt.Time)
		if p.labels != nil {
			if pt, ok := drawn[i].last(); ok {
				p.labels[i].at = pt.Y
			}
		}
	}
	f.noteMissing(c.missing, p.bridged, drawn)
	if p.labels != nil && !p.legend {
		if _, ok := f.spreadLabels(p.labels, plot.X+plot.W, plot.Y, bottom); !ok {
			// Measured to fit: only a grid that gave another height gets here.
			p.legend = true
		}
	}
	if p.legend {
		f.scene.Note("legend", false, "the series names do not fit beside the line ends: named them in a legend below the chart")
		// In the order the lines end, top first, so that the key reads
		// like the plot.
		rows := slices.Clone(p.labels)
		slices.SortStableFunc(rows, func(a, b label) int { return cmp.Compare(a.at, b.at) })
		f.key(keyRows(rows), plot.X, axisBottom)
	}
	text, marks := f.boxesSince(from)
	return forLayers(placed{xs: xs, ys: ys, text: text, marks: marks}, ay, c.opt.Time, c.ys()...), nil
}

func (p *linePlan) describe() (string, string) {
	if p.idx >= 0 {
		s := p.c.series[p.idx]
		return describeSeries(s, scale.ValueFormat(shownValues([]Series{s}), p.c.unitText()), p.c.xk), s.Name
	}
	return p.c.describe(false), p.c.accessibleTitle()
}
