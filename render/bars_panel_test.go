package render

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/scale"
)

// gridOf plans panels into one frame and draws them as a grid.
func gridOf(t *testing.T, c Common, o gridOptions, panels ...Panel) (*frame, gridResult) {
	t.Helper()
	f, err := newFrame(c)
	require.NoError(t, err)
	var cells []gridCell
	for _, p := range panels {
		plan, err := p.plan(f)
		require.NoError(t, err)
		cells = append(cells, gridCell{title: p.Title, plan: plan})
	}
	res, err := f.drawGrid(cells, o, f.plotTop())
	require.NoError(t, err)
	return f, res
}

// Invented catches of four harbours in four years, one far above the rest.
var harbours = []string{"North harbour", "East quay", "South pier", "West landing"}
var catches = [][]float64{{120, 80, 45, 10}, {100, 95, 60, 5}, {20, 30, 410, 15}, {60, 70, 50, 40}}

func harbourPanels(vertical, dots bool) []Panel {
	var ps []Panel
	for i, v := range catches {
		c := Common{Title: strconv.Itoa(2021 + i)}
		if dots {
			ps = append(ps, DotsPanel(harbours, v, DotsOptions{Common: c, RowOptions: RowOptions{Unit: "t", Order: ByData}}))
		} else {
			ps = append(ps, BarsPanel(harbours, v, BarsOptions{Common: c, Vertical: vertical, RowOptions: RowOptions{Unit: "t", Order: ByData}}))
		}
	}
	return ps
}

// perUnit is a scale's pixels per unit of data.
func perUnit(l scale.Linear) float64 { return (l.R1 - l.R0) / (l.D1 - l.D0) }

// A grid of four bar panels with shared scales draws a bar of 100 the same
// length in every panel: one pixel-per-unit, read from the scales the
// panels report and from the widths of the bars they drew. Own scales
// differ, because each panel ends on its own ticks.
func TestBarsGridSharedScales(t *testing.T) {
	for _, vertical := range []bool{false, true} {
		t.Run(fmt.Sprint("vertical=", vertical), func(t *testing.T) {
			f, res := gridOf(t, Common{Width: 900}, gridOptions{shareX: true, shareY: true}, harbourPanels(vertical, false)...)
			require.Len(t, res.placed, 4)
			scaleOf := func(p placed) scale.Linear {
				if vertical {
					return p.ys
				}
				return p.xs
			}
			want := perUnit(scaleOf(res.placed[0]))
			for i, p := range res.placed {
				assert.Equal(t, !vertical, p.horizontal)
				assert.InDelta(t, want, perUnit(scaleOf(p)), 1e-9, "panel %d", i)
				assert.Len(t, p.cats, 4)
			}
			// The bars themselves: length over value is one number.
			var ratios []float64
			for _, m := range f.scene.Marks {
				if m.Class != "plumb-mark" {
					continue
				}
				v, err := strconv.ParseFloat(markAttr(m, "value"), 64)
				require.NoError(t, err)
				length := m.W
				if vertical {
					length = m.H
				}
				ratios = append(ratios, length/v)
			}
			require.Len(t, ratios, 16)
			// Each category's place: its centre and the end of its bar, for
			// the layers drawn over the panel.
			first := res.placed[0].cats[0]
			assert.Equal(t, harbours[0], first.label)
			if vertical {
				assert.InDelta(t, res.placed[0].ys.Map(catches[0][0]), first.end, 0.01)
			} else {
				assert.InDelta(t, res.placed[0].xs.Map(catches[0][0]), first.end, 0.01)
			}
			assert.NotEmpty(t, res.placed[0].text)
			assert.Len(t, res.placed[0].marks, 4)
			for _, r := range ratios {
				assert.InDelta(t, math.Abs(want), r, 0.02, "bar length per unit")
			}
		})
	}
	_, own := gridOf(t, Common{Width: 900}, gridOptions{}, harbourPanels(false, false)...)
	assert.NotEqual(t, perUnit(own.placed[0].xs), perUnit(own.placed[2].xs), "own scales differ")
}

func markAttr(m Mark, name string) string {
	for _, a := range m.Attrs {
		if a.Name == name {
			return a.Value
		}
	}
	return ""
}

// Equal category lists are labelled once, on the grid's left edge; a
// shared value axis is labelled under the bottom row only. Different lists
// are labelled in every panel.
func TestBarsGridLabelsOuterPanels(t *testing.T) {
	count := func(f *frame, class string) []int {
		var counts []int
		depth := 0
		for _, m := range f.scene.Marks {
			switch {
			case m.Kind == GroupStart && m.Class == "plumb-panel":
				counts = append(counts, 0)
				depth = 1
			case m.Kind == GroupStart && depth > 0:
				depth++
			case m.Kind == GroupEnd && depth > 0:
				depth--
			case m.Kind == Text && m.Class == class && depth > 0:
				counts[len(counts)-1]++
			}
		}
		return counts
	}
	f, _ := gridOf(t, Common{Width: 900}, gridOptions{cols: 2, shareX: true, shareY: true}, harbourPanels(false, false)...)
	assert.Equal(t, []int{4, 0, 4, 0}, count(f, "plumb-label"), "category labels on the left edge only")
	ticks := count(f, "plumb-tick")
	assert.Zero(t, ticks[0]+ticks[1], "no tick labels inside the grid")
	assert.Positive(t, ticks[2])

	ps := harbourPanels(false, false)
	ps[1] = BarsPanel([]string{"Quay A", "Quay B"}, []float64{3, 4}, BarsOptions{Common: Common{Title: "other"}})
	f, _ = gridOf(t, Common{Width: 900}, gridOptions{cols: 2, shareX: true, shareY: true}, ps...)
	labels := count(f, "plumb-label")
	assert.Equal(t, []int{4, 2, 4, 4}, labels, "different lists: every panel labels its own")

	f, _ = gridOf(t, Common{Width: 900}, gridOptions{cols: 2}, harbourPanels(false, false)...)
	assert.Equal(t, []int{4, 4, 4, 4}, count(f, "plumb-label"), "own scales: every panel labels its own")
	for i, n := range count(f, "plumb-tick") {
		assert.Positive(t, n, "own scales: panel %d labels its axis", i)
	}
}

// Bar and dot panels drawn into grids of random sizes keep their text on
// the canvas and apart, whatever the canvas, medium, count and data.
func TestBarsPanelsInRandomBoxes(t *testing.T) {
	r := rand.New(rand.NewPCG(10, 9))
	words := []string{"North", "harbour", "quay", "Saint", "Agnes", "ferry", "terminal", "pier", "landing", "Oskmouth"}
	media := []Medium{Screen, Print, Slide}
	drawn := 0
	for trial := range 80 {
		n := 1 + r.IntN(6)
		vertical := r.IntN(3) == 0
		panels := make([]Panel, n)
		for i := range panels {
			k := 2 + r.IntN(8)
			labels, values := make([]string, k), make([]float64, k)
			scaleV := math.Pow(10, float64(r.IntN(6)-1))
			for j := range labels {
				var w []string
				for range 1 + r.IntN(4) {
					w = append(w, words[r.IntN(len(words))])
				}
				labels[j] = fmt.Sprintf("%s %d", strings.Join(w, " "), j)
				values[j] = (r.Float64()*1.2 - 0.2) * scaleV
			}
			c := Common{Title: fmt.Sprintf("Panel %d", i+1)}
			second := make([]float64, k)
			for j := range second {
				second[j] = values[j] * (0.5 + r.Float64())
			}
			series := []RowSeries{{"this year", values}, {"last year", second}}
			switch r.IntN(5) {
			case 0:
				panels[i] = DotsPanel(labels, values, DotsOptions{Common: c})
			case 1:
				panels[i] = SeriesDotsPanel(labels, series, DotsOptions{Common: c})
			case 2:
				panels[i] = SeriesBarsPanel(labels, series, BarsOptions{Common: c, Layout: LayoutSide})
			default:
				panels[i] = BarsPanel(labels, values, BarsOptions{Common: c, Vertical: vertical})
			}
		}
		m := media[r.IntN(len(media))]
		c := Common{Title: "Grid of bars", Medium: m}
		if r.IntN(2) == 0 {
			c.Width = 400 + float64(r.IntN(1200))
		}
		s, err := FigureScene(FigureOptions{Common: c, ShareX: r.IntN(2) == 0, ShareY: r.IntN(2) == 0}, panels...)
		if err != nil {
			// Too dense a grid is refused with a reason, never drawn badly.
			assert.Regexp(t, "do not fit|too narrow|too short", err.Error(), "trial %d", trial)
			continue
		}
		drawn++
		t.Run(fmt.Sprint(trial), func(t *testing.T) { assertNoOverlap(t, s) })
	}
	assert.Greater(t, drawn, 40, "most random grids draw")
}

// A bad option of one panel is an *OptionError a Go caller can tell apart.
func TestBarsPanelOptionError(t *testing.T) {
	tests := []struct {
		name   string
		panel  Panel
		option string
	}{
		{"top", BarsPanel(harbours, catches[0], BarsOptions{RowOptions: RowOptions{Top: 1}}), "Top"},
		{"other", BarsPanel(harbours, catches[0], BarsOptions{RowOptions: RowOptions{Other: "most"}}), "Other"},
		{"dots sum", DotsPanel(harbours, catches[0], DotsOptions{RowOptions: RowOptions{Other: OtherSum}}), "Other"},
		{"from cuts bars", BarsPanel(harbours, catches[0], BarsOptions{RowOptions: RowOptions{From: ptr(20.0)}}), "From"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := FigureScene(FigureOptions{}, tc.panel, BarsPanel(harbours, catches[1], BarsOptions{}))
			var oe *OptionError
			require.True(t, errors.As(err, &oe), "%v", err)
			assert.Equal(t, tc.option, oe.Option)
		})
	}
}

// The category axis: bands of equal length, ticks at their centres,
// labels wrapped to the width given, and thinned when they would touch.
func TestCategoryAxis(t *testing.T) {
	f, err := newFrame(Common{})
	require.NoError(t, err)
	cats := make([]catLabel, 12)
	for i := range cats {
		l := fmt.Sprintf("Category %d", i+1)
		cats[i] = catLabel{text: l, full: l}
	}
	a, widest, most, cut := f.categoryAxis(cats, 30, 1000, 2, false)
	assert.Equal(t, 1, most)
	assert.Positive(t, widest)
	assert.NotContains(t, cut, true)
	assert.InDelta(t, 100+15, a.catCentre(100, 0), 1e-9, "first centre half a band in")
	assert.InDelta(t, 100+11.5*30, a.catCentre(100, 11), 1e-9)

	// 360 px for twelve labels of about 70 px: every other or fewer.
	thinned := f.fitCategories(cats, 360, 1000, 1, false)
	require.Less(t, len(thinned.ticks), 12)
	assert.True(t, f.categoriesFit(thinned))
	assert.Equal(t, 0.0, thinned.ticks[0], "thinning keeps the first category")
	stride := thinned.ticks[1] - thinned.ticks[0]
	assert.Equal(t, "Category "+strconv.Itoa(int(stride)+1), thinned.cats[1].lines[0], "kept labels stay with their categories")

	// Wrapped to a narrow width: two lines, the rest shortened and noted as cut.
	long := []catLabel{{text: "Lantern Isles Ferry Company main terminal", full: "Lantern Isles Ferry Company main terminal"}}
	a, _, most, cut = f.categoryAxis(long, 40, 90, 2, true)
	assert.Equal(t, 2, most)
	assert.True(t, cut[0])
	assert.Equal(t, long[0].full, a.cats[0].tip, "a shortened label keeps its full text as a tooltip")

	// Stacked labels fit when their lines fit their bands.
	two := []catTick{{lines: []string{"a", "b"}}, {lines: []string{"c", "d"}}}
	lh := lineHeight(f.spec.text)
	assert.False(t, f.categoriesFit(axis{kind: categoryTicks, ticks: []float64{0, 1}, band: 2*lh - 1, upright: true, cats: two}))
	assert.True(t, f.categoriesFit(axis{kind: categoryTicks, ticks: []float64{0, 1}, band: 2 * lh, upright: true, cats: two}))
}
