package render

import (
	"fmt"
	"math"

	"plumb/layout"
	"plumb/scale"
)

// The difference chart is one or two panels in one column of a grid: the
// levels of both series (with Context) over the difference itself, on one
// x scale, each banked for its own height. Both plot areas share their
// left and right edges: the room beside them is measured once for both
// (diffChart.fit).

// fit measures, once for both panels, the room beside the plots: the y
// tick labels of either panel, the series names at the levels' line ends
// and the x tick labels' overhang.
func (c *diffChart) fit(f *frame, cellW float64) {
	if c.side != nil {
		return
	}
	yw := c.diff.axes.yLabelWidth(f)
	if c.levels != nil {
		yw = math.Max(yw, c.levels.axes.yLabelWidth(f))
		_, _, lineA, lineB := f.diffColors()
		c.labels, c.labelW = f.measureLabels([]string{c.opt.aName, c.opt.bName}, []Colour{lineA, lineB}, cellW*0.3)
	}
	ax := lineAxes{xk: c.xk, x: c.diff.axes.x, labelW: c.labelW}
	side := ax.fit(f, cellW, yw, allEdges)
	c.side, c.w = &side, ax.w
}

// panelTitle wraps a panel's title, which names both series and may be
// long: up to two lines across the cell, then shortened with the full text
// in a tooltip. It returns the room above the plot it takes.
func (c *diffChart) panelTitle(f *frame, text string, cellW float64) (axisTitleText, float64) {
	sp := f.spec
	t := f.axisTitle(text+c.unitSuffix(), cellW)
	return t, t.height(lineHeight(sp.text)) + sp.gap + halfLine(f)
}

// drawTitle sets a panel's title above its plot, from the cell's left edge.
func (c *diffChart) drawTitle(f *frame, t axisTitleText, plot layout.Box) {
	sp := f.spec
	f.drawAxisTitle(t, plot.X-c.side.left, plot.Y-halfLine(f)-t.height(lineHeight(sp.text))-sp.gap)
}

// diffGeom is how both panels reduce their lines: M4 per pixel column
// when the series have more than four points per column.
func (c *diffChart) diffGeom(f *frame, axes *lineAxes, plotW float64) lineGeom {
	g := lineGeom{w: int(plotW), ax: axes.xAxisFor(f, plotW)}
	g.reduce = shouldReduce([]Series{{X: c.x}}, g.w)
	return g
}

// diffPlan is the difference panel: a − b as areas of two colours against
// a zero baseline, the line over them, and each colour named once.
type diffPlan struct {
	c        *diffChart
	inFigure bool // a panel of someone else's figure
	axes     lineAxes
	title    axisTitleText
	keyRows  int // the key rows the bottom room holds
	// Chosen by height for the plot width hw.
	hw, room float64
	pd       scale.Polyline
	bridged  int
	bank     banking
	h        float64
	ay       axis
}

func (p *diffPlan) domains() (x, y axisDomain) {
	c := p.c
	xlo, xhi, _ := dataRange(c.x)
	dlo, dhi, _ := dataRange(c.d)
	c.diff = p
	return xyDomains(xlo, xhi, dlo, dhi, c.xk, c.dk)
}

func (p *diffPlan) share(x, y axisDomain) {
	p.axes = lineAxes{xk: p.c.xk, yk: p.c.dk, x: x, y: y, xName: p.c.opt.XName}
}

// measure reserves the room of the key under the axis: none when both
// colours are named inside their areas at the plot's banked height, which
// it lays out here; on a canvas of fixed size, or in someone else's
// figure, where the height is not yet known, room for both rows.
func (p *diffPlan) measure(f *frame, cellW float64, e edges) insets {
	c := p.c
	c.fit(f, cellW)
	var top float64
	p.title, top = c.panelTitle(f, "difference, "+c.opt.aName+" − "+c.opt.bName, cellW)
	in := insets{left: c.side.left, right: c.side.right, top: top, bottom: p.axes.bottom(f, e)}
	p.keyRows = 2
	if f.fixedPlotBottom() <= 0 && !p.inFigure {
		if h, err := p.height(f, c.w, 0); err == nil {
			xs := scale.Linear{D0: p.axes.ax.d0, D1: p.axes.ax.d1, R0: 0, R1: c.w}
			ys := scale.Linear{D0: p.ay.d0, D1: p.ay.d1, R0: h, R1: 0}
			p.keyRows = len(f.areaKeyRows(f.layoutAreas(p.pd, xs, ys, c.opt.aName, c.opt.bName), c.opt.aName, c.opt.bName, c.w))
		}
	}
	in.bottom += f.keyHeight(p.keyRows)
	return in
}

// height banks the difference for width plotW (see plotHeight).
func (p *diffPlan) height(f *frame, plotW, room float64) (float64, error) {
	c := p.c
	if plotW < f.spec.text*8 {
		return 0, fmt.Errorf("the plot is too narrow at this width: give a wider canvas (%s)", c.opt.name("Width"))
	}
	if p.hw == plotW && p.room == room && p.pd.X != nil {
		return p.h, nil
	}
	g := c.diffGeom(f, &p.axes, plotW)
	pd, bridged := g.polyline(c.x, c.d)
	if g.reduce && len(pd.X) < len(c.x) {
		f.scene.Note("reduced", false, reduceNote(len(c.x), len(pd.X)))
	}
	p.bank = banking{}
	// Two panels sharing a fixed canvas may each be as short as a panel of
	// small multiples; alone, or choosing its height, the difference keeps
	// the medium's minimum.
	shared := room > 0 && c.levels != nil
	h, ay, err := f.plotHeight(&p.bank, []scale.Polyline{pd}, c.opt.Time, g.ax.d1-g.ax.d0, plotW, p.axes.y.lo, p.axes.y.hi, c.dk, room, shared)
	if err != nil {
		return 0, err
	}
	p.hw, p.room, p.pd, p.bridged, p.h, p.ay = plotW, room, pd, bridged, h, ay
	return h, nil
}

func (p *diffPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	c := p.c
	sp := f.spec
	from := len(f.scene.Marks)
	if _, err := p.height(f, plot.W, p.room); err != nil {
		return placed{}, err
	}
	ay := p.ay
	if plot.H != p.h {
		ay = f.fitY(p.axes.y.lo, p.axes.y.hi, plot.H, c.dk)
		p.bank.fill, p.bank.raised, p.bank.alpha = true, false, plot.H/plot.W
	}
	f.scene.Note("aspect", false, p.bank.note(plot.W, plot.H))
	c.drawTitle(f, p.title, plot)
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	bottom := p.axes.draw(f, ay, ys, plot, e)
	xs := scale.Linear{D0: p.axes.ax.d0, D1: p.axes.ax.d1, R0: plot.X, R1: plot.X + plot.W}
	ar := f.layoutAreas(p.pd, xs, ys, c.opt.aName, c.opt.bName)
	areaA, areaB, _, _ := f.diffColors()
	if len(ar.pos) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-mark plumb-area-a", Lines: ar.pos, Closed: true, Fill: areaA, Attrs: []Attr{{"series", c.opt.aName + " above " + c.opt.bName}}})
	}
	if len(ar.neg) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-mark plumb-area-b", Lines: ar.neg, Closed: true, Fill: areaB, Attrs: []Attr{{"series", c.opt.bName + " above " + c.opt.aName}}})
	}
	lw := strokeWidth(sp)
	f.scene.Add(Mark{Kind: Path, Class: "plumb-baseline", Lines: [][]Point{{{plot.X, ar.base}, {plot.X + plot.W, ar.base}}}, Stroke: f.th.baseline, StrokeWidth: lw * 0.75, Join: JoinRound, Cap: CapRound})
	f.addSeries("plumb-mark", "difference", crossingsPolyline(ar.runs), drawnLine{pieces: ar.line, first: runStarts(ar.runs)}, f.th.text, lw*0.75, c.opt.Time)
	f.noteMissing(c.missing, p.bridged, []drawnLine{{pieces: ar.line}})
	for k, r := range ar.names {
		if ar.named[k] {
			r.draw(f)
		}
	}
	// Say once what each colour means: in its region's label, or, for a
	// colour whose regions are all too thin for a label, in a key under
	// the axis.
	f.key(f.areaKeyRows(ar, c.opt.aName, c.opt.bName, plot.W), plot.X, bottom)
	text, marks := f.boxesSince(from)
	return forLayers(placed{xs: xs, ys: ys, text: text, marks: marks}, ay, c.opt.Time, c.d), nil
}

func (p *diffPlan) describe() (string, string) { return p.c.describe(), p.c.name() }

// levelsPlan is the context panel over the difference: both series as
// lines, named at their ends, on the difference's x scale.
type levelsPlan struct {
	c        *diffChart
	axes     lineAxes
	title    axisTitleText
	hw, room float64
	pa, pb   scale.Polyline
	bank     banking
	h        float64
	ay       axis
}

func (p *levelsPlan) domains() (x, y axisDomain) {
	c := p.c
	xlo, xhi, _ := dataRange(c.x)
	lo, hi, _ := dataRange(c.a, c.b)
	c.levels = p
	return xyDomains(xlo, xhi, lo, hi, c.xk, c.lk)
}

func (p *levelsPlan) share(x, y axisDomain) {
	p.axes = lineAxes{xk: p.c.xk, yk: p.c.lk, x: x, y: y}
}

func (p *levelsPlan) measure(f *frame, cellW float64, e edges) insets {
	c := p.c
	c.fit(f, cellW)
	var top float64
	p.title, top = c.panelTitle(f, c.opt.aName+" and "+c.opt.bName, cellW)
	return insets{left: c.side.left, right: c.side.right, top: top, bottom: halfLine(f)}
}

// height banks both lines together for width plotW; the panel may be as
// short as one of small multiples, for it is read with the difference.
func (p *levelsPlan) height(f *frame, plotW, room float64) (float64, error) {
	c := p.c
	if p.hw == plotW && p.room == room && p.pa.X != nil {
		return p.h, nil
	}
	g := c.diffGeom(f, &p.axes, plotW)
	p.pa, _ = g.polyline(c.x, c.a)
	p.pb, _ = g.polyline(c.x, c.b)
	p.bank = banking{}
	h, ay, err := f.plotHeight(&p.bank, []scale.Polyline{p.pa, p.pb}, c.opt.Time, g.ax.d1-g.ax.d0, plotW, p.axes.y.lo, p.axes.y.hi, c.lk, room, true)
	if err != nil {
		return 0, err
	}
	p.hw, p.room, p.h, p.ay = plotW, room, h, ay
	return h, nil
}

func (p *levelsPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	c := p.c
	from := len(f.scene.Marks)
	if _, err := p.height(f, plot.W, p.room); err != nil {
		return placed{}, err
	}
	ay := p.ay
	if plot.H != p.h {
		ay = f.fitY(p.axes.y.lo, p.axes.y.hi, plot.H, c.lk)
		p.bank.fill, p.bank.raised, p.bank.alpha = true, false, plot.H/plot.W
	}
	f.scene.Note("aspect", false, "levels panel: "+p.bank.note(plot.W, plot.H))
	c.drawTitle(f, p.title, plot)
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	// The x axis is the difference's, under it: the levels' plot shares
	// its scale and needs no ticks of its own.
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.drawYAxis(ay, ys, plot.X, plot.X+plot.W, e.left)
	f.scene.Add(Mark{Kind: GroupEnd})
	_, _, lineA, lineB := f.diffColors()
	g := c.diffGeom(f, &p.axes, plot.W)
	g.left = plot.X
	labels := append([]label(nil), c.labels...)
	for i, pl := range []scale.Polyline{p.pa, p.pb} {
		d := g.screen(pl, ys)
		f.addSeries("plumb-mark", []string{c.opt.aName, c.opt.bName}[i], pl, d, []Colour{lineA, lineB}[i], strokeWidth(f.spec), c.opt.Time)
		if pt, ok := d.last(); ok && i < len(labels) {
			labels[i].at = pt.Y
		}
	}
	if _, ok := f.spreadLabels(labels, plot.X+plot.W, plot.Y, plot.Y+plot.H); !ok {
		f.scene.Note("legend", false, "the series names do not fit beside the line ends: named them in the panel title")
	}
	xs := scale.Linear{D0: p.axes.ax.d0, D1: p.axes.ax.d1, R0: plot.X, R1: plot.X + plot.W}
	text, marks := f.boxesSince(from)
	return forLayers(placed{xs: xs, ys: ys, text: text, marks: marks}, ay, c.opt.Time, c.a, c.b), nil
}

func (p *levelsPlan) describe() (string, string) { return p.c.describe(), p.c.name() }
