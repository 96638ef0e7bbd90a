package render

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/internal/stats"
)

// Hyndman & Fan (1996) type 7, worked values from methods.md section 8
// (checked there against R 4.2.2 quantile(type = 7) and Python's
// statistics.quantiles(method = "inclusive")).
func TestQuantile7(t *testing.T) {
	cases := []struct {
		x         []float64
		q1, m, q3 float64
	}{
		{[]float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30}, 4.25, 6.5, 8.75},
		{[]float64{1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 100}, 3.5, 6, 8.5},
		{[]float64{7}, 7, 7, 7},        // one value is every quantile
		{[]float64{1, 3}, 1.5, 2, 2.5}, // h = p: a quarter of the way, by hand
	}
	for _, tc := range cases {
		assert.InDelta(t, tc.q1, stats.Quantile(tc.x, 0.25), 1e-12, "%v", tc.x)
		assert.InDelta(t, tc.m, stats.Quantile(tc.x, 0.5), 1e-12, "%v", tc.x)
		assert.InDelta(t, tc.q3, stats.Quantile(tc.x, 0.75), 1e-12, "%v", tc.x)
	}
	assert.True(t, math.IsNaN(stats.Quantile(nil, 0.5)))
}

func TestMeanSD(t *testing.T) {
	// By hand: deviations -3, -1, 4 from 13; 26 / (3 - 1) = 13.
	m, sd := meanSD([]float64{10, 12, 17})
	assert.InDelta(t, 13, m, 1e-12)
	assert.InDelta(t, math.Sqrt(13), sd, 1e-12)
	// Large values of small spread keep their digits.
	m, sd = meanSD([]float64{1e9 + 1, 1e9 + 3})
	assert.InDelta(t, 1e9+2, m, 1e-6)
	assert.InDelta(t, math.Sqrt2, sd, 1e-6)
	// Values near the largest number: no square overflows.
	m, sd = meanSD([]float64{-math.MaxFloat64 / 2, math.MaxFloat64 / 2})
	assert.Equal(t, 0.0, m)
	assert.InDelta(t, 1, sd/(math.Sqrt2/2*math.MaxFloat64), 1e-12)
	_, sd = meanSD([]float64{3, 3, 3})
	assert.Equal(t, 0.0, sd)
	_, err := LinesScene([]Series{{X: []float64{1, 1, 2, 2}, Y: []float64{-math.MaxFloat64, math.MaxFloat64, 1, 2}}}, LinesOptions{Agg: AggMean, Spread: SpreadSD})
	assert.ErrorContains(t, err, "beyond the largest number")
	_, sd = meanSD([]float64{5})
	assert.True(t, math.IsNaN(sd), "one value has no sample standard deviation")
}

// subjects are repeated measurements of invented subjects: four weeks, a
// score per subject and week, rows out of order and one missing. Week 3
// has one measurement (n = 1). Group B is group A plus 30.
func subjects() []Series {
	x := []float64{2, 1, 1, 2, 4, 3, 1, 2, 4, 2, 1}
	y := []float64{11, 10, 12, 15, 18, 14, 17, 19, 22, 20, math.NaN()}
	b := make([]float64, len(y))
	for i, v := range y {
		b[i] = v + 30
	}
	return []Series{{Name: "A", X: x, Y: y}, {Name: "B", X: x, Y: b}}
}

// The hand computation of group A, per week 1..4: values {10, 12, 17},
// {11, 15, 19, 20}, {14}, {18, 22}.
var subjectsByHand = map[string]struct{ y, lo, hi []float64 }{
	"mean/none":  {y: []float64{13, 16.25, 14, 20}},
	"mean/range": {y: []float64{13, 16.25, 14, 20}, lo: []float64{10, 11, 14, 18}, hi: []float64{17, 20, 14, 22}},
	// Type 7: week 2 Q1 at h = 0.75 is 11 + 0.75 * 4 = 14, Q3 at h = 2.25 is 19 + 0.25 * 1.
	"median/iqr": {y: []float64{12, 17, 14, 20}, lo: []float64{11, 14, 14, 19}, hi: []float64{14.5, 19.25, 14, 21}},
	// Sample sd: week 1 √(26/2), week 2 √(50.75/3), week 4 √(8/1); none for one value.
	"mean/sd": {y: []float64{13, 16.25, 14, 20},
		lo: []float64{13 - math.Sqrt(13), 16.25 - math.Sqrt(50.75/3), math.NaN(), 20 - math.Sqrt(8)},
		hi: []float64{13 + math.Sqrt(13), 16.25 + math.Sqrt(50.75/3), math.NaN(), 20 + math.Sqrt(8)}},
	"median/range": {y: []float64{12, 17, 14, 20}, lo: []float64{10, 11, 14, 18}, hi: []float64{17, 20, 14, 22}},
}

func TestSummariseByHand(t *testing.T) {
	for key, want := range subjectsByHand {
		agg, spread, _ := strings.Cut(key, "/")
		t.Run(key, func(t *testing.T) {
			out, sum, err := summarise(subjects(), agg, spread)
			require.NoError(t, err)
			require.Len(t, out, 2)
			a := out[0]
			assert.Equal(t, []float64{1, 2, 3, 4}, a.X)
			assert.Equal(t, []int{3, 4, 1, 2}, a.n)
			assert.InDeltaSlice(t, want.y, a.Y, 1e-12)
			if want.lo == nil {
				assert.Nil(t, a.lo)
			} else {
				assertNaNDelta(t, want.lo, a.lo)
				assertNaNDelta(t, want.hi, a.hi)
			}
			for i := range want.y {
				assert.InDelta(t, want.y[i]+30, out[1].Y[i], 1e-9)
			}
			assert.Equal(t, 1, sum.nlo)
			assert.Equal(t, 4, sum.nhi)
			assert.Equal(t, []float64{3}, sum.single)
			assert.Equal(t, 2, sum.left, "week 1's missing score, in each group")
		})
	}
}

func assertNaNDelta(t *testing.T, want, got []float64) {
	t.Helper()
	require.Len(t, got, len(want))
	for i := range want {
		if math.IsNaN(want[i]) {
			assert.True(t, math.IsNaN(got[i]), "index %d: want NaN, got %v", i, got[i])
			continue
		}
		assert.InDelta(t, want[i], got[i], 1e-9, "index %d", i)
	}
}

// The drawn chart: the line's vertices are the summary values and the
// band's vertices the spread at each x, read back through the mapping the
// line itself shows (two of its vertices fix it).
func TestAggBandVertices(t *testing.T) {
	for key, want := range subjectsByHand {
		agg, spread, _ := strings.Cut(key, "/")
		t.Run(key, func(t *testing.T) {
			s, err := LinesScene(subjects(), LinesOptions{Agg: agg, Spread: spread})
			require.NoError(t, err)
			var line Mark
			firstBand, firstLine := -1, -1
			for i, m := range s.Marks {
				switch {
				case m.Class == "plumb-mark" && dataAttr(m, "series") == "A":
					line = m
					firstLine = max(firstLine, i)
				case m.Class == "plumb-band" && firstBand < 0:
					firstBand = i
				}
			}
			require.NotEmpty(t, line.Lines)
			pts := line.Lines[0]
			require.Len(t, pts, 4)
			// y = a + b·value from weeks 1 and 2; x = c + d·week likewise.
			b := (pts[1].Y - pts[0].Y) / (want.y[1] - want.y[0])
			a := pts[0].Y - b*want.y[0]
			d := pts[1].X - pts[0].X
			c := pts[0].X - d
			for i, p := range pts {
				assert.InDelta(t, a+b*want.y[i], p.Y, 0.02, "line at week %d", i+1)
			}
			bands := marksOf(s, "plumb-band")
			if want.lo == nil {
				assert.Empty(t, bands)
				return
			}
			require.Len(t, bands, 2, "one band per series")
			assert.Less(t, firstBand, firstLine, "bands are drawn behind the lines")
			band := bands[0]
			assert.Equal(t, "A", dataAttr(band, "series"))
			assert.Equal(t, spread, dataAttr(band, "spread"))
			assert.True(t, band.Closed)
			assert.InDelta(t, bandOpacity, band.Opacity, 0)
			// The runs of weeks with a band of their own; a run of one week
			// (week 4 after the sd's gap at n = 1) has no area.
			var runs [][]int
			var cur []int
			for i := range want.lo {
				if math.IsNaN(want.lo[i]) {
					if len(cur) > 1 {
						runs = append(runs, cur)
					}
					cur = nil
					continue
				}
				cur = append(cur, i)
			}
			if len(cur) > 1 {
				runs = append(runs, cur)
			}
			require.Len(t, band.Lines, len(runs))
			for k, run := range runs {
				piece := band.Lines[k]
				require.Len(t, piece, 2*len(run))
				for j, i := range run {
					top, bot := piece[j], piece[len(piece)-1-j]
					assert.InDelta(t, c+d*float64(i+1), top.X, 0.02)
					assert.InDelta(t, c+d*float64(i+1), bot.X, 0.02)
					assert.InDelta(t, a+b*want.hi[i], top.Y, 0.02, "high at week %d", i+1)
					assert.InDelta(t, a+b*want.lo[i], bot.Y, 0.02, "low at week %d", i+1)
				}
			}
		})
	}
}

func noteOf(s *Scene, code string) (Note, bool) {
	for _, n := range s.Notes {
		if n.Code == code {
			return n, true
		}
	}
	return Note{}, false
}

func TestAggNotes(t *testing.T) {
	s, err := LinesScene(subjects(), LinesOptions{Agg: AggMedian})
	require.NoError(t, err)
	n, ok := noteOf(s, "agg")
	require.True(t, ok)
	assert.True(t, n.Changed)
	assert.Contains(t, n.Text, "median")
	assert.Contains(t, n.Text, "n = 1 to 4 per x; n = 1 at 3)")
	assert.Contains(t, n.Text, "interquartile range")
	assert.Contains(t, n.Text, "left out 2 missing values at x values that hold others")
	_, ok = noteOf(s, "band-overlap")
	assert.False(t, ok, "bands 30 apart do not overlap")
	assert.Contains(t, s.Desc, "Each line is the median of the values at each x")

	// Two groups with the same spread overlap everywhere.
	same := subjects()
	same[1].Y = same[0].Y
	s, err = LinesScene(same, LinesOptions{Agg: AggMean, Spread: SpreadRange})
	require.NoError(t, err)
	n, ok = noteOf(s, "band-overlap")
	require.True(t, ok)
	assert.Contains(t, n.Text, `"A" and "B"`)

	// No repeats: said, and no band drawn.
	s, err = LinesScene([]Series{{Name: "A", X: []float64{1, 2, 3}, Y: []float64{4, 5, 7}}}, LinesOptions{Agg: AggMedian})
	require.NoError(t, err)
	n, _ = noteOf(s, "agg")
	assert.Contains(t, n.Text, "no x value repeats")
	for _, b := range marksOf(s, "plumb-band") {
		for _, p := range b.Lines {
			assert.Equal(t, p[0].Y, p[len(p)-1].Y, "a band of no width")
		}
	}
}

func TestAggRefusalAndOptions(t *testing.T) {
	_, err := LinesScene(subjects(), LinesOptions{})
	require.Error(t, err)
	assert.True(t, errors.Is(err, ErrRefused))
	assert.Contains(t, err.Error(), "two points at x = 1")
	assert.Contains(t, err.Error(), "Agg mean or median")
	_, err = LinesScene(subjects(), LinesOptions{Common: Common{Names: OptionNames{"Agg": "--agg"}}})
	assert.Contains(t, err.Error(), "--agg mean or median")

	for _, tc := range []struct {
		opt    LinesOptions
		option string
	}{
		{LinesOptions{Agg: "mode"}, "Agg"},
		{LinesOptions{Agg: AggMean, Spread: "var"}, "Spread"},
		{LinesOptions{Spread: SpreadIQR}, "Spread"},
	} {
		_, err := LinesScene(subjects(), tc.opt)
		var oe *OptionError
		require.True(t, errors.As(err, &oe), "%+v: %v", tc.opt, err)
		assert.Equal(t, tc.option, oe.Option)
	}
}

// Annotations read the summary: a reference line at the mean is the mean
// of the drawn summary values.
func TestAggRefMean(t *testing.T) {
	opt := LinesOptions{Agg: AggMean}
	opt.Refs = []Ref{{Stat: "mean"}}
	s, err := LinesScene(subjects()[:1], opt)
	require.NoError(t, err)
	refs := marksOf(s, "plumb-ref")
	require.Len(t, refs, 1)
	// (13 + 16.25 + 14 + 20) / 4, by hand.
	assert.Equal(t, "15.8125", dataAttr(refs[0], "value"))
}

// An index rebases the band with its line.
func TestAggIndex(t *testing.T) {
	opt := LinesOptions{Agg: AggMean, Spread: SpreadRange, Index: true}
	c, err := newLineChart(subjects()[:1], opt, false)
	require.NoError(t, err)
	s := c.series[0]
	assert.InDeltaSlice(t, []float64{100, 125, 100 * 14 / 13.0, 100 * 20 / 13.0}, s.Y, 1e-9)
	assert.InDeltaSlice(t, []float64{100 * 10 / 13.0, 100 * 11 / 13.0, 100 * 14 / 13.0, 100 * 18 / 13.0}, s.lo, 1e-9)
	assert.InDeltaSlice(t, []float64{100 * 17 / 13.0, 100 * 20 / 13.0, 100 * 14 / 13.0, 100 * 22 / 13.0}, s.hi, 1e-9)
}

func TestXTextsOneForm(t *testing.T) {
	day := func(y, m, d int) float64 { return float64(time.Date(y, time.Month(m), d, 0, 0, 0, 0, time.UTC).Unix()) }
	k := xKind{time: true}
	assert.Equal(t, []string{"1 Jan 2024", "5 Jan 2024"}, xTexts([]float64{day(2024, 1, 1), day(2024, 1, 5)}, k))
	assert.Equal(t, []string{"Jan 2024", "Mar 2024"}, xTexts([]float64{day(2024, 1, 1), day(2024, 3, 1)}, k))
	assert.Equal(t, []string{"2023", "2024"}, xTexts([]float64{day(2023, 1, 1), day(2024, 1, 1)}, k))
	assert.Equal(t, []string{"2023", "2024"}, xTexts([]float64{2023, 2024}, xKind{integer: true, years: true}))
}

// BenchmarkAggScene: 200,000 repeated measurements of three series over
// 1,000 x values, summarised to medians with their quartiles and drawn.
func BenchmarkAggScene(b *testing.B) {
	r := rand.New(rand.NewPCG(1, 2))
	series := make([]Series, 3)
	for i := range series {
		n := 200_000 / 3
		x, y := make([]float64, n), make([]float64, n)
		for j := range x {
			x[j] = float64(r.IntN(1000))
			y[j] = x[j]*0.01 + r.NormFloat64()
		}
		series[i] = Series{Name: fmt.Sprintf("s%d", i+1), X: x, Y: y}
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := LinesScene(series, LinesOptions{Agg: AggMedian}); err != nil {
			b.Fatal(err)
		}
	}
}

// A band over more x values than four per pixel column keeps each
// column's lowest low and highest high, at most four vertices a column.
func TestAggBandReduced(t *testing.T) {
	n := 5000
	x, y := make([]float64, 2*n), make([]float64, 2*n)
	for i := range n {
		v := math.Sin(float64(i) / 300)
		x[2*i], y[2*i] = float64(i), v-0.1-0.05*float64(i%7)
		x[2*i+1], y[2*i+1] = float64(i), v+0.1+0.05*float64(i%5)
	}
	s, err := LinesScene([]Series{{Name: "a", X: x, Y: y}}, LinesOptions{Agg: AggMean, Spread: SpreadRange})
	require.NoError(t, err)
	line := marksOf(s, "plumb-mark")[0].Lines[0]
	band := marksOf(s, "plumb-band")
	require.Len(t, band, 1)
	pts := band[0].Lines[0]
	w := line[len(line)-1].X - line[0].X
	assert.LessOrEqual(t, float64(len(pts)), 4*(w+1), "vertices per column")
	// The line's first and last vertices are the first and last means.
	mean := func(i int) float64 { return (y[2*i] + y[2*i+1]) / 2 }
	b := (line[len(line)-1].Y - line[0].Y) / (mean(n-1) - mean(0))
	a := line[0].Y - b*mean(0)
	top, bottom := math.Inf(1), math.Inf(-1)
	for _, p := range pts {
		top, bottom = math.Min(top, p.Y), math.Max(bottom, p.Y)
	}
	lo, hi, _ := dataRange(y)
	assert.InDelta(t, a+b*hi, top, 0.05, "the highest high")
	assert.InDelta(t, a+b*lo, bottom, 0.05, "the lowest low")
}

// FuzzAgg: any repeated measurements either draw, with every band vertex
// finite and every summary between its band, or are refused; never a panic.
func FuzzAgg(f *testing.F) {
	f.Add([]byte{1, 10, 1, 12, 2, 11, 2, 30, 3, 7}, uint8(0))
	f.Add([]byte{0, 0, 0, 255, 0, 128}, uint8(5))
	f.Fuzz(func(t *testing.T, data []byte, mode uint8) {
		var x, y []float64
		for i := 0; i+1 < len(data); i += 2 {
			x = append(x, float64(data[i]%16))
			v := float64(data[i+1])
			switch data[i+1] {
			case 255:
				v = math.NaN()
			case 254:
				v = 1e300
			}
			y = append(y, v)
		}
		aggs := []string{AggMean, AggMedian}
		spreads := []string{"", SpreadRange, SpreadIQR, SpreadSD, SpreadNone}
		opt := LinesOptions{Agg: aggs[int(mode)%2], Spread: spreads[int(mode/2)%5]}
		series, _, err := summarise([]Series{{Name: "a", X: x, Y: y}}, opt.Agg, spreadOr(opt))
		if err != nil {
			return
		}
		for _, s := range series {
			for i := range s.X {
				// A mean may lie outside the quartiles; every centre lies
				// within the range, a median within the quartiles too, and
				// a mean within its ± sd band.
				sp := spreadOr(opt)
				inside := sp == SpreadRange || (sp == SpreadSD && opt.Agg == AggMean) || (sp == SpreadIQR && opt.Agg == AggMedian)
				if s.lo == nil || math.IsNaN(s.lo[i]) || math.IsNaN(s.Y[i]) || !inside {
					continue
				}
				if s.Y[i] < s.lo[i] || s.Y[i] > s.hi[i] {
					t.Fatalf("summary %v outside its band %v..%v at x = %v", s.Y[i], s.lo[i], s.hi[i], s.X[i])
				}
			}
		}
		sc, err := LinesScene([]Series{{Name: "a", X: x, Y: y}}, opt)
		if err != nil {
			return
		}
		for _, m := range marksOf(sc, "plumb-band") {
			for _, p := range m.Lines {
				for _, pt := range p {
					if math.IsNaN(pt.X) || math.IsInf(pt.X, 0) || math.IsNaN(pt.Y) || math.IsInf(pt.Y, 0) {
						t.Fatalf("band vertex %v", pt)
					}
				}
			}
		}
	})
}

// spreadOr is the spread LinesScene draws for opt.
func spreadOr(opt LinesOptions) string {
	s, _ := opt.aggSpread()
	return s
}
