package palette

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

// SRGB is a colour in the sRGB space of IEC 61966-2-1, each component
// gamma-encoded and nominally in 0..1. Values outside 0..1 are out of gamut;
// Hex clamps them.
type SRGB struct{ R, G, B float64 }

// LinearRGB is an sRGB colour with the transfer function removed, so that
// components add like light. Simulation of colour vision and mixing happen
// here.
type LinearRGB struct{ R, G, B float64 }

// XYZ is a CIE 1931 XYZ tristimulus value relative to the sRGB D65 white,
// scaled so that white has Y = 1.
type XYZ struct{ X, Y, Z float64 }

// ErrBadHex is the cause of every ParseHex failure.
var ErrBadHex = errors.New("not a hex colour (want #rgb or #rrggbb)")

// ParseHex reads a colour written as "#rgb" or "#rrggbb" (either case; the
// leading '#' may be left out, because an unquoted '#' starts a comment in
// most shells). Surrounding spaces are ignored.
func ParseHex(s string) (SRGB, error) {
	h := strings.TrimPrefix(strings.TrimSpace(s), "#")
	var v [6]byte
	switch len(h) {
	case 3:
		for i := 0; i < 3; i++ {
			d, ok := hexDigit(h[i])
			if !ok {
				return SRGB{}, fmt.Errorf("%q: %w", s, ErrBadHex)
			}
			v[2*i], v[2*i+1] = d, d
		}
	case 6:
		for i := 0; i < 6; i++ {
			d, ok := hexDigit(h[i])
			if !ok {
				return SRGB{}, fmt.Errorf("%q: %w", s, ErrBadHex)
			}
			v[i] = d
		}
	default:
		return SRGB{}, fmt.Errorf("%q: %w", s, ErrBadHex)
	}
	return SRGB{
		R: float64(v[0]<<4|v[1]) / 255,
		G: float64(v[2]<<4|v[3]) / 255,
		B: float64(v[4]<<4|v[5]) / 255,
	}, nil
}

// hex24 builds a colour from 0xrrggbb, the form the generated tables use.
func hex24(v uint32) SRGB {
	return SRGB{float64(v>>16&255) / 255, float64(v>>8&255) / 255, float64(v&255) / 255}
}

func hexDigit(c byte) (byte, bool) {
	switch {
	case '0' <= c && c <= '9':
		return c - '0', true
	case 'a' <= c && c <= 'f':
		return c - 'a' + 10, true
	case 'A' <= c && c <= 'F':
		return c - 'A' + 10, true
	}
	return 0, false
}

// Hex writes the colour as lowercase "#rrggbb", clamping each component to
// 0..1 and rounding to the nearest 8-bit step. NaN counts as 0.
func (c SRGB) Hex() string {
	const digits = "0123456789abcdef"
	b := []byte("#000000")
	for i, v := range [3]float64{c.R, c.G, c.B} {
		n := to8(v)
		b[1+2*i] = digits[n>>4]
		b[2+2*i] = digits[n&15]
	}
	return string(b)
}

// String returns Hex, so that colours print readably.
func (c SRGB) String() string { return c.Hex() }

func to8(v float64) uint8 {
	if !(v > 0) { // also catches NaN
		return 0
	}
	if v >= 1 {
		return 255
	}
	return uint8(math.Round(v * 255))
}

// Quantize rounds the colour to the nearest 8-bit sRGB colour, the one Hex
// writes, so that measurements describe what a file will actually show.
func (c SRGB) Quantize() SRGB {
	return SRGB{float64(to8(c.R)) / 255, float64(to8(c.G)) / 255, float64(to8(c.B)) / 255}
}

// InGamut reports whether every component lies in 0..1 (within eps, to
// forgive the rounding of a round trip through another space).
func (c SRGB) InGamut(eps float64) bool {
	return c.R >= -eps && c.R <= 1+eps && c.G >= -eps && c.G <= 1+eps && c.B >= -eps && c.B <= 1+eps
}

// Clamp clips each component to 0..1 (NaN becomes 0).
func (c SRGB) Clamp() SRGB { return SRGB{clamp01(c.R), clamp01(c.G), clamp01(c.B)} }

func clamp01(v float64) float64 {
	if !(v > 0) {
		return 0
	}
	if v > 1 {
		return 1
	}
	return v
}

// IEC 61966-2-1 transfer function constants. The standard prints the
// encoding threshold as 0.0031308, which is not quite where its decoding
// branch ends (0.04045/12.92 = 0.00313080495); encoding switches at the
// latter so that encode is the exact inverse of decode. The two readings
// differ only for linear values in that 5e-9 sliver, by at most 3e-8.
const (
	decodeThreshold = 0.04045
	encodeThreshold = decodeThreshold / linearSlope
	linearSlope     = 12.92
	gammaOffset     = 0.055
	gammaExponent   = 2.4
)

// decode is the IEC 61966-2-1 electro-optical transfer function, extended to
// negative values by symmetry as in the CSS Color 4 sample code, so that
// out-of-gamut colours survive a round trip.
func decode(v float64) float64 {
	a := math.Abs(v)
	var l float64
	if a <= decodeThreshold {
		l = a / linearSlope
	} else {
		l = math.Pow((a+gammaOffset)/(1+gammaOffset), gammaExponent)
	}
	return math.Copysign(l, v)
}

// encode is the inverse of decode.
func encode(v float64) float64 {
	a := math.Abs(v)
	var e float64
	if a <= encodeThreshold {
		e = a * linearSlope
	} else {
		e = (1+gammaOffset)*math.Pow(a, 1/gammaExponent) - gammaOffset
	}
	return math.Copysign(e, v)
}

// SRGBToLinear removes the sRGB transfer function (IEC 61966-2-1).
func SRGBToLinear(c SRGB) LinearRGB { return LinearRGB{decode(c.R), decode(c.G), decode(c.B)} }

// LinearToSRGB applies the sRGB transfer function (IEC 61966-2-1).
func LinearToSRGB(c LinearRGB) SRGB { return SRGB{encode(c.R), encode(c.G), encode(c.B)} }

// mat3 is a 3x3 matrix applied to column vectors; rows as printed in the
// sources.
type mat3 [3][3]float64

func (m *mat3) apply(x, y, z float64) (float64, float64, float64) {
	return m[0][0]*x + m[0][1]*y + m[0][2]*z,
		m[1][0]*x + m[1][1]*y + m[1][2]*z,
		m[2][0]*x + m[2][1]*y + m[2][2]*z
}

// inverse returns the inverse by the adjugate; the matrices here are well
// conditioned, and inverting in float64 keeps round trips within 1e-12
// where the printed inverses (10 decimals) would not.
func (m mat3) inverse() mat3 {
	a, b, c := m[0][0], m[0][1], m[0][2]
	d, e, f := m[1][0], m[1][1], m[1][2]
	g, h, i := m[2][0], m[2][1], m[2][2]
	A, B, C := e*i-f*h, -(d*i - f*g), d*h-e*g
	det := a*A + b*B + c*C
	return mat3{
		{A / det, -(b*i - c*h) / det, (b*f - c*e) / det},
		{B / det, (a*i - c*g) / det, -(a*f - c*d) / det},
		{C / det, -(a*h - b*g) / det, (a*e - b*d) / det},
	}
}

// linearToXYZ and xyzToLinear are the 64-bit sRGB matrices of the W3C CSS
// Color 4 sample code, derived from the IEC 61966-2-1 primaries and the D65
// white (0.3127, 0.3290); their row sums are that white, so sRGB white is
// exactly the CIELAB reference white.
var (
	linearToXYZ = mat3{
		{0.41239079926595934, 0.357584339383878, 0.1804807884018343},
		{0.21263900587151027, 0.715168678767756, 0.07219231536073371},
		{0.01933081871559182, 0.11919477979462598, 0.9505321522496607},
	}
	xyzToLinear = mat3{
		{3.2409699419045226, -1.537383177570094, -0.4986107602930034},
		{-0.9692436362808796, 1.8759675015077202, 0.04155505740717559},
		{0.05563007969699366, -0.20397695888897652, 1.0569715142428786},
	}
)

// LinearToXYZ converts linear sRGB to CIE XYZ (D65).
func LinearToXYZ(c LinearRGB) XYZ {
	x, y, z := linearToXYZ.apply(c.R, c.G, c.B)
	return XYZ{x, y, z}
}

// XYZToLinear converts CIE XYZ (D65) to linear sRGB.
func XYZToLinear(c XYZ) LinearRGB {
	r, g, b := xyzToLinear.apply(c.X, c.Y, c.Z)
	return LinearRGB{r, g, b}
}

// SRGBToXYZ converts sRGB to CIE XYZ (D65).
func SRGBToXYZ(c SRGB) XYZ { return LinearToXYZ(SRGBToLinear(c)) }

// XYZToSRGB converts CIE XYZ (D65) to sRGB, without clipping.
func XYZToSRGB(c XYZ) SRGB { return LinearToSRGB(XYZToLinear(c)) }
