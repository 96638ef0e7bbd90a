package stats

import (
	"errors"
	"fmt"
	"math"
)

// ErrTooFew is the cause of a fit that has too few usable points.
var ErrTooFew = errors.New("too few points")

// ErrTooLarge is the cause of a fit whose sums of squares overflow: values
// near the largest float64 have squares beyond it.
var ErrTooLarge = errors.New("the values are too large to square; divide them by a power of ten")

// ErrNoSpread is the cause of a fit whose x values are all equal: no line
// through them has a slope.
var ErrNoSpread = errors.New("every x value is the same")

// LinearFit is a straight line fitted by least squares, y = Intercept +
// Slope·x, with how well it fits.
type LinearFit struct {
	Intercept, Slope float64
	// R is Pearson's correlation coefficient of x and y, R2 its square:
	// the share of the variance of y the line accounts for.
	R, R2 float64
	N     int // the points fitted: pairs where both values are finite
}

// At is the line's value at x.
func (l LinearFit) At(x float64) float64 { return l.Intercept + l.Slope*x }

// LeastSquares fits a line to the pairs (x[i], y[i]) by ordinary least
// squares (the line minimising the sum of squared vertical distances),
// skipping pairs with a value that is not finite. Sums are taken about the
// means (two passes), which keeps them exact to rounding where the
// one-pass textbook formula loses digits to cancellation on large values.
func LeastSquares(x, y []float64) (LinearFit, error) {
	if len(x) != len(y) {
		return LinearFit{}, fmt.Errorf("least squares: %d x values and %d y values", len(x), len(y))
	}
	var sx, sy float64
	n := 0
	for i := range x {
		if finite(x[i]) && finite(y[i]) {
			sx += x[i]
			sy += y[i]
			n++
		}
	}
	if n < 2 {
		return LinearFit{N: n}, fmt.Errorf("least squares: %d usable %s: %w (a line needs two)", n, plural(n), ErrTooFew)
	}
	mx, my := sx/float64(n), sy/float64(n)
	var sxx, syy, sxy float64
	for i := range x {
		if finite(x[i]) && finite(y[i]) {
			dx, dy := x[i]-mx, y[i]-my
			sxx += dx * dx
			syy += dy * dy
			sxy += dx * dy
		}
	}
	if !finite(mx) || !finite(my) || !finite(sxx) || !finite(syy) || !finite(sxy) {
		return LinearFit{N: n}, fmt.Errorf("least squares: %w", ErrTooLarge)
	}
	if sxx == 0 {
		return LinearFit{N: n}, fmt.Errorf("least squares: %w", ErrNoSpread)
	}
	f := LinearFit{Slope: sxy / sxx, N: n}
	f.Intercept = my - f.Slope*mx
	if syy > 0 {
		f.R = sxy / math.Sqrt(sxx*syy)
		f.R = math.Max(-1, math.Min(1, f.R))
	}
	f.R2 = f.R * f.R
	return f, nil
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

func plural(n int) string {
	if n == 1 {
		return "point"
	}
	return "points"
}
