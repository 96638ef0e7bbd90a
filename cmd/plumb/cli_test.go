package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/image/font/gofont/goregular"
)

// plumb runs the CLI as a shell would and returns exit code, stdout, stderr.
func plumb(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errs bytes.Buffer
	code := run(args, strings.NewReader(stdin), &out, &errs)
	return code, out.String(), errs.String()
}

func writeFile(t *testing.T, dir, name, content string) string {
	t.Helper()
	p := filepath.Join(dir, name)
	require.NoError(t, os.WriteFile(p, []byte(content), 0o644))
	return p
}

const eightRegions = `region,revenue
North,120
South,340
East,95
West,410
Centre,260
Coast,75
Hills,180
Islands,55
`

func TestBarsEndToEnd(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "sales.csv", eightRegions)
	out := filepath.Join(dir, "fig.svg")
	code, _, stderr := plumb(t, "", "bars", data, "--label", "region", "--value", "revenue", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	svg, err := os.ReadFile(out)
	require.NoError(t, err)
	root := checkFigure(t, svg)
	checkBars(t, root)
	bars := root.all("rect", "plumb-mark")
	require.Len(t, bars, 8)
	// Sorted largest first: top to bottom.
	prevY, prevV := -1.0, 1e18
	for _, b := range bars {
		y, v := b.num(t, "y"), b.num(t, "data-value")
		assert.Greater(t, y, prevY)
		assert.LessOrEqual(t, v, prevV)
		prevY, prevV = y, v
	}
}

func TestBarsDeterministic(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "sales.csv", eightRegions)
	_, a, _ := plumb(t, "", "bars", data)
	_, b, _ := plumb(t, "", "bars", data)
	require.NotEmpty(t, a)
	assert.Equal(t, a, b, "two runs must give byte-identical SVG")
}

func TestStdinToStdout(t *testing.T) {
	code, out, stderr := plumb(t, eightRegions, "bars", "-", "--label", "region", "--value", "revenue")
	require.Equal(t, exitOK, code, stderr)
	assert.True(t, strings.HasPrefix(out, "<?xml"), "SVG on stdout")
	checkFigure(t, []byte(out))
}

func TestMarkupIsText(t *testing.T) {
	data := "name,value\n\"<script>alert(1)</script>\",5\n\"a & b \"\"q\"\"\",3\n"
	code, out, stderr := plumb(t, data, "bars", "-", "--title", "<b>bold</b>")
	require.Equal(t, exitOK, code, stderr)
	assert.NotContains(t, out, "<script>")
	assert.NotContains(t, out, "<b>")
	root := checkFigure(t, []byte(out))
	var found bool
	for _, n := range root.all("text", "plumb-label") {
		if n.Text == "<script>alert(1)</script>" {
			found = true
		}
	}
	assert.True(t, found, "the label arrives as text")
}

func TestOtherBar(t *testing.T) {
	var b strings.Builder
	b.WriteString("item,count\n")
	for i := 1; i <= 20; i++ {
		fmt.Fprintf(&b, "Item %d,%d\n", i, 100+i*7)
	}
	// An explicit --agg sum says the values are parts of a whole.
	code, out, stderr := plumb(t, b.String(), "bars", "-", "--agg", "sum")
	require.Equal(t, exitOK, code, stderr)
	root := checkFigure(t, []byte(out))
	checkBars(t, root)
	bars := root.all("rect", "plumb-mark")
	require.Len(t, bars, 12)
	last := bars[len(bars)-1]
	assert.Equal(t, "Other (9)", last.Attr["data-label"])
	assert.Contains(t, stderr, "Other (9)")
	// The Other bar holds the sum of the nine smallest: items 1..9.
	sum := 0
	for i := 1; i <= 9; i++ {
		sum += 100 + i*7
	}
	assert.Equal(t, fmt.Sprint(sum), last.Attr["data-value"])
}

// TestOtherNeverSumsMedians: one value per label may be a median or a rate,
// which do not add up, so no Other bar is made of them (issue 7, item 1).
func TestOtherNeverSumsMedians(t *testing.T) {
	var b strings.Builder
	b.WriteString("area,median_income\n")
	for i := 1; i <= 30; i++ {
		fmt.Fprintf(&b, "Area %d,%d\n", i, 90000+i*1250)
	}
	code, out, stderr := plumb(t, b.String(), "bars", "-")
	require.Equal(t, exitOK, code, stderr)
	root := checkFigure(t, []byte(out))
	checkBars(t, root)
	assert.Len(t, root.all("rect", "plumb-mark"), 30, "every area drawn")
	assert.NotContains(t, out, "Other (")

	code, out, stderr = plumb(t, b.String(), "bars", "-", "--top", "5")
	require.Equal(t, exitOK, code, stderr)
	root = checkFigure(t, []byte(out))
	assert.Len(t, root.all("rect", "plumb-mark"), 5)
	assert.NotContains(t, out, "Other (")
	assert.Contains(t, stderr, "left out 25")
	var under bool
	for _, n := range root.all("text", "plumb-note") {
		under = under || strings.Contains(n.Text, "5 of 30 categories shown")
	}
	assert.True(t, under, "the chart itself says how many were left out")

	code, out, stderr = plumb(t, b.String(), "bars", "-", "--top", "5", "--other", "mean")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "Other (26)")
	code, _, stderr = plumb(t, b.String(), "dots", "-", "--other", "sum")
	assert.Equal(t, exitUsage, code, stderr)
}

func TestFromRefusedSuggestsDots(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "fig.svg")
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "--from", "50", "-o", out)
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "plumb dots")
	assert.NoFileExists(t, out)
}

func TestNegativeBarsEndAtZero(t *testing.T) {
	code, out, stderr := plumb(t, "k,v\na,5\nb,-3\nc,-8\nd,2\n", "bars", "-")
	require.Equal(t, exitOK, code, stderr)
	checkBars(t, checkFigure(t, []byte(out)))
}

func TestBadNumberNamesLineAndColumn(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "bad.csv", "region,revenue\nNorth,12\nSouth,1x2\n")
	out := filepath.Join(dir, "fig.svg")
	code, _, stderr := plumb(t, "", "bars", data, "--label", "region", "--value", "revenue", "-o", out)
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "bad.csv")
	assert.Contains(t, stderr, "line 3")
	assert.Contains(t, stderr, `"revenue"`)
	assert.Contains(t, stderr, "1x2")
	assert.NoFileExists(t, out)
	entries, _ := os.ReadDir(dir)
	assert.Len(t, entries, 1, "no temporary file is left behind")
}

func TestFailureKeepsPreviousFigure(t *testing.T) {
	dir := t.TempDir()
	out := writeFile(t, dir, "fig.svg", "previous")
	code, _, _ := plumb(t, eightRegions, "bars", "-", "--from", "50", "-o", out)
	assert.Equal(t, exitData, code)
	got, _ := os.ReadFile(out)
	assert.Equal(t, "previous", string(got))
}

func TestMissingColumnSuggests(t *testing.T) {
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "--label", "region", "--value", "revenu")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, `"revenue"`)
}

func TestDotsDomainFitsData(t *testing.T) {
	code, out, stderr := plumb(t, "k,v\na,91\nb,94.5\nc,88\nd,97\n", "dots", "-")
	require.Equal(t, exitOK, code, stderr)
	root := checkFigure(t, []byte(out))
	dots := root.all("circle", "plumb-mark")
	require.Len(t, dots, 4)
	// Positions are linear in value: (x - x0)/(v - v0) is constant.
	x0, v0 := dots[0].num(t, "cx"), dots[0].num(t, "data-value")
	k := (dots[1].num(t, "cx") - x0) / (dots[1].num(t, "data-value") - v0)
	for _, d := range dots[2:] {
		got := (d.num(t, "cx") - x0) / (d.num(t, "data-value") - v0)
		assert.InDelta(t, k, got, 0.01*k)
	}
	// Zero is far outside the data, so it is not on the axis.
	for _, tk := range root.all("text", "plumb-tick") {
		assert.NotEqual(t, "0", tk.Text)
	}
}

func TestUsageErrorsExit2(t *testing.T) {
	code, _, _ := plumb(t, "", "bars")
	assert.Equal(t, exitUsage, code)
	code, _, _ = plumb(t, "", "bars", "x.csv", "--order", "sideways")
	assert.Equal(t, exitUsage, code)
	code, _, _ = plumb(t, "", "nosuchchart")
	assert.Equal(t, exitUsage, code)
}

func TestDemoWritesGallery(t *testing.T) {
	dir := t.TempDir()
	code, _, stderr := plumb(t, "", "demo", "-o", dir)
	require.Equal(t, exitOK, code, stderr)
	files, _ := filepath.Glob(filepath.Join(dir, "*.svg"))
	assert.GreaterOrEqual(t, len(files), len(gallery))
}

func TestFontFlags(t *testing.T) {
	dir := t.TempDir()
	font := filepath.Join(dir, "face.ttf")
	require.NoError(t, os.WriteFile(font, goregular.TTF, 0o644))
	code, out, stderr := plumb(t, eightRegions, "bars", "-", "--font", font, "--embed-font")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "@font-face")
	assert.Contains(t, out, "base64,")
	checkFigure(t, []byte(out))

	bad := writeFile(t, dir, "bad.ttf", "not a font")
	code, _, stderr = plumb(t, eightRegions, "bars", "-", "--font", bad)
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "bad.ttf")
}
