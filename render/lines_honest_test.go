package render

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/palette"
)

// marksOf returns the scene's marks of one class.
func marksOf(s *Scene, class string) []Mark {
	var out []Mark
	for _, m := range s.Marks {
		if m.Class == class {
			out = append(out, m)
		}
	}
	return out
}

// isolated counts the values with no value on either side: a path of one
// point, which no stroke shows.
func isolated(y []float64) int {
	n := 0
	for i, v := range y {
		if math.IsNaN(v) {
			continue
		}
		left := i == 0 || math.IsNaN(y[i-1])
		right := i == len(y)-1 || math.IsNaN(y[i+1])
		if left && right {
			n++
		}
	}
	return n
}

// TestLinesEveryValueVisible draws series under random gap patterns and
// checks that every non-missing value is a vertex of a drawn path of two or
// more points or a dot as wide as the line carrying its value.
func TestLinesEveryValueVisible(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 13))
	for trial := range 200 {
		n := 2 + rng.IntN(120)
		k := 1 + rng.IntN(3)
		p := rng.Float64() * 0.8 // share of missing values
		var series []Series
		values := 0
		for s := range k {
			x, y := make([]float64, n), make([]float64, n)
			for i := range x {
				x[i] = float64(i)
				y[i] = math.Round(rng.NormFloat64()*100) / 10
				if rng.Float64() < p {
					y[i] = math.NaN()
				}
			}
			y[rng.IntN(n)] = 1 // at least one value
			series = append(series, Series{Name: fmt.Sprintf("s%d", s), X: x, Y: y})
		}
		sc, err := LinesScene(series, LinesOptions{})
		require.NoError(t, err)
		vertices, dots := 0, 0
		for _, m := range sc.Marks {
			if m.Class != "plumb-mark" {
				continue
			}
			switch m.Kind {
			case Path:
				for _, l := range m.Lines {
					require.GreaterOrEqual(t, len(l), 2, "trial %d: a path piece of one point shows nothing", trial)
					vertices += len(l)
				}
				for _, d := range marksOf(sc, "plumb-mark") {
					if d.Kind == Circle {
						assert.InDelta(t, m.StrokeWidth, 2*d.R, 0.011, "a dot as wide as the line")
					}
				}
			case Circle:
				dots++
				v, err := strconv.ParseFloat(dataAttr(m, "value"), 64)
				require.NoError(t, err)
				found := false
				for _, s := range series {
					if s.Name == dataAttr(m, "series") {
						xi, _ := strconv.ParseFloat(dataAttr(m, "x"), 64)
						found = s.Y[int(xi)] == v
					}
				}
				assert.True(t, found, "trial %d: dot %v carries its series' value", trial, m.Attrs)
			}
		}
		want := 0
		for _, s := range series {
			want += isolated(s.Y)
			for _, v := range s.Y {
				if !math.IsNaN(v) {
					values++
				}
			}
		}
		assert.Equal(t, want, dots, "trial %d: one dot per value between two gaps", trial)
		assert.Equal(t, values, vertices+dots, "trial %d: every value is drawn", trial)
	}
}

func dataAttr(m Mark, name string) string {
	for _, a := range m.Attrs {
		if a.Name == name {
			return a.Value
		}
	}
	return ""
}

// countingWriter counts bytes.
type countingWriter struct{ n int }

func (c *countingWriter) Write(p []byte) (int, error) { c.n += len(p); return len(p), nil }

// TestLinesGapsDoNotDefeatReduction is the case of a million points with
// every other value missing: per-column reduction keeps the SVG near the
// size of a gapless million (about 32 KB), where M4 across the gaps wrote
// 13.5 MB.
func TestLinesGapsDoNotDefeatReduction(t *testing.T) {
	if testing.Short() {
		t.Skip("a million points")
	}
	const n = 1_000_000
	x, y := make([]float64, n), make([]float64, n)
	for i := range x {
		x[i] = float64(i)
		y[i] = math.Sin(float64(i)/20000) + float64(i%13)/20
		if i%2 == 1 {
			y[i] = math.NaN()
		}
	}
	var w countingWriter
	notes, err := Lines(&w, []Series{{Name: "reading", X: x, Y: y}}, LinesOptions{})
	require.NoError(t, err)
	assert.Less(t, w.n, 64*1024, "SVG bytes")
	text := fmt.Sprint(notes)
	// The last value is missing, a gap after the line's end; every other
	// missing value shares a pixel column with values.
	assert.Contains(t, text, "499,999 more missing values fall inside pixel columns that also hold values")
	assert.Contains(t, text, "reduced 1,000,000 points")
}

// TestLinesGapAcrossWholeColumns: with reduction, a run of missing values
// that empties whole pixel columns still breaks the line.
func TestLinesGapAcrossWholeColumns(t *testing.T) {
	const n = 100_000
	x, y := make([]float64, n), make([]float64, n)
	for i := range x {
		x[i], y[i] = float64(i), float64(i%7)
		if i%2 == 1 || i > 40_000 && i < 50_000 {
			y[i] = math.NaN()
		}
	}
	s, err := LinesScene([]Series{{Name: "r", X: x, Y: y}}, LinesOptions{})
	require.NoError(t, err)
	paths := marksOf(s, "plumb-mark")
	require.Len(t, paths, 1)
	assert.Len(t, paths[0].Lines, 2, "one gap, where whole columns have no value")
	assert.Contains(t, fmt.Sprint(s.Notes), "drawn in 2 pieces")
}

func BenchmarkLinesAlternatingGaps(b *testing.B) {
	const n = 1_000_000
	x, y := make([]float64, n), make([]float64, n)
	for i := range x {
		x[i], y[i] = float64(i), float64(i%97)
		if i%2 == 1 {
			y[i] = math.NaN()
		}
	}
	series := []Series{{Name: "r", X: x, Y: y}}
	for b.Loop() {
		if _, err := Lines(io.Discard, series, LinesOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// yTicks reads the values of the y tick labels of a scene's first panel.
func gridYs(s *Scene) []float64 {
	var ys []float64
	for _, m := range marksOf(s, "plumb-grid") {
		ys = append(ys, m.Lines[0][0].Y)
	}
	return ys
}

func TestLinesIndexBase(t *testing.T) {
	// Four indices between 90 and 125 after rebasing: the base is a
	// reference line and a tick, and the domain hugs the data.
	x := []float64{0, 1, 2, 3, 4, 5}
	series := []Series{
		{Name: "a", X: x, Y: []float64{50, 48, 46, 45, 47, 49}},
		{Name: "b", X: x, Y: []float64{10, 11, 12, 12.5, 12, 11}},
		{Name: "c", X: x, Y: []float64{200, 210, 220, 230, 240, 250}},
		{Name: "d", X: x, Y: []float64{4, 3.8, 3.7, 3.6, 3.9, 4.1}},
	}
	s, err := LinesScene(series, LinesOptions{Index: true})
	require.NoError(t, err)
	refs := marksOf(s, "plumb-ref")
	require.Len(t, refs, 1)
	assert.Equal(t, "100", dataAttr(refs[0], "value"))
	var labels []string
	for _, m := range marksOf(s, "plumb-tick") {
		if m.Anchor == End { // the y axis
			labels = append(labels, m.Text)
		}
	}
	assert.Contains(t, labels, "100")
	lowest := math.Inf(1)
	for _, l := range labels {
		if v, err := strconv.ParseFloat(l, 64); err == nil && !strings.Contains(l, ".") {
			lowest = math.Min(lowest, v)
		}
	}
	assert.GreaterOrEqual(t, lowest, 80.0, "the domain fits the data (minimum 90), not down to %v", lowest)
	// The reference line lies where 100 maps: on the grid line of tick 100.
	for _, m := range marksOf(s, "plumb-tick") {
		if m.Text == "100" {
			assert.InDelta(t, refs[0].Lines[0][0].Y, m.Y-(m.Size*0.35), m.Size*0.5)
		}
	}
}

func TestLinesLeadersAreNotData(t *testing.T) {
	x := []float64{1, 2, 3, 4, 5, 6, 7}
	series := []Series{
		{Name: "north", X: x, Y: []float64{3, 4, 5, 4, 6, 7, 8}},
		{Name: "south", X: x, Y: []float64{2, 3, 3, 4, 3, 5, 7.9}},
		{Name: "east", X: x, Y: []float64{1, 2, 2, 2, 3, 2, 2}},
	}
	s, err := LinesScene(series, LinesOptions{})
	require.NoError(t, err)
	var right, width float64
	for _, m := range marksOf(s, "plumb-mark") {
		for _, l := range m.Lines {
			right = math.Max(right, l[len(l)-1].X)
		}
		width = m.StrokeWidth
	}
	th := defaultTheme()
	leaders := marksOf(s, "plumb-leader")
	require.Len(t, leaders, 3)
	for _, l := range leaders {
		assert.Equal(t, th.muted, l.Stroke, "neutral, not the series colour")
		assert.Less(t, l.StrokeWidth, width/2, "thinner than the data")
		for _, p := range l.Lines[0] {
			assert.Greater(t, p.X, right, "a leader lives right of the plot")
		}
	}
	// The x axis ends where the data ends: the last grid line ends at the
	// last point.
	for _, g := range marksOf(s, "plumb-grid") {
		assert.InDelta(t, right, g.Lines[0][1].X, 0.01)
	}
}

func TestLinesLabelsMatchTheirLines(t *testing.T) {
	x := []float64{1, 2, 3, 4}
	var series []Series
	for i := range 4 {
		series = append(series, Series{Name: fmt.Sprintf("series %d", i), X: x, Y: []float64{float64(i), float64(2 * i), float64(i), float64(3 * i)}})
	}
	s, err := LinesScene(series, LinesOptions{})
	require.NoError(t, err)
	lineColor := map[string]Colour{}
	for _, m := range marksOf(s, "plumb-mark") {
		lineColor[dataAttr(m, "series")] = m.Stroke
	}
	white := palette.SRGB{R: 1, G: 1, B: 1}
	for _, l := range marksOf(s, "plumb-label") {
		fill, err := palette.ParseHex(l.Fill.Hex())
		require.NoError(t, err)
		line, err := palette.ParseHex(lineColor[dataAttr(l, "series")].Hex())
		require.NoError(t, err)
		// WCAG 2.x text contrast.
		assert.GreaterOrEqual(t, palette.Contrast(fill, white), 4.5, "%s in %s", l.Text, l.Fill)
		a, b := palette.OKLabToOKLCH(palette.SRGBToOKLab(fill)), palette.OKLabToOKLCH(palette.SRGBToOKLab(line))
		d := math.Abs(math.Mod(a.H-b.H+540, 360) - 180)
		assert.Less(t, d, 8.0, "%s: label hue %.0f° against line hue %.0f°", l.Text, a.H, b.H)
	}
}

// plotHeight is the height between a scene's top and bottom grid lines.
func plotHeightOf(s *Scene) float64 {
	ys := gridYs(s)
	if len(ys) == 0 {
		return 0
	}
	return slices.Max(ys) - slices.Min(ys)
}

func TestLinesNoStrip(t *testing.T) {
	// Ten years of daily noise around a slow seasonal trend: banking the
	// noise asks for a strip; the plot keeps the medium's minimum and the
	// note names the trend's scale.
	rng := rand.New(rand.NewPCG(3, 3))
	const n = 3653
	x, y := make([]float64, n), make([]float64, n)
	for i := range x {
		x[i] = float64(1.45e9 + 86400*i)
		y[i] = 1000 + 300*math.Sin(2*math.Pi*float64(i)/365.25) + 150*rng.NormFloat64()
	}
	for _, m := range []Medium{Screen, Print, Slide} {
		c := Common{Medium: m}
		if m == Slide {
			c.Height = 2000 // taller than the minimum needs, so the test reads banking
		}
		s, err := LinesScene([]Series{{Name: "passengers", X: x, Y: y}}, LinesOptions{Common: c, Time: true})
		require.NoError(t, err)
		sp, _ := m.spec()
		assert.GreaterOrEqual(t, plotHeightOf(s), minPlotHeight(sp, false)-0.01, "%s", m)
		if m != Slide {
			assert.Contains(t, fmt.Sprint(s.Notes), "multi-scale banking, Heer & Agrawala 2006")
			assert.Contains(t, fmt.Sprint(s.Notes), "months and longer")
		}
	}
}

func TestLinesManyPanels(t *testing.T) {
	mk := func(n int) []Series {
		var out []Series
		for i := range n {
			out = append(out, Series{Name: fmt.Sprintf("station %02d", i), X: []float64{2000, 2001, 2002, 2003}, Y: []float64{float64(i), 3, 2, float64(i % 5)}})
		}
		return out
	}
	cols := func(s *Scene) int {
		xs := map[float64]bool{}
		for _, m := range s.Marks {
			if m.Kind == GroupStart && m.Class == "plumb-panel" {
				xs[m.DX] = true
			}
		}
		return len(xs)
	}
	prev := 0
	for _, n := range []int{5, 9, 16, 25, 30} {
		s, err := LinesScene(mk(n), LinesOptions{})
		require.NoError(t, err)
		c := cols(s)
		assert.GreaterOrEqual(t, c, prev, "%d panels: the columns grow with the count", n)
		assert.GreaterOrEqual(t, c*c*2, n, "%d panels in %d columns", n, c)
		prev = c
	}
	_, err := LinesScene(mk(MaxPanels+1), LinesOptions{})
	require.Error(t, err)
	assert.True(t, errors.Is(err, ErrRefused))
	for _, alt := range []string{"highlight", "aggregate", "filter"} {
		assert.Contains(t, err.Error(), alt)
	}
	// --together draws them on one panel, alike, without names.
	s, err := LinesScene(mk(50), LinesOptions{Together: true})
	require.NoError(t, err)
	assert.Zero(t, classCount(s, "plumb-label"))
	assert.Contains(t, fmt.Sprint(s.Notes), "without names")
}

// TestLinesContextLinear: the context of small multiples is one band per
// panel, so the output grows linearly with the number of series.
func TestLinesContextLinear(t *testing.T) {
	size := func(n int) int {
		rng := rand.New(rand.NewPCG(1, uint64(n)))
		var series []Series
		for i := range n {
			x, y := make([]float64, 100), make([]float64, 100)
			v := 0.0
			for j := range x {
				v += rng.NormFloat64()
				x[j], y[j] = float64(j), v
			}
			series = append(series, Series{Name: fmt.Sprintf("s%d", i), X: x, Y: y})
		}
		var b bytes.Buffer
		_, err := Lines(&b, series, LinesOptions{})
		require.NoError(t, err)
		return b.Len()
	}
	s10, s30 := size(10), size(30)
	assert.Less(t, float64(s30)/float64(s10), 3.6, "30 series vs 10: %d vs %d bytes", s30, s10)
}

func TestLinesYearsAndWholeNumbers(t *testing.T) {
	x := make([]float64, 20)
	y := make([]float64, 20)
	for i := range x {
		x[i] = float64(2004 + i)
		y[i] = float64(3 + i%4)
	}
	s, err := LinesScene([]Series{{Name: "births", X: x, Y: y}}, LinesOptions{XName: "year"})
	require.NoError(t, err)
	assert.Contains(t, fmt.Sprint(s.Notes), "as years")
	for _, m := range marksOf(s, "plumb-tick") {
		assert.NotContains(t, m.Text, ",", "no thousands separator in a year or a small count")
		assert.NotContains(t, m.Text, ".", "whole numbers never get fractional ticks: %q", m.Text)
	}
	assert.Contains(t, s.Desc, "over year")
}

func TestLinesDescriptionNamesX(t *testing.T) {
	x := []float64{1, 2, 3}
	s, err := LinesScene([]Series{{Name: "a", X: x, Y: x}}, LinesOptions{XName: "week"})
	require.NoError(t, err)
	assert.Contains(t, s.Desc, "over week")
	s, err = LinesScene([]Series{{Name: "a", X: []float64{1.7e9, 1.8e9, 1.9e9}, Y: x}}, LinesOptions{Time: true})
	require.NoError(t, err)
	assert.Contains(t, s.Desc, "over time")
	assert.NotContains(t, s.Desc, "over x")
	d, err := DiffScene(Series{X: x, Y: x}, Series{X: x, Y: []float64{3, 2, 1}}, DiffOptions{XName: "week"})
	require.NoError(t, err)
	assert.Contains(t, d.Desc, "over week")
}

func TestLinesZeroAndFloorTicks(t *testing.T) {
	// A range from −500 to 2,000 once gave the ticks −500 and 2,000 alone:
	// zero lies inside, so it is labelled, and a tall axis has at least three.
	x := []float64{0, 1, 2, 3, 4, 5}
	s, err := LinesScene([]Series{{Name: "balance", X: x, Y: []float64{-500, 300, 900, 1400, 2000, 1700}}}, LinesOptions{})
	require.NoError(t, err)
	var ys []string
	for _, m := range marksOf(s, "plumb-tick") {
		if m.Anchor == End {
			ys = append(ys, m.Text)
		}
	}
	assert.Contains(t, ys, "0")
	assert.GreaterOrEqual(t, len(ys), 3)
}

func TestDiffIsolatedValuesDrawn(t *testing.T) {
	nan := math.NaN()
	x := []float64{1, 2, 3, 4, 5, 6, 7}
	a := []float64{5, nan, 7, nan, 3, 4, 6}
	b := []float64{4, 4, 4, 4, nan, 2, 2}
	s, err := DiffScene(Series{X: x, Y: a}, Series{X: x, Y: b}, DiffOptions{})
	require.NoError(t, err)
	var dots []Mark
	for _, m := range marksOf(s, "plumb-mark") {
		if m.Kind == Circle {
			dots = append(dots, m)
		}
	}
	// Differences at x = 1 and 3 stand alone between missing ones.
	require.Len(t, dots, 2)
	assert.Equal(t, "1", dataAttr(dots[0], "x"))
	assert.Equal(t, "1", dataAttr(dots[0], "value"))
	assert.Equal(t, "3", dataAttr(dots[1], "value"))
	assert.Contains(t, fmt.Sprint(s.Notes), "drawn as dots")
}

func TestLinesDrawnPointsBound(t *testing.T) {
	// Past the bound on drawn points the chart is declined, before any
	// path is built, with the alternatives.
	f, err := newFrame(Common{})
	require.NoError(t, err)
	var series []Series
	for i := range 20 {
		series = append(series, Series{Name: fmt.Sprint(i), X: []float64{0, 1, 2}, Y: []float64{1, 2, float64(i)}})
	}
	c := &lineChart{series: series}
	g := lineGeom{w: 300, ax: axis{d0: 0, d1: 2}}
	_, _, err = c.reduceWithin(f, g, 59)
	require.Error(t, err)
	assert.True(t, errors.Is(err, ErrRefused))
	assert.Contains(t, err.Error(), "aggregate")
	_, _, err = c.reduceWithin(f, g, 60)
	assert.NoError(t, err)
}
