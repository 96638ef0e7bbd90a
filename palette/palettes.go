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
// found by simulated annealing (internal/gen): the worst case, over normal,
// protan, deutan and tritan vision (Machado et al. 2009), of the smallest
// pairwise CIEDE2000 distance of all eight is as large as the search could
// make it (15.27; at least 14 is required), while no two colours share a
// hue family (OKLCH hues 25° or more apart, or OKLab lightness 0.15 apart),
// the hues cover all but at most two 45° sectors of the hue circle, and
// the prefixes of 2, 3 and 4 colours keep at least the worst cases of the
// palette this one replaced. The order then makes each prefix as strong as
// the set allows, n = 2 first. The first two colours, the most used, are a
// blue and a clear (not dark) warm hue across the hue circle (an orange),
// the pair that colour-blind readers tell apart best.
func Categorical(n int) (Palette, error) {
	if n < 1 || n > MaxCategorical {
		return nil, fmt.Errorf("categorical: n = %d: %w (want 1..%d)", n, ErrSize, MaxCategorical)
	}
	return slices.Clone(Palette(categoricalTable[:n])), nil
}

// Neutral is the default colour of a single series: the middle grey
// (CIELAB L* 50, 4.5:1 on white) faintly tinted (C*ab 6) in the hue of
// plumb's own grey family, so that a chart without a grouping carries no
// false meaning in its colour. It stays at least MinPairDistance from every
// categorical colour under all four visions, because series beyond the
// palette are drawn in it; its hue was chosen together with Accent (see
// THEME.md).
func Neutral() SRGB { return neutralColor }

// Accent is the highlight colour: at least 3:1 on white, at least
// MinPairDistance from every categorical colour under all four visions (a
// highlight is never taken for a group), and of such colours the one
// farthest from Neutral in the worst case over the four visions.
func Accent() SRGB { return accentColor }

// Context is the colour of faint context marks (other series drawn behind
// the one in focus, leader lines): a light tint of the grey family at
// 1.73:1 on white (the square root of the 3:1 of data marks), visible but
// never mistaken for data.
func Context() SRGB { return contextColor }

// Grid is the colour of grid lines: a tint of the grey family at 1.32:1 on
// white (the fourth root of 3:1), below the 1.5:1 at which a grid starts to
// compete with the marks.
func Grid() SRGB { return gridColor }

// Text is the colour for titles, labels and values: the grey family at
// half the CIELAB lightness of Muted, 11:1 on white (WCAG 2.x SC 1.4.6
// asks 7:1).
func Text() SRGB { return textColor }

// Muted is the colour for secondary text (notes, sources, tick labels): the
// lightest tint of the grey family that keeps 4.5:1 on white (WCAG 2.x SC
// 1.4.3).
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
