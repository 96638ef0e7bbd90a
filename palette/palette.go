package palette

import "math"

// Palette is an ordered list of colours, with the measures plumb judges
// palettes by.
type Palette []SRGB

// Hex returns the colours as lowercase "#rrggbb" strings.
func (p Palette) Hex() []string {
	s := make([]string, len(p))
	for i, c := range p {
		s[i] = c.Hex()
	}
	return s
}

// Simulate returns the palette as seen with vision v at full severity
// (Machado et al. 2009).
func (p Palette) Simulate(v Vision) Palette {
	q := make(Palette, len(p))
	for i, c := range p {
		q[i] = Simulate(c, v, 1)
	}
	return q
}

// Lab returns the CIELAB of each colour as seen with vision v at full
// severity.
func (p Palette) Lab(v Vision) []Lab {
	l := make([]Lab, len(p))
	for i, c := range p {
		l[i] = SRGBToLab(Simulate(c, v, 1))
	}
	return l
}

// ClosestPair returns the indices and CIEDE2000 distance of the two colours
// that are closest with vision v at full severity: the pair a reader of
// that vision is most likely to confuse. With fewer than two colours it
// returns -1, -1 and +Inf.
func (p Palette) ClosestPair(v Vision) (i, j int, d float64) {
	return closestPair(p.Lab(v))
}

func closestPair(lab []Lab) (int, int, float64) {
	bi, bj, best := -1, -1, math.Inf(1)
	for i := range lab {
		for j := i + 1; j < len(lab); j++ {
			if d := DeltaE2000(lab[i], lab[j]); d < best {
				bi, bj, best = i, j, d
			}
		}
	}
	return bi, bj, best
}

// MinDistance is the smallest pairwise CIEDE2000 distance between the
// colours as seen with vision v at full severity; +Inf for fewer than two
// colours.
func (p Palette) MinDistance(v Vision) float64 {
	_, _, d := p.ClosestPair(v)
	return d
}

// WorstCase is the smallest MinDistance over the four visions: how far
// apart the two most similar colours stay for the reader who sees them
// worst. plumb's categorical palette maximises this.
func (p Palette) WorstCase() float64 {
	w := math.Inf(1)
	for _, v := range Visions {
		w = math.Min(w, p.MinDistance(v))
	}
	return w
}

// MinContrast is the lowest WCAG 2.x contrast ratio of any colour against
// background; +Inf for an empty palette.
func (p Palette) MinContrast(background SRGB) float64 {
	m := math.Inf(1)
	for _, c := range p {
		m = math.Min(m, Contrast(c, background))
	}
	return m
}
