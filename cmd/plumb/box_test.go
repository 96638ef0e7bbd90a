package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// type7 is the p-quantile of Hyndman & Fan (1996) type 7 written out again
// from its definition, h = (n−1)p + 1 over 1-based order statistics, so
// that the chart is checked against the formula rather than against the
// code that drew it.
func type7(xs []float64, p float64) float64 {
	s := slices.Clone(xs)
	slices.Sort(s)
	h := float64(len(s)-1)*p + 1
	lo := math.Floor(h)
	if int(lo) >= len(s) {
		return s[len(s)-1]
	}
	return s[int(lo)-1] + (h-lo)*(s[int(lo)]-s[int(lo)-1])
}

// crossingTable invents crossing times for a few routes: skewed, with a
// storm crossing now and then, and one route sailed three times.
func crossingTable(seed uint64) (string, map[string][]float64) {
	rng := rand.New(rand.NewPCG(seed, 9))
	var b strings.Builder
	b.WriteString("route,minutes,skipper\n")
	groups := map[string][]float64{}
	for r, name := range []string{"North Sound", "Gull Rock, via the Narrows", "Eastquay", "Harbour Bar"} {
		n := 20 + rng.IntN(60)
		if r == 3 {
			n = 3
		}
		for range n {
			v := math.Round((25+float64(r*15)+rng.NormFloat64()*3+rng.ExpFloat64()*2)*10) / 10
			if rng.Float64() < 0.05 {
				v += 30
			}
			groups[name] = append(groups[name], v)
			fmt.Fprintf(&b, "%q,%s,K%d\n", name, strconv.FormatFloat(v, 'f', -1, 64), rng.IntN(4))
		}
	}
	return b.String(), groups
}

// TestBoxQuartilesAndOutliers draws random tables and checks every box's
// quartiles against type 7 (to 0.005) and its outlier circles against the
// count beyond Tukey's fences (Tukey 1977, 1.5 IQR).
func TestBoxQuartilesAndOutliers(t *testing.T) {
	for seed := range uint64(6) {
		data, groups := crossingTable(seed)
		args := []string{"box", "-", "--group", "route", "--value", "minutes"}
		if seed%2 == 1 {
			args = append(args, "--vertical") // the same marks, stood up
		}
		code, out, errs := plumb(t, data, args...)
		require.Equal(t, 0, code, errs)
		root := checkFigure(t, []byte(out))
		boxes := root.all("rect", "plumb-box")
		require.Len(t, boxes, 3, "the three routes with five or more sailings get a box")
		for _, b := range boxes {
			vals := groups[b.Attr["data-label"]]
			require.NotEmpty(t, vals, b.Attr["data-label"])
			q1, med, q3 := type7(vals, 0.25), type7(vals, 0.5), type7(vals, 0.75)
			assert.InDelta(t, q1, b.num(t, "data-q1"), 0.005)
			assert.InDelta(t, med, b.num(t, "data-median"), 0.005)
			assert.InDelta(t, q3, b.num(t, "data-q3"), 0.005)
			beyond := 0
			for _, v := range vals {
				if v < q1-1.5*(q3-q1) || v > q3+1.5*(q3-q1) {
					beyond++
				}
			}
			drawn := 0
			for _, o := range root.all("circle", "plumb-outlier") {
				if o.Attr["data-label"] == b.Attr["data-label"] {
					drawn++
					v := o.num(t, "data-value")
					assert.True(t, v < q1-1.5*(q3-q1) || v > q3+1.5*(q3-q1), "outlier %v inside the fences", v)
				}
			}
			assert.Equal(t, beyond, drawn, b.Attr["data-label"])
			assert.Contains(t, out, fmt.Sprintf(">n = %d<", len(vals)))
		}
		// The route sailed three times is drawn as its three points.
		pts := 0
		for _, c := range root.all("circle", "plumb-point") {
			if c.Attr["data-label"] == "Harbour Bar" {
				pts++
			}
		}
		assert.Equal(t, 3, pts)
		// Every value beyond its group's fences carries the outlier
		// class, boxed or not.
		total := 0
		for _, vals := range groups {
			q1, q3 := type7(vals, 0.25), type7(vals, 0.75)
			for _, v := range vals {
				if v < q1-1.5*(q3-q1) || v > q3+1.5*(q3-q1) {
					total++
				}
			}
		}
		assert.Len(t, root.all("circle", "plumb-outlier"), total)
		assert.Contains(t, errs, "drew the values instead of a box")
	}
}

// TestBoxOrder checks the default order (median, largest first) and the
// order of the file.
func TestBoxOrder(t *testing.T) {
	data := "g,v\nlow,1\nlow,2\nlow,3\nlow,4\nlow,5\nhigh,11\nhigh,12\nhigh,13\nhigh,14\nhigh,15\n"
	labels := func(args ...string) []string {
		code, out, errs := plumb(t, data, append([]string{"box", "-", "--group", "g", "--value", "v"}, args...)...)
		require.Equal(t, 0, code, errs)
		var got []string
		for _, b := range parseSVG(t, []byte(out)).all("rect", "plumb-box") {
			got = append(got, b.Attr["data-label"])
		}
		return got
	}
	assert.Equal(t, []string{"high", "low"}, labels())
	assert.Equal(t, []string{"low", "high"}, labels("--order", "data"))
}

func TestBoxErrors(t *testing.T) {
	dir := t.TempDir()
	p := writeFile(t, dir, "times.csv", "route,minutes\nA,12\nA,13\nB,1x4\n")
	code, _, errs := plumb(t, "", "box", p, "--group", "route", "--value", "minutes")
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, `times.csv: line 4, column "minutes"`)
	code, _, errs = plumb(t, "", "box", p, "--group", "road", "--value", "minutes")
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, `"road"`)
	code, _, errs = plumb(t, "", "box", p, "--group", "route", "--value", "route")
	assert.Equal(t, 2, code, errs)
}

// A group too small for a box is drawn as its values; one beyond Tukey's
// fences still counts as an outlier.
func TestBoxSmallGroupOutlier(t *testing.T) {
	code, out, errs := plumb(t, "g,v\na,1\na,2\na,3\na,100\n", "box", "-", "--group", "g", "--value", "v")
	require.Equal(t, 0, code, errs)
	root := checkFigure(t, []byte(out))
	assert.Len(t, root.all("circle", "plumb-point"), 4)
	assert.Len(t, root.all("circle", "plumb-outlier"), 1)
	assert.Empty(t, root.all("rect", "plumb-box"))
	assert.Contains(t, errs, `"a" (n = 4)`)
}

// A reference line at the median of a box plot is the median of every
// value drawn, and a span's mean line the mean of its middles.
func TestDistributionRefLines(t *testing.T) {
	data, groups := crossingTable(3)
	var all []float64
	for _, v := range groups {
		all = append(all, v...)
	}
	code, out, errs := plumb(t, data, "box", "-", "--group", "route", "--value", "minutes", "--ref", "median")
	require.Equal(t, 0, code, errs)
	refs := checkFigure(t, []byte(out)).all("path", "plumb-ref")
	require.Len(t, refs, 1)
	assert.InDelta(t, type7(all, 0.5), refs[0].num(t, "data-value"), 1e-9)

	code, out, errs = plumb(t, "m,v\nA,1\nA,3\nB,10\nB,20\n", "span", "-", "--label", "m", "--value", "v", "--ref", "mean")
	require.Equal(t, 0, code, errs)
	refs = checkFigure(t, []byte(out)).all("path", "plumb-ref")
	require.Len(t, refs, 1)
	assert.InDelta(t, (2+15)/2.0, refs[0].num(t, "data-value"), 1e-9, "the mean of the middles 2 and 15")
}
