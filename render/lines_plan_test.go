package render

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/scale"
)

// linesGrid draws small multiples of series through drawGrid, as
// LinesScene does, and returns what each panel placed.
func linesGrid(t *testing.T, series []Series, c Common) gridResult {
	t.Helper()
	lc, err := newLineChart(series, LinesOptions{Common: c}, false)
	require.NoError(t, err)
	require.True(t, lc.multiples)
	f, err := newFrame(c)
	require.NoError(t, err)
	var cells []gridCell
	for i, s := range lc.series {
		p := lc.panel(i, s.Name)
		plan, err := p.plan(f)
		require.NoError(t, err)
		cells = append(cells, gridCell{title: p.Title, plan: plan})
	}
	res, err := f.drawGrid(cells, gridOptions{shareX: true, shareY: true, cols: lc.multipleColumns()}, f.plotTop())
	require.NoError(t, err)
	return res
}

// Small multiples share one length per unit along x and along y in every
// panel, however different each panel's own series, on every medium and
// on a fixed canvas.
func TestMultiplesOnePixelPerUnit(t *testing.T) {
	var series []Series
	for i := range 7 {
		s := Series{Name: fmt.Sprintf("pier %d", i+1)}
		for j := range 10 + 3*i { // different x extents
			s.X = append(s.X, float64(j+i))
			s.Y = append(s.Y, float64(i*i)*10+float64(j%4)) // different levels
		}
		series = append(series, s)
	}
	perUnit := func(l scale.Linear) float64 { return (l.R1 - l.R0) / (l.D1 - l.D0) }
	for _, c := range []Common{{}, {Medium: Print}, {Medium: Slide}, {Width: 900, Height: 700}} {
		res := linesGrid(t, series, c)
		require.Len(t, res.placed, len(series))
		for i, p := range res.placed {
			assert.InDelta(t, perUnit(res.placed[0].xs), perUnit(p.xs), 1e-9, "%v panel %d x", c, i)
			assert.InDelta(t, perUnit(res.placed[0].ys), perUnit(p.ys), 1e-9, "%v panel %d y", c, i)
			assert.Equal(t, res.placed[0].ys.D0, p.ys.D0, "one y domain")
			assert.Equal(t, res.cells[0].H, res.cells[i].H, "one plot height: the joint banking")
			assert.NotEmpty(t, p.marks, "panel %d placed its line", i)
		}
	}
}

// The context panel of a difference chart shares the difference's x scale
// and plot edges, and each panel is banked for its own height.
func TestDiffContextSharesX(t *testing.T) {
	a := Series{Name: "north", X: []float64{1, 2, 3, 4, 5, 6, 7, 8}, Y: []float64{500, 520, 560, 540, 470, 430, 450, 510}}
	b := Series{Name: "south", X: []float64{1, 2, 3, 4, 5, 6, 7, 8}, Y: []float64{480, 490, 500, 505, 500, 495, 500, 505}}
	c, err := newDiffChart(a, b, DiffOptions{Context: true})
	require.NoError(t, err)
	f, err := newFrame(Common{})
	require.NoError(t, err)
	var cells []gridCell
	for _, levels := range []bool{true, false} {
		plan, err := c.panel(levels).plan(f)
		require.NoError(t, err)
		cells = append(cells, gridCell{plan: plan})
	}
	res, err := f.drawGrid(cells, gridOptions{cols: 1, shareX: true, ownHeights: true}, f.plotTop())
	require.NoError(t, err)
	x0 := res.placed[0].xs.Map(4) + res.origin[0].X
	x1 := res.placed[1].xs.Map(4) + res.origin[1].X
	assert.InDelta(t, x0, x1, 1e-9, "x = 4 at one place in both panels")
	assert.Equal(t, res.cells[0].X, res.cells[1].X)
	assert.Equal(t, res.cells[0].W, res.cells[1].W)
	assert.NotEqual(t, res.cells[0].H, res.cells[1].H, "each panel banked for its own lines")
}

// Line and difference charts, alone, as small multiples, on fixed canvases
// and as panels of figures, keep their text on the canvas and apart,
// whatever the sizes: random widths, media, series counts and names.
func TestLinePanelsTextInsideAndApart(t *testing.T) {
	r := rand.New(rand.NewPCG(11, 3))
	media := []Medium{Screen, Print, Slide}
	mkSeries := func(n int) []Series {
		out := make([]Series, n)
		for i := range out {
			name := strings.TrimSpace(strings.Repeat("harbour ", 1+r.IntN(3))) + fmt.Sprint(i+1)
			k := 4 + r.IntN(60)
			s := Series{Name: name}
			level := math.Pow(10, float64(r.IntN(5)-1))
			for j := range k {
				s.X = append(s.X, 2000+float64(j))
				y := level * (1 + r.Float64())
				if r.IntN(15) == 0 {
					y = math.NaN()
				}
				s.Y = append(s.Y, y)
			}
			s.Y[0] = level
			out[i] = s
		}
		return out
	}
	for trial := range 80 {
		c := Common{Title: "Passengers by harbour", Medium: media[r.IntN(len(media))]}
		if r.IntN(2) == 0 {
			c.Width = 320 + float64(r.IntN(1400))
		}
		if r.IntN(4) == 0 && c.Medium != Slide {
			c.Height = 420 + float64(r.IntN(700))
		}
		series := mkSeries(1 + r.IntN(9))
		var s *Scene
		var err error
		switch trial % 4 {
		case 0, 1:
			s, err = LinesScene(series, LinesOptions{Common: c, XName: "year", YName: "passengers", Index: trial%8 == 1})
		case 2:
			if len(series) < 2 {
				series = mkSeries(2)
			}
			s, err = DiffScene(series[0], series[1], DiffOptions{Common: c, Context: r.IntN(2) == 0, XName: "year"})
		case 3:
			if len(series) < 2 {
				series = mkSeries(2)
			}
			p1 := LinesPanel(series, LinesOptions{Common: Common{Title: "Levels"}, YName: "passengers"})
			p2 := DiffPanel(series[0], series[1], DiffOptions{Common: Common{Title: "Gap"}})
			s, err = FigureScene(FigureOptions{Common: c, ShareX: true}, p1, p2)
		}
		if err != nil {
			// A canvas too small is refused with what would fix it.
			assert.Regexp(t, "narrow|do not fit|fixed height|too short", err.Error(), "trial %d", trial)
			continue
		}
		t.Run(fmt.Sprint(trial), func(t *testing.T) {
			assertNoOverlap(t, s)
			for _, m := range s.Marks {
				for _, v := range []float64{m.X, m.Y, m.W, m.H} {
					assert.False(t, math.IsNaN(v) || math.IsInf(v, 0), "mark %s", m.Class)
				}
			}
		})
	}
}

// Names that cannot be spread along a short plot go in a key under it,
// in room the panel measured for it: the key stays on the canvas and
// clear of every other text.
func TestLinesLegendWhenNamesDoNotFit(t *testing.T) {
	var series []Series
	for i := range 8 {
		s := Series{Name: fmt.Sprintf("A long route name that wraps onto two lines %d", i)}
		for j := range 30 {
			s.X = append(s.X, float64(j))
			s.Y = append(s.Y, float64(i)*3+math.Sin(float64(j)/4))
		}
		series = append(series, s)
	}
	for _, c := range []Common{{}, {Medium: Print}, {Width: 900}} {
		s, err := LinesScene(series, LinesOptions{Common: c, Together: true, Aspect: "4:1", XName: "day"})
		require.NoError(t, err)
		assert.Equal(t, 1, classCount(s, "plumb-legend"), "%v", c)
		assert.Contains(t, fmt.Sprint(s.Notes), "legend below the chart")
		assert.Zero(t, classCount(s, "plumb-leader"), "no direct labels as well")
		assertNoOverlap(t, s)
	}
}
