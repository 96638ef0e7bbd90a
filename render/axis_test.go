package render

import (
	"math"
	"math/rand/v2"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/scale"
)

func TestThin(t *testing.T) {
	num := func(ts []float64) []string { return formatAll(scale.TickFormat(ts, ""), ts) }
	tests := []struct {
		name   string
		ticks  []float64
		stride int
		want   []float64
		labels []string
	}{
		// Zero is read against, so it survives thinning.
		{"counted from zero", []float64{-1, -0.5, 0, 0.5, 1, 1.5}, 2, []float64{-1, 0, 1}, []string{"−1", "0", "1"}},
		{"from the first without zero", []float64{1, 1.5, 2, 2.5, 3}, 2, []float64{1, 2, 3}, []string{"1", "2", "3"}},
		{"stride three", []float64{-20, -10, 0, 10, 20, 30, 40}, 3, []float64{0, 30}, []string{"0", "30"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			a := axis{d0: tc.ticks[0], d1: tc.ticks[len(tc.ticks)-1], ticks: tc.ticks, labels: num(tc.ticks), label: num}
			got := thin(a, tc.stride)
			assert.Equal(t, tc.want, got.ticks)
			// Written again at the kept ticks' precision: "1", not "1.0".
			assert.Equal(t, tc.labels, got.labels)
		})
	}
}

func TestThinCalendarKeepsContext(t *testing.T) {
	var ts []float64
	for d := 28; d <= 33; d++ { // 28 Dec 2023 .. 2 Jan 2024
		ts = append(ts, float64(time.Date(2023, 12, d, 0, 0, 0, 0, time.UTC).Unix()))
	}
	a := axis{kind: timeTicks, d0: ts[0], d1: ts[len(ts)-1], ticks: ts, labels: timeLabels(ts), label: timeLabels}
	got := thin(a, 2)
	require.Len(t, got.ticks, 3)
	// The year the dropped ticks carried is written on a kept one.
	assert.Equal(t, timeLabels(got.ticks), got.labels)
	lone := thin(a, 10)
	assert.Equal(t, a.labels[:1], lone.labels, "a lone calendar tick keeps its full label")
}

// TestFitValueLabelsApart checks the rule every axis shares: on any
// length, the chosen tick labels keep one text height apart, zero is a
// tick when the domain holds it, and short axes carry the fewest nice
// ticks before any is thinned out.
func TestFitValueLabelsApart(t *testing.T) {
	f, err := newFrame(Common{})
	require.NoError(t, err)
	r := rand.New(rand.NewPCG(9, 2))
	for range 300 {
		lo := -math.Pow(10, r.Float64()*8) * float64(r.IntN(2))
		hi := math.Pow(10, r.Float64()*9)
		length := 20 + r.Float64()*600
		k := valueKind{zero: r.IntN(2) == 0, integer: r.IntN(2) == 0, label: func(ts []float64) []string { return formatAll(scale.TickFormat(ts, "$"), ts) }}
		a := f.fitValue(lo, hi, length, true, k)
		require.NotEmpty(t, a.ticks)
		assert.True(t, f.labelsFit(a, length), "[%g, %g] on %g px: %v", lo, hi, length, a.labels)
		if a.d0 <= 0 && a.d1 >= 0 && len(a.ticks) > 1 {
			assert.Contains(t, a.ticks, 0.0, "[%g, %g] on %g px", lo, hi, length)
		}
	}
}

// TestDrawOrientation checks that one drawing path sets both orientations:
// a vertical axis puts its labels at their ticks' heights ending left of
// the plot; a horizontal one centres them under their ticks.
func TestDrawOrientation(t *testing.T) {
	f, err := newFrame(Common{})
	require.NoError(t, err)
	a := axis{d0: 0, d1: 10, ticks: []float64{0, 5, 10}, labels: []string{"0", "5", "10"}}
	pos := scale.Linear{D0: 0, D1: 10, R0: 100, R1: 0}
	f.draw(a, axisDraw{vertical: true, pos: pos, from: 40, to: 300, labelAt: 34, labels: true, baseline: true})
	f.drawBaseline(axisDraw{vertical: true, pos: pos, from: 40, to: 300})
	var grid, ticks, base []Mark
	for _, m := range f.scene.Marks {
		switch m.Class {
		case "plumb-grid":
			grid = append(grid, m)
		case "plumb-tick":
			ticks = append(ticks, m)
		case "plumb-baseline":
			base = append(base, m)
		}
	}
	require.Len(t, grid, 2, "the zero is the baseline, not a grid line")
	assert.Equal(t, []Point{{40, 50}, {300, 50}}, grid[0].Lines[0])
	require.Len(t, ticks, 3)
	for _, m := range ticks {
		assert.Equal(t, End, m.Anchor)
		assert.Equal(t, 34.0, m.X)
	}
	require.Len(t, base, 1)
	assert.Equal(t, []Point{{40, 100}, {300, 100}}, base[0].Lines[0])

	f, err = newFrame(Common{})
	require.NoError(t, err)
	bottom := f.drawXAxis(a, 10, 200, 120, true)
	assert.Greater(t, bottom, 120.0)
	var marks []Mark
	for _, m := range f.scene.Marks {
		if m.Class == "plumb-tick-mark" {
			marks = append(marks, m)
		}
		if m.Class == "plumb-tick" {
			assert.Equal(t, Middle, m.Anchor)
		}
	}
	require.Len(t, marks, 3)
	assert.Equal(t, []Point{{110, 120}, {110, 124}}, marks[1].Lines[0])
}

// TestDrawnTickLabelsApart checks bars and dots through their builders:
// on any canvas, neighbouring tick labels as drawn keep one text height
// apart, including a thinned axis whose data reach past its outer kept
// tick (the label test measures at the domain the ticks give).
func TestDrawnTickLabelsApart(t *testing.T) {
	r := rand.New(rand.NewPCG(9, 3))
	labels := []string{"Delta", "Alpha", "Gamma", "Beta"}
	for range 200 {
		values := make([]float64, len(labels))
		scaleV := math.Pow(10, 1+r.Float64()*6)
		for i := range values {
			values[i] = (r.Float64()*1.2 - 0.2) * scaleV
		}
		common := Common{Medium: []Medium{Screen, Print, Slide}[r.IntN(3)], Width: 140 + float64(r.IntN(400))}
		var s *Scene
		var err error
		if r.IntN(2) == 0 {
			s, err = BarsScene(labels, values, BarsOptions{Common: common})
		} else {
			s, err = DotsScene(labels, values, DotsOptions{Common: common})
		}
		if err != nil {
			continue // a canvas too narrow is refused with an error, never drawn crowded
		}
		f, err := newFrame(common)
		require.NoError(t, err)
		prevR := math.Inf(-1)
		for _, m := range s.Marks {
			if m.Class != "plumb-tick" {
				continue
			}
			w := f.measure(m.Text, m.Size, false)
			assert.GreaterOrEqual(t, m.X-w/2, prevR+m.Size-0.02, "%v at %g px wide on %s", values, common.Width, common.Medium)
			prevR = m.X + w/2
		}
	}
}
