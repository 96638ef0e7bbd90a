package scale

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestAlbersSnyderExample(t *testing.T) {
	// Snyder (1987), Map Projections: A Working Manual, USGS PP 1395,
	// Appendix A, pp. 291-292, Albers conic equal-area on the sphere:
	// R = 1, standard parallels 29.5° and 45.5°, origin 23°N 96°W; the
	// point 35°N 75°W gives x = 0.2952720, y = 0.2416774.
	p := AlbersEqualArea{Lat0: 23, Lon0: -96, Lat1: 29.5, Lat2: 45.5}
	x, y := p.Project(-75, 35)
	assert.InDelta(t, 0.2952720, x, 5e-8)
	assert.InDelta(t, 0.2416774, y, 5e-8)
}

func TestEqualEarthEquatorEnd(t *testing.T) {
	// PROJ test suite, test/gie (eqearth, +R=6378137): x = 17263256.84 m
	// at 180°E on the equator, 1 cm tolerance.
	x, y := EqualEarth{}.Project(180-1e-12, 0)
	assert.InDelta(t, 17263256.84, x*6378137, 0.01)
	assert.Zero(t, y)
	// At the pole θ = asin(√3/2) = π/3, so y = A1θ + A2θ³ + A3θ⁷ + A4θ⁹ and
	// the meridians meet in a line of length 2·x(180°, 90°) > 0 (the
	// projection has a flat pole): hand computation from equation 2 of
	// Šavrič, Patterson & Jenny (2018).
	th := math.Pi / 3
	_, yp := EqualEarth{}.Project(0, 90)
	assert.InDelta(t, eeA1*th+eeA2*math.Pow(th, 3)+eeA3*math.Pow(th, 7)+eeA4*math.Pow(th, 9), yp, 1e-12)
	xp, _ := EqualEarth{}.Project(179.999, 90)
	assert.Greater(t, xp, 0.5, "flat pole")
}

func TestLambertPolarAspect(t *testing.T) {
	// North polar aspect: ρ = 2R·sin(45° − φ/2) and the meridian λ − λ0 =
	// 90° points along +x (Snyder 1987, equations 24-18 and 24-19; hand
	// computation at φ = 60°: ρ = 2·sin 15° = 0.5176381).
	p := LambertAzimuthal{Lat0: 90}
	x, y := p.Project(90, 60)
	assert.InDelta(t, 0.5176381, x, 1e-7)
	assert.InDelta(t, 0, y, 1e-12)
	x, y = p.Project(0, 60)
	assert.InDelta(t, 0, x, 1e-12)
	assert.InDelta(t, -0.5176381, y, 1e-7)
}

// sphereCellArea is the area on the unit sphere of the cell between two
// meridians and two parallels: Δλ·(sin φ2 − sin φ1) (common practice).
func sphereCellArea(lon0, lat0, lon1, lat1 float64) float64 {
	return (lon1 - lon0) * rad * (math.Sin(lat1*rad) - math.Sin(lat0*rad))
}

// projectedCellArea projects the cell's boundary densely and measures it
// with the shoelace formula.
func projectedCellArea(p Projection, lon0, lat0, lon1, lat1 float64) float64 {
	const k = 40
	var xs, ys []float64
	edge := func(a0, b0, a1, b1 float64) {
		for i := range k {
			f := float64(i) / k
			x, y := p.Project(a0+(a1-a0)*f, b0+(b1-b0)*f)
			xs, ys = append(xs, x), append(ys, y)
		}
	}
	edge(lon0, lat0, lon1, lat0)
	edge(lon1, lat0, lon1, lat1)
	edge(lon1, lat1, lon0, lat1)
	edge(lon0, lat1, lon0, lat0)
	a := 0.0
	for i := range xs {
		j := (i + 1) % len(xs)
		a += xs[i]*ys[j] - xs[j]*ys[i]
	}
	return math.Abs(a) / 2
}

// Equal-area projections keep the ratio of projected to spherical area
// constant (here 1, on the unit sphere) to 0.5% across the map; the
// equirectangular projection does not, which shows the test can fail.
func TestEqualAreaProperty(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	ext := Extent{West: -30, South: 50, East: 30, North: 70}
	cases := []struct {
		p     Projection
		equal bool
	}{
		{albersFor(ext), true},
		{EqualEarth{Lon0: 10}, true},
		{LambertAzimuthal{Lat0: 60, Lon0: 0}, true},
		{Equirectangular{Lat0: 60}, false},
	}
	for _, c := range cases {
		t.Run(c.p.Name(), func(t *testing.T) {
			lo, hi := math.Inf(1), math.Inf(-1)
			for range 200 {
				lon := ext.West + r.Float64()*(ext.East-ext.West-1)
				lat := ext.South + r.Float64()*(ext.North-ext.South-1)
				d := 0.05 + r.Float64()*0.9
				ratio := projectedCellArea(c.p, lon, lat, lon+d, lat+d) / sphereCellArea(lon, lat, lon+d, lat+d)
				lo, hi = math.Min(lo, ratio), math.Max(hi, ratio)
			}
			assert.Equal(t, c.equal, hi/lo < 1.005, "area ratios %.5f..%.5f", lo, hi)
			assert.Equal(t, c.p.EqualArea(), c.equal)
			if c.equal {
				assert.InDelta(t, 1, lo, 0.005)
			}
		})
	}
}

func TestLongitudeExtentAcrossAntimeridian(t *testing.T) {
	for _, c := range []struct {
		lons       []float64
		west, east float64
	}{
		{[]float64{170, 175, -175, -170}, 170, -170},
		{[]float64{-10, 5, 20}, -10, 20},
		{[]float64{190}, -170, -170},
	} {
		w, e, ok := LongitudeExtent(c.lons)
		require.True(t, ok)
		assert.InDelta(t, c.west, w, 1e-9, fmt.Sprint(c.lons))
		assert.InDelta(t, c.east, e, 1e-9, fmt.Sprint(c.lons))
	}
	_, _, ok := LongitudeExtent([]float64{math.NaN()})
	assert.False(t, ok)
	// A region across the antimeridian projects without a seam: its two
	// sides land next to each other, not a world apart.
	p := ChooseProjection(Extent{West: 170, South: -20, East: -170, North: -10})
	x1, _ := p.Project(179.9, -15)
	x2, _ := p.Project(-179.9, -15)
	assert.Less(t, math.Abs(x1-x2), 0.01)
}

func TestChooseProjection(t *testing.T) {
	assert.IsType(t, EqualEarth{}, ChooseProjection(Extent{West: -170, South: -60, East: 170, North: 80}))
	assert.IsType(t, LambertAzimuthal{}, ChooseProjection(Extent{West: -50, South: 60, East: 10, North: 84}))
	a, ok := ChooseProjection(Extent{West: 0, South: 40, East: 20, North: 70}).(AlbersEqualArea)
	require.True(t, ok)
	// One sixth in from each end (Snyder 1987, p. 99).
	assert.InDelta(t, 45, a.Lat1, 1e-9)
	assert.InDelta(t, 65, a.Lat2, 1e-9)
	assert.InDelta(t, 10, a.Lon0, 1e-9)
	_, err := ProjectionByName("mercator", Extent{})
	assert.ErrorContains(t, err, "unknown projection")
	for _, n := range []string{"", "albers", "equal-earth", "lambert", "equirectangular"} {
		p, err := ProjectionByName(n, Extent{West: 0, South: 40, East: 20, North: 70})
		require.NoError(t, err, n)
		x, y := p.Project(10, 55)
		assert.False(t, math.IsNaN(x) || math.IsNaN(y), n)
	}
}

func BenchmarkEqualEarth(b *testing.B) {
	p := EqualEarth{}
	for i := 0; b.Loop(); i++ {
		p.Project(float64(i%360)-180, float64(i%180)-90)
	}
}
