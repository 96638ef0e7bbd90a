package render

import (
	"math"
	"slices"
	"time"

	"plumb/scale"
)

// axis is one axis of any chart, along x or y: its domain, which the
// pixels map from, and its labelled ticks. Ticks are chosen (fitX, fitY,
// fitValue), measured (labelsFit, overhang) and drawn (draw) here and
// nowhere else, so that every chart reads the same way.
type axis struct {
	kind   axisKind
	d0, d1 float64
	ticks  []float64
	labels []string
	// label writes the labels of a set of ticks, so that an axis thinned
	// to fewer ticks is written again at their precision and, on a
	// calendar, with the context its kept ticks need.
	label func([]float64) []string
	// extent, when set, is the domain a set of ticks gives: a value axis
	// ends on its outer ticks or at the data, whichever is further out, so
	// that labels are measured where they will be drawn.
	extent func([]float64) (d0, d1 float64)
	// cats are the written labels of a category axis, one per tick, and
	// band the length of each category's band.
	cats    []catTick
	band    float64
	upright bool // a category axis down the side of a plot
}

// axisKind says what an axis's values are, which decides its ticks and
// how its labels are written.
type axisKind int

const (
	numberTicks   axisKind = iota // nice steps of 1, 2, 2.5 and 5
	timeTicks                     // calendar steps, instants as Unix seconds
	categoryTicks                 // one band per category, ticks at the indexes (see categoryAxis)
)

// xKind says what the x values are, which decides their ticks.
type xKind struct {
	time bool // instants as Unix seconds: calendar ticks
	// integer: every x is a whole number (years, counts, ranks), so no
	// tick falls between two of them.
	integer bool
	// years: whole numbers that all look like calendar years (1800..2100),
	// printed as years: no thousands separator.
	years bool
	// grain is the finest calendar unit the instants use (time only), so
	// that descriptions write every date at that precision: "Jan 2024"
	// for monthly data, never "2024". Zero decides per value.
	grain dateGrain
}

// yKind says what a value axis must show besides the data.
type yKind struct {
	unit    string   // on the tick labels ("%" only)
	include *float64 // a value forced into the domain: the zero of a difference, the base of an index
	integer bool     // every value is a whole number: no fractional ticks
}

// Tick spacing on axes that need not reach zero, in pixels at screen text
// size (13 px) and scaled with the medium's text: roughly one tick per
// 50-100 px reads without crowding (a y axis goes beyond 120 px between
// ticks only when nothing denser fits the data well). The target (one per
// 75 px) and the floor (scale.MinTicks: three labelled ticks beyond 150 px,
// so that the reader can tell the scale's step as well as its level) are
// the scale package's, shared with bars and dots (common practice).
const (
	tickSpacingMin    = 50.0
	tickSpacingTarget = 75.0
	tickSpacingMax    = 120.0
)

// fitX chooses the x ticks for an axis of length px: the count closest to
// one per tickSpacingTarget px whose labels (centred on their ticks) keep
// one text height apart, never fewer than three on a long axis when three
// fit at all. The domain is the data's range, numbers as well as times:
// the line ends where the data ends, and the ticks fall inside it.
func (f *frame) fitX(lo, hi float64, k xKind, length float64) axis {
	sp := f.spec
	if hi == lo {
		if k.time {
			lo, hi = lo-43200, hi+43200 // a single instant: show the day around it
		} else {
			lo, hi = lo-1, hi+1
		}
	}
	scaleK := sp.text / 13
	floor := f.lineFloor(length)
	target := max(2, int(math.Round(length/(tickSpacingTarget*scaleK))))
	var best axis
	bestScore := math.Inf(-1)
	for _, a := range xCandidates(lo, hi, k, target) {
		if len(a.ticks) == 0 || !f.labelsFit(a, length) {
			continue
		}
		n := len(a.ticks)
		spacing := length
		if n > 1 {
			spacing = length * (a.ticks[n-1] - a.ticks[0]) / (a.d1 - a.d0) / float64(n-1)
		}
		score := -math.Abs(float64(n - target))
		if n < floor {
			score -= 100
		}
		if n > 1 && spacing < tickSpacingMin*scaleK {
			score -= 10
		}
		if score > bestScore {
			best, bestScore = a, score
		}
	}
	// Too few ticks fit (calendar steps jump, from days to weeks): keep
	// every s-th tick of a denser set, the smallest stride whose labels fit.
	if best.ticks != nil && len(best.ticks) < floor {
		for m := target + 1; m <= 4*target+8; m++ {
			dense := xTicks(lo, hi, k, m)
			for stride := 2; len(dense.ticks) >= floor*stride-stride+1; stride++ {
				if a := thin(dense, stride); f.labelsFit(a, length) {
					return a
				}
			}
		}
	}
	if best.ticks != nil {
		return best
	}
	// Even the fewest ticks collide (very long labels on a narrow axis).
	return f.thinToFit(xTicks(lo, hi, k, 2), length)
}

// minTicks is scale.MinTicks for an axis whose labels are set in the
// medium's text: its threshold length (150 px at 13 px text) grows and
// shrinks with the text, as the tick spacing does.
func (f *frame) minTicks(length float64) int {
	return scale.MinTicks(length * 13 / f.spec.text)
}

// lineFloor is the fewest ticks a line axis of this length must carry:
// scale.MinTicks beyond its threshold length, else none, because a line
// axis's ticks fall inside the data's range and a short one may have room
// for a single label only.
func (f *frame) lineFloor(length float64) int {
	if n := f.minTicks(length); n > 2 {
		return n
	}
	return 0
}

// thin keeps every stride-th tick of a, counted from zero when a number
// axis labels it (zero is read against) and from the first tick otherwise,
// and writes the kept labels again: at the precision of the kept ticks, or
// on a calendar with the date a dropped tick carried. A lone calendar tick
// keeps its label, which TimeTicks wrote with the full context at the
// precision of its step.
func thin(a axis, stride int) axis {
	anchor := 0
	if a.kind == numberTicks {
		if i := slices.Index(a.ticks, 0); i >= 0 {
			anchor = i
		}
	}
	out := axis{kind: a.kind, d0: a.d0, d1: a.d1, label: a.label, extent: a.extent, band: a.band, upright: a.upright}
	for i := range a.ticks {
		if (i-anchor)%stride == 0 {
			out.ticks, out.labels = append(out.ticks, a.ticks[i]), append(out.labels, a.labels[i])
			if a.cats != nil {
				out.cats = append(out.cats, a.cats[i])
			}
		}
	}
	if a.label != nil && (len(out.ticks) > 1 || a.kind == numberTicks) {
		out.labels = a.label(out.ticks)
	}
	if a.extent != nil {
		out.d0, out.d1 = a.extent(out.ticks)
	}
	return out
}

// thinToFit is the fallback of every axis whose fewest nice ticks are
// still too many to label (long labels on a short axis): the smallest
// stride whose labels keep apart, so that labels never overlap.
func (f *frame) thinToFit(a axis, length float64) axis {
	base := a
	for k := 2; k <= len(base.ticks) && len(a.ticks) > 1 && !f.labelsFit(a, length); k++ {
		a = thin(base, k)
	}
	return a
}

// xCandidates are the labellings fitX chooses from: calendar ticks for
// about 2 to target+2 ticks on a time axis; on a number axis the nice
// steps of stepCandidates, each with its ticks inside the data's range (a
// whole-number axis takes whole steps only).
func xCandidates(lo, hi float64, k xKind, target int) []axis {
	var out []axis
	if k.time {
		for m := 2; m <= max(12, target+2); m++ {
			out = append(out, xTicks(lo, hi, k, m))
		}
		return out
	}
	eps := (hi - lo) * 1e-9
	for _, c := range stepCandidates(lo, hi) {
		if k.integer && c.step != math.Trunc(c.step) {
			continue
		}
		var vals []float64
		for _, v := range c.values {
			if v >= lo-eps && v <= hi+eps {
				vals = append(vals, v)
			}
		}
		out = append(out, labelNumbers(lo, hi, vals, k))
	}
	return out
}

// labelNumbers labels the ticks vals of a number axis over [lo, hi].
func labelNumbers(lo, hi float64, vals []float64, k xKind) axis {
	label := func(ts []float64) []string {
		if k.years {
			return formatAll(scale.Format{}, ts) // 2018, never 2,018
		}
		return formatAll(scale.TickFormat(ts, ""), ts)
	}
	return axis{d0: lo, d1: hi, ticks: vals, labels: label(vals), label: label}
}

// timeLabels writes calendar tick labels, each with the context (year,
// month) that its neighbours do not already give.
func timeLabels(ts []float64) []string {
	tt := make([]time.Time, len(ts))
	for i, t := range ts {
		tt[i] = unixTime(t)
	}
	out := make([]string, len(ts))
	for i, t := range scale.TimeLabels(tt, time.UTC) {
		out[i] = t.Label
	}
	return out
}

// xTicks computes about m ticks inside [lo, hi] and their labels.
func xTicks(lo, hi float64, k xKind, m int) axis {
	if k.time {
		tt := scale.TimeTicks(unixTime(lo), unixTime(hi), m, time.UTC)
		a := axis{kind: timeTicks, d0: lo, d1: hi, label: timeLabels}
		for _, t := range tt {
			a.ticks = append(a.ticks, float64(t.T.Unix())+float64(t.T.Nanosecond())/1e9)
			a.labels = append(a.labels, t.Label)
		}
		return a
	}
	return labelNumbers(lo, hi, innerTicks(lo, hi, m, k.integer), k)
}

// innerTicks are about m nice values inside [lo, hi]: the loose ticks of
// NiceDomain with those outside the range dropped. For integer data a
// fractional step gives no ticks, so that callers try another count.
func innerTicks(lo, hi float64, m int, integer bool) []float64 {
	t := scale.NiceDomain(lo, hi, m)
	if integer && t.Step != math.Trunc(t.Step) {
		return nil
	}
	eps := (hi - lo) * 1e-9
	var out []float64
	for _, v := range t.Values {
		if v >= lo-eps && v <= hi+eps {
			out = append(out, v)
		}
	}
	return out
}

// labelsFit reports whether neighbouring tick labels keep one text height
// apart on an axis of this length.
func (f *frame) labelsFit(a axis, length float64) bool {
	if a.kind == categoryTicks {
		return f.categoriesFit(a)
	}
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

// overhang is how far the outer tick labels reach beyond the axis ends.
func (f *frame) overhang(a axis, length float64) (left, right float64) {
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

// fitY chooses nice value ticks for a panel of height h, the domain ending
// on the outer ticks: among tick counts whose labels keep at least
// tickSpacingMin px apart (scaled with the text), the one whose domain fits
// the data most tightly, then the one closest to a tick every
// tickSpacingTarget px, never fewer than three on a tall axis when three
// fit. Lines need not include zero (their position, not a length, carries
// the value); k.include forces a value (the zero of a difference, the base
// of an index) into the domain, and zero is a tick whenever it lies inside
// (nice ticks are multiples of their step).
func (f *frame) fitY(lo, hi float64, h float64, k yKind) axis {
	if k.include != nil {
		lo, hi = math.Min(lo, *k.include), math.Max(hi, *k.include)
	}
	scaleK := f.spec.text / 13
	minSp := math.Max(lineHeight(f.spec.text)*1.5, tickSpacingMin*scaleK*0.8)
	target := scale.TickTarget(h, f.spec.text)
	floor := f.lineFloor(h)
	var best axis
	bestScore := math.Inf(-1)
	lh := lineHeight(f.spec.text)
	label := func(ts []float64) []string { return formatAll(scale.TickFormat(ts, k.unit), ts) }
	for _, c := range stepCandidates(lo, hi) {
		n := len(c.values)
		if k.integer && c.step != math.Trunc(c.step) {
			continue
		}
		spacing := h / float64(n-1)
		if spacing < lh*1.2 {
			continue // the labels would touch
		}
		fit := 1.0
		if hi > lo {
			fit = (hi - lo) / (c.values[n-1] - c.values[0])
		}
		score := 4*fit - 0.25*math.Abs(float64(n-target)) - c.penalty
		if n < floor {
			score -= 100
		}
		if spacing < minSp {
			score -= 3
		}
		// Sparser than one tick per tickSpacingMax px leaves the reader
		// guessing between labels.
		if spacing > tickSpacingMax*scaleK {
			score -= 1.5
		}
		if k.include != nil && !slices.Contains(c.values, *k.include) {
			score -= 2
		}
		if score > bestScore {
			best = axis{d0: c.values[0], d1: c.values[n-1], ticks: c.values, labels: label(c.values), label: label}
			bestScore = score
		}
	}
	if best.ticks == nil {
		t := scale.NiceDomain(lo, hi, 2)
		best = axis{d0: t.Values[0], d1: t.Values[len(t.Values)-1], ticks: t.Values, labels: label(t.Values), label: label}
	}
	// A forced value (the base of an index) is read against, so it is a
	// tick; the zero of a difference already is one (a multiple of the step).
	if v := k.include; v != nil && !slices.Contains(best.ticks, *v) {
		i, _ := slices.BinarySearch(best.ticks, *v)
		best.ticks = slices.Insert(slices.Clone(best.ticks), i, *v)
		best.labels = label(best.ticks)
	}
	return best
}

// tickCandidate is one loose labelling of a value axis.
type tickCandidate struct {
	values  []float64
	step    float64
	penalty float64 // 2.5 steps read a little less easily than 1, 2 and 5
}

// stepCandidates are the loose labellings of [lo, hi] by the nice steps
// 1, 2, 2.5 and 5 times a power of ten, from 2 to 13 ticks, the first tick
// at or below lo and the last at or above hi (the "nice numbers" of
// Heckbert 1990, enumerated rather than searched, so that every count an
// axis could carry is scored). Each tick is computed from its integer
// multiple of the step, so no rounding noise accumulates.
func stepCandidates(lo, hi float64) []tickCandidate {
	if hi == lo {
		d := math.Max(math.Abs(lo)*0.1, 1)
		lo, hi = lo-d, hi+d
	}
	span := hi - lo
	e0 := int(math.Floor(math.Log10(span)))
	var out []tickCandidate
	for e := e0 - 2; e <= e0+1; e++ {
		for _, q := range []float64{1, 2, 2.5, 5} {
			// step = q·10^e, held as an integer multiple m of 10^e or of 10^-e.
			unit := math.Pow(10, float64(e))
			step := q * unit
			k0, k1 := math.Floor(lo/step+1e-9), math.Ceil(hi/step-1e-9)
			n := int(k1-k0) + 1
			if n < 2 || n > 13 {
				continue
			}
			c := tickCandidate{step: step}
			if q == 2.5 {
				c.penalty = 0.3
			}
			for i := 0; i < n; i++ {
				m := (k0 + float64(i)) * q
				v := m * unit
				if e < 0 {
					v = m / math.Pow(10, float64(-e))
				}
				if v == 0 {
					v = 0 // no negative zero
				}
				c.values = append(c.values, v)
			}
			out = append(out, c)
		}
	}
	return out
}

// yLabelWidth is the widest tick label any candidate labelling gives, so
// that the plot's left edge is known before its height (which banking
// chooses) fixes the ticks.
func (f *frame) yLabelWidth(lo, hi float64, k yKind) float64 {
	if k.include != nil {
		lo, hi = math.Min(lo, *k.include), math.Max(hi, *k.include)
	}
	w := 0.0
	for _, c := range stepCandidates(lo, hi) {
		tf := scale.TickFormat(c.values, k.unit)
		for _, v := range c.values {
			w = math.Max(w, f.measure(tf.Format(v), f.spec.text, false))
		}
	}
	return w
}

// xLabelTop is where x tick labels start below a plot ending at bottom:
// clear of the lowest y tick label, which is centred on the bottom edge.
func (f *frame) xLabelTop(bottom float64) float64 {
	sp := f.spec
	face := f.fonts.Face(false)
	return bottom + math.Max(sp.gap, (face.Ascent(sp.text)+face.Descent(sp.text))/2+2)
}

// axisDraw says where and how an axis is drawn: along the foot of a plot
// (horizontal) or up its left edge (vertical).
type axisDraw struct {
	vertical bool         // the axis runs up the plot: ticks are y positions
	pos      scale.Linear // data to pixels along the axis
	// from and to are where each tick's line starts and ends across the
	// axis: the plot's extent for a grid line, 4 px for a tick mark.
	from, to  float64
	tickMarks bool    // short tick marks instead of grid lines
	labelAt   float64 // vertical: where the labels end; horizontal: their baseline
	labels    bool    // false on the inner panels of small multiples
	// baseline: the zero is the baseline bars grow from, drawn by
	// drawBaseline over the marks' ends, so it is no grid line.
	baseline bool
}

// draw adds the axis's tick lines and labels to the scene, each tick's
// line before its label, so that marks drawn later cover the grid. It is
// the one drawing path of every chart's axes.
func (f *frame) draw(a axis, d axisDraw) {
	for i := range a.ticks {
		f.drawTick(a, d, i)
	}
}

// drawTick draws tick i of the axis: its line and its label, or a
// category's label lines (categories have bands, not grid lines). Charts
// that draw each category's label beside its mark call it tick by tick.
func (f *frame) drawTick(a axis, d axisDraw, i int) {
	if a.kind == categoryTicks {
		f.drawCategory(a, d, i)
		return
	}
	sp := f.spec
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	class, stroke := "plumb-grid", f.th.grid
	if d.tickMarks {
		class, stroke = "plumb-tick-mark", f.th.muted
	}
	t := a.ticks[i]
	p := round2(d.pos.Map(t))
	if !(d.baseline && t == 0) {
		line := []Point{{p, d.from}, {p, d.to}}
		if d.vertical {
			line = []Point{{d.from, p}, {d.to, p}}
		}
		f.scene.Add(Mark{Kind: Path, Class: class, Lines: [][]Point{line}, Stroke: stroke, StrokeWidth: 1, Join: JoinRound, Cap: CapRound})
	}
	if !d.labels || a.labels[i] == "" {
		return
	}
	if d.vertical {
		f.text(d.labelAt, p+(asc-desc)/2, a.labels[i], sp.text, false, f.th.muted, "plumb-tick", End)
	} else {
		f.text(p, d.labelAt, a.labels[i], sp.text, false, f.th.muted, "plumb-tick", Middle)
	}
}

// drawBaseline draws the zero line of a value axis across the plot.
func (f *frame) drawBaseline(d axisDraw) {
	z := round2(d.pos.Map(0))
	line := []Point{{z, d.from}, {z, d.to}}
	if d.vertical {
		line = []Point{{d.from, z}, {d.to, z}}
	}
	f.scene.Add(Mark{Kind: Path, Class: "plumb-baseline", Lines: [][]Point{line}, Stroke: f.th.baseline, StrokeWidth: 1.5, Join: JoinRound, Cap: CapRound})
}

// drawYAxis draws a line panel's value axis: the horizontal grid from left
// to right and, when labels is set, the tick labels left of the plot.
func (f *frame) drawYAxis(a axis, ys scale.Linear, left, right float64, labels bool) {
	f.draw(a, axisDraw{vertical: true, pos: ys, from: left, to: right, labelAt: left - f.spec.gap, labels: labels})
}

// drawXAxis draws the x tick marks of a line panel and, when labels is
// set, their labels; it returns the y under the labels.
func (f *frame) drawXAxis(a axis, left float64, w int, bottom float64, labels bool) float64 {
	sp := f.spec
	xs := scale.Linear{D0: a.d0, D1: a.d1, R0: left, R1: left + float64(w)}
	top := f.xLabelTop(bottom)
	f.draw(a, axisDraw{pos: xs, from: bottom, to: bottom + 4, tickMarks: true, labelAt: top + f.fonts.Face(false).Ascent(sp.text), labels: labels})
	if !labels {
		return bottom
	}
	return top + lineHeight(sp.text)
}

func formatAll(f scale.Format, vs []float64) []string {
	out := make([]string, len(vs))
	for i, v := range vs {
		out[i] = f.Format(v)
	}
	return out
}
