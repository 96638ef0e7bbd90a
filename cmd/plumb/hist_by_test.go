package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestDistributionsBy draws span, box and hist as small multiples: one
// panel per value of --by, histograms on bins shared by every panel.
func TestDistributionsBy(t *testing.T) {
	rng := rand.New(rand.NewPCG(8, 8))
	var b strings.Builder
	b.WriteString("season,route,minutes\n")
	for s, season := range []string{"Winter", "Spring", "Summer"} {
		for _, route := range []string{"North", "South", "East"} {
			for range 15 + 10*s {
				fmt.Fprintf(&b, "%s,%s,%.1f\n", season, route, 30+float64(s)*4+rng.NormFloat64()*(2+float64(s)))
			}
		}
	}
	data := b.String()

	code, out, errs := plumb(t, data, "hist", "-", "--value", "minutes", "--by", "season")
	require.Equal(t, 0, code, errs)
	root := checkFigure(t, []byte(out))
	assert.Len(t, root.all("g", "plumb-panel"), 3)
	bars := root.all("rect", "plumb-bin")
	require.NotEmpty(t, bars)
	width := bars[0].num(t, "data-high") - bars[0].num(t, "data-low")
	for _, bar := range bars {
		lo := bar.num(t, "data-low")
		assert.InDelta(t, width, bar.num(t, "data-high")-lo, 1e-9, "one width in every panel")
		assert.InDelta(t, 0, math.Remainder(lo, width), 1e-9, "edges on its multiples")
	}
	assert.Equal(t, 1, strings.Count(out, "the same bins in every panel"), "the rule is noted once")

	code, out, errs = plumb(t, data, "box", "-", "--group", "route", "--value", "minutes", "--by", "season")
	require.Equal(t, 0, code, errs)
	root = checkFigure(t, []byte(out))
	assert.Len(t, root.all("g", "plumb-panel"), 3)
	assert.Len(t, root.all("rect", "plumb-box"), 9)

	code, out, errs = plumb(t, data, "span", "-", "--label", "route", "--value", "minutes", "--stat", "quartiles", "--by", "season")
	require.Equal(t, 0, code, errs)
	root = checkFigure(t, []byte(out))
	assert.Len(t, root.all("rect", "plumb-range"), 9)
}

// TestBoxByAlignsRows: a group missing from one panel leaves an empty row
// there, so that every row is one group across the panels, named once on
// the grid's outer side.
func TestBoxByAlignsRows(t *testing.T) {
	var b strings.Builder
	b.WriteString("season,route,minutes\n")
	for i := range 10 {
		fmt.Fprintf(&b, "Winter,North,%d\nWinter,South,%d\nSummer,South,%d\nSummer,East,%d\n", 30+i, 40+i, 41+i, 20+i)
	}
	code, out, errs := plumb(t, b.String(), "box", "-", "--group", "route", "--value", "minutes", "--by", "season")
	require.Equal(t, 0, code, errs)
	root := checkFigure(t, []byte(out))
	// Row positions inside each panel's group: Winter has South and
	// North, Summer South and East; East keeps the third row, below an
	// empty North row.
	panels := map[float64]map[string]float64{}
	for _, bx := range root.all("rect", "plumb-box") {
		if panels[bx.DY] == nil {
			panels[bx.DY] = map[string]float64{}
		}
		panels[bx.DY][bx.Attr["data-label"]] = bx.num(t, "y")
	}
	require.Len(t, panels, 2)
	var band, east float64
	for _, rows := range panels {
		if n, ok := rows["North"]; ok {
			band = n - rows["South"]
		}
		if e, ok := rows["East"]; ok {
			east = e - rows["South"]
		}
	}
	assert.Greater(t, band, 0.0)
	assert.InDelta(t, 2*band, east, 0.02)
}
