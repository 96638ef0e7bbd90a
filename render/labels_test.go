package render

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestSpreadAlong(t *testing.T) {
	cases := map[string]struct {
		want      []float64
		gap, hang float64
		lo, hi    float64
		ok        bool
		unmoved   int // how many labels stay where they want
	}{
		"apart already":  {[]float64{10, 40, 70}, 15, 0, 0, 100, true, 3},
		"crowded":        {[]float64{50, 51, 52}, 15, 0, 0, 100, true, 1}, // the middle one stays, the others move out evenly
		"at the edge":    {[]float64{0, 1}, 15, 5, 0, 100, true, 0},
		"too many":       {[]float64{10, 20, 30, 40}, 30, 0, 0, 60, false, 0},
		"hang too large": {[]float64{10}, 10, 60, 0, 100, false, 0},
	}
	for name, tc := range cases {
		got, ok := spreadAlong(tc.want, tc.gap, tc.hang, tc.lo, tc.hi)
		require.Equal(t, tc.ok, ok, name)
		if !ok {
			continue
		}
		moved := 0
		for i, g := range got {
			assert.GreaterOrEqual(t, g, tc.lo+tc.hang-1e-9, name)
			assert.LessOrEqual(t, g, tc.hi-tc.hang+1e-9, name)
			if i > 0 {
				assert.GreaterOrEqual(t, g-got[i-1], tc.gap-1e-9, "%s: neighbours at least gap apart", name)
			}
			if g != tc.want[i] {
				moved++
			}
		}
		assert.Equal(t, len(got)-tc.unmoved, moved, name)
	}
}

// A key's rows never overlap, whatever mix of line and area swatches.
func TestKeyRowsApart(t *testing.T) {
	f, err := newFrame(Common{})
	require.NoError(t, err)
	rows := []keyRow{
		{swatch: swatchLine, color: f.th.neutral, text: f.th.text, label: "north route", series: "north route"},
		{swatch: swatchArea, color: f.th.accent, text: f.th.text, label: "north above south", tip: "north route above south route"},
		{swatch: swatchArea, color: f.th.neutral, text: f.th.text}, // the swatch alone
	}
	bottom, boxes := f.key(rows, 20, 100)
	require.Len(t, boxes, 2)
	assert.False(t, boxes[0].Overlaps(boxes[1]))
	assert.InDelta(t, 100+f.keyHeight(3), bottom, 1e-9, "keyHeight is what key takes")
	assert.Equal(t, 1, classCount(f.scene, "plumb-legend"))
	assert.Equal(t, 3, classCount(f.scene, "plumb-swatch"))
}
