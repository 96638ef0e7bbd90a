package render

import (
	"fmt"

	"plumb/layout"
	"plumb/scale"
)

// jointPanels is what the small multiples of one chart share: one plot
// size, banked over all the series together so that every panel has one
// height and one scale, their lines reduced once, and one context band,
// the range of all the series, computed once for every panel so that the
// figure grows linearly with the number of series.
type jointPanels struct {
	w, room float64
	ax      axis
	polys   []scale.Polyline
	bridged int
	bank    banking
	h       float64
	ay      axis
	// Set by the first panel drawn, at the plot's left edge.
	drawn []drawnLine
	band  [][]Point
}

// jointHeight banks every series together for panels plotW wide (or fits
// the room of a fixed canvas), once for all panels.
func (c *lineChart) jointHeight(f *frame, plotW, room float64, x, y axisDomain) (*jointPanels, error) {
	if j := c.joint; j != nil && j.w == plotW && j.room == room {
		return j, nil
	}
	sp := f.spec
	if plotW < sp.text*6 {
		return nil, fmt.Errorf("%d panels do not fit at this width: give a wider canvas (%s), or %s for one panel", len(c.series), c.opt.name("Width"), c.opt.name("Together"))
	}
	j := &jointPanels{w: plotW, room: room, bank: c.bank}
	j.ax = f.fitX(x.lo, x.hi, c.xk, plotW)
	g := lineGeom{w: int(plotW), ax: j.ax}
	var err error
	if j.polys, j.bridged, err = c.reduceAll(f, g); err != nil {
		return nil, err
	}
	if j.h, j.ay, err = f.plotHeight(&j.bank, j.polys, c.opt.Time, j.ax.d1-j.ax.d0, plotW, y.lo, y.hi, c.yk, room, true); err != nil {
		return nil, err
	}
	c.joint = j
	return j, nil
}

// drawMultiple draws one small multiple: its own series strongly over the
// band of all of them, on the shared axes.
func (p *linePlan) drawMultiple(f *frame, plot layout.Box, e edges) (placed, error) {
	c := p.c
	from := len(f.scene.Marks)
	j, err := c.jointHeight(f, plot.W, c.jointRoom(), p.axes.x, p.axes.y)
	if err != nil {
		return placed{}, err
	}
	ax := p.axes.xAxisFor(f, plot.W)
	ys := scale.Linear{D0: j.ay.d0, D1: j.ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	if j.drawn == nil {
		// The first panel: every panel's lines, for the notes, and the
		// band, at the plot's left edge; each panel moves them to its own.
		f.scene.Note("aspect", false, j.bank.note(plot.W, plot.H)+", each panel")
		g := lineGeom{w: int(plot.W), ax: ax}
		j.drawn = make([]drawnLine, len(c.series))
		for i := range c.series {
			g.reduce = shouldReduce(c.series[i:i+1], g.w)
			j.drawn[i] = g.screen(j.polys[i], ys)
		}
		f.noteMissing(c.missing, j.bridged, j.drawn)
		j.band = bandPieces(envelope(c.series, ax, g.w), ys)
	}
	p.axes.draw(f, j.ay, ys, plot, e)
	if len(j.band) > 0 {
		band := make([][]Point, len(j.band))
		for i, piece := range j.band {
			band[i] = make([]Point, len(piece))
			for k, pt := range piece {
				band[i][k] = Point{round2(pt.X + plot.X), pt.Y}
			}
		}
		f.scene.Add(Mark{Kind: Path, Class: "plumb-context", Lines: band, Closed: true, Fill: f.th.context, Attrs: []Attr{{"series", "range of all series"}}})
	}
	c.drawBase(f, ys, plot.X, plot.X+plot.W)
	s := c.series[p.idx]
	xs := scale.Linear{D0: ax.d0, D1: ax.d1, R0: plot.X, R1: plot.X + plot.W}
	c.drawBand(f, s, f.th.neutral, xs, ys)
	g := lineGeom{left: plot.X, w: int(plot.W), ax: ax, reduce: shouldReduce(c.series[p.idx:p.idx+1], int(plot.W))}
	f.addSeries("plumb-mark", s.Name, j.polys[p.idx], g.screen(j.polys[p.idx], ys), f.th.neutral, strokeWidth(f.spec), c.opt.Time)
	text, marks := f.boxesSince(from)
	return forLayers(placed{xs: xs, ys: ys, text: text, marks: marks}, j.ay, c.opt.Time, s.Y), nil
}

// jointRoom is the room the panels were last fitted to.
func (c *lineChart) jointRoom() float64 {
	if c.joint == nil {
		return 0
	}
	return c.joint.room
}
