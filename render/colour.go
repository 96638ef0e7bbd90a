package render

import (
	"image/color"
	"math"

	"plumb/palette"
)

// Colour is the paint of a mark: an 8-bit sRGB colour with straight (not
// premultiplied) alpha, as color.NRGBA. The zero value is fully transparent,
// which a Scene reads as no paint at all ("none"), so a Mark that sets no
// Fill is not filled. Backends serialise it as they need (the SVG writer as
// "#rrggbb"); a raster backend uses it as the color.Color it is.
type Colour color.NRGBA

// None is no paint: the zero Colour.
var None Colour

// RGB is the opaque Colour nearest to c, rounded to 8 bits per channel the
// way palette.SRGB.Hex rounds, so the two always agree.
func RGB(c palette.SRGB) Colour {
	q := c.Quantize()
	return Colour{R: to8(q.R), G: to8(q.G), B: to8(q.B), A: 255}
}

func to8(v float64) uint8 { return uint8(math.Round(v * 255)) }

// ParseColour reads "#rgb" or "#rrggbb" (palette.ParseHex) as an opaque
// Colour.
func ParseColour(s string) (Colour, error) {
	c, err := palette.ParseHex(s)
	if err != nil {
		return None, err
	}
	return RGB(c), nil
}

// IsNone reports whether the colour paints nothing.
func (c Colour) IsNone() bool { return c.A == 0 }

// RGBA implements color.Color.
func (c Colour) RGBA() (r, g, b, a uint32) { return color.NRGBA(c).RGBA() }

// SRGB is the colour's sRGB value, ignoring alpha, for contrast and
// colour-vision computations.
func (c Colour) SRGB() palette.SRGB {
	return palette.SRGB{R: float64(c.R) / 255, G: float64(c.G) / 255, B: float64(c.B) / 255}
}

// Hex writes the colour as lowercase "#rrggbb", or "none" when it paints
// nothing. Alpha other than 0 and 255 is not part of the text: the SVG
// writer carries it as an opacity.
func (c Colour) Hex() string {
	if c.IsNone() {
		return "none"
	}
	return c.SRGB().Hex()
}

// String returns Hex.
func (c Colour) String() string { return c.Hex() }

// LineJoin is how a stroke turns a corner.
type LineJoin uint8

// Line joins. The zero value is the mitre join every renderer defaults to.
const (
	JoinMiter LineJoin = iota
	JoinRound
	JoinBevel
)

// LineCap is how a stroke ends.
type LineCap uint8

// Line caps. The zero value is the butt cap every renderer defaults to.
const (
	CapButt LineCap = iota
	CapRound
	CapSquare
)
