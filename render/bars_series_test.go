package render

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Invented landings of four harbours in three years; the East quay has no
// figure for 2025.
var (
	seriesLabels = []string{"North harbour", "East quay", "South pier", "West landing"}
	seriesYears  = []RowSeries{
		{"2024", []float64{120, 80, 45, 10}},
		{"2025", []float64{100, math.NaN(), 60, 5}},
		{"2026", []float64{90, 99, 70, 12}},
	}
)

// dataMarks returns the data marks of a scene.
func dataMarks(s *Scene) []Mark {
	var out []Mark
	for _, m := range s.Marks {
		if m.Class == "plumb-mark" {
			out = append(out, m)
		}
	}
	return out
}

// One dot per category and series, at the value it stands for, named by
// data-series; the missing value draws nothing.
func TestSeriesDotsOneDotPerValue(t *testing.T) {
	s, err := SeriesDotsScene(seriesLabels, seriesYears, DotsOptions{RowOptions: RowOptions{Unit: "t"}})
	require.NoError(t, err)
	marks := dataMarks(s)
	require.Len(t, marks, 11, "4 categories x 3 series, one missing")
	seen := map[string]bool{}
	for _, m := range marks {
		assert.Equal(t, Circle, m.Kind)
		key := markAttr(m, "label") + "/" + markAttr(m, "series")
		assert.False(t, seen[key], "one dot for %s", key)
		seen[key] = true
	}
	assert.False(t, seen["East quay/2025"])
	assert.Equal(t, "Dot plot of values by category", s.Title, "an untitled chart's accessible name")
	// One axis: x is linear in the value across every series.
	x := func(m Mark) (float64, float64) {
		v, err := strconv.ParseFloat(markAttr(m, "value"), 64)
		require.NoError(t, err)
		return v, m.X
	}
	v0, x0 := x(marks[0])
	v1, x1 := x(marks[1])
	k := (x1 - x0) / (v1 - v0)
	for _, m := range marks {
		v, px := x(m)
		assert.InDelta(t, x0+(v-v0)*k, px, 0.02, "dot of %s", markAttr(m, "series"))
	}
	// Named directly: each series' name once, in the first row's line.
	names := 0
	for _, m := range s.Marks {
		if m.Kind == Text && markAttr(m, "series") != "" {
			names++
		}
	}
	assert.Equal(t, 3, names)
	assertNoOverlap(t, s)
}

// A stack draws its segments end to end from zero in the series' order,
// the total at the end; rows of 100% all end at one x.
func TestSeriesStack(t *testing.T) {
	s, err := SeriesBarsScene(seriesLabels, seriesYears, BarsOptions{Layout: LayoutStack})
	require.NoError(t, err)
	bySeries := map[string][]Mark{}
	rows := map[string][]Mark{}
	for _, m := range dataMarks(s) {
		rows[markAttr(m, "label")] = append(rows[markAttr(m, "label")], m)
		bySeries[markAttr(m, "series")] = append(bySeries[markAttr(m, "series")], m)
	}
	require.Len(t, rows, 4)
	for label, ms := range rows {
		for i := 1; i < len(ms); i++ {
			assert.InDelta(t, ms[i-1].X+ms[i-1].W, ms[i].X, 0.02, "%s: segments end to end", label)
			assert.Less(t, markAttr(ms[i-1], "series"), markAttr(ms[i], "series"), "%s: series in their order", label)
		}
	}
	assert.Contains(t, texts(s), "310", "North harbour's total")

	s, err = SeriesBarsScene(seriesLabels, seriesYears, BarsOptions{Layout: LayoutStack, Percent: true})
	require.NoError(t, err)
	ends := map[string]float64{}
	for _, m := range dataMarks(s) {
		ends[markAttr(m, "label")] = math.Max(ends[markAttr(m, "label")], m.X+m.W)
	}
	for label, e := range ends {
		assert.InDelta(t, ends["North harbour"], e, 0.03, "%s ends at 100%%", label)
	}
	assert.Equal(t, "percent", s.Notes[0].Code)
}

func texts(s *Scene) []string {
	var out []string
	for _, m := range s.Marks {
		if m.Kind == Text {
			out = append(out, m.Text)
		}
	}
	return out
}

// Side by side: one bar per value, in rows of the series' order; more than
// three series are refused with the honest alternative.
func TestSeriesSide(t *testing.T) {
	s, err := SeriesBarsScene(seriesLabels, seriesYears, BarsOptions{Layout: LayoutSide})
	require.NoError(t, err)
	assert.Len(t, dataMarks(s), 11)
	assertNoOverlap(t, s)

	four := append(seriesYears[:3:3], RowSeries{"2027", []float64{1, 2, 3, 4}})
	_, err = SeriesBarsScene(seriesLabels, four, BarsOptions{Layout: LayoutSide})
	var oe *OptionError
	require.True(t, errors.As(err, &oe), "%v", err)
	assert.Equal(t, "Layout", oe.Option)
	assert.ErrorIs(t, err, ErrRefused)
	assert.ErrorContains(t, err, "one dot per series")
}

func TestSeriesRefusals(t *testing.T) {
	neg := []RowSeries{{"a", []float64{1, -2, 3, 4}}, {"b", []float64{1, 2, 3, 4}}}
	tests := []struct {
		name   string
		series []RowSeries
		opt    BarsOptions
		option string // "" for an error that is not an option's
	}{
		{"negative in a stack", neg, BarsOptions{Layout: LayoutStack}, "Layout"},
		{"percent without a stack", seriesYears, BarsOptions{Percent: true}, "Percent"},
		{"vertical", seriesYears, BarsOptions{Vertical: true}, "Vertical"},
		{"unknown layout", seriesYears, BarsOptions{Layout: "heap"}, "Layout"},
		{"short series", []RowSeries{{"a", []float64{1, 2}}}, BarsOptions{}, ""},
		{"no series", nil, BarsOptions{}, ""},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := SeriesBarsScene(seriesLabels, tc.series, tc.opt)
			require.Error(t, err)
			var oe *OptionError
			if tc.option == "" {
				assert.False(t, errors.As(err, &oe), "%v", err)
				return
			}
			require.True(t, errors.As(err, &oe), "%v", err)
			assert.Equal(t, tc.option, oe.Option)
		})
	}
	// A negative value is fine side by side and as a dot.
	_, err := SeriesBarsScene(seriesLabels, neg, BarsOptions{Layout: LayoutSide})
	assert.NoError(t, err)
}

// The Other rule of bars applies to categories: a stack of parts of a
// whole folds the smallest categories into one Other row, summing each
// series; dots leave them out with a note.
func TestSeriesOther(t *testing.T) {
	n := 30
	labels := make([]string, n)
	a, b := make([]float64, n), make([]float64, n)
	for i := range labels {
		labels[i] = fmt.Sprintf("Landing %d", i+1)
		a[i], b[i] = float64(100-i), float64(2*i)
	}
	series := []RowSeries{{"nets", a}, {"lines", b}}
	s, err := SeriesBarsScene(labels, series, BarsOptions{Layout: LayoutStack})
	require.NoError(t, err)
	sumA, sumB := 0.0, 0.0
	for i := range labels {
		sumA, sumB = sumA+a[i], sumB+b[i]
	}
	gotA, gotB := 0.0, 0.0
	rows := map[string]bool{}
	for _, m := range dataMarks(s) {
		v, _ := strconv.ParseFloat(markAttr(m, "value"), 64)
		rows[markAttr(m, "label")] = true
		if markAttr(m, "series") == "nets" {
			gotA += v
		} else {
			gotB += v
		}
	}
	assert.Len(t, rows, DefaultTop)
	assert.InDelta(t, sumA, gotA, 1e-9, "Other sums each series: nothing lost")
	assert.InDelta(t, sumB, gotB, 1e-9)

	d, err := SeriesDotsScene(labels, series, DotsOptions{})
	require.NoError(t, err)
	assert.Len(t, dataMarks(d), 2*DefaultDotsTop)
	codes := map[string]bool{}
	for _, nt := range d.Notes {
		codes[nt.Code] = true
	}
	assert.True(t, codes["left-out"])
}

// Every layout keeps its text apart on random tables, canvases and media.
func TestSeriesTextApart(t *testing.T) {
	r := rand.New(rand.NewPCG(10, 6))
	layouts := []SeriesLayout{LayoutDots, LayoutStack, LayoutSide}
	for trial := range 60 {
		n, k := 1+r.IntN(12), 1+r.IntN(3)
		labels := make([]string, n)
		series := make([]RowSeries, k)
		for s := range series {
			series[s] = RowSeries{Name: fmt.Sprintf("Fleet %c", 'A'+s), Values: make([]float64, n)}
		}
		scaleV := math.Pow(10, float64(r.IntN(5)))
		for i := range labels {
			labels[i] = fmt.Sprintf("Harbour %d of the outer isles", i)
			for s := range series {
				series[s].Values[i] = r.Float64() * scaleV
				if r.IntN(8) == 0 && s > 0 {
					series[s].Values[i] = math.NaN()
				}
			}
		}
		c := Common{Medium: []Medium{Screen, Print, Slide}[r.IntN(3)], Title: "Landings"}
		if r.IntN(2) == 0 {
			c.Width = 360 + float64(r.IntN(900))
		}
		opt := BarsOptions{Common: c, Layout: layouts[r.IntN(3)], Percent: r.IntN(4) == 0}
		if opt.Percent {
			opt.Layout = LayoutStack
		}
		s, err := SeriesBarsScene(labels, series, opt)
		if err != nil {
			assert.Regexp(t, "do not fit|too narrow", err.Error(), "trial %d", trial)
			continue
		}
		t.Run(fmt.Sprint(trial), func(t *testing.T) { assertNoOverlap(t, s) })
	}
}

// BenchmarkSeriesStack plans, folds and draws 10,000 categories of three
// series into a stack of DefaultTop rows.
func BenchmarkSeriesStack(b *testing.B) {
	r := rand.New(rand.NewPCG(1, 2))
	n := 10_000
	labels := make([]string, n)
	series := []RowSeries{{"nets", make([]float64, n)}, {"pots", make([]float64, n)}, {"lines", make([]float64, n)}}
	for i := range labels {
		labels[i] = fmt.Sprintf("Landing %d", i)
		for s := range series {
			series[s].Values[i] = r.Float64() * 1000
		}
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := SeriesBarsScene(labels, series, BarsOptions{Layout: LayoutStack}); err != nil {
			b.Fatal(err)
		}
	}
}
