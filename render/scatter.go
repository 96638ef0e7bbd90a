package render

import (
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/palette"
	"plumb/scale"
)

// ScatterOptions configures a scatter plot. The zero value draws every
// point in the neutral colour on number axes that need not include zero,
// translucent when many, binned when too many to draw one by one.
type ScatterOptions struct {
	Common
	// Groups names each point's group (one entry per point); nil draws one
	// group. Groups get the categorical colours in the order they first
	// appear and are named beside their points when that is unambiguous,
	// else in a legend.
	Groups []string
	// GroupOrder lists the groups in the order they take the categorical
	// colours, so that the panels of small multiples colour each group
	// alike even when a panel lacks some; groups it does not list follow
	// in the order they appear.
	GroupOrder []string
	// Fit draws a trend through all the points: "line" fits a straight
	// line by least squares (r and R² go in the notes), "loess" a smooth
	// curve (Cleveland 1979: span 0.75, tricube weights, local lines); ""
	// draws none.
	Fit string
	// XName and YName say what the axes measure, for their titles and
	// the description.
	XName, YName string
}

// BinAbove is the number of points above which a scatter plot draws
// hexagonal bins instead of points. Beyond a few thousand points on a
// plot of a few hundred pixels, points hide each other so much that
// translucency no longer shows where most of them are, and an SVG of one
// element per point grows past what viewers draw briskly (common
// practice; 5,000 circles are about 600 kB of SVG).
const BinAbove = 5000

// fits are the values Fit accepts.
var fits = []string{"", "line", "loess"}

// Scatter draws a scatter plot of y against x and writes it as SVG to w.
// It returns the notes that record what was decided for the caller.
func Scatter(w io.Writer, x, y []float64, opt ScatterOptions) ([]Note, error) {
	s, err := ScatterScene(x, y, opt)
	return writeScene(w, s, err)
}

// ScatterScene builds the scatter plot's scene without writing it.
func ScatterScene(x, y []float64, opt ScatterOptions) (*Scene, error) {
	return chartScene(opt.Common, ScatterPanel(x, y, opt))
}

// ScatterPanel plans a scatter plot for a cell of a figure; the options'
// title is the panel's heading.
func ScatterPanel(x, y []float64, opt ScatterOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		return newScatterPlan(f, x, y, opt)
	})
}

// scatterPlan is a scatter plot planned for a box: its points cleaned and
// grouped, its fit computed, its domains known.
type scatterPlan struct {
	opt  ScatterOptions
	x, y []float64
	// The points' extent, found once: a pass over 100,000 points in
	// each of 30 matrix panels took a quarter of the matrix's time.
	xlo, xhi, ylo, yhi float64
	group              []int    // each point's group index; nil for one group
	names              []string // the groups, in order of first appearance
	colour             []Colour // each group's colour
	kx, ky             valueKind
	dx, dy             axisDomain
	fit                *fitCurve
	// binned: too many points to draw one by one; bins is the shading
	// every panel of a figure shares.
	binned bool
	bins   *binShades
	ownKey bool    // the panel draws its bin key (not in a matrix)
	titles bool    // the panel draws its axis titles (not in a matrix)
	aspect float64 // plot height / width when the panel chooses
	// fixed domains and margin, set by a matrix so that every panel of a
	// row or column draws one scale whatever its own points.
	fixed    bool
	fx, fy   axisDomain
	marginPx float64
	legend   bool // groups are named in a legend, not beside their points

	// Laid out for a plot of w × h (layout):
	w, h     float64
	ax, ay   axis
	px, py   []float64 // points in the plot's pixels, origin at its top left
	cells    []stats.Bin
	hexR     float64
	labelPos []layout.Box // group labels, in the plot's pixels
}

// fitCurve is a trend through the points, evaluated along x.
type fitCurve struct {
	kind string // "line" or "loess"
	x, y []float64
	line stats.LinearFit
}

func newScatterPlan(f *frame, x, y []float64, opt ScatterOptions) (*scatterPlan, error) {
	if len(x) != len(y) {
		return nil, fmt.Errorf("%d x values and %d y values: give one y per x", len(x), len(y))
	}
	if opt.Groups != nil && len(opt.Groups) != len(x) {
		return nil, &OptionError{Option: "Groups", Value: strconv.Itoa(len(opt.Groups)), Err: fmt.Errorf("give one group per point (%d)", len(x))}
	}
	if !slices.Contains(fits, opt.Fit) {
		return nil, &OptionError{Option: "Fit", Value: opt.Fit, Err: errors.New("use line or loess")}
	}
	p := &scatterPlan{opt: opt, titles: true, ownKey: true, aspect: 0.75, x: make([]float64, 0, len(x)), y: make([]float64, 0, len(y))}
	var groups []string
	missing := 0
	for i := range x {
		if !finiteValue(x[i]) || !finiteValue(y[i]) {
			missing++
			continue
		}
		p.x = append(p.x, x[i])
		p.y = append(p.y, y[i])
		if opt.Groups != nil {
			groups = append(groups, opt.Groups[i])
		}
	}
	if len(p.x) == 0 {
		return nil, fmt.Errorf("no points to draw: every point misses its x or its y")
	}
	if missing > 0 {
		f.scene.Note("missing", true, fmt.Sprintf("left out %s with a missing x or y", groupedCount(missing, "point", "points")))
	}
	p.xlo, p.xhi = finiteRange(p.x)
	p.ylo, p.yhi = finiteRange(p.y)
	for _, s := range []struct {
		what   string
		lo, hi float64
	}{{"x values", p.xlo, p.xhi}, {"y values", p.ylo, p.yhi}} {
		if err := axisRoom(s.what, s.lo, s.hi); err != nil {
			return nil, err
		}
	}
	p.binned = len(p.x) > BinAbove
	p.bins = &binShades{}
	if err := p.setGroups(f, groups); err != nil {
		return nil, err
	}
	p.kx = plainNumberKind(p.x)
	p.ky = plainNumberKind(p.y)
	if err := p.fitTrend(f); err != nil {
		return nil, err
	}
	return p, nil
}

// maxAxisValue bounds the values a number axis places: nice ticks and the
// margins beyond the data go up to ten times past them, which must stay
// below the largest float64 (1.8e308).
const maxAxisValue = math.MaxFloat64 / 1e4

// finiteRange is the least and greatest of values that are all finite and
// at least one: plain comparisons, which math.Min's care for NaN would
// slow down.
func finiteRange(v []float64) (lo, hi float64) {
	lo, hi = v[0], v[0]
	for _, x := range v[1:] {
		if x < lo {
			lo = x
		}
		if x > hi {
			hi = x
		}
	}
	return lo, hi
}

// setGroups gives each point its group and each group its colour. One
// group, or binned points, draw in the neutral colour.
func (p *scatterPlan) setGroups(f *frame, groups []string) error {
	if groups == nil {
		p.colour = []Colour{f.th.neutral}
		return nil
	}
	idx := map[string]int{}
	p.group = make([]int, len(groups))
	for i, g := range groups {
		k, ok := idx[g]
		if !ok {
			k = len(p.names)
			idx[g] = k
			p.names = append(p.names, g)
		}
		p.group[i] = k
	}
	n := len(p.names)
	if n > palette.MaxCategorical {
		return &RefusalError{Reason: fmt.Sprintf("%d groups are more than colours can tell apart (at most %d)", n, palette.MaxCategorical),
			Instead: "draw one panel per group, or combine the groups into fewer"}
	}
	if p.binned {
		if n > 1 {
			f.scene.Note("groups-binned", true, fmt.Sprintf("%s are binned together: above %s points, groups drawn over each other hide each other; draw one panel per group to compare them",
				groupedCount(len(p.x), "point", "points"), scale.Format{Group: true}.Format(BinAbove)))
		}
		p.group, p.names = nil, nil
		p.colour = []Colour{f.th.neutral}
		return nil
	}
	// Colours follow GroupOrder, then the order of appearance: every
	// panel of small multiples then colours a group alike.
	global := slices.Clone(p.opt.GroupOrder)
	at := make([]int, n)
	for k, name := range p.names {
		i := slices.Index(global, name)
		if i < 0 {
			i = len(global)
			global = append(global, name)
		}
		at[k] = i
	}
	if len(global) == 1 {
		p.colour = []Colour{f.th.neutral}
		return nil
	}
	if len(global) > palette.MaxCategorical {
		return &RefusalError{Reason: fmt.Sprintf("%d groups are more than colours can tell apart (at most %d)", len(global), palette.MaxCategorical),
			Instead: "draw one panel per group, or combine the groups into fewer"}
	}
	pal, _, ok := f.categorical(len(global), "groups")
	if !ok {
		return fmt.Errorf("no categorical palette of %d colours", len(global))
	}
	// Names, legends and colours in that one order too.
	perm := make([]int, n)
	for k := range perm {
		perm[k] = k
	}
	slices.SortStableFunc(perm, func(a, b int) int { return at[a] - at[b] })
	newIndex := make([]int, n)
	names := make([]string, n)
	p.colour = make([]Colour, n)
	for k, old := range perm {
		newIndex[old] = k
		names[k] = p.names[old]
		p.colour[k] = pal[at[old]]
	}
	p.names = names
	for i, g := range p.group {
		p.group[i] = newIndex[g]
	}
	return nil
}

// loessPoints is how many x values the LOESS curve is evaluated at: at
// 120 the polyline's segments are a few pixels long on any plot, so the
// curve reads as smooth.
const loessPoints = 120

// fitTrend computes the requested trend and notes what it is.
func (p *scatterPlan) fitTrend(f *frame) error {
	if p.opt.Fit == "" {
		return nil
	}
	lo, hi := p.xlo, p.xhi
	c := &fitCurve{kind: p.opt.Fit}
	switch p.opt.Fit {
	case "line":
		l, err := stats.LeastSquares(p.x, p.y)
		if err != nil {
			// The data, not the option, is at fault: an error of input.
			return fmt.Errorf("%s %s: cannot fit a line to these points: %w", f.c.name("Fit"), p.opt.Fit, errors.Unwrap(err))
		}
		c.line = l
		c.x = []float64{lo, hi}
		c.y = []float64{l.At(lo), l.At(hi)}
		vf := scale.ValueFormat([]float64{l.Intercept, l.Slope}, "")
		sign, b := "+", l.Slope
		if b < 0 {
			sign, b = "−", -b
		}
		f.scene.Note("fit", false, fmt.Sprintf("least-squares line: y = %s %s %s·x; r = %s, R² = %s (%s)",
			vf.Format(l.Intercept), sign, vf.Format(b), fmtFit(l.R), fmtFit(l.R2), groupedCount(l.N, "point", "points")))
	case "loess":
		c.x = make([]float64, loessPoints)
		for i := range c.x {
			c.x[i] = lo + (hi-lo)*float64(i)/float64(loessPoints-1)
		}
		ys, err := stats.Loess(p.x, p.y, c.x, stats.LoessSpan)
		if err != nil {
			return fmt.Errorf("%s %s: cannot fit a curve to %s: %w (a LOESS curve needs at least 4, spread along x); use %s line or more points", f.c.name("Fit"), p.opt.Fit,
				groupedCount(len(p.x), "point", "points"), errors.Unwrap(err), f.c.name("Fit"))
		}
		c.y = ys
		f.scene.Note("fit", false, fmt.Sprintf("LOESS curve (Cleveland 1979): at each x, a line fitted to the nearest 75%% of the %s, weighted by the tricube of their distance",
			groupedCount(len(p.x), "point", "points")))
	}
	p.fit = c
	return nil
}

// fmtFit writes r and R² with two decimals, the precision they are read at.
func fmtFit(v float64) string {
	s := strconv.FormatFloat(v, 'f', 2, 64)
	if strings.HasPrefix(s, "-") {
		s = "−" + s[1:]
	}
	return s
}

func (p *scatterPlan) domains() (axisDomain, axisDomain) {
	if p.fixed {
		return p.fx, p.fy
	}
	xlo, xhi, ylo, yhi := p.xlo, p.xhi, p.ylo, p.yhi
	if p.fit != nil {
		// The trend stays on the plot: a fitted value beyond the data
		// widens the y axis rather than leaving it.
		if lo, hi, ok := dataRange(p.fit.y); ok {
			ylo, yhi = math.Min(ylo, lo), math.Max(yhi, hi)
		}
	}
	return axisDomain{kind: domainNumber, lo: xlo, hi: xhi, integer: p.kx.integer},
		axisDomain{kind: domainNumber, lo: ylo, hi: yhi, integer: p.ky.integer}
}

func (p *scatterPlan) share(x, y axisDomain) { p.dx, p.dy = x, y }

// markRadius is a point's radius: a quarter of the text size (3 px on a
// screen), large enough to see and small enough that moderate counts stay
// apart (common practice).
func markRadius(sp mediumSpec) float64 { return math.Max(2, sp.text/4) }

// hexRadius is a bin's circumradius: half the text size (6 px on a screen),
// fine enough to show the shape of the cloud, coarse enough that a cell
// holds a count worth reading (common practice).
func hexRadius(sp mediumSpec, small bool) float64 {
	if small {
		return math.Max(3, sp.text*0.35)
	}
	return math.Max(3, sp.text/2)
}

// opacityFor is the translucency of n points: opaque up to 250, then
// fading as 1/√n so that the ink of a dense area grows while single points
// stay visible, never below 0.2 (common practice).
func opacityFor(n int) float64 {
	if n <= 250 {
		return 0
	}
	return math.Max(0.2, math.Round(math.Sqrt(250/float64(n))*100)/100)
}

// margin is the room kept between the data's extremes and the plot's
// edges, in pixels, so that no mark reaches past the axes.
func (p *scatterPlan) margin(f *frame) float64 {
	if p.marginPx > 0 {
		return p.marginPx
	}
	if p.binned {
		return 2 * hexRadius(f.spec, !p.titles)
	}
	return markRadius(f.spec) + 1
}

func (p *scatterPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	half := math.Ceil((face.Ascent(sp.text) + face.Descent(sp.text)) / 2)
	in := insets{top: half}
	if p.titles && p.opt.YName != "" {
		in.top += f.axisTitle(p.opt.YName, cellW).height(lh) + sp.gap
	}
	if e.left {
		in.left = tickLabelWidth(f, p.dy, p.ky, false) + sp.gap
	}
	if e.bottom {
		in.bottom = f.xLabelTop(0) + lh
		if p.titles && p.opt.XName != "" {
			in.bottom += sp.gap + lh
		}
	}
	in.right = math.Ceil(tickLabelWidth(f, p.dx, p.kx, true)/2) + 1
	// Decide on direct labels or a legend for a plot of the size this cell
	// will most likely give: exact for a chart of its own.
	w := math.Floor(cellW - math.Ceil(in.left) - math.Ceil(in.right))
	h := math.Round(w * p.aspect)
	if fb := f.fixedPlotBottom(); fb > 0 && p.titles {
		h = fb - f.plotTop() - in.top - in.bottom
	}
	// A panel beside others gets whatever height its row needs, so names
	// placed for one size may find no place at the size drawn: beside
	// other panels, groups are named in a legend, alike in every panel.
	beside := cellW < f.width-2*f.spec.pad-1
	if len(p.names) > 1 && w > 0 && h > 0 {
		p.layout(f, w, h)
		p.legend = beside || !p.placeGroupLabels(f)
		if p.legend {
			f.scene.Note("legend", false, "named the groups in a legend: labels beside their points would cover other groups' points or each other")
		}
	}
	if n := p.keyLines(f, w); n > 0 {
		in.top += float64(n)*lh + sp.gap
	}
	return in
}

// keyLines is how many lines the legend or the bin key takes above a
// plot w wide.
func (p *scatterPlan) keyLines(f *frame, w float64) int {
	switch {
	case p.binned && p.ownKey:
		// The counts are known once binned; n bounds them all.
		return len(f.flowEntries(p.bins.keyItems(f, len(p.x)), w, 0, 0, false))
	case p.legend:
		return len(f.flowEntries(p.legendItems(f), w, 0, 0, false))
	}
	return 0
}

func (p *scatterPlan) height(f *frame, plotW, room float64) (float64, error) {
	h := room
	if h <= 0 {
		h = math.Round(plotW * p.aspect)
	}
	if p.binned && h > 0 && plotW > 0 {
		// Bin now, so that every panel of a figure knows its counts
		// before any is drawn and one shading serves them all.
		p.layout(f, plotW, h)
	}
	return h, nil
}

// layout fixes the axes and the points' pixels for a plot of w × h, and
// bins them when there are too many to draw.
func (p *scatterPlan) layout(f *frame, w, h float64) {
	if p.w == w && p.h == h && p.px != nil {
		return
	}
	p.w, p.h = w, h
	p.ax, p.ay = fitNumberAxes(f, p.dx, p.dy, p.kx, p.ky, w, h, p.margin(f))
	xs := scale.Linear{D0: p.ax.d0, D1: p.ax.d1, R0: 0, R1: w}
	ys := scale.Linear{D0: p.ay.d0, D1: p.ay.d1, R0: h, R1: 0}
	p.px, p.py = make([]float64, len(p.x)), make([]float64, len(p.y))
	for i := range p.x {
		p.px[i], p.py[i] = xs.Map(p.x[i]), ys.Map(p.y[i])
	}
	if p.binned {
		p.hexR = hexRadius(f.spec, !p.titles)
		p.cells = stats.HexBin(p.px, p.py, p.hexR)
		for _, c := range p.cells {
			p.bins.max = max(p.bins.max, c.Count)
		}
	}
}

func (p *scatterPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	p.layout(f, plot.W, plot.H)
	xs := scale.Linear{D0: p.ax.d0, D1: p.ax.d1, R0: plot.X, R1: plot.X + plot.W}
	ys := scale.Linear{D0: p.ay.d0, D1: p.ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	pl := placed{xs: xs, ys: ys}
	f.drawNumberAxes(p.ax, p.ay, xs, ys, plot, e)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	lh := lineHeight(sp.text)
	top := plot.Y - math.Ceil((asc+desc)/2)
	if p.titles && p.opt.YName != "" {
		t := f.axisTitle(p.opt.YName, plot.W+plot.X)
		top -= t.height(lh) + sp.gap
		f.drawAxisTitle(t, plot.X, top)
	}
	if p.titles && p.opt.XName != "" && e.bottom {
		t, _ := f.wrap(p.opt.XName, sp.text, false, plot.W, 1)
		if len(t) > 0 {
			f.text(plot.X+plot.W/2, f.xLabelTop(plot.Y+plot.H)+lh+sp.gap+asc, t[0], sp.text, false, f.th.muted, "plumb-axis-title", Middle)
		}
	}
	var items []keyEntry
	switch {
	case p.binned && p.ownKey:
		items = p.bins.keyItems(f, p.bins.max)
	case p.legend:
		items = p.legendItems(f)
	}
	if len(items) > 0 {
		lines := f.flowEntries(items, plot.X+plot.W, plot.X, 0, false)
		y := top - sp.gap - float64(len(lines))*lh
		f.flowEntries(items, plot.X+plot.W, plot.X, y, true)
	}
	if p.binned {
		p.drawBins(f, plot, xs, ys)
	} else {
		p.drawPoints(f, plot)
	}
	p.drawFit(f, xs, ys)
	if len(p.names) > 1 && !p.legend {
		p.drawGroupLabels(f, plot)
	}
	return pl, nil
}
