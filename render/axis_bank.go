package render

import (
	"fmt"
	"math"
	"strconv"

	"plumb/scale"
)

// minPlotHeight is the shortest plot a line chart draws on its medium:
// 160 px beside 13 px screen text, scaled with the medium's text size
// (about 117 px in print, 345 px on a slide). Below it a banked noisy
// series turns into a strip from which no value can be read (common
// practice). A panel of small multiples may be half as tall: it is read
// against its neighbours, which share its scale.
func minPlotHeight(sp mediumSpec, panel bool) float64 {
	h := 160 * sp.text / 13
	if panel {
		h /= 2
	}
	return math.Round(h)
}

// MinPlotHeight is the shortest plot, in pixels, a line or difference
// chart draws on medium m (see minPlotHeight); a panel of small multiples
// or one of the two panels of a difference chart may be half as tall. An
// unknown medium gives 0.
func MinPlotHeight(m Medium) float64 {
	sp, err := m.spec()
	if err != nil {
		return 0
	}
	return minPlotHeight(sp, false)
}

// trendMinPoints is the length from which a series counts as long enough
// for multi-scale banking: below it every segment is visible on its own
// and banking the segments themselves is right.
const trendMinPoints = 64

// banking is how a panel's height was chosen.
type banking struct {
	method  string  // "" (median absolute slope), "orientation", or "W:H"
	forced  float64 // alpha from "W:H", else 0
	alpha   float64 // the final plot H/W
	banked  float64 // what banking asked for, before any limit
	msAlpha float64 // the median-slope alpha of what was banked, for the angle in notes
	ok      bool    // banking was defined for the data
	// trend is set when the lines were banked at the scale of their trend
	// (multi-scale banking): the shortest period kept, in words, and what
	// the finest scale alone asked for.
	trend    string
	rawAlpha float64
	clamped  bool
	raised   bool    // kept at the medium's minimum height
	minH     float64 // that minimum
	fill     bool    // the plot fills a canvas of fixed size
}

// bankAlpha banks the polylines for the y axis a (Cleveland, McGill &
// McGill 1988: median absolute slope; Cleveland 1993: length-weighted
// orientation), clamped to [MinAspect, MaxAspect].
func (b *banking) bankAlpha(lines []scale.Polyline, rx float64, a axis) float64 {
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

// bank chooses a panel's banked plot height for plot width w: banking
// needs the y domain, whose nice ticks depend on the height, so it
// iterates until the two agree.
func (f *frame) bank(b *banking, lines []scale.Polyline, rx, w, lo, hi float64, k yKind) (float64, axis) {
	h := w * 0.5
	var a axis
	for i := 0; i < 6; i++ {
		a = f.fitY(lo, hi, h, k)
		nh := b.bankAlpha(lines, rx, a) * w
		if math.Abs(nh-h) < 0.5 {
			h = nh
			break
		}
		h = nh
	}
	return h, a
}

// trendLines are the lines at the scale of their dominant trend
// (scale.DominantCycles, scale.LowPassTrend; Heer & Agrawala 2006), all
// cut at the finest of the series' dominant frequencies so that one scale
// is named, and that scale's period in words. ok is false when no line is
// long enough to analyse.
func trendLines(lines []scale.Polyline, isTime bool) ([]scale.Polyline, string, bool) {
	cycles := 0
	span := 0.0
	for _, l := range lines {
		if len(l.X) < trendMinPoints {
			continue
		}
		// A dominant cycle as fast as the points themselves (a series that
		// alternates) is the detail, not a trend below it: a trend needs
		// at least eight points per kept cycle.
		if k, ok := scale.DominantCycles(l.X, l.Y); ok && 2*k*8 <= len(l.X) {
			// The dominant cycle and its first harmonic, so that an uneven
			// cycle (slow rise, quick fall) keeps its shape.
			cycles = max(cycles, 2*k)
			lo, hi, _ := dataRange(l.X)
			span = math.Max(span, hi-lo)
		}
	}
	if cycles == 0 {
		return nil, "", false
	}
	var out []scale.Polyline
	for _, l := range lines {
		if t, ok := scale.LowPassTrend(l.X, l.Y, cycles); ok {
			out = append(out, t)
		} else {
			out = append(out, l)
		}
	}
	return out, periodText(span/float64(cycles), isTime), true
}

// periodText says a period in x units, or in calendar words on a time axis.
func periodText(p float64, isTime bool) string {
	if !isTime {
		return scale.ValueFormat([]float64{p}, "").Format(p) + " on the x axis"
	}
	days := p / 86400
	switch {
	case days >= 730:
		return fmt.Sprintf("%.0f years", days/365.25)
	case days >= 60:
		return fmt.Sprintf("%.0f months", days/30.44)
	case days >= 14:
		return fmt.Sprintf("%.0f weeks", days/7)
	case days >= 2:
		return fmt.Sprintf("%.0f days", days)
	case p >= 7200:
		return fmt.Sprintf("%.0f hours", p/3600)
	}
	return fmt.Sprintf("%.0f minutes", math.Max(1, p/60))
}

// plotHeight chooses a panel's plot height for width w: banked to 45°, at
// the scale of the lines' trend when banking every segment would draw a
// strip shorter than the medium allows (multi-scale banking, Heer &
// Agrawala 2006); never shorter than the medium's minimum; and, when the
// canvas height is fixed (room > 0), exactly the room the frame leaves,
// so that a fixed canvas is filled. It returns the height and the y axis
// fitted to it, and records every decision in b for the note.
func (f *frame) plotHeight(b *banking, lines []scale.Polyline, isTime bool, rx, w, lo, hi float64, k yKind, room float64, panel bool) (float64, axis, error) {
	b.minH = minPlotHeight(f.spec, panel)
	h, ay := f.bank(b, lines, rx, w, lo, hi, k)
	if b.forced == 0 && b.ok && b.banked*w < b.minH {
		if trend, period, ok := trendLines(lines, isTime); ok {
			raw := b.banked
			var tb banking = *b
			th, tay := f.bank(&tb, trend, rx, w, lo, hi, k)
			// The trend's scale is used only when it asks for a clearly
			// taller plot than the detail: otherwise the detail is the trend.
			if tb.ok && tb.banked >= 1.5*raw {
				*b = tb
				b.trend, b.rawAlpha = period, raw
				h, ay = th, tay
			}
		}
	}
	if room > 0 {
		if room < b.minH {
			return 0, axis{}, fmt.Errorf("the figure's fixed height leaves a %.0f px plot, under the %.0f px a line chart needs on this medium to be read: give a taller canvas (%s), or a shorter title and notes, so that it can fit", room, b.minH, f.c.name("Height"))
		}
		if b.forced > 0 {
			h = math.Min(h, room)
		} else {
			h = room
		}
		b.fill = true
	} else if h < b.minH {
		h, b.raised = b.minH, true
	}
	// Whole pixels: the grid lines fall on exact positions, and the plot's
	// bottom edge lines up with the x axis ticks.
	if r := math.Round(h); r != h {
		h = r
		if room > 0 {
			h = math.Min(h, math.Floor(room))
		}
		b.alpha = h / w
		ay = f.fitY(lo, hi, h, k)
	}
	if b.fill || b.raised {
		ay = f.fitY(lo, hi, h, k)
		b.alpha = h / w
	}
	return h, ay, nil
}

// note says how the height was chosen.
func (b *banking) note(w, h float64) string {
	angle := func() string {
		return fmt.Sprintf("the median segment is drawn at %.0f°", medianAngle(b.alpha, b.msAlpha))
	}
	if b.forced > 0 {
		s := fmt.Sprintf("aspect ratio forced as asked: plot %.0f × %.0f px", w, h)
		if b.msAlpha > 0 {
			s += "; " + angle()
		}
		return s
	}
	if !b.ok {
		return fmt.Sprintf("the lines neither rise nor fall: no banking; plot %.0f × %.0f px", w, h)
	}
	how := "banked to 45° by median absolute slope (Cleveland, McGill & McGill 1988)"
	if b.method == "orientation" {
		how = "banked to 45° by length-weighted mean orientation (Cleveland 1993)"
	}
	if b.trend != "" {
		how += fmt.Sprintf(" at the scale of the trend, cycles of %s and longer (multi-scale banking, Heer & Agrawala 2006; every segment alone would ask for a height/width of %s, a strip)", b.trend, strconv.FormatFloat(b.rawAlpha, 'g', 2, 64))
	}
	off := math.Abs(medianAngle(b.alpha, b.msAlpha)-45) >= 2
	switch {
	case b.fill && off:
		return fmt.Sprintf("%s, height/width %.2f; the plot fills the figure's fixed size instead (plot %.0f × %.0f px), so %s", how, b.banked, w, h, angle())
	case b.fill:
		return fmt.Sprintf("%s; the plot fills the figure's fixed size (plot %.0f × %.0f px)", how, w, h)
	case b.raised && off:
		return fmt.Sprintf("%s, height/width %.2f; kept at the medium's minimum plot height of %.0f px (plot %.0f × %.0f px), so %s", how, b.banked, b.minH, w, h, angle())
	case b.clamped && off:
		return fmt.Sprintf("%s, height/width %.2f; kept within %.2f–%.2f (plot %.0f × %.0f px), so %s", how, b.banked, MinAspect, MaxAspect, w, h, angle())
	}
	return fmt.Sprintf("%s: plot %.0f × %.0f px", how, w, h)
}

// medianAngle is the drawn angle, in degrees, of the median segment at
// aspect alpha, given the alpha that would draw it at 45°.
func medianAngle(alpha, ms float64) float64 {
	if !(ms > 0) {
		return 45
	}
	return math.Atan(alpha/ms) * 180 / math.Pi
}
