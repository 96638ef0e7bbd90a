package main

import (
	"math"

	"plumb/palette"
)

// hueRamp describes a sequential ramp in OKLCH from light to dark: hue moves
// linearly from light to dark end, chroma follows a quadratic Bézier
// through a peak, lightness falls linearly. The curve is then sampled at
// equal CIEDE2000 steps.
type hueRamp struct {
	name                 string
	hLight, hDark        float64 // OKLCH hue, degrees
	cLight, cPeak, cDark float64 // OKLCH chroma
}

// Light and dark ends of every sequential ramp (OKLab L): the light end
// stays visible on white, the dark end stays distinguishable from black.
const (
	seqLight = 0.96
	seqDark  = 0.32
)

// sequentialRamps are plumb's own ramps, in the order SequentialHues lists.
var sequentialRamps = []hueRamp{
	{"blue", 230, 262, 0.02, 0.13, 0.08},
	{"green", 135, 160, 0.03, 0.13, 0.07},
	{"orange", 85, 40, 0.04, 0.15, 0.08},
	{"purple", 300, 295, 0.02, 0.14, 0.09},
	{"grey", 250, 250, 0, 0, 0},
}

func (r hueRamp) at(t float64) palette.SRGB {
	L := seqLight + (seqDark-seqLight)*t
	C := (1-t)*(1-t)*r.cLight + 2*t*(1-t)*r.cPeak + t*t*r.cDark
	H := r.hLight + (r.hDark-r.hLight)*t
	return palette.OKLCHToSRGB(palette.OKLCH{L: L, C: C, H: H})
}

// equalSteps places n points on the curve at(t), t in 0..1, with the first
// at 0, the last at 1 and consecutive CIEDE2000 distances equal: it finds by
// bisection the step D for which walking from 0 in chord steps of D lands
// exactly on 1.
func equalSteps(at func(float64) palette.SRGB, n int) []palette.SRGB {
	walk := func(d float64) []float64 {
		ts := []float64{0}
		t := 0.0
		for len(ts) < n {
			from := palette.SRGBToLab(at(t))
			if palette.DeltaE2000(from, palette.SRGBToLab(at(1))) < d {
				return append(ts, 2) // overshoot: d too large
			}
			lo, hi := t, 1.0
			for i := 0; i < 60; i++ {
				mid := (lo + hi) / 2
				if palette.DeltaE2000(from, palette.SRGBToLab(at(mid))) < d {
					lo = mid
				} else {
					hi = mid
				}
			}
			t = (lo + hi) / 2
			ts = append(ts, t)
		}
		return ts
	}
	lo, hi := 0.0, 200.0
	for i := 0; i < 60; i++ {
		mid := (lo + hi) / 2
		ts := walk(mid)
		if ts[len(ts)-1] > 1 || ts[len(ts)-1] == 1 && len(ts) < n {
			hi = mid
		} else {
			lo = mid
		}
	}
	ts := walk(lo)
	ts[len(ts)-1] = 1
	out := make([]palette.SRGB, n)
	for i, t := range ts {
		out[i] = at(math.Min(t, 1)).Quantize()
	}
	return out
}

// colourAtLstar returns the colour of OKLCH hue h and chroma c (reduced to
// fit the gamut) whose CIELAB L* is lstar, by bisection on OKLab L; arms of
// a diverging scale are matched in L*, the lightness CIEDE2000 measures.
func colourAtLstar(h, c, lstar float64) palette.SRGB {
	lo, hi := 0.0, 1.0
	for i := 0; i < 60; i++ {
		mid := (lo + hi) / 2
		if palette.SRGBToLab(palette.OKLCHToSRGB(palette.OKLCH{L: mid, C: c, H: h})).L < lstar {
			lo = mid
		} else {
			hi = mid
		}
	}
	return palette.OKLCHToSRGB(palette.OKLCH{L: (lo + hi) / 2, C: c, H: h})
}

// divergingPair is two arms around a light neutral middle.
type divergingPair struct {
	name          string
	hLeft, hRight float64 // OKLCH hues of the two arms
	cLeft, cRight float64 // chroma at the dark ends
}

// Lightness (CIELAB L*) of the neutral middle and of both dark ends.
const (
	divMid = 96
	divEnd = 32
)

var divergingPairs = []divergingPair{
	{"blue-orange", 255, 55, 0.12, 0.12},
	{"purple-green", 305, 150, 0.13, 0.10},
}

// arm returns the colour at position t (0 = middle, 1 = end) of one arm:
// L* falls linearly, chroma rises as sqrt(t) so that colours near the
// middle already show their side.
func armColour(h, cEnd, t float64) palette.SRGB {
	return colourAtLstar(h, cEnd*math.Sqrt(t), divMid+(divEnd-divMid)*t).Quantize()
}

func designDiverging(p divergingPair, n int) []palette.SRGB {
	m := n / 2
	out := make([]palette.SRGB, n)
	for k := 1; k <= m; k++ {
		var t float64
		if n%2 == 1 {
			t = float64(k) / float64(m)
		} else {
			t = (float64(k) - 0.5) / (float64(m) - 0.5)
		}
		out[m-k] = armColour(p.hLeft, p.cLeft, t)
		out[n-1-(m-k)] = armColour(p.hRight, p.cRight, t)
	}
	if n%2 == 1 {
		out[m] = armColour(0, 0, 0)
	}
	return out
}
