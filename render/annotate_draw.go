package render

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"time"

	"plumb/layout"
	"plumb/scale"
)

// This file draws the annotation layers (annotate.go): each widens the
// panel's domains to hold what it marks, then draws from what the panel
// reports in placed, so that it works on any chart that fills placed.

// annotationLayer draws a panel's annotations (see Annotations.layers).
type annotationLayer struct{ a Annotations }

// widen extends the panel's domains to hold every valid annotation; a bad
// one widens nothing and fails the drawing.
func (l annotationLayer) widen(f *frame, x, y *axisDomain) {
	for _, r := range l.a.Refs {
		if r.check() == nil {
			refLine{r}.widen(f, x, y)
		}
	}
	for _, e := range l.a.Events {
		if e.check() == nil {
			eventLine{e}.widen(f, x, y)
		}
	}
	for _, p := range l.a.Periods {
		if p.check() == nil {
			periodShade{p}.widen(f, x, y)
		}
	}
}

// pending is an annotation's label waiting for its place.
type pending struct {
	order int // placing order: callouts, events, reference lines, periods
	note  noteText
	near  Point                     // the point it belongs to
	spots func(w, h float64) []spot // the places it prefers
	mark  int                       // the scene index of its mark, which keeps the text as a tooltip if no place is free; -1 for a callout, which is refused instead
	what  string                    // what it labels, for the note
	line  layout.Box                // the box of its line (references, events) or of its span (periods)
	// across: the label runs beside its line, so it keeps clear of the
	// lines parallel to it.
	across bool
}

func (l annotationLayer) draw(f *frame, p *placed, plot layout.Box) error {
	if err := l.a.check(); err != nil {
		return err
	}
	var labels []*pending
	add := func(lab *pending, err error) error {
		if lab != nil {
			labels = append(labels, lab)
		}
		return err
	}
	// Shades first, inserted in order behind everything the panel drew:
	// the lines and indices recorded after them stay where they are.
	at := min(max(p.start, 0), len(f.scene.Marks))
	for i, per := range l.a.Periods {
		if err := add(periodShade{per}.mark(f, p, plot, at+i)); err != nil {
			return err
		}
	}
	for _, r := range l.a.Refs {
		if err := add(refLine{r}.mark(f, p, plot)); err != nil {
			return err
		}
	}
	for _, e := range l.a.Events {
		if err := add(eventLine{e}.mark(f, p, plot)); err != nil {
			return err
		}
	}
	for _, c := range l.a.Callouts {
		if err := add(calloutNote{c}.label(f, p)); err != nil {
			return err
		}
	}
	var lines []layout.Box
	for _, lab := range labels {
		if lab.line.W > 0 { // periods have a span, not a line
			lines = append(lines, lab.line)
		}
	}
	slices.SortStableFunc(labels, func(a, b *pending) int { return a.order - b.order })
	for _, lab := range labels {
		// A label may cross the lines across its own (an event's label
		// a reference line) but never one parallel to it, next to which
		// it would read as that line's label.
		var avoid, cross []layout.Box
		for _, l := range lines {
			if lab.across && (l.H > l.W) == (lab.line.H > lab.line.W) {
				avoid = append(avoid, l)
			} else {
				cross = append(cross, l)
			}
		}
		sp, moved, ok := f.placeText(p, avoid, cross, plot, lab.note, lab.near, lab.spots)
		switch {
		case ok && moved && lab.note.leader:
			f.leaderToBox(lab.near, sp.box, lab.note.attrs)
		case !ok && lab.mark < 0:
			return annotationError("Callouts", strconv.Quote(dataAttrOf(lab.note.attrs, "label")), "the note %q finds no free place beside its mark; shorten it or give a larger canvas", lab.note.text)
		case !ok:
			f.hidden(lab.mark, lab.note.text, lab.what)
		}
	}
	return nil
}

// dataAttrOf is the value of the data- attribute name among attrs.
func dataAttrOf(attrs []Attr, name string) string {
	for _, a := range attrs {
		if a.Name == name {
			return a.Value
		}
	}
	return ""
}

// widenFor widens d to hold vs with a note saying what needed it, so
// that an annotation outside the data is drawn rather than lost.
func (f *frame) widenFor(d *axisDomain, what, axisName string, vs ...float64) {
	lo, hi := d.lo, d.hi
	widened := false
	for _, v := range vs {
		widened = d.include(v) || widened
	}
	if !widened {
		return
	}
	var from, to string
	switch {
	case axisName == "x axis":
		from, to = xText(lo, d.kind == domainTime), xText(hi, d.kind == domainTime)
	default:
		t := formatAll(scale.ValueFormat(append([]float64{lo, hi}, vs...), ""), []float64{lo, hi})
		from, to = t[0], t[1]
	}
	f.scene.Note("annotation-domain", false, fmt.Sprintf("widened the %s beyond the data (%s to %s) to show %s", axisName, from, to, what))
}

// xText writes an x value as the x axis would: a date, a year as a year
// (2020, never 2,020), else a number.
func xText(x float64, isTime bool) string {
	k := xKind{time: isTime}
	if !isTime && x == math.Trunc(x) && x >= 1800 && x <= 2100 {
		k.years = true
	}
	return xValueText(x, k)
}

// noScale reports a scale the panel did not set: the chart has no such
// axis (or has not become a panel plan that reports it).
func noScale(l scale.Linear) bool { return l.R0 == l.R1 }

// onPlot checks that pos, where an annotation falls, lies on the plot:
// the grid widened the domain, but a plan may keep a fixed one.
func onPlot(pos, lo, hi float64, option, value string) error {
	if lo > hi {
		lo, hi = hi, lo
	}
	if pos < lo-0.5 || pos > hi+0.5 {
		return annotationError(option, value, "it falls outside this chart's fixed axis; widen the axis to include it")
	}
	return nil
}

// refLine draws a reference line.
type refLine struct{ r Ref }

func (l refLine) widen(f *frame, x, y *axisDomain) {
	// The mean and median lie within the data: only a given value can
	// fall outside it.
	if d := valueAxis(x, y); d != nil && l.r.Stat == "" {
		v := l.r.Value
		f.widenFor(d, "the reference line at "+scale.ValueFormat([]float64{d.lo, d.hi, v}, "").Format(v), "value axis", v)
	}
}

// value is where the line goes: the given value or the statistic of the
// panel's values.
func (l refLine) value(p *placed) (float64, error) {
	if l.r.Stat == "" {
		return l.r.Value, nil
	}
	vs := make([]float64, 0, len(p.values))
	for _, v := range p.values {
		if finite(v) {
			vs = append(vs, v)
		}
	}
	if len(vs) == 0 {
		return 0, annotationError("Refs", strconv.Quote(l.r.Stat), "this chart gives no values to take the %s of; give the line's value instead", l.r.Stat)
	}
	if l.r.Stat == StatMean {
		// Neumaier's compensated sum keeps the mean exact enough to sit
		// on its pixel for any count of values (Neumaier 1974).
		sum, c := 0.0, 0.0
		for _, v := range vs {
			t := sum + v
			if math.Abs(sum) >= math.Abs(v) {
				c += (sum - t) + v
			} else {
				c += (v - t) + sum
			}
			sum = t
		}
		m := (sum + c) / float64(len(vs))
		if !finite(m) {
			// Values near the float64 limit overflow the sum.
			m = 0
			for _, v := range vs {
				m += v / float64(len(vs))
			}
		}
		return m, nil
	}
	slices.Sort(vs)
	n := len(vs)
	if n%2 == 1 {
		return vs[n/2], nil
	}
	return vs[n/2-1]/2 + vs[n/2]/2, nil
}

// mark draws the line and returns its label, to be placed once every
// annotation's line is drawn.
func (l refLine) mark(f *frame, p *placed, plot layout.Box) (*pending, error) {
	v, err := l.value(p)
	if err != nil {
		return nil, err
	}
	ax := p.ys
	if p.horizontal {
		ax = p.xs
	}
	name := numValue(v)
	if l.r.Stat != "" {
		name = strconv.Quote(l.r.Stat)
	}
	if noScale(ax) {
		return nil, annotationError("Refs", name, "this chart has no value axis to draw a reference line on")
	}
	pos := round2(ax.Map(v))
	if err := onPlot(pos, ax.R0, ax.R1, "Refs", name); err != nil {
		return nil, err
	}
	line := []Point{{plot.X, pos}, {plot.X + plot.W, pos}}
	box := layout.Box{X: plot.X, Y: pos - 1, W: plot.W, H: 2}
	if p.horizontal {
		line = []Point{{pos, plot.Y}, {pos, plot.Y + plot.H}}
		box = layout.Box{X: pos - 1, Y: plot.Y, W: 2, H: plot.H}
	}
	attrs := []Attr{{"value", dataNumber(v)}}
	if l.r.Stat != "" {
		attrs = append(attrs, Attr{"stat", l.r.Stat})
	}
	text := l.r.Text
	if text == "" {
		text = p.formatValue(v)
		if l.r.Stat != "" {
			text = l.r.Stat + " " + text
		}
	}
	// As the index base line of a line chart: in the baseline colour,
	// thinner than a bar baseline because no mark starts on it (see
	// "Theme" in DEVELOPERS.md).
	mark := Mark{Kind: Path, Class: "plumb-ref", Lines: [][]Point{line}, Stroke: f.th.baseline, StrokeWidth: 1, Join: JoinRound, Cap: CapRound, Attrs: attrs}
	i := len(f.scene.Marks)
	f.scene.Add(mark)
	gap := f.spec.gap / 2
	spots := func(w, h float64) []spot {
		var s []spot
		if p.horizontal {
			// Beside the line, from the top down, right side first.
			for y := plot.Y; y+h <= plot.Y+plot.H; y += h {
				s = append(s, spot{layout.Box{X: pos + gap, Y: y, W: w, H: h}, Start}, spot{layout.Box{X: pos - gap - w, Y: y, W: w, H: h}, End})
			}
			return s
		}
		// Above the line, then below it, from the right end leftwards:
		// the right end is where a reader arrives along the line.
		for k := range 9 {
			x := plot.X + plot.W - w - float64(k)*(plot.W-w)/8
			s = append(s, spot{layout.Box{X: x, Y: pos - gap - h, W: w, H: h}, End}, spot{layout.Box{X: x, Y: pos + gap, W: w, H: h}, End})
		}
		return s
	}
	return &pending{order: 2, note: noteText{text: text, class: "plumb-ref-label", fill: f.th.muted, attrs: attrs}, near: Point{plot.X + plot.W, pos}, spots: spots, mark: i, what: "reference line", line: box, across: true}, nil
}

// formatValue writes a value as the panel's value axis labels it.
func (p *placed) formatValue(v float64) string {
	if p.valueText != nil {
		return p.valueText(v)
	}
	ax := p.ys
	if p.horizontal {
		ax = p.xs
	}
	return scale.ValueFormat([]float64{v, ax.D0, ax.D1}, "").Format(v)
}

// hidden keeps the text of an annotation that found no free place as the
// tooltip of its mark (the scene's mark i), with a note that counts as a
// change: the reader of a printed figure does not see the label.
func (f *frame) hidden(i int, text, what string) {
	f.scene.Marks[i].Tooltip = text
	f.scene.Note("annotation-hidden", true, fmt.Sprintf("the label of the %s %q found no free place in the plot: it is the tooltip of its mark; give a larger canvas or a shorter label", what, text))
}

// xOf is where an event or a period end falls on the panel's x axis: X on
// a number axis, the instant on a time axis.
func xOf(x float64, at time.Time, isTime bool, option string) (float64, error) {
	if isTime {
		if at.IsZero() {
			return 0, annotationError(option, numValue(x), "the x axis holds dates: give a date")
		}
		return seconds(at), nil
	}
	if !at.IsZero() && x == 0 {
		return 0, annotationError(option, dateText(at), "the x axis holds numbers, not dates: give a number")
	}
	return x, nil
}

// xAxisOf is the x domain's kind as an event or period reads it.
func xAxisOf(x *axisDomain) (isTime, ok bool) {
	switch x.kind {
	case domainTime:
		return true, true
	case domainNumber:
		return false, true
	}
	return false, false
}

// eventLine marks one x.
type eventLine struct{ e Event }

func (l eventLine) widen(f *frame, x, y *axisDomain) {
	if isTime, ok := xAxisOf(x); ok {
		if v, err := xOf(l.e.X, l.e.At, isTime, "Events"); err == nil {
			f.widenFor(x, "the event at "+xText(v, isTime), "x axis", v)
		}
	}
}

// mark draws the event's line and returns its label.
func (l eventLine) mark(f *frame, p *placed, plot layout.Box) (*pending, error) {
	if noScale(p.xs) || p.horizontal || len(p.cats) > 0 {
		return nil, annotationError("Events", l.name(), "events mark an x on a number or time axis; this chart has none (give a reference line instead)")
	}
	x, err := xOf(l.e.X, l.e.At, p.xTime, "Events")
	if err != nil {
		return nil, err
	}
	pos := round2(p.xs.Map(x))
	if err := onPlot(pos, p.xs.R0, p.xs.R1, "Events", l.name()); err != nil {
		return nil, err
	}
	attrs := []Attr{{"x", xData(x, p.xTime)}}
	// In the context colour, below 3:1, so that it never reads as data.
	i := len(f.scene.Marks)
	f.scene.Add(Mark{Kind: Path, Class: "plumb-event", Lines: [][]Point{{{pos, plot.Y}, {pos, plot.Y + plot.H}}}, Stroke: f.th.context, StrokeWidth: 1, Join: JoinRound, Cap: CapRound, Attrs: attrs})
	text := l.e.Text
	if text == "" {
		text = xText(x, p.xTime)
	}
	gap := f.spec.gap / 2
	spots := func(w, h float64) []spot {
		// At the top beside the line, right side first, moving down.
		var s []spot
		for y := plot.Y; y+h <= plot.Y+plot.H; y += h {
			s = append(s, spot{layout.Box{X: pos + gap, Y: y, W: w, H: h}, Start}, spot{layout.Box{X: pos - gap - w, Y: y, W: w, H: h}, End})
		}
		return s
	}
	return &pending{order: 1, note: noteText{text: text, class: "plumb-event-label", fill: f.th.muted, attrs: attrs}, near: Point{pos, plot.Y}, spots: spots, mark: i, what: "event", line: layout.Box{X: pos - 1, Y: plot.Y, W: 2, H: plot.H}, across: true}, nil
}

func (l eventLine) name() string {
	if !l.e.At.IsZero() {
		return dateText(l.e.At)
	}
	return numValue(l.e.X)
}

// periodShade shades a span of x.
type periodShade struct{ p Period }

func (l periodShade) widen(f *frame, x, y *axisDomain) {
	isTime, ok := xAxisOf(x)
	if !ok {
		return
	}
	from, err1 := xOf(l.p.From, l.p.FromAt, isTime, "Periods")
	to, err2 := xOf(l.p.To, l.p.ToAt, isTime, "Periods")
	if err1 == nil && err2 == nil {
		f.widenFor(x, "the period "+l.describe(isTime), "x axis", from, to)
	}
}

func (l periodShade) describe(isTime bool) string {
	if isTime && !l.p.FromAt.IsZero() {
		return xText(seconds(l.p.FromAt), true) + " to " + xText(seconds(l.p.ToAt), true)
	}
	return xText(l.p.From, false) + " to " + xText(l.p.To, false)
}

// The shade of a period: the context colour at 30% over white, lighter
// than the grid, so that grid lines and data stay visible across it.
const periodOpacity = 0.3

// mark inserts the period's shade at the scene's mark at, behind the
// panel's data, and returns its label (nil for a period without text).
func (l periodShade) mark(f *frame, p *placed, plot layout.Box, at int) (*pending, error) {
	name := l.describe(p.xTime)
	if noScale(p.xs) || p.horizontal || len(p.cats) > 0 {
		return nil, annotationError("Periods", name, "periods shade a span of a number or time axis; this chart has none")
	}
	from, err := xOf(l.p.From, l.p.FromAt, p.xTime, "Periods")
	if err != nil {
		return nil, err
	}
	to, err := xOf(l.p.To, l.p.ToAt, p.xTime, "Periods")
	if err != nil {
		return nil, err
	}
	x0, x1 := round2(p.xs.Map(from)), round2(p.xs.Map(to))
	if err := firstError(onPlot(x0, p.xs.R0, p.xs.R1, "Periods", name), onPlot(x1, p.xs.R0, p.xs.R1, "Periods", name)); err != nil {
		return nil, err
	}
	if x0 > x1 {
		x0, x1 = x1, x0
	}
	attrs := []Attr{{"from", xData(from, p.xTime)}, {"to", xData(to, p.xTime)}}
	// Behind everything the panel drew, grid lines included: the shade
	// is context, and the data must read across it.
	shade := Mark{Kind: Rect, Class: "plumb-period", X: x0, Y: plot.Y, W: round2(x1 - x0), H: plot.H, Fill: f.th.context, Opacity: periodOpacity, Attrs: attrs}
	f.scene.Marks = slices.Insert(f.scene.Marks, at, shade)
	if l.p.Text == "" {
		return nil, nil
	}
	gap := f.spec.gap / 2
	spots := func(w, h float64) []spot {
		// Inside the span at its top, then outside it, moving down.
		var s []spot
		for y := plot.Y; y+h <= plot.Y+plot.H; y += h {
			s = append(s, spot{layout.Box{X: x0 + gap, Y: y, W: w, H: h}, Start}, spot{layout.Box{X: x1 - gap - w, Y: y, W: w, H: h}, End},
				spot{layout.Box{X: x1 + gap, Y: y, W: w, H: h}, Start}, spot{layout.Box{X: x0 - gap - w, Y: y, W: w, H: h}, End})
		}
		return s
	}
	return &pending{order: 3, note: noteText{text: l.p.Text, class: "plumb-period-label", fill: f.th.muted, attrs: attrs}, near: Point{x0, plot.Y}, spots: spots, mark: at, what: "period", line: layout.Box{X: x0, Y: plot.Y, W: 0, H: plot.H}, across: true}, nil
}

// calloutNote sets a note beside one category's mark.
type calloutNote struct{ c Callout }

// label returns the callout's note, to be placed beside its category's
// mark once every annotation's line is drawn.
func (l calloutNote) label(f *frame, p *placed) (*pending, error) {
	if len(p.cats) == 0 {
		return nil, annotationError("Callouts", strconv.Quote(l.c.Label), "callouts go beside a category's bar or dot; this chart has no categories")
	}
	var c catPlace
	labels := make([]string, len(p.cats))
	found := false
	for i, k := range p.cats {
		labels[i] = k.label
		if k.label == l.c.Label && !found {
			c, found = k, true
		}
	}
	if !found {
		return nil, annotationError("Callouts", strconv.Quote(l.c.Label), "no category has this label%s", closest(l.c.Label, labels))
	}
	gap := f.spec.gap
	// The point the note belongs to: the mark's end, in the middle of
	// its row or column.
	end := Point{c.end, c.centre}
	if !p.horizontal {
		end = Point{c.centre, c.end}
	}
	// Its own place: beyond the mark's end, or past the mark's own value
	// label there; anywhere else is found by the placer's scan, nearest
	// first, and joined to the mark by a leader. Beyond is away from
	// zero: to the left of a negative bar, under a negative column.
	own := func(b layout.Box) bool { return distance(end, nearestIn(b, end)) <= 2*gap }
	ax := p.ys
	if p.horizontal {
		ax = p.xs
	}
	zero := ax.Map(math.Max(math.Min(ax.D0, ax.D1), math.Min(0, math.Max(ax.D0, ax.D1))))
	if noScale(ax) {
		zero = math.Inf(-1)
		if !p.horizontal {
			zero = math.Inf(1)
		}
	}
	spots := func(w, h float64) []spot {
		var s []spot
		if p.horizontal {
			y := c.centre - h/2
			if c.end >= zero {
				s = append(s, spot{layout.Box{X: c.end + gap, Y: y, W: w, H: h}, Start})
				for _, b := range p.text {
					if own(b) && b.X >= c.end {
						s = append(s, spot{layout.Box{X: b.X + b.W + gap, Y: y, W: w, H: h}, Start})
					}
				}
				return s
			}
			s = append(s, spot{layout.Box{X: c.end - gap - w, Y: y, W: w, H: h}, End})
			for _, b := range p.text {
				if own(b) && b.X+b.W <= c.end {
					s = append(s, spot{layout.Box{X: b.X - gap - w, Y: y, W: w, H: h}, End})
				}
			}
			return s
		}
		x := c.centre - w/2
		if c.end <= zero {
			s = append(s, spot{layout.Box{X: x, Y: c.end - gap - h, W: w, H: h}, Middle})
			for _, b := range p.text {
				if own(b) && b.Y+b.H <= c.end+gap {
					s = append(s, spot{layout.Box{X: x, Y: b.Y - gap - h, W: w, H: h}, Middle})
				}
			}
			return s
		}
		s = append(s, spot{layout.Box{X: x, Y: c.end + gap, W: w, H: h}, Middle})
		for _, b := range p.text {
			if own(b) && b.Y >= c.end-gap {
				s = append(s, spot{layout.Box{X: x, Y: b.Y + b.H + gap, W: w, H: h}, Middle})
			}
		}
		return s
	}
	attrs := []Attr{{"label", l.c.Label}}
	return &pending{order: 0, note: noteText{text: l.c.Text, class: "plumb-callout", fill: f.th.text, attrs: attrs, leader: true}, near: end, spots: spots, mark: -1, what: "callout"}, nil
}

// leaderToBox joins a moved note to the point it belongs to: from the
// point to the nearest point of the note's box, a gap short of it.
func (f *frame) leaderToBox(from Point, b layout.Box, attrs []Attr) {
	to := nearestIn(b, from)
	dx, dy := to.X-from.X, to.Y-from.Y
	d := math.Hypot(dx, dy)
	if d < 2*f.spec.gap {
		return // close enough to read as one without a line
	}
	// Stop short of both ends so that the line touches neither the
	// mark nor the text.
	s := f.spec.gap / 2 / d
	a := Point{round2(from.X + dx*s), round2(from.Y + dy*s)}
	z := Point{round2(to.X - dx*s), round2(to.Y - dy*s)}
	f.leader(a, z, attrs)
}
