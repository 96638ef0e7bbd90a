package palette

import (
	"fmt"
	"slices"
)

// namedRamps is one generated family: a palette for every n from 3 to 11.
type namedRamps struct {
	name  string
	ramps [9][]SRGB
}

// Design limits of the generated palettes, checked by the tests.
const (
	// MaxCategorical is the largest categorical palette plumb offers; more
	// groups than this are better shown as small multiples.
	MaxCategorical = 8
	// MinRamp and MaxRamp bound the number of classes of a sequential or
	// diverging palette.
	MinRamp = 3
	MaxRamp = 11
	// MaxCategoricalChroma is the OKLCH chroma no categorical colour
	// exceeds, keeping them calm (the sRGB primaries have 0.26 to 0.32).
	MaxCategoricalChroma = 0.15
)

// ErrSize is returned for a palette size plumb does not offer.
var ErrSize = fmt.Errorf("palette size out of range")

// Categorical returns the first n colours of plumb's categorical palette
// (n from 1 to MaxCategorical). The order is fixed and every prefix is
// itself a good palette, so a group keeps its colour when groups are added.
// Every colour is at least 3:1 on white (WCAG 2.x non-text contrast) with
// OKLCH chroma between 0.07 and MaxCategoricalChroma. The colours were
// chosen by search, in order of priority: the worst case, over normal,
// protan, deutan and tritan vision (Machado et al. 2009), of the smallest
// pairwise CIEDE2000 distance is at least 12 for all 8; no two colours
// share a hue family (OKLCH hues 25° or more apart, or lightness far
// apart); the hues are spread evenly around the hue circle, the first ones
// most. The first two colours, the most used, are a blue and a clear
// (not dark) warm hue, the pair that colour-blind readers tell apart best.
func Categorical(n int) (Palette, error) {
	if n < 1 || n > MaxCategorical {
		return nil, fmt.Errorf("categorical: n = %d: %w (want 1..%d)", n, ErrSize, MaxCategorical)
	}
	return slices.Clone(Palette(categoricalTable[:n])), nil
}

// Neutral is the default colour of a single series: a calm grey-blue,
// 5.5:1 on white, so that a chart without a grouping carries no false
// meaning in its colour.
func Neutral() SRGB { return neutralColor }

// Accent is the highlight colour: a warm colour at least 3:1 on white,
// chosen to be as far as possible from Neutral under all four visions.
func Accent() SRGB { return accentColor }

// Context is a light grey for faint context marks (other series drawn
// behind the one in focus, grid lines); it is not meant to carry data.
func Context() SRGB { return contextColor }

// Text is the colour for titles and labels, well above 7:1 on white.
func Text() SRGB { return textColor }

// Muted is the colour for secondary text (notes, sources, tick labels),
// at least 4.5:1 on white (WCAG 2.x SC 1.4.3).
func Muted() SRGB { return mutedColor }

// SequentialHues lists the hue names Sequential accepts, in a fixed order;
// the first is the default.
func SequentialHues() []string { return names(sequentialTables) }

// DivergingHues lists the hue pairs DivergingPair accepts, in a fixed
// order; the first is the default that Diverging uses. No pair is red and
// green.
func DivergingHues() []string { return names(divergingTables) }

func names(t []namedRamps) []string {
	s := make([]string, len(t))
	for i, r := range t {
		s[i] = r.name
	}
	return s
}

// Sequential returns an n-class ramp (n from MinRamp to MaxRamp) from light
// to dark in the named hue, for "more = darker" on a light background.
// Lightness falls strictly under all four visions and consecutive CIEDE2000
// steps are even (coefficient of variation below 0.25): the ramp is a curve
// in OKLCH sampled at equal CIEDE2000 steps.
func Sequential(hue string, n int) (Palette, error) {
	return lookup("sequential", sequentialTables, hue, n)
}

// Diverging returns the default (blue-orange) diverging scale of n classes.
func Diverging(n int) (Palette, error) {
	return DivergingPair(divergingTables[0].name, n)
}

// DivergingPair returns an n-class diverging scale (n from MinRamp to
// MaxRamp) in the named hue pair: two arms matched in CIELAB lightness
// around a light neutral middle (the middle class for odd n; the two
// lightest classes for even n), dark at both ends.
func DivergingPair(pair string, n int) (Palette, error) {
	return lookup("diverging", divergingTables, pair, n)
}

func lookup(kind string, t []namedRamps, name string, n int) (Palette, error) {
	for _, r := range t {
		if r.name != name {
			continue
		}
		if n < MinRamp || n > MaxRamp {
			return nil, fmt.Errorf("%s: n = %d: %w (want %d..%d)", kind, n, ErrSize, MinRamp, MaxRamp)
		}
		return slices.Clone(Palette(r.ramps[n-MinRamp])), nil
	}
	return nil, fmt.Errorf("%s: unknown hue %q (want one of %v)", kind, name, names(t))
}
