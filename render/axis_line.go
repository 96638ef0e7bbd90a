package render

import (
	"fmt"
	"math"
	"time"

	"plumb/scale"
)

// Aspect ratio limits of a banked plot, as plot height over plot width. A
// banked ratio below 0.15 draws a strip too thin to read a value from; above
// 1.5 a tall column where a long series' detail is lost in the width
// (common practice: Cleveland 1993 banks within roughly these proportions).
// The limits are applied after banking, and the note says at what angle the
// median segment is then drawn.
const (
	MinAspect = 0.15
	MaxAspect = 1.5
)

// xAxis is the horizontal axis of a line chart: its domain, which the x
// pixels map from, and its labelled ticks.
type xAxis struct {
	time   bool
	d0, d1 float64
	ticks  []float64
	labels []string
}

// yAxis is the value axis of a line panel.
type yAxis struct {
	d0, d1 float64
	ticks  []float64
	format scale.Format
}

// dataRange returns the smallest and largest finite values of vs, and
// false when there are none.
func dataRange(vs ...[]float64) (lo, hi float64, ok bool) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		for _, x := range v {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				continue
			}
			lo, hi = math.Min(lo, x), math.Max(hi, x)
		}
	}
	return lo, hi, lo <= hi
}

// fitX chooses the x ticks for an axis of length px: as many as fit with
// their labels (centred on the ticks) at least one text height apart. For
// numbers the domain widens to the outer nice ticks; a time axis keeps the
// data's range, and its calendar ticks fall inside it.
func (f *frame) fitX(lo, hi float64, isTime bool, length float64) xAxis {
	sp := f.spec
	if hi == lo {
		if isTime {
			lo, hi = lo-43200, hi+43200 // a single instant: show the day around it
		}
	}
	var best xAxis
	start := int(math.Max(2, math.Min(12, math.Floor(length/(sp.text*5)))))
	for m := start; m >= 2; m-- {
		a := xTicks(lo, hi, isTime, m)
		best = a
		if f.xLabelsFit(a, length) {
			return a
		}
	}
	// Even the fewest ticks collide (very long labels on a narrow axis):
	// keep every other tick, the first always, until the labels fit.
	for len(best.ticks) > 1 && !f.xLabelsFit(best, length) {
		best = thinX(best)
	}
	return best
}

// thinX keeps every other tick of a, starting with the first. Time labels
// of two or more kept ticks are written again, so that a kept tick whose
// date was on a dropped one still says which day it is.
func thinX(a xAxis) xAxis {
	out := xAxis{time: a.time, d0: a.d0, d1: a.d1}
	for i := 0; i < len(a.ticks); i += 2 {
		out.ticks, out.labels = append(out.ticks, a.ticks[i]), append(out.labels, a.labels[i])
	}
	// A lone tick keeps its label, which TimeTicks wrote with the full
	// context at the precision of its step.
	if a.time && len(out.ticks) > 1 {
		ts := make([]time.Time, len(out.ticks))
		for i, t := range out.ticks {
			ts[i] = unixTime(t)
		}
		for i, t := range scale.TimeLabels(ts, time.UTC) {
			out.labels[i] = t.Label
		}
	}
	return out
}

// xTicks computes about m ticks and their labels.
func xTicks(lo, hi float64, isTime bool, m int) xAxis {
	if isTime {
		tt := scale.TimeTicks(unixTime(lo), unixTime(hi), m, time.UTC)
		a := xAxis{time: true, d0: lo, d1: hi}
		for _, t := range tt {
			a.ticks = append(a.ticks, float64(t.T.Unix())+float64(t.T.Nanosecond())/1e9)
			a.labels = append(a.labels, t.Label)
		}
		return a
	}
	t := scale.NiceDomain(lo, hi, m)
	a := xAxis{d0: lo, d1: hi}
	if len(t.Values) > 0 {
		a.d0, a.d1 = math.Min(lo, t.Values[0]), math.Max(hi, t.Values[len(t.Values)-1])
	}
	tf := scale.TickFormat(t.Values, "")
	for _, v := range t.Values {
		a.ticks = append(a.ticks, v)
		a.labels = append(a.labels, tf.Format(v))
	}
	return a
}

// unixTime turns seconds since 1970 UTC into a time.
func unixTime(s float64) time.Time {
	sec := math.Floor(s)
	return time.Unix(int64(sec), int64(math.Round((s-sec)*1e9))).UTC()
}

// xLabelsFit reports whether neighbouring tick labels keep one text height
// apart on an axis of this length.
func (f *frame) xLabelsFit(a xAxis, length float64) bool {
	if len(a.ticks) < 2 {
		return true
	}
	xs := scale.Linear{D0: a.d0, D1: a.d1, R0: 0, R1: length}
	prevR := math.Inf(-1)
	for i, t := range a.ticks {
		w := f.measure(a.labels[i], f.spec.text, false)
		x := xs.Map(t)
		if x-w/2 < prevR+f.spec.text {
			return false
		}
		prevR = x + w/2
	}
	return true
}

// xOverhang is how far the outer tick labels reach beyond the axis ends.
func (f *frame) xOverhang(a xAxis, length float64) (left, right float64) {
	if len(a.ticks) == 0 {
		return 0, 0
	}
	xs := scale.Linear{D0: a.d0, D1: a.d1, R0: 0, R1: length}
	w0 := f.measure(a.labels[0], f.spec.text, false)
	w1 := f.measure(a.labels[len(a.labels)-1], f.spec.text, false)
	left = math.Max(0, w0/2-xs.Map(a.ticks[0]))
	right = math.Max(0, xs.Map(a.ticks[len(a.ticks)-1])+w1/2-length)
	return left, right
}

// fitY chooses nice value ticks for a panel of height h: as many as keep
// their labels apart, the domain ending on the outer ticks. Lines need not
// include zero (their position, not a length, carries the value); include
// forces a value (the zero of a difference) into the domain.
func (f *frame) fitY(lo, hi float64, h float64, unit string, include *float64) yAxis {
	if include != nil {
		lo, hi = math.Min(lo, *include), math.Max(hi, *include)
	}
	lh := lineHeight(f.spec.text)
	start := int(math.Max(2, math.Min(10, math.Floor(h/(lh*1.3)))))
	var a yAxis
	for m := start; m >= 2; m-- {
		t := scale.NiceDomain(lo, hi, m)
		if len(t.Values) < 2 {
			continue
		}
		a = yAxis{d0: t.Values[0], d1: t.Values[len(t.Values)-1], ticks: t.Values, format: scale.TickFormat(t.Values, unit)}
		step := h / float64(len(t.Values)-1)
		if step >= lh*1.2 {
			break
		}
	}
	if a.ticks == nil {
		a = yAxis{d0: lo - 1, d1: hi + 1, ticks: []float64{lo - 1, hi + 1}, format: scale.TickFormat([]float64{lo - 1, hi + 1}, unit)}
	}
	return a
}

// yLabelWidth is the widest tick label any tick count up to 10 gives, so
// that the plot's left edge is known before its height (which banking
// chooses) fixes the ticks.
func (f *frame) yLabelWidth(lo, hi float64, unit string, include *float64) float64 {
	if include != nil {
		lo, hi = math.Min(lo, *include), math.Max(hi, *include)
	}
	w := 0.0
	for m := 2; m <= 10; m++ {
		t := scale.NiceDomain(lo, hi, m)
		tf := scale.TickFormat(t.Values, unit)
		for _, v := range t.Values {
			w = math.Max(w, f.measure(tf.Format(v), f.spec.text, false))
		}
	}
	return w
}

// banking is how a panel's height was chosen.
type banking struct {
	method  string  // "" (median absolute slope), "orientation", or "W:H"
	forced  float64 // alpha from "W:H", else 0
	alpha   float64 // the final plot H/W
	banked  float64 // what banking asked for, before clamping
	msAlpha float64 // the median-slope alpha, for the angle in notes
	ok      bool    // banking was defined for the data
	clamped bool
	fixed   bool // the canvas height, fixed by the medium or --size, limited the plot
}

// limit records that a fixed canvas height cut the plot to h for width w.
func (b *banking) limit(w, h float64) {
	b.alpha, b.fixed = h/w, true
}

// parseAspect reads an Aspect option.
func parseAspect(s string) (method string, forced float64, err error) {
	switch s {
	case "", "slope":
		return "", 0, nil
	case "orientation":
		return "orientation", 0, nil
	}
	var w, h float64
	if _, e := fmt.Sscanf(s, "%g:%g", &w, &h); e != nil || !(w > 0) || !(h > 0) || math.IsInf(w, 0) || math.IsInf(h, 0) {
		return "", 0, fmt.Errorf("aspect %q: use orientation, or width:height such as 16:9", s)
	}
	if a := h / w; a > 0 && !math.IsInf(a, 0) {
		return "W:H", a, nil
	}
	return "", 0, fmt.Errorf("aspect %q: the ratio is out of range; use width:height such as 16:9", s)
}

// bankAlpha banks the drawn polylines for the y axis a (Cleveland, McGill &
// McGill 1988: median absolute slope; Cleveland 1993: length-weighted
// orientation), clamped to [MinAspect, MaxAspect].
func (b *banking) bankAlpha(lines []scale.Polyline, rx float64, a yAxis) float64 {
	ry := a.d1 - a.d0
	b.msAlpha, _ = scale.BankMedianSlope(lines, rx, ry)
	if b.forced > 0 {
		b.ok = true
		b.alpha, b.banked = b.forced, b.forced
		return b.alpha
	}
	var alpha float64
	var ok bool
	if b.method == "orientation" {
		alpha, ok = scale.BankWeightedOrientation(lines, rx, ry)
	} else {
		alpha, ok = b.msAlpha, b.msAlpha > 0
	}
	b.ok, b.banked = ok, alpha
	if !ok {
		alpha = 0.5 // no segment rises or falls: a calm default
	}
	b.clamped = ok && (alpha < MinAspect || alpha > MaxAspect)
	b.alpha = math.Min(MaxAspect, math.Max(MinAspect, alpha))
	return b.alpha
}

// bank chooses a panel's plot height for plot width w: banking needs the
// y domain, whose nice ticks depend on the height, so it iterates until the
// two agree, and always returns the alpha computed for the axis it returns.
func (f *frame) bank(b *banking, lines []scale.Polyline, rx, w, lo, hi float64, unit string, include *float64) (float64, yAxis) {
	h := w * 0.5
	var a yAxis
	for i := 0; i < 6; i++ {
		a = f.fitY(lo, hi, h, unit, include)
		nh := b.bankAlpha(lines, rx, a) * w
		if math.Abs(nh-h) < 0.5 {
			h = nh
			break
		}
		h = nh
	}
	return h, a
}

// bankNote says how the height was chosen.
func (b *banking) note(w, h float64) string {
	switch {
	case b.forced > 0:
		angle := ""
		if b.msAlpha > 0 {
			angle = fmt.Sprintf("; the median segment is drawn at %.0f°", medianAngle(b.alpha, b.msAlpha))
		}
		return fmt.Sprintf("aspect ratio forced by --aspect: plot %.0f × %.0f px%s", w, h, angle)
	case !b.ok:
		return fmt.Sprintf("the lines neither rise nor fall: no banking; plot %.0f × %.0f px", w, h)
	case b.fixed:
		return fmt.Sprintf("banking to 45° asks for a plot height/width of %.2f; the figure's fixed height allows %.2f (plot %.0f × %.0f px), so the median segment is drawn at %.0f°",
			b.banked, b.alpha, w, h, medianAngle(b.alpha, b.msAlpha))
	case b.clamped:
		return fmt.Sprintf("banking to 45° asks for a plot height/width of %.2f; kept within %.2f–%.2f (plot %.0f × %.0f px), so the median segment is drawn at %.0f°",
			b.banked, MinAspect, MaxAspect, w, h, medianAngle(b.alpha, b.msAlpha))
	case b.method == "orientation":
		return fmt.Sprintf("banked to 45° by length-weighted mean orientation (Cleveland 1993): plot %.0f × %.0f px", w, h)
	}
	return fmt.Sprintf("banked to 45° by median absolute slope (Cleveland, McGill & McGill 1988): plot %.0f × %.0f px", w, h)
}

// medianAngle is the drawn angle, in degrees, of the median segment at
// aspect alpha, given the alpha that would draw it at 45°.
func medianAngle(alpha, ms float64) float64 {
	if !(ms > 0) {
		return 45
	}
	return math.Atan(alpha/ms) * 180 / math.Pi
}

// lineGeom maps data to the screen of one panel, with M4 reduction when a
// panel has more than four points per pixel column.
type lineGeom struct {
	left   float64 // the plot's left edge, a whole pixel so columns line up
	w      int     // plot width in whole pixels
	ax     xAxis
	reduce bool
}

// keep returns the indices of the points of (x, y) to draw: all of them, or
// the M4 selection (Jugel et al. 2014) over the panel's pixel columns.
func (g lineGeom) keep(x, y []float64) []int {
	if !g.reduce {
		idx := make([]int, len(x))
		for i := range idx {
			idx[i] = i
		}
		return idx
	}
	return scale.M4(make([]int, 0, 4*g.w+8), x, y, g.ax.d0, g.ax.d1, g.w)
}

// polyline is the kept points in data units, NaN where the line breaks, for
// banking and drawing alike.
func (g lineGeom) polyline(x, y []float64) scale.Polyline {
	idx := g.keep(x, y)
	p := scale.Polyline{X: make([]float64, len(idx)), Y: make([]float64, len(idx))}
	for i, j := range idx {
		p.X[i], p.Y[i] = x[j], y[j]
	}
	return p
}

// screen maps a polyline to pixel polylines, broken at missing values. When
// reduced, every vertex stays inside the pixel column M4 grouped it in (the
// linear position moved by under 0.01 px at most), so that rounding to two
// decimals never carries a vertex into the next column.
func (g lineGeom) screen(p scale.Polyline, ys scale.Linear) [][]Point {
	xs := scale.Linear{D0: g.ax.d0, D1: g.ax.d1, R0: g.left, R1: g.left + float64(g.w)}
	var out [][]Point
	var cur []Point
	for i := range p.X {
		if math.IsNaN(p.Y[i]) || math.IsNaN(p.X[i]) {
			if len(cur) > 0 {
				out = append(out, cur)
				cur = nil
			}
			continue
		}
		x := xs.Map(p.X[i])
		if g.reduce {
			c := float64(scale.PixelColumn(p.X[i], g.ax.d0, g.ax.d1, g.w))
			x = math.Min(math.Max(x, g.left+c), g.left+c+0.99)
		}
		cur = append(cur, Point{round2(x), round2(ys.Map(p.Y[i]))})
	}
	if len(cur) > 0 {
		out = append(out, cur)
	}
	return out
}

// drawYAxis draws the horizontal grid and, when labels is set, the tick
// labels left of the plot.
func (f *frame) drawYAxis(a yAxis, ys scale.Linear, left, right float64, labels bool) {
	sp := f.spec
	asc, desc := f.fonts.Face(false).Ascent(sp.text), f.fonts.Face(false).Descent(sp.text)
	for _, t := range a.ticks {
		y := round2(ys.Map(t))
		f.scene.Add(Mark{Kind: Path, Class: "plumb-grid", Lines: [][]Point{{{left, y}, {right, y}}}, Stroke: f.th.grid, StrokeWidth: 1})
		if labels {
			f.text(left-sp.gap, y+(asc-desc)/2, a.format.Format(t), sp.text, false, f.th.muted, "plumb-tick", End)
		}
	}
}

// xLabelTop is where x tick labels start below a plot ending at bottom:
// clear of the lowest y tick label, which is centred on the bottom edge.
func (f *frame) xLabelTop(bottom float64) float64 {
	sp := f.spec
	face := f.fonts.Face(false)
	return bottom + math.Max(sp.gap, (face.Ascent(sp.text)+face.Descent(sp.text))/2+2)
}

// drawXAxis draws the x tick marks and, when labels is set, their labels;
// it returns the y under the labels.
func (f *frame) drawXAxis(a xAxis, left float64, w int, bottom float64, labels bool) float64 {
	sp := f.spec
	xs := scale.Linear{D0: a.d0, D1: a.d1, R0: left, R1: left + float64(w)}
	top := f.xLabelTop(bottom)
	for i, t := range a.ticks {
		x := round2(xs.Map(t))
		f.scene.Add(Mark{Kind: Path, Class: "plumb-tick-mark", Lines: [][]Point{{{x, bottom}, {x, bottom + 4}}}, Stroke: f.th.muted, StrokeWidth: 1})
		if labels && a.labels[i] != "" {
			f.text(x, top+f.fonts.Face(false).Ascent(sp.text), a.labels[i], sp.text, false, f.th.muted, "plumb-tick", Middle)
		}
	}
	if !labels {
		return bottom
	}
	return top + lineHeight(sp.text)
}

// fitPanelsX places cols plots of one width side by side, from left0 to
// the right edge less labelW (room for end labels beside the last plot). It
// fits the x ticks to the plot width, then narrows the plots until the
// outer tick labels, centred on their ticks, stay on the canvas and keep one
// text height clear of the labels of the neighbouring plot, widening the
// gutter between plots (at least gap0) as they need. It returns the first
// plot's left edge, the plot width, the gutter and the axis; the width may
// come out too small to draw, which callers check.
func (f *frame) fitPanelsX(left0, labelW float64, cols int, gap0, xlo, xhi float64, isTime bool) (left, w, gap float64, ax xAxis) {
	sp := f.spec
	cols = max(cols, 1)
	n := float64(cols)
	right := f.width - sp.pad
	w = math.Floor((right - labelW - left0 - (n-1)*gap0) / n)
	for {
		ax = f.fitX(xlo, xhi, isTime, w)
		lo, ro := f.xOverhang(ax, w)
		left, gap = math.Max(left0, math.Ceil(sp.pad+lo)), gap0
		if cols > 1 {
			gap = math.Max(gap0, math.Ceil(lo+ro+sp.text))
		}
		excess := left + n*w + (n-1)*gap + math.Max(labelW, ro) - right
		// Each pass narrows the plots, so the loop ends; below a few
		// characters' width no caller draws.
		if excess <= 0 || w < sp.text*4 {
			return left, w, gap, ax
		}
		w -= math.Max(1, math.Ceil(excess/n))
	}
}

// axisTitleText is an axis or panel title wrapped to its width.
type axisTitleText struct {
	lines []string
	tip   string // the full text when it was shortened
}

// axisTitle wraps an axis title to at most two lines of width, shortening
// the second with an ellipsis; the full text then goes in the tooltip.
func (f *frame) axisTitle(text string, width float64) axisTitleText {
	lines, cut := f.wrap(text, f.spec.text, false, width, 2)
	t := axisTitleText{lines: lines}
	if cut {
		t.tip = text
	}
	return t
}

// height is the title's height in lines of height lh.
func (t axisTitleText) height(lh float64) float64 { return float64(len(t.lines)) * lh }

// drawAxisTitle draws the title's lines from top, starting at x.
func (f *frame) drawAxisTitle(t axisTitleText, x, top float64) {
	sp := f.spec
	asc, lh := f.fonts.Face(false).Ascent(sp.text), lineHeight(sp.text)
	for i, l := range t.lines {
		f.scene.Add(Mark{Kind: Text, Class: "plumb-axis-title", X: x, Y: top + asc + float64(i)*lh, Text: l, Size: sp.text, Fill: f.th.muted, Anchor: Start, Tooltip: t.tip})
	}
}
