package render

import (
	"fmt"
	"strings"

	"plumb/palette"
)

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

	// series are the caller's colours (Common.Colors) for series and
	// groups, in order; nil takes the generated categorical palette.
	series []Colour
}

// withColors is the theme with the caller's colours (Common.Colors): the
// first is the neutral of single-series charts and the first series, the
// second the accent of highlighted marks and the second series, and all
// of them in order colour series and groups. Only the data colours change:
// text, grid and baseline keep their derived colours, whose contrasts are
// what makes the figure readable.
func (t theme) withColors(cs []Colour) theme {
	if len(cs) == 0 {
		return t
	}
	t.series = cs
	t.neutral = cs[0]
	if len(cs) > 1 {
		t.accent = cs[1]
	}
	return t
}

// categorical colours n series or groups: the caller's colours when they
// are enough, else the generated categorical palette (ok false when n is
// beyond it too). user says whether the caller's colours were used, so
// that a chart can note it when they were too few.
func (t theme) categorical(n int) (cs []Colour, user, ok bool) {
	if len(t.series) > 0 && n <= len(t.series) {
		return t.series[:n:n], true, true
	}
	p, err := palette.Categorical(n)
	if err != nil {
		return nil, false, false
	}
	cs = make([]Colour, len(p))
	for i, c := range p {
		cs[i] = RGB(c)
	}
	return cs, false, true
}

// pageColour is the background every figure is drawn on: SVGs are
// transparent and placed on white pages and screens (see "Theme").
var pageColour = palette.SRGB{R: 1, G: 1, B: 1}

// checkColors validates the caller's colours and reviews them as `plumb
// palette check` does (palette.Check): every pair must stay
// palette.MinPairDistance apart (CIEDE2000) under normal, protan, deutan
// and tritan vision, every colour must reach palette.MinMarkContrast on
// the page. A problem is a warning, not a refusal: organisations have
// brand colours, and the chart is drawn with them, but every collision is
// a note ("colors-cvd", "colors-contrast") with the colours and the
// measured number, printed by default. A colour that is not opaque is an
// option error.
func checkColors(cs []Colour) ([]Note, error) {
	if len(cs) == 0 {
		return nil, nil
	}
	srgb := make([]palette.SRGB, len(cs))
	for i, c := range cs {
		if c.A != 255 {
			return nil, &OptionError{Option: "Colors", Value: fmt.Sprintf("%d", i+1), Err: fmt.Errorf("colour %d is not an opaque colour; give #rrggbb", i+1)}
		}
		srgb[i] = c.SRGB()
	}
	r := palette.Check(srgb, pageColour)
	var notes []Note
	for _, p := range r.Pairs {
		var bad []string
		for _, v := range palette.Visions {
			if d := p.Distance[v]; d < palette.MinPairDistance {
				bad = append(bad, fmt.Sprintf("%s for %s vision", trunc(d, 1), v))
			}
		}
		if len(bad) > 0 {
			notes = append(notes, Note{Code: "colors-cvd", Changed: true, Text: fmt.Sprintf(
				"the colours %s and %s are hard to tell apart: CIEDE2000 distance %s (at least %s needed); marks in them may be confused",
				p.A.Hex(), p.B.Hex(), strings.Join(bad, ", "), trunc(palette.MinPairDistance, 0))})
		}
	}
	for _, c := range r.Contrast {
		if c.Ratio < palette.MinMarkContrast {
			notes = append(notes, Note{Code: "colors-contrast", Changed: true, Text: fmt.Sprintf(
				"the colour %s has contrast %s:1 on the white page, below the %s:1 marks need (WCAG 2.x non-text contrast); marks in it are hard to see",
				c.Color.Hex(), trunc(c.Ratio, 2), trunc(palette.MinMarkContrast, 0))})
		}
	}
	return notes, nil
}

// trunc writes x with the given decimals, cut rather than rounded, as
// palette.Check does, so that a failing value never prints as if it met
// the threshold (2.999 is 2.99, not 3.00).
func trunc(x float64, decimals int) string {
	p := 1.0
	for range decimals {
		p *= 10
	}
	return fmt.Sprintf("%.*f", decimals, float64(int64(x*p))/p)
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

// categorical is theme.categorical for a chart: when the caller's colours
// are fewer than the series or groups (what), plumb's palette colours them
// all, and a note says so ("colors-short").
func (f *frame) categorical(n int, what string) ([]Colour, bool, bool) {
	cs, user, ok := f.th.categorical(n)
	if len(f.th.series) > 0 && !user {
		given := fmt.Sprintf("%d colours were", len(f.th.series))
		if len(f.th.series) == 1 {
			given = "1 colour was"
		}
		f.scene.Note("colors-short", true, fmt.Sprintf("%s given for %d %s: drew them all in plumb's own palette; give at least %d colours", given, n, what, n))
	}
	return cs, user, ok
}

// diffColors are diffColors, or, when Common.Colors gives two or more,
// the caller's first two colours for the lines of a and b and a tint of
// each for their areas: the areas carry their names in the text colour,
// so each is lightened in its own hue (lightenToContrast) until that text
// reaches WCAG 2.x's 4.5:1 on it, as the default areas do.
func (f *frame) diffColors() (areaA, areaB, lineA, lineB Colour) {
	s := f.th.series
	if len(s) < 2 {
		return diffColors()
	}
	tint := func(c Colour) Colour {
		if t, ok := lightenToContrast(c.SRGB(), f.th.text.SRGB(), palette.MinTextContrast); ok {
			return RGB(t)
		}
		return c
	}
	return tint(s[0]), tint(s[1]), s[0], s[1]
}

// rampColors notes that a chart coloured by a ramp (heat maps, maps,
// binned points) keeps its ramp when the caller gave colours: a ramp must
// change monotonically in lightness to be read as more and less, which a
// list of brand colours does not. what says what the ramp colours, such
// as "heat maps colour values".
func (f *frame) rampColors(what string) {
	if len(f.th.series) > 0 {
		f.scene.Note("colors-ignored", true, fmt.Sprintf("%s by a ramp that changes steadily in lightness; the colours given are not used", what))
	}
}
