package render

import (
	"bytes"
	"errors"
	"flag"
	"image"
	"image/color"
	"image/png"
	"io"
	"math"
	"os"
	"path/filepath"
	"testing"
)

func TestPNGRefusesWhatItCannotDraw(t *testing.T) {
	small := &Scene{Width: 10, Height: 10}
	for _, tc := range []struct {
		name  string
		s     *Scene
		scale float64
		want  error // nil: any error
	}{
		{"nil scene", nil, 1, ErrNoScene},
		{"negative scale", small, -1, ErrPNGScale},
		{"NaN scale", small, math.NaN(), ErrPNGScale},
		{"infinite scale", small, math.Inf(1), ErrPNGScale},
		{"empty scene", &Scene{}, 1, nil},
		{"NaN width", &Scene{Width: math.NaN(), Height: 10}, 1, nil},
		{"over the pixel limit", &Scene{Width: 20000, Height: 20000}, 1, nil},
	} {
		t.Run(tc.name, func(t *testing.T) {
			var b bytes.Buffer
			err := PNGEncoder{Scale: tc.scale}.Encode(&b, tc.s)
			if err == nil {
				t.Fatal("no error")
			}
			if tc.want != nil && !errors.Is(err, tc.want) {
				t.Fatalf("error %v, want %v", err, tc.want)
			}
			if b.Len() != 0 {
				t.Errorf("%d bytes written before the error", b.Len())
			}
		})
	}
	if err := WritePNG(io.Discard, nil); !errors.Is(err, ErrNoScene) {
		t.Errorf("WritePNG(nil): %v, want ErrNoScene as WriteSVG gives", err)
	}
}

// decode encodes the scene as PNG and reads it back, so that tests look at
// the bytes a user gets.
func decode(t *testing.T, s *Scene, scale float64) *image.NRGBA {
	t.Helper()
	var b bytes.Buffer
	if err := (PNGEncoder{Scale: scale}).Encode(&b, s); err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(&b)
	if err != nil {
		t.Fatal(err)
	}
	n, ok := img.(*image.NRGBA)
	if !ok {
		t.Fatalf("decoded a %T, want *image.NRGBA", img)
	}
	return n
}

func TestPNGSize(t *testing.T) {
	bars := func(t *testing.T, c Common) *Scene {
		s, err := BarsScene([]string{"a", "b", "c"}, []float64{3, 1, 2}, BarsOptions{Common: c})
		if err != nil {
			t.Fatal(err)
		}
		return s
	}
	screen := bars(t, Common{})
	slide := bars(t, Common{Medium: Slide})
	for _, tc := range []struct {
		name  string
		s     *Scene
		scale float64
		w, h  int
	}{
		{"screen", screen, 1, int(screen.Width), int(screen.Height)},
		{"screen at scale 2", screen, 2, 2 * int(screen.Width), 2 * int(screen.Height)},
		{"zero scale is 1", screen, 0, int(screen.Width), int(screen.Height)},
		{"slide", slide, 1, 1920, 1080},
		{"640x400 at scale 2", &Scene{Width: 640, Height: 400}, 2, 1280, 800}, // issue 13
		{"fractional size rounds up", &Scene{Width: 10.25, Height: 5.5}, 1, 11, 6},
	} {
		t.Run(tc.name, func(t *testing.T) {
			img := decode(t, tc.s, tc.scale)
			if got := img.Bounds().Size(); got != image.Pt(tc.w, tc.h) {
				t.Errorf("%v, want %dx%d", got, tc.w, tc.h)
			}
		})
	}
}

func TestPNGIsDeterministic(t *testing.T) {
	s := compareScenes(t)["lines"]
	var a, b bytes.Buffer
	if err := WritePNG(&a, s); err != nil {
		t.Fatal(err)
	}
	if err := WritePNG(&b, s); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(a.Bytes(), b.Bytes()) {
		t.Error("two encodings of one scene differ")
	}
}

// placedRects returns the rects of a class in canvas units, the
// translations of their groups applied.
func placedRects(s *Scene, class string) []Mark {
	var out []Mark
	var dx, dy float64
	var stack [][2]float64
	for _, m := range s.Marks {
		switch m.Kind {
		case GroupStart:
			stack = append(stack, [2]float64{dx, dy})
			dx, dy = dx+m.DX, dy+m.DY
		case GroupEnd:
			dx, dy = stack[len(stack)-1][0], stack[len(stack)-1][1]
			stack = stack[:len(stack)-1]
		case Rect:
			if m.Class == class {
				m.X, m.Y = round2(m.X)+dx, round2(m.Y)+dy
				out = append(out, m)
			}
		}
	}
	return out
}

func same(c color.NRGBA, k Colour) bool { return c == color.NRGBA(k) }

// barsOnly keeps a scene's groups and the rects of a class, so that the
// rects' anti-aliased edges lie over the transparent background alone.
func barsOnly(s *Scene, class string) *Scene {
	out := &Scene{Width: s.Width, Height: s.Height, Font: s.Font}
	for _, m := range s.Marks {
		if m.Kind == GroupStart || m.Kind == GroupEnd || (m.Kind == Rect && m.Class == class) {
			out.Add(m)
		}
	}
	return out
}

// TestPNGBarLengths measures each bar in pixels along its middle row. In
// the chart, the run of pixels of exactly the bar's colour is its width
// less at most the two edge pixels that are anti-aliased (or under the
// baseline). Drawn alone, a bar's exact run plus the cover (alpha) of its
// two edge pixels measures its width within a twentieth of a pixel, and
// pixels over value is one number for all bars within one pixel (a lie
// factor of 1, Tufte 1983, p. 57).
func TestPNGBarLengths(t *testing.T) {
	values := []float64{412, 288.5, 197, 150, 96.25, 31}
	labels := []string{"Harbour", "Old town", "Station", "Riverside", "Hill", "Market"}
	for _, scale := range []float64{1, 2, 1.5} {
		chart, err := BarsScene(labels, values, BarsOptions{})
		if err != nil {
			t.Fatal(err)
		}
		bars := placedRects(chart, "plumb-mark")
		if len(bars) != len(values) {
			t.Fatalf("%d bars in the scene, want %d", len(bars), len(values))
		}
		for _, alone := range []bool{false, true} {
			s := chart
			if alone {
				s = barsOnly(chart, "plumb-mark")
			}
			img := decode(t, s, scale)
			// Bars are drawn longest first, in the order of values.
			var perUnit float64
			for i, b := range bars {
				y := int((b.Y + b.H/2) * scale)
				x0 := int((b.X + b.W/2) * scale)
				if !same(img.NRGBAAt(x0, y), b.Fill) {
					t.Fatalf("scale %g: the middle of bar at y %g is %v, not its colour %v exactly", scale, b.Y, img.NRGBAAt(x0, y), b.Fill)
				}
				lo, hi := x0, x0
				for lo > 0 && same(img.NRGBAAt(lo-1, y), b.Fill) {
					lo--
				}
				for hi+1 < img.Bounds().Dx() && same(img.NRGBAAt(hi+1, y), b.Fill) {
					hi++
				}
				run, want := float64(hi-lo+1), round2(b.W)*scale
				if !alone {
					if run > want+1e-9 || run < want-2 {
						t.Errorf("scale %g: bar %d of width %g px has a run of %g exact pixels", scale, i, want, run)
					}
					continue
				}
				length := run + float64(img.NRGBAAt(lo-1, y).A)/255 + float64(img.NRGBAAt(hi+1, y).A)/255
				if math.Abs(length-want) > 0.05 {
					t.Errorf("scale %g: bar %d of width %g px measures %.3f px", scale, i, want, length)
				}
				if i == 0 {
					perUnit = length / values[0]
				}
				if want := values[i] * perUnit; math.Abs(length-want) > 1 {
					t.Errorf("scale %g: bar %d is %.2f px, %.2f px in proportion to the first", scale, i, length, want)
				}
			}
		}
	}
}

// TestPNGImageMarkIsCrisp: an Image mark's pixels are squares of one
// colour each (nearest neighbour). rsvg-convert smooths them, which SVG's
// image-rendering: pixelated asks it not to, so it is no reference here.
func TestPNGImageMarkIsCrisp(t *testing.T) {
	src := image.NewNRGBA(image.Rect(0, 0, 2, 2))
	cols := []color.NRGBA{{200, 30, 30, 255}, {30, 200, 30, 255}, {30, 30, 200, 255}, {10, 10, 10, 128}}
	for i, c := range cols {
		src.SetNRGBA(i%2, i/2, c)
	}
	s := &Scene{Width: 30, Height: 30}
	s.Add(Mark{Kind: GroupStart, DX: 5, DY: 5}, Mark{Kind: Image, X: 0, Y: 0, W: 20, H: 20, Img: src}, Mark{Kind: GroupEnd})
	img := decode(t, s, 1)
	for y := range 30 {
		for x := range 30 {
			want := color.NRGBA{}
			if x >= 5 && x < 25 && y >= 5 && y < 25 {
				want = cols[(y-5)/10*2+(x-5)/10]
			}
			if got := img.NRGBAAt(x, y); got != want {
				t.Fatalf("pixel (%d, %d) is %v, want %v", x, y, got, want)
			}
		}
	}

	// A box edge that falls inside a pixel covers it in part, as any
	// other edge does: half a pixel is half the alpha.
	one := image.NewNRGBA(image.Rect(0, 0, 1, 1))
	one.SetNRGBA(0, 0, color.NRGBA{200, 30, 30, 255})
	s = &Scene{Width: 12, Height: 4}
	s.Add(Mark{Kind: Image, X: 0.5, Y: 0, W: 10, H: 4, Img: one})
	img = decode(t, s, 1)
	for x, a := range map[int]uint8{0: 128, 1: 255, 10: 128, 11: 0} {
		if got := img.NRGBAAt(x, 2).A; got != a {
			t.Errorf("pixel %d of an image from x 0.5 to 10.5 has alpha %d, want %d", x, got, a)
		}
	}
}

// TestPNGOpacityGroupsFillAndStroke: SVG's opacity applies to a mark's fill
// and stroke together (SVG 1.1, section 14.5), so where the opaque stroke
// covers the fill the pixel is the stroke's colour at the mark's opacity,
// not the stroke over a half-seen fill.
func TestPNGOpacityGroupsFillAndStroke(t *testing.T) {
	s := &Scene{Width: 20, Height: 20}
	red, blue := Colour{255, 0, 0, 255}, Colour{0, 0, 255, 255}
	s.Add(Mark{Kind: Rect, X: 2, Y: 2, W: 16, H: 16, Fill: red, Stroke: blue, StrokeWidth: 4, Opacity: 0.5})
	img := decode(t, s, 1)
	// (2, 10) is on the stroke, which covers x from 0 to 4.
	if got, want := img.NRGBAAt(2, 10), (color.NRGBA{0, 0, 255, 128}); got != want {
		t.Errorf("on the stroke: %v, want %v", got, want)
	}
	if got, want := img.NRGBAAt(10, 10), (color.NRGBA{255, 0, 0, 128}); got != want {
		t.Errorf("inside: %v, want %v", got, want)
	}
	if got := img.NRGBAAt(0, 0); got.A != 128 {
		t.Errorf("the stroke's outer mitre corner: %v, want alpha 128", got)
	}
}

// goldenPNGs are small figures pinned as PNG files: what each feature of
// the backend draws.
func goldenPNGs(t *testing.T) map[string]*Scene {
	t.Helper()
	scenes := compareScenes(t)
	out := map[string]*Scene{"bars": scenes["bars"], "lines": scenes["lines"]}
	s := &Scene{Width: 160, Height: 120}
	ink := Colour{0x2b, 0x55, 0x8c, 255}
	accent := Colour{0xc8, 0x5a, 0x1e, 255}
	zig := [][]Point{{{10, 40}, {30, 10}, {50, 40}, {70, 10}}}
	for i, j := range []LineJoin{JoinMiter, JoinRound, JoinBevel} {
		dy := float64(i) * 35
		s.Add(Mark{Kind: GroupStart, DY: dy},
			Mark{Kind: Path, Lines: zig, Stroke: ink, StrokeWidth: 7, Join: j, Cap: LineCap(i)},
			Mark{Kind: GroupEnd})
	}
	s.Add(Mark{Kind: Path, Lines: [][]Point{{{85, 15}, {150, 15}}}, Stroke: accent, StrokeWidth: 3, Cap: CapRound, Dash: []float64{0, 6}},
		Mark{Kind: Path, Lines: [][]Point{{{85, 30}, {150, 30}, {150, 60}}}, Stroke: accent, StrokeWidth: 2, Dash: []float64{8, 4, 2}},
		Mark{Kind: Circle, X: 100, Y: 85, R: 12, Fill: ink, Stroke: Colour{255, 255, 255, 255}, StrokeWidth: 2},
		Mark{Kind: Circle, X: 112, Y: 92, R: 12, Fill: accent, Opacity: 0.6},
		Mark{Kind: Path, Lines: [][]Point{{{125, 70}, {155, 70}, {140, 100}}}, Closed: true, Fill: Colour{0x2b, 0x55, 0x8c, 128}, Stroke: ink},
		Mark{Kind: Text, X: 140, Y: 114, Text: "Wave", Size: 11, Anchor: Middle, Bold: true, Fill: ink})
	out["strokes"] = s
	return out
}

func TestPNGGolden(t *testing.T) {
	update := false
	if f := flag.Lookup("update"); f != nil {
		update = f.Value.String() == "true"
	}
	for name, s := range goldenPNGs(t) {
		t.Run(name, func(t *testing.T) {
			var b bytes.Buffer
			if err := WritePNG(&b, s); err != nil {
				t.Fatal(err)
			}
			path := filepath.Join("..", "golden", "png", name+".png")
			if update {
				if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
					t.Fatal(err)
				}
			}
			f, err := os.Open(path)
			if err != nil {
				t.Fatalf("%v (go test ./render -update writes it)", err)
			}
			defer f.Close()
			want, err := png.Decode(f)
			if err != nil {
				t.Fatal(err)
			}
			got, err := png.Decode(&b)
			if err != nil {
				t.Fatal(err)
			}
			if got.Bounds() != want.Bounds() {
				t.Fatalf("%v, golden is %v", got.Bounds(), want.Bounds())
			}
			// A change in float rounding moves an edge pixel by a step or
			// two; a moved or recoloured shape moves the mean far more.
			if whole, inked := imageDiff(got, want); whole > 0.001 || inked > 0.01 {
				t.Errorf("differs from golden/png/%s.png by %.4f whole, %.4f inked; look at it, then go test ./render -update", name, whole, inked)
			}
		})
	}
}

// TestPNGJoinAndCapPixels draws a corner 6 wide from (5, 10) to (25, 10)
// to (25, 30) and reads pixels whose cover follows from the outlines by
// hand computation: the straight parts cover y 7 to 13 and x 22 to 28; a
// mitre fills the square up to the tip (28, 7); a bevel is cut by the
// line x - y = 18 from (25, 7) to (28, 10); a square cap reaches x = 2 and
// a round cap covers the disc of radius 3 about (5, 10).
func TestPNGJoinAndCapPixels(t *testing.T) {
	ink := Colour{20, 60, 120, 255}
	full, none := color.NRGBA(ink), color.NRGBA{}
	for _, tc := range []struct {
		name string
		join LineJoin
		cap  LineCap
		px   map[image.Point]color.NRGBA
	}{
		{"mitre, butt", JoinMiter, CapButt, map[image.Point]color.NRGBA{{27, 7}: full, {24, 12}: full, {4, 10}: none, {5, 10}: full}},
		{"bevel, square", JoinBevel, CapSquare, map[image.Point]color.NRGBA{{27, 7}: none, {25, 8}: full, {3, 10}: full, {2, 10}: full, {1, 10}: none}},
		{"round, round", JoinRound, CapRound, map[image.Point]color.NRGBA{{26, 8}: full, {3, 10}: full, {1, 10}: none, {27, 25}: full}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s := &Scene{Width: 40, Height: 40}
			s.Add(Mark{Kind: Path, Lines: [][]Point{{{5, 10}, {25, 10}, {25, 30}}}, Stroke: ink, StrokeWidth: 6, Join: tc.join, Cap: tc.cap})
			img := decode(t, s, 1)
			for p, want := range tc.px {
				if got := img.NRGBAAt(p.X, p.Y); got != want {
					t.Errorf("pixel %v is %v, want %v", p, got, want)
				}
			}
		})
	}
}

// TestPNGDashedCircle: a circle's dashes start at its rightmost point and
// run the way SVG's circle path does (SVG 1.1, section 9.3): towards the
// bottom, as y grows down. With dash and gap a quarter of the
// circumference each, the bottom-right and top-left eighths are drawn
// and the other two are not.
func TestPNGDashedCircle(t *testing.T) {
	r := 10.0
	q := math.Pi * r / 2
	s := &Scene{Width: 30, Height: 30}
	ink := Colour{0, 0, 0, 255}
	s.Add(Mark{Kind: Circle, X: 15, Y: 15, R: r, Stroke: ink, StrokeWidth: 2, Dash: []float64{round2(q), round2(q)}})
	img := decode(t, s, 1)
	for _, tc := range []struct {
		deg   float64
		inked bool
	}{{45, true}, {135, false}, {225, true}, {315, false}} {
		a := tc.deg * math.Pi / 180
		x, y := int(15+r*math.Cos(a)), int(15+r*math.Sin(a))
		if alpha := img.NRGBAAt(x, y).A; (alpha > 128) != tc.inked {
			t.Errorf("%g degrees, pixel (%d, %d): alpha %d, want inked %v", tc.deg, x, y, alpha, tc.inked)
		}
	}
}
