package render

import (
	"fmt"
	"math"
	"slices"

	"plumb/layout"
	"plumb/scale"
)

// colsFit is what measuring vertical columns decided, kept for drawing.
type colsFit struct {
	titleH   float64 // the axis title line above the plot, with its gap
	rt, rb   float64 // room above and below the value domain for value labels
	plotH    float64 // the plot's height with that room, when the chart chooses it
	tickW    float64 // the widest tick label
	lines    int     // lines the category labels may take
	labels   bool    // the panel labels its categories
	ticks    bool    // the panel labels its value axis
	measured float64 // the band the labels were measured for
}

// measureColumns lays out vertical bars in a cell cellW wide: the axis
// title above, the tick labels left of the plot, the category labels under
// it. The tick labels' width depends on the ticks, which depend on the
// height, which the medium fixes or the chart chooses here; the category
// labels' height depends on the column width, which depends on the tick
// labels, so their room is estimated from the widest value text first
// (ticks are rounder and not wider) and fixed from the ticks after.
func (c *rowChart) measureColumns(cellW float64, e edges) insets {
	f, sp, v := c.f, c.f.spec, &c.vc
	lh := lineHeight(sp.text)
	n := len(c.rows)
	top := f.plotTop()
	v.titleH = 0
	if c.axisTitle() != "" {
		v.titleH = lh + sp.gap
		top += v.titleH
	}
	v.labels, v.ticks = c.catLabels(e), c.valueLabels(e)
	guess := 0.0
	for _, x := range c.values() {
		guess = math.Max(guess, f.measure(c.vfmt.Format(x), sp.text, false))
	}
	maxLines := 3
	if band := (cellW - guess - sp.gap) / float64(n); band > sp.gap && v.labels {
		c.abbreviateCalendar(band - sp.gap)
		_, _, maxLines = c.wrapLabelsQuiet(band-sp.gap, 3, false)
	}
	labelsH := float64(maxLines)*lh + sp.gap
	if !v.labels {
		maxLines, labelsH = 0, 0
	}
	fixed := f.fixedPlotBottom() > 0
	v.plotH = math.Min((cellW+2*sp.pad)*0.5, 420*sp.text/13)
	if fixed {
		v.plotH = f.fixedPlotBottom() - top - labelsH
	}
	hasNeg, hasPos := false, false
	for _, r := range c.rows {
		hasNeg = hasNeg || r.value < 0
		hasPos = hasPos || r.value > 0
	}
	v.rt, v.rb = 0, 0
	if hasPos {
		v.rt = lh
	}
	if hasNeg {
		v.rb = lh
	}
	c.fitTicks(v.plotH-v.rt-v.rb, false)
	v.tickW = 0
	for _, l := range c.ax.labels {
		v.tickW = math.Max(v.tickW, f.measure(l, sp.text, false))
	}
	v.lines = maxLines
	if !fixed && v.labels {
		// The labels of the band the columns will have, without their
		// notes, which drawing them gives.
		v.measured = (cellW - v.tickW - sp.gap) / float64(n)
		notes, short := len(f.scene.Notes), c.shortLabels()
		c.abbreviateCalendar(v.measured - sp.gap)
		_, _, v.lines = c.wrapLabelsQuiet(v.measured-sp.gap, maxLines, false)
		f.scene.Notes = f.scene.Notes[:notes]
		for i := range c.rows {
			c.rows[i].short = short[i]
		}
	}
	in := insets{top: v.titleH + v.rt, bottom: v.rb}
	if face := f.fonts.Face(false); hasPos && !c.alone {
		// The value label over the tallest bar: a chart alone lets it
		// reach into the frame's gap above, a panel keeps it under its
		// heading.
		in.top = v.titleH + math.Max(v.rt, sp.gap/2+face.Ascent(sp.text)+face.Descent(sp.text))
	}
	if v.labels {
		in.bottom += sp.gap + float64(v.lines)*lh
	}
	if v.ticks {
		in.left = v.tickW + sp.gap
	}
	return in
}

// shortLabels are the rows' short forms, to restore after an estimate.
func (c *rowChart) shortLabels() []string {
	s := make([]string, len(c.rows))
	for i, r := range c.rows {
		s[i] = r.short
	}
	return s
}

// heightColumns is the height of the value axis: the chart's choice, or
// the fixed room; either must leave the bars room to differ.
func (c *rowChart) heightColumns(plotW, room float64) (float64, error) {
	sp, v := c.f.spec, &c.vc
	h := room
	if room <= 0 {
		h = v.plotH - v.rt - v.rb
	}
	if h < 4*sp.text {
		return 0, fmt.Errorf("the figure is too short for vertical bars: give a taller canvas (%s) or drop %s", c.opt.name("Height"), c.opt.name("Vertical"))
	}
	if n := len(c.rows); plotW/float64(n) < sp.text*1.6 {
		return 0, fmt.Errorf("%d columns are too narrow at this width: drop %s (horizontal bars fit long lists) or show fewer with %s", n, c.opt.name("Vertical"), c.opt.name("Top"))
	}
	return h, nil
}

// drawColumns draws vertical bars with the value domain spanning the plot
// box's height and the categories its width.
func (c *rowChart) drawColumns(plot layout.Box, e edges) placed {
	f, sp, v := c.f, c.f.spec, &c.vc
	asc, desc := f.fonts.Face(false).Ascent(sp.text), f.fonts.Face(false).Descent(sp.text)
	n := len(c.rows)
	if title := c.axisTitle(); title != "" {
		left := plot.X
		if v.ticks {
			left -= v.tickW + sp.gap
		}
		f.text(left, plot.Y-v.rt-v.titleH+asc, title, sp.text, false, f.th.muted, "plumb-axis-title", Start)
	}
	c.fitTicks(plot.H, false)
	plotL, plotR := plot.X, plot.X+plot.W
	band := plot.W / float64(n)
	barW := math.Min(band*0.7, sp.text*4)
	ys := scale.Linear{D0: c.d0, D1: c.d1, R0: plot.Y + plot.H, R1: plot.Y}
	bottom := plot.Y + plot.H + v.rb

	ad := axisDraw{vertical: true, pos: ys, from: plotL, to: plotR, labelAt: plotL - sp.gap, labels: v.ticks, baseline: true}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.draw(c.ax, ad)
	f.scene.Add(Mark{Kind: GroupEnd})
	f.drawBaseline(ad)
	zero := round2(ys.Map(0))

	vtext, vw := c.valueTexts()
	tooWide := func(w float64) bool { return w > band-2 }
	if slices.IndexFunc(vw, tooWide) >= 0 {
		// Shorter numbers before no numbers: three significant digits,
		// each value abbreviated on its own ($3.23M, $119k).
		c.vfmt = scale.ShortValueFormat(c.values(), c.opt.Unit)
		vtext, vw = c.valueTexts()
	}
	showValues := slices.IndexFunc(vw, tooWide) < 0
	if !showValues {
		f.scene.Note("value-labels-dropped", false, "left out the value labels: even with three significant digits they are wider than the columns; the axis carries the values (or drop "+c.opt.name("Vertical")+")")
	}
	var cat axis
	if v.labels {
		c.abbreviateCalendar(band - sp.gap)
		// Words wrap at their boundaries, up to the lines measured, before any is shortened.
		cat, _, _ = c.wrapLabels(band-sp.gap, v.lines, false)
		cat.band = band
	}
	cd := axisDraw{pos: scale.Linear{R0: plotL}, labelAt: bottom + sp.gap + asc, labels: true}
	p := placed{ys: ys, cats: make([]catPlace, n)}
	for i, r := range c.rows {
		cx := plotL + (float64(i)+0.5)*band
		yv := round2(ys.Map(r.value))
		lo, hi := yv, zero
		if r.value < 0 {
			lo, hi = zero, yv
		}
		f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark", X: round2(cx - barW/2), Y: lo, W: round2(barW), H: hi - lo, Fill: c.fill(r), Attrs: c.markAttrs(r)})
		p.cats[i] = catPlace{label: r.label, centre: cx, size: band, end: yv}
		if showValues {
			if r.value < 0 {
				f.text(cx, yv+sp.gap/2+asc, vtext[i], sp.text, false, f.th.text, "plumb-value", Middle)
			} else {
				f.text(cx, yv-sp.gap/2-desc, vtext[i], sp.text, false, f.th.text, "plumb-value", Middle)
			}
		}
		if !v.labels {
			continue
		}
		f.drawTick(cat, cd, i)
	}
	return p
}
