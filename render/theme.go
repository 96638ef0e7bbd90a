package render

import "plumb/palette"

// theme holds the colours a chart uses. Charts take every colour from here,
// and every colour comes from package palette, where it is derived by a
// documented rule (palette/THEME.md), reproduced by `go generate ./palette`
// and pinned by tests; the one colour computed here, the value label inside
// a bar, is derived from the bar's own colour (insideLabel). What each
// colour is used for, and why, is the "Theme" section of DEVELOPERS.md.
type theme struct {
	neutral  Colour // the one colour of ordinary marks
	accent   Colour // highlighted marks
	context  Colour // faint context: guide lines, others' series
	grid     Colour // grid lines along the value axis
	baseline Colour // the zero line, stronger than the grid
	text     Colour // titles, labels, values: at least 4.5:1 on white
	muted    Colour // ticks, unit line, notes, source: still at least 4.5:1 on white
}

func defaultTheme() theme {
	return theme{
		neutral: RGB(palette.Neutral()),
		accent:  RGB(palette.Accent()),
		context: RGB(palette.Context()),
		// Grid lines carry no data: a tint of the neutral's family below
		// 1.5:1 on white, so they recede behind the marks.
		grid: RGB(palette.Grid()),
		// The zero line is the reference every bar is read from: drawn in
		// the text colour, as strong as the labels that name it.
		baseline: RGB(palette.Text()),
		text:     RGB(palette.Text()),
		muted:    RGB(palette.Muted()),
	}
}

// insideLabel is the colour of a value label set inside a bar of colour
// fill: the bar's own OKLCH hue, darkened (or, when no dark colour of that
// hue reaches the contrast, lightened) until it has WCAG 2.x's 4.5:1 for
// text against the bar. Dark is tried first because every other text on
// the figure is dark on light: the label keeps the figure's polarity
// wherever the bar allows it. The hue ties the label to its bar, as a
// tint of the bar rather than a white hole in it. One direction always
// reaches 4.5:1: black and white end every hue, and against any colour
// one of them has at least √21 = 4.58:1 (their contrasts multiply to 21).
// ok is false only for a fill that is not a colour.
func insideLabel(fill Colour) (Colour, bool) {
	if fill.IsNone() {
		return None, false
	}
	bar := fill.SRGB()
	if dark, ok := palette.DarkenToContrast(bar, bar, palette.MinTextContrast); ok && palette.Contrast(dark, bar) >= palette.MinTextContrast {
		return RGB(dark), true
	}
	if light, ok := lightenToContrast(bar, bar, palette.MinTextContrast); ok {
		return RGB(light), true
	}
	return None, false
}

// lightenToContrast is palette.DarkenToContrast's mirror for a dark
// background: c lightened in OKLCH, hue kept and chroma only as far as
// sRGB allows, until its contrast against bg reaches min, checked after
// 8-bit quantisation. It returns the darkest such colour, the one closest
// to c; ok is false when even the lightest colour of that hue misses min.
func lightenToContrast(c, bg palette.SRGB, min float64) (palette.SRGB, bool) {
	c = c.Quantize()
	if palette.Contrast(c, bg) >= min && palette.RelativeLuminance(c) >= palette.RelativeLuminance(bg) {
		return c, true
	}
	lch := palette.OKLabToOKLCH(palette.SRGBToOKLab(c))
	at := func(l float64) palette.SRGB {
		return palette.OKLCHToSRGB(palette.OKLCH{L: l, C: lch.C, H: lch.H}).Quantize()
	}
	if palette.Contrast(at(1), bg) < min || palette.RelativeLuminance(at(1)) < palette.RelativeLuminance(bg) {
		return at(1), false
	}
	// Contrast against a darker background grows with lightness: bisect
	// for the darkest L that still meets min (WCAG: 4.499 fails).
	lo, hi := lch.L, 1.0 // at(lo) misses min, at(hi) meets it
	for i := 0; i < 40 && hi-lo > 1e-6; i++ {
		mid := (lo + hi) / 2
		if palette.Contrast(at(mid), bg) >= min {
			hi = mid
		} else {
			lo = mid
		}
	}
	return at(hi), true
}
