package palette

// RelativeLuminance is the WCAG 2.x relative luminance of c: the Y of its
// linear sRGB, 0.2126 R + 0.7152 G + 0.0722 B, with components decoded by the
// IEC 61966-2-1 transfer function (threshold 0.04045, as WCAG has read since
// 2021; for 8-bit colours the older 0.03928 gives identical results).
// Components are clamped to 0..1 first.
func RelativeLuminance(c SRGB) float64 {
	c = c.Clamp()
	return 0.2126*decode(c.R) + 0.7152*decode(c.G) + 0.0722*decode(c.B)
}

// Contrast is the WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05) between
// a and b, L1 the lighter relative luminance; 1 for equal colours, 21 for
// black on white. Nothing is rounded: WCAG says 2.999:1 does not meet 3:1.
func Contrast(a, b SRGB) float64 {
	la, lb := RelativeLuminance(a), RelativeLuminance(b)
	if la < lb {
		la, lb = lb, la
	}
	return (la + 0.05) / (lb + 0.05)
}
