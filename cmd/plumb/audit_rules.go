package main

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"

	"plumb/palette"
	"plumb/render"
	"plumb/scale"
)

// The rules of plumb audit. Each has a stable name of ours, which the
// README lists with a before/after pair; check measures one panel and
// returns its findings with the severity, measured value, threshold,
// message and suggestion set (auditFile adds the rule, file and panel).

// auditRule is one rule: its stable name and its check.
type auditRule struct {
	name  string
	check func(p *auditPanel) []finding
}

// auditRules are every rule, in the order findings are reported.
var auditRules = []auditRule{
	{"aspect-not-banked", checkAspect},
	{"colour-collision", func(p *auditPanel) []finding { return checkCollision(panelColours(p)) }},
	{"mark-contrast", func(p *auditPanel) []finding { return checkMarkContrast(panelColours(p)) }},
	{"text-contrast", func(p *auditPanel) []finding { return checkTextContrast(p.marks) }},
	{"text-too-small", checkTextSize},
	{"too-many-series", checkSeriesCount},
	{"too-many-categories", checkCategories},
	{"magnitudes-apart", checkMagnitudes},
	{"narrow-domain", checkNarrow},
	{"honest-default-overridden", checkOverrides},
}

// Thresholds of the rules.
const (
	// auditAspectTolerance is how far, in degrees, the median orientation
	// of the drawn segments may stray from the 45° that banking aims at
	// (Cleveland, McGill & McGill 1988) before the shape is reported: 15°
	// either way is a plot √3 ≈ 1.7 times too tall or too flat (tan 30° =
	// 0.577, tan 60° = 1.73), a difference readers' slope judgements feel
	// (common practice).
	auditAspectTolerance = 15.0
	// auditMaxSeries is the most series one plot should carry, the
	// number plumb lines keeps on one panel (render.MaxTogether).
	auditMaxSeries = render.MaxTogether
	// auditMaxCategories is the most categories a reader goes through
	// without --top: twice plumb's own DefaultTop (common practice: about
	// two dozen labelled rows are still read one by one).
	auditMaxCategories = 2 * render.DefaultTop
	// auditMaxMagnitude is the ratio of typical magnitudes of two series
	// on one axis beyond which the smaller is flattened into its baseline:
	// an order of magnitude (common practice).
	auditMaxMagnitude = 10.0
	// auditMinSpan is the smallest change, in percent of the values'
	// size, that may fill a line or dot plot's whole value axis (common
	// practice: "a few percent" look like a collapse or a boom).
	auditMinSpan = 5.0
)

// white is the background every chart is drawn on (render/theme.go).
var white = palette.SRGB{R: 1, G: 1, B: 1}

// seen is a colour as drawn over white: a mark's colour composited with
// its opacity, so that a faint mark is judged as faint.
func seen(c render.Colour, opacity float64) palette.SRGB {
	s := c.SRGB()
	a := float64(c.A) / 255
	if opacity > 0 {
		a *= opacity
	}
	mix := func(v float64) float64 { return v*a + (1 - a) }
	return palette.SRGB{R: mix(s.R), G: mix(s.G), B: mix(s.B)}
}

// dataColours are the distinct colours of a panel's data marks
// (plumb-mark: bars, dots, lines, areas) as seen over white, in drawing
// order: a line's stroke, a bar's or dot's fill.
func dataColours(marks []render.Mark) []palette.SRGB {
	var out []palette.SRGB
	add := func(c render.Colour, op float64) {
		if c.IsNone() {
			return
		}
		s := seen(c, op)
		if !slices.Contains(out, s) {
			out = append(out, s)
		}
	}
	for _, m := range marks {
		if m.Class != "plumb-mark" {
			continue
		}
		if m.Kind == render.Path && !m.Closed {
			add(m.Stroke, m.Opacity)
			continue
		}
		add(m.Fill, m.Opacity)
	}
	return out
}

// panelColours are the colours of a panel that tell series or
// categories apart. A heat map's cells and a map's regions encode values
// on a ramp whose lightest step is light by design (the ramps are
// checked where they are made, in palette), so they have none; a
// scatter plot's translucent points build up where they overlap, so its
// colours are judged at full strength.
func panelColours(p *auditPanel) []palette.SRGB {
	switch p.chart {
	case "heat", "map":
		return nil
	case "scatter":
		marks := slices.Clone(p.marks)
		for i := range marks {
			marks[i].Opacity = 0
		}
		return dataColours(marks)
	}
	return dataColours(p.marks)
}

// checkCollision reports the pair of data colours that is closest under
// any vision when it is closer than palette.MinPairDistance (CIEDE2000,
// Machado et al. 2009 simulation at full severity, as plumb palette check).
func checkCollision(colours []palette.SRGB) []finding {
	if len(colours) < 2 {
		return nil
	}
	r := palette.Check(colours, white)
	worst, wv, wi := math.Inf(1), palette.Normal, -1
	bad := 0
	for i, pr := range r.Pairs {
		d, v := pr.Min()
		if d < palette.MinPairDistance {
			bad++
		}
		if d < worst {
			worst, wv, wi = d, v, i
		}
	}
	if bad == 0 {
		return nil
	}
	pr := r.Pairs[wi]
	who := "readers with " + wv.String() + " colour vision"
	if wv == palette.Normal {
		who = "every reader"
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(worst),
		Threshold:  num(palette.MinPairDistance),
		Message:    fmt.Sprintf("%d %s of data colours cannot be told apart; the closest, %s and %s, are %.1f apart (CIEDE2000) for %s", bad, plural(bad, "pair", "pairs"), pr.A.Hex(), pr.B.Hex(), worst, who),
		Suggestion: "use plumb's categorical palette (leave the colours to plumb), check your own with plumb palette check, or label the series directly and draw fewer of them",
	}}
}

// checkMarkContrast reports the data colour with the least contrast on
// white when it is under WCAG 2.x non-text contrast, 3:1 (SC 1.4.11).
func checkMarkContrast(colours []palette.SRGB) []finding {
	lo, which := math.Inf(1), palette.SRGB{}
	for _, c := range colours {
		if r := palette.Contrast(c, white); r < lo {
			lo, which = r, c
		}
	}
	if lo >= palette.MinMarkContrast {
		return nil
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(lo),
		Threshold:  num(palette.MinMarkContrast),
		Message:    fmt.Sprintf("data marks in %s have contrast %.2f:1 on white, too faint to find and compare", which.Hex(), lo),
		Suggestion: "use a darker colour (plumb palette check names the ones that pass), or plumb's own colours",
	}}
}

// checkTextContrast reports the text with the least contrast on white
// when it is under WCAG 2.x contrast minimum for text, 4.5:1 (SC 1.4.3).
func checkTextContrast(marks []render.Mark) []finding {
	lo, which, text := math.Inf(1), palette.SRGB{}, ""
	for _, m := range marks {
		if m.Kind != render.Text || m.Fill.IsNone() || strings.TrimSpace(m.Text) == "" {
			continue
		}
		c := seen(m.Fill, m.Opacity)
		if r := palette.Contrast(c, white); r < lo {
			lo, which, text = r, c, m.Text
		}
	}
	if lo >= palette.MinTextContrast {
		return nil
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(lo),
		Threshold:  num(palette.MinTextContrast),
		Message:    fmt.Sprintf("text %q in %s has contrast %.2f:1 on white, hard to read", shorten(text, 30), which.Hex(), lo),
		Suggestion: "set text in a darker colour; plumb's own text colours reach 4.5:1",
	}}
}

// shorten cuts s to at most n characters for a message.
func shorten(s string, n int) string {
	r := []rune(s)
	if len(r) <= n {
		return s
	}
	return string(r[:n-1]) + "…"
}

// checkTextSize reports the smallest text under the medium's floor.
func checkTextSize(p *auditPanel) []finding {
	floor, err := p.medium.TextFloor()
	if err != nil {
		return nil
	}
	lo, text := math.Inf(1), ""
	for _, m := range p.marks {
		if m.Kind == render.Text && strings.TrimSpace(m.Text) != "" && m.Size < lo {
			lo, text = m.Size, m.Text
		}
	}
	// A size within rounding of the floor meets it: sizes are written
	// to two decimals.
	if lo >= floor-0.005 {
		return nil
	}
	medium := p.medium
	if medium == "" {
		medium = render.Screen
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(lo),
		Threshold:  num(floor),
		Message:    fmt.Sprintf("text %q is set at %.2f px, under the %.2f px floor of %s", shorten(text, 30), lo, floor, medium),
		Suggestion: "give the panel fewer or shorter labels, or a larger canvas, so that text stays at the floor",
	}}
}

// checkSeriesCount reports a plot that carries more than four series: the
// distinct series names of its data marks in one innermost group, so
// that small multiples (one series per plot) are not counted together.
func checkSeriesCount(p *auditPanel) []finding {
	most := 0
	for _, plot := range p.plots {
		var names []string
		for _, m := range plot {
			if m.Class != "plumb-mark" {
				continue
			}
			if s, ok := attr(m, "series"); ok && !slices.Contains(names, s) {
				names = append(names, s)
			}
		}
		most = max(most, len(names))
	}
	if most <= auditMaxSeries {
		return nil
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(float64(most)),
		Threshold:  num(auditMaxSeries),
		Message:    fmt.Sprintf("%d series share one plot; past %d lines tangle and their colours can no longer be told apart", most, auditMaxSeries),
		Suggestion: "draw the few series that matter and leave the rest out, or draw them as small multiples (plumb lines --series without --together) or one panel each",
	}}
}

// checkCategories reports a bar or dot panel with more categories than a
// reader goes through.
func checkCategories(p *auditPanel) []finding {
	// A histogram's bins and the like are not categories to read one by
	// one: only bar and dot panels are counted.
	if p.chart != "bars" && p.chart != "dots" {
		return nil
	}
	n := len(p.labels)
	if n <= auditMaxCategories {
		return nil
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(float64(n)),
		Threshold:  num(auditMaxCategories),
		Message:    fmt.Sprintf("%d categories are drawn; past %d a reader no longer reads them one by one", n, auditMaxCategories),
		Suggestion: fmt.Sprintf("give \"top\": %d to keep the largest (the rest left out with a note, or combined into Other with \"other\")", render.DefaultTop),
	}}
}

// magnitude is a series' typical size: the median of its finite absolute
// values; 0 when it has none that is not zero.
func magnitude(ys []float64) float64 {
	var a []float64
	for _, y := range ys {
		if !math.IsNaN(y) && !math.IsInf(y, 0) && y != 0 {
			a = append(a, math.Abs(y))
		}
	}
	if len(a) == 0 {
		return 0
	}
	sort.Float64s(a)
	if len(a)%2 == 1 {
		return a[len(a)/2]
	}
	return (a[len(a)/2-1] + a[len(a)/2]) / 2
}

// checkMagnitudes reports series on one value axis whose typical sizes
// differ by more than ten times: the small one is drawn flat. An indexed
// chart has rebased them and is not checked.
func checkMagnitudes(p *auditPanel) []finding {
	if len(p.series) < 2 || p.given("index") || p.given("index-at") {
		return nil
	}
	lo, hi := math.Inf(1), 0.0
	var loName, hiName string
	for _, s := range p.series {
		m := magnitude(s.Y)
		if m == 0 {
			continue
		}
		if m < lo {
			lo, loName = m, s.Name
		}
		if m > hi {
			hi, hiName = m, s.Name
		}
	}
	if hi == 0 || hi/lo <= auditMaxMagnitude {
		return nil
	}
	suggest := "draw the series as panels of their own"
	if p.chart == "lines" {
		suggest = "give \"index\": true to compare their change, or draw the series as panels of their own"
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(hi / lo),
		Threshold:  num(auditMaxMagnitude),
		Message:    fmt.Sprintf("%q is typically %.3g and %q %.3g, %.1f times apart on one axis: the smaller is drawn flat", hiName, hi, loName, lo, hi/lo),
		Suggestion: suggest,
	}}
}

// checkNarrow reports a line or dot panel whose values vary by only a few
// percent of their size, which the value axis then stretches over its
// whole length: the span of the domain drawn (the data, and for dots the
// from and to given) as a percentage of its largest absolute end.
func checkNarrow(p *auditPanel) []finding {
	var vals []float64
	switch p.chart {
	case "lines":
		for _, s := range p.series {
			vals = append(vals, s.Y...)
		}
	case "dots":
		vals = slices.Clone(p.values)
		for _, k := range []string{"from", "to"} {
			if v, ok := p.keys[k]; ok {
				if x, err := strconv.ParseFloat(v, 64); err == nil {
					vals = append(vals, x)
				}
			}
		}
	default:
		return nil
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range vals {
		if !math.IsNaN(v) && !math.IsInf(v, 0) {
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
	}
	size := math.Max(math.Abs(lo), math.Abs(hi))
	if !(hi > lo) || size == 0 {
		return nil
	}
	pct := (hi - lo) / size * 100
	if pct >= auditMinSpan {
		return nil
	}
	suggest := "show context: give \"from\" and \"to\" so that the axis holds a meaningful range (zero, or the usual range of the measure), or say the narrow scale in the title"
	if p.chart == "lines" {
		suggest = "show context: draw the change itself (plumb diff against a baseline), or say the narrow scale in the title and subtitle"
	}
	return []finding{{
		Severity:   sevWarning,
		Measured:   num(pct),
		Threshold:  num(auditMinSpan),
		Message:    fmt.Sprintf("the values run from %.4g to %.4g, a change of %.2f%% of their size, yet fill the whole value axis", lo, hi, pct),
		Suggestion: suggest,
	}}
}

// checkOverrides reports keys that override a default plumb chose to keep
// the chart honest.
func checkOverrides(p *auditPanel) []finding {
	var out []finding
	if p.chart == "bars" {
		for _, k := range []string{"from", "to"} {
			if v, ok := p.keys[k]; ok {
				out = append(out, finding{
					Severity:   sevWarning,
					Message:    fmt.Sprintf("\"%s\": %s moves the end of the bars' axis that plumb fits to the data from zero, which shrinks every difference between the bars", k, v),
					Suggestion: fmt.Sprintf("remove \"%s\"; to compare with a target, draw it as a reference line instead", k),
				})
			}
		}
		agg := p.keys["agg"]
		averages := agg == "mean" || agg == "median" || agg == "min" || agg == "max"
		if p.keys["other"] == "sum" && (averages || strings.Contains(p.keys["unit"], "%")) {
			why := "the values are " + agg + "s"
			if !averages {
				why = "the values are percentages"
			}
			out = append(out, finding{
				Severity:   sevError,
				Message:    fmt.Sprintf("\"other\": \"sum\" adds up the categories left over, but %s, which do not add up: the Other bar is a number no one measured", why),
				Suggestion: "give \"other\": \"mean\", or \"none\" to leave them out with a note",
			})
		}
	}
	if p.chart == "lines" && p.given("aspect") && p.keys["aspect"] != "orientation" {
		f := finding{
			Severity:   sevWarning,
			Message:    fmt.Sprintf("\"aspect\": %q fixes the plot's shape instead of banking its lines to 45°, so slopes look steeper or flatter than they are", p.keys["aspect"]),
			Suggestion: "remove \"aspect\" and let plumb bank the lines (see aspect-not-banked for the shape it would choose)",
		}
		// The angle it draws at, against the 45° banking aims at.
		if med, _, _, _, ok := orientation(p); ok {
			f.Measured, f.Threshold = num(med), num(45)
			f.Message += fmt.Sprintf("; its segments are drawn at a median %.1f°", med)
		}
		out = append(out, f)
	}
	return out
}

// checkAspect measures the median absolute orientation, as drawn, of the
// segments of a panel's lines (stroked open plumb-mark paths) against
// the 45° banking aims at, and gives the banked shape. Flat and vertical
// segments are left out, as scale.BankMedianSlope leaves them out, so
// that the measured angle and the banked shape agree.
func checkAspect(p *auditPanel) []finding {
	med, grow, w, h, ok := orientation(p)
	if !ok {
		return nil
	}
	dev := math.Abs(med - 45)
	if dev <= auditAspectTolerance {
		return nil
	}
	shape := ""
	if grow > 0 && w > 0 && h > 0 {
		shape = fmt.Sprintf("; the plot is drawn about %s, banked to 45° it would be about %s", ratio(w/h), ratio(w/(h*grow)))
	}
	// plumb banks a line panel within its limits (a plot's minimum
	// height, the canvas, a grid's shared row height): a shape it chose is
	// worth knowing, a shape forced on it is a warning.
	sev := sevInfo
	forced := "plumb could not bank it within the canvas, the medium's limits and the figure's grid"
	suggest := "give the line chart a figure of its own, or place it beside panels of a similar shape (\"columns\"), so that it can be banked"
	if p.given("aspect") || p.sized {
		sev = sevWarning
		forced = "the shape was fixed by \"aspect\" or the figure's \"size\""
		suggest = "remove \"aspect\" (and \"size\", or give the height 0) so that plumb banks the lines to 45°"
	}
	way, bound := "flat", 45-auditAspectTolerance
	if med > 45 {
		way, bound = "steep", 45+auditAspectTolerance
	}
	return []finding{{
		Severity:   sev,
		Measured:   num(med),
		Threshold:  num(bound),
		Message:    fmt.Sprintf("the lines' segments are drawn at a median %.1f° instead of about 45°, so their changes look too %s; %s%s", med, way, forced, shape),
		Suggestion: suggest,
	}}
}

// ratio writes a width/height ratio as W:1 or 1:H.
func ratio(r float64) string {
	if r >= 1 {
		return fmt.Sprintf("%.1f:1", r)
	}
	return fmt.Sprintf("1:%.1f", 1/r)
}

// orientation measures a panel's lines (stroked open plumb-mark paths
// with a series) as drawn: the median absolute orientation of their
// segments in degrees, the factor BankMedianSlope would multiply the
// plot's height by, and the drawn extent of the plot (grid, baseline and
// lines). ok is false for a panel without two sloped segments.
func orientation(p *auditPanel) (med, grow, w, h float64, ok bool) {
	var lines []scale.Polyline
	var angles []float64
	x0, x1, y0, y1 := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, m := range p.marks {
		if m.Kind != render.Path || m.Closed || m.Stroke.IsNone() {
			continue
		}
		if m.Class == "plumb-grid" || m.Class == "plumb-baseline" {
			for _, l := range m.Lines {
				for _, pt := range l {
					x0, x1, y0, y1 = math.Min(x0, pt.X), math.Max(x1, pt.X), math.Min(y0, pt.Y), math.Max(y1, pt.Y)
				}
			}
			continue
		}
		if m.Class != "plumb-mark" {
			continue
		}
		if _, ok := attr(m, "series"); !ok {
			continue
		}
		for _, l := range m.Lines {
			var pl scale.Polyline
			for i, pt := range l {
				x0, x1, y0, y1 = math.Min(x0, pt.X), math.Max(x1, pt.X), math.Min(y0, pt.Y), math.Max(y1, pt.Y)
				pl.X, pl.Y = append(pl.X, pt.X), append(pl.Y, pt.Y)
				if i == 0 {
					continue
				}
				dx, dy := math.Abs(pt.X-l[i-1].X), math.Abs(pt.Y-l[i-1].Y)
				if dx > 0 && dy > 0 {
					angles = append(angles, math.Atan(dy/dx)*180/math.Pi)
				}
			}
			lines = append(lines, pl)
		}
	}
	if len(angles) < 2 {
		return 0, 0, 0, 0, false
	}
	sort.Float64s(angles)
	med = angles[len(angles)/2]
	if len(angles)%2 == 0 {
		med = (angles[len(angles)/2-1] + med) / 2
	}
	// In pixels both extents are 1: BankMedianSlope's alpha is then the
	// factor the plot's height must be multiplied by to bank to 45°.
	grow, _ = scale.BankMedianSlope(lines, 1, 1)
	return med, grow, x1 - x0, y1 - y0, true
}
