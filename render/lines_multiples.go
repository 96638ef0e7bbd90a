package render

import (
	"fmt"
	"math"

	"plumb/scale"
)

// layoutMultiples draws one panel per series in a grid, all with the same
// scales; each panel shows its own series strongly over one faint band:
// the range of all the series, computed once for every panel, so that the
// figure grows linearly with the number of series.
func (c *lineChart) layoutMultiples() (float64, error) {
	f, sp := c.f, c.f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	top := f.plotTop()
	if c.yTitle != "" {
		t := f.axisTitle(c.yTitle, f.width-2*sp.pad)
		f.drawAxisTitle(t, sp.pad, top)
		top += t.height(lh) + sp.gap
	}
	n := len(c.series)
	left0 := math.Ceil(sp.pad + f.yLabelWidth(c.ylo, c.yhi, c.yk) + sp.gap)
	// The gutter between panels is two characters, or wider when the
	// outer x labels of neighbouring panels need it. The grid is about
	// square in panels, so the columns grow with the count; a panel
	// narrower than minPanelChars characters reads poorly, so fewer
	// columns are tried then.
	hgap0 := math.Ceil(sp.text * 2)
	cols := min(n, int(math.Ceil(math.Sqrt(float64(n)))))
	var left, w, hgap float64
	var ax axis
	for ; ; cols-- {
		left, w, hgap, ax = f.fitPanelsX(left0, 0, cols, hgap0, c.xlo, c.xhi, c.xk)
		if cols == 1 || w >= sp.text*minPanelChars {
			break
		}
	}
	rows := (n + cols - 1) / cols
	if w < sp.text*6 {
		return 0, fmt.Errorf("%d panels do not fit at this width: give a wider canvas (%s), or %s for one panel", n, c.opt.name("Width"), c.opt.name("Together"))
	}
	g := lineGeom{left: 0, w: int(w), ax: ax}
	polys, bridged, err := c.reduceAll(g)
	if err != nil {
		return 0, err
	}
	titleH := lh
	plotOff := titleH + math.Ceil((asc+desc)/2)
	room := 0.0
	if fb := f.fixedPlotBottom(); fb > 0 {
		// Rows of panels, the last one or two with x labels, within the canvas.
		over := float64(rows)*(plotOff+sp.gap*2) + 2*(f.xLabelTop(0)+lh)
		if c.opt.XName != "" {
			over += lh
		}
		room = math.Floor((fb - top - over) / float64(rows))
		if room < minPlotHeight(sp, true) {
			return 0, fmt.Errorf("%d %s not fit in a %g px high figure: give a taller canvas (%s), or %s for one panel", rows, plural(rows, "row of panels does", "rows of panels do"), f.spec.height, c.opt.name("Height"), c.opt.name("Together"))
		}
	}
	h, ay, err := f.plotHeight(&c.bank, polys, c.opt.Time, ax.d1-ax.d0, w, c.ylo, c.yhi, c.yk, room, true)
	if err != nil {
		return 0, err
	}
	f.scene.Note("aspect", false, c.bank.note(w, h)+", each panel")
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: plotOff + h, R1: plotOff}
	lastRow := n - (rows-1)*cols
	drawn := make([]drawnLine, n)
	for i := range c.series {
		g.reduce = shouldReduce(c.series[i:i+1], g.w)
		drawn[i] = g.screen(polys[i], ys)
	}
	c.noteMissing(bridged, drawn)
	band := bandPieces(envelope(c.series, ax, g.w), ys)
	y := top
	for r := 0; r < rows; r++ {
		rowH := plotOff + h
		labelled := r == rows-1 || r == rows-2 && lastRow < cols
		if labelled {
			rowH = f.xLabelTop(plotOff+h) + lh
		}
		for col := 0; col < cols; col++ {
			i := r*cols + col
			if i >= n {
				break
			}
			dx := left + float64(col)*(w+hgap)
			f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-panel", DX: dx, DY: round2(y), Attrs: []Attr{{"series", c.series[i].Name}}})
			title, cut := f.wrap(c.series[i].Name, sp.text, true, w, 1)
			tip := ""
			if cut {
				tip = c.series[i].Name
			}
			if len(title) > 0 {
				f.scene.Add(Mark{Kind: Text, Class: "plumb-panel-title", X: 0, Y: asc, Text: title[0], Size: sp.text, Bold: true, Fill: f.th.text, Tooltip: tip})
			}
			f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
			f.drawYAxis(ay, ys, 0, w, col == 0)
			showX := r == rows-1 || (r+1)*cols+col >= n
			f.drawXAxis(ax, 0, int(w), plotOff+h, showX)
			f.scene.Add(Mark{Kind: GroupEnd})
			if len(band) > 0 {
				f.scene.Add(Mark{Kind: Path, Class: "plumb-context", Lines: band, Closed: true, Fill: f.th.context, Attrs: []Attr{{"series", "range of all series"}}})
			}
			c.drawBase(ys, 0, w)
			f.addSeries("plumb-mark", c.series[i].Name, polys[i], drawn[i], f.th.neutral, strokeWidth(sp), c.opt.Time)
			f.scene.Add(Mark{Kind: GroupEnd})
		}
		y += rowH + sp.gap*2
	}
	bottom := y - sp.gap*2
	if c.opt.XName != "" {
		f.text(left+(float64(cols)*w+float64(cols-1)*hgap)/2, bottom+asc, c.opt.XName, sp.text, false, f.th.muted, "plumb-axis-title", Middle)
		bottom += lh
	}
	return bottom, nil
}
