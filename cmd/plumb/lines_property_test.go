package main

import (
	"bytes"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"plumb/layout"
	"plumb/render"
)

// mediumText is each medium's text size (render's type scale), to scale
// the tick floor with the medium as the builder does.
var mediumText = map[render.Medium]float64{render.Screen: 13, render.Print: 9.5, render.Slide: 28}

// mediumPad is each medium's outer margin, which the frame keeps empty on
// purpose: a fixed canvas is measured for blank space inside it.
var mediumPad = map[render.Medium]float64{render.Screen: 12, render.Print: 6, render.Slide: 48}

// randomLines draws a random line or difference chart: 1 to 6 series of
// 5 to 3,000 points, noisy or smooth, numbers, whole numbers or instants,
// with gaps, on a random medium and sometimes a fixed --size. It returns
// the SVG, or nil when the builder declined (a figure too small, which it
// must say).
func randomLines(t *testing.T, rng *rand.Rand, diff bool) ([]byte, render.Common) {
	t.Helper()
	media := []render.Medium{render.Screen, render.Print, render.Slide}
	n := 5 + rng.IntN(3000)
	if rng.IntN(2) == 0 {
		n = 5 + rng.IntN(60)
	}
	k := 1 + rng.IntN(6)
	if diff {
		k = 2
	}
	xs := make([]float64, n)
	step := []float64{1, 3600, 86400, 0.37}[rng.IntN(4)]
	start := []float64{0, 2004, 1.4e9, -50}[rng.IntN(4)]
	for i := range xs {
		xs[i] = start + float64(i)*step
	}
	noise := []float64{0, 0.3, 3}[rng.IntN(3)]
	gaps := []float64{0, 0.02, 0.4}[rng.IntN(3)]
	series := make([]render.Series, k)
	for s := range series {
		y := make([]float64, n)
		level := rng.NormFloat64() * 100
		for i := range y {
			y[i] = level + 20*math.Sin(float64(i)/float64(n)*2*math.Pi*float64(1+s)) + noise*rng.NormFloat64()*10
			if rng.Float64() < gaps {
				y[i] = math.NaN()
			}
		}
		series[s] = render.Series{Name: fmt.Sprintf("series %d", s), X: xs, Y: y}
	}
	c := render.Common{Medium: media[rng.IntN(len(media))], Title: "A random chart"}
	if rng.IntN(3) == 0 {
		c.Width, c.Height = float64(400+rng.IntN(1400)), float64(300+rng.IntN(900))
	}
	isTime := step >= 3600 && start > 1e9
	var svg bytes.Buffer
	var err error
	if diff {
		_, err = render.Diff(&svg, render.Series{Name: "north route", X: xs, Y: series[0].Y}, render.Series{Name: "south route", X: xs, Y: series[1].Y}, render.DiffOptions{Common: c, Time: isTime, Context: rng.IntN(2) == 0})
	} else {
		_, err = render.Lines(&svg, series, render.LinesOptions{Common: c, Time: isTime, Index: rng.IntN(5) == 0 && gaps == 0})
	}
	if err != nil {
		msg := err.Error()
		if !strings.Contains(msg, "fit") && !strings.Contains(msg, "narrow") && !strings.Contains(msg, "taller") && !strings.Contains(msg, "index") && !strings.Contains(msg, "subtract") {
			t.Errorf("declined without saying the figure is too small: %v", err)
		}
		return nil, c
	}
	return svg.Bytes(), c
}

// extent is the bounding box of everything drawn: text, paths, shapes.
func extent(t *testing.T, root *svgNode) layout.Box {
	lo, hi := [2]float64{math.Inf(1), math.Inf(1)}, [2]float64{math.Inf(-1), math.Inf(-1)}
	add := func(x, y float64) {
		lo[0], lo[1] = math.Min(lo[0], x), math.Min(lo[1], y)
		hi[0], hi[1] = math.Max(hi[0], x), math.Max(hi[1], y)
	}
	boxes, _ := textBoxes(t, root)
	for _, b := range boxes {
		add(b.X, b.Y)
		add(b.X+b.W, b.Y+b.H)
	}
	for _, p := range root.all("path", "") {
		xs, ys := pathPoints(t, p.Attr["d"])
		for i := range xs {
			add(xs[i]+p.DX, ys[i]+p.DY)
		}
	}
	return layout.Box{X: lo[0], Y: lo[1], W: hi[0] - lo[0], H: hi[1] - lo[1]}
}

// panelGrids groups the grid lines by panel (their translate).
func panelGrids(t *testing.T, root *svgNode) map[[2]float64][][2]float64 {
	out := map[[2]float64][][2]float64{}
	for _, g := range root.all("path", "plumb-grid") {
		xs, ys := pathPoints(t, g.Attr["d"])
		key := [2]float64{g.DX, g.DY}
		out[key] = append(out[key], [2]float64{xs[1] - xs[0], ys[0]})
	}
	return out
}

// TestLinesHonestProperty draws hundreds of random line and difference
// charts and checks the properties on each SVG: a fixed canvas is
// never more than a quarter blank inside the medium's margins; no plot is shorter than its medium's
// minimum (half of it for a panel among several); an axis longer than
// 150 px (at screen text size) carries at least three labelled ticks; and
// in a difference chart no text box meets a data path.
func TestLinesHonestProperty(t *testing.T) {
	rng := rand.New(rand.NewPCG(17, 19))
	for trial := range 240 {
		diff := trial%3 == 2
		svg, c := randomLines(t, rng, diff)
		if svg == nil {
			continue
		}
		root := checkFigure(t, svg)
		w, h := root.num(t, "width"), root.num(t, "height")
		name := fmt.Sprintf("trial %d (%s, size %gx%g, diff %v)", trial, c.Medium, c.Width, c.Height, diff)
		fixed := c.Medium == render.Slide || c.Height > 0
		if fixed {
			want := c.Height
			if want == 0 {
				want = 1080 // the slide's canvas
			}
			if h != want {
				t.Errorf("%s: a fixed %g px canvas came out %g px high", name, want, h)
			}
			e := extent(t, root)
			pad := mediumPad[c.Medium]
			if blank := 1 - e.W*e.H/((w-2*pad)*(h-2*pad)); blank > 0.25 {
				t.Errorf("%s: %.0f%% of the fixed %gx%g canvas is blank inside its margins (drawn extent %+v)", name, 100*blank, w, h, e)
			}
		}
		grids := panelGrids(t, root)
		minH := render.MinPlotHeight(c.Medium)
		if len(grids) > 1 {
			minH /= 2
		}
		k := mediumText[c.Medium] / 13
		for key, lines := range grids {
			top, bottom := math.Inf(1), math.Inf(-1)
			for _, l := range lines {
				top, bottom = math.Min(top, l[1]), math.Max(bottom, l[1])
			}
			if bottom-top < minH-0.5 {
				t.Errorf("%s: panel at %v is %.1f px high, under the medium's %.0f px", name, key, bottom-top, minH)
			}
			if bottom-top > 150*k && len(lines) < 3 {
				t.Errorf("%s: a %.0f px y axis with %d ticks", name, bottom-top, len(lines))
			}
		}
		// The x axis of the lowest panel: its labelled ticks.
		var xLabels []*svgNode
		lowest := math.Inf(-1)
		for _, n := range root.all("text", "plumb-tick") {
			if n.Attr["text-anchor"] == "middle" {
				lowest = math.Max(lowest, n.DY)
			}
		}
		for _, n := range root.all("text", "plumb-tick") {
			if n.Attr["text-anchor"] == "middle" && n.DY == lowest {
				xLabels = append(xLabels, n)
			}
		}
		for _, lines := range grids {
			if lines[0][0] > 150*k && len(grids) == 1 && len(xLabels) < 3 {
				var l []string
				for _, x := range xLabels {
					l = append(l, x.Text)
				}
				t.Errorf("%s: a %.0f px x axis with %d labelled ticks %q", name, lines[0][0], len(xLabels), l)
			}
			break
		}
		if diff {
			checkDiffLabelsClear(t, root, name)
		}
	}
}

// checkDiffLabelsClear asserts that no text box of a difference chart
// meets a segment of a data path (the areas' outlines and the difference
// line).
func checkDiffLabelsClear(t *testing.T, root *svgNode, name string) {
	t.Helper()
	boxes, texts := textBoxes(t, root)
	for _, p := range root.all("path", "plumb-mark") {
		xs, ys := pathPoints(t, p.Attr["d"])
		// Each M starts a new polyline: split the d attribute on M.
		var runs [][2][]float64
		i := 0
		for _, sub := range strings.Split(p.Attr["d"], "M")[1:] {
			n := strings.Count(sub, "L") + 1
			runs = append(runs, [2][]float64{xs[i : i+n], ys[i : i+n]})
			i += n
		}
		for _, r := range runs {
			for j := 1; j < len(r[0]); j++ {
				a := [2]float64{r[0][j-1] + p.DX, r[1][j-1] + p.DY}
				b := [2]float64{r[0][j] + p.DX, r[1][j] + p.DY}
				for k, box := range boxes {
					if segmentMeetsBox(a, b, box) {
						t.Errorf("%s: text %q %+v meets the data path %q at %v-%v", name, texts[k], box, p.Attr["class"], a, b)
						return
					}
				}
			}
		}
	}
}

// segmentMeetsBox clips the segment ab against the box (Liang-Barsky).
func segmentMeetsBox(a, b [2]float64, box layout.Box) bool {
	t0, t1 := 0.0, 1.0
	dx, dy := b[0]-a[0], b[1]-a[1]
	for _, e := range [4][2]float64{{-dx, a[0] - box.X}, {dx, box.X + box.W - a[0]}, {-dy, a[1] - box.Y}, {dy, box.Y + box.H - a[1]}} {
		if e[0] == 0 {
			if e[1] < 0 {
				return false
			}
			continue
		}
		r := e[1] / e[0]
		if e[0] < 0 {
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
