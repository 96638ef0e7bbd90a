package render

import (
	"bytes"
	"image"
	"image/png"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"testing"

	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"
)

// rsvgRender renders an SVG with rsvg-convert, the reference SVG renderer
// CI installs, given the Go fonts (and only those) through a fontconfig
// file of the test's own, so that both renderers set the text in the faces
// layout measured with. It skips the test when rsvg-convert is absent.
func rsvgRender(t *testing.T, svg []byte, scale float64) image.Image {
	t.Helper()
	bin, err := exec.LookPath("rsvg-convert")
	if err != nil {
		t.Skip("rsvg-convert not installed (Debian: librsvg2-bin); .ci/run installs it")
	}
	dir := t.TempDir()
	fontDir := filepath.Join(dir, "fonts")
	if err := os.Mkdir(fontDir, 0o755); err != nil {
		t.Fatal(err)
	}
	for name, data := range map[string][]byte{"Go-Regular.ttf": goregular.TTF, "Go-Bold.ttf": gobold.TTF} {
		if err := os.WriteFile(filepath.Join(fontDir, name), data, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	conf := `<?xml version="1.0"?>
<!DOCTYPE fontconfig SYSTEM "fonts.dtd">
<fontconfig>
  <dir>` + fontDir + `</dir>
  <cachedir>` + filepath.Join(dir, "cache") + `</cachedir>
  <alias><family>sans-serif</family><prefer><family>Go</family></prefer></alias>
</fontconfig>
`
	confPath := filepath.Join(dir, "fonts.conf")
	if err := os.WriteFile(confPath, []byte(conf), 0o644); err != nil {
		t.Fatal(err)
	}
	in, out := filepath.Join(dir, "in.svg"), filepath.Join(dir, "out.png")
	if err := os.WriteFile(in, svg, 0o644); err != nil {
		t.Fatal(err)
	}
	args := []string{"-o", out}
	if scale != 1 {
		args = append(args, "--zoom", strconv.FormatFloat(scale, 'f', -1, 64))
	}
	cmd := exec.Command(bin, append(args, in)...)
	cmd.Env = append(os.Environ(), "FONTCONFIG_FILE="+confPath)
	if msg, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("rsvg-convert: %v\n%s", err, msg)
	}
	b, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		t.Fatal(err)
	}
	return img
}

// imageDiff is the mean absolute difference of the red, green and blue
// channels, on a 0 to 1 scale, of two images of one size each put over
// white: over the whole image, and over the inked pixels (those that are
// not pure white in either image).
func imageDiff(a, b image.Image) (whole, inked float64) {
	r := a.Bounds()
	var sum, inkSum float64
	var n, inkN int
	flat := func(img image.Image, x, y int) [3]float64 {
		cr, cg, cb, ca := img.At(x, y).RGBA() // premultiplied, 16-bit
		w := float64(0xffff - ca)
		return [3]float64{(float64(cr) + w) / 0xffff, (float64(cg) + w) / 0xffff, (float64(cb) + w) / 0xffff}
	}
	for y := r.Min.Y; y < r.Max.Y; y++ {
		for x := r.Min.X; x < r.Max.X; x++ {
			p, q := flat(a, x, y), flat(b, x, y)
			var d float64
			white := true
			for i := range 3 {
				d += math.Abs(p[i] - q[i])
				if p[i] < 1-1e-9 || q[i] < 1-1e-9 {
					white = false
				}
			}
			sum += d
			n += 3
			if !white {
				inkSum += d
				inkN += 3
			}
		}
	}
	if inkN == 0 {
		inkN = 1
	}
	return sum / float64(n), inkSum / float64(inkN)
}

// compareScenes are the figures the PNG backend is held to rsvg-convert's
// rendering on: a bar chart and a line chart of invented values.
func compareScenes(t *testing.T) map[string]*Scene {
	t.Helper()
	bars, err := BarsScene([]string{"Harbour", "Old town", "Station", "Riverside", "Hill", "Market"},
		[]float64{412, 288.5, 197, 150, 96.25, 31}, BarsOptions{Common: Common{Title: "Visitors per day", Subtitle: "Mean over May", Source: "Invented figures"}})
	if err != nil {
		t.Fatal(err)
	}
	x := []float64{2015, 2016, 2017, 2018, 2019, 2020, 2021, 2022, 2023}
	lines, err := LinesScene([]Series{
		{Name: "Ferry", X: x, Y: []float64{100, 104, 103, 110, 118, 61, 84, 102, 109}},
		{Name: "Bus", X: x, Y: []float64{100, 101, 99, 100, 98, 70, 80, 91, 95}},
	}, LinesOptions{Common: Common{Title: "Trips, 2015 = 100", Source: "Invented figures"}})
	if err != nil {
		t.Fatal(err)
	}
	return map[string]*Scene{"bars": bars, "lines": lines}
}

// TestPNGMatchesReferenceRenderer holds our PNG to rsvg-convert's
// rendering of our SVG of the same scene, the bar and line charts and the
// stroke sampler of the golden files, at scale 1 and 2.
func TestPNGMatchesReferenceRenderer(t *testing.T) {
	scenes := goldenPNGs(t)
	for _, name := range []string{"bars", "lines", "strokes"} {
		for _, scale := range []float64{1, 2} {
			t.Run(name+"@"+strconv.FormatFloat(scale, 'f', -1, 64), func(t *testing.T) {
				s := scenes[name]
				var svg bytes.Buffer
				if err := WriteSVG(&svg, s); err != nil {
					t.Fatal(err)
				}
				ref := rsvgRender(t, svg.Bytes(), scale)
				ours, err := PNGEncoder{Scale: scale}.Draw(s)
				if err != nil {
					t.Fatal(err)
				}
				if ours.Bounds() != ref.Bounds() {
					t.Fatalf("PNG is %v, rsvg-convert draws %v", ours.Bounds(), ref.Bounds())
				}
				whole, inked := imageDiff(ours, ref)
				t.Logf("mean absolute difference %.4f whole, %.4f inked", whole, inked)
				// The bounds issue 13 accepts; two independent SVG
				// renderers with different fallback fonts differ by 0.023
				// and 0.107 on a bar chart (issue 13).
				if whole >= 0.03 || inked >= 0.2 {
					t.Errorf("differs from rsvg-convert by %.4f whole (bound 0.03), %.4f inked (bound 0.2)", whole, inked)
				}
				// Measured at most 0.0005 whole and 0.0038 inked when the
				// backend was written: beyond these tighter bounds is a
				// change in geometry or text, not in anti-aliasing (which
				// differs a little between versions of rsvg-convert).
				if whole >= 0.005 || inked >= 0.03 {
					t.Errorf("drifted from rsvg-convert: %.4f whole, %.4f inked (measured at most 0.0005, 0.0038)", whole, inked)
				}
			})
		}
	}
}
