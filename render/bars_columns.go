package render

import (
	"fmt"
	"math"
	"slices"

	"plumb/scale"
)

// layoutColumns draws vertical bars and returns the y under the labels.
func (c *rowChart) layoutColumns() (float64, error) {
	f, sp := c.f, c.f.spec
	lh := lineHeight(sp.text)
	asc, desc := f.fonts.Face(false).Ascent(sp.text), f.fonts.Face(false).Descent(sp.text)
	n := len(c.rows)
	top := f.plotTop()
	if title := c.axisTitle(); title != "" {
		f.text(sp.pad, top+asc, title, sp.text, false, f.th.muted, "plumb-axis-title", Start)
		top += lh + sp.gap
	}
	// Width first: the tick labels' width depends on the ticks, which depend
	// on the height; the height is fixed by the medium or chosen here.
	// The category labels' height depends on the column width, which
	// depends on the tick labels: estimate the width from the widest value
	// text (ticks are rounder and not wider), and keep to the lines
	// reserved here when the labels are wrapped for good below.
	guess := 0.0
	for _, v := range c.values() {
		guess = math.Max(guess, f.measure(c.vfmt.Format(v), sp.text, false))
	}
	maxLines := 3
	if band := (f.width - 2*sp.pad - guess - sp.gap) / float64(n); band > sp.gap {
		c.abbreviateCalendar(band - sp.gap)
		_, _, maxLines = c.wrapLabelsQuiet(band-sp.gap, 3)
	}
	labelsH := float64(maxLines)*lh + sp.gap
	plotH := math.Min(f.width*0.5, 420*sp.text/13)
	if fb := f.fixedPlotBottom(); fb > 0 {
		plotH = fb - top - labelsH
	}
	hasNeg, hasPos := false, false
	for _, r := range c.rows {
		hasNeg = hasNeg || r.value < 0
		hasPos = hasPos || r.value > 0
	}
	rt, rb := 0.0, 0.0
	if hasPos {
		rt = lh
	}
	if hasNeg {
		rb = lh
	}
	if plotH-rt-rb < 4*sp.text {
		return 0, fmt.Errorf("the figure is too short for vertical bars: give a taller canvas (%s) or drop %s", c.opt.name("Height"), c.opt.name("Vertical"))
	}
	c.fitTicks(plotH-rt-rb, false)
	labels := c.ax.labels
	tickW := 0.0
	for _, l := range labels {
		tickW = math.Max(tickW, f.measure(l, sp.text, false))
	}
	plotL := sp.pad + tickW + sp.gap
	plotR := f.width - sp.pad
	band := (plotR - plotL) / float64(n)
	if band < sp.text*1.6 {
		return 0, fmt.Errorf("%d columns are too narrow at this width: drop %s (horizontal bars fit long lists) or show fewer with %s", n, c.opt.name("Vertical"), c.opt.name("Top"))
	}
	barW := math.Min(band*0.7, sp.text*4)
	y0, y1 := top+plotH-rb, top+rt
	ys := scale.Linear{D0: c.d0, D1: c.d1, R0: y0, R1: y1}
	bottom := top + plotH

	ad := axisDraw{vertical: true, pos: ys, from: plotL, to: plotR, labelAt: plotL - sp.gap, labels: true, baseline: true}
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
	c.abbreviateCalendar(band - sp.gap)
	// Words wrap at their boundaries, up to three lines, before any is shortened.
	wrapped, _, lines := c.wrapLabels(band-sp.gap, maxLines)
	for i, r := range c.rows {
		cx := plotL + (float64(i)+0.5)*band
		yv := round2(ys.Map(r.value))
		lo, hi := yv, zero
		if r.value < 0 {
			lo, hi = zero, yv
		}
		f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark", X: round2(cx - barW/2), Y: lo, W: round2(barW), H: hi - lo, Fill: c.fill(r), Attrs: c.markAttrs(r)})
		if showValues {
			if r.value < 0 {
				f.text(cx, yv+sp.gap/2+asc, vtext[i], sp.text, false, f.th.text, "plumb-value", Middle)
			} else {
				f.text(cx, yv-sp.gap/2-desc, vtext[i], sp.text, false, f.th.text, "plumb-value", Middle)
			}
		}
		tip := tooltip(r.label, wrapped[i])
		for j, l := range wrapped[i] {
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: cx, Y: bottom + sp.gap + asc + float64(j)*lh, Text: l, Size: sp.text, Bold: r.highlight, Fill: c.labelFill(r), Anchor: Middle, Tooltip: tip})
		}
	}
	return bottom + sp.gap + float64(lines)*lh, nil
}
