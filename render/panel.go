package render

import (
	"fmt"
	"math"
	"slices"

	"plumb/layout"
	"plumb/scale"
)

// This file is the panel layer. Every chart kind is a panel plan: its data
// planned (validated, ordered, domains decided) but nothing placed. A grid
// asks each plan what room its axes and labels need, gives it a box, and
// lets it draw there. A single chart, small multiples, a chart with a
// context panel and a figure file are all grids of plans laid out by
// drawGrid, so that panels line up, share scales when asked, and label an
// axis once on the outside of the grid.

// insets is the room a panel needs outside its plot area, in pixels.
type insets struct{ left, right, top, bottom float64 }

// edges says which sides of a panel face the outside of its grid. Tick
// labels and axis titles belong on those sides only: inside the grid the
// neighbour's labels already say the same.
type edges struct{ left, right, top, bottom bool }

// allEdges are the edges of a panel that is alone in its grid.
var allEdges = edges{true, true, true, true}

// domainKind is what an axis of a panel measures.
type domainKind uint8

// The kinds of axis domain.
const (
	domainNone     domainKind = iota // the panel has no such axis (or it is not shareable)
	domainNumber                     // numbers
	domainTime                       // instants, as Unix seconds
	domainCategory                   // category labels, in drawing order
)

// axisDomain is one data axis of a panel, which a grid may share with the
// other panels of the same kind.
type axisDomain struct {
	kind    domainKind
	lo, hi  float64  // number and time: the data's extent before nice widening
	integer bool     // every value on the axis is a whole number
	labels  []string // categories, in drawing order
	// shared: the grid gave this domain to every panel along its
	// direction, so inner panels may leave its labels to the outer ones.
	shared bool
	// mixed: categories of panels whose lists differ were combined, so
	// every panel must still label its own.
	mixed bool
}

// union is the domain that holds both d and o. Domains of different kinds
// do not combine: d is returned unchanged.
func (d axisDomain) union(o axisDomain) axisDomain {
	if o.kind == domainNone || (d.kind != domainNone && d.kind != o.kind) {
		return d
	}
	if d.kind == domainNone {
		o.labels = slices.Clone(o.labels)
		return o
	}
	switch d.kind {
	case domainNumber, domainTime:
		d.lo, d.hi = math.Min(d.lo, o.lo), math.Max(d.hi, o.hi)
		d.integer = d.integer && o.integer
	case domainCategory:
		d.mixed = d.mixed || o.mixed || !slices.Equal(d.labels, o.labels)
		for _, l := range o.labels {
			if !slices.Contains(d.labels, l) {
				d.labels = append(d.labels, l)
			}
		}
	}
	return d
}

// include widens a number or time domain to hold v, and reports whether it
// had to: an annotation outside the data widens the domain rather than
// disappearing.
func (d *axisDomain) include(v float64) bool {
	if d.kind != domainNumber && d.kind != domainTime {
		return false
	}
	if v >= d.lo && v <= d.hi {
		return false
	}
	d.lo, d.hi = math.Min(d.lo, v), math.Max(d.hi, v)
	if v != math.Trunc(v) {
		d.integer = false
	}
	return true
}

// catPlace is where one category sits along a category axis, in the
// panel's coordinates: a row (horizontal charts) or a column.
type catPlace struct {
	label  string
	centre float64 // y of a row's middle, x of a column's middle
	size   float64 // the row's height or the column's width
	end    float64 // the far end of the category's mark along the value axis (a bar's end, a dot's edge), for callouts
}

// placed is what a drawn panel tells the layers drawn over it (reference
// lines, events, periods, callouts) and the tests: its scales and what it
// already occupies.
type placed struct {
	xs, ys     scale.Linear // data to pixels on number and time axes; zero on others
	horizontal bool         // categories are rows (the value axis runs along x)
	cats       []catPlace   // category positions, for callouts
	text       []layout.Box // every text box the panel drew
	marks      []layout.Box // the boxes of its data marks

	// For the annotation layers (render/annotate.go):
	values    []float64            // the values along the value axis, for a reference line at their mean or median
	valueText func(float64) string // writes a value as the value axis labels it; nil writes it plainly
	xTime     bool                 // x holds instants (Unix seconds): events and periods are dates
	start     int                  // index in the scene of the panel's first mark, set by the grid: periods are shaded behind everything the panel drew
}

// panelPlan is one chart kind's data, planned and ready to be drawn into a
// box. The grid calls its methods in this order: domains, share, measure,
// height, draw.
type panelPlan interface {
	// domains are the panel's own x and y domains.
	domains() (x, y axisDomain)
	// share gives the domains the panel must draw: its own widened by
	// its annotations, or the grid's union when scales are shared. A plan
	// may widen them further to nice ticks, which is deterministic, so
	// panels given one domain and one length draw one scale.
	share(x, y axisDomain)
	// measure reports the room the panel needs around its plot area in a
	// cell cellW wide whose outer sides are e.
	measure(f *frame, cellW float64, e edges) insets
	// height is the plot height the panel wants for a plot area plotW
	// wide. room > 0 is a fixed height the panel must fit (return room,
	// or an error that says what would make it fit).
	height(f *frame, plotW, room float64) (float64, error)
	// draw adds the panel's marks with its plot area at plot, in the
	// coordinates of the group the grid opened for it.
	draw(f *frame, plot layout.Box, e edges) (placed, error)
	// describe is the panel's plain-language description for readers who
	// cannot see it, and a short accessible name for an untitled figure;
	// called after draw.
	describe() (desc, name string)
}

// panelLayer is something drawn over a panel after its data: an
// annotation. widen lets it extend the domains before they are shared, so
// that what it marks is never off the scale.
type panelLayer interface {
	widen(f *frame, x, y *axisDomain)
	draw(f *frame, p *placed, plot layout.Box) error
}

// A Panel is one chart planned for a cell of a figure: a bar chart, a line
// chart, a distribution. Make one with a chart's Panel function (BarsPanel,
// LinesPanel, ...) and draw several together with Figure.
type Panel struct {
	// Title is the panel's heading in a grid; empty draws none.
	Title string

	name   string // data-panel of an untitled panel of a composed chart ("levels")
	plan   func(f *frame) (panelPlan, error)
	layers []panelLayer
	colors []Colour // the panel's own data colours, when its options give them
}

// newPanel is how every chart's Panel function makes its Panel: the
// options' title is the heading and their annotations its layers.
func newPanel(c Common, plan func(f *frame) (panelPlan, error)) Panel {
	return Panel{Title: c.Title, plan: plan, layers: c.Annotations.layers(), colors: c.Colors}
}

// gridCell is one panel of a grid with its heading.
type gridCell struct {
	title  string
	name   string // data-panel when there is no title
	plan   panelPlan
	layers []panelLayer
}

// err names the panel an error is about when the grid has several, as
// figureScene does for errors of planning, so that a figure file's reader
// can point at the panel.
func (c gridCell) err(err error, n int) error {
	if n > 1 && c.title != "" {
		return fmt.Errorf("panel %q: %w", c.title, err)
	}
	return err
}

// gridOptions say how a grid is composed.
type gridOptions struct {
	cols           int     // a fixed column count; 0 chooses from the count and the aspect
	shareX, shareY bool    // one scale for every panel along x, along y
	aspect         float64 // preferred plot height / width for choosing columns; 0 is 0.62
	above          string  // an axis title said once, above the grid
	below          string  // an axis title said once, under the grid
	// ownHeights gives each row of panels its own plot height, the
	// tallest its panels ask for (a chart over its context panel); on a
	// fixed canvas the rows share the room in those proportions. Without
	// it every panel gets one height. It does not combine with shareY.
	ownHeights bool
	// describe, when set, describes the grid as one chart (small
	// multiples, a chart with its context panel) instead of panel by panel.
	describe func() (desc, name string)
	// independent says that panels keep their own scales unless shared:
	// an axis no neighbour shares is labelled on every panel (a figure
	// of different charts). Without it, a grid labels only its outer
	// edges and the caller sees to it that the panels line up (small
	// multiples, a scatterplot matrix).
	independent bool
}

// gridResult is where a grid put its panels, for layers and tests.
type gridResult struct {
	bottom float64      // the y under the grid
	cells  []layout.Box // each panel's plot area in scene coordinates
	placed []placed     // what each panel drew, in its own coordinates
	origin []Point      // each panel's group translation
}

// drawGrid lays out cells in a grid across the frame's width from top down
// and draws them. Every panel gets the same plot size, so that shared scales
// give one length per unit; columns take the widest left and right room of
// their panels and rows the tallest top and bottom room, so that plot areas
// line up; the gutter between panels is one em plus what labels need.
func (f *frame) drawGrid(cells []gridCell, o gridOptions, top float64) (gridResult, error) {
	sp := f.spec
	n := len(cells)
	if n == 0 {
		return gridResult{}, fmt.Errorf("nothing to draw: no panels")
	}
	f.shareDomains(cells, o)
	single := n == 1 && cells[0].title == ""
	lh := lineHeight(sp.text)
	width := f.width - 2*sp.pad
	asc := f.fonts.Face(false).Ascent(sp.text)
	if o.above != "" {
		t := f.axisTitle(o.above, width)
		f.drawAxisTitle(t, sp.pad, top)
		top += t.height(lh) + sp.gap
	}
	belowH := 0.0
	if o.below != "" {
		belowH = sp.gap + lh
	}
	gutter := math.Ceil(sp.text)
	if single {
		gutter = 0
	}
	aspect := o.aspect
	if aspect <= 0 {
		aspect = 0.62
	}
	room := 0.0
	if fb := f.fixedPlotBottom(); fb > 0 {
		room = fb - top - belowH
	}
	cols := o.cols
	if cols <= 0 {
		g := layout.LayoutGrid(layout.GridSpec{N: n, Box: layout.Box{W: width, H: room}, Aspect: aspect, GutterX: gutter, GutterY: gutter, MinW: sp.text * minPanelChars * 2})
		cols = g.Cols
	}
	cols = max(1, min(cols, n))
	rows := (n + cols - 1) / cols
	edgeOf := func(i int) edges {
		r, c := i/cols, i%cols
		e := edges{left: c == 0, right: c == cols-1 || i == n-1, top: r == 0, bottom: i+cols >= n}
		if o.independent {
			e.left = e.left || !o.shareY
			e.bottom = e.bottom || !o.shareX
		}
		return e
	}
	// Room around the plot areas: the widest per column, the tallest per row.
	cellW := (width - float64(cols-1)*gutter) / float64(cols)
	// Whole pixels line the panels of a grid up; a lone panel that places
	// its own marks on pixels has nothing to line up with and keeps the
	// room it measured.
	whole, wholeDown := pixelRounding(single, cells)
	left, right := make([]float64, cols), make([]float64, cols)
	above, below := make([]float64, rows), make([]float64, rows)
	for i, c := range cells {
		in := c.plan.measure(f, cellW, edgeOf(i))
		r, col := i/cols, i%cols
		left[col] = math.Max(left[col], whole(in.left))
		right[col] = math.Max(right[col], whole(in.right))
		above[r] = math.Max(above[r], whole(in.top))
		below[r] = math.Max(below[r], whole(in.bottom))
	}
	titleH := 0.0
	for _, c := range cells {
		if c.title != "" {
			titleH = lh
		}
	}
	plotW := width - float64(cols-1)*gutter
	for c := range cols {
		plotW -= left[c] + right[c]
	}
	plotW = wholeDown(plotW / float64(cols))
	minW := sp.text * minPanelChars
	if plotW < minW && single && !(plotW > 0) {
		return gridResult{}, fmt.Errorf("the plot is too narrow at this width: it would be %.0f px wide, less than %.0f for %g px text; give a wider canvas (%s)", plotW, minW, sp.text, f.c.name("Width"))
	}
	if plotW < minW && !single {
		return gridResult{}, fmt.Errorf("%d %s do not fit in %g px with %g px text: each plot would be %.0f px wide, less than %.0f; give a wider canvas (%s) or fewer columns", n, plural(n, "panel", "panels"), f.width, sp.text, plotW, minW, f.c.name("Width"))
	}
	rowH, err := f.rowHeights(cells, o, cols, plotW, room, titleH, gutter, above, below, single)
	if err != nil {
		return gridResult{}, err
	}
	res := gridResult{cells: make([]layout.Box, n), placed: make([]placed, n), origin: make([]Point, n)}
	y := top
	for r := range rows {
		x := sp.pad
		for col := range cols {
			i := r*cols + col
			if i >= n {
				break
			}
			c := cells[i]
			e := edgeOf(i)
			plot := layout.Box{X: left[col], Y: titleH + above[r], W: plotW, H: rowH[r]}
			var org Point
			if single {
				plot.X += x
				plot.Y += y
			} else {
				org = Point{X: round2(x), Y: round2(y)}
				attrs := []Attr(nil)
				if c.title != "" {
					attrs = []Attr{{"panel", c.title}}
				} else if c.name != "" {
					attrs = []Attr{{"panel", c.name}}
				}
				f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-panel", DX: org.X, DY: org.Y, Attrs: attrs})
				f.panelTitle(c.title, asc, left[col]+plotW+right[col])
			}
			start := len(f.scene.Marks)
			p, err := c.plan.draw(f, plot, e)
			if err != nil {
				return gridResult{}, c.err(err, n)
			}
			p.start = start
			for _, l := range c.layers {
				if err := l.draw(f, &p, plot); err != nil {
					return gridResult{}, err
				}
			}
			if !single {
				f.scene.Add(Mark{Kind: GroupEnd})
			}
			res.placed[i], res.origin[i] = p, org
			res.cells[i] = layout.Box{X: plot.X + org.X, Y: plot.Y + org.Y, W: plot.W, H: plot.H}
			x += left[col] + plotW + right[col] + gutter
		}
		y += titleH + above[r] + rowH[r] + below[r] + gutter
	}
	res.bottom = y - gutter
	if o.below != "" {
		mid := sp.pad + width/2
		f.text(mid, res.bottom+sp.gap+asc, o.below, sp.text, false, f.th.muted, "plumb-axis-title", Middle)
		res.bottom += belowH
	}
	return res, nil
}

// rowHeights asks the plans for their plot heights at width plotW: one
// height for every row, the tallest asked for, or each row its own with
// o.ownHeights. On a fixed canvas (room > 0) the rows fill the room, in
// equal parts or in the proportions the plans ask for, and every plan is
// told the height it must fit.
func (f *frame) rowHeights(cells []gridCell, o gridOptions, cols int, plotW, room, titleH, gutter float64, above, below []float64, single bool) ([]float64, error) {
	sp := f.spec
	rows := len(above)
	rowH := make([]float64, rows)
	own := o.ownHeights && !o.shareY
	whole, wholeDown := pixelRounding(single, cells)
	if room <= 0 || own {
		for i, c := range cells {
			h, err := c.plan.height(f, plotW, 0)
			if err != nil {
				return nil, c.err(err, len(cells))
			}
			rowH[i/cols] = math.Max(rowH[i/cols], whole(h))
		}
		if !own {
			top := slices.Max(rowH)
			for r := range rowH {
				rowH[r] = top
			}
		}
		if room <= 0 {
			return rowH, nil
		}
	}
	fixed := float64(rows-1)*gutter + float64(rows)*titleH
	for r := range rows {
		fixed += above[r] + below[r]
	}
	want := 0.0
	for r := range rows {
		want += rowH[r]
	}
	for r := range rows {
		if own && want > 0 {
			rowH[r] = wholeDown((room - fixed) * rowH[r] / want)
		} else {
			rowH[r] = wholeDown((room - fixed) / float64(rows))
		}
		if rowH[r] < minPlotHeight(sp, !single) && single && !(rowH[r] > 0) {
			return nil, fmt.Errorf("the figure's fixed height leaves a %.0f px plot, under the %.0f px a chart needs on this medium to be read: give a taller canvas (%s), or a shorter title and notes, so that it can fit", rowH[r], minPlotHeight(sp, false), f.c.name("Height"))
		}
		if rowH[r] < minPlotHeight(sp, !single) && !single {
			return nil, fmt.Errorf("%d %s of panels do not fit in a %g px high figure with %g px text: each plot would be %.0f px high; give a taller canvas (%s) or fewer panels", rows, plural(rows, "row", "rows"), f.spec.height, sp.text, rowH[r], f.c.name("Height"))
		}
	}
	for i, c := range cells {
		if _, err := c.plan.height(f, plotW, rowH[i/cols]); err != nil {
			return nil, c.err(err, len(cells))
		}
	}
	return rowH, nil
}

// exactRoom is implemented by a plan that rounds its own marks to pixels
// (bars round both ends of every bar): alone, it keeps the room and the
// height it measured, unrounded.
type exactRoom interface{ exactRoom() }

// pixelRounding is how a grid rounds room and heights: up and down to
// whole pixels, so that the plot areas of neighbouring panels line up,
// except for a lone panel that rounds its own marks.
func pixelRounding(single bool, cells []gridCell) (whole, wholeDown func(float64) float64) {
	if _, ok := cells[0].plan.(exactRoom); single && ok {
		same := func(v float64) float64 { return v }
		return same, same
	}
	return math.Ceil, math.Floor
}

// shareDomains gives every plan the domains it must draw: its own, widened
// by its layers, or the union over the grid along a shared direction.
func (f *frame) shareDomains(cells []gridCell, o gridOptions) {
	xs, ys := make([]axisDomain, len(cells)), make([]axisDomain, len(cells))
	var ux, uy axisDomain
	for i, c := range cells {
		xs[i], ys[i] = c.plan.domains()
		for _, l := range c.layers {
			l.widen(f, &xs[i], &ys[i])
		}
		ux, uy = ux.union(xs[i]), uy.union(ys[i])
	}
	for i, c := range cells {
		x, y := xs[i], ys[i]
		if o.shareX && x.kind != domainNone && x.kind == ux.kind {
			x = ux
			x.shared = true
		}
		if o.shareY && y.kind != domainNone && y.kind == uy.kind {
			y = uy
			y.shared = true
		}
		c.plan.share(x, y)
	}
}

// panelTitle sets a panel's heading on one line of its cell, shortened
// with the whole text as a tooltip when it is too long.
func (f *frame) panelTitle(title string, asc, width float64) {
	if title == "" {
		return
	}
	sp := f.spec
	lines, cut := f.wrap(title, sp.text, true, width, 1)
	if len(lines) == 0 {
		return
	}
	tip := ""
	if cut {
		tip = title
	}
	f.scene.Add(Mark{Kind: Text, Class: "plumb-panel-title", Y: asc, Text: lines[0], Size: sp.text, Bold: true, Fill: f.th.text, Tooltip: tip})
}
