package render

import (
	"io"
	"math"
	"testing"
)

// TestPNGHostileMarks: marks no builder makes (non-finite or enormous
// coordinates, sizes and dashes) are drawn or skipped, never a panic or a
// runaway loop.
func TestPNGHostileMarks(t *testing.T) {
	ink := Colour{0, 0, 0, 255}
	nan, inf := math.NaN(), math.Inf(1)
	for _, tc := range []struct {
		name string
		m    Mark
	}{
		{"NaN rect", Mark{Kind: Rect, X: nan, Y: 0, W: 10, H: 10, Fill: ink}},
		{"infinite rect", Mark{Kind: Rect, X: -inf, Y: 0, W: inf, H: 10, Fill: ink}},
		{"enormous rect", Mark{Kind: Rect, X: -1e300, Y: -1e300, W: 2e300, H: 2e300, Fill: ink, Stroke: ink}},
		{"enormous circle", Mark{Kind: Circle, X: 10, Y: 10, R: 1e300, Fill: ink, Stroke: ink}},
		{"NaN circle", Mark{Kind: Circle, X: 10, Y: 10, R: nan, Fill: ink}},
		{"path through infinity", Mark{Kind: Path, Lines: [][]Point{{{0, 0}, {inf, 5}, {10, nan}, {5, 5}}}, Fill: ink, Stroke: ink, StrokeWidth: 2}},
		{"enormous path", Mark{Kind: Path, Lines: [][]Point{{{-1e300, 5}, {1e300, 5}, {1e300, 1e300}}}, Stroke: ink, StrokeWidth: 2, Join: JoinRound, Cap: CapRound}},
		{"enormous stroke", Mark{Kind: Path, Lines: [][]Point{{{0, 5}, {10, 5}}}, Stroke: ink, StrokeWidth: 1e300, Cap: CapRound}},
		{"fine dashes on a long line", Mark{Kind: Path, Lines: [][]Point{{{-1e9, 5}, {1e9, 5}}}, Stroke: ink, Dash: []float64{0.01, 0.01}}},
		{"visible dashes on a long line", Mark{Kind: Path, Lines: [][]Point{{{-1e12, 5}, {1e12, 5}, {1e12, 1e12}}}, Stroke: ink, Dash: []float64{0.1, 0.2}, Cap: CapRound}},
		{"tiny dashes", Mark{Kind: Path, Lines: [][]Point{{{0, 5}, {100, 5}}}, Stroke: ink, Dash: []float64{1e-300, 1e-300}}},
		{"NaN text", Mark{Kind: Text, X: nan, Y: 10, Text: "x", Size: 12, Fill: ink}},
		{"enormous text", Mark{Kind: Text, X: 0, Y: 10, Text: "xy", Size: 1e300, Fill: ink}},
		{"image in an enormous box", Mark{Kind: Image, X: -1e300, Y: 0, W: 2e300, H: inf, Img: nil}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s := &Scene{Width: 20, Height: 20}
			s.Add(Mark{Kind: GroupStart, DX: 1e300}, tc.m, Mark{Kind: GroupEnd}, tc.m)
			if err := WritePNG(io.Discard, s); err != nil {
				t.Logf("refused: %v", err)
			}
		})
	}
}

// FuzzPNGMark draws one mark of any kind and geometry: an error or an
// image, never a panic.
func FuzzPNGMark(f *testing.F) {
	f.Add(uint8(2), 1.0, 2.0, 30.0, 40.0, 3.0, 2.0, 1.0, uint8(0), "Wave")
	f.Add(uint8(0), -1e300, 5.0, 1e300, 1.0, 0.5, 0.0, 0.0, uint8(5), "")
	f.Fuzz(func(t *testing.T, kind uint8, x, y, w, h, r, width, dash float64, style uint8, text string) {
		ink := Colour{10, 20, 30, 200}
		m := Mark{Kind: Kind(kind % 7), X: x, Y: y, W: w, H: h, R: r, Size: r, Text: text,
			Lines:  [][]Point{{{x, y}, {w, h}, {y, x}}, {{r, r}}},
			Closed: style&8 != 0, Fill: ink, Stroke: ink, StrokeWidth: width,
			Join: LineJoin(style % 3), Cap: LineCap(style / 3 % 3), Opacity: dash}
		if dash != 0 {
			m.Dash = []float64{dash, width}
		}
		s := &Scene{Width: 40, Height: 30}
		s.Add(Mark{Kind: GroupStart, DX: r, DY: -r}, m, Mark{Kind: GroupEnd})
		_ = WritePNG(io.Discard, s)
	})
}
