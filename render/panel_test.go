package render

import (
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

// pointsPlan is a small plan for testing the grid: points on two number
// axes, ticked and drawn by the shared axis code.
type pointsPlan struct {
	x, y   []float64
	dx, dy axisDomain
	ax, ay axis
	label  string // a long label drawn at the plot's top right, to test room
}

func (p *pointsPlan) domains() (axisDomain, axisDomain) {
	lo, hi, _ := dataRange(p.x)
	ylo, yhi, _ := dataRange(p.y)
	return axisDomain{kind: domainNumber, lo: lo, hi: hi}, axisDomain{kind: domainNumber, lo: ylo, hi: yhi}
}

func (p *pointsPlan) share(x, y axisDomain) { p.dx, p.dy = x, y }

func (p *pointsPlan) kind() valueKind {
	return valueKind{label: func(v []float64) []string { return formatAll(scale.ValueFormat(v, ""), v) }}
}

func (p *pointsPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	in := insets{top: lineHeight(sp.text) + sp.gap}
	if e.left {
		a := f.fitValue(p.dy.lo, p.dy.hi, 200, false, p.kind())
		for _, l := range a.labels {
			in.left = math.Max(in.left, f.measure(l, sp.text, false)+sp.gap)
		}
	}
	if e.bottom {
		in.bottom = f.xLabelTop(0) + lineHeight(sp.text)
	}
	in.right = sp.text * 2 // half of a tick label hangs past the plot
	return in
}

func (p *pointsPlan) height(f *frame, plotW, room float64) (float64, error) {
	if room > 0 {
		return room, nil
	}
	return plotW * 0.6, nil
}

func (p *pointsPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	p.ax = f.fitValue(p.dx.lo, p.dx.hi, plot.W, true, p.kind())
	p.ay = f.fitY(p.dy.lo, p.dy.hi, plot.H, yKind{})
	xs := scale.Linear{D0: p.ax.d0, D1: p.ax.d1, R0: plot.X, R1: plot.X + plot.W}
	ys := scale.Linear{D0: p.ay.d0, D1: p.ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	f.draw(p.ay, axisDraw{vertical: true, pos: ys, from: plot.X, to: plot.X + plot.W, labelAt: plot.X - sp.gap, labels: e.left})
	top := f.xLabelTop(plot.Y + plot.H)
	f.draw(p.ax, axisDraw{pos: xs, from: plot.Y + plot.H, to: plot.Y + plot.H + 4, tickMarks: true, labelAt: top + f.fonts.Face(false).Ascent(sp.text), labels: e.bottom})
	for i := range p.x {
		f.scene.Add(Mark{Kind: Circle, Class: "plumb-mark", X: xs.Map(p.x[i]), Y: ys.Map(p.y[i]), R: 2, Fill: f.th.neutral})
	}
	if p.label != "" {
		lines, _ := f.wrap(p.label, sp.text, false, plot.W, 1)
		if len(lines) > 0 {
			f.text(plot.X+plot.W, plot.Y-sp.gap, lines[0], sp.text, false, f.th.muted, "plumb-label", End)
		}
	}
	return placed{xs: xs, ys: ys}, nil
}

func (p *pointsPlan) describe() (string, string) { return "points", "Points" }

func pointsPanel(title string, x, y []float64, label string) Panel {
	return Panel{Title: title, plan: func(*frame) (panelPlan, error) {
		return &pointsPlan{x: x, y: y, label: label}, nil
	}}
}

// Panels drawn into grids of random sizes keep their text on the canvas
// and apart, whatever the canvas, the medium and the panel count.
func TestGridTextInsideAndApart(t *testing.T) {
	r := rand.New(rand.NewPCG(9, 9))
	media := []Medium{Screen, Print, Slide}
	for trial := range 60 {
		n := 1 + r.IntN(9)
		panels := make([]Panel, n)
		for i := range panels {
			k := 3 + r.IntN(20)
			x, y := make([]float64, k), make([]float64, k)
			scaleY := math.Pow(10, float64(r.IntN(7)-2))
			for j := range x {
				x[j] = float64(j) + r.Float64()
				y[j] = (r.Float64()*2 - 0.5) * scaleY
			}
			panels[i] = pointsPanel(fmt.Sprintf("Region %d of the islands", i+1), x, y, strings.Repeat("label ", 1+r.IntN(4)))
		}
		m := media[r.IntN(len(media))]
		c := Common{Title: "Grid", Medium: m}
		if r.IntN(2) == 0 {
			c.Width = 300 + float64(r.IntN(1300))
		}
		if r.IntN(3) == 0 && m != Slide {
			c.Height = 400 + float64(r.IntN(800))
		}
		s, err := FigureScene(FigureOptions{Common: c, ShareX: r.IntN(2) == 0, ShareY: r.IntN(2) == 0}, panels...)
		if err != nil {
			// Too dense a grid is refused with a reason, never drawn badly.
			assert.Regexp(t, "do not fit", err.Error(), "trial %d", trial)
			continue
		}
		t.Run(fmt.Sprint(trial), func(t *testing.T) { assertNoOverlap(t, s) })
		assert.Equal(t, n, classCount(s, "plumb-panel")*boolInt(n > 1)+boolInt(n == 1), "trial %d: one group per panel", trial)
	}
}

func boolInt(b bool) int {
	if b {
		return 1
	}
	return 0
}

// Shared scales give one length per unit across the panels of a grid,
// whatever each panel's own data; own scales do not.
func TestGridSharedScalesOnePixelPerUnit(t *testing.T) {
	small := pointsPanel("small", []float64{0, 1, 2}, []float64{1, 2, 3}, "")
	large := pointsPanel("large", []float64{0, 10, 20}, []float64{5, 400, 900}, "")
	f, err := newFrame(Common{})
	require.NoError(t, err)
	var cells []gridCell
	for _, p := range []Panel{small, large, small, large} {
		plan, err := p.plan(f)
		require.NoError(t, err)
		cells = append(cells, gridCell{title: p.Title, plan: plan})
	}
	res, err := f.drawGrid(cells, gridOptions{shareX: true, shareY: true}, f.plotTop())
	require.NoError(t, err)
	perUnit := func(l scale.Linear) float64 { return (l.R1 - l.R0) / (l.D1 - l.D0) }
	for i, p := range res.placed {
		assert.InDelta(t, perUnit(res.placed[0].xs), perUnit(p.xs), 1e-9, "panel %d x", i)
		assert.InDelta(t, perUnit(res.placed[0].ys), perUnit(p.ys), 1e-9, "panel %d y", i)
		assert.InDelta(t, res.cells[0].W, res.cells[i].W, 1e-9)
		assert.InDelta(t, res.cells[0].H, res.cells[i].H, 1e-9)
	}

	f, err = newFrame(Common{})
	require.NoError(t, err)
	for i, p := range []Panel{small, large} {
		plan, _ := p.plan(f)
		cells[i] = gridCell{title: p.Title, plan: plan}
	}
	res, err = f.drawGrid(cells[:2], gridOptions{}, f.plotTop())
	require.NoError(t, err)
	assert.NotEqual(t, perUnit(res.placed[0].ys), perUnit(res.placed[1].ys), "own scales differ")
}

// Plot areas of one column share their left edge and of one row their top,
// and tick labels appear only on the grid's outer panels.
func TestGridAlignsAndLabelsOuterPanels(t *testing.T) {
	var panels []Panel
	for i := range 6 {
		panels = append(panels, pointsPanel(fmt.Sprint("p", i), []float64{0, 5, 10}, []float64{0, 50, 100 * float64(i+1)}, ""))
	}
	f, err := newFrame(Common{Width: 900})
	require.NoError(t, err)
	var cells []gridCell
	for _, p := range panels {
		plan, _ := p.plan(f)
		cells = append(cells, gridCell{title: p.Title, plan: plan})
	}
	res, err := f.drawGrid(cells, gridOptions{cols: 3, shareY: true}, f.plotTop())
	require.NoError(t, err)
	for i := range res.cells {
		assert.InDelta(t, res.cells[i%3].X, res.cells[i].X, 1e-9, "column edge %d", i)
		assert.InDelta(t, res.cells[i/3*3].Y, res.cells[i].Y, 1e-9, "row edge %d", i)
	}
	// Count tick labels per panel group.
	var counts []int
	depth := 0
	for _, m := range f.scene.Marks {
		switch {
		case m.Kind == GroupStart && m.Class == "plumb-panel":
			counts = append(counts, 0)
			depth = 1
		case m.Kind == GroupEnd:
			depth = 0
		case depth == 1 && m.Kind == Text && m.Class == "plumb-tick":
			counts[len(counts)-1]++
		}
	}
	require.Len(t, counts, 6)
	assert.Zero(t, counts[1], "an inner panel (top row, middle column) draws no tick labels")
	assert.Positive(t, counts[3], "the bottom-left panel labels both axes")
}

func TestFigureOptionErrors(t *testing.T) {
	_, err := FigureScene(FigureOptions{Columns: -1}, pointsPanel("", []float64{1}, []float64{1}, ""))
	var oe *OptionError
	require.ErrorAs(t, err, &oe)
	assert.Equal(t, "Columns", oe.Option)
	_, err = FigureScene(FigureOptions{})
	assert.Error(t, err)
	_, err = FigureScene(FigureOptions{}, Panel{Title: "zero"})
	assert.ErrorContains(t, err, "Panel function")
}

// A chart not yet planned as a panel still joins a figure whole.
func TestFigureOfWholeCharts(t *testing.T) {
	s, err := FigureScene(FigureOptions{Common: Common{Title: "Two charts"}},
		BarsPanel([]string{"a", "b", "c"}, []float64{3, 2, 1}, BarsOptions{Common: Common{Title: "Bars"}}),
		DotsPanel([]string{"a", "b", "c"}, []float64{30, 32, 31}, DotsOptions{Common: Common{Title: "Dots"}}),
	)
	require.NoError(t, err)
	assert.Equal(t, 2, classCount(s, "plumb-panel"))
	assert.Equal(t, 6, classCount(s, "plumb-mark"), "three bars and three dots")
	assertNoOverlap(t, s)
	assert.Contains(t, s.Desc, "Bars:")
}

// A panel of a figure that gives its own colours draws in them, and they
// are checked like a figure's; its neighbours keep theirs.
func TestFigurePanelColours(t *testing.T) {
	red, green := Colour{R: 0xd6, G: 0x27, B: 0x28, A: 255}, Colour{R: 0x2c, G: 0xa0, B: 0x2c, A: 255}
	s, err := FigureScene(FigureOptions{},
		BarsPanel([]string{"a", "b"}, []float64{1, 2}, BarsOptions{Common: Common{Title: "own", Colors: []Colour{red, green}}}),
		BarsPanel([]string{"c", "d"}, []float64{3, 4}, BarsOptions{Common: Common{Title: "plumb's"}}))
	require.NoError(t, err)
	var fills []Colour
	for _, m := range s.Marks {
		if m.Kind == Rect && m.Class == "plumb-mark" {
			fills = append(fills, m.Fill)
		}
	}
	require.Len(t, fills, 4)
	assert.Equal(t, red, fills[0])
	assert.Equal(t, red, fills[1])
	assert.Equal(t, defaultTheme().neutral, fills[2])
	found := false
	for _, n := range s.Notes {
		found = found || (n.Code == "colors-cvd" && strings.HasPrefix(n.Text, "own: "))
	}
	assert.True(t, found, "the red/green pair is checked and the note names its panel: %v", s.Notes)
}
