package palette

// DarkenToContrast returns c darkened until its WCAG 2.x contrast against
// bg reaches at least min, so that text set in a mark's colour (a line's
// name beside its line) reads as one with the mark and still meets the
// text contrast rule. Only OKLCH lightness is lowered: hue is kept, and
// chroma only as far as sRGB allows at the lower lightness (GamutMap), so
// the label keeps the line's hue. The result is an 8-bit colour whose
// contrast is checked after quantisation. A colour that already meets min
// is returned unchanged. ok is false when even the darkest colour of that
// hue (black) does not reach min against bg; the darkest is then returned.
func DarkenToContrast(c, bg SRGB, min float64) (SRGB, bool) {
	c = c.Quantize()
	if Contrast(c, bg) >= min {
		return c, true
	}
	lch := OKLabToOKLCH(SRGBToOKLab(c))
	at := func(l float64) SRGB {
		return OKLCHToSRGB(OKLCH{L: l, C: lch.C, H: lch.H}).Quantize()
	}
	if Contrast(at(0), bg) < min {
		return at(0), false
	}
	// Contrast against a lighter background grows as lightness falls:
	// bisect for the lightest L that still meets min (WCAG: 4.499 fails).
	lo, hi := 0.0, lch.L // at(lo) meets min, at(hi) does not
	for i := 0; i < 40 && hi-lo > 1e-6; i++ {
		mid := (lo + hi) / 2
		if Contrast(at(mid), bg) >= min {
			lo = mid
		} else {
			hi = mid
		}
	}
	return at(lo), true
}
