package render

import (
	"image/color"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/palette"
)

func TestColour(t *testing.T) {
	tests := []struct {
		name string
		c    Colour
		hex  string
		none bool
	}{
		{"zero value is none", Colour{}, "none", true},
		{"opaque", Colour{R: 0x12, G: 0xab, B: 0xff, A: 255}, "#12abff", false},
		{"from sRGB rounds as palette.Hex", RGB(palette.SRGB{R: 0.5, G: 1.2, B: -0.1}), palette.SRGB{R: 0.5, G: 1.2, B: -0.1}.Hex(), false},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			assert.Equal(t, tc.hex, tc.c.Hex())
			assert.Equal(t, tc.none, tc.c.IsNone())
		})
	}
	c, err := ParseColour("#0a0B0c")
	require.NoError(t, err)
	assert.Equal(t, Colour{10, 11, 12, 255}, c)
	_, err = ParseColour("red")
	assert.ErrorIs(t, err, palette.ErrBadHex)
	// A Colour is a color.Color, so a raster backend paints with it as is.
	var cc color.Color = c
	assert.Equal(t, color.NRGBAModel.Convert(cc), color.NRGBA{10, 11, 12, 255})
}

// TestSVGWritesWhatTheMarkSays checks that the writer decides nothing about
// paint: joins, caps, dashes and translucency appear exactly when the mark
// carries them.
func TestSVGWritesWhatTheMarkSays(t *testing.T) {
	line := [][]Point{{{0, 0}, {10, 10}}}
	ink := Colour{R: 0x33, G: 0x33, B: 0x33, A: 255}
	tests := []struct {
		name string
		m    Mark
		want string
	}{
		{"plain stroke writes no join or cap", Mark{Kind: Path, Lines: line, Stroke: ink, StrokeWidth: 1},
			`<path d="M0,0L10,10" fill="none" stroke="#333333" stroke-width="1" />`},
		{"round join and cap as asked", Mark{Kind: Path, Lines: line, Stroke: ink, StrokeWidth: 1, Join: JoinRound, Cap: CapRound},
			`<path d="M0,0L10,10" fill="none" stroke="#333333" stroke-width="1" stroke-linejoin="round" stroke-linecap="round" />`},
		{"bevel, square, dashes", Mark{Kind: Path, Lines: line, Stroke: ink, Join: JoinBevel, Cap: CapSquare, Dash: []float64{1.5, 3}},
			`<path d="M0,0L10,10" fill="none" stroke="#333333" stroke-linejoin="bevel" stroke-linecap="square" stroke-dasharray="1.5 3" />`},
		{"translucent fill", Mark{Kind: Rect, W: 2, H: 3, Fill: Colour{R: 255, A: 128}},
			`<rect x="0.00" y="0.00" width="2.00" height="3.00" fill="#ff0000" fill-opacity="0.502" />`},
		{"no stroke, no stroke attributes", Mark{Kind: Path, Lines: line, Fill: ink, Join: JoinRound, Dash: []float64{2}},
			`<path d="M0,0L10,10" fill="#333333" />`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			out := encode(t, SVGEncoder{Fragment: true}, &Scene{Width: 10, Height: 10, Marks: []Mark{tc.m}})
			assert.Contains(t, out, tc.want)
		})
	}
}

// TestSceneCarriesMeasuringFaces checks that a scene names the faces its
// text was measured with, so that a raster backend can set the same widths.
func TestSceneCarriesMeasuringFaces(t *testing.T) {
	s, err := BarsScene([]string{"a", "b"}, []float64{1, 2}, BarsOptions{})
	require.NoError(t, err)
	require.NotNil(t, s.Font.Faces.Regular)
	require.NotNil(t, s.Font.Faces.Bold)
	for _, m := range s.Marks {
		if m.Kind == Text {
			assert.Positive(t, s.Font.Faces.Face(m.Bold).Width(m.Text, m.Size), m.Text)
		}
	}
	sheet := PaletteSheet("p", []palette.SRGB{{R: 1}})
	assert.NotNil(t, sheet.Font.Faces.Regular)
}

// TestSVGNamesOnlyTheSceneFont checks that the writer adds no font of its
// own: the family is the scene's, and a scene without one names none.
func TestSVGNamesOnlyTheSceneFont(t *testing.T) {
	out := encode(t, SVGEncoder{}, &Scene{Width: 1, Height: 1})
	assert.NotContains(t, out, "font-family")
	out = encode(t, SVGEncoder{}, &Scene{Width: 1, Height: 1, Font: Font{Family: "Go, serif"}})
	assert.Contains(t, out, `font-family="Go, serif"`)
}
