package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// routeTable invents n sailings with a vessel class, a length, a time and
// a fare, as a CSV.
func routeTable(n int, seed uint64) string {
	r := rand.New(rand.NewPCG(seed, 5))
	var b strings.Builder
	b.WriteString("vessel,crossing_km,minutes,fare\n")
	classes := []string{"Car ferry", "Fast craft", "Island launch"}
	for i := range n {
		km := 3 + r.Float64()*40
		fmt.Fprintf(&b, "%s,%.1f,%.1f,£%.2f\n", classes[i%3], km, km*(1.2+float64(i%3)*0.6)+r.NormFloat64()*3, 2+km*0.3+r.NormFloat64())
	}
	return b.String()
}

func TestScatterCLISixtyPoints(t *testing.T) {
	code, out, stderr := plumb(t, routeTable(60, 1), "scatter", "-", "--format", "csv", "--x", "crossing_km", "--y", "minutes", "--group", "vessel")
	require.Equal(t, exitOK, code, stderr)
	root := checkFigure(t, []byte(out))
	marks := root.all("circle", "plumb-mark")
	require.Len(t, marks, 60)
	for _, m := range marks {
		assert.NotEmpty(t, m.Attr["data-x"])
		assert.NotEmpty(t, m.Attr["data-y"])
		assert.Contains(t, []string{"Car ferry", "Fast craft", "Island launch"}, m.Attr["data-group"])
	}
	// The axes are named after the columns; a currency column keeps its unit.
	code, out, stderr = plumb(t, routeTable(60, 1), "scatter", "-", "--format", "csv", "--x", "crossing_km", "--y", "fare", "--fit", "line", "--explain")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "fare (£)")
	assert.Contains(t, stderr, "R² = ")
	assert.Len(t, checkFigure(t, []byte(out)).all("path", "plumb-fit"), 1)
}

// Without --x and --y the first two numeric columns are used, with a note.
func TestScatterCLIChoosesColumns(t *testing.T) {
	code, out, stderr := plumb(t, routeTable(20, 2), "scatter", "-", "--format", "csv", "--explain")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, `using column "crossing_km" for x and "minutes" for y`)
	assert.Len(t, checkFigure(t, []byte(out)).all("circle", "plumb-mark"), 20)
}

// 200,000 points through the command line give a small figure of bins,
// and a note says so.
func TestScatterCLIBinsManyPoints(t *testing.T) {
	if testing.Short() {
		t.Skip("writes 200,000 rows")
	}
	dir := t.TempDir()
	r := rand.New(rand.NewPCG(200, 1))
	var b strings.Builder
	b.WriteString("wind_kn,delay_min\n")
	for range 200_000 {
		w := math.Abs(r.NormFloat64() * 8)
		fmt.Fprintf(&b, "%.1f,%.1f\n", w, r.ExpFloat64()*3+w*w*w/400)
	}
	data := writeFile(t, dir, "sailings.csv", b.String())
	out := filepath.Join(dir, "wind.svg")
	code, _, stderr := plumb(t, "", "scatter", data, "--x", "wind_kn", "--y", "delay_min", "--fit", "loess", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "hexagonal bins")
	svg, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.Less(t, len(svg), 2<<20)
	assert.Less(t, strings.Count(string(svg), "<"), 20_000, "elements")
	root := checkFigure(t, svg)
	assert.Empty(t, root.all("circle", "plumb-mark"))
	assert.NotEmpty(t, root.all("path", "plumb-bin"))
	renderable(t, out)
}

// Bad input names the file, the line and the column.
func TestScatterCLIErrors(t *testing.T) {
	dir := t.TempDir()
	bad := writeFile(t, dir, "bad.csv", "crossing_km,minutes\n3,10\n5,twelve\n")
	code, _, stderr := plumb(t, "", "scatter", bad, "--x", "crossing_km", "--y", "minutes")
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "bad.csv")
	assert.Contains(t, stderr, "line 3")
	assert.Contains(t, stderr, `"minutes"`)

	code, _, stderr = plumb(t, "", "scatter", bad, "--x", "crossing_km", "--y", "hours")
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "hours")

	code, _, stderr = plumb(t, routeTable(10, 3), "scatter", "-", "--format", "csv", "--fit", "cubic")
	assert.Equal(t, 2, code)
	assert.Contains(t, stderr, "--fit")

	one := writeFile(t, dir, "one.csv", "vessel,minutes\nA,3\n")
	code, _, stderr = plumb(t, "", "scatter", one)
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "two numeric columns")

	gaps := writeFile(t, dir, "gaps.csv", "crossing_km,minutes\n3,10\n5,\n7,14\nNA,3\n")
	code, out, stderr := plumb(t, "", "scatter", gaps, "--x", "crossing_km", "--y", "minutes")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "skipped 1 row")
	assert.Len(t, checkFigure(t, []byte(out)).all("circle", "plumb-mark"), 2)
}

func TestMatrixCLI(t *testing.T) {
	dir := t.TempDir()
	r := rand.New(rand.NewPCG(4, 4))
	var b strings.Builder
	b.WriteString("route,crossing_km,minutes,fuel_l,wind_kn\n")
	for i := range 80 {
		km := 3 + r.Float64()*40
		fmt.Fprintf(&b, "R%d,%.1f,%.1f,%.0f,%.1f\n", i, km, km*2+r.NormFloat64()*4, km*40+r.NormFloat64()*90, math.Abs(r.NormFloat64()*8))
	}
	data := writeFile(t, dir, "routes.csv", b.String())
	for _, medium := range []string{"screen", "slide"} {
		out := filepath.Join(dir, medium+".svg")
		code, _, stderr := plumb(t, "", "matrix", data, "--cols", "crossing_km,minutes", "--cols", "fuel_l,wind_kn", "--for", medium, "-o", out)
		require.Equal(t, exitOK, code, stderr)
		svg, err := os.ReadFile(out)
		require.NoError(t, err)
		root := checkFigure(t, svg)
		assert.Len(t, root.all("g", "plumb-panel"), 16)
		assert.Len(t, root.all("circle", "plumb-mark"), 12*80)
		renderable(t, out)
	}
	// Without --cols every numeric column is used.
	code, out, stderr := plumb(t, "", "matrix", data, "--explain")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "using the numeric columns")
	assert.Len(t, checkFigure(t, []byte(out)).all("g", "plumb-panel"), 16)

	code, _, stderr = plumb(t, "", "matrix", data, "--cols", "crossing_km,crossing_km")
	assert.Equal(t, 2, code)
	assert.Contains(t, stderr, "twice")
	code, _, stderr = plumb(t, "", "matrix", data, "--cols", "crossing_km,route")
	assert.Equal(t, 1, code)
	assert.Contains(t, stderr, "route")
}

// FuzzScatterMatrix feeds arbitrary data to scatter and matrix through the
// CLI: exit 0 with well-formed XML or exit 1 with a message, never a panic.
func FuzzScatterMatrix(f *testing.F) {
	for _, seed := range []string{
		"x,y\n1,5\n2,7\n3,-2\n",
		"g,x,y\na,1,1\nb,2,2\na,3,1\nb,4,2\nc,1e308,-1e308\n",
		"x,y,z\n1,1,1\n1,1,1\n1,1,1\n",
		"x,y\n,\nNA,3\n",
		"a,b,c\n\"<b>\",1,2\n3,4,5\n",
	} {
		for v := range uint8(6) {
			f.Add(seed, v)
		}
	}
	variants := [][]string{
		{"scatter"}, {"scatter", "--fit", "line"}, {"scatter", "--fit", "loess", "--for", "print"},
		{"scatter", "--group", "g", "--for", "slide"}, {"matrix"}, {"matrix", "--for", "print"},
	}
	f.Fuzz(func(t *testing.T, data string, variant uint8) {
		args := append(append([]string(nil), variants[int(variant)%len(variants)]...), "-", "--format", "csv", "--quiet")
		var out, errs strings.Builder
		code := run(args, strings.NewReader(data), &out, &errs)
		switch code {
		case exitOK:
			if !notFinite.MatchString(data) {
				checkNoNaN(t, []byte(out.String()))
			}
			parseSVG(t, []byte(out.String()))
		case exitData:
			if errs.Len() == 0 {
				t.Fatalf("%v on %q: exit 1 without a message", args, data)
			}
		default:
			t.Fatalf("%v on %q: exit %d: %s", args, data, code, errs.String())
		}
	})
}
