// Package palette does the colour science behind plumb's colours: colour
// spaces, colour difference, contrast, colour-vision-deficiency simulation,
// and palettes of plumb's own design that stay apart for every reader.
//
// The methods, and where they come from:
//
//   - sRGB and its transfer function, linear RGB and CIE XYZ (D65):
//     IEC 61966-2-1:1999, with the 64-bit matrices of the W3C CSS Color 4
//     sample code so that white maps to L* = 100, a* = b* = 0 exactly.
//   - CIELAB (D65 white, ε = 216/24389, κ = 24389/27) and the CIEDE2000
//     colour difference as set out by Sharma, Wu & Dalal (2005), "The CIEDE2000
//     Color-Difference Formula: Implementation Notes, Supplementary Test Data,
//     and Mathematical Observations", Color Research and Application 30(1).
//   - OKLab and OKLCH: Ottosson (2020), "A perceptual color space for image
//     processing". Gamut mapping reduces OKLCH chroma at constant lightness
//     and hue until the colour fits sRGB.
//   - Relative luminance and contrast ratio: W3C WCAG 2.x, computed without
//     rounding any intermediate value.
//   - Colour-vision-deficiency simulation: Machado, Oliveira & Fernandes
//     (2009), "A Physiologically-based Model for Simulation of Color Vision
//     Deficiency", IEEE TVCG 15(6), applied to linear RGB and clipped to the
//     gamut.
//
// The palettes (Categorical, Sequential, Diverging and the theme colours
// Neutral, Accent, Context, Grid, Text and Muted) are tables written by the
// generator in internal/gen (run `go generate`), which searches for colours
// by the measures above; the tests pin every property the generator
// optimised for, so that a regenerated table that loses one fails. The
// rules behind the theme colours, and the numbers they give, are in
// THEME.md next to this file.
package palette

//go:generate go run ./internal/gen -o tables.go
