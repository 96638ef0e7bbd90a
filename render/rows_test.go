package render

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestNaturalCompare(t *testing.T) {
	// Readers expect "Route 9" before "Route 10" (common practice).
	ordered := []string{"Route 2", "route 9", "Route 10", "Route 10a", "Route 100", "Sound", "sound 1"}
	for i := 0; i+1 < len(ordered); i++ {
		assert.Negative(t, naturalCompare(ordered[i], ordered[i+1]), "%q < %q", ordered[i], ordered[i+1])
		assert.Positive(t, naturalCompare(ordered[i+1], ordered[i]), "%q > %q", ordered[i+1], ordered[i])
	}
	assert.Zero(t, naturalCompare("Same", "Same"))
	assert.NotZero(t, naturalCompare("a", "A"), "case-insensitive first, but a total order")
}

func TestArrange(t *testing.T) {
	rows := func() []row {
		// e is largest but last by label, so value and label orders differ.
		return []row{{label: "b", value: 2}, {label: "a", value: 5}, {label: "e", value: 9}, {label: "c", value: 2}, {label: "d", value: -1}}
	}
	labels := func(rs []row) string {
		var s []string
		for _, r := range rs {
			s = append(s, r.label)
		}
		return strings.Join(s, "")
	}
	for _, tc := range []struct {
		order Order
		want  string
	}{
		{"", "eabcd"}, // largest first; ties by label
		{ByValue, "eabcd"},
		{ByLabel, "abcde"},
		{ByData, "baecd"},
	} {
		rs := rows()
		require.NoError(t, arrange(rs, tc.order))
		assert.Equal(t, tc.want, labels(rs), "order %q", tc.order)
	}
	assert.Error(t, arrange(rows(), "sideways"))
}

func TestCombineTail(t *testing.T) {
	var rs []row
	for i := 1; i <= 20; i++ {
		rs = append(rs, row{label: fmt.Sprintf("c%d", i), value: float64(100 - i), raw: float64(100 - i)})
	}
	t.Run("sum", func(t *testing.T) {
		got, note := combineTail(rs, 12, true)
		require.Len(t, got, 12)
		other := got[11]
		assert.Equal(t, "Other (9)", other.label)
		assert.Equal(t, 9, other.other)
		want := 0.0
		for i := 12; i <= 20; i++ {
			want += float64(100 - i)
		}
		assert.Equal(t, want, other.value)
		assert.Contains(t, note, "combined the 9 smallest of 20")
	})
	t.Run("mean", func(t *testing.T) {
		got, note := combineTail(rs, 12, false)
		assert.InDelta(t, (88.0+80.0)/2, got[11].value, 1e-12)
		assert.Contains(t, note, "averaged")
	})
	t.Run("highlight is never hidden", func(t *testing.T) {
		hl := append([]row(nil), rs...)
		hl[19].highlight = true
		got, _ := combineTail(hl, 12, true)
		assert.Equal(t, "c20", got[10].label)
		assert.Equal(t, "Other (9)", got[11].label)
	})
	t.Run("few rows unchanged", func(t *testing.T) {
		got, note := combineTail(rs[:5], 12, true)
		assert.Len(t, got, 5)
		assert.Empty(t, note)
	})
}

func TestRefusals(t *testing.T) {
	from, to := 50.0, 10.0
	for name, opt := range map[string]BarsOptions{
		"from cuts bars":      {RowOptions: RowOptions{From: &from}},
		"to cuts bars":        {RowOptions: RowOptions{To: &to}},
		"percent of negative": {Percent: true},
	} {
		t.Run(name, func(t *testing.T) {
			_, err := BarsScene([]string{"a", "b", "c"}, []float64{60, 40, -5}, opt)
			require.Error(t, err)
			assert.True(t, errors.Is(err, ErrRefused), "%v", err)
		})
	}
	_, err := DotsScene([]string{"a", "b"}, []float64{60, 40}, DotsOptions{RowOptions: RowOptions{From: &from}})
	assert.True(t, errors.Is(err, ErrRefused), "dots may not hide values: %v", err)
}

func TestBadInput(t *testing.T) {
	for name, tc := range map[string]struct {
		labels []string
		values []float64
	}{
		"lengths differ": {[]string{"a"}, []float64{1, 2}},
		"empty":          {nil, nil},
		"NaN":            {[]string{"a"}, []float64{math.NaN()}},
		"Inf":            {[]string{"a"}, []float64{math.Inf(1)}},
	} {
		_, err := BarsScene(tc.labels, tc.values, BarsOptions{})
		assert.Error(t, err, name)
	}
	_, err := BarsScene([]string{"North"}, []float64{1}, BarsOptions{RowOptions: RowOptions{Highlight: []string{"Nroth"}}})
	require.Error(t, err)
	assert.Contains(t, err.Error(), `did you mean "North"`)
}

func TestTextSizesPerMedium(t *testing.T) {
	// Minimum text sizes: print 7 pt = 9.33 px at 96 px per inch (common
	// practice for journals); screen 12 px and slides 24 px as plumb's own floor.
	minimum := map[Medium]float64{Print: 7 * 96.0 / 72, Screen: 12, Slide: 24}
	labels := []string{"Saltmarrow Point to Kettlewick Harbour via Little Osk", "b", "c"}
	for m, least := range minimum {
		s, err := BarsScene(labels, []float64{3, 2, -1}, BarsOptions{RowOptions: RowOptions{Common: Common{Medium: m, Title: "T", Subtitle: "S", Source: "src", Note: "n"}}})
		require.NoError(t, err)
		for _, mk := range s.Marks {
			if mk.Kind == Text {
				assert.GreaterOrEqual(t, mk.Size, least, "%s: %q", m, mk.Text)
			}
		}
		if m == Slide {
			assert.Equal(t, 1920.0, s.Width)
			assert.Equal(t, 1080.0, s.Height)
		}
	}
}

func TestEmbedFont(t *testing.T) {
	s, err := BarsScene([]string{"a"}, []float64{1}, BarsOptions{RowOptions: RowOptions{Common: Common{EmbedFont: true}}})
	require.NoError(t, err)
	require.NotEmpty(t, s.Font.Data)
	var b strings.Builder
	require.NoError(t, WriteSVG(&b, s))
	assert.Contains(t, b.String(), "@font-face")
	family := FontFamilyName(s.Font)
	assert.Regexp(t, `^plumb-font-[0-9a-f]{16}$`, family)
	assert.Contains(t, b.String(), `font-family="`+family+`, Go, sans-serif"`)
	assert.Contains(t, b.String(), `@font-face{font-family:"`+family+`"`)
}
