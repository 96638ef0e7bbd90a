package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"plumb/render"
)

// PNG output. Every chart writes its figure with render.WriteSVG, which
// hands the scene to a writer that takes scenes (render.SceneWriter)
// instead of serialising it. A figure named .png gets such a writer, which
// draws the scene with render's own rasteriser, so every chart writes PNG
// through the same safe output path as SVG without a branch of its own.

// isPNG says whether the -o path names a PNG figure.
func isPNG(path string) bool { return strings.EqualFold(filepath.Ext(path), ".png") }

// errNotScene stops bytes that are not a scene (the SVG of a figure that
// does not go through render.WriteSVG) from landing in a file named .png.
var errNotScene = errors.New("this figure cannot be drawn as PNG; name it .svg")

// pngOutput is the writer a .png figure is written through: it takes the
// scene and writes it as PNG at scale pixels per SVG unit.
type pngOutput struct {
	w     io.Writer
	scale float64
}

func (p *pngOutput) Write([]byte) (int, error) { return 0, errNotScene }

// WriteScene draws the scene as PNG.
func (p *pngOutput) WriteScene(s *render.Scene) error {
	return render.PNGEncoder{Scale: p.scale}.Encode(p.w, s)
}

// pngSignature starts every PNG file (PNG specification, section 5.2).
const pngSignature = "\x89PNG\r\n\x1a\n"

// pngGuard passes on bytes only when they start as a PNG file does:
// writeOutput puts it in front of every file named .png, so that a figure
// written past writeFigure (as SVG bytes) fails with a message instead of
// leaving a file whose name lies about its format.
type pngGuard struct {
	w    io.Writer
	seen int // bytes of the signature checked so far
}

func (g *pngGuard) Write(p []byte) (int, error) {
	if g.seen < len(pngSignature) {
		n := min(len(p), len(pngSignature)-g.seen)
		if string(p[:n]) != pngSignature[g.seen:g.seen+n] {
			return 0, errNotScene
		}
		g.seen += n
	}
	return g.w.Write(p)
}

// writeFigure is writeOutput for a figure: the format follows the path's
// extension, PNG at scale pixels per SVG unit for .png, SVG otherwise.
func writeFigure(path string, scale float64, stdout io.Writer, write func(io.Writer) error) error {
	if !isPNG(path) {
		return writeOutput(path, stdout, write)
	}
	return writeOutput(path, stdout, func(w io.Writer) error {
		return write(&pngOutput{w: w, scale: scale})
	})
}

// maxScale bounds --scale: beyond 16 pixels per unit even a small chart
// reaches render.MaxPNGPixels, which is checked once the canvas is known.
const maxScale = 16

// scaleValue is --scale K: a plain positive decimal up to maxScale. Unset
// (0) is 1.
type scaleValue struct{ p *float64 }

func (v scaleValue) String() string {
	if v.p == nil || *v.p == 0 {
		return "1"
	}
	return strconv.FormatFloat(*v.p, 'g', -1, 64)
}

func (v scaleValue) Set(s string) error {
	s = strings.TrimSpace(s)
	f, err := strconv.ParseFloat(s, 64)
	if !plainDecimal(s) || err != nil || !(f > 0 && f <= maxScale) || math.IsInf(f, 0) {
		return fmt.Errorf("give the pixels per SVG unit of a PNG, a number above 0 and at most %d, such as 2", maxScale)
	}
	*v.p = f
	return nil
}

// checkScale refuses --scale for a figure that is not a PNG, which has no
// pixels to scale.
func checkScale(scale float64, out string) error {
	if scale != 0 && scale != 1 && !isPNG(out) {
		return usagef("--scale %s: only a PNG has pixels to scale; name the figure .png with -o", strconv.FormatFloat(scale, 'g', -1, 64))
	}
	return nil
}
