package render

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestHistPanelsShareBins draws three groups of different spread on shared
// bins: every bar's edges are multiples of one width, and a bin drawn in
// two panels sits at the same x in each (shared scale, aligned plots).
func TestHistPanelsShareBins(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 4))
	var groups []Group
	for i, name := range []string{"Spring", "Summer", "Autumn"} {
		var v []float64
		for range 200 + 100*i {
			v = append(v, 10+float64(i)*6+rng.NormFloat64()*(2+float64(i)))
		}
		groups = append(groups, Group{Label: name, Values: v})
	}
	s, err := FigureScene(FigureOptions{Columns: 1, ShareX: true, ShareY: true}, HistPanels(groups, HistOptions{ValueName: "temperature"})...)
	require.NoError(t, err)
	type bar struct{ x, w float64 }
	at := map[string][]bar{} // low edge: the bar in each panel
	width := 0.0
	dx := 0.0
	bins := 0
	for _, m := range s.Marks {
		if m.Kind == GroupStart && m.Class == "plumb-panel" {
			dx = m.DX
		}
		if m.Kind != Rect || m.Class != "plumb-mark plumb-bin" {
			continue
		}
		var lo, hi string
		for _, a := range m.Attrs {
			switch a.Name {
			case "low":
				lo = a.Value
			case "high":
				hi = a.Value
			}
		}
		var l, h float64
		_, _ = fmtSscan(lo, &l), fmtSscan(hi, &h)
		if width == 0 {
			width = h - l
		}
		assert.InDelta(t, width, h-l, 1e-9, "one width in every panel")
		assert.InDelta(t, 0, math.Remainder(l, width), 1e-9, "edges on multiples of the width")
		at[lo] = append(at[lo], bar{m.X + dx, m.W})
		bins++
	}
	require.Greater(t, bins, 10)
	shared := 0
	for lo, bs := range at {
		for _, b := range bs[1:] {
			assert.InDelta(t, bs[0].x, b.x, 0.011, "bin %s at one x in every panel", lo)
			assert.InDelta(t, bs[0].w, b.w, 0.011)
			shared++
		}
	}
	assert.Greater(t, shared, 5, "the panels share bins")
	bn := 0
	for _, n := range s.Notes {
		if n.Code == "bins" {
			bn++
			assert.Contains(t, n.Text, "the same bins in every panel")
		}
	}
	assert.Equal(t, 1, bn, "the rule is noted once")
}

func fmtSscan(s string, v *float64) error {
	_, err := fmt.Sscan(s, v)
	return err
}
