package render

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strings"

	"plumb/layout"
	"plumb/palette"
	"plumb/scale"
)

// DiffOptions configures a difference chart. The zero value draws a − b
// against a zero baseline, banked to 45°, the two signs in two colours
// that stay apart under colour vision deficiency.
type DiffOptions struct {
	Common
	Time bool // x holds instants as Unix seconds (UTC); series made by TimeSeries need no flag
	// Context adds a panel above the difference with both series on the
	// same x scale, so that the reader sees the levels too.
	Context bool
	Unit    string // unit of a and b
	XName   string // what x is

	aName, bName string // the two series' names, set by DiffScene
}

// Diff draws the difference chart of a − b over their x and writes it as SVG
// to w. Readers judge the gap between two curves by their shortest
// distance rather than the vertical one (Cleveland & McGill 1984), so the
// difference itself is plotted. It returns the notes.
func Diff(w io.Writer, a, b Series, opt DiffOptions) ([]Note, error) {
	s, err := DiffScene(a, b, opt)
	if err != nil {
		return nil, err
	}
	return s.Notes, WriteSVG(w, s)
}

// diffColors are the two area colours and the two context line colours:
// the inner and outer classes of the two arms of the default diverging
// scale, matched in lightness and no red/green pair. The areas are light
// enough for text in the Text colour (7:1) and stay over 30 CIEDE2000
// apart under all four visions (checked in diff_test.go).
func diffColors() (areaA, areaB, lineA, lineB Colour) {
	p, err := palette.Diverging(7)
	if err != nil || len(p) != 7 {
		return RGB(palette.Accent()), RGB(palette.Neutral()), RGB(palette.Accent()), RGB(palette.Neutral())
	}
	return RGB(p[4]), RGB(p[2]), RGB(p[5]), RGB(p[1])
}

// DiffScene builds the difference chart's scene without writing it. The
// series' names name the two sides ("" means "a" and "b"). Their x values
// are matched exactly: the difference is drawn at every x that both series
// have, and x values only one of them has are left out with a note.
func DiffScene(a, b Series, opt DiffOptions) (*Scene, error) {
	if a.Name == "" {
		a.Name = "a"
	}
	if b.Name == "" {
		b.Name = "b"
	}
	opt.aName, opt.bName = a.Name, b.Name
	var err error
	if opt.Time, err = timeAxis(opt.Time, a, b); err != nil {
		return nil, err
	}
	series, notes, err := cleanSeries([]Series{a, b})
	if err != nil {
		return nil, err
	}
	if len(series) < 2 { // one of them has no values at all
		return nil, fmt.Errorf("no x has both %s and %s: nothing to subtract", opt.aName, opt.bName)
	}
	x, av, bv, onlyA, onlyB := matchX(series[0], series[1])
	d := make([]float64, len(x))
	for i := range x {
		d[i] = av[i] - bv[i] // NaN when either is missing: a gap
		if math.IsInf(d[i], 0) {
			return nil, fmt.Errorf("%s − %s at x = %g is beyond the largest number (%.1e): divide both series by a power of ten first", opt.aName, opt.bName, x[i], math.MaxFloat64)
		}
	}
	if _, _, ok := dataRange(d); !ok {
		return nil, fmt.Errorf("no x has both %s and %s: nothing to subtract", opt.aName, opt.bName)
	}
	f, err := newFrame(opt.Common)
	if err != nil {
		return nil, err
	}
	for _, n := range notes[:min(len(notes), 1)] {
		f.scene.Notes = append(f.scene.Notes, n)
	}
	if onlyA+onlyB > 0 {
		f.scene.Note("unmatched-x", true, fmt.Sprintf("drew the difference at the %d x values both series have; left out %d x values only %s has and %d only %s has", len(x), onlyA, opt.aName, onlyB, opt.bName))
	}
	if opt.Time {
		f.noteMilliseconds(dataRange(x))
	}
	if err := firstError(checkSpan("x values", x), checkSpan("values of "+opt.aName+" and "+opt.bName, av, bv)); err != nil {
		return nil, err
	}
	c := &diffChart{opt: opt, f: f, x: x, a: av, b: bv, d: d, missing: countMissing([]Series{{Y: d}}), xk: xKindOf([][]float64{x}, opt.Time)}
	bottom, err := c.layout()
	if err != nil {
		return nil, err
	}
	f.scene.Desc = c.describe()
	if f.scene.Title == "" {
		// Untitled figures still need an accessible name.
		f.scene.Title = "Difference between " + opt.aName + " and " + opt.bName
	}
	return f.finish(bottom), nil
}

// matchX pairs the values of a and b (each sorted by x, one value per x)
// at the x values both have, and counts the x values only one has.
func matchX(a, b Series) (x, av, bv []float64, onlyA, onlyB int) {
	if slices.Equal(a.X, b.X) {
		return a.X, a.Y, b.Y, 0, 0
	}
	i, j := 0, 0
	for i < len(a.X) && j < len(b.X) {
		switch {
		case a.X[i] < b.X[j]:
			onlyA++
			i++
		case a.X[i] > b.X[j]:
			onlyB++
			j++
		default:
			x, av, bv = append(x, a.X[i]), append(av, a.Y[i]), append(bv, b.Y[j])
			i++
			j++
		}
	}
	return x, av, bv, onlyA + len(a.X) - i, onlyB + len(b.X) - j
}

type diffChart struct {
	opt        DiffOptions
	f          *frame
	x, a, b, d []float64
	missing    int // x values where a or b is missing
	xk         xKind
}

// noteMissing records what the missing values did to the drawn difference.
func (c *diffChart) noteMissing(bridged int, drawn []drawnLine) {
	if n := missingNote(c.missing, bridged, drawn); n != "" {
		c.f.scene.Note("missing", true, n)
	}
}

func (c *diffChart) unitSuffix() string {
	unit := strings.TrimSpace(c.opt.Unit)
	if unit == "" {
		return ""
	}
	return " (" + unit + ")"
}

// layout places the optional context panel and the difference panel, one
// above the other, sharing the x axis and the plot's left and right edges.
func (c *diffChart) layout() (float64, error) {
	f, sp := c.f, c.f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	areaA, areaB, lineA, lineB := diffColors()
	zero := 0.0
	dlo, dhi, _ := dataRange(c.d)
	xlo, xhi, _ := dataRange(c.x)
	lvLo, lvHi, _ := dataRange(c.a, c.b)
	xk := c.xk
	if xk.years {
		f.scene.Note("years", false, yearsNote)
	}
	dk := yKind{include: &zero, integer: wholeNumbers(c.d)}
	lk := yKind{integer: wholeNumbers(c.a) && wholeNumbers(c.b)}

	yw := f.yLabelWidth(dlo, dhi, dk)
	var labels []endLabel
	labelW := 0.0
	if c.opt.Context {
		yw = math.Max(yw, f.yLabelWidth(lvLo, lvHi, lk))
		labels, labelW = f.directLabels([]string{c.opt.aName, c.opt.bName}, []Colour{lineA, lineB}, (f.width-2*sp.pad)*0.3)
	}
	left, w, _, ax := f.fitPanelsX(math.Ceil(sp.pad+yw+sp.gap), labelW, 1, 0, xlo, xhi, xk)
	if w < sp.text*8 {
		return 0, fmt.Errorf("the plot is too narrow at this width: give a wider canvas (%s)", c.opt.name("Width"))
	}
	g := lineGeom{left: 0, w: int(w), ax: ax}
	y := f.plotTop()
	half := math.Ceil((asc + desc) / 2)

	// Bank both panels first: a medium of fixed height shares its room
	// between them.
	series := []Series{{Name: c.opt.aName, X: c.x, Y: c.a}, {Name: c.opt.bName, X: c.x, Y: c.b}}
	g.reduce = shouldReduce([]Series{{X: c.x}}, g.w)
	var pa, pb scale.Polyline
	var hc float64
	var ayc axis
	var bkc banking
	var err error
	if c.opt.Context {
		pa, _ = g.polyline(c.x, c.a)
		pb, _ = g.polyline(c.x, c.b)
		if hc, ayc, err = f.plotHeight(&bkc, []scale.Polyline{pa, pb}, c.opt.Time, ax.d1-ax.d0, w, lvLo, lvHi, lk, 0, true); err != nil {
			return 0, err
		}
	}
	pd, bridged := g.polyline(c.x, c.d)
	if g.reduce && len(pd.X) < len(c.x) {
		f.scene.Note("reduced", false, reduceNote(len(c.x), len(pd.X)))
	}
	var bk banking
	h, ay, err := f.plotHeight(&bk, []scale.Polyline{pd}, c.opt.Time, ax.d1-ax.d0, w, dlo, dhi, dk, 0, false)
	if err != nil {
		return 0, err
	}
	// Panel titles name both series, which may be long: up to two lines
	// across the figure, then shortened with the full text in a tooltip.
	inner := f.width - 2*sp.pad
	ctxTitle := f.axisTitle(c.opt.aName+" and "+c.opt.bName+c.unitSuffix(), inner)
	diffTitle := f.axisTitle("difference, "+c.opt.aName+" − "+c.opt.bName+c.unitSuffix(), inner)
	panelTop := diffTitle.height(lh) + sp.gap + half
	if fb := f.fixedPlotBottom(); fb > 0 {
		room := fb - y - panelTop - (f.xLabelTop(0) + lh) - 2*lh - sp.gap // a key of up to two rows under the axis
		if c.opt.XName != "" {
			room -= lh
		}
		if c.opt.Context {
			room -= ctxTitle.height(lh) + sp.gap + 2*half + sp.gap*2
		}
		// The room is shared in the banked proportion, so that both panels
		// fill the canvas together.
		k := room / (h + hc)
		h, hc = math.Floor(h*k), math.Floor(hc*k)
		// Two panels share a fixed canvas: each may then be as short as a
		// panel of small multiples.
		if h < minPlotHeight(sp, c.opt.Context) || c.opt.Context && hc < minPlotHeight(sp, true) {
			return 0, fmt.Errorf("the figure's fixed height leaves too short a plot for a difference chart to be read: give a taller canvas (%s), or a shorter title and notes, so that it can fit", c.opt.name("Height"))
		}
		ay = f.fitY(dlo, dhi, h, dk)
		bk.fill, bk.raised, bk.alpha = true, false, h/w
		if c.opt.Context {
			ayc = f.fitY(lvLo, lvHi, hc, lk)
			bkc.fill, bkc.raised, bkc.alpha = true, false, hc/w
		}
	}
	lw := strokeWidth(sp)
	if c.opt.Context {
		h, ay := hc, ayc
		f.scene.Note("aspect", false, "levels panel: "+bkc.note(w, h))
		f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-panel", DX: left, DY: round2(y), Attrs: []Attr{{"panel", "levels"}}})
		f.drawAxisTitle(ctxTitle, -left+sp.pad, 0)
		top := ctxTitle.height(lh) + sp.gap + half
		ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: top + h, R1: top}
		f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
		f.drawYAxis(ay, ys, 0, w, true)
		f.scene.Add(Mark{Kind: GroupEnd})
		for i, p := range []scale.Polyline{pa, pb} {
			d := g.screen(p, ys)
			f.addSeries("plumb-mark", series[i].Name, p, d, []Colour{lineA, lineB}[i], lw, c.opt.Time)
			if pt, ok := d.last(); ok {
				labels[i].ex, labels[i].ey = pt.X, pt.Y
			}
		}
		if !f.placeLabels(labels, w, top, top+h) {
			f.scene.Note("legend", false, "the series names do not fit beside the line ends: named them in the panel title")
		}
		f.scene.Add(Mark{Kind: GroupEnd})
		y += top + h + half + sp.gap*2
	}

	f.scene.Note("aspect", false, bk.note(w, h))
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-panel", DX: left, DY: round2(y), Attrs: []Attr{{"panel", "difference"}}})
	f.drawAxisTitle(diffTitle, -left+sp.pad, 0)
	top := panelTop
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: top + h, R1: top}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.drawYAxis(ay, ys, 0, w, true)
	bottom := f.drawXAxis(ax, 0, g.w, top+h, true)
	if c.opt.XName != "" {
		f.text(w/2, bottom+asc, c.opt.XName, sp.text, false, f.th.muted, "plumb-axis-title", Middle)
		bottom += lh
	}
	f.scene.Add(Mark{Kind: GroupEnd})

	// The drawn difference with every sign change split at its exact
	// crossing, interpolated linearly between the two neighbouring points.
	pts := crossings(pd)
	xs := scale.Linear{D0: ax.d0, D1: ax.d1, R0: 0, R1: w}
	base := round2(ys.Map(0))
	var pos, neg [][]Point
	var largest [2]areaInfo
	for _, run := range pts {
		for _, part := range splitSigns(run) {
			poly := make([]Point, 0, len(part.pts)+2)
			area := 0.0
			for i, p := range part.pts {
				poly = append(poly, Point{round2(xs.Map(p.X)), round2(ys.Map(p.Y))})
				if i > 0 {
					area += math.Abs(xs.Map(p.X)-xs.Map(part.pts[i-1].X)) * math.Abs(ys.Map(p.Y)+ys.Map(part.pts[i-1].Y)-2*ys.Map(0)) / 2
				}
			}
			if area == 0 {
				continue
			}
			// Close along the baseline: an area that starts or ends at the
			// series' ends rather than at a crossing drops to it there.
			if first := poly[0]; first.Y != base {
				poly = append([]Point{{first.X, base}}, poly...)
			}
			if last := poly[len(poly)-1]; last.Y != base {
				poly = append(poly, Point{last.X, base})
			}
			k := 0
			if part.sign < 0 {
				k = 1
				neg = append(neg, poly)
			} else {
				pos = append(pos, poly)
			}
			if area > largest[k].area {
				largest[k] = areaInfo{area: area, pts: part.pts}
			}
		}
	}
	if len(pos) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-mark plumb-area-a", Lines: pos, Closed: true, Fill: areaA, Attrs: []Attr{{"series", c.opt.aName + " above " + c.opt.bName}}})
	}
	if len(neg) > 0 {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-mark plumb-area-b", Lines: neg, Closed: true, Fill: areaB, Attrs: []Attr{{"series", c.opt.bName + " above " + c.opt.aName}}})
	}
	f.scene.Add(Mark{Kind: Path, Class: "plumb-baseline", Lines: [][]Point{{{0, base}, {w, base}}}, Stroke: f.th.baseline, StrokeWidth: lw * 0.75, Join: JoinRound, Cap: CapRound})
	var dl [][]Point
	for _, run := range pts {
		var l []Point
		for _, p := range run {
			l = append(l, Point{round2(xs.Map(p.X)), round2(ys.Map(p.Y))})
		}
		dl = append(dl, l)
	}
	f.addSeries("plumb-mark", "difference", crossingsPolyline(pts), drawnLine{pieces: dl, first: runStarts(pts)}, f.th.text, lw*0.75, c.opt.Time)
	c.noteMissing(bridged, []drawnLine{{pieces: dl}})
	// Every segment a label must keep clear of: the difference line and the
	// outlines of the areas.
	var segs [][2]Point
	for _, group := range [][][]Point{dl, pos, neg} {
		for _, l := range group {
			for i := 1; i < len(l); i++ {
				segs = append(segs, [2]Point{l[i-1], l[i]})
			}
		}
	}
	placed := [2]bool{
		c.regionLabel(largest[0], c.opt.aName, c.opt.bName, xs, ys, segs, true),
		c.regionLabel(largest[1], c.opt.bName, c.opt.aName, xs, ys, segs, false),
	}
	// Say once what each colour means: in its region's label, or, for a
	// colour whose regions are all too thin for a label, in a key under
	// the axis.
	var key []keyItem
	if !placed[0] && len(pos) > 0 {
		key = append(key, keyItem{areaA, c.opt.aName, c.opt.bName})
	}
	if !placed[1] && len(neg) > 0 {
		key = append(key, keyItem{areaB, c.opt.bName, c.opt.aName})
	}
	bottom = f.areaKey(key, 0, w, bottom)
	f.scene.Add(Mark{Kind: GroupEnd})
	return y + bottom, nil
}

// keyItem is one colour of a difference chart and what it means.
type keyItem struct {
	fill         Colour
	above, below string
}

// areaKey draws the key for the colours whose meaning no region label
// gives, one row each under the axis from y; it returns the y under it.
func (f *frame) areaKey(items []keyItem, left, width, y float64) float64 {
	if len(items) == 0 {
		return y
	}
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-legend"})
	y += sp.gap
	for _, it := range items {
		sw := sp.text
		full := it.above + " above " + it.below
		text, ok := f.regionText(it.above, it.below, width-sw-sp.gap)
		f.scene.Add(Mark{Kind: Rect, Class: "plumb-swatch", X: left, Y: round2(y + (lh-sw)/2), W: sw, H: sw, Fill: it.fill})
		if ok {
			tip := ""
			if text != full {
				tip = full
			}
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: left + sw + sp.gap, Y: round2(y + lh/2 + (asc-desc)/2), Text: text, Size: sp.text, Fill: f.th.text, Tooltip: tip})
		}
		y += lh
	}
	f.scene.Add(Mark{Kind: GroupEnd})
	return y
}

// crossingsPolyline flattens the runs back into one polyline, NaN between
// runs, so that addSeries can read a dot's data from it.
func crossingsPolyline(runs [][]xy) scale.Polyline {
	var p scale.Polyline
	for i, r := range runs {
		if i > 0 {
			p.X, p.Y = append(p.X, math.NaN()), append(p.Y, math.NaN())
		}
		for _, q := range r {
			p.X, p.Y = append(p.X, q.X), append(p.Y, q.Y)
		}
	}
	return p
}

// runStarts is the index in crossingsPolyline of every run's first point.
func runStarts(runs [][]xy) []int {
	out := make([]int, len(runs))
	i := 0
	for k, r := range runs {
		out[k] = i
		i += len(r) + 1
	}
	return out
}

type areaInfo struct {
	area float64
	pts  []xy
}

// regionLabel names the largest area of one sign, "a above b", inside it:
// in the area's tallest clear space that holds the whole label with a
// margin, centred there, its box crossing neither the difference line nor
// any area's outline. An area too thin for its label gets none (the key
// then says what the colour means). It reports whether it placed one.
func (c *diffChart) regionLabel(ar areaInfo, a, b string, xs, ys scale.Linear, segs [][2]Point, above bool) bool {
	if ar.area == 0 {
		return false
	}
	f, sp := c.f, c.f.spec
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	margin := math.Max(2, sp.gap/2)
	zero := ys.Map(0)
	full := a + " above " + b
	x0, x1 := xs.Map(ar.pts[0].X), xs.Map(ar.pts[len(ar.pts)-1].X)
	// One line, shortened to the region's width if need be, then the full
	// names on two lines ("a above" over "b"), which fit a region that is
	// deep rather than long.
	var layouts [][]string
	if text, ok := f.regionText(a, b, x1-x0-2*margin); ok {
		layouts = append(layouts, []string{text})
	}
	layouts = append(layouts, []string{a + " above", b})
	lh := lineHeight(sp.text)
	for _, lines := range layouts {
		tw := 0.0
		for _, l := range lines {
			tw = math.Max(tw, f.measure(l, sp.text, false))
		}
		th := asc + desc + float64(len(lines)-1)*lh
		bestCX, bestD := 0.0, -1.0
		for cx := x0 + tw/2 + margin; cx <= x1-tw/2-margin; cx += 2 {
			if d := minDepth(ar.pts, xs, ys, cx-tw/2-margin, cx+tw/2+margin); d > bestD {
				bestCX, bestD = cx, d
			}
		}
		if bestD < th+2*margin {
			continue
		}
		// Centred in the clear space between the baseline and the line.
		mid := zero - bestD/2
		if !above {
			mid = zero + bestD/2
		}
		box := layout.Box{X: bestCX - tw/2, Y: mid - th/2, W: tw, H: th}
		if slices.ContainsFunc(segs, func(s [2]Point) bool { return segmentHitsBox(s[0], s[1], box) }) {
			continue
		}
		tip := ""
		if strings.Join(lines, " ") != full {
			tip = full
		}
		for i, l := range lines {
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(bestCX), Y: round2(mid - th/2 + asc + float64(i)*lh), Text: l, Size: sp.text, Fill: f.th.text, Anchor: Middle, Tooltip: tip})
		}
		return true
	}
	return false
}

// segmentHitsBox reports whether the segment pq meets the box (Liang-Barsky
// clipping of the segment against the box).
func segmentHitsBox(p, q Point, b layout.Box) bool {
	t0, t1 := 0.0, 1.0
	dx, dy := q.X-p.X, q.Y-p.Y
	for _, e := range [4][2]float64{{-dx, p.X - b.X}, {dx, b.X + b.W - p.X}, {-dy, p.Y - b.Y}, {dy, b.Y + b.H - p.Y}} {
		pk, qk := e[0], e[1]
		if pk == 0 {
			if qk < 0 {
				return false
			}
			continue
		}
		r := qk / pk
		if pk < 0 {
			t0 = math.Max(t0, r)
		} else {
			t1 = math.Min(t1, r)
		}
		if t0 > t1 {
			return false
		}
	}
	return true
}

// regionText is "a above b" within width: when it is too wide, the longer
// name is shortened first, then both, with an ellipsis, so that the reader
// still sees which series is above which. It reports false when even that
// does not fit.
func (f *frame) regionText(a, b string, width float64) (string, bool) {
	sp := f.spec
	full := a + " above " + b
	if f.measure(full, sp.text, false) <= width {
		return full, true
	}
	room := width - f.measure(" above ", sp.text, false)
	wa, wb := f.measure(a, sp.text, false), f.measure(b, sp.text, false)
	// Give the shorter name all it needs up to half the room, the longer
	// one the rest.
	switch {
	case wa <= wb:
		wa = math.Min(wa, room/2)
		wb = room - wa
	default:
		wb = math.Min(wb, room/2)
		wa = room - wb
	}
	if wa <= 0 || wb <= 0 {
		return "", false
	}
	sa, _ := f.wrap(a, sp.text, false, wa, 1)
	sb, _ := f.wrap(b, sp.text, false, wb, 1)
	if len(sa) != 1 || len(sb) != 1 || sa[0] == "…" && sb[0] == "…" {
		return "", false
	}
	text := sa[0] + " above " + sb[0]
	if f.measure(text, sp.text, false) > width {
		return "", false
	}
	return text, true
}

// crossings returns the drawn difference as runs without gaps, with a
// vertex inserted at every sign change: where d goes from one sign to the
// other between two points, at the x where the straight segment between
// them meets zero.
func crossings(p scale.Polyline) [][]xy {
	var out [][]xy
	var run []xy
	for i := range p.X {
		x, y := p.X[i], p.Y[i]
		if math.IsNaN(y) {
			if len(run) > 0 {
				out = append(out, run)
				run = nil
			}
			continue
		}
		if n := len(run); n > 0 {
			q := run[n-1]
			if q.Y < 0 && y > 0 || q.Y > 0 && y < 0 {
				run = append(run, xy{X: q.X + (x-q.X)*q.Y/(q.Y-y), Y: 0})
			}
		}
		run = append(run, xy{X: x, Y: y})
	}
	if len(run) > 0 {
		out = append(out, run)
	}
	return out
}

// signedPart is a stretch of the difference of one sign, from baseline to
// baseline where it crosses.
type signedPart struct {
	sign int
	pts  []xy
}

// splitSigns cuts a run at its zero vertices into parts of one sign each.
func splitSigns(run []xy) []signedPart {
	var out []signedPart
	cur := signedPart{}
	for _, p := range run {
		s := 0
		if p.Y > 0 {
			s = 1
		} else if p.Y < 0 {
			s = -1
		}
		if s != 0 && cur.sign != 0 && s != cur.sign {
			// Only reached without a zero vertex between, which crossings prevents.
			out = append(out, cur)
			cur = signedPart{}
		}
		cur.pts = append(cur.pts, p)
		if s != 0 {
			cur.sign = s
		}
		if s == 0 && cur.sign != 0 {
			out = append(out, cur)
			cur = signedPart{pts: []xy{p}}
		}
	}
	if cur.sign != 0 {
		out = append(out, cur)
	}
	return out
}

// describe says what is plotted, where each series is above, and the
// largest differences.
func (c *diffChart) describe() string {
	var b strings.Builder
	over := overText(c.opt.XName, c.opt.Time)
	xlo, xhi, _ := dataRange(c.x)
	fmt.Fprintf(&b, "Difference chart of %s minus %s %s, from %s to %s, against a zero line.", c.opt.aName, c.opt.bName, over,
		xValueText(xlo, c.xk), xValueText(xhi, c.xk))
	series := []Series{{Name: c.opt.aName, X: c.x, Y: c.a}, {Name: c.opt.bName, X: c.x, Y: c.b}, {X: c.x, Y: c.d}}
	vf := scale.ValueFormat(shownValues(series), c.opt.Unit)
	_, _, lo, hi := extremes(c.d)
	above, below := 0, 0
	for _, v := range c.d {
		if v > 0 {
			above++
		} else if v < 0 {
			below++
		}
	}
	fmt.Fprintf(&b, " %s is above %s at %d of %d points and below at %d.", c.opt.aName, c.opt.bName, above, len(c.d), below)
	fmt.Fprintf(&b, " Largest difference: %s at %s; smallest: %s at %s.", vf.Format(c.d[hi]), xValueText(c.x[hi], c.xk), vf.Format(c.d[lo]), xValueText(c.x[lo], c.xk))
	for _, s := range series[:2] {
		b.WriteString(" " + describeSeries(s, vf, c.xk))
	}
	return b.String()
}

// xy is one point of the difference in data units.
type xy struct{ X, Y float64 }

// minDepth is the smallest distance in pixels between the baseline and the
// difference line over the screen interval [l, r], which lies within the
// part pts (one sign, in x order).
func minDepth(pts []xy, xs, ys scale.Linear, l, r float64) float64 {
	zero := ys.Map(0)
	depth := math.Inf(1)
	at := func(px float64) {
		for i := 1; i < len(pts); i++ {
			a, b := xs.Map(pts[i-1].X), xs.Map(pts[i].X)
			if px >= a && px <= b && b > a {
				y := ys.Map(pts[i-1].Y) + (ys.Map(pts[i].Y)-ys.Map(pts[i-1].Y))*(px-a)/(b-a)
				depth = math.Min(depth, math.Abs(y-zero))
				return
			}
		}
	}
	at(l)
	at(r)
	for _, p := range pts {
		if px := xs.Map(p.X); px >= l && px <= r {
			depth = math.Min(depth, math.Abs(ys.Map(p.Y)-zero))
		}
	}
	return depth
}
