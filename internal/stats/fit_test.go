package stats

import (
	"errors"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/stat"
)

func TestLeastSquares(t *testing.T) {
	tests := []struct {
		name                string
		x, y                []float64
		intercept, slope, r float64
		r2                  float64
		tol                 float64
	}{
		{
			// Anscombe (1973), "Graphs in statistical analysis", The
			// American Statistician 27(1): 17-21, data set I (values
			// from memory): the published fit is y = 3.00 + 0.500x with
			// r = 0.816 and R² = 0.67, to the digits printed there.
			name:      "Anscombe I",
			x:         []float64{10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5},
			y:         []float64{8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68},
			intercept: 3.00, slope: 0.500, r: 0.816, r2: 0.67, tol: 0.005,
		},
		{
			// Hand computation: means 3 and 4, Sxx = 10, Sxy = 6,
			// Syy = 6, so slope 0.6, intercept 4 − 1.8 = 2.2,
			// r = 6/√60, R² = 36/60 = 0.6.
			name: "five points by hand",
			x:    []float64{1, 2, 3, 4, 5}, y: []float64{2, 4, 5, 4, 5},
			intercept: 2.2, slope: 0.6, r: 6 / math.Sqrt(60), r2: 0.6, tol: 1e-12,
		},
		{
			// Hand computation: points on y = 7 − 2x fit exactly, r = −1.
			name: "exact line",
			x:    []float64{-1, 0, 2, 5}, y: []float64{9, 7, 3, -3},
			intercept: 7, slope: -2, r: -1, r2: 1, tol: 1e-12,
		},
		{
			// Hand computation: pairs with a missing value are skipped,
			// leaving the exact line y = x.
			name: "skips missing",
			x:    []float64{0, 1, math.NaN(), 3}, y: []float64{0, 1, 5, 3},
			intercept: 0, slope: 1, r: 1, r2: 1, tol: 1e-12,
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			f, err := LeastSquares(tc.x, tc.y)
			require.NoError(t, err)
			assert.InDelta(t, tc.intercept, f.Intercept, tc.tol)
			assert.InDelta(t, tc.slope, f.Slope, tc.tol)
			assert.InDelta(t, tc.r, f.R, tc.tol)
			assert.InDelta(t, tc.r2, f.R2, tc.tol)
			assert.InDelta(t, f.Intercept+2*f.Slope, f.At(2), 1e-12)
		})
	}
}

// LeastSquares agrees with gonum's stat.LinearRegression and
// stat.Correlation (gonum v0.17.0, a test-only reference) on large,
// offset values where a one-pass formula loses digits.
func TestLeastSquaresMatchesGonum(t *testing.T) {
	x := make([]float64, 500)
	y := make([]float64, 500)
	for i := range x {
		x[i] = 1e6 + float64(i)*0.37
		y[i] = 3e5 - 2.5*x[i] + 40*math.Sin(float64(i))
	}
	f, err := LeastSquares(x, y)
	require.NoError(t, err)
	alpha, beta := stat.LinearRegression(x, y, nil, false)
	r := stat.Correlation(x, y, nil)
	assert.InDelta(t, alpha, f.Intercept, 1e-6*math.Abs(alpha))
	assert.InDelta(t, beta, f.Slope, 1e-9)
	assert.InDelta(t, r, f.R, 1e-9)
	assert.Equal(t, 500, f.N)
}

func TestLeastSquaresErrors(t *testing.T) {
	_, err := LeastSquares([]float64{1}, []float64{2})
	assert.True(t, errors.Is(err, ErrTooFew), "%v", err)
	_, err = LeastSquares([]float64{3, 3, 3}, []float64{1, 2, 3})
	assert.True(t, errors.Is(err, ErrNoSpread), "%v", err)
	_, err = LeastSquares([]float64{1, 2}, []float64{1})
	assert.Error(t, err)
	_, err = LeastSquares([]float64{0, 1e308, -1e308}, []float64{1, 2, 3})
	assert.True(t, errors.Is(err, ErrTooLarge), "%v", err)
	// A flat y has no correlation to speak of: r is 0, not NaN.
	f, err := LeastSquares([]float64{1, 2, 3}, []float64{4, 4, 4})
	require.NoError(t, err)
	assert.Zero(t, f.R)
	assert.Zero(t, f.Slope)
}
