package main

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// diffData's a − b is −1 2 4 2 −2 −4 0 1 3: it changes sign twice between
// points and touches zero once on a point (x = 6).
const diffData = `x,north,south
0,1,2
1,3,1
2,5,1
3,4,2
4,1,3
5,0,4
6,3,3
7,2,1
8,4,1
`

func TestDiffVerticesAreDifferences(t *testing.T) {
	code, out, stderr := plumb(t, diffData, "diff", "-", "--format", "csv", "--explain")
	require.Equal(t, exitOK, code, stderr)
	root := checkFigure(t, []byte(out))
	paths := marks(t, root)["difference"]
	require.Len(t, paths, 1)
	runs := polylines(t, paths[0])
	require.Len(t, runs, 1)
	pts := runs[0]
	base := root.all("path", "plumb-baseline")
	require.Len(t, base, 1)
	_, by := pathPoints(t, base[0].Attr["d"])
	zero := by[0] + base[0].DY

	var x, d []float64
	for _, line := range strings.Split(strings.TrimSpace(diffData), "\n")[1:] {
		f := strings.Split(line, ",")
		xv, _ := strconv.ParseFloat(f[0], 64)
		a, _ := strconv.ParseFloat(f[1], 64)
		b, _ := strconv.ParseFloat(f[2], 64)
		x, d = append(x, xv), append(d, a-b)
	}
	// The linear maps, from the first and last vertices and the baseline.
	kx := (pts[len(pts)-1][0] - pts[0][0]) / (x[len(x)-1] - x[0])
	ky := (pts[0][1] - zero) / d[0]
	mapX := func(v float64) float64 { return pts[0][0] + kx*(v-x[0]) }
	mapY := func(v float64) float64 { return zero + ky*v }
	// Every data point is a vertex at (x, a − b), within the 0.01 px rounding.
	j := 0
	for i := range x {
		for j < len(pts) && math.Abs(pts[j][0]-mapX(x[i])) > 0.02 {
			j++
		}
		require.Less(t, j, len(pts), "no vertex for x = %g", x[i])
		assert.InDelta(t, mapY(d[i]), pts[j][1], 0.02, "x = %g", x[i])
	}
	// Every sign change has a vertex on the baseline at the linear crossing.
	crossings := 0
	for i := 1; i < len(d); i++ {
		if d[i-1]*d[i] >= 0 {
			continue
		}
		crossings++
		cx := x[i-1] + (x[i]-x[i-1])*d[i-1]/(d[i-1]-d[i])
		found := false
		for _, p := range pts {
			if math.Abs(p[0]-mapX(cx)) < 0.02 && p[1] == zero {
				found = true
			}
		}
		assert.True(t, found, "no baseline vertex at the crossing x = %g", cx)
	}
	assert.Equal(t, 2, crossings)
	// Both areas, labelled directly.
	assert.Len(t, root.all("path", "plumb-area-a"), 1)
	assert.Len(t, root.all("path", "plumb-area-b"), 1)
	var labels []string
	for _, l := range root.all("text", "plumb-label") {
		labels = append(labels, l.Text)
	}
	assert.ElementsMatch(t, []string{"north above south", "south above north"}, labels)
}

func TestDiffAreasCloseOnBaseline(t *testing.T) {
	code, out, _ := plumb(t, diffData, "diff", "-", "--format", "csv")
	require.Equal(t, exitOK, code)
	root := parseSVG(t, []byte(out))
	base := root.all("path", "plumb-baseline")[0]
	_, by := pathPoints(t, base.Attr["d"])
	for _, class := range []string{"plumb-area-a", "plumb-area-b"} {
		for _, a := range root.all("path", class) {
			for _, run := range polylines(t, a) {
				assert.Equal(t, by[0], run[0][1]-a.DY, "%s starts off the baseline", class)
				assert.Equal(t, by[0], run[len(run)-1][1]-a.DY, "%s ends off the baseline", class)
			}
		}
	}
}

func TestDiffContextPanel(t *testing.T) {
	code, out, stderr := plumb(t, diffData, "diff", "-", "--format", "csv", "--explain", "--context", "--a", "north", "--b", "south")
	require.Equal(t, exitOK, code, stderr)
	root := checkFigure(t, []byte(out))
	panels := root.all("g", "plumb-panel")
	require.Len(t, panels, 2)
	assert.Len(t, panels[0].all("path", "plumb-mark"), 2)
	ms := marks(t, root)
	assert.Contains(t, ms, "north")
	assert.Contains(t, ms, "south")
	// Same x scale: the first vertex of each line and of the difference align.
	xn := polylines(t, ms["north"][0])[0][0][0]
	xd := polylines(t, ms["difference"][0])[0][0][0]
	assert.Equal(t, xn, xd)
}

func TestDiffMissingBreaks(t *testing.T) {
	code, out, stderr := plumb(t, "x,a,b\n1,2,1\n2,3,1\n3,,1\n4,3,1\n5,4,1\n", "diff", "-", "--format", "csv", "--explain")
	require.Equal(t, exitOK, code, stderr)
	root := parseSVG(t, []byte(out))
	assert.Len(t, polylines(t, marks(t, root)["difference"][0]), 2)
	assert.Contains(t, stderr, "missing")
}
