package render

import (
	"image"
	"image/color"
	"math"

	"plumb/palette"
)

// heatSteps is the number of colours a heat scale takes from its ramp:
// more than the eye tells apart along a ramp, few enough to keep as a
// table (and to keep lightness monotone after rounding to 8 bits).
const heatSteps = 256

// heatScale maps values to colours: a sequential ramp (light to dark, more
// is darker) or a diverging one (dark, light neutral at mid, dark in the
// other hue), each continuous by interpolation in CIELAB between the
// palette's eleven classes, so that lightness changes linearly between
// classes and never turns back.
type heatScale struct {
	diverging bool
	mid       float64 // diverging: the neutral middle
	lo, hi    float64 // the data's extent
	d0, d1    float64 // the domain the colours span (the key's), set by fit
	table     [heatSteps]Colour
}

// newHeatScale chooses the scale: diverging about mid when it is given,
// else about zero when the values have both signs, else sequential.
func newHeatScale(lo, hi float64, mid *float64) heatScale {
	s := heatScale{lo: lo, hi: hi, d0: lo, d1: hi}
	var stops palette.Palette
	switch {
	case mid != nil:
		s.diverging, s.mid = true, *mid
	case lo < 0 && hi > 0:
		s.diverging = true
	}
	if s.diverging {
		stops, _ = palette.Diverging(palette.MaxRamp)
	} else {
		stops, _ = palette.Sequential("blue", palette.MaxRamp)
	}
	labs := make([]palette.Lab, len(stops))
	for i, c := range stops {
		labs[i] = palette.SRGBToLab(c)
	}
	for i := range heatSteps {
		t := float64(i) / (heatSteps - 1) * float64(len(labs)-1)
		k := min(int(t), len(labs)-2)
		u := t - float64(k)
		a, b := labs[k], labs[k+1]
		c := palette.LabToSRGB(palette.Lab{L: a.L + u*(b.L-a.L), A: a.A + u*(b.A-a.A), B: a.B + u*(b.B-a.B)})
		s.table[i] = RGB(c.Clamp())
	}
	s.monotone()
	return s
}

// monotone makes lightness never rise towards the dark end (for a
// diverging scale, towards both ends from the middle) after rounding to 8
// bits: a step that would turn back keeps the previous colour.
func (s *heatScale) monotone() {
	fix := func(from, to, step int) {
		prev := palette.SRGBToLab(s.table[from].SRGB()).L
		for i := from + step; i != to+step; i += step {
			l := palette.SRGBToLab(s.table[i].SRGB()).L
			if l > prev {
				s.table[i] = s.table[i-step]
				continue
			}
			prev = l
		}
	}
	if s.diverging {
		fix(heatSteps/2, heatSteps-1, 1)
		fix(heatSteps/2-1, 0, -1)
		return
	}
	fix(0, heatSteps-1, 1)
}

// fit sets the domain the colours span to the key axis's extent; a
// diverging domain is made symmetric about the middle, so that equal
// distances from it are equally dark on both sides.
func (s *heatScale) fit(d0, d1 float64) {
	s.d0, s.d1 = d0, d1
	if s.diverging {
		r := math.Max(s.mid-d0, d1-s.mid)
		s.d0, s.d1 = s.mid-r, s.mid+r
	}
}

// index is the table entry for v.
func (s *heatScale) index(v float64) int {
	if s.d1 == s.d0 {
		return heatSteps / 2
	}
	t := (v - s.d0) / (s.d1 - s.d0)
	return max(0, min(heatSteps-1, int(math.Round(t*(heatSteps-1)))))
}

// colour is the colour of value v.
func (s *heatScale) colour(v float64) Colour { return s.table[s.index(v)] }

// keyDomain is the range of values the key must show: the data's, widened
// to hold the middle of a diverging scale.
func (s *heatScale) keyDomain() (float64, float64) {
	lo, hi := s.lo, s.hi
	if s.diverging {
		lo, hi = math.Min(lo, s.mid), math.Max(hi, s.mid)
	}
	if lo == hi {
		d := math.Max(1, math.Abs(lo)*0.1)
		lo, hi = lo-d, hi+d
	}
	return lo, hi
}

// ramp is the key's colour strip over [k0, k1]: w pixels wide, one high.
func (s *heatScale) ramp(k0, k1 float64, w int) *image.NRGBA {
	img := image.NewNRGBA(image.Rect(0, 0, w, 1))
	for x := range w {
		v := k0 + (float64(x)+0.5)/float64(w)*(k1-k0)
		img.SetNRGBA(x, 0, color.NRGBA(s.colour(v)))
	}
	return img
}
