package palette

import "math"

// OKLab is a colour in Ottosson's (2020) OKLab space: L is perceived
// lightness from 0 (black) to 1 (white); A and B are the green-red and
// blue-yellow opponent axes. Equal steps look about equally large, and
// hue stays put as chroma changes, which makes it the space plumb designs
// ramps in.
type OKLab struct{ L, A, B float64 }

// OKLCH is OKLab in polar form: lightness L (0..1), chroma C (0 for greys)
// and hue angle H in degrees [0, 360).
type OKLCH struct{ L, C, H float64 }

// The matrices of Ottosson (2020), "A perceptual color space for image
// processing", as printed in the post (after its 2021-01-25 update).
// Inverses are computed in float64 rather than copied at 10 decimals, so
// that round trips hold to 1e-12.
var (
	// linearToLMS is M1 composed with the sRGB matrix (the post's
	// linear_srgb_to_oklab code).
	linearToLMS = mat3{
		{0.4122214708, 0.5363325363, 0.0514459929},
		{0.2119034982, 0.6806995451, 0.1073969566},
		{0.0883024619, 0.2817188376, 0.6299787005},
	}
	// xyzToLMS is the post's M1.
	xyzToLMS = mat3{
		{0.8189330101, 0.3618667424, -0.1288597137},
		{0.0329845436, 0.9293118715, 0.0361456387},
		{0.0482003018, 0.2643662691, 0.6338517070},
	}
	// lmsToOKLab is the post's M2, applied to the cube roots of LMS.
	lmsToOKLab = mat3{
		{0.2104542553, 0.7936177850, -0.0040720468},
		{1.9779984951, -2.4285922050, 0.4505937099},
		{0.0259040371, 0.7827717662, -0.8086757660},
	}
	lmsToLinear = linearToLMS.inverse()
	lmsToXYZ    = xyzToLMS.inverse()
	okLabToLMS  = lmsToOKLab.inverse()
)

func lmsToLab(l, m, s float64) OKLab {
	L, a, b := lmsToOKLab.apply(math.Cbrt(l), math.Cbrt(m), math.Cbrt(s))
	return OKLab{L, a, b}
}

func labToLMS(c OKLab) (float64, float64, float64) {
	l, m, s := okLabToLMS.apply(c.L, c.A, c.B)
	return l * l * l, m * m * m, s * s * s
}

// LinearToOKLab converts linear sRGB to OKLab (Ottosson 2020). math.Cbrt
// keeps the sign, so out-of-gamut colours convert and return.
func LinearToOKLab(c LinearRGB) OKLab {
	return lmsToLab(linearToLMS.apply(c.R, c.G, c.B))
}

// OKLabToLinear converts OKLab to linear sRGB, without clipping.
func OKLabToLinear(c OKLab) LinearRGB {
	r, g, b := lmsToLinear.apply(labToLMS(c))
	return LinearRGB{r, g, b}
}

// XYZToOKLab converts CIE XYZ (D65) to OKLab with Ottosson's M1 and M2.
func XYZToOKLab(c XYZ) OKLab { return lmsToLab(xyzToLMS.apply(c.X, c.Y, c.Z)) }

// OKLabToXYZ converts OKLab to CIE XYZ (D65).
func OKLabToXYZ(c OKLab) XYZ {
	x, y, z := lmsToXYZ.apply(labToLMS(c))
	return XYZ{x, y, z}
}

// SRGBToOKLab converts sRGB to OKLab.
func SRGBToOKLab(c SRGB) OKLab { return LinearToOKLab(SRGBToLinear(c)) }

// OKLabToSRGB converts OKLab to sRGB, without clipping; see GamutMap.
func OKLabToSRGB(c OKLab) SRGB { return LinearToSRGB(OKLabToLinear(c)) }

// OKLabToOKLCH converts to polar form. Greys get hue 0.
func OKLabToOKLCH(c OKLab) OKLCH {
	return OKLCH{L: c.L, C: math.Hypot(c.A, c.B), H: hueDeg(c.A, c.B)}
}

// OKLCHToOKLab converts from polar form.
func OKLCHToOKLab(c OKLCH) OKLab {
	s, co := math.Sincos(c.H * math.Pi / 180)
	return OKLab{L: c.L, A: c.C * co, B: c.C * s}
}

// GamutMap returns the colour of lightness c.L and hue c.H with the largest
// chroma not above c.C that sRGB can show, found by bisection on chroma
// (a chroma-reduction gamut mapping: lightness and hue are what readers
// notice first, so they are kept). Lightness is clipped to 0..1 first;
// negative or NaN chroma counts as 0.
func GamutMap(c OKLCH) OKLCH {
	if math.IsNaN(c.L) || c.L < 0 {
		c.L = 0
	} else if c.L > 1 {
		c.L = 1
	}
	if math.IsNaN(c.H) || math.IsInf(c.H, 0) {
		c.H = 0
	}
	if !(c.C > 0) {
		c.C = 0
		return c
	}
	if inGamutLCH(c) {
		return c
	}
	lo, hi := 0.0, math.Min(c.C, 0.5) // no sRGB colour has OKLCH chroma above 0.33
	for i := 0; i < 50 && hi-lo > 1e-12; i++ {
		mid := (lo + hi) / 2
		if inGamutLCH(OKLCH{c.L, mid, c.H}) {
			lo = mid
		} else {
			hi = mid
		}
	}
	c.C = lo
	return c
}

func inGamutLCH(c OKLCH) bool {
	l := OKLabToLinear(OKLCHToOKLab(c))
	const eps = 1e-12
	return l.R >= -eps && l.R <= 1+eps && l.G >= -eps && l.G <= 1+eps && l.B >= -eps && l.B <= 1+eps
}

// OKLCHToSRGB converts an OKLCH colour to sRGB after GamutMap, clamping the
// last rounding residue, so the result is always displayable.
func OKLCHToSRGB(c OKLCH) SRGB {
	return OKLabToSRGB(OKLCHToOKLab(GamutMap(c))).Clamp()
}
