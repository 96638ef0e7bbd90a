package main

import (
	"bytes"
	"errors"
	"fmt"
	"image"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"plumb/render"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestFigureSlide(t *testing.T) {
	out := filepath.Join(t.TempDir(), "slide.svg")
	code, _, stderr := plumb(t, "", "figure", filepath.Join(figureDir, "slide.json"), "-o", out)
	require.Equal(t, exitOK, code, stderr)
	data, err := os.ReadFile(out)
	require.NoError(t, err)
	root := checkFigure(t, data)
	assert.Equal(t, 1920.0, root.num(t, "width"))
	assert.Equal(t, 1080.0, root.num(t, "height"))
	assert.Len(t, panelsOf(root), 4)
	// No text under 20 px on a slide (issue 10); plumb's slide floor is 24.
	assert.GreaterOrEqual(t, smallestText(t, root), 24.0)
	titles := []string{}
	for _, p := range panelsOf(root) {
		titles = append(titles, p.Attr["data-panel"])
	}
	assert.Equal(t, []string{"All regions, tonnes", "Mean yield", "All crops, tonnes", "Mean yield by region"}, titles)
	assert.Contains(t, string(data), "Harvest 2025 by region")
	renderable(t, out)
}

// smallestText is the smallest font-size of any element of the figure.
func smallestText(t *testing.T, root *svgNode) float64 {
	t.Helper()
	least := 0.0
	n := 0
	root.walk(func(c *svgNode) {
		if c.Name == "text" && c.Attr["font-size"] == "" {
			t.Errorf("text %q has no font-size", c.Text)
		}
		if s, ok := c.Attr["font-size"]; ok {
			v, err := strconv.ParseFloat(s, 64)
			if err != nil {
				t.Errorf("font-size %q is not a number", s)
				return
			}
			if n == 0 || v < least {
				least = v
			}
			n++
		}
	})
	return least
}

// mediumFloor is the text floor of the medium a figure was drawn for, read
// from its size: a 1920x1080 canvas is a slide (24 px), a canvas at most
// 400 px wide a print column (7 pt, 9.33 px), anything else a screen
// (12 px). The floors are render's (medium.go).
func mediumFloor(w, h float64) (string, float64) {
	switch {
	case w == 1920 && h == 1080:
		return "slide", 24
	case w <= 400:
		return "print", 7 * 96.0 / 72
	}
	return "screen", 12
}

// TestGoldenTextFloor checks every golden figure for text smaller than
// its medium allows: a grid shrinks plot areas, never text.
func TestGoldenTextFloor(t *testing.T) {
	files, err := filepath.Glob(filepath.Join(goldenDir, "*.svg"))
	require.NoError(t, err)
	require.NotEmpty(t, files)
	for _, path := range files {
		t.Run(filepath.Base(path), func(t *testing.T) {
			data, err := os.ReadFile(path)
			require.NoError(t, err)
			root := parseSVG(t, data)
			medium, floor := mediumFloor(root.num(t, "width"), root.num(t, "height"))
			// Sizes are written with two decimals, rounded up (typeStep).
			assert.GreaterOrEqual(t, smallestText(t, root), floor-0.005, "text below the %s floor", medium)
		})
	}
}

// figureFixture writes crops.csv and a figure file with the given panels
// (and top-level keys) into a new folder and returns the file's path.
func figureFixture(t *testing.T, name, body string) string {
	t.Helper()
	dir := t.TempDir()
	crops, err := os.ReadFile(filepath.Join(figureDir, "crops.csv"))
	require.NoError(t, err)
	writeFile(t, dir, "crops.csv", string(crops))
	return writeFile(t, dir, name, body)
}

func TestFigureErrors(t *testing.T) {
	for _, tc := range []struct {
		name, json, want string
	}{
		{"missing column under its key", `{"panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes"},
			{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes"},
			{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "kg"}]}`,
			`panels[2].value: no column "kg" in crops.csv; the columns are "region", "crop", "tonnes", "yield_t_ha"`},
		{"unknown panel key", `{"panels": [{"chart": "bars", "data": "crops.csv", "lable": "crop"}]}`, `panels[0].lable: unknown key for a bars panel; did you mean "label"?`},
		{"unknown figure key", `{"colums": 2, "panels": []}`, `colums: unknown key of a figure; did you mean "columns"?`},
		{"number as string", `{"panels": [{"chart": "bars", "data": "crops.csv", "top": "5"}]}`, `panels[0].top: give a whole number, not a string`},
		{"switch as string", `{"panels": [{"chart": "bars", "data": "crops.csv", "vertical": "yes"}]}`, `panels[0].vertical: give true or false, not a string`},
		{"list item", `{"panels": [{"chart": "bars", "data": "crops.csv", "highlight": ["oats", 3]}]}`, `panels[0].highlight: item 1: give a string, not a number`},
		{"bad choice", `{"panels": [{"chart": "dots", "data": "crops.csv", "order": "size"}]}`, `panels[0].order: "size": use value, label or data`},
		{"unknown chart", `{"panels": [{"chart": "pie", "data": "crops.csv"}]}`, `panels[0].chart: unknown chart "pie"; use bars, dots, lines, diff, span, box, hist, scatter, heat or map`},
		{"no chart", `{"panels": [{"data": "crops.csv"}]}`, `panels[0]: no "chart" key`},
		{"no data", `{"panels": [{"chart": "bars"}]}`, `panels[0]: no "data" key`},
		{"missing file", `{"panels": [{"chart": "bars", "data": "nope.csv"}]}`, `panels[0].data: cannot read nope.csv: no such file or directory`},
		{"figure key in a panel", `{"panels": [{"chart": "bars", "data": "crops.csv", "for": "slide"}]}`, `panels[0].for: the medium is the whole figure's`},
		{"by in a panel", `{"panels": [{"chart": "bars", "data": "crops.csv", "by": "region"}]}`, `panels[0].by: a panel is one chart`},
		{"repeated key", `{"panels": [{"chart": "bars", "chart": "dots", "data": "crops.csv"}]}`, `panels[0].chart: the key "chart" is given twice`},
		{"flag in a message as key", `{"panels": [{"chart": "lines", "data": "crops.csv", "series": "region", "y": ["tonnes", "yield_t_ha"]}]}`, `panels[0].series takes one value column (panels[0].y COL)`},
		{"not an object", `[1, 2]`, `a figure file is a JSON object with "panels", not a list`},
		{"no panels", `{"title": "x"}`, `no "panels"`},
		{"empty panels", `{"panels": []}`, `panels: the list is empty`},
		{"panels not a list", `{"panels": {"chart": "bars"}}`, `panels: give a list of panel objects, not an object`},
		{"syntax", "{\n\"panels\": [,]}", `line 2: not valid JSON`},
		{"bad medium", `{"for": "tv", "panels": [{"chart": "bars", "data": "crops.csv"}]}`, `for: "tv": use print, screen or slide`},
		{"bad size", `{"size": "wide", "panels": [{"chart": "bars", "data": "crops.csv"}]}`, `size: "wide": give width x height in pixels`},
		{"negative columns", `{"columns": -1, "panels": [{"chart": "bars", "data": "crops.csv"}]}`, `columns: -1: give 0`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			file := figureFixture(t, "fig.json", tc.json)
			code, _, stderr := plumb(t, "", "figure", file, "-o", filepath.Join(t.TempDir(), "out.svg"))
			assert.Equal(t, exitData, code, stderr)
			assert.Contains(t, stderr, "plumb: "+file+": "+tc.want)
			assert.Equal(t, 1, strings.Count(stderr, "\n"), "one line: %s", stderr)
		})
	}
}

func TestFigureUsage(t *testing.T) {
	a := figureFixture(t, "a.json", `{"panels": [{"chart": "bars", "data": "crops.csv"}]}`)
	b := figureFixture(t, "a.json", `{"panels": [{"chart": "bars", "data": "crops.csv"}]}`)
	for _, tc := range []struct {
		name string
		args []string
		want string
	}{
		{"no file", []string{"figure"}, "give one or more figure files"},
		{"several to stdout", []string{"figure", a, b}, "2 figure files need -o DIR"},
		{"same name twice", []string{"figure", a, b, "-o", t.TempDir()}, "would both be written to a.svg"},
		{"unknown flag", []string{"figure", a, "--columns", "2"}, "unknown flag --columns"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, _, stderr := plumb(t, "", tc.args...)
			assert.Equal(t, exitUsage, code, stderr)
			assert.Contains(t, stderr, tc.want)
		})
	}
}

func TestFigureToStdoutAndDir(t *testing.T) {
	a := figureFixture(t, "harvest.json", `{"title": "Harvest", "panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes", "title": "Tonnes"}]}`)
	code, stdout, stderr := plumb(t, "", "figure", a, "--quiet")
	require.Equal(t, exitOK, code, stderr)
	assert.True(t, strings.HasPrefix(stdout, "<?xml"), "one figure file without -o goes to standard output")
	dir := filepath.Join(t.TempDir(), "new") + "/"
	code, _, stderr = plumb(t, "", "figure", a, "-o", dir, "--quiet")
	require.Equal(t, exitOK, code, stderr)
	got, err := os.ReadFile(filepath.Join(dir, "harvest.svg"))
	require.NoError(t, err)
	assert.Equal(t, stdout, string(got))
}

// TestFigureParallelDeterministic renders the same figure files one at a
// time and several at once: the bytes must not depend on the schedule.
func TestFigureParallelDeterministic(t *testing.T) {
	var files []string
	dir := t.TempDir()
	crops, err := os.ReadFile(filepath.Join(figureDir, "crops.csv"))
	require.NoError(t, err)
	writeFile(t, dir, "crops.csv", string(crops))
	for i := range 6 {
		files = append(files, writeFile(t, dir, fmt.Sprintf("fig%d.json", i), fmt.Sprintf(`{"title": "Figure %d", "columns": %d, "panels": [
			{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes", "title": "Tonnes"},
			{"chart": "dots", "data": "crops.csv", "label": "region", "value": "yield_t_ha", "agg": "mean", "title": "Yield"}]}`, i, 1+i%2)))
	}
	render := func(workers int) [][]byte {
		out := filepath.Join(t.TempDir(), "out")
		jobs, err := figureJobs(files, out)
		require.NoError(t, err)
		renderFigures(jobs, &bytes.Buffer{}, func() {}, workers)
		var all [][]byte
		for _, j := range jobs {
			require.NoError(t, j.err)
			data, err := os.ReadFile(j.out)
			require.NoError(t, err)
			all = append(all, data)
		}
		return all
	}
	serial, parallel := render(1), render(4)
	for i := range serial {
		assert.True(t, bytes.Equal(serial[i], parallel[i]), "fig%d.svg differs between serial and parallel rendering", i)
	}
	assert.False(t, bytes.Equal(serial[0], serial[1]), "the figures differ from each other, so the comparison means something")
}

func TestFigureProgressOnlyOnTerminal(t *testing.T) {
	a := figureFixture(t, "a.json", `{"panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes"}]}`)
	b := figureFixture(t, "b.json", `{"panels": [{"chart": "bars", "data": "crops.csv", "label": "region", "value": "tonnes"}]}`)
	code, _, stderr := plumb(t, "", "figure", a, b, "-o", t.TempDir(), "--quiet")
	require.Equal(t, exitOK, code, stderr)
	assert.Empty(t, stderr, "no progress line when stderr is not a terminal")
	assert.False(t, isTerminal(&bytes.Buffer{}))
	f, err := os.CreateTemp(t.TempDir(), "log")
	require.NoError(t, err)
	defer f.Close()
	assert.False(t, isTerminal(f), "a log file is not a terminal")
}

func TestFigureOneBadFileOthersWritten(t *testing.T) {
	good := figureFixture(t, "good.json", `{"panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes"}]}`)
	bad := figureFixture(t, "bad.json", `{"panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "kg"}]}`)
	out := t.TempDir()
	code, _, stderr := plumb(t, "", "figure", good, bad, "-o", out, "--quiet")
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, `panels[0].value: no column "kg"`)
	_, err := os.Stat(filepath.Join(out, "good.svg"))
	assert.NoError(t, err, "the good figure is still written")
	_, err = os.Stat(filepath.Join(out, "bad.svg"))
	assert.Error(t, err, "no figure for the bad file")
}

// TestPanelKeysAreChartFlags checks that a panel takes every flag of its
// chart as a key, straight from the command table, and that every key a
// panel refuses is a flag there.
func TestPanelKeysAreChartFlags(t *testing.T) {
	dir := t.TempDir()
	refused := map[string]bool{}
	for _, c := range commandTable() {
		if c.chart == nil {
			continue
		}
		pc, ok := c.chart().(panelChart)
		if !ok {
			continue
		}
		for _, d := range pc.flags() {
			if _, no := notPanelKeys[d.name]; no {
				refused[d.name] = true
				continue
			}
			value := `""`
			switch d.value.(type) {
			case boolValue, indexValue:
				value = "false"
			case intValue, numberValue, positiveValue:
				value = "1"
			}
			if d.repeat {
				value = "[]"
			}
			body := fmt.Sprintf(`{"panels": [{"chart": %q, "data": "none.csv", %q: %s}]}`, c.name, d.name, value)
			_, err := parseFigure([]byte(body), dir)
			require.Error(t, err, "none.csv does not exist")
			assert.NotContains(t, err.Error(), "unknown key", "%s panel, key %q", c.name, d.name)
			assert.NotContains(t, err.Error(), "give ", "%s panel, key %q: value %s", c.name, d.name, value)
		}
	}
	for k := range notPanelKeys {
		assert.True(t, refused[k], "%q is refused in panels but is no chart's flag", k)
	}
}

// TestFigureExamplesRender renders every example figure file in
// testdata/figure, as the README promises.
func TestFigureExamplesRender(t *testing.T) {
	files, err := filepath.Glob(filepath.Join(figureDir, "*.json"))
	require.NoError(t, err)
	require.GreaterOrEqual(t, len(files), 2)
	out := t.TempDir()
	code, _, stderr := plumb(t, "", append(append([]string{"figure"}, files...), "-o", out, "--quiet")...)
	require.Equal(t, exitOK, code, stderr)
	for _, f := range files {
		svg := filepath.Join(out, strings.TrimSuffix(filepath.Base(f), ".json")+".svg")
		data, err := os.ReadFile(svg)
		require.NoError(t, err)
		checkFigure(t, data)
		renderable(t, svg)
	}
}

func TestFigureWordsNamesPanelByPath(t *testing.T) {
	spec := &figureSpec{panels: []render.Panel{{Title: "Tonnes"}, {Title: "Mean yield"}}}
	spec.opt.Names = render.OptionNames{"Top": "top"}
	err := fmt.Errorf("panel %q: %w", "Mean yield", &render.OptionError{Option: "Top", Value: "-2", Err: render.ErrNegative})
	assert.Equal(t, `panels[1] ("Mean yield"): top -2: `+render.ErrNegative.Error(), figureWords(err, spec))
	assert.Equal(t, "no room", figureWords(errors.New("no room"), spec))
}

// A slide figure file renders to a PNG of the slide's 1920x1080 pixels.
func TestSlideFigureToPNG(t *testing.T) {
	i := slices.IndexFunc(gallery, func(f figure) bool { return f.name == "figure-slide" })
	require.GreaterOrEqual(t, i, 0)
	out := filepath.Join(t.TempDir(), "slide.png")
	var stderr bytes.Buffer
	require.Equal(t, exitOK, renderDemo(gallery[i], out, io.Discard, &stderr), stderr.String())
	img := readPNG(t, out)
	assert.Equal(t, image.Rect(0, 0, 1920, 1080), img.Bounds())
}

// FuzzFigureFile feeds arbitrary figure files to the parser and, when they
// parse, to the figure: an error or a figure, never a panic.
func FuzzFigureFile(f *testing.F) {
	f.Add([]byte(`{"panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes"}]}`))
	f.Add([]byte(`{"for": "slide", "columns": 3, "colors": "#d62728", "panels": [{"chart": "lines", "data": "crops.csv", "ref": ["mean"]}, {"chart": "hist", "data": "crops.csv", "value": "tonnes"}]}`))
	f.Add([]byte(`{"panels": [{"chart": "scatter", "data": "crops.csv", "x": "tonnes", "y": "yield_t_ha", "title": "<script>"}]}`))
	dir, err := filepath.Abs(figureDir)
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, body []byte) {
		spec, err := parseFigure(body, dir)
		if err != nil {
			return
		}
		if s, err := render.FigureScene(spec.opt, spec.panels...); err == nil {
			var b strings.Builder
			if err := render.WriteSVG(&b, s); err != nil {
				t.Fatal(err)
			}
			if strings.Contains(b.String(), "<script>") {
				t.Fatal("unescaped text in the figure")
			}
		}
	})
}
