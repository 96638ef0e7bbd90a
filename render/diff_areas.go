package render

import (
	"math"
	"slices"
	"strings"

	"plumb/layout"
	"plumb/scale"
)

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

// regionPlace is where a region label goes: its lines centred on cx from
// the baseline of the first at y.
type regionPlace struct {
	lines []string
	cx, y float64
	tip   string
	box   layout.Box
}

// regionLabel places the name of the largest area of one sign, "a above
// b", inside it: in the area's tallest clear space that holds the whole
// label with a margin, centred there, its box crossing neither the
// difference line nor any area's outline. An area too thin for its label
// gets none (the key then says what the colour means): ok is false.
func (f *frame) regionLabel(ar areaInfo, a, b string, xs, ys scale.Linear, segs [][2]Point, above bool) (regionPlace, bool) {
	if ar.area == 0 {
		return regionPlace{}, false
	}
	sp := f.spec
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
		return regionPlace{lines: lines, cx: bestCX, y: mid - th/2 + asc, tip: tip, box: box}, true
	}
	return regionPlace{}, false
}

// draw sets the label's lines.
func (r regionPlace) draw(f *frame) {
	sp := f.spec
	lh := lineHeight(sp.text)
	for i, l := range r.lines {
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(r.cx), Y: round2(r.y + float64(i)*lh), Text: l, Size: sp.text, Fill: f.th.text, Anchor: Middle, Tooltip: r.tip})
	}
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

// diffAreas is the difference as drawn in one plot: the areas of each sign
// closed along the baseline, the line through the crossings, and where
// the region labels go.
type diffAreas struct {
	pos, neg [][]Point // the areas where a is above b, and below
	line     [][]Point // the difference line, one piece per run without gaps
	runs     [][]xy    // the same runs in data units, with their crossings
	base     float64   // the baseline's y
	names    [2]regionPlace
	named    [2]bool // a region label was placed for the sign (a above, b above)
}

// layoutAreas splits the drawn difference pd at every sign change, at its
// exact crossing (interpolated linearly between the two neighbouring
// points), closes each part along the baseline, and places the label of
// the largest area of each sign clear of every outline.
func (f *frame) layoutAreas(pd scale.Polyline, xs, ys scale.Linear, aName, bName string) diffAreas {
	var out diffAreas
	out.runs = crossings(pd)
	out.base = round2(ys.Map(0))
	base := out.base
	var largest [2]areaInfo
	for _, run := range out.runs {
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
				out.neg = append(out.neg, poly)
			} else {
				out.pos = append(out.pos, poly)
			}
			if area > largest[k].area {
				largest[k] = areaInfo{area: area, pts: part.pts}
			}
		}
	}
	for _, run := range out.runs {
		var l []Point
		for _, p := range run {
			l = append(l, Point{round2(xs.Map(p.X)), round2(ys.Map(p.Y))})
		}
		out.line = append(out.line, l)
	}
	// Every segment a label must keep clear of: the difference line and the
	// outlines of the areas.
	var segs [][2]Point
	for _, group := range [][][]Point{out.line, out.pos, out.neg} {
		for _, l := range group {
			for i := 1; i < len(l); i++ {
				segs = append(segs, [2]Point{l[i-1], l[i]})
			}
		}
	}
	out.names[0], out.named[0] = f.regionLabel(largest[0], aName, bName, xs, ys, segs, true)
	out.names[1], out.named[1] = f.regionLabel(largest[1], bName, aName, xs, ys, segs, false)
	return out
}

// keyRows say once what each colour means when no region label does: a
// colour whose regions are all too thin for a label gets a key row.
func (f *frame) areaKeyRows(ar diffAreas, aName, bName string, width float64) []keyRow {
	areaA, areaB, _, _ := f.diffColors()
	var rows []keyRow
	add := func(fill Colour, above, below string) {
		text, ok := f.regionText(above, below, width-f.spec.text-f.spec.gap)
		r := keyRow{swatch: swatchArea, color: fill, text: f.th.text}
		if ok {
			r.label = text
			if full := above + " above " + below; text != full {
				r.tip = full
			}
		}
		rows = append(rows, r)
	}
	if !ar.named[0] && len(ar.pos) > 0 {
		add(areaA, aName, bName)
	}
	if !ar.named[1] && len(ar.neg) > 0 {
		add(areaB, bName, aName)
	}
	return rows
}
