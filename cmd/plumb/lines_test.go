package main

import (
	"fmt"
	"math"
	"regexp"
	"slices"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// linesSVG runs plumb lines on csv and returns the checked figure and stderr.
func linesSVG(t *testing.T, csv string, args ...string) (*svgNode, string) {
	t.Helper()
	code, out, stderr := plumb(t, csv, append([]string{"lines", "-", "--format", "csv", "--explain"}, args...)...)
	require.Equal(t, exitOK, code, stderr)
	return checkFigure(t, []byte(out)), stderr
}

// marks returns the data paths by series name, with the enclosing
// translate applied.
func marks(t *testing.T, root *svgNode) map[string][]*svgNode {
	out := map[string][]*svgNode{}
	for _, p := range root.all("path", "plumb-mark") {
		out[p.Attr["data-series"]] = append(out[p.Attr["data-series"]], p)
	}
	return out
}

// polylines splits a path's d into its M…L… runs.
func polylines(t *testing.T, n *svgNode) [][][2]float64 {
	t.Helper()
	var out [][][2]float64
	for _, run := range strings.Split(n.Attr["d"], "M")[1:] {
		xs, ys := pathPoints(t, "M"+run)
		var pts [][2]float64
		for i := range xs {
			pts = append(pts, [2]float64{xs[i] + n.DX, ys[i] + n.DY})
		}
		out = append(out, pts)
	}
	return out
}

// medianScreenSlope is the median |dy/dx| of the drawn segments, in screen
// pixels: 1 when the chart is banked to 45° by median absolute slope.
func medianScreenSlope(t *testing.T, root *svgNode) float64 {
	t.Helper()
	var s []float64
	for _, p := range root.all("path", "plumb-mark") {
		for _, run := range polylines(t, p) {
			for i := 1; i < len(run); i++ {
				dx, dy := math.Abs(run[i][0]-run[i-1][0]), math.Abs(run[i][1]-run[i-1][1])
				if dx > 0 && dy > 0 {
					s = append(s, dy/dx)
				}
			}
		}
	}
	require.NotEmpty(t, s)
	slices.Sort(s)
	if len(s)%2 == 1 {
		return s[len(s)/2]
	}
	return (s[len(s)/2-1] + s[len(s)/2]) / 2
}

func csvOf(header string, n int, row func(i int) string) string {
	var b strings.Builder
	b.WriteString(header + "\n")
	for i := range n {
		b.WriteString(row(i) + "\n")
	}
	return b.String()
}

func TestLinesBankedTo45Degrees(t *testing.T) {
	cases := []struct {
		name string
		csv  string
		tol  float64
	}{
		// Any straight line banks to 45° exactly: every |v/u| is 1 at alpha = 1
		// (methods.md §3.4, derived). The plot's height in whole pixels (under
		// 0.5 px off) is the only error: under 0.003 on a plot over 170 px.
		{"straight line", "x,y\n0,7\n2,13\n5,22\n10,37\n", 0.003},
		// Symmetric zigzag: every segment has the same |slope|, so all are drawn
		// at 45° (methods.md §3.4: alpha = 1/N).
		// (Two segments, alpha = 1/2, so that the plot stays above the
		// medium's minimum height.)
		{"zigzag", "x,y\n0,0\n1,1\n2,0\n", 0.003},
		// y = sin x, 100 equal segments on [0, 2π] (methods.md §3.4): within 1%.
		{"sine", csvOf("x,y", 101, func(i int) string {
			x := 2 * math.Pi * float64(i) / 100
			return fmt.Sprintf("%.6f,%.6f", x, math.Sin(x))
		}), 0.01},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			root, stderr := linesSVG(t, c.csv)
			assert.Contains(t, stderr, "banked to 45°")
			assert.InDelta(t, 1, medianScreenSlope(t, root), c.tol)
		})
	}
}

func TestLinesStraightLineEveryAngle45(t *testing.T) {
	root, _ := linesSVG(t, "x,y\n0,7\n2,13\n5,22\n10,37\n")
	for _, run := range polylines(t, root.all("path", "plumb-mark")[0]) {
		for i := 1; i < len(run); i++ {
			angle := math.Atan2(math.Abs(run[i][1]-run[i-1][1]), run[i][0]-run[i-1][0]) * 180 / math.Pi
			assert.InDelta(t, 45, angle, 0.05)
		}
	}
}

func TestLinesClampNotesAngle(t *testing.T) {
	// A series that alternates between two values banks to a strip: the
	// plot keeps the medium's minimum height, and the note says the
	// resulting angle. Alternation is the series' detail, not a trend, so
	// no multi-scale banking.
	csv := csvOf("x,y", 200, func(i int) string { return fmt.Sprintf("%d,%d", i, i%2*100) })
	root, stderr := linesSVG(t, csv)
	assert.Regexp(t, `kept at the medium's minimum plot height of \d+ px .* drawn at \d+°`, stderr)
	assert.NotContains(t, stderr, "multi-scale")
	assert.NotNil(t, root)
}

func TestLinesThreeSeriesDirectLabels(t *testing.T) {
	csv := csvOf("x,north,south,east", 12, func(i int) string {
		return fmt.Sprintf("%d,%d,%d,%d", i, 10+i, 11+i, 10+i%3)
	})
	root, _ := linesSVG(t, csv)
	labels := root.all("text", "plumb-label")
	require.Len(t, labels, 3)
	var names []string
	for _, l := range labels {
		names = append(names, l.Text)
	}
	assert.ElementsMatch(t, []string{"north", "south", "east"}, names)
	assert.Empty(t, root.all("g", "plumb-legend"))
	assert.Len(t, marks(t, root), 3)
}

func TestLinesSixSeriesSmallMultiples(t *testing.T) {
	csv := csvOf("x,a,b,c,d,e,f", 10, func(i int) string {
		return fmt.Sprintf("%d,%d,%d,%d,%d,%d,%d", i, i, 2*i, 3*i, i%4, 9-i, i*i%7)
	})
	root, stderr := linesSVG(t, csv)
	assert.GreaterOrEqual(t, len(root.all("g", "plumb-panel")), 6)
	assert.Contains(t, stderr, "one panel per series")
	// Shared scales: every panel's grid lines sit at the same heights and
	// are equally long (the first column's plots start after the y labels).
	var grids []string
	for _, p := range root.all("g", "plumb-panel")[:3] {
		var ys []string
		for _, g := range p.all("path", "plumb-grid") {
			runs := polylines(t, g)
			require.Len(t, runs, 1)
			line := runs[0]
			ys = append(ys, fmt.Sprintf("%g long at y %g", line[len(line)-1][0]-line[0][0], line[0][1]))
		}
		grids = append(grids, strings.Join(ys, " "))
	}
	assert.Equal(t, grids[0], grids[1])
	assert.Equal(t, grids[0], grids[2])

	root, stderr = linesSVG(t, csv, "--together")
	assert.Empty(t, root.all("g", "plumb-panel"))
	assert.Contains(t, stderr, "--together")
}

func TestLinesMissingValueSplitsPath(t *testing.T) {
	root, stderr := linesSVG(t, "x,y\n1,3\n2,4\n3,\n4,6\n5,5\n")
	runs := polylines(t, root.all("path", "plumb-mark")[0])
	require.Len(t, runs, 2)
	assert.Len(t, runs[0], 2)
	assert.Len(t, runs[1], 2)
	assert.Contains(t, stderr, "1 missing value")
	assert.Contains(t, stderr, "2 pieces")
}

func TestLinesIndexStartsTogether(t *testing.T) {
	csv := "month,small,large\n2024-01,2,3000\n2024-02,3,3300\n2024-03,2.5,2900\n2024-04,4,3100\n"
	root, stderr := linesSVG(t, csv, "--index")
	assert.Contains(t, stderr, "rebased every series to 100")
	var first []float64
	for _, p := range root.all("path", "plumb-mark") {
		first = append(first, polylines(t, p)[0][0][1])
	}
	require.Len(t, first, 2)
	assert.Equal(t, first[0], first[1])
	assert.Contains(t, root.all("text", "plumb-axis-title")[0].Text, "first value = 100")

	// At a point between two months: linear interpolation, and every line
	// passes through 100 there.
	root, _ = linesSVG(t, csv, "--index=2024-02-15")
	assert.Contains(t, root.all("text", "plumb-axis-title")[0].Text, "= 100")
	// The vertices sit at Feb 1 and Mar 1; Feb 15 is 14 of the 29 days of
	// February 2024 after the first. Both lines must cross there at one y.
	var atY []float64
	for _, p := range root.all("path", "plumb-mark") {
		pts := polylines(t, p)[0]
		require.GreaterOrEqual(t, len(pts), 3)
		f := 14.0 / 29
		atY = append(atY, pts[1][1]+f*(pts[2][1]-pts[1][1]))
	}
	require.Len(t, atY, 2)
	assert.InDelta(t, atY[0], atY[1], 0.02, "both series are 100 at the index point")

	// Without --index, the tenfold difference in size gets a suggestion.
	_, stderr = linesSVG(t, csv)
	assert.Contains(t, stderr, "--index")
}

func TestLinesIndexRefusesZeroBase(t *testing.T) {
	code, _, stderr := plumb(t, "x,a,b\n1,0,5\n2,3,6\n", "lines", "-", "--format", "csv", "--index")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "cannot index")
}

func TestLinesTimeAxisYears(t *testing.T) {
	start := time.Date(2021, 1, 1, 0, 0, 0, 0, time.UTC)
	csv := csvOf("date,riders", 3*365+1, func(i int) string {
		return fmt.Sprintf("%s,%d", start.AddDate(0, 0, i).Format("2006-01-02"), 1000+(i*37)%200)
	})
	root, _ := linesSVG(t, csv)
	var ticks []string
	for _, n := range root.all("text", "plumb-tick") {
		ticks = append(ticks, n.Text)
	}
	joined := strings.Join(ticks, " ")
	for _, y := range []string{"2022", "2023"} {
		assert.Contains(t, joined, y)
	}
	iso := regexp.MustCompile(`\d{4}-\d{2}`)
	assert.False(t, iso.MatchString(joined), "raw ISO dates in tick labels: %s", joined)
}

func TestLinesBadDatePointsAtLine(t *testing.T) {
	code, _, stderr := plumb(t, "date,y\n2024-01-01,1\n2024-01-02,2\n2024-01-03,2\n2024-01-04,2\n2024-01-05,2\n2024-13-06,3\n", "lines", "-", "--format", "csv")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "line 7")
	assert.Contains(t, stderr, `column "date"`)
	assert.Contains(t, stderr, "2024-13-06")
}

func TestLinesDuplicateXNamesBothLines(t *testing.T) {
	code, _, stderr := plumb(t, "x,y\n1,2\n2,3\n1,4\n", "lines", "-", "--format", "csv")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "line 4")
	assert.Contains(t, stderr, "line 2")
}

func TestLinesUnsortedRowsAreSorted(t *testing.T) {
	root, stderr := linesSVG(t, "x,y\n3,1\n1,2\n2,5\n")
	assert.Contains(t, stderr, "sorted the rows")
	xs, _ := pathPoints(t, root.all("path", "plumb-mark")[0].Attr["d"])
	assert.True(t, slices.IsSorted(xs))
}

func TestLinesLongFormat(t *testing.T) {
	csv := "month,route,pct\n2024-01,A,80\n2024-01,B,90\n2024-02,A,82\n2024-02,B,88\n2024-03,A,85\n2024-03,B,91\n"
	root, _ := linesSVG(t, csv, "--x", "month", "--y", "pct", "--series", "route", "--unit", "%")
	assert.Len(t, marks(t, root), 2)
}

func TestLinesM4LongSeries(t *testing.T) {
	n := 20000
	csv := csvOf("x,y", n, func(i int) string { return fmt.Sprintf("%d,%.2f", i, math.Sin(float64(i)/50)*100+float64(i%17)) })
	root, stderr := linesSVG(t, csv)
	assert.Contains(t, stderr, "M4")
	assert.LessOrEqual(t, maxPerColumn(t, root), 4)
}

// maxPerColumn counts the vertices of the data paths in each pixel column.
func maxPerColumn(t *testing.T, root *svgNode) int {
	t.Helper()
	most := 0
	for _, p := range root.all("path", "plumb-mark") {
		cols := map[int]int{}
		for _, run := range polylines(t, p) {
			for _, v := range run {
				cols[int(math.Floor(v[0]))]++
			}
		}
		for _, c := range cols {
			most = max(most, c)
		}
	}
	return most
}

func TestLinesBankedRandomWalk(t *testing.T) {
	// Held-out shapes: banking holds on whatever is drawn, measured from
	// the written path (Cleveland, McGill & McGill 1988: median |slope| 1).
	banked := 0
	for _, n := range []int{30, 400, 5000} {
		v := 0.0
		csv := csvOf("day,level", n, func(i int) string {
			v += math.Sin(float64(i)*1.7) + math.Cos(float64(i*i)*0.3)
			return fmt.Sprintf("%d,%.3f", i, v)
		})
		root, stderr := linesSVG(t, csv)
		if strings.Contains(stderr, "kept within") || strings.Contains(stderr, "minimum plot height") || strings.Contains(stderr, "scale of the trend") {
			continue // clamped or banked at the trend, and the note says at what angle
		}
		assert.InDelta(t, 1, medianScreenSlope(t, root), 0.02, "n = %d", n)
		banked++
	}
	assert.Positive(t, banked)
}

func TestLinesMillionPoints(t *testing.T) {
	if testing.Short() {
		t.Skip("a million rows")
	}
	data := linesCSV(linesBenchRows)
	code, out, stderr := plumb(t, string(data), "lines", "-", "--format", "csv", "--explain")
	require.Equal(t, exitOK, code, stderr)
	assert.Less(t, len(out), 300*1024)
	root := parseSVG(t, []byte(out))
	assert.LessOrEqual(t, maxPerColumn(t, root), 4)
	assert.Contains(t, stderr, "reduced 1,000,000 points")
}
