package render

import (
	"fmt"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/scale"
)

// medians is one invented row per area with a median: values that do not
// add up, so nothing may be summed into Other.
func medians(n int) ([]string, []float64) {
	r := rand.New(rand.NewPCG(5, 6))
	labels := make([]string, n)
	values := make([]float64, n)
	for i := range labels {
		labels[i] = fmt.Sprintf("Area %d", i+1)
		values[i] = float64(60000 + r.IntN(90000))
	}
	return labels, values
}

func countClass(s *Scene, k Kind, class string) int {
	n := 0
	for _, m := range s.Marks {
		if m.Kind == k && m.Class == class {
			n++
		}
	}
	return n
}

func TestBarsDrawEveryMedian(t *testing.T) {
	labels, values := medians(200)
	s, err := BarsScene(labels, values, BarsOptions{})
	require.NoError(t, err)
	assert.Equal(t, 200, countClass(s, Rect, "plumb-mark"), "200 areas, 200 bars")
	for _, n := range s.Notes {
		assert.NotEqual(t, "other", n.Code)
	}
	// On a slide the canvas is fixed: the largest that fit, and the rest
	// named in a note and under the chart.
	s, err = BarsScene(labels, values, BarsOptions{Common: Common{Medium: Slide}})
	require.NoError(t, err)
	drawn := countClass(s, Rect, "plumb-mark")
	assert.Less(t, drawn, 200)
	var noted, under bool
	for _, n := range s.Notes {
		noted = noted || n.Code == "left-out"
	}
	for _, m := range s.Marks {
		under = under || (m.Class == "plumb-note" && strings.Contains(m.Text, fmt.Sprintf("%d of 200 categories shown", drawn)))
	}
	assert.True(t, noted && under, "left out, and said so twice")
}

func TestOtherModes(t *testing.T) {
	labels, values := medians(20)
	for _, tc := range []struct {
		opt        BarsOptions
		bars       int
		other      bool
		wantLeftOn bool
	}{
		{BarsOptions{}, 20, false, false},
		{BarsOptions{RowOptions: RowOptions{Top: 5}}, 5, false, true},
		{BarsOptions{RowOptions: RowOptions{Top: 5, Other: OtherMean}}, 5, true, false},
		{BarsOptions{Additive: true}, DefaultTop, true, false},
		{BarsOptions{Additive: true, RowOptions: RowOptions{Other: OtherNone}}, 20, false, false},
		{BarsOptions{RowOptions: RowOptions{Top: 5, Highlight: []string{labels[0], labels[1], labels[2], labels[3], labels[4], labels[5]}}}, 6, false, true},
	} {
		s, err := BarsScene(labels, values, tc.opt)
		require.NoError(t, err)
		assert.Equal(t, tc.bars, countClass(s, Rect, "plumb-mark"), "%+v", tc.opt)
		var other, left bool
		for _, n := range s.Notes {
			other = other || n.Code == "other"
			left = left || n.Code == "left-out"
		}
		assert.Equal(t, tc.other, other, "%+v", tc.opt)
		assert.Equal(t, tc.wantLeftOn, left, "%+v", tc.opt)
	}
	_, err := DotsScene(labels, values, DotsOptions{RowOptions: RowOptions{Other: OtherSum}})
	assert.Error(t, err, "dots are positions, never summed")
}

// TestBarsTickFloor: the value axis of a bar chart carries at least the
// floor of labelled ticks for its length, zero among them, whole numbers
// for whole-number data, whatever the values.
func TestBarsTickFloor(t *testing.T) {
	r := rand.New(rand.NewPCG(9, 10))
	for range 200 {
		n := 1 + r.IntN(15)
		labels := make([]string, n)
		values := make([]float64, n)
		integer := r.IntN(2) == 0
		for i := range values {
			labels[i] = fmt.Sprintf("c%d", i)
			values[i] = (r.Float64()*2 - 0.5) * float64(1+r.IntN(20000))
			if integer {
				values[i] = float64(int(values[i]))
			}
		}
		medium := []Medium{Screen, Print, Slide}[r.IntN(3)]
		s, c := drawRowChart(t, labels, values, BarsOptions{Common: Common{Medium: medium}}, false)
		var ticks []float64
		minX, maxX := 1e9, -1e9
		for _, m := range s.Marks {
			if m.Class == "plumb-tick" {
				minX, maxX = min(minX, m.X), max(maxX, m.X)
			}
		}
		ticks = c.ax.ticks
		length := maxX - minX
		assert.GreaterOrEqual(t, len(ticks), scale.MinTicks(length), "%v on %s: ticks %v over %g px", values, medium, ticks, length)
		assert.Contains(t, ticks, 0.0)
		if integer && c.d1-c.d0 >= 2 {
			for _, v := range ticks {
				assert.Equal(t, float64(int64(v)), v, "whole-number data, ticks %v", ticks)
			}
		}
	}
}

func TestCalendarShort(t *testing.T) {
	for in, want := range map[string]string{"September": "Sep", "sept": "Sep", "Tues.": "Tue", "may": "May", "Sunday": "Sun"} {
		got, ok := calendarShort(in)
		assert.True(t, ok, in)
		assert.Equal(t, want, got, in)
	}
	_, ok := calendarShort("Marchmont")
	assert.False(t, ok)
}

func TestAxisTitleSaysUnitOnce(t *testing.T) {
	for _, tc := range []struct{ name, unit, want string }{
		{"rainfall_mm", "mm", "rainfall_mm"},
		{"Weight (g)", "g", "Weight (g)"},
		{"points", "pts", "points (pts)"},
		{"fare", "£", "fare"}, // the currency sign is on every tick
		{"gain", " pts", "gain (pts)"},
	} {
		c := rowChart{opt: BarsOptions{RowOptions: RowOptions{ValueName: tc.name, Unit: tc.unit}}}
		c.opt.Unit = strings.TrimSpace(c.opt.Unit)
		assert.Equal(t, tc.want, c.axisTitle())
	}
}

func TestDotsOnSlideLeaveOutWhatDoesNotFit(t *testing.T) {
	labels, values := medians(60)
	s, err := DotsScene(labels, values, DotsOptions{Common: Common{Medium: Slide}})
	require.NoError(t, err)
	drawn := countClass(s, Circle, "plumb-mark")
	assert.Less(t, drawn, DefaultDotsTop)
	assert.Greater(t, drawn, 5)
	var noted bool
	for _, n := range s.Notes {
		noted = noted || n.Code == "left-out"
	}
	assert.True(t, noted)
}

// TestColumnsKeepTheirValues: value labels too wide for their columns
// take three significant digits before they are dropped (issue 7, item 15).
func TestColumnsKeepTheirValues(t *testing.T) {
	labels := []string{"January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"}
	values := make([]float64, len(labels))
	for i := range values {
		values[i] = 118750 + float64(i)*12345.5
	}
	// A small value beside six-digit ones: in full ("$118,750") the labels
	// are wider than the columns, and a shared k would print it "$1k".
	values[11] = 950
	s, err := BarsScene(labels, values, BarsOptions{Vertical: true, RowOptions: RowOptions{Order: ByData, Unit: "$"}})
	require.NoError(t, err)
	var texts []string
	for _, m := range s.Marks {
		if m.Class == "plumb-value" {
			texts = append(texts, m.Text)
		}
		if m.Class == "plumb-label" {
			assert.NotContains(t, m.Text, "…", "calendar words are abbreviated, never cut")
			assert.LessOrEqual(t, len(m.Text), 3, m.Text)
		}
	}
	require.Len(t, texts, 12, "every column keeps its value")
	assert.Equal(t, "$119k", texts[0])
	assert.Equal(t, "$950", texts[11])
	for _, n := range s.Notes {
		assert.NotEqual(t, "value-labels-dropped", n.Code)
	}
}

// On canvases too narrow for the fewest nice ticks that keep zero, tick
// labels are thinned rather than overlapped.
func TestNarrowBarAxisThinsTicks(t *testing.T) {
	labels := []string{"a", "b", "c", "d"}
	values := []float64{-121, 1502, 800, 300}
	for w := 120.0; w <= 400; w += 10 {
		for _, dots := range []bool{false, true} {
			var s *Scene
			var err error
			if dots {
				s, err = DotsScene(labels, values, DotsOptions{Common: Common{Width: w}})
			} else {
				s, err = BarsScene(labels, values, BarsOptions{Common: Common{Width: w}})
			}
			require.NoError(t, err)
			ticks := 0
			for _, m := range s.Marks {
				if m.Kind == Text && m.Class == "plumb-tick" {
					ticks++
				}
			}
			if w >= 160 {
				assert.GreaterOrEqual(t, ticks, 2, "width %g: at least two labelled ticks", w)
			}
			assertNoOverlap(t, s)
		}
	}
}

// drawRowChart draws a bar chart or dot plot alone in its figure and
// returns the plan with the scene, for tests that read its axis.
func drawRowChart(t *testing.T, labels []string, values []float64, opt BarsOptions, dots bool) (*Scene, *rowChart) {
	t.Helper()
	f, err := newFrame(opt.Common)
	require.NoError(t, err)
	c, err := newRowChart(f, labels, values, opt, dots)
	require.NoError(t, err)
	res, err := f.drawGrid([]gridCell{{plan: c}}, gridOptions{}, f.plotTop())
	require.NoError(t, err)
	return f.finish(res.bottom), c
}
