package main

import (
	"math"

	"plumb/palette"
)

var white = palette.SRGB{R: 1, G: 1, B: 1}

// Design constraints of the categorical palette. Exported as constants in
// the palette package too; they are repeated here because the generator
// decides, and the package tests check.
const (
	catSize        = 8
	catMaxChroma   = 0.15 // OKLCH; the sRGB primaries have 0.26-0.32
	catMinChroma   = 0.07 // below this a colour reads as a grey
	catMinL        = 0.48 // OKLab L; darker colours read as black ink
	catMinContrast = 3.0  // WCAG 2.x SC 1.4.11 on white
)

// catRules are the rules every categorical palette obeys, beyond the
// constants above. They are hard constraints of the search, not weights.
type catRules struct {
	// Hue families: two colours share a family (and would be named alike)
	// when their OKLCH hues are less than sameHue degrees apart and their
	// OKLab lightness less than lightPair apart. No two colours may.
	sameHue   float64
	lightPair float64
	// The first colour is a blue (OKLCH hue firstLo..firstHi): the hue that
	// protan and deutan readers see as strongly as everyone else.
	firstLo, firstHi float64
	// The first two colours, the most used, are no darker than leadMinL
	// (OKLab L; darker warm hues read as browns) and no greyer than
	// leadMinC (OKLCH C), so that their hue names itself.
	leadMinL, leadMinC float64
	// The second hue sits across the circle from the first (at least
	// secondGap degrees), and the third at least thirdGap from both.
	secondGap, thirdGap float64
	// At most maxEmpty of the eight 45-degree sectors of the OKLCH hue
	// circle hold no colour: the hues are spread, not bunched in one family.
	maxEmpty int
	// floor[n] is the worst case the first n colours must keep, so that
	// the small palettes, the most used, stay at least as strong as those
	// of the palette this search replaced (47.21, 19.51 and 18.91 for n =
	// 2, 3 and 4).
	floor [catSize + 1]float64
}

var catDesign = catRules{
	sameHue:   25,
	lightPair: 0.15,
	firstLo:   235,
	firstHi:   265,
	leadMinL:  0.56,
	leadMinC:  0.09,
	secondGap: 150,
	thirdGap:  60,
	maxEmpty:  2,
	floor:     [catSize + 1]float64{2: 47.21, 3: 19.51, 4: 18.91},
}

// candidate is an 8-bit colour with its CIELAB under each vision and its
// OKLCH lightness, chroma and hue.
type candidate struct {
	c       palette.SRGB
	lab     [4]palette.Lab
	L, C, H float64
}

func newCandidate(c palette.SRGB) candidate {
	k := candidate{c: c}
	for _, v := range palette.Visions {
		k.lab[v] = palette.SRGBToLab(palette.Simulate(c, v, 1))
	}
	lch := palette.OKLabToOKLCH(palette.SRGBToOKLab(c))
	k.L, k.C, k.H = lch.L, lch.C, lch.H
	return k
}

// worstPair is the smallest CIEDE2000 distance between a and b over the
// four visions.
func worstPair(a, b candidate) float64 {
	w := math.Inf(1)
	for v := range 4 {
		w = math.Min(w, palette.DeltaE2000(a.lab[v], b.lab[v]))
	}
	return w
}

// categoricalColour is the 8-bit colour nearest lch, if it is one the
// categorical palette may use: inside sRGB before rounding, no channel at 0
// or 1 after it, OKLCH chroma catMinChroma..catMaxChroma, OKLab lightness
// at least catMinL, and catMinContrast on white.
func categoricalColour(lch palette.OKLCH) (candidate, bool) {
	if lch.C < catMinChroma || lch.C > catMaxChroma || lch.L < catMinL || lch.L > 1 {
		return candidate{}, false
	}
	if palette.GamutMap(lch).C < lch.C-1e-9 {
		return candidate{}, false
	}
	s := palette.OKLCHToSRGB(lch).Quantize()
	q := palette.OKLabToOKLCH(palette.SRGBToOKLab(s))
	if atGamutEdge(s) || q.C < catMinChroma || q.C > catMaxChroma || q.L < catMinL || palette.Contrast(s, white) < catMinContrast {
		return candidate{}, false
	}
	return newCandidate(s), true
}

// atGamutEdge reports a channel at 0 or 1, the mark of a colour pushed to
// the edge of sRGB: such colours look loud beside the others.
func atGamutEdge(c palette.SRGB) bool {
	for _, v := range []float64{c.R, c.G, c.B} {
		if v == 0 || v == 1 {
			return true
		}
	}
	return false
}

// hueGap is the angle between two hues, 0 to 180 degrees.
func hueGap(a, b float64) float64 {
	d := math.Abs(a - b)
	if d > 180 {
		d = 360 - d
	}
	return d
}

// sameFamily reports whether two colours would be named alike: close in
// hue and not set apart by lightness.
func (r catRules) sameFamily(a, b candidate) bool {
	return hueGap(a.H, b.H) < r.sameHue && math.Abs(a.L-b.L) < r.lightPair
}

// fitsSlot reports whether c may stand at position slot of the palette,
// given the colours before it (set[:slot]); later colours are checked
// against it when they are placed.
func (r catRules) fitsSlot(c candidate, slot int, set []candidate) bool {
	if slot < 2 && (c.L < r.leadMinL || c.C < r.leadMinC) {
		return false
	}
	switch slot {
	case 0:
		return c.H >= r.firstLo && c.H <= r.firstHi
	case 1:
		return hueGap(c.H, set[0].H) >= r.secondGap
	case 2:
		return hueGap(c.H, set[0].H) >= r.thirdGap && hueGap(c.H, set[1].H) >= r.thirdGap
	}
	return true
}

// fitsAll reports whether the ordered set obeys every rule.
func (r catRules) fitsAll(set []candidate) bool {
	for i, c := range set {
		if !r.fitsSlot(c, i, set) {
			return false
		}
		for j := range i {
			if r.sameFamily(c, set[j]) {
				return false
			}
		}
	}
	var sectors [8]bool
	for _, c := range set {
		sectors[int(c.H/45)%8] = true
	}
	empty := 0
	for _, s := range sectors {
		if !s {
			empty++
		}
	}
	return empty <= r.maxEmpty
}
