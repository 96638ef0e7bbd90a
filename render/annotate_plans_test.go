package render

import (
	"math"
	"slices"

	"plumb/layout"
	"plumb/scale"
)

// Two small plans for testing the annotation layers until bars, dots,
// lines and diff are plans themselves: rowsPlan draws one bar (or dot) per
// category with its label and value, horizontal or standing; seriesPlan
// draws points over a number or time x. Both fill placed as a real chart
// must: scales, categories, the boxes of their text and marks, values.

// rowsPlan is bars or dots by category.
type rowsPlan struct {
	labels   []string
	values   []float64
	vertical bool
	dots     bool
	dv       axisDomain
}

func (p *rowsPlan) domains() (axisDomain, axisDomain) {
	lo, hi, _ := dataRange(p.values)
	if !p.dots {
		lo, hi = math.Min(lo, 0), math.Max(hi, 0)
	}
	v := axisDomain{kind: domainNumber, lo: lo, hi: hi}
	c := axisDomain{kind: domainCategory, labels: p.labels}
	if p.vertical {
		return c, v
	}
	return v, c
}

func (p *rowsPlan) share(x, y axisDomain) {
	p.dv = x
	if p.vertical {
		p.dv = y
	}
}

func (p *rowsPlan) kind() valueKind {
	return valueKind{zero: !p.dots, label: func(v []float64) []string { return formatAll(scale.ValueFormat(v, ""), v) }}
}

func (p *rowsPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	labelW := 0.0
	for _, l := range p.labels {
		labelW = math.Max(labelW, f.measure(l, sp.text, false))
	}
	lh := lineHeight(sp.text)
	if p.vertical {
		return insets{left: 4 * sp.text, right: sp.text, top: lh, bottom: lh + sp.gap + p.negRoom(f)}
	}
	return insets{left: labelW + sp.gap + p.negRoom(f), right: 4 * sp.text, top: sp.gap, bottom: f.xLabelTop(0) + lh}
}

// negRoom is the room the value labels of negative marks take beyond the
// plot, between it and the category labels.
func (p *rowsPlan) negRoom(f *frame) float64 {
	if slices.ContainsFunc(p.values, func(v float64) bool { return v < 0 }) {
		if p.vertical {
			return lineHeight(f.spec.text) + f.spec.gap
		}
		return 5 * f.spec.text
	}
	return 0
}

func (p *rowsPlan) height(f *frame, plotW, room float64) (float64, error) {
	if room > 0 {
		return room, nil
	}
	if p.vertical {
		return plotW * 0.6, nil
	}
	return float64(len(p.labels)) * lineHeight(f.spec.text) * 1.6, nil
}

func (p *rowsPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	start := len(f.scene.Marks)
	length := plot.W
	if p.vertical {
		length = plot.H
	}
	a := f.fitValue(p.dv.lo, p.dv.hi, length, !p.vertical, p.kind())
	vs := scale.Linear{D0: a.d0, D1: a.d1, R0: plot.X, R1: plot.X + plot.W}
	if p.vertical {
		vs = scale.Linear{D0: a.d0, D1: a.d1, R0: plot.Y + plot.H, R1: plot.Y}
	}
	out := placed{horizontal: !p.vertical, values: p.values}
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	format := scale.ValueFormat(p.values, "")
	out.valueText = format.Format
	if p.vertical {
		out.ys = vs
		f.draw(a, axisDraw{vertical: true, pos: vs, from: plot.X, to: plot.X + plot.W, labelAt: plot.X - sp.gap, labels: true})
	} else {
		out.xs = vs
		top := f.xLabelTop(plot.Y + plot.H)
		f.draw(a, axisDraw{pos: vs, from: plot.Y, to: plot.Y + plot.H, labelAt: top + asc, labels: true})
	}
	n := float64(len(p.labels))
	band := plot.H / n
	if p.vertical {
		band = plot.W / n
	}
	base := vs.Map(math.Max(a.d0, math.Min(0, a.d1)))
	for i, l := range p.labels {
		v := p.values[i]
		end := vs.Map(v)
		c := catPlace{label: l, size: band}
		var mark layout.Box
		if p.vertical {
			c.centre = plot.X + band*(float64(i)+0.5)
			mark = layout.Box{X: c.centre - band*0.35, Y: math.Min(end, base), W: band * 0.7, H: math.Abs(end - base)}
			c.end = end
			if short, _ := f.wrap(l, sp.text, false, band-sp.gap, 1); len(short) == 1 {
				f.text(c.centre, plot.Y+plot.H+p.negRoom(f)+sp.gap+asc, short[0], sp.text, false, f.th.text, "plumb-label", Middle)
			}
			if end <= base {
				f.text(c.centre, end-sp.gap-desc, format.Format(v), sp.text, false, f.th.text, "plumb-value", Middle)
			} else {
				f.text(c.centre, end+sp.gap+asc, format.Format(v), sp.text, false, f.th.text, "plumb-value", Middle)
			}
		} else {
			c.centre = plot.Y + band*(float64(i)+0.5)
			mark = layout.Box{X: math.Min(end, base), Y: c.centre - band*0.35, W: math.Abs(end - base), H: band * 0.7}
			c.end = end
			f.text(plot.X-sp.gap-p.negRoom(f), c.centre+(asc-desc)/2, l, sp.text, false, f.th.text, "plumb-label", End)
			if end >= base {
				f.text(end+sp.gap, c.centre+(asc-desc)/2, format.Format(v), sp.text, false, f.th.text, "plumb-value", Start)
			} else {
				f.text(end-sp.gap, c.centre+(asc-desc)/2, format.Format(v), sp.text, false, f.th.text, "plumb-value", End)
			}
		}
		if p.dots {
			r := band * 0.25
			if p.vertical {
				mark = layout.Box{X: c.centre - r, Y: end - r, W: 2 * r, H: 2 * r}
			} else {
				mark = layout.Box{X: end - r, Y: c.centre - r, W: 2 * r, H: 2 * r}
			}
			f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark", X: mark.X + r, Y: mark.Y + r, R: r, Fill: f.th.neutral})
		} else {
			f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark", X: mark.X, Y: mark.Y, W: mark.W, H: mark.H, Fill: f.th.neutral})
		}
		out.cats = append(out.cats, c)
		out.marks = append(out.marks, mark)
	}
	out.text = textBoxesSince(f, start)
	return out, nil
}

func (p *rowsPlan) describe() (string, string) { return "rows", "Rows" }

// seriesPlan is points joined over a number or time x.
type seriesPlan struct {
	x, y   []float64
	time   bool
	dx, dy axisDomain
}

func (p *seriesPlan) domains() (axisDomain, axisDomain) {
	lo, hi, _ := dataRange(p.x)
	ylo, yhi, _ := dataRange(p.y)
	k := domainNumber
	if p.time {
		k = domainTime
	}
	return axisDomain{kind: k, lo: lo, hi: hi}, axisDomain{kind: domainNumber, lo: ylo, hi: yhi}
}

func (p *seriesPlan) share(x, y axisDomain) { p.dx, p.dy = x, y }

func (p *seriesPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	return insets{left: 5 * sp.text, right: 2 * sp.text, top: sp.gap, bottom: f.xLabelTop(0) + lineHeight(sp.text)}
}

func (p *seriesPlan) height(f *frame, plotW, room float64) (float64, error) {
	if room > 0 {
		return room, nil
	}
	return plotW * 0.5, nil
}

func (p *seriesPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	start := len(f.scene.Marks)
	ax := f.fitX(p.dx.lo, p.dx.hi, xKindOf([][]float64{p.x}, p.time), plot.W)
	ay := f.fitY(p.dy.lo, p.dy.hi, plot.H, yKind{})
	xs := scale.Linear{D0: ax.d0, D1: ax.d1, R0: plot.X, R1: plot.X + plot.W}
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	f.drawYAxis(ay, ys, plot.X, plot.X+plot.W, true)
	f.drawXAxis(ax, plot.X, int(plot.W), plot.Y+plot.H, true)
	line := make([]Point, len(p.x))
	for i := range p.x {
		line[i] = Point{round2(xs.Map(p.x[i])), round2(ys.Map(p.y[i]))}
	}
	f.scene.Add(Mark{Kind: Path, Class: "plumb-mark", Lines: [][]Point{line}, Stroke: f.th.neutral, StrokeWidth: 2})
	// One box per segment, widened by the stroke: a line's marks are
	// where its ink is, not the box of the whole line.
	var marks []layout.Box
	for i := 1; i < len(line); i++ {
		a, b := line[i-1], line[i]
		marks = append(marks, layout.Box{X: math.Min(a.X, b.X) - 1, Y: math.Min(a.Y, b.Y) - 1, W: math.Abs(b.X-a.X) + 2, H: math.Abs(b.Y-a.Y) + 2})
	}
	_ = sp
	return placed{xs: xs, ys: ys, xTime: p.time, values: p.y, text: textBoxesSince(f, start), marks: marks}, nil
}

func (p *seriesPlan) describe() (string, string) { return "series", "Series" }

// textBoxesSince are the boxes of the text marks added since mark start,
// as the frame measures them.
func textBoxesSince(f *frame, start int) []layout.Box {
	var out []layout.Box
	for _, m := range f.scene.Marks[start:] {
		if m.Kind != Text {
			continue
		}
		w := f.measure(m.Text, m.Size, m.Bold)
		face := f.fonts.Face(m.Bold)
		x := m.X
		switch m.Anchor {
		case Middle:
			x -= w / 2
		case End:
			x -= w
		}
		out = append(out, layout.Box{X: x, Y: m.Y - face.Ascent(m.Size), W: w, H: face.Ascent(m.Size) + face.Descent(m.Size)})
	}
	return out
}

func rowsPanel(c Common, labels []string, values []float64, vertical, dots bool) Panel {
	return newPanel(c, func(*frame) (panelPlan, error) {
		return &rowsPlan{labels: labels, values: values, vertical: vertical, dots: dots}, nil
	})
}

func seriesPanel(c Common, x, y []float64, isTime bool) Panel {
	return newPanel(c, func(*frame) (panelPlan, error) {
		return &seriesPlan{x: x, y: y, time: isTime}, nil
	})
}
