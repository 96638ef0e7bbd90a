package render

import (
	"bytes"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/layout"
)

// drawOne draws one panel alone, as figureScene does, and returns the
// scene with what the panel reported.
func drawOne(t *testing.T, c Common, p Panel) (*Scene, placed, error) {
	t.Helper()
	f, err := newFrame(c)
	require.NoError(t, err)
	plan, err := p.plan(f)
	require.NoError(t, err)
	res, err := f.drawGrid([]gridCell{{plan: plan, layers: p.layers}}, gridOptions{}, f.plotTop())
	if err != nil {
		return nil, placed{}, err
	}
	return f.finish(res.bottom), res.placed[0], nil
}

func noteCodes(s *Scene) []string {
	var out []string
	for _, n := range s.Notes {
		out = append(out, n.Code)
	}
	return out
}

var islands = []string{"Karsholm", "Vellmar Sound", "Little Ebbe", "Orrin Point", "Saltmere"}

// A reference line sits exactly where the value axis puts its value: on
// the scale the panel drew with, and on the grid line of a tick at the
// same value, on every kind of panel.
func TestRefAtAxisValue(t *testing.T) {
	vals := []float64{42, 118, 75, 96, 61}
	cases := []struct {
		name  string
		panel func(Common) Panel
		ref   float64
	}{
		{"horizontal bars", func(c Common) Panel { return rowsPanel(c, islands, vals, false, false) }, 100},
		{"columns", func(c Common) Panel { return rowsPanel(c, islands, vals, true, false) }, 100},
		{"dots", func(c Common) Panel { return rowsPanel(c, islands, vals, false, true) }, 80},
		{"series", func(c Common) Panel { return seriesPanel(c, []float64{1, 2, 3, 4, 5}, vals, false) }, 100},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			c := Common{Annotations: Annotations{Refs: []Ref{{Value: tc.ref, Text: "Target"}}}}
			s, p, err := drawOne(t, c, tc.panel(c))
			require.NoError(t, err)
			refs := marksOf(s, "plumb-ref")
			require.Len(t, refs, 1)
			assert.Equal(t, strconv.FormatFloat(tc.ref, 'g', -1, 64), dataAttr(refs[0], "value"))
			line := refs[0].Lines[0]
			ax, at := p.ys, line[0].Y
			if p.horizontal {
				ax, at = p.xs, line[0].X
			}
			// The check the issue sets: within 0.5 px of the axis's own mapping.
			assert.InDelta(t, ax.Map(tc.ref), at, 0.5)
			grid := false
			for _, g := range marksOf(s, "plumb-grid") {
				pos := g.Lines[0][0].Y
				if p.horizontal {
					pos = g.Lines[0][0].X
				}
				grid = grid || math.Abs(pos-at) < 0.01
			}
			assert.True(t, grid, "a grid line at the tick %g lies under the reference line", tc.ref)
			labels := marksOf(s, "plumb-ref-label")
			require.Len(t, labels, 1)
			assert.Equal(t, "Target", labels[0].Text)
			assertNoOverlap(t, s)
		})
	}
}

// The mean and the median are computed from the panel's values, and an
// unlabelled line is labelled with its value as the axis writes it.
func TestRefStatistics(t *testing.T) {
	vals := []float64{10, 20, 30, 100}
	c := Common{Annotations: Annotations{Refs: []Ref{{Stat: StatMean}, {Stat: StatMedian}, {Value: 70}}}}
	s, p, err := drawOne(t, c, rowsPanel(c, islands[:4], vals, false, false))
	require.NoError(t, err)
	refs := marksOf(s, "plumb-ref")
	require.Len(t, refs, 3)
	want := map[string]float64{"mean": 40, "median": 25, "": 70}
	for _, r := range refs {
		v := want[dataAttr(r, "stat")]
		assert.Equal(t, strconv.FormatFloat(v, 'g', -1, 64), dataAttr(r, "value"))
		assert.InDelta(t, p.xs.Map(v), r.Lines[0][0].X, 0.5)
	}
	var texts []string
	for _, m := range marksOf(s, "plumb-ref-label") {
		texts = append(texts, m.Text)
	}
	assert.ElementsMatch(t, []string{"mean 40", "median 25", "70"}, texts)
}

// A reference line beyond the data widens the value axis, with a note,
// rather than falling off the plot; so do events and periods on x.
func TestAnnotationsWidenTheDomain(t *testing.T) {
	c := Common{Annotations: Annotations{Refs: []Ref{{Value: 500, Text: "Capacity"}}}}
	s, p, err := drawOne(t, c, rowsPanel(c, islands, []float64{42, 118, 75, 96, 61}, false, false))
	require.NoError(t, err)
	assert.GreaterOrEqual(t, p.xs.D1, 500.0)
	assert.Contains(t, noteCodes(s), "annotation-domain")
	assert.Contains(t, s.Notes[slices.Index(noteCodes(s), "annotation-domain")].Text, "500")
	ref := marksOf(s, "plumb-ref")[0]
	assert.InDelta(t, p.xs.Map(500), ref.Lines[0][0].X, 0.5)

	c = Common{Annotations: Annotations{
		Events:  []Event{{X: -3, Text: "Survey starts"}},
		Periods: []Period{{From: 8, To: 12, Text: "Dry dock"}},
	}}
	s, p, err = drawOne(t, c, seriesPanel(c, []float64{1, 2, 3, 4, 5, 6}, []float64{3, 5, 4, 6, 7, 6}, false))
	require.NoError(t, err)
	assert.LessOrEqual(t, p.xs.D0, -3.0)
	assert.GreaterOrEqual(t, p.xs.D1, 12.0)
	n := 0
	for _, note := range s.Notes {
		if note.Code == "annotation-domain" {
			n++
			assert.False(t, note.Changed, "widening an axis leaves the data as it was")
		}
	}
	assert.Equal(t, 2, n, "one note for the event and one for the period")

	// Inside the data: no note.
	c = Common{Annotations: Annotations{Refs: []Ref{{Value: 50}}}}
	s, _, err = drawOne(t, c, rowsPanel(c, islands, []float64{42, 118, 75, 96, 61}, false, false))
	require.NoError(t, err)
	assert.NotContains(t, noteCodes(s), "annotation-domain")
}

// An event on a date axis is drawn at that date, and a period's shade is
// behind everything the panel drew.
func TestEventAndPeriodOnDates(t *testing.T) {
	day := func(y int, m time.Month, d int) time.Time { return time.Date(y, m, d, 0, 0, 0, 0, time.UTC) }
	var x, y []float64
	for i := range 24 {
		x = append(x, seconds(day(2020, time.Month(1+i), 1)))
		y = append(y, 100+10*math.Sin(float64(i)/3))
	}
	at := day(2020, 9, 14)
	c := Common{Annotations: Annotations{
		Events:  []Event{{At: at, Text: "New timetable"}},
		Periods: []Period{{FromAt: day(2021, 3, 1), ToAt: day(2021, 6, 1), Text: "Harbour works"}},
	}}
	s, p, err := drawOne(t, c, seriesPanel(c, x, y, true))
	require.NoError(t, err)
	ev := marksOf(s, "plumb-event")
	require.Len(t, ev, 1)
	assert.Equal(t, "2020-09-14T00:00:00Z", dataAttr(ev[0], "x"))
	assert.InDelta(t, p.xs.Map(seconds(at)), ev[0].Lines[0][0].X, 0.5)
	assert.Equal(t, "New timetable", marksOf(s, "plumb-event-label")[0].Text)

	per := marksOf(s, "plumb-period")
	require.Len(t, per, 1)
	assert.Equal(t, "2021-03-01T00:00:00Z", dataAttr(per[0], "from"))
	assert.Equal(t, "2021-06-01T00:00:00Z", dataAttr(per[0], "to"))
	assert.InDelta(t, p.xs.Map(seconds(day(2021, 3, 1))), per[0].X, 0.5)
	assert.InDelta(t, p.xs.Map(seconds(day(2021, 6, 1))), per[0].X+per[0].W, 0.5)
	iPeriod := slices.IndexFunc(s.Marks, func(m Mark) bool { return m.Class == "plumb-period" })
	for i, m := range s.Marks {
		if m.Class == "plumb-mark" || m.Class == "plumb-grid" {
			assert.Less(t, iPeriod, i, "the shade is drawn before the data and the grid")
		}
	}
	assertNoOverlap(t, s)

	// A number given on a date axis, and a date on a number axis, are
	// refused with the reason.
	c = Common{Annotations: Annotations{Events: []Event{{X: 2021}}}}
	_, _, err = drawOne(t, c, seriesPanel(c, x, y, true))
	var oe *OptionError
	require.ErrorAs(t, err, &oe)
	assert.Equal(t, "Events", oe.Option)
	assert.ErrorContains(t, err, "dates")

	// A bare year given both ways fits either axis.
	both := Event{X: 2021, At: day(2021, 1, 1), Text: "2021"}
	for _, isTime := range []bool{true, false} {
		xs := x
		if !isTime {
			xs = []float64{2019, 2020, 2021, 2022}
		}
		c = Common{Annotations: Annotations{Events: []Event{both}}}
		s, _, err = drawOne(t, c, seriesPanel(c, xs, y[:len(xs)], isTime))
		require.NoError(t, err)
		assert.Len(t, marksOf(s, "plumb-event"), 1)
	}
}

// A callout sits beside its category's mark, past the value label, and
// names the category it belongs to.
func TestCalloutBesideItsMark(t *testing.T) {
	vals := []float64{42, 118, 75, 96, 61}
	for _, vertical := range []bool{false, true} {
		c := Common{Annotations: Annotations{Callouts: []Callout{{Label: "Little Ebbe", Text: "new pier"}}}}
		s, p, err := drawOne(t, c, rowsPanel(c, islands, vals, vertical, false))
		require.NoError(t, err)
		co := marksOf(s, "plumb-callout")
		require.Len(t, co, 1)
		assert.Equal(t, "Little Ebbe", dataAttr(co[0], "label"))
		cat := p.cats[2]
		if vertical {
			assert.InDelta(t, cat.centre, co[0].X, 1, "centred over its column")
			assert.Less(t, co[0].Y, cat.end, "above the column")
		} else {
			assert.Greater(t, co[0].X, cat.end, "right of the bar's end")
			assert.InDelta(t, cat.centre, co[0].Y, lineHeight(13), "on the bar's row")
		}
		assert.Empty(t, marksOf(s, "plumb-leader"), "in its own place: no leader")
		assertNoOverlap(t, s)
	}
}

// A callout on a negative bar or column goes beyond its end, away from
// zero, where its value label is.
func TestCalloutOnNegativeMarks(t *testing.T) {
	vals := []float64{42, -8, 75, -60, 20} // room beyond the callout's bar, left of -8
	for _, vertical := range []bool{false, true} {
		c := Common{Width: 800, Annotations: Annotations{Callouts: []Callout{{Label: "Vellmar Sound", Text: "fewer sailings"}}}}
		s, p, err := drawOne(t, c, rowsPanel(c, islands, vals, vertical, false))
		require.NoError(t, err)
		co := marksOf(s, "plumb-callout")
		require.NotEmpty(t, co)
		cat := p.cats[1]
		if vertical {
			assert.Greater(t, co[0].Y, cat.end, "under the negative column")
		} else {
			assert.Less(t, co[0].X, cat.end, "left of the negative bar")
			assert.Equal(t, End, co[0].Anchor)
		}
		assertNoOverlap(t, s)
	}
}

// Every bad annotation is an OptionError naming the option, whose cause
// says what would work.
func TestAnnotationErrors(t *testing.T) {
	vals := []float64{42, 118, 75}
	rows := func(c Common) Panel { return rowsPanel(c, islands[:3], vals, false, false) }
	series := func(c Common) Panel { return seriesPanel(c, []float64{1, 2, 3}, vals, false) }
	day := time.Date(2021, 1, 1, 0, 0, 0, 0, time.UTC)
	cases := []struct {
		name   string
		a      Annotations
		panel  func(Common) Panel
		option string
		want   string
	}{
		{"NaN reference", Annotations{Refs: []Ref{{Value: math.NaN()}}}, rows, "Refs", "finite"},
		{"infinite reference", Annotations{Refs: []Ref{{Value: math.Inf(1)}}}, rows, "Refs", "finite"},
		{"unknown statistic", Annotations{Refs: []Ref{{Stat: "mode"}}}, rows, "Refs", `"mean", "median"`},
		{"NaN event", Annotations{Events: []Event{{X: math.NaN()}}}, series, "Events", "finite"},
		{"event on categories", Annotations{Events: []Event{{X: 1}}}, rows, "Events", "reference line instead"},
		{"period backwards", Annotations{Periods: []Period{{From: 3, To: 1}}}, series, "Periods", "start is not before its end"},
		{"period of dates backwards", Annotations{Periods: []Period{{FromAt: day.AddDate(1, 0, 0), ToAt: day}}}, series, "Periods", "earlier date first"},
		{"period with one date", Annotations{Periods: []Period{{FromAt: day, To: 3}}}, series, "Periods", "both ends"},
		{"unknown callout label", Annotations{Callouts: []Callout{{Label: "Karsholn", Text: "busiest"}}}, rows, "Callouts", `did you mean "Karsholm"?`},
		{"callout without text", Annotations{Callouts: []Callout{{Label: "Karsholm"}}}, rows, "Callouts", "needs a text"},
		{"callout on a series", Annotations{Callouts: []Callout{{Label: "a", Text: "b"}}}, series, "Callouts", "no categories"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			c := Common{Annotations: tc.a}
			_, err := FigureScene(FigureOptions{}, tc.panel(c))
			var oe *OptionError
			require.ErrorAs(t, err, &oe)
			assert.Equal(t, tc.option, oe.Option)
			assert.ErrorIs(t, err, ErrAnnotation)
			assert.ErrorContains(t, err, tc.want)
		})
	}
}

// A chart that joins a figure whole (not yet a plan) reports no scales:
// its annotations are refused rather than drawn in the wrong place or
// dropped.
func TestAnnotationsOnWholeChartsAreRefused(t *testing.T) {
	c := Common{Annotations: Annotations{Refs: []Ref{{Value: 2}}}}
	_, err := FigureScene(FigureOptions{}, BarsPanel([]string{"a", "b"}, []float64{1, 3}, BarsOptions{Common: c}))
	var oe *OptionError
	require.ErrorAs(t, err, &oe)
	assert.Equal(t, "Refs", oe.Option)
}

// Property: whatever the annotations, the chart kind, the medium and the
// canvas, no annotation text overlaps any other text or leaves the canvas,
// every reference line lies within 0.5 px of its value's place on the axis,
// and the scene holds no NaN or Inf.
func TestAnnotationsNeverOverlap(t *testing.T) {
	r := rand.New(rand.NewPCG(6, 9))
	words := strings.Fields("target last year's mean harbour works new timetable storm season fleet renewal pier closed record crossing winter schedule strike fuel price cap")
	phrase := func() string {
		n := 1 + r.IntN(6)
		out := make([]string, n)
		for i := range out {
			out[i] = words[r.IntN(len(words))]
		}
		return strings.Join(out, " ")
	}
	media := []Medium{Screen, Print, Slide}
	placedLabels, refused := 0, 0
	for trial := range 120 {
		kind := r.IntN(4) // bars, columns, dots, series
		n := 3 + r.IntN(8)
		labels, vals := make([]string, n), make([]float64, n)
		scaleV := math.Pow(10, float64(r.IntN(5)-1))
		for i := range labels {
			labels[i] = fmt.Sprintf("%s %d", islands[i%len(islands)], i)
			vals[i] = (0.2 + r.Float64()) * scaleV
			if trial%3 == 0 && r.IntN(3) == 0 {
				vals[i] = -vals[i] // negative bars and columns grow the other way
			}
		}
		var a Annotations
		for range r.IntN(4) {
			ref := Ref{Value: (r.Float64()*1.6 - 0.1) * scaleV, Text: phrase()}
			if r.IntN(4) == 0 {
				ref = Ref{Stat: []string{StatMean, StatMedian}[r.IntN(2)]}
			}
			a.Refs = append(a.Refs, ref)
		}
		if kind == 3 {
			for range r.IntN(4) {
				a.Events = append(a.Events, Event{X: r.Float64()*float64(n+2) - 1, Text: phrase()})
			}
			for range r.IntN(3) {
				from := r.Float64() * float64(n)
				a.Periods = append(a.Periods, Period{From: from, To: from + 0.5 + r.Float64()*3, Text: phrase()})
			}
		} else {
			for range r.IntN(4) {
				a.Callouts = append(a.Callouts, Callout{Label: labels[r.IntN(n)], Text: phrase()})
			}
		}
		c := Common{Annotations: a}
		var p Panel
		switch kind {
		case 3:
			xs := make([]float64, n)
			for i := range xs {
				xs[i] = float64(i)
			}
			p = seriesPanel(c, xs, vals, false)
		default:
			p = rowsPanel(c, labels, vals, kind == 1, kind == 2)
		}
		fc := Common{Title: "Passengers by route", Source: "invented", Medium: media[r.IntN(3)]}
		if r.IntN(2) == 0 {
			fc.Width = 320 + float64(r.IntN(900))
		}
		fc.Annotations = a
		s, pl, err := drawOne(t, fc, p)
		if err != nil {
			// A callout with no free place, or a slide canvas too narrow
			// for the plot, is refused with the reason.
			assert.Regexp(t, "finds no free place|do not fit|too narrow|too short", err.Error(), "trial %d", trial)
			refused++
			continue
		}
		t.Run(fmt.Sprint(trial), func(t *testing.T) {
			assertNoOverlap(t, s)
			refs := marksOf(s, "plumb-ref")
			require.Len(t, refs, len(a.Refs))
			for _, m := range refs {
				v, err := strconv.ParseFloat(dataAttr(m, "value"), 64)
				require.NoError(t, err)
				if pl.horizontal {
					assert.InDelta(t, pl.xs.Map(v), m.Lines[0][0].X, 0.5)
				} else {
					assert.InDelta(t, pl.ys.Map(v), m.Lines[0][0].Y, 0.5)
				}
			}
			var b bytes.Buffer
			require.NoError(t, WriteSVG(&b, s))
			assertFinite(t, b.Bytes())
			// A label left out is said in a note that counts as a change.
			hidden := 0
			for _, m := range s.Marks {
				if m.Tooltip != "" && (m.Class == "plumb-ref" || m.Class == "plumb-event" || m.Class == "plumb-period") {
					hidden++
				}
			}
			if hidden > 0 {
				assert.Contains(t, noteCodes(s), "annotation-hidden")
				for _, n := range s.Notes {
					if n.Code == "annotation-hidden" {
						assert.True(t, n.Changed)
					}
				}
			}
		})
		placedLabels += len(marksOf(s, "plumb-ref-label")) + len(marksOf(s, "plumb-callout")) + len(marksOf(s, "plumb-event-label"))
	}
	assert.Greater(t, placedLabels, 200, "the trials place many labels")
	assert.Less(t, refused, 10, "few trials are refused")
}

// The placer wraps a label that is too long for one line and shortens one
// too long for any, keeping the whole text as a tooltip.
func TestPlaceTextWrapsThenShortens(t *testing.T) {
	f, err := newFrame(Common{})
	require.NoError(t, err)
	p := &placed{}
	bounds := layout.Box{X: 10, Y: 10, W: 130, H: 200}
	long := "the harbour was closed for the whole winter season while the new breakwater was built"
	_, _, ok := f.placeText(p, nil, nil, bounds, noteText{text: long, class: "plumb-ref-label"}, Point{10, 10}, func(w, h float64) []spot {
		return []spot{{layout.Box{X: 10, Y: 10, W: w, H: h}, Start}}
	})
	require.True(t, ok)
	lines := marksOf(f.scene, "plumb-ref-label")
	assert.Greater(t, len(lines), 1, "wrapped")
	assert.Equal(t, long, lines[0].Tooltip, "cut after three lines: the whole text is the tooltip")

	// A box that holds one short line only: the text is shortened, at
	// the place the scan finds (a note with a leader may go anywhere).
	f, _ = newFrame(Common{})
	p = &placed{}
	_, _, ok = f.placeText(p, nil, nil, layout.Box{W: 90, H: 20}, noteText{text: long, class: "plumb-ref-label", leader: true}, Point{}, func(w, h float64) []spot { return nil })
	require.True(t, ok)
	lines = marksOf(f.scene, "plumb-ref-label")
	require.Len(t, lines, 1)
	assert.True(t, strings.HasSuffix(lines[0].Text, "…"), lines[0].Text)
	assert.Equal(t, long, lines[0].Tooltip)

	// No room at all: nothing is drawn and ok is false.
	f, _ = newFrame(Common{})
	_, _, ok = f.placeText(&placed{}, nil, nil, layout.Box{W: 10, H: 5}, noteText{text: long, leader: true}, Point{}, func(w, h float64) []spot { return nil })
	assert.False(t, ok)
	assert.Empty(t, f.scene.Marks)
}

// BenchmarkAnnotations draws a 30-row bar panel without annotations and
// with eight, the placing of their labels included.
func BenchmarkAnnotations(b *testing.B) {
	labels, vals := make([]string, 30), make([]float64, 30)
	for i := range labels {
		labels[i] = fmt.Sprintf("%s %d", islands[i%len(islands)], i)
		vals[i] = float64(100 + (i*37)%250)
	}
	a := Annotations{
		Refs:     []Ref{{Value: 200, Text: "Break-even"}, {Stat: StatMean}, {Stat: StatMedian}, {Value: 400, Text: "Capacity of the fleet"}},
		Callouts: []Callout{{Label: labels[3], Text: "new pier"}, {Label: labels[10], Text: "closed in winter"}, {Label: labels[20], Text: "fare cut in May"}, {Label: labels[29], Text: "new route"}},
	}
	for _, bc := range []struct {
		name string
		a    Annotations
	}{{"none", Annotations{}}, {"eight", a}} {
		p := rowsPanel(Common{Annotations: bc.a}, labels, vals, false, false)
		b.Run(bc.name, func(b *testing.B) {
			for b.Loop() {
				if _, err := FigureScene(FigureOptions{}, p); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// In a grid, each panel draws its own annotations in its own cell, and a
// reference that widens one panel's axis widens every panel sharing it.
func TestAnnotationsInAGrid(t *testing.T) {
	x := []float64{1, 2, 3, 4, 5, 6}
	var panels []Panel
	for i := range 4 {
		y := []float64{10, 12, 11, 14, 13, 15}
		a := Annotations{Events: []Event{{X: 3.5, Text: "Refit"}}}
		if i == 0 {
			a.Refs = []Ref{{Value: 40, Text: "Capacity"}}
		}
		p := seriesPanel(Common{Annotations: a}, x, y, false)
		p.Title = fmt.Sprintf("Vessel %c", 'A'+i)
		panels = append(panels, p)
	}
	f, err := newFrame(Common{Title: "Fuel", Width: 800})
	require.NoError(t, err)
	var cells []gridCell
	for _, p := range panels {
		plan, err := p.plan(f)
		require.NoError(t, err)
		cells = append(cells, gridCell{title: p.Title, plan: plan, layers: p.layers})
	}
	res, err := f.drawGrid(cells, gridOptions{cols: 2, shareY: true}, f.plotTop())
	require.NoError(t, err)
	s := f.finish(res.bottom)
	assertNoOverlap(t, s)
	assert.Len(t, marksOf(s, "plumb-event"), 4)
	assert.Len(t, marksOf(s, "plumb-ref"), 1)
	for i, p := range res.placed {
		assert.GreaterOrEqual(t, p.ys.D1, 40.0, "panel %d shares the widened axis", i)
	}
}
