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
