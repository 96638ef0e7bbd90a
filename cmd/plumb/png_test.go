package main

import (
	"bytes"
	"errors"
	"image"
	"image/color"
	"image/png"
	"io"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"
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

// goFontsConfig writes the Go fonts and a fontconfig file naming only them
// into a temporary folder and returns the file, so that rsvg-convert sets
// text in the faces plumb measured with.
func goFontsConfig(t *testing.T) string {
	t.Helper()
	dir := t.TempDir()
	fonts := filepath.Join(dir, "fonts")
	require.NoError(t, os.Mkdir(fonts, 0o755))
	require.NoError(t, os.WriteFile(filepath.Join(fonts, "Go-Regular.ttf"), goregular.TTF, 0o644))
	require.NoError(t, os.WriteFile(filepath.Join(fonts, "Go-Bold.ttf"), gobold.TTF, 0o644))
	conf := filepath.Join(dir, "fonts.conf")
	require.NoError(t, os.WriteFile(conf, []byte(`<?xml version="1.0"?>
<!DOCTYPE fontconfig SYSTEM "fonts.dtd">
<fontconfig><dir>`+fonts+`</dir><cachedir>`+filepath.Join(dir, "cache")+`</cachedir></fontconfig>
`), 0o644))
	return conf
}

// TestGalleryPNGMatchesSVG draws every figure of the demo gallery as PNG
// and as SVG, renders the SVG with rsvg-convert given the Go fonts, and
// bounds the mean absolute difference of the red, green, blue and alpha
// channels (0 to 1) over the whole image and over the pixels inked in
// either: under 0.03 and 0.2 as issue 13 asks, and in fact under a third
// and a quarter of that, 0.01 and 0.05 (measured at most 0.0022 and 0.0125,
// on the dense daily line chart, when the backend was written; other
// versions of rsvg-convert anti-alias a little differently).
func TestGalleryPNGMatchesSVG(t *testing.T) {
	bin, err := exec.LookPath("rsvg-convert")
	if err != nil {
		t.Skip("rsvg-convert not installed (Debian: librsvg2-bin); .ci/run installs it")
	}
	if testing.Short() {
		t.Skip("renders the gallery twice")
	}
	conf := goFontsConfig(t)
	dir := t.TempDir()
	for _, fig := range gallery {
		t.Run(fig.name, func(t *testing.T) {
			svgPath, pngPath, refPath := filepath.Join(dir, fig.name+".svg"), filepath.Join(dir, fig.name+".png"), filepath.Join(dir, fig.name+"-ref.png")
			for _, out := range []string{svgPath, pngPath} {
				var stderr bytes.Buffer
				require.Equal(t, exitOK, renderDemo(fig, out, io.Discard, &stderr), stderr.String())
			}
			cmd := exec.Command(bin, "-o", refPath, svgPath)
			cmd.Env = append(os.Environ(), "FONTCONFIG_FILE="+conf)
			msg, err := cmd.CombinedOutput()
			require.NoError(t, err, string(msg))
			ours, ref := readPNG(t, pngPath), readPNG(t, refPath)
			require.Equal(t, ref.Bounds(), ours.Bounds(), "the PNG has the size rsvg-convert gives the SVG")
			whole, inked := channelDiff(ours, ref)
			t.Logf("mean absolute difference %.4f whole, %.4f inked", whole, inked)
			assert.Less(t, whole, 0.01, "whole image; issue 13 bound 0.03")
			assert.Less(t, inked, 0.05, "inked pixels; issue 13 bound 0.2")
		})
	}
}

func readPNG(t *testing.T, path string) image.Image {
	t.Helper()
	f, err := os.Open(path)
	require.NoError(t, err)
	defer f.Close()
	img, err := png.Decode(f)
	require.NoError(t, err)
	return img
}

// channelDiff is the mean absolute difference of the straight-alpha red,
// green, blue and alpha channels of two images of one size, on a 0 to 1
// scale, over all pixels and over those with any alpha in either image.
func channelDiff(a, b image.Image) (whole, inked float64) {
	r := a.Bounds()
	var sum, inkSum float64
	var n, inkN int
	for y := r.Min.Y; y < r.Max.Y; y++ {
		for x := r.Min.X; x < r.Max.X; x++ {
			p := color.NRGBAModel.Convert(a.At(x, y)).(color.NRGBA)
			q := color.NRGBAModel.Convert(b.At(x, y)).(color.NRGBA)
			d := 0.0
			for _, c := range [][2]uint8{{p.R, q.R}, {p.G, q.G}, {p.B, q.B}, {p.A, q.A}} {
				d += math.Abs(float64(c[0])-float64(c[1])) / 255
			}
			sum += d
			n += 4
			if p.A > 0 || q.A > 0 {
				inkSum += d
				inkN += 4
			}
		}
	}
	return sum / float64(max(n, 1)), inkSum / float64(max(inkN, 1))
}

func TestPNGGuard(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct {
		name   string
		chunks []string
		ok     bool
	}{
		{"a PNG in one write", []string{pngSignature + "IHDR"}, true},
		{"a PNG in pieces", []string{"\x89P", "NG\r", "\n\x1a\n", "IHDR"}, true},
		{"SVG", []string{"<svg>"}, false},
		{"SVG after a PNG's first bytes", []string{"\x89PNG", "<svg>"}, false},
	} {
		t.Run(tc.name, func(t *testing.T) {
			path := filepath.Join(dir, "fig.png")
			err := writeOutput(path, nil, func(w io.Writer) error {
				for _, c := range tc.chunks {
					if _, err := w.Write([]byte(c)); err != nil {
						return err
					}
				}
				return nil
			})
			if tc.ok {
				require.NoError(t, err)
				b, _ := os.ReadFile(path)
				assert.Equal(t, strings.Join(tc.chunks, ""), string(b))
				require.NoError(t, os.Remove(path))
				return
			}
			require.ErrorIs(t, err, errNotScene)
			assert.NoFileExists(t, path, "no file that is not a PNG under a .png name")
		})
	}
}
