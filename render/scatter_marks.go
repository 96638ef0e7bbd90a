package render

// The marks of a scatter plot: points, bins, the fitted curve, the key and
// the group labels.

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/palette"
	"plumb/scale"
)

// drawNumberAxes draws the grid of both number axes of a plot, with tick
// labels on its outer edges.
func (f *frame) drawNumberAxes(ax, ay axis, xs, ys scale.Linear, plot layout.Box, e edges) {
	sp := f.spec
	f.draw(ay, axisDraw{vertical: true, pos: ys, from: plot.X, to: plot.X + plot.W, labelAt: plot.X - sp.gap, labels: e.left})
	top := f.xLabelTop(plot.Y + plot.H)
	f.draw(ax, axisDraw{pos: xs, from: plot.Y, to: plot.Y + plot.H, labelAt: top + f.fonts.Face(false).Ascent(sp.text), labels: e.bottom})
}

// drawPoints draws one circle per point, each group in its colour, all
// translucent when there are many.
func (p *scatterPlan) drawPoints(f *frame, plot layout.Box) {
	r := markRadius(f.spec)
	op := opacityFor(len(p.x))
	if op > 0 && p.ownKey {
		f.scene.Note("translucent", false, fmt.Sprintf("drew the %s translucent (opacity %s), so that where they pile up reads darker",
			groupedCount(len(p.x), "point", "points"), strconv.FormatFloat(op, 'f', -1, 64)))
	}
	for i := range p.x {
		g := 0
		if p.group != nil {
			g = p.group[i]
		}
		attrs := []Attr{{"x", dataNumber(p.x[i])}, {"y", dataNumber(p.y[i])}}
		if p.group != nil {
			attrs = append(attrs, Attr{"group", p.names[g]})
		}
		f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark", X: round2(plot.X + p.px[i]), Y: round2(plot.Y + p.py[i]), R: r, Fill: p.colour[g], Opacity: op, Attrs: attrs})
	}
}

// drawBins draws one hexagon per occupied cell, shaded by its count.
func (p *scatterPlan) drawBins(f *frame, plot layout.Box, xs, ys scale.Linear) {
	if p.ownKey {
		f.scene.Note("binned", true, fmt.Sprintf("%s are too many to draw one by one: drew them as %s hexagonal bins %s px across, darker for more points (plumb bins above %s points)",
			groupedCount(len(p.x), "point", "points"), scale.Format{Group: true}.Format(float64(len(p.cells))), strconv.FormatFloat(math.Round(p.hexR*math.Sqrt(3)*10)/10, 'f', -1, 64), scale.Format{Group: true}.Format(BinAbove)))
		f.rampColors("hexagonal bins colour their counts")
	}
	shades := p.bins.shades()
	for _, c := range p.cells {
		cs := stats.HexCorners(plot.X+c.X, plot.Y+c.Y, p.hexR)
		line := make([]Point, 6)
		for i, k := range cs {
			line[i] = Point{round2(k[0]), round2(k[1])}
		}
		f.scene.Add(Mark{Kind: Path, Class: "plumb-bin", Lines: [][]Point{line}, Closed: true, Fill: shades.colour(c.Count),
			Attrs: []Attr{{"count", strconv.Itoa(c.Count)}, {"x", dataNumber(roundPosition(xs.Invert(plot.X + c.X)))}, {"y", dataNumber(roundPosition(ys.Invert(plot.Y + c.Y)))}}})
	}
}

// roundPosition rounds a bin centre's data value to six significant digits:
// it is a position, not a measurement.
func roundPosition(v float64) float64 {
	if v == 0 || !finiteValue(v) {
		return v
	}
	d := math.Pow(10, 5-math.Floor(math.Log10(math.Abs(v))))
	return math.Round(v*d) / d
}

// drawFit draws the trend as one path.
func (p *scatterPlan) drawFit(f *frame, xs, ys scale.Linear) {
	if p.fit == nil {
		return
	}
	line := make([]Point, len(p.fit.x))
	for i := range p.fit.x {
		line[i] = Point{round2(xs.Map(p.fit.x[i])), round2(ys.Map(p.fit.y[i]))}
	}
	label := "least-squares line"
	if p.fit.kind == "loess" {
		label = "LOESS curve"
	}
	f.scene.Add(Mark{Kind: Path, Class: "plumb-fit", Lines: [][]Point{line}, Stroke: f.th.text, StrokeWidth: strokeWidth(f.spec), Join: JoinRound, Cap: CapRound,
		Attrs: []Attr{{"label", label}}})
}

func (p *scatterPlan) describe() (string, string) {
	what := func(name, axis string) string {
		if name != "" {
			return name
		}
		return axis
	}
	xn, yn := what(p.opt.XName, "x"), what(p.opt.YName, "y")
	xlo, xhi, ylo, yhi := p.xlo, p.xhi, p.ylo, p.yhi
	xf, yf := scale.ValueFormat([]float64{xlo, xhi}, ""), scale.ValueFormat([]float64{ylo, yhi}, "")
	var b strings.Builder
	fmt.Fprintf(&b, "Scatter plot of %s against %s, %s", yn, xn, groupedCount(len(p.x), "point", "points"))
	if len(p.names) > 1 {
		fmt.Fprintf(&b, " in %d groups (%s)", len(p.names), strings.Join(p.names, ", "))
	}
	fmt.Fprintf(&b, "; %s from %s to %s, %s from %s to %s.", xn, xf.Format(xlo), xf.Format(xhi), yn, yf.Format(ylo), yf.Format(yhi))
	if p.binned {
		fmt.Fprintf(&b, " Drawn as hexagonal bins; the fullest holds %s.", groupedCount(p.bins.max, "point", "points"))
	}
	if p.fit != nil && p.fit.kind == "line" {
		slope, dir := p.fit.line.Slope, "rises"
		if slope < 0 {
			slope, dir = -slope, "falls"
		}
		fmt.Fprintf(&b, " A least-squares line %s %s per unit of %s; r = %s.", dir, scale.ValueFormat([]float64{slope}, "").Format(slope), xn, fmtFit(p.fit.line.R))
	}
	if p.fit != nil && p.fit.kind == "loess" {
		b.WriteString(" A LOESS curve shows the trend.")
	}
	return b.String(), yn + " against " + xn
}

// keyEntry is one entry of a legend or a colour key: a swatch and its text.
type keyEntry struct {
	colour Colour
	hex    bool   // a hexagon swatch (bins); else a dot (groups)
	text   string // the label
	textC  Colour // the label's colour
	lead   bool   // a heading without a swatch ("points per cell")
}

// flowEntries lays key items out left to right from x, wrapping within width
// right, and draws them at top y when draw is set. It returns the items
// of each line.
func (f *frame) flowEntries(items []keyEntry, right, x, y float64, draw bool) [][]keyEntry {
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	sw := sp.text * 0.8
	var lines [][]keyEntry
	cx, line := x, []keyEntry(nil)
	width := func(it keyEntry) float64 {
		w := f.measure(it.text, sp.text, false)
		if !it.lead {
			w += sw + sp.gap/2
		}
		return w
	}
	if draw {
		f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-legend"})
	}
	for _, it := range items {
		w := width(it)
		if len(line) > 0 && cx+w > right {
			lines = append(lines, line)
			line = nil
			cx = x
			y += lh
		}
		if draw {
			mid := y + lh/2
			tx := cx
			if !it.lead {
				if it.hex {
					cs := stats.HexCorners(cx+sw/2, mid, sw/2)
					pts := make([]Point, 6)
					for i, k := range cs {
						pts[i] = Point{round2(k[0]), round2(k[1])}
					}
					f.scene.Add(Mark{Kind: Path, Class: "plumb-swatch", Lines: [][]Point{pts}, Closed: true, Fill: it.colour})
				} else {
					f.scene.Add(Mark{Kind: Circle, Class: "plumb-swatch", X: round2(cx + sw/2), Y: round2(mid), R: round2(sw / 2.5), Fill: it.colour})
				}
				tx += sw + sp.gap/2
			}
			f.text(round2(tx), round2(mid+(asc-desc)/2), it.text, sp.text, false, it.textC, "plumb-label", Start)
		}
		line = append(line, it)
		cx += w + sp.gap*2
	}
	if len(line) > 0 {
		lines = append(lines, line)
	}
	if draw {
		f.scene.Add(Mark{Kind: GroupEnd})
	}
	return lines
}

// legendItems are the groups as legend entries.
func (p *scatterPlan) legendItems(f *frame) []keyEntry {
	items := make([]keyEntry, len(p.names))
	for i, n := range p.names {
		items[i] = keyEntry{colour: p.colour[i], text: n, textC: groupTextColour(f, p.colour[i])}
	}
	return items
}

// groupTextColour is a group's colour darkened until it reads as text at
// 4.5:1 on white (WCAG 2.x SC 1.4.3), so that a label and its points read
// as one.
func groupTextColour(f *frame, c Colour) Colour {
	if dark, ok := palette.DarkenToContrast(c.SRGB(), palette.SRGB{R: 1, G: 1, B: 1}, palette.MinTextContrast); ok {
		return RGB(dark)
	}
	return f.th.text
}

// binShades is the shading of bins by count, shared by every panel of a
// figure so that one shade means one count everywhere.
type binShades struct {
	max int // the fullest cell of any panel
}

// binShading maps counts to the colours of a sequential ramp.
type binShading struct {
	lows    []int // the smallest count of each class, rising
	colours []Colour
}

// maxBinClasses is the most classes a bin shading uses: six shades of one
// hue stay distinguishable side by side (common practice).
const maxBinClasses = 6

// shades divides counts 1..max into classes of equal width on a log
// scale, because cell counts are skewed (a few full cells, many nearly
// empty): equal-width classes would put nearly every cell in the palest.
// The colours are a sequential ramp's darker classes: its palest is too
// close to white for a single point's cell to show.
func (b *binShades) shades() binShading {
	return shadesFor(b.max)
}

func shadesFor(maxCount int) binShading {
	maxCount = max(1, maxCount)
	k := min(maxBinClasses, maxCount)
	lows := []int{1}
	for i := 1; i < k; i++ {
		v := int(math.Round(math.Pow(float64(maxCount), float64(i)/float64(k))))
		if v > lows[len(lows)-1] {
			lows = append(lows, v)
		}
	}
	k = len(lows)
	ramp, err := palette.Sequential(palette.SequentialHues()[0], max(palette.MinRamp, k+1))
	s := binShading{lows: lows, colours: make([]Colour, k)}
	for i := range s.colours {
		if err != nil {
			s.colours[i] = Colour{A: 255}
			continue
		}
		s.colours[i] = RGB(ramp[len(ramp)-k+i])
	}
	return s
}

func (s binShading) colour(count int) Colour {
	i := 0
	for i+1 < len(s.lows) && count >= s.lows[i+1] {
		i++
	}
	return s.colours[i]
}

// keyItems are the shading's classes as key entries, headed by what the
// shades count, for counts up to maxCount.
func (b *binShades) keyItems(f *frame, maxCount int) []keyEntry {
	s := shadesFor(maxCount)
	items := []keyEntry{{lead: true, text: "Points per bin:", textC: f.th.muted}}
	g := scale.Format{Group: true}
	for i, lo := range s.lows {
		hi := maxCount
		if i+1 < len(s.lows) {
			hi = s.lows[i+1] - 1
		}
		t := g.Format(float64(lo))
		if hi > lo {
			t += "–" + g.Format(float64(hi))
		}
		items = append(items, keyEntry{colour: s.colours[i], hex: true, text: t, textC: f.th.muted})
	}
	return items
}

// placeGroupLabels looks for a place for each group's name near its
// centroid where it covers few points, none of another group if it can,
// and no other name; it reports whether every group got one that is
// unambiguous: the points nearest the label are its own group's.
func (p *scatterPlan) placeGroupLabels(f *frame) bool {
	sp := f.spec
	face := f.fonts.Face(false)
	th := face.Ascent(sp.text) + face.Descent(sp.text)
	r := markRadius(sp)
	n := len(p.names)
	cx, cy, cnt := make([]float64, n), make([]float64, n), make([]int, n)
	for i := range p.px {
		g := p.group[i]
		cx[g] += p.px[i]
		cy[g] += p.py[i]
		cnt[g]++
	}
	p.labelPos = make([]layout.Box, n)
	plot := layout.Box{W: p.w, H: p.h}
	step := th + r
	for g := range n {
		cx[g] /= float64(cnt[g])
		cy[g] /= float64(cnt[g])
		w := f.measure(p.names[g], sp.text, false)
		best, bestCost := layout.Box{}, math.Inf(1)
		for _, d := range labelOffsets {
			b := layout.Box{X: cx[g] + d[0]*(w/2+step) - w/2, Y: cy[g] + d[1]*step - th/2, W: w, H: th}
			if !b.Inside(plot) {
				continue
			}
			clash := false
			for _, o := range p.labelPos[:g] {
				if b.Overlaps(o) {
					clash = true
				}
			}
			if clash {
				continue
			}
			own, other := p.covered(b, g, r)
			cost := float64(other)*4 + float64(own) + math.Hypot(d[0], d[1])*0.5
			if cost < bestCost {
				best, bestCost = b, cost
			}
		}
		if math.IsInf(bestCost, 1) {
			return false
		}
		_, other := p.covered(best, g, r)
		if other > max(1, len(p.px)/100) || p.nearestGroup(best) != g {
			return false
		}
		p.labelPos[g] = best
	}
	return true
}

// labelOffsets are where a group's label is tried, in units of its half
// width (x) and a line (y) from the centroid: on it, then above, below,
// beside, and further out.
var labelOffsets = [][2]float64{{0, 0}, {0, -1}, {0, 1}, {-1, 0}, {1, 0}, {-1, -1}, {1, -1}, {-1, 1}, {1, 1}, {0, -2}, {0, 2}, {-2, 0}, {2, 0}}

// covered counts the points of group g and of other groups whose marks
// touch box b.
func (p *scatterPlan) covered(b layout.Box, g int, r float64) (own, other int) {
	for i := range p.px {
		if p.px[i]+r < b.X || p.px[i]-r > b.X+b.W || p.py[i]+r < b.Y || p.py[i]-r > b.Y+b.H {
			continue
		}
		if p.group[i] == g {
			own++
		} else {
			other++
		}
	}
	return own, other
}

// nearestGroup is the group with the most points among the ten nearest
// the label's centre: a label reads as naming the points around it.
func (p *scatterPlan) nearestGroup(b layout.Box) int {
	mx, my := b.X+b.W/2, b.Y+b.H/2
	order := make([]int, len(p.px))
	d := make([]float64, len(p.px))
	for i := range p.px {
		order[i] = i
		d[i] = math.Hypot(p.px[i]-mx, p.py[i]-my)
	}
	slices.SortStableFunc(order, func(a, b int) int { return cmp.Compare(d[a], d[b]) })
	votes := make([]int, len(p.names))
	for _, i := range order[:min(10, len(order))] {
		votes[p.group[i]]++
	}
	top := 0
	for g, v := range votes {
		if v > votes[top] {
			top = g
		}
	}
	return top
}

// drawGroupLabels names each group at the place found for it, in its
// colour darkened to text contrast. On a plot of another size than the
// one measured, places are found again; a name that then finds none is
// left to the description.
func (p *scatterPlan) drawGroupLabels(f *frame, plot layout.Box) {
	if len(p.labelPos) != len(p.names) || !p.placeGroupLabels(f) {
		// The plot came out another size than measured and the names
		// no longer fit beside their points: the legend had no room,
		// so say so rather than draw names over other groups.
		f.scene.Note("unlabelled", false, "the groups could not be named beside their points at this size; give a larger canvas")
		return
	}
	sp := f.spec
	asc := f.fonts.Face(false).Ascent(sp.text)
	for g, b := range p.labelPos {
		f.text(round2(plot.X+b.X+b.W/2), round2(plot.Y+b.Y+asc), p.names[g], sp.text, false, groupTextColour(f, p.colour[g]), "plumb-label", Middle)
	}
}
