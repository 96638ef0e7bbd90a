package render

import (
	"bytes"
	"errors"
	"math"
	"regexp"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// notFinite finds the words Go and SVG use for numbers that are not
// finite. A chart must never carry them: "NaN%" is not a label and
// "M0,-Inf" draws nothing.
var notFinite = regexp.MustCompile(`(^|[^\pL])(NaN|[+\-−]Inf)([^\pL]|$)`)

// assertFinite fails when an SVG holds NaN or Inf anywhere.
func assertFinite(t *testing.T, svg []byte) {
	t.Helper()
	if loc := notFinite.FindIndex(svg); loc != nil {
		lo, hi := max(0, loc[0]-120), min(len(svg), loc[1]+60)
		t.Errorf("output holds %q: …%s…", svg[loc[0]:loc[1]], svg[lo:hi])
	}
}

// checkExtreme draws one chart: it must give an error or a finite SVG.
func checkExtreme(t *testing.T, draw func(w *bytes.Buffer) error) {
	t.Helper()
	var b bytes.Buffer
	if err := draw(&b); err != nil {
		t.Log(err)
		assert.NotContains(t, err.Error(), "NaN%", "error text")
		return
	}
	assertFinite(t, b.Bytes())
}

func TestExtremeDataNeverWritesNaNOrInf(t *testing.T) {
	const big = 1.7e308
	values := map[string][]float64{
		"near max float":     {big, big, big / 2},
		"max and min":        {math.MaxFloat64, -math.MaxFloat64, 1},
		"smallest subnormal": {5e-324, 1e-323, 2e-323},
		"tiny":               {1e-300, 2e-300, 3e-300},
		"huge range":         {1e-300, 1e300, 1},
		"huge equal":         {1e308, 1e308, 1e308},
		"ones and a max":     {1, 1, math.MaxFloat64},
	}
	labels := []string{"North", "South", "East"}
	for name, v := range values {
		t.Run(name, func(t *testing.T) {
			for _, pct := range []bool{false, true} {
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Bars(w, labels, v, BarsOptions{Percent: pct})
					return err
				})
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Bars(w, labels, v, BarsOptions{Percent: pct, Vertical: true})
					return err
				})
			}
			checkExtreme(t, func(w *bytes.Buffer) error {
				_, err := Dots(w, labels, v, DotsOptions{})
				return err
			})
			x := []float64{1, 2, 3}
			for _, index := range []bool{false, true} {
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Lines(w, []Series{{Name: "a", X: x, Y: v}}, LinesOptions{Index: index})
					return err
				})
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Lines(w, []Series{{Name: "a", X: v, Y: x}}, LinesOptions{Index: index})
					return err
				})
			}
			for _, ctx := range []bool{false, true} {
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Diff(w, Series{X: x, Y: v}, Series{X: x, Y: []float64{0, 1, 2}}, DiffOptions{Context: ctx})
					return err
				})
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Diff(w, Series{X: v, Y: x}, Series{X: v, Y: []float64{3, 1, 2}}, DiffOptions{Context: ctx})
					return err
				})
				neg := make([]float64, len(v))
				for i := range v {
					neg[i] = -v[i]
				}
				checkExtreme(t, func(w *bytes.Buffer) error {
					_, err := Diff(w, Series{X: x, Y: v}, Series{X: x, Y: neg}, DiffOptions{Context: ctx})
					return err
				})
			}
		})
	}
}

// TestPercentOfHugeValues checks the shares of values whose total
// overflows: once every share printed as "NaN%".
func TestPercentOfHugeValues(t *testing.T) {
	s, err := BarsScene([]string{"a", "b", "c", "d"}, []float64{1.7e308, 1.7e308, 1.7e308, 1.7e308}, BarsOptions{Percent: true})
	require.NoError(t, err)
	for _, m := range s.Marks {
		if m.Class == "plumb-mark" {
			assert.Equal(t, "25", dataAttr(m, "value"))
		}
	}
}

// TestIndexOnTinyBase checks a rebase on 1e-300: the index is 100 at the
// base and the ratios are kept, or the chart is refused.
func TestIndexOnTinyBase(t *testing.T) {
	x := []float64{1, 2, 3}
	s, err := LinesScene([]Series{{Name: "a", X: x, Y: []float64{1e-300, 2e-300, 3e-300}}}, LinesOptions{Index: true})
	require.NoError(t, err)
	var b bytes.Buffer
	require.NoError(t, WriteSVG(&b, s))
	assertFinite(t, b.Bytes())
	_, err = LinesScene([]Series{{Name: "a", X: x, Y: []float64{1e-300, 1e10, 3}}}, LinesOptions{Index: true})
	require.ErrorIs(t, err, ErrRefused)
	var r *RefusalError
	require.ErrorAs(t, err, &r)
	assert.Contains(t, r.Instead, "IndexAt")
}

func TestOptionErrors(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	labels, values := []string{"a", "b"}, []float64{1, 2}
	x := []float64{1, 2}
	tests := []struct {
		name   string
		option string
		cause  error
		draw   func() error
	}{
		{"NaN width", "Width", ErrNotFinite, func() error {
			_, err := BarsScene(labels, values, BarsOptions{Common: Common{Width: nan}})
			return err
		}},
		{"infinite width", "Width", ErrNotFinite, func() error {
			_, err := DotsScene(labels, values, DotsOptions{Common: Common{Width: inf}})
			return err
		}},
		{"negative height", "Height", ErrNegative, func() error {
			_, err := LinesScene([]Series{{X: x, Y: values}}, LinesOptions{Common: Common{Height: -1}})
			return err
		}},
		{"huge width", "Width", ErrTooLarge, func() error {
			_, err := DiffScene(Series{X: x, Y: values}, Series{X: x, Y: x}, DiffOptions{Common: Common{Width: 1e308}})
			return err
		}},
		{"NaN from", "From", ErrNotFinite, func() error {
			_, err := BarsScene(labels, values, BarsOptions{RowOptions: RowOptions{From: &nan}})
			return err
		}},
		{"infinite to", "To", ErrNotFinite, func() error {
			_, err := DotsScene(labels, values, DotsOptions{RowOptions: RowOptions{To: &inf}})
			return err
		}},
		{"unknown medium", "Medium", nil, func() error {
			_, err := BarsScene(labels, values, BarsOptions{Common: Common{Medium: "poster"}})
			return err
		}},
		{"bad aspect", "Aspect", nil, func() error {
			_, err := LinesScene([]Series{{X: x, Y: values}}, LinesOptions{Aspect: "NaN:1"})
			return err
		}},
		{"NaN index point", "IndexAt", ErrNotFinite, func() error {
			_, err := LinesScene([]Series{{X: x, Y: values}}, LinesOptions{IndexAt: &nan})
			return err
		}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.draw()
			var oe *OptionError
			require.True(t, errors.As(err, &oe), "%v is not an *OptionError", err)
			assert.Equal(t, tc.option, oe.Option)
			if tc.cause != nil {
				assert.ErrorIs(t, err, tc.cause)
			}
			assert.Contains(t, err.Error(), tc.option)
			assert.False(t, errors.Is(err, ErrRefused), "bad input, not a refusal")
		})
	}
}

func TestRefusalErrorAs(t *testing.T) {
	_, err := BarsScene([]string{"a", "b"}, []float64{60, 40}, BarsOptions{RowOptions: RowOptions{From: new(50.0)}})
	var r *RefusalError
	require.ErrorAs(t, err, &r)
	assert.ErrorIs(t, err, ErrRefused)
	assert.NotEmpty(t, r.Reason)
	assert.Contains(t, r.Instead, "dot plot")
	assert.Equal(t, r.Reason+"; "+r.Instead, r.Error())
	var oe *OptionError
	require.ErrorAs(t, err, &oe, "a bound that cuts bars is also an option error")
	assert.Equal(t, "From", oe.Option)
}

func TestTimeSeries(t *testing.T) {
	day := func(d int) time.Time { return time.Date(2024, 3, d, 0, 0, 0, 0, time.UTC) }
	ts := []time.Time{day(1), day(2), day(3), day(4)}
	s := TimeSeries("riders", ts, []float64{3, 4, 2, 5})
	assert.True(t, s.IsTime())
	assert.Equal(t, float64(day(1).Unix()), s.X[0])
	assert.True(t, s.Times()[3].Equal(day(4)))

	sc, err := LinesScene([]Series{s}, LinesOptions{})
	require.NoError(t, err)
	assert.Contains(t, sc.Desc, "over time", "a calendar axis without the Time flag")

	// Mixing instants and plain numbers has no common axis.
	_, err = LinesScene([]Series{s, {Name: "plain", X: []float64{1, 2}, Y: []float64{1, 2}}}, LinesOptions{})
	assert.Error(t, err)

	d, err := DiffScene(s, TimeSeries("target", ts, []float64{3, 3, 3, 3}), DiffOptions{})
	require.NoError(t, err)
	assert.Contains(t, d.Desc, "over time")
}

func TestMillisecondsNoted(t *testing.T) {
	// 2024-03-01 in milliseconds since 1970, flagged as times.
	ms := []float64{1709251200000, 1709337600000, 1709424000000}
	y := []float64{1, 3, 2}
	codes := func(s *Scene) []string {
		var c []string
		for _, n := range s.Notes {
			c = append(c, n.Code)
		}
		return c
	}
	s, err := LinesScene([]Series{{Name: "a", X: ms, Y: y}}, LinesOptions{Time: true})
	require.NoError(t, err)
	assert.Contains(t, codes(s), "milliseconds")
	d, err := DiffScene(Series{X: ms, Y: y}, Series{X: ms, Y: []float64{2, 2, 2}}, DiffOptions{Time: true})
	require.NoError(t, err)
	assert.Contains(t, codes(d), "milliseconds")
	// Seconds are not noted.
	sec := []float64{1709251200, 1709337600, 1709424000}
	s, err = LinesScene([]Series{{Name: "a", X: sec, Y: y}}, LinesOptions{Time: true})
	require.NoError(t, err)
	assert.NotContains(t, codes(s), "milliseconds")
}

func TestDiffMatchesX(t *testing.T) {
	tests := []struct {
		name         string
		ax, bx       []float64
		wantX        []float64
		onlyA, onlyB int
	}{
		{"same x", []float64{1, 2, 3}, []float64{1, 2, 3}, []float64{1, 2, 3}, 0, 0},
		{"b starts later", []float64{1, 2, 3, 4}, []float64{3, 4}, []float64{3, 4}, 2, 0},
		{"interleaved", []float64{1, 3, 5, 7}, []float64{2, 3, 4, 7, 8}, []float64{3, 7}, 2, 3},
		{"disjoint", []float64{1, 2}, []float64{3, 4}, nil, 2, 2},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			a := Series{X: tc.ax, Y: make([]float64, len(tc.ax))}
			b := Series{X: tc.bx, Y: make([]float64, len(tc.bx))}
			x, av, bv, onlyA, onlyB := matchX(a, b)
			assert.Equal(t, tc.wantX, x)
			assert.Len(t, av, len(x))
			assert.Len(t, bv, len(x))
			assert.Equal(t, tc.onlyA, onlyA)
			assert.Equal(t, tc.onlyB, onlyB)
		})
	}
	// Different x: drawn at the shared ones, with a note that says so.
	s, err := DiffScene(Series{Name: "east", X: []float64{1, 2, 3, 4}, Y: []float64{1, 2, 3, 4}},
		Series{Name: "west", X: []float64{2, 3, 4, 5}, Y: []float64{2, 2, 2, 2}}, DiffOptions{})
	require.NoError(t, err)
	found := false
	for _, n := range s.Notes {
		if n.Code == "unmatched-x" {
			found = true
			assert.True(t, n.Changed)
			assert.Contains(t, n.Text, "3 x values both")
		}
	}
	assert.True(t, found, "notes %v", s.Notes)
	_, err = DiffScene(Series{X: []float64{1, 2}, Y: []float64{1, 2}}, Series{X: []float64{3, 4}, Y: []float64{1, 2}}, DiffOptions{})
	assert.Error(t, err, "no shared x")
}
