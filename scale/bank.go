package scale

import (
	"math"
	"slices"
)

// Polyline is one drawn line, the input to the banking functions: the points
// (X[i], Y[i]) in drawing order. A non-finite coordinate (NaN for a missing
// value) breaks the line; extra elements of the longer slice are ignored.
//
// Banking to 45° chooses a panel's aspect ratio alpha = H/W (Cleveland's
// convention: height over width) from the segments of the lines it shows.
// The banking functions take rx and ry, the extents of the x and y scale
// domains actually mapped onto the panel (after padding or nice-tick
// extension), so that a segment's normalised deltas are u = Δx/rx and
// v = Δy/ry and it is drawn with slope alpha·|v/u|. All segments of all lines
// are pooled, as for several series on one panel or small multiples with
// shared scales. Segments between duplicate points are dropped. The functions
// report ok == false, with alpha 0, when rx or ry is not a positive finite
// number or banking is undefined for the segments (for example a constant
// series); the caller then keeps its default aspect ratio. Clamping alpha to
// layout limits is the caller's job. Method names (MS, AO, AWO) follow Heer &
// Agrawala (2006).
type Polyline struct {
	X, Y []float64
}

// BankMedianSlope returns the aspect ratio that makes the median absolute
// slope of the drawn segments 1, i.e. 45° (MS; Cleveland, McGill & McGill
// 1988, "The Shape Parameter of a Two-Variable Graph", JASA 83:289–300). It
// has the closed form alpha = 1 / median|v/u|. Flat and vertical segments are
// dropped first (methods.md §3.3): otherwise a series that is flat at least
// half the time would bank to an infinitely tall panel.
func BankMedianSlope(lines []Polyline, rx, ry float64) (alpha float64, ok bool) {
	if !bankExtentOK(rx, ry) {
		return 0, false
	}
	slopes := make([]float64, 0, bankPoints(lines))
	bankSegments(lines, rx, ry, func(u, v float64) {
		if u == 0 || v == 0 {
			return
		}
		if s := v / u; s > 0 && !math.IsInf(s, 0) {
			slopes = append(slopes, s)
		}
	})
	if len(slopes) == 0 {
		return 0, false
	}
	return bankResult(1 / bankMedian(slopes))
}

// BankOrientation returns the aspect ratio at which the mean absolute
// orientation of the drawn segments is 45° (AO; Cleveland, McGill & McGill
// 1988). A vertical segment counts as 90°, a flat one as 0°. The mean
// orientation increases monotonically with alpha, so the root is found by
// bisection on log alpha. ok is false when no alpha reaches 45°: when at
// least half the segments are vertical, or at least half are flat.
func BankOrientation(lines []Polyline, rx, ry float64) (alpha float64, ok bool) {
	return bankSolve(lines, rx, ry, false)
}

// BankWeightedOrientation returns the aspect ratio at which the mean absolute
// orientation of the drawn segments, each weighted by its drawn length, is
// 45° (AWO; Cleveland 1993, Visualizing Data). Long segments, which dominate
// what the eye sees, count for more than short ones. ok is false unless some
// segment rises or falls and some segment advances in x.
func BankWeightedOrientation(lines []Polyline, rx, ry float64) (alpha float64, ok bool) {
	return bankSolve(lines, rx, ry, true)
}

func bankExtentOK(rx, ry float64) bool {
	return rx > 0 && ry > 0 && !math.IsInf(rx, 0) && !math.IsInf(ry, 0)
}

func bankResult(alpha float64) (float64, bool) {
	if !(alpha > 0) || math.IsInf(alpha, 0) {
		return 0, false
	}
	return alpha, true
}

// bankSegments calls f with the absolute normalised deltas |Δx|/rx, |Δy|/ry
// of every drawn, non-degenerate segment.
func bankSegments(lines []Polyline, rx, ry float64, f func(u, v float64)) {
	for _, l := range lines {
		n := min(len(l.X), len(l.Y))
		for i := 1; i < n; i++ {
			x0, y0, x1, y1 := l.X[i-1], l.Y[i-1], l.X[i], l.Y[i]
			if !bankFinite(x0) || !bankFinite(y0) || !bankFinite(x1) || !bankFinite(y1) {
				continue
			}
			u, v := math.Abs(x1-x0)/rx, math.Abs(y1-y0)/ry
			if u == 0 && v == 0 || math.IsInf(u, 0) || math.IsInf(v, 0) {
				continue
			}
			f(u, v)
		}
	}
}

// bankPoints is an upper bound on the number of segments, used to allocate
// once: growing by append cost five times the memory on 1e6 segments.
func bankPoints(lines []Polyline) int {
	n := 0
	for _, l := range lines {
		n += min(len(l.X), len(l.Y))
	}
	return n
}

func bankFinite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// bankSolve finds alpha with mean orientation π/4 (weighted by drawn length
// when weighted is set) by bisection on log2 alpha.
func bankSolve(lines []Polyline, rx, ry float64, weighted bool) (float64, bool) {
	if !bankExtentOK(rx, ry) {
		return 0, false
	}
	segs := make([][2]float64, 0, bankPoints(lines))
	var flat, vertical int
	bankSegments(lines, rx, ry, func(u, v float64) {
		switch {
		case v == 0:
			flat++
		case u == 0:
			vertical++
		}
		segs = append(segs, [2]float64{u, v})
	})
	n := len(segs)
	// Limits of the mean orientation as alpha → 0 and → ∞ (methods.md §3.3):
	// a root exists only if the first is below 45° and the second above.
	switch {
	case n == 0:
		return 0, false
	case weighted && !bankHasTurning(segs):
		return 0, false
	case !weighted && (2*vertical >= n || 2*flat >= n):
		return 0, false
	}
	f := func(log2A float64) float64 { return bankMeanOrientation(segs, math.Exp2(log2A), weighted) - math.Pi/4 }
	// Bracket the root in log2 alpha, starting at alpha = 1 and doubling the
	// distance, so that even alpha near the float64 limits costs about a
	// dozen evaluations.
	lo, hi := 0.0, 0.0
	flo, fhi := f(0), 0.0
	if flo > 0 {
		for hi, fhi = lo, flo; ; hi, fhi = lo, flo {
			if lo = min(2*lo, -1); lo < -2048 {
				return 0, false
			}
			if flo = f(lo); flo <= 0 {
				break
			}
		}
	} else {
		for {
			if hi = max(2*hi, 1); hi > 2048 {
				return 0, false
			}
			if fhi = f(hi); fhi >= 0 {
				break
			}
			lo, flo = hi, fhi
		}
	}
	return bankResult(math.Exp2(bankRoot(f, lo, hi, flo, fhi)))
}

// bankRoot narrows a bracket [lo, hi] with f(lo) <= 0 <= f(hi) of an
// increasing f to 1e-11 (in log2 alpha, so a relative error in alpha below
// 1e-11, far under the 1e-6 of the published check values). It bisects,
// as methods.md §3.3 advises for robustness, but tries the Illinois variant
// of regula falsi first: on 1e5 random-walk segments (alpha ≈ 0.01) that
// needs 8 evaluations of the objective after bracketing instead of 39
// (BenchmarkBankWeightedOrientation: 22 ms for 13 evaluations). A step that
// fails to halve the bracket is followed by a bisection step, so it never
// needs more than about twice bisection's evaluations.
func bankRoot(f func(float64) float64, lo, hi, flo, fhi float64) float64 {
	side := 0
	bisect := false
	for range 400 {
		if flo == 0 {
			return lo
		}
		if fhi == 0 {
			return hi
		}
		if hi-lo <= 1e-11 {
			return (lo + hi) / 2
		}
		width := hi - lo
		x := (lo + hi) / 2
		if !bisect {
			if r := hi - fhi*(hi-lo)/(fhi-flo); r > lo && r < hi {
				x = r
			}
		}
		fx := f(x)
		if fx < 0 {
			lo, flo = x, fx
			if side == -1 {
				fhi /= 2 // Illinois: halve the stale end
			}
			side = -1
		} else {
			hi, fhi = x, fx
			if side == 1 {
				flo /= 2
			}
			side = 1
		}
		bisect = !bisect && hi-lo > width/2
	}
	return (lo + hi) / 2
}

// bankHasTurning reports whether some segment advances in x and some segment
// rises or falls, the condition for AWO to have a root.
func bankHasTurning(segs [][2]float64) bool {
	var du, dv bool
	for _, s := range segs {
		du = du || s[0] != 0
		dv = dv || s[1] != 0
	}
	return du && dv
}

// bankMeanOrientation is the (optionally length-weighted) mean of
// atan(alpha·v/u) over the segments, in radians.
func bankMeanOrientation(segs [][2]float64, alpha float64, weighted bool) float64 {
	var sum, wsum float64
	for _, s := range segs {
		u, v := s[0], alpha*s[1]
		theta := math.Atan2(v, u)
		if weighted {
			w := math.Hypot(u, v)
			sum += theta * w
			wsum += w
		} else {
			sum += theta
			wsum++
		}
	}
	if wsum == 0 {
		return 0
	}
	return sum / wsum
}

// bankMedian returns the median of xs, reordering xs in place. It runs in
// expected linear time (quickselect with a median-of-three pivot), and falls
// back to sorting when partitioning degenerates, so it is never quadratic.
func bankMedian(xs []float64) float64 {
	n := len(xs)
	if n == 0 {
		return math.NaN()
	}
	k := n / 2
	hi := bankSelectKth(xs, k)
	if n%2 == 1 {
		return hi
	}
	// After selection every element left of k is <= xs[k].
	return (slices.Max(xs[:k]) + hi) / 2
}

// bankSelectKth reorders xs so that xs[k] is the k-th smallest element and
// returns it (Hoare's selection; Musser's introselect depth limit).
func bankSelectKth(xs []float64, k int) float64 {
	lo, hi := 0, len(xs)-1
	budget := 2 * bankBits(len(xs))
	for lo < hi {
		if budget == 0 {
			slices.Sort(xs[lo : hi+1])
			return xs[k]
		}
		budget--
		mid := lo + (hi-lo)/2
		// Median of three as pivot, moved to xs[hi].
		if xs[mid] < xs[lo] {
			xs[mid], xs[lo] = xs[lo], xs[mid]
		}
		if xs[hi] < xs[lo] {
			xs[hi], xs[lo] = xs[lo], xs[hi]
		}
		if xs[mid] < xs[hi] {
			xs[mid], xs[hi] = xs[hi], xs[mid]
		}
		pivot := xs[hi]
		// Three-way partition so that runs of equal values do not degrade.
		lt, i, gt := lo, lo, hi
		for i <= gt {
			switch {
			case xs[i] < pivot:
				xs[lt], xs[i] = xs[i], xs[lt]
				lt++
				i++
			case xs[i] > pivot:
				xs[i], xs[gt] = xs[gt], xs[i]
				gt--
			default:
				i++
			}
		}
		switch {
		case k < lt:
			hi = lt - 1
		case k > gt:
			lo = gt + 1
		default:
			return pivot
		}
	}
	return xs[k]
}

func bankBits(n int) int {
	b := 0
	for ; n > 0; n >>= 1 {
		b++
	}
	return b
}
