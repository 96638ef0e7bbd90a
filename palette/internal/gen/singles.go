package main

import (
	"math"
	"slices"

	"plumb/palette"
)

// The theme colours: every colour a chart uses that is not a palette. The
// rules and the numbers they give are written out in palette/THEME.md; the
// constants here are the rules' inputs, each with its reason.
const (
	// neutralLstar is the CIELAB lightness of the neutral mark colour: the
	// middle grey (L* 50, 18% luminance), as far in lightness from the
	// white page as from black ink, so that a mark reads neither as a tint
	// of the background nor as text. It has 4.5:1 on white, above the 3:1
	// that WCAG 2.x SC 1.4.11 asks of graphical objects.
	neutralLstar = 50
	// markChroma is the CIELAB chroma C*ab of the neutral: enough for the
	// family's hue to show beside a true grey, little enough that the
	// colour is named by its lightness and carries no meaning.
	markChroma = 6
	// inkChroma is the chroma of the text and guide tints: half the
	// mark's, so they keep the family's hue as a trace and never compete
	// with the marks.
	inkChroma = 3
	// mutedContrast is the contrast on white of secondary text, the
	// minimum of WCAG 2.x SC 1.4.3: muted text recedes as far as the rule
	// lets it.
	mutedContrast = 4.5
	// accentMinL is the accent's lowest OKLab lightness, the categorical
	// palette's catMinL: darker colours read as ink, not as a highlight.
	accentMinL = catMinL
	// accentApart is the worst-case CIEDE2000 distance the accent keeps
	// from every categorical colour (palette.MinPairDistance), so that a
	// highlighted mark is never taken for a group.
	accentApart = palette.MinPairDistance
)

// Contrast on white of the faint guides, on a scale that halves the
// logarithm of the contrast at each step down from the 3:1 every data mark
// keeps (WCAG 2.x SC 1.4.11): context marks (other series behind the one in
// focus, leader lines) at 3^(1/2) = 1.73:1, visible but below any data
// mark; grid lines at 3^(1/4) = 1.32:1, below the 1.5:1 at which they
// would start to compete with the marks.
var (
	contextContrast = math.Sqrt(3)
	gridContrast    = math.Sqrt(math.Sqrt(3))
)

// singles are the theme colours.
type singles struct {
	neutral, accent, context, grid, text, muted palette.SRGB
	hue                                         float64 // CIELAB hue of the family, degrees
	neutralApart, accentFromNeutral             float64 // the two searches' optima
}

// lab is the 8-bit colour nearest the CIELAB colour of lightness l,
// chroma c and hue h (degrees).
func lab(l, c, h float64) palette.SRGB {
	r := h * math.Pi / 180
	return palette.LabToSRGB(palette.Lab{L: l, A: c * math.Cos(r), B: c * math.Sin(r)}).Clamp().Quantize()
}

// tintAt is the 8-bit colour of the family (hue h, chroma c) whose
// contrast on white is closest to ratio but not below it when atLeast, not
// above it otherwise: bisection on L*, then one 8-bit step at a time.
func tintAt(h, c, ratio float64, atLeast bool) palette.SRGB {
	lo, hi := 0.0, 100.0
	for range 60 {
		mid := (lo + hi) / 2
		if palette.Contrast(lab(mid, c, h), white) > ratio {
			lo = mid
		} else {
			hi = mid
		}
	}
	l := (lo + hi) / 2
	for range 200 {
		s := lab(l, c, h)
		r := palette.Contrast(s, white)
		if atLeast && r >= ratio || !atLeast && r <= ratio {
			return s
		}
		if atLeast {
			l -= 0.05
		} else {
			l += 0.05
		}
	}
	return lab(l, c, h)
}

// designSingles derives the theme colours from the categorical palette
// cat, in order: the accents allowed beside it, the neutral and accent
// pair (which fixes the family's hue), and the tints of text and guides.
func designSingles(cat []palette.SRGB) singles {
	var s singles
	cs := make([]candidate, len(cat))
	for i, c := range cat {
		cs[i] = newCandidate(c)
	}
	apart := func(k candidate) float64 {
		w := math.Inf(1)
		for _, o := range cs {
			w = math.Min(w, worstPair(k, o))
		}
		return w
	}
	// The accents that may be chosen: of the 8-bit colours on a grid in
	// OKLCH (lightness from accentMinL to 0.80 in steps of 0.01, chroma
	// 0.05 to 0.32 in steps of 0.01, hue in steps of 2 degrees), those
	// inside sRGB, with 3:1 on white (WCAG 2.x SC 1.4.11), that stay
	// accentApart from every categorical colour under all four visions.
	var accents []candidate
	for li := 0; accentMinL+0.01*float64(li) <= 0.80+1e-9; li++ {
		for ci := 0; ci <= 27; ci++ {
			for hi := 0; hi < 180; hi++ {
				lch := palette.OKLCH{L: accentMinL + 0.01*float64(li), C: 0.05 + 0.01*float64(ci), H: 2 * float64(hi)}
				if palette.GamutMap(lch).C < lch.C-1e-9 {
					continue
				}
				c := palette.OKLCHToSRGB(lch).Quantize()
				if palette.Contrast(c, white) < palette.MinMarkContrast {
					continue
				}
				k := newCandidate(c)
				if k.L >= accentMinL && apart(k) >= accentApart && !slices.ContainsFunc(accents, func(o candidate) bool { return o.c == c }) {
					accents = append(accents, k)
				}
			}
		}
	}
	// The neutral and the accent, chosen together: the neutral at the
	// stated lightness and chroma, at a CIELAB hue in whole degrees where
	// it too stays accentApart from every categorical colour (series
	// beyond the palette's eight are drawn in the neutral beside the
	// others), and the accent from the list above; of all such pairs, the
	// one farthest apart in the worst case over the four visions, since a
	// highlight is read against the neutral. Ties go to the neutral
	// farther from the categorical colours, then to the first found.
	s.accentFromNeutral, s.neutralApart = -1, -1
	for h := range 360 {
		k := newCandidate(lab(neutralLstar, markChroma, float64(h)))
		w := apart(k)
		if w < accentApart {
			continue
		}
		for _, a := range accents {
			d := worstPair(a, k)
			if d > s.accentFromNeutral+1e-9 || d > s.accentFromNeutral-1e-9 && w > s.neutralApart+1e-9 {
				s.accentFromNeutral, s.neutralApart = d, w
				s.hue, s.neutral, s.accent = float64(h), k.c, a.c
			}
		}
	}
	// Text and guides: the family's hue at half the chroma.
	s.muted = tintAt(s.hue, inkChroma, mutedContrast, true)
	// Text at half the muted text's lightness: as far below muted in L*
	// as black is below text, a clear step in the hierarchy that stays a
	// tint of the family rather than black.
	s.text = lab(palette.SRGBToLab(s.muted).L/2, inkChroma, s.hue)
	s.context = tintAt(s.hue, inkChroma, contextContrast, false)
	s.grid = tintAt(s.hue, inkChroma, gridContrast, false)
	return s
}
