package stats

import (
	"cmp"
	"fmt"
	"math"
	"slices"
)

// LoessSpan is the share of the points each local fit uses by default:
// Cleveland (1979) suggests a span between 0.2 and 0.8 and 0.75 is the
// usual default, smooth enough not to chase noise.
const LoessSpan = 0.75

// Loess evaluates a locally weighted regression curve at each value of at
// (Cleveland 1979, "Robust locally weighted regression and smoothing
// scatterplots", JASA 74: 829-836), the local fits of degree 1 without the
// robustness iterations: for a point x0, the q = ⌊span·n⌋ points nearest x0
// along x are weighted by the tricube function of their distance scaled
// to the q-th nearest, w = (1 − (d/h)³)³, and a weighted least-squares line
// through them gives the curve's value at x0. With span > 1 every point is
// used and h grows by the factor span, as in Cleveland's definition.
//
// Pairs with a value that is not finite are skipped. A span of 0 takes
// LoessSpan.
func Loess(x, y []float64, at []float64, span float64) ([]float64, error) {
	if len(x) != len(y) {
		return nil, fmt.Errorf("loess: %d x values and %d y values", len(x), len(y))
	}
	if span == 0 {
		span = LoessSpan
	}
	if !(span > 0) || math.IsInf(span, 0) {
		return nil, fmt.Errorf("loess: span %g: give a share of the points above 0", span)
	}
	pts := make([]pair, 0, len(x))
	for i := range x {
		if finite(x[i]) && finite(y[i]) {
			pts = append(pts, pair{x[i], y[i]})
		}
	}
	n := len(pts)
	q := int(math.Floor(span * float64(n)))
	q = min(q, n)
	if q < 3 {
		return nil, fmt.Errorf("loess: a span of %g of %d %s leaves %d for each local fit: %w (want at least 3; give more points or a larger span)", span, n, plural(n), q, ErrTooFew)
	}
	slices.SortFunc(pts, func(a, b pair) int { return cmp.Compare(a.x, b.x) })
	if pts[0].x == pts[n-1].x {
		return nil, fmt.Errorf("loess: %w", ErrNoSpread)
	}
	out := make([]float64, len(at))
	for i, x0 := range at {
		lo, hi := window(pts, x0, q)
		h := math.Max(x0-pts[lo].x, pts[hi-1].x-x0)
		if span > 1 {
			h *= span
		}
		out[i] = localLine(pts[lo:hi], x0, h)
		if !finite(out[i]) {
			return nil, fmt.Errorf("loess: %w", ErrTooLarge)
		}
	}
	return out, nil
}

type pair struct{ x, y float64 }

// window finds the q points of pts (sorted by x) nearest x0: the run
// pts[lo:hi] of length q. It starts from where x0 falls and grows the run
// towards the nearer neighbour, O(q) per call after an O(log n) search.
func window(pts []pair, x0 float64, q int) (lo, hi int) {
	n := len(pts)
	i, _ := slices.BinarySearchFunc(pts, x0, func(p pair, v float64) int { return cmp.Compare(p.x, v) })
	lo, hi = i, i
	for hi-lo < q {
		switch {
		case lo == 0:
			hi++
		case hi == n:
			lo--
		case x0-pts[lo-1].x <= pts[hi].x-x0:
			lo--
		default:
			hi++
		}
	}
	return lo, hi
}

// localLine is the weighted least-squares line through pts with tricube
// weights of distance from x0 scaled by h, evaluated at x0. The sums are
// taken in d = x − x0, which keeps them small (|d| ≤ h) and makes the
// value at x0 the line's intercept; one pass with no buffer, because a
// curve of 120 values over 200,000 points would otherwise allocate 140 MB
// of weights.
func localLine(pts []pair, x0, h float64) float64 {
	// y is taken from a reference in the window too, so that values far
	// from zero (a level of 10⁶ varying by units) keep their digits.
	yref := pts[len(pts)/2].y
	var sw, swd, swy, swdd, swdy float64
	for _, p := range pts {
		w := 1.0
		if h > 0 {
			w = tricube(math.Abs(p.x-x0) / h)
		}
		d, y := p.x-x0, p.y-yref
		sw += w
		swd += w * d
		swy += w * y
		swdd += w * d * d
		swdy += w * d * y
	}
	if sw == 0 {
		// Every chosen point lies exactly h away (x0 midway between two
		// clumps): the tricube gives them all weight 0, so they count
		// alike.
		return localLine(pts, x0, 0)
	}
	den := sw*swdd - swd*swd
	// A spread in x below rounding noise gives no slope: the local
	// weighted mean is the fit (degree 0 where degree 1 is undefined).
	if den <= 1e-12*sw*swdd || den <= 0 {
		return yref + swy/sw
	}
	b := (sw*swdy - swd*swy) / den
	return yref + (swy-b*swd)/sw
}

// tricube is the weight function of Cleveland (1979): (1 − |u|³)³ for
// |u| < 1, else 0.
func tricube(u float64) float64 {
	if u >= 1 {
		return 0
	}
	t := 1 - u*u*u
	return t * t * t
}
