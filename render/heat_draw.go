package render

import (
	"fmt"
	"image"
	"image/color"
	"math"
	"strconv"

	"plumb/layout"
	"plumb/scale"
)

// keyWidth is the length of the colour key's ramp: long enough for a
// handful of tick labels, never longer than the cells above it.
func (p *heatPlan) keyWidth(f *frame, plot layout.Box) float64 {
	w := math.Min(20*f.spec.text, plot.W)
	if p.missing > 0 {
		w = math.Min(w, plot.W-p.noDataWidth(f))
	}
	return math.Floor(math.Max(w, 4*f.spec.text))
}

// noDataWidth is the room of the key's "no data" swatch and its label.
func (p *heatPlan) noDataWidth(f *frame) float64 {
	sp := f.spec
	return 2*sp.text + p.rampHeight(f) + sp.gap + f.measure("no data", sp.text, false)
}

// fitKey chooses the key's ticks and with them the colours' domain.
func (p *heatPlan) fitKey(f *frame, plot layout.Box) {
	lo, hi := p.colours.keyDomain()
	unit := p.opt.Unit
	if unit != "%" {
		unit = ""
	}
	k := valueKind{label: func(v []float64) []string { return formatAll(scale.TickFormat(v, unit), v) }}
	p.key = f.fitValue(lo, hi, p.keyWidth(f, plot), true, k)
	p.colours.fit(p.key.d0, p.key.d1)
}

// drawCells draws one rect per cell, or above HeatRectLimit cells one
// image with a pixel per cell.
func (p *heatPlan) drawCells(f *frame, plot layout.Box, pl *placed) {
	p.fitKey(f, plot)
	m := p.m
	nr, nc := len(p.rowOrder), len(p.colOrder)
	missing := f.th.context
	if nr*nc > HeatRectLimit {
		img := image.NewNRGBA(image.Rect(0, 0, nc, nr))
		for y, i := range p.rowOrder {
			for x, j := range p.colOrder {
				c := missing
				if v := m.Values[i*len(m.Cols)+j]; !math.IsNaN(v) {
					c = p.colours.colour(v)
				}
				img.SetNRGBA(x, y, color.NRGBA(c))
			}
		}
		f.scene.Add(Mark{Kind: Image, Class: "plumb-mark plumb-cells", X: round2(plot.X), Y: round2(plot.Y), W: round2(plot.W), H: round2(plot.H), Img: img,
			Attrs: []Attr{{"rows", strconv.Itoa(nr)}, {"cols", strconv.Itoa(nc)}}})
		pl.marks = append(pl.marks, plot)
		f.scene.Note("heat-image", false, fmt.Sprintf("%d cells (more than %d) drawn as one image, a pixel per cell", nr*nc, HeatRectLimit))
		if plot.H < float64(nr) {
			f.scene.Note("heat-dense", false, fmt.Sprintf("%d rows share %.0f px: a viewer shows about one row in %.0f at this size; zoom in or split the table for each row", nr, plot.H, math.Ceil(float64(nr)/plot.H)))
		}
		return
	}
	xs := edgesOf(plot.X, plot.W, nc)
	ys := edgesOf(plot.Y, plot.H, nr)
	for y, i := range p.rowOrder {
		for x, j := range p.colOrder {
			v := m.Values[i*len(m.Cols)+j]
			mk := Mark{Kind: Rect, Class: "plumb-mark", X: xs[x], Y: ys[y], W: round2(xs[x+1] - xs[x]), H: round2(ys[y+1] - ys[y]),
				Attrs: []Attr{{"row", m.Rows[i]}, {"col", m.Cols[j]}, {"value", ""}}}
			if math.IsNaN(v) {
				mk.Class, mk.Fill = "plumb-mark plumb-missing", missing
			} else {
				mk.Fill = p.colours.colour(v)
				mk.Attrs[2].Value = strconv.FormatFloat(v, 'g', -1, 64)
			}
			f.scene.Add(mk)
			pl.marks = append(pl.marks, layout.Box{X: mk.X, Y: mk.Y, W: mk.W, H: mk.H})
		}
	}
}

// rightW is the room right of the cells: the tree's.
func (p *heatPlan) rightW(f *frame) float64 {
	if p.tree == nil {
		return 0
	}
	return f.spec.gap + p.treeWidth(f)
}

// edgesOf splits [from, from+length] into n equal parts, edges rounded.
func edgesOf(from, length float64, n int) []float64 {
	e := make([]float64, n+1)
	for i := range e {
		e[i] = round2(from + length*float64(i)/float64(n))
	}
	return e
}

// drawRowLabels labels the rows left of the cells, every k-th when rows
// are thinner than a line of text.
func (p *heatPlan) drawRowLabels(f *frame, plot layout.Box, pl *placed) {
	sp := f.spec
	nr := len(p.rowOrder)
	cell := plot.H / float64(nr)
	p.rowStride = max(1, int(math.Ceil(p.lh(f)/cell-1e-9)))
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	width := p.labelW
	right := plot.X - 1.5*sp.gap
	for y := 0; y < nr; y += p.rowStride {
		label := p.m.Rows[p.rowOrder[y]]
		lines, cut := f.wrap(label, sp.text, false, width, 1)
		if len(lines) == 0 {
			continue
		}
		tip := ""
		if cut {
			tip = label
		}
		cy := plot.Y + (float64(y)+0.5)*cell
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(right), Y: round2(cy + (asc-desc)/2), Text: lines[0], Size: sp.text, Fill: f.th.text, Anchor: End, Tooltip: tip})
		w := f.measure(lines[0], sp.text, false)
		pl.text = append(pl.text, layout.Box{X: right - w, Y: cy - (asc+desc)/2, W: w, H: asc + desc})
	}
	if p.rowStride > 1 {
		f.scene.Note("heat-thin-rows", false, fmt.Sprintf("%d rows are too thin to label each: every %s row is labelled, counted from the first", nr, ordinal(p.rowStride)))
	}
}

// drawColLabels labels the columns under the cells, centred, every k-th
// when the labels are wider than their columns; it returns the y under
// them.
func (p *heatPlan) drawColLabels(f *frame, plot layout.Box, pl *placed) float64 {
	sp := f.spec
	nc := len(p.colOrder)
	cell := plot.W / float64(nc)
	maxW := 10 * sp.text
	widest := f.measure(layout.Ellipsis, sp.text, false)
	for _, j := range p.colOrder {
		widest = math.Max(widest, math.Min(maxW, f.measure(p.m.Cols[j], sp.text, false)))
	}
	p.colStride = max(1, int(math.Ceil((widest+sp.gap)/cell-1e-9)))
	room := math.Min(maxW, float64(p.colStride)*cell-sp.gap)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	top := plot.Y + plot.H + sp.gap
	prevRight := math.Inf(-1)
	for x := 0; x < nc; x += p.colStride {
		label := p.m.Cols[p.colOrder[x]]
		lines, cut := f.wrap(label, sp.text, false, room, 1)
		if len(lines) == 0 {
			continue
		}
		tip := ""
		if cut {
			tip = label
		}
		cx := plot.X + (float64(x)+0.5)*cell
		w := f.measure(lines[0], sp.text, false)
		// A label wider than its column may reach under the row labels
		// or the tree, never beyond them; labels are a stride apart, so
		// they do not meet.
		cx = math.Max(cx, plot.X-p.labelW+w/2)
		cx = math.Min(cx, plot.X+plot.W+p.rightW(f)-w/2)
		if cx-w/2 < prevRight+sp.gap {
			continue // never reached while labels are a stride apart; kept as a guard
		}
		prevRight = cx + w/2
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(cx), Y: round2(top + asc), Text: lines[0], Size: sp.text, Fill: f.th.text, Anchor: Middle, Tooltip: tip})
		pl.text = append(pl.text, layout.Box{X: cx - w/2, Y: top, W: w, H: asc + desc})
	}
	if p.colStride > 1 {
		f.scene.Note("heat-thin-cols", false, fmt.Sprintf("%d columns are too narrow to label each: every %s column is labelled, counted from the first", nc, ordinal(p.colStride)))
	}
	return top + p.lh(f)
}

func ordinal(k int) string {
	switch {
	case k%100 >= 11 && k%100 <= 13:
		return fmt.Sprintf("%dth", k)
	case k%10 == 2:
		return fmt.Sprintf("%dnd", k)
	case k%10 == 3:
		return fmt.Sprintf("%drd", k)
	}
	return fmt.Sprintf("%dth", k)
}

// drawTree draws the row dendrogram right of the cells: leaves at their
// rows, each merge at its height (the root at the far side). Merges lower
// than half a pixel are left out: they would draw nothing.
func (p *heatPlan) drawTree(f *frame, plot layout.Box) {
	t := p.tree
	n := t.d.Leaves
	x0 := plot.X + plot.W + f.spec.gap
	tw := p.treeWidth(f)
	top := t.d.Merges[len(t.d.Merges)-1].Height
	cell := plot.H / float64(n)
	ys := make([]float64, n+len(t.d.Merges))
	xs := make([]float64, len(ys))
	for i := range n {
		ys[i], xs[i] = plot.Y+(float64(t.pos[i])+0.5)*cell, x0
	}
	var lines [][]Point
	for i, mg := range t.d.Merges {
		v := n + i
		x := x0
		if top > 0 {
			x = x0 + tw*mg.Height/top
		}
		xs[v], ys[v] = x, (ys[mg.Left]+ys[mg.Right])/2
		if x-x0 < 0.5 {
			continue
		}
		a, b := mg.Left, mg.Right
		lines = append(lines, []Point{
			{round2(xs[a]), round2(ys[a])}, {round2(x), round2(ys[a])}, {round2(x), round2(ys[b])}, {round2(xs[b]), round2(ys[b])}})
	}
	if len(lines) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-tree", Lines: lines, Stroke: f.th.muted, StrokeWidth: 1, Join: JoinRound, Cap: CapRound})
	}
}

// drawKey draws the colour key under the column labels: what the values
// measure, the ramp with nice ticks, and a "no data" swatch when cells are
// missing.
func (p *heatPlan) drawKey(f *frame, plot layout.Box, top float64, pl *placed) {
	sp := f.spec
	face := f.fonts.Face(false)
	asc := face.Ascent(sp.text)
	title := p.opt.ValueName
	if title == "" {
		title = "Value"
	}
	if p.colours.diverging {
		title += fmt.Sprintf(" (colours part at %s)", scale.ValueFormat([]float64{p.colours.mid}, "").Format(p.colours.mid))
	}
	lines, _ := f.wrap(title, sp.text, false, plot.W, 1)
	if len(lines) > 0 {
		f.text(round2(plot.X), round2(top+asc), lines[0], sp.text, false, f.th.muted, "plumb-axis-title", Start)
	}
	y := top + p.lh(f) + sp.gap
	kw := p.keyWidth(f, plot)
	rh := p.rampHeight(f)
	f.scene.Add(Mark{Kind: Image, Class: "plumb-key", X: round2(plot.X), Y: round2(y), W: kw, H: rh, Img: p.colours.ramp(p.key.d0, p.key.d1, int(kw))})
	pos := scale.Linear{D0: p.key.d0, D1: p.key.d1, R0: plot.X, R1: plot.X + kw}
	f.draw(p.key, axisDraw{pos: pos, from: y + rh, to: y + rh + 4, tickMarks: true, labelAt: f.xLabelTop(y+rh) + asc, labels: true})
	if p.missing > 0 {
		x := plot.X + kw + 2*sp.text
		f.scene.Add(Mark{Kind: Rect, Class: "plumb-missing", X: round2(x), Y: round2(y), W: rh, H: rh, Fill: f.th.context})
		f.text(round2(x+rh+sp.gap), round2(y+rh/2+asc/2-face.Descent(sp.text)/2), "no data", sp.text, false, f.th.muted, "plumb-label", Start)
	}
}
