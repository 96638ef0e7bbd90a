package render

import (
	"fmt"
	"math"

	"plumb/layout"
	"plumb/scale"
)

// This file is the plan that span and box share: one row per category, a
// value axis along x that fits the data (a range or a box is read by the
// position of its ends on a common scale, not by a length from zero, so
// the domain need not include zero; Cleveland & McGill 1984), the labels
// right-aligned left of the plot as on bars, and a column of short text
// right of it (the n of each box).

// valueRow is one category's row: its label, the extent of what it draws
// and how to draw it.
type valueRow struct {
	label  string
	key    float64 // the value the rows are ordered by (median, middle)
	lo, hi float64 // the extent of the row's marks in data units
	right  string  // text in the column right of the plot ("n = 12"), or ""
	direct string  // a label drawn right of the row's marks (the name of an overlay), or ""
	// draw adds the row's marks across the value axis pos at centre c (a
	// row's y; a column's x when vertical), thick px across, and returns
	// their boxes and where its marks end towards the high values.
	draw func(f *frame, pos scale.Linear, c, thick float64, vertical bool) ([]layout.Box, float64)
}

// valueRows is the panel plan of span and box.
type valueRows struct {
	rows      []valueRow
	axisTitle string // the unit line above the plot
	unit      string
	integer   bool // every value is whole: whole-number ticks
	rowCap    float64
	// values are what a reference line at the mean or median of the
	// panel is taken over: every value of a box plot, the middles of
	// ranges.
	values []float64

	dx      axisDomain
	wrapped [][]string
	labelW  float64
	lines   int
	band    float64
	ax      axis
	vfmt    scale.Format

	desc, name string
}

// orderRows orders rows: by key, largest first (ByValue), by label, or as
// given.
func orderRows(rows []valueRow, o Order) error {
	return orderBy(rows, o, func(r valueRow) float64 { return r.key }, func(r valueRow) string { return r.label })
}

// checkLabels refuses an empty list and labels given twice: two rows with
// one name could not be told apart.
func checkLabels(what string, labels []string) error {
	if len(labels) == 0 {
		return fmt.Errorf("no %s to draw", what)
	}
	seen := make(map[string]bool, len(labels))
	for _, l := range labels {
		if seen[l] {
			return fmt.Errorf("the label %q is given twice; give each %s once", l, what)
		}
		seen[l] = true
	}
	return nil
}

func (p *valueRows) domains() (x, y axisDomain) {
	lo, hi := math.Inf(1), math.Inf(-1)
	labels := make([]string, len(p.rows))
	for i, r := range p.rows {
		if r.draw != nil {
			lo, hi = math.Min(lo, r.lo), math.Max(hi, r.hi)
		}
		labels[i] = r.label
	}
	return axisDomain{kind: domainNumber, lo: lo, hi: hi, integer: p.integer}, axisDomain{kind: domainCategory, labels: labels}
}

func (p *valueRows) share(x, y axisDomain) {
	p.dx = x
	if y.kind == domainCategory {
		p.alignRows(y.labels)
	}
}

// alignRows lays the rows out in the order of a category axis shared by
// the panels of a grid: every panel gets a row for every category, empty
// where it has no data, so that a row means one category across the grid
// and the labels on its outer side name the rows of every panel.
func (p *valueRows) alignRows(labels []string) {
	if len(labels) == 0 {
		return
	}
	same := len(labels) == len(p.rows)
	for i := 0; same && i < len(labels); i++ {
		same = labels[i] == p.rows[i].label
	}
	if same {
		return
	}
	own := make(map[string]valueRow, len(p.rows))
	for _, r := range p.rows {
		own[r.label] = r
	}
	rows := make([]valueRow, len(labels))
	for i, l := range labels {
		r, ok := own[l]
		if !ok {
			r = valueRow{label: l, lo: math.NaN(), hi: math.NaN()} // no data here: an empty row
		}
		rows[i] = r
	}
	p.rows = rows
}

func (p *valueRows) kind() valueKind {
	return valueKind{integer: p.dx.integer, label: p.tickLabels}
}

func (p *valueRows) tickLabels(ticks []float64) []string {
	return formatAll(scale.TickFormat(ticks, p.unitOnTicks()), ticks)
}

// unitOnTicks is the unit written on every tick: a currency sign only; any
// other unit is said once, in the unit line.
func (p *valueRows) unitOnTicks() string {
	if scale.IsCurrency(p.unit) {
		return p.unit
	}
	return ""
}

// unitLine is the unit line wrapped to the cell.
func (p *valueRows) unitLine(f *frame, cellW float64) axisTitleText {
	if p.axisTitle == "" {
		return axisTitleText{}
	}
	return f.axisTitle(p.axisTitle, cellW*0.62)
}

func (p *valueRows) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	lh := lineHeight(sp.text)
	var in insets
	if e.top {
		if t := p.unitLine(f, cellW); len(t.lines) > 0 {
			in.top = t.height(lh) + sp.gap
		}
	}
	// Labels: up to two lines in at most 38% of the cell, as on bars.
	p.wrapped = make([][]string, len(p.rows))
	p.labelW, p.lines = 0, 1
	for i, r := range p.rows {
		lines, cut := f.wrap(r.label, sp.text, false, cellW*0.38, 2)
		if cut {
			f.scene.Note("label-shortened", false, fmt.Sprintf("shortened the label %q to fit; the full text is in its tooltip", r.label))
		}
		p.wrapped[i] = lines
		p.lines = max(p.lines, len(lines))
		for _, l := range lines {
			p.labelW = math.Max(p.labelW, f.measure(l, sp.text, false))
		}
	}
	if e.left {
		in.left = p.labelW + sp.gap*1.5
	}
	// Half of the last tick label hangs past the plot; the right column
	// and a direct label need their width.
	a := f.fitValue(p.dx.lo, p.dx.hi, math.Max(cellW*0.5, 1), true, p.kind())
	if n := len(a.labels); n > 0 {
		in.right = f.measure(a.labels[n-1], sp.text, false) / 2
	}
	for _, r := range p.rows {
		if r.right != "" {
			in.right = math.Max(in.right, sp.gap+f.measure(r.right, sp.text, false))
		}
		if r.direct != "" {
			in.right = math.Max(in.right, sp.gap+f.measure(r.direct, sp.text, false))
		}
	}
	if e.bottom {
		in.bottom = sp.gap + lh
	}
	return in
}

func (p *valueRows) height(f *frame, plotW, room float64) (float64, error) {
	sp := f.spec
	lh := lineHeight(sp.text)
	n := float64(len(p.rows))
	p.band = math.Max(float64(p.lines)*lh+sp.gap*1.5, sp.text*2.1)
	if p.rowCap > 0 {
		p.band = math.Max(p.band, p.rowCap)
	}
	if room > 0 {
		if room/n < lh+sp.gap/2 {
			return 0, fmt.Errorf("%d rows do not fit in a %g px high plot with %g px text: give a taller canvas (%s) or fewer categories", len(p.rows), math.Round(room), sp.text, f.c.name("Height"))
		}
		p.band = room / n
		return room, nil
	}
	return n * p.band, nil
}

func (p *valueRows) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc := face.Ascent(sp.text)
	p.ax = f.fitValue(p.dx.lo, p.dx.hi, plot.W, true, p.kind())
	xs := scale.Linear{D0: p.ax.d0, D1: p.ax.d1, R0: plot.X, R1: plot.X + plot.W}
	bottom := plot.Y + plot.H
	out := forLayers(placed{xs: xs, horizontal: true}, p.ax, false, p.values)
	out.valueText = p.vfmt.Format // as the data are written: a mean of tenths in tenths
	if e.top {
		if t := p.unitLine(f, plot.W+plot.X); len(t.lines) > 0 {
			top := plot.Y - sp.gap - t.height(lh)
			f.drawAxisTitle(t, round2(plot.X), top)
			for i, l := range t.lines {
				out.text = append(out.text, layout.Box{X: plot.X, Y: top + float64(i)*lh, W: f.measure(l, sp.text, false), H: lh})
			}
		}
	}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.draw(p.ax, axisDraw{pos: xs, from: plot.Y, to: bottom, labelAt: bottom + sp.gap + asc, labels: e.bottom})
	f.scene.Add(Mark{Kind: GroupEnd})
	thick := math.Min(math.Max(p.band*0.5, sp.text*0.8), math.Max(sp.text*1.6, p.band*0.4))
	for i, r := range p.rows {
		cy := plot.Y + (float64(i)+0.5)*p.band
		textY := cy + (asc-face.Descent(sp.text))/2
		if e.left {
			lines := p.wrapped[i]
			tip := tooltip(r.label, lines)
			for j, l := range lines {
				y := textY + (float64(j)-float64(len(lines)-1)/2)*lh
				f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(plot.X - sp.gap*1.5), Y: round2(y), Text: l, Size: sp.text, Fill: f.th.text, Anchor: End, Tooltip: tip})
				w := f.measure(l, sp.text, false)
				out.text = append(out.text, layout.Box{X: plot.X - sp.gap*1.5 - w, Y: y - asc, W: w, H: lh})
			}
		}
		if r.draw == nil {
			continue // a category of other panels
		}
		boxes, end := r.draw(f, xs, cy, thick, false)
		out.marks = append(out.marks, boxes...)
		out.cats = append(out.cats, catPlace{label: r.label, centre: cy, size: p.band, end: end})
		if r.right != "" {
			f.text(round2(plot.X+plot.W+sp.gap), round2(textY), r.right, sp.text, false, f.th.muted, "plumb-value plumb-n", Start)
			out.text = append(out.text, layout.Box{X: plot.X + plot.W + sp.gap, Y: textY - asc, W: f.measure(r.right, sp.text, false), H: lh})
		}
		if r.direct != "" {
			f.text(round2(end+sp.gap), round2(textY), r.direct, sp.text, false, f.th.text, "plumb-label plumb-direct", Start)
			out.text = append(out.text, layout.Box{X: end + sp.gap, Y: textY - asc, W: f.measure(r.direct, sp.text, false), H: lh})
		}
	}
	return out, nil
}

func (p *valueRows) describe() (string, string) { return p.desc, p.name }
