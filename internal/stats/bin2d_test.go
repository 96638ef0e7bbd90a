package stats

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Every point lands in the hexagon whose centre is nearest, and every
// point is counted once.
func TestHexBinNearestCentre(t *testing.T) {
	r := rand.New(rand.NewPCG(1987, 424))
	const radius = 5.0
	x, y := make([]float64, 3000), make([]float64, 3000)
	for i := range x {
		x[i] = r.Float64()*300 - 20
		y[i] = r.Float64()*200 - 20
	}
	bins := HexBin(x, y, radius)
	total := 0
	for _, b := range bins {
		total += b.Count
	}
	assert.Equal(t, len(x), total)
	// Brute force: the nearest centre among all bins must hold the point,
	// and be within the circumradius.
	for i := range x[:300] {
		best, bd := -1, math.Inf(1)
		for j, b := range bins {
			if d := math.Hypot(x[i]-b.X, y[i]-b.Y); d < bd {
				best, bd = j, d
			}
		}
		require.GreaterOrEqual(t, best, 0)
		assert.LessOrEqual(t, bd, radius+1e-9, "point %d lies inside its hexagon", i)
	}
	// Centres are spaced as a hexagonal lattice: neighbours √3·r apart.
	for i := 1; i < len(bins); i++ {
		if bins[i].Y == bins[i-1].Y {
			step := bins[i].X - bins[i-1].X
			assert.InDelta(t, 0, math.Mod(step+1e-9, math.Sqrt(3)*radius), 1e-6)
		}
	}
}

func TestHexBinCounts(t *testing.T) {
	// Hand computation: with r = 10 the centres (0, 0) and (√3·10/2, 15)
	// are neighbours; points near each land in their own.
	x := []float64{0, 1, -1, 8.66, 9, math.NaN()}
	y := []float64{0, 1, 2, 15, 14, 3}
	bins := HexBin(x, y, 10)
	require.Len(t, bins, 2)
	assert.Equal(t, Bin{X: 0, Y: 0, Count: 3}, bins[0])
	assert.InDelta(t, math.Sqrt(3)*5, bins[1].X, 1e-12)
	assert.Equal(t, 15.0, bins[1].Y)
	assert.Equal(t, 2, bins[1].Count)
	assert.Nil(t, HexBin(x, y, 0))
	c := HexCorners(0, 0, 2)
	assert.InDelta(t, -2, c[0][1], 1e-12, "pointy top in a y-down frame")
}

func TestSquareBin(t *testing.T) {
	// Hand computation: squares of 10 with corners on multiples of 10.
	bins := SquareBin([]float64{1, 9, 11, -1, 5}, []float64{1, 9, 1, 1, math.Inf(1)}, 10)
	assert.Equal(t, []Bin{{X: -5, Y: 5, Count: 1}, {X: 5, Y: 5, Count: 2}, {X: 15, Y: 5, Count: 1}}, bins)
}

// Points far apart take the map path and give the same cells as the
// dense path would.
func TestBinFarApart(t *testing.T) {
	bins := SquareBin([]float64{0, 1e9, 1e9, -1e9}, []float64{0, 1e9, 1e9, 5}, 1)
	assert.Equal(t, []Bin{{X: 0.5, Y: 0.5, Count: 1}, {X: -1e9 + 0.5, Y: 5.5, Count: 1}, {X: 1e9 + 0.5, Y: 1e9 + 0.5, Count: 2}}, bins)
	assert.Empty(t, HexBin([]float64{math.NaN()}, []float64{1}, 1))
}
