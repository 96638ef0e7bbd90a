package main

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"plumb/render"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// figureDir holds the figure fixtures: invented crops and rainfall tables
// and figure files that read them.
const figureDir = "../../testdata/figure"

// byBars draws crops.csv as bars --by region (4 regions of 5 crops) and
// returns the parsed figure and stderr.
func byBars(t *testing.T, extra ...string) (*svgNode, string) {
	t.Helper()
	out := filepath.Join(t.TempDir(), "by.svg")
	args := append([]string{"bars", filepath.Join(figureDir, "crops.csv"), "--label", "crop", "--value", "tonnes", "--by", "region", "-o", out, "--explain"}, extra...)
	code, _, stderr := plumb(t, "", args...)
	require.Equal(t, exitOK, code, stderr)
	data, err := os.ReadFile(out)
	require.NoError(t, err)
	return checkFigure(t, data), stderr
}

// panelsOf returns the panel groups of a figure.
func panelsOf(root *svgNode) []*svgNode { return root.all("g", "plumb-panel") }

func TestByBarsPanelsAndBars(t *testing.T) {
	root, stderr := byBars(t)
	panels := panelsOf(root)
	require.Len(t, panels, 4, "one panel per region")
	assert.Len(t, root.all("rect", "plumb-mark"), 20, "5 crops in each of 4 regions")
	for _, p := range panels {
		assert.Len(t, p.all("rect", "plumb-mark"), 5, "panel %q", p.Attr["data-panel"])
		checkBars(t, p) // within a panel: one baseline, lengths proportional to values
	}
	assert.Contains(t, stderr, `one panel per value of "region": 4 panels, largest total first`)
}

// pxPerUnit is the length of each panel's bars per unit of value, which
// must agree within a panel (checkBars) and, on shared scales, across
// panels.
func pxPerUnit(t *testing.T, panel *svgNode) float64 {
	t.Helper()
	bars := panel.all("rect", "plumb-mark")
	require.NotEmpty(t, bars)
	b := bars[0]
	return b.num(t, "width") / math.Abs(b.num(t, "data-value"))
}

func TestByBarsShareOneScale(t *testing.T) {
	root, _ := byBars(t)
	panels := panelsOf(root)
	require.Len(t, panels, 4)
	first := pxPerUnit(t, panels[0])
	for _, p := range panels[1:] {
		// Tufte's lie factor between panels, within 0.5% as for the bars
		// of one panel (checkBars).
		assert.InDelta(t, 1, pxPerUnit(t, p)/first, 0.005, "panel %q draws another scale", p.Attr["data-panel"])
	}
}

func TestByOrder(t *testing.T) {
	titles := func(root *svgNode) []string {
		var out []string
		for _, p := range panelsOf(root) {
			out = append(out, p.Attr["data-panel"])
		}
		return out
	}
	// Totals from crops.csv: North Vale 8480, Eastmarch 8460, Southholt
	// 6810, West Fen 3180 tonnes.
	for _, tc := range []struct {
		order string
		want  []string
	}{
		{"value", []string{"North Vale", "Eastmarch", "Southholt", "West Fen"}},
		{"label", []string{"Eastmarch", "North Vale", "Southholt", "West Fen"}},
		{"data", []string{"North Vale", "Eastmarch", "Southholt", "West Fen"}},
	} {
		t.Run(tc.order, func(t *testing.T) {
			root, _ := byBars(t, "--by-order", tc.order)
			assert.Equal(t, tc.want, titles(root))
		})
	}
	// By mean: the order changes when the values do not add up.
	root, _ := byBars(t, "--agg", "mean", "--value", "yield_t_ha")
	assert.Equal(t, []string{"Eastmarch", "North Vale", "Southholt", "West Fen"}, titles(root), "means 5.68, 5.62, 5.28, 4.64 t/ha")
}

func TestByOwnScalesNote(t *testing.T) {
	_, stderr := byBars(t, "--own-scales")
	assert.Contains(t, stderr, "own value scale (--own-scales)")
	_, stderr = byBars(t)
	assert.NotContains(t, stderr, "own-scales")
}

func TestByLines(t *testing.T) {
	out := filepath.Join(t.TempDir(), "rain.svg")
	code, _, stderr := plumb(t, "", "lines", filepath.Join(figureDir, "rainfall.csv"), "--x", "month", "--y", "rain_mm", "--by", "station", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	data, err := os.ReadFile(out)
	require.NoError(t, err)
	root := checkFigure(t, data)
	panels := panelsOf(root)
	require.Len(t, panels, 2)
	// Hillcrest has the larger mean rainfall, so it comes first.
	assert.Equal(t, "Hillcrest", panels[0].Attr["data-panel"])
	assert.Equal(t, "Saltmere", panels[1].Attr["data-panel"])
	for _, p := range panels {
		assert.NotEmpty(t, p.all("path", ""), "panel %q draws its line", p.Attr["data-panel"])
	}
}

func TestByErrors(t *testing.T) {
	crops := filepath.Join(figureDir, "crops.csv")
	for _, tc := range []struct {
		name string
		args []string
		code int
		want string
	}{
		{"no such column", []string{"bars", crops, "--by", "regoin"}, exitData, `--by: ` + crops + `: line 1, column "regoin": there is no such column; did you mean "region"?`},
		{"order without by", []string{"bars", crops, "--by-order", "label"}, exitUsage, "give --by COLUMN too"},
		{"bad order", []string{"bars", crops, "--by", "region", "--by-order", "size"}, exitUsage, `--by-order "size": use value, label or data`},
		{"panel error names the panel", []string{"bars", crops, "--by", "region", "--value", "yield", "--label", "crop"}, exitData, `column "yield"`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, _, stderr := plumb(t, "", tc.args...)
			assert.Equal(t, tc.code, code, stderr)
			assert.Contains(t, stderr, tc.want)
		})
	}
}

func TestByTooManyPanels(t *testing.T) {
	var b strings.Builder
	b.WriteString("group,item,value\n")
	for g := range maxByPanels + 1 {
		b.WriteString("g" + string(rune('A'+g%26)) + string(rune('a'+g/26)) + ",x,1\n")
	}
	code, _, stderr := plumb(t, b.String(), "bars", "-", "--by", "group")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "61 values, too many panels to compare")
}

func TestByTooDenseForSlide(t *testing.T) {
	// 20 panels cannot keep 24 px text on one 1920x1080 slide: the message
	// says how many panels --by made and what would fit.
	var b strings.Builder
	b.WriteString("group,item,value\n")
	for g := range 20 {
		for _, item := range []string{"first", "second", "third", "fourth", "fifth"} {
			b.WriteString("Group " + string(rune('A'+g)) + "," + item + ",12\n")
		}
	}
	code, _, stderr := plumb(t, b.String(), "bars", "-", "--by", "group", "--for", "slide", "--quiet")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "--by group made 20 panels: ")
	assert.Contains(t, stderr, "--size")
	assert.Contains(t, stderr, "draw fewer panels: filter the rows, or choose a --by column with fewer values")
}

func TestMergeNotes(t *testing.T) {
	cols := render.Note{Code: "columns", Text: "using column x"}
	skip := render.Note{Code: "rows-skipped", Changed: true, Text: "skipped 2 rows"}
	got := mergeNotes([]string{"A", "B"}, [][]render.Note{{cols, skip}, {cols}})
	texts := make([]string, len(got))
	for i, n := range got {
		texts[i] = n.Text
	}
	assert.Equal(t, []string{"using column x", `panel "A": skipped 2 rows`}, texts)
	assert.True(t, slices.ContainsFunc(got, func(n render.Note) bool { return n.Code == "rows-skipped" }))
}

// Scatter plots by group: one panel per value, one scale on both axes
// (a point's offset from the axis origin per unit is the same in every
// panel), and a group has one colour in every panel, even where the first
// rows of a panel belong to another group.
func TestByScatter(t *testing.T) {
	var b strings.Builder
	b.WriteString("harbour,km,minutes,vessel\n")
	for i, h := range []string{"North", "South", "East", "West"} {
		for j := range 12 {
			v := []string{"ferry", "fast"}[(i+j)%2]
			fmt.Fprintf(&b, "%s,%d,%d,%s\n", h, 5+j*3+i, 20+j*(5+i), v)
		}
	}
	out := filepath.Join(t.TempDir(), "s.svg")
	code, _, stderr := plumb(t, b.String(), "scatter", "-", "--format", "csv", "--x", "km", "--y", "minutes", "--group", "vessel", "--by", "harbour", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	data, err := os.ReadFile(out)
	require.NoError(t, err)
	root := checkFigure(t, data)
	panels := panelsOf(root)
	require.Len(t, panels, 4)
	colourOf := map[string]string{}
	var scaleX []float64
	for _, p := range panels {
		pts := p.all("circle", "plumb-mark")
		require.Len(t, pts, 12)
		// Two points of the panel give its px per unit along x.
		a, z := pts[0], pts[len(pts)-1]
		scaleX = append(scaleX, (z.num(t, "cx")-a.num(t, "cx"))/(z.num(t, "data-x")-a.num(t, "data-x")))
		for _, c := range pts {
			g, fill := c.Attr["data-group"], c.Attr["fill"]
			if prev, ok := colourOf[g]; ok {
				assert.Equal(t, prev, fill, "group %s in panel %s", g, p.Attr["data-panel"])
			}
			colourOf[g] = fill
		}
	}
	for _, s := range scaleX[1:] {
		assert.InDelta(t, scaleX[0], s, 1e-6*math.Abs(scaleX[0]), "one px per unit along x")
	}
	assert.NotEqual(t, colourOf["ferry"], colourOf["fast"])
}

// Heat maps by group share one colour scale: a value has one colour in
// every panel, whatever each panel's own range.
func TestByHeatSharesColours(t *testing.T) {
	data := "route,day,hour,load\n" +
		"North,Mon,6,10\nNorth,Mon,7,20\nNorth,Tue,6,30\nNorth,Tue,7,40\n" +
		"South,Mon,6,40\nSouth,Mon,7,60\nSouth,Tue,6,80\nSouth,Tue,7,90\n"
	out := filepath.Join(t.TempDir(), "h.svg")
	code, _, stderr := plumb(t, data, "heat", "-", "--format", "csv", "--row", "day", "--col", "hour", "--value", "load", "--by", "route", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	b, err := os.ReadFile(out)
	require.NoError(t, err)
	root := checkFigure(t, b)
	require.Len(t, panelsOf(root), 2)
	fill := map[string]string{}
	for _, c := range root.all("rect", "plumb-mark") {
		v := c.Attr["data-value"]
		if prev, ok := fill[v]; ok {
			assert.Equal(t, prev, c.Attr["fill"], "value %s", v)
		}
		fill[v] = c.Attr["fill"]
	}
	require.Contains(t, fill, "40")
	assert.Len(t, fill, 7, "seven distinct values, one colour each")
	// The wide form has no rows to split.
	code, _, stderr = plumb(t, "site,a,b\nx,1,2\n", "heat", "-", "--format", "csv", "--by", "site")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "long form")
}

// Maps by group share one set of classes chosen from every row.
func TestByMapSharesClasses(t *testing.T) {
	shapes := shapesFile(t, "Alder", "Birch", "Cedar", "Damson")
	var b strings.Builder
	b.WriteString("year,place,v\n")
	for i, y := range []string{"2024", "2025"} {
		for j, p := range []string{"Alder", "Birch", "Cedar", "Damson"} {
			fmt.Fprintf(&b, "%s,%s,%d\n", y, p, (i*4+j+1)*10)
		}
	}
	out := filepath.Join(t.TempDir(), "m.svg")
	code, _, stderr := plumb(t, b.String(), "map", "-", "--format", "csv", "--region", "place", "--value", "v", "--shapes", shapes, "--classes", "4", "--by", "year", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	data, err := os.ReadFile(out)
	require.NoError(t, err)
	root := checkFigure(t, data)
	require.Len(t, panelsOf(root), 2)
	var limits [][]string
	for _, p := range panelsOf(root) {
		var l []string
		for _, s := range p.all("rect", "plumb-key-swatch") {
			l = append(l, s.Attr["data-high"])
		}
		limits = append(limits, l[:len(l)-1]) // the inner limits
	}
	assert.Equal(t, limits[0], limits[1], "one set of classes")
	code, _, stderr = plumb(t, b.String(), "map", "-", "--format", "csv", "--shapes", shapes, "--breaks", "none", "--by", "year")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "one set of classes")
}
