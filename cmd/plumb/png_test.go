package main

import (
	"bytes"
	"errors"
	"image"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// pngSize reads the size of a PNG file.
func pngSize(t *testing.T, path string) image.Point {
	t.Helper()
	b, err := os.ReadFile(path)
	require.NoError(t, err)
	cfg, err := png.DecodeConfig(bytes.NewReader(b))
	require.NoError(t, err, "a PNG file")
	return image.Pt(cfg.Width, cfg.Height)
}

var svgWH = regexp.MustCompile(`<svg width="([^"]*)" height="([^"]*)"`)

// svgSize runs the same command to standard output and reads the width and
// height of its SVG.
func svgSize(t *testing.T, stdin string, args ...string) [2]float64 {
	t.Helper()
	code, out, stderr := plumb(t, stdin, args...)
	require.Equal(t, exitOK, code, stderr)
	m := svgWH.FindStringSubmatch(out)
	require.NotNil(t, m, "an SVG with a width and height")
	w, err1 := strconv.ParseFloat(m[1], 64)
	h, err2 := strconv.ParseFloat(m[2], 64)
	require.NoError(t, errors.Join(err1, err2))
	return [2]float64{w, h}
}

func TestPNGOutput(t *testing.T) {
	dir := t.TempDir()
	years := "year,north,south\n2019,3,4\n2020,5,3\n2021,4,6\n2022,7,5\n"
	for _, tc := range []struct {
		name  string
		stdin string
		args  []string
		scale int
		want  image.Point // zero: the SVG's size times scale
	}{
		{"bars", eightRegions, []string{"bars", "-"}, 1, image.Point{}},
		{"bars at scale 2", eightRegions, []string{"bars", "-", "--scale", "2"}, 2, image.Point{}},
		{"dots", eightRegions, []string{"dots", "-"}, 1, image.Point{}},
		{"lines at scale 3", years, []string{"lines", "-", "--scale", "3"}, 3, image.Point{}},
		{"diff", years, []string{"diff", "-"}, 1, image.Point{}},
		{"slide", years, []string{"lines", "-", "--for", "slide"}, 1, image.Pt(1920, 1080)},
		{"640x400 at scale 2", eightRegions, []string{"bars", "-", "--size", "640x400", "--scale", "2"}, 2, image.Pt(1280, 800)}, // issue 13
	} {
		t.Run(tc.name, func(t *testing.T) {
			out := filepath.Join(dir, tc.name+".png")
			code, stdout, stderr := plumb(t, tc.stdin, append(tc.args, "-o", out)...)
			require.Equal(t, exitOK, code, stderr)
			assert.Empty(t, stdout)
			got := pngSize(t, out)
			want := tc.want
			if want == (image.Point{}) {
				var svgArgs []string
				for i := 0; i < len(tc.args); i++ {
					if tc.args[i] == "--scale" {
						i++
						continue
					}
					svgArgs = append(svgArgs, tc.args[i])
				}
				// The SVG's size times the scale, rounded up as
				// rsvg-convert rounds it.
				wh := svgSize(t, tc.stdin, svgArgs...)
				want = image.Pt(int(math.Ceil(wh[0]*float64(tc.scale))), int(math.Ceil(wh[1]*float64(tc.scale))))
			}
			assert.Equal(t, want, got)
		})
	}
}

func TestScaleFlag(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct {
		name string
		args []string
		want string
	}{
		{"not a PNG", []string{"--scale", "2", "-o", filepath.Join(dir, "a.svg")}, "--scale 2: only a PNG has pixels to scale"},
		{"standard output", []string{"--scale", "2"}, "only a PNG has pixels to scale"},
		{"zero", []string{"--scale", "0", "-o", filepath.Join(dir, "a.png")}, `--scale "0": give the pixels per SVG unit`},
		{"negative", []string{"--scale", "-2", "-o", filepath.Join(dir, "a.png")}, `--scale "-2": give`},
		{"NaN", []string{"--scale", "NaN", "-o", filepath.Join(dir, "a.png")}, `--scale "NaN": give`},
		{"huge", []string{"--scale", "1e9", "-o", filepath.Join(dir, "a.png")}, "at most 16"},
		{"over the pixel limit", []string{"--scale", "16", "--size", "4000x3000", "-o", filepath.Join(dir, "a.png")}, "over the limit of 64 million pixels"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, _, stderr := plumb(t, eightRegions, append([]string{"bars", "-"}, tc.args...)...)
			assert.NotEqual(t, exitOK, code)
			assert.Contains(t, stderr, tc.want)
			assert.NoFileExists(t, filepath.Join(dir, "a.png"))
		})
	}
}
