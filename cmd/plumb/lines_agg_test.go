package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// visits invents repeated measurements: twelve subjects in two groups
// scored in five visits, long format, rows shuffled, and returns the table
// with each group's scores by visit.
func visits(seed uint64) (string, map[string]map[int][]float64) {
	r := rand.New(rand.NewPCG(seed, 7))
	byHand := map[string]map[int][]float64{"control": {}, "treated": {}}
	var rows []string
	for s := range 12 {
		group := "control"
		if s%2 == 1 {
			group = "treated"
		}
		for v := 1; v <= 5; v++ {
			score := math.Round((50+float64(v)*3*float64(s%2)+r.NormFloat64()*6)*10) / 10
			byHand[group][v] = append(byHand[group][v], score)
			rows = append(rows, fmt.Sprintf("%d,S%02d,%s,%.1f", v, s+1, group, score))
		}
	}
	r.Shuffle(len(rows), func(i, j int) { rows[i], rows[j] = rows[j], rows[i] })
	return "visit,subject,group,score\n" + strings.Join(rows, "\n") + "\n", byHand
}

// The mean line and its ± 1 sd band through the CLI: every vertex equals
// the mean and the sample sd computed here, independently, read through
// the mapping two of the line's vertices fix.
func TestLinesAggMeanSD(t *testing.T) {
	csv, byHand := visits(3)
	root, stderr := linesSVG(t, csv, "--x", "visit", "--y", "score", "--series", "group", "--agg", "mean", "--spread", "sd")
	assert.Contains(t, stderr, "drew the mean of the values at each x (n = 6 per x)")
	assert.Contains(t, stderr, "mean ± one standard deviation")
	lines := marks(t, root)
	bands := map[string]*svgNode{}
	for _, b := range root.all("path", "plumb-band") {
		bands[b.Attr["data-series"]] = b
	}
	for _, group := range []string{"control", "treated"} {
		mean, sd := make([]float64, 5), make([]float64, 5)
		for v := range 5 {
			vals := byHand[group][v+1]
			for _, x := range vals {
				mean[v] += x / float64(len(vals))
			}
			for _, x := range vals {
				sd[v] += (x - mean[v]) * (x - mean[v]) / float64(len(vals)-1)
			}
			sd[v] = math.Sqrt(sd[v])
		}
		require.Len(t, lines[group], 1, group)
		pts := polylines(t, lines[group][0])[0]
		require.Len(t, pts, 5)
		b := (pts[4][1] - pts[0][1]) / (mean[4] - mean[0])
		a := pts[0][1] - b*mean[0]
		for v, p := range pts {
			assert.InDelta(t, a+b*mean[v], p[1], 0.03, "%s visit %d", group, v+1)
		}
		require.NotNil(t, bands[group], group)
		band := polylines(t, bands[group])[0]
		require.Len(t, band, 10)
		for v := range 5 {
			assert.InDelta(t, a+b*(mean[v]+sd[v]), band[v][1], 0.03, "%s high at visit %d", group, v+1)
			assert.InDelta(t, a+b*(mean[v]-sd[v]), band[9-v][1], 0.03, "%s low at visit %d", group, v+1)
		}
	}
}

func TestLinesRepeatedXNamesAgg(t *testing.T) {
	csv, _ := visits(4)
	code, _, stderr := plumb(t, csv, "lines", "-", "--format", "csv", "--x", "visit", "--y", "score", "--series", "group")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "two rows share one x value")
	assert.Contains(t, stderr, "--agg mean or --agg median")

	code, _, stderr = plumb(t, csv, "lines", "-", "--format", "csv", "--x", "visit", "--y", "score", "--series", "group", "--agg", "mode")
	assert.Equal(t, exitUsage, code, stderr)
	assert.Contains(t, stderr, "--agg")
	code, _, stderr = plumb(t, csv, "lines", "-", "--format", "csv", "--x", "visit", "--y", "score", "--series", "group", "--spread", "iqr")
	assert.Equal(t, exitUsage, code, stderr)
	assert.Contains(t, stderr, "--agg mean or median")
}

// The median's default band is the interquartile range; a reference line
// at the mean reads the summary values.
func TestLinesAggMedianDefaults(t *testing.T) {
	csv, byHand := visits(5)
	root, stderr := linesSVG(t, csv, "--x", "visit", "--y", "score", "--series", "group", "--agg", "median", "--ref", "mean")
	assert.Contains(t, stderr, "interquartile range")
	assert.Len(t, root.all("path", "plumb-band"), 2)
	refs := root.all("path", "plumb-ref")
	require.Len(t, refs, 1)
	var medians []float64
	for _, g := range []string{"control", "treated"} {
		for v := 1; v <= 5; v++ {
			s := slices.Sorted(slices.Values(byHand[g][v]))
			medians = append(medians, (s[2]+s[3])/2) // six values: the middle two
		}
	}
	mean := 0.0
	for _, m := range medians {
		mean += m / float64(len(medians))
	}
	var got float64
	fmt.Sscan(refs[0].Attr["data-value"], &got)
	assert.InDelta(t, mean, got, 1e-6)
}

// Bands that overlap over most of x are noted, naming --by on the series
// column.
func TestLinesAggOverlapNamesBy(t *testing.T) {
	var b strings.Builder
	b.WriteString("visit,group,score\n")
	for v := 1; v <= 4; v++ {
		for k := range 5 {
			fmt.Fprintf(&b, "%d,a,%d\n%d,b,%d\n", v, 10+k, v, 11+k)
		}
	}
	_, stderr := linesSVG(t, b.String(), "--x", "visit", "--y", "score", "--series", "group", "--agg", "mean", "--spread", "range")
	assert.Contains(t, stderr, `the bands of "a" and "b" overlap`)
	assert.Contains(t, stderr, "(--by group)")
}
