package render

import (
	"fmt"
	"math"

	"plumb/layout"
	"plumb/scale"
)

// valueColumns is the plan of vertical box plots: one column per group,
// the value axis up the left, the group names and their n under the
// columns. It draws the same rows as valueRows, stood up.
type valueColumns struct {
	*valueRows
	dy    axisDomain
	lines int // label lines under the columns
}

func (p *valueColumns) domains() (x, y axisDomain) {
	y, x = p.valueRows.domains()
	return x, y
}

func (p *valueColumns) share(x, y axisDomain) {
	p.dy = y
	if x.kind == domainCategory {
		p.alignRows(x.labels)
	}
}

func (p *valueColumns) kind() valueKind {
	return valueKind{integer: p.dy.integer, label: p.tickLabels}
}

// columnLabelLines is the most lines a label under a column may take.
const columnLabelLines = 3

func (p *valueColumns) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	lh := lineHeight(sp.text)
	in := insets{top: lh / 2, right: sp.gap}
	if e.top {
		if t := p.unitLine(f, cellW); len(t.lines) > 0 {
			in.top = t.height(lh) + titleLift(f)
		}
	}
	if e.left {
		a := f.fitValue(p.dy.lo, p.dy.hi, math.Max(cellW*0.55, 1), false, p.kind())
		for _, l := range a.labels {
			in.left = math.Max(in.left, f.measure(l, sp.text, false)+sp.gap)
		}
	}
	band := (cellW - in.left - in.right) / float64(len(p.rows))
	p.lines = 1
	for _, r := range p.rows {
		lines, _ := f.wrap(r.label, sp.text, false, math.Max(band-sp.gap, 1), columnLabelLines)
		p.lines = max(p.lines, len(lines))
	}
	if e.bottom {
		in.bottom = sp.gap + float64(p.lines)*lh
		for _, r := range p.rows {
			if r.right != "" {
				in.bottom += lh
				break
			}
		}
	}
	return in
}

func (p *valueColumns) height(f *frame, plotW, room float64) (float64, error) {
	sp := f.spec
	if band := plotW / float64(len(p.rows)); band < sp.text*2 {
		return 0, fmt.Errorf("%d columns do not fit in a %.0f px wide plot with %g px text: each would be %.0f px wide; draw the boxes as rows (leave out %s), or give a wider canvas (%s)",
			len(p.rows), plotW, sp.text, band, f.c.name("Vertical"), f.c.name("Width"))
	}
	if room > 0 {
		return room, nil
	}
	return math.Max(math.Round(plotW*0.62), minPlotHeight(sp, false)), nil
}

func (p *valueColumns) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	lh := lineHeight(sp.text)
	asc := f.fonts.Face(false).Ascent(sp.text)
	ay := f.fitValue(p.dy.lo, p.dy.hi, plot.H, false, p.kind())
	bottom := plot.Y + plot.H
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: bottom, R1: plot.Y}
	out := forLayers(placed{ys: ys}, ay, false, p.values)
	out.valueText = p.vfmt.Format
	if e.top {
		if t := p.unitLine(f, plot.W+plot.X); len(t.lines) > 0 {
			f.drawAxisTitle(t, round2(math.Max(plot.X-f.measure("0", sp.text, false), sp.pad)), plot.Y-titleLift(f)-t.height(lh))
		}
	}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.draw(ay, axisDraw{vertical: true, pos: ys, from: plot.X, to: plot.X + plot.W, labelAt: plot.X - sp.gap, labels: e.left})
	f.scene.Add(Mark{Kind: GroupEnd})
	band := plot.W / float64(len(p.rows))
	thick := math.Min(band*0.5, sp.text*2.4)
	for i, r := range p.rows {
		cx := plot.X + (float64(i)+0.5)*band
		if r.draw != nil {
			boxes, end := r.draw(f, ys, cx, thick, true)
			out.marks = append(out.marks, boxes...)
			out.cats = append(out.cats, catPlace{label: r.label, centre: cx, size: band, end: end})
		}
		if !e.bottom {
			continue
		}
		lines, cut := f.wrap(r.label, sp.text, false, math.Max(band-sp.gap, 1), p.lines)
		tip := ""
		if cut {
			tip = r.label
			f.scene.Note("label-shortened", false, fmt.Sprintf("shortened the label %q to fit; the full text is in its tooltip", r.label))
		}
		y := bottom + sp.gap + asc
		for _, l := range lines {
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(cx), Y: round2(y), Text: l, Size: sp.text, Fill: f.th.text, Anchor: Middle, Tooltip: tip})
			y += lh
		}
		if r.right != "" {
			f.text(round2(cx), round2(bottom+sp.gap+asc+float64(p.lines)*lh), r.right, sp.text, false, f.th.muted, "plumb-value plumb-n", Middle)
		}
	}
	return out, nil
}
