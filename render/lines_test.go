package render

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/layout"
	"plumb/scale"
)

// textBoxes measures every text mark of a scene, with the translate of its
// enclosing groups applied.
func textBoxes(s *Scene) ([]layout.Box, []string) {
	var boxes []layout.Box
	var texts []string
	var dx, dy []float64
	ox, oy := 0.0, 0.0
	fonts := layout.Fonts{}
	for _, m := range s.Marks {
		switch m.Kind {
		case GroupStart:
			dx, dy = append(dx, m.DX), append(dy, m.DY)
			ox, oy = ox+m.DX, oy+m.DY
		case GroupEnd:
			ox, oy = ox-dx[len(dx)-1], oy-dy[len(dy)-1]
			dx, dy = dx[:len(dx)-1], dy[:len(dy)-1]
		case Text:
			boxes = append(boxes, layout.TextBox(fonts.Face(m.Bold), m.Text, m.Size, round2(m.X)+ox, round2(m.Y)+oy, int(m.Anchor)))
			texts = append(texts, m.Text)
		}
	}
	return boxes, texts
}

func assertNoOverlap(t *testing.T, s *Scene) {
	t.Helper()
	boxes, texts := textBoxes(s)
	canvas := layout.Box{W: s.Width, H: s.Height}
	for i, b := range boxes {
		assert.True(t, b.Inside(canvas), "text %q leaves the canvas", texts[i])
		for j := i + 1; j < len(boxes); j++ {
			assert.False(t, b.Overlaps(boxes[j]), "text %q overlaps %q", texts[i], texts[j])
		}
	}
}

func classCount(s *Scene, class string) int {
	n := 0
	for _, m := range s.Marks {
		for _, c := range strings.Fields(m.Class) {
			if c == class {
				n++
			}
		}
	}
	return n
}

func TestLinesLabelsNeverOverlap(t *testing.T) {
	// Property: whatever the series' end values, the direct labels (moved
	// apart by layout.Spread) or the legend never overlap any text.
	rng := rand.New(rand.NewPCG(4, 2))
	for trial := range 150 {
		n := 2 + rng.IntN(3)
		var series []Series
		for i := range n {
			s := Series{Name: fmt.Sprintf("route %c%d", 'A'+i, rng.IntN(1000))}
			for j := range 6 + rng.IntN(20) {
				s.X = append(s.X, float64(j))
				s.Y = append(s.Y, float64(rng.IntN(5))*math.Pow(10, float64(rng.IntN(3))))
			}
			series = append(series, s)
		}
		opt := LinesOptions{}
		if trial%3 == 0 {
			opt.Medium = Print
		}
		s, err := LinesScene(series, opt)
		require.NoError(t, err)
		assertNoOverlap(t, s)
		named := map[string]bool{}
		for _, m := range s.Marks {
			if m.Class == "plumb-label" && len(m.Attrs) > 0 {
				named[m.Attrs[0].Value] = true
			}
		}
		assert.Len(t, named, n, "trial %d: every series is named once", trial)
	}
}

func TestLinesLabelsLeastDisplacement(t *testing.T) {
	// Two series ending at the same value: the labels move apart by half
	// the gap each, symmetric about the shared end (least squares).
	s, err := LinesScene([]Series{
		{Name: "north", X: []float64{0, 1, 2, 3}, Y: []float64{0, 2, 6, 3}},
		{Name: "south", X: []float64{0, 1, 2, 3}, Y: []float64{6, 3, 4, 3}},
	}, LinesOptions{})
	require.NoError(t, err)
	var ys []float64
	var end float64
	for _, m := range s.Marks {
		if m.Class == "plumb-leader" {
			ys = append(ys, m.Lines[0][1].Y)
			end = m.Lines[0][0].Y
		}
	}
	require.Len(t, ys, 2)
	assert.InDelta(t, lineHeight(mustSpec(t).text), math.Abs(ys[1]-ys[0]), 0.02)
	assert.InDelta(t, end, (ys[0]+ys[1])/2, 0.02)
}

// raster draws a polyline of pixel cells with Bresenham's algorithm and
// returns the set of cells: the binary rasterisation M4's exactness
// argument assumes (methods.md §5).
func raster(cells [][2]int) map[[2]int]bool {
	out := map[[2]int]bool{}
	for i, c := range cells {
		if i == 0 {
			out[c] = true
			continue
		}
		x0, y0, x1, y1 := cells[i-1][0], cells[i-1][1], c[0], c[1]
		dx, dy := abs(x1-x0), -abs(y1-y0)
		sx, sy := sign(x1-x0), sign(y1-y0)
		e := dx + dy
		for {
			out[[2]int{x0, y0}] = true
			if x0 == x1 && y0 == y1 {
				break
			}
			if 2*e >= dy {
				e += dy
				x0 += sx
			}
			if 2*e <= dx {
				e += dx
				y0 += sy
			}
		}
	}
	return out
}

func abs(v int) int {
	if v < 0 {
		return -v
	}
	return v
}

func sign(v int) int {
	switch {
	case v > 0:
		return 1
	case v < 0:
		return -1
	}
	return 0
}

func TestLinesM4PixelIdentity(t *testing.T) {
	// Jugel et al. (2014): the M4-reduced line rasterises to the same pixels
	// as the full line at the chart's own width and column mapping.
	rng := rand.New(rand.NewPCG(7, 7))
	n := 40000
	x, y := make([]float64, n), make([]float64, n)
	v := 0.0
	for i := range x {
		x[i] = float64(i) * 0.37
		v += rng.NormFloat64()
		y[i] = v
	}
	s, err := LinesScene([]Series{{Name: "walk", X: x, Y: y}}, LinesOptions{})
	require.NoError(t, err)
	assert.Contains(t, fmt.Sprint(s.Notes), "M4")
	var mark Mark
	for _, m := range s.Marks {
		if m.Class == "plumb-mark" {
			mark = m
		}
	}
	require.Len(t, mark.Lines, 1)
	reduced := mark.Lines[0]
	// Recover the chart's geometry from the scene: the plot's pixel columns
	// start at the whole pixel under the first vertex, and x maps linearly.
	left := math.Floor(reduced[0].X)
	g, ys := sceneGeometry(t, s, x, y)
	require.Equal(t, left, g.left)
	full := make([][2]int, n)
	for i := range x {
		full[i] = [2]int{scale.PixelColumn(x[i], g.ax.d0, g.ax.d1, g.w), int(math.Round(round2(ys.Map(y[i]))))}
	}
	red := make([][2]int, len(reduced))
	for i, p := range reduced {
		red[i] = [2]int{int(math.Floor(p.X - g.left)), int(math.Round(p.Y))}
	}
	assert.Less(t, len(reduced), n/10)
	assert.Equal(t, raster(full), raster(red))
}

// sceneGeometry rebuilds the plot's x geometry and y scale the way the
// builder chose them, from the grid lines of the scene.
func sceneGeometry(t *testing.T, s *Scene, x, y []float64) (lineGeom, scale.Linear) {
	t.Helper()
	var grid []Mark
	for _, m := range s.Marks {
		if m.Class == "plumb-grid" {
			grid = append(grid, m)
		}
	}
	require.GreaterOrEqual(t, len(grid), 2)
	l, r := grid[0].Lines[0][0].X, grid[0].Lines[0][1].X
	f, err := newFrame(Common{})
	require.NoError(t, err)
	ax := f.fitX(x[0], x[len(x)-1], xKind{}, r-l)
	top, bottom := grid[len(grid)-1].Lines[0][0].Y, grid[0].Lines[0][0].Y
	lo, hi, _ := dataRange(y)
	ay := f.fitY(lo, hi, bottom-top, yKind{})
	return lineGeom{left: l, w: int(r - l), ax: ax, reduce: true}, scale.Linear{D0: ay.d0, D1: ay.d1, R0: bottom, R1: top}
}

func TestLinesIndex(t *testing.T) {
	series := []Series{
		{Name: "a", X: []float64{1, 2, 3}, Y: []float64{50, 60, 75}},
		{Name: "b", X: []float64{1, 2, 3}, Y: []float64{math.NaN(), 2, 3}},
	}
	s, err := LinesScene(series, LinesOptions{Index: true})
	require.NoError(t, err)
	assert.Contains(t, s.Desc, "a: 100 at 1, 150 at 3")
	assert.Contains(t, s.Desc, "b: 100 at 2, 150 at 3")

	at := 1.5
	s, err = LinesScene(series[:1], LinesOptions{IndexAt: &at})
	require.NoError(t, err)
	assert.Contains(t, s.Desc, "a: 91 at 1, 136 at 3") // 50/55·100 and 75/55·100: 55 is linear between 50 and 60

	at = 1.2 // b is missing at x = 1: no value to index at
	_, err = LinesScene(series, LinesOptions{IndexAt: &at})
	assert.True(t, errors.Is(err, ErrRefused), "%v", err)

	_, err = LinesScene([]Series{{Name: "z", X: []float64{1, 2}, Y: []float64{0, 1}}}, LinesOptions{Index: true})
	assert.True(t, errors.Is(err, ErrRefused), "%v", err)
}

func TestLinesRejects(t *testing.T) {
	ok := []Series{{Name: "a", X: []float64{1, 2}, Y: []float64{1, 2}}}
	cases := map[string]struct {
		series []Series
		opt    LinesOptions
		says   string // part of the message that names the cause
	}{
		"no series":     {nil, LinesOptions{}, "no series"},
		"length":        {[]Series{{Name: "a", X: []float64{1, 2}, Y: []float64{1}}}, LinesOptions{}, "2 x values but 1 y"},
		"empty":         {[]Series{{Name: "a"}}, LinesOptions{}, "no points"},
		"duplicate x":   {[]Series{{Name: "a", X: []float64{1, 1}, Y: []float64{1, 2}}}, LinesOptions{}, "two points at x = 1"},
		"infinite y":    {[]Series{{Name: "a", X: []float64{1, 2}, Y: []float64{1, math.Inf(1)}}}, LinesOptions{}, "infinite"},
		"nan x":         {[]Series{{Name: "a", X: []float64{1, math.NaN()}, Y: []float64{1, 2}}}, LinesOptions{}, "finite x"},
		"all missing":   {[]Series{{Name: "a", X: []float64{1, 2}, Y: []float64{math.NaN(), math.NaN()}}}, LinesOptions{}, "every value is missing"},
		"bad aspect":    {ok, LinesOptions{Aspect: "wide"}, "wide"},
		"narrow canvas": {ok, LinesOptions{Common: Common{Width: 90}}, "narrow"},
	}
	for name, tc := range cases {
		_, err := LinesScene(tc.series, tc.opt)
		if assert.Error(t, err, name) {
			assert.Contains(t, err.Error(), tc.says, name)
		}
	}
}

func TestLinesAspectForced(t *testing.T) {
	s, err := LinesScene([]Series{{Name: "a", X: []float64{0, 1, 2, 3}, Y: []float64{1, 3, 2, 4}}}, LinesOptions{Aspect: "2:1"})
	require.NoError(t, err)
	var grid []Mark
	for _, m := range s.Marks {
		if m.Class == "plumb-grid" {
			grid = append(grid, m)
		}
	}
	w := grid[0].Lines[0][1].X - grid[0].Lines[0][0].X
	h := grid[0].Lines[0][0].Y - grid[len(grid)-1].Lines[0][0].Y
	assert.InDelta(t, 0.5, h/w, 0.005)
	assert.Contains(t, fmt.Sprint(s.Notes), "forced")
}

func TestLinesSmallMultiplesPanels(t *testing.T) {
	var series []Series
	for i := range 6 {
		series = append(series, Series{Name: fmt.Sprintf("s%d", i), X: []float64{0, 1, 2, 3}, Y: []float64{float64(i), 2, float64(3 - i), 1}})
	}
	s, err := LinesScene(series, LinesOptions{})
	require.NoError(t, err)
	assert.Equal(t, 6, classCount(s, "plumb-panel"))
	assert.Equal(t, 6, classCount(s, "plumb-mark"))
	assert.Equal(t, 6, classCount(s, "plumb-context"), "one context band per panel, not every other series")
	assertNoOverlap(t, s)
}

func TestLinesTimeAxisLabels(t *testing.T) {
	// Monthly points over two years: calendar ticks, a year where it changes.
	var x, y []float64
	for m := range 24 {
		x = append(x, float64(unixMonth(2024, m)))
		y = append(y, float64(m%5))
	}
	s, err := LinesScene([]Series{{Name: "a", X: x, Y: y}}, LinesOptions{Time: true})
	require.NoError(t, err)
	var ticks []string
	for _, m := range s.Marks {
		if m.Kind == Text && m.Class == "plumb-tick" && m.Anchor == Middle {
			ticks = append(ticks, m.Text)
		}
	}
	assert.Contains(t, ticks, "Jan 2024")
	assert.Contains(t, ticks, "Jan 2025")
}

func unixMonth(year, m int) int64 {
	return unixTime(0).AddDate(year-1970, m, 0).Unix()
}

func FuzzParseAspect(f *testing.F) {
	for _, s := range []string{"", "orientation", "16:9", "1:0", "-1:2", "1e308:1e-308", "NaN:1", ":"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		method, alpha, err := parseAspect(s)
		if err != nil {
			return
		}
		if method == "W:H" && (!(alpha > 0) || math.IsInf(alpha, 0)) {
			t.Fatalf("parseAspect(%q) = %v, want a positive finite ratio", s, alpha)
		}
	})
}

func mustSpec(t *testing.T) mediumSpec {
	t.Helper()
	sp, err := Screen.spec()
	require.NoError(t, err)
	return sp
}

func TestLinesTickLabelsClearOfNeighbours(t *testing.T) {
	// Small multiples whose outer x labels reach past their panels (numbers
	// whose domain ends on a tick; a seconds axis whose first label carries
	// the date) and a long y title: every label stays on the canvas and
	// clear of the neighbouring panel's labels.
	for _, c := range []struct {
		name  string
		time  bool
		start float64
		step  float64
	}{
		{"numbers", false, 252e6, 7919},
		{"seconds", true, 1261440000, 1},
		{"hours", true, 1261440000, 3600},
	} {
		for _, m := range []Medium{Screen, Print, Slide} {
			var series []Series
			for k := range 6 {
				s := Series{Name: fmt.Sprintf("route %d", k)}
				for i := range 95 {
					s.X = append(s.X, c.start+float64(i)*c.step)
					s.Y = append(s.Y, float64(k*10+i%7))
				}
				series = append(series, s)
			}
			opt := LinesOptions{Common: Common{Medium: m, Title: "Title"}, Time: c.time,
				YName: strings.Repeat("a long measure name ", 8), Unit: "passengers"}
			s, err := LinesScene(series, opt)
			require.NoError(t, err, "%s %v", c.name, m)
			assertNoOverlap(t, s)
			assert.Greater(t, classCount(s, "plumb-panel"), 1)
		}
	}
}
