package palette

import (
	"fmt"
	"strconv"
)

// Thresholds used by Check.
const (
	// MinPairDistance is the smallest CIEDE2000 distance Check accepts
	// between two colours under any vision. A distance of about 1 is just
	// noticeable for large patches side by side under controlled viewing
	// (Sharma, Wu & Dalal 2005 discuss the scale); chart marks are small,
	// apart and seen on uncalibrated screens, so plumb asks for ten times
	// that (common practice). By this measure the widely used 8-colour set
	// of Okabe & Ito (2008) reaches 10.87, and a typical red/green pair
	// falls far below it for deutan readers.
	MinPairDistance = 10.0

	// MinMarkContrast is the contrast ratio every data colour must reach
	// against the background: WCAG 2.x success criterion 1.4.11 (non-text
	// contrast) asks 3:1 for graphical objects needed to understand content.
	MinMarkContrast = 3.0

	// MinTextContrast is the contrast ratio for body text: WCAG 2.x success
	// criterion 1.4.3 (contrast, minimum) asks 4.5:1.
	MinTextContrast = 4.5
)

// Pair is the distance between two colours under each vision.
type Pair struct {
	A, B     SRGB
	Distance [4]float64 // CIEDE2000 at full severity, indexed by Vision
}

// Min returns the smallest distance of the pair and the vision it occurs
// under (the first such vision in Visions order on a tie).
func (p Pair) Min() (float64, Vision) {
	d, v := p.Distance[0], Normal
	for _, w := range Visions[1:] {
		if p.Distance[w] < d {
			d, v = p.Distance[w], w
		}
	}
	return d, v
}

// ColorContrast is one colour's WCAG 2.x contrast ratio against the
// background.
type ColorContrast struct {
	Color SRGB
	Ratio float64
}

// Report is the result of Check: every measurement, whether the colours
// pass, and a sentence for each failure.
type Report struct {
	Colors     []SRGB
	Background SRGB
	Pairs      []Pair          // every unordered pair, in input order
	Contrast   []ColorContrast // one per colour, in input order
	Safe       bool            // no problem found
	Problems   []string        // human-readable, one per failing pair-vision or colour
}

// Check reviews colours meant to be told apart on background: every pair
// must stay at least MinPairDistance apart (CIEDE2000) under normal, protan,
// deutan and tritan vision (Machado et al. 2009, full severity), and every
// colour must reach MinMarkContrast against the background (WCAG 2.x).
// Problems is never nil, so that it encodes as an empty list.
func Check(colors []SRGB, background SRGB) Report {
	r := Report{
		Colors:     append([]SRGB(nil), colors...),
		Background: background,
		Pairs:      []Pair{},
		Contrast:   make([]ColorContrast, len(colors)),
		Problems:   []string{},
	}
	var labs [4][]Lab
	for _, v := range Visions {
		labs[v] = Palette(colors).Lab(v)
	}
	for i := range colors {
		for j := i + 1; j < len(colors); j++ {
			p := Pair{A: colors[i], B: colors[j]}
			for _, v := range Visions {
				p.Distance[v] = DeltaE2000(labs[v][i], labs[v][j])
				if p.Distance[v] < MinPairDistance {
					r.Problems = append(r.Problems, fmt.Sprintf(
						"%s and %s are only %s apart for %s vision (CIEDE2000; at least %s needed)",
						p.A.Hex(), p.B.Hex(), fmtNum(p.Distance[v], 1), v, fmtNum(MinPairDistance, 0)))
				}
			}
			r.Pairs = append(r.Pairs, p)
		}
	}
	for i, c := range colors {
		ratio := Contrast(c, background)
		r.Contrast[i] = ColorContrast{Color: c, Ratio: ratio}
		if ratio < MinMarkContrast {
			r.Problems = append(r.Problems, fmt.Sprintf(
				"%s has contrast %s:1 on %s (WCAG non-text contrast needs at least %s:1)",
				c.Hex(), fmtNum(ratio, 2), background.Hex(), fmtNum(MinMarkContrast, 0)))
		}
	}
	r.Safe = len(r.Problems) == 0
	return r
}

// fmtNum truncates rather than rounds, so that a failing value is never
// printed as if it met the threshold (4.499 shows as 4.49, not 4.50).
func fmtNum(x float64, decimals int) string {
	p := 1.0
	for i := 0; i < decimals; i++ {
		p *= 10
	}
	t := float64(int64(x*p)) / p
	return strconv.FormatFloat(t, 'f', decimals, 64)
}
