package stats

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/gonum/stat"
)

// referenceLoess is LOESS written from Cleveland's (1979) definition by
// brute force, with gonum's weighted stat.LinearRegression (gonum v0.17.0,
// a test-only reference) for the local fits: h is the q-th smallest
// distance from x0, every point weighted by the tricube of d/h.
func referenceLoess(x, y []float64, x0, span float64) float64 {
	n := len(x)
	q := int(math.Floor(span * float64(n)))
	d := make([]float64, n)
	for i := range x {
		d[i] = math.Abs(x[i] - x0)
	}
	sorted := slices.Clone(d)
	slices.Sort(sorted)
	h := sorted[q-1]
	w := make([]float64, n)
	for i := range d {
		if u := d[i] / h; u < 1 {
			w[i] = math.Pow(1-u*u*u, 3)
		}
	}
	alpha, beta := stat.LinearRegression(x, y, w, false)
	return alpha + beta*x0
}

func TestLoessMatchesReference(t *testing.T) {
	r := rand.New(rand.NewPCG(1979, 829))
	for trial := range 20 {
		n := 10 + r.IntN(200)
		x, y := make([]float64, n), make([]float64, n)
		for i := range x {
			x[i] = r.Float64() * 50
			y[i] = math.Sin(x[i]/8)*10 + r.NormFloat64()*2
		}
		span := []float64{0.3, 0.5, LoessSpan, 1}[trial%4]
		var at []float64
		for i := range 25 {
			at = append(at, 50*float64(i)/24)
		}
		got, err := Loess(x, y, at, span)
		require.NoError(t, err)
		for i, x0 := range at {
			assert.InDelta(t, referenceLoess(x, y, x0, span), got[i], 1e-9, "trial %d at x = %g", trial, x0)
		}
	}
}

func TestLoessExactCases(t *testing.T) {
	// Hand computation: a local line through points on a line is that
	// line, whatever the weights.
	x := []float64{0, 1, 2, 3, 4, 5, 6, 7, 8, 9}
	y := make([]float64, len(x))
	for i := range x {
		y[i] = 4 - 0.5*x[i]
	}
	got, err := Loess(x, y, []float64{0, 2.5, 9}, 0)
	require.NoError(t, err)
	for i, x0 := range []float64{0, 2.5, 9} {
		assert.InDelta(t, 4-0.5*x0, got[i], 1e-12)
	}
	// Hand computation: x = 0..4, y = 0 1 0 1 0, span 1 at x0 = 2: h = 2,
	// weights (1 − (d/2)³)³ are 0, 0.669921875, 1, 0.669921875, 0; the
	// data are symmetric about x0, so the local line is flat at the
	// weighted mean 2·0.669921875 / (1 + 2·0.669921875).
	got, err = Loess([]float64{0, 1, 2, 3, 4}, []float64{0, 1, 0, 1, 0}, []float64{2}, 1)
	require.NoError(t, err)
	w := math.Pow(1-1.0/8, 3)
	assert.InDelta(t, 2*w/(1+2*w), got[0], 1e-12)
	assert.InDelta(t, 0.669921875, w, 1e-15)
}

func TestLoessErrors(t *testing.T) {
	_, err := Loess([]float64{1, 2}, []float64{1, 2}, []float64{1}, 0)
	assert.True(t, errors.Is(err, ErrTooFew), "%v", err)
	_, err = Loess([]float64{1, 1, 1, 1}, []float64{1, 2, 3, 4}, []float64{1}, 1)
	assert.True(t, errors.Is(err, ErrNoSpread), "%v", err)
	_, err = Loess([]float64{1, 2, 3}, []float64{1, 2, 3}, nil, -1)
	assert.Error(t, err)
	_, err = Loess([]float64{1, 2, 3}, []float64{1, 2}, nil, 0)
	assert.Error(t, err)
}

// Values far from zero keep their digits: the curve of a level of 10⁶
// varying by units is the curve of the units, shifted.
func TestLoessLargeOffset(t *testing.T) {
	r := rand.New(rand.NewPCG(6, 6))
	x, y, big := make([]float64, 300), make([]float64, 300), make([]float64, 300)
	for i := range x {
		x[i] = 5e5 + r.Float64()*10
		y[i] = math.Sin(x[i]) + r.NormFloat64()
		big[i] = 1e6 + y[i]
	}
	at := []float64{5e5 + 1, 5e5 + 5, 5e5 + 9}
	a, err := Loess(x, y, at, 0)
	require.NoError(t, err)
	b, err := Loess(x, big, at, 0)
	require.NoError(t, err)
	for i := range at {
		assert.InDelta(t, a[i]+1e6, b[i], 1e-6)
	}
}
